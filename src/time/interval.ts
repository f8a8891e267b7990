// ISO 8601 time intervals (ISO 8601-1:2019 §5.5.4): start/end, start/duration and duration/end, read as
// periods. Rules (documented in DEVELOPERS.md "Time values"):
// - an end point written as a date covers that whole date: 2021-04-05/2021-04-11 is the seven days
//   [2021-04-05, 2021-04-12); an end written as a date-time is that instant (exclusive);
// - both bounds are wall-clock readings at the start's offset (when the start has one), so subtracting
//   `offset` minutes from `ms` and `endMs` gives both instants; an end without an offset takes the start's;
// - a duration is added on the wall clock: months and years by field arithmetic (day clamped to the
//   month's end), weeks and days as calendar days, hours and below as elapsed time;
// - the unit is set only when the duration is exactly one unit (P1W → 'week', PT1H → 'hour').
// Reduced end points (2021-04-05/12) and recurring intervals (R5/…) are not read.
import type { ParsedTime } from './types.js';
import { type Scan, MAX_MS, MS_PER_MINUTE, outOfRange } from './scan.js';
import { scanIso, skipBlanks, trimEnd } from './iso.js';
import { MS_PER_DAY } from '../calendar/civil.js';
import { type IsoDuration, scanDuration, addDurationToWall, durationUnit } from './duration.js';

/** Scratch for one interval parser: two scans and a duration, made once per parser. */
export interface IntervalScratch {
  a: Scan;
  b: Scan;
  d: IsoDuration;
  civil: number[];
}

function isDurationAt(s: string, i: number): boolean {
  const c = s.charCodeAt(i);
  return c === 80 || c === 112 || (c === 45 && (s.charCodeAt(i + 1) === 80 || s.charCodeAt(i + 1) === 112));
}

/** Wall-clock start of what a scan names (its day start plus any time). */
function wallStart(sc: Scan): number {
  return sc.days * MS_PER_DAY + (sc.timeMs < 0 ? 0 : sc.timeMs);
}

/** Wall-clock end of what a scan names as an interval end: a date covers its whole period. */
function wallEnd(sc: Scan): number {
  return sc.timeMs < 0 ? sc.endDays * MS_PER_DAY : sc.days * MS_PER_DAY + sc.timeMs;
}

function finish(out: ParsedTime, start: number, end: number, offset: number, x: IntervalScratch): string | null {
  if (!(end > start)) return 'invalid-interval: the end is not after the start';
  const off = offset === offset ? offset * MS_PER_MINUTE : 0;
  if (start - off < -MAX_MS || end - off > MAX_MS) return outOfRange('the interval');
  out.kind = 'period';
  out.ms = start;
  out.endMs = end;
  out.offset = offset;
  out.leapSecond = x.a.leap || x.b.leap;
  return null;
}

function startEnd(s: string, i: number, slash: number, end: number, out: ParsedTime, x: IntervalScratch): string | null {
  let r = scanIso(s, i, slash, x.a);
  if (r !== null) return r;
  r = scanIso(s, slash + 1, end, x.b);
  if (r !== null) return r;
  const offA = x.a.offset;
  const offB = x.b.offset;
  if (offA !== offA && offB === offB) return 'invalid-interval: the end has an offset but the start has none';
  let e = wallEnd(x.b);
  if (offA === offA && offB === offB) e += (offA - offB) * MS_PER_MINUTE;
  out.unit = null;
  return finish(out, wallStart(x.a), e, offA, x);
}

function startDuration(s: string, i: number, slash: number, end: number, out: ParsedTime, x: IntervalScratch): string | null {
  let r = scanIso(s, i, slash, x.a);
  if (r !== null) return r;
  r = scanDuration(s, slash + 1, end, x.d);
  if (r !== null) return r;
  x.b.leap = false;
  const start = wallStart(x.a);
  out.unit = x.d.sign > 0 ? durationUnit(x.d) : null;
  return finish(out, start, addDurationToWall(start, x.d, x.civil), x.a.offset, x);
}

function durationEnd(s: string, i: number, slash: number, end: number, out: ParsedTime, x: IntervalScratch): string | null {
  let r = scanDuration(s, i, slash, x.d);
  if (r !== null) return r;
  r = scanIso(s, slash + 1, end, x.b);
  if (r !== null) return r;
  x.a.leap = false;
  const e = wallEnd(x.b);
  x.d.sign = x.d.sign > 0 ? -1 : 1;
  const start = addDurationToWall(e, x.d, x.civil);
  out.unit = x.d.sign < 0 ? durationUnit(x.d) : null;
  return finish(out, start, e, x.b.offset, x);
}

/** Index of the interval separator '/' in s[start, end), or -1. */
function findSlash(s: string, start: number, end: number): number {
  for (let k = start; k < end; k++) if (s.charCodeAt(k) === 47) return k;
  return -1;
}

/** Parses an ISO 8601 interval (start/end, start/duration, duration/end) into `out` as a period. */
export function parseIntervalInto(s: string, out: ParsedTime, x: IntervalScratch): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  const slash = findSlash(s, i, end);
  if (slash < 0) return 'not-recognised: an ISO 8601 interval has two parts separated by "/"';
  const durA = isDurationAt(s, i);
  const durB = isDurationAt(s, slash + 1);
  if (durA && durB) return 'invalid-interval: an interval cannot be two durations';
  if (durB) return startDuration(s, i, slash, end, out, x);
  if (durA) return durationEnd(s, i, slash, end, out, x);
  return startEnd(s, i, slash, end, out, x);
}
