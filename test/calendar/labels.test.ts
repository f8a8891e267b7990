// Label notation of every unit, parsing back, and the errors of bad labels and options.
import { describe, expect, it } from 'vitest';
import { makeCalendar, parseUnitName, parseWeekStart, type CalendarOptions } from '../../src/calendar/index.js';

const at = (iso: string) => Date.parse(iso);

describe('Calendar.label(ms)', () => {
  it.each<[CalendarOptions, string, string]>([
    // ISO 8601 calendar date, year-month, year and week date notations (ISO 8601-1 §5.2)
    [{ unit: 'day' }, '2024-03-10T15:00:00Z', '2024-03-10'],
    [{ unit: 'month' }, '2024-03-10T15:00:00Z', '2024-03'],
    [{ unit: 'year' }, '2024-03-10T15:00:00Z', '2024'],
    [{ unit: 'iso-week' }, '2024-02-14T15:00:00Z', '2024-W07'],
    // trade notation (common practice)
    [{ unit: 'quarter' }, '2024-03-10T15:00:00Z', '2024-Q1'],
    [{ unit: 'half' }, '2024-08-10T15:00:00Z', '2024-H2'],
    [{ unit: 'epi-week' }, '2024-02-14T15:00:00Z', '2024-EW07'], // MMWR 2024 week 1 starts 2023-12-31 (REFERENCES.md §2)
    [{ unit: 'fiscal-year' }, '2023-10-01T00:00:00Z', 'FY2024'], // US FY2024 = 2023-10-01..2024-09-30 (REFERENCES.md §6)
    [{ unit: 'fiscal-quarter' }, '2023-12-31T00:00:00Z', 'FY2024-Q1'],
    [{ unit: 'fiscal-month' }, '2023-10-15T00:00:00Z', 'FY2024-M01'],
    // ISO 8601 start/duration for other week starts and for steps
    [{ unit: 'week', weekStart: 7 }, '2024-03-13T15:00:00Z', '2024-03-10/P1W'],
    [{ unit: 'day', step: 3 }, '1970-01-05T00:00:00Z', '1970-01-04/P3D'], // counted from 1970-01-01
    [{ unit: 'quarter', step: 2 }, '2024-08-10T00:00:00Z', '2024-07-01/P6M'],
    [{ unit: 'year', step: 10 }, '2024-08-10T00:00:00Z', '2020-01-01/P10Y'],
    [{ unit: 'minute', step: 15, zone: 'America/New_York' }, '2024-03-10T13:20:00Z', '2024-03-10T09:15-04:00/PT15M'],
    [{ unit: 'hour', zone: 'America/New_York' }, '2024-11-03T06:10:00Z', '2024-11-03T01:00-05:00'],
    [{ unit: 'second', zone: 'Asia/Kolkata' }, '2024-01-01T00:00:07.5Z', '2024-01-01T05:30:07+05:30'],
    [{ unit: 'millisecond', step: 250 }, '2024-01-01T00:00:07.6Z', '2024-01-01T00:00:07.500+00:00/PT0.250S'],
    // ISO 8601 expanded years outside 0000–9999
    [{ unit: 'year' }, '+012024-05-01T00:00:00Z', '+012024'],
    [{ unit: 'day' }, '-000001-05-01T00:00:00Z', '-000001-05-01'],
  ])('%j at %s is %s', (options, iso, label) => {
    const cal = makeCalendar(options);
    expect(cal.label(at(iso))).toBe(label);
    expect(cal.parseLabel(label).start).toBe(cal.floor(at(iso)));
  });
});

describe('Calendar.parseLabel(label)', () => {
  it.each<[CalendarOptions, string, string]>([
    [{ unit: 'day' }, '2021-02-29', 'bad day label "2021-02-29": 2021-02 has no day 29'],
    [{ unit: 'month' }, '2022-13', 'bad month label "2022-13": month 13 does not exist'],
    [{ unit: 'quarter' }, '2024-Q5', 'bad quarter label "2024-Q5": quarter 5 does not exist'],
    [{ unit: 'epi-week' }, '2024-W07', 'bad epi-week label "2024-W07": an ISO week, not an epidemiological week'],
    [{ unit: 'iso-week' }, '2024-EW07', 'bad iso-week label "2024-EW07": an epidemiological week, not an ISO week'],
    [{ unit: 'epi-week' }, '2024-EW53', 'bad epi-week label "2024-EW53": 2024 has 52 epidemiological weeks'],
    [{ unit: 'week', weekStart: 7 }, '2024-03-11/P1W', 'bad week label "2024-03-11/P1W": not a period of this calendar; 2024-03-11 falls in 2024-03-10/P1W'],
    [{ unit: 'hour', zone: 'America/New_York' }, '2024-03-10T08:15-04:00', 'bad hour label "2024-03-10T08:15-04:00": not the start of a period; that instant falls in 2024-03-10T08:00-04:00'],
    [{ unit: 'minute', step: 15 }, '2024-03-10T08:15+00:00', 'bad 15-minute label "2024-03-10T08:15+00:00": the duration must be PT15M'],
    [{ unit: 'fiscal-quarter' }, 'FY2024-Q0', 'bad fiscal-quarter label "FY2024-Q0": fiscal quarter 0 does not exist'],
    [{ unit: 'day' }, 'yesterday', 'bad day label "yesterday": not a period label'],
  ])('%j refuses %s with E_LABEL', (options, label, message) => {
    const cal = makeCalendar(options);
    expect(() => cal.parseLabel(label)).toThrowError(expect.objectContaining({ code: 'E_LABEL', message }));
    expect(cal.tryParseLabel(label)).toBeNull();
  });

  it('accepts lower-case letters and surrounding blanks', () => {
    expect(makeCalendar({ unit: 'fiscal-quarter' }).parseLabel(' fy2024-q1 ').label).toBe('FY2024-Q1');
    expect(makeCalendar({ unit: 'iso-week' }).parseLabel('2024-w07').label).toBe('2024-W07');
  });

  it('reads a sub-day label written in Z as the same instant', () => {
    const cal = makeCalendar({ unit: 'hour', zone: 'America/New_York' });
    expect(cal.parseLabel('2024-03-10T12:00Z').label).toBe('2024-03-10T08:00-04:00');
  });
});

describe('makeCalendar(options) validation', () => {
  it.each<[unknown, string]>([
    [{ unit: 'fortnight' }, 'unknown unit "fortnight"'],
    [{ unit: 'day', step: 0 }, 'bad step 0: a step is a whole number of units, 1 or more'],
    [{ unit: 'day', step: 1.5 }, 'bad step 1.5: a step is a whole number of units, 1 or more'],
    [{ unit: 'week', weekStart: 8 }, 'bad week start 8'],
    [{ unit: 'fiscal-year', fiscalStart: { month: 13, day: 1 } }, 'bad fiscal-year start month 13 day 1'],
    [{ unit: 'fiscal-year', fiscalStart: { month: 2, day: 30 } }, 'bad fiscal-year start month 2 day 30'],
  ])('%j throws E_UNIT', (options, message) => {
    expect(() => makeCalendar(options as CalendarOptions)).toThrowError(expect.objectContaining({ code: 'E_UNIT', message }));
  });

  it('throws E_ZONE for an unknown zone', () => {
    expect(() => makeCalendar({ unit: 'day', zone: 'Atlantis/Capital' })).toThrowError(expect.objectContaining({ code: 'E_ZONE' }));
  });

  it('counts steps from a stated origin: 2-week pay periods from Sunday 2024-01-07', () => {
    const cal = makeCalendar({ unit: 'week', weekStart: 7, step: 2, origin: at('2024-01-07T00:00:00Z') });
    expect(cal.label(at('2024-01-20T12:00:00Z'))).toBe('2024-01-07/P2W');
    expect(cal.label(at('2024-01-21T12:00:00Z'))).toBe('2024-01-21/P2W');
    expect(cal.index(at('2024-01-07T00:00:00Z'))).toBe(0);
  });

  it('counts sub-day steps from a stated origin: 15-minute slots at :05/:20/:35/:50', () => {
    const cal = makeCalendar({ unit: 'minute', step: 15, origin: at('2024-01-01T00:05:00Z') });
    expect(cal.floor(at('2024-06-01T10:19:59Z'))).toBe(at('2024-06-01T10:05:00Z'));
  });

  it('never mutates the options it is given', () => {
    const options = Object.freeze({ unit: 'fiscal-year' as const, fiscalStart: Object.freeze({ month: 4, day: 6 }) });
    const cal = makeCalendar(options);
    expect(cal.fiscalStart).toEqual({ month: 4, day: 6 });
    expect(cal.fiscalStart).not.toBe(options.fiscalStart);
  });
});

describe('parseUnitName(text) / parseWeekStart(text)', () => {
  it.each([
    ['iso-week', 'iso-week'], ['isoweek', 'iso-week'], ['EPI-WEEK', 'epi-week'], ['mmwr', 'epi-week'], ['weeks', 'week'],
    ['min', 'minute'], ['h', 'hour'], ['fy', 'fiscal-year'], ['fiscal-quarter', 'fiscal-quarter'], ['half-year', 'half'],
  ])('parseUnitName(%s) is %s', (text, unit) => {
    expect(parseUnitName(text)).toBe(unit);
  });

  it('parseUnitName refuses unknown names with E_UNIT and lists the units', () => {
    expect(() => parseUnitName('fortnight')).toThrowError(expect.objectContaining({ code: 'E_UNIT', hint: expect.stringContaining('epi-week') }));
  });

  it.each([
    ['monday', 1], ['mon', 1], ['Mo', 1], ['1', 1], ['sunday', 7], ['sun', 7], ['7', 7], ['0', 7], ['Thu', 4], ['saturday', 6],
  ])('parseWeekStart(%s) is %d', (text, n) => {
    expect(parseWeekStart(text)).toBe(n);
  });

  it.each(['8', 'funday', 's', 't'])('parseWeekStart(%s) throws E_UNIT', (text) => {
    expect(() => parseWeekStart(text)).toThrowError(expect.objectContaining({ code: 'E_UNIT' }));
  });
});
