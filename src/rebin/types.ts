// Plain data of a rebin: its options and its result, printed by `--format json` as they are.
import type { CalendarOptions, UnitName } from '../calendar/types.js';
import type { Diagnostic } from '../errors.js';
import type { AccumulatorLimits } from './accumulate.js';
import type { AggSpec } from './aggregates.js';
import type { AssignPolicy } from './period-source.js';
import type { QuantileType } from '../bins/quantile.js';

/** What `rebin` is asked to do. */
export interface RebinOptions {
  /** The time column. */
  time: string;
  /** The target calendar (unit, step, zone, week start, fiscal start and label). */
  calendar: CalendarOptions;
  /** Aggregates; default [count]. */
  aggregates?: readonly AggSpec[];
  /** Group columns (`--by`), in order. */
  by?: readonly string[];
  /** Fill empty periods between the first and last (default true). */
  fill?: boolean;
  /** First and last period to include: the periods holding these instants; null for the data's own. */
  from?: number | null;
  until?: number | null;
  /** Most periods fill may build; default `defaultMaxPeriods(unit, step)`. */
  maxPeriods?: number;
  /** Policy for source periods that straddle a target boundary; null: none chosen (an error if needed). */
  assign?: AssignPolicy | null;
  /** The unit each source value names when it is a date standing for a longer period (a week-ending date). */
  sourceUnit?: UnitName | null;
  /** Whether such a date is the first day ('start', default) or the last day ('end') of its period. */
  sourceAnchor?: 'start' | 'end';
  /** Time format id to use instead of inferring one from the first rows (e.g. 'day-month-year'). */
  timeFormat?: string | null;
  /** How numeric day-month dates are ordered (05/04/2021), when the values alone cannot tell. */
  dayOrder?: 'day-first' | 'month-first' | null;
  /** Hyndman–Fan quantile type for median and pNN; default 7. */
  quantileType?: QuantileType;
  limits?: Partial<AccumulatorLimits>;
  /** How many rejected-value examples to keep; default 5. */
  maxExamples?: number;
}

/** One output row: a period, its group, its aggregates (null where empty). */
export interface RebinRow {
  period: string;
  /** Local ISO 8601 date-time with offset of the period's first instant. */
  start: string;
  /** Local ISO 8601 date-time with offset of the first instant after the period (exclusive). */
  end: string;
  /** Values of the group columns, in `groupColumns` order. */
  group: string[];
  /** Aggregates in `aggregates` order; null for an empty aggregate. */
  values: (number | null)[];
  /** True when no source row fell in this period and group (the row was filled). */
  filled: boolean;
}

/** Accounting of one measure column. */
export interface MeasureSummary {
  column: string;
  /** Used rows whose value was a number (or, for distinct-only columns, non-empty). */
  valid: number;
  empty: number;
  rejected: number;
  rejectedByReason: Record<string, number>;
}

/** Row accounting shared by rebin and gaps: rowsRead = rowsUsed + rowsEmpty + rowsRejected + rowsOutside. */
export interface RowAccounting {
  file: string;
  rowsRead: number;
  /** Rows that went into a period. */
  rowsUsed: number;
  /** Rows whose time value is empty. */
  rowsEmpty: number;
  /** Rows rejected (by the reader or for their time value), by reason. */
  rowsRejected: number;
  rejectedByReason: Record<string, number>;
  /** Rows outside --from/--until. */
  rowsOutside: number;
  /** The first few rejected rows and values. */
  examples: Diagnostic[];
}

/** The summary of a rebin: its row accounting, and what was built. */
export interface RebinSummary extends RowAccounting {
  /** Periods in the output (filled ones included). */
  periods: number;
  groups: number;
  /** Output rows with no source row (filled). */
  filledRows: number;
  /** Readings without an offset that a daylight-saving change skips or repeats, and the rule applied. */
  localTime: { nonexistent: number; repeated: number; rule: string };
  /** How the time values were read. */
  timeFormat: { id: string; label: string; kind: 'instant' | 'local' | 'period' };
  /** For source values that are periods: their unit, how many straddle a target boundary, the policy. */
  sourcePeriods: { unit: string | null; rows: number; straddling: number; policy: AssignPolicy | null } | null;
  measures: MeasureSummary[];
  /** Plain-words remarks (e.g. periods cut in UTC although the values carry another offset). */
  notes: string[];
}

/** The result of a rebin. */
export interface RebinResult {
  unit: UnitName;
  step: number;
  zone: string;
  weekStart: number;
  fiscalStart: { month: number; day: number };
  fiscalLabel: 'end' | 'start';
  quantileType: QuantileType;
  /** All output columns: period, start, end, group columns, aggregates. */
  columns: string[];
  groupColumns: string[];
  aggregates: string[];
  rows: RebinRow[];
  summary: RebinSummary;
}
