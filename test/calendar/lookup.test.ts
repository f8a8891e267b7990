// lookupPeriod(value, options): how VALUE is read and what the answer holds.
import { describe, expect, it } from 'vitest';
import { describeLength, lookupPeriod } from '../../src/calendar/index.js';

describe('lookupPeriod(value, options)', () => {
  it('looks a label up in its own unit when no unit is given', () => {
    expect(lookupPeriod('2024-EW07')).toMatchObject({ unit: 'epi-week', readAs: 'label', label: '2024-EW07', start: '2024-02-11T00:00:00+00:00' }); // MMWR 2024 week 1 = 2023-12-31 (REFERENCES.md §2), + 6 weeks
    expect(lookupPeriod('2024-Q2')).toMatchObject({ unit: 'quarter', start: '2024-04-01T00:00:00+00:00', end: '2024-07-01T00:00:00+00:00', dates: 91 });
    expect(lookupPeriod('2024')).toMatchObject({ unit: 'year', dates: 366 }); // 2024 is a leap year (Gregorian rule)
  });

  it('reads an ISO 8601 week date (2005-W01-1 is 2005-01-03; PostgreSQL docs: 2005-01-01 is in 2004-W53)', () => {
    expect(lookupPeriod('2005-W01-1')).toMatchObject({ unit: 'day', label: '2005-01-03' });
  });

  it('looks a label of one unit up in another: the period holding its start', () => {
    const r = lookupPeriod('FY2024', { unit: 'iso-week' });
    expect(r.label).toBe('2023-W39'); // 2023-10-01 is a Sunday, the last day of ISO week 39 (Computed: Temporal weekOfYear)
    expect(r.notes).toEqual(['FY2024 names a fiscal-year; this is the iso-week holding its start']);
  });

  it('takes the earlier instant of a repeated local time and says so (REFERENCES.md §5, US Nov rule)', () => {
    const r = lookupPeriod('2024-11-03T01:30', { unit: 'hour', zone: 'America/New_York' });
    expect(r.label).toBe('2024-11-03T01:00-04:00');
    expect(r.notes).toEqual(['2024-11-03T01:30 happens twice in America/New_York; the earlier, 2024-11-03T01:30:00-04:00, is used']);
  });

  it('refuses impossible date-times with E_VALUE rather than rolling them over', () => {
    expect(() => lookupPeriod('2024-02-30T10:00', { unit: 'hour' })).toThrowError(expect.objectContaining({ code: 'E_VALUE' }));
    expect(() => lookupPeriod('2024-03-10T24:01', { unit: 'hour' })).toThrowError(expect.objectContaining({ code: 'E_VALUE' }));
  });

  it('gives the length in words: "7 days (167 hours)" for the New York week holding the spring change', () => {
    const r = lookupPeriod('2024-03-10', { unit: 'iso-week', zone: 'America/New_York' });
    expect(r.length).toBe('7 days (167 hours)'); // US 2024-03-10 lost an hour (REFERENCES.md §5)
    expect(r.lengthMs).toBe(167 * 3_600_000);
  });
});

describe('describeLength(ms, dates, unit, step)', () => {
  it.each([
    [23 * 3_600_000, 1, 'day', 1, '23 hours'],
    [24.5 * 3_600_000, 1, 'day', 1, '24.5 hours'],
    [7 * 86_400_000, 7, 'iso-week', 1, '7 days'],
    [900_000, null, 'minute', 15, '15 minutes'],
    [3_600_000, null, 'hour', 1, '1 hour'],
    [1_000, null, 'second', 1, '1 second'],
  ] as const)('describeLength(%d, %s, %s, %d) is %s', (ms, dates, unit, step, text) => {
    expect(describeLength(ms, dates, unit, step)).toBe(text);
  });
});
