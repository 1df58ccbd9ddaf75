// One side of the live-reducer memory case of `npm run bench`, in its own process:
//   node --expose-gc --import tsx scripts/bench-live.ts batch|live PLAN.json LOG.csv [chunkBytes]
// Feeds the log in chunks to the batch Reducer or to a LiveReducer and prints, as one JSON line,
// the retained heap growth (heapUsed after a full GC, sampled every 64 chunks, peak minus the
// baseline taken after construction), the wall time, the rows and the events.
import { createReadStream, readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { LiveReducer, parsePlan, Reducer } from '../src/lib/reduction/index';

const [mode, planFile, logFile, chunkArg] = process.argv.slice(2);
if ((mode !== 'batch' && mode !== 'live') || !planFile || !logFile) {
  process.stderr.write('usage: bench-live.ts batch|live PLAN.json LOG.csv [chunkBytes]\n');
  process.exit(2);
}
const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) {
  process.stderr.write('bench-live.ts needs node --expose-gc\n');
  process.exit(2);
}
const retained = () => {
  gc();
  return process.memoryUsage().heapUsed;
};

async function main() {
  const plan = parsePlan(JSON.parse(readFileSync(planFile!, 'utf8')));
  const chunkBytes = Number(chunkArg ?? 65536);
  const t0 = performance.now();
  const live = mode === 'live' ? new LiveReducer(plan) : null;
  const batch = mode === 'batch' ? new Reducer(plan) : null;
  batch?.beginSegment();
  const base = retained();
  let peak = base;
  let chunks = 0;
  let pushedEvents = 0;
  for await (const chunk of createReadStream(logFile!, { highWaterMark: chunkBytes })) {
    const bytes = chunk as Buffer;
    if (live) pushedEvents += live.push(bytes).length;
    else batch!.push(bytes);
    if (++chunks % 64 === 0) peak = Math.max(peak, retained());
  }
  peak = Math.max(peak, retained());
  let rows: number, events: number | null, verdict: string;
  if (live) {
    const done = live.finish();
    rows = done.result.log.rows;
    events = done.events.length;
    verdict = done.result.verdict;
  } else {
    batch!.endSegment();
    const { result } = batch!.finish();
    rows = result.log.rows;
    events = null;
    verdict = result.verdict;
  }
  const wallS = (performance.now() - t0) / 1000;
  process.stdout.write(
    JSON.stringify({ mode, chunks, rows, events, pushedEvents, verdict, wallS, growthBytes: peak - base }) + '\n',
  );
}

main().catch((e) => {
  process.stderr.write(`bench-live failed: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exitCode = 1;
});
