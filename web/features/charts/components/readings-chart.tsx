import { useMemo } from 'react';
import type uPlot from 'uplot';
import { ChartCanvas } from './chart-canvas';
import { shadeYRange } from './chart-draw';
import { dateAxis, dayText, clockText, percentAxis } from './chart-axes';
import { CHART_COLOURS } from './chart-theme';

export interface ReadingPoint {
  takenAt: string;
  spo2: number;
  familyReported: boolean;
}

interface ReadingsChartProps {
  readings: readonly ReadingPoint[];
  /** The SpO2 band to aim for, shaded behind the points. */
  band: { min: number; max: number };
  description: string;
  height?: number;
}

const noLine = () => null;

function buildChart(readings: readonly ReadingPoint[], band: { min: number; max: number }) {
  const sorted = [...readings].sort((a, b) => Date.parse(a.takenAt) - Date.parse(b.takenAt));
  const x = sorted.map((r) => Date.parse(r.takenAt) / 1000);
  // Staff and family readings are separate series with different point shapes (filled, hollow), not just colours.
  const data: uPlot.AlignedData = [
    x,
    sorted.map((r) => (r.familyReported ? null : r.spo2)),
    sorted.map((r) => (r.familyReported ? r.spo2 : null)),
  ];
  const lowest = Math.min(band.min, ...sorted.map((r) => r.spo2));
  const value = (_u: uPlot, v: number | null) => (v === null || v === undefined ? '—' : `${v} %`);
  const options: Omit<uPlot.Options, 'width' | 'height'> = {
    scales: { x: { time: true }, y: { range: [Math.max(50, Math.floor(lowest) - 3), 100] } },
    axes: [dateAxis, percentAxis('SpO2 %')],
    series: [
      { label: 'Taken', value: (_u, v) => (v === null ? '—' : `${dayText(v)} ${clockText(v)}`) },
      { label: 'By staff', stroke: CHART_COLOURS.point, paths: noLine, points: { show: true, size: 9, fill: CHART_COLOURS.point }, value },
      { label: 'Family-reported', stroke: CHART_COLOURS.min, paths: noLine, points: { show: true, size: 10, width: 2, fill: '#ffffff' }, value },
    ],
    // The key below names the marks by shape; the table below gives every value.
    legend: { show: false },
    hooks: { drawClear: [(u) => shadeYRange(u, band.min, band.max, CHART_COLOURS.targetBand)] },
  };
  return { options, data };
}

/** Spot SpO2 readings over time against the programme's target band. */
export function ReadingsChart({ readings, band, description, height = 220 }: ReadingsChartProps) {
  const { min, max } = band;
  const { options, data } = useMemo(() => buildChart(readings, { min, max }), [readings, min, max]);
  return (
    <figure className="flex flex-col gap-2">
      <ChartCanvas options={options} data={data} height={height} />
      <p aria-hidden="true" className="flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink-700">
        <span><span className="inline-block size-2.5 rounded-full bg-brand-700 align-middle" /> By staff</span>
        <span><span className="inline-block size-2.5 rounded-full border-2 border-straw-700 bg-surface-0 align-middle" /> Family-reported</span>
        <span><span className="inline-block h-3 w-5 bg-ok-200 align-middle" /> Target band {min}–{max} %</span>
      </p>
      <figcaption className="text-sm text-ink-700">{description}</figcaption>
    </figure>
  );
}
