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
export type { Disposition, DispositionOutcome, DispositionedGauge } from './dispositions';
export type * from './types';
