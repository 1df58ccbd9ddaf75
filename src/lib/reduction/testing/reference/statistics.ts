// Statistics for the reference: written out from the textbook definitions. Independent of the engine.

/** Ordinary least squares y = a + b x, two-pass (centred) sums; residual SD with n − 2 degrees of freedom. */
export function leastSquares(x: readonly number[], y: readonly number[]) {
  const n = x.length;
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  let sxx = 0,
    sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i]! - mx) ** 2;
    sxy += (x[i]! - mx) * (y[i]! - my);
  }
  const b = sxy / sxx;
  const a = my - b * mx;
  const residuals = y.map((v, i) => v - a - b * x[i]!);
  const sse = residuals.reduce((s, e) => s + e * e, 0);
  const sd = Math.sqrt(sse / (n - 2));
  return { slope: b, intercept: a, residuals, residualSD: sd, slopeSE: sd / Math.sqrt(sxx), n };
}

/**
 * Two-sided 95 % critical values t(0.975, ν) of Student's t — NIST/SEMATECH e-Handbook of
 * Statistical Methods, table 1.3.6.7.2 (from memory, 3 decimals as printed there).
 */
export const T975: Record<number, number> = {
  1: 12.706,
  2: 4.303,
  3: 3.182,
  4: 2.776,
  5: 2.571,
  6: 2.447,
  7: 2.365,
  8: 2.306,
  9: 2.262,
  10: 2.228,
};

/** Lag-1 autocorrelation r1 = Σ e_i e_{i−1} / Σ e_i² (Box and Jenkins' estimator). */
export function lag1(e: readonly number[]): number {
  let num = 0,
    den = 0;
  for (let i = 0; i < e.length; i++) {
    den += e[i]! ** 2;
    if (i > 0) num += e[i]! * e[i - 1]!;
  }
  return num / den;
}

/** Bartlett's effective sample count for lag-1 autocorrelation ρ (common practice): n(1 − ρ)/(1 + ρ). */
export function effectiveCount(n: number, rho: number): number {
  return (n * (1 - rho)) / (1 + rho);
}

/** GUM (JCGM 100:2008) eq. 10: u_c = √Σ (c_i u_i)² for uncorrelated inputs. */
export function combined(contributions: readonly number[]): number {
  return Math.sqrt(contributions.reduce((s, c) => s + c * c, 0));
}
