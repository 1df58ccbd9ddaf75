// The push script against a small stand-in for the live API (DESIGN 8's chunk rules: the same
// number with the same bytes answers 200, other bytes or a gap 409 with details.expected), with
// faults injected: dropped connections, lost answers, 503s, and the script itself killed.
import { spawn } from 'node:child_process';
import { appendFileSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { parseOptions, Pusher } from './hoopline-push.mjs';

const TOKEN = 'hpl_test-token';
const SCRIPT = path.join(import.meta.dirname, 'hoopline-push.mjs');

interface Session {
  id: string;
  chunks: Buffer[];
  finished: boolean;
  abandoned: boolean;
}

/** The live API's chunk rules, in memory, with switches to misbehave. */
class FakeLiveApi {
  sessions: Session[] = [];
  log: string[] = [];
  faults = { dropBeforeAnswer: 0, loseAnswerAfterStore: 0, unavailable: 0 };
  private server: Server | null = null;
  url = '';

  async start() {
    this.server = createServer((req, res) => void this.handle(req, res));
    await new Promise<void>((resolve) => this.server?.listen(0, '127.0.0.1', resolve));
    this.url = `http://127.0.0.1:${(this.server.address() as AddressInfo).port}`;
  }

  async stop() {
    await new Promise((resolve) => this.server?.close(resolve));
  }

  get open() {
    return this.sessions.find((s) => !s.finished && !s.abandoned);
  }

  assembled(): Buffer {
    const s = this.sessions.find((x) => x.finished);
    return Buffer.concat(s?.chunks ?? []);
  }

  private async handle(req: IncomingMessage, res: ServerResponse) {
    const parts: Buffer[] = [];
    for await (const p of req) parts.push(p as Buffer);
    const body = Buffer.concat(parts);
    const answer = (status: number, json?: unknown) => {
      res.writeHead(status, { 'content-type': 'application/json' });
      res.end(json === undefined ? '' : JSON.stringify(json));
    };
    if (req.headers.authorization !== `Bearer ${TOKEN}`)
      return answer(401, { error: { code: 'invalid-token', message: 'The API token is unknown.' } });
    if (this.faults.unavailable > 0) {
      this.faults.unavailable--;
      return answer(503, { error: { code: 'unavailable', message: 'down for a moment' } });
    }
    if (this.faults.dropBeforeAnswer > 0) {
      this.faults.dropBeforeAnswer--;
      return req.socket.destroy();
    }
    const url = req.url ?? '';
    let m: RegExpMatchArray | null;
    if (req.method === 'POST' && /^\/api\/tests\/7\/live$/.test(url)) {
      if (this.open) return answer(409, { error: { code: 'live-session-open', message: 'one at a time' } });
      const s: Session = { id: `s${this.sessions.length + 1}`, chunks: [], finished: false, abandoned: false };
      this.sessions.push(s);
      return answer(201, { sessionId: s.id });
    }
    if (req.method === 'PUT' && (m = url.match(/^\/api\/tests\/7\/live\/(\w+)\/chunks\/(\d+)$/))) {
      const s = this.sessions.find((x) => x.id === m?.[1]);
      const n = Number(m[2]);
      if (!s || s.finished || s.abandoned) return answer(404, { error: { code: 'not-found', message: 'no session' } });
      const expected = s.chunks.length + 1;
      if (n < expected) {
        const same = s.chunks[n - 1]?.equals(body);
        this.log.push(`${n}:${same ? 'repeat' : 'conflict'}`);
        return same
          ? answer(200, { n, bytes: body.length })
          : answer(409, { error: { code: 'chunk-conflict', message: 'other bytes', details: { expected } } });
      }
      if (n > expected) return answer(409, { error: { code: 'chunk-gap', message: 'gap', details: { expected } } });
      s.chunks.push(body);
      this.log.push(`${n}:stored`);
      if (this.faults.loseAnswerAfterStore > 0) {
        this.faults.loseAnswerAfterStore--;
        return req.socket.destroy();
      }
      return answer(201, { n, bytes: body.length, rows: body.toString().split('\n').length - 1 });
    }
    if (req.method === 'POST' && (m = url.match(/^\/api\/tests\/7\/live\/(\w+)\/finish$/))) {
      const s = this.sessions.find((x) => x.id === m?.[1]);
      if (!s) return answer(404, { error: { code: 'not-found', message: 'no session' } });
      s.finished = true;
      return answer(201, { logId: 11, reductionId: 12 });
    }
    if (req.method === 'DELETE' && (m = url.match(/^\/api\/tests\/7\/live\/(\w+)$/))) {
      const s = this.sessions.find((x) => x.id === m?.[1]);
      if (s) s.abandoned = true;
      res.writeHead(204);
      return res.end();
    }
    return answer(404, { error: { code: 'not-found', message: url } });
  }
}

let api: FakeLiveApi;
let dir: string;
let file: string;

beforeEach(async () => {
  api = new FakeLiveApi();
  await api.start();
  dir = mkdtempSync(path.join(tmpdir(), 'hoopline-push-'));
  file = path.join(dir, 'run.csv');
});

afterEach(async () => {
  await api.stop();
  rmSync(dir, { recursive: true, force: true });
});

const options = (extra: string[] = []) => ({
  ...parseOptions(
    ['--url', api.url, '--test', '7', '--file', file, '--interval', '0.05', '--max-chunk', '1024', ...extra],
    { HOOPLINE_TOKEN: TOKEN },
  ),
  retryBaseMs: 20, // back off quickly in tests
});
const quiet = () => undefined;

/** A log that grows by `pieces` appends, cut anywhere (also mid-line). */
function logLines(n: number): string {
  let text = 'unit,DAQ demo\ntime_s,P [MPa],SG1\n';
  for (let i = 0; i < n; i++) text += `${i},${(i / 10).toFixed(3)},${(i * 1.7).toFixed(2)}\n`;
  return text;
}

async function growFile(text: string, pieces: number, everyMs: number) {
  const cut = Math.ceil(text.length / pieces);
  for (let i = 0; i < text.length; i += cut) {
    appendFileSync(file, text.slice(i, i + cut));
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

function runScript(args: string[], env: Record<string, string> = { HOOPLINE_TOKEN: TOKEN }) {
  const child = spawn(process.execPath, [SCRIPT, ...args], { env: { ...process.env, ...env } });
  let out = '';
  let err = '';
  child.stdout.on('data', (d) => (out += d));
  child.stderr.on('data', (d) => (err += d));
  const done = new Promise<{ code: number | null; out: string; err: string }>((resolve) =>
    child.on('close', (code) => resolve({ code, out, err })),
  );
  return { child, done };
}

// child processes and a shared 2-core machine: allow more than vitest's 5 s
describe('hoopline-push', { timeout: 30_000 }, () => {
  it('sends a growing log in chunks cut anywhere and finishes after the idle time, byte for byte', async () => {
    writeFileSync(file, '');
    const text = logLines(2000); // about 40 KB in 9 appends of about 4.5 KB
    const pusher = new Pusher(options(['--idle', '0.4']), quiet);
    const running = pusher.run();
    await growFile(text, 9, 60);
    await running;
    expect(api.assembled().equals(Buffer.from(text))).toBe(true);
    expect(api.sessions[0]?.chunks.length).toBeGreaterThan(9); // 1 KB chunks: the file was split further
    expect(existsSync(`${file}.hoopline-push.json`)).toBe(false);
  });

  it('retries after dropped connections, 503s and lost answers without sending a byte twice', async () => {
    writeFileSync(file, logLines(300));
    api.faults = { dropBeforeAnswer: 2, loseAnswerAfterStore: 2, unavailable: 2 };
    await new Pusher(options(['--finish']), quiet).run();
    expect(api.assembled().equals(readFileSync(file))).toBe(true);
    expect(api.log.filter((l) => l.endsWith(':repeat'))).toHaveLength(2); // each lost answer: one idempotent repeat
    expect(api.log.some((l) => l.endsWith(':conflict'))).toBe(false);
  });

  it('resumes after being killed mid-session and carries on from the saved state', async () => {
    writeFileSync(file, logLines(2000)); // about 40 KB: 40 chunks of 1 KB
    api.faults.unavailable = 0;
    const first = runScript([
      '--url',
      api.url,
      '--test',
      '7',
      '--file',
      file,
      '--interval',
      '0.05',
      '--max-chunk',
      '1024',
    ]);
    while ((api.open?.chunks.length ?? 0) < 5) await new Promise((r) => setTimeout(r, 10));
    first.child.kill('SIGKILL');
    await first.done;
    appendFileSync(file, '2000,200.000,3400.00\n2001,200.1'); // the log grew meanwhile, ending mid-line
    const second = runScript(['--url', api.url, '--test', '7', '--file', file, '--max-chunk', '1024', '--finish']);
    const result = await second.done;
    expect(result.code, result.err).toBe(0);
    expect(result.out).toMatch(/resuming live session s1 at chunk \d+/);
    expect(api.sessions).toHaveLength(1);
    expect(api.assembled().equals(readFileSync(file))).toBe(true);
    expect(api.log.some((l) => l.endsWith(':conflict'))).toBe(false);
  });

  it('pauses on Ctrl-C with its state kept, then finishes with --finish', async () => {
    writeFileSync(file, logLines(50));
    const first = runScript(['--url', api.url, '--test', '7', '--file', file, '--interval', '0.05']);
    while (!api.open?.chunks.length) await new Promise((r) => setTimeout(r, 10));
    first.child.kill('SIGINT');
    const paused = await first.done;
    expect(paused.code).toBe(0);
    expect(paused.out).toMatch(/paused after \d+ bytes/);
    expect(existsSync(`${file}.hoopline-push.json`)).toBe(true);
    const second = await runScript(['--url', api.url, '--test', '7', '--file', file, '--finish']).done;
    expect(second.code, second.err).toBe(0);
    expect(api.assembled().equals(readFileSync(file))).toBe(true);
  });

  it('refuses a log that is not the one its saved session started with', async () => {
    writeFileSync(file, logLines(100));
    const first = runScript(['--url', api.url, '--test', '7', '--file', file, '--interval', '5']);
    while (!api.open?.chunks.length) await new Promise((r) => setTimeout(r, 10));
    first.child.kill('SIGINT');
    await first.done;
    writeFileSync(file, logLines(100).replace('0,0.000', '9,9.999'));
    const second = await runScript(['--url', api.url, '--test', '7', '--file', file, '--finish']).done;
    expect(second.code).toBe(2);
    expect(second.err).toMatch(/is not the log this session started with/);
    expect(api.sessions[0]?.finished).toBe(false);
  });

  it('pauses at once on Ctrl-C, even between looks or while the server is down', async () => {
    writeFileSync(file, logLines(20));
    const idle = runScript(['--url', api.url, '--test', '7', '--file', file, '--interval', '60']);
    while (!api.open?.chunks.length) await new Promise((r) => setTimeout(r, 10));
    const asked = Date.now();
    idle.child.kill('SIGINT');
    expect((await idle.done).code).toBe(0);
    expect(Date.now() - asked).toBeLessThan(3000); // not the 60 s interval

    appendFileSync(file, logLines(5));
    api.faults.unavailable = 1000;
    const down = runScript(['--url', api.url, '--test', '7', '--file', file, '--interval', '0.05']);
    while (api.faults.unavailable > 998) await new Promise((r) => setTimeout(r, 10));
    down.child.kill('SIGINT');
    const r = await down.done;
    expect(r.code, r.err).toBe(0);
    expect(r.out).toMatch(/paused while retrying/);
    api.faults.unavailable = 0;
    expect((await runScript(['--url', api.url, '--test', '7', '--file', file, '--finish']).done).code).toBe(0);
    expect(api.assembled().equals(readFileSync(file))).toBe(true);
  });

  it('abandons the saved session on request', async () => {
    writeFileSync(file, logLines(20));
    const first = runScript(['--url', api.url, '--test', '7', '--file', file, '--interval', '5']);
    while (!api.open?.chunks.length) await new Promise((r) => setTimeout(r, 10));
    first.child.kill('SIGINT');
    await first.done;
    const r = await runScript(['--url', api.url, '--test', '7', '--file', file, '--abandon']).done;
    expect(r.code, r.err).toBe(0);
    expect(api.sessions[0]?.abandoned).toBe(true);
    expect(existsSync(`${file}.hoopline-push.json`)).toBe(false);
  });

  it.each([
    [['--test', '7', '--file', 'x.csv'], { HOOPLINE_TOKEN: TOKEN }, 2, /--url is required/],
    [
      ['--url', 'http://127.0.0.1:9', '--test', 'seven', '--file', 'x.csv'],
      { HOOPLINE_TOKEN: TOKEN },
      2,
      /--test must be a test number/,
    ],
    [
      ['--url', 'http://127.0.0.1:9', '--test', '7', '--file', 'x.csv'],
      { HOOPLINE_TOKEN: '' },
      2,
      /Set HOOPLINE_TOKEN/,
    ],
  ])('refuses bad usage with one clear line: %j', async (args, env, code, message) => {
    const r = await runScript(args, env).done;
    expect(r.code).toBe(code);
    expect(r.err).toMatch(message);
    expect(r.err.trim().split('\n')).toHaveLength(1);
  });

  it('stops with exit 3 and the server’s own message when the token is refused', async () => {
    writeFileSync(file, logLines(5));
    const r = await runScript(['--url', api.url, '--test', '7', '--file', file], { HOOPLINE_TOKEN: 'hpl_wrong' }).done;
    expect(r.code).toBe(3);
    expect(r.err).toMatch(/The API token is unknown \(401 invalid-token\)/);
  });
});
