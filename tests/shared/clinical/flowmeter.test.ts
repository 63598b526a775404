import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DEFAULT_FLOWMETER_STEPS_LPM, roundUpToStepLpm } from '@shared/clinical/flowmeter';

describe('programme flowmeter steps', () => {
  it('when built, then they run 0.025..1 L/min by 0.025 and 1.25..2 L/min by 0.25, with no float drift', () => {
    // common practice for infant low-flow meters (programme default)
    expect(DEFAULT_FLOWMETER_STEPS_LPM).toHaveLength(44);
    expect(DEFAULT_FLOWMETER_STEPS_LPM[0]).toBe(0.025);
    expect(DEFAULT_FLOWMETER_STEPS_LPM[9]).toBe(0.25);
    expect(DEFAULT_FLOWMETER_STEPS_LPM[39]).toBe(1);
    expect(DEFAULT_FLOWMETER_STEPS_LPM.slice(40)).toEqual([1.25, 1.5, 1.75, 2]);
    DEFAULT_FLOWMETER_STEPS_LPM.forEach((stepLpm) => expect(Math.round(stepLpm * 1000) / 1000).toBe(stepLpm));
  });
});

describe('rounding a flow up to a step', () => {
  it('when the requirement equals a step up to float noise, then that step is kept', () => {
    expect(roundUpToStepLpm(0.25000000001, DEFAULT_FLOWMETER_STEPS_LPM)).toBe(0.25);
    expect(roundUpToStepLpm(0.1 + 0.2, DEFAULT_FLOWMETER_STEPS_LPM)).toBe(0.3);
  });

  it('when the requirement is genuinely above a step, then the next step is chosen, never the lower one', () => {
    expect(roundUpToStepLpm(0.2500001, DEFAULT_FLOWMETER_STEPS_LPM)).toBe(0.275);
    expect(roundUpToStepLpm(0.526, DEFAULT_FLOWMETER_STEPS_LPM)).toBe(0.55);
    expect(roundUpToStepLpm(0.000001, DEFAULT_FLOWMETER_STEPS_LPM)).toBe(0.025);
    expect(roundUpToStepLpm(1.01, DEFAULT_FLOWMETER_STEPS_LPM)).toBe(1.25);
  });

  it('when no oxygen is needed, then the flow stays 0', () => {
    expect(roundUpToStepLpm(0, DEFAULT_FLOWMETER_STEPS_LPM)).toBe(0);
  });

  it('when the requirement is above the largest step, then there is no step (null), not a capped flow', () => {
    expect(roundUpToStepLpm(2.0001, DEFAULT_FLOWMETER_STEPS_LPM)).toBeNull();
  });

  it('when steps are unusable, then they are refused', () => {
    expect(() => roundUpToStepLpm(0.5, [])).toThrow(RangeError);
    expect(() => roundUpToStepLpm(0.5, [0.5, 0.25])).toThrow(RangeError);
    expect(() => roundUpToStepLpm(0.5, [0, 0.5])).toThrow(RangeError);
    expect(() => roundUpToStepLpm(-0.1, [0.5])).toThrow(RangeError);
  });

  it('when rounding any requirement, then the result is never below it and less than one step above it', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 2, noNaN: true }), (requiredLpm) => {
        const rounded = roundUpToStepLpm(requiredLpm, DEFAULT_FLOWMETER_STEPS_LPM);
        expect(rounded).not.toBeNull();
        const roundedLpm = rounded as number;
        expect(roundedLpm).toBeGreaterThanOrEqual(requiredLpm - 1e-9);
        const index = DEFAULT_FLOWMETER_STEPS_LPM.indexOf(roundedLpm);
        const previousLpm = index > 0 ? DEFAULT_FLOWMETER_STEPS_LPM[index - 1] : 0;
        // the step below the chosen one would have been too small (or the requirement is 0)
        if (requiredLpm > 0) expect(previousLpm).toBeLessThan(requiredLpm);
        expect(roundedLpm - requiredLpm).toBeLessThan(roundedLpm - previousLpm + 1e-9);
      }),
    );
  });
});
