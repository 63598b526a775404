import { describe, expect, it } from 'vitest';
import { flowWords, settingText } from '../../web/components/clinical/setting-text';

describe('settingText', () => {
  it('when no periods are set, then the flow reads as day and night', () => {
    expect(settingText({ flowLpm: 0.25, periods: null })).toBe('0.25 litres per minute, day and night');
  });

  it('when all periods carry the same flow, then it still reads as day and night', () => {
    expect(settingText({ flowLpm: 0.5, periods: { awake: 0.5, asleep: 0.5, feeding: 0.5 } })).toBe('0.5 litres per minute, day and night');
  });

  it('when periods differ, then each period is named and a zero reads as no oxygen', () => {
    expect(settingText({ flowLpm: 0.25, periods: { awake: 0, asleep: 0.25, feeding: 0.125 } })).toBe(
      'No oxygen when awake; 0.25 litres per minute when asleep; 0.125 litres per minute when feeding',
    );
  });

  it('when the flow is a fine flowmeter step, then it is shown exactly, never rounded', () => {
    expect(flowWords(0.125)).toBe('0.125 litres per minute');
    expect(flowWords(0.025)).toBe('0.025 litres per minute');
    expect(flowWords(1)).toBe('1 litre per minute');
  });

  it('when the setting is no oxygen at all (the last step down), then it says so and names no source', () => {
    expect(settingText({ flowLpm: 0, periods: null, source: 'concentrator' })).toBe('No oxygen, day and night');
    expect(settingText({ flowLpm: 0, periods: { awake: 0, asleep: 0, feeding: 0 }, source: 'cylinder' })).toBe('No oxygen, day and night');
  });

  it('when the source is known, then it follows in words', () => {
    expect(settingText({ flowLpm: 0.25, periods: null, source: 'concentrator' })).toBe(
      '0.25 litres per minute, day and night, from the concentrator',
    );
  });
});
