// `quern sql` through run(): the query it prints for the demo visits (fixtures/visits.csv, invented data)
// gives, in DuckDB and PostgreSQL, exactly what `quern rebin` prints for the same file and options; plus
// usage errors with their exit statuses (cli/exit.ts) and the bucket spec path.
import { readFile, writeFile, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { openEngines, runDuck, runPg, type Engines, type ResultRow } from './engines.js';

const VISITS = fileURLToPath(new URL('../../fixtures/visits.csv', import.meta.url));
let engines: Engines;
let dir: string;

beforeAll(async () => {
  engines = await openEngines();
  // The engines parse the ISO 8601 text themselves; quern is not involved in loading.
  await engines.duck.run(`CREATE TABLE visits AS SELECT CAST(visit_time AS TIMESTAMPTZ) AS visit_time FROM read_csv('${VISITS.replace(/'/g, "''")}', all_varchar = true)`);
  const text = await readFile(VISITS, 'utf8');
  const times = text.trim().split('\n').slice(1).map((line) => line.split(',')[1]!);
  await engines.pg.exec('CREATE TABLE visits (visit_time timestamptz)');
  for (let i = 0; i < times.length; i += 2000) {
    await engines.pg.exec(`INSERT INTO visits VALUES ${times.slice(i, i + 2000).map((t) => `('${t}')`).join(',')}`);
  }
  dir = await mkdtemp(join(tmpdir(), 'quern-sql-'));
}, 120_000);

afterAll(async () => {
  await engines?.close();
  if (dir) await rm(dir, { recursive: true, force: true });
});

function rebinRows(csv: string): ResultRow[] {
  return csv.trim().split('\n').slice(1).map((line) => {
    const [period, start, end, count] = line.split(',');
    return { period: period!, start: Date.parse(start!), end: Date.parse(end!), count: Number(count) };
  });
}

describe('quern sql --query on the demo visits', () => {
  it.each([
    [['--unit', 'epi-week']], [['--unit', 'iso-week']], [['--unit', 'month']], [['--unit', 'fiscal-quarter', '--fiscal-start', '10']],
    [['--unit', 'day']], [['--unit', 'hour', '--step', '6']], [['--unit', 'week', '--week-start', 'sunday', '--step', '2']],
  ])('%j gives quern rebin\'s periods and counts in DuckDB and PostgreSQL', async (unitArgs) => {
    const common = [...unitArgs, '--zone', 'America/Chicago'];
    const rebin = await runCli(['rebin', VISITS, '--time', 'visit_time', ...common]);
    expect(rebin.status, rebin.stderr).toBe(0);
    const expected = rebinRows(rebin.stdout);
    expect(expected.length).toBeGreaterThan(3);
    for (const dialect of ['duckdb', 'postgres'] as const) {
      const sql = await runCli(['sql', ...common, '--column', 'visit_time', '--table', 'visits', '--dialect', dialect, '--query']);
      expect(sql.status, sql.stderr).toBe(0);
      const got = dialect === 'duckdb' ? await runDuck(engines, sql.stdout) : await runPg(engines, sql.stdout);
      expect(got).toEqual(expected);
    }
  });

  it('--from and --until pick the periods holding them, as quern rebin does', async () => {
    const common = ['--unit', 'epi-week', '--zone', 'America/Chicago', '--from', '2024-03-01', '--until', '2024-04-15'];
    const rebin = await runCli(['rebin', VISITS, '--time', 'visit_time', ...common]);
    const expected = rebinRows(rebin.stdout);
    expect(expected[0]!.period).toBe('2024-EW09'); // 2024-03-01 is a Friday of MMWR week 9 (2024-02-25 – 03-02), REFERENCES §2 week-1 start 2023-12-31
    const sql = await runCli(['sql', ...common, '--column', 'visit_time', '--table', 'visits', '--dialect', 'postgres', '--query']);
    expect(await runPg(engines, sql.stdout)).toEqual(expected);
  });
});

describe('quern sql output and errors', () => {
  it('without --query prints the three expressions and, with --table, the query', async () => {
    const r = await runCli(['sql', '--unit', 'epi-week', '--zone', 'America/Chicago', '--column', 'visit_time', '--dialect', 'postgres']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('-- period label (text)');
    expect(r.stdout).toContain('-- period start (first instant)');
    expect(r.stdout).toContain('-- period end (exclusive)');
    expect(r.stdout).toContain('day arithmetic');
    expect(r.stdout).not.toContain('-- rebin query');
    const withTable = await runCli(['sql', '--unit', 'month', '--column', 'ts', '--table', 'ev', '--dialect', 'trino']);
    expect(withTable.stdout).toContain('-- rebin query');
    expect(withTable.stdout).toContain('CROSS JOIN UNNEST(sequence(0, 9999))');
  });

  it.each([
    [['sql', '--unit', 'day', '--column', 'ts'], 2, 'no --dialect'],
    [['sql', '--unit', 'day', '--column', 'ts', '--dialect', 'oracle'], 2, 'unknown SQL dialect'],
    [['sql', '--unit', 'day', '--dialect', 'duckdb'], 2, 'no --column'],
    [['sql', '--unit', 'day', '--column', 'ts', '--dialect', 'duckdb', '--query'], 2, '--query needs --table'],
    [['sql', '--unit', 'fortnight', '--column', 'ts', '--dialect', 'duckdb'], 2, 'unknown unit'],
    [['sql', '--unit', 'day', '--zone', "UTC'; DROP TABLE x; --", '--column', 'ts', '--dialect', 'duckdb'], 2, 'unknown time zone'],
    [['sql', '--unit', 'iso-week', '--week-start', 'sunday', '--column', 'ts', '--dialect', 'duckdb'], 2, 'does not apply'],
    [['sql', '--unit', 'day', '--column-expr', 'ts; DROP TABLE x', '--dialect', 'duckdb'], 2, 'holds ";"'],
    [['sql', '--spec', 'no-such-file.json', '--column', 'age', '--dialect', 'duckdb'], 3, 'cannot read the spec file'],
  ])('%j exits %d with a one-line message', async (argv, status, message) => {
    const r = await runCli(argv);
    expect(r.status).toBe(status);
    expect(r.stderr).toContain(message);
    expect(r.stdout).toBe('');
  });

  it('--spec prints the CASE expressions and, with --table and --query, a count query that runs', async () => {
    const spec = { kind: 'quern-bucket-spec', version: 1, value: 'age', discrete: true, closed: 'left', source: 'two bands',
      ranges: [{ index: 0, label: '0-17', low: 0, high: 18, lowClosed: true, highClosed: false },
        { index: 1, label: '18+', low: 18, high: null, lowClosed: true, highClosed: false }] };
    const file = join(dir, 'bands.json');
    await writeFile(file, JSON.stringify(spec));
    const r = await runCli(['sql', '--spec', file, '--column', 'patient_age', '--dialect', 'spark']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain("WHEN `patient_age` >= 18 THEN '18+'");
    const q = await runCli(['sql', '--spec', file, '--column', 'age', '--dialect', 'duckdb', '--table', 'ages', '--query']);
    await engines.duck.run('CREATE TABLE ages AS SELECT * FROM (VALUES (3), (17), (18), (40), (NULL)) t(age)');
    const rows = (await engines.duck.runAndReadAll(q.stdout)).getRows().map((x) => [x[0], x[1] === null ? null : Number(x[1]), Number(x[2])]);
    expect(rows).toEqual([['0-17', 0, 2], ['18+', 1, 2], [null, null, 1]]);
  });

  it('--help shows real examples and the caution', async () => {
    const r = await runCli(['sql', '--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('quern sql --unit epi-week --zone America/Chicago --column visit_time --table visits --dialect duckdb --query');
    expect(r.stdout).toContain('Confirm against your reporting authority');
  });
});
