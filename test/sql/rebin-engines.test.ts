// rebinQuerySql and periodSql against real engines: for every unit, several zones and both tested dialects,
// seeded events are rebinned in process with quern's calendar (makeCalendar: index, startOf, period) and by
// the emitted SQL in DuckDB (embedded) and PostgreSQL (PGlite); periods (label, start, end) and counts must
// be identical. The oracle is quern's calendar, itself checked against published tables in test/calendar;
// the published values for the hard cases are checked again here in worked-values.test.ts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeCalendar, type CalendarOptions } from '../../src/calendar/index.js';
import { periodSql } from '../../src/sql/period.js';
import { rebinQuerySql } from '../../src/sql/rebin.js';
import { loadEvents, openEngines, runDuck, runExpressions, runPg, seeded, type Engines, type ResultRow } from './engines.js';

const ZONES = ['UTC', 'America/New_York', 'Australia/Sydney', 'Asia/Kathmandu', 'America/Sao_Paulo', 'America/Havana', '+05:30'];

const DAY = 86_400_000;
const t = (iso: string): number => Date.parse(iso);

type Variant = { name: string; options: Omit<CalendarOptions, 'zone'>; subday?: boolean };

const DATE_VARIANTS: Variant[] = [
  { name: 'day', options: { unit: 'day' } },
  { name: '3 days', options: { unit: 'day', step: 3 } },
  { name: 'week (Wednesday)', options: { unit: 'week', weekStart: 3 } },
  { name: 'week (Sunday) x2', options: { unit: 'week', weekStart: 7, step: 2 } },
  { name: 'iso-week', options: { unit: 'iso-week' } },
  { name: 'epi-week', options: { unit: 'epi-week' } },
  { name: 'epi-week x4 from origin', options: { unit: 'epi-week', step: 4, origin: t('2019-12-29T12:00:00Z') } },
  { name: 'month', options: { unit: 'month' } },
  { name: '2 months', options: { unit: 'month', step: 2 } },
  { name: 'quarter', options: { unit: 'quarter' } },
  { name: 'half', options: { unit: 'half' } },
  { name: 'year', options: { unit: 'year' } },
  { name: 'fiscal-year (Oct, end)', options: { unit: 'fiscal-year' } },
  { name: 'fiscal-year (Jul, start)', options: { unit: 'fiscal-year', fiscalStart: { month: 7, day: 1 }, fiscalLabel: 'start' } },
  { name: 'fiscal-quarter (Apr 6)', options: { unit: 'fiscal-quarter', fiscalStart: { month: 4, day: 6 } } },
  { name: 'fiscal-month (Oct)', options: { unit: 'fiscal-month' } },
];

const SUBDAY_VARIANTS: Variant[] = [
  { name: 'hour', options: { unit: 'hour' }, subday: true },
  { name: '15 minutes', options: { unit: 'minute', step: 15 }, subday: true },
  { name: '6 hours', options: { unit: 'hour', step: 6 }, subday: true },
  { name: '30 seconds', options: { unit: 'second', step: 30 }, subday: true },
];

// Windows with the days that broke other tools: ISO 2020-W53 and epi 2020-EW53 (2020-12-27..2021-01-09),
// ISO 2026-W53 and epi 2025-EW53, the skipped Sao Paulo midnight of 2018-11-04, the repeated Havana
// midnight of 2024-11-03, Sydney's April and October changes, New York's March and November changes.
const DATE_SPAN: [number, number] = [t('2018-10-01T00:00:00Z'), t('2026-03-01T00:00:00Z')];
const HOT_DATES = ['2018-11-04', '2018-11-03', '2020-12-31', '2021-01-03', '2021-01-04', '2024-11-03', '2024-04-07',
  '2024-10-06', '2024-03-10', '2025-12-28', '2026-01-01', '2026-01-04', '2026-12-31', '2015-01-03', '2024-04-06'];

function dateEvents(zone: string): number[] {
  const rnd = seeded(20241103);
  const out: number[] = [];
  for (let i = 0; i < 600; i++) out.push(Math.floor(DATE_SPAN[0] + rnd() * (DATE_SPAN[1] - DATE_SPAN[0])));
  // Instants right at and around local midnight of the hot dates, in this zone (via quern's own day starts
  // would be circular, so use fixed UTC offsets from -14 h to +14 h in 15-minute steps near each date).
  for (const d of HOT_DATES) {
    const base = t(`${d}T00:00:00Z`);
    for (let q = -56; q <= 56; q += 7) out.push(base - q * 900_000, base - q * 900_000 - 1);
  }
  void zone;
  return out;
}

// Sub-day windows: two days around each daylight-saving change of the zone in 2024 (2018 for Sao Paulo).
const SUBDAY_WINDOWS: Record<string, string[]> = {
  UTC: ['2024-03-10'],
  'America/New_York': ['2024-03-10', '2024-11-03'],
  'Australia/Sydney': ['2024-04-07', '2024-10-06'],
  'Asia/Kathmandu': ['2024-03-10'],
  'America/Sao_Paulo': ['2018-11-04', '2019-02-17'],
  'America/Havana': ['2024-03-10', '2024-11-03'],
  '+05:30': ['2024-03-10'],
};

function subdayEvents(zone: string, window: string): number[] {
  const rnd = seeded(7 + window.length);
  // 36 hours from noon UTC of the day before: every change in SUBDAY_WINDOWS falls inside.
  const base = t(`${window}T00:00:00Z`) - DAY / 2;
  const out: number[] = [];
  for (let i = 0; i < 300; i++) out.push(Math.floor(base + rnd() * 1.5 * DAY));
  void zone;
  return out;
}

/** quern in process: counts per period key, every key from the first to the last filled. */
function quernRebin(options: CalendarOptions, events: readonly number[]): ResultRow[] {
  const cal = makeCalendar(options);
  const counts = new Map<number, number>();
  for (const ms of events) {
    const k = cal.index(ms);
    counts.set(k, (counts.get(k) ?? 0) + 1);
  }
  const keys = [...counts.keys()];
  if (keys.length === 0) return [];
  const lo = Math.min(...keys);
  const hi = Math.max(...keys);
  const rows: ResultRow[] = [];
  for (let k = lo; k <= hi; k++) {
    const p = cal.period(cal.startOf(k));
    rows.push({ period: p.label, start: p.start, end: p.end, count: counts.get(k) ?? 0 });
  }
  return rows;
}

let engines: Engines;
const agreement = { combos: 0, agreed: 0, failed: [] as string[], rowChecks: 0, rowAgreed: 0 };

beforeAll(async () => {
  engines = await openEngines();
}, 120_000);

afterAll(async () => {
  // The closing note of the README quotes this count.
  console.log(`quern sql: ${agreement.agreed} of ${agreement.combos} unit x zone x dialect combinations agree with quern` +
    (agreement.failed.length > 0 ? `; failed: ${agreement.failed.join(', ')}` : '') +
    `; periodSql row by row: ${agreement.rowAgreed} of ${agreement.rowChecks} unit x zone x dialect combinations agree`);
  await engines?.close();
});

async function checkBoth(table: string, options: CalendarOptions, events: readonly number[], label: string): Promise<void> {
  const expected = quernRebin(options, events);
  expect(expected.length).toBeGreaterThan(1);
  for (const dialect of ['duckdb', 'postgres'] as const) {
    const sql = rebinQuerySql({ ...options, column: 'ts', table, dialect });
    const got = dialect === 'duckdb' ? await runDuck(engines, sql) : await runPg(engines, sql);
    agreement.combos++;
    const same = JSON.stringify(got) === JSON.stringify(expected);
    if (same) agreement.agreed++;
    else agreement.failed.push(`${label} ${dialect}`);
    expect(got, `${label} in ${dialect}`).toEqual(expected);
  }
}

describe.each(ZONES)('rebinQuerySql in zone %s', (zone) => {
  const table = `ev_${zone.replace(/[^A-Za-z0-9]/g, '_').toLowerCase()}`;
  beforeAll(async () => {
    await loadEvents(engines, table, dateEvents(zone));
  });

  it.each(DATE_VARIANTS.map((v) => [v.name, v] as const))('%s: DuckDB and PostgreSQL give quern\'s periods and counts', async (name, v) => {
    await checkBoth(table, { ...v.options, zone }, dateEvents(zone), `${name} / ${zone}`);
  });

  it.each(SUBDAY_VARIANTS.map((v) => [v.name, v] as const))('%s: DuckDB and PostgreSQL give quern\'s periods and counts', async (name, v) => {
    for (const w of SUBDAY_WINDOWS[zone]!) {
      const events = subdayEvents(zone, w);
      const sub = `${table}_${w.replace(/-/g, '')}`;
      await loadEvents(engines, sub, events);
      await checkBoth(sub, { ...v.options, zone }, events, `${name} / ${zone} / ${w}`);
    }
  });
});

describe('periodSql expressions row by row', () => {
  const zones = ['America/Sao_Paulo', 'Australia/Sydney', 'America/Havana', 'Asia/Kathmandu'];
  const variants = [...DATE_VARIANTS.filter((v) => ['iso-week', 'epi-week', 'month', 'fiscal-quarter (Apr 6)', 'week (Sunday) x2'].includes(v.name)), SUBDAY_VARIANTS[0]!, SUBDAY_VARIANTS[1]!];
  it.each(zones)('label, start and end of every row in %s match makeCalendar(...).period(ms)', async (zone) => {
    const events = [...dateEvents(zone).slice(0, 150), ...subdayEvents(zone, SUBDAY_WINDOWS[zone]![0]!)].sort((a, b) => a - b);
    const table = `rows_${zone.replace(/[^A-Za-z0-9]/g, '_').toLowerCase()}`;
    await loadEvents(engines, table, events);
    for (const v of variants) {
      const options = { ...v.options, zone };
      const cal = makeCalendar(options);
      const expected = events.map((ms) => { const p = cal.period(ms); return { ts: ms, period: p.label, start: p.start, end: p.end }; });
      for (const which of ['duck', 'pg'] as const) {
        const p = periodSql({ ...options, column: 'ts', dialect: which === 'duck' ? 'duckdb' : 'postgres' });
        const got = await runExpressions(engines, which, `SELECT ts, ${p.label}, ${p.start}, ${p.end} FROM ${table} ORDER BY ts`);
        agreement.rowChecks++;
        if (JSON.stringify(got) === JSON.stringify(expected)) agreement.rowAgreed++;
        expect(got, `${v.name} / ${zone} / ${which}`).toEqual(expected);
      }
    }
  });
});
