// The domain a set of ranges should cover: `0..` (ages), `0..120`, `2024-01-01..2024-12-31`, or any label.
import type { Range, RangeLabelOptions } from './types.js';
import { discreteRange, makeRange } from './range.js';
import { parseRangeLabel } from './labels.js';
import { rangeFromEndpoints } from './time-labels.js';

/** A plain number at one end of a domain; exported for the ReDoS check in the tests. */
export const DOMAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

function numericEnd(s: string): number | null | undefined {
  if (s === '') return null;
  return DOMAIN_NUMBER.test(s) ? Number(s) : undefined;
}

/**
 * Parses a domain `a..b` (either end may be left out: unbounded). Integer ends are inclusive whole
 * numbers (0..120 holds 0 to 120), other numbers a closed interval, dates whole days inclusive; any
 * other text is read as a range label. Null when it does not parse.
 */
export function parseDomain(text: string, options: RangeLabelOptions = {}): Range | null {
  const s = text.trim();
  const i = s.indexOf('..');
  if (i === -1) return parseRangeLabel(s, options);
  const a = s.slice(0, i).trim();
  const b = s.slice(i + 2).trim();
  const lo = numericEnd(a);
  const hi = numericEnd(b);
  if (lo !== undefined && hi !== undefined) {
    if (lo !== null && hi !== null && hi < lo) return null;
    const ints = (lo === null || Number.isInteger(lo)) && (hi === null || Number.isInteger(hi));
    if (ints && options.ends !== 'closed' && options.ends !== 'half-open') return discreteRange(lo, hi);
    return makeRange(lo, hi, true, options.ends !== 'half-open');
  }
  const t = options.time;
  if (t === undefined) return null;
  const ta = a === '' ? null : t.read(a);
  const tb = b === '' ? null : t.read(b);
  if ((a !== '' && ta === null) || (b !== '' && tb === null)) return null;
  if (ta === null || tb === null) {
    return makeRange(ta === null ? null : ta.start, tb === null ? null : tb.whole ? tb.end : tb.start, true, false);
  }
  return rangeFromEndpoints(ta, tb, options.ends ?? 'auto');
}
