// Deciding a column's number format from evidence in the column, never by guessing: `1,234` alone
// could be one thousand two hundred and thirty-four or one point two three four.
import type { GroupMark, NumberFormat, NumberFormatInference } from './types.js';
import { DEFAULT_MISSING_MARKERS, emptyParsedNumber, isAmbiguousSeparatorPattern, makeNumberParser } from './parse.js';

interface Tally { dot: number; comma: number; ambComma: number; ambDot: number; sawComma: boolean; sawDot: boolean; space: boolean; apos: boolean; examples: string[] }

const SPACE_GROUPED = /^\d{1,3}(?:[ \u00a0\u202f]\d{3})+(?:[.,]\d+)?(?:[eE][+-]?\d+)?$/;
const APOS_GROUPED = /^\d{1,3}(?:['\u2019]\d{3})+(?:[.,]\d+)?$/;
/** The patterns inference runs on values, for the ReDoS check in the tests. */
const COMMA_DECIMAL = /^\d*,\d+$/;
const DOT_DECIMAL = /^\d*\.\d+(?:[eE][+-]?\d+)?$/;
const GROUP_BETWEEN = /\d[ \u00a0\u202f'\u2019]\d/;
export const INFER_PATTERNS: readonly RegExp[] = [SPACE_GROUPED, APOS_GROUPED, COMMA_DECIMAL, DOT_DECIMAL, GROUP_BETWEEN];

function count(s: string, ch: string): number {
  let k = 0;
  for (let i = s.indexOf(ch); i !== -1; i = s.indexOf(ch, i + 1)) k++;
  return k;
}

/** Strips spaces at the ends, a trailing percent sign and a leading sign. */
function bodyOf(text: string): string {
  let s = text.trim();
  if (s.endsWith('%')) s = s.slice(0, -1).trim();
  if (s[0] === '+' || s[0] === '-' || s[0] === '\u2212') s = s.slice(1);
  return s;
}

function note(t: Tally, kind: 'dot' | 'comma', value: string): void {
  t[kind]++;
  if (t.examples.length < 5) t.examples.push(value);
}

/** Adds one value's evidence: which mark is the decimal one, if the value shows it. */
function tallyValue(t: Tally, value: string): void {
  const s = bodyOf(value);
  if (!/\d/.test(s)) return;
  if (SPACE_GROUPED.test(s)) t.space = true;
  if (APOS_GROUPED.test(s)) t.apos = true;
  if (GROUP_BETWEEN.test(s)) { // spaces or apostrophes group, so a lone mark is decimal
    const marks = s.replace(/[^.,]/g, '');
    if (marks === '.') note(t, 'dot', value); else if (marks === ',') note(t, 'comma', value);
    if (marks.length > 0) return;
  }
  const commas = count(s, ',');
  const dots = count(s, '.');
  if (commas > 0) t.sawComma = true;
  if (dots > 0) t.sawDot = true;
  if (commas > 0 && dots > 0) note(t, s.lastIndexOf('.') > s.lastIndexOf(',') ? 'dot' : 'comma', value);
  else if (commas > 1) note(t, 'dot', value); // 1,234,567: commas group thousands
  else if (dots > 1) note(t, 'comma', value); // 1.234.567: dots group thousands
  else if (commas === 1) { if (isAmbiguousSeparatorPattern(s)) t.ambComma++; else if (COMMA_DECIMAL.test(s)) note(t, 'comma', value); }
  else if (dots === 1) { if (isAmbiguousSeparatorPattern(s)) t.ambDot++; else if (DOT_DECIMAL.test(s)) note(t, 'dot', value); }
}

function otherGroup(t: Tally, other: GroupMark, sawOther: boolean): GroupMark | null {
  if (sawOther) return other;
  if (t.space) return ' ';
  if (t.apos) return "'";
  return null;
}

function decide(t: Tally): { format: NumberFormat; decision: NumberFormatInference['decision'] } {
  const base = { unresolved: false, percent: 'keep' as const, missing: DEFAULT_MISSING_MARKERS };
  const commaWins = t.comma > t.dot;
  if (t.dot > 0 || t.comma > 0) {
    const format: NumberFormat = commaWins
      ? { ...base, decimal: ',', group: otherGroup(t, '.', t.sawDot) }
      : { ...base, decimal: '.', group: otherGroup(t, ',', t.sawComma) };
    if (t.dot > 0 && t.comma > 0) return { format, decision: 'conflict' };
    return { format, decision: format.decimal === '.' && format.group === null ? 'plain' : 'decided' };
  }
  const group = otherGroup(t, ',', false);
  if (t.ambComma > 0) return { format: { ...base, decimal: '.', group, unresolved: true }, decision: 'ambiguous' };
  return { format: { ...base, decimal: '.', group }, decision: group === null ? 'plain' : 'decided' };
}

/**
 * Decides a column's number format from a sample of its values. A dot followed by other than three
 * digits, or a comma after a dot (1,234.5), proves the dot marks decimals, and the reverse for a comma;
 * with no such evidence a dot is the decimal mark (the default of most data) and a comma before three
 * digits stays unresolved: such values are rejected as 'ambiguous-separator', never guessed.
 */
export function inferNumberFormat(sample: Iterable<string>): NumberFormatInference {
  const t: Tally = { dot: 0, comma: 0, ambComma: 0, ambDot: 0, sawComma: false, sawDot: false, space: false, apos: false, examples: [] };
  const values: string[] = [];
  for (const v of sample) { values.push(v); tallyValue(t, v); }
  const { format, decision } = decide(t);
  const parser = makeNumberParser(format);
  const out = emptyParsedNumber();
  let ok = 0, empty = 0, invalid = 0, percent = 0;
  for (const v of values) {
    const st = parser.parse(v, out);
    if (st === 'ok') { ok++; if (out.percent) percent++; } else if (st === 'empty') empty++; else invalid++;
  }
  return { format, decision, evidence: { dotDecimal: t.dot, commaDecimal: t.comma, examples: t.examples }, ok, empty, invalid, percent };
}
