import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { numberInWords } from '@shared/format/number-words';

describe('numberInWords', () => {
  it('groups thousands with commas and keeps up to three decimals', () => {
    expect(numberInWords(1250)).toBe('1,250');
    expect(numberInWords(2438)).toBe('2,438');
    expect(numberInWords(1_234_567.891)).toBe('1,234,567.891');
    expect(numberInWords(0.125)).toBe('0.125');
    expect(numberInWords(0.0625)).toBe('0.063');
    expect(numberInWords(12.5)).toBe('12.5');
    expect(numberInWords(999.9996)).toBe('1,000');
    expect(numberInWords(0)).toBe('0');
    expect(numberInWords(-30)).toBe('-30');
    expect(numberInWords(-0.0001)).toBe('-0');
  });

  it('writes every value exactly as toLocaleString("en-GB") does, which it replaces', () => {
    const same = (value: number): void => {
      expect(numberInWords(value), String(value)).toBe(value.toLocaleString('en-GB'));
    };
    for (const value of [0, -0, 1, 7.5, 999, 1000, 43_200, 0.0004, 0.0005, 2.0005, 1.0005, -1500.25, 8000, 1e20, 1e21, 1e300,
      Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, Number.MAX_SAFE_INTEGER, 5e-324]) {
      same(value);
    }
    fc.assert(fc.property(fc.double({ noNaN: true }), (value) => same(value)), { numRuns: 5000 });
    fc.assert(fc.property(fc.integer({ min: -10_000_000, max: 10_000_000 }), fc.integer({ min: 0, max: 9999 }), (whole, tenThousandths) => same(whole + tenThousandths / 10_000)), { numRuns: 5000 });
  });
});
