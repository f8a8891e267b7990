// Trade notations that name periods: quarters (2021-Q2, 2021Q2, 2021 Q2, Q2 2021), halves (2021-H1,
// 2021H1, H1 2021), epidemiological weeks in quern's label notation (2024-EW07: Sunday-start weeks, week 1
// the first with at least four days in the year — CDC MMWR week) and fiscal years (FY2022, read by the
// calendar engine). Values are read by char codes; bounds are wall-clock milliseconds, end exclusive.
import { daysFromCivil, epiWeekYearStart, epiWeeksInYear, MS_PER_DAY } from '../calendar/civil.js';
import type { FiscalStart, UnitName } from '../calendar/types.js';
import type { ParsedTime } from './types.js';
import type { TimeFormatId } from './format.js';
import type { TimeParser } from './parser.js';
import { readDigits, countDigits, notRecognised, pad2 } from './scan.js';
import { skipBlanks, trimEnd } from './iso.js';
import { makeFiscalYearParser } from './fiscal.js';
import { QuernError } from '../errors.js';

/** Fills `out` with the period [startDays, endDays) of `unit`. */
export function setPeriod(out: ParsedTime, unit: UnitName, startDays: number, endDays: number): null {
  out.kind = 'period';
  out.unit = unit;
  out.ms = startDays * MS_PER_DAY;
  out.endMs = endDays * MS_PER_DAY;
  out.offset = NaN;
  out.leapSecond = false;
  return null;
}

function monthStart(year: number, month0: number): number {
  return daysFromCivil(year + Math.floor(month0 / 12), (month0 % 12) + 1, 1);
}

/**
 * Reads "YYYY-Xn", "YYYYXn", "YYYY Xn" or "Xn YYYY" where X is `letter` (Q or H, either case) and n one digit.
 * Returns year * 10 + n, or -1 when the text is not of that shape.
 */
function yearLetterNumber(s: string, letter: number, i: number, end: number): number {
  const lower = letter | 32;
  const first = s.charCodeAt(i);
  if (first === letter || first === lower) {
    const n = readDigits(s, i + 1, 1, end);
    const c = s.charCodeAt(i + 2);
    if (n < 0 || (c !== 32 && c !== 45)) return -1;
    const y = readDigits(s, i + 3, 4, end);
    return y < 0 || i + 7 !== end ? -1 : y * 10 + n;
  }
  const y = readDigits(s, i, 4, end);
  if (y < 0) return -1;
  let p = i + 4;
  const c = s.charCodeAt(p);
  if (c === 45 || c === 32) p++;
  const l = s.charCodeAt(p);
  if (l !== letter && l !== lower) return -1;
  const n = readDigits(s, p + 1, 1, end);
  return n < 0 || p + 2 !== end ? -1 : y * 10 + n;
}

function quarterInto(s: string, out: ParsedTime): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  const v = yearLetterNumber(s, 81, i, end);
  if (v < 0) return notRecognised(s, 'a quarter such as 2021-Q2, 2021Q2 or Q2 2021');
  const y = Math.floor(v / 10);
  const q = v % 10;
  if (q < 1 || q > 4) return `invalid-quarter: quarter ${q} does not exist; quarters run Q1 to Q4`;
  return setPeriod(out, 'quarter', monthStart(y, (q - 1) * 3), monthStart(y, q * 3));
}

function halfInto(s: string, out: ParsedTime): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  const v = yearLetterNumber(s, 72, i, end);
  if (v < 0) return notRecognised(s, 'a half-year such as 2021-H1 or H1 2021');
  const y = Math.floor(v / 10);
  const h = v % 10;
  if (h < 1 || h > 2) return `invalid-half: half ${h} does not exist; halves are H1 and H2`;
  return setPeriod(out, 'half', monthStart(y, (h - 1) * 6), monthStart(y, h * 6));
}

/** Epidemiological week label YYYY-EWww (the calendar's notation, never mistaken for an ISO week). */
function epiWeekInto(s: string, out: ParsedTime): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  const y = readDigits(s, i, 4, end);
  const ok = y >= 0 && s.charCodeAt(i + 4) === 45 && (s.charCodeAt(i + 5) | 32) === 101 && (s.charCodeAt(i + 6) | 32) === 119;
  const w = ok ? readDigits(s, i + 7, 2, end) : -1;
  if (w < 0 || countDigits(s, i + 7, end) !== 2 || i + 9 !== end) return notRecognised(s, 'an epidemiological week such as 2024-EW07');
  const weeks = epiWeeksInYear(y);
  if (w < 1 || w > weeks) return `invalid-week: epidemiological year ${y} has ${weeks} weeks, so week ${pad2(w)} does not exist`;
  const start = epiWeekYearStart(y) + (w - 1) * 7;
  return setPeriod(out, 'epi-week', start, start + 7);
}

/** Options of trade-notation parsers. */
export interface TradeOptions {
  fiscalStart?: FiscalStart | undefined;
  fiscalLabel?: 'end' | 'start' | undefined;
}

/** The parser of a trade-notation format id (quarter, half, epi-week, fiscal-year). */
export function makeTradeParser(id: TimeFormatId, options: TradeOptions): TimeParser {
  if (id === 'quarter') return quarterInto;
  if (id === 'half') return halfInto;
  if (id === 'epi-week') return epiWeekInto;
  if (id === 'fiscal-year') return makeFiscalYearParser(options.fiscalStart, options.fiscalLabel);
  throw new QuernError('E_INTERNAL', `no trade-notation parser for format ${id}`);
}
