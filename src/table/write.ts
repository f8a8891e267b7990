// Encoding rows for output: RFC 4180 CSV cells with spreadsheet-formula neutralisation, and NDJSON lines.

export interface CsvWriteOptions {
  /** Field delimiter; default ','. */
  delimiter?: string;
  /** Neutralise cells a spreadsheet would run as a formula; default true. Turn off only for trusted pipelines. */
  neutraliseFormulas?: boolean;
  /** Line end; default '\n' (common practice on Unix pipelines); RFC 4180 §2.1 names CRLF. */
  lineEnd?: '\n' | '\r\n';
}

// OWASP CSV Injection (www-community pages/attacks/CSV_Injection.md): cells starting with
// = + - @ TAB CR or LF can be run as formulas by spreadsheet programs.
const FORMULA_START = /^[=+\-@\t\r\n]/;
// A plain decimal number, optionally signed and with an exponent: stays a number (-5, +3.2, -1e5, -.5).
const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** True when a spreadsheet opening the cell could run it as a formula (OWASP CSV Injection). */
export function isFormulaLike(value: string): boolean {
  return FORMULA_START.test(value) && !PLAIN_NUMBER.test(value);
}

/**
 * One CSV cell. Quotes the value when it holds the delimiter, a quote, CR or LF, doubling inner quotes
 * (RFC 4180 §2.6–2.7). A formula-like value is prefixed with `'` and quoted, as OWASP recommends
 * (`=1+2";=1+2` → `"'=1+2"";=1+2"`), unless `neutraliseFormulas` is false.
 */
export function csvCell(value: string, options: CsvWriteOptions = {}): string {
  const delimiter = options.delimiter ?? ',';
  if ((options.neutraliseFormulas ?? true) && isFormulaLike(value)) {
    return `"'${value.replaceAll('"', '""')}"`;
  }
  if (value.includes(delimiter) || value.includes('"') || value.includes('\n') || value.includes('\r')) {
    return `"${value.replaceAll('"', '""')}"`;
  }
  return value;
}

/** One CSV record with its line end. */
export function csvRow(values: readonly string[], options: CsvWriteOptions = {}): string {
  const delimiter = options.delimiter ?? ',';
  let out = '';
  for (let i = 0; i < values.length; i++) {
    if (i > 0) out += delimiter;
    out += csvCell(values[i]!, options);
  }
  return out + (options.lineEnd ?? '\n');
}

/** A value as JSON keeps it: NaN and ±Infinity (which JSON cannot hold) become their names as strings. */
function jsonSafe(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && !Number.isFinite(value)) return String(value);
  if (value === undefined) return null;
  return value;
}

/** One NDJSON line: the record as JSON on one line, then LF. Undefined values are written as null. */
export function ndjsonLine(record: Readonly<Record<string, unknown>>): string {
  return `${JSON.stringify(record, jsonSafe)}\n`;
}
