// Number parsing under a column's format: plain decimals take an allocation-free fast path; separators,
// signs, exponents and percent signs take a careful path that says why a value is not a number.
import type { NumberFormat, NumberParser, NumberStatus, ParsedNumber, NumberReason } from './types.js';

/** Markers that mean "no value" in exports from common systems (common practice). */
export const DEFAULT_MISSING_MARKERS: readonly string[] = ['NA', 'N/A', 'n/a', 'na', 'NULL', 'null', 'None', 'none', 'nil', '-', '--', '—', '.'];

/** The format of plain decimals: a dot marks decimals, no thousands separators. */
export const PLAIN_NUMBER_FORMAT: NumberFormat = Object.freeze({
  decimal: '.', group: null, unresolved: false, percent: 'keep', missing: DEFAULT_MISSING_MARKERS,
});

/** Makes an empty ParsedNumber to reuse across calls. */
export function emptyParsedNumber(): ParsedNumber {
  return { status: 'empty', value: NaN, reason: 'blank', percent: false, leadingZero: false, grouped: false };
}

const C0 = 48, C9 = 57, DOT = 46, COMMA = 44, PLUS = 43, MINUS = 45, LE = 101, UE = 69;

/** Scans `+12.5e-3`-style text: 1 when plain (and fills out), 0 otherwise. Allocates nothing. */
function scanPlain(s: string, out: ParsedNumber, allowDot: boolean): number {
  const n = s.length;
  let i = 0;
  let c = n > 0 ? s.charCodeAt(0) : 0;
  if (c === PLUS || c === MINUS) i++;
  const intStart = i;
  while (i < n && (c = s.charCodeAt(i)) >= C0 && c <= C9) i++;
  let digits = i - intStart;
  const lead = digits > 1 && s.charCodeAt(intStart) === C0;
  if (i < n && s.charCodeAt(i) === DOT) {
    if (!allowDot) return 0;
    i++;
    const f = i;
    while (i < n && (c = s.charCodeAt(i)) >= C0 && c <= C9) i++;
    digits += i - f;
  }
  if (digits === 0) return 0;
  if (i < n && ((c = s.charCodeAt(i)) === LE || c === UE)) {
    i++;
    if (i < n && ((c = s.charCodeAt(i)) === PLUS || c === MINUS)) i++;
    const e = i;
    while (i < n && (c = s.charCodeAt(i)) >= C0 && c <= C9) i++;
    if (i === e) return 0;
  }
  if (i !== n) return 0;
  const v = Number(s);
  setOk(out, v === 0 ? 0 : v, false, lead, false);
  if (!Number.isFinite(v)) setBad(out, 'invalid', 'out-of-range');
  return 1;
}

function setOk(out: ParsedNumber, v: number, percent: boolean, lead: boolean, grouped: boolean): void {
  out.status = 'ok'; out.value = v; out.reason = null; out.percent = percent; out.leadingZero = lead; out.grouped = grouped;
}

function setBad(out: ParsedNumber, status: NumberStatus, reason: NumberReason): NumberStatus {
  out.status = status; out.value = NaN; out.reason = reason; out.percent = false; out.leadingZero = false; out.grouped = false;
  return status;
}

const NAN_WORDS = new Set(['nan', '+nan', '-nan', 'nan%']);
const INF_WORDS = new Set(['inf', '+inf', '-inf', 'infinity', '+infinity', '-infinity', '∞', '+∞', '-∞', '−∞', '−inf', '−infinity']);
const AMBIGUOUS = /^[1-9]\d{0,2}[.,]\d{3}$/;
const EXPONENT = /^[+-]?\d+$/;
/** The patterns that read values, for the ReDoS check in the tests. */
export const NUMBER_PATTERNS: readonly RegExp[] = [AMBIGUOUS, EXPONENT];

/** Trims white space (String.prototype.trim covers U+00A0 and U+202F too: ECMA-262 WhiteSpace). */
const trimSpaces = (s: string): string => s.trim();

function isGroupChar(ch: string, group: NumberFormat['group']): boolean {
  if (group === null) return false;
  if (group === ' ') return ch === ' ' || ch === '\u00a0' || ch === '\u202f';
  if (group === "'") return ch === "'" || ch === '\u2019';
  return ch === group;
}

function isSeparatorChar(ch: string): boolean {
  return ch === ',' || ch === '.' || ch === ' ' || ch === '\u00a0' || ch === '\u202f' || ch === "'" || ch === '\u2019';
}

/** True for `1,234` or `1.234` alone: one separator before exactly three digits, 1–3 digits before it. */
export function isAmbiguousSeparatorPattern(body: string): boolean {
  return AMBIGUOUS.test(body);
}

interface Pieces { int: string; frac: string; exp: string; grouped: boolean }

/** Splits an unsigned body into digits under the format, or returns the reason it cannot. */
function splitBody(body: string, f: NumberFormat): Pieces | NumberReason {
  let i = 0;
  const n = body.length;
  let int = '';
  let groupLen = -1; // digits since the last group mark; -1 before any mark
  let firstGroup = 0;
  let grouped = false;
  for (; i < n; i++) {
    const ch = body[i]!;
    if (ch >= '0' && ch <= '9') { int += ch; if (groupLen >= 0) groupLen++; else firstGroup++; continue; }
    if (ch === f.decimal) break;
    if (isGroupChar(ch, f.group)) {
      if (groupLen === -1 ? firstGroup < 1 || firstGroup > 3 : groupLen !== 3) return 'bad-grouping';
      groupLen = 0; grouped = true; continue;
    }
    if (ch === 'e' || ch === 'E') break;
    return isSeparatorChar(ch) ? 'unexpected-separator' : 'malformed';
  }
  if (grouped && groupLen !== 3) return 'bad-grouping';
  let frac = '';
  if (i < n && body[i] === f.decimal) {
    for (i++; i < n; i++) {
      const ch = body[i]!;
      if (ch >= '0' && ch <= '9') { frac += ch; continue; }
      if (ch === 'e' || ch === 'E') break;
      return isSeparatorChar(ch) ? 'unexpected-separator' : 'malformed';
    }
  }
  if (int.length + frac.length === 0) return 'malformed';
  let exp = '';
  if (i < n) {
    exp = body.slice(i + 1);
    if (!EXPONENT.test(exp)) return 'malformed';
  }
  return { int, frac, exp, grouped };
}

/** The careful path: trims, reads missing markers, words, percent, sign, separators. */
function parseSlow(raw: string, f: NumberFormat, out: ParsedNumber): NumberStatus {
  const s = trimSpaces(raw);
  if (s === '') return setBad(out, 'empty', 'blank');
  if (f.missing.includes(s)) return setBad(out, 'empty', 'missing-marker');
  const lower = s.toLowerCase();
  if (NAN_WORDS.has(lower)) return setBad(out, 'invalid', 'not-a-number');
  let body = s;
  let percent = false;
  if (body.endsWith('%')) { percent = true; body = trimSpaces(body.slice(0, -1)); }
  let sign = '';
  const c0 = body[0];
  if (c0 === '+' || c0 === '-' || c0 === '\u2212') { sign = c0 === '+' ? '' : '-'; body = body.slice(1); }
  if (INF_WORDS.has(body.toLowerCase())) return setBad(out, 'invalid', 'infinite');
  if (f.unresolved && isAmbiguousSeparatorPattern(body)) return setBad(out, 'invalid', 'ambiguous-separator');
  if (f.unresolved && body.includes(',')) return setBad(out, 'invalid', 'ambiguous-separator');
  const p = splitBody(body, f);
  if (typeof p === 'string') return setBad(out, 'invalid', p);
  let v = Number(`${sign}${p.int === '' ? '0' : p.int}.${p.frac === '' ? '0' : p.frac}${p.exp === '' ? '' : `e${p.exp}`}`);
  if (!Number.isFinite(v)) return setBad(out, 'invalid', 'out-of-range');
  if (percent && f.percent === 'fraction') v /= 100;
  setOk(out, v === 0 ? 0 : v, percent, p.int.length > 1 && p.int[0] === '0', p.grouped);
  return 'ok';
}

/**
 * Compiles a parser for one column format. Plain decimals (`-12.5`, `3e8`) are checked with a character
 * scan and read by `Number` without allocating; everything else takes the careful path. NaN, Infinity
 * and overflow are invalid with a reason, never a silent NaN; -0 reads as 0.
 */
export function makeNumberParser(format: Partial<NumberFormat> = {}): NumberParser {
  const f: NumberFormat = Object.freeze({ ...PLAIN_NUMBER_FORMAT, ...format });
  const dotIsDecimal = f.decimal === '.' && !f.unresolved;
  return {
    format: f,
    parse(text: string, out: ParsedNumber): NumberStatus {
      if (scanPlain(text, out, dotIsDecimal) === 1) return out.status;
      return parseSlow(text, f, out);
    },
  };
}

/** Parses one value (allocating a result); for loops, reuse a parser from makeNumberParser. */
export function parseNumber(text: string, format: Partial<NumberFormat> = {}): ParsedNumber {
  const out = emptyParsedNumber();
  makeNumberParser(format).parse(text, out);
  return out;
}
