// Filling empty periods for every group, --from/--until, and the --max-periods guard against stray values.
import { describe, expect, it } from 'vitest';
import { defaultMaxPeriods, parseAggSpecs } from '../../src/rebin/index.js';
import { rebinText } from './helpers.js';

const T = 'ts,clinic,v\n2024-01-01T10:00:00Z,a,1\n2024-01-03T10:00:00Z,b,2\n2024-01-05T10:00:00Z,a,4\n';

describe('rebin(reader) fill', () => {
  it('fills every day between the first and last of the whole table, for every group: count 0, sum empty', async () => {
    const r = await rebinText(T, { time: 'ts', calendar: { unit: 'day' }, by: ['clinic'], aggregates: parseAggSpecs(['count', 'sum:v']) });
    // 2024-01-01 … 2024-01-05 is 5 days (common practice: inclusive count of calendar days) × 2 groups.
    expect(r.rows.map((x) => `${x.period} ${x.group[0]} ${x.values.join('/')}`)).toEqual([
      '2024-01-01 a 1/1', '2024-01-01 b 0/',
      '2024-01-02 a 0/', '2024-01-02 b 0/',
      '2024-01-03 a 0/', '2024-01-03 b 1/2',
      '2024-01-04 a 0/', '2024-01-04 b 0/',
      '2024-01-05 a 1/4', '2024-01-05 b 0/',
    ]);
    expect(r.rows.filter((x) => x.filled)).toHaveLength(7);
    expect(r.summary).toMatchObject({ periods: 5, groups: 2, filledRows: 7 });
  });

  it('fill: false emits only the periods and groups that hold rows', async () => {
    const r = await rebinText(T, { time: 'ts', calendar: { unit: 'day' }, by: ['clinic'], fill: false });
    expect(r.rows.map((x) => `${x.period} ${x.group[0]}`)).toEqual(['2024-01-01 a', '2024-01-03 b', '2024-01-05 a']);
  });

  it('from/until fix the range and count rows outside it, so the summary still adds up', async () => {
    const r = await rebinText(T, {
      time: 'ts', calendar: { unit: 'day' }, from: Date.parse('2023-12-30T00:00:00Z'), until: Date.parse('2024-01-03T23:00:00Z'),
    });
    expect(r.rows.map((x) => `${x.period}=${x.values[0]}`)).toEqual(['2023-12-30=0', '2023-12-31=0', '2024-01-01=1', '2024-01-02=0', '2024-01-03=1']);
    expect(r.summary.rowsOutside).toBe(1);
    expect(r.summary.rowsUsed + r.summary.rowsOutside).toBe(r.summary.rowsRead);
  });

  it('sorts periods by their order, not their text: 2024-W09 before 2024-W10 and 2023-EW52 before 2024-EW01', async () => {
    const t = 'ts\n2024-01-02T00:00:00Z\n2023-12-25T00:00:00Z\n';
    const r = await rebinText(t, { time: 'ts', calendar: { unit: 'epi-week' } });
    expect(r.rows.map((x) => x.period)).toEqual(['2023-EW52', '2024-EW01']); // MMWR 2024 week 1 starts 2023-12-31 (REFERENCES.md §2)
  });
});

describe('rebin(reader) --max-periods guard', () => {
  it('defaultMaxPeriods(unit) is 20 years of periods, at least 250 and at most 500,000', () => {
    // 20 years ≈ 1,043.6 weeks (20 × 365.2425 / 7), 7,305 days, 240 months → raised to 250 (the floor).
    expect(defaultMaxPeriods('iso-week')).toBe(1044);
    expect(defaultMaxPeriods('day')).toBe(7305);
    expect(defaultMaxPeriods('month')).toBe(250);
    expect(defaultMaxPeriods('minute')).toBe(500_000);
  });

  it('stops a stray 1970-01-01 among 2024 events, naming the value and its line (E_DATA)', async () => {
    const lines = ['ts'];
    for (let d = 1; d <= 28; d++) lines.push(`2024-02-${String(d).padStart(2, '0')}T12:00:00Z`);
    lines.splice(5, 0, '1970-01-01T00:00:00Z'); // on line 6 (the header is line 1)
    let err: { code?: string; message?: string; hint?: string } = {};
    try { await rebinText(`${lines.join('\n')}\n`, { time: 'ts', calendar: { unit: 'iso-week' } }); } catch (e) { err = e as typeof err; }
    expect(err.code).toBe('E_DATA');
    expect(err.message).toContain('"1970-01-01T00:00:00Z" on line 6');
    expect(err.message).toContain('earliest');
    expect(err.hint).toContain('--max-periods');
  });

  it('stops a stray 9999-12-31 naming it as the latest value', async () => {
    const t = 'ts\n2024-02-01\n2024-02-02\n9999-12-31\n2024-02-03\n';
    let err: { code?: string; message?: string } = {};
    try { await rebinText(t, { time: 'ts', calendar: { unit: 'day' } }); } catch (e) { err = e as typeof err; }
    expect(err.code).toBe('E_DATA');
    expect(err.message).toContain('latest value "9999-12-31" on line 4');
  });

  it('lets the same data through with fill off or a higher limit', async () => {
    const t = 'ts\n1970-01-01\n2024-02-01\n';
    const off = await rebinText(t, { time: 'ts', calendar: { unit: 'month' }, fill: false });
    expect(off.rows.map((x) => x.period)).toEqual(['1970-01', '2024-02']);
    const raised = await rebinText(t, { time: 'ts', calendar: { unit: 'month' }, maxPeriods: 1000 });
    expect(raised.rows).toHaveLength(54 * 12 + 2); // 1970-01 … 2024-02 inclusive: 54 years and 2 months
  });
});
