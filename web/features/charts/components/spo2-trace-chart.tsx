import { useMemo } from 'react';
import type uPlot from 'uplot';
import type { RecordingTrace } from '@shared/schemas/recordings';
import { ChartCanvas } from './chart-canvas';
import { shadeXRanges, drawHorizontalLine } from './chart-draw';
import { clockText, elapsedText, percentAxis, timeAxis } from './chart-axes';
import { CHART_COLOURS, CHART_FONT } from './chart-theme';

interface Spo2TraceChartProps {
  trace: RecordingTrace;
  /** ISO start of the recording; null when the file counted seconds from the start. */
  startedAt: string | null;
  /** What the chart shows, in words: the figure's caption. */
  description: string;
  height?: number;
}

const percent = (_u: uPlot, v: number | null) => (v === null || v === undefined ? '—' : `${v.toFixed(0)} %`);

function buildChart(trace: RecordingTrace, startedAt: string | null) {
  const offset = startedAt ? Date.parse(startedAt) / 1000 : 0;
  const clockTime = startedAt !== null;
  const x = trace.points.map((p) => p.tSec + offset);
  const data: uPlot.AlignedData = [x, trace.points.map((p) => p.spo2Min), trace.points.map((p) => p.spo2Mean)];
  const events = trace.events.map((e) => ({
    from: e.startSec + offset,
    to: e.endSec + offset,
    fill: e.deep ? CHART_COLOURS.eventDeep : CHART_COLOURS.eventLight,
    // A fall of 4 points or more is hatched and marked with a triangle, so it differs in pattern and shape too.
    ...(e.deep ? { hatch: CHART_COLOURS.eventDeepHatch, marker: CHART_COLOURS.eventDeepMarker } : {}),
  }));
  const options: Omit<uPlot.Options, 'width' | 'height'> = {
    scales: { x: { time: clockTime }, y: { range: [50, 100] } },
    axes: [timeAxis(clockTime), percentAxis('SpO2 %')],
    series: [
      { label: clockTime ? 'Time' : 'From start', value: (_u, v) => (v === null ? '—' : clockTime ? clockText(v) : elapsedText(v - offset)) },
      { label: 'Lowest SpO2', stroke: CHART_COLOURS.min, width: 1, value: percent },
      { label: 'Mean SpO2', stroke: CHART_COLOURS.mean, width: 2, value: percent },
    ],
    // Drag across the chart to zoom into part of the night; double-click to see it all again.
    cursor: { drag: { x: true, y: false } },
    legend: { show: false },
    hooks: {
      drawClear: [(u) => shadeXRanges(u, events)],
      draw: [(u) => drawHorizontalLine(u, trace.threshold, CHART_COLOURS.threshold, `${trace.threshold} %`, CHART_FONT)],
    },
  };
  return { options, data };
}

const line = 'inline-block w-5 align-middle';
const area = 'inline-block h-3 w-5 align-middle';

// Every mark on the canvas named in words and shape; the caption says the same for screen readers.
function TraceKey({ threshold }: { threshold: number }) {
  return (
    <p aria-hidden="true" className="flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink-700">
      <span><span className={`${line} border-t-[3px] border-brand-600`} /> Mean SpO2</span>
      <span><span className={`${line} border-t border-straw-700`} /> Lowest SpO2</span>
      <span><span className={`${line} border-t-2 border-dashed border-danger-600`} /> {threshold} % line</span>
      <span><span className={`${area} bg-warn-200`} /> Fall of 3 points or more (plain band)</span>
      <span>
        <span className={`${area} relative bg-warn-600/40 bg-[repeating-linear-gradient(135deg,rgba(122,70,0,0.6)_0_1.5px,transparent_1.5px_6px)]`} />
        <svg viewBox="0 0 10 8" className="ml-0.5 inline-block h-2 w-2.5 align-middle text-warn-800"><path d="M0 0h10L5 8z" fill="currentColor" /></svg>
        {' '}Fall of 4 points or more (hatched, triangle on top)
      </span>
    </p>
  );
}

/** One night's SpO2: per-interval lowest and mean, the threshold line, and each desaturation shaded. */
export function Spo2TraceChart({ trace, startedAt, description, height = 280 }: Spo2TraceChartProps) {
  const { options, data } = useMemo(() => buildChart(trace, startedAt), [trace, startedAt]);
  return (
    <figure className="flex flex-col gap-2">
      <ChartCanvas options={options} data={data} height={height} />
      <TraceKey threshold={trace.threshold} />
      <figcaption className="text-sm text-ink-700">{description}</figcaption>
    </figure>
  );
}
