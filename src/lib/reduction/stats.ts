// Least-squares fits, from point lists or from streaming sums.
import jstat from 'jstat';

export interface LineFit {
  n: number;
  slope: number;
  intercept: number;
  /** null when y does not vary (R² undefined) */
  rSquared: number | null;
  /** √(SSE/(n−2)); null for n ≤ 2 */
  residualSD: number | null;
  slopeSE: number | null;
  /** 95 % interval of the slope, Student t with n − 2 degrees of freedom; null for n ≤ 2 */
  slopeCI95: [number, number] | null;
}

/** Two-sided 95 % Student t quantile t(0.975, dof). */
export function tQuantile975(dof: number): number {
  return jstat.jStat.studentt.inv(0.975, dof);
}

/** Fit from centred sums (Sxx = Σ(x−x̄)², Sxy, Syy): shared by the point and the streaming fits. */
export function fitFromMoments(
  n: number,
  meanX: number,
  meanY: number,
  sxx: number,
  sxy: number,
  syy: number,
): LineFit | null {
  if (n < 2 || !(sxx > 0)) return null;
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  const sse = Math.max(0, syy - slope * sxy);
  const rSquared = syy > 0 ? Math.min(1, (sxy * sxy) / (sxx * syy)) : null;
  if (n <= 2) return { n, slope, intercept, rSquared, residualSD: null, slopeSE: null, slopeCI95: null };
  const residualSD = Math.sqrt(sse / (n - 2));
  const slopeSE = residualSD / Math.sqrt(sxx);
  const tq = tQuantile975(n - 2);
  return {
    n,
    slope,
    intercept,
    rSquared,
    residualSD,
    slopeSE,
    slopeCI95: [slope - tq * slopeSE, slope + tq * slopeSE],
  };
}

/** Ordinary least squares y = intercept + slope·x (two-pass, centred). Null with fewer than 2 distinct x. */
export function fitLine(xs: readonly number[], ys: readonly number[]): LineFit | null {
  // i < n, the length of the shorter array, in every loop below
  const n = Math.min(xs.length, ys.length);
  if (n < 2) return null;
  let mx = 0,
    my = 0;
  for (let i = 0; i < n; i++) {
    mx += xs[i]!;
    my += ys[i]!;
  }
  mx /= n;
  my /= n;
  let sxx = 0,
    sxy = 0,
    syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = xs[i]! - mx;
    const dy = ys[i]! - my;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  return fitFromMoments(n, mx, my, sxx, sxy, syy);
}

/** Least squares through the origin y = slope·x, with the slope's standard deviation (NIST NoInt). */
export function fitThroughOrigin(
  xs: readonly number[],
  ys: readonly number[],
): { slope: number; slopeSE: number | null; residualSD: number | null } | null {
  // i < n, the length of the shorter array, in every loop below
  const n = Math.min(xs.length, ys.length);
  let sxx = 0,
    sxy = 0;
  for (let i = 0; i < n; i++) {
    const x = xs[i]!;
    sxx += x * x;
    sxy += x * ys[i]!;
  }
  if (n < 1 || !(sxx > 0)) return null;
  const slope = sxy / sxx;
  if (n < 2) return { slope, slopeSE: null, residualSD: null };
  let sse = 0;
  for (let i = 0; i < n; i++) sse += (ys[i]! - slope * xs[i]!) ** 2;
  const residualSD = Math.sqrt(sse / (n - 1));
  return { slope, slopeSE: residualSD / Math.sqrt(sxx), residualSD };
}

/**
 * Streaming regression sums for many series that share x, in one Float64Array: per series
 * [n, Σx, Σy, Σx², Σxy, Σy²] of values shifted by a per-series origin (its first y), which keeps
 * the sums well conditioned. Merging two accumulators with the same origins is addition.
 */
export const SUMS_STRIDE = 6;

export function fitFromSums(sums: Float64Array, offset: number): LineFit | null {
  // a window past the end of the sums holds no samples
  const [n = 0, sx = 0, sy = 0, sumXX = 0, sumXY = 0, sumYY = 0] = sums.subarray(offset, offset + SUMS_STRIDE);
  if (n < 2) return null;
  const mx = sx / n,
    my = sy / n;
  const sxx = sumXX - sx * mx;
  const sxy = sumXY - sx * my;
  const syy = Math.max(0, sumYY - sy * my);
  return fitFromMoments(n, mx, my, sxx, sxy, syy);
}

/** Linear interpolation in points sorted by x (ys[i] belongs to xs[i]); null outside their range. */
export function interpolateSorted(xs: readonly number[], ys: readonly number[], x: number): number | null {
  const first = xs[0],
    last = xs.at(-1);
  if (first === undefined || last === undefined || x < first || x > last) return null;
  if (xs.length === 1) return ys[0] ?? null;
  let lo = 0,
    hi = xs.length - 1;
  // bisection keeps lo < hi inside xs, so xs[mid] exists
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid]! <= x) lo = mid;
    else hi = mid;
  }
  const x0 = xs[lo],
    x1 = xs[hi],
    y0 = ys[lo],
    y1 = ys[hi];
  if (x0 === undefined || x1 === undefined || y0 === undefined || y1 === undefined) return null; // ys shorter than xs
  if (x1 === x0) return (y0 + y1) / 2;
  return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
}

/** Two-sided 95 % interval half-width factor for an effective sample count (dof = nEff − 2, at least 1). */
function tForEffective(nEff: number): number {
  return tQuantile975(Math.max(1, nEff - 2));
}

export interface SerialCorrelation {
  /** lag-1 autocorrelation of the block-mean residuals (0 when negative) */
  rho: number;
  /** block means used */
  blocks: number;
  /** effective sample count n(1 − ρ)/(1 + ρ) of the block means (Bartlett) */
  effective: number;
  /** standard error of the slope allowing for it, and its 95 % half-width */
  slopeSE: number;
  halfWidth95: number;
}

/**
 * The slope's uncertainty from block means that allows for serial correlation: a least-squares fit
 * of the block means, the lag-1 autocorrelation ρ of its residuals, n_eff = n(1 − ρ)/(1 + ρ)
 * (Bartlett, common practice), SE = SE_blocks·√(n/n_eff), Student t with n_eff − 2 degrees of
 * freedom. `sums` holds, from `offset`: n, Σx, Σy, Σx², Σxy, Σy², and over consecutive pairs m,
 * Σyy', Σ(xy' + x'y), Σxx', Σ(y + y'), Σ(x + x'). Null with fewer than 4 blocks.
 */
export function serialCorrelationFromBlockSums(sums: Float64Array, offset: number): SerialCorrelation | null {
  const fit = fitFromSums(sums, offset);
  const [m = 0, syy1 = 0, sxy1 = 0, sxx1 = 0, sy1 = 0, sx1 = 0] = sums.subarray(offset + 6, offset + 12);
  if (!fit || fit.n < 4 || fit.slopeSE === null || fit.residualSD === null) return null;
  const b = fit.slope,
    a = fit.intercept;
  // Σ e_i e_{i−1} with e = y − a − b x, expanded over the pair sums
  const lagged = syy1 - a * sy1 - b * sxy1 + a * a * m + a * b * sx1 + b * b * sxx1;
  const sse = fit.residualSD * fit.residualSD * (fit.n - 2);
  const rho = sse > 0 && m > 0 ? Math.min(0.999, Math.max(0, lagged / sse)) : 0;
  const effective = (fit.n * (1 - rho)) / (1 + rho);
  const slopeSE = fit.slopeSE * Math.sqrt(fit.n / effective);
  return { rho, blocks: fit.n, effective, slopeSE, halfWidth95: tForEffective(effective) * slopeSE };
}
