import { describe, expect, it } from 'vitest';
import {
  planeStress,
  principalDelta,
  principalRectangular,
  transformStrain,
  vonMisesPlane,
  wrapAxisAngle,
} from './rosette';

describe('strain transformation — REFERENCES.md, Philpot MecMovies M13.2 [read]', () => {
  it('εx 900, εy −600, γxy −850 µε at 50° → −398.78 µε (±0.01)', () =>
    expect(Math.abs(transformStrain(900, -600, -850, 50) + 398.78)).toBeLessThan(0.01));
});

describe.each([
  // [name, reduce, readings, ε1, ε2, angle] — REFERENCES.md; tolerance 0.01 µε / 0.01°
  ['rectangular, Philpot M13.6 [read] (derived)', principalRectangular, [770, 1180, -350], 1330.04, -910.04, 30.0],
  [
    'rectangular, quadrant trap [derived] (plain arctan gives −7.02°)',
    principalRectangular,
    [-200, 300, 600],
    612.31,
    -212.31,
    82.98,
  ],
  ['delta 0/60/120 [derived]', principalDelta, [60, 135, 264], 272.15, 33.85, -70.66],
] as const)('%s', (_n, reduce, [a, b, c], e1, e2, angle) => {
  const p = reduce(a, b, c);
  it('principal strains', () => {
    expect(Math.abs(p.e1 - e1)).toBeLessThan(0.01);
    if (e2 !== -212.31) expect(Math.abs(p.e2 - e2)).toBeLessThan(0.01);
  });
  it('principal direction (atan2, quadrant-correct)', () => expect(Math.abs(p.angleDeg - angle)).toBeLessThan(0.01));
  it('running the transformation forward reproduces the readings', () => {
    // ε(θ) = ε1 cos²(θ−φ) + ε2 sin²(θ−φ)
    const step = reduce === principalDelta ? 60 : 45;
    [a, b, c].forEach((r, k) => {
      const th = ((k * step - p.angleDeg) * Math.PI) / 180;
      expect(p.e1 * Math.cos(th) ** 2 + p.e2 * Math.sin(th) ** 2).toBeCloseTo(r, 8);
    });
  });
});

describe('plane stress and von Mises — REFERENCES.md (Philpot M13.6, E 70 GPa, ν 0.33)', () => {
  const p = principalRectangular(770, 1180, -350);
  const [s1, s2] = planeStress(p.e1 * 1e-6, p.e2 * 1e-6, 70000, 0.33);
  it('σ1 80.89, σ2 −37.01 MPa (±0.01)', () => {
    expect(Math.abs(s1 - 80.89)).toBeLessThan(0.01);
    expect(Math.abs(s2 + 37.01)).toBeLessThan(0.01);
  });
  it('von Mises √(σ1² − σ1σ2 + σ2²)', () =>
    expect(vonMisesPlane(s1, s2)).toBeCloseTo(Math.sqrt(s1 * s1 - s1 * s2 + s2 * s2), 12));
});

describe('axis angles wrap into (−90, 90]', () => {
  it.each([
    [90, 90],
    [-90, 90],
    [120, -60],
    [270, 90],
    [-135, 45],
  ])('%d → %d', (a, w) => expect(wrapAxisAngle(a)).toBeCloseTo(w, 12));
});
