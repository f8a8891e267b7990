// Source values that are periods: nesting, straddling, the --assign policies and apportioning by day share.
// Week dates follow the CDC MMWR rule (REFERENCES.md §2: MMWR 2024 week 1 is 2023-12-31..2024-01-06), so
// 2024-EW04 = 01-21..01-27, 2024-EW05 = 01-28..02-03, 2024-EW09 = 02-25..03-02 (2024 is a leap year).
import { describe, expect, it } from 'vitest';
import { parseAggSpecs } from '../../src/rebin/index.js';
import type { RebinOptions } from '../../src/rebin/index.js';
import { rebinText } from './helpers.js';

const WEEKS = 'epi_week,week_ending,cases\n2024-EW04,2024-01-27,14\n2024-EW05,2024-02-03,70\n2024-EW09,2024-03-02,7\n';
const monthly = (extra: Partial<RebinOptions> = {}): RebinOptions => ({
  time: 'epi_week', calendar: { unit: 'month', zone: 'America/Chicago' }, aggregates: parseAggSpecs(['count', 'sum:cases']), ...extra,
});
const byPeriod = (rows: { period: string; values: (number | null)[] }[]) => Object.fromEntries(rows.map((r) => [r.period, r.values]));

async function code(p: Promise<unknown>): Promise<string | undefined> {
  try {
    await p;
  } catch (e) {
    return (e as { code?: string }).code;
  }
  return undefined;
}

describe('rebin(reader) with source periods', () => {
  it('refuses weeks that straddle a month without --assign, saying how many straddle (E_POLICY)', async () => {
    let message = '';
    try { await rebinText(WEEKS, monthly()); } catch (e) { message = (e as Error).message; expect((e as { code: string }).code).toBe('E_POLICY'); }
    expect(message).toContain('2 of 3 epi-week values straddle a month boundary');
    expect(message).toContain('"2024-EW05" on line 3');
  });

  it('--assign apportion splits count and sum by the share of days in each month', async () => {
    // Hand-computed day shares:
    //   2024-EW05 (Sun 01-28 … Sat 02-03): January holds 28, 29, 30, 31 = 4 days, February 1, 2, 3 = 3 days.
    //     70 cases → January 70 × 4/7 = 40, February 70 × 3/7 = 30.
    //   2024-EW09 (Sun 02-25 … Sat 03-02): February 25–29 = 5 days, March 1–2 = 2 days.
    //     7 cases → February 5, March 2.
    //   2024-EW04 lies wholly in January: 14.
    // Sums: January 14 + 40 = 54; February 30 + 5 = 35; March 2.
    // Counts (rows): January 1 + 4/7 = 11/7; February 3/7 + 5/7 = 8/7; March 2/7.
    const r = await rebinText(WEEKS, monthly({ assign: 'apportion' }));
    const got = byPeriod(r.rows);
    expect(Object.keys(got)).toEqual(['2024-01', '2024-02', '2024-03']);
    expect(got['2024-01']![1]).toBeCloseTo(54, 12);
    expect(got['2024-02']![1]).toBeCloseTo(35, 12);
    expect(got['2024-03']![1]).toBeCloseTo(2, 12);
    expect(got['2024-01']![0]).toBeCloseTo(11 / 7, 12);
    expect(got['2024-02']![0]).toBeCloseTo(8 / 7, 12);
    expect(got['2024-03']![0]).toBeCloseTo(2 / 7, 12);
    expect(r.summary.sourcePeriods).toEqual({ unit: 'epi-week', rows: 3, straddling: 2, policy: 'apportion' });
    expect(r.summary.measures[0]).toMatchObject({ valid: 3, empty: 0, rejected: 0 }); // each row read once
  });

  it('apportions by calendar days, not hours, across a 23-hour day (Europe/London 2024-03-31)', async () => {
    // 2024-EW14 = Sun 2024-03-31 … Sat 04-06. London springs forward on 03-31 (a 23 h day; REFERENCES.md §5).
    // By day share March gets 1/7 of 7 = 1 and April 6/7 of 7 = 6; an hour share would give 7 × 23/167.
    const r = await rebinText('epi_week,cases\n2024-EW14,7\n', { ...monthly({ assign: 'apportion' }), calendar: { unit: 'month', zone: 'Europe/London' } });
    expect(r.rows.map((x) => x.values[1])).toEqual([1, 6]);
  });

  it('--assign start puts a straddling week in the month of its first day, --assign end in that of its last', async () => {
    const start = byPeriod((await rebinText(WEEKS, monthly({ assign: 'start' }))).rows);
    expect(start).toEqual({ '2024-01': [2, 84], '2024-02': [1, 7] }); // EW09 starts in February: no March at all
    const end = byPeriod((await rebinText(WEEKS, monthly({ assign: 'end' }))).rows);
    expect(end).toEqual({ '2024-01': [1, 14], '2024-02': [1, 70], '2024-03': [1, 7] });
  });

  it('reads week-ending dates as epidemiological weeks with sourceUnit and anchor end', async () => {
    const r = await rebinText(WEEKS, monthly({ time: 'week_ending', sourceUnit: 'epi-week', sourceAnchor: 'end', assign: 'end' }));
    expect(byPeriod(r.rows)).toEqual({ '2024-01': [1, 14], '2024-02': [1, 70], '2024-03': [1, 7] });
  });

  it('rejects a week-ending date that is not the last day of its week, counting it', async () => {
    // 2024-02-01 is a Thursday (Temporal: dayOfWeek 4), not the Saturday that ends an MMWR week.
    const t = 'week_ending,cases\n2024-01-27,14\n2024-02-01,3\n';
    const r = await rebinText(t, monthly({ time: 'week_ending', sourceUnit: 'epi-week', sourceAnchor: 'end' }));
    expect(r.summary.rejectedByReason).toEqual({ 'not-period-end': 1 });
    expect(r.summary.rowsUsed + r.summary.rowsRejected).toBe(r.summary.rowsRead);
  });

  it('nests months in quarters exactly, with no policy needed', async () => {
    const t = 'month,cases\n2024-01,1\n2024-02,2\n2024-03,3\n2024-04,4\n2024-06,6\n';
    const r = await rebinText(t, { time: 'month', calendar: { unit: 'quarter' }, aggregates: parseAggSpecs(['sum:cases']) });
    expect(byPeriod(r.rows)).toEqual({ '2024-Q1': [6], '2024-Q2': [10] });
    expect(r.summary.sourcePeriods?.straddling).toBe(0);
  });

  it.each([
    // [source table, target unit] — each asks for a split quern would have to invent
    ['epi_week,cases\n2024-EW05,70\n', 'day'],
    ['month,cases\n2024-01,1\n', 'iso-week'],
    ['quarter,cases\n2024-Q1,1\n', 'month'],
  ])('refuses rebinning to a finer unit (%j → %s) with E_POLICY', async (t, unit) => {
    const time = t.slice(0, t.indexOf(','));
    expect(await code(rebinText(t, { time, calendar: { unit: unit as 'day' }, aggregates: parseAggSpecs(['sum:cases']) }))).toBe('E_POLICY');
  });

  it.each(['mean:cases', 'median:cases', 'p90:cases', 'distinct:cases', 'min:cases'])('refuses to apportion %s (E_POLICY)', async (agg) => {
    expect(await code(rebinText(WEEKS, monthly({ aggregates: parseAggSpecs([agg]), assign: 'apportion' })))).toBe('E_POLICY');
  });

  it('gives means of straddling weeks under --assign start (no split, so no distortion)', async () => {
    const r = await rebinText(WEEKS, monthly({ aggregates: parseAggSpecs(['mean:cases']), assign: 'start' }));
    expect(byPeriod(r.rows)['2024-01']).toEqual([42]); // (14 + 70) / 2
  });
});
