// parseTimeText: single values typed on a command line; misuse throws QuernError('E_VALUE') naming the value.
import { describe, it, expect } from 'vitest';
import { parseTimeText, isQuernError } from '../../src/index.js';

const iso = (ms: number) => new Date(ms).toISOString();

function failure(text: string, hints = {}): { code: string; message: string } {
  try {
    parseTimeText(text, hints);
  } catch (e) {
    if (isQuernError(e)) return { code: e.code, message: e.message };
    throw e;
  }
  throw new Error(`no error for ${text}`);
}

describe('parseTimeText(text, hints)', () => {
  it.each([
    ['2024-03-10', 'period', 'day', '2024-03-10T00:00:00.000Z'], // ISO 8601 calendar date
    ['2024-03-10T08:15:00-05:00', 'instant', null, '2024-03-10T13:15:00.000Z'], // RFC 3339 §5.6
    ['2024-03-10T08:15', 'local', null, '2024-03-10T08:15:00.000Z'], // ISO 8601 local date-time
    ['2024-W10', 'period', 'iso-week', '2024-03-04T00:00:00.000Z'], // ISO 8601 week: Monday 2024-03-04 (common practice)
    ['2024-EW10', 'period', 'epi-week', '2024-03-03T00:00:00.000Z'], // REFERENCES §2: 2024-EW01 starts 2023-12-31, +63 days
    ['2024-Q1', 'period', 'quarter', '2024-01-01T00:00:00.000Z'],
    ['FY2024', 'period', 'fiscal-year', '2023-10-01T00:00:00.000Z'], // REFERENCES §6: US federal FY2024
    ['2024', 'period', 'year', '2024-01-01T00:00:00.000Z'],
    ['March 10, 2024', 'period', 'day', '2024-03-10T00:00:00.000Z'],
    ['25/03/2024', 'period', 'day', '2024-03-25T00:00:00.000Z'], // the value itself settles day-first
    ['2024-03-10/P1W', 'period', 'week', '2024-03-10T00:00:00.000Z'],
  ])('reads %s', (text, kind, unit, at) => {
    const r = parseTimeText(text);
    expect(r.kind).toBe(kind);
    expect(iso(r.ms)).toBe(at);
    if (kind === 'period') expect(r.unit).toBe(unit);
  });

  it('reads ambiguous day-month values and numbers only with hints', () => {
    expect(failure('05/04/2021')).toMatchObject({ code: 'E_VALUE' });
    expect(failure('05/04/2021').message).toContain('"05/04/2021"');
    expect(iso(parseTimeText('05/04/2021', { dayFirst: true }).ms)).toBe('2021-04-05T00:00:00.000Z');
    expect(iso(parseTimeText('05/04/2021', { monthFirst: true }).ms)).toBe('2021-05-04T00:00:00.000Z');
    expect(failure('1700000000').message).toContain('bare number');
    expect(iso(parseTimeText('1700000000', { epochUnit: 's' }).ms)).toBe('2023-11-14T22:13:20.000Z'); // REFERENCES §4
    expect(iso(parseTimeText('45292.5', { serial: '1900' }).ms)).toBe('2024-01-01T12:00:00.000Z'); // REFERENCES §3
  });

  it.each([
    ['2021-02-29', 'invalid-date: 2021 is not a leap year'],
    ['2021-W53', 'invalid-week'],
    ['2021-04-05T24:01', 'invalid-time'],
    ['tomorrow', 'not a time value'],
    ['', 'not a time value'],
  ])('refuses %j with E_VALUE and the reason', (text, words) => {
    const f = failure(text);
    expect(f.code).toBe('E_VALUE');
    expect(f.message).toContain(JSON.stringify(text));
    expect(f.message).toContain(words);
  });
});
