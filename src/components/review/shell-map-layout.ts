// Geometry of the developed shell: the cylinder cut along a generator and laid flat, axial
// position across (0…length) and circumference down (clock 0…360°, as arc length at the outer
// radius, the same measure the engine uses for distances). Edge zones reach edgeZoneDistance
// from every head seam and feature, as the engine measures them (DESIGN 3.3, 4.1).
import type { GaugeOutcome } from '../../lib/reduction/types';
import { combineOutcomes } from './outcome-style';

export type ShellFeatureKind = 'head' | 'nozzle' | 'support' | 'thickness-change';

export interface ShellMapFeature {
  id?: string;
  name?: string;
  kind: ShellFeatureKind;
  axialPosition: number;
  clockDeg?: number;
  size?: number;
}

export interface ShellMapGauge {
  id: string;
  kind: 'uniaxial' | 'rosette-rectangular' | 'rosette-delta';
  angleDeg: number;
  axialPosition?: number;
  clockDeg?: number;
}

/** The plan fields the map needs (a parsed plan fits). */
export interface ShellMapPlan {
  vessel: {
    shape: 'cylinder' | 'sphere';
    insideDiameter: number;
    wallThickness: number;
    length?: number;
    features?: ShellMapFeature[];
  };
  gauges: ShellMapGauge[];
}

export interface RingZone {
  x0: number;
  x1: number;
  label: string;
}
export interface PointZone {
  x: number;
  arc: number;
  radius: number;
  label: string;
}

export interface ShellMapLayout {
  length: number;
  /** outer circumference, plan length unit */
  circumference: number;
  seams: { x: number; label: string }[];
  ringZones: RingZone[];
  pointZones: PointZone[];
  features: (ShellMapFeature & { label: string; ring: boolean; arc: number | null })[];
  placed: { gauge: ShellMapGauge; x: number; arc: number }[];
  unplaced: ShellMapGauge[];
}

/** Grid directions of a gauge, degrees from the vessel axis. */
export function gaugeDirections(g: Pick<ShellMapGauge, 'kind' | 'angleDeg'>): number[] {
  if (g.kind === 'rosette-rectangular') return [g.angleDeg, g.angleDeg + 45, g.angleDeg + 90];
  if (g.kind === 'rosette-delta') return [g.angleDeg, g.angleDeg + 60, g.angleDeg + 120];
  return [g.angleDeg];
}

/** Layout in plan length units; null for a sphere or a cylinder without a length. */
export function layoutShellMap(plan: ShellMapPlan, edgeZoneDistance: number): ShellMapLayout | null {
  const v = plan.vessel;
  if (v.shape !== 'cylinder' || !v.length || v.length <= 0) return null;
  const length = v.length;
  const circumference = Math.PI * (v.insideDiameter + 2 * v.wallThickness);
  const arcOf = (clockDeg: number) => ((((clockDeg % 360) + 360) % 360) / 360) * circumference;
  const ez = Math.max(0, edgeZoneDistance);
  const seams = [
    { x: 0, label: 'head seam' },
    { x: length, label: 'head seam' },
  ];
  const ringZones: RingZone[] = seams.map((s) => ({ x0: s.x - ez, x1: s.x + ez, label: 'edge zone' }));
  const pointZones: PointZone[] = [];
  const features = (v.features ?? []).map((f, i) => {
    // the feature's own name, else its place in the plan's list; the map puts the kind before it
    const label = f.name ?? f.id ?? String(i + 1);
    const ring = f.kind === 'head' || f.kind === 'thickness-change' || f.clockDeg === undefined;
    if (ring) ringZones.push({ x0: f.axialPosition - ez, x1: f.axialPosition + ez, label: 'edge zone' });
    else {
      const reach = ez + (f.kind === 'nozzle' && f.size !== undefined ? f.size / 2 : 0);
      pointZones.push({ x: f.axialPosition, arc: arcOf(f.clockDeg!), radius: reach, label: 'edge zone' });
    }
    return { ...f, label, ring, arc: f.clockDeg === undefined ? null : arcOf(f.clockDeg) };
  });
  const placed: ShellMapLayout['placed'] = [];
  const unplaced: ShellMapGauge[] = [];
  for (const g of plan.gauges) {
    if (g.axialPosition === undefined || g.clockDeg === undefined) unplaced.push(g);
    else placed.push({ gauge: g, x: g.axialPosition, arc: arcOf(g.clockDeg) });
  }
  return {
    length,
    circumference,
    seams,
    ringZones: ringZones
      .map((z) => ({ ...z, x0: Math.max(0, z.x0), x1: Math.min(length, z.x1) }))
      .filter((z) => z.x1 > z.x0),
    pointZones,
    features,
    placed,
    unplaced,
  };
}

/** Round step (1, 2 or 5 × 10ⁿ) giving about `target` ticks over `span`. */
export function niceStep(span: number, target = 6): number {
  const raw = span / Math.max(1, target);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const m = raw / mag;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * mag;
}

/** A plan gauge's outcome: its own result, or for a rosette the worst of its grids `{id}/A…C`. */
export function resolveGaugeOutcome(
  gaugeId: string,
  results: Record<string, { outcome: GaugeOutcome } | undefined>,
): GaugeOutcome {
  const own = results[gaugeId];
  if (own) return own.outcome;
  const grids = Object.keys(results)
    .filter((k) => k.startsWith(`${gaugeId}/`))
    .map((k) => results[k]!.outcome);
  return grids.length > 0 ? combineOutcomes(grids) : 'not-compared';
}

export interface TopLabel {
  text: string;
  x: number;
  anchor: 'start' | 'middle' | 'end';
  row: number;
}

/** Put labels above the map in rows so that none overlaps (width estimated at 7 units a character). */
export function stackTopLabels(labels: Omit<TopLabel, 'row'>[], charWidth = 7): TopLabel[] {
  const span = (l: Omit<TopLabel, 'row'>) => {
    const w = l.text.length * charWidth;
    const x0 = l.anchor === 'start' ? l.x : l.anchor === 'end' ? l.x - w : l.x - w / 2;
    return [x0, x0 + w] as const;
  };
  const rowsEnd: number[] = [];
  return [...labels]
    .sort((a, b) => span(a)[0] - span(b)[0])
    .map((l) => {
      const [x0, x1] = span(l);
      let row = rowsEnd.findIndex((end) => end + 6 <= x0);
      if (row < 0) row = rowsEnd.length;
      rowsEnd[row] = x1;
      return { ...l, row };
    });
}
