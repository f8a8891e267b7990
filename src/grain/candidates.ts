// The candidate grains a date column is tested against: sub-day steps (from the millisecond to the day),
// with start and end anchors, and calendar periods of a day or more (weeks on each start day, fortnights,
// months, quarters, halves, calendar and fiscal years), with start and end anchors.
import { isoWeekday } from '../calendar/civil.js';
import type { Grain } from './types.js';

/** The civil parts of one wall-clock value that every candidate test reads. */
export interface ValueParts {
  /** Milliseconds since local midnight. */
  tod: number;
  /** Day number (days since 1970-01-01) of the local date. */
  days: number;
  year: number;
  month: number;
  day: number;
  /** ISO weekday, Monday 1 … Sunday 7. */
  weekday: number;
  daysInMonth: number;
}

/** A grain to test, with an approximate length used only to rank candidates (never for arithmetic). */
export interface Candidate {
  grain: Grain;
  approxMs: number;
  /** True when only values naming a whole day (midnight or the day's last instant) can pass the test. */
  wholeDays: boolean;
  /** Sub-day candidates: the test is (tod + gap) % ms === 0; 0 for others. */
  ms: number;
  gap: number;
  /**
   * Calendar candidates' test. It may read only the time of day, the month, whether the day is the first or
   * the last of its month, the weekday and the parity of the week: boundary-classes.ts groups values on
   * exactly these fields (test/grain/counter.test.ts checks the grouping against a per-value evaluation).
   */
  test(v: ValueParts): boolean;
}

const SECOND = 1000;
const MINUTE = 60 * SECOND;
const HOUR = 60 * MINUTE;
export const DAY = 24 * HOUR;

const SUB_DAY: ReadonlyArray<readonly [Grain['unit'], number, number]> = [
  ['millisecond', 1, 1],
  ['second', 1, SECOND], ['second', 5, 5 * SECOND], ['second', 10, 10 * SECOND], ['second', 15, 15 * SECOND],
  ['second', 30, 30 * SECOND],
  ['minute', 1, MINUTE], ['minute', 2, 2 * MINUTE], ['minute', 5, 5 * MINUTE], ['minute', 10, 10 * MINUTE],
  ['minute', 15, 15 * MINUTE], ['minute', 20, 20 * MINUTE], ['minute', 30, 30 * MINUTE],
  ['hour', 1, HOUR], ['hour', 2, 2 * HOUR], ['hour', 3, 3 * HOUR], ['hour', 4, 4 * HOUR], ['hour', 6, 6 * HOUR],
  ['hour', 8, 8 * HOUR], ['hour', 12, 12 * HOUR],
  ['day', 1, DAY],
];

/** Gaps between the last written instant of a period and its end: a millisecond (…:59.999) or a second (…:59). */
const END_GAPS = [1, SECOND];

function grain(unit: Grain['unit'], step: number, anchor: Grain['anchor'], weekStart: number | null = null): Grain {
  return { unit, step, anchor, weekStart };
}

/** A value that names a whole day: local midnight, or the last instant of the day (…23:59:59[.999]). */
function isDayStart(v: ValueParts): boolean {
  return v.tod === 0;
}
function isDayEnd(v: ValueParts): boolean {
  return v.tod === 0 || v.tod === DAY - 1 || v.tod === DAY - SECOND;
}
function isLastDay(v: ValueParts): boolean {
  return v.day === v.daysInMonth;
}

function subDayCandidates(): Candidate[] {
  const out: Candidate[] = [];
  for (const [unit, step, ms] of SUB_DAY) {
    out.push({ grain: grain(unit, step, 'start'), approxMs: ms, wholeDays: false, ms, gap: 0, test: (v) => v.tod % ms === 0 });
    for (const gap of END_GAPS) {
      if (ms <= gap) continue;
      if (gap === SECOND && ms < MINUTE) continue;
      out.push({ grain: grain(unit, step, 'end'), approxMs: ms, wholeDays: false, ms, gap, test: (v) => (v.tod + gap) % ms === 0 });
    }
  }
  return out;
}

/** Index of the week (starting on ISO weekday `w`) that holds day number `days`. */
export function weekIndex(days: number, w: number): number {
  const first = (((w - isoWeekday(0)) % 7) + 7) % 7; // day number of the first such weekday from 1970-01-01
  return Math.floor((days - first) / 7);
}

function weekCandidates(): Candidate[] {
  const out: Candidate[] = [];
  for (let w = 1; w <= 7; w++) {
    out.push({ grain: grain('week', 1, 'start', w), approxMs: 7 * DAY, wholeDays: true, ms: 0, gap: 0, test: (v) => isDayStart(v) && v.weekday === w });
    for (let phase = 0; phase < 2; phase++) {
      out.push({
        grain: grain('week', 2, 'start', w),
        approxMs: 14 * DAY,
        wholeDays: true,
        ms: 0,
        gap: 0,
        test: (v) => isDayStart(v) && v.weekday === w && (((weekIndex(v.days, w) % 2) + 2) % 2) === phase,
      });
    }
  }
  return out;
}

function monthCandidates(): Candidate[] {
  const start = (unit: Grain['unit'], approx: number, months: (m: number) => boolean): Candidate => ({
    grain: grain(unit, 1, 'start'), approxMs: approx, wholeDays: true, ms: 0, gap: 0, test: (v) => isDayStart(v) && v.day === 1 && months(v.month),
  });
  const end = (unit: Grain['unit'], approx: number, months: (m: number) => boolean): Candidate => ({
    grain: grain(unit, 1, 'end'), approxMs: approx, wholeDays: true, ms: 0, gap: 0, test: (v) => isDayEnd(v) && isLastDay(v) && months(v.month),
  });
  const out: Candidate[] = [
    start('month', 30.44 * DAY, () => true),
    start('quarter', 91.3 * DAY, (m) => m % 3 === 1),
    start('half', 182.6 * DAY, (m) => m === 1 || m === 7),
    start('year', 365.25 * DAY, (m) => m === 1),
    end('month', 30.44 * DAY, () => true),
    end('quarter', 91.3 * DAY, (m) => m % 3 === 0),
    end('half', 182.6 * DAY, (m) => m === 6 || m === 12),
    end('year', 365.25 * DAY, (m) => m === 12),
  ];
  // Fiscal years that start on the first of another month (US federal: October 1, 31 U.S.C. §1102).
  for (let fm = 2; fm <= 12; fm++) {
    const lastMonth = fm - 1;
    out.push({
      grain: { ...grain('fiscal-year', 1, 'start'), fiscalStart: { month: fm, day: 1 } },
      approxMs: 365.25 * DAY,
      wholeDays: true,
      ms: 0,
      gap: 0,
      test: (v) => isDayStart(v) && v.day === 1 && v.month === fm,
    });
    out.push({
      grain: { ...grain('fiscal-year', 1, 'end'), fiscalStart: { month: fm, day: 1 } },
      approxMs: 365.25 * DAY,
      wholeDays: true,
      ms: 0,
      gap: 0,
      test: (v) => isDayEnd(v) && isLastDay(v) && v.month === lastMonth,
    });
  }
  return out;
}

/** Every candidate grain, finest first (ranked by approximate length). */
export const CANDIDATES: readonly Candidate[] = [...subDayCandidates(), ...weekCandidates(), ...monthCandidates()]
  .sort((a, b) => a.approxMs - b.approxMs);

/** Days at or above which a candidate names whole days (the level boundary between instants and periods). */
export function isPeriodGrain(g: Grain): boolean {
  return !(g.unit === 'millisecond' || g.unit === 'second' || g.unit === 'minute' || g.unit === 'hour');
}
