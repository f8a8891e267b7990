// Plain data types of time-value parsing.
import type { UnitName } from '../calendar/types.js';

/**
 * What a written time value is: an instant with a stated offset, a wall-clock reading without one
 * (to be placed in a zone later), or a period named by its notation (a day, a month, a quarter, a week).
 */
export type TimeKind = 'instant' | 'local' | 'period';

/** How to place a wall-clock time that a zone skips (spring forward) or repeats (fall back). */
export type LocalTimeRule = 'compatible' | 'earlier' | 'later' | 'reject';

/**
 * A reusable out-record the parser fills without allocating. For 'instant', `ms` is epoch
 * milliseconds. For 'local' and 'period', `ms` is wall-clock milliseconds: the epoch milliseconds the
 * same reading would have in UTC (so civil fields come out of it with UTC arithmetic).
 */
export interface ParsedTime {
  kind: TimeKind;
  ms: number;
  /** The written offset in minutes ('Z' is 0) for instants; NaN when the value carries none. */
  offset: number;
  /** For 'period': the unit its notation names ('day', 'month', 'quarter', 'iso-week', …); else null. */
  unit: UnitName | null;
  /** For 'period': wall-clock milliseconds of its end (exclusive); NaN otherwise. */
  endMs: number;
  /** True when the value was a leap second (23:59:60), read as 23:59:59.999 … see DEVELOPERS.md. */
  leapSecond: boolean;
}

/** Makes an empty ParsedTime to reuse across calls. */
export function emptyParsedTime(): ParsedTime {
  return { kind: 'instant', ms: NaN, offset: NaN, unit: null, endMs: NaN, leapSecond: false };
}
