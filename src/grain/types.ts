// Plain result types of grain detection: what a date column really holds and how quern knows it.
import type { FiscalStart, UnitName } from '../calendar/types.js';
import type { Diagnostic } from '../errors.js';

/** Whether the values mark the start of each period or its end (last day of a month, last instant of a day). */
export type Anchor = 'start' | 'end';

/** A grain: periods of `step` units, marked at their start or end. */
export interface Grain {
  unit: UnitName;
  step: number;
  anchor: Anchor;
  /** ISO weekday number (Monday 1 … Sunday 7) on which weeks start; null for other units. */
  weekStart: number | null;
  /** First month and day of the year, for fiscal units. */
  fiscalStart?: FiscalStart;
}

/** One example value with the 1-based line on which its row starts. */
export interface ValueExample {
  line: number;
  value: string;
  /** Why the value is an exception or invalid, in plain words. */
  reason?: string;
}

/** How many values of the column parsed, were empty or were invalid under the chosen format. */
export interface ValueCounts {
  parsed: number;
  empty: number;
  invalid: number;
}

/** The share of parsed values that lie on the grain, and the exceptions. */
export interface Coverage {
  onGrain: number;
  share: number;
  exceptions: number;
  /** The first few exceptions in file order. */
  examples: ValueExample[];
}

/** How the zone was found. */
export type ZoneBasis =
  | 'written' // the values carry one fixed offset and nothing suggests another zone
  | 'offsets' // the written offsets change exactly as an IANA zone's daylight-saving rules do
  | 'aligned' // the values fall on local boundaries (midnight, hour starts) in this zone
  | 'given' // the user named it with --zone
  | 'none'; // the values carry no offset (wall-clock readings or named periods)

export interface ZoneFinding {
  /** IANA name, fixed offset ('+05:30', 'UTC'), or null when values carry no offset. */
  zone: string | null;
  basis: ZoneBasis;
  /** Distinct offsets (minutes) the zone shows over the values, ascending. */
  offsets: number[];
  /** Other zones that match the values equally well (same offsets at every value). */
  alternatives: string[];
  /** True when the match was checked on a sample only (too many distinct values to keep). */
  sampled: boolean;
}

export type CadenceKind = 'single' | 'regular' | 'weekdays' | 'weekly' | 'monthly' | 'irregular';

/** Spacing of the distinct periods of the column. */
export interface Cadence {
  kind: CadenceKind;
  /** For 'regular': periods are every `every` units (with `unit`); else null. */
  every: number | null;
  unit: UnitName | null;
  /** Distinct periods seen; exact unless `distinctExact` is false (then a HyperLogLog estimate). */
  distinct: number;
  distinctExact: boolean;
  /** Periods of the regular spacing between first and last that hold no value. */
  missing: number;
  /** Periods that hold more than one row (duplicates). */
  repeated: number;
  /** The most common gap between consecutive distinct periods, in units of the grain. */
  typicalGap: number | null;
}

export type Level = 'quantitative' | 'ordinal';

/** Everything quern found about one date-like column. */
export interface ColumnGrain {
  name: string;
  /** Format id from the time-values catalogue ('iso-date-time-offset', 'day-month-year', …). */
  format: string | null;
  formatLabel: string | null;
  /** How the format was chosen (day-first evidence, notation), in plain words. */
  formatEvidence: string | null;
  /** Set when the format could not be told apart (03/04/2021): the candidates, and what to pass. */
  ambiguity: string[] | null;
  /**
   * The unit the written notation itself names: 'day' for 2021-04-05, 'epi-week' for 2024-EW07, and for
   * instants and wall-clock readings the clock unit every value writes ('second' for 2021-04-05T08:15:00Z,
   * 'minute' for 08:15); null when the values write a fraction of a second or differ in kind.
   */
  notationUnit: UnitName | null;
  values: ValueCounts;
  /** The first few invalid values with their lines. */
  invalidExamples: ValueExample[];
  grain: Grain | null;
  zone: string | null;
  zoneFinding: ZoneFinding;
  level: Level | null;
  /** One line saying why the level is what it is. */
  levelReason: string;
  coverage: Coverage | null;
  cadence: Cadence | null;
  /** First and last value (as ISO 8601 text in the column's zone). */
  first: string | null;
  last: string | null;
  /** The plain sentences that explain each finding, in order. */
  findings: string[];
}

/** The result of `detectGrain` over a table. */
export interface GrainReport {
  file: string;
  /** Data rows read; each is used, empty or rejected. */
  rows: number;
  /** Rows the table reader rejected (ragged, undecodable) before any column saw them. */
  rejectedRows: number;
  /** The first few rejected rows, with line and reason (the table reader's examples). */
  rejectedExamples?: Diagnostic[];
  columns: ColumnGrain[];
  /** Columns that were looked at and are not date-like, with the reason. */
  skipped: Array<{ name: string; reason: string }>;
}
