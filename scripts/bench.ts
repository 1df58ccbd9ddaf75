// Benchmark of the reduction CLI against a papaparse-only parse of the same file.
//   npm run bench            (logs are generated once into bench-out/, which git ignores)
// Generates a 900 Hz nine-hold test (time, pressure, 18 gauge channels) of about 1 M rows and a
// 250 k-row one, then runs, each in its own child process: the CLI (node --import tsx
// scripts/reduce.ts) and papaparse with header + dynamicTyping streaming the file and counting
// rows. Wall time is measured around the child; peak RSS from /usr/bin/time -v when available,
// else from the child's own process.resourceUsage().maxRSS. Then the live case: the 1 M-row log fed
// in 64 KiB chunks to the batch Reducer and to a LiveReducer (scripts/bench-live.ts, one process
// each), and the ratio of their retained heap growth.
import { spawnSync } from 'node:child_process';
import { existsSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { ensureLog, outDir, planPath, root } from './bench-data';

const papaScript = join(outDir, 'papaparse-only.cjs');
writeFileSync(
  papaScript,
  `// papaparse with header + dynamicTyping, streaming the file, counting rows
const fs = require('node:fs');
const Papa = require(${JSON.stringify(join(root, 'node_modules/papaparse'))});
let rows = 0;
Papa.parse(fs.createReadStream(process.argv[2]), {
  header: true, dynamicTyping: true, skipEmptyLines: true,
  chunk: (r) => { rows += r.data.length; },
  complete: () => { process.stdout.write(JSON.stringify({ rows, maxRSSkB: process.resourceUsage().maxRSS }) + '\\n'); },
});
`,
);

const haveTime = existsSync('/usr/bin/time');
interface Run {
  wallS: number;
  rssMB: number | null;
  ok: boolean;
  out: string;
}
function run(cmd: string[]): Run {
  const args = haveTime ? ['-v', ...cmd] : cmd;
  const t0 = performance.now();
  const r = spawnSync(haveTime ? '/usr/bin/time' : cmd[0]!, haveTime ? args : cmd.slice(1), {
    cwd: root,
    maxBuffer: 1 << 28,
    encoding: 'utf8',
  });
  const wallS = (performance.now() - t0) / 1000;
  let rssMB: number | null = null;
  const m = /Maximum resident set size \(kbytes\): (\d+)/.exec(r.stderr ?? '');
  if (m) rssMB = Number(m[1]) / 1024;
  else {
    const j = /"maxRSSkB":(\d+)/.exec(r.stdout ?? '');
    if (j) rssMB = Number(j[1]) / 1024;
  }
  return {
    wallS,
    rssMB,
    ok: r.status === 0,
    out:
      r.status === 0
        ? r.stdout
        : (r.stderr ?? '')
            .split('\n')
            .filter((l) => !/^\s/.test(l) && l)
            .slice(-3)
            .join(' | '),
  };
}

const cliCmd = (log: string) => [process.execPath, '--import', 'tsx', 'scripts/reduce.ts', planPath, log, '--compact'];

async function main() {
  const small = await ensureLog('hydrotest-250k.csv', 250_000);
  const big = await ensureLog('hydrotest-1m.csv', 1_000_000);
  const rows: {
    name: string;
    sizeMB: number;
    cli: Run;
    papa: Run;
    verdict: string;
    holds: number;
    dataRows: number;
  }[] = [];
  for (const [name, path] of [
    ['250 k rows', small],
    ['1 M rows', big],
  ] as const) {
    const papa = run([process.execPath, papaScript, path]);
    const cli = run(cliCmd(path));
    let verdict = '?',
      holds = 0,
      dataRows = 0;
    if (cli.ok) {
      const res = JSON.parse(cli.out);
      verdict = res.verdict;
      holds = res.holds.length;
      dataRows = res.log.rows;
    }
    rows.push({ name, sizeMB: statSync(path).size / 2 ** 20, cli, papa, verdict, holds, dataRows });
  }
  const pad = (s: string, n: number) => s.padEnd(n);
  const f = (x: number | null, d = 2) => (x === null ? 'n/a' : x.toFixed(d));
  const lines: string[] = [];
  lines.push(
    `Hoopline reduction benchmark — node ${process.version}, ${haveTime ? 'peak RSS from /usr/bin/time -v' : 'peak RSS from process.resourceUsage()'}`,
  );
  lines.push('');
  lines.push(
    pad('log', 12) +
      pad('size MB', 9) +
      pad('rows', 10) +
      pad('CLI s', 8) +
      pad('papa s', 8) +
      pad('ratio', 7) +
      pad('CLI RSS MB', 12) +
      pad('papa RSS MB', 13) +
      'result',
  );
  for (const r of rows) {
    const ratio = r.cli.wallS / r.papa.wallS;
    lines.push(
      pad(r.name, 12) +
        pad(f(r.sizeMB, 1), 9) +
        pad(String(r.dataRows), 10) +
        pad(f(r.cli.wallS), 8) +
        pad(f(r.papa.wallS), 8) +
        pad(f(ratio), 7) +
        pad(f(r.cli.rssMB, 0), 12) +
        pad(f(r.papa.rssMB, 0), 13) +
        (r.cli.ok ? `${r.verdict}, ${r.holds} holds` : `CLI failed: ${r.cli.out}`),
    );
  }
  const [s, b] = rows as [(typeof rows)[0], (typeof rows)[0]];
  const ratioBig = b.cli.wallS / b.papa.wallS;
  const growth = b.cli.rssMB !== null && s.cli.rssMB !== null ? b.cli.rssMB - s.cli.rssMB : null;
  const ok = (c: boolean) => (c ? 'met' : 'NOT met');
  lines.push('');
  lines.push('targets (1 M rows):');
  lines.push(`  wall time ratio CLI / papaparse ≤ 0.35 ....... ${f(ratioBig)}  ${ok(ratioBig <= 0.35)}`);
  lines.push(`  stretch ratio ≤ 0.2 ........................... ${f(ratioBig)}  ${ok(ratioBig <= 0.2)}`);
  lines.push(
    `  peak RSS ≤ 150 MB ............................. ${f(b.cli.rssMB, 0)} MB  ${ok((b.cli.rssMB ?? Infinity) <= 150)}`,
  );
  lines.push(
    `  memory flat, 250 k → 1 M rows (≤ 25 MB growth) . ${growth === null ? 'n/a' : `${growth >= 0 ? '+' : ''}${growth.toFixed(0)} MB`}  ${ok(growth !== null && growth <= 25)}`,
  );
  lines.push(`  all runs succeeded ............................ ${ok(rows.every((r) => r.cli.ok && r.papa.ok))}`);
  // live reducer against the batch Reducer, the same log and chunks, in this run
  const side = (mode: 'batch' | 'live') => {
    const r = run([process.execPath, '--expose-gc', '--import', 'tsx', 'scripts/bench-live.ts', mode, planPath, big]);
    if (!r.ok) return { r, j: null };
    return {
      r,
      j: JSON.parse(r.out) as {
        growthBytes: number;
        wallS: number;
        rows: number;
        events: number | null;
        chunks: number;
      },
    };
  };
  const lb = side('batch');
  const ll = side('live');
  const mb = (x: number) => x / 2 ** 20;
  lines.push('');
  if (lb.j && ll.j) {
    // judged against max(1 MB, batch): a few hundred kB either way is GC noise, not growth
    const rawRatio = ll.j.growthBytes / Math.max(1, lb.j.growthBytes);
    const liveRatio = mb(ll.j.growthBytes) / Math.max(1, mb(lb.j.growthBytes));
    lines.push(
      `live reducer, 1 M rows in ${ll.j.chunks} chunks of 64 KiB, ${ll.j.events} events: retained heap growth batch ${f(mb(lb.j.growthBytes))} MB, live ${f(mb(ll.j.growthBytes))} MB, ratio live/batch ${f(rawRatio)}; wall batch ${f(lb.j.wallS)} s, live ${f(ll.j.wallS)} s (both with a full GC every 64 chunks)`,
    );
    lines.push(`  live memory flat (growth ≤ 1.5 × max(1 MB, batch)) ${f(liveRatio)}  ${ok(liveRatio <= 1.5)}`);
  } else lines.push(`live reducer case failed: ${lb.j ? ll.r.out : lb.r.out}`);
  process.stdout.write(lines.join('\n') + '\n');
}

main().catch((e) => {
  process.stderr.write(`bench failed: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exitCode = 1;
});
