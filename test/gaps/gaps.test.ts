// findGaps on generated series with known holes, weekday calendars and holiday lists. Dates and weekdays
// of the generated series come from the Temporal polyfill, not from quern's calendar.
import { Temporal } from 'temporal-polyfill';
import { describe, expect, it } from 'vitest';
import { findGaps, isoDay, parseSkipDates } from '../../src/gaps/index.js';
import type { GapsOptions } from '../../src/gaps/index.js';
import { openTable } from '../../src/table/index.js';
import { tableFile } from '../rebin/helpers.js';

async function gapsOf(text: string, options: GapsOptions) {
  const reader = await openTable(tableFile(text));
  try {
    return await findGaps(reader, options);
  } finally {
    reader.close();
  }
}

/** Days from `from` for `n` days, as Temporal PlainDates. */
function days(from: string, n: number): Temporal.PlainDate[] {
  const d0 = Temporal.PlainDate.from(from);
  return Array.from({ length: n }, (_, i) => d0.add({ days: i }));
}

describe('findGaps(reader, {unit: day})', () => {
  it('reports the known holes per series as runs, the duplicates with counts, and the coverage', async () => {
    // Series a: 2024-03-01 … 2024-03-31 without 03-10 … 03-12 and 03-20; 03-05 twice. Series b: complete.
    const lines = ['day,site'];
    for (const d of days('2024-03-01', 31)) {
      const s = d.toString();
      if (!['2024-03-10', '2024-03-11', '2024-03-12', '2024-03-20'].includes(s)) lines.push(`${s},a`);
      if (s === '2024-03-05') lines.push(`${s},a`);
      lines.push(`${s},b`);
    }
    const r = await gapsOf(`${lines.join('\n')}\n`, { time: 'day', calendar: { unit: 'day' }, by: ['site'] });
    const [a, b] = r.series;
    expect(a).toMatchObject({ key: 'a', first: '2024-03-01', last: '2024-03-31', expected: 31, present: 27, rows: 28 });
    expect(a!.missing.map(({ from, to, periods }) => ({ from, to, periods }))).toEqual([
      { from: '2024-03-10', to: '2024-03-12', periods: 3 },
      { from: '2024-03-20', to: '2024-03-20', periods: 1 },
    ]);
    expect(a!.duplicates.map(({ period, count }) => ({ period, count }))).toEqual([{ period: '2024-03-05', count: 2 }]);
    expect(a!.coverage).toBeCloseTo(27 / 31, 12);
    expect(a!.longestGap).toMatchObject({ from: '2024-03-10', periods: 3 });
    expect(b).toMatchObject({ key: 'b', expected: 31, present: 31, missing: [], duplicates: [], coverage: 1 });
    expect(r.problems).toBe(true);
    expect(r.summary).toMatchObject({ rowsRead: 59, rowsUsed: 59, rowsEmpty: 0, rowsRejected: 0 });
  });

  it('--weekdays expects Monday–Friday only: a week of weekday data has no gap over its weekend', async () => {
    // 2024-03-04 is a Monday (Temporal dayOfWeek 1); two weeks of weekday readings, Tuesday 03-12 missing.
    const weekdays = days('2024-03-04', 14).filter((d) => d.dayOfWeek <= 5 && d.toString() !== '2024-03-12');
    const text = `day\n${weekdays.join('\n')}\n`;
    const plain = await gapsOf(text, { time: 'day', calendar: { unit: 'day' } });
    expect(plain.series[0]!.missing.map((m) => m.from)).toEqual(['2024-03-09', '2024-03-12']); // the weekend and the Tuesday
    const r = await gapsOf(text, { time: 'day', calendar: { unit: 'day' }, weekdays: true });
    expect(r.series[0]).toMatchObject({ expected: 10, present: 9 });
    expect(r.series[0]!.missing.map(({ from, to, periods }) => ({ from, to, periods }))).toEqual([{ from: '2024-03-12', to: '2024-03-12', periods: 1 }]);
  });

  it('--skip-dates removes listed holidays from what is expected', async () => {
    // US federal holidays in this span (5 U.S.C. §6103): 2024-12-25 (Christmas Day) and 2025-01-01 (New Year's Day).
    const holidays = parseSkipDates('date,name\n2024-12-25,Christmas Day\n# observed\n2025-01-01,New Year\n');
    expect([...holidays]).toEqual([isoDay('2024-12-25'), isoDay('2025-01-01')]);
    const open = days('2024-12-23', 14).filter((d) => d.dayOfWeek <= 5 && !['2024-12-25', '2025-01-01'].includes(d.toString()));
    const r = await gapsOf(`day\n${open.join('\n')}\n`, { time: 'day', calendar: { unit: 'day' }, weekdays: true, skipDays: holidays });
    expect(r.series[0]).toMatchObject({ expected: open.length, present: open.length, missing: [] });
    expect(r.problems).toBe(false);
  });

  it('refuses --weekdays with a unit longer than a day (E_USAGE)', async () => {
    await expect(gapsOf('day\n2024-03-04\n', { time: 'day', calendar: { unit: 'month' }, weekdays: true })).rejects.toMatchObject({ code: 'E_USAGE' });
  });

  it('parseSkipDates names the line of a value that is not a date (E_VALUE)', () => {
    expect(() => parseSkipDates('2024-12-25\n2024-02-30\n', 'holidays.txt')).toThrow(expect.objectContaining({ code: 'E_VALUE', message: expect.stringContaining('holidays.txt:2') }));
  });
});

describe('findGaps(reader) with 15-minute readings', () => {
  // Readings every 15 minutes for two days from 2024-02-13T00:00Z, with readings from 02:00 to 10:45 on
  // 2024-02-14 missing (36 slots) and one duplicated reading.
  const t0 = Date.parse('2024-02-13T00:00:00Z');
  const lines = ['reading_time,temp_c'];
  for (let i = 0; i < 192; i++) {
    const t = t0 + i * 900_000;
    if (i >= 104 && i < 140) continue;
    lines.push(`${Temporal.Instant.fromEpochMilliseconds(t).toString()},4.5`);
    if (i === 20) lines.push(`${Temporal.Instant.fromEpochMilliseconds(t).toString()},4.6`);
  }
  const text = `${lines.join('\n')}\n`;

  it('--unit minute --step 15 finds the outage as one run of 36 slots and the duplicate', async () => {
    const r = await gapsOf(text, { time: 'reading_time', calendar: { unit: 'minute', step: 15 } });
    const s = r.series[0]!;
    expect(s).toMatchObject({ expected: 192, present: 156 });
    expect(s.missing).toHaveLength(1);
    expect(s.missing[0]!.periods).toBe(36);
    expect(Date.parse(s.missing[0]!.from.split('/')[0]!)).toBe(Date.parse('2024-02-14T02:00:00Z'));
    expect(s.duplicates.map((d) => d.count)).toEqual([2]);
  });

  it('--max-gap PT1H reports the gap from the last reading before it to the first after it', async () => {
    const r = await gapsOf(text, { time: 'reading_time', calendar: null, maxGapMs: 3600_000, maxGapText: 'PT1H' });
    expect(r.unit).toBeNull();
    expect(r.series[0]!.gaps).toEqual([{ from: '2024-02-14T01:45:00Z', to: '2024-02-14T11:00:00Z', length: 'PT9H15M', ms: 37 * 900_000 }]);
    expect(r.problems).toBe(true);
  });

  it('takes the unit from the detect callback when the values are instants and none is given', async () => {
    const r = await gapsOf(text, {
      time: 'reading_time', calendar: null,
      detect: async () => ({ calendar: { unit: 'minute', step: 15 }, basis: 'detected grain: 15-minute', weekdays: false }),
    });
    expect(r).toMatchObject({ unit: 'minute', step: 15, unitBasis: 'detected grain: 15-minute' });
    expect(r.series[0]!.missing[0]!.periods).toBe(36);
  });

  it('without a unit, a detect callback or --max-gap, instants are misuse (E_USAGE)', async () => {
    await expect(gapsOf(text, { time: 'reading_time', calendar: null })).rejects.toMatchObject({ code: 'E_USAGE' });
  });
});

describe('findGaps(reader) with values that are periods', () => {
  it('takes epi-week from the labels and reports 2024-EW52 … 2025-EW02 as one run over the 53-week year', async () => {
    // MMWR 2024 has 52 weeks and 2025 begins 2024-12-29 (REFERENCES.md §2), so EW52 of 2024 is followed by
    // 2025-EW01. Missing 2024-EW52, 2025-EW01 and 2025-EW02: three weeks.
    const text = 'epi_week\n2024-EW50\n2024-EW51\n2025-EW03\n2025-EW04\n';
    const r = await gapsOf(text, { time: 'epi_week', calendar: null });
    expect(r.unit).toBe('epi-week');
    expect(r.unitBasis).toContain('notation');
    expect(r.series[0]!.missing.map(({ from, to, periods }) => ({ from, to, periods }))).toEqual([{ from: '2024-EW52', to: '2025-EW02', periods: 3 }]);
  });

  it('counts rejected and empty rows so the summary adds up', async () => {
    const r = await gapsOf('epi_week\n2024-EW50\n\n2024-EW99\n2024-EW51\n', { time: 'epi_week', calendar: null });
    const s = r.summary;
    expect(s.rowsUsed + s.rowsEmpty + s.rowsRejected + s.rowsOutside).toBe(s.rowsRead);
    expect(s.rowsRejected).toBe(1);
  });
});

describe('findGaps(reader, {from, until})', () => {
  it('checks a fixed span: missing days before the first and after the last row are runs too', async () => {
    const r = await gapsOf('day\n2024-03-03\n2024-03-04\n2099-01-01\n', {
      time: 'day', calendar: { unit: 'day' }, from: Date.parse('2024-03-01T00:00:00Z'), until: Date.parse('2024-03-06T00:00:00Z'),
    });
    const s = r.series[0]!;
    expect(s).toMatchObject({ first: '2024-03-01', last: '2024-03-06', expected: 6, present: 2 });
    expect(s.missing.map(({ from, to }) => `${from}…${to}`)).toEqual(['2024-03-01…2024-03-02', '2024-03-05…2024-03-06']);
    expect(r.summary.rowsOutside).toBe(1); // 2099-01-01
  });
});
