// Temporal range labels through injected readers: ISO 8601 intervals start/end, start/duration and
// duration/end, calendar periods (2021-Q1) and single whole days. No calendar rules live here.
import type { EndsRule, Range, TimeEndpoint, TimeEndpoints } from './types.js';
import { makeRange } from './range.js';

/** An ISO 8601 duration (P3M, PT15M); exported for the ReDoS check in the tests. */
export const DURATION = /^P(?!$)(?:\d+[YMWD])*(?:T(?=\d)(?:\d+(?:\.\d+)?[HMS])*)?$/;

/** Splits `a/b`, `a..b` or `a to b` into its two ends; null when the text has no such separator. */
function splitInterval(s: string): [string, string] | null {
  for (const sep of ['/', '..', ' to ']) {
    const i = s.indexOf(sep);
    if (i > 0 && s.indexOf(sep, i + sep.length) === -1) return [s.slice(0, i).trim(), s.slice(i + sep.length).trim()];
  }
  return null;
}

/** The range between two read endpoints under an ends rule (whole days inclusive by default). */
export function rangeFromEndpoints(a: TimeEndpoint, b: TimeEndpoint, ends: EndsRule): Range | null {
  let r: Range;
  if (ends === 'half-open') r = makeRange(a.start, b.start, true, false);
  else if (ends === 'open-closed') r = b.whole ? makeRange(a.end, b.end, true, false) : makeRange(a.start, b.start, false, true);
  else if (b.whole) r = makeRange(a.start, b.end, true, false);
  else r = makeRange(a.start, b.start, true, ends === 'closed' || ends === 'discrete');
  if (r.low! > r.high! || (r.low === r.high && !r.highClosed)) return null;
  return r;
}

function instantAt(ms: number): TimeEndpoint {
  return { start: ms, end: ms, whole: false };
}

/** Reads `a/b`, `a/PnD` or `PnD/b`; null when either end does not read. */
function parseInterval(a: string, b: string, time: TimeEndpoints, ends: EndsRule): Range | null {
  if (DURATION.test(a) && time.addDuration !== undefined) {
    const end = time.read(b);
    if (end === null) return null;
    const stop = end.whole ? end.end : end.start;
    const start = time.addDuration(stop, a, -1);
    return start === null ? null : rangeFromEndpoints(instantAt(start), instantAt(stop), 'half-open');
  }
  const start = time.read(a);
  if (start === null) return null;
  if (DURATION.test(b) && time.addDuration !== undefined) {
    const stop = time.addDuration(start.start, b, 1);
    return stop === null ? null : rangeFromEndpoints(instantAt(start.start), instantAt(stop), 'half-open');
  }
  const end = time.read(b);
  return end === null ? null : rangeFromEndpoints(start, end, ends);
}

/** Parses a temporal range label with the injected readers; null when it is not one. */
export function tryParseTimeRange(text: string, time: TimeEndpoints, ends: EndsRule): Range | null {
  const s = text.trim();
  const p = time.period?.(s) ?? null;
  if (p !== null) return makeRange(p.start, p.end, true, false);
  const parts = splitInterval(s);
  if (parts !== null) return parseInterval(parts[0], parts[1], time, ends);
  const one = time.read(s);
  if (one === null) return null;
  return one.whole ? makeRange(one.start, one.end, true, false) : makeRange(one.start, one.start, true, true);
}
