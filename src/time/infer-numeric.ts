// Evidence for numeric day-month dates (05/04/2021). A first field above 12 can only be a day, so it is
// day-first evidence; a second field above 12 is month-first evidence. No evidence either way is
// ambiguous and is never guessed; evidence both ways (a column that changes order) is a conflict.
import { QuernError } from '../errors.js';
import { newNumericFields, scanNumericFields } from './daymonth.js';
import { skipBlanks, trimEnd } from './iso.js';
import { type TimeFormat, type TimeFormatId, timeFormat } from './format.js';
import type { Candidate, InferHints, InferStatus } from './infer-types.js';

/** What one family of formats found in the sample. */
export interface FamilyResult {
  status: InferStatus;
  chosen: Candidate | null;
  candidates: Candidate[];
  reason: string | null;
  evidence: string[];
}

interface Tally {
  dm: number; // values shaped d/m/y or m/d/y
  ymd: number;
  dayFirst: number[]; // sample positions with a first field above 12
  monthFirst: number[]; // sample positions with a second field above 12
  twoDigitYears: number;
  oneDigit: boolean;
  seps: Map<string, number>;
  withTime: number;
}

function tally(values: readonly string[]): Tally {
  const f = newNumericFields();
  const t: Tally = { dm: 0, ymd: 0, dayFirst: [], monthFirst: [], twoDigitYears: 0, oneDigit: false, seps: new Map(), withTime: 0 };
  values.forEach((v, k) => {
    const i = skipBlanks(v, 0, v.length);
    const end = trimEnd(v, i, v.length);
    if (!scanNumericFields(v, i, end, f)) return;
    if (f.pos < end) t.withTime++;
    const sep = String.fromCharCode(f.sep);
    if (f.n1 === 4 && f.n3 <= 2) {
      if (sep === '-') return; // 2021-04-05 is ISO 8601, read by the ISO family
      t.ymd++;
    } else if (f.n1 <= 2 && (f.n3 === 4 || f.n3 === 2)) {
      t.dm++;
      if (f.f1 > 12 && f.f1 <= 31) t.dayFirst.push(k);
      if (f.f2 > 12 && f.f2 <= 31) t.monthFirst.push(k);
      if (f.n3 === 2) t.twoDigitYears++;
      if (f.n1 === 1 || f.n2 === 1) t.oneDigit = true;
    } else return;
    t.seps.set(sep, (t.seps.get(sep) ?? 0) + 1);
  });
  return t;
}

function patternOf(id: TimeFormatId, sep: string, t: Tally): string {
  const d = t.oneDigit ? 'd' : 'dd';
  const m = t.oneDigit ? 'M' : 'MM';
  const y = t.twoDigitYears > 0 ? 'yy' : 'yyyy';
  const date = id === 'day-month-year' ? `${d}${sep}${m}${sep}${y}` : id === 'month-day-year' ? `${m}${sep}${d}${sep}${y}` : `yyyy${sep}MM${sep}dd`;
  return t.withTime > 0 ? `${date} HH:mm` : date;
}

function makeFormat(id: TimeFormatId, t: Tally, hints: InferHints): TimeFormat {
  const sep = [...t.seps.entries()].sort((a, b) => b[1] - a[1])[0]?.[0] ?? '/';
  const words = id === 'day-month-year' ? 'day/month/year' : id === 'month-day-year' ? 'month/day/year' : 'year/month/day';
  const code = id === 'day-month-year' ? 'DD/MM/YYYY' : id === 'month-day-year' ? 'MM/DD/YYYY' : 'YYYY/MM/DD';
  const label = `${words.replaceAll('/', sep)} (${code.replaceAll('/', sep)})`;
  const extra: Partial<TimeFormat> = { label, separator: sep, pattern: patternOf(id, sep, t) };
  if (hints.twoDigitYearPivot !== undefined) extra.twoDigitYearPivot = hints.twoDigitYearPivot;
  return timeFormat(id, extra);
}

function positions(list: number[]): string {
  const shown = list.slice(0, 3).map((k) => `#${k + 1}`).join(', ');
  return list.length > 3 ? `${shown}, …` : shown;
}

function changeOrder(t: Tally): string {
  const lastDay = t.dayFirst[t.dayFirst.length - 1]!;
  const firstMonth = t.monthFirst[0]!;
  const lastMonth = t.monthFirst[t.monthFirst.length - 1]!;
  const firstDay = t.dayFirst[0]!;
  if (lastDay < firstMonth) return `; the order changes part way: day-first up to value #${lastDay + 1}, month-first from value #${firstMonth + 1}`;
  if (lastMonth < firstDay) return `; the order changes part way: month-first up to value #${lastMonth + 1}, day-first from value #${firstDay + 1}`;
  return '; the two orders are interleaved';
}

function decide(t: Tally, hints: InferHints): { id: TimeFormatId | null; status: InferStatus; reason: string | null; evidence: string[] } {
  const nd = t.dayFirst.length;
  const nm = t.monthFirst.length;
  const dayWords = `${nd} value${nd === 1 ? ' has' : 's have'} a first field above 12 (${positions(t.dayFirst)}), which only a day-first reading allows`;
  const monthWords = `${nm} value${nm === 1 ? ' has' : 's have'} a second field above 12 (${positions(t.monthFirst)}), which only a month-first reading allows`;
  if (hints.dayFirst === true) {
    if (nm > 0) return { id: 'day-month-year', status: 'conflict', reason: `the column was declared day-first, but ${monthWords}`, evidence: [] };
    return { id: 'day-month-year', status: 'ok', reason: null, evidence: ['day-first as declared (dayFirst)'] };
  }
  if (hints.monthFirst === true) {
    if (nd > 0) return { id: 'month-day-year', status: 'conflict', reason: `the column was declared month-first, but ${dayWords}`, evidence: [] };
    return { id: 'month-day-year', status: 'ok', reason: null, evidence: ['month-first as declared (monthFirst)'] };
  }
  if (nd > 0 && nm > 0) return { id: null, status: 'conflict', reason: `${dayWords}, and ${monthWords}${changeOrder(t)}`, evidence: [] };
  if (nd > 0) return { id: 'day-month-year', status: 'ok', reason: null, evidence: [`${dayWords}, so the column is day-first`] };
  if (nm > 0) return { id: 'month-day-year', status: 'ok', reason: null, evidence: [`${monthWords}, so the column is month-first`] };
  return {
    id: null,
    status: 'ambiguous',
    reason: `every first and second field of the ${t.dm} numeric dates is 12 or below, so a value such as 05/04/2021 could be 5 April or May 4; say whether the column is day-first or month-first`,
    evidence: [],
  };
}

/** Infers numeric day-month(-year) formats; `count` returns how many values a format reads. */
export function inferNumeric(values: readonly string[], hints: InferHints, count: (f: TimeFormat) => number): FamilyResult | null {
  if (hints.dayFirst === true && hints.monthFirst === true) {
    throw new QuernError('E_USAGE', 'a column cannot be both day-first and month-first', 'give one of dayFirst or monthFirst');
  }
  const t = tally(values);
  if (t.dm === 0 && t.ymd === 0) return null;
  const evidence: string[] = [];
  if (t.seps.size > 1) evidence.push(`the separators differ between values (${[...t.seps.keys()].join(' ')})`);
  if (t.twoDigitYears > 0 && hints.twoDigitYearPivot === undefined) {
    evidence.push(`${t.twoDigitYears} values have two-digit years, which are not read without a two-digit-year pivot`);
  }
  if (t.ymd > t.dm) {
    const format = makeFormat('year-month-day', t, hints);
    const chosen = { format, matched: count(format), evidence: `${t.ymd} values start with a four-digit year, so the column is year/month/day` };
    return { status: 'ok', chosen, candidates: [], reason: null, evidence: [chosen.evidence, ...evidence] };
  }
  const d = decide(t, hints);
  const dmy = makeFormat('day-month-year', t, hints);
  const mdy = makeFormat('month-day-year', t, hints);
  const both: Candidate[] = [
    { format: dmy, matched: count(dmy), evidence: 'day-first reading' },
    { format: mdy, matched: count(mdy), evidence: 'month-first reading' },
  ];
  if (d.id === null) return { status: d.status, chosen: null, candidates: both, reason: d.reason, evidence };
  const chosen = d.id === 'day-month-year' ? both[0]! : both[1]!;
  chosen.evidence = d.evidence[0] ?? chosen.evidence;
  const others = both.filter((c) => c !== chosen);
  return { status: d.status, chosen, candidates: others, reason: d.reason, evidence: [...d.evidence, ...evidence] };
}
