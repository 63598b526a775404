/** Words for how recent spot readings move: the newest half against the older half, to the nearest point. */
export function readingTrend(spo2NewestFirst: readonly number[]): string {
  if (spo2NewestFirst.length < 2) return spo2NewestFirst.length === 1 ? 'One reading: no trend yet.' : 'No recent readings.';
  const half = Math.ceil(spo2NewestFirst.length / 2);
  const mean = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  const newer = mean(spo2NewestFirst.slice(0, half));
  const older = mean(spo2NewestFirst.slice(half).length ? spo2NewestFirst.slice(half) : spo2NewestFirst.slice(-1));
  const change = Math.round((newer - older) * 10) / 10;
  if (Math.abs(change) < 1) return `Steady: newer readings average ${newer.toFixed(1)} %, older ${older.toFixed(1)} %.`;
  return `${change > 0 ? 'Rising' : 'Falling'} by ${Math.abs(change)} points: newer readings average ${newer.toFixed(1)} %, older ${older.toFixed(1)} %.`;
}
