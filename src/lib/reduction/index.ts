// The reduction engine's public API (DESIGN 3, 4.2). Pure TypeScript: no framework, database,
// env or process access. Browser code should import './browser' (no papaparse).
export * from './browser';
export type { LineFit } from './stats';
export {
  fitLine,
  fitThroughOrigin,
  fitFromMoments,
  fitFromSums,
  tQuantile975,
  interpolateSorted,
  serialCorrelationFromBlockSums,
} from './stats';
export { HoldDetector, classifyHolds, detectHolds, mergeHolds } from './holds';
export type { HoldSettings, RawHold, ClassifiedHold, HoldWindow } from './holds';
export { LineSplitter } from './line-splitter';
export { scanNumber, scanPlainDecimal } from './number-scan';
export { LogReader, describeConversion } from './reader';
export { RowAccumulator } from './accumulator';
export { decimateSeries, SeriesBuilder } from './series';
export { inspectLogHead } from './inspect';
export type { LogHeadInfo } from './inspect';
export { reduceLog, Reducer } from './reduce';
export { LiveReducer } from './live';
export type {
  LiveEvent,
  LiveHoldEvent,
  LiveWarningEvent,
  LiveStatusEvent,
  LiveWarningCode,
  LiveSnapshot,
} from './live';
export type { ReduceOptions } from './reduce';
export type { ChunkSource } from './reader';
export { parseNumberText, parseIsoMillis, splitUnit } from './text';
