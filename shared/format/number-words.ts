/**
 * One way of writing numbers people read (web pages, the printed plan, the audit trail's words): British grouping
 * ("1,250") and at most three decimals, exactly as `toLocaleString('en-GB')` writes them (tests hold the two equal).
 * Written out here rather than through `Intl.NumberFormat`: a browser's first number format loads its locale data,
 * which took a slow phone about 80 ms of the caseload's first paint. Like Intl, it rounds the shortest decimal that
 * reads back as the same number (`String(value)`: 1.0005, not the binary 1.000499…), a half away from zero.
 */
let intl: Intl.NumberFormat | undefined;

export function numberInWords(value: number): string {
  const size = Math.abs(value);
  // NaN, ±∞ and 1e21 up (written with an exponent) the locale's own way; they do not occur in practice.
  if (!Number.isFinite(value) || size >= 1e21) {
    intl ??= new Intl.NumberFormat('en-GB', { maximumFractionDigits: 3 });
    return intl.format(value);
  }
  const sign = value < 0 || Object.is(value, -0) ? '-' : '';
  // Below half a thousandth (this includes every value String() writes with an exponent) it rounds to zero.
  if (size < 0.0005) return `${sign}0`;
  const [whole = '0', fraction = ''] = String(size).split('.');
  const thousandths = BigInt(whole + fraction.slice(0, 3).padEnd(3, '0')) + (Number(fraction[3] ?? '0') >= 5 ? 1n : 0n);
  const grouped = (thousandths / 1000n).toString().replace(/\B(?=(\d{3})+$)/g, ',');
  const decimals = (thousandths % 1000n).toString().padStart(3, '0').replace(/0+$/, '');
  return `${sign}${grouped}${decimals ? `.${decimals}` : ''}`;
}
