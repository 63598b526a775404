/**
 * A made-up overnight recording for the demo: 1 Hz from 21:00, a wandering baseline, a few dips and some sensor-off
 * rows. Deterministic per seed so a second seed run produces the same bytes (and so the same SHA-256).
 */
export function demoOvernightCsv(startIso: string, hours: number, seed: number, baselineSpo2: number): string {
  let state = seed * 2654435761 % 4294967296;
  const rand = () => {
    state = (state * 1664525 + 1013904223) % 4294967296;
    return state / 4294967296;
  };
  const start = Date.parse(startIso);
  const rows = ['timestamp,spo2,pulse,status'];
  let dipLeft = 0;
  let dipDepth = 0;
  for (let t = 0; t < hours * 3600; t++) {
    if (dipLeft === 0 && rand() < 1 / 1500) {
      dipLeft = 12 + Math.floor(rand() * 25);
      dipDepth = 3 + Math.floor(rand() * 7);
    }
    const wander = Math.sin(t / 1800) * 0.8;
    let spo2 = Math.round(baselineSpo2 + wander + (rand() - 0.5) * 1.5 - (dipLeft > 0 ? dipDepth : 0));
    if (dipLeft > 0) dipLeft--;
    spo2 = Math.max(70, Math.min(100, spo2));
    const pulse = Math.round(132 + Math.sin(t / 900) * 8 + (rand() - 0.5) * 6);
    const sensorOff = t % 7200 > 7150;
    const time = new Date(start + t * 1000).toISOString();
    rows.push(sensorOff ? `${time},,,sensor off` : `${time},${spo2},${pulse},ok`);
  }
  return rows.join('\n') + '\n';
}
