// Reading stored results of older engines: engine 2 added fields (the yield check, named
// dimension changes, cycles, the uncertainty budget, band details, rosette stresses per unit
// pressure). normalizeResult fills what can be derived from an engine 1 result exactly and marks
// the rest as unknown, so the review and the reports read results of either engine. Pure.
import type { BudgetEntry, GaugeResult, ModelPrediction, ReductionResult, RosetteResult, YieldCheck } from './types';
import { pressureFactor } from './units';

type Legacy<T, K extends keyof T> = Omit<T, K> & Partial<Pick<T, K>>;

/** The gauge fields engine 2 added. */
export type Engine2GaugeFields =
  | 'predictedU95'
  | 'uncertaintyBudget'
  | 'bandSlope'
  | 'bandBasis'
  | 'transverseCorrection'
  | 'pairedWith'
  | 'holdCreep'
  | 'headPressure'
  | 'effectiveSamples';

/** A gauge as an engine 1 result stored it. */
export type StoredGauge = Legacy<GaugeResult, Engine2GaugeFields>;
export type StoredRosette = Legacy<
  RosetteResult,
  'expectedPrincipalAngleDeg' | 'stressesPerUnitPressure' | 'vonMisesPerUnitPressure' | 'notes'
>;
export type StoredModel = Legacy<ModelPrediction, 'dimensionChanges' | 'yieldCheck'>;

/** A result as stored by any engine version. */
export type StoredResult = Omit<
  ReductionResult,
  'gauges' | 'rosettes' | 'predicted' | 'yieldCheck' | 'bandMode' | 'cycles' | 'uncertaintyInputs' | 'log'
> & {
  gauges: StoredGauge[];
  rosettes: StoredRosette[];
  predicted: Omit<ReductionResult['predicted'], 'lame' | 'membrane'> & { lame: StoredModel; membrane: StoredModel };
  yieldCheck?: ReductionResult['yieldCheck'];
  bandMode?: ReductionResult['bandMode'];
  cycles?: ReductionResult['cycles'];
  uncertaintyInputs?: ReductionResult['uncertaintyInputs'];
  log: Legacy<ReductionResult['log'], 'pressureConversion'>;
};

export interface NormalizeContext {
  /** the material's yield strength, plan stress unit (an engine 1 result stores only fractions) */
  yieldStrength: number;
  /** the near-yield limit, a fraction of yield */
  yieldFraction: number;
  /** ± slope band, for an engine 1 result's band */
  slopeBand: number;
}

const NO_BUDGET: BudgetEntry[] = [];

/** Membrane von Mises (plane stress) from the stored membrane stresses. */
function membraneYield(m: StoredModel, ctx: NormalizeContext, pressure: number): YieldCheck {
  const vm = Math.sqrt(m.hoopStress ** 2 - m.hoopStress * m.axialStress + m.axialStress ** 2);
  return { stress: vm, fraction: vm / ctx.yieldStrength, surface: 'mid-wall', pressure };
}

function model(m: StoredModel, membrane: StoredModel, ctx: NormalizeContext, p: number): ModelPrediction {
  // engine 1: Lamé's diameterChange was the outside diameter, the membrane's the mean one
  const lame = m.model === 'lame';
  const dims = m.dimensionChanges ?? {
    insideDiameter: lame ? m.diameterChange - 2 * m.thicknessChange : m.diameterChange - m.thicknessChange,
    meanDiameter: lame ? m.diameterChange - m.thicknessChange : m.diameterChange,
    outsideDiameter: lame ? m.diameterChange : m.diameterChange + m.thicknessChange,
    length: m.lengthChange,
    thickness: m.thicknessChange,
  };
  let yc = m.yieldCheck;
  if (!yc) {
    const mid = membraneYield(membrane, ctx, p);
    const bore = m.yieldFraction * ctx.yieldStrength; // engine 1 Lamé: von Mises at the bore
    yc = lame && bore >= mid.stress ? { stress: bore, fraction: m.yieldFraction, surface: 'inner', pressure: p } : mid;
  }
  return { ...m, dimensionChanges: dims, yieldCheck: yc, yieldFraction: yc.fraction };
}

/** Engine 1 converted a bracketed gauge-pressure unit only, by its factor. */
function legacyConversion(stored: StoredResult): ReductionResult['log']['pressureConversion'] {
  const unit = stored.log.pressureUnitInLog;
  if (!unit) return null;
  let factor = NaN;
  try {
    factor = pressureFactor(unit, stored.pressureUnit);
  } catch {
    // a unit this engine no longer knows: the factor stays unknown
  }
  return {
    fromUnit: unit,
    toUnit: stored.pressureUnit,
    absolute: false,
    factor,
    atmosphere: 0,
    atmosphereSource: 'none',
  };
}

/** A stored result of any engine version in the shape of the current one. */
export function normalizeResult(stored: StoredResult, ctx: NormalizeContext): ReductionResult {
  const tp = stored.testPressure;
  const membrane = model(stored.predicted.membrane, stored.predicted.membrane, ctx, tp);
  const lame = model(stored.predicted.lame, stored.predicted.membrane, ctx, tp);
  const used = stored.model === 'lame' ? lame : membrane;
  const yieldCheck = stored.yieldCheck ?? {
    ...used.yieldCheck,
    model: stored.model,
    limit: ctx.yieldFraction,
    nearYield: used.yieldCheck.fraction >= ctx.yieldFraction,
  };
  const hoop = used.hoopStrainPerPressure,
    axial = used.axialStrainPerPressure;
  const gauges = stored.gauges.map((g): GaugeResult => ({
    ...g,
    predictedU95: g.predictedU95 ?? null,
    uncertaintyBudget: g.uncertaintyBudget ?? NO_BUDGET,
    bandSlope:
      g.bandSlope !== undefined
        ? g.bandSlope
        : g.outcome === 'not-compared'
          ? null
          : [
              g.predictedSlope - ctx.slopeBand * Math.abs(g.predictedSlope),
              g.predictedSlope + ctx.slopeBand * Math.abs(g.predictedSlope),
            ],
    bandBasis: g.bandBasis ?? 'relative',
    transverseCorrection:
      g.transverseCorrection ??
      (g.notes.some((n) => n.startsWith('transverse sensitivity'))
        ? g.id.includes('/')
          ? 'rosette'
          : 'model-ratio'
        : 'none'),
    pairedWith: g.pairedWith ?? null,
    holdCreep: g.holdCreep ?? null,
    headPressure: g.headPressure ?? 0,
    effectiveSamples: g.effectiveSamples ?? null,
  }));
  const rosettes = stored.rosettes.map((r): RosetteResult => ({
    ...r,
    expectedPrincipalAngleDeg:
      r.expectedPrincipalAngleDeg !== undefined
        ? r.expectedPrincipalAngleDeg
        : hoop === axial
          ? null
          : hoop > axial
            ? 90
            : 0,
    stressesPerUnitPressure: r.stressesPerUnitPressure ?? [r.principalStresses[0] / tp, r.principalStresses[1] / tp],
    vonMisesPerUnitPressure: r.vonMisesPerUnitPressure ?? r.vonMises / tp,
    notes: r.notes ?? [],
  }));
  const pressureConversion =
    stored.log.pressureConversion !== undefined ? stored.log.pressureConversion : legacyConversion(stored);
  return {
    ...stored,
    predicted: { ...stored.predicted, lame, membrane },
    gauges,
    rosettes,
    yieldCheck,
    bandMode: stored.bandMode ?? 'fixed',
    cycles: stored.cycles ?? [],
    uncertaintyInputs: stored.uncertaintyInputs ?? [],
    log: { ...stored.log, pressureConversion },
  };
}
