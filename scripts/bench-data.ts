// The generated logs and plan that the benchmarks share (npm run bench, npm run bench:api): a
// 900 Hz nine-hold test (time, pressure, 18 gauge channels), written once into bench-out/.
import { createWriteStream, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { once } from 'node:events';
import { join, resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import { parsePlan, type PlanInput } from '../src/lib/reduction/index';
import { syntheticLogChunks } from '../src/lib/reduction/testing/synthetic-log';

export const root = resolve(import.meta.dirname, '..');
export const outDir = join(root, 'bench-out');
mkdirSync(outDir, { recursive: true });

export const planInput: PlanInput = {
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1800, wallThickness: 16, length: 6000 },
  material: { elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 260 },
  testPressure: 3.4,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [
    ...Array.from({ length: 6 }, (_, i) => ({
      id: `U${i + 1}`,
      kind: 'uniaxial' as const,
      channels: [`SG${i + 1}`],
      angleDeg: i % 2 ? 0 : 90,
      distanceToDiscontinuity: 1500,
    })),
    ...Array.from({ length: 4 }, (_, i) => ({
      id: `R${i + 1}`,
      kind: 'rosette-rectangular' as const,
      channels: [`SG${7 + 3 * i}`, `SG${8 + 3 * i}`, `SG${9 + 3 * i}`],
      angleDeg: 0,
      transverseSensitivity: 0.01,
      distanceToDiscontinuity: 1500,
    })),
  ],
};
const plan = parsePlan(planInput);
export const planPath = join(outDir, 'bench-plan.json');
writeFileSync(planPath, JSON.stringify(planInput, null, 2));

const RATE = 900;
export async function ensureLog(name: string, targetRows: number): Promise<string> {
  const path = join(outDir, name);
  const metaPath = path + '.meta.json';
  if (existsSync(path) && existsSync(metaPath) && JSON.parse(readFileSync(metaPath, 'utf8')).targetRows === targetRows)
    return path;
  // nine holds and eight ramps, hold:ramp ≈ 2:1, sized to the row count at 900 Hz
  const duration = targetRows / RATE;
  const ramp = duration / (9 * 2 + 8);
  const hold = 2 * ramp;
  process.stderr.write(`generating ${name} (${targetRows} rows)… `);
  const t0 = performance.now();
  const ws = createWriteStream(path);
  for (const chunk of syntheticLogChunks(plan, {
    rateHz: RATE,
    holdSeconds: hold,
    rampSeconds: ramp,
    seed: 7,
    strainNoise: 2,
    chunkRows: 5000,
    format: { digits: 2 },
  })) {
    if (!ws.write(chunk)) await once(ws, 'drain');
  }
  ws.end();
  await once(ws, 'finish');
  writeFileSync(metaPath, JSON.stringify({ targetRows }));
  process.stderr.write(`${((performance.now() - t0) / 1000).toFixed(1)} s\n`);
  return path;
}
