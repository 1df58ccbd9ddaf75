// The reduction engine's public API (DESIGN 3, 4.2). Pure TypeScript: no framework, database,
// env or process access. Browser code should import './browser' (no papaparse).
export * from './browser';
export { fitLine, fitThroughOrigin, fitFromMoments, fitFromSums, tQuantile975, interpolateSorted } from './stats';
export type { LineFit } from './stats';
export { HoldDetector, classifyHolds, detectHolds } from './holds';
export type { HoldSettings, RawHold, ClassifiedHold } from './holds';
export { decimateSeries, SeriesBuilder } from './series';
export { inspectLogHead } from './inspect';
export type { LogHeadInfo } from './inspect';
export { reduceLog } from './reduce';
export type { ReduceOptions } from './reduce';
export type { ChunkSource } from './reader';
export { parseNumberText, parseIsoMillis, splitUnit } from './text';
