import 'uplot/dist/uPlot.min.css';
import { useCallback, useEffect, useId, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { decodeSeries, type DecodedSeries, type EncodedSeries } from '../../lib/series-encoding';
import { formatFixed, type PressureUnit } from '../../lib/ui-format';
import { api } from '../api';
import { LegendSwatch } from './ChartLegend';
import { CHART_COLORS } from './outcome-style';
import { buildSeriesUrl, buildTimeHistoryData, readAtIndex, scaleWindow } from './series-data';
import { buildTimeHistoryOptions, channelColor } from './time-history-options';
import { useUplot } from './use-uplot';

interface Props {
  /** e.g. `/api/tests/12/series` or `/api/share/TOKEN/series` */
  seriesUrl: string;
  /** gauge channel names the reader may choose from */
  channels: string[];
  pressureUnit: PressureUnit;
  /** channels shown at first; the first three by default */
  initialChannels?: string[];
  /** the reduction whose series this is (lets the browser keep the answers) */
  reductionId?: number | null;
  /** what a person calls each channel: `A1 (CH03)`, `R1/B (CH07)`; the channel name when absent */
  channelLabels?: Record<string, string>;
}

type Window = [number, number];
const heightFor = (w: number) => Math.round(Math.min(420, Math.max(260, w * 0.42)));

/** Pressure and chosen strain channels over time; drag to zoom, which fetches finer buckets. */
export default function TimeHistoryPlot({
  seriesUrl,
  channels,
  pressureUnit,
  initialChannels,
  reductionId = null,
  channelLabels = {},
}: Props) {
  const nameOf = (c: string) => channelLabels[c] ?? c;
  const [cursor, setCursor] = useState<number | null>(null);
  const chartEl = useRef<HTMLDivElement>(null);
  const groupId = useId();
  const [chosen, setChosen] = useState<string[]>(initialChannels ?? channels.slice(0, 3));
  const [view, setView] = useState<Window | null>(null);
  const [full, setFull] = useState<Window | null>(null);
  const [series, setSeries] = useState<DecodedSeries | null>(null);
  const [loading, setLoading] = useState(true);
  const [error, setError] = useState<string | null>(null);
  const [attempt, setAttempt] = useState(0);

  useEffect(() => {
    const ctrl = new AbortController();
    setLoading(true);
    setError(null);
    const range = view ? { from: view[0], to: view[1] } : null;
    api<EncodedSeries>(buildSeriesUrl(seriesUrl, range, undefined, reductionId), { signal: ctrl.signal })
      .then((answer) => {
        const s = decodeSeries(answer);
        setSeries(s);
        if (!view && s.t.length > 1) setFull([s.t[0]!, s.t[s.t.length - 1]!]);
      })
      .catch((e: Error) => {
        if (!ctrl.signal.aborted) setError(`The time history could not be loaded: ${e.message}`);
      })
      .finally(() => {
        if (!ctrl.signal.aborted) setLoading(false);
      });
    return () => ctrl.abort();
  }, [seriesUrl, view, attempt, reductionId]);

  const onSelectWindow = useCallback((t0: number, t1: number) => {
    if (t1 > t0) setView([t0, t1]);
  }, []);
  const plot = useMemo(
    () => (series && series.t.length > 0 ? buildTimeHistoryData(series, chosen) : null),
    [series, chosen],
  );
  const options = useMemo(
    () =>
      plot && series
        ? buildTimeHistoryOptions({
            specs: plot.specs,
            data: plot.data,
            channels,
            pressureUnit,
            timeIsIndex: series.timeIsIndex,
            onSelectWindow,
            onCursor: setCursor,
          })
        : null,
    [plot, series, channels, pressureUnit, onSelectWindow],
  );
  useUplot(chartEl, options, plot?.data ?? null, heightFor);

  const current: Window | null = view ?? full;
  const zoom = (factor: number) => {
    if (current && full) setView(scaleWindow(current, full, factor));
  };
  const toggle = (c: string) =>
    setChosen((cs) => (cs.includes(c) ? cs.filter((x) => x !== c) : channels.filter((x) => x === c || cs.includes(x))));
  const unit = series?.timeIsIndex ? '' : ' s';
  const pan = (direction: -1 | 1) => {
    if (!current || !full) return;
    const step = ((current[1] - current[0]) / 4) * direction;
    const lo = Math.max(full[0], Math.min(full[1] - (current[1] - current[0]), current[0] + step));
    setView([lo, lo + (current[1] - current[0])]);
  };
  const onKey = (e: KeyboardEvent) => {
    if (e.key === '+' || e.key === '=') zoom(0.5);
    else if (e.key === '-') zoom(2);
    else if (e.key === '0' || e.key === 'Home') setView(null);
    else if (e.key === 'ArrowLeft') pan(-1);
    else if (e.key === 'ArrowRight') pan(1);
    else return;
    e.preventDefault();
  };
  const reading = plot && cursor !== null ? readAtIndex(plot.data, plot.specs, cursor) : null;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" className="btn-secondary" onClick={() => zoom(0.5)} disabled={!full}>
          Zoom in
        </button>
        <button type="button" className="btn-secondary" onClick={() => zoom(2)} disabled={!view}>
          Zoom out
        </button>
        <button type="button" className="btn-secondary" onClick={() => setView(null)} disabled={!view}>
          Reset zoom
        </button>
        <span className="num text-sm text-ink-700" aria-live="polite">
          {current &&
            `Showing ${formatFixed(current[0], 0)}–${formatFixed(current[1], 0)}${unit}${view ? ' (zoomed) · ' : ' · '}drag across the chart, or focus it and use + − ← →, to zoom`}
        </span>
      </div>
      {error && (
        <div className="flex flex-wrap items-center gap-3">
          <p role="alert" className="error-text mt-0">
            {error}
          </p>
          <button type="button" className="btn-secondary" onClick={() => setAttempt((n) => n + 1)}>
            Try again
          </button>
        </div>
      )}
      <div className={`relative ${series || loading ? 'min-h-64' : ''}`}>
        <div
          ref={chartEl}
          role="img"
          tabIndex={0}
          onKeyDown={onKey}
          aria-label={`Pressure and strain of ${chosen.map(nameOf).join(', ') || 'no channel'} over time. Keys: plus and minus zoom, left and right arrows move, 0 resets.`}
          className="w-full min-w-0 rounded focus-visible:outline-3 focus-visible:outline-brass-500"
          data-testid="time-history-chart"
        />
        <p className="num mt-1 min-h-5 text-sm text-ink-800" data-testid="time-history-readout">
          {reading && reading.t !== null
            ? [
                `${series?.timeIsIndex ? 'sample' : 't ='} ${formatFixed(reading.t, 1)}${unit}`,
                ...reading.values.map((v) =>
                  v.channel === 'pressure'
                    ? `pressure ${v.value === null ? '—' : formatFixed(v.value, 3)} ${pressureUnit}`
                    : `${nameOf(v.channel)} ${v.value === null ? '—' : formatFixed(v.value, 1)} µε`,
                ),
              ].join(' · ')
            : 'Point at the chart to read time, pressure and strain.'}
        </p>
        {loading && (
          <p
            role="status"
            className="absolute top-2 right-2 rounded bg-white/90 px-2 py-1 text-sm font-medium text-ink-800 shadow-xs"
          >
            Loading time history…
          </p>
        )}
        {!loading && series && series.t.length === 0 && (
          <p className="text-sm text-ink-700">No samples in this window.</p>
        )}
      </div>
      <fieldset className="flex flex-wrap gap-x-4 gap-y-2" aria-describedby={groupId}>
        <legend className="label">Channels</legend>
        <span id={groupId} className="inline-flex items-center gap-1.5 text-sm text-ink-900">
          <LegendSwatch kind="line" color={CHART_COLORS.ink} />
          Pressure ({pressureUnit}, right axis)
        </span>
        {channels.map((c) => (
          <label key={c} className="inline-flex cursor-pointer items-center gap-1.5 text-sm text-ink-900">
            <input
              type="checkbox"
              className="size-4 accent-ink-800"
              checked={chosen.includes(c)}
              onChange={() => toggle(c)}
            />
            <LegendSwatch kind="line" color={channelColor(channels, c)} />
            {nameOf(c)}
          </label>
        ))}
      </fieldset>
    </div>
  );
}
