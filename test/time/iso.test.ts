// makeTimeParser for ISO 8601 / RFC 3339 formats: the allocation-free ISO path.
import { describe, it, expect } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { read, code } from './read.js';

describe('makeTimeParser(iso) reads ISO 8601-1 representations', () => {
  // The 1985-04-12 examples are those of ISO 8601:2004 §4.1.2.2, §4.1.3.2, §4.1.4.2 and §4.3.2 (from
  // memory); Friday 1985-04-12 is day 102 and 1985-W15-5, which Temporal confirms in the next test.
  it.each([
    ['1985-04-12', '1985-04-12T00:00:00.000Z', '1985-04-13T00:00:00.000Z', 'day'], // ISO 8601 §4.1.2.2 extended
    ['19850412', '1985-04-12T00:00:00.000Z', '1985-04-13T00:00:00.000Z', 'day'], // ISO 8601 §4.1.2.2 basic
    ['1985-102', '1985-04-12T00:00:00.000Z', '1985-04-13T00:00:00.000Z', 'day'], // ISO 8601 §4.1.3.2 extended ordinal
    ['1985102', '1985-04-12T00:00:00.000Z', '1985-04-13T00:00:00.000Z', 'day'], // ISO 8601 §4.1.3.2 basic ordinal
    ['1985-W15-5', '1985-04-12T00:00:00.000Z', '1985-04-13T00:00:00.000Z', 'day'], // ISO 8601 §4.1.4.2 extended week date
    ['1985W155', '1985-04-12T00:00:00.000Z', '1985-04-13T00:00:00.000Z', 'day'], // ISO 8601 §4.1.4.2 basic week date
    ['1985-W15', '1985-04-08T00:00:00.000Z', '1985-04-15T00:00:00.000Z', 'iso-week'], // ISO 8601 §4.1.4.3 reduced week
    ['1985W15', '1985-04-08T00:00:00.000Z', '1985-04-15T00:00:00.000Z', 'iso-week'], // ISO 8601 §4.1.4.3 basic
    ['1985-04', '1985-04-01T00:00:00.000Z', '1985-05-01T00:00:00.000Z', 'month'], // ISO 8601 §4.1.2.3 a) year and month
    ['1985', '1985-01-01T00:00:00.000Z', '1986-01-01T00:00:00.000Z', 'year'], // ISO 8601 §4.1.2.3 b) a year
    ['2021-W14', '2021-04-05T00:00:00.000Z', '2021-04-12T00:00:00.000Z', 'iso-week'], // issue 2 example; Monday 2021-04-05, common practice
    ['2021-095', '2021-04-05T00:00:00.000Z', '2021-04-06T00:00:00.000Z', 'day'], // issue 2 example; Temporal dayOfYear 95
    ['0000-01-01', '0000-01-01T00:00:00.000Z', '0000-01-02T00:00:00.000Z', 'day'], // ISO 8601 §4.1.2.1: year 0000 is 1 BCE proleptic
    ['+275760-09-12', '+275760-09-12T00:00:00.000Z', '+275760-09-13T00:00:00.000Z', 'day'], // ECMA-262 §21.4.1.1 time value limit 8.64e15
  ])('reads %s as a period', (text, at, end, unit) => {
    expect(read('iso-date', text)).toEqual({ kind: 'period', at, end, unit });
  });

  it('agrees with Temporal that 1985-04-12 is day 102 and 1985-W15-5', () => {
    const d = Temporal.PlainDate.from('1985-04-12'); // Temporal polyfill as oracle
    expect([d.dayOfYear, d.weekOfYear, d.dayOfWeek]).toEqual([102, 15, 5]);
  });

  // REFERENCES §1 (ISO week dates at year boundaries, Computed with Temporal; PostgreSQL docs for 2004/2005/2006).
  it.each([
    ['2004-W53-5', '2004-12-31'], ['2004-W53-6', '2005-01-01'], ['2004-W53-7', '2005-01-02'], // PostgreSQL docs; Computed
    ['2005-W52-7', '2006-01-01'], // PostgreSQL docs
    ['2008-W52-7', '2008-12-28'], ['2009-W01-1', '2008-12-29'], // Computed
    ['2009-W53-4', '2009-12-31'], ['2009-W53-5', '2010-01-01'], ['2009-W53-7', '2010-01-03'], // Computed; vendor doc
    ['2015-W53-4', '2015-12-31'], ['2015-W53-7', '2016-01-03'], // Computed
    ['2020-W53-4', '2020-12-31'], ['2020-W53-7', '2021-01-03'], // Computed
    ['1999-W52-6', '2000-01-01'], ['2000-W01-1', '2000-01-03'], // Computed
    ['2011-W52-7', '2012-01-01'], ['2012-W01-1', '2012-01-02'], // Computed
    ['2013-W01-1', '2012-12-31'], // PostgreSQL docs; Computed
    ['2025-W01-1', '2024-12-30'], ['2025-W01-2', '2024-12-31'], // Computed; PostgreSQL list thread
    ['2026-W01-1', '2025-12-29'], // Computed
    ['2026-W53-4', '2026-12-31'], ['2026-W53-7', '2027-01-03'], // Computed
  ])('reads week date %s as %s (REFERENCES §1)', (text, date) => {
    const r = read('iso-week-date', text);
    expect(r).toMatchObject({ kind: 'period', unit: 'day', at: `${date}T00:00:00.000Z` });
  });

  // REFERENCES §1: ISO years with 53 weeks 2000–2040 are 2004, 2009, 2015, 2020, 2026, 2032, 2037.
  it('accepts week 53 exactly in the 53-week years of 2000–2040 (REFERENCES §1)', () => {
    const long = [2004, 2009, 2015, 2020, 2026, 2032, 2037];
    for (let y = 2000; y <= 2040; y++) {
      expect(code('iso-week', `${y}-W53`)).toBe(long.includes(y) ? 'ok' : 'invalid-week');
    }
  });
});

describe('makeTimeParser(iso) reads date-times', () => {
  // RFC 3339 §5.8 examples, quoted from memory of the RFC's text.
  it.each([
    ['1985-04-12T23:20:50.52Z', 'instant', '1985-04-12T23:20:50.520Z', 0, false], // RFC 3339 §5.8
    ['1996-12-19T16:39:57-08:00', 'instant', '1996-12-20T00:39:57.000Z', -480, false], // RFC 3339 §5.8
    ['1990-12-31T23:59:60Z', 'instant', '1990-12-31T23:59:59.999Z', 0, true], // RFC 3339 §5.8 leap second
    ['1990-12-31T15:59:60-08:00', 'instant', '1990-12-31T23:59:59.999Z', -480, true], // RFC 3339 §5.8 same leap second
    ['1937-01-01T12:00:27.87+00:20', 'instant', '1937-01-01T11:40:27.870Z', 20, false], // RFC 3339 §5.8 Netherlands time
    ['1985-04-12t23:20:50.52z', 'instant', '1985-04-12T23:20:50.520Z', 0, false], // RFC 3339 §5.6 NOTE: t and z may be lower case
    ['1985-04-12 23:20:50Z', 'instant', '1985-04-12T23:20:50.000Z', 0, false], // RFC 3339 §5.6 NOTE: space separator
  ])('reads %s', (text, kind, at, offset, leap) => {
    const r = read('iso-date-time-offset', text);
    expect(r).toEqual(leap ? { kind, at, offset, leap: true } : { kind, at, offset });
  });

  // ISO 8601:2004 §4.2.2 and §4.3.2 time and combined examples (from memory).
  it.each([
    ['19850412T101530', '1985-04-12T10:15:30.000Z'], // ISO 8601 §4.3.2 basic
    ['1985-04-12T10:15:30', '1985-04-12T10:15:30.000Z'], // ISO 8601 §4.3.2 extended
    ['1985-04-12T10:15', '1985-04-12T10:15:00.000Z'], // ISO 8601 §4.2.2.3 reduced precision
    ['1985-04-12T10', '1985-04-12T10:00:00.000Z'], // ISO 8601 §4.2.2.3 hours only
    ['1985-04-12T23:20:50,5', '1985-04-12T23:20:50.500Z'], // ISO 8601 §4.2.2.4 comma decimal sign
    ['1985-04-12T23:20,5', '1985-04-12T23:20:30.000Z'], // ISO 8601 §4.2.2.4 decimal fraction of a minute
    ['1985-04-12T23,5', '1985-04-12T23:30:00.000Z'], // ISO 8601 §4.2.2.4 decimal fraction of an hour
    ['20210405T1330', '2021-04-05T13:30:00.000Z'], // issue 2 example of basic format
    ['1985-W15-5T10:15', '1985-04-12T10:15:00.000Z'], // ISO 8601 §4.3.3 week date and time
    ['1985-102T10:15', '1985-04-12T10:15:00.000Z'], // ISO 8601 §4.3.3 ordinal date and time
    ['2021-04-05T13:30:00.123456789', '2021-04-05T13:30:00.123Z'], // quern rule: fractions truncated to the millisecond
    ['2021-04-05T23:59:59.9999', '2021-04-05T23:59:59.999Z'], // quern rule: truncated, never rounded into the next day
    ['2021-04-05T24:00', '2021-04-06T00:00:00.000Z'], // ISO 8601 §4.2.3: 24:00 is the end of the day
    ['2021-12-31T24:00:00.000', '2022-01-01T00:00:00.000Z'], // ISO 8601 §4.2.3 end of the year's last day
    ['  2021-04-05T13:30  ', '2021-04-05T13:30:00.000Z'], // quern rule: surrounding spaces ignored
  ])('reads local %s', (text, at) => {
    expect(read('iso-date-time', text)).toEqual({ kind: 'local', at });
  });

  it.each([
    ['2021-04-05T13:30+0200', '2021-04-05T11:30:00.000Z', 120], // ISO 8601 §4.2.5.1 basic offset
    ['2021-04-05T13:30+02', '2021-04-05T11:30:00.000Z', 120], // ISO 8601 §4.2.5.1 hours-only offset
    ['2021-04-05T13:30-05:30', '2021-04-05T19:00:00.000Z', -330], // ISO 8601 §4.2.5.1 extended offset
    ['2021-04-05T13:30\u221205:00', '2021-04-05T18:30:00.000Z', -300], // ISO 8601-1:2019 §3.2.4: U+2212 minus sign
    ['20210405T133000Z', '2021-04-05T13:30:00.000Z', 0], // ISO 8601 §4.3.2 basic with Z
    ['2021-12-31T24:00Z', '2022-01-01T00:00:00.000Z', 0], // ISO 8601 §4.2.3 with an offset
  ])('reads instant %s', (text, at, offset) => {
    expect(read('iso-date-time-offset', text)).toEqual({ kind: 'instant', at, offset });
  });

  it('reads Temporal the same leap second as 23:59:59 while quern keeps it in the same second with a flag', () => {
    // REFERENCES §4: Temporal turns 2016-12-31T23:59:60Z into 23:59:59Z.
    expect(Temporal.Instant.from('2016-12-31T23:59:60Z').toString()).toBe('2016-12-31T23:59:59Z');
    expect(read('iso-date-time-offset', '2016-12-31T23:59:60Z')).toEqual({ kind: 'instant', at: '2016-12-31T23:59:59.999Z', offset: 0, leap: true });
  });
});

describe('makeTimeParser(iso) refuses impossible values with a reason, never rolling over', () => {
  it.each([
    ['2021-02-29', 'invalid-date', 'not a leap year'], // Gregorian rule: 2021 is not divisible by 4
    ['1900-02-29', 'invalid-date', 'not a leap year'], // Gregorian rule: century years need divisibility by 400
    ['2022-13-31', 'invalid-date', 'month 13'], // ISO 8601 §3.2.1: months 01–12
    ['2022-00-10', 'invalid-date', 'month 00'], // ISO 8601 §3.2.1
    ['2021-04-31', 'invalid-date', 'April 2021 has 30 days'], // Gregorian month lengths
    ['2021-04-00', 'invalid-date', 'day 0'], // ISO 8601 §3.2.1: days from 01
    ['2021-000', 'invalid-date', 'day 000'], // ISO 8601 §4.1.3: ordinal days 001–365/366
    ['2021-366', 'invalid-date', '365 days'], // 2021 is a common year
    ['2021-04-05T24:01', 'invalid-time', '24:01'], // ISO 8601 §4.2.3: only 24:00 itself
    ['2021-04-05T24:00:01', 'invalid-time', '24:00'], // ISO 8601 §4.2.3
    ['2021-04-05T25:00', 'invalid-time', 'hour 25'], // ISO 8601 §4.2.1: hours 00–24
    ['2021-04-05T12:60', 'invalid-time', 'minute 60'], // ISO 8601 §4.2.1
    ['2021-04-05T12:00:61', 'invalid-time', 'second 61'], // ISO 8601 §4.2.1: 60 only as a leap second
    ['2021-04-05T12:00:60Z', 'invalid-time', '23:59:60 UTC'], // RFC 3339 §5.7: leap seconds at the end of a UTC day
    ['2021-W53', 'invalid-week', '52 ISO weeks'], // REFERENCES §1: 2021 is not a 53-week year
    ['2021-W00', 'invalid-week', 'week 00'], // ISO 8601 §4.1.4: weeks from 01
    ['2021-W10-8', 'invalid-week', 'weekday 8'], // ISO 8601 §4.1.4: weekdays 1–7
    ['2021-04-05T12:00+24:00', 'invalid-offset', '+24:00'], // ISO 8601 §4.2.5: hours of an offset up to 23
    ['+275760-09-14', 'out-of-range', 'JavaScript'], // ECMA-262 §21.4.1.1: ±8.64e15 ms
    ['-271821-04-19', 'out-of-range', 'JavaScript'], // ECMA-262 §21.4.1.1
    ['-000000-01-01', 'invalid-date', '-000000'], // ISO 8601 §4.1.2.4 / RFC 3339: negative zero year is not allowed (Temporal agrees)
    ['202104', 'not-recognised', 'YYYYMM'], // ISO 8601 §4.1.2.3: basic year-month is not allowed
    ['2021-4-5', 'not-recognised', 'ISO 8601'], // ISO 8601: fixed two-digit fields
    ['2021-04-05T12:00:00.', 'not-recognised', 'decimal sign'], // ISO 8601 §4.2.2.4: a fraction needs digits
    ['2021-04T10:00', 'not-recognised', 'full date'], // a time follows a complete date only
    ['', 'empty', 'empty'], // common practice
  ])('refuses %s with %s', (text, reason, words) => {
    const r = read('iso-date-time-offset', text);
    expect(typeof r).toBe('string');
    expect((r as string).split(':')[0]).toBe(reason);
    expect(r).toContain(words);
  });

  it('explains February 29 of a common year in plain words', () => {
    expect(read('iso-date', '2021-02-29')).toBe('invalid-date: 2021 is not a leap year, so February has 28 days');
  });
});

describe('makeTimeParser(iso, {strictKind})', () => {
  it('refuses a date among offset date-times only when asked', () => {
    expect(code('iso-date-time-offset', '2021-04-05')).toBe('ok'); // default: each value keeps its own kind
    expect(code('iso-date-time-offset', '2021-04-05', { strictKind: true })).toBe('other-kind');
    expect(code('iso-date-time-offset', '2021-04-05T10:00', { strictKind: true })).toBe('other-kind');
    expect(code('iso-date-time-offset', '2021-04-05T10:00Z', { strictKind: true })).toBe('ok');
  });
});

describe('makeTimeParser(iso) on hostile text (issue 9)', () => {
  it('asks for a sign on years of more than four digits', () => {
    expect(read('iso-date', '275760-09-14')).toMatch(/^not-recognised: .*with a sign.*\+275760/); // ISO 8601 §4.1.2.4 expanded years
    expect(code('iso-date', '+275760-09-14')).toBe('out-of-range'); // ECMA-262 §21.4.1.1
  });

  it('answers a one-megabyte value with a short reason', () => {
    const r = read('iso-date-time-offset', '2'.repeat(1_000_000));
    expect(typeof r === 'string' && r.length < 300).toBe(true);
    expect(code('iso-date-time-offset', `2021-04-05T10:00:00.${'9'.repeat(100_000)}Z`)).toBe('ok'); // any number of fraction digits
  });
});
