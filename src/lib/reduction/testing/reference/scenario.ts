// From a plan (as plain JSON, DESIGN 4.1) and a true vessel (which may differ from the plan) to the
// channels of a synthetic log and the values a correct reduction must find. Independent of the
// engine: the plan is read as plain data, every number comes from shells.ts and gauges.ts.
import { indicatedByTransverse, shownByInstrument, shownWithLeads, waterHeadPa } from './gauges';
import type { RefChannel } from './log-writer';
import { lameOuterMicrostrainPerPressure, membraneMicrostrainPerPressure, strainAlong, type Vessel } from './shells';

/** The parts of a plan gauge the reference reads. */
export interface RefGauge {
  id: string;
  kind: 'uniaxial' | 'rosette-rectangular' | 'rosette-delta';
  channels: readonly string[];
  angleDeg: number;
  gaugeFactor?: number;
  instrumentGaugeFactor?: number;
  transverseSensitivity?: number;
  leadResistance?: number;
  gaugeResistance?: number;
  leadWiring?: 'two-wire' | 'three-wire';
  elevation?: number;
}

export interface RefPlan {
  units: 'SI' | 'US';
  vessel: { shape: 'cylinder' | 'sphere'; ends?: 'closed' | 'open'; insideDiameter: number; wallThickness: number };
  material: { elasticModulus: number; poissonRatio: number };
  model?: 'lame' | 'membrane';
  testFluidDensity?: number;
  pressureTapElevation?: number;
  gauges: readonly RefGauge[];
}

/** The plan's vessel as the reference sees it. */
export function planVessel(plan: RefPlan): Vessel {
  return {
    shape: plan.vessel.shape,
    closed: (plan.vessel.ends ?? 'closed') === 'closed',
    D: plan.vessel.insideDiameter,
    t: plan.vessel.wallThickness,
    E: plan.material.elasticModulus,
    nu: plan.material.poissonRatio,
  };
}

/** Strains per unit pressure (µε) along the axis and the hoop, for a model. */
export function fieldOf(v: Vessel, model: 'lame' | 'membrane' = 'lame'): { axial: number; hoop: number } {
  return model === 'lame' ? lameOuterMicrostrainPerPressure(v) : membraneMicrostrainPerPressure(v);
}

/** Grid directions from the axis: A, B, C. */
export function gridAngles(g: RefGauge): number[] {
  if (g.kind === 'rosette-rectangular') return [g.angleDeg, g.angleDeg + 45, g.angleDeg + 90];
  if (g.kind === 'rosette-delta') return [g.angleDeg, g.angleDeg + 60, g.angleDeg + 120];
  return [g.angleDeg];
}

export function gridIds(g: RefGauge): string[] {
  return g.kind === 'uniaxial' ? [g.id] : ['A', 'B', 'C'].map((k) => `${g.id}/${k}`);
}

/** Water head at a gauge in the plan's pressure unit (common practice: ρ g Δh). */
export function headAt(plan: RefPlan, g: RefGauge): number {
  if (g.elevation === undefined || plan.pressureTapElevation === undefined) return 0;
  const drop = plan.pressureTapElevation - g.elevation;
  const metres = plan.units === 'US' ? (drop * 25.4) / 1000 : drop / 1000;
  const pa = waterHeadPa(plan.testFluidDensity ?? 1000, metres);
  return plan.units === 'US' ? pa / 6894.757293168 : pa / 1e6;
}

export interface Scenario {
  channels: RefChannel[];
  /** per grid id: the true strain per unit pressure along the grid (what a perfect reduction measures) */
  truth: Record<string, number>;
  /** per grid id: the plan's prediction (reference formulas with the plan's vessel and model) */
  predicted: Record<string, number>;
}

export interface Behaviour {
  /** the true strain field is this factor × the true vessel's (a gauge reading low or high) */
  scale?: number;
  offset?: number;
  setPerCycle?: readonly number[];
  creepPerSecond?: number;
  noise?: number;
  /** wiring reversed */
  reversed?: boolean;
  /** the channel shows only noise */
  dead?: boolean;
  clipAt?: number;
}

/**
 * Channels for every grid of the plan: the true field of `truth` (default the plan's vessel, Lamé)
 * seen through the gauge (TN-509 with the true transverse strain), the instrument's gauge-factor
 * setting and the lead wires.
 */
export function scenario(
  plan: RefPlan,
  opts: {
    truth?: Vessel;
    field?: { axial: number; hoop: number };
    behaviour?: Record<string, Behaviour>;
    /** rosette grids bonded this many degrees off the plan's angle */
    rotation?: Record<string, number>;
  } = {},
): Scenario {
  const model = plan.model ?? 'lame';
  const field = opts.field ?? fieldOf(opts.truth ?? planVessel(plan), 'lame');
  const predictedField = fieldOf(planVessel(plan), model);
  const channels: RefChannel[] = [];
  const truth: Record<string, number> = {};
  const predicted: Record<string, number> = {};
  for (const g of plan.gauges) {
    const b = opts.behaviour?.[g.id] ?? {};
    const rot = opts.rotation?.[g.id] ?? 0;
    const ids = gridIds(g);
    gridAngles(g).forEach((angle, k) => {
      const along = strainAlong(field.axial, field.hoop, angle + rot) * (b.scale ?? 1);
      const across = strainAlong(field.axial, field.hoop, angle + rot + 90) * (b.scale ?? 1);
      const kt = g.transverseSensitivity ?? 0;
      let shown = indicatedByTransverse(along, across, kt);
      shown = shownByInstrument(shown, g.gaugeFactor ?? 2, g.instrumentGaugeFactor ?? g.gaugeFactor ?? 2);
      if (g.leadResistance !== undefined)
        shown = shownWithLeads(shown, g.leadResistance, g.gaugeResistance ?? 120, g.leadWiring !== 'three-wire');
      if (b.reversed) shown = -shown;
      if (b.dead) shown = 0;
      const id = ids[k]!;
      truth[id] = b.dead ? 0 : (b.reversed ? -1 : 1) * along;
      predicted[id] = strainAlong(predictedField.axial, predictedField.hoop, angle);
      channels.push({
        name: g.channels[k]!,
        slope: shown,
        offset: b.offset,
        head: headAt(plan, g),
        setPerCycle: b.setPerCycle,
        creepPerSecond: b.creepPerSecond,
        noise: b.noise,
        clipAt: b.clipAt,
      });
    });
  }
  return { channels, truth, predicted };
}
