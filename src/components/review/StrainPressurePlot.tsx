import 'uplot/dist/uPlot.min.css';
import { useId, useMemo, useRef } from 'react';
import type uPlot from 'uplot';
import type { GaugeResult } from '../../lib/reduction/types';
import { formatPercent, formatRatio, formatRSquared, formatSlope, type PressureUnit } from '../../lib/ui-format';
import ChartLegend, { type LegendItem } from './ChartLegend';
import OutcomeBadge from './OutcomeBadge';
import { drawSeriesMarkers, drawVerticalMarker } from './canvas-markers';
import { CHART_COLORS } from './outcome-style';
import { buildStrainPlotData } from './strain-plot-data';
import { styleAxis, useUplot, type ChartOptions } from './use-uplot';

interface Props {
  gauge: GaugeResult;
  /** plan pressure unit */
  testPressure: number;
  /** tolerance band as a fraction, 0.10 for ±10 % */
  slopeBand: number;
  pressureUnit: PressureUnit;
}

const LOADING = 5;
const UNLOADING = 6;
const hidden: uPlot.Series.PathBuilder = () => null;

/** The band's legend: ±band, or how the engine made it when not relative to the prediction. */
function bandLabel(g: GaugeResult, slopeBand: number): string {
  if (g.bandBasis === 'uncertainty') return 'Band from the uncertainties';
  if (g.bandBasis === 'near-zero') return `Band ±${formatPercent(slopeBand, 0)} of the largest principal strain`;
  return `Band ±${formatPercent(slopeBand, 0)}`;
}

/** Strain against pressure for one gauge: hold averages, fitted and predicted lines, tolerance band. */
export default function StrainPressurePlot({ gauge, testPressure, slopeBand, pressureUnit }: Props) {
  const chartEl = useRef<HTMLDivElement>(null);
  const captionId = useId();
  const plot = useMemo(() => buildStrainPlotData(gauge, testPressure, slopeBand), [gauge, testPressure, slopeBand]);
  const data = useMemo<uPlot.AlignedData>(
    () => [plot.x, plot.bandUpper, plot.bandLower, plot.predicted, plot.fit, plot.loading, plot.unloading],
    [plot],
  );
  const options = useMemo<ChartOptions>(
    () => ({
      legend: { show: false },
      cursor: { show: false },
      scales: {
        x: { time: false, range: [0, plot.xMax] },
        y: {
          range: (_u, min, max) => {
            const lo = Math.min(0, min),
              hi = Math.max(0, max),
              pad = (hi - lo) * 0.06 || 1;
            return [lo - pad, hi + pad];
          },
        },
      },
      axes: [styleAxis(`Pressure (${pressureUnit})`), styleAxis('Strain (µε)', { size: 64 })],
      series: [
        {},
        { label: 'band upper', stroke: 'rgba(168, 107, 18, 0.45)', width: 1, points: { show: false } },
        { label: 'band lower', stroke: 'rgba(168, 107, 18, 0.45)', width: 1, points: { show: false } },
        { label: 'predicted', stroke: CHART_COLORS.brass, width: 2, dash: [8, 5], points: { show: false } },
        { label: 'fitted', stroke: CHART_COLORS.ink, width: 2, points: { show: false } },
        { label: 'loading', paths: hidden, points: { show: false } },
        { label: 'unloading', paths: hidden, points: { show: false } },
      ],
      bands: [{ series: [1, 2], fill: CHART_COLORS.bandFill }],
      hooks: {
        draw: [
          (u) => {
            drawVerticalMarker(u, testPressure, 'test pressure', CHART_COLORS.inkLight);
            // unloading squares first and larger, so a loading dot at the same place shows inside
            drawSeriesMarkers(u, UNLOADING, 'square-open', CHART_COLORS.unloading, 12);
            drawSeriesMarkers(u, LOADING, 'dot', CHART_COLORS.ink, 8);
          },
        ],
      },
    }),
    [plot.xMax, pressureUnit, testPressure],
  );
  useUplot(chartEl, options, data);

  const legend: LegendItem[] = [
    { label: 'Loading holds', color: CHART_COLORS.ink, kind: 'dot' },
    { label: 'Unloading holds', color: CHART_COLORS.unloading, kind: 'square-open' },
    { label: 'Fitted (loading)', color: CHART_COLORS.ink, kind: 'line' },
    { label: 'Predicted', color: CHART_COLORS.brass, kind: 'dashed' },
    { label: bandLabel(gauge, slopeBand), color: CHART_COLORS.bandFill, kind: 'band' },
  ];
  const summary = `Strain against pressure for gauge ${gauge.id}: measured ${formatSlope(gauge.measuredSlope, pressureUnit)}, predicted ${formatSlope(gauge.predictedSlope, pressureUnit)}, ratio ${formatRatio(gauge.ratio)}.`;

  return (
    <figure className="min-w-0 space-y-2" aria-labelledby={captionId}>
      <div
        ref={chartEl}
        role="img"
        aria-label={summary}
        className="w-full min-w-0"
        data-testid="strain-pressure-chart"
      />
      <ChartLegend items={legend} label={`Legend for gauge ${gauge.id}`} />
      <figcaption id={captionId} className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm text-ink-900">
        <span className="font-semibold">
          Gauge {gauge.id}{' '}
          <span className="font-normal text-ink-700">
            ({gauge.channel}, {gauge.angleDeg}°)
          </span>
        </span>
        <span className="num">
          Measured/predicted <strong>{formatRatio(gauge.ratio)}</strong>
        </span>
        <span className="num">
          R² <strong>{formatRSquared(gauge.rSquared)}</strong>
        </span>
        <span className="num">
          Measured {formatSlope(gauge.measuredSlope, pressureUnit)} · predicted{' '}
          {formatSlope(gauge.predictedSlope, pressureUnit)}
        </span>
        <OutcomeBadge outcome={gauge.outcome} compact />
      </figcaption>
    </figure>
  );
}
