// The decimated time history of a reduction (GET …/series). The worker stores a fine min/max
// series (20 000 buckets) in object storage once; this server keeps the decoded series of the
// reductions people look at in a cache bounded by bytes, re-buckets a requested window to at
// most `points`, encodes it compactly (src/lib/series-encoding.ts) and keeps that answer,
// compressed, for the next reader of the same window. A reduction's series never changes, so an
// answer's ETag names the reduction and the window, and a browser that has it gets 304.
import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import { getConfig } from '../config.server';
import { getDb } from '../db/client.server';
import { findSeriesSource } from '../db/queries/series';
import { decimateSeries } from '../lib/reduction';
import type { Series } from '../lib/reduction/types';
import { encodeSeries, SERIES_FORMAT, seriesResolutions } from '../lib/series-encoding';
import { chooseCoding, compressBytes } from './compression.server';
import { errors } from './errors';
import { seriesQuery } from './api/schemas';
import { zodToAppError } from './http';
import { logger } from './observability/logger.server';
import { getObjectText } from './storage.server';

interface StoredSeries {
  series: Series;
  steps: ReturnType<typeof seriesResolutions>;
  bytes: number;
}

interface Answer {
  identity: Buffer;
  br: Buffer;
  gzip: Buffer;
}

/** A stored series as plain arrays of doubles (missing values NaN), and its size in memory. */
function toStored(parsed: Series): StoredSeries {
  const col = (values: readonly (number | null)[] | undefined) => Array.from(values ?? [], (v) => v ?? NaN);
  const series: Series = {
    t: col(parsed.t),
    channels: [...parsed.channels],
    timeIsIndex: parsed.timeIsIndex,
    min: Object.fromEntries(parsed.channels.map((c) => [c, col(parsed.min[c])])),
    max: Object.fromEntries(parsed.channels.map((c) => [c, col(parsed.max[c])])),
  };
  const values = series.t.length * (1 + 2 * series.channels.length);
  return { series, steps: seriesResolutions(series), bytes: values * 8 + 1024 };
}

let caches: { stored: LRUCache<number, StoredSeries, string>; answers: LRUCache<string, Answer, AnswerJob> } | null =
  null;

interface AnswerJob {
  reductionId: number;
  seriesKey: string;
  window: Window;
}

/** Both caches share SERIES_CACHE_MB: three quarters for decoded series, a quarter for answers. */
function getCaches() {
  if (caches) return caches;
  const budget = getConfig().SERIES_CACHE_MB * 1024 * 1024;
  const stored = new LRUCache<number, StoredSeries, string>({
    maxSize: Math.floor(budget * 0.75),
    sizeCalculation: (s) => Math.max(1, s.bytes),
    // concurrent requests for one reduction share a single fetch and decode
    fetchMethod: async (_reductionId, _stale, { context: seriesKey }) =>
      toStored(JSON.parse(await getObjectText(seriesKey)) as Series),
  });
  const answers = new LRUCache<string, Answer, AnswerJob>({
    maxSize: Math.floor(budget * 0.25),
    sizeCalculation: (a) => Math.max(1, a.identity.length + a.br.length + a.gzip.length),
    fetchMethod: async (_key, _stale, { context }) => buildAnswer(stored, context),
  });
  caches = { stored, answers };
  return caches;
}

async function buildAnswer(stored: LRUCache<number, StoredSeries, string>, job: AnswerJob): Promise<Answer> {
  const full = await stored.fetch(job.reductionId, { context: job.seriesKey });
  if (!full) throw new Error(`series of reduction ${job.reductionId} could not be loaded`);
  const w = job.window;
  const s = decimateSeries(full.series, { from: w.from, to: w.to, points: w.points });
  const wanted = w.channels ? new Set(['pressure', ...w.channels]) : null;
  const channels = s.channels.filter((c) => !wanted || wanted.has(c));
  const picked: Series = { ...s, channels };
  const identity = Buffer.from(JSON.stringify(encodeSeries(picked, job.reductionId, full.steps)));
  const [br, gzip] = await Promise.all([
    compressBytes(identity, 'br', 'small'),
    compressBytes(identity, 'gzip', 'small'),
  ]);
  return { identity, br, gzip };
}

interface Window {
  from?: number;
  to?: number;
  points: number;
  channels: string[] | null;
}

function parseQuery(url: URL): { window: Window; reductionId: number | null } {
  const q = seriesQuery.safeParse(Object.fromEntries(url.searchParams));
  if (!q.success) throw zodToAppError(q.error);
  const channels = q.data.channels ? [...new Set(q.data.channels.split(',').filter(Boolean))].sort() : null;
  return {
    window: { from: q.data.from, to: q.data.to, points: q.data.points, channels },
    reductionId: q.data.reduction ?? null,
  };
}

/** Weak, because the bytes differ by Content-Encoding while the content is the same. */
function etagFor(reductionId: number, window: Window): string {
  const key = `${SERIES_FORMAT}|${window.from ?? ''}|${window.to ?? ''}|${window.points}|${window.channels?.join(',') ?? '*'}`;
  return `W/"series-${reductionId}-${createHash('sha256').update(key).digest('base64url').slice(0, 16)}"`;
}

function matches(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  const bare = etag.replace(/^W\//, '');
  return ifNoneMatch.split(',').some((t) => {
    const v = t.trim();
    return v === '*' || v.replace(/^W\//, '') === bare;
  });
}

export interface SeriesReadOptions {
  /** a share link: the current reduction only, and every reuse is checked with the server */
  shareLink?: boolean;
}

/**
 * GET …/series?from&to&points&channels=a,b&reduction=R for a test. With `reduction` naming a
 * finished reduction the answer may be kept by the browser for a year (the URL names content
 * that never changes); without it the browser revalidates, and gets 304 while the test's
 * current reduction stays the same.
 */
export async function seriesResponse(request: Request, url: URL, testId: number, o: SeriesReadOptions = {}) {
  const { window, reductionId: named } = parseQuery(url);
  const source = await findSeriesSource(getDb(), testId, named);
  if (!source.testExists) throw errors.notFound('test');
  if (named !== null && (source.reductionId === null || (o.shareLink && !source.current)))
    throw errors.notFound('reduction of this test');
  if (!source.reductionId || !source.seriesKey || source.status !== 'done')
    throw errors.notFound('reduced time history yet: run a reduction first');

  const etag = etagFor(source.reductionId, window);
  const headers = new Headers({
    etag,
    vary: 'Accept-Encoding',
    'cache-control': named !== null && !o.shareLink ? 'private, max-age=31536000, immutable' : 'private, no-cache',
  });
  if (matches(request.headers.get('if-none-match'), etag)) return new Response(null, { status: 304, headers });

  const { answers } = getCaches();
  const key = `${source.reductionId}|${etag}`;
  let answer: Answer | undefined;
  try {
    answer = await answers.fetch(key, {
      context: { reductionId: source.reductionId, seriesKey: source.seriesKey, window },
    });
  } catch (err) {
    logger().error({ err, reductionId: source.reductionId }, 'reading a stored series failed');
  }
  if (!answer)
    throw errors.unavailable('The stored time history could not be read from object storage; try again shortly.');
  const coding = chooseCoding(request.headers.get('accept-encoding'));
  headers.set('content-type', 'application/json; charset=utf-8');
  if (coding !== 'identity') headers.set('content-encoding', coding);
  return new Response(new Uint8Array(coding === 'identity' ? answer.identity : answer[coding]), { headers });
}

/** Sizes of the caches, for tests and metrics. */
export function seriesCacheStats() {
  const c = getCaches();
  return { storedBytes: c.stored.calculatedSize, storedEntries: c.stored.size, answerBytes: c.answers.calculatedSize };
}
