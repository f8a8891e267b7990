// ISO 8601 durations (ISO 8601-1:2019 §5.5.2): PnYnMnDTnHnMnS and PnW, e.g. P3M, PT30M, P1W, P1DT2H.
// A decimal fraction (point or comma) is allowed on the last component when it is hours, minutes or
// seconds (years, months, weeks and days are nominal calendar units and take whole numbers); it is
// truncated to the millisecond. A leading '-' (ISO 8601-2) negates the whole duration.
import { QuernError } from '../errors.js';
import { daysFromCivil, daysInMonth, civilFromDays, MS_PER_DAY } from '../calendar/civil.js';
import type { UnitName } from '../calendar/types.js';
import { countDigits, MS_PER_HOUR, MS_PER_MINUTE, notRecognised } from './scan.js';

/** Plain fields of an ISO 8601 duration; every field a non-negative integer, `sign` applies to all. */
export interface IsoDuration {
  sign: 1 | -1;
  years: number;
  months: number;
  weeks: number;
  days: number;
  hours: number;
  minutes: number;
  seconds: number;
  milliseconds: number;
}

/** A zero duration to fill. */
export function emptyDuration(): IsoDuration {
  return { sign: 1, years: 0, months: 0, weeks: 0, days: 0, hours: 0, minutes: 0, seconds: 0, milliseconds: 0 };
}

function clear(d: IsoDuration): void {
  d.sign = 1;
  d.years = d.months = d.weeks = d.days = d.hours = d.minutes = d.seconds = d.milliseconds = 0;
}

/** Position of a designator in its list (Y M W D before T, H M S after), or -1. */
function designatorIndex(inTime: boolean, code: number): number {
  if (inTime) return code === 72 ? 0 : code === 77 ? 1 : code === 83 ? 2 : -1;
  return code === 89 ? 0 : code === 77 ? 1 : code === 87 ? 2 : code === 68 ? 3 : -1;
}

function setField(d: IsoDuration, inTime: boolean, designator: number, whole: number, q: number, scale: number): void {
  if (!inTime) {
    if (designator === 89) d.years = whole;
    else if (designator === 77) d.months = whole;
    else if (designator === 87) d.weeks = whole;
    else d.days = whole;
    return;
  }
  const unitMs = designator === 72 ? MS_PER_HOUR : designator === 77 ? MS_PER_MINUTE : 1000;
  if (designator === 72) d.hours = whole;
  else if (designator === 77) d.minutes = whole;
  else d.seconds = whole;
  let extra = Math.floor((q * unitMs) / scale);
  // Spread a fraction of hours or minutes over the smaller fields, truncated to the millisecond.
  if (designator === 72) { d.minutes += Math.floor(extra / MS_PER_MINUTE); extra %= MS_PER_MINUTE; }
  if (designator !== 83) { d.seconds += Math.floor(extra / 1000); extra %= 1000; }
  d.milliseconds = extra;
}

/**
 * Reads an ISO 8601 duration in s[start, end) into `d` without allocating on success.
 * Returns null or a reason ('invalid-duration: …').
 */
export function scanDuration(s: string, start: number, end: number, d: IsoDuration): string | null {
  clear(d);
  let i = start;
  if (i < end && s.charCodeAt(i) === 45) { d.sign = -1; i++; }
  if (i >= end || (s.charCodeAt(i) !== 80 && s.charCodeAt(i) !== 112)) return notRecognised(s, 'an ISO 8601 duration (it starts with P)');
  i++;
  let inTime = false;
  let order = -1; // index of the last designator in its list, to keep components in order
  let any = false;
  let fractionSeen = false;
  while (i < end) {
    let c = s.charCodeAt(i);
    if (c === 84 || c === 116) {
      if (inTime) return 'invalid-duration: T appears twice';
      inTime = true;
      order = -1;
      i++;
      if (i >= end) return 'invalid-duration: T must be followed by hours, minutes or seconds';
      continue;
    }
    if (fractionSeen) return 'invalid-duration: only the last component may have a decimal fraction';
    const n = countDigits(s, i, end);
    if (n === 0 || n > 15) return notRecognised(s, 'an ISO 8601 duration (each component is a number and a designator)');
    let whole = 0;
    for (let k = 0; k < n; k++) whole = whole * 10 + (s.charCodeAt(i + k) - 48);
    i += n;
    let q = 0;
    let scale = 1;
    c = s.charCodeAt(i);
    if (c === 46 || c === 44) {
      const m = countDigits(s, i + 1, end);
      if (m === 0) return 'invalid-duration: a decimal sign must be followed by digits';
      for (let k = 0; k < m && k < 9; k++) { q = q * 10 + (s.charCodeAt(i + 1 + k) - 48); scale *= 10; }
      i += 1 + m;
      fractionSeen = true;
    }
    if (i >= end) return 'invalid-duration: a number must be followed by a designator (Y, M, W, D, H, M or S)';
    const des = s.charCodeAt(i) & ~32;
    const at = designatorIndex(inTime, des);
    if (at < 0) return `invalid-duration: ${JSON.stringify(String.fromCharCode(s.charCodeAt(i)))} is not a ${inTime ? 'time' : 'date'} designator here`;
    if (at <= order) return 'invalid-duration: components must appear once each, largest first';
    if (q > 0 && !inTime) return 'invalid-duration: years, months, weeks and days take whole numbers';
    order = at;
    setField(d, inTime, des, whole, q, scale);
    any = true;
    i++;
  }
  if (!any) return 'invalid-duration: a duration needs at least one component, as in P1D or PT15M';
  return null;
}

/**
 * Parses an ISO 8601 duration typed by a user (P3M, PT30M, P1W, P1DT2H) into plain fields.
 * Throws QuernError('E_VALUE') naming the value when it is malformed.
 */
export function parseIsoDuration(text: string): IsoDuration {
  const d = emptyDuration();
  const t = text.trim();
  const r = scanDuration(t, 0, t.length, d);
  if (r !== null) throw new QuernError('E_VALUE', `${JSON.stringify(text)} is not a valid ISO 8601 duration: ${r}`, 'write a duration such as P1D, P1W, P3M or PT15M');
  return d;
}

/** Milliseconds of the clock part (hours, minutes, seconds) of a duration. */
function clockMs(d: IsoDuration): number {
  return d.hours * MS_PER_HOUR + d.minutes * MS_PER_MINUTE + d.seconds * 1000 + d.milliseconds;
}

/**
 * Adds a duration to a wall-clock reading: years and months by field arithmetic with the day clamped to the
 * month's end (2021-01-31 + P1M = 2021-02-28, as Temporal's "constrain"), weeks and days as calendar days,
 * then hours, minutes and seconds. `sign` is applied to every component.
 */
export function addDurationToWall(wallMs: number, d: IsoDuration, scratch: number[] = [0, 0, 0]): number {
  let days = Math.floor(wallMs / MS_PER_DAY);
  const timeOfDay = wallMs - days * MS_PER_DAY;
  const monthsToAdd = d.sign * (d.years * 12 + d.months);
  if (monthsToAdd !== 0) {
    civilFromDays(days, scratch);
    const total = scratch[0]! * 12 + (scratch[1]! - 1) + monthsToAdd;
    const y = Math.floor(total / 12);
    const m = total - y * 12 + 1;
    const dd = Math.min(scratch[2]!, daysInMonth(y, m));
    days = daysFromCivil(y, m, dd);
  }
  days += d.sign * (d.weeks * 7 + d.days);
  return days * MS_PER_DAY + timeOfDay + d.sign * clockMs(d);
}

/** The unit a duration of exactly one unit names (P1W → 'week', PT1H → 'hour'); null for anything else. */
export function durationUnit(d: IsoDuration): UnitName | null {
  const parts = [d.years, d.months, d.weeks, d.days, d.hours, d.minutes, d.seconds, d.milliseconds];
  const units: UnitName[] = ['year', 'month', 'week', 'day', 'hour', 'minute', 'second', 'millisecond'];
  let found: UnitName | null = null;
  for (let k = 0; k < parts.length; k++) {
    if (parts[k] === 0) continue;
    if (parts[k] !== 1 || found !== null) return null;
    found = units[k]!;
  }
  return found;
}
