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
