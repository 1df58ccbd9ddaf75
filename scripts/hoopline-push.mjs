#!/usr/bin/env node
// Pushes a growing data-acquisition log to Hoopline's live test mode (DESIGN 8) from the PC that
// writes it. Plain Node.js 20, standard library only, so it can be copied onto the acquisition PC
// alone. It tails the file, sends the new bytes every few seconds as numbered chunks with an API
// token (scope `upload`), retries safely after a network fault (a chunk is idempotent: the same
// number with the same bytes), resumes after its own restart from a small state file, and
// finishes the session when asked (--finish) or when the file has been idle for a set time.
//
//   HOOPLINE_TOKEN=hpl_… node hoopline-push.mjs --url https://hoopline.example --test 12 --file run.csv
//
// Exit codes: 0 finished (or paused by Ctrl-C, state kept); 2 bad usage or a file problem;
// 3 the server refused (permission, conflict, a released test); 1 anything else.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { open, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import { pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';

const HELP = `Usage: node hoopline-push.mjs --url URL --test ID --file LOG.csv [options]

Sends a growing log to a Hoopline test's live session, chunk by chunk.
The API token is read from the environment variable HOOPLINE_TOKEN (scope "upload").

Options:
  --url URL            Hoopline's address, e.g. https://hoopline.example
  --test ID            the test's number (from its address, /tests/ID)
  --file PATH          the log the acquisition unit keeps appending to
  --interval SECONDS   how often to look for new bytes (default 5)
  --idle SECONDS       finish after the file has not grown for this long (default 900; 0: never)
  --max-chunk BYTES    largest chunk sent at once (default 4194304)
  --state PATH         where progress is kept for a restart (default: LOG.csv.hoopline-push.json)
  --finish             send what is left and finish the session now (resumes a saved session)
  --abandon            abandon the saved session and delete its chunks on the server
  --help               this text

Ctrl-C pauses: progress is kept in the state file and the next run carries on.`;

const EXIT = { ok: 0, internal: 1, usage: 2, refused: 3 };

class UsageError extends Error {}
class RefusedError extends Error {}
/** Ctrl-C while a request was being retried: nothing is lost, the state file has the range. */
class PausedError extends Error {}

/** Parse the command line; throws UsageError naming what is wrong. */
export function parseOptions(argv, env = process.env) {
  let values;
  try {
    ({ values } = parseArgs({
      args: argv,
      options: {
        url: { type: 'string' },
        test: { type: 'string' },
        file: { type: 'string' },
        interval: { type: 'string', default: '5' },
        idle: { type: 'string', default: '900' },
        'max-chunk': { type: 'string', default: String(4 * 1024 * 1024) },
        state: { type: 'string' },
        finish: { type: 'boolean', default: false },
        abandon: { type: 'boolean', default: false },
        help: { type: 'boolean', default: false },
      },
      strict: true,
    }));
  } catch (err) {
    throw new UsageError(`${err.message}. Run with --help for the options.`);
  }
  if (values.help) return { help: true };
  for (const name of ['url', 'test', 'file']) if (!values[name]) throw new UsageError(`--${name} is required.`);
  let base;
  try {
    base = new URL(values.url);
  } catch {
    throw new UsageError(`--url is not an address: ${values.url}`);
  }
  if (!/^https?:$/.test(base.protocol)) throw new UsageError('--url must start with http:// or https://');
  const testId = Number(values.test);
  if (!Number.isSafeInteger(testId) || testId <= 0)
    throw new UsageError(`--test must be a test number, not ${values.test}`);
  const number = (name, min) => {
    const n = Number(values[name]);
    if (!Number.isFinite(n) || n < min) throw new UsageError(`--${name} must be a number of at least ${min}.`);
    return n;
  };
  const token = env.HOOPLINE_TOKEN?.trim();
  if (!token)
    throw new UsageError(
      'Set HOOPLINE_TOKEN to an API token with the "upload" scope (create one on your account page).',
    );
  return {
    help: false,
    base: base.origin + base.pathname.replace(/\/+$/, ''),
    testId,
    file: values.file,
    intervalMs: number('interval', 0.05) * 1000,
    idleMs: number('idle', 0) * 1000,
    maxChunk: Math.floor(number('max-chunk', 1024)),
    statePath: values.state ?? `${values.file}.hoopline-push.json`,
    finish: values.finish,
    abandon: values.abandon,
    token,
  };
}

/** The state kept between runs: which session, how far, and the chunk being sent (write-ahead). */
async function loadState(path) {
  try {
    return JSON.parse(await readFile(path, 'utf8'));
  } catch (err) {
    if (err.code === 'ENOENT') return null;
    throw new UsageError(
      `The state file ${path} cannot be read (${err.message}); move it away to start a new session.`,
    );
  }
}

async function saveState(path, state) {
  const tmp = `${path}.tmp`;
  await writeFile(tmp, JSON.stringify(state, null, 2));
  await rename(tmp, path);
}

/** Feed the first `length` bytes of a file into `hash` (to notice a log replaced under a saved session). */
async function hashPrefix(hash, file, length) {
  if (length > 0) for await (const part of createReadStream(file, { start: 0, end: length - 1 })) hash.update(part);
  return hash;
}

async function readRange(file, offset, length) {
  const handle = await open(file, 'r');
  try {
    const buf = Buffer.alloc(length);
    const { bytesRead } = await handle.read(buf, 0, length, offset);
    return buf.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

/** A transient fault worth retrying: no answer, a timeout, or a 5xx / 429 / 408. */
const isTransient = (status) => status === undefined || status === 408 || status === 429 || status >= 500;

function describe(answer) {
  const e = answer.body?.error;
  return e
    ? `${String(e.message).replace(/\.$/, '')} (${answer.status} ${e.code})`
    : `the server answered ${answer.status}`;
}

export class Pusher {
  /**
   * @param {ReturnType<typeof parseOptions> & { retryBaseMs?: number }} options
   * @param {(line: string) => void} [log] where progress lines go (stdout by default)
   */
  constructor(
    options,
    log = (line) => {
      process.stdout.write(`${line}\n`);
    },
  ) {
    this.o = options;
    this.log = log;
    this.stopping = false;
    this.sent = 0;
    /** SHA-256 over every byte sent so far, kept running (a copy is digested for the state file) */
    this.prefix = createHash('sha256');
    this.wake = () => undefined;
  }

  /** Stop after the chunk in flight (Ctrl-C): the wait between looks at the file ends at once. */
  pause() {
    this.stopping = true;
    this.wake();
  }

  /** Wait `ms`, or less if paused meanwhile. */
  nap(ms) {
    return new Promise((resolve) => {
      const timer = setTimeout(resolve, ms);
      this.wake = () => {
        clearTimeout(timer);
        resolve();
      };
    });
  }

  /** One HTTP request with the token; resolves to {status, body} or {status: undefined} when no answer came. */
  async request(method, path, body) {
    const headers = { authorization: `Bearer ${this.o.token}` };
    if (body !== undefined) headers['content-type'] = 'text/csv; charset=utf-8';
    try {
      const res = await fetch(this.o.base + path, { method, headers, body, signal: AbortSignal.timeout(60_000) });
      const text = await res.text();
      let parsed = null;
      try {
        parsed = text ? JSON.parse(text) : null;
      } catch {
        parsed = null;
      }
      return { status: res.status, body: parsed };
    } catch (err) {
      return { status: undefined, body: null, fault: err.cause?.code ?? err.name ?? String(err) };
    }
  }

  /** Repeat a request while the fault is transient, backing off to 30 s; any other answer returns. */
  async persist(what, method, path, body) {
    for (let attempt = 0; ; attempt++) {
      const answer = await this.request(method, path, body);
      if (!isTransient(answer.status)) return answer;
      const wait = Math.min(30_000, (this.o.retryBaseMs ?? 500) * 2 ** attempt) * (0.5 + Math.random() / 2);
      this.log(
        `${what}: ${answer.status ? describe(answer) : `no answer (${answer.fault})`}; trying again in ${(wait / 1000).toFixed(1)} s`,
      );
      if (this.stopping) throw new PausedError();
      await this.nap(wait);
    }
  }

  livePath(suffix = '') {
    return `/api/tests/${this.o.testId}/live${suffix}`;
  }

  async openSession() {
    const answer = await this.persist('opening the live session', 'POST', this.livePath(), '');
    if (answer.status !== 201 || !answer.body?.sessionId)
      throw new RefusedError(`The live session could not be opened: ${describe(answer)}.`);
    const state = {
      base: this.o.base,
      testId: this.o.testId,
      sessionId: answer.body.sessionId,
      next: 1,
      offset: 0,
      sentSha256: null,
      pending: null,
    };
    await saveState(this.o.statePath, state);
    this.log(`live session ${state.sessionId} opened for test ${this.o.testId}`);
    return state;
  }

  /** The saved session for this test, checked against the file, or a new one. */
  async resumeOrOpen() {
    const saved = await loadState(this.o.statePath);
    if (!saved) return this.openSession();
    if (saved.base !== this.o.base || saved.testId !== this.o.testId)
      throw new UsageError(
        `${this.o.statePath} belongs to test ${saved.testId} on ${saved.base}; use another --state or move it away.`,
      );
    const size = (await stat(this.o.file)).size;
    if (size >= saved.offset) await hashPrefix(this.prefix, this.o.file, saved.offset);
    if (size < saved.offset || (saved.offset > 0 && this.prefix.copy().digest('hex') !== saved.sentSha256))
      throw new UsageError(
        `${this.o.file} is not the log this session started with (its first ${saved.offset} bytes changed); move ${this.o.statePath} away to start a new session.`,
      );
    this.log(`resuming live session ${saved.sessionId} at chunk ${saved.next} (byte ${saved.offset})`);
    return saved;
  }

  /** Send the pending chunk of `state` (the exact byte range recorded before the first try). */
  async sendPending(state) {
    const { n, offset, length } = state.pending;
    const bytes = await readRange(this.o.file, offset, length);
    if (bytes.length !== length) throw new UsageError(`${this.o.file} became shorter while it was being sent.`);
    const answer = await this.persist(`chunk ${n}`, 'PUT', this.livePath(`/${state.sessionId}/chunks/${n}`), bytes);
    if (answer.status !== 201 && answer.status !== 200)
      throw new RefusedError(`Chunk ${n} was refused: ${describe(answer)}.`);
    this.prefix.update(bytes);
    Object.assign(state, {
      next: n + 1,
      offset: offset + length,
      sentSha256: this.prefix.copy().digest('hex'),
      pending: null,
    });
    await saveState(this.o.statePath, state);
    this.sent += length;
    const rows = answer.body?.rows;
    this.log(`chunk ${n}: ${length} bytes${rows !== undefined ? `, ${rows} rows` : ''} (byte ${state.offset} sent)`);
  }

  /** Send whatever the file holds beyond what was sent, in chunks of at most maxChunk bytes. */
  async sendNewBytes(state) {
    if (state.pending) await this.sendPending(state);
    let grew = false;
    for (;;) {
      const size = (await stat(this.o.file)).size;
      if (size <= state.offset) return grew;
      const length = Math.min(this.o.maxChunk, size - state.offset);
      state.pending = { n: state.next, offset: state.offset, length };
      await saveState(this.o.statePath, state); // write-ahead: a restart resends exactly this range
      await this.sendPending(state);
      grew = true;
      if (this.stopping) return grew;
    }
  }

  async finishSession(state) {
    await this.sendNewBytes(state);
    const answer = await this.persist('finishing', 'POST', this.livePath(`/${state.sessionId}/finish`), '');
    if (answer.status !== 201 && answer.status !== 200)
      throw new RefusedError(`The session could not be finished: ${describe(answer)}.`);
    await rm(this.o.statePath, { force: true });
    this.log(`finished: log ${answer.body?.logId}, reduction ${answer.body?.reductionId} queued`);
    return answer.body;
  }

  async abandonSession() {
    const saved = await loadState(this.o.statePath);
    if (!saved) throw new UsageError(`No saved session in ${this.o.statePath}: nothing to abandon.`);
    const answer = await this.persist('abandoning', 'DELETE', this.livePath(`/${saved.sessionId}`));
    if (answer.status !== 200 && answer.status !== 204 && answer.status !== 404)
      throw new RefusedError(`The session could not be abandoned: ${describe(answer)}.`);
    await rm(this.o.statePath, { force: true });
    this.log(`live session ${saved.sessionId} abandoned`);
  }

  /** Tail the file until Ctrl-C (pause), --finish, or the idle time. */
  async run() {
    if (this.o.abandon) return this.abandonSession();
    await stat(this.o.file).catch(() => {
      throw new UsageError(`${this.o.file} does not exist (yet). Start the acquisition first, or check the path.`);
    });
    try {
      return await this.tail();
    } catch (err) {
      if (!(err instanceof PausedError)) throw err;
      this.log(`paused while retrying; run the same command again to carry on (state in ${this.o.statePath})`);
      return null;
    }
  }

  async tail() {
    const state = await this.resumeOrOpen();
    if (this.o.finish) return this.finishSession(state);
    let lastGrowth = Date.now();
    while (!this.stopping) {
      if (await this.sendNewBytes(state)) lastGrowth = Date.now();
      if (this.stopping) break;
      if (this.o.idleMs > 0 && Date.now() - lastGrowth >= this.o.idleMs) {
        this.log(`${this.o.file} has not grown for ${Math.round(this.o.idleMs / 1000)} s: finishing the session`);
        return this.finishSession(state);
      }
      await this.nap(this.o.intervalMs);
    }
    this.log(
      `paused after ${state.offset} bytes; run the same command again to carry on (state in ${this.o.statePath})`,
    );
    return null;
  }
}

async function main() {
  let options;
  try {
    options = parseOptions(process.argv.slice(2));
  } catch (err) {
    process.stderr.write(`hoopline-push: ${err.message}\n`);
    return EXIT.usage;
  }
  if (options.help) {
    process.stdout.write(`${HELP}\n`);
    return EXIT.ok;
  }
  const pusher = new Pusher(options);
  const pause = () => {
    if (pusher.stopping) process.exit(EXIT.ok); // a second Ctrl-C: the state file is already safe
    pusher.pause();
  };
  process.on('SIGINT', pause);
  process.on('SIGTERM', pause);
  try {
    await pusher.run();
    return EXIT.ok;
  } catch (err) {
    process.stderr.write(`hoopline-push: ${err.message}\n`);
    if (err instanceof UsageError) return EXIT.usage;
    if (err instanceof RefusedError) return EXIT.refused;
    return EXIT.internal;
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) process.exitCode = await main();
