// Fiscal-year labels (FY2022) are read by the calendar engine, the only home of fiscal rules: one
// calendar per format (zone UTC, so its bounds are wall-clock milliseconds), never one per value.
import { makeCalendar } from '../calendar/index.js';
import type { FiscalStart, CalendarOptions } from '../calendar/types.js';
import type { TimeParser } from './parser.js';
import { notRecognised } from './scan.js';

/**
 * A parser of fiscal-year labels under one convention (default: starts October 1, named by the calendar
 * year in which it ends — US federal, 31 U.S.C. §1102). Throws QuernError('E_UNIT') for a bad fiscal start.
 */
export function makeFiscalYearParser(start: FiscalStart | undefined, label: 'end' | 'start' | undefined): TimeParser {
  const options: CalendarOptions = { unit: 'fiscal-year', zone: 'UTC' };
  if (start !== undefined) options.fiscalStart = start;
  if (label !== undefined) options.fiscalLabel = label;
  const calendar = makeCalendar(options);
  return (text, out) => {
    if (text.trim() === '') return 'empty: the value is empty';
    const p = calendar.tryParseLabel(text);
    if (p === null) return notRecognised(text, 'a fiscal-year label such as FY2022');
    out.kind = 'period';
    out.unit = 'fiscal-year';
    out.ms = p.start;
    out.endMs = p.end;
    out.offset = NaN;
    out.leapSecond = false;
    return null;
  };
}
