// `quern grain` runs the byte path of detectGrain. Differential checks (no expected value is computed by
// quern here; the two paths are held to each other): on every demo file (fixtures/generate.mjs, invented
// data) the JSON the command prints equals the report of the string path it replaced
// (detectGrainFromStrings), and `--report` still writes its page from the same result.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { detectGrainFromStrings } from '../../src/grain/detect.js';
import { runCli } from '../helpers/cli.js';

vi.setConfig({ testTimeout: 120_000 });

const DEMO = ['fixtures/visits.csv', 'fixtures/fridge-temps.csv', 'fixtures/weekly-cases.csv', 'fixtures/reporting-periods.csv', 'fixtures/messy-visits.csv'];

describe('quern grain through the byte path', () => {
  it.each(DEMO)('%s --json equals the string path report', async (file) => {
    const r = await runCli(['grain', file, '--json']);
    expect(r.status).toBe(0);
    const expected = await detectGrainFromStrings(file, { table: { cwd: process.cwd() } });
    expect(JSON.parse(r.stdout)).toEqual(JSON.parse(JSON.stringify(expected)));
  });

  it('--column gives the string path report too', async () => {
    const r = await runCli(['grain', 'fixtures/visits.csv', '--column', 'visit_time', '--column', 'clinic', '--json']);
    expect(r.status).toBe(0);
    const expected = await detectGrainFromStrings('fixtures/visits.csv', { columns: ['visit_time', 'clinic'] });
    expect(JSON.parse(r.stdout)).toEqual(JSON.parse(JSON.stringify(expected)));
  });

  it('--report writes an HTML page naming the date column beside the JSON on standard output', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'quern-grain-report-'));
    const page = join(dir, 'grain.html');
    const r = await runCli(['grain', 'fixtures/fridge-temps.csv', '--json', '--report', page]);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).columns[0].name).toBe('reading_time');
    const html = readFileSync(page, 'utf8');
    // An HTML5 document (WHATWG HTML: the doctype) that names the column.
    expect(html.toLowerCase()).toContain('<!doctype html>');
    expect(html).toContain('reading_time');
  });
});
