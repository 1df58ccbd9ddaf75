// A decimated time history for the fixture test (what GET …/series answers), built from the
// fixture's holds and hold strains: ramps between holds, small noise, one spike on SG2.
import type { Series } from '../../lib/reduction/types';
import { FIXTURE_GAUGES, FIXTURE_HOLDS } from './fixtures';

const SAMPLE_HZ = 10;
const END_S = 1900;

/** Deterministic noise in [−1, 1): the same time gives the same value in every run. */
function noiseAt(t: number, seed: number): number {
  const x = Math.sin(t * 12.9898 + seed * 78.233) * 43758.5453;
  return 2 * (x - Math.floor(x)) - 1;
}

/** Value at time t, holding each hold's level and ramping linearly between holds. */
function levelAt(t: number, levels: readonly number[]): number {
  const holds = FIXTURE_HOLDS;
  if (t <= holds[0]!.end) return levels[0]!;
  for (let i = 1; i < holds.length; i++) {
    const h = holds[i]!;
    const prev = holds[i - 1]!;
    if (t < h.start) return levels[i - 1]! + ((levels[i]! - levels[i - 1]!) * (t - prev.end)) / (h.start - prev.end);
    if (t <= h.end) return levels[i]!;
  }
  return levels[levels.length - 1]!;
}

/** Bucketed min/max of every channel over [from, to], at most `points` buckets. */
export function makeFixtureSeries(opts: { from?: number; to?: number; points?: number } = {}): Series {
  const from = Math.max(0, opts.from ?? 0);
  const to = Math.min(END_S, opts.to ?? END_S);
  const points = Math.max(1, opts.points ?? 1500);
  const n = Math.max(1, Math.floor((to - from) * SAMPLE_HZ) + 1);
  const per = Math.max(1, Math.ceil(n / points));
  const pressureLevels = FIXTURE_HOLDS.map((h) => h.pressure);
  const channels = ['pressure', ...FIXTURE_GAUGES.map((g) => g.channel)];
  const t: number[] = [];
  const min: Record<string, number[]> = Object.fromEntries(channels.map((c) => [c, []]));
  const max: Record<string, number[]> = Object.fromEntries(channels.map((c) => [c, []]));
  for (let start = 0; start < n; start += per) {
    t.push(from + start / SAMPLE_HZ);
    channels.forEach((c, k) => {
      let lo = Infinity;
      let hi = -Infinity;
      for (let j = start; j < Math.min(n, start + per); j++) {
        const time = from + j / SAMPLE_HZ;
        const v =
          c === 'pressure'
            ? levelAt(time, pressureLevels) + 0.004 * noiseAt(time, 0)
            : levelAt(
                time,
                FIXTURE_GAUGES[k - 1]!.holdStrains.map((s) => s ?? 0),
              ) +
              1.5 * noiseAt(time, k) +
              (c === 'SG2' && Math.abs(time - 1000) < 0.15 ? 45 : 0);
        lo = Math.min(lo, v);
        hi = Math.max(hi, v);
      }
      min[c]!.push(lo);
      max[c]!.push(hi);
    });
  }
  return { t, min, max, channels, timeIsIndex: false };
}
