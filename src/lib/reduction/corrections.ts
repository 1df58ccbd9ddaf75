// Gauge corrections: gauge-factor mismatch and transverse sensitivity (Micro-Measurements TN-509).
// All are linear in the indicated strains, so they apply equally to samples, hold means and slopes.

/** Poisson's ratio of the calibration beam on which Kt and the gauge factor are measured. */
export const NU0_CALIBRATION = 0.285;

/** ε = ε_indicated × F_instrument / F_gauge. */
export function correctGaugeFactor(indicated: number, gaugeFactor: number, instrumentGaugeFactor: number): number {
  return (indicated * instrumentGaugeFactor) / gaugeFactor;
}

/** f = (1 − ν0 Kt)/(1 − Kt²), the common factor of the TN-509 corrections. */
export function transverseFactor(kt: number): number {
  return (1 - NU0_CALIBRATION * kt) / (1 - kt * kt);
}

/** Indicated strain of a grid: (ε_along + Kt ε_across)/(1 − ν0 Kt). Forward model, for tests and synthetic logs. */
export function indicatedStrain(along: number, across: number, kt: number): number {
  return (along + kt * across) / (1 - NU0_CALIBRATION * kt);
}

/**
 * Two perpendicular grids at one place: εx = f(ε̂x − Kt ε̂y) for one Kt (TN-509). With a different
 * Kt for each grid the same forward model solved exactly: εx = [(1 − ν0 Kx) ε̂x − Kx (1 − ν0 Ky) ε̂y] / (1 − Kx Ky).
 */
export function correctPerpendicularPair(ex: number, ey: number, kt: number, ktY = kt): [number, number] {
  const [cxx, cxy] = perpendicularPairCoefficients(kt, ktY);
  const [cyy, cyx] = perpendicularPairCoefficients(ktY, kt);
  return [cxx * ex + cxy * ey, cyy * ey + cyx * ex];
}

/** Coefficients [on ε̂x, on ε̂y] of grid x's corrected strain in a perpendicular pair (Kt of x, Kt of y). */
export function perpendicularPairCoefficients(ktX: number, ktY: number): [number, number] {
  const d = 1 - ktX * ktY;
  return [(1 - NU0_CALIBRATION * ktX) / d, (-ktX * (1 - NU0_CALIBRATION * ktY)) / d];
}

/** Nominal gauge resistance assumed when a plan gives lead resistance only, ohm (a common foil gauge). */
export const DEFAULT_GAUGE_RESISTANCE = 120;

/**
 * Quarter-bridge lead-wire desensitisation: the bridge sees R_G/(R_G + R_L) of the gauge's change,
 * R_L being both leads for a two-wire hook-up and one lead for three-wire. Returns the factor that
 * restores the strain, (R_G + R_L)/R_G.
 */
export function leadWireFactor(
  leadResistance: number,
  gaugeResistance = DEFAULT_GAUGE_RESISTANCE,
  wiring: 'two-wire' | 'three-wire' = 'two-wire',
): number {
  const rl = (wiring === 'two-wire' ? 2 : 1) * leadResistance;
  return (gaugeResistance + rl) / gaugeResistance;
}

/** Rectangular rosette: εA = f(ε̂A − Kt ε̂C), εB = f[ε̂B(1+Kt) − Kt(ε̂A+ε̂C)], εC = f(ε̂C − Kt ε̂A). */
export function correctRectangular(a: number, b: number, c: number, kt: number): [number, number, number] {
  const f = transverseFactor(kt);
  return [f * (a - kt * c), f * (b * (1 + kt) - kt * (a + c)), f * (c - kt * a)];
}

/** Delta rosette: εi = f[ε̂i(1 + Kt/3) − (2Kt/3)(ε̂j + ε̂k)]. */
export function correctDelta(a: number, b: number, c: number, kt: number): [number, number, number] {
  const f = transverseFactor(kt);
  const g = (i: number, j: number, k: number) => f * (i * (1 + kt / 3) - ((2 * kt) / 3) * (j + k));
  return [g(a, b, c), g(b, c, a), g(c, a, b)];
}

/**
 * Uniaxial gauge: with the transverse strain taken as ratio × the strain along the gauge (the
 * model's predicted ratio), ε = ε̂ (1 − ν0 Kt)/(1 + Kt·ratio).
 */
export function uniaxialTransverseFactor(kt: number, transverseRatio: number): number {
  return (1 - NU0_CALIBRATION * kt) / (1 + kt * transverseRatio);
}

/**
 * Coefficients that turn the raw channel readings of a gauge into corrected strains per grid:
 * grid k = Σ_j m[k][j] × raw_j. Gauge factor (and any lead-wire factor, `scale`) first, per
 * channel, then transverse sensitivity.
 */
export function correctionMatrix(
  kind: 'uniaxial' | 'rosette-rectangular' | 'rosette-delta',
  gaugeFactor: number,
  instrumentGaugeFactor: number,
  kt: number,
  uniaxialTransverseRatio = 0,
  scale = 1,
): number[][] {
  const g = (scale * instrumentGaugeFactor) / gaugeFactor;
  if (kind === 'uniaxial') return [[g * (kt === 0 ? 1 : uniaxialTransverseFactor(kt, uniaxialTransverseRatio))]];
  const f = transverseFactor(kt);
  if (kind === 'rosette-rectangular')
    return [
      [g * f, 0, -g * f * kt],
      [-g * f * kt, g * f * (1 + kt), -g * f * kt],
      [-g * f * kt, 0, g * f],
    ];
  const d = g * f * (1 + kt / 3);
  const o = -g * f * ((2 * kt) / 3);
  return [
    [d, o, o],
    [o, d, o],
    [o, o, d],
  ];
}
