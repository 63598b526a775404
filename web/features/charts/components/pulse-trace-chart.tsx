import { useMemo } from 'react';
import type uPlot from 'uplot';
import type { RecordingTrace } from '@shared/schemas/recordings';
import { ChartCanvas } from './chart-canvas';
import { clockText, elapsedText, percentAxis, timeAxis } from './chart-axes';
import { CHART_COLOURS } from './chart-theme';

interface PulseTraceChartProps {
  trace: RecordingTrace;
  /** ISO start of the recording; null when the file counted seconds from the start. */
  startedAt: string | null;
  description: string;
  height?: number;
}

const bpm = (_u: uPlot, v: number | null) => (v === null || v === undefined ? '—' : `${v.toFixed(0)} /min`);

/** Never a range narrower than 40 beats, so a steady night is not drawn as a jagged one. */
export function pulseRange(values: readonly (number | null)[]): [number, number] {
  const known = values.filter((v): v is number => v !== null);
  if (known.length === 0) return [80, 200];
  const low = Math.min(...known);
  const high = Math.max(...known);
  const pad = Math.max(10, (40 - (high - low)) / 2);
  return [Math.max(0, Math.floor((low - pad) / 10) * 10), Math.ceil((high + pad) / 10) * 10];
}

export function buildPulseChart(trace: RecordingTrace, startedAt: string | null) {
  const offset = startedAt ? Date.parse(startedAt) / 1000 : 0;
  const clockTime = startedAt !== null;
  const pulse = trace.points.map((p) => p.pulseMean);
  const data: uPlot.AlignedData = [trace.points.map((p) => p.tSec + offset), pulse];
  const options: Omit<uPlot.Options, 'width' | 'height'> = {
    scales: { x: { time: clockTime }, y: { range: pulseRange(pulse) } },
    axes: [timeAxis(clockTime), { ...percentAxis('Pulse /min'), incrs: [5, 10, 20, 50] }],
    series: [
      { label: clockTime ? 'Time' : 'From start', value: (_u, v) => (v === null ? '—' : clockTime ? clockText(v) : elapsedText(v - offset)) },
      { label: 'Mean pulse', stroke: CHART_COLOURS.pulse, width: 1.5, value: bpm },
    ],
    cursor: { drag: { x: true, y: false } },
    legend: { show: false },
  };
  return { options, data };
}

/** The night's pulse under the SpO2 trace, on the same time axis; a file without a pulse column says so. */
export function PulseTraceChart({ trace, startedAt, description, height = 180 }: PulseTraceChartProps) {
  const { options, data } = useMemo(() => buildPulseChart(trace, startedAt), [trace, startedAt]);
  const hasPulse = trace.points.some((p) => p.pulseMean !== null);
  if (!hasPulse) return <p className="text-ink-700">This file has no pulse readings, so there is no pulse trace.</p>;
  return (
    <figure className="flex flex-col gap-2">
      <ChartCanvas options={options} data={data} height={height} />
      <p aria-hidden="true" className="text-sm text-ink-700">
        <span className="inline-block w-5 border-t-2 border-ok-600 align-middle" /> Mean pulse
      </p>
      <figcaption className="text-sm text-ink-700">{description}</figcaption>
    </figure>
  );
}
