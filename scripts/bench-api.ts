// API benchmark: many viewers on one app server, uploads and the worker (issue "many viewers").
//   npm run bench:api            (HOOPLINE_SKIP_BUILD=1 reuses dist/)
// Starts a private stack (scripts/stack.ts), then measures in one run, on this machine:
//   - upload throughput of the 1 M-row log (raw text/csv body, API token), MB/s;
//   - the worker's time for that log (queued → done, worker already running) against the CLI's;
//   - 50 concurrent readers, each sending 20 requests in turn, for a one-row read
//     (GET /api/vessels/{id}), the time-history series for 2000 points as the review page asks
//     for it (GET /api/tests/{id}/series?points=2000&reduction=R, Accept-Encoding: br, gzip,
//     no If-None-Match: a first view) and the result read (GET /api/reductions/{id}). Phases run
//     twice in turn (row, series, result, row, series, result) so drift hits all alike;
//   - the one-row read again while 200 live-event streams of the test are open (each polls MariaDB
//     every LIVE_POLL_MS), against the same read without them.
// Prints medians, p99s, bytes on the wire and the ratios the targets are stated in.
import { spawnSync } from 'node:child_process';
import { createReadStream, statSync } from 'node:fs';
import http from 'node:http';
import { performance } from 'node:perf_hooks';
import { HttpClient } from '../tests/support/http-client';
import { ensureLog, planInput, planPath, root } from './bench-data';
import { startStack, type Stack } from './stack';

const READERS = 50;
const PER_READER = 20;
/** open live-event streams (the review and inspector pages of a test bay) during the last read phase */
const STREAMS = 200;

interface Sample {
  ms: number;
  status: number;
  wireBytes: number;
}

const agent = new http.Agent({ keepAlive: true, maxSockets: READERS });

function get(url: string, headers: Record<string, string>): Promise<Sample> {
  const t0 = performance.now();
  return new Promise((resolve, reject) => {
    const req = http.get(url, { agent, headers }, (res) => {
      let wireBytes = 0;
      res.on('data', (c: Buffer) => (wireBytes += c.length));
      res.on('end', () => resolve({ ms: performance.now() - t0, status: res.statusCode ?? 0, wireBytes }));
      res.on('error', reject);
    });
    req.on('error', reject);
  });
}

interface Phase {
  samples: Sample[];
  errors: number;
  nonOk: number;
  seconds: number;
}

/** Open `n` Server-Sent-Event streams and keep them open; `stats` says how many answered and sent bytes. */
function openStreams(url: string, headers: Record<string, string>, n: number) {
  const own = new http.Agent({ keepAlive: false, maxSockets: Infinity });
  const bytes = new Array<number>(n).fill(0);
  let opened = 0;
  let errors = 0;
  const requests = Array.from({ length: n }, (_, i) => {
    const req = http.get(url, { agent: own, headers: { ...headers, accept: 'text/event-stream' } }, (res) => {
      if (res.statusCode === 200) opened++;
      res.on('data', (c: Buffer) => (bytes[i]! += c.length));
      res.on('error', () => undefined);
    });
    req.on('error', () => errors++);
    return req;
  });
  return {
    stats: () => ({ opened, errors, sending: bytes.filter((b) => b > 0).length }),
    close: () => {
      for (const r of requests) r.destroy();
      own.destroy();
    },
  };
}

async function readers(url: string, headers: Record<string, string>): Promise<Phase> {
  const samples: Sample[] = [];
  let errors = 0,
    nonOk = 0;
  const t0 = performance.now();
  await Promise.all(
    Array.from({ length: READERS }, async () => {
      for (let i = 0; i < PER_READER; i++) {
        try {
          const s = await get(url, headers);
          if (s.status !== 200) nonOk++;
          samples.push(s);
        } catch {
          errors++;
        }
      }
    }),
  );
  return { samples, errors, nonOk, seconds: (performance.now() - t0) / 1000 };
}

const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))] ?? NaN;
};

/** Stream a file as a raw text/csv body; resolves to the answer and the seconds it took. */
function uploadFile(
  url: string,
  token: string,
  file: string,
): Promise<{ status: number; body: string; seconds: number }> {
  const t0 = performance.now();
  return new Promise((resolve, reject) => {
    const req = http.request(
      url,
      {
        method: 'POST',
        headers: {
          authorization: `Bearer ${token}`,
          'content-type': 'text/csv',
          'content-length': String(statSync(file).size),
          'x-filename': 'bench-1m.csv',
        },
      },
      (res) => {
        let body = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (body += c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body, seconds: (performance.now() - t0) / 1000 }));
      },
    );
    req.on('error', reject);
    createReadStream(file).pipe(req);
  });
}

async function waitDone(c: HttpClient, id: number): Promise<void> {
  for (;;) {
    const r = await c.json(`/api/reductions/${id}`);
    if (r.body.status === 'done') return;
    if (r.body.status === 'failed') throw new Error(`reduction failed: ${r.body.error}`);
    await new Promise((res) => setTimeout(res, 50));
  }
}

async function run(stack: Stack) {
  const server = stack.servers[0]!;
  const engineer = new HttpClient(server.url);
  if (!(await engineer.signIn('engineer@example.com', stack.password))) throw new Error('sign-in failed');
  const technician = new HttpClient(server.url);
  if (!(await technician.signIn('technician@example.com', stack.password))) throw new Error('sign-in failed');
  const token = (await technician.json('/api/account/tokens', { method: 'POST', json: { name: 'bench' } })).body.token;

  const made = await engineer.json('/api/tests', { method: 'POST', json: { name: 'API bench', plan: planInput } });
  if (made.status !== 201) throw new Error(`creating the test: ${JSON.stringify(made.body)}`);
  const testId: number = made.body.id;
  const vesselId: number = (await engineer.json(`/api/tests/${testId}`)).body.vessel.id;

  const log = await ensureLog('hydrotest-1m.csv', 1_000_000);
  const sizeMB = statSync(log).size / 1e6;
  const up = await uploadFile(`${server.url}/api/tests/${testId}/logs`, token, log);
  if (up.status !== 201) throw new Error(`upload answered ${up.status}: ${up.body.slice(0, 300)}`);
  const uploadMBs = sizeMB / up.seconds;

  const c0 = performance.now();
  const cli = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/reduce.ts', planPath, log, '--compact'], {
    cwd: root,
    maxBuffer: 1 << 28,
    encoding: 'utf8',
  });
  const cliSeconds = (performance.now() - c0) / 1000;
  if (cli.status !== 0) throw new Error(`CLI failed: ${cli.stderr.slice(-500)}`);

  const worker = stack.startWorker('bench-worker');
  await new Promise((r) => setTimeout(r, 2000)); // started and polling before the job is queued
  const w0 = performance.now();
  const q = await technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} });
  await waitDone(engineer, q.body.id);
  const workerSeconds = (performance.now() - w0) / 1000;
  worker.child.kill('SIGTERM');
  await worker.exited;
  const rid: number = q.body.id;

  const cookie = engineer.cookieHeader();
  const browser = { cookie, 'accept-encoding': 'br, gzip' };
  const urls = {
    row: `${server.url}/api/vessels/${vesselId}`,
    series: `${server.url}/api/tests/${testId}/series?points=2000&reduction=${rid}`,
    result: `${server.url}/api/reductions/${rid}`,
  };
  // the first series request fetches and decodes the stored series: reported on its own
  const cold = await get(urls.series, browser);
  for (const u of Object.values(urls)) for (let i = 0; i < 10; i++) await get(u, browser);
  const phases: Record<keyof typeof urls, Phase[]> = { row: [], series: [], result: [] };
  for (let round = 0; round < 2; round++)
    for (const kind of ['row', 'series', 'result'] as const) phases[kind].push(await readers(urls[kind], browser));

  // the same one-row read while many pages follow the test's live events (each stream polls MariaDB)
  const streams = openStreams(`${server.url}/api/tests/${testId}/live/events`, { cookie }, STREAMS);
  await new Promise((r) => setTimeout(r, 3000));
  const underStreams = await readers(urls.row, browser);
  const streamStats = streams.stats();
  streams.close();
  const rowUnderStreams = quantile(
    underStreams.samples.map((x) => x.ms),
    0.5,
  );

  const all = (k: keyof typeof urls) => phases[k].flatMap((p) => p.samples);
  const med = (k: keyof typeof urls) =>
    quantile(
      all(k).map((s) => s.ms),
      0.5,
    );
  const p99 = (k: keyof typeof urls) =>
    quantile(
      all(k).map((s) => s.ms),
      0.99,
    );
  const wire = (k: keyof typeof urls) =>
    quantile(
      all(k).map((s) => s.wireBytes),
      0.5,
    );
  const dropped = Object.values(phases)
    .flat()
    .reduce((n, p) => n + p.errors, 0);
  const nonOk = Object.values(phases)
    .flat()
    .reduce((n, p) => n + p.nonOk, 0);
  const rowRps = all('row').length / phases.row.reduce((s, p) => s + p.seconds, 0);
  const seriesRps = all('series').length / phases.series.reduce((s, p) => s + p.seconds, 0);
  const identity = await get(urls.series, { cookie });

  const f = (x: number, d = 1) => x.toFixed(d);
  const ok = (c: boolean) => (c ? 'met' : 'NOT met');
  const seriesRatio = med('series') / med('row');
  const resultRatio = med('result') / med('row');
  const workerRatio = workerSeconds / cliSeconds;
  const streamRatio = rowUnderStreams / med('row');
  const lines = [
    `Hoopline API benchmark — node ${process.version}, one app server, ${READERS} concurrent readers × ${PER_READER} requests × 2 rounds`,
    '',
    'read              median ms   p99 ms   wire KB   req/s',
    ...(['row', 'series', 'result'] as const).map(
      (k) =>
        `${{ row: 'one-row read', series: 'series 2000 pts', result: 'result read' }[k].padEnd(18)}${f(med(k)).padStart(9)}${f(p99(k)).padStart(9)}${f(wire(k) / 1024).padStart(10)}${f(k === 'row' ? rowRps : k === 'series' ? seriesRps : all(k).length / phases[k].reduce((s, p) => s + p.seconds, 0), 0).padStart(8)}`,
    ),
    `series, first request (fetch + decode + encode): ${f(cold.ms)} ms; uncompressed answer ${f(identity.wireBytes / 1024)} KB`,
    `one-row read with ${STREAMS} live-event streams open: median ${f(rowUnderStreams)} ms; streams answered ${streamStats.opened}, sending ${streamStats.sending}, failed ${streamStats.errors}`,
    `upload: ${f(sizeMB)} MB in ${f(up.seconds, 2)} s = ${f(uploadMBs)} MB/s`,
    `1 M-row log: CLI ${f(cliSeconds, 2)} s, worker ${f(workerSeconds, 2)} s (${f(1_000_000 / workerSeconds / 1000, 0)} k rows/s per worker)`,
    '',
    'targets:',
    `  series median / one-row median ≤ 4 ........... ${f(seriesRatio, 2)}  ${ok(seriesRatio <= 4)}`,
    `  series on the wire ≤ 300 KB .................. ${f(wire('series') / 1024)} KB  ${ok(wire('series') <= 300 * 1024)}`,
    `  result median / one-row median ≤ 2 ........... ${f(resultRatio, 2)}  ${ok(resultRatio <= 2)}`,
    `  no dropped connection ........................ ${dropped} dropped, ${nonOk} not 200  ${ok(dropped === 0 && nonOk === 0)}`,
    `  one-row read, ${STREAMS} streams open / none ≤ 2 .... ${f(streamRatio, 2)}  ${ok(streamRatio <= 2 && streamStats.opened === STREAMS && underStreams.errors === 0)}`,
    `  upload ≥ 50 MB/s ............................. ${f(uploadMBs)} MB/s  ${ok(uploadMBs >= 50)}`,
    `  worker / CLI ≤ 1.5 on the 1 M-row log ........ ${f(workerRatio, 2)}  ${ok(workerRatio <= 1.5)}`,
  ];
  process.stdout.write(lines.join('\n') + '\n');
}

const stack = await startStack({
  servers: 1,
  workers: 0,
  env: { LOG_LEVEL: 'warn', UPLOAD_MAX_BYTES: String(1 << 30) },
});
try {
  await run(stack);
} catch (e) {
  process.stderr.write(`bench failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
  process.exitCode = 1;
} finally {
  agent.destroy();
  await stack.stop();
}
