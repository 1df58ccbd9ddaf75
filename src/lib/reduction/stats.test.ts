import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { linearRegression, rSquared } from 'simple-statistics';
import { fitLine, fitThroughOrigin, tQuantile975, fitFromSums, interpolateSorted } from './stats';

// NIST StRD "Norris" (public domain), tests/fixtures/nist-strd-norris.dat — REFERENCES.md [read]
const text = readFileSync(
  fileURLToPath(new URL('../../../tests/fixtures/nist-strd-norris.dat', import.meta.url)),
  'utf8',
);
const rows = text
  .split('\n')
  .slice(60)
  .map((l) => l.trim().split(/\s+/).map(Number))
  .filter((r) => r.length === 2 && r.every(Number.isFinite));
const ys = rows.map((r) => r[0]!);
const xs = rows.map((r) => r[1]!);

describe('NIST StRD Norris — certified values (REFERENCES.md)', () => {
  const fit = fitLine(xs, ys)!;
  it('has 36 observations', () => expect(rows.length).toBe(36));
  it.each([
    ['B1', fit.slope, 1.00211681802045],
    ['B0', fit.intercept, -0.262323073774029],
    ['sd(B1)', fit.slopeSE!, 0.429796848199937e-3],
    ['residual SD', fit.residualSD!, 0.884796396144373],
    ['R²', fit.rSquared!, 0.999993745883712],
  ])('%s to 10 significant digits', (_n, got, want) => expect(Math.abs(got / want - 1)).toBeLessThan(1e-10));
  it('sd(B0) 0.232818234301152', () => {
    const n = xs.length;
    const mx = xs.reduce((a, b) => a + b) / n;
    const sxx = xs.reduce((s, x) => s + (x - mx) ** 2, 0);
    expect(fit.residualSD! * Math.sqrt(1 / n + (mx * mx) / sxx)).toBeCloseTo(0.232818234301152, 10);
  });
  it('95 % slope interval with t(0.975, 34) = 2.0322445 → [1.0012434, 1.0029903] [derived]', () => {
    expect(tQuantile975(34)).toBeCloseTo(2.0322445, 6);
    expect(fit.slopeCI95![0]).toBeCloseTo(1.0012434, 6);
    expect(fit.slopeCI95![1]).toBeCloseTo(1.0029903, 6);
  });
  it('agrees with simple-statistics', () => {
    const ss = linearRegression(rows.map((r) => [r[1]!, r[0]!]));
    expect(fit.slope).toBeCloseTo(ss.m, 9);
    expect(fit.rSquared!).toBeCloseTo(
      rSquared(
        rows.map((r) => [r[1]!, r[0]!]),
        (x) => ss.m * x + ss.b,
      ),
      9,
    );
  });
  it('the streaming sums give the same fit', () => {
    const sums = new Float64Array(6);
    const y0 = ys[0]!;
    xs.forEach((x, i) => {
      const y = ys[i]! - y0;
      sums[0]!++;
      sums[1]! += x;
      sums[2]! += y;
      sums[3]! += x * x;
      sums[4]! += x * y;
      sums[5]! += y * y;
    });
    const f = fitFromSums(sums, 0)!;
    expect(f.slope).toBeCloseTo(fit.slope, 9);
    expect(f.intercept + y0).toBeCloseTo(fit.intercept, 7);
    expect(f.residualSD!).toBeCloseTo(fit.residualSD!, 7);
  });
});

describe('NIST StRD NoInt1 — fit through zero (REFERENCES.md)', () => {
  const x = Array.from({ length: 11 }, (_, i) => 60 + i);
  const y = Array.from({ length: 11 }, (_, i) => 130 + i);
  const f = fitThroughOrigin(x, y)!;
  it('B1 2.07438016528926, sd 0.0165289256198347', () => {
    expect(f.slope).toBeCloseTo(2.07438016528926, 12);
    expect(f.slopeSE!).toBeCloseTo(0.0165289256198347, 12);
  });
});

describe('small fits', () => {
  it('two points: slope, no interval', () => {
    const f = fitLine([0, 1], [1, 3])!;
    expect(f.slope).toBe(2);
    expect(f.slopeCI95).toBeNull();
  });
  it('constant x → null', () => expect(fitLine([1, 1, 1], [1, 2, 3])).toBeNull());
  it('interpolation', () => {
    expect(interpolateSorted([0, 1, 2], [0, 10, 40], 1.5)).toBe(25);
    expect(interpolateSorted([0, 1], [0, 10], 2)).toBeNull();
  });
});
