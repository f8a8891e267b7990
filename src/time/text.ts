// parseTimeText: one value typed on a command line (VALUE of `quern period`, --from, --until), read under
// the single format its text fits. Misuse, not data: an unreadable value throws QuernError('E_VALUE').
import { QuernError } from '../errors.js';
import { type ParsedTime, emptyParsedTime } from './types.js';
import { inferTimeFormat } from './infer.js';
import type { InferHints } from './infer-types.js';
import { makeTimeParser } from './parser.js';

/** The ISO parser's reason for text that looks like ISO 8601 but is invalid (2021-02-29), else null. */
function isoReason(text: string): string | null {
  const r = makeTimeParser('iso-date')(text, emptyParsedTime());
  return r !== null && !r.startsWith('not-recognised') && !r.startsWith('empty') ? r : null;
}

/**
 * Parses a single time value typed by a user: any ISO 8601 date, date-time, week, ordinal date, year-month,
 * year or interval; a quarter, half, epidemiological week or fiscal year; a date with an English month
 * name; a numeric day-month date when its fields or the hints settle the order; an epoch number or serial
 * only when the hints ask for one. Throws QuernError('E_VALUE') naming the value otherwise.
 */
export function parseTimeText(text: string, hints: InferHints = {}): ParsedTime {
  const shown = JSON.stringify(text);
  const result = inferTimeFormat([text], hints);
  const numberWithoutHint = /^\s*[-+]?\d+(\.\d+)?\s*$/.test(text) && hints.epochUnit === undefined && hints.serial === undefined
    && !(result.format !== null && result.format.id.startsWith('iso-'));
  if (result.format === null || numberWithoutHint) {
    const hint = result.status === 'ambiguous'
      ? 'add --day-first or --month-first, or write the date as YYYY-MM-DD'
      : 'write a date such as 2024-03-10, a date-time such as 2024-03-10T08:15:00-05:00, or a label such as 2024-W10 or 2024-Q1';
    const why = numberWithoutHint ? 'a bare number needs to be declared an epoch number or serial day' : isoReason(text) ?? result.reason ?? 'it is not a date, date-time or period';
    throw new QuernError('E_VALUE', `${shown} is not a time value quern can read: ${why}`, hint);
  }
  const parser = makeTimeParser(result.format, hints.twoDigitYearPivot !== undefined ? { twoDigitYearPivot: hints.twoDigitYearPivot } : {});
  const out = emptyParsedTime();
  const r = parser(text, out);
  if (r !== null) {
    throw new QuernError('E_VALUE', `${shown} is not a valid time value: ${r}`, 'check the date exists (month 01-12, the days of that month)');
  }
  return out;
}
