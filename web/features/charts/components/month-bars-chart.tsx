import { useMemo } from 'react';
import { ChartCanvas } from './chart-canvas';
import { buildMonthBars, monthName, type MonthValue } from './month-bars';

interface MonthBarsChartProps {
  months: readonly MonthValue[];
  /** What is counted, for the axis and the table heading: "Babies". */
  valueLabel: string;
  /** One or two sentences saying what the bars show, for everyone (the caption) and for screen readers. */
  description: string;
  height?: number;
}

/** Counts per month as bars, with the same figures in a table that opens below (the canvas is hidden from screen readers). */
export function MonthBarsChart({ months, valueLabel, description, height = 200 }: MonthBarsChartProps) {
  const { options, data } = useMemo(() => buildMonthBars(months, valueLabel), [months, valueLabel]);
  return (
    <figure className="flex flex-col gap-2">
      <ChartCanvas options={options} data={data} height={height} />
      <figcaption className="text-ink-700">{description}</figcaption>
      <details className="rounded-lg border border-surface-200">
        <summary className="cursor-pointer px-3 py-2 font-semibold text-brand-700 underline">Show the figures as a table</summary>
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">{description}</caption>
          <thead>
            <tr className="border-b border-surface-200">
              <th scope="col" className="px-3 py-1.5">Month</th>
              <th scope="col" className="px-3 py-1.5 text-right">{valueLabel}</th>
            </tr>
          </thead>
          <tbody>
            {months.map((m) => (
              <tr key={m.month} className="border-b border-surface-100 last:border-0">
                <th scope="row" className="px-3 py-1 font-normal">{monthName(m.month)}</th>
                <td className="px-3 py-1 text-right tabular-nums">{m.count}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
