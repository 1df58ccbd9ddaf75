// The decimated time history of a reduction: the worker stores a fine min/max series (20 000
// buckets) in object storage; this re-buckets the requested window to at most `points`, so the
// browser never sees the raw log and an answer stays well under 1 MB.
import { z } from 'zod';
import { decimateSeries } from '../lib/reduction';
import type { Series } from '../lib/reduction/types';
import { errors } from './errors';
import { zodToAppError } from './http';
import { getObjectText } from './storage.server';

const cache = new Map<string, Series>();
const CACHE_ENTRIES = 8;

async function loadSeries(key: string): Promise<Series> {
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const series = JSON.parse(await getObjectText(key)) as Series;
  cache.set(key, series);
  if (cache.size > CACHE_ENTRIES) cache.delete(cache.keys().next().value!);
  return series;
}

const querySchema = z
  .object({
    from: z.coerce.number().optional(),
    to: z.coerce.number().optional(),
    points: z.coerce.number().int().min(10).max(5000).default(1000),
    channels: z.string().optional(),
  })
  .refine((q) => q.from === undefined || q.to === undefined || q.to > q.from, {
    path: ['to'],
    message: 'must be greater than from',
  });

/** Round to keep the JSON small: 4 significant digits beyond the integer part is plenty for a plot. */
const round = (v: number) => (Number.isFinite(v) ? Math.round(v * 1000) / 1000 : v);

/** GET …/series?from&to&points&channels=a,b for a stored series key. */
export async function readSeries(seriesKey: string | null, url: URL) {
  if (!seriesKey) throw errors.notFound('reduced time history yet: run a reduction first');
  const q = querySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!q.success) throw zodToAppError(q.error);
  const full = await loadSeries(seriesKey);
  const s = decimateSeries(full, { from: q.data.from, to: q.data.to, points: q.data.points });
  const wanted = q.data.channels ? new Set(['pressure', ...q.data.channels.split(',')]) : null;
  const channels = s.channels.filter((c) => !wanted || wanted.has(c));
  const pick = (rec: Record<string, number[]>) =>
    Object.fromEntries(channels.map((c) => [c, (rec[c] ?? []).map(round)]));
  return { ...s, t: s.t.map(round), channels, min: pick(s.min), max: pick(s.max) };
}
