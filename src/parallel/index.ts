// Parallel reading of a plain file in byte ranges: plan the ranges, run a task per range on several
// threads, and put line numbers and row accounting back together.
export type { ByteRange, RangeOutcome, RangeHooks, RangeTask, RangeRun } from './types.js';
export { defaultBytesPerRange, planRanges, RANGES_PER_THREAD } from './plan.js';
export { runRanges } from './pool.js';
export { startRangeWorkers, bundledWorker, type RangeWorkers } from './workers.js';
export { lineBases, mergeSummaries } from './lines.js';
export { siblingModule, isSourceModule } from './module-url.js';
export { openRange, type RangeReadOptions } from './open-range.js';
