// Public surface of gaps: expected periods, missing runs, duplicates, gaps between instants.
export { findGaps } from './gaps.js';
export type { GapsOptions, GapsResult, GapSeries, GapsSummary, MissingRun, DuplicatePeriod, InstantGapReport } from './types.js';
export { expectedTest, parseSkipDates, isoDay, NO_SKIPS } from './expected.js';
export type { SkipRules } from './expected.js';
export { walkSeries, longestRun } from './runs.js';
export type { KeyRun, KeyDuplicate, SeriesWalk } from './runs.js';
export { InstantBuckets, fixedDurationMs } from './max-gap.js';
export type { InstantGap } from './max-gap.js';
export { isoDurationOfMs } from './report-series.js';
export { gapsUnitFromGrain, detectGapsUnit } from './grain-unit.js';
export type { GapsUnitChoice } from './grain-unit.js';
