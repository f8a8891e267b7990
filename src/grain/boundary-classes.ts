// Classes of wall-clock values that pass exactly the same candidate grains, so that the boundary counter can
// test the candidates once per class instead of once per value. A value's class follows from a few integer
// fields of its wall clock:
//   - a whole-day value (local midnight, or 23:59:59[.999]) by which of those three times it is, its month,
//     whether it is the first or the last day of its month, its weekday and the parity of its week: the only
//     fields the calendar candidates read (candidates.ts);
//   - any other value by its time of day. Every sub-day candidate is a whole number of seconds that divides a
//     day, so a time of day s seconds after midnight passes a start candidate of k seconds when k divides
//     gcd(s, 86400), and an end candidate when k divides gcd(s + 1, 86400); values between whole seconds pass
//     only the millisecond (or, at …999, the end candidates, by gcd(s + 1, 86400)).
// The candidate tests themselves decide each class's pass/miss vector (computed on its first member), and
// vectors are shared between classes. Tables fill on first sight of each class, once per process.
import { civilFromDays, daysInMonth, isoWeekday } from '../calendar/civil.js';
import { CANDIDATES, DAY, weekIndex, type ValueParts } from './candidates.js';

const SECOND = 1000;
const SECONDS_PER_DAY = 86_400;
/** Whole-day class keys: 3 times of day × 12 months × 3 day kinds × 7 weekdays × 2 week parities. */
const WHOLE_KEYS = 3 * 12 * 3 * 7 * 2;
/** Upper bound on distinct pass/miss vectors (whole-day keys plus the few hundred sub-day ones). */
export const MAX_VECTORS = 4096;

interface Tables {
  /** Vector of a value s whole seconds after midnight (−1 until first seen). */
  start: Int16Array;
  /** Vector of a value at s seconds and 999 ms after midnight (−1 until first seen). */
  end1: Int16Array;
  /** Vectors of whole-day keys, −1 until first seen. */
  whole: Int16Array;
  /** Vector of other whole-millisecond times of day, and of anything else (fractions, NaN). */
  msOnly: number;
  none: number;
}

const passed: number[][] = [];
const missed: number[][] = [];
const byKey = new Map<string, number>();
let tables: Tables | null = null;
const ymd = [0, 0, 0];

/** Candidate indices a vector passes, and misses. */
export function passedBy(v: number): readonly number[] {
  return passed[v]!;
}
export function missedBy(v: number): readonly number[] {
  return missed[v]!;
}

/** Runs every candidate test on one value (as the counter did per value) and interns the outcome. */
function intern(p: ValueParts, wholeDay: boolean): number {
  const on: number[] = [];
  const off: number[] = [];
  for (let c = 0; c < CANDIDATES.length; c++) {
    const cand = CANDIDATES[c]!;
    const hit = cand.ms > 0 ? (p.tod + cand.gap) % cand.ms === 0 : wholeDay && cand.test(p);
    (hit ? on : off).push(c);
  }
  const key = on.join(',');
  let v = byKey.get(key);
  if (v === undefined) {
    v = passed.length;
    if (v >= MAX_VECTORS) throw new Error('grain: more boundary classes than MAX_VECTORS');
    passed.push(on);
    missed.push(off);
    byKey.set(key, v);
  }
  return v;
}

function partsAt(tod: number, days = 0, year = 1970, month = 1, day = 1, weekday = 4, dim = 31): ValueParts {
  return { tod, days, year, month, day, weekday, daysInMonth: dim };
}

function gcd(a: number, b: number): number {
  while (b !== 0) {
    const r = a % b;
    a = b;
    b = r;
  }
  return a;
}

function build(): Tables {
  for (const c of CANDIDATES) {
    const whole = c.ms === 0 || c.ms === 1 || (c.ms % SECOND === 0 && DAY % c.ms === 0);
    if (!whole || !(c.gap === 0 || c.gap === 1 || c.gap === SECOND)) throw new Error('grain: a candidate breaks the class rule of boundary-classes.ts');
  }
  return {
    start: new Int16Array(SECONDS_PER_DAY).fill(-1),
    end1: new Int16Array(SECONDS_PER_DAY).fill(-1),
    whole: new Int16Array(WHOLE_KEYS).fill(-1),
    msOnly: intern(partsAt(1), false),
    none: intern(partsAt(0.5), false),
  };
}

const startOf = new Map<number, number>();
const endOf = new Map<number, number>();

/** Vector of a time of day of s whole seconds, by gcd(s, 86400) and gcd(s + 1, 86400); filled on first sight. */
function startVector(t: Tables, s: number): number {
  const k = gcd(SECONDS_PER_DAY, s) * (SECONDS_PER_DAY + 1) + gcd(SECONDS_PER_DAY, s + 1);
  let v = startOf.get(k);
  if (v === undefined) startOf.set(k, (v = intern(partsAt(s * SECOND), false)));
  t.start[s] = v;
  return v;
}

/** Vector of a time of day of s seconds and 999 ms, by gcd(s + 1, 86400); filled on first sight. */
function endVector(t: Tables, s: number): number {
  const k = gcd(SECONDS_PER_DAY, s + 1);
  let v = endOf.get(k);
  if (v === undefined) endOf.set(k, (v = intern(partsAt(s * SECOND + 999), false)));
  t.end1[s] = v;
  return v;
}

/** Last whole-day value's day number and key (without its time of day), kept by each counter. */
export interface DayCache {
  days: number;
  base: number;
}

function wholeDayVector(t: Tables, days: number, tod: number, cache: DayCache): number {
  const kind = tod === 0 ? 0 : tod === DAY - 1 ? 1 : 2;
  let base = cache.base;
  if (days !== cache.days) {
    civilFromDays(days, ymd);
    const weekday = isoWeekday(days);
    const day = ymd[2]!;
    const flag = day === 1 ? 1 : day === daysInMonth(ymd[0]!, ymd[1]!) ? 2 : 0;
    const parity = ((weekIndex(days, weekday) % 2) + 2) % 2;
    base = (((ymd[1]! - 1) * 3 + flag) * 7 + (weekday - 1)) * 2 + parity;
    cache.days = days;
    cache.base = base;
  }
  const key = kind * (WHOLE_KEYS / 3) + base;
  let v = t.whole[key]!;
  if (v < 0) {
    civilFromDays(days, ymd);
    const p = partsAt(tod, days, ymd[0]!, ymd[1]!, ymd[2]!, isoWeekday(days), daysInMonth(ymd[0]!, ymd[1]!));
    t.whole[key] = v = intern(p, true);
  }
  return v;
}

/** vectorOf for a time of day that is not a 32-bit integer, in double arithmetic. */
function fractionVector(t: Tables, tod: number): number {
  const r = tod % SECOND;
  if (r === 0) {
    const s = tod / SECOND;
    const v = t.start[s]!;
    return v >= 0 ? v : startVector(t, s);
  }
  if (r === 999) {
    const s = (tod - 999) / SECOND;
    const v = t.end1[s]!;
    return v >= 0 ? v : endVector(t, s);
  }
  return Number.isInteger(tod) ? t.msOnly : t.none;
}

/** The class vector of one wall-clock value (ms); `cache` speeds up runs of values on the same day. */
export function vectorOf(wallMs: number, cache: DayCache): number {
  const t = tables ?? (tables = build());
  const days = Math.floor(wallMs / DAY);
  const tod = wallMs - days * DAY;
  if (tod === 0 || tod === DAY - 1 || tod === DAY - SECOND) return wholeDayVector(t, days, tod, cache);
  // Integer arithmetic from here when the time of day is a 32-bit integer, as every time of day of a
  // finite value in whole milliseconds is; the rest (fractions, NaN) takes the same rule in doubles.
  const ms = tod | 0;
  if (ms !== tod) return fractionVector(t, tod);
  const r = ms % SECOND;
  if (r === 0) {
    const s = (ms / SECOND) | 0;
    const v = t.start[s]!;
    return v >= 0 ? v : startVector(t, s);
  }
  if (r === 999) {
    const s = ((ms - 999) / SECOND) | 0;
    const v = t.end1[s]!;
    return v >= 0 ? v : endVector(t, s);
  }
  return t.msOnly;
}
