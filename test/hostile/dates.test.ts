// Hostile date values through `quern rebin` and the value parser: impossible dates are rejected with
// line, column, value and reason; edge values are read as the documented rules say (DEVELOPERS.md
// "Time values"); outliers that would build decades of periods stop with one line naming value and line.
import { afterAll, describe, expect, it } from 'vitest';
import { emptyParsedTime, makeTimeParser } from '../../src/index.js';
import { runCli } from '../helpers/cli.js';
import { countSum, expectOneLineError, rebinAccount, scratch } from './helpers.js';

const tmp = scratch('dates');
afterAll(() => tmp.cleanup());
const column = (name: string, values: string[]) => tmp.file(name, `t\n${values.join('\n')}\n`);

describe('quern rebin rejects impossible dates, naming line, column and value', () => {
  it.each([
    // [value, reason code, words in the message, source]
    ['2022-13-31', 'invalid-date', 'month 13', 'ISO 8601-1 §5.2.2: months 01–12'],
    ['2021-02-29', 'invalid-date', 'not a leap year', 'Gregorian rule: 2021 is not divisible by 4'],
    ['2024-01-03T24:01:00Z', 'invalid-time', '24:01', 'ISO 8601-1 §5.3.2: 24:00 only as end of day'],
    ['2024-01-03T12:30:60Z', 'invalid-time', 'leap second', 'RFC 3339 §5.7: second 60 only at 23:59:60 UTC'],
  ])('rejects %s as %s', async (value, code, words) => {
    const f = column(`bad-${code}-${value.slice(0, 10)}.csv`, ['2024-01-01', value, '2024-01-02']);
    const a = await rebinAccount([f, '--time', 't', '--unit', 'day']);
    expect([a.read, a.used, a.rejected]).toEqual([3, 2, 1]);
    expect(a.examples[0]).toMatchObject({ code, line: 3, column: 't', value });
    expect(a.examples[0]!.message).toContain(words);
  });

  it('rejects 2021-W53 in an ISO-week column (2021 has 52 ISO weeks: it starts on a Friday, ISO 8601-1 §5.2.4.1)', async () => {
    const f = column('w53.csv', ['2021-W53', '2020-W53', '2021-W01']);
    const a = await rebinAccount([f, '--time', 't', '--unit', 'iso-week']);
    expect([a.read, a.used, a.rejected]).toEqual([3, 2, 1]);
    expect(a.examples[0]).toMatchObject({ code: 'invalid-week', line: 2, value: '2021-W53' });
  });

  it('reads 24:00 as the next day\'s 00:00 (ISO 8601-1 §5.3.2)', async () => {
    const f = column('t2400.csv', ['2024-01-01T24:00:00Z', '2024-01-02T00:00:00Z']);
    const a = await rebinAccount([f, '--time', 't', '--unit', 'day']);
    expect(a.rows.map((r) => [r['period'], r['count']])).toEqual([['2024-01-02', 2]]);
  });

  it('keeps 23:59:60 in its own day (RFC 3339 §5.7; read as 23:59:59.999, DEVELOPERS.md)', async () => {
    const f = column('second-60.csv', ['2016-12-31T23:59:60Z', '2017-01-01T00:00:00Z']);
    const a = await rebinAccount([f, '--time', 't', '--unit', 'day', '--no-fill']);
    expect(a.rows.map((r) => [r['period'], r['count']])).toEqual([['2016-12-31', 1], ['2017-01-01', 1]]);
  });

  // DEVELOPERS.md "Time values": a leap second is accepted with a warning in the summary.
  it('warns in the rebin summary that a leap second was read as 23:59:59.999', async () => {
    const f = column('second-60-warn.csv', ['2016-12-31T23:59:60Z', '2017-01-01T00:00:00Z']);
    const r = await runCli(['rebin', f, '--time', 't', '--unit', 'day', '--format', 'json']);
    expect(r.stdout + r.stderr).toMatch(/leap/i);
  });
});

describe('quern rebin at the ends of the calendar', () => {
  it('stops on year 0000 among recent values, naming value and line, instead of filling 2,025 years', async () => {
    const f = column('year0.csv', ['0000-01-01', '2024-01-01']);
    const line = expectOneLineError(await runCli(['rebin', f, '--time', 't', '--unit', 'year']), 3, '--max-periods', '"2024-01-01"', 'line 3');
    expect(line).toContain('0000');
  });

  it('reads year 0000 alone as 1 BCE (ISO 8601 proleptic Gregorian)', async () => {
    const a = await rebinAccount([column('year0-alone.csv', ['0000-06-01', '0000-07-01']), '--time', 't', '--unit', 'year']);
    expect(a.rows.map((r) => [r['period'], r['count']])).toEqual([['0000', 2]]);
  });

  it('rejects +275760-09-13 as a day whose end lies past the last JavaScript date (8.64e15 ms, ECMA-262 §21.4.1.1)', async () => {
    const a = await rebinAccount([column('year275760.csv', ['+275760-09-13', '2024-01-01']), '--time', 't', '--unit', 'year']);
    expect([a.read, a.used, a.rejected]).toEqual([2, 1, 1]);
    expect(a.examples[0]).toMatchObject({ line: 2, value: '+275760-09-13' });
    expect(a.examples[0]!.message).toContain('outside');
  });

  it.each([
    ['1970-01-01', 'earliest', 4],
    ['9999-12-31', 'latest', 4],
  ])('stops on one %s outlier among recent values, naming it as the %s value and its line', async (value, which, line) => {
    const f = column(`outlier-${value}.csv`, ['2024-03-01', '2024-03-02', value, '2024-03-03']);
    const r = await runCli(['rebin', f, '--time', 't', '--unit', 'day']);
    expectOneLineError(r, 3, '--max-periods', `${which} value "${value}"`, `line ${line}`);
    expect(r.stdout).toBe('');
  });

  it('rebins the same outlier file with --no-fill, counting every row', async () => {
    const f = column('outlier-nofill.csv', ['2024-03-01', '2024-03-02', '1970-01-01', '2024-03-03']);
    const a = await rebinAccount([f, '--time', 't', '--unit', 'day', '--no-fill']);
    expect([a.read, a.used, countSum(a.rows)]).toEqual([4, 4, 4]);
  });
});

describe('quern rebin on numbers that may be times', () => {
  const epochs = ['1700000000', '1700000000123', '1700000000123456', '1700000000123456789'];

  it('refuses a column mixing epochs of 10, 13, 16 and 19 digits unless asked, naming the digit counts', async () => {
    const r = await runCli(['rebin', column('epochs.csv', epochs), '--time', 't', '--unit', 'day']);
    expectOneLineError(r, 3, '10 digits', '13 digits', '16 digits', '19 digits');
  });

  it('reads each epoch by its digit count with --time-format epoch-auto (1700000000 s = 2023-11-14T22:13:20Z, from memory)', async () => {
    const a = await rebinAccount([column('epochs-auto.csv', epochs), '--time', 't', '--unit', 'day', '--time-format', 'epoch-auto']);
    expect(a.rows.map((r) => [r['period'], r['count']])).toEqual([['2023-11-14', 4]]);
  });

  it('rejects spreadsheet serial 60, the fictitious 1900-02-29 (ECMA-376 Part 1 §18.17.4.1), and reads fractions', async () => {
    const f = tmp.file('serials.csv', 'visit_date\n60\n42580.3333\n59\n61\n');
    const a = await rebinAccount([f, '--time', 'visit_date', '--unit', 'day', '--time-format', 'serial-1900', '--no-fill']);
    expect([a.read, a.used, a.rejected]).toEqual([4, 3, 1]);
    expect(a.examples[0]).toMatchObject({ line: 2, value: '60' });
    // Serial 59 = 1900-02-28, 61 = 1900-03-01, 42580 = 2016-07-29 (ECMA-376 1900 date system, from memory).
    expect(a.rows.map((r) => r['period'])).toEqual(['1900-02-28', '1900-03-01', '2016-07-29']);
  });

  it('makeTimeParser("serial-1900") reads 42580.3333 as 08:00, not 07:59:57.12 (DEVELOPERS.md serial rule)', () => {
    const out = emptyParsedTime();
    expect(makeTimeParser('serial-1900')('42580.3333', out)).toBeNull();
    expect(out.ms).toBe(Date.UTC(2016, 6, 29, 8));
  });
});

describe('quern rebin on day-month dates', () => {
  it('refuses two-digit years without a pivot, naming the value', async () => {
    const f = column('yy.csv', ['05/04/21', '25/12/99']);
    const a = await rebinAccount([f, '--time', 't', '--unit', 'day', '--time-format', 'day-month-year']);
    expect([a.read, a.used, a.rejected]).toEqual([2, 0, 2]);
    expect(a.examples[0]).toMatchObject({ code: 'two-digit-year', line: 2, value: '05/04/21' });
  });

  it.each([
    // The 100-year window starting at the pivot (DEVELOPERS.md "Two-digit years"): 49 → 2049, 50 → 1950.
    ['05/04/49', Date.UTC(2049, 3, 5)],
    ['05/04/50', Date.UTC(1950, 3, 5)],
  ])('makeTimeParser("day-month-year", pivot 1950) reads %s in 1950–2049', (value, ms) => {
    const out = emptyParsedTime();
    expect(makeTimeParser('day-month-year', { twoDigitYearPivot: 1950 })(value, out)).toBeNull();
    expect(out.ms).toBe(ms);
  });

  it('refuses a column that turns from day-first to month-first half way, saying where', async () => {
    const f = column('flip.csv', ['13/01/2024', '14/01/2024', '01/02/2024', '01/15/2024', '01/16/2024']);
    const r = await runCli(['rebin', f, '--time', 't', '--unit', 'day']);
    expectOneLineError(r, 3, 'day-first', 'month-first', 'part way');
  });

  it('with --day-first still refuses the column, naming the month-first values by position', async () => {
    const f = column('flip-df.csv', ['13/01/2024', '14/01/2024', '01/02/2024', '01/15/2024', '01/16/2024']);
    expectOneLineError(await runCli(['rebin', f, '--time', 't', '--unit', 'day', '--day-first']), 3, 'declared day-first', '#4, #5');
  });

  it('with --time-format day-month-year reads the day-first half and rejects the rest row by row', async () => {
    const f = column('flip-dmy.csv', ['13/01/2024', '14/01/2024', '01/02/2024', '01/15/2024', '01/16/2024']);
    const a = await rebinAccount([f, '--time', 't', '--unit', 'day', '--time-format', 'day-month-year', '--no-fill']);
    expect([a.read, a.used, a.rejected]).toEqual([5, 3, 2]);
    expect(a.examples.map((e) => [e.line, e.value, e.code])).toEqual([[5, '01/15/2024', 'invalid-date'], [6, '01/16/2024', 'invalid-date']]);
  });
});
