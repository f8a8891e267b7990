// How the time column is read: a format named by the user, or one inferred from the first values.
import { QuernError } from '../errors.js';
import { isTimeFormatId, timeFormat } from '../time/format.js';
import type { TimeFormat } from '../time/format.js';
import { inferTimeFormat } from '../time/infer.js';
import type { InferHints } from '../time/infer-types.js';
import { makeTimeParser } from '../time/parser.js';
import { isoFastLane, makeTimeBytesParser } from '../time/bytes-parser.js';
import type { TimeBytesParser } from '../time/bytes-parser.js';
import type { TimeParserOptions } from '../time/parser.js';
import type { ParsedTime } from '../time/types.js';
import { isBlank } from './measures.js';

/** How the time column is read: a compiled parser and what it yields. */
export interface TimeReading {
  id: string;
  label: string;
  kind: 'instant' | 'local' | 'period';
  /** Fills `out`; returns null, or why the text is not a time of this format. */
  parse(text: string, out: ParsedTime): string | null;
  /** The same parser over UTF-8 bytes (same results and reasons), for byte batches. */
  parseBytes: TimeBytesParser;
  /** True when a value `fastIsoBytes` reads needs no other parse (src/time/bytes-parser.ts isoFastLane). */
  isoFast: boolean;
}

/** Inference hints from a column name and a stated day order. */
export function timeHints(column: string, dayOrder: 'day-first' | 'month-first' | null | undefined): InferHints {
  return { columnName: column, ...(dayOrder === 'day-first' ? { dayFirst: true } : dayOrder === 'month-first' ? { monthFirst: true } : {}) };
}

/** Splits a parser reason ("bad-day: February has 29 days in 2024") into its code and its words. */
export function splitReason(reason: string): { code: string; message: string } {
  const m = /^([a-z][a-z0-9-]*): ?(.*)$/s.exec(reason);
  return m ? { code: m[1]!, message: m[2]! } : { code: 'invalid-time', message: reason };
}

/**
 * The reading of a time column: the format `formatId` when given, else the one inferred from `sample`
 * (the column's first values). Throws QuernError 'E_FORMAT' when no format fits.
 */
export function timeReading(sample: readonly string[], formatId: string | null, options: TimeParserOptions & InferHints = {}): TimeReading {
  return timeReadingOf(inferTimeReadingFormat(sample, formatId, options), options);
}

/** The format of a time column: `formatId` when given (QuernError 'E_USAGE' if unknown), else inferred from `sample`. */
export function inferTimeReadingFormat(sample: readonly string[], formatId: string | null, options: TimeParserOptions & InferHints = {}): TimeFormat {
  return formatId !== null ? formatOf(formatId) : inferFormat(sample, options);
}

/** The reading of a time column written in `format` (a format of timeFormat or inferTimeFormat). */
export function timeReadingOf(format: TimeFormat, options: TimeParserOptions = {}): TimeReading {
  const parse = makeTimeParser(format, options);
  const parseBytes = makeTimeBytesParser(format, options);
  return { id: format.id, label: format.label, kind: format.kind, parse, parseBytes, isoFast: isoFastLane(format, options) };
}

function formatOf(id: string): TimeFormat {
  if (!isTimeFormatId(id)) {
    throw new QuernError('E_USAGE', `unknown time format ${JSON.stringify(id)}`, 'give a format id such as iso-date-time-offset, iso-date, epi-week or day-month-year');
  }
  return timeFormat(id);
}

// The format the first values are written in; never a guess (ambiguous day/month orders stop here).
function inferFormat(sample: readonly string[], hints: InferHints): TimeFormat {
  const r = inferTimeFormat(sample, hints, { stopAtFull: true });
  if (r.status === 'ok' && r.format !== null) return r.format;
  if (r.status === 'none' && r.total === 0) return timeFormat('iso-date-time-offset'); // no values at all
  const first = sample.find((v) => !isBlank(v)) ?? '';
  const hint = r.status === 'ambiguous'
    ? 'say which comes first with --day-first or --month-first (or write the dates as YYYY-MM-DD)'
    : 'name the format with --time-format (e.g. iso-date-time-offset, iso-date, epi-week, day-month-year)';
  throw new QuernError('E_FORMAT', `cannot tell how the time values are written (first: ${JSON.stringify(first)}): ${r.reason ?? r.status}`, hint);
}
