import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';

export interface UplotChartProps {
  options: Omit<uPlot.Options, 'width' | 'height'>;
  data: uPlot.AlignedData;
  height: number;
}

/**
 * The only place that touches uPlot and the canvas. Kept apart (and loaded lazily) so pages pay for the library only
 * when a chart is on screen, and tests can swap it out: jsdom has no canvas.
 */
export default function UplotChart({ options, data, height }: UplotChartProps) {
  const box = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const element = box.current;
    if (!element) return;
    const width = () => Math.max(200, Math.floor(element.clientWidth));
    const chart = new uPlot({ ...options, width: width(), height }, data, element);
    const observer = new ResizeObserver(() => chart.setSize({ width: width(), height }));
    observer.observe(element);
    return () => {
      observer.disconnect();
      chart.destroy();
    };
  }, [options, data, height]);

  return <div ref={box} className="w-full" />;
}
