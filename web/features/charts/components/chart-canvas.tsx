import { lazy, Suspense } from 'react';
import type { UplotChartProps } from './uplot-chart';

const UplotChart = lazy(() => import('./uplot-chart'));

/** The chart itself is decoration for sighted readers; the figure's caption and the tables carry the same facts. */
export function ChartCanvas(props: UplotChartProps) {
  return (
    <div aria-hidden="true" className="w-full overflow-hidden">
      <Suspense fallback={<div style={{ height: props.height }} className="w-full animate-pulse rounded-lg bg-surface-100 motion-reduce:animate-none" />}>
        <UplotChart {...props} />
      </Suspense>
    </div>
  );
}
