// The range model: construction, endpoint positions (so open and closed ends compare exactly), membership.
import type { Range } from './types.js';

/**
 * Makes a range, normalising -0 to 0 and unbounded ends to open. A discrete range is given by the first
 * and the last whole number it holds (inclusive) and stored half-open: discreteRange(0, 4) is [0, 5).
 */
export function makeRange(low: number | null, high: number | null, lowClosed: boolean, highClosed: boolean): Range {
  return {
    low: low === null ? null : low === 0 ? 0 : low,
    high: high === null ? null : high === 0 ? 0 : high,
    lowClosed: low !== null && lowClosed,
    highClosed: high !== null && highClosed,
    discrete: false,
  };
}

/** A discrete range holding the whole numbers first..last (either may be null: unbounded). */
export function discreteRange(first: number | null, last: number | null): Range {
  return { low: first === null ? null : first === 0 ? 0 : first, high: last === null ? null : last + 1, lowClosed: first !== null, highClosed: false, discrete: true };
}

/**
 * Endpoint positions on a line where every number v has a point "just before v" (side 0) and "just
 * after v" (side 1). A range then covers the position interval [lowPos, highPos): a closed low end at v
 * starts at (v,0), an open one at (v,1); a closed high end at v stops at (v,1), an open one at (v,0).
 * Two ranges touch without overlap or hole exactly when one's highPos equals the other's lowPos.
 */
export function lowValue(r: Range): number { return r.low === null ? -Infinity : r.low; }
export function highValue(r: Range): number { return r.high === null ? Infinity : r.high; }
export function lowSide(r: Range): number { return r.lowClosed ? 0 : 1; }
export function highSide(r: Range): number { return r.highClosed ? 1 : 0; }

/** Compares positions (v, s) and (w, t): negative, zero or positive. */
export function comparePositions(v: number, s: number, w: number, t: number): number {
  return v < w ? -1 : v > w ? 1 : s - t;
}

/** True when the range holds no number at all ([5,5), (5,5], reversed ends). */
export function isEmptyRange(r: Range): boolean {
  return comparePositions(lowValue(r), lowSide(r), highValue(r), highSide(r)) >= 0;
}

/** True when `x` lies in the range. */
export function rangeContains(r: Range, x: number): boolean {
  if (r.low !== null && (r.lowClosed ? x < r.low : x <= r.low)) return false;
  if (r.high !== null && (r.highClosed ? x > r.high : x >= r.high)) return false;
  return true;
}

/** True when both ranges hold the same ends with the same closedness and kind. */
export function rangeEquals(a: Range, b: Range): boolean {
  return a.low === b.low && a.high === b.high && a.lowClosed === b.lowClosed && a.highClosed === b.highClosed && a.discrete === b.discrete;
}

/** Orders ranges by low end then high end (positions); for sorting copies, never the caller's array. */
export function compareRanges(a: Range, b: Range): number {
  return comparePositions(lowValue(a), lowSide(a), lowValue(b), lowSide(b))
    || comparePositions(highValue(a), highSide(a), highValue(b), highSide(b));
}

/** The range between two positions, as the hole finder reports it. */
export function rangeFromPositions(v: number, s: number, w: number, t: number, discrete: boolean): Range {
  const r = makeRange(v === -Infinity ? null : v, w === Infinity ? null : w, s === 0, t === 1);
  const wholeEnds = (v === -Infinity || Number.isInteger(v)) && (w === Infinity || Number.isInteger(w));
  if (discrete && (r.low === null || r.lowClosed) && !r.highClosed && wholeEnds) r.discrete = true;
  return r;
}
