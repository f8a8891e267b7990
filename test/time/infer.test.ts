// inferTimeFormat: one format per column, with evidence; ambiguity and conflict are reported, never guessed
// (issue 2 §3, issue 9 "a column that turns from day-first to month-first half way").
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { inferTimeFormat } from '../../src/time/index.js';

const column = (file: string, index: number): string[] =>
  readFileSync(new URL(`../../fixtures/${file}`, import.meta.url), 'utf8').split(/\r?\n/).slice(1).filter((l) => l !== '').map((l) => l.split(',')[index]!);

describe('inferTimeFormat(sample) for ISO 8601 columns', () => {
  it('reads the demo visit times as ISO 8601 date-times with offset', () => {
    const sample = column('visits.csv', 1).slice(0, 2000);
    const r = inferTimeFormat(sample, { columnName: 'visit_time' });
    expect(r.status).toBe('ok');
    expect(r.format).toMatchObject({ id: 'iso-date-time-offset', kind: 'instant', label: 'ISO 8601 date-time with offset', pattern: "yyyy-MM-dd'T'HH:mm:ssXXX" });
    expect(r.matched).toBe(sample.length);
    expect(r.evidence[0]).toContain('ISO 8601 date-times with an offset');
  });

  it('reads the fridge log as UTC date-times (pattern with X for Z) and the weekly table as epi weeks and dates', () => {
    expect(inferTimeFormat(column('fridge-temps.csv', 1).slice(0, 500)).format).toMatchObject({ id: 'iso-date-time-offset', pattern: "yyyy-MM-dd'T'HH:mm:ssX" });
    expect(inferTimeFormat(column('weekly-cases.csv', 0)).format).toMatchObject({ id: 'epi-week', unit: 'epi-week', kind: 'period' });
    expect(inferTimeFormat(column('weekly-cases.csv', 1)).format).toMatchObject({ id: 'iso-date', unit: 'day', kind: 'period' });
  });

  it('finds no time format in ages, ids and zero-padded codes', () => {
    expect(inferTimeFormat(column('visits.csv', 4).slice(0, 500)).status).toBe('none'); // patient_age
    expect(inferTimeFormat(column('visits.csv', 0).slice(0, 500)).status).toBe('none'); // visit_id, 6 digits
    expect(inferTimeFormat(column('visits.csv', 7).slice(0, 500)).status).toBe('none'); // area_code, 5 digits
  });

  it('counts empty values apart and reports the values that do not fit', () => {
    const r = inferTimeFormat(['2024-03-10', '', '  ', '2024-03-11', '2024-02-30', '2024-03-12']);
    expect(r).toMatchObject({ status: 'ok', total: 4, empty: 2, matched: 3 });
    expect(r.rejected).toEqual([{ value: '2024-02-30', reason: 'invalid-date: February 2024 has 29 days, not 30' }]);
    expect(r.evidence).toContain('1 of 4 values do not fit it');
  });

  it('names the dominant shape of a mixed ISO column and lists the shapes in the evidence', () => {
    const r = inferTimeFormat(['2024-03-10T08:00:00-05:00', '2024-03-10T09:00:00-05:00', '2024-03-11']);
    expect(r.format?.id).toBe('iso-date-time-offset');
    expect(r.evidence[0]).toMatch(/date-times with an offset \(2\), dates \(1\)/);
  });

  it.each([
    [['2021-W14', '2021-W15'], 'iso-week'], [['2021-04', '2021-05'], 'iso-year-month'], [['2021-095'], 'iso-ordinal-date'],
    [['20210405', '20210406'], 'iso-basic-date'], [['20210405T133000Z'], 'iso-basic-date-time-offset'], [['2021-04-05T13:30'], 'iso-date-time'],
    [['2021', '2022'], 'iso-year'], [['2021-Q1', 'Q2 2021'], 'quarter'], [['2021-H1'], 'half'], [['FY2022', 'FY2023'], 'fiscal-year'],
    [['Apr 2021', 'May 2021'], 'month-name-year'], [['April 5, 2021'], 'month-name-day-year'], [['5 Apr 2021'], 'day-month-name-year'],
    [['2021-04-05/P1W'], 'iso-interval'], [['2021/04/05', '2021/04/06'], 'year-month-day'],
  ])('infers %j as %s', (sample, id) => {
    expect(inferTimeFormat(sample).format?.id).toBe(id);
  });

  it('does not take four-digit codes for years', () => {
    expect(inferTimeFormat(['4519', '4527', '0045']).status).toBe('none');
    expect(inferTimeFormat(['1066', '1215'], { columnName: 'year' }).format?.id).toBe('iso-year');
  });
});

describe('inferTimeFormat(sample) for numeric day-month columns', () => {
  it('decides day-first from first fields above 12 and says so', () => {
    const r = inferTimeFormat(['05/04/2021', '25/04/2021', '13/05/2021', '01/06/2021']);
    expect(r.status).toBe('ok');
    expect(r.format).toMatchObject({ id: 'day-month-year', label: 'day/month/year (DD/MM/YYYY)', pattern: 'dd/MM/yyyy', separator: '/' });
    expect(r.evidence[0]).toBe('2 values have a first field above 12 (#2, #3), which only a day-first reading allows, so the column is day-first');
    expect(r.matched).toBe(4);
  });

  it('decides month-first from second fields above 12', () => {
    const r = inferTimeFormat(['04/05/2021', '04/25/2021', '12/31/2021']);
    expect(r.format).toMatchObject({ id: 'month-day-year', label: 'month/day/year (MM/DD/YYYY)' });
    expect(r.evidence[0]).toMatch(/^2 values have a second field above 12 \(#2, #3\).*month-first$/);
  });

  it('names the separator and a time part in the label and pattern', () => {
    const r = inferTimeFormat(['25.04.2021 10:20', '26.04.2021 11:00']);
    expect(r.format).toMatchObject({ id: 'day-month-year', label: 'day.month.year (DD.MM.YYYY)', pattern: 'dd.MM.yyyy HH:mm', separator: '.' });
  });

  it('returns ambiguous, never a guess, when every first and second field is 12 or below', () => {
    const r = inferTimeFormat(['05/04/2021', '06/04/2021', '12/11/2021']);
    expect(r.status).toBe('ambiguous');
    expect(r.format).toBeNull();
    expect(r.reason).toContain('every first and second field');
    expect(r.candidates.map((c) => c.format.id).sort()).toEqual(['day-month-year', 'month-day-year']);
  });

  it('reads an ambiguous column under a declared order', () => {
    expect(inferTimeFormat(['05/04/2021', '06/04/2021'], { dayFirst: true })).toMatchObject({ status: 'ok', format: { id: 'day-month-year' }, evidence: ['day-first as declared (dayFirst)'] });
    expect(inferTimeFormat(['05/04/2021', '06/04/2021'], { monthFirst: true }).format?.id).toBe('month-day-year');
  });

  it('reports a column that turns from day-first to month-first half way as a conflict', () => {
    const sample = ['25/01/2024', '26/01/2024', '03/02/2024', '02/14/2024', '02/15/2024'];
    const r = inferTimeFormat(sample);
    expect(r.status).toBe('conflict');
    expect(r.format).toBeNull();
    expect(r.reason).toContain('the order changes part way: day-first up to value #2, month-first from value #4');
  });

  it('reports interleaved orders and a declared order the values contradict as conflicts', () => {
    expect(inferTimeFormat(['25/01/2024', '02/14/2024', '26/01/2024']).reason).toContain('interleaved');
    const r = inferTimeFormat(['05/04/2021', '04/25/2021'], { dayFirst: true });
    expect(r.status).toBe('conflict');
    expect(r.reason).toContain('declared day-first');
  });

  it('reads two-digit years only with a pivot, and says so', () => {
    const without = inferTimeFormat(['25/04/21', '26/04/21']);
    expect(without.matched).toBe(0);
    expect(without.evidence.join(' ')).toContain('two-digit years');
    const withPivot = inferTimeFormat(['25/04/21', '26/04/21'], { twoDigitYearPivot: 1950 });
    expect(withPivot).toMatchObject({ status: 'ok', matched: 2, format: { id: 'day-month-year', pattern: 'dd/MM/yy', twoDigitYearPivot: 1950 } });
  });

  it('refuses to be told both day-first and month-first', () => {
    expect(() => inferTimeFormat(['05/04/2021'], { dayFirst: true, monthFirst: true })).toThrow(expect.objectContaining({ code: 'E_USAGE' }));
  });

  it('reports values written in two formats as a conflict', () => {
    const r = inferTimeFormat(['2024-03-10', '2024-03-11', '2024-03-12', '25/03/2024', '26/03/2024']);
    expect(r.status).toBe('conflict');
    expect(r.reason).toContain('two formats');
  });
});

describe('inferTimeFormat(sample) for numbers', () => {
  it.each([
    [['1700000000', '1700003600'], 'epoch-seconds', '10 digits (seconds)'], // REFERENCES §4 digit bands
    [['1700000000000', '1700003600000'], 'epoch-milliseconds', '13 digits (milliseconds)'],
    [['1700000000000000', '1700003600000000'], 'epoch-microseconds', '16 digits (microseconds)'],
    [['1700000000000000000', '9223372036854775807'], 'epoch-nanoseconds', '19 digits (nanoseconds)'],
  ])('tells %j apart by digits as %s', (sample, id, words) => {
    const r = inferTimeFormat(sample);
    expect(r.format?.id).toBe(id);
    expect(r.evidence[0]).toContain(words);
    expect(r.evidence[0]).toContain('they run from 2023-11-14T22:13:20Z');
  });

  it('reports epochs of 10, 13, 16 and 19 digits mixed in one column as a conflict, offering the per-value reading', () => {
    const r = inferTimeFormat(['1700000000', '1700000000000', '1700000000000000', '1700000000000000000']);
    expect(r.status).toBe('conflict');
    expect(r.reason).toContain('mixes epoch units');
    expect(r.candidates[0]).toMatchObject({ format: { id: 'epoch-auto' }, matched: 4 });
    expect(inferTimeFormat(['1700000000', '1700000000000'], { epochUnit: 'auto' })).toMatchObject({ status: 'ok', matched: 2, format: { id: 'epoch-auto' } });
  });

  it('reads serial days only when asked or when the name and range make it clear, and says so', () => {
    const sample = ['45292', '45293.5', '45351'];
    expect(inferTimeFormat(sample).status).toBe('none');
    const named = inferTimeFormat(sample, { columnName: 'visit_date' });
    expect(named.format?.id).toBe('serial-1900');
    expect(named.evidence[0]).toContain('the column is named "visit_date"');
    expect(named.evidence[0]).toContain('2024-01-01T00:00:00Z to 2024-02-29T00:00:00Z'); // REFERENCES §3: 45292 = 2024-01-01, 45351 = 2024-02-29
    expect(inferTimeFormat(sample, { columnName: 'amount' }).status).toBe('none');
    expect(inferTimeFormat(['43830'], { serial: '1904' })).toMatchObject({ status: 'ok', matched: 1, format: { id: 'serial-1904' } }); // REFERENCES §3
  });

  it('does not change the caller\'s array', () => {
    const sample = Object.freeze(['05/04/2021', ' 25/04/2021 ', '']);
    expect(() => inferTimeFormat(sample)).not.toThrow();
    expect(sample).toEqual(['05/04/2021', ' 25/04/2021 ', '']);
  });
});

describe('inferTimeFormat(sample) patterns of trade notations', () => {
  it.each([
    [['2021-Q2'], "yyyy-'Q'Q"], [['2021Q2'], "yyyy'Q'Q"], [['Q2 2021'], "'Q'Q yyyy"], [['2021 Q2'], "yyyy 'Q'Q"],
  ])('gives %j the Unicode pattern %s (UTS #35: Q is the quarter number)', (sample, pattern) => {
    expect(inferTimeFormat(sample).format).toMatchObject({ id: 'quarter', pattern });
  });
});
