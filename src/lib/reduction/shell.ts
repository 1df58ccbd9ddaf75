// Predicted strain of an elastic shell under internal pressure (DESIGN 3.1). Pure arithmetic in
// the plan's own consistent units (MPa + mm, or psi + in): strains per unit pressure come out in
// µε per plan pressure unit. Importable in the browser (the plan editor's live preview).
import type { DimensionChanges, ModelPrediction, PredictedBlock, ShellModel, YieldCheck } from './types';
import type { Plan, PlanGauge } from './plan';

export type Shape = 'cylinder' | 'sphere';
export type Ends = 'closed' | 'open';

export interface ShellInput {
  shape: Shape;
  ends?: Ends;
  insideDiameter: number;
  wallThickness: number;
  length?: number;
  elasticModulus: number;
  poissonRatio: number;
  yieldStrength: number;
  testPressure: number;
}

/** Principal surface strains (dimensionless) and stresses for one pressure. */
export interface ShellState {
  hoopStrain: number;
  axialStrain: number;
  radialStrain: number;
  hoopStress: number;
  axialStress: number;
}

/** Hooke's law for biaxial stress with σr = 0 (the outer surface, or a thin wall). */
function surfaceState(sh: number, sa: number, E: number, nu: number): ShellState {
  return {
    hoopStress: sh,
    axialStress: sa,
    hoopStrain: (sh - nu * sa) / E,
    axialStrain: (sa - nu * sh) / E,
    radialStrain: (-nu * (sh + sa)) / E,
  };
}

/** Thin shell with radius r (Roark Table 13.1): σh = p r/t, σa = p r/2t (closed), sphere p r/2t. */
export function membraneState(
  p: number,
  r: number,
  t: number,
  E: number,
  nu: number,
  shape: Shape,
  ends: Ends = 'closed',
): ShellState {
  let sh: number, sa: number;
  if (shape === 'sphere') sh = sa = (p * r) / (2 * t);
  else {
    sh = (p * r) / t;
    sa = ends === 'closed' ? (p * r) / (2 * t) : 0;
  }
  return surfaceState(sh, sa, E, nu);
}

/** Lamé thick shell at the outer surface r = b (σr = 0 there); a inner, b outer radius. */
export function lameOuterState(
  p: number,
  a: number,
  b: number,
  E: number,
  nu: number,
  shape: Shape,
  ends: Ends = 'closed',
): ShellState {
  let sh: number, sa: number;
  if (shape === 'sphere') {
    const B = (p * a ** 3) / (b ** 3 - a ** 3);
    sh = sa = 1.5 * B; // σt(b) = B (1 + b³ / 2b³)
  } else {
    const A = (p * a * a) / (b * b - a * a);
    sh = 2 * A; // σθ(b) = A (1 + b²/b²)
    sa = ends === 'closed' ? A : 0;
  }
  return surfaceState(sh, sa, E, nu);
}

/** Lamé stresses at radius r: hoop, radial, axial (axial = 0 for open ends; sphere: axial = hoop). */
export function lameStressAt(p: number, a: number, b: number, r: number, shape: Shape, ends: Ends = 'closed') {
  if (shape === 'sphere') {
    const B = (p * a ** 3) / (b ** 3 - a ** 3);
    const st = B * (1 + b ** 3 / (2 * r ** 3));
    return { hoop: st, radial: B * (1 - b ** 3 / r ** 3), axial: st };
  }
  const A = (p * a * a) / (b * b - a * a);
  return { hoop: A * (1 + (b * b) / (r * r)), radial: A * (1 - (b * b) / (r * r)), axial: ends === 'closed' ? A : 0 };
}

/** Strain along a direction θ from the vessel axis (0 axial, 90 hoop): εa cos²θ + εh sin²θ. */
export function strainAtAngle(axial: number, hoop: number, angleDeg: number): number {
  const th = (angleDeg * Math.PI) / 180;
  const c = Math.cos(th);
  const s = Math.sin(th);
  return axial * c * c + hoop * s * s;
}

/** von Mises of three principal stresses. */
export function vonMises3(s1: number, s2: number, s3: number): number {
  return Math.sqrt(0.5 * ((s1 - s2) ** 2 + (s2 - s3) ** 2 + (s3 - s1) ** 2));
}

/** Hoop strain at radius r of the Lamé field (σ from lameStressAt); sphere: both tangential stresses are σt. */
function lameHoopStrain(s: { hoop: number; radial: number; axial: number }, E: number, nu: number, shape: Shape) {
  return shape === 'sphere' ? (s.hoop - nu * (s.hoop + s.radial)) / E : (s.hoop - nu * (s.radial + s.axial)) / E;
}

/**
 * Named dimension changes at pressure p. Lamé: u(r) = r·εθ(r) at the bore and the outer surface,
 * Δt = u(b) − u(a). Membrane: the hoop strain at the mean radius, the wall thinning by εr·t
 * split evenly to both faces.
 */
export function dimensionChanges(input: ShellInput, model: ShellModel, p: number): DimensionChanges {
  const { shape, insideDiameter: Di, wallThickness: t, elasticModulus: E, poissonRatio: nu } = input;
  const ends = input.ends ?? 'closed';
  const a = Di / 2;
  const b = a + t;
  const L = shape === 'cylinder' && input.length !== undefined && input.length > 0 ? input.length : null;
  if (model === 'lame') {
    const inner = lameStressAt(p, a, b, a, shape, ends);
    const outer = lameStressAt(p, a, b, b, shape, ends);
    const dDi = 2 * a * lameHoopStrain(inner, E, nu, shape);
    const dDo = 2 * b * lameHoopStrain(outer, E, nu, shape);
    const axialStrain = lameOuterState(p, a, b, E, nu, shape, ends).axialStrain; // uniform through the wall
    return {
      insideDiameter: dDi,
      meanDiameter: (dDi + dDo) / 2,
      outsideDiameter: dDo,
      length: L === null ? null : axialStrain * L,
      thickness: (dDo - dDi) / 2,
    };
  }
  const m = membraneState(p, a + t / 2, t, E, nu, shape, ends);
  const dDm = m.hoopStrain * (Di + t);
  const dt = m.radialStrain * t;
  return {
    insideDiameter: dDm - dt,
    meanDiameter: dDm,
    outsideDiameter: dDm + dt,
    length: L === null ? null : m.axialStrain * L,
    thickness: dt,
  };
}

/**
 * The largest stress in the wall at pressure p against yield (DESIGN 3.1): under Lamé the von Mises
 * stress at the bore (√3·p·b²/(b² − a²) for a closed cylinder) or the membrane value if larger;
 * under membrane the membrane von Mises (plane stress, mean radius).
 */
export function yieldCheckAt(input: ShellInput, model: ShellModel, p: number): YieldCheck {
  const { shape, insideDiameter: Di, wallThickness: t, elasticModulus: E, poissonRatio: nu } = input;
  const ends = input.ends ?? 'closed';
  const a = Di / 2;
  const m = membraneState(p, a + t / 2, t, E, nu, shape, ends);
  const membrane = vonMises3(m.hoopStress, m.axialStress, 0);
  let stress = membrane;
  let surface: YieldCheck['surface'] = 'mid-wall';
  if (model === 'lame') {
    const bore = lameStressAt(p, a, a + t, a, shape, ends);
    const atBore = vonMises3(bore.hoop, bore.radial, bore.axial);
    if (atBore >= membrane) {
      stress = atBore;
      surface = 'inner';
    }
  }
  return { stress, fraction: stress / input.yieldStrength, surface, pressure: p };
}

/**
 * One model's prediction: strains per unit pressure (µε per plan pressure unit) and stresses and
 * dimension changes at test pressure. `lame` is evaluated at the outer surface, `membrane` with the mean radius.
 */
export function predictShell(input: ShellInput, model: ShellModel): ModelPrediction {
  const { shape, insideDiameter: Di, wallThickness: t, elasticModulus: E, poissonRatio: nu } = input;
  const ends = input.ends ?? 'closed';
  const p = input.testPressure;
  const a = Di / 2;
  const b = a + t;
  const perUnit =
    model === 'lame' ? lameOuterState(1, a, b, E, nu, shape, ends) : membraneState(1, a + t / 2, t, E, nu, shape, ends);
  const atTest =
    model === 'lame' ? lameOuterState(p, a, b, E, nu, shape, ends) : membraneState(p, a + t / 2, t, E, nu, shape, ends);
  const dims = dimensionChanges(input, model, p);
  const yieldCheck = yieldCheckAt(input, model, p);
  return {
    model,
    hoopStrainPerPressure: perUnit.hoopStrain * 1e6,
    axialStrainPerPressure: perUnit.axialStrain * 1e6,
    radialStrainPerPressure: perUnit.radialStrain * 1e6,
    hoopStress: atTest.hoopStress,
    axialStress: atTest.axialStress,
    dimensionChanges: dims,
    diameterChange: model === 'lame' ? dims.outsideDiameter : dims.meanDiameter,
    lengthChange: dims.length ?? 0,
    thicknessChange: dims.thickness,
    yieldCheck,
    yieldFraction: yieldCheck.fraction,
  };
}

/** 2.5·√(r t) with the mean radius: beyond it an edge disturbance has decayed to about 4 %. */
export function edgeZoneDistance(insideDiameter: number, wallThickness: number): number {
  return 2.5 * Math.sqrt((insideDiameter / 2 + wallThickness / 2) * wallThickness);
}

/** Both models, their difference, and the edge-zone distance. */
export function predictBoth(input: ShellInput): PredictedBlock {
  const lame = predictShell(input, 'lame');
  const membrane = predictShell(input, 'membrane');
  return {
    lame,
    membrane,
    membraneOverLame: membrane.hoopStrainPerPressure / lame.hoopStrainPerPressure - 1,
    edgeZoneDistance: edgeZoneDistance(input.insideDiameter, input.wallThickness),
  };
}

export function shellInputFromPlan(plan: Plan): ShellInput {
  return {
    shape: plan.vessel.shape,
    ends: plan.vessel.ends,
    insideDiameter: plan.vessel.insideDiameter,
    wallThickness: plan.vessel.wallThickness,
    length: plan.vessel.length,
    elasticModulus: plan.material.elasticModulus,
    poissonRatio: plan.material.poissonRatio,
    yieldStrength: plan.material.yieldStrength,
    testPressure: plan.testPressure,
  };
}

/** Grid directions of a gauge from the vessel axis: [θ] or [θ, θ+45, θ+90] / [θ, θ+60, θ+120]. */
export function gridAngles(g: Pick<PlanGauge, 'kind' | 'angleDeg'>): number[] {
  if (g.kind === 'rosette-rectangular') return [g.angleDeg, g.angleDeg + 45, g.angleDeg + 90];
  if (g.kind === 'rosette-delta') return [g.angleDeg, g.angleDeg + 60, g.angleDeg + 120];
  return [g.angleDeg];
}
export const GRID_NAMES = ['A', 'B', 'C'] as const;

/** Predicted slope along a direction for a given wall thickness (µε per plan pressure unit). */
export function predictedSlopeAt(input: ShellInput, model: ShellModel, angleDeg: number): number {
  const m = predictShell(input, model);
  return strainAtAngle(m.axialStrainPerPressure, m.hoopStrainPerPressure, angleDeg);
}

/**
 * The wall thickness that makes the model's predicted slope at this angle equal the measured one
 * (bisection on log t; the predicted slope falls monotonically with t). Null when no positive
 * thickness matches (opposite sign, or a direction where the prediction is about zero).
 */
export function effectiveThickness(
  input: ShellInput,
  model: ShellModel,
  angleDeg: number,
  measuredSlope: number,
): number | null {
  if (!Number.isFinite(measuredSlope) || measuredSlope === 0) return null;
  const f = (t: number) => predictedSlopeAt({ ...input, wallThickness: t }, model, angleDeg) - measuredSlope;
  let lo = Math.log(input.insideDiameter * 1e-6);
  let hi = Math.log(input.insideDiameter * 100);
  let flo = f(Math.exp(lo));
  const fhi = f(Math.exp(hi));
  if (!Number.isFinite(flo) || !Number.isFinite(fhi) || Math.sign(flo) === Math.sign(fhi)) return null;
  for (let i = 0; i < 200 && hi - lo > 1e-13; i++) {
    const mid = (lo + hi) / 2;
    const fm = f(Math.exp(mid));
    if (Math.sign(fm) === Math.sign(flo)) {
      lo = mid;
      flo = fm;
    } else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

export interface DiscontinuityDistance {
  distance: number;
  /** what it is measured to, e.g. "head seam at 0" or "nozzle N1" */
  to: string;
}

/**
 * Shell-surface distance from a gauge to the nearest discontinuity: head seams at 0 and `length`
 * (cylinders) and the vessel's features. Ring features (heads, thickness changes, features without
 * clockDeg) count the axial difference only; point features add the arc length at the outer radius
 * and, for nozzles, subtract half the feature's size. Null without axialPosition.
 */
export function distanceToNearestDiscontinuity(
  plan: Plan,
  gauge: Pick<PlanGauge, 'axialPosition' | 'clockDeg'>,
): DiscontinuityDistance | null {
  if (gauge.axialPosition === undefined) return null;
  const z = gauge.axialPosition;
  const ro = plan.vessel.insideDiameter / 2 + plan.vessel.wallThickness;
  const candidates: DiscontinuityDistance[] = [];
  if (plan.vessel.shape === 'cylinder' && plan.vessel.length !== undefined) {
    candidates.push({ distance: Math.abs(z), to: 'head seam at 0' });
    candidates.push({ distance: Math.abs(plan.vessel.length - z), to: `head seam at ${plan.vessel.length}` });
  }
  plan.vessel.features.forEach((f, i) => {
    const name = f.id ?? f.name ?? String(i + 1);
    const dz = Math.abs(f.axialPosition - z);
    let d = dz;
    const ring = f.kind === 'head' || f.kind === 'thickness-change' || f.clockDeg === undefined;
    if (!ring && gauge.clockDeg !== undefined && f.clockDeg !== undefined) {
      let dth = Math.abs(f.clockDeg - gauge.clockDeg) % 360;
      if (dth > 180) dth = 360 - dth;
      const arc = (ro * dth * Math.PI) / 180;
      d = Math.hypot(dz, arc);
    }
    if (f.kind === 'nozzle' && f.size !== undefined) d -= f.size / 2;
    candidates.push({ distance: Math.max(0, d), to: `${f.kind} ${name}` });
  });
  if (candidates.length === 0) return null;
  return candidates.reduce((m, c) => (c.distance < m.distance ? c : m));
}

export interface PlannedGrid {
  /** `H1`, or `R1/A` for a rosette grid */
  id: string;
  gaugeId: string;
  grid: 'A' | 'B' | 'C' | null;
  channel: string;
  angleDeg: number;
  /** the plan model's prediction, µε per plan pressure unit */
  predictedSlope: number;
  lamePredictedSlope: number;
  membranePredictedSlope: number;
  edgeZone: boolean;
  distanceToDiscontinuity: number | null;
  /** what the distance is measured to ("given in the plan" when the plan states it) */
  distanceTo: string | null;
}

/** Predictions for a whole plan: both models, and per gauge grid its predicted slope and edge zone. */
export function predictForPlan(plan: Plan): { predicted: PredictedBlock; gauges: PlannedGrid[] } {
  const input = shellInputFromPlan(plan);
  const predicted = predictBoth(input);
  const gauges: PlannedGrid[] = [];
  for (const g of plan.gauges) {
    let distance: number | null = null;
    let to: string | null = null;
    if (g.distanceToDiscontinuity !== undefined) {
      distance = g.distanceToDiscontinuity;
      to = 'given in the plan';
    } else {
      const d = distanceToNearestDiscontinuity(plan, g);
      if (d) {
        distance = d.distance;
        to = d.to;
      }
    }
    const angles = gridAngles(g);
    angles.forEach((angleDeg, k) => {
      const lame = strainAtAngle(predicted.lame.axialStrainPerPressure, predicted.lame.hoopStrainPerPressure, angleDeg);
      const membrane = strainAtAngle(
        predicted.membrane.axialStrainPerPressure,
        predicted.membrane.hoopStrainPerPressure,
        angleDeg,
      );
      // a rosette's grids are A, B, C in the order of its angles; a uniaxial gauge has none
      const grid = g.kind === 'uniaxial' ? null : (GRID_NAMES[k] ?? null);
      gauges.push({
        id: grid ? `${g.id}/${grid}` : g.id,
        gaugeId: g.id,
        grid,
        channel: g.channels[k] ?? '',
        angleDeg,
        predictedSlope: plan.model === 'lame' ? lame : membrane,
        lamePredictedSlope: lame,
        membranePredictedSlope: membrane,
        edgeZone: distance !== null && distance < predicted.edgeZoneDistance,
        distanceToDiscontinuity: distance,
        distanceTo: to,
      });
    });
  }
  return { predicted, gauges };
}
