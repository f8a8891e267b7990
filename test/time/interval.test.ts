// makeTimeParser(iso-interval) and parseIsoDuration. Interval and duration examples are those of
// ISO 8601:2004 §4.4.3–§4.4.5 (from memory); Temporal.Duration.from is the oracle for duration fields.
import { describe, it, expect } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { parseIsoDuration, isQuernError, makeTimeParser, emptyParsedTime } from '../../src/index.js';
import { read, code } from './read.js';

describe('makeTimeParser(iso-interval)', () => {
  it.each([
    // ISO 8601 §4.4.5 examples (from memory): start/end, start/duration, duration/end name the same interval.
    ['2007-03-01T13:00:00Z/2008-05-11T15:30:00Z', '2007-03-01T13:00:00.000Z', '2008-05-11T15:30:00.000Z', 0, null],
    ['2007-03-01T13:00:00Z/P1Y2M10DT2H30M', '2007-03-01T13:00:00.000Z', '2008-05-11T15:30:00.000Z', 0, null],
    ['P1Y2M10DT2H30M/2008-05-11T15:30:00Z', '2007-03-01T13:00:00.000Z', '2008-05-11T15:30:00.000Z', 0, null],
    // Team label notation: weeks with another start day and sub-day slots as start/duration.
    ['2024-03-10/P1W', '2024-03-10T00:00:00.000Z', '2024-03-17T00:00:00.000Z', undefined, 'week'],
    ['2024-03-10T08:15-05:00/PT15M', '2024-03-10T08:15:00.000Z', '2024-03-10T08:30:00.000Z', -300, null],
    ['2024-03-10T08:00-05:00/PT1H', '2024-03-10T08:00:00.000Z', '2024-03-10T09:00:00.000Z', -300, 'hour'],
    // quern rule: an end written as a date covers that whole date.
    ['2021-04-05/2021-04-11', '2021-04-05T00:00:00.000Z', '2021-04-12T00:00:00.000Z', undefined, null],
    // quern rule: months are added by field arithmetic with the day clamped (as Temporal's "constrain").
    ['2021-01-31/P1M', '2021-01-31T00:00:00.000Z', '2021-02-28T00:00:00.000Z', undefined, 'month'],
    // quern rule: bounds are wall-clock readings at the start's offset (a 25-hour day: 04:00Z to 05:00Z next day).
    ['2024-11-03T00:00-04:00/2024-11-04T00:00-05:00', '2024-11-03T00:00:00.000Z', '2024-11-04T01:00:00.000Z', -240, null],
  ])('reads %s', (text, at, end, offset, unit) => {
    const want: Record<string, unknown> = { kind: 'period', at, end, unit };
    if (offset !== undefined) want.offset = offset;
    expect(read('iso-interval', text)).toEqual(want);
  });

  it('agrees with Temporal on the end of start/duration intervals', () => {
    // Temporal as oracle: PlainDateTime.add with the same duration ("constrain" overflow).
    for (const [start, dur] of [['2021-01-31T10:00', 'P1M'], ['2020-02-29T00:00', 'P1Y'], ['2021-03-27T12:00', 'P1DT12H'], ['2021-12-31T23:30', 'PT45M']] as const) {
      const want = Temporal.PlainDateTime.from(start).add(Temporal.Duration.from(dur)).toZonedDateTime('UTC').epochMilliseconds;
      expect(read('iso-interval', `${start}/${dur}`)).toMatchObject({ end: new Date(want).toISOString() });
    }
  });

  it.each([
    ['2021-04-12/2021-04-05', 'invalid-interval'], // the end before the start
    ['P1D/P2D', 'invalid-interval'], // ISO 8601 §4.4.4: two durations do not make an interval
    ['2021-04-05T10:00/2021-04-05T11:00Z', 'invalid-interval'], // only the end has an offset
    ['2021-04-05', 'not-recognised'], // no solidus
    ['2021-02-29/P1D', 'invalid-date'],
    ['2021-04-05/P1X', 'invalid-duration'],
  ])('refuses %s with %s', (text, reason) => {
    expect(code('iso-interval', text)).toBe(reason);
  });
});

describe('parseIsoDuration', () => {
  it.each([
    ['P3Y6M4DT12H30M5S'], // ISO 8601 §4.4.3.2 example (from memory)
    ['P3M'], ['PT30M'], ['P1W'], ['P1DT2H'], // issue 2 examples
    ['PT0.5S'], ['PT1.25S'], ['P0D'], ['PT36H'], ['P2W'], ['-P1D'],
  ])('reads %s with the fields Temporal.Duration.from gives', (text) => {
    const d = parseIsoDuration(text);
    const t = Temporal.Duration.from(text); // Temporal polyfill as oracle
    expect([d.years, d.months, d.weeks, d.days, d.hours, d.minutes, d.seconds, d.milliseconds].map((x) => x * d.sign + 0))
      .toEqual([t.years, t.months, t.weeks, t.days, t.hours, t.minutes, t.seconds, t.milliseconds].map((x) => x + 0));
  });

  it('spreads a fraction of an hour over minutes and seconds, truncated to the millisecond (ISO 8601 §4.4.3.2)', () => {
    expect(parseIsoDuration('PT1.5H')).toMatchObject({ hours: 1, minutes: 30, seconds: 0, milliseconds: 0 });
    expect(parseIsoDuration('PT0,5M')).toMatchObject({ minutes: 0, seconds: 30 });
  });

  it.each([
    ['P'], ['PT'], ['P1H'], ['PT1D'], ['P1M1Y'], ['1D'], ['P1.5D'], ['PT1.5H30M'], ['P1DT'], ['P1Y1Y'], ['P-1D'], [''],
  ])('refuses %s with E_VALUE naming the value', (text) => {
    let caught: unknown;
    try {
      parseIsoDuration(text);
    } catch (e) {
      caught = e;
    }
    expect(isQuernError(caught, 'E_VALUE')).toBe(true);
    expect((caught as Error).message).toContain(JSON.stringify(text));
  });
});

describe('makeTimeParser(iso-interval) on a stray character in a duration', () => {
  // Found by the fuzz property in parser.test.ts (seed -1258901384): the reason must start with its code and
  // a visible word, so a blank designator is quoted. Expected shape: this file's own reason-code rule.
  it('quotes a blank designator in the reason for "2024-03-10/P1 W"', () => {
    const out = emptyParsedTime();
    const reason = makeTimeParser('iso-interval')('2024-03-10/P1 W', out);
    expect(reason).toMatch(/^invalid-duration: " " is not a date designator here$/);
  });
});
