// uPlot options for the time history: strain on the left axis, pressure on the right, each
// channel a min/max band, drag along x to select a window (the component re-fetches it).
import type uPlot from 'uplot';
import { CHANNEL_COLORS, CHART_COLORS } from './outcome-style';
import { alignZeroRanges, measureExtents, type PlotSeriesSpec } from './series-data';
import { styleAxis, type ChartOptions } from './use-uplot';

export function channelColor(channels: readonly string[], channel: string): string {
  const i = channels.indexOf(channel);
  return CHANNEL_COLORS[(i < 0 ? 0 : i) % CHANNEL_COLORS.length]!;
}

export function buildTimeHistoryOptions(opts: {
  specs: PlotSeriesSpec[];
  data: uPlot.AlignedData;
  channels: readonly string[];
  pressureUnit: string;
  timeIsIndex: boolean;
  onSelectWindow: (t0: number, t1: number) => void;
  /** the sample under the cursor (null when it leaves the chart), for the read-out */
  onCursor?: (index: number | null) => void;
}): ChartOptions {
  const series: uPlot.Series[] = [{}];
  const bands: uPlot.Band[] = [];
  opts.specs.forEach((s, k) => {
    const color = s.channel === 'pressure' ? CHART_COLORS.ink : channelColor(opts.channels, s.channel);
    series.push({
      label: `${s.channel} ${s.edge}`,
      scale: s.scale,
      stroke: color,
      width: s.channel === 'pressure' ? 2 : 1.25,
      points: { show: false },
    });
    if (s.edge === 'max') bands.push({ series: [k + 1, k + 2], fill: `${color}33` });
  });
  const hasStrain = opts.specs.some((s) => s.scale === 'y');
  const ext = measureExtents(opts.data, opts.specs);
  const ranges = alignZeroRanges(ext.strainMin, ext.strainMax, ext.pressureMax);
  const axes: uPlot.Axis[] = [styleAxis(opts.timeIsIndex ? 'Sample' : 'Time (s)')];
  if (hasStrain) axes.push(styleAxis('Strain (µε)', { scale: 'y', size: 64 }));
  axes.push(
    styleAxis(`Pressure (${opts.pressureUnit})`, {
      scale: 'p',
      side: 1,
      size: 64,
      ...(hasStrain ? { grid: { show: false } } : {}),
    }),
  );
  return {
    legend: { show: false },
    cursor: { drag: { x: true, y: false, setScale: false }, points: { show: false } },
    scales: {
      x: { time: false },
      y: { range: () => (hasStrain ? ranges.strain : [0, 1]) },
      p: { range: () => (hasStrain ? ranges.pressure : [0, ext.pressureMax > 0 ? ext.pressureMax * 1.08 : 1]) },
    },
    axes,
    series,
    bands,
    hooks: {
      setCursor: [(u) => opts.onCursor?.(u.cursor.idx ?? null)],
      setSelect: [
        (u) => {
          const { left, width } = u.select;
          if (width < 4) return;
          const t0 = u.posToVal(left, 'x');
          const t1 = u.posToVal(left + width, 'x');
          u.setSelect({ left: 0, top: 0, width: 0, height: 0 }, false);
          opts.onSelectWindow(t0, t1);
        },
      ],
    },
  };
}
