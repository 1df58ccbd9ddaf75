// Reduce a hydrotest log against a plan and print the result JSON (DESIGN 4.3).
//   npm run reduce -- PLAN.json LOG.csv [LOG2.csv …] [--series SERIES.json] [--compact]
// Exit 0 with the result on stdout; bad input: exit 2 and one line on stderr naming the problem
// (for the log: line and column); an internal fault: exit 1. `npx tsx scripts/reduce.ts …` or
// `node --import tsx scripts/reduce.ts …` gives the bare output without npm's own lines.
import { createReadStream, promises as fs } from 'node:fs';
import { InputError, parsePlan, reduceLog } from '../src/lib/reduction/index';

class UsageError extends Error {}

const USAGE = 'usage: reduce PLAN.json LOG.csv [LOG2.csv …] [--series SERIES.json] [--compact]';

function oneLine(s: string): string {
  return s.replace(/\s*\n\s*/g, ' ').trim();
}

async function main(argv: string[]): Promise<void> {
  const files: string[] = [];
  let seriesOut: string | null = null;
  let compact = false;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--series') {
      seriesOut = argv[++i] ?? null;
      if (!seriesOut) throw new UsageError('--series needs a file name');
    } else if (a === '--compact') compact = true;
    else if (a === '-h' || a === '--help') {
      process.stdout.write(USAGE + '\n');
      return;
    } else if (a.startsWith('--')) throw new UsageError(`unknown option ${a}`);
    else files.push(a);
  }
  if (files.length < 2) throw new UsageError(USAGE);
  const [planPath, ...logPaths] = files as [string, ...string[]];

  let planText: string;
  try {
    planText = await fs.readFile(planPath, 'utf8');
  } catch (e) {
    throw new UsageError(
      `${planPath}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`,
    );
  }
  let plan;
  try {
    plan = parsePlan(planText);
  } catch (e) {
    if (e instanceof InputError) throw new InputError(e.code, `${planPath}: ${e.message}`, e.details);
    throw e;
  }
  for (const p of logPaths) {
    try {
      const st = await fs.stat(p);
      if (!st.isFile()) throw new UsageError(`${p}: not a file`);
    } catch (e) {
      if (e instanceof UsageError) throw e;
      throw new UsageError(
        `${p}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`,
      );
    }
  }
  const sources = logPaths.map((p) => createReadStream(p, { highWaterMark: 1 << 20 }));
  let out;
  try {
    out = await reduceLog(plan, sources);
  } catch (e) {
    if (e instanceof InputError) {
      const which =
        logPaths.length > 1 && e.details?.source !== undefined
          ? logPaths[e.details.source]
          : logPaths.length === 1
            ? logPaths[0]
            : null;
      throw new InputError(
        e.code,
        which && !e.message.startsWith('column') ? `${which}: ${e.message}` : e.message,
        e.details,
      );
    }
    throw e;
  } finally {
    for (const s of sources) s.destroy();
  }
  if (seriesOut) await fs.writeFile(seriesOut, JSON.stringify(out.series));
  process.stdout.write(JSON.stringify(out.result, null, compact ? 0 : 2) + '\n');
}

main(process.argv.slice(2)).then(
  () => {
    process.exitCode = 0;
  },
  (e: unknown) => {
    if (e instanceof InputError || e instanceof UsageError) {
      process.stderr.write(oneLine(e.message) + '\n');
      process.exitCode = 2;
    } else {
      const msg = e instanceof Error ? e.message : String(e);
      process.stderr.write(`internal error: ${oneLine(msg)} (please report it with the plan and the log)\n`);
      if (process.argv.includes('--debug') && e instanceof Error && e.stack) process.stderr.write(e.stack + '\n');
      process.exitCode = 1;
    }
  },
);
