// The time-of-day and offset parts of ISO 8601 / RFC 3339: hh, hh:mm, hh:mm:ss (or basic hhmm, hhmmss),
// a decimal fraction of the last component (point or comma, ISO 8601-1:2019 §3.2.6), and Z or ±hh[:mm].
// Choices (documented in DEVELOPERS.md "Time values"):
// - fractions are truncated to the millisecond (never rounded up, so 23:59:59.9999 stays in its day);
//   any number of digits is accepted;
// - 24:00 (with zero minutes, seconds and fraction) is the end of the day, i.e. the next day's 00:00
//   (ISO 8601-1:2019 §5.3.2, amended 2022); anything later than 24:00 is invalid;
// - second 60 is a leap second: read as hh:mm:59.999 with `leapSecond` set, accepted only at 23:59 UTC
//   (RFC 3339 §5.7); whether the leap second really happened that day is not checked.
import { type Scan, readDigits, countDigits, MS_PER_HOUR, MS_PER_MINUTE, pad2, notRecognised } from './scan.js';

const WHAT = 'an ISO 8601 date-time';

/** Reads a decimal fraction at `i` (after '.' or ','), returning its value in ms of `unitMs`, truncated; -1 if none. */
function scanFraction(s: string, i: number, end: number, unitMs: number, sc: Scan): number {
  const c = s.charCodeAt(i);
  if (i >= end || (c !== 46 && c !== 44)) return -1;
  const n = countDigits(s, i + 1, end);
  if (n === 0) return -2;
  const kept = n < 9 ? n : 9;
  let q = 0;
  for (let k = 0; k < kept; k++) q = q * 10 + (s.charCodeAt(i + 1 + k) - 48);
  let scale = 1;
  for (let k = 0; k < kept; k++) scale *= 10;
  sc.fracDigits = n;
  sc.pos = i + 1 + n;
  return Math.floor((q * unitMs) / scale);
}

/** Reads the offset at sc.pos: Z/z, ±hh, ±hh:mm or ±hhmm (minus may also be U+2212). */
function scanOffset(s: string, end: number, sc: Scan): string | null {
  const i = sc.pos;
  if (i >= end) return null;
  const c = s.charCodeAt(i);
  if (c === 90 || c === 122) {
    sc.offset = 0;
    sc.offsetForm = 1;
    sc.pos = i + 1;
    return null;
  }
  if (c !== 43 && c !== 45 && c !== 0x2212) return notRecognised(s, WHAT);
  const sign = c === 43 ? 1 : -1;
  const hh = readDigits(s, i + 1, 2, end);
  if (hh < 0) return `invalid-offset: an offset is ±hh:mm, as in +02:00 or -05:30`;
  let mm = 0;
  let p = i + 3;
  sc.offsetForm = 2;
  if (p < end) {
    const colon = s.charCodeAt(p) === 58 ? 1 : 0;
    mm = readDigits(s, p + colon, 2, end);
    if (mm < 0) return `invalid-offset: an offset is ±hh:mm, as in +02:00 or -05:30`;
    p += colon + 2;
    sc.offsetForm = 3;
  }
  if (hh > 23 || mm > 59) return `invalid-offset: offset ${sign > 0 ? '+' : '-'}${pad2(hh)}:${pad2(mm)} does not exist; hours run to 23 and minutes to 59`;
  sc.offset = sign * (hh * 60 + mm);
  sc.pos = p;
  return null;
}

function checkFields(hh: number, mm: number, ss: number, frac: number): string | null {
  if (hh === 24) {
    if (mm !== 0 || ss > 0 || frac > 0) {
      return `invalid-time: ${pad2(hh)}:${pad2(mm)} does not exist; 24:00 is the end of the day and nothing comes after it`;
    }
    return null;
  }
  if (hh > 24) return `invalid-time: hour ${pad2(hh)} does not exist; hours run 00 to 23 (24:00 ends a day)`;
  if (mm > 59) return `invalid-time: minute ${pad2(mm)} does not exist; minutes run 00 to 59`;
  if (ss > 60) return `invalid-time: second ${pad2(ss)} does not exist; seconds run 00 to 59 (60 only for a leap second)`;
  return null;
}

/** Reads hh[:mm[:ss]] or hh[mm[ss]] and a fraction of the last component at `i`; fills timeMs, precision, leap. */
function scanClock(s: string, i: number, end: number, sc: Scan): string | null {
  const hh = readDigits(s, i, 2, end);
  if (hh < 0) return notRecognised(s, WHAT);
  let p = i + 2;
  let mm = 0;
  let ss = 0;
  sc.precision = 1;
  const extended = p < end && s.charCodeAt(p) === 58;
  const step = extended ? 1 : 0;
  if (countDigits(s, p + step, end) >= 2 && (extended || countDigits(s, p, end) % 2 === 0)) {
    mm = readDigits(s, p + step, 2, end);
    p += step + 2;
    sc.precision = 2;
    const more = extended ? p < end && s.charCodeAt(p) === 58 : countDigits(s, p, end) >= 2;
    if (more) {
      ss = readDigits(s, p + step, 2, end);
      if (ss < 0) return notRecognised(s, WHAT);
      p += step + 2;
      sc.precision = 3;
    }
  } else if (extended) {
    return notRecognised(s, WHAT);
  }
  sc.pos = p;
  const unitMs = sc.precision === 1 ? MS_PER_HOUR : sc.precision === 2 ? MS_PER_MINUTE : 1000;
  let frac = scanFraction(s, p, end, unitMs, sc);
  if (frac === -2) return notRecognised(s, `${WHAT} (a decimal sign must be followed by digits)`);
  if (frac < 0) frac = 0;
  const bad = checkFields(hh, mm, ss, frac);
  if (bad !== null) return bad;
  if (ss === 60) {
    sc.leap = true;
    sc.timeMs = hh * MS_PER_HOUR + mm * MS_PER_MINUTE + 59_999;
  } else {
    sc.timeMs = hh * MS_PER_HOUR + mm * MS_PER_MINUTE + ss * 1000 + frac;
  }
  return null;
}

/**
 * Reads a time of day at `i` (just after the T or space) and an optional offset, up to `end`.
 * On success sc.pos is the index after the offset.
 */
export function scanIsoTime(s: string, i: number, end: number, sc: Scan): string | null {
  const r = scanClock(s, i, end, sc);
  if (r !== null) return r;
  return scanOffset(s, end, sc);
}

/** Checks a leap second sits at 23:59 UTC (RFC 3339 §5.7), given the wall-clock time and the offset (NaN for local). */
export function checkLeapSecond(timeMs: number, offset: number): string | null {
  const minuteOfDay = Math.floor(timeMs / MS_PER_MINUTE);
  const off = offset === offset ? offset : 0;
  const utcMinute = (((minuteOfDay - off) % 1440) + 1440) % 1440;
  if (utcMinute === 1439) return null;
  return 'invalid-time: second 60 is a leap second, which only occurs at 23:59:60 UTC';
}
