// makeWrittenUnitReader: the finest clock unit a value's text writes. The texts are written by the Temporal
// polyfill (an independent ISO 8601 implementation) with a chosen smallestUnit, so the expected unit is the
// one the writer was asked for, never computed by quern.
import { describe, expect, it } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { timeFormat } from '../../src/time/format.js';
import { commonWrittenUnit, makeWrittenUnitReader } from '../../src/time/written-unit.js';
import { seeded } from '../helpers/seeded.js';

describe('makeWrittenUnitReader on ISO 8601 texts', () => {
  const offsetReader = makeWrittenUnitReader(timeFormat('iso-date-time-offset'));
  const localReader = makeWrittenUnitReader(timeFormat('iso-date-time'));

  it('gives the smallestUnit Temporal wrote each instant with (Temporal.Instant.prototype.toString)', () => {
    const rnd = seeded(41);
    const units = ['minute', 'second', 'millisecond'] as const;
    for (let k = 0; k < 500; k++) {
      const ms = Date.UTC(1990, 0, 1) + Math.floor(rnd() * 40 * 365 * 86_400_000);
      const unit = units[k % 3]!;
      const zone = k % 2 === 0 ? 'UTC' : 'America/Chicago';
      const text = Temporal.Instant.fromEpochMilliseconds(ms).toString({ smallestUnit: unit, timeZone: zone });
      // smallestUnit 'millisecond' always writes three fraction digits, even .000: the notation says milliseconds.
      expect(offsetReader(text), text).toBe(unit);
    }
  });

  it('gives the smallestUnit of wall-clock readings (Temporal.PlainDateTime.prototype.toString)', () => {
    const rnd = seeded(42);
    for (const unit of ['minute', 'second', 'millisecond'] as const) {
      for (let k = 0; k < 100; k++) {
        const ms = Date.UTC(2000, 0, 1) + Math.floor(rnd() * 20 * 365 * 86_400_000);
        const text = Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO('UTC').toPlainDateTime().toString({ smallestUnit: unit });
        expect(localReader(text), text).toBe(unit);
      }
    }
  });

  it.each([
    // ISO 8601-1:2019 §5.3.1.3, reduced precision (from memory): hh:mm and hh omit the lower components;
    // the basic format drops the colons (§5.3.1.1); a decimal fraction may follow the last component (§5.3.1.4).
    ['2024-03-05T08Z', 'hour'],
    ['2024-03-05T08:15Z', 'minute'],
    ['2024-03-05T08:15:00+01:00', 'second'],
    ['2024-03-05 08:15:00Z', 'second'], // RFC 3339 §5.6 note: a space may stand for T
    ['2024-03-05T08:15:00,5Z', 'millisecond'], // a comma is a decimal sign too (ISO 8601-1:2019 §3.2.6, from memory)
    ['2024-03-05T08:15.5Z', 'millisecond'], // a fraction of a minute
    ['20240305T0815Z', 'minute'],
    ['20240305T081500Z', 'second'],
    ['  2024-03-05T08:15:00Z ', 'second'],
  ])('%s writes to the %s', (text, unit) => {
    expect(offsetReader(text)).toBe(unit);
  });

  it('a date alone, or text that is no date-time, writes no clock unit', () => {
    expect(offsetReader('2024-03-05')).toBeNull();
    expect(offsetReader('2024-W10')).toBeNull();
    expect(offsetReader('not a date')).toBeNull();
    expect(offsetReader('')).toBeNull();
  });
});

describe('makeWrittenUnitReader on other formats', () => {
  it('epoch seconds write seconds unless they carry a fraction; finer epoch units write milliseconds (POSIX seconds since the Epoch)', () => {
    const s = makeWrittenUnitReader(timeFormat('epoch-seconds'));
    expect(s('1700000000')).toBe('second');
    expect(s('-86400')).toBe('second');
    expect(s('1700000000.25')).toBe('millisecond');
    expect(makeWrittenUnitReader(timeFormat('epoch-milliseconds'))('1700000000000')).toBe('millisecond');
    const auto = makeWrittenUnitReader(timeFormat('epoch-auto'));
    // Digit bands of epochUnitOfDigits: 10 digits are seconds, 13 milliseconds (common practice).
    expect(auto('1700000000')).toBe('second');
    expect(auto('1700000000000')).toBe('millisecond');
  });

  it('numeric and month-name dates with a time after them write the time\'s unit; without one, none', () => {
    const dmy = makeWrittenUnitReader(timeFormat('day-month-year'));
    expect(dmy('25/03/2024 08:15')).toBe('minute');
    expect(dmy('25/03/2024 08:15:30')).toBe('second');
    expect(dmy('25/03/2024')).toBeNull();
    const named = makeWrittenUnitReader(timeFormat('day-month-name-year'));
    expect(named('5 Apr 2021 13:30')).toBe('minute');
    expect(named('5 Apr 2021')).toBeNull();
    expect(makeWrittenUnitReader(timeFormat('month-name-day-year'))('April 5, 2021 13:30:05')).toBe('second');
  });

  it('spreadsheet serial numbers and named periods write no clock unit (a fraction of a day has none)', () => {
    expect(makeWrittenUnitReader(timeFormat('serial-1900'))('45000.5')).toBeNull();
    expect(makeWrittenUnitReader(timeFormat('quarter'))('2024-Q1')).toBeNull();
  });
});

describe('commonWrittenUnit', () => {
  const r = makeWrittenUnitReader(timeFormat('iso-date-time-offset'));
  it('is the finest unit among the values, and null if any value writes none', () => {
    expect(commonWrittenUnit(r, ['2024-03-05T08Z', '2024-03-05T09:15Z'])).toBe('minute');
    expect(commonWrittenUnit(r, ['2024-03-05T08:15:00Z', '2024-03-05T09:15:00.000Z'])).toBe('millisecond');
    expect(commonWrittenUnit(r, ['2024-03-05T08:15:00Z', '2024-03-05'])).toBeNull();
    expect(commonWrittenUnit(r, [])).toBeNull();
  });
});
