import { describe, expect, it } from 'vitest';
import { mkdtemp, readFile, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../helpers/cli.js';

const VISITS = 'fixtures/visits.csv';
const json = (s: string) => JSON.parse(s) as Record<string, any>;

describe('quern bucket', () => {
  it('quern bucket --list-schemes names every scheme with its published source', async () => {
    const r = await runCli(['bucket', '--list-schemes']);
    expect(r.status).toBe(0);
    for (const name of ['five-year-85', 'ten-year', 'who-world-2000', 'us-2000-19', 'us-2000-11', 'life-stages']) expect(r.stdout).toContain(name);
    expect(r.stdout).toContain('GPE Discussion Paper Series No. 31'); // Ahmad et al. 2001
    expect(r.stdout).toContain('P25-1130'); // US Census Bureau
    expect(r.stdout).toContain('National Vital Statistics Reports 47(3)'); // Anderson & Rosenberg 1998
    expect(r.stdout).toContain('common practice');
  });

  it('quern bucket --help shows examples on the demo files', async () => {
    const r = await runCli(['bucket', '--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('fixtures/visits.csv --value patient_age --scheme five-year-85');
    expect(r.stdout).toContain('--no-neutralise');
  });

  it('quern bucket visits --scheme five-year-85 --json: 18 ranges whose counts add up to the rows read', async () => {
    const r = await runCli(['bucket', VISITS, '--value', 'patient_age', '--scheme', 'five-year-85', '--summary', '--json']);
    expect(r.status).toBe(0);
    const s = json(r.stdout);
    expect(s.buckets.map((b: any) => b.label).slice(0, 3)).toEqual(['0-4', '5-9', '10-14']);
    expect(s.buckets).toHaveLength(18);
    const counted = s.buckets.reduce((a: number, b: any) => a + b.count, 0);
    expect(counted).toBe(s.bucketed);
    expect(s.bucketed + s.below.count + s.above.count + s.between.count + s.empty.count + s.invalid.count + s.rowsRejected).toBe(s.rowsRead);
    expect(s.rowsRead).toBeGreaterThan(1000);
  });

  it('quern bucket writes every row with its label and order index, summary on stderr', async () => {
    const csv = 'id,age\n1,0\n2,4\n3,5\n4,85\n5,\n6,abc\n7,-1\n';
    const r = await runCli(['bucket', '-', '--value', 'age', '--scheme', 'five-year-85'], { stdin: csv });
    expect(r.status).toBe(0);
    expect(r.stdout).toBe('id,age,age_range,age_range_index\n1,0,0-4,0\n2,4,0-4,0\n3,5,5-9,1\n4,85,85+,17\n5,,,\n6,abc,,\n7,-1,,\n');
    expect(r.stderr).toContain('rows read 7 = 4 bucketed + 1 below + 0 above + 1 empty + 1 invalid + 0 rejected rows');
  });

  it('quern bucket names each rejected row by line and reason, in the text and in --json (standard input as "-")', async () => {
    const csv = 'id,age\n1,34\n2,45,extra\n3,50\n';
    const r = await runCli(['bucket', '-', '--value', 'age', '--edges', '0,18,65', '--open-high', '--summary'], { stdin: csv });
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('rejected rows: 1 (ragged-row 1)');
    expect(r.stdout).toContain('-:3: value "2,45,extra": expected 2 fields as in the header, found 3');
    const j = await runCli(['bucket', '-', '--value', 'age', '--method', 'quantile', '--bins', '2', '--summary', '--json'], { stdin: csv });
    const s = json(j.stdout);
    expect(s.rejectedExamples).toEqual([expect.objectContaining({ code: 'ragged-row', file: '-', line: 3 })]);
    expect(s.bucketed + s.rowsRejected).toBe(s.rowsRead);
  });

  // Which end holds the edge: [a, b) under left, (a, b] under right (the issue; R's cut(right =) — common practice).
  it.each([
    ['left', ['0-4', '0-4', '5-9', '10+']],
    ['right', ['', '1-5', '1-5', '6-10']],
  ] as const)('quern bucket --edges 0,5,10 --open-high --closed %s puts each edge value in exactly one range', async (closed, labels) => {
    const r = await runCli(['bucket', '-', '--value', 'v', '--edges', '0,5,10', '--open-high', '--closed', closed, '-q'], { stdin: 'v\n0\n4\n5\n10\n' });
    expect(r.status).toBe(0);
    expect(r.stdout.trim().split('\n').slice(1).map((l) => l.split(',')[1])).toEqual(labels);
  });

  it('quern bucket --edges gives interval labels when the data are not whole numbers (0-9 would hide 9.5)', async () => {
    const r = await runCli(['bucket', '-', '--value', 'v', '--edges', '0,10', '--open-high', '-q'], { stdin: 'v\n9.5\n10\n' });
    expect(r.stdout).toBe('v,v_range,v_range_index\n9.5,"[0,10)",0\n10,"[10,inf)",1\n');
  });

  it('quern bucket neutralises formula-like cells in CSV output (OWASP CSV Injection) and --no-neutralise turns it off', async () => {
    const csv = 'name,v\n=1+2,3\n-5,4\n';
    const on = await runCli(['bucket', '-', '--value', 'v', '--edges', '0,5', '-q'], { stdin: csv });
    expect(on.stdout).toContain(`"'=1+2",3,0-4,0`);
    expect(on.stdout).toContain('-5,4,0-4,0'); // a number stays a number
    const off = await runCli(['bucket', '-', '--value', 'v', '--edges', '0,5', '-q', '--no-neutralise'], { stdin: csv });
    expect(off.stdout).toContain('=1+2,3,0-4,0');
  });

  it('quern bucket --method quantile on standard input reads it twice via a temporary file', async () => {
    const values = Array.from({ length: 100 }, (_, i) => `${i + 1}`).join('\n');
    const r = await runCli(['bucket', '-', '--value', 'v', '--method', 'quantile', '--bins', '4', '--summary', '--json'], { stdin: `v\n${values}\n` });
    expect(r.status).toBe(0);
    const s = json(r.stdout);
    // type-7 quartiles of 1..100 are 1, 25.75, 50.5, 75.25, 100 (d3-array quantile; Hyndman & Fan 1996)
    expect(s.buckets.map((b: any) => b.label)).toEqual(['1-25', '26-50', '51-75', '76-100']);
    expect(s.buckets.map((b: any) => b.count)).toEqual([25, 25, 25, 25]);
    expect(s.passes).toBe(2);
  });

  it('quern bucket --spec-out then --spec applies the same ranges again', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'quern-test-'));
    const spec = join(dir, 'wait.json');
    const a = await runCli(['bucket', VISITS, '--value', 'wait_minutes', '--method', 'ckmeans', '--bins', '4', '--summary', '--json', '--spec-out', spec]);
    expect(a.status).toBe(0);
    const written = json(await readFile(spec, 'utf8'));
    expect(written.kind).toBe('quern-bucket-spec');
    expect(written.ranges).toHaveLength(4);
    const b = await runCli(['bucket', VISITS, '--value', 'wait_minutes', '--spec', spec, '--summary', '--json']);
    expect(json(b.stdout).buckets.map((x: any) => x.count)).toEqual(json(a.stdout).buckets.map((x: any) => x.count));
  });

  it('quern bucket --out writes the file atomically and the summary to stdout', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'quern-test-'));
    const out = join(dir, 'o.csv');
    const r = await runCli(['bucket', '-', '--value', 'v', '--edges', '0,10', '--out', out], { stdin: 'v\n1\n2\n' });
    expect(r.status).toBe(0);
    expect(await readFile(out, 'utf8')).toBe('v,v_range,v_range_index\n1,0-9,0\n2,0-9,0\n');
    expect(r.stdout).toContain('rows read 2');
  });

  it('quern bucket reads decimal commas when the column shows them, and never guesses 1,234', async () => {
    const r = await runCli(['bucket', '-', '--value', 'v', '--edges', '0,2', '--summary', '--json'], { stdin: 'v\n"0,5"\n"1,25"\n' });
    expect(json(r.stdout).bucketed).toBe(2);
    const amb = await runCli(['bucket', '-', '--value', 'v', '--edges', '0,5000', '--summary', '--json'], { stdin: 'v\n"1,234"\n12\n' });
    const s = json(amb.stdout);
    expect(s.invalid.byReason).toEqual({ 'ambiguous-separator': 1 });
    expect(s.numberFormat.decision).toBe('ambiguous');
    const told = await runCli(['bucket', '-', '--value', 'v', '--edges', '0,5000', '--summary', '--json', '--decimal', '.'], { stdin: 'v\n"1,234"\n12\n' });
    expect(json(told.stdout).bucketed).toBe(2);
  });

  it.each([
    [['bucket', VISITS, '--value', 'patient_age'], 2, /exactly one of/],
    [['bucket', VISITS, '--value', 'patient_age', '--scheme', 'nope'], 2, /unknown scheme "nope"/],
    [['bucket', VISITS, '--value', 'no_such', '--scheme', 'five-year-85'], 3, /no_such/],
    [['bucket', VISITS, '--value', 'patient_age', '--edges', '0,x'], 2, /--edges: "x" is not a number/],
    [['bucket', VISITS, '--value', 'patient_age', '--method', 'quantile'], 2, /--bins/],
  ])('quern %j fails with status %d and one line', async (argv, status, message) => {
    const r = await runCli(argv as string[]);
    expect(r.status).toBe(status);
    expect(r.stderr).toMatch(message);
  });
});
