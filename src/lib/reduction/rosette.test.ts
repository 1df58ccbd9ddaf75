import { describe, expect, it } from 'vitest';
import {
  planeStress,
  principalDelta,
  principalRectangular,
  transformStrain,
  vonMisesPlane,
  wrapAxisAngle,
  evaluateRosette,
  lineAngleDifference,
} from './rosette';

describe('strain transformation — REFERENCES.md, Philpot MecMovies M13.2 [read]', () => {
  it('εx 900, εy −600, γxy −850 µε at 50° → −398.78 µε (±0.01)', () =>
    expect(Math.abs(transformStrain(900, -600, -850, 50) + 398.78)).toBeLessThan(0.01));
});

describe.each([
  // [name, reduce, readings, ε1, ε2, angle] — REFERENCES.md; tolerance 0.01 µε / 0.01°
  ['rectangular, Philpot M13.6 [read] (derived)', principalRectangular, [770, 1180, -350], 1330.04, -910.04, 30.0],
  [
    // ε2 derived here: mean (εA + εC)/2 = 200, radius √((−500)² + 300²)/√2 = 412.31 → ε2 = −212.31
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
    expect(Math.abs(p.e2 - e2)).toBeLessThan(0.01);
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
});

describe('von Mises of plane stress — REFERENCES "Added for engine v2" [derived from Lamé]', () => {
  it.each([
    ['thick cylinder outer surface σθ(b) 166.67, σz 83.333 MPa', 166.6667, 83.3333, 144.34],
    ['thin-wall membrane σh 240, σa 120 MPa', 240, 120, 207.85],
  ])('%s → %f MPa', (_n, a, b, want) => expect(vonMisesPlane(a, b)).toBeCloseTo(want, 2));
});

describe('evaluateRosette: stresses per unit pressure, expected direction, principal-direction flag', () => {
  // principal strains along the hoop and the axis, µε/MPa (about the DESIGN 4.1 example vessel)
  const hoop = 236.9,
    axial = 55.75;
  const grids = (rot: number) =>
    [0, 45, 90].map((a) => transformStrain(axial, hoop, 0, a + rot)) as [number, number, number];
  const base = {
    id: 'R1',
    kind: 'rosette-rectangular' as const,
    angleDeg: 0,
    elasticModulus: 200000,
    poissonRatio: 0.3,
    yieldStrength: 260,
    pressure: 3.4,
    predictedHoop: hoop,
    predictedAxial: axial,
    shape: 'cylinder' as const,
    directionTolerance: 10,
  };
  it('a rosette where the plan says: ε1 hoop, stresses E/(1−ν²)(ε1 + ν ε2) per MPa, no flag', () => {
    const r = evaluateRosette({ ...base, slopes: grids(0) });
    expect(r.expectedPrincipalAngleDeg).toBe(90);
    expect(Math.abs(r.principalAngleDeg)).toBeCloseTo(90, 6);
    const k = 200000 / (1 - 0.09);
    expect(r.stressesPerUnitPressure[0]).toBeCloseTo(k * (hoop + 0.3 * axial) * 1e-6, 9);
    expect(r.principalStresses[0]).toBeCloseTo(3.4 * r.stressesPerUnitPressure[0], 12);
    expect(r.vonMises).toBeCloseTo(3.4 * r.vonMisesPerUnitPressure, 12);
    expect(r.flags).toEqual([]);
  });
  it.each([
    [8, false],
    [15, true],
    [-25, true],
  ])('bonded %d° off: flagged %s', (rot, flagged) => {
    const r = evaluateRosette({ ...base, slopes: grids(rot) });
    expect(lineAngleDifference(r.principalAngleDeg, 90)).toBeCloseTo(Math.abs(rot), 6);
    expect(r.flags.includes('principal-direction')).toBe(flagged);
  });
  it('a sphere has no expected direction', () => {
    const r = evaluateRosette({ ...base, shape: 'sphere', slopes: [100, 100, 100] });
    expect(r.expectedPrincipalAngleDeg).toBeNull();
    expect(r.flags).toEqual([]);
  });
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
