// Hostile CSV inputs through `quern rebin` (and `profile`): each ends either in one clear `quern:` line with
// the exit status of cli/exit.ts (3 for input problems) or in a result where every row is used, empty or
// rejected with its line and reason. Record rules: RFC 4180 §2 (REFERENCES.md §12); UTF-8 validity: RFC 3629 §3.
import { gzipSync } from 'node:zlib';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { INPUTS, STACK_LINE, countSum, expectOneLineError, rebinAccount, scratch } from './helpers.js';

const tmp = scratch('csv');
afterAll(() => tmp.cleanup());
const input = (name: string) => join(INPUTS, name);
const day = ['--time', 't', '--unit', 'day'];

describe('quern rebin on malformed CSV accounts for every row', () => {
  it('rejects ragged rows (too many and too few fields) naming their lines', async () => {
    const a = await rebinAccount([input('ragged.csv'), ...day]);
    expect([a.read, a.used, a.empty, a.rejected]).toEqual([4, 2, 0, 2]);
    expect(a.why).toEqual({ 'ragged-row': 2 });
    expect(a.examples.map((e) => [e.line, e.value])).toEqual([[3, '2024-01-02,2,3'], [4, '2024-01-03']]);
    expect(countSum(a.rows)).toBe(2);
  });

  it('rejects the last row when its quote is never closed (RFC 4180 §2.5: the field runs to the end of the file)', async () => {
    const a = await rebinAccount([input('unterminated-quote.csv'), ...day]);
    expect([a.read, a.used, a.rejected]).toEqual([2, 1, 1]);
    expect(a.why).toEqual({ 'unterminated-quote': 1 });
    expect(a.examples[0]!.line).toBe(3);
  });

  it('rejects a quote inside an unquoted field (RFC 4180 §2.5) and keeps a properly doubled quote (§2.7)', async () => {
    const a = await rebinAccount([input('quote-in-unquoted.csv'), ...day]);
    expect([a.read, a.used, a.rejected]).toEqual([3, 2, 1]);
    expect(a.why).toEqual({ 'bad-quote': 1 });
    expect(a.examples[0]).toMatchObject({ line: 2, value: '2024-01-01,ab"c' });
  });

  it('reads a semicolon file and rejects the one row written with a comma, naming the column and value', async () => {
    const a = await rebinAccount([input('mixed-delimiters.csv'), ...day]);
    expect([a.read, a.used, a.rejected]).toEqual([3, 2, 1]);
    expect(a.examples[0]).toMatchObject({ line: 3, column: 't', value: '2024-01-02,2' });
  });

  it('reads a header-only file as zero rows, not as an error', async () => {
    const a = await rebinAccount([input('header-only.csv'), ...day]);
    expect([a.read, a.used, a.rows.length]).toEqual([0, 0, 0]);
  });

  it('skips a completely blank line without counting it as a row (documented in ReadSummary.blankLines)', async () => {
    const a = await rebinAccount([input('blank-line.csv'), ...day]);
    expect([a.read, a.used]).toEqual([2, 2]);
  });

  it('reads a BOM and CRLF line ends as plain UTF-8 (the BOM is not part of the first name)', async () => {
    const f = tmp.file('bom-crlf.csv', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('t,v\r\n2024-01-01,1\r\n2024-01-02,2\r\n')]));
    const a = await rebinAccount([f, ...day]);
    expect([a.read, a.used, a.rejected]).toEqual([2, 2, 0]);
    expect(a.rows.map((r) => r['period'])).toEqual(['2024-01-01', '2024-01-02']);
  });

  it('reads lone CR line ends (old Mac files) as line ends, counting lines by them', async () => {
    const f = tmp.file('cr.csv', 't,v\r2024-01-01,1\r2024-01-02,x\r2024-01-02,3,3\r');
    const a = await rebinAccount([f, ...day]);
    expect([a.read, a.used, a.rejected]).toEqual([3, 2, 1]);
    expect(a.examples[0]).toMatchObject({ code: 'ragged-row', line: 4 });
  });

  it('rejects a row with Latin-1 bytes in a UTF-8 file (E9 alone is not UTF-8, RFC 3629 §3), naming line and column', async () => {
    const f = tmp.file('latin1.csv', Buffer.concat([Buffer.from('t,v\n2024-01-01,caf'), Buffer.from([0xe9]), Buffer.from('\n2024-01-02,2\n')]));
    const a = await rebinAccount([f, ...day]);
    expect([a.read, a.used, a.rejected]).toEqual([2, 1, 1]);
    expect(a.examples[0]).toMatchObject({ code: 'undecodable-bytes', line: 2, column: 'v' });
  });

  it('keeps NUL bytes in a column not read, and rejects a time value holding one, naming it', async () => {
    const f = tmp.file('nul.csv', 't,v\n2024-01-01,a\u0000b\n2024-01-02\u0000,2\n2024-01-03,3\n');
    const a = await rebinAccount([f, ...day]);
    expect([a.read, a.used, a.rejected]).toEqual([3, 2, 1]);
    expect(a.examples[0]).toMatchObject({ line: 3, column: 't', value: '2024-01-02\u0000' });
  });

  it('reads a 10 MB single field on one line and shortens it in any message', async () => {
    const f = tmp.file('10mb.csv', `t,v\n2024-01-01,${'x'.repeat(10 * 1024 * 1024)}\n${'y'.repeat(10 * 1024 * 1024)},2\n`);
    const a = await rebinAccount([f, ...day]);
    expect([a.read, a.used, a.rejected]).toEqual([2, 1, 1]);
    // Diagnostics carry at most 80 characters of a value (src/errors.ts shortValue).
    expect(a.examples[0]!.value!.length).toBeLessThanOrEqual(80);
  });

  it('reads a 10 MB file that is one line without any line end as a header only', async () => {
    const f = tmp.file('10mb-one-line.csv', 'x'.repeat(10 * 1024 * 1024));
    const r = await runCli(['profile', f]);
    expect(r.stderr).not.toMatch(STACK_LINE);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/0 rows, 1 columns?/);
  });
});

describe('quern on CSV it cannot read gives one line and exit status 3', () => {
  it('names an empty file', async () => {
    expectOneLineError(await runCli(['rebin', input('empty.csv'), ...day]), 3, 'empty.csv', 'no header');
  });

  it('names a duplicate header name', async () => {
    expectOneLineError(await runCli(['rebin', input('duplicate-header.csv'), ...day]), 3, 'duplicate-header.csv', 'duplicate', '"t"');
  });

  it('names the position of an empty header name', async () => {
    expectOneLineError(await runCli(['profile', input('empty-header.csv')]), 3, 'empty-header.csv', 'column 2 of 3', 'empty name');
  });

  it('says a gzip file is cut short, and writes no rows before failing', async () => {
    let text = 't,v\n';
    for (let i = 0; i < 20_000; i++) text += `2024-01-${String(1 + (i % 28)).padStart(2, '0')},${i}\n`;
    const gz = gzipSync(text);
    const f = tmp.file('cut.csv.gz', gz.subarray(0, gz.length >> 1));
    const r = await runCli(['rebin', f, ...day]);
    expectOneLineError(r, 3, 'cut.csv.gz', 'cut short');
    expect(r.stdout).toBe('');
  });

  it('reads a whole gzip file (the control for the cut one)', async () => {
    const f = tmp.file('whole.csv.gz', gzipSync('t,v\n2024-01-01,1\n2024-01-01,2\n'));
    const a = await rebinAccount([f, ...day]);
    expect([a.read, a.used]).toEqual([2, 2]);
  });
});
