// Live test mode (DESIGN 8): sessions of numbered chunks, kept in object storage as they arrive;
// the live reducer's events stored in MariaDB with a deterministic ordinal; finish through the
// one log service. Any app server may take any chunk:
// - each server keeps, per session, an in-memory live reducer and the count of chunks it has fed;
//   when it has none or is behind (a restart, or another server took chunks) it rebuilds by
//   replaying the stored chunks from object storage, so it derives exactly the same events;
// - a chunk's object key carries its SHA-256, and the object is written before its row: an object
//   without a row (a refused or failed request) is harmless, and never overwrites a stored chunk;
// - the row, the session's counters and the events commit in one transaction under the test's
//   and the session's row locks; events go in with INSERT IGNORE on (session, ordinal), so two
//   servers deriving the same events store each once.
import { createHash } from 'node:crypto';
import { Readable } from 'node:stream';
import { getDb, type Tx } from '../db/client.server';
import { isDuplicateKey } from '../db/errors';
import {
  claimWarningMail,
  deleteLiveChunks,
  findLiveChunk,
  findLiveSession,
  findOpenLiveSession,
  insertLiveChunk,
  insertLiveEvents,
  insertLiveSession,
  listLiveChunks,
  lockLiveSession,
  maxLiveEventOrdinal,
  updateLiveSession,
  type NewLiveEvent,
} from '../db/queries/live';
import { findUserById } from '../db/queries/users';
import type { LiveSession, Test } from '../db/schema';
import type { Plan } from '../lib/reduction/plan';
import { getConfig } from '../config.server';
import { auditBy } from './audit.server';
import { AppError, errors } from './errors';
import { readBodyBytes, type RequestUser } from './http';
import { createLiveEngine, type LiveEngine, type LiveEngineEvent } from './live-reducer.server';
import { withLockedTest } from './locks.server';
import { checkLogHead, HEAD_BYTES, storeLog } from './logs.server';
import { logger } from './observability/logger.server';
import { enqueueMailIn, kickOutbox } from './outbox.server';
import { loadTest, validatePlan } from './plans.server';
import { queueTestReduction } from './reductions.server';
import { deleteObject, getObjectBytes, getObjectStream, putObject } from './storage.server';
import { liveWarningMail } from './live-mail.server';

const sha256Of = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

const chunkKey = (testId: number, sessionId: number, n: number, sha: string) =>
  `tests/${testId}/live/${sessionId}/${String(n).padStart(6, '0')}-${sha.slice(0, 16)}.csv`;

/** A session's reducer on this server: how many chunks it has fed and how many events it derived. */
interface Reducing {
  engine: LiveEngine;
  plan: Plan;
  fed: number;
  events: number;
  /** the log's first bytes until the header has been seen (then null) */
  head: Buffer | null;
}

const reducing = new Map<number, Reducing>();
const queues = new Map<number, Promise<unknown>>();

/** Run `fn` after every earlier call for the same session on this server (one chunk at a time). */
function serialized<T>(sessionId: number, fn: () => Promise<T>): Promise<T> {
  const before = queues.get(sessionId) ?? Promise.resolve();
  const run = before.then(fn, fn);
  const tail = run.catch(() => undefined);
  queues.set(sessionId, tail);
  void tail.then(() => {
    if (queues.get(sessionId) === tail) queues.delete(sessionId);
  });
  return run;
}

function fresh(plan: Plan): Reducing {
  return { engine: createLiveEngine(plan), plan, fed: 0, events: 0, head: Buffer.alloc(0) };
}

/**
 * Feed one chunk: first the header check of the log service (with the engine's messages) until
 * the header has been seen, then the live reducer. Events come back numbered from `state.events`.
 */
function feed(state: Reducing, bytes: Uint8Array): NewLiveEvent[] {
  if (state.head) {
    const head = Buffer.concat([state.head, bytes]).subarray(0, HEAD_BYTES + 1);
    state.head = checkLogHead(state.plan, head, false) ? null : head;
  }
  return number(state, state.engine.push(bytes));
}

function number(state: Reducing, events: LiveEngineEvent[]): NewLiveEvent[] {
  return events.map((e) => ({ ordinal: ++state.events, type: e.type, data: e.data }));
}

/** This server's reducer for the session, having fed exactly `chunks` chunks (rebuilt from storage if not). */
async function reducerAt(session: LiveSession, chunks: number): Promise<Reducing> {
  const known = reducing.get(session.id);
  if (known && known.fed === chunks) return known;
  reducing.delete(session.id);
  const state = fresh(validatePlan(session.plan));
  const stored = (await listLiveChunks(getDb(), session.id)).slice(0, chunks);
  for (const c of stored) {
    feed(state, await getObjectBytes(c.objectKey));
    state.fed++;
  }
  if (state.fed !== chunks) throw errors.unavailable('The stored chunks of this live session are incomplete.');
  return state;
}

async function loadSession(testId: number, sessionId: number): Promise<LiveSession> {
  const session = await findLiveSession(getDb(), sessionId);
  if (!session || session.testId !== testId) throw errors.notFound('live session');
  return session;
}

/** POST /api/tests/{id}/live → the new session's id; 409 while another is open or the test is released. */
export async function openLiveSession(user: RequestUser, testId: number): Promise<number> {
  try {
    return await withLockedTest(testId, { forWrite: true }, async (tx, test) => {
      validatePlan(test.plan);
      const open = await findOpenLiveSession(tx, test.id);
      if (open) throw new AppError('live-session-open', undefined, { sessionId: open.id });
      const id = await insertLiveSession(tx, test.id, user.id, test.plan);
      await auditBy(tx, user, 'live-session-opened', test.id, { sessionId: id });
      return id;
    });
  } catch (err) {
    // the database's own guard: one open session per test (a unique index on a generated column)
    if (isDuplicateKey(err)) {
      const open = await findOpenLiveSession(getDb(), testId);
      throw new AppError('live-session-open', undefined, { sessionId: open?.id ?? null });
    }
    throw err;
  }
}

export interface ChunkAnswer {
  status: 200 | 201;
  n: number;
  bytes: number;
  rows: number;
}

function refuseOther(session: LiveSession, n: number, sha: string, stored: { sha256: string } | undefined) {
  if (n < session.nextChunk) {
    if (stored && stored.sha256 === sha) return;
    throw new AppError(
      'chunk-conflict',
      `Chunk ${n} was stored already with other bytes; nothing was stored. The next chunk expected is ${session.nextChunk}.`,
      { expected: session.nextChunk, n },
    );
  }
  throw new AppError(
    'chunk-gap',
    `Chunk ${n} comes after a gap; nothing was stored. The next chunk expected is ${session.nextChunk}.`,
    { expected: session.nextChunk, n },
  );
}

/** PUT …/live/{sessionId}/chunks/{n}: 201 stored, 200 the same bytes again; 409 other bytes or a gap. */
export async function receiveChunk(
  request: Request,
  testId: number,
  sessionId: number,
  n: number,
): Promise<ChunkAnswer> {
  const bytes = await readBodyBytes(request, getConfig().LIVE_CHUNK_MAX_BYTES, errors.chunkTooLarge);
  const sha = sha256Of(bytes);
  return serialized(sessionId, async () => {
    const session = await loadSession(testId, sessionId);
    if (session.status !== 'open') throw new AppError('live-session-closed');
    if (n !== session.nextChunk) {
      const stored = n < session.nextChunk ? await findLiveChunk(getDb(), sessionId, n) : undefined;
      refuseOther(session, n, sha, stored);
      return { status: 200, n, bytes: stored!.bytes, rows: stored!.rows };
    }
    if (bytes.length === 0) throw errors.invalid('The chunk is empty: send the next bytes of the log.');

    let state: Reducing | undefined;
    try {
      state = await reducerAt(session, n - 1);
      const rowsBefore = state.engine.rows;
      const events = feed(state, bytes); // a bad header answers 422 here, and nothing is stored
      state.fed++;
      const rows = state.engine.rows - rowsBefore;
      const key = chunkKey(testId, sessionId, n, sha);
      await putObject(key, bytes, 'text/csv');
      const answer = await withLockedTest(testId, { forWrite: true }, async (tx, test) => {
        const locked = await lockLiveSession(tx, sessionId);
        if (!locked || locked.status !== 'open') throw new AppError('live-session-closed');
        if (locked.nextChunk !== n) {
          // another server stored this number meanwhile
          const stored = await findLiveChunk(tx, sessionId, n);
          refuseOther(locked, n, sha, stored);
          return { status: 200 as const, n, bytes: stored!.bytes, rows: stored!.rows, mail: false };
        }
        await insertLiveChunk(tx, { sessionId, n, bytes: bytes.length, rows, sha256: sha, objectKey: key });
        await updateLiveSession(tx, sessionId, {
          nextChunk: n + 1,
          bytes: locked.bytes + bytes.length,
          rows: locked.rows + rows,
        });
        const inserted = new Set(await insertLiveEvents(tx, sessionId, events));
        const mail = await mailWarnings(
          tx,
          test,
          sessionId,
          events.filter((e) => inserted.has(e.ordinal)),
        );
        return { status: 201 as const, n, bytes: bytes.length, rows, mail };
      });
      reducing.set(sessionId, state);
      if (answer.mail) kickOutbox();
      return { status: answer.status, n: answer.n, bytes: answer.bytes, rows: answer.rows };
    } catch (err) {
      // the in-memory reducer may be ahead of what is stored: the next chunk rebuilds it
      reducing.delete(sessionId);
      throw err;
    }
  });
}

/** Each warning e-mailed once per session, gauge and code, to the test's engineer (its owner). */
async function mailWarnings(tx: Tx, test: Test, sessionId: number, events: NewLiveEvent[]): Promise<boolean> {
  let queued = false;
  for (const e of events) {
    if (e.type !== 'warning') continue;
    const gaugeId = String(e.data.gaugeId ?? '');
    const code = String(e.data.code ?? '');
    if (!gaugeId || !code) continue;
    if (!(await claimWarningMail(tx, sessionId, gaugeId, code))) continue;
    const engineer = test.ownerId ? await findUserById(tx, test.ownerId) : undefined;
    if (!engineer || engineer.disabled) {
      logger().warn({ testId: test.id, gaugeId, code }, 'a live warning has nobody to e-mail (the test has no owner)');
      continue;
    }
    await enqueueMailIn(tx, { ...liveWarningMail(test, engineer.name, e.data), to: engineer.email, testId: test.id });
    queued = true;
  }
  return queued;
}

export interface FinishAnswer {
  status: 200 | 201;
  logId: number;
  reductionId: number;
}

/**
 * POST …/live/{sessionId}/finish: the chunks, concatenated, become one log through the log
 * service (the same bytes uploaded at once give the same SHA-256, so the same log), and a
 * reduction is queued. A session finished already answers its log and reduction again (200).
 */
export async function finishLiveSession(user: RequestUser, testId: number, sessionId: number): Promise<FinishAnswer> {
  return serialized(sessionId, async () => {
    const session = await loadSession(testId, sessionId);
    if (session.status === 'finished' && session.logId && session.reductionId)
      return { status: 200, logId: session.logId, reductionId: session.reductionId };
    if (session.status !== 'open') throw new AppError('live-session-closed');
    const chunks = await listLiveChunks(getDb(), sessionId);
    if (!chunks.length) throw new AppError('live-session-empty');
    const test = await loadTest(testId, true);
    const plan = validatePlan(test.plan);
    const source = Readable.from(
      (async function* () {
        for (const c of chunks) yield* await getObjectStream(c.objectKey);
      })(),
    );
    const { log } = await storeLog({
      test,
      plan,
      source,
      filename: `live-session-${sessionId}.csv`,
      user,
      auditDetails: { liveSessionId: sessionId, chunks: chunks.length },
    });
    const reductionId = await queueTestReduction(user, testId);
    let finalEvents: NewLiveEvent[] = [];
    try {
      const state = await reducerAt(session, chunks.length);
      finalEvents = number(state, state.engine.finish());
    } catch (err) {
      // the log is stored and reduced either way; only the live view misses its last events
      logger().warn({ err, sessionId }, 'the live reducer could not finish');
    }
    const settled = await withLockedTest(testId, { forWrite: true }, async (tx) => {
      const locked = await lockLiveSession(tx, sessionId);
      // another server finished it meanwhile (the same bytes: the same log): its answer stands
      if (locked?.status === 'finished' && locked.logId && locked.reductionId)
        return { status: 200 as const, logId: locked.logId, reductionId: locked.reductionId };
      if (!locked || locked.status !== 'open') throw new AppError('live-session-closed');
      await updateLiveSession(tx, sessionId, {
        status: 'finished',
        sha256: log.sha256,
        logId: log.id,
        reductionId,
        finishedAt: new Date(),
      });
      const base = Math.max(await maxLiveEventOrdinal(tx, sessionId), finalEvents.at(-1)?.ordinal ?? 0);
      await insertLiveEvents(tx, sessionId, [
        ...finalEvents,
        { ordinal: base + 1, type: 'finished', data: { reductionId, logId: log.id, sha256: log.sha256 } },
      ]);
      await auditBy(tx, user, 'live-session-finished', testId, {
        sessionId,
        logId: log.id,
        reductionId,
        sha256: log.sha256,
        chunks: chunks.length,
      });
      return null;
    });
    reducing.delete(sessionId);
    if (settled) return settled;
    // the log holds every byte now: the chunk objects are no longer needed
    await Promise.all(chunks.map((c) => deleteObject(c.objectKey).catch(() => undefined)));
    return { status: 201, logId: log.id, reductionId };
  });
}

/** DELETE …/live/{sessionId}: abandon an open session and delete its chunks. */
export async function abandonLiveSession(user: RequestUser, testId: number, sessionId: number): Promise<void> {
  await serialized(sessionId, async () => {
    const keys = await withLockedTest(testId, { forWrite: false }, async (tx) => {
      const locked = await lockLiveSession(tx, sessionId);
      if (!locked || locked.testId !== testId) throw errors.notFound('live session');
      if (locked.status === 'abandoned') return [];
      if (locked.status === 'finished')
        throw new AppError('live-session-closed', 'This live session is finished: its log is stored and kept.');
      const chunks = await listLiveChunks(tx, sessionId);
      await deleteLiveChunks(tx, sessionId);
      await updateLiveSession(tx, sessionId, { status: 'abandoned', finishedAt: new Date() });
      const base = await maxLiveEventOrdinal(tx, sessionId);
      await insertLiveEvents(tx, sessionId, [
        {
          ordinal: base + 1,
          type: 'status',
          data: { rows: locked.rows, pressure: null, verdict: null, session: 'abandoned' },
        },
      ]);
      await auditBy(tx, user, 'live-session-abandoned', testId, { sessionId, chunks: chunks.length });
      return chunks.map((c) => c.objectKey);
    });
    reducing.delete(sessionId);
    await Promise.all(keys.map((k) => deleteObject(k).catch(() => undefined)));
  });
}
