// The one log service (DESIGN 5, 8): every log that becomes part of a record — a one-shot
// upload (multipart field `file`, or a raw text/csv body), a finished live session, the demo
// seed — passes through `storeLog`. It checks the header from the first 64 KB with the engine's
// own reader (its findings and messages, with line and column), then streams the bytes to object
// storage while hashing, counting and keeping only the last few KB. Nothing is written to the
// database until the object is complete; then one transaction locks the test row, re-checks that
// it is not released (a release may have happened while the bytes streamed) and stores the log
// with its audit row. The same bytes again give the existing log. A refused or failed log leaves
// no object behind.
import busboy from 'busboy';
import { createHash, randomUUID } from 'node:crypto';
import type { ReadableStream as WebReadableStream } from 'node:stream/web';
import { PassThrough, Readable, Transform, type TransformCallback } from 'node:stream';
import { getDb } from '../db/client.server';
import { isDuplicateKey } from '../db/errors';
import { findLogBySha, insertLog } from '../db/queries/logs';
import { updateTest } from '../db/queries/tests';
import { canonicalJson } from '../lib/canonical-json';
import type { LogFile, Test } from '../db/schema';
import { inspectLogHead, LogReader, type LogHeadInfo } from '../lib/reduction';
import { isInputError } from '../lib/reduction/errors';
import type { Plan } from '../lib/reduction/plan';
import { auditBy } from './audit.server';
import { getConfig } from '../config.server';
import { logger } from './observability/logger.server';
import { AppError, errors } from './errors';
import type { RequestUser } from './http';
import { withLockedTest } from './locks.server';
import { deleteObject, putObjectStream } from './storage.server';

/** How much of a log's start must hold its preamble and header. */
export const HEAD_BYTES = 64 * 1024;
const TAIL_BYTES = 8 * 1024;

interface IncomingFile {
  stream: Readable;
  filename: string;
}

/** The file's byte stream: the multipart field `file`, or the raw body. */
async function openIncomingFile(request: Request): Promise<IncomingFile> {
  if (!request.body)
    throw errors.invalid('The request has no body: send the log as multipart field `file` or as a text/csv body.');
  const type = request.headers.get('content-type') ?? '';
  const body = Readable.fromWeb(request.body as WebReadableStream);
  if (!type.toLowerCase().startsWith('multipart/form-data')) {
    const name = request.headers.get('x-filename') ?? 'log.csv';
    return { stream: body, filename: name.slice(0, 255) };
  }
  return new Promise((resolve, reject) => {
    let bb: busboy.Busboy;
    try {
      bb = busboy({ headers: { 'content-type': type }, limits: { files: 1, fields: 20 } });
    } catch {
      reject(errors.invalid('The multipart body could not be read (no boundary in Content-Type).'));
      return;
    }
    let found = false;
    bb.on('file', (field, stream, info) => {
      if (field !== 'file' || found) {
        stream.resume();
        return;
      }
      found = true;
      resolve({ stream, filename: (info.filename || 'log.csv').slice(0, 255) });
    });
    bb.on('error', () => reject(errors.invalid('The multipart body is malformed.')));
    bb.on('close', () => {
      if (!found) reject(errors.invalid('The multipart body has no field named `file`.'));
    });
    body.pipe(bb);
  });
}

/** Read until `HEAD_BYTES` are buffered or the stream ends; returns the head and whether it ended. */
async function readHead(stream: Readable, limit: number): Promise<{ head: Buffer; ended: boolean }> {
  const parts: Buffer[] = [];
  let size = 0;
  for (;;) {
    const chunk: Buffer | null = stream.read();
    if (chunk) {
      parts.push(chunk);
      size += chunk.length;
      if (size > limit) throw errors.tooLarge(limit);
      if (size >= HEAD_BYTES) return { head: Buffer.concat(parts), ended: false };
      continue;
    }
    if (stream.readableEnded) return { head: Buffer.concat(parts), ended: true };
    const more = await new Promise<boolean>((resolve, reject) => {
      const onReadable = () => {
        cleanup();
        resolve(true);
      };
      const onEnd = () => {
        cleanup();
        resolve(false);
      };
      const onError = (e: Error) => {
        cleanup();
        reject(e);
      };
      const cleanup = () => {
        stream.off('readable', onReadable);
        stream.off('end', onEnd);
        stream.off('error', onError);
      };
      stream.once('readable', onReadable);
      stream.once('end', onEnd);
      stream.once('error', onError);
    });
    if (!more) return { head: Buffer.concat(parts), ended: true };
  }
}

/** Hashes, counts bytes and non-empty lines, keeps the tail; errors past the size limit. */
class LogMeter extends Transform {
  readonly hash = createHash('sha256');
  bytes = 0;
  lines = 0;
  private lineHasContent = false;
  tail: Buffer = Buffer.alloc(0);
  constructor(private readonly limit: number) {
    super();
  }
  override _transform(chunk: Buffer, _enc: BufferEncoding, done: TransformCallback) {
    this.bytes += chunk.length;
    if (this.bytes > this.limit) {
      done(errors.tooLarge(this.limit));
      return;
    }
    this.hash.update(chunk);
    // find each newline natively; look at a line's bytes only until one is not blank
    let start = 0;
    for (;;) {
      const nl = chunk.indexOf(10, start);
      const end = nl < 0 ? chunk.length : nl;
      for (let i = start; !this.lineHasContent && i < end; i++) {
        const b = chunk[i]!;
        if (b !== 13 && b !== 32 && b !== 9) this.lineHasContent = true;
      }
      if (nl < 0) break;
      if (this.lineHasContent) this.lines++;
      this.lineHasContent = false;
      start = nl + 1;
    }
    this.tail =
      chunk.length >= TAIL_BYTES
        ? chunk.subarray(chunk.length - TAIL_BYTES)
        : Buffer.concat([this.tail, chunk]).subarray(-TAIL_BYTES);
    done(null, chunk);
  }
  override _flush(done: TransformCallback) {
    if (this.lineHasContent) this.lines++;
    done();
  }
}

/** Time value of a data line (seconds, or epoch seconds for ISO timestamps), or null. */
function timeOf(line: string | undefined, column: number, delimiter: string, decimalComma: boolean): number | null {
  if (!line || column < 0) return null;
  const cell = line.split(delimiter)[column]?.trim().replace(/^"|"$/g, '');
  if (!cell) return null;
  const n = Number(decimalComma ? cell.replace(',', '.') : cell);
  if (Number.isFinite(n)) return n;
  const t = Date.parse(cell);
  return Number.isFinite(t) ? t / 1000 : null;
}

export interface UploadOutcome {
  log: LogFile;
  created: boolean;
}

/**
 * The header check, with the engine's own reader: the complete lines of `head` are read as a
 * segment, so a missing or repeated column, binary bytes or a header without the pressure column
 * fail with the engine's code, message, line and column (422 through the endpoint's one mapping).
 * Answers what the header holds, or null while no line of a log still arriving (`ended` false)
 * is its header yet and the head is shorter than HEAD_BYTES (a live session's first chunks).
 */
export function checkLogHead(plan: Plan, head: Uint8Array, ended: boolean): LogHeadInfo | null {
  if (head.length === 0) {
    if (!ended) return null;
    throw new AppError('empty-file', 'The file is empty.');
  }
  // only whole lines: a header cut by the window would look like one that lacks a column
  const window = head.subarray(0, HEAD_BYTES);
  const lastNewline = window.lastIndexOf(10);
  const whole = ended && head.length <= HEAD_BYTES ? window : window.subarray(0, lastNewline + 1);
  const waiting = !ended && head.length < HEAD_BYTES;
  if (whole.length === 0) {
    if (waiting) return null;
    throw new AppError(
      'not-delimited-text',
      `The first ${Math.round(HEAD_BYTES / 1024)} KB of the log hold no line end: it is not delimited text.`,
      { line: 1 },
    );
  }
  try {
    const reader = new LogReader(plan, () => undefined);
    reader.beginSegment();
    reader.push(whole);
    reader.endSegment();
    return inspectLogHead(plan, Buffer.from(whole).toString('utf8'));
  } catch (err) {
    if (waiting && isInputError(err) && (err.code === 'pressure-column-not-found' || err.code === 'no-data'))
      return null;
    throw err;
  }
}

/** What the log row records about the header and its mapping to the plan. */
function columnMapOf(plan: Plan, info: LogHeadInfo) {
  return {
    delimiter: info.delimiter,
    decimalComma: info.decimalComma,
    headerLine: info.headerLine,
    columns: info.columns,
    pressureUnit: info.pressureUnit,
    preview: info.previewRows.slice(0, 10),
    mapping: {
      pressure: plan.columns.pressure,
      time: plan.columns.time ?? null,
      channels: plan.gauges.flatMap((g) => g.channels),
    },
  };
}

export interface StoreLogInput {
  test: Test;
  plan: Plan;
  /** the log's bytes, in order */
  source: Readable;
  filename: string;
  user: RequestUser;
  /** extra audit details (a live session's id, the demo seed) */
  auditDetails?: Record<string, unknown>;
}

/**
 * Check, store, hash and record one log (the one path every log takes). Throws AppError
 * 400/409/413/422, 503 when storage or the database fails; the same bytes again answer the
 * existing log with `created` false.
 */
export async function storeLog(input: StoreLogInput): Promise<UploadOutcome> {
  const { test, plan, source: stream, user } = input;
  const limit = getConfig().UPLOAD_MAX_BYTES;
  let head: Buffer;
  let ended: boolean;
  let info: LogHeadInfo;
  try {
    ({ head, ended } = await readHead(stream, limit));
    info = checkLogHead(plan, head, ended)!; // ended, or a full head: never null
  } catch (err) {
    stream.resume();
    throw err;
  }
  const headText = head.toString('utf8');

  const meter = new LogMeter(limit);
  const body = new PassThrough();
  body.pipe(meter);
  body.write(head);
  if (ended) body.end();
  else stream.pipe(body);
  stream.on('error', (e) => meter.destroy(e));

  const key = `tests/${test.id}/logs/${randomUUID()}.csv`;
  try {
    await putObjectStream(key, meter, 'text/csv');
  } catch (err) {
    stream.resume();
    await deleteObject(key).catch(() => undefined);
    if (err instanceof AppError) throw err;
    if (meter.bytes > limit) throw errors.tooLarge(limit);
    logger().error({ err }, 'storing a log in object storage failed');
    throw errors.unavailable('Object storage did not take the file; nothing was stored. Try again shortly.');
  }

  const sha256 = meter.hash.digest('hex');
  const timeIndex = plan.columns.time ? info.columns.indexOf(plan.columns.time) : -1;
  const headLines = headText.split(/\r?\n/);
  const firstData = headLines.slice(info.headerLine).find((l) => l.trim().length > 0);
  const tailLines = meter.tail
    .toString('utf8')
    .split(/\r?\n/)
    .filter((l) => l.trim().length > 0);
  const checkedPlan = canonicalJson(test.plan);
  let outcome: UploadOutcome;
  try {
    outcome = await withLockedTest(test.id, { forWrite: true }, async (tx, locked) => {
      const existing = await findLogBySha(tx, test.id, sha256);
      if (existing) return { log: existing, created: false };
      // the header was checked against the plan as it was when the log began
      if (canonicalJson(locked.plan) !== checkedPlan) throw new AppError('plan-changed');
      const id = await insertLog(tx, {
        testId: test.id,
        objectKey: key,
        filename: input.filename,
        sha256,
        sizeBytes: meter.bytes,
        rows: Math.max(0, meter.lines - info.headerLine),
        timeStart: timeOf(firstData, timeIndex, info.delimiter, info.decimalComma),
        timeEnd: timeOf(tailLines.at(-1), timeIndex, info.delimiter, info.decimalComma),
        columnMap: columnMapOf(plan, info),
        uploadedBy: user.id,
      });
      await updateTest(tx, test.id, { status: 'logging' });
      await auditBy(tx, user, 'log-uploaded', test.id, {
        logId: id,
        filename: input.filename,
        sha256,
        bytes: meter.bytes,
        ...input.auditDetails,
      });
      if (locked.status === 'reviewed')
        await auditBy(tx, user, 'review-withdrawn', test.id, { reason: `log ${id} uploaded after the review` });
      return { log: (await findLogBySha(tx, test.id, sha256))!, created: true };
    });
  } catch (err) {
    // nothing was stored: the object goes too (a release won the race, or the database failed)
    await deleteObject(key).catch(() => undefined);
    if (isDuplicateKey(err)) {
      const again = await findLogBySha(getDb(), test.id, sha256);
      if (again) return { log: again, created: false };
    }
    throw err;
  }
  if (!outcome.created) await deleteObject(key).catch(() => undefined);
  return outcome;
}

/** POST /api/tests/{id}/logs. Throws AppError 400/413/422; 503 when storage fails. */
export async function receiveLogUpload(
  request: Request,
  test: Test,
  plan: Plan,
  user: RequestUser,
): Promise<UploadOutcome> {
  const limit = getConfig().UPLOAD_MAX_BYTES;
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > limit + 64 * 1024) throw errors.tooLarge(limit);
  const incoming = await openIncomingFile(request);
  return storeLog({ test, plan, source: incoming.stream, filename: incoming.filename, user });
}
