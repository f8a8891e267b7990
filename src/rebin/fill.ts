// Filling empty periods, and the guard that stops one stray value (a 1970-01-01 or a 9999-12-31 among this
// decade's events) from silently building decades of empty periods.
import type { Calendar, UnitName } from '../calendar/types.js';
import { QuernError } from '../errors.js';

/** The earliest and latest period key seen, with the line and text of the value that set each. */
export interface KeyExtremes {
  minKey: number;
  minLine: number;
  minText: string;
  maxKey: number;
  maxLine: number;
  maxText: string;
}

/** Extremes before any value: min +Infinity, max −Infinity. */
export function emptyExtremes(): KeyExtremes {
  return { minKey: Infinity, minLine: 0, minText: '', maxKey: -Infinity, maxLine: 0, maxText: '' };
}

/** Records that the value `text` on `line` fell in period `key`. */
export function noteExtreme(x: KeyExtremes, key: number, line: number, text: string): void {
  if (key < x.minKey) {
    x.minKey = key;
    x.minLine = line;
    x.minText = text;
  }
  if (key > x.maxKey) {
    x.maxKey = key;
    x.maxLine = line;
    x.maxText = text;
  }
}

// Nominal unit lengths in ms: used only to size the default guard, never for calendar arithmetic.
const NOMINAL: Record<UnitName, number> = {
  millisecond: 1, second: 1e3, minute: 6e4, hour: 3.6e6, day: 8.64e7,
  week: 6.048e8, 'iso-week': 6.048e8, 'epi-week': 6.048e8,
  month: 2.6298e9, 'fiscal-month': 2.6298e9, quarter: 7.8894e9, 'fiscal-quarter': 7.8894e9,
  half: 1.57788e10, year: 3.15576e10, 'fiscal-year': 3.15576e10,
};

/** Nominal length of one period of `step` units in ms (for ranking units, never for arithmetic). */
export function nominalLength(unit: UnitName, step = 1): number {
  return NOMINAL[unit] * step;
}

/**
 * The default `--max-periods`: as many periods as 20 years hold, at least 250 and at most 500,000.
 * 20 years of weeks is 1,043, so a stray 1970 date among weekly data of the 2020s (2,800 weeks) stops.
 */
export function defaultMaxPeriods(unit: UnitName, step = 1): number {
  const n = Math.round((20 * NOMINAL.year) / nominalLength(unit, step));
  return Math.min(500_000, Math.max(250, n));
}

/** An inclusive range of period keys to emit. */
export interface KeyRange {
  first: number;
  last: number;
}

/**
 * The periods to fill: from `fromKey` (or the first period seen) to `untilKey` (or the last seen);
 * null when there is nothing to fill.
 */
export function fillRange(x: KeyExtremes, fromKey: number | null, untilKey: number | null): KeyRange | null {
  const first = fromKey ?? x.minKey;
  const last = untilKey ?? x.maxKey;
  if (!Number.isFinite(first) || !Number.isFinite(last) || last < first) return null;
  return { first, last };
}

/**
 * Throws QuernError 'E_DATA' when `range` holds more than `maxPeriods` periods, naming the value that
 * stretches it: the extreme on the far side of the widest run of empty periods among `occupied`
 * (sorted ascending period keys that hold rows).
 */
export function checkFill(range: KeyRange, occupied: readonly number[], x: KeyExtremes, maxPeriods: number, cal: Calendar,
  explicit = false): void {
  const n = range.last - range.first + 1;
  if (n <= maxPeriods) return;
  if (explicit) {
    throw new QuernError('E_DATA', `--from/--until span ${n.toLocaleString('en-US')} periods, more than --max-periods ${maxPeriods.toLocaleString('en-US')}`,
      'narrow --from/--until, use a longer unit, or raise --max-periods');
  }
  const unitName = cal.step === 1 ? cal.unit : `${cal.step}-${cal.unit}`;
  const label = (k: number): string => cal.label(cal.startOf(k));
  const head = `filling ${n.toLocaleString('en-US')} ${unitName} periods from ${label(range.first)} to ${label(range.last)} ` +
    `exceeds --max-periods ${maxPeriods.toLocaleString('en-US')}`;
  const hint = 'fix or remove that row, pass --from/--until, raise --max-periods, or use --no-fill';
  let widest = 0;
  let at = -1;
  for (let i = 1; i < occupied.length; i++) {
    const jump = occupied[i]! - occupied[i - 1]!;
    if (jump > widest) {
      widest = jump;
      at = i;
    }
  }
  if (at < 0 || widest <= 1) throw new QuernError('E_DATA', `${head}: the values run from line ${x.minLine} to line ${x.maxLine}`, hint);
  // The side of the widest empty run with fewer occupied periods holds the stray value.
  const lowSide = at < occupied.length - at;
  const [line, text, nearKey] = lowSide ? [x.minLine, x.minText, occupied[at]!] : [x.maxLine, x.maxText, occupied[at - 1]!];
  const side = lowSide ? 'earliest' : 'latest';
  const where = lowSide ? 'before' : 'after';
  throw new QuernError('E_DATA',
    `${head}: the ${side} value ${JSON.stringify(text)} on line ${line} is cut off from the rest by ` +
    `${(widest - 1).toLocaleString('en-US')} empty periods (${where} ${label(nearKey)})`, hint);
}
