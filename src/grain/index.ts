// Grain detection: a date column's true resolution, format, zone and cadence.
export { detectGrain, checkGrainOptions } from './detect.js';
export type { GrainOptions } from './detect.js';
export { GrainColumn } from './column.js';
export { analyseColumn } from './analyse.js';
export type { AnalyseOptions } from './analyse.js';
export { MIN_SHARE, MIN_DISTINCT, holds, distinctNeeded } from './tolerance.js';
export { grainWords, boundaryWords, unitPlural, utcOffset } from './words.js';
export type {
  Anchor, Grain, ValueExample, ValueCounts, Coverage, ZoneBasis, ZoneFinding, CadenceKind, Cadence, Level,
  ColumnGrain, GrainReport,
} from './types.js';
