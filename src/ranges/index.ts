// Public surface of the range model: ranges, labels, Allen's relations and the overlap/hole sweep.
export type { Range, EndsRule, TimeEndpoint, TimeEndpoints, RangeLabelOptions, AllenRelation } from './types.js';
export { makeRange, discreteRange, rangeContains, rangeEquals, compareRanges, isEmptyRange } from './range.js';
export { allenRelation, ALLEN_INVERSE, OVERLAPPING_RELATIONS } from './allen.js';
export { parseRangeLabel, tryParseNumericRange, formatRange } from './labels.js';
export { rangeFromEndpoints } from './time-labels.js';
export { parseDomain } from './domain.js';
export { checkRanges, checkRangeColumns } from './sweep.js';
export { RangeColumnsBuilder, IntColumn, rangeAt, rangeColumnsOf, rangeFlags, LOW_CLOSED, HIGH_CLOSED, DISCRETE } from './columns.js';
export type { RangeColumns } from './columns.js';
export type { RangeCheck, RangeCheckOptions, OverlapPair, DuplicateGroup } from './sweep.js';
