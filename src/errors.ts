// One catalogue of misuse errors and data diagnostics, so every message follows one wording rule
// and the CLI can map each stable code to one exit status.

/** Stable codes for misuse: bad options, unknown units, unreadable files. Thrown as QuernError. */
export type ErrorCode =
  | 'E_USAGE' // a bad or missing option
  | 'E_UNIT' // an unknown calendar unit or an option that does not fit the unit
  | 'E_ZONE' // an unknown IANA zone or malformed offset
  | 'E_LABEL' // a period or range label that cannot be parsed
  | 'E_VALUE' // a command-line value that cannot be parsed (a date, a number, a duration)
  | 'E_FILE' // a missing, unreadable or non-regular input file
  | 'E_OUTPUT' // an output that cannot be written
  | 'E_HEADER' // duplicate or empty header names
  | 'E_COLUMN' // a named column that the table does not have
  | 'E_FORMAT' // a column whose values do not fit one format, or are ambiguous (day-first or month-first)
  | 'E_DATA' // the data makes the request impossible (an outlier that would build decades of periods…)
  | 'E_POLICY' // a rebin that needs a policy, or a policy that cannot apply (apportioning a mean)
  | 'E_INTERNAL'; // a bug in quern

/** A typed error for misuse and fatal input problems; `message` is one line, `hint` says what to do. */
export class QuernError extends Error {
  readonly code: ErrorCode;
  readonly hint: string | undefined;
  constructor(code: ErrorCode, message: string, hint?: string) {
    super(message);
    this.name = 'QuernError';
    this.code = code;
    this.hint = hint;
  }
}

/** True when `e` is a QuernError, optionally with the given code. */
export function isQuernError(e: unknown, code?: ErrorCode): e is QuernError {
  return e instanceof QuernError && (code === undefined || e.code === code);
}

/**
 * A data problem found in one value or row. Data problems are results, not exceptions: they are
 * counted in a summary and the first few are shown with file, line, column and value.
 */
export interface Diagnostic {
  /** Stable code such as 'ragged-row', 'invalid-date', 'undecodable-bytes'. */
  code: string;
  /** The input file as the user named it ('-' for standard input). */
  file: string;
  /** 1-based physical line number where the row starts. */
  line: number;
  /** Column name, when the problem sits in one column. */
  column?: string;
  /** The offending text, shortened to at most 80 characters. */
  value?: string;
  /** Plain-words explanation. */
  message: string;
}

/** Shortens a value for a diagnostic so a 10 MB field never floods the terminal. */
export function shortValue(text: string, max = 80): string {
  return text.length <= max ? text : `${text.slice(0, max - 1)}…`;
}

/** Formats a diagnostic as the one-line message the CLI prints: file:line: column "value": message. */
export function formatDiagnostic(d: Diagnostic): string {
  const where = `${d.file}:${d.line}`;
  const col = d.column !== undefined ? ` column ${JSON.stringify(d.column)}` : '';
  const val = d.value !== undefined ? ` value ${JSON.stringify(shortValue(d.value))}` : '';
  return `${where}:${col}${val}: ${d.message}`;
}
