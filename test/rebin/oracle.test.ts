// rebin counts checked against an independent oracle: every expected count and period start below is
// computed with the Temporal polyfill (temporal-polyfill), never with quern's calendar code.
import { Temporal } from 'temporal-polyfill';
import { describe, expect, it } from 'vitest';
import type { RebinResult } from '../../src/rebin/index.js';
import { rebinText, seeded } from './helpers.js';

const NY = 'America/New_York';
const pad = (n: number, w = 2) => String(n).padStart(w, '0');

/** Generated events: uniform over 2019-06..2027-06, plus dense runs at ISO week-year and DST boundaries. */
function events(): number[] {
  const rnd = seeded(20240310);
  const out: number[] = [];
  const lo = Date.UTC(2019, 5, 1);
  const hi = Date.UTC(2027, 5, 1);
  for (let i = 0; i < 3000; i++) out.push(lo + Math.floor(rnd() * (hi - lo) / 1000) * 1000);
  // Around New Year (ISO week-years: 2020-W53 and 2026-W53 exist; REFERENCES.md §1), every 5 hours.
  for (let y = 2020; y <= 2027; y++) {
    for (let t = Date.UTC(y - 1, 11, 26); t < Date.UTC(y, 0, 6); t += 5 * 3600_000) out.push(t);
  }
  // Both sides of New York's DST changes (US rule: 2nd Sunday of March, 1st Sunday of November at 02:00;
  // REFERENCES.md §5): 2024-03-10T07:00Z and 2024-11-03T06:00Z, 2025-03-09T07:00Z and 2025-11-02T06:00Z.
  for (const iso of ['2024-03-10T07:00:00Z', '2024-11-03T06:00:00Z', '2025-03-09T07:00:00Z', '2025-11-02T06:00:00Z']) {
    const t = Date.parse(iso);
    for (const d of [-3600_000, -60_000, -1000, 0, 1000, 60_000, 3600_000]) out.push(t + d);
  }
  // Midnight at quarter and fiscal-year starts in New York, one second either side.
  for (const iso of ['2023-10-01T04:00:00Z', '2024-01-01T05:00:00Z', '2024-04-01T04:00:00Z', '2024-10-01T04:00:00Z']) {
    const t = Date.parse(iso);
    out.push(t - 1000, t, t + 1000);
  }
  return out;
}

const OFFSETS = ['UTC', '+05:30', '-08:00', '+13:45', '-03:30'];

/** The events as a CSV `ts,site`, each instant written with one of several offsets (Temporal formats them). */
function csv(ms: readonly number[]): string {
  const lines = ['ts,site'];
  ms.forEach((t, i) => {
    const text = Temporal.Instant.fromEpochMilliseconds(t).toString({ timeZone: OFFSETS[i % OFFSETS.length]! });
    lines.push(`${text},${i % 3 === 0 ? 'north' : 'south'}`);
  });
  return `${lines.join('\n')}\n`;
}

function zoned(t: number, zone: string): Temporal.ZonedDateTime {
  return Temporal.Instant.fromEpochMilliseconds(t).toZonedDateTimeISO(zone);
}

// ISO 8601 week date: Temporal's yearOfWeek / weekOfYear.
const isoWeekLabel = (t: number, zone: string) => {
  const z = zoned(t, zone);
  return `${z.yearOfWeek}-W${pad(z.weekOfYear!)}`;
};

// CDC MMWR week (REFERENCES.md §2): Sunday–Saturday; the week belongs to the year holding at least four of
// its days, i.e. the year of its Wednesday; week 1 holds January 4.
const epiWeekLabel = (t: number, zone: string) => {
  const d = zoned(t, zone).toPlainDate();
  const wednesday = d.subtract({ days: d.dayOfWeek % 7 }).add({ days: 3 });
  return `${wednesday.year}-EW${pad(Math.floor((wednesday.dayOfYear - 1) / 7) + 1)}`;
};

const quarterLabel = (t: number, zone: string) => {
  const z = zoned(t, zone);
  return `${z.year}-Q${Math.ceil(z.month / 3)}`;
};

// US federal fiscal year: 1 October – 30 September, named by the year in which it ends (31 U.S.C. §1102;
// REFERENCES.md §6).
const fiscalYearLabel = (t: number, zone: string) => {
  const z = zoned(t, zone);
  return `FY${z.month >= 10 ? z.year + 1 : z.year}`;
};

function oracleCounts(ms: readonly number[], label: (t: number) => string, group?: (i: number) => string): Map<string, number> {
  const m = new Map<string, number>();
  ms.forEach((t, i) => {
    const k = group ? `${label(t)}|${group(i)}` : label(t);
    m.set(k, (m.get(k) ?? 0) + 1);
  });
  return m;
}

function expectCounts(r: RebinResult, expected: Map<string, number>, total: number): void {
  let sum = 0;
  const seen = new Set<string>();
  for (const row of r.rows) {
    const key = [row.period, ...row.group].join('|');
    expect(row.values[0], key).toBe(expected.get(key) ?? 0);
    sum += row.values[0]!;
    seen.add(key);
  }
  expect(sum).toBe(total);
  for (const k of expected.keys()) expect(seen.has(k), k).toBe(true);
  expect(r.summary.rowsUsed).toBe(total);
}

const ms = events();
const text = csv(ms);

describe('rebin(reader, {unit}) counts against Temporal', () => {
  it('rebin(iso-week, UTC) matches Temporal weekOfYear/yearOfWeek, across 2020-W53 and 2026-W53', async () => {
    const r = await rebinText(text, { time: 'ts', calendar: { unit: 'iso-week', zone: 'UTC' } });
    expectCounts(r, oracleCounts(ms, (t) => isoWeekLabel(t, 'UTC')), ms.length);
    expect(r.rows.some((x) => x.period === '2020-W53')).toBe(true); // 2020 has 53 ISO weeks (REFERENCES.md §1)
    expect(r.rows.some((x) => x.period === '2026-W53')).toBe(true);
  });

  it('rebin(iso-week, America/New_York) fills every week and starts each at Monday 00:00 local (Temporal startOfDay)', async () => {
    const r = await rebinText(text, { time: 'ts', calendar: { unit: 'iso-week', zone: NY } });
    expectCounts(r, oracleCounts(ms, (t) => isoWeekLabel(t, NY)), ms.length);
    const first = zoned(Math.min(...ms), NY).toPlainDate();
    const last = zoned(Math.max(...ms), NY).toPlainDate();
    const monday = (d: Temporal.PlainDate) => d.subtract({ days: d.dayOfWeek - 1 });
    const weeks = monday(first).until(monday(last), { largestUnit: 'days' }).days / 7 + 1;
    expect(r.rows.length).toBe(weeks);
    r.rows.forEach((row, i) => {
      const start = monday(first).add({ weeks: i }).toZonedDateTime({ timeZone: NY });
      expect(Date.parse(row.start), row.period).toBe(start.epochMilliseconds);
      expect(Date.parse(row.end), row.period).toBe(start.add({ weeks: 1 }).epochMilliseconds);
    });
  });

  it('rebin(epi-week, America/New_York) matches the CDC MMWR rule computed with Temporal', async () => {
    const r = await rebinText(text, { time: 'ts', calendar: { unit: 'epi-week', zone: NY } });
    expectCounts(r, oracleCounts(ms, (t) => epiWeekLabel(t, NY)), ms.length);
    expect(r.rows.some((x) => x.period === '2020-EW53')).toBe(true); // MMWR 2020 has 53 weeks (REFERENCES.md §2)
    expect(r.rows.some((x) => x.period === '2025-EW53')).toBe(true); // and 2025
    expect(r.rows.some((x) => x.period === '2026-EW53')).toBe(false); // ISO has 2026-W53, MMWR does not
  });

  it('rebin(quarter, America/New_York) matches Temporal calendar quarters in New York, per group', async () => {
    const r = await rebinText(text, { time: 'ts', calendar: { unit: 'quarter', zone: NY }, by: ['site'] });
    const group = (i: number) => (i % 3 === 0 ? 'north' : 'south');
    expectCounts(r, oracleCounts(ms, (t) => quarterLabel(t, NY), group), ms.length);
    const q = r.rows.find((x) => x.period === '2024-Q1')!;
    // 2024-01-01T00:00 in New York is EST (UTC−5); 2024-04-01T00:00 is EDT (UTC−4) (Temporal).
    expect(q.start).toBe('2024-01-01T00:00:00-05:00');
    expect(q.end).toBe('2024-04-01T00:00:00-04:00');
  });

  it('rebin(fiscal-year, America/New_York) names US federal years by their end: FY2024 = 2023-10-01..2024-09-30', async () => {
    const r = await rebinText(text, { time: 'ts', calendar: { unit: 'fiscal-year', zone: NY, fiscalStart: { month: 10, day: 1 } } });
    expectCounts(r, oracleCounts(ms, (t) => fiscalYearLabel(t, NY)), ms.length);
    const fy = r.rows.find((x) => x.period === 'FY2024')!;
    expect(fy.start).toBe('2023-10-01T00:00:00-04:00'); // 31 U.S.C. §1102; EDT in October (Temporal)
    expect(fy.end).toBe('2024-10-01T00:00:00-04:00');
  });

  it('rebin(day, America/New_York) puts events one second either side of a DST change in the right day', async () => {
    // 2024-03-10T06:59:59Z is 01:59:59 EST, 07:00:00Z is 03:00:00 EDT: both on 2024-03-10 (Temporal).
    // 2024-11-03T05:59:59Z is 01:59:59 EDT, 06:00:00Z is 01:00:00 EST: both on 2024-11-03 (Temporal).
    const lines = ['ts', '2024-03-10T04:59:59Z', '2024-03-10T05:00:00Z', '2024-03-10T06:59:59Z', '2024-03-10T07:00:00Z', '2024-11-03T05:59:59Z', '2024-11-03T06:00:00Z'];
    const r = await rebinText(`${lines.join('\n')}\n`, { time: 'ts', calendar: { unit: 'day', zone: NY }, fill: false });
    const expected = oracleCounts(lines.slice(1).map(Date.parse), (t) => zoned(t, NY).toPlainDate().toString());
    expect(new Map(r.rows.map((x) => [x.period, x.values[0]]))).toEqual(expected);
    const day = r.rows.find((x) => x.period === '2024-03-10')!;
    expect(Date.parse(day.end) - Date.parse(day.start)).toBe(23 * 3600_000); // a 23-hour day (REFERENCES.md §5)
  });
});

describe('rebin(reader, {unit: day | month}) in zones with odd offsets and DST rules, against Temporal', () => {
  // Zones from REFERENCES.md §5: half-hour DST (Lord Howe), +05:45 (Kathmandu), southern-hemisphere DST
  // (Sydney), midnight skipped (Havana, Sao Paulo 2018), 25-hour days (New York, Beirut).
  const zones = ['Australia/Lord_Howe', 'Asia/Kathmandu', 'Australia/Sydney', 'America/Havana', 'America/Sao_Paulo', 'Asia/Beirut', 'Europe/London'];
  const rnd = seeded(99);
  const sample: number[] = [];
  const lo = Date.UTC(2017, 0, 1);
  const hi = Date.UTC(2025, 0, 1);
  for (let i = 0; i < 1500; i++) sample.push(lo + Math.floor(rnd() * (hi - lo)));
  const body = `ts\n${sample.map((t) => new Date(t).toISOString()).join('\n')}\n`;

  it.each(zones)('day and month counts in %s match Temporal toPlainDate()', async (zone) => {
    const day = await rebinText(body, { time: 'ts', calendar: { unit: 'day', zone }, fill: false });
    const dayOracle = oracleCounts(sample, (t) => zoned(t, zone).toPlainDate().toString());
    expect(new Map(day.rows.map((x) => [x.period, x.values[0]]))).toEqual(dayOracle);
    const month = await rebinText(body, { time: 'ts', calendar: { unit: 'month', zone } });
    const monthOracle = oracleCounts(sample, (t) => zoned(t, zone).toPlainDate().toPlainYearMonth().toString());
    for (const row of month.rows) expect(row.values[0], row.period).toBe(monthOracle.get(row.period) ?? 0);
    // Each month starts at the first instant of its first day (Temporal startOfDay: the end of a gap
    // where midnight is skipped).
    for (const row of month.rows) {
      const start = Temporal.PlainYearMonth.from(row.period).toPlainDate({ day: 1 }).toZonedDateTime({ timeZone: zone }).startOfDay();
      expect(Date.parse(row.start), `${zone} ${row.period}`).toBe(start.epochMilliseconds);
    }
  });
});
