// The compact columnar form of a decimated time history (GET …/series): every value is a whole
// number of its channel's resolution step, delta-coded along the column, and each bucket's
// maximum is sent as its span above the minimum. The server encodes, the island decodes; both
// sides share this file. Small numbers with repeating digits also compress very well.
import type { Series } from './reduction/types';

export const SERIES_FORMAT = 'hoopline-series-columnar/1';

/** One channel: `min` delta-coded in steps (null: no sample in the bucket), `span` = max − min in steps. */
export interface EncodedChannel {
  name: string;
  step: number;
  min: (number | null)[];
  span: (number | null)[];
}

export interface EncodedSeries {
  format: typeof SERIES_FORMAT;
  reductionId: number;
  timeIsIndex: boolean;
  /** bucket start times, delta-coded in `t.step` */
  t: { step: number; d: number[] };
  channels: EncodedChannel[];
}

/** What the island plots: the Series shape with `null` where a bucket has no sample (a gap for uPlot). */
export interface DecodedSeries {
  reductionId: number;
  timeIsIndex: boolean;
  t: number[];
  channels: string[];
  min: Record<string, (number | null)[]>;
  max: Record<string, (number | null)[]>;
}

/** Finest step kept for values and for time, as a fraction of the column's range. */
const VALUE_RANGE_FRACTION = 1e-5;
const TIME_RANGE_FRACTION = 1e-6;
const MAX_DECIMALS = 6;

/** 10^e as the nearest double to the decimal (10 ** -4 is 0.00009999999999999999). */
const powerOfTen = (e: number) => Number(`1e${e}`);

function extent(columns: readonly ArrayLike<number | null>[]): [number, number] | null {
  let lo = Infinity,
    hi = -Infinity;
  for (const c of columns)
    for (let i = 0; i < c.length; i++) {
      const v = c[i];
      if (v === null || v === undefined || !Number.isFinite(v)) continue;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  return lo <= hi ? [lo, hi] : null;
}

function isMultipleOf(columns: readonly ArrayLike<number | null>[], scale: number): boolean {
  for (const c of columns)
    for (let i = 0; i < c.length; i++) {
      const v = c[i];
      if (v === null || v === undefined || !Number.isFinite(v)) continue;
      const k = v * scale;
      // binary noise of a decimal (12.34 × 100 = 1234.0000000000002) is not a finer step
      if (Math.abs(k - Math.round(k)) > 1e-6 + Math.abs(k) * 1e-12) return false;
    }
  return true;
}

/**
 * The channel's resolution: the decimal step its values were recorded at (1, 0.1, … 1e-6) when
 * every value is a whole number of such a step, but never finer than `rangeFraction` of the
 * channel's range (corrected strains are no longer decimal; a plot cannot show finer steps).
 * @example channelResolution([[0, 0.25, 1.5]]) // 0.01
 */
export function channelResolution(
  columns: readonly ArrayLike<number | null>[],
  rangeFraction = VALUE_RANGE_FRACTION,
): number {
  const ext = extent(columns);
  if (!ext) return 1;
  const range = ext[1] - ext[0] || Math.abs(ext[1]) || 1;
  const finest = powerOfTen(Math.floor(Math.log10(range * rangeFraction)));
  for (let d = 0; d <= MAX_DECIMALS; d++) {
    const step = powerOfTen(-d);
    if (step < finest) break;
    if (isMultipleOf(columns, powerOfTen(d))) return step;
  }
  return finest;
}

/** The resolution of time and of every channel of a (stored, full) series. */
export function seriesResolutions(series: Series): { t: number; channels: Record<string, number> } {
  return {
    t: channelResolution([series.t], TIME_RANGE_FRACTION),
    channels: Object.fromEntries(
      series.channels.map((c) => [c, channelResolution([series.min[c] ?? [], series.max[c] ?? []])]),
    ),
  };
}

/** Steps in `scale` per unit: 1/step, exact for decimal steps (0.1 → 10, not 9.999…). */
const perUnit = (step: number) => (step < 1 ? Math.round(1 / step) : 1 / step);

function deltaCode(values: ArrayLike<number | null>, step: number): (number | null)[] {
  const k = perUnit(step);
  const out: (number | null)[] = new Array<number | null>(values.length);
  let prev = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v === null || v === undefined || !Number.isFinite(v)) {
      out[i] = null;
      continue;
    }
    const q = Math.round(v * k);
    out[i] = q - prev;
    prev = q;
  }
  return out;
}

/**
 * Encode a decimated series. `steps` gives each channel's resolution (computed once on the
 * reduction's full stored series, so every window of it uses the same steps); a channel without
 * one gets the resolution of the values at hand.
 */
export function encodeSeries(
  series: Series,
  reductionId: number,
  steps: { t?: number; channels?: Readonly<Record<string, number>> } = {},
): EncodedSeries {
  const tStep = steps.t ?? seriesResolutions(series).t;
  const channels = series.channels.map((name): EncodedChannel => {
    const lo = series.min[name] ?? [];
    const hi = series.max[name] ?? [];
    const step = steps.channels?.[name] ?? channelResolution([lo, hi]);
    const k = perUnit(step);
    const span = new Array<number | null>(series.t.length);
    const minKept = new Array<number | null>(series.t.length);
    for (let i = 0; i < series.t.length; i++) {
      const a = lo[i],
        b = hi[i];
      if (a === undefined || b === undefined || !Number.isFinite(a) || !Number.isFinite(b)) {
        span[i] = minKept[i] = null;
        continue;
      }
      const qa = Math.round(a * k);
      minKept[i] = a;
      span[i] = Math.max(0, Math.round(b * k) - qa);
    }
    return { name, step, min: deltaCode(minKept, step), span };
  });
  return {
    format: SERIES_FORMAT,
    reductionId,
    timeIsIndex: series.timeIsIndex,
    t: { step: tStep, d: deltaCode(series.t, tStep) as number[] },
    channels,
  };
}

/** A value `q` steps of `step`, printed without binary noise (0.1 × 3 → 0.3). */
function fromSteps(q: number, step: number): number {
  if (step >= 1) return q * step;
  const k = perUnit(step);
  return q / k;
}

/** Decode the columnar form back into plot arrays. Throws on a format this code does not know. */
export function decodeSeries(e: EncodedSeries): DecodedSeries {
  if (e.format !== SERIES_FORMAT) throw new Error(`unknown series format ${String(e.format)}`);
  const t: number[] = new Array<number>(e.t.d.length);
  let acc = 0;
  for (let i = 0; i < e.t.d.length; i++) {
    acc += e.t.d[i] ?? 0;
    t[i] = fromSteps(acc, e.t.step);
  }
  const min: DecodedSeries['min'] = {};
  const max: DecodedSeries['max'] = {};
  for (const c of e.channels) {
    const lo: (number | null)[] = new Array<number | null>(c.min.length);
    const hi: (number | null)[] = new Array<number | null>(c.min.length);
    let q = 0;
    for (let i = 0; i < c.min.length; i++) {
      const d = c.min[i];
      const s = c.span[i];
      if (d === null || d === undefined || s === null || s === undefined) {
        lo[i] = hi[i] = null;
        continue;
      }
      q += d;
      lo[i] = fromSteps(q, c.step);
      hi[i] = fromSteps(q + s, c.step);
    }
    min[c.name] = lo;
    max[c.name] = hi;
  }
  return {
    reductionId: e.reductionId,
    timeIsIndex: e.timeIsIndex,
    t,
    channels: e.channels.map((c) => c.name),
    min,
    max,
  };
}
