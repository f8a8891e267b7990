// Plain data types of ranges: numeric or temporal (epoch or wall-clock milliseconds) intervals whose
// ends are each closed or open, possibly unbounded, possibly discrete (integers).

/**
 * A range of numbers. `low: null` is unbounded below and `high: null` unbounded above (the matching
 * closed flag is then false). A discrete range holds whole numbers only and is kept half-open on
 * integer bounds, [low, high): the label 0-4 is { low: 0, high: 5, lowClosed: true, highClosed: false }.
 */
export interface Range {
  low: number | null;
  high: number | null;
  lowClosed: boolean;
  highClosed: boolean;
  discrete: boolean;
}

/** How the two ends of a written range are read when the label does not say (a-b, start/end columns). */
export type EndsRule =
  | 'auto' // integers are discrete (0-4 holds 0..4), other numbers half-open, whole days inclusive, date-times half-open
  | 'discrete' // both ends inclusive whole units: a-b holds a..b
  | 'closed' // [a, b]
  | 'half-open' // [a, b)
  | 'open-closed'; // (a, b]

/** One written time endpoint as an injected time parser reads it. */
export interface TimeEndpoint {
  /** First instant of the written value (epoch or wall-clock milliseconds). */
  start: number;
  /** End (exclusive) of the written value when it names a whole unit (a day, a month); else = start. */
  end: number;
  /** True when the text names a whole unit (2021-03-31) rather than an instant (2021-03-31T08:00Z). */
  whole: boolean;
}

/**
 * Temporal endpoints come in through this injected reader, so the range model depends on no calendar:
 * the CLI builds it from the project's time parser and calendar.
 */
export interface TimeEndpoints {
  /** Reads one endpoint (a date, a date-time); null when the text is not one. */
  read(text: string): TimeEndpoint | null;
  /** Reads a calendar-period label (2021-Q1, 2024-W07) as [start, end); null when it is not one. */
  period?(text: string): { start: number; end: number } | null;
  /** Adds (sign 1) or subtracts (sign -1) an ISO 8601 duration (P3M); null when it cannot. */
  addDuration?(ms: number, duration: string, sign: 1 | -1): number | null;
  /** Writes a temporal range as a label that `read`/`period` read back (ISO 8601 interval). */
  format?(range: Range): string;
}

/** Options of label parsing. */
export interface RangeLabelOptions {
  ends?: EndsRule;
  time?: TimeEndpoints;
}

/** The thirteen relations of J. F. Allen, "Maintaining knowledge about temporal intervals", CACM 26(11), 1983. */
export type AllenRelation =
  | 'before' | 'after'
  | 'meets' | 'met-by'
  | 'overlaps' | 'overlapped-by'
  | 'starts' | 'started-by'
  | 'during' | 'contains'
  | 'finishes' | 'finished-by'
  | 'equals';
