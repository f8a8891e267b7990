// Plain data of `gaps`: its options and its result, printed by `--json` as they are.
import type { CalendarOptions, UnitName } from '../calendar/types.js';
import type { RowAccounting } from '../rebin/types.js';

/** What `findGaps` is asked to do. */
export interface GapsOptions {
  /** The time column. */
  time: string;
  /** The expected periods' calendar; null: take the unit from the values' notation (or the detected grain). */
  calendar: CalendarOptions | null;
  /** How the unit was chosen, when the caller chose it (e.g. 'detected grain: 15-minute'). */
  unitBasis?: string;
  /** One series per distinct tuple of these columns. */
  by?: readonly string[];
  /** Only Monday–Friday are expected. */
  weekdays?: boolean;
  /** Report periods with several rows as duplicates (default true); false for event logs, where many
   *  rows a period are normal and only missing periods matter. */
  duplicates?: boolean;
  /** Local dates (day numbers) not expected (holidays). */
  skipDays?: ReadonlySet<number>;
  /** For instants without a regular grain: report every gap longer than this many ms (instead of a unit). */
  maxGapMs?: number | null;
  /** The duration as the user wrote it, for the report. */
  maxGapText?: string;
  /** Expected periods start at the one holding `from` and end at the one holding `until` (with --max-gap:
   *  instants before `from` or after `until` are left out). */
  from?: number | null;
  until?: number | null;
  /** Zone used with `calendar: null` and with --max-gap; default: the detected zone, else UTC. */
  zone?: string;
  timeFormat?: string | null;
  /** How numeric day-month dates are ordered (05/04/2021), when the values alone cannot tell. */
  dayOrder?: 'day-first' | 'month-first' | null;
  maxExamples?: number;
  /**
   * With `calendar: null`, when the values are not periods with a notation of their own: how to choose the
   * expected calendar (the CLI passes the detected grain, which costs one more pass over the file).
   */
  detect?: () => Promise<{ calendar: CalendarOptions; basis: string; weekdays: boolean }>;
}

/** A run of missing periods: `2021-W14 … 2021-W16, 3 weeks`. */
export interface MissingRun {
  from: string;
  to: string;
  periods: number;
  /** Position of its first period among the series' expected periods (0-based), for drawing. */
  index: number;
}

/** A period with more than one row. */
export interface DuplicatePeriod {
  period: string;
  count: number;
  index: number;
}

/** A gap longer than --max-gap between two consecutive instants. */
export interface InstantGapReport {
  /** The last instant before the gap and the first after it, ISO 8601 in the zone. */
  from: string;
  to: string;
  /** Length as an ISO 8601 duration (PT6H15M) and in ms. */
  length: string;
  ms: number;
}

/** Gaps and duplicates of one series. */
export interface GapSeries {
  /** The group values joined by ' / ' ('' for the whole table). */
  key: string;
  group: string[];
  first: string | null;
  last: string | null;
  /** Rows of this series that fell in a period. */
  rows: number;
  expected: number;
  present: number;
  missing: MissingRun[];
  duplicates: DuplicatePeriod[];
  /** present / expected (1 for no expected period). */
  coverage: number;
  /** The longest run of missing periods, or with --max-gap the longest gap between instants. */
  longestGap: MissingRun | InstantGapReport | null;
  /** Periods with rows that the calendar does not expect (a Saturday under --weekdays). */
  unexpected: number;
  /** With --max-gap: the gaps between instants; otherwise absent. */
  gaps?: InstantGapReport[];
}

/** The summary of a gaps run: its row accounting (as rebin's), and what was found. */
export interface GapsSummary extends RowAccounting {
  localTime: { nonexistent: number; repeated: number };
  timeFormat: { id: string; label: string; kind: 'instant' | 'local' | 'period' };
}

/** The result of a gaps run. */
export interface GapsResult {
  /** The expected periods' unit (null with --max-gap). */
  unit: UnitName | null;
  step: number;
  zone: string;
  /** How the unit was chosen: 'given' (--unit), the values' notation, or the detected grain. */
  unitBasis: string;
  weekdays: boolean;
  skippedDates: number;
  maxGap: string | null;
  /** Whether periods with several rows were reported as duplicates. */
  duplicatesReported: boolean;
  series: GapSeries[];
  /** True when any series has a missing period, a duplicate or a gap over --max-gap. */
  problems: boolean;
  summary: GapsSummary;
}
