// `quern profile` through runCli on the demo files (invented data; column roles from the fixture brief:
// visit_id unique sequential integers, area_code zero-padded 5-digit codes, triage low/medium/high,
// weekly-cases an aggregated table).
import { describe, expect, it, vi } from 'vitest';
import { profileTable } from '../../src/index.js';
import { runCli } from '../helpers/cli.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

describe('quern profile', () => {
  it('--json keeps the shape the issue gives: rows, shape {kind, key}, columns {name, level, role, distinct, empty}', async () => {
    const r = await runCli(['profile', 'fixtures/visits.csv', '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.rows).toBe(13513);
    expect(out.shape).toMatchObject({ kind: 'items', key: ['visit_id'] });
    const byName = Object.fromEntries(out.columns.map((c: { name: string }) => [c.name, c]));
    for (const c of out.columns) expect(Object.keys(c)).toEqual(expect.arrayContaining(['name', 'level', 'role', 'distinct', 'empty']));
    expect(byName.visit_id).toMatchObject({ level: 'categorical', role: 'identifier' });
    expect(byName.visit_time).toMatchObject({ level: 'quantitative', role: 'time' });
    expect(byName.area_code).toMatchObject({ level: 'categorical', role: 'code' });
    expect(byName.triage).toMatchObject({ level: 'ordinal', role: 'ordered-vocabulary', order: ['low', 'medium', 'high'] });
    expect(byName.wait_minutes).toMatchObject({ level: 'quantitative', role: 'measure' });
    expect(byName.clinic).toMatchObject({ level: 'categorical', role: 'category', distinct: 5 });
  });

  it('weekly cases are an aggregated table keyed by epi_week × clinic', async () => {
    const r = await runCli(['profile', 'fixtures/weekly-cases.csv']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('Shape: aggregated, key epi_week × clinic');
    expect(r.stdout).toMatch(/cases\s+quantitative\s+count/);
  });

  it('age bands: range labels in their order', async () => {
    const out = JSON.parse((await runCli(['profile', 'fixtures/age-bands.csv', '--json'])).stdout);
    const label = out.columns.find((c: { name: string }) => c.name === 'label');
    expect(label).toMatchObject({ level: 'ordinal', role: 'range-label' });
    expect(label.order[0]).toBe('0-4');
    expect(label.order[label.order.length - 1]).toBe('85+');
  });

  it.each(['fixtures/visits.csv', 'fixtures/weekly-cases.csv', 'fixtures/fridge-temps.csv', 'fixtures/reporting-periods.csv'])(
    '--json on %s (read as bytes) is the report the string path and csv-parse give',
    async (file) => {
      // Differential: the CLI's default byte path against the library's string path (`bytes: false`) and the
      // reference engine (csv-parse); the file name is the only field that differs in form.
      const out = JSON.parse((await runCli(['profile', file, '--json'])).stdout);
      const strings = JSON.parse(JSON.stringify(await profileTable(file, { bytes: false })));
      const reference = JSON.parse(JSON.stringify(await profileTable(file, { table: { engine: 'reference' } })));
      expect(out).toEqual(strings);
      expect(out).toEqual(reference);
    },
  );

  it.each(['0', '-1', '1.5', 'two'])('--threads %s is a usage error (exit 2) with a hint', async (n) => {
    // Exit statuses of cli/exit.ts (team brief): 2 is misuse.
    const r = await runCli(['profile', 'fixtures/visits.csv', '--threads', n]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^quern: --threads "[^"]*" is not 'auto' or a whole number from 1 to 64/);
    expect(r.stderr).toContain('hint:');
  });

  it('--threads 1, --threads 2, --threads auto and the default print the same JSON', async () => {
    // Differential: a file under the split threshold reads in one thread either way; the option must not change it.
    const one = await runCli(['profile', 'fixtures/weekly-cases.csv', '--json', '--threads', '1']);
    for (const extra of [['--threads', '2'], ['--threads', 'auto'], []]) {
      const other = await runCli(['profile', 'fixtures/weekly-cases.csv', '--json', ...extra]);
      expect(other.status).toBe(0);
      expect(other.stdout).toBe(one.stdout);
    }
  });

  it("--help says what --threads 'auto' does", async () => {
    const r = await runCli(['profile', '--help']);
    expect(r.stdout).toMatch(/'auto' \(the default\) takes two/);
  });

  it('a missing file exits 3 with one line and a hint', async () => {
    const r = await runCli(['profile', 'fixtures/no-such-file.csv']);
    expect(r.status).toBe(3);
    expect(r.stderr.split('\n')[0]).toMatch(/^quern: /);
  });

  it('--help shows examples on the demo files', async () => {
    const r = await runCli(['profile', '--help']);
    expect(r.stdout).toContain('quern profile fixtures/weekly-cases.csv');
    expect(r.stdout).toContain('Stevens (1946)');
  });

  it('quern profile names each rejected row by line and reason (standard input as "-")', async () => {
    const csv = 'ts,age\n2021-01-01T00:00:00Z,34\n2021-01-02T00:00:00Z,45,extra\n2021-01-03T00:00:00Z,50\n';
    const r = await runCli(['profile', '-'], { stdin: csv });
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('1 rejected by the reader');
    expect(r.stdout).toContain('-:3: value "2021-01-02T00:00:00Z,45,extra": expected 2 fields as in the header, found 3');
    const j = await runCli(['profile', '-', '--json'], { stdin: csv });
    expect(JSON.parse(j.stdout).rejectedExamples).toEqual([expect.objectContaining({ code: 'ragged-row', file: '-', line: 3 })]);
  });

  it('the heading counts in the singular when there is one row or one column (common practice: English number agreement)', async () => {
    const one = await runCli(['profile', '-'], { stdin: 'ts\n2024-03-05T08:15:00Z\n' });
    expect(one.stdout.split('\n')[0]).toBe('-: 1 row, 1 column');
    const two = await runCli(['profile', '-'], { stdin: 'ts,n\n2024-03-05T08:15:00Z,1\n2024-03-06T08:15:00Z,2\n' });
    expect(two.stdout.split('\n')[0]).toBe('-: 2 rows, 2 columns');
  });
});
