// Strain transformation, rosette reduction and plane-stress conversion, and a rosette's
// evaluation against the prediction. Angles in degrees, counter-clockwise; rosette angles are
// measured from grid A.
import type { FlagCode, RosetteResult } from './types';

const RAD = Math.PI / 180;

/** Normal strain along θ: εx cos²θ + εy sin²θ + γxy sinθ cosθ (Philpot, Mechanics of Materials). */
export function transformStrain(ex: number, ey: number, gxy: number, thetaDeg: number): number {
  const c = Math.cos(thetaDeg * RAD);
  const s = Math.sin(thetaDeg * RAD);
  return ex * c * c + ey * s * s + gxy * s * c;
}

export interface Principal {
  /** larger principal strain */
  e1: number;
  e2: number;
  /** direction of e1 from grid A, degrees, in (−90, 90] */
  angleDeg: number;
}

/** Wrap an angle into (−90, 90]: a principal direction is a line, not a ray. */
export function wrapAxisAngle(deg: number): number {
  let a = deg % 180;
  if (a <= -90) a += 180;
  if (a > 90) a -= 180;
  return a;
}

/** Rectangular 0/45/90 rosette (ASTM E1561): quadrant-correct atan2. */
export function principalRectangular(eA: number, eB: number, eC: number): Principal {
  const mean = (eA + eC) / 2;
  const rad = Math.SQRT1_2 * Math.sqrt((eA - eB) ** 2 + (eB - eC) ** 2);
  const angle = (0.5 * Math.atan2(2 * eB - eA - eC, eA - eC)) / RAD;
  return { e1: mean + rad, e2: mean - rad, angleDeg: wrapAxisAngle(angle) };
}

/** Delta 0/60/120 rosette: quadrant-correct atan2. */
export function principalDelta(eA: number, eB: number, eC: number): Principal {
  const mean = (eA + eB + eC) / 3;
  const rad = (Math.SQRT2 / 3) * Math.sqrt((eA - eB) ** 2 + (eB - eC) ** 2 + (eC - eA) ** 2);
  const angle = (0.5 * Math.atan2(Math.sqrt(3) * (eB - eC), 2 * eA - eB - eC)) / RAD;
  return { e1: mean + rad, e2: mean - rad, angleDeg: wrapAxisAngle(angle) };
}

/** Plane stress from principal strains (dimensionless in, stress unit of E out). */
export function planeStress(e1: number, e2: number, E: number, nu: number): [number, number] {
  const k = E / (1 - nu * nu);
  return [k * (e1 + nu * e2), k * (e2 + nu * e1)];
}

/** von Mises of a plane stress state: √(σ1² − σ1σ2 + σ2²). */
export function vonMisesPlane(s1: number, s2: number): number {
  return Math.sqrt(s1 * s1 - s1 * s2 + s2 * s2);
}

/** The angle between two directions as lines, 0–90° (a principal direction has no sense). */
export function lineAngleDifference(a: number, b: number): number {
  return Math.abs(wrapAxisAngle(a - b));
}

export interface RosetteInput {
  id: string;
  kind: 'rosette-rectangular' | 'rosette-delta';
  /** grid A's direction from the vessel axis */
  angleDeg: number;
  /** corrected measured slopes of grids A, B, C, µε per plan pressure unit */
  slopes: readonly [number, number, number];
  elasticModulus: number;
  poissonRatio: number;
  yieldStrength: number;
  /** the pressure stresses are given at: test pressure plus the water head at the rosette */
  pressure: number;
  /** predicted hoop and axial strain per unit pressure (the plan's model) */
  predictedHoop: number;
  predictedAxial: number;
  shape: 'cylinder' | 'sphere';
  /** principal-direction tolerance, degrees */
  directionTolerance: number;
}

/**
 * Principal strains and direction from the grid slopes, principal and von Mises stresses per unit
 * pressure and at test pressure (plane stress), the direction the prediction expects for ε1 (hoop on
 * a cylinder, where hoop strain is the larger; none on a sphere, equal-biaxial), and the
 * `principal-direction` flag when ε1 is further from it than the tolerance.
 */
export function evaluateRosette(r: RosetteInput): RosetteResult {
  const [a, b, c] = r.slopes;
  const pr = r.kind === 'rosette-rectangular' ? principalRectangular(a, b, c) : principalDelta(a, b, c);
  const perUnit = planeStress(pr.e1 * 1e-6, pr.e2 * 1e-6, r.elasticModulus, r.poissonRatio);
  const [s1, s2] = perUnit;
  const vmUnit = vonMisesPlane(s1, s2);
  const principalAngleDeg = wrapAxisAngle(r.angleDeg + pr.angleDeg);
  const expected = r.shape === 'sphere' ? null : r.predictedHoop >= r.predictedAxial ? 90 : 0;
  const flags: FlagCode[] = [];
  const notes: string[] = [];
  if (expected !== null) {
    const spread = pr.e1 - pr.e2;
    const off = lineAngleDifference(principalAngleDeg, expected);
    if (spread < 0.1 * Math.max(Math.abs(pr.e1), Math.abs(pr.e2)))
      notes.push('ε1 and ε2 are nearly equal: the principal direction is not defined well enough to compare');
    else if (off > r.directionTolerance) {
      flags.push('principal-direction');
      notes.push(
        `ε1 lies ${off.toFixed(1)}° from the predicted direction (${expected === 90 ? 'hoop' : 'axial'}): rosette bonded at another angle than the plan says, grids wired in another order, or a local bending or shear field?`,
      );
    }
  }
  const vonMises = vmUnit * r.pressure;
  const ph = r.predictedHoop,
    pa = r.predictedAxial;
  return {
    id: r.id,
    kind: r.kind,
    angleDeg: r.angleDeg,
    principalStrains: [pr.e1, pr.e2],
    principalAngleDeg,
    expectedPrincipalAngleDeg: expected,
    principalStresses: [s1 * r.pressure, s2 * r.pressure],
    stressesPerUnitPressure: [s1, s2],
    vonMises,
    vonMisesPerUnitPressure: vmUnit,
    yieldFraction: vonMises / r.yieldStrength,
    predictedPrincipalStrains: [Math.max(ph, pa), Math.min(ph, pa)],
    flags,
    notes,
  };
}
