// Mount a uPlot chart in a container: created in an effect (never during SSR), rebuilt when the
// options or data change, resized with the container, destroyed on unmount.
import { useEffect, useRef, type RefObject } from 'react';
import uPlot from 'uplot';
import { formatFixed } from '../../lib/ui-format';

export type ChartOptions = Omit<uPlot.Options, 'width' | 'height'>;

/** Chart height for a container width: about 3:5, kept readable on a laptop and a wide monitor. */
export function chartHeightFor(widthPx: number, minPx = 260, maxPx = 440): number {
  return Math.round(Math.min(maxPx, Math.max(minPx, widthPx * 0.6)));
}

export function useUplot(
  containerRef: RefObject<HTMLDivElement | null>,
  options: ChartOptions | null,
  data: uPlot.AlignedData | null,
  heightFor: (widthPx: number) => number = chartHeightFor,
): RefObject<uPlot | null> {
  const chartRef = useRef<uPlot | null>(null);
  useEffect(() => {
    const el = containerRef.current;
    if (!el || !options || !data) return;
    const width = Math.max(240, Math.floor(el.clientWidth));
    const chart = new uPlot({ ...options, width, height: heightFor(width) }, data, el);
    chartRef.current = chart;
    const observer = new ResizeObserver((entries) => {
      const w = Math.max(240, Math.floor(entries[0]?.contentRect.width ?? width));
      if (w !== chart.width) chart.setSize({ width: w, height: heightFor(w) });
    });
    observer.observe(el);
    return () => {
      observer.disconnect();
      chart.destroy();
      chartRef.current = null;
    };
  }, [containerRef, options, data, heightFor]);
  return chartRef;
}

/** Tick labels with as many decimals as the tick step needs and a true minus sign. */
export function formatTicks(splits: number[], increment: number): string[] {
  // as many decimals as the step needs to be exact: a step of 0.25 shows 0.25, 0.50, 0.75
  let digits = 0;
  if (increment > 0)
    while (digits < 6 && Math.abs(Math.round(increment * 10 ** digits) - increment * 10 ** digits) > 1e-6) digits++;
  return splits.map((v) => (v === null || v === undefined ? '' : formatFixed(v, digits)));
}

/** Axis styling shared by the review charts: legible 13 px ticks, bold labels, light grid. */
export function styleAxis(label: string, extra: Partial<uPlot.Axis> = {}): uPlot.Axis {
  return {
    label,
    values: (_u, splits, _axisIdx, _space, increment) => formatTicks(splits, increment),
    stroke: '#14273d',
    font: '13px Inter, ui-sans-serif, system-ui, sans-serif',
    labelFont: '600 13px Inter, ui-sans-serif, system-ui, sans-serif',
    grid: { stroke: 'rgba(29, 53, 87, 0.10)', width: 1 },
    ticks: { stroke: 'rgba(29, 53, 87, 0.25)', width: 1 },
    ...extra,
  };
}
