// Allen's thirteen interval relations (J. F. Allen, CACM 26(11):832–843, 1983), on endpoint positions
// so that open and closed ends, and unbounded ones, are handled exactly.
import type { AllenRelation, Range } from './types.js';
import { comparePositions, highSide, highValue, lowSide, lowValue } from './range.js';
import { isEmptyRange } from './range.js';

/** The inverse of each relation (A r B ⇔ B inverse(r) A). */
export const ALLEN_INVERSE: Readonly<Record<AllenRelation, AllenRelation>> = Object.freeze({
  before: 'after', after: 'before', meets: 'met-by', 'met-by': 'meets', overlaps: 'overlapped-by',
  'overlapped-by': 'overlaps', starts: 'started-by', 'started-by': 'starts', during: 'contains',
  contains: 'during', finishes: 'finished-by', 'finished-by': 'finishes', equals: 'equals',
});

/** Relations in which the two ranges share at least one value. */
export const OVERLAPPING_RELATIONS: ReadonlySet<AllenRelation> = new Set<AllenRelation>([
  'overlaps', 'overlapped-by', 'starts', 'started-by', 'during', 'contains', 'finishes', 'finished-by', 'equals',
]);

/**
 * The Allen relation of A to B given endpoint positions a1 < a2 and b1 < b2 (as [v, side] pairs, see
 * range.ts). Exactly one of the thirteen holds for any pair (Allen 1983).
 */
export function allenFromPositions(a1v: number, a1s: number, a2v: number, a2s: number, b1v: number, b1s: number, b2v: number, b2s: number): AllenRelation {
  const a2b1 = comparePositions(a2v, a2s, b1v, b1s);
  if (a2b1 < 0) return 'before';
  if (a2b1 === 0) return 'meets';
  const b2a1 = comparePositions(b2v, b2s, a1v, a1s);
  if (b2a1 < 0) return 'after';
  if (b2a1 === 0) return 'met-by';
  const lo = comparePositions(a1v, a1s, b1v, b1s);
  const hi = comparePositions(a2v, a2s, b2v, b2s);
  if (lo === 0) return hi === 0 ? 'equals' : hi < 0 ? 'starts' : 'started-by';
  if (hi === 0) return lo > 0 ? 'finishes' : 'finished-by';
  if (lo < 0) return hi < 0 ? 'overlaps' : 'contains';
  return hi < 0 ? 'during' : 'overlapped-by';
}

/** The Allen relation of range A to range B; throws on an empty range, which has no relation. */
export function allenRelation(a: Range, b: Range): AllenRelation {
  if (isEmptyRange(a) || isEmptyRange(b)) throw new RangeError('allenRelation needs non-empty ranges');
  return allenFromPositions(lowValue(a), lowSide(a), highValue(a), highSide(a), lowValue(b), lowSide(b), highValue(b), highSide(b));
}
