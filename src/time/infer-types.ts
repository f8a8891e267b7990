// Plain data types of time-format inference.
import type { FiscalStart } from '../calendar/types.js';
import type { TimeFormat, EpochUnit } from './format.js';

/** What the caller knows about a column; every field optional. */
export interface InferHints {
  /** Numeric day-month dates are day first (05/04/2021 = 5 April). */
  dayFirst?: boolean;
  /** Numeric day-month dates are month first (05/04/2021 = May 4). */
  monthFirst?: boolean;
  /** Read numbers as spreadsheet serial day numbers of this ECMA-376 date system. */
  serial?: '1900' | '1904';
  /** Read numbers as epoch numbers of this unit ('auto': told per value by its digit count). */
  epochUnit?: EpochUnit | 'auto';
  /** First year of the 100-year window two-digit years are read in; without it two-digit years are not read. */
  twoDigitYearPivot?: number;
  /** The column's name: a name such as "visit_date" lets a serial-day range count as evidence. */
  columnName?: string;
  fiscalStart?: FiscalStart;
  fiscalLabel?: 'end' | 'start';
}

/** One format that reads (part of) the sample, with the evidence for it in plain words. */
export interface Candidate {
  format: TimeFormat;
  /** Number of non-empty sample values it reads. */
  matched: number;
  evidence: string;
}

/**
 * The outcome: 'ok' (a format was chosen), 'ambiguous' (formats fit equally and the sample gives no
 * evidence — never guessed), 'conflict' (the values contradict one another, e.g. day-first in some rows and
 * month-first in others) or 'none' (no time format reads the values).
 */
export type InferStatus = 'ok' | 'ambiguous' | 'conflict' | 'none';

export interface InferResult {
  status: InferStatus;
  /** The chosen format; null unless status is 'ok'. */
  format: TimeFormat | null;
  /** Number of non-empty sample values the chosen format reads (0 when none was chosen). */
  matched: number;
  /** Number of non-empty sample values. */
  total: number;
  /** Number of empty (blank) sample values, not counted in `total`. */
  empty: number;
  /** The evidence in plain words, one sentence each. */
  evidence: string[];
  /** Why no format was chosen (ambiguous, conflict, none); null when status is 'ok'. */
  reason: string | null;
  /** Other formats that read part or all of the sample, best first. */
  candidates: Candidate[];
  /** First few values the chosen format does not read, with the reason. */
  rejected: { value: string; reason: string }[];
}
