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
  | 'near-yield';

export type GaugeOutcome = 'in-band' | 'flagged' | 'excluded' | 'not-compared';
export type TestVerdict = 'conforms' | 'flagged' | 'incomplete';
export type HoldBranch = 'zero' | 'loading' | 'unloading' | 'return';
export type ShellModel = 'lame' | 'membrane';

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
  /** at test pressure, plan length unit (positive = growth) */
  diameterChange: number;
  lengthChange: number;
  thicknessChange: number;
  /** larger of the membrane stresses (or von Mises of them) over yield, 0–1+ */
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
  /** corrected, zeroed mean strain at each hold, aligned with result.holds (µε) */
  holdStrains: (number | null)[];
  /** the points that the fits used: pressure (plan unit), strain (µε), branch */
  points: { pressure: number; strain: number; branch: 'loading' | 'unloading' }[];
  notes: string[];
}

export interface RosetteResult {
  id: string;
  kind: 'rosette-rectangular' | 'rosette-delta';
  angleDeg: number;
  /** [ε1, ε2] µε per plan pressure unit */
  principalStrains: [number, number];
  /** direction of ε1 from the vessel axis, degrees, (−90, 90] */
  principalAngleDeg: number;
  /** [σ1, σ2] at test pressure, plan stress unit (plane stress) */
  principalStresses: [number, number];
  vonMises: number;
  /** von Mises over yield */
  yieldFraction: number;
  /** predicted principal strains per unit pressure, for comparison */
  predictedPrincipalStrains: [number, number];
  flags: FlagCode[];
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
  /** what was read */
  log: {
    rows: number;
    missingSamples: number;
    timeSpan: [number, number] | null;
    peakPressure: number;
    pressureUnitInLog: string | null;
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
