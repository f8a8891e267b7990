// makeTimeParser: compiles a column's format once into a function that reads one value into a reusable
// ParsedTime without allocating on success. Scratch records live in the closure, made once per parser.
import { QuernError } from '../errors.js';
import type { ParsedTime } from './types.js';
import { type TimeFormat, type TimeFormatId, isTimeFormatId, timeFormat } from './format.js';
import { newScan } from './scan.js';
import { parseIsoInto } from './iso.js';
import { parseIntervalInto } from './interval.js';
import { emptyDuration } from './duration.js';
import { parseEpochInto } from './epoch.js';
import { parseSerialInto } from './serial.js';
import { parseNumericDateInto, newNumericFields } from './daymonth.js';
import { makeTradeParser } from './trade.js';
import { makeMonthNameParser } from './monthname.js';
import type { FiscalStart } from '../calendar/types.js';

/** Reads one value into `out`; returns null on success, else a stable reason code and plain words. */
export type TimeParser = (text: string, out: ParsedTime) => string | null;

/** Options of a parser; each overrides the same field of the format. */
export interface TimeParserOptions {
  /** First year of the 100-year window two-digit years are read in; without it two-digit years are invalid. */
  twoDigitYearPivot?: number;
  /** Fiscal-year start for 'fiscal-year' labels (default October 1, US federal). */
  fiscalStart?: FiscalStart;
  /** Fiscal years named by the calendar year in which they end (default) or start. */
  fiscalLabel?: 'end' | 'start';
  /**
   * For ISO formats: reject values of another kind than the format's (a date in a column of offset
   * date-times, a date-time without offset among offset ones) with reason 'other-kind'. Default false:
   * every ISO 8601 date or date-time is read and `out.kind` says what each value was.
   */
  strictKind?: boolean;
}

function isoParser(format: TimeFormat, strict: boolean): TimeParser {
  const sc = newScan();
  if (!strict) return (text, out) => parseIsoInto(text, out, sc);
  const want = format.kind;
  return (text, out) => {
    const r = parseIsoInto(text, out, sc);
    if (r !== null || out.kind === want) return r;
    return `other-kind: the value is ${kindWords(out.kind)} but the column holds ${format.label} values`;
  };
}

function kindWords(kind: string): string {
  return kind === 'instant' ? 'a date-time with an offset' : kind === 'local' ? 'a date-time without an offset' : 'a date or period';
}

function numericParser(format: TimeFormat, pivot: number | undefined): TimeParser {
  const sc = newScan();
  const f = newNumericFields();
  const order = format.id === 'day-month-year' ? 'dmy' : format.id === 'month-day-year' ? 'mdy' : 'ymd';
  const sep = format.separator !== undefined && format.separator.length === 1 ? format.separator.charCodeAt(0) : 0;
  return (text, out) => parseNumericDateInto(text, order, pivot, sep, out, sc, f);
}

function checkPivot(pivot: number | undefined): void {
  if (pivot !== undefined && !(Number.isInteger(pivot) && pivot >= 0 && pivot <= 9900)) {
    throw new QuernError('E_USAGE', `two-digit-year pivot ${pivot} is not a year`, 'give the first year of the window, such as 1950');
  }
}

/**
 * Compiles a format (or a format id with catalogue defaults) into a parser. The ISO 8601 formats share one
 * allocation-free path by char codes; no regular expression, Date or luxon runs per value.
 * Throws QuernError('E_USAGE') for an unknown format id or a bad option.
 */
export function makeTimeParser(format: TimeFormat | TimeFormatId | string, options: TimeParserOptions = {}): TimeParser {
  if (typeof format === 'string') {
    if (!isTimeFormatId(format)) throw new QuernError('E_USAGE', `unknown time format ${JSON.stringify(format)}`, 'see the format ids in the documentation of inferTimeFormat');
    format = timeFormat(format);
  }
  const pivot = options.twoDigitYearPivot ?? format.twoDigitYearPivot;
  checkPivot(pivot);
  const id = format.id;
  if (id === 'iso-interval') {
    const x = { a: newScan(), b: newScan(), d: emptyDuration(), civil: [0, 0, 0] };
    return (text, out) => parseIntervalInto(text, out, x);
  }
  if (id.startsWith('iso-')) return isoParser(format, options.strictKind === true);
  if (id === 'day-month-year' || id === 'month-day-year' || id === 'year-month-day') return numericParser(format, pivot);
  if (id.startsWith('epoch-')) {
    const unit = format.epochUnit ?? 'auto';
    return (text, out) => parseEpochInto(text, unit, out);
  }
  if (id === 'serial-1900' || id === 'serial-1904') {
    const system = id === 'serial-1900' ? '1900' : '1904';
    return (text, out) => parseSerialInto(text, system, out);
  }
  if (id === 'month-name-year' || id === 'month-name-day-year' || id === 'day-month-name-year') {
    return makeMonthNameParser(id, pivot);
  }
  return makeTradeParser(id, {
    fiscalStart: options.fiscalStart ?? format.fiscalStart,
    fiscalLabel: options.fiscalLabel ?? format.fiscalLabel,
  });
}
