// The flags of one gauge grid (DESIGN 3.3) from its fitted numbers: a pure function, tested flag
// by flag. The notes say in plain words what each flag saw and what usually causes it.
import type { Plan } from './plan';
import type { FlagCode, GaugeOutcome, GaugeResult } from './types';
import { fmt } from './number-words';

export interface GaugeFlagInput {
  predictedSlope: number;
  measuredSlope: number | null;
  slopeCI95: [number, number] | null;
  rSquared: number | null;
  /** µε */
  peakStrain: number;
  /** the predicted strain at test pressure, µε (predicted slope × test pressure) */
  predictedPeak: number;
  zeroShift: number | null;
  hysteresis: number | null;
  /** pressure above which the strain stops changing, or null */
  saturatedAt: number | null;
  /** strain change during the hold at test pressure (µε), or null */
  holdCreep: number | null;
  edgeZone: boolean;
  /** the largest predicted principal strain magnitude per unit pressure (hoop or axial) */
  largestPrincipal: number;
  /** 2·u_c of the predicted slope */
  predictedU95: number | null;
  /** the test's yield check: largest stress in the wall over yield */
  yieldFraction: number;
  /** where that stress sits, in words ("von Mises at the bore (Lamé)") */
  yieldWhere: string;
  /** von Mises from the gauge's own rosette over yield (rosette grids only) */
  rosetteYieldFraction: number | null;
  /** flags the rosette evaluation raised (principal-direction) */
  rosetteFlags: readonly FlagCode[];
  tolerances: Plan['tolerances'];
  pressureUnit: string;
}

export interface GaugeFlagOutcome {
  flags: FlagCode[];
  notes: string[];
  outcome: GaugeOutcome;
  bandSlope: GaugeResult['bandSlope'];
  bandBasis: GaugeResult['bandBasis'];
}

/** Below this share of the largest predicted principal strain a relative band is meaningless. */
export const NEAR_ZERO_SHARE = 0.2;

/** The predicted slope is too small for a relative band (an open cylinder near 28.7° from the axis). */
export function isNearZeroPrediction(predictedSlope: number, largestPrincipal: number): boolean {
  return Math.abs(predictedSlope) < NEAR_ZERO_SHARE * Math.abs(largestPrincipal);
}

/** Flags, notes, band and outcome of one grid. */
export function flagGauge(i: GaugeFlagInput): GaugeFlagOutcome {
  const tol = i.tolerances;
  const flags: FlagCode[] = [];
  const notes: string[] = [];
  const m = i.measuredSlope;
  const pred = i.predictedSlope;
  let bandSlope: GaugeFlagOutcome['bandSlope'] = null;
  const nearZero = isNearZeroPrediction(pred, i.largestPrincipal);
  const bandBasis: GaugeFlagOutcome['bandBasis'] =
    tol.bandMode === 'uncertainty' && i.predictedU95 !== null ? 'uncertainty' : nearZero ? 'near-zero' : 'relative';
  if (i.edgeZone) flags.push('edge-zone');
  // a dead channel cannot be told from a gauge whose predicted strain is itself about the floor
  const floorMeaningful = Math.abs(i.predictedPeak) >= 2 * tol.noResponseMicrostrain;
  const dead = m === null || (floorMeaningful && Math.abs(i.peakStrain) < tol.noResponseMicrostrain);
  if (m !== null && !floorMeaningful)
    notes.push(
      `the predicted strain at test pressure (${fmt(i.predictedPeak)} µε) is too small to tell a dead channel: no-response not checked`,
    );
  if (dead) {
    flags.push('no-response');
    notes.push(
      m === null
        ? 'no slope could be fitted (too few readings)'
        : `peak strain ${fmt(i.peakStrain)} µε is below the ${tol.noResponseMicrostrain} µε floor: dead, disconnected or unbonded channel?`,
    );
  } else {
    if (i.saturatedAt !== null) {
      flags.push('no-response');
      notes.push(
        `strain stops changing above ${fmt(i.saturatedAt, 4)} ${i.pressureUnit}: saturated amplifier or debonded gauge?`,
      );
    }
    if (!i.edgeZone) {
      if (!nearZero && Math.sign(m) !== Math.sign(pred)) {
        flags.push('reversed-sign');
        notes.push('slope has the opposite sign of the prediction: reversed wiring, wrong channel or wrong angle?');
      }
      let half: number;
      if (bandBasis === 'uncertainty') {
        const fit = i.slopeCI95 ? (i.slopeCI95[1] - i.slopeCI95[0]) / 2 : 0;
        half = Math.hypot(i.predictedU95 ?? 0, fit);
        notes.push(
          `band from the uncertainties: ±${fmt(half)} µε/${i.pressureUnit} = √(U_pred ${fmt(i.predictedU95 ?? 0)}² + U_fit ${fmt(fit)}²)`,
        );
      } else if (nearZero) {
        half = tol.slopeBand * Math.abs(i.largestPrincipal);
        notes.push(
          `the predicted slope ${fmt(pred)} µε/${i.pressureUnit} is below a fifth of the largest principal strain ${fmt(i.largestPrincipal)}: compared as an absolute deviation within ±${fmt(tol.slopeBand * 100)} % of that principal strain (±${fmt(half)} µε/${i.pressureUnit}), not as a ratio; sign, linearity and hysteresis are not judged on so small a prediction`,
        );
      } else half = tol.slopeBand * Math.abs(pred);
      bandSlope = [pred - half, pred + half];
      if (Math.abs(m - pred) > half) flags.push('outside-band');
    }
    // on a prediction near zero the fit is mostly noise: its R² and hysteresis share say nothing
    if (!nearZero && i.rSquared !== null && i.rSquared < tol.minRSquared) flags.push('nonlinear');
    if (!nearZero && i.hysteresis !== null && i.hysteresis > tol.hysteresis) flags.push('hysteresis');
    if (
      i.zeroShift !== null &&
      Math.abs(i.zeroShift) > Math.max(tol.zeroShiftMicrostrain, tol.zeroShiftFraction * Math.abs(i.peakStrain))
    )
      flags.push('zero-shift');
    const creepLimit = Math.max(tol.holdCreepMicrostrain, tol.holdCreepFraction * Math.abs(i.peakStrain));
    if (i.holdCreep !== null && Math.abs(i.holdCreep) > creepLimit) {
      flags.push('hold-creep');
      notes.push(
        `strain moved ${fmt(i.holdCreep)} µε during the hold at test pressure while the pressure stayed in its band (limit ${fmt(creepLimit)} µε): yielding, a leak, or a gauge coming loose?`,
      );
    }
  }
  if (i.yieldFraction >= tol.yieldFraction) {
    flags.push('near-yield');
    notes.push(
      `the largest stress in the wall at test pressure (${i.yieldWhere}) is ${fmt(i.yieldFraction * 100)} % of yield (limit ${fmt(tol.yieldFraction * 100)} %)`,
    );
  }
  if (i.rosetteYieldFraction !== null && i.rosetteYieldFraction >= tol.yieldFraction) {
    if (!flags.includes('near-yield')) flags.push('near-yield');
    notes.push(`von Mises stress from the rosette at test pressure is ${fmt(i.rosetteYieldFraction * 100)} % of yield`);
  }
  for (const f of i.rosetteFlags) if (!flags.includes(f)) flags.push(f);
  const unique = [...new Set(flags)];
  // an edge-zone gauge is not compared, but a wall near yield is never passed over
  const outcome: GaugeOutcome = unique.includes('near-yield')
    ? 'flagged'
    : i.edgeZone
      ? 'not-compared'
      : unique.length
        ? 'flagged'
        : 'in-band';
  return { flags: unique, notes, outcome, bandSlope, bandBasis };
}
