// The CLI as a user runs it (DESIGN 4.3): result JSON on stdout and exit 0; bad input: exit 2
// and exactly one line on stderr naming the problem (for the log: line and column).
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { demoPlanInput, demoPlan } from '../src/lib/reduction/testing/fixtures';
import { syntheticLog } from '../src/lib/reduction/testing/synthetic-log';

const dir = mkdtempSync(path.join(tmpdir(), 'hoopline-cli-'));
const file = (name: string, text: string) => {
  const p = path.join(dir, name);
  writeFileSync(p, text);
  return p;
};
const run = (...args: string[]) =>
  spawnSync(process.execPath, ['--import', 'tsx', 'scripts/reduce.ts', ...args], { encoding: 'utf8' });

const planPath = file('plan.json', JSON.stringify(demoPlanInput));
const logText = syntheticLog(demoPlan(), { rateHz: 1, holdSeconds: 30, rampSeconds: 15 });
const logPath = file('log.csv', logText);

describe('npm run reduce', () => {
  it('prints the result JSON and exits 0', () => {
    const r = run(planPath, logPath);
    expect(r.status).toBe(0);
    const result = JSON.parse(r.stdout);
    expect(result.verdict).toBe('conforms');
    expect(result.gauges.map((g: { id: string }) => g.id)).toContain('R1/B');
    expect(r.stderr).toBe('');
  });

  it.each([
    [
      'a plan with a negative wall thickness',
      () => [
        file(
          'bad-plan.json',
          JSON.stringify({ ...demoPlanInput, vessel: { ...demoPlanInput.vessel, wallThickness: -4 } }),
        ),
        logPath,
      ],
      /Vessel wall thickness: must be greater than 0/,
    ],
    ['a plan that is not JSON', () => [file('broken.json', '{ "units": '), logPath], /not valid JSON/],
    [
      'a log without a mapped column',
      () => [planPath, file('no-sg3.csv', logText.replace('SG3', 'SGX'))],
      /line \d+, column 'SG3'/,
    ],
    [
      'a log whose pressure column holds no number',
      () => [
        planPath,
        file(
          'words.csv',
          'time_s,P [MPa],SG1,SG2,SG3,SG4,SG5,SG6,SG7,SG8,SG9,SG10\n' +
            Array.from({ length: 20 }, (_, i) => `${i},high,1,1,1,1,1,1,1,1,1,1`).join('\n'),
        ),
      ],
      /line 1.*pressure value/,
    ],
    [
      'a log with a gauge column that holds no number',
      () => [
        planPath,
        file(
          'dead-col.csv',
          logText
            .split('\n')
            .map((l, i) =>
              i === 0 || !l
                ? l
                : l
                    .split(',')
                    .map((c, k) => (k === 3 ? 'n/a' : c))
                    .join(','),
            )
            .join('\n'),
        ),
      ],
      /column 'SG2'/,
    ],
    ['a log file that does not exist', () => [planPath, path.join(dir, 'missing.csv')], /missing\.csv: no such file/],
    ['no log at all', () => [planPath], /usage/],
  ])('exits 2 with one line on stderr for %s', (_name, args, message) => {
    const r = run(...args());
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    const lines = r.stderr.trimEnd().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(message);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
  });
});
