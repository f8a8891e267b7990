// Range labels as people write them (5-9, 5–9, 5 to 9, 85+, 85 and over, <5, under 5, [5,10), (5,10])
// and the labels quern writes, chosen so that parsing a written label gives the same range back.
import type { EndsRule, Range, RangeLabelOptions } from './types.js';
import { discreteRange, makeRange } from './range.js';
import { tryParseTimeRange } from './time-labels.js';

const NUM = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
const INF = String.raw`[+-]?(?:inf|infinity|∞)`;
const DASH_RANGE = new RegExp(String.raw`^(${NUM})\s*(?:-|–|—|‒|to|through|thru)\s*(${NUM})$`, 'i');
const AT_LEAST = new RegExp(String.raw`^(?:(${NUM})\s*(?:\+|and over|and older|and above|or more|or older|or over)|(?:>=|≥|at least)\s*(${NUM}))$`, 'i');
const ABOVE = new RegExp(String.raw`^(?:>|over|above|more than|older than)\s*(${NUM})$`, 'i');
const BELOW = new RegExp(String.raw`^(?:<|under|below|less than|younger than)\s*(${NUM})$`, 'i');
const AT_MOST = new RegExp(String.raw`^(?:(?:<=|≤|at most|up to)\s*(${NUM})|(${NUM})\s*(?:and under|and younger|and below|or less|or younger|or under))$`, 'i');
const END = new RegExp(String.raw`^(?:${NUM}|${INF})?$`, 'i');
const SINGLE = new RegExp(String.raw`^(${NUM})$`);
const ALL = /^(?:all|any|all ages)$/i;

/** Every pattern that reads label text, for the ReDoS check in the tests. */
export const RANGE_LABEL_PATTERNS: readonly RegExp[] = [DASH_RANGE, AT_LEAST, ABOVE, BELOW, AT_MOST, END, SINGLE, ALL];

/** Reads the minus signs people write (U+2212) and trims; dashes between numbers stay range separators. */
function normalise(text: string): string {
  return text.trim().replace(/\u2212/g, '-').replace(/\s+/g, ' ');
}

function num(s: string | undefined): number {
  if (s === undefined || s === '') return NaN;
  if (/inf|∞/i.test(s)) return s.startsWith('-') ? -Infinity : Infinity;
  const v = Number(s);
  return v === 0 ? 0 : v;
}

/** Whether written integers are read as whole-number (discrete) ranges under the ends rule. */
function isDiscrete(ends: EndsRule, ...xs: number[]): boolean | null {
  const ints = xs.every(Number.isInteger);
  if (ends === 'discrete') return ints ? true : null;
  return ends === 'auto' ? ints : false;
}

function dashRange(a: number, b: number, ends: EndsRule): Range | null {
  const d = isDiscrete(ends, a, b);
  if (d === null || b < a) return null;
  if (d) return discreteRange(a, b);
  if (ends === 'closed') return makeRange(a, b, true, true);
  if (ends === 'open-closed') return makeRange(a, b, false, true);
  return makeRange(a, b, true, false);
}

function oneSided(x: number, kind: 'ge' | 'gt' | 'lt' | 'le', ends: EndsRule): Range | null {
  const d = isDiscrete(ends, x);
  if (d === null || !Number.isFinite(x)) return null;
  if (d) {
    if (kind === 'ge') return discreteRange(x, null);
    if (kind === 'gt') return discreteRange(x + 1, null);
    return discreteRange(null, kind === 'lt' ? x - 1 : x);
  }
  if (kind === 'ge' || kind === 'gt') return makeRange(x, null, kind === 'ge', false);
  return makeRange(null, x, false, kind === 'le');
}

/** Interval notation [a,b), (a,b], [a,) …: read by hand, not by one regular expression, to stay linear. */
function bracketRange(s: string): Range | null {
  const open = s[0], close = s[s.length - 1];
  if ((open !== '[' && open !== '(') || (close !== ']' && close !== ')')) return null;
  const inner = s.slice(1, -1);
  const sep = inner.includes(';') ? ';' : ',';
  const parts = inner.split(sep);
  if (parts.length !== 2) return null;
  const [a, b] = [parts[0]!.trim(), parts[1]!.trim()];
  if (!END.test(a) || !END.test(b)) return null;
  const lo = a === '' ? -Infinity : num(a);
  const hi = b === '' ? Infinity : num(b);
  if (lo === Infinity || hi === -Infinity || !(lo <= hi)) return null;
  return makeRange(lo === -Infinity ? null : lo, hi === Infinity ? null : hi, open === '[', close === ']');
}

/** Parses a numeric range label; null when the text is not one. */
export function tryParseNumericRange(text: string, ends: EndsRule = 'auto'): Range | null {
  const s = normalise(text);
  let m: RegExpExecArray | null;
  if (s.startsWith('[') || s.startsWith('(')) return bracketRange(s);
  if ((m = DASH_RANGE.exec(s))) return dashRange(num(m[1]), num(m[2]), ends);
  if ((m = AT_LEAST.exec(s))) return oneSided(num(m[1] ?? m[2]), 'ge', ends);
  if ((m = AT_MOST.exec(s))) return oneSided(num(m[1] ?? m[2]), 'le', ends);
  if ((m = ABOVE.exec(s))) return oneSided(num(m[1]), 'gt', ends);
  if ((m = BELOW.exec(s))) return oneSided(num(m[1]), 'lt', ends);
  if ((m = SINGLE.exec(s))) {
    const x = num(m[1]);
    if (!Number.isFinite(x)) return null;
    return isDiscrete(ends, x) ? discreteRange(x, x) : makeRange(x, x, true, true);
  }
  if (ALL.test(s)) return { low: null, high: null, lowClosed: false, highClosed: false, discrete: ends === 'auto' || ends === 'discrete' };
  return null;
}

/**
 * Parses a range label: numeric forms first, then (when `options.time` is given) ISO 8601 intervals
 * (2021-01-01/2021-03-31, 2021-01-01/P3M), calendar periods (2021-Q1) and single dates. Null when the
 * text is no range. Integer labels are discrete (0-4 holds 0, 1, 2, 3 and 4) unless `ends` says otherwise.
 */
export function parseRangeLabel(text: string, options: RangeLabelOptions = {}): Range | null {
  const ends = options.ends ?? 'auto';
  const r = tryParseNumericRange(text, ends);
  if (r !== null || options.time === undefined) return r;
  return tryParseTimeRange(text, options.time, ends);
}

function n(x: number): string {
  return String(x === 0 ? 0 : x);
}

/** The label of a discrete range: 0-4, 85+, <5, 7, -5 to -1. */
function formatDiscrete(r: Range): string {
  if (r.low === null && r.high === null) return 'all';
  if (r.low === null) return `<${n(r.high!)}`;
  if (r.high === null) return `${n(r.low)}+`;
  const last = r.high - 1;
  if (last === r.low) return n(r.low);
  return r.low < 0 || last < 0 ? `${n(r.low)} to ${n(last)}` : `${n(r.low)}-${n(last)}`;
}

/** The label of a continuous range in interval notation: [0,5), (5,10], [85,inf), (-inf,5). */
function formatContinuous(r: Range): string {
  if (r.low === null && r.high === null) return '(-inf,inf)';
  if (r.low === null) return `(-inf,${n(r.high!)}${r.highClosed ? ']' : ')'}`;
  if (r.high === null) return `${r.lowClosed ? '[' : '('}${n(r.low)},inf)`;
  return `${r.lowClosed ? '[' : '('}${n(r.low)},${n(r.high)}${r.highClosed ? ']' : ')'}`;
}

/**
 * Writes a range as a label that parseRangeLabel reads back to the same range: discrete ranges as
 * inclusive whole numbers (0-4, 85+), continuous ones in interval notation ([0,5), [85,inf)), temporal ones
 * through `options.time.format` (an ISO 8601 interval).
 */
export function formatRange(r: Range, options: RangeLabelOptions = {}): string {
  if (options.time?.format !== undefined) return options.time.format(r);
  return r.discrete ? formatDiscrete(r) : formatContinuous(r);
}
