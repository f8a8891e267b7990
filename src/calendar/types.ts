// Plain data types of the calendar engine. Instants are epoch milliseconds; periods are half-open
// [start, end) with a unit, a step and a zone.

/** Every calendar unit quern knows, as used on the command line (`--unit`). */
export type UnitName =
  | 'millisecond'
  | 'second'
  | 'minute'
  | 'hour'
  | 'day'
  | 'week' // weeks starting on `weekStart` (ISO weekday number), numbered by the January-4 rule: week 1 holds January 4
  | 'iso-week' // ISO 8601 week of the ISO week-year, Monday start, week 1 holds January 4
  | 'epi-week' // epidemiological week: Sunday start, week 1 is the first week with >= 4 days in the year
  | 'month'
  | 'quarter'
  | 'half'
  | 'year'
  | 'fiscal-year'
  | 'fiscal-quarter'
  | 'fiscal-month';

/** A zone: an IANA name ('America/New_York'), 'UTC', or a fixed offset ('+05:30', '-03:00'). */
export type ZoneName = string;

/** Month and day on which a fiscal year starts (October 1 → { month: 10, day: 1 }). */
export interface FiscalStart {
  month: number;
  day: number;
}

/** Options that define a calendar; all optional but `unit`. */
export interface CalendarOptions {
  unit: UnitName;
  /** Periods of `step` units (15 minutes, 2 weeks); default 1. */
  step?: number;
  /** Default 'UTC'. */
  zone?: ZoneName;
  /** ISO weekday number Monday 1 … Sunday 7 for unit 'week'; default 1. */
  weekStart?: number;
  /** Default { month: 10, day: 1 } (the US federal fiscal year). */
  fiscalStart?: FiscalStart;
  /** Name a fiscal year by the calendar year in which it ends (default) or starts. */
  fiscalLabel?: 'end' | 'start';
  /** Instant from which steps are counted; default: the unit's natural origin (see DEVELOPERS.md). */
  origin?: number;
}

/** A half-open period [start, end) of the calendar, with its label. */
export interface Period {
  label: string;
  start: number;
  end: number;
  unit: UnitName;
  step: number;
  zone: ZoneName;
}

/** The numbered parts of a period's label (present where the unit defines them). */
export interface PeriodParts {
  year: number; // calendar year, ISO week-year, epi year or fiscal year as the unit names it
  half?: number;
  quarter?: number;
  month?: number;
  week?: number;
  day?: number;
  hour?: number;
  minute?: number;
  second?: number;
}

/**
 * A compiled calendar: one unit, step, zone and week/fiscal convention, with the zone's offsets cached.
 * Every method is pure; a Calendar may be shared freely.
 *
 * Period keys: `index(ms)` gives an integer key for the period holding `ms`; consecutive periods have
 * consecutive keys, so filling, gaps and counting are integer arithmetic. `startOf(k)` is its inverse.
 */
export interface Calendar {
  readonly unit: UnitName;
  readonly step: number;
  readonly zone: ZoneName;
  readonly weekStart: number;
  readonly fiscalStart: FiscalStart;
  readonly fiscalLabel: 'end' | 'start';
  /** Start of the period that holds `ms` (never after `ms`; floor(floor(ms)) === floor(ms)). */
  floor(ms: number): number;
  /** End (exclusive) of the period that holds `ms`: the next boundary after floor(ms). */
  next(ms: number): number;
  /** Integer key of the period that holds `ms`. */
  index(ms: number): number;
  /** Start instant of the period with key `k`. */
  startOf(k: number): number;
  /** The period that holds `ms`, with its label. */
  period(ms: number): Period;
  /** Label of the period that holds `ms` (ISO 8601 where it defines one, trade notation otherwise). */
  label(ms: number): string;
  /** Numbered parts of the period that holds `ms`. */
  parts(ms: number): PeriodParts;
  /** Parses a label of this calendar's unit back to its period; throws QuernError 'E_LABEL'. */
  parseLabel(label: string): Period;
  /** Like parseLabel but returns null for a label that does not parse. */
  tryParseLabel(label: string): Period | null;
  /** Number of periods from the one holding `from` to the one holding `until`: index(until) - index(from). */
  count(from: number, until: number): number;
}
