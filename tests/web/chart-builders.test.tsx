import { render, screen } from '@testing-library/react';
import type uPlot from 'uplot';
import { describe, expect, it, vi } from 'vitest';
import type { RecordingTrace } from '@shared/schemas/recordings';
import { ReadingsChart } from '../../web/features/charts/components/readings-chart';
import { PulseTraceChart, pulseRange } from '../../web/features/charts/components/pulse-trace-chart';
import { Spo2TraceChart } from '../../web/features/charts/components/spo2-trace-chart';
import type { UplotChartProps } from '../../web/features/charts/components/uplot-chart';

// The canvas wrapper is replaced by one that keeps what it was given, so the options can be checked without a canvas.
const given: UplotChartProps[] = [];
vi.mock('../../web/features/charts/components/uplot-chart', () => ({
  default: (props: UplotChartProps) => {
    given.push(props);
    return <div data-testid="uplot-chart" />;
  },
}));

const trace: RecordingTrace = {
  points: [{ tSec: 0, spo2Min: 95, spo2Mean: 96, pulseMean: 142 }, { tSec: 18, spo2Min: null, spo2Mean: null, pulseMean: null }, { tSec: 36, spo2Min: 84, spo2Mean: 90, pulseMean: 151.5 }],
  events: [
    { startSec: 3600, endSec: 3601, nadir: 86, deep: true },
    { startSec: 7200, endSec: 7260, nadir: 91, deep: false },
  ],
  threshold: 90,
};

/** Enough of a uPlot instance for the drawing hooks: a 1:1 canvas and a linear x scale of 0.1 px per second. */
function fakePlot() {
  const calls: { fill: string; rect: number[] }[] = [];
  let fill = '';
  const ctx = {
    canvas: { width: 800 },
    save: vi.fn(), restore: vi.fn(), beginPath: vi.fn(), rect: vi.fn(), clip: vi.fn(), moveTo: vi.fn(), lineTo: vi.fn(), stroke: vi.fn(),
    setLineDash: vi.fn(), fillText: vi.fn(), measureText: () => ({ width: 30 }), closePath: vi.fn(), fill: vi.fn(),
    set fillStyle(value: string) { fill = value; },
    get fillStyle() { return fill; },
    fillRect: (...rect: number[]) => calls.push({ fill, rect }),
  };
  const u = {
    ctx, width: 800, bbox: { left: 40, top: 10, width: 760, height: 200 },
    valToPos: (value: number, scale: string) => (scale === 'x' ? 40 + value * 0.1 : 210 - (value - 50) * 4),
  } as unknown as uPlot;
  return { u, calls, ctx };
}

const lastGiven = async () => {
  await screen.findByTestId('uplot-chart');
  return given[given.length - 1];
};

describe('SpO2 trace chart', () => {
  it('when the recording has no start time, then x is seconds from the start, gaps stay null and y runs 50–100', async () => {
    render(<Spo2TraceChart trace={trace} startedAt={null} description="A night." />);
    const { data, options } = await lastGiven();
    expect(data).toEqual([[0, 18, 36], [95, null, 84], [96, null, 90]]);
    expect(options.scales?.x?.time).toBe(false);
    expect(options.scales?.y?.range).toEqual([50, 100]);
    expect(options.series.map((s) => s.label)).toEqual(['From start', 'Lowest SpO2', 'Mean SpO2']);
    const axis = options.axes?.[0].values as (u: uPlot, splits: number[]) => string[];
    expect(axis({} as uPlot, [0, 3600, 5400])).toEqual(['0:00', '1:00', '1:30']);
    expect(screen.getByRole('figure')).toHaveTextContent('A night.');
  });

  it('when the recording has a start time, then x is clock time', async () => {
    render(<Spo2TraceChart trace={trace} startedAt="2025-04-09T20:00:00.000Z" description="A night." />);
    const { data, options } = await lastGiven();
    const start = Date.parse('2025-04-09T20:00:00.000Z') / 1000;
    expect(data[0]).toEqual([start, start + 18, start + 36]);
    expect(options.scales?.x?.time).toBe(true);
  });

  it('when the chart is drawn, then each event is shaded (at least 3 px wide, deeper falls darker) and the threshold is drawn with its value', async () => {
    render(<Spo2TraceChart trace={trace} startedAt={null} description="A night." />);
    const { options } = await lastGiven();
    const { u, calls, ctx } = fakePlot();
    const hooks = options.hooks as { drawClear: ((u: uPlot) => void)[]; draw: ((u: uPlot) => void)[] };
    hooks.drawClear[0](u);
    expect(calls).toHaveLength(2);
    const [deep, light] = calls;
    expect(deep.rect[2]).toBe(3);
    expect(light.rect).toEqual([40 + 720, 10, 6, 200]);
    expect(deep.fill).not.toBe(light.fill);
    // Beyond colour: the deeper fall is hatched (diagonal strokes) and carries one filled triangle; the lighter one has neither.
    expect(ctx.stroke).toHaveBeenCalledTimes(1);
    expect(ctx.fill).toHaveBeenCalledTimes(1);
    expect(ctx.closePath).toHaveBeenCalledTimes(1);
    hooks.draw[0](u);
    expect(ctx.fillText).toHaveBeenCalledWith('90 %', expect.any(Number), expect.any(Number));
  });
});

describe('Pulse trace chart', () => {
  it('when the trace has pulse means, then they are drawn on the same time axis with a bpm range at least 40 beats wide', async () => {
    render(<PulseTraceChart trace={trace} startedAt={null} description="Pulse." />);
    const { data, options } = await lastGiven();
    expect(data).toEqual([[0, 18, 36], [142, null, 151.5]]);
    expect(options.series.map((s) => s.label)).toEqual(['From start', 'Mean pulse']);
    expect(options.scales?.y?.range).toEqual([120, 170]);
    expect(pulseRange([60, 220])).toEqual([50, 230]);
    expect(pulseRange([null])).toEqual([80, 200]);
  });

  it('when the file had no pulse column, then no chart is drawn and the page says so', () => {
    const none = { ...trace, points: trace.points.map((p) => ({ ...p, pulseMean: null })) };
    render(<PulseTraceChart trace={none} startedAt={null} description="Pulse." />);
    expect(screen.getByText('This file has no pulse readings, so there is no pulse trace.')).toBeInTheDocument();
    expect(screen.queryByRole('figure')).not.toBeInTheDocument();
  });
});

describe('Readings chart', () => {
  it('when some readings come from the family, then they are a separate series and the band is shaded from its minimum to 100', async () => {
    const readings = [
      { takenAt: '2025-04-14T21:00:00.000Z', spo2: 91, familyReported: true },
      { takenAt: '2025-04-12T10:00:00.000Z', spo2: 96, familyReported: false },
    ];
    render(<ReadingsChart readings={readings} band={{ min: 93, max: 100 }} description="Readings." />);
    const { data, options } = await lastGiven();
    expect(data).toEqual([[Date.parse(readings[1].takenAt) / 1000, Date.parse(readings[0].takenAt) / 1000], [96, null], [null, 91]]);
    expect(options.series.map((s) => s.label)).toEqual(['Taken', 'By staff', 'Family-reported']);
    const { u, calls } = fakePlot();
    (options.hooks as { drawClear: ((u: uPlot) => void)[] }).drawClear[0](u);
    // y 100 → 10 px, y 93 → 38 px on the fake scale.
    expect(calls[0].rect).toEqual([40, 10, 760, 28]);
  });
});
