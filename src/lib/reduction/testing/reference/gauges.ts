// What a bonded gauge and its instrument show for a true strain field (REFERENCES.md "Gauge
// corrections", "Strain transformation and rosettes"). Independent of the engine.

/** Micro-Measurements TN-509 (equations from memory): the calibration beam's Poisson ratio. */
export const NU0 = 0.285;

/** TN-509: indicated ε̂ = (ε_along + Kt ε_across)/(1 − ν0 Kt). */
export function indicatedByTransverse(along: number, across: number, kt: number): number {
  return (along + kt * across) / (1 - NU0 * kt);
}

/** Gauge-factor setting (from memory): the instrument shows ε × F_gauge / F_instrument. */
export function shownByInstrument(strain: number, gaugeFactor: number, instrumentGaugeFactor: number): number {
  return (strain * gaugeFactor) / instrumentGaugeFactor;
}

/** Lead wires (from memory): output reduced by R_G/(R_G + R_L); two-wire counts both leads, three-wire one. */
export function shownWithLeads(strain: number, leadOhm: number, gaugeOhm: number, twoWire: boolean): number {
  const rl = (twoWire ? 2 : 1) * leadOhm;
  return (strain * gaugeOhm) / (gaugeOhm + rl);
}

/** Philpot, Mechanics of Materials: εθ = εx cos²θ + εy sin²θ + γxy sinθ cosθ. */
export function strainTransform(ex: number, ey: number, gxy: number, thetaDeg: number): number {
  const th = (thetaDeg * Math.PI) / 180;
  return ex * Math.cos(th) ** 2 + ey * Math.sin(th) ** 2 + gxy * Math.sin(th) * Math.cos(th);
}

/** Plane stress: σ1 = E/(1−ν²)(ε1 + ν ε2), σ2 = E/(1−ν²)(ε2 + ν ε1). */
export function planeStressFromStrains(e1: number, e2: number, E: number, nu: number): [number, number] {
  const k = E / (1 - nu * nu);
  return [k * (e1 + nu * e2), k * (e2 + nu * e1)];
}

/** Water head (common practice): Δp = ρ g Δh, ρ kg/m³, Δh m → Pa; g standard gravity 9.80665 m/s². */
export function waterHeadPa(densityKgM3: number, dropMetres: number): number {
  return densityKgM3 * 9.80665 * dropMetres;
}
