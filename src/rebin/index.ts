// Public surface of rebin: events (or source periods) into calendar periods, with aggregates, groups and fill.
export { rebin } from './rebin.js';
export { rebinFile, PARALLEL_MIN_BYTES } from './parallel.js';
export type { RebinThreads, RebinPlan } from './parallel.js';
export type { RebinOptions, RebinResult, RebinRow, RebinSummary, MeasureSummary } from './types.js';
export { parseAggSpec, parseAggSpecs, parseQuantileType, aggColumns, isAdditive } from './aggregates.js';
export type { AggKind, AggSpec } from './aggregates.js';
export { parseAssignPolicy, placePeriod, emptyPlacement } from './period-source.js';
export type { AssignPolicy, Placement } from './period-source.js';
export { defaultMaxPeriods, nominalLength } from './fill.js';
export { DEFAULT_LIMITS } from './accumulate.js';
export type { AccumulatorLimits } from './accumulate.js';
export { LocalResolver } from './local-time.js';
export type { LocalResolutions } from './local-time.js';
export { boundInstant } from './bounds.js';
export { formatLocalIso } from './rows.js';
