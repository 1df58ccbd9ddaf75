// What the browser may import (the plan editor and its live preview): zod and arithmetic only,
// no papaparse and no node modules.
export { ENGINE_VERSION } from './version';
export { InputError, isInputError } from './errors';
export type { InputIssue, InputErrorDetails, InputErrorCode } from './errors';
export * from './plan';
export * from './units';
export {
  predictShell,
  predictBoth,
  predictForPlan,
  predictedSlopeAt,
  strainAtAngle,
  membraneState,
  lameOuterState,
  lameStressAt,
  edgeZoneDistance,
  effectiveThickness,
  distanceToNearestDiscontinuity,
  gridAngles,
  shellInputFromPlan,
  GRID_NAMES,
} from './shell';
export type { ShellInput, ShellState, PlannedGrid, DiscontinuityDistance, Shape, Ends } from './shell';
export * from './rosette';
export * from './corrections';
export { applyDispositions } from './dispositions';
export { normalizeResult } from './compat';
export type { StoredResult, StoredGauge, StoredRosette, NormalizeContext } from './compat';
export { dimensionChanges, yieldCheckAt, vonMises3 } from './shell';
export { planGridSetups, findPerpendicularPartners, headPressureAt, STANDARD_GRAVITY } from './installation';
export type { GridSetup } from './installation';
export {
  gridBudget,
  resolveUncertainty,
  propagateCentral,
  describeUncertainty,
  UNCERTAINTY_DEFAULTS,
  UNCERTAINTY_LABELS,
} from './uncertainty';
export type { ResolvedUncertainty, UncertaintyInput } from './uncertainty';
export { flagGauge, isNearZeroPrediction, NEAR_ZERO_SHARE } from './flags';
export type { GaugeFlagInput, GaugeFlagOutcome } from './flags';
export { splitCycles, comparedCycle } from './cycles';
export type { CycleSpan } from './cycles';
export type { Disposition, DispositionOutcome, DispositionedGauge } from './dispositions';
export type * from './types';
