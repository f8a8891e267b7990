// Unix epoch numbers (POSIX "Seconds Since the Epoch": every day has 86400 s, leap seconds not counted)
// in seconds, milliseconds, microseconds or nanoseconds. The digits are read by char codes and shifted
// in decimal, never through Number of the whole value, so 19-digit nanoseconds (beyond 2^53) keep their
// millisecond exactly. Sub-millisecond digits are dropped toward the past (floor).
import type { ParsedTime } from './types.js';
import type { EpochUnit } from './format.js';
import { MAX_MS, countDigits, notRecognised } from './scan.js';
import { skipBlanks, trimEnd } from './iso.js';

/** Decimal digits from the unit to milliseconds: seconds ×10³, microseconds ÷10³, nanoseconds ÷10⁶. */
const SHIFT: Record<EpochUnit, number> = { s: 3, ms: 0, us: -3, ns: -6 };

const UNIT_WORDS: Record<EpochUnit, string> = { s: 'seconds', ms: 'milliseconds', us: 'microseconds', ns: 'nanoseconds' };

/**
 * The epoch unit that a count of integer digits (sign and leading zeros excluded) stands for under the
 * digit-length bands that hold for 1973-03-03 … 2286-11-20 (seconds 9–10, milliseconds 12–13,
 * microseconds 15–16, nanoseconds 18–19 digits); null for 11, 14 and 17 digits and for fewer than 9.
 */
export function epochUnitOfDigits(n: number): EpochUnit | null {
  if (n === 9 || n === 10) return 's';
  if (n === 12 || n === 13) return 'ms';
  if (n === 15 || n === 16) return 'us';
  if (n === 18 || n === 19) return 'ns';
  return null;
}

/** Plain words of an epoch unit ('seconds'). */
export function epochUnitWords(u: EpochUnit): string {
  return UNIT_WORDS[u];
}

/** Number of significant integer digits of a numeric text (sign and leading zeros skipped); -1 if not a number. */
export function integerDigits(s: string): number {
  let i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i < end && (s.charCodeAt(i) === 45 || s.charCodeAt(i) === 43)) i++;
  const n = countDigits(s, i, end);
  if (n === 0) return -1;
  const after = i + n;
  if (after < end) {
    if (s.charCodeAt(after) !== 46 || countDigits(s, after + 1, end) !== end - after - 1 || after + 1 === end) return -1;
  }
  let z = i;
  while (z < i + n - 1 && s.charCodeAt(z) === 48) z++;
  return i + n - z;
}

/**
 * Parses an epoch number in `unit` ('auto': unit told by its digit count) into `out` as an instant (offset 0).
 * Accepts an optional sign and a decimal fraction; returns null or a reason.
 */
export function parseEpochInto(s: string, unit: EpochUnit | 'auto', out: ParsedTime): string | null {
  let i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  let neg = false;
  const c0 = s.charCodeAt(i);
  if (c0 === 45 || c0 === 43) { neg = c0 === 45; i++; }
  const n = countDigits(s, i, end);
  if (n === 0) return notRecognised(s, 'an epoch number');
  const intEnd = i + n;
  let fracStart = intEnd;
  let fracEnd = intEnd;
  if (intEnd < end) {
    if (s.charCodeAt(intEnd) !== 46) return notRecognised(s, 'an epoch number (digits, optionally a fraction)');
    fracStart = intEnd + 1;
    fracEnd = fracStart + countDigits(s, fracStart, end);
    if (fracEnd !== end || fracEnd === fracStart) return notRecognised(s, 'an epoch number (digits, optionally a fraction)');
  }
  let u: EpochUnit | null = unit === 'auto' ? null : unit;
  if (u === null) {
    let z = i;
    while (z < intEnd - 1 && s.charCodeAt(z) === 48) z++;
    u = epochUnitOfDigits(intEnd - z);
    if (u === null) {
      return `ambiguous-epoch: a number of ${intEnd - z} digits falls between the digit bands of seconds (9-10), milliseconds (12-13), microseconds (15-16) and nanoseconds (18-19)`;
    }
  }
  return shiftIntoMs(s, i, intEnd, fracStart, fracEnd, SHIFT[u], neg, out);
}

/** Builds the millisecond count from integer and fraction digits shifted by `shift` decimal places. */
function shiftIntoMs(
  s: string, i: number, intEnd: number, fracStart: number, fracEnd: number, shift: number, neg: boolean, out: ParsedTime,
): string | null {
  // The millisecond integer is the digits up to position intEnd + shift; digits after it are the remainder.
  const cut = intEnd + shift; // index in the virtual digit string (integer then fraction digits)
  let ms = 0;
  let rest = false;
  let digits = 0;
  for (let k = i; k < intEnd; k++) {
    const d = s.charCodeAt(k) - 48;
    if (k < cut) {
      if (d !== 0 || digits > 0) digits++;
      ms = ms * 10 + d;
    } else if (d !== 0) rest = true;
  }
  for (let k = 0; k < shift; k++) {
    const at = fracStart + k;
    const d = at < fracEnd ? s.charCodeAt(at) - 48 : 0;
    if (d !== 0 || digits > 0) digits++;
    ms = ms * 10 + d;
  }
  for (let at = fracStart + (shift > 0 ? shift : 0); at < fracEnd; at++) if (s.charCodeAt(at) !== 48) rest = true;
  if (digits > 16 || ms > MAX_MS) return 'out-of-range: the epoch number lies outside the dates JavaScript can hold (-271821-04-20 to +275760-09-13)';
  if (neg) ms = rest ? -ms - 1 : -ms;
  if (ms < -MAX_MS) return 'out-of-range: the epoch number lies outside the dates JavaScript can hold (-271821-04-20 to +275760-09-13)';
  out.kind = 'instant';
  out.ms = ms === 0 ? 0 : ms;
  out.offset = 0;
  out.unit = null;
  out.endMs = NaN;
  out.leapSecond = false;
  return null;
}
