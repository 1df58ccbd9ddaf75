// Bounded time history for plots: per bucket the min and max of every channel, so spikes survive.
// The bucket width doubles whenever the log outgrows the bucket count, so memory is fixed.
import { InputError } from './errors';
import type { Series } from './types';

/** The array under key `name`, created empty on first use (two channels of one name share it). */
function column(record: Record<string, number[]>, name: string): number[] {
  return (record[name] ??= []);
}

const IDENTITY = { offset: 0, scale: 1 };

export class SeriesBuilder {
  private readonly nC: number;
  private readonly maxB: number;
  private readonly min: Float64Array;
  private readonly max: Float64Array;
  private readonly count: Float64Array;
  private t0 = NaN;
  private w: number;
  private used = 0;

  constructor(
    private readonly channels: string[],
    maxBuckets: number,
    private readonly timeIsIndex: boolean,
    initialWidth = timeIsIndex ? 1 : 0.001,
  ) {
    this.nC = channels.length;
    this.maxB = Math.max(2, Math.floor(maxBuckets / 2) * 2);
    this.min = new Float64Array(this.maxB * this.nC).fill(Infinity);
    this.max = new Float64Array(this.maxB * this.nC).fill(-Infinity);
    this.count = new Float64Array(this.maxB);
    this.w = initialWidth;
  }

  /** `values` holds one value per channel (at least as many as the channel names). */
  add(t: number, values: ArrayLike<number>): void {
    if (this.t0 !== this.t0) this.t0 = t;
    let idx = Math.floor((t - this.t0) / this.w);
    if (!(idx >= 0)) idx = 0;
    while (idx >= this.maxB) {
      this.compress();
      idx = Math.floor((t - this.t0) / this.w);
    }
    const nC = this.nC;
    const base = idx * nC;
    const mn = this.min,
      mx = this.max;
    // hot: idx < maxB, so base + k lies inside min and max (maxB × nC values each)
    for (let k = 0; k < nC; k++) {
      const v = values[k]!;
      if (v < mn[base + k]!) mn[base + k] = v;
      if (v > mx[base + k]!) mx[base + k] = v;
    }
    this.count[idx]!++;
    if (idx + 1 > this.used) this.used = idx + 1;
  }

  private compress() {
    const nC = this.nC,
      half = this.maxB / 2;
    const mn = this.min,
      mx = this.max;
    // buckets 2i and 2i + 1 < maxB fold into bucket i
    for (let i = 0; i < half; i++) {
      const a = 2 * i * nC,
        b = (2 * i + 1) * nC,
        d = i * nC;
      for (let k = 0; k < nC; k++) {
        mn[d + k] = Math.min(mn[a + k]!, mn[b + k]!);
        mx[d + k] = Math.max(mx[a + k]!, mx[b + k]!);
      }
      this.count[i] = this.count[2 * i]! + this.count[2 * i + 1]!;
    }
    mn.fill(Infinity, half * nC);
    mx.fill(-Infinity, half * nC);
    this.count.fill(0, half);
    this.used = Math.ceil(this.used / 2);
    this.w *= 2;
  }

  /** The series; `transform[k]` (offset, scale) is applied to channel k (used to zero and correct strains). */
  build(transform?: { offset: number; scale: number }[]): Series {
    const out: Series = { t: [], min: {}, max: {}, channels: [...this.channels], timeIsIndex: this.timeIsIndex };
    const columns = this.channels.map((c, k) => ({
      min: column(out.min, c),
      max: column(out.max, c),
      tr: transform?.[k] ?? IDENTITY,
    }));
    for (let i = 0; i < this.used; i++) {
      if (this.count[i] === 0) continue;
      out.t.push(this.t0 + i * this.w);
      for (const [k, { min, max, tr }] of columns.entries()) {
        // i < used ≤ maxB and k < nC; a value outside the arrays would read as an empty bucket
        let lo = this.min[i * this.nC + k] ?? Infinity,
          hi = this.max[i * this.nC + k] ?? -Infinity;
        if (lo === Infinity) lo = hi = NaN; // channel missing in this bucket (JSON: null)
        const a = (lo - tr.offset) * tr.scale,
          b = (hi - tr.offset) * tr.scale;
        min.push(Math.min(a, b));
        max.push(Math.max(a, b));
      }
    }
    return out;
  }
}

/** Re-bucket a stored series to at most `points` buckets over [from, to], keeping each bucket's min and max. */
export function decimateSeries(series: Series, opts: { from?: number; to?: number; points: number }): Series {
  const points = Math.floor(opts.points);
  if (!(points >= 1))
    throw new InputError('invalid-series-request', 'points: must be a whole number of at least 1', { path: 'points' });
  // an empty series has no span: [0, 0] unless the request names one
  const from = opts.from ?? series.t[0] ?? 0;
  const to = opts.to ?? series.t.at(-1) ?? 0;
  if (!(to >= from)) throw new InputError('invalid-series-request', 'to: must not be before from', { path: 'to' });
  const out: Series = { t: [], min: {}, max: {}, channels: [...series.channels], timeIsIndex: series.timeIsIndex };
  // a channel the stored series lacks reads as missing (NaN) in every bucket
  const columns = series.channels.map((c) => ({
    fromMin: series.min[c],
    fromMax: series.max[c],
    min: column(out.min, c),
    max: column(out.max, c),
  }));
  const width = (to - from) / points;
  let current = -1;
  for (const [i, t] of series.t.entries()) {
    if (t < from || t > to) continue;
    const j = width > 0 ? Math.min(points - 1, Math.floor((t - from) / width)) : 0;
    if (j !== current) {
      current = j;
      out.t.push(t);
      for (const { fromMin, fromMax, min, max } of columns) {
        min.push(fromMin?.[i] ?? NaN);
        max.push(fromMax?.[i] ?? NaN);
      }
      continue;
    }
    const last = out.t.length - 1;
    for (const { fromMin, fromMax, min, max } of columns) {
      const lo = fromMin?.[i] ?? NaN,
        hi = fromMax?.[i] ?? NaN;
      // NaN: no value in the bucket yet
      const curLo = min[last] ?? NaN,
        curHi = max[last] ?? NaN;
      if (lo === lo && (curLo !== curLo || lo < curLo)) min[last] = lo;
      if (hi === hi && (curHi !== curHi || hi > curHi)) max[last] = hi;
    }
  }
  return out;
}
