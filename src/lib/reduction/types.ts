// The engine's output contract (DESIGN.md 4.2). Plain data only: JSON-serialisable.
// Units: strains in microstrain (µε); pressures in the plan's pressure unit (MPa for SI,
// psi for US); stresses in the plan's stress unit (MPa for SI, psi for US); lengths in the
// plan's length unit (mm for SI, in for US). Slopes are µε per plan pressure unit.

export type FlagCode =
  | 'outside-band'
  | 'nonlinear'
  | 'hysteresis'
  | 'zero-shift'
  | 'no-response'
  | 'reversed-sign'
  | 'edge-zone'
  | 'near-yield'
  | 'hold-creep'
  | 'principal-direction';

export type GaugeOutcome = 'in-band' | 'flagged' | 'excluded' | 'not-compared';
export type TestVerdict = 'conforms' | 'flagged' | 'incomplete';
export type HoldBranch = 'zero' | 'loading' | 'unloading' | 'return';
export type ShellModel = 'lame' | 'membrane';
export type BandMode = 'fixed' | 'uncertainty';

/** Where the stress checked against yield sits: the bore (Lamé), the outer surface, or mid-wall (membrane). */
export type YieldSurface = 'inner' | 'outer' | 'mid-wall';

/** The largest stress in the wall at a pressure, against yield (DESIGN 3.1). */
export interface YieldCheck {
  /** von Mises, plan stress unit */
  stress: number;
  /** stress over yield strength, 0–1+ */
  fraction: number;
  surface: YieldSurface;
  /** the pressure it is evaluated at, plan pressure unit (test pressure plus any water head) */
  pressure: number;
}

/** Changes of the named dimensions at test pressure, plan length unit (positive = growth). */
export interface DimensionChanges {
  insideDiameter: number;
  /** the mean of the inside and outside diameter */
  meanDiameter: number;
  outsideDiameter: number;
  /** seam to seam; null for a sphere */
  length: number | null;
  thickness: number;
}

/** Strains per unit pressure (µε per plan pressure unit) and values at test pressure. */
export interface ModelPrediction {
  model: ShellModel;
  /** µε per plan pressure unit */
  hoopStrainPerPressure: number;
  axialStrainPerPressure: number;
  radialStrainPerPressure: number;
  /** at test pressure, plan stress unit */
  hoopStress: number;
  axialStress: number;
  /** at test pressure, plan length unit (positive = growth): the named changes of both models */
  dimensionChanges: DimensionChanges;
  /** kept from engine 1: the outside diameter under Lamé, the mean diameter under membrane (read dimensionChanges) */
  diameterChange: number;
  lengthChange: number;
  thicknessChange: number;
  /** this model's yield check at test pressure (no water head): Lamé the bore or mid-wall if larger, membrane mid-wall */
  yieldCheck: YieldCheck;
  /** yieldCheck.fraction (kept for engine 1 readers) */
  yieldFraction: number;
}

export interface PredictedBlock {
  lame: ModelPrediction;
  membrane: ModelPrediction;
  /** membrane over lame hoop strain − 1 (≈ (r_mean / r_inside)² − 1 for a cylinder) */
  membraneOverLame: number;
  /** 2.5·√(r t) in plan length units: the edge-zone distance */
  edgeZoneDistance: number;
}

export interface Hold {
  index: number;
  /** the pressure cycle (index into result.cycles) the hold belongs to; a zero hold shared by two cycles belongs to the later */
  cycle?: number;
  /** mean pressure over the settled part, plan pressure unit */
  pressure: number;
  /** seconds from the start of the log (or sample index when the log has no time column) */
  start: number;
  end: number;
  branch: HoldBranch;
  samples: number;
}

export interface GaugeResult {
  /** the gauge's id, or `{rosette id}/A` … `/C` for a rosette's grid */
  id: string;
  channel: string;
  angleDeg: number;
  measuredSlope: number | null;
  predictedSlope: number;
  ratio: number | null;
  deviation: number | null;
  slopeCI95: [number, number] | null;
  rSquared: number | null;
  residualSD: number | null;
  intercept: number | null;
  unloadingSlope: number | null;
  /** largest loading/unloading gap at the same pressure over peak strain, 0–1 */
  hysteresis: number | null;
  /** µε left after the return to zero (null when the log has no return hold) */
  zeroShift: number | null;
  /** µε, largest magnitude over the holds (or samples) */
  peakStrain: number;
  effectiveThickness: number | null;
  distanceToDiscontinuity: number | null;
  flags: FlagCode[];
  outcome: GaugeOutcome;
  /** 2 × the combined standard uncertainty of the predicted slope (GUM, DESIGN 3.4), µε per plan pressure unit */
  predictedU95: number | null;
  /** every input's contribution to the predicted slope's uncertainty, largest first */
  uncertaintyBudget: BudgetEntry[];
  /** the measured slopes that count as in band, µε per plan pressure unit (null: not compared) */
  bandSlope: [number, number] | null;
  /**
   * how the band is applied: `relative` ±slopeBand × predicted; `near-zero` ±slopeBand × the largest
   * predicted principal strain (the prediction is below a fifth of it); `uncertainty` √(U_pred² + U_fit²)
   */
  bandBasis: 'relative' | 'near-zero' | 'uncertainty';
  /** which transverse-sensitivity correction the gauge got, and with which partner gauge */
  transverseCorrection: TransverseCorrection;
  /** the pairing partner when the correction used a measured perpendicular strain */
  pairedWith: string | null;
  /** strain change during the hold at test pressure, pressure change allowed for (µε); null without such a hold */
  holdCreep: number | null;
  /** water head added to the tap pressure at this gauge, plan pressure unit (0 without elevations) */
  headPressure: number;
  /** effective sample count of the fit when it allows for serial correlation (ramp fallback), else null */
  effectiveSamples: number | null;
  /** corrected, zeroed mean strain at each hold, aligned with result.holds (µε) */
  holdStrains: (number | null)[];
  /** the points that the fits used: pressure (plan unit), strain (µε), branch */
  points: { pressure: number; strain: number; branch: 'loading' | 'unloading' }[];
  notes: string[];
}

export type TransverseCorrection = 'none' | 'model-ratio' | 'measured-partner' | 'rosette';

/** One input of the uncertainty budget (DESIGN 3.4). */
export interface BudgetEntry {
  input:
    | 'wallThickness'
    | 'insideDiameter'
    | 'elasticModulus'
    | 'poissonRatio'
    | 'gaugeFactor'
    | 'transverseSensitivity'
    | 'misalignmentDeg';
  /** nominal value in `unit` */
  value: number;
  /** standard uncertainty (k = 1) in `unit` */
  standardUncertainty: number;
  unit: string;
  /** |∂(slope)/∂(input)| · u, µε per plan pressure unit */
  contribution: number;
  /** contribution² over u_c², 0–1 */
  share: number;
  /** the plan gave no value: the default was assumed */
  assumed: boolean;
}

/** One pressure cycle: from a zero hold through its highest hold back to zero (DESIGN 3.2.5). */
export interface CycleResult {
  index: number;
  /** indices into result.holds; null when the log starts at pressure or has not come back yet */
  startHold: number | null;
  peakHold: number;
  endHold: number | null;
  /** pressure of the highest hold, plan pressure unit */
  peakPressure: number;
  /** the peak is within 5 % of the test pressure */
  reachesTestPressure: boolean;
  /** this is the cycle that gauges[] compare (the last one that reaches the test pressure) */
  compared: boolean;
  /** per gauge grid: slopes from this cycle's holds and the strain left at its end, zeroed at its own start */
  gauges: { id: string; loadingSlope: number | null; unloadingSlope: number | null; zeroShift: number | null }[];
}

export interface RosetteResult {
  id: string;
  kind: 'rosette-rectangular' | 'rosette-delta';
  angleDeg: number;
  /** [ε1, ε2] µε per plan pressure unit */
  principalStrains: [number, number];
  /** direction of ε1 from the vessel axis, degrees, (−90, 90] */
  principalAngleDeg: number;
  /** the direction the prediction expects for ε1 from the vessel axis (90: hoop); null on a sphere */
  expectedPrincipalAngleDeg: number | null;
  /** [σ1, σ2] at test pressure (plus the water head at the rosette), plan stress unit (plane stress) */
  principalStresses: [number, number];
  /** [σ1, σ2] per unit pressure, plan stress unit per plan pressure unit */
  stressesPerUnitPressure: [number, number];
  vonMises: number;
  vonMisesPerUnitPressure: number;
  /** von Mises over yield */
  yieldFraction: number;
  /** predicted principal strains per unit pressure, for comparison */
  predictedPrincipalStrains: [number, number];
  flags: FlagCode[];
  notes: string[];
}

/** How the log's pressure column was turned into the plan's gauge pressure. */
export interface PressureConversion {
  /** the unit read from the header (canonical) */
  fromUnit: string;
  toUnit: 'MPa' | 'psi';
  absolute: boolean;
  /** plan pressure = log value × factor − atmosphere */
  factor: number;
  /** subtracted after scaling (0 for gauge pressure), plan pressure unit */
  atmosphere: number;
  /** where the atmosphere came from */
  atmosphereSource: 'none' | 'standard' | 'plan';
}

export interface ReductionResult {
  engineVersion: string;
  model: ShellModel;
  units: 'SI' | 'US';
  pressureUnit: 'MPa' | 'psi';
  testPressure: number;
  predicted: PredictedBlock;
  holds: Hold[];
  gauges: GaugeResult[];
  rosettes: RosetteResult[];
  verdict: TestVerdict;
  warnings: string[];
  /** the yield check of the plan's model at test pressure plus the largest water head (DESIGN 3.1) */
  yieldCheck: YieldCheck & { model: ShellModel; limit: number; nearYield: boolean };
  bandMode: BandMode;
  cycles: CycleResult[];
  /** the uncertainty inputs used (k = 1), and which of them were assumed (DESIGN 3.4) */
  uncertaintyInputs: { input: BudgetEntry['input']; standardUncertainty: number; unit: string; assumed: boolean }[];
  /** what was read */
  log: {
    rows: number;
    missingSamples: number;
    timeSpan: [number, number] | null;
    peakPressure: number;
    pressureUnitInLog: string | null;
    /** the conversion of the first segment's pressure column; null when it had no unit (plan unit assumed) */
    pressureConversion: PressureConversion | null;
    usedHolds: boolean;
    /** ISO 8601 time of the first sample, when the time column holds timestamps (added by the engine) */
    startTime?: string;
  };
}

/** Decimated time history: per bucket min and max of every channel, so spikes survive. */
export interface Series {
  /** bucket start times (s, or sample index without a time column) */
  t: number[];
  /** per channel name (the pressure column under the key `pressure`) */
  min: Record<string, number[]>;
  max: Record<string, number[]>;
  /** which channels are in the series; `pressure` first */
  channels: string[];
  timeIsIndex: boolean;
}
