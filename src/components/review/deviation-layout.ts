// Rows of the deviation overview: each compared gauge's measured/predicted ratio with its 95 %
// interval, grouped by direction, and a ratio axis that keeps the band readable.
import type { GaugeResult } from '../../lib/reduction/types';

export type DirectionGroup = 'hoop' | 'axial' | 'other' | 'rosette';

export const DIRECTION_LABELS: Record<DirectionGroup, string> = {
  hoop: 'Hoop gauges (≈ 90°)',
  axial: 'Axial gauges (≈ 0°)',
  other: 'Other angles',
  rosette: 'Rosette grids',
};

const GROUP_ORDER: DirectionGroup[] = ['hoop', 'axial', 'other', 'rosette'];

/** Hoop within ±tolDeg of 90°, axial within ±tolDeg of 0° (modulo 180°); rosette grids by their id. */
export function classifyDirection(g: Pick<GaugeResult, 'id' | 'angleDeg'>, tolDeg = 5): DirectionGroup {
  if (g.id.includes('/')) return 'rosette';
  const a = ((g.angleDeg % 180) + 180) % 180;
  if (Math.abs(a - 90) <= tolDeg) return 'hoop';
  if (a <= tolDeg || a >= 180 - tolDeg) return 'axial';
  return 'other';
}

export interface DeviationRow {
  gauge: GaugeResult;
  ratio: number;
  /** the slope's 95 % interval divided by the predicted slope, ordered low to high */
  ci: [number, number] | null;
}

export interface DeviationLayout {
  groups: { group: DirectionGroup; label: string; rows: DeviationRow[] }[];
  /** not compared, or without a ratio: listed, not plotted */
  notPlotted: GaugeResult[];
  domain: [number, number];
}

/** Ratio axis: at least the band ± half a band, at most 1 ± 5 bands (further points sit on the edge). */
export function ratioDomain(values: readonly number[], band: number): [number, number] {
  const finite = values.filter(Number.isFinite);
  const lo = Math.min(1 - 1.5 * band, ...finite);
  const hi = Math.max(1 + 1.5 * band, ...finite);
  return [Math.max(lo, 1 - 5 * band), Math.min(hi, 1 + 5 * band)];
}

export function layoutDeviation(gauges: readonly GaugeResult[], band: number): DeviationLayout {
  const notPlotted: GaugeResult[] = [];
  const byGroup = new Map<DirectionGroup, DeviationRow[]>();
  const values: number[] = [];
  for (const g of gauges) {
    if (g.outcome === 'not-compared' || g.ratio === null || !Number.isFinite(g.ratio) || g.predictedSlope === 0) {
      notPlotted.push(g);
      continue;
    }
    const ci = g.slopeCI95
      ? ([
          Math.min(g.slopeCI95[0], g.slopeCI95[1]) / g.predictedSlope,
          Math.max(g.slopeCI95[0], g.slopeCI95[1]) / g.predictedSlope,
        ].sort((a, b) => a - b) as [number, number])
      : null;
    const group = classifyDirection(g);
    byGroup.set(group, [...(byGroup.get(group) ?? []), { gauge: g, ratio: g.ratio, ci }]);
    values.push(g.ratio, ...(ci ?? []));
  }
  const groups = GROUP_ORDER.filter((k) => byGroup.has(k)).map((group) => ({
    group,
    label: DIRECTION_LABELS[group],
    rows: byGroup.get(group)!,
  }));
  return { groups, notPlotted, domain: ratioDomain(values, band) };
}

/** Ticks for the ratio axis at a step of 0.05, 0.1 or 0.25, including 1. */
export function ratioTicks(domain: [number, number]): number[] {
  const span = domain[1] - domain[0];
  const step = span <= 0.5 ? 0.05 : span <= 1.2 ? 0.1 : 0.25;
  const ticks: number[] = [];
  for (let v = Math.ceil(domain[0] / step - 1e-9) * step; v <= domain[1] + 1e-9; v += step)
    ticks.push(Math.round(v * 1000) / 1000);
  return ticks;
}
