// Arrays for the strain–pressure plot of one gauge: one shared, ascending pressure axis; hold
// averages split into loading and unloading series (null where the other branch sits); the
// fitted line, the predicted line through the origin and the tolerance band evaluated on it (the
// engine's bandSlope when the result has one: relative, near-zero or from the uncertainties).
import type { GaugeResult } from '../../lib/reduction/types';

export interface StrainPlotData {
  /** pressure, ascending, from 0 to xMax (plan pressure unit) */
  x: number[];
  loading: (number | null)[];
  unloading: (number | null)[];
  fit: (number | null)[];
  predicted: number[];
  bandLower: number[];
  bandUpper: number[];
  xMax: number;
}

/** Upper end of the pressure axis: 5 % beyond the larger of the test pressure and the highest point. */
export function pressureAxisMax(testPressure: number, pressures: readonly number[]): number {
  const top = Math.max(testPressure, ...pressures, 0);
  return top > 0 ? top * 1.05 : 1;
}

export function buildStrainPlotData(gauge: GaugeResult, testPressure: number, slopeBand: number): StrainPlotData {
  const points = [...gauge.points].sort((a, b) => a.pressure - b.pressure);
  const xMax = pressureAxisMax(
    testPressure,
    points.map((p) => p.pressure),
  );
  const x: number[] = [0];
  const loading: (number | null)[] = [null];
  const unloading: (number | null)[] = [null];
  for (const p of points) {
    x.push(Math.max(0, p.pressure));
    loading.push(p.branch === 'loading' ? p.strain : null);
    unloading.push(p.branch === 'unloading' ? p.strain : null);
  }
  x.push(xMax);
  loading.push(null);
  unloading.push(null);
  const m = gauge.measuredSlope;
  const b = gauge.intercept ?? 0;
  const k = gauge.predictedSlope;
  const [lo, hi] = gauge.bandSlope ?? [k * (1 - slopeBand), k * (1 + slopeBand)];
  return {
    x,
    loading,
    unloading,
    fit: x.map((p) => (m === null ? null : b + m * p)),
    predicted: x.map((p) => k * p),
    bandLower: x.map((p) => Math.min(lo * p, hi * p)),
    bandUpper: x.map((p) => Math.max(lo * p, hi * p)),
    xMax,
  };
}
