// `quern rebin` through runCli on the demo files. Expected periods and counts are computed here with the
// Temporal polyfill from the fixture's own rows, never with quern's calendar.
import { readFileSync } from 'node:fs';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Temporal } from 'temporal-polyfill';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';

const CHI = 'America/Chicago';
const visits = readFileSync(new URL('../../fixtures/visits.csv', import.meta.url), 'utf8').trim().split('\n').slice(1)
  .map((line) => line.split(','));
const visitTimes = visits.map((f) => Date.parse(f[1]!));
const tmp = mkdtempSync(join(tmpdir(), 'quern-cli-rebin-'));
const pad = (n: number) => String(n).padStart(2, '0');
const plainDate = (t: number) => Temporal.Instant.fromEpochMilliseconds(t).toZonedDateTimeISO(CHI).toPlainDate();

// CDC MMWR week of a date (REFERENCES.md §2): the year and week of the Wednesday of its Sunday-start week.
function epiWeek(d: Temporal.PlainDate): string {
  const wed = d.subtract({ days: d.dayOfWeek % 7 }).add({ days: 3 });
  return `${wed.year}-EW${pad(Math.floor((wed.dayOfYear - 1) / 7) + 1)}`;
}

function parseCsv(text: string): string[][] {
  return text.trim().split('\n').map((l) => l.split(','));
}

describe('quern rebin (demo visits)', () => {
  it('rebins to epidemiological weeks in America/Chicago with every week present and the counts of Temporal', async () => {
    const r = await runCli(['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'epi-week', '--zone', CHI]);
    expect(r.status).toBe(0);
    const rows = parseCsv(r.stdout);
    expect(rows[0]).toEqual(['period', 'start', 'end', 'count']);
    // Every epi week from the first visit's to the last visit's, in order (Sunday steps, Temporal).
    const first = plainDate(Math.min(...visitTimes));
    const last = plainDate(Math.max(...visitTimes));
    const weeks: string[] = [];
    for (let d = first.subtract({ days: first.dayOfWeek % 7 }); Temporal.PlainDate.compare(d, last) <= 0; d = d.add({ days: 7 })) weeks.push(epiWeek(d));
    expect(rows.slice(1).map((x) => x[0])).toEqual(weeks);
    const oracle = new Map<string, number>();
    for (const t of visitTimes) oracle.set(epiWeek(plainDate(t)), (oracle.get(epiWeek(plainDate(t))) ?? 0) + 1);
    for (const row of rows.slice(1)) expect(Number(row[3]), row[0]).toBe(oracle.get(row[0]!) ?? 0);
    expect(r.stderr).toContain(`${visits.length.toLocaleString('en-US')} rows read`);
  });

  it('rebins to US federal fiscal quarters by clinic, filling quarters before a clinic opened', async () => {
    const r = await runCli(['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'fiscal-quarter', '--fiscal-start', '10', '--zone', CHI,
      '--by', 'clinic', '--agg', 'count', '--agg', 'mean:wait_minutes']);
    expect(r.status).toBe(0);
    const rows = parseCsv(r.stdout);
    expect(rows[0]).toEqual(['period', 'start', 'end', 'clinic', 'count', 'mean_wait_minutes']);
    // Fiscal quarter of the US federal year (1 October start, named by the end year; 31 U.S.C. §1102).
    const fq = (d: Temporal.PlainDate) => {
      const shifted = d.with({ day: 1 }).add({ months: 3 }); // October → January of the next (fiscal) year
      return `FY${shifted.year}-Q${Math.ceil(shifted.month / 3)}`;
    };
    const clinics = [...new Set(visits.map((f) => f[2]!))].sort();
    const quarters = [...new Set(visitTimes.map((t) => fq(plainDate(t))))];
    expect(rows.length - 1).toBe(quarters.length * clinics.length);
    const oracle = new Map<string, number>();
    visits.forEach((f, i) => { const k = `${fq(plainDate(visitTimes[i]!))}|${f[2]}`; oracle.set(k, (oracle.get(k) ?? 0) + 1); });
    for (const row of rows.slice(1)) {
      const n = oracle.get(`${row[0]}|${row[3]}`) ?? 0;
      expect(Number(row[4]), `${row[0]} ${row[3]}`).toBe(n);
      if (n === 0) expect(row[5]).toBe(''); // filled: count 0, other aggregates empty
    }
    const q1 = rows.find((x) => x[0] === 'FY2024-Q1')!;
    expect(q1.slice(1, 3)).toEqual(['2023-10-01T00:00:00-05:00', '2024-01-01T00:00:00-06:00']); // CDT then CST (Temporal)
  });

  it('--format json carries the rows as records and the summary; ndjson one record a line', async () => {
    const j = await runCli(['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'quarter', '--zone', CHI, '--format', 'json', '--agg', 'p90:wait_minutes']);
    expect(j.status).toBe(0);
    const doc = JSON.parse(j.stdout);
    expect(doc).toMatchObject({ unit: 'quarter', zone: CHI, columns: ['period', 'start', 'end', 'p90_wait_minutes'] });
    expect(doc.rows[0]).toHaveProperty('p90_wait_minutes');
    expect(doc.summary.rowsRead).toBe(visits.length);
    expect(j.stderr).toBe('');
    const n = await runCli(['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'quarter', '--zone', CHI, '--format', 'ndjson']);
    const lines = n.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines.map((x) => x.period)).toEqual(doc.rows.map((x: { period: string }) => x.period));
  });

  it('--out writes the file and leaves standard output empty', async () => {
    const out = join(tmp, 'weeks.csv');
    const r = await runCli(['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'iso-week', '--zone', CHI, '--out', out, '--quiet']);
    expect(r).toMatchObject({ status: 0, stdout: '', stderr: '' });
    expect(readFileSync(out, 'utf8').split('\n')[0]).toBe('period,start,end,count');
  });

  it('neutralises group values a spreadsheet would run as formulas (OWASP CSV Injection)', async () => {
    const f = join(tmp, 'formula.csv');
    writeFileSync(f, 'ts,site\n2024-01-01T00:00:00Z,=1+2\n');
    const r = await runCli(['rebin', f, '--time', 'ts', '--unit', 'day', '--by', 'site']);
    expect(r.stdout.split('\n')[1]).toContain(`"'=1+2"`);
  });

  it('--help shows real examples and the caution about week and fiscal conventions', async () => {
    const r = await runCli(['rebin', '--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('--unit epi-week --zone America/Chicago');
    expect(r.stdout).toContain('--unit fiscal-quarter --fiscal-start 10');
    expect(r.stdout).toMatch(/Caution: ISO weeks start on Monday, epidemiological/);
  });
});

describe('quern rebin errors and exit statuses', () => {
  it.each([
    // [arguments, exit status, text on stderr] — statuses from cli/exit.ts
    [['rebin', 'fixtures/weekly-cases.csv', '--time', 'epi_week', '--unit', 'month', '--agg', 'sum:cases'], 3, 'straddle a month boundary'],
    [['rebin', 'fixtures/weekly-cases.csv', '--time', 'epi_week', '--unit', 'month', '--agg', 'mean:cases', '--assign', 'apportion'], 3, 'meaningless for mean_cases'],
    [['rebin', 'fixtures/weekly-cases.csv', '--time', 'epi_week', '--unit', 'day'], 3, 'which are shorter'],
    [['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'fortnight'], 2, 'unknown unit'],
    [['rebin', 'fixtures/visits.csv', '--time', 'visit_tme', '--unit', 'day'], 3, 'visit_time'],
    [['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'day', '--agg', 'avg:wait_minutes'], 2, 'unknown aggregate'],
    [['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'day', '--zone', 'America/Chicgo'], 2, 'America/Chicago'],
  ])('quern %j exits %i', async (argv, status, text) => {
    const r = await runCli(argv);
    expect(r.status).toBe(status);
    expect(r.stderr).toContain(text);
    expect(r.stderr).toMatch(/^quern: /);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it('stops at --max-periods naming the stray value and its line (exit 3)', async () => {
    const f = join(tmp, 'stray.csv');
    writeFileSync(f, `ts\n${Array.from({ length: 30 }, (_, i) => `2024-05-${pad(i + 1)}T10:00:00Z`).join('\n')}\n1970-01-01T00:00:00Z\n`);
    const r = await runCli(['rebin', f, '--time', 'ts', '--unit', 'day']);
    expect(r.status).toBe(3);
    expect(r.stderr).toContain('"1970-01-01T00:00:00Z" on line 32');
    const ok = await runCli(['rebin', f, '--time', 'ts', '--unit', 'day', '--from', '2024-05-01', '--until', '2024-05-31']);
    expect(ok.status).toBe(0);
    expect(ok.stderr).toContain('1 outside --from/--until');
  });

  it('the summary on the messy demo file adds up: used + empty + rejected = read', async () => {
    const r = await runCli(['rebin', 'fixtures/messy-visits.csv', '--time', 'visit_time', '--unit', 'day', '--zone', CHI, '--agg', 'mean:patient_age']);
    expect(r.status).toBe(0);
    const m = /([\d,]+) rows? read from .*: ([\d,]+) used, ([\d,]+) with an empty time, ([\d,]+) rejected/.exec(r.stderr)!;
    const [read, used, empty, rejected] = m.slice(1).map((x) => Number(x.replaceAll(',', '')));
    expect(used! + empty! + rejected!).toBe(read);
    expect(r.stderr).toContain('patient_age:');
  });
});

describe('quern rebin with numeric day-month dates', () => {
  it('never guesses 05/04/2021: E_FORMAT (exit 3) until --day-first or --month-first says which', async () => {
    const f = join(tmp, 'dm.csv');
    writeFileSync(f, 'd\n05/04/2021\n06/04/2021\n');
    const r = await runCli(['rebin', f, '--time', 'd', '--unit', 'month']);
    expect(r.status).toBe(3);
    expect(r.stderr).toContain('--day-first');
    const day = await runCli(['rebin', f, '--time', 'd', '--unit', 'month', '--day-first']);
    expect(parseCsv(day.stdout).slice(1).map((x) => `${x[0]}=${x[3]}`)).toEqual(['2021-04=2']); // 5 and 6 April
    const month = await runCli(['rebin', f, '--time', 'd', '--unit', 'month', '--month-first']);
    expect(parseCsv(month.stdout).slice(1).map((x) => `${x[0]}=${x[3]}`)).toEqual(['2021-05=1', '2021-06=1']); // May 4, June 4
  });
});
