import { describe, expect, it } from 'vitest';
import { weightWarnings } from '@shared/clinical/weight-check';

// Thresholds: confirm under 1.0 kg and for a change of more than 20 % within 14 days (common practice).
describe('weight plausibility', () => {
  it('when 0.32 kg is typed for 3.2, then both the low weight and the fall are named', () => {
    const w = weightWarnings(0.32, '2026-11-30', { kg: 3.2, date: '2026-11-25' });
    expect(w).toEqual([
      '0.32 kg is under 1 kg: check the decimal point (e.g. 3.2, not 0.32).',
      '0.32 kg is 90 % less than 3.2 kg on 2026-11-25: check the number.',
    ]);
  });

  it('when the weight is 1.0 kg or more and within 20 %, then nothing is asked', () => {
    expect(weightWarnings(1.0, '2026-11-30', null)).toEqual([]);
    expect(weightWarnings(0.99, '2026-11-30', null)).toHaveLength(1);
    expect(weightWarnings(3.84, '2026-11-30', { kg: 3.2, date: '2026-11-20' })).toEqual([]);
    expect(weightWarnings(2.56, '2026-11-30', { kg: 3.2, date: '2026-11-20' })).toEqual([]);
  });

  it('when the change is just over 20 % within 14 days, then it must be confirmed; after 14 days it need not', () => {
    expect(weightWarnings(3.85, '2026-11-30', { kg: 3.2, date: '2026-11-16' })).toEqual(['3.85 kg is 20 % more than 3.2 kg on 2026-11-16: check the number.']);
    expect(weightWarnings(3.85, '2026-11-30', { kg: 3.2, date: '2026-11-15' })).toEqual([]);
    expect(weightWarnings(2.5, '2026-11-30', { kg: 3.2, date: '2026-11-30' })).toHaveLength(1);
  });
});
