// Public surface of bucketing: named schemes, edges, data-driven breaks, the assigner and the tally.
export type { ClosedSide, Bucket, BucketScheme, MergedEdge, BucketSet, BucketSpec } from './types.js';
export { BUCKET_SCHEMES, findScheme } from './schemes.js';
export { bucketsFromEdges, bucketsFromExtents, mergeEdges, toDiscrete } from './edges.js';
export type { EdgeOptions } from './edges.js';
export { quantileOfSorted } from './quantile.js';
export type { QuantileType } from './quantile.js';
export { equalWidthEdges, quantileEdges, ckmeansExtents, ruleBinCount, BIN_RULES, CKMEANS_MAX_VALUES } from './breaks.js';
export type { BinRule, Extent } from './breaks.js';
export { makeBucketer, BELOW, ABOVE, BETWEEN } from './bucketer.js';
export type { Bucketer } from './bucketer.js';
export { buildBuckets, planNeedsData } from './build.js';
export type { BucketPlan, BucketData, BuildOptions } from './build.js';
export { bucketSpecOf, bucketsFromSpec } from './spec.js';
export { BucketTally } from './tally.js';
export type { BucketSummary, BucketCount, Outcome, BucketExample } from './tally.js';
export { NumberBuffer } from './values.js';
export { bucketTable } from './run.js';
export type { BucketRunOptions, BucketSink, BucketRunResult } from './run.js';
