// Strain transformation, rosette reduction and plane-stress conversion.
// Angles in degrees, counter-clockwise; rosette angles are measured from grid A.

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
