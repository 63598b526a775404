import type uPlot from 'uplot';
import { CHART_COLOURS, CHART_FONT } from './chart-theme';

const clock = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
const dayMonth = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short' });

export const clockText = (epochSec: number) => clock.format(new Date(epochSec * 1000));
export const dayText = (epochSec: number) => dayMonth.format(new Date(epochSec * 1000));

/** "2:05" for two hours five minutes after the start of a recording. */
export function elapsedText(sec: number): string {
  const minutes = Math.round(sec / 60);
  return `${Math.floor(minutes / 60)}:${String(minutes % 60).padStart(2, '0')}`;
}

const axisStyle = { font: CHART_FONT, stroke: CHART_COLOURS.axis, grid: { stroke: CHART_COLOURS.grid, width: 1 }, ticks: { stroke: CHART_COLOURS.grid } };

// Round steps for hours from the start: 10 min up to 4 h.
const ELAPSED_STEPS = [600, 900, 1800, 3600, 7200, 10800, 14400];

/** x axis in clock time (24-hour) when the recording has a start time, else in h:mm from the start. */
export function timeAxis(clockTime: boolean): uPlot.Axis {
  return clockTime
    ? { ...axisStyle, space: 60, values: (_u, splits) => splits.map(clockText) }
    : { ...axisStyle, space: 60, incrs: ELAPSED_STEPS, values: (_u, splits) => splits.map(elapsedText) };
}

/** x axis across days, for spot readings taken over weeks. */
export const dateAxis: uPlot.Axis = { ...axisStyle, space: 70, values: (_u, splits) => splits.map(dayText) };

export const percentAxis = (label: string): uPlot.Axis => ({
  ...axisStyle,
  label,
  labelFont: CHART_FONT,
  labelSize: 18,
  size: 40,
  // Whole percentages only: a tick at 97.5 % reads as a precision the readings do not have.
  incrs: [1, 2, 5, 10, 20],
  values: (_u, splits) => splits.map((v) => `${v}`),
});
