// Bounded time history for plots: per bucket the min and max of every channel, so spikes survive.
// The bucket width doubles whenever the log outgrows the bucket count, so memory is fixed.
import { InputError } from './errors';
import type { Series } from './types';

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
    for (let k = 0; k < nC; k++) {
      const v = values[k]!;
      if (v < mn[base + k]!) mn[base + k] = v;
      if (v > mx[base + k]!) mx[base + k] = v;
    }
    this.count[idx]++;
    if (idx + 1 > this.used) this.used = idx + 1;
  }

  private compress() {
    const nC = this.nC,
      half = this.maxB / 2;
    const mn = this.min,
      mx = this.max;
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
    for (const c of this.channels) {
      out.min[c] = [];
      out.max[c] = [];
    }
    for (let i = 0; i < this.used; i++) {
      if (this.count[i] === 0) continue;
      out.t.push(this.t0 + i * this.w);
      this.channels.forEach((c, k) => {
        const tr = transform?.[k] ?? { offset: 0, scale: 1 };
        let lo = this.min[i * this.nC + k]!,
          hi = this.max[i * this.nC + k]!;
        if (lo === Infinity) lo = hi = NaN; // channel missing in this bucket (JSON: null)
        const a = (lo - tr.offset) * tr.scale,
          b = (hi - tr.offset) * tr.scale;
        out.min[c]!.push(Math.min(a, b));
        out.max[c]!.push(Math.max(a, b));
      });
    }
    return out;
  }
}

/** Re-bucket a stored series to at most `points` buckets over [from, to], keeping each bucket's min and max. */
export function decimateSeries(series: Series, opts: { from?: number; to?: number; points: number }): Series {
  const points = Math.floor(opts.points);
  if (!(points >= 1))
    throw new InputError('invalid-series-request', 'points: must be a whole number of at least 1', { path: 'points' });
  const n = series.t.length;
  const from = opts.from ?? (n ? series.t[0]! : 0);
  const to = opts.to ?? (n ? series.t[n - 1]! : 0);
  if (!(to >= from)) throw new InputError('invalid-series-request', 'to: must not be before from', { path: 'to' });
  const out: Series = { t: [], min: {}, max: {}, channels: [...series.channels], timeIsIndex: series.timeIsIndex };
  for (const c of series.channels) {
    out.min[c] = [];
    out.max[c] = [];
  }
  const width = (to - from) / points;
  let current = -1;
  for (let i = 0; i < n; i++) {
    const t = series.t[i]!;
    if (t < from || t > to) continue;
    const j = width > 0 ? Math.min(points - 1, Math.floor((t - from) / width)) : 0;
    if (j !== current) {
      current = j;
      out.t.push(t);
      for (const c of series.channels) {
        out.min[c]!.push(series.min[c]?.[i] ?? NaN);
        out.max[c]!.push(series.max[c]?.[i] ?? NaN);
      }
      continue;
    }
    const last = out.t.length - 1;
    for (const c of series.channels) {
      const lo = series.min[c]?.[i] ?? NaN,
        hi = series.max[c]?.[i] ?? NaN;
      const mn = out.min[c]!,
        mx = out.max[c]!;
      if (lo === lo && (mn[last]! !== mn[last]! || lo < mn[last]!)) mn[last] = lo;
      if (hi === hi && (mx[last]! !== mx[last]! || hi > mx[last]!)) mx[last] = hi;
    }
  }
  return out;
}
