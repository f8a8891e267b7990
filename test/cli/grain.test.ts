// `quern grain` through runCli on the demo files (fixtures/generate.mjs, invented data) and on generated
// files. Expected facts of the demo data come from the fixture brief: visit_time is written with the
// offsets of America/Chicago, reading_time every 15 minutes in UTC, week_ending Saturdays.
import { describe, expect, it, vi } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { writeColumns } from '../grain/helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

describe('quern grain', () => {
  it('--json keeps the shape the issue gives: rows, columns with format, values, grain, zone, level, coverage, cadence, first, last', async () => {
    const r = await runCli(['grain', 'fixtures/fridge-temps.csv', '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.rows).toBe(11485);
    const c = out.columns[0];
    expect(Object.keys(c)).toEqual(expect.arrayContaining(['name', 'format', 'values', 'grain', 'zone', 'level', 'coverage', 'cadence', 'first', 'last']));
    expect(c).toMatchObject({
      name: 'reading_time', format: 'iso-date-time-offset', zone: 'UTC', level: 'quantitative',
      grain: { unit: 'minute', step: 15, anchor: 'start', weekStart: null },
      cadence: { kind: 'regular', every: 15, unit: 'minute' },
      first: '2024-01-08T00:00:00Z',
    });
    expect(c.values.parsed + c.values.empty + c.values.invalid).toBe(out.rows);
  });

  it('explains each finding in plain sentences (visits: America/Chicago offsets, instants)', async () => {
    const r = await runCli(['grain', 'fixtures/visits.csv']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('visit_time — seconds · quantitative · zone America/Chicago');
    expect(r.stdout).toMatch(/change exactly as\s+America\/Chicago's daylight-saving rules do/);
    expect(r.stdout).toContain('UTC\u221206:00 in winter, UTC\u221205:00 in summer');
    expect(r.stdout).toMatch(/not date-like: visit_id, clinic/);
  });

  it('weekly cases: epidemiological weeks and weeks ending Saturday (ISO weekday 7 starts them)', async () => {
    const r = await runCli(['grain', 'fixtures/weekly-cases.csv', '--json']);
    const out = JSON.parse(r.stdout);
    const byName = Object.fromEntries(out.columns.map((c: { name: string }) => [c.name, c]));
    expect(byName.epi_week.grain).toMatchObject({ unit: 'epi-week', weekStart: 7 });
    expect(byName.week_ending.grain).toMatchObject({ unit: 'week', anchor: 'end', weekStart: 7 });
    expect(byName.week_ending.level).toBe('ordinal');
  });

  it('every row is accounted for on the messy demo file: parsed + empty + invalid + rejected rows = rows read', async () => {
    const out = JSON.parse((await runCli(['grain', 'fixtures/messy-visits.csv', '--json'])).stdout);
    const c = out.columns[0];
    expect(c.values.parsed + c.values.empty + c.values.invalid + out.rejectedRows).toBe(out.rows);
    expect(c.values.invalid).toBeGreaterThan(0);
    // 2024-02-30 is no date: February 2024 has 29 days (2024 is a Gregorian leap year).
    expect(c.invalidExamples.map((e: { value: string }) => e.value)).toContain('2024-02-30T09:10:00-06:00');
  });

  it('--column limits the columns; a named column that is not date-like exits 3 (E_FORMAT)', async () => {
    const ok = await runCli(['grain', 'fixtures/visits.csv', '--column', 'visit_time', '--json']);
    expect(JSON.parse(ok.stdout).columns.map((c: { name: string }) => c.name)).toEqual(['visit_time']);
    const bad = await runCli(['grain', 'fixtures/visits.csv', '--column', 'clinic']);
    expect(bad.status).toBe(3);
    expect(bad.stderr).toMatch(/^quern: no named column is date-like/);
  });

  it('misuse: an unknown column exits 3, an unknown zone and both day orders exit 2', async () => {
    expect((await runCli(['grain', 'fixtures/visits.csv', '--column', 'visit_tim'])).status).toBe(3);
    const zone = await runCli(['grain', 'fixtures/visits.csv', '--zone', 'America/Chicag']);
    expect(zone.status).toBe(2);
    expect(zone.stderr).toContain('unknown time zone');
    const both = await runCli(['grain', 'fixtures/visits.csv', '--day-first', '--month-first']);
    expect(both.status).toBe(2);
    expect(both.stderr).toContain('both day-first and month-first');
  });

  it('--day-first settles an ambiguous column', async () => {
    const file = writeColumns({ when: Array.from({ length: 30 }, (_, i) => `0${1 + (i % 9)}/0${1 + (i % 7)}/2024`) });
    const amb = JSON.parse((await runCli(['grain', file, '--json'])).stdout).columns[0];
    expect(amb.ambiguity).toHaveLength(2);
    const settled = JSON.parse((await runCli(['grain', file, '--json', '--day-first'])).stdout).columns[0];
    expect(settled.format).toBe('day-month-year');
  });

  it("reads standard input as '-': first-of-month dates are months", async () => {
    // 2024-01-01 … 2024-12-01: the 1st of each month of 2024 (Gregorian calendar).
    const csv = `month_start\n${Array.from({ length: 12 }, (_, i) => `2024-${String(i + 1).padStart(2, '0')}-01`).join('\n')}\n`;
    const r = await runCli(['grain', '-', '--json'], { stdin: csv });
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).columns[0].grain).toMatchObject({ unit: 'month', anchor: 'start' });
  });

  it('--help shows examples on the demo files and the tolerance rule', async () => {
    const r = await runCli(['grain', '--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('quern grain fixtures/fridge-temps.csv --json');
    expect(r.stdout).toContain('at least 99% of the parsed values');
  });

  it('quern grain names each rejected row by line and reason (standard input as "-")', async () => {
    const csv = 'ts,age\n2021-01-01T00:00:00Z,34\n2021-01-02T00:00:00Z,45,extra\n2021-01-03T00:00:00Z,50\n';
    const r = await runCli(['grain', '-'], { stdin: csv });
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('1 rejected by the reader');
    expect(r.stdout).toContain('-:3: value "2021-01-02T00:00:00Z,45,extra": expected 2 fields as in the header, found 3');
    const j = await runCli(['grain', '-', '--json'], { stdin: csv });
    expect(JSON.parse(j.stdout).rejectedExamples).toEqual([expect.objectContaining({ code: 'ragged-row', file: '-', line: 3 })]);
  });
});
