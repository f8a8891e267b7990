import { describe, expect, it } from 'vitest';
import { mkdtemp, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../helpers/cli.js';

const json = (s: string) => JSON.parse(s) as Record<string, any>;

describe('quern overlaps', () => {
  it('quern overlaps fixtures/age-bands.csv --range label shows the demo overlap (10-15/15-19) and hole (40-49)', async () => {
    // The demo table (fixtures/generate.mjs) is written with one overlap and one hole.
    const r = await runCli(['overlaps', 'fixtures/age-bands.csv', '--range', 'label', '--json']);
    expect(r.status).toBe(0);
    const s = json(r.stdout).series[0];
    expect(s.overlaps).toEqual([{ a: { line: 4, range: '10-15' }, b: { line: 5, range: '15-19' }, relation: 'overlaps', shared: '15' }]);
    expect(s.holes).toEqual([{ from: 40, to: 49, range: '40-49' }]);
    expect([s.covers, s.partition]).toEqual([false, false]);
  });

  it('quern overlaps on reporting periods per programme: inclusive days, one overlap and one hole (demo data)', async () => {
    const r = await runCli(['overlaps', 'fixtures/reporting-periods.csv', '--start', 'period_start', '--end', 'period_end', '--by', 'programme', '--domain', '2024-01-01..2024-12-31', '--json']);
    const res = json(r.stdout);
    const by = Object.fromEntries(res.series.map((s: any) => [s.key, s]));
    // 2024-03-31 then 2024-04-01: whole days inclusive touch without a hole (the default for dates).
    expect(by['Immunisation returns']).toMatchObject({ overlapCount: 0, holes: [], covers: true, partition: true });
    expect(by['Maternal care audit'].overlaps[0]).toMatchObject({ relation: 'overlaps', shared: '2024-04-15/2024-04-30' });
    expect(by['Cold-chain review'].holes).toEqual([{ from: '2024-06-01', to: '2024-06-14', range: '2024-06-01/2024-06-14' }]);
    expect(res.totals).toMatchObject({ overlaps: 1, holes: 1, duplicates: 0, series: 3 });
  });

  it('quern overlaps --check exits 1 when an overlap or hole is found, 0 otherwise', async () => {
    const bad = await runCli(['overlaps', 'fixtures/age-bands.csv', '--range', 'label', '--check']);
    expect(bad.status).toBe(1);
    const good = await runCli(['overlaps', '-', '--range', 'band', '--check', '--domain', '0..'], { stdin: 'band\n0-4\n5-9\n10+\n' });
    expect(good.status).toBe(0);
    expect(good.stdout).toContain('covers 0+ exactly (a partition)');
  });

  it('quern overlaps --ends half-open reads 2024-01-01..2024-01-31 as ending before the 31st', async () => {
    const csv = 's,e\n2024-01-01,2024-01-31\n2024-01-31,2024-02-29\n';
    const auto = json((await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--json'], { stdin: csv })).stdout);
    expect(auto.series[0].overlaps[0].relation).toBe('overlaps'); // inclusive days share the 31st
    const half = json((await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--json', '--ends', 'half-open'], { stdin: csv })).stdout);
    expect(half.series[0].overlapCount).toBe(0); // [Jan 1, Jan 31) meets [Jan 31, Feb 29)
  });

  it('quern overlaps reads date-times as half-open: 08:00-09:00 and 09:00-10:00 meet', async () => {
    const csv = 's,e\n2024-03-10T08:00:00Z,2024-03-10T09:00:00Z\n2024-03-10T09:00:00Z,2024-03-10T10:00:00Z\n2024-03-10T09:30:00Z,2024-03-10T09:45:00Z\n';
    const r = json((await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--json'], { stdin: csv })).stdout);
    expect(r.series[0].overlaps.map((p: any) => [p.a.line, p.b.line, p.relation])).toEqual([[3, 4, 'contains']]);
    expect(r.series[0].holes).toEqual([]);
  });

  it('quern overlaps reports duplicates, rejected rows and every row read', async () => {
    const csv = 'a,b\n1,5\n1,5\n6,9\n9,3\n,4\nx,2\n';
    const r = json((await runCli(['overlaps', '-', '--start', 'a', '--end', 'b', '--json'], { stdin: csv })).stdout);
    expect(r.series[0].duplicates).toEqual([{ range: '1-5', lines: [2, 3], count: 2 }]);
    expect(r.rejected.byReason).toEqual({ 'reversed-range': 1, 'empty-start': 1, 'invalid-start': 1 });
    expect(r.ranges + r.rejected.count).toBe(r.rowsRead);
  });

  it('quern overlaps --range reads calendar-period labels (2024-Q1) and ISO intervals with durations', async () => {
    const csv = 'p\n2024-Q1\n2024-04-01/P3M\n2024-07-01/2024-09-30\n2024-10\n';
    const r = json((await runCli(['overlaps', '-', '--range', 'p', '--json', '--domain', '2024-01-01..2024-12-31'], { stdin: csv })).stdout);
    const s = r.series[0];
    expect(s.overlapCount).toBe(0);
    expect(s.holes).toEqual([{ from: '2024-11-01', to: '2024-12-31', range: '2024-11-01/2024-12-31' }]);
  });

  it('quern overlaps --spec checks the ranges of a bucket spec', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'quern-test-'));
    const spec = join(dir, 's.json');
    await writeFile(spec, JSON.stringify({ kind: 'quern-bucket-spec', version: 1, value: 'age', discrete: true, closed: 'left', source: 'test', ranges: [
      { index: 0, label: '0-4', low: 0, high: 5, lowClosed: true, highClosed: false },
      { index: 1, label: '10+', low: 10, high: null, lowClosed: true, highClosed: false }] }));
    const r = json((await runCli(['overlaps', '--spec', spec, '--json', '--domain', '0..'])).stdout);
    expect(r.series[0].holes).toEqual([{ from: 5, to: 9, range: '5-9' }]);
  });

  it('quern overlaps prints a chart and the findings for people', async () => {
    const r = await runCli(['overlaps', 'fixtures/age-bands.csv', '--range', 'label']);
    expect(r.stdout).toContain('overlap   line 4 10-15 overlaps line 5 15-19 (shared 15)');
    expect(r.stdout).toContain('hole      40-49');
    expect(r.stdout).toContain('▲ overlap');
  });

  it.each([
    [['overlaps', 'fixtures/age-bands.csv'], 2, /give one of/],
    [['overlaps', 'fixtures/age-bands.csv', '--range', 'nope'], 3, /nope/],
    [['overlaps', 'fixtures/age-bands.csv', '--range', 'label', '--domain', 'zzz'], 2, /--domain "zzz" is not a range/],
    [['overlaps', 'fixtures/age-bands.csv', '--start', 'band'], 2, /--start and --end go together/],
  ])('quern %j fails with status %d', async (argv, status, message) => {
    const r = await runCli(argv as string[]);
    expect(r.status).toBe(status);
    expect(r.stderr).toMatch(message);
  });
});

describe('quern overlaps on hostile ranges', () => {
  it('quern overlaps keeps zero-length ranges apart and rejects reversed labels with their line', async () => {
    const r = json((await runCli(['overlaps', '-', '--range', 'r', '--json'], { stdin: 'r\n"[5,5)"\n"[5,5]"\n9-5\n0-4\n' })).stdout);
    expect(r.series[0].empty).toEqual([{ line: 2, range: '[5,5)' }]);
    expect(r.rejected.examples).toEqual([{ line: 4, value: '9-5', reason: 'not-a-range' }]);
    expect(r.ranges + r.rejected.count).toBe(r.rowsRead);
  });

  it('quern overlaps on 20,000 identical ranges reports one duplicate group, not 200 million pairs', async () => {
    const r = json((await runCli(['overlaps', '-', '--start', 'a', '--end', 'b', '--json'], { stdin: `a,b\n${'1,5\n'.repeat(20_000)}` })).stdout);
    expect(r.series[0].duplicates).toHaveLength(1);
    expect(r.series[0].duplicates[0].count).toBe(20_000);
    expect(r.series[0].overlapCount).toBe(0);
  });
});
