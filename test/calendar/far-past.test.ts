// Sub-day periods at the far ends of the ECMAScript time range (±8.64e15 ms, ECMA-262 §21.4.1.1): the
// calendar gives the same floor as temporal-polyfill (the oracle) in local mean time, without walking
// the zone table year by year (the suite's timeout would catch a walk of 270,000 years).
import { Temporal } from 'temporal-polyfill';
import { describe, expect, it } from 'vitest';
import { makeCalendar } from '../../src/calendar/index.js';
import type { UnitName } from '../../src/calendar/types.js';

/** Floor of `ms` to `unit` × `step` on the wall clock of `zone`, by temporal-polyfill. */
function oracleFloor(ms: number, zone: string, unit: 'hour' | 'minute', step: number): number {
  const z = Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(zone);
  const wall = z.toPlainDateTime();
  const field = unit === 'hour' ? wall.hour : wall.minute;
  const floored = wall.round({ smallestUnit: unit, roundingMode: 'floor' }).subtract(unit === 'hour' ? { hours: field % step } : { minutes: field % step });
  return floored.toZonedDateTime(zone, { disambiguation: 'earlier' }).epochMilliseconds;
}

const cases: Array<[string, number, UnitName, number]> = [
  // The first day of the time range, -271821-04-20 (ECMA-262), and a day later to stay inside in every zone.
  ['Europe/Paris', -8.64e15 + 2 * 86_400_000 + 12_345_678, 'hour', 1],
  ['America/New_York', -8.64e15 + 5 * 86_400_000 + 7_654_321, 'minute', 15],
  ['Asia/Kathmandu', -8.64e15 + 9 * 86_400_000, 'hour', 6],
  // The year 1 and the year 1799, before any zone's first transition.
  ['Australia/Lord_Howe', Date.UTC(2000, 0, 1) - 1999 * 31_556_952_000 + 1_234_567, 'minute', 30],
  ['Europe/London', Date.UTC(1799, 11, 31, 23, 59, 30), 'hour', 1],
  // Just after 1800 the table is read as before: London's local mean time until 1847 (tzdb, from memory).
  ['Europe/London', Date.UTC(1800, 0, 1, 0, 0, 30), 'minute', 1],
];

describe('makeCalendar(sub-day unit) in the far past', () => {
  it.each(cases)('floor in %s at %d (%s × %d) equals temporal-polyfill', (zone, ms, unit, step) => {
    const cal = makeCalendar({ unit, step, zone });
    const want = oracleFloor(ms, zone, unit as 'hour' | 'minute', step);
    expect(cal.floor(ms)).toBe(want);
    expect(cal.startOf(cal.index(ms))).toBe(want);
    expect(cal.next(want)).toBe(oracleFloor(want + step * (unit === 'hour' ? 3_600_000 : 60_000), zone, unit as 'hour' | 'minute', step));
  });
});
