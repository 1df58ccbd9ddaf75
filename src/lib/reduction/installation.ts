// What the plan says about each installed grid, beyond its predicted slope: how its corrected
// strain is built from the raw channels (gauge factor, lead wires, transverse sensitivity — from
// the model's strain ratio, a measured perpendicular partner, or the rosette's other grids), and
// the water head it sees. Pure and browser-safe: the plan editor's preview uses it too.
import {
  correctionMatrix,
  leadWireFactor,
  DEFAULT_GAUGE_RESISTANCE,
  perpendicularPairCoefficients,
  uniaxialTransverseFactor,
} from './corrections';
import { lineAngleBetween, PERPENDICULAR_TOLERANCE_DEG, type Plan, type PlanGauge } from './plan';
import { strainAtAngle, type PlannedGrid } from './shell';
import type { ModelPrediction, TransverseCorrection } from './types';
import { MM_PER_IN, PA_PER_MPA, planPressureUnit, PSI_IN_PA } from './units';
import { fmt } from './number-words';

/** Standard gravity, m/s² (exact by definition; NIST SP 811). */
export const STANDARD_GRAVITY = 9.80665;

/** One grid's corrected strain as a linear combination of raw channels, and what the plan says about it. */
export interface GridSetup {
  grid: PlannedGrid;
  gauge: PlanGauge;
  /** indices into the plan's channel list (gauge by gauge, A B C) and coefficients: strain = Σ coef × raw */
  terms: { ch: number; coef: number }[];
  /** per term: the channel's own scale (gauge factor × lead wires), so coef / scale acts on indicated strain */
  scales: number[];
  transverseCorrection: TransverseCorrection;
  pairedWith: string | null;
  /** water head at the grid, plan pressure unit */
  headPressure: number;
  notes: string[];
}

/** ρ·g·Δh from the pressure tap down to the gauge, in the plan's pressure unit (0 without both elevations). */
export function headPressureAt(plan: Plan, gauge: Pick<PlanGauge, 'elevation'>): number {
  if (gauge.elevation === undefined || plan.pressureTapElevation === undefined) return 0;
  const dropPlanLength = plan.pressureTapElevation - gauge.elevation;
  const dropMetres = plan.units === 'US' ? (dropPlanLength * MM_PER_IN) / 1000 : dropPlanLength / 1000;
  const pa = plan.testFluidDensity * STANDARD_GRAVITY * dropMetres;
  return plan.units === 'US' ? pa / PSI_IN_PA : pa / PA_PER_MPA;
}

/**
 * Perpendicular uniaxial partners: an explicit `pairWith` (either side), else two uniaxial gauges
 * whose positions on the shell are within one wall thickness of each other and whose directions
 * are 90° apart (±5°). Each gauge has at most one partner; the nearest wins.
 */
export function findPerpendicularPartners(plan: Plan): Map<string, string> {
  const partner = new Map<string, string>();
  const uni = plan.gauges.filter((g) => g.kind === 'uniaxial');
  for (const g of uni)
    if (g.pairWith !== undefined) {
      partner.set(g.id, g.pairWith);
      partner.set(g.pairWith, g.id);
    }
  const ro = plan.vessel.insideDiameter / 2 + plan.vessel.wallThickness;
  const tol = plan.vessel.wallThickness;
  const placed = uni.filter((g) => g.axialPosition !== undefined && g.clockDeg !== undefined && !partner.has(g.id));
  const candidates: { a: string; b: string; d: number }[] = [];
  placed.forEach((g, i) => {
    for (const h of placed.slice(i + 1)) {
      if (Math.abs(lineAngleBetween(g.angleDeg, h.angleDeg) - 90) > PERPENDICULAR_TOLERANCE_DEG) continue;
      let dth = Math.abs(g.clockDeg! - h.clockDeg!) % 360;
      if (dth > 180) dth = 360 - dth;
      const d = Math.hypot(g.axialPosition! - h.axialPosition!, (ro * dth * Math.PI) / 180);
      if (d <= tol) candidates.push({ a: g.id, b: h.id, d });
    }
  });
  candidates.sort((x, y) => x.d - y.d);
  for (const c of candidates)
    if (!partner.has(c.a) && !partner.has(c.b)) {
      partner.set(c.a, c.b);
      partner.set(c.b, c.a);
    }
  return partner;
}

/** Per-channel scale: gauge-factor mismatch times lead-wire desensitisation. */
function channelScale(g: PlanGauge): number {
  const lead = g.leadResistance !== undefined ? leadWireFactor(g.leadResistance, g.gaugeResistance, g.leadWiring) : 1;
  return (lead * g.instrumentGaugeFactor) / g.gaugeFactor;
}

/**
 * Every grid of the plan with its correction terms, in plan order (the order of predictForPlan's
 * grids and of the plan's channel list). `model` gives the strain ratio for a uniaxial gauge
 * without a measured partner.
 */
export function planGridSetups(plan: Plan, grids: readonly PlannedGrid[], model: ModelPrediction): GridSetup[] {
  const partners = findPerpendicularPartners(plan);
  const channelIndex = new Map<string, number>();
  plan.gauges.flatMap((g) => g.channels).forEach((c, i) => channelIndex.set(c, i));
  const byId = new Map(plan.gauges.map((g) => [g.id, g]));
  const out: GridSetup[] = [];
  let gi = 0;
  for (const g of plan.gauges) {
    const myGrids = grids.slice(gi, gi + g.channels.length);
    gi += g.channels.length;
    const scale = channelScale(g);
    const gfNote =
      g.gaugeFactor !== g.instrumentGaugeFactor
        ? `gauge factor ${g.gaugeFactor} against instrument setting ${g.instrumentGaugeFactor}: readings scaled by ${fmt(g.instrumentGaugeFactor / g.gaugeFactor, 4)}`
        : null;
    const leadNote =
      g.leadResistance !== undefined
        ? `lead wires: ${g.leadWiring ?? 'two-wire'} quarter bridge, ${fmt(g.leadResistance, 4)} Ω per lead with a ${fmt(g.gaugeResistance ?? DEFAULT_GAUGE_RESISTANCE, 4)} Ω gauge${g.gaugeResistance === undefined ? ' (assumed)' : ''}: readings scaled by ${fmt(leadWireFactor(g.leadResistance, g.gaugeResistance, g.leadWiring), 5)}`
        : null;
    const head = headPressureAt(plan, g);
    const headNote =
      head !== 0
        ? `water head: the gauge sits ${head > 0 ? 'below' : 'above'} the pressure tap and sees ${fmt(Math.abs(head), 3)} ${planPressureUnit(plan.units)} ${head > 0 ? 'more' : 'less'} than the log's pressure (ρ ${fmt(plan.testFluidDensity, 5)} kg/m³)`
        : null;
    const base = [gfNote, leadNote, headNote].filter((n): n is string => n !== null);
    const own = channelIndex.get(g.channels[0]!) ?? 0;
    const partnerId = g.kind === 'uniaxial' ? partners.get(g.id) : undefined;
    const partner = partnerId !== undefined ? byId.get(partnerId) : undefined;
    if (g.kind === 'uniaxial') {
      const grid = myGrids[0]!;
      const kt = g.transverseSensitivity;
      const notes = [...base];
      let terms: GridSetup['terms'];
      let scales: number[];
      let correction: TransverseCorrection = 'none';
      if (kt !== 0 && partner) {
        const pScale = channelScale(partner);
        const [cx, cy] = perpendicularPairCoefficients(kt, partner.transverseSensitivity);
        terms = [
          { ch: own, coef: cx * scale },
          { ch: channelIndex.get(partner.channels[0]!) ?? 0, coef: cy * pScale },
        ];
        scales = [scale, pScale];
        correction = 'measured-partner';
        notes.push(
          `transverse sensitivity Kt ${fmt(kt * 100)} % corrected with the strain measured by the perpendicular gauge ${partner.id} at the same place (standard correction, calibration ν₀ = 0.285)`,
        );
      } else if (kt !== 0) {
        const along = strainAtAngle(model.axialStrainPerPressure, model.hoopStrainPerPressure, g.angleDeg);
        const across = strainAtAngle(model.axialStrainPerPressure, model.hoopStrainPerPressure, g.angleDeg + 90);
        const ratio = along !== 0 ? across / along : 0;
        terms = [{ ch: own, coef: scale * uniaxialTransverseFactor(kt, ratio) }];
        scales = [scale];
        correction = 'model-ratio';
        notes.push(
          `transverse sensitivity Kt ${fmt(kt * 100)} % corrected (standard correction, calibration ν₀ = 0.285) with the ${plan.model === 'lame' ? 'Lamé' : 'membrane'} model's predicted transverse/along strain ratio ${fmt(ratio, 4)} (factor ${fmt(uniaxialTransverseFactor(kt, ratio), 5)}); no perpendicular gauge at the same place`,
        );
      } else {
        terms = [{ ch: own, coef: scale }];
        scales = [scale];
      }
      out.push({
        grid,
        gauge: g,
        terms,
        scales,
        transverseCorrection: correction,
        pairedWith: correction === 'measured-partner' ? partner!.id : null,
        headPressure: head,
        notes,
      });
      continue;
    }
    const M = correctionMatrix(g.kind, g.gaugeFactor, g.instrumentGaugeFactor, g.transverseSensitivity, 0, scale);
    for (const [k, grid] of myGrids.entries()) {
      const row = M[k];
      // one row per grid: both come from the gauge's kind, which the plan checked against its channels
      if (!row) throw new Error(`gauge ${g.id}: no correction row for grid ${k + 1} of ${myGrids.length}`);
      const notes = [...base];
      if (g.transverseSensitivity !== 0)
        notes.push(
          `transverse sensitivity Kt ${fmt(g.transverseSensitivity * 100)} % corrected from the three grids of the ${g.kind === 'rosette-delta' ? 'delta' : 'rectangular'} rosette (standard correction, calibration ν₀ = 0.285)`,
        );
      const used = row.map((coef, j) => ({ ch: own + j, coef })).filter((x) => x.coef !== 0);
      out.push({
        grid,
        gauge: g,
        terms: used,
        scales: used.map(() => scale),
        transverseCorrection: g.transverseSensitivity !== 0 ? 'rosette' : 'none',
        pairedWith: null,
        headPressure: head,
        notes,
      });
    }
  }
  return out;
}
