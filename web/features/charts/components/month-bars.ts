import type uPlot from 'uplot';
import { CHART_COLOURS, CHART_FONT } from './chart-theme';

export interface MonthValue {
  /** YYYY-MM */
  month: string;
  count: number;
}

const short = new Intl.DateTimeFormat('en-GB', { month: 'short', timeZone: 'UTC' });
const long = new Intl.DateTimeFormat('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' });
const asDate = (month: string) => new Date(`${month}-01T00:00:00Z`);

/** "Jan", with the year added at January and at the first month so a year change is never silent. */
export function monthTick(month: string, first: boolean): string {
  const text = short.format(asDate(month));
  return first || month.endsWith('-01') ? `${text} ${month.slice(2, 4)}` : text;
}
export const monthName = (month: string) => long.format(asDate(month));

const axisStyle = { font: CHART_FONT, stroke: CHART_COLOURS.axis, grid: { stroke: CHART_COLOURS.grid, width: 1 }, ticks: { stroke: CHART_COLOURS.grid } };

/** Bars drawn on the canvas from the series' values, one per month, each with its number above it. */
function drawBars(u: uPlot) {
  const ratio = u.ctx.canvas.width / u.width || 1;
  const xs = u.data[0];
  const ys = u.data[1];
  const step = xs.length > 1 ? Math.abs(u.valToPos(1, 'x', true) - u.valToPos(0, 'x', true)) : u.bbox.width / 2;
  const width = Math.max(4 * ratio, step * 0.6);
  const { ctx } = u;
  ctx.save();
  ctx.font = CHART_FONT.replace(/^(\d+)px/, (_m, size: string) => `bold ${Number(size) * ratio}px`);
  ctx.textAlign = 'center';
  ctx.textBaseline = 'bottom';
  for (let i = 0; i < xs.length; i++) {
    const value = ys[i] ?? 0;
    const x = u.valToPos(xs[i], 'x', true);
    const top = u.valToPos(value, 'y', true);
    const base = u.valToPos(0, 'y', true);
    ctx.fillStyle = CHART_COLOURS.mean;
    ctx.fillRect(x - width / 2, top, width, Math.max(0, base - top));
    ctx.fillStyle = CHART_COLOURS.axis;
    ctx.fillText(String(value), x, top - 2 * ratio);
  }
  ctx.restore();
}

/** uPlot options and data for counts per month; months are placed at 0, 1, 2… and labelled by name. */
export function buildMonthBars(months: readonly MonthValue[], valueLabel: string) {
  const x = months.map((_m, i) => i);
  const data: uPlot.AlignedData = [x, months.map((m) => m.count)];
  const top = Math.max(4, ...months.map((m) => m.count));
  const options: Omit<uPlot.Options, 'width' | 'height'> = {
    scales: { x: { time: false, range: [-0.6, months.length - 0.4] }, y: { range: [0, Math.ceil(top * 1.2)] } },
    axes: [
      { ...axisStyle, space: 28, incrs: [1, 2, 3], values: (_u, splits) => splits.map((v) => (Number.isInteger(v) && months[v] ? monthTick(months[v].month, v === 0) : '')) },
      { ...axisStyle, label: valueLabel, labelFont: CHART_FONT, labelSize: 18, size: 40, incrs: [1, 2, 5, 10, 20, 50, 100], values: (_u, splits) => splits.map((v) => `${v}`) },
    ],
    series: [{ label: 'Month' }, { label: valueLabel, paths: () => null, points: { show: false } }],
    legend: { show: false },
    cursor: { show: false },
    hooks: { draw: [drawBars] },
  };
  return { options, data };
}
