import { describe, expect, it } from 'vitest';
import { concentratorCovers, settingFlowRange } from '../../../shared/equipment/concentrator-fit';

// Pure range arithmetic over the programme's own figures (demo-style values, no published source needed).
describe('concentrator fit', () => {
  it('when a setting has parts of the day, then its range spans them and leaves out the ones that are off', () => {
    expect(settingFlowRange(0.25, { awake: 0.25, asleep: 0.5, feeding: 0 })).toEqual({ low: 0.25, high: 0.5 });
    expect(settingFlowRange(0, null)).toBeNull();
  });

  it('when the range is inside the concentrator’s, then it covers; one end outside, it does not; unknown ends, unknown', () => {
    expect(concentratorCovers({ flowMinLpm: 0.1, flowMaxLpm: 2 }, { low: 0.25, high: 0.5 })).toBe(true);
    expect(concentratorCovers({ flowMinLpm: 0.5, flowMaxLpm: 2 }, { low: 0.25, high: 0.5 })).toBe(false);
    expect(concentratorCovers({ flowMinLpm: 0.1, flowMaxLpm: 0.4 }, { low: 0.25, high: 0.5 })).toBe(false);
    expect(concentratorCovers({ flowMinLpm: 0.1 }, { low: 0.25, high: 0.5 })).toBeNull();
  });
});
