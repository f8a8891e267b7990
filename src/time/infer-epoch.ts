// Evidence for numbers that are times: epoch numbers told apart by their digit count (the bands that
// hold for 1973-03-03 … 2286-11-20: seconds 9–10 digits, milliseconds 12–13, microseconds 15–16,
// nanoseconds 18–19), and spreadsheet serial day numbers — only when asked for, or when the column's name
// says it holds dates and every value lies in the serial range of 1950–2099 (1900 system).
import { type TimeFormat, type EpochUnit, timeFormat, epochFormatId } from './format.js';
import { integerDigits, epochUnitOfDigits, epochUnitWords } from './epoch.js';
import type { Candidate, InferHints } from './infer-types.js';
import type { FamilyResult } from './infer-numeric.js';
import type { TimeParser } from './parser.js';
import { emptyParsedTime } from './types.js';

const DATE_NAME = /date|day|time|when|(^|_)dt($|_)|_on$|_at$/i;
const SERIAL_1950 = 18_264; // 1950-01-01 in the 1900 system (25569 = 1970-01-01, REFERENCES §3, minus 7305 days)
const SERIAL_2099 = 73_050; // 2099-12-31 in the 1900 system

/** "from 2023-10-01T00:00:00Z to 2024-12-31T23:00:00Z" over the values a parser reads. */
export function spanWords(values: readonly string[], parser: TimeParser): string {
  const out = emptyParsedTime();
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (parser(v, out) !== null) continue;
    if (out.ms < lo) lo = out.ms;
    if (out.ms > hi) hi = out.ms;
  }
  if (lo > hi) return '';
  const iso = (ms: number) => new Date(ms).toISOString().replace('.000Z', 'Z');
  return `; they run from ${iso(lo)} to ${iso(hi)}`;
}

function asked(format: TimeFormat, count: (f: TimeFormat) => number, why: string): FamilyResult {
  const chosen: Candidate = { format, matched: count(format), evidence: why };
  return { status: 'ok', chosen, candidates: [], reason: null, evidence: [why] };
}

function bandTally(values: readonly string[]) {
  const bands = new Map<EpochUnit, Map<number, number>>();
  let numeric = 0;
  let outside = 0;
  let fractional = false;
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    const n = integerDigits(v);
    if (n < 0) continue;
    numeric++;
    if (v.includes('.')) fractional = true;
    const x = Number(v);
    if (x < lo) lo = x;
    if (x > hi) hi = x;
    const u = epochUnitOfDigits(n);
    if (u === null) { outside++; continue; }
    const m = bands.get(u) ?? new Map<number, number>();
    m.set(n, (m.get(n) ?? 0) + 1);
    bands.set(u, m);
  }
  return { bands, numeric, outside, fractional, lo, hi };
}

function bandWords(u: EpochUnit, m: Map<number, number>): string {
  const digits = [...m.keys()].sort((a, b) => a - b).join(' or ');
  const n = [...m.values()].reduce((a, b) => a + b, 0);
  return `${n} value${n === 1 ? ' has' : 's have'} ${digits} digits (${epochUnitWords(u)})`;
}

/** Infers epoch-number and serial-day formats; null when the values are not mostly numbers. */
export function inferNumber(values: readonly string[], hints: InferHints, count: (f: TimeFormat) => number, parserOf: (f: TimeFormat) => TimeParser): FamilyResult | null {
  if (hints.serial !== undefined) {
    return asked(timeFormat(hints.serial === '1900' ? 'serial-1900' : 'serial-1904'), count, `read as spreadsheet serial day numbers of the ${hints.serial} date system, as asked`);
  }
  if (hints.epochUnit !== undefined) {
    const f = hints.epochUnit === 'auto' ? timeFormat('epoch-auto') : timeFormat(epochFormatId(hints.epochUnit));
    return asked(f, count, `read as ${f.label}, as asked`);
  }
  const t = bandTally(values);
  if (t.numeric === 0 || t.numeric * 2 < values.length) return null;
  if (t.bands.size === 0) {
    const name = hints.columnName;
    if (name !== undefined && DATE_NAME.test(name) && t.numeric === values.length && t.lo >= SERIAL_1950 && t.hi < SERIAL_2099 + 1) {
      const f = timeFormat('serial-1900');
      const why = `the column is named ${JSON.stringify(name)} and every value lies between ${SERIAL_1950} and ${SERIAL_2099}, the 1900-system serial day numbers of 1950-01-01 to 2099-12-31, so it is read as spreadsheet serial days (1900 date system; ask for the 1904 system if the workbook used it)${spanWords(values, parserOf(f))}`;
      return asked(f, count, why);
    }
    return null;
  }
  const entries = [...t.bands.entries()];
  if (entries.length > 1) {
    const auto = timeFormat('epoch-auto');
    return {
      status: 'conflict',
      chosen: null,
      candidates: [{ format: auto, matched: count(auto), evidence: 'each value read in the unit its digit count gives' }],
      reason: `the column mixes epoch units: ${entries.map(([u, m]) => bandWords(u, m)).join(', ')}; ask for epochUnit 'auto' to read each value in the unit its digits give, or clean the column`,
      evidence: [],
    };
  }
  const [unit, m] = entries[0]!;
  if (t.outside * 20 > t.numeric) return null;
  const f = timeFormat(epochFormatId(unit));
  const evidence = [`${bandWords(unit, m)}, the band of epoch ${epochUnitWords(unit)} for 1973-03-03 to 2286-11-20${spanWords(values, parserOf(f))}`];
  if (t.outside > 0) evidence.push(`${t.outside} values fall outside that band and are read in the same unit`);
  return { status: 'ok', chosen: { format: f, matched: count(f), evidence: evidence[0]! }, candidates: [], reason: null, evidence };
}
