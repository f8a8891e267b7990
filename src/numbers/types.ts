// Plain data types of number parsing: a column's number format and the reusable out-record of a parse.

/** The character that marks decimals. */
export type DecimalMark = '.' | ',';

/**
 * The character that groups thousands. ' ' stands for every space a writer may use (U+0020, the
 * no-break space U+00A0 and the narrow no-break space U+202F, as CLDR locales do); "'" stands for the
 * apostrophe and the right single quotation mark U+2019 (Swiss usage).
 */
export type GroupMark = ',' | '.' | ' ' | "'";

/** How a column writes numbers, decided once from evidence in the column (see inferNumberFormat). */
export interface NumberFormat {
  decimal: DecimalMark;
  /** Thousands separator accepted between groups of three digits; null accepts none. */
  group: GroupMark | null;
  /**
   * True when the column uses a separator without saying whether it groups thousands or marks decimals
   * (only values like `1,234` were seen). Values whose reading depends on it are rejected with reason
   * 'ambiguous-separator' instead of being guessed.
   */
  unresolved: boolean;
  /** 'keep' reads `12%` as 12 (and flags it); 'fraction' reads it as 0.12. */
  percent: 'keep' | 'fraction';
  /** Whole-cell markers read as empty with reason 'missing-marker' (compared after trimming). */
  missing: readonly string[];
}

/** What a parse found: a number, an empty cell, or an invalid value with a reason. */
export type NumberStatus = 'ok' | 'empty' | 'invalid';

/** Stable reason codes of empty and invalid results. */
export type NumberReason =
  | 'blank' // empty or only spaces (empty)
  | 'missing-marker' // NA, N/A, null, - … (empty)
  | 'not-a-number' // NaN written out
  | 'infinite' // Infinity, inf, ∞ written out
  | 'out-of-range' // a finite-looking value beyond ±1.7976931348623157e308
  | 'malformed' // not a number at all
  | 'bad-grouping' // thousands separators not in groups of three
  | 'unexpected-separator' // a separator this column's format does not use
  | 'ambiguous-separator'; // 1,234 in a column that does not say what the comma is

/** A reusable out-record, filled by a NumberParser without allocating on the plain-decimal path. */
export interface ParsedNumber {
  status: NumberStatus;
  /** The number (NaN unless status is 'ok'); -0 reads as 0. */
  value: number;
  /** Why the value is empty or invalid; null when ok. */
  reason: NumberReason | null;
  /** The value carried a percent sign. */
  percent: boolean;
  /** The integer part has a leading zero (`007`): often a code, not a quantity. */
  leadingZero: boolean;
  /** The value used a thousands separator. */
  grouped: boolean;
}

/** A compiled parser for one number format. */
export interface NumberParser {
  readonly format: NumberFormat;
  /** Parses `text` into `out` and returns its status. */
  parse(text: string, out: ParsedNumber): NumberStatus;
}

/** What inferNumberFormat decided from a sample and the evidence it used. */
export interface NumberFormatInference {
  format: NumberFormat;
  /** 'plain': nothing but plain decimals; 'decided': separators settled by evidence; 'ambiguous': a
   *  separator was seen but nothing says what it means; 'conflict': both readings have evidence (the
   *  majority won and values of the other kind will be rejected). */
  decision: 'plain' | 'decided' | 'ambiguous' | 'conflict';
  /** Sample values that prove a dot (resp. a comma) marks decimals, and counts. */
  evidence: { dotDecimal: number; commaDecimal: number; examples: string[] };
  /** Sample values that parse under the format, are empty, or are invalid. */
  ok: number;
  empty: number;
  invalid: number;
  percent: number;
}
