// Row accounting: every row is passed on or rejected with file, line, column, value and reason;
// blank lines are counted apart; the summary adds up.
import { afterAll, describe, expect, it } from 'vitest';
import { formatDiagnostic } from '../../src/errors.js';
import { openTable } from '../../src/table/index.js';
import type { TableEngine } from '../../src/table/index.js';
import { expectAddsUp, readAll, tempDir } from './helpers.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());
const engines: TableEngine[] = ['fast', 'reference'];

describe.each(engines)('openTable(file, { engine: %s }) accounts for every row', (engine) => {
  it('rejects rows with the wrong number of fields, naming file, line and value', async () => {
    const f = tmp.file(`ragged-${engine}.csv`, 'a,b,c\n1,2,3\n4,5\n6,7,8,9\n10,11,12\n');
    const r = await readAll(f, { engine });
    expect(r.rows).toEqual([[2, '1', '2', '3'], [5, '10', '11', '12']]);
    expect(r.summary.rejectedByReason).toEqual({ 'ragged-row': 2 });
    expect(r.summary.examples).toEqual([
      { code: 'ragged-row', file: f, line: 3, value: '4,5', message: 'expected 3 fields as in the header, found 2' },
      { code: 'ragged-row', file: f, line: 4, value: '6,7,8,9', message: 'expected 3 fields as in the header, found 4' },
    ]);
    expectAddsUp(r.summary);
    expect(r.summary.rowsRead).toBe(4);
  });

  it('rejects a row holding Latin-1 bytes in a UTF-8 file, naming the column', async () => {
    // "café" in ISO 8859-1 is 63 61 66 E9; E9 alone is not valid UTF-8 (RFC 3629 §3).
    const bytes = Buffer.concat([Buffer.from('city,name\nParis,caf'), Buffer.from([0xe9]), Buffer.from('\nLyon,café\n')]);
    const r = await readAll(tmp.file(`latin1-${engine}.csv`, bytes), { engine });
    expect(r.rows).toEqual([[3, 'Lyon', 'café']]);
    expect(r.summary.rejectedByReason).toEqual({ 'undecodable-bytes': 1 });
    const d = r.summary.examples[0]!;
    expect([d.code, d.line, d.column]).toEqual(['undecodable-bytes', 2, 'name']);
    expect(d.value).toBe('Paris,caf\uFFFD');
    expectAddsUp(r.summary);
  });

  it('validates bytes, not decoded text: a real U+FFFD in the data is kept', async () => {
    const r = await readAll(tmp.file(`fffd-${engine}.csv`, 'a\n\uFFFD\n'), { engine });
    expect(r.rows).toEqual([[2, '\uFFFD']]);
    expect(r.summary.rowsRejected).toBe(0);
  });

  it('rejects an overlong encoding and a lone surrogate (RFC 3629 §3, §10)', async () => {
    const bytes = Buffer.concat([Buffer.from('a\n'), Buffer.from([0xc0, 0xaf]), Buffer.from('\n'), Buffer.from([0xed, 0xa0, 0x80]), Buffer.from('\nok\n')]);
    const r = await readAll(tmp.file(`overlong-${engine}.csv`, bytes), { engine });
    expect(r.rows).toEqual([[4, 'ok']]);
    expect(r.summary.rejectedByReason).toEqual({ 'undecodable-bytes': 2 });
  });

  it('rejects an unterminated quote at the end of the input as one row from the line where it opens', async () => {
    const r = await readAll(tmp.file(`unterminated-${engine}.csv`, 'a,b\n1,2\n3,"never closed\n4,5\n'), { engine });
    expect(r.rows).toEqual([[2, '1', '2']]);
    expect(r.summary.rejectedByReason).toEqual({ 'unterminated-quote': 1 });
    expect(r.summary.examples[0]!.line).toBe(3);
    expectAddsUp(r.summary);
  });

  it('rejects a quote inside an unquoted field (RFC 4180 §2.5) and goes on with the next line', async () => {
    const r = await readAll(tmp.file(`stray-${engine}.csv`, 'a,b\n1,5" screen\n2,ok\n'), { engine });
    expect(r.rows).toEqual([[3, '2', 'ok']]);
    expect(r.summary.rejectedByReason).toEqual({ 'bad-quote': 1 });
    expect(r.summary.examples[0]!.line).toBe(2);
  });

  it('counts a completely empty line as a blank line, not a row; spaces and "" are rows', async () => {
    const r = await readAll(tmp.file(`blank-${engine}.csv`, 'a\n1\n\n\r\n \n""\n2\n\n'), { engine });
    expect(r.rows).toEqual([[2, '1'], [5, ' '], [6, ''], [7, '2']]);
    expect(r.summary.blankLines).toBe(3);
    expect(r.summary.rowsRead).toBe(4);
    expect(r.summary.lines).toBe(8);
  });

  it('keeps the first maxExamples rejections and counts them all', async () => {
    const text = 'a,b\n' + Array.from({ length: 50 }, (_, i) => (i % 2 === 0 ? `${i}\n` : `${i},x\n`)).join('');
    const r = await readAll(tmp.file(`many-${engine}.csv`, text), { engine, maxExamples: 3 });
    expect(r.summary.rejectedByReason).toEqual({ 'ragged-row': 25 });
    expect(r.summary.examples.map((d) => d.line)).toEqual([2, 4, 6]);
    expect(r.summary.rowsPassed).toBe(25);
    expectAddsUp(r.summary);
  });

  it('keeps a row of 10 MB on one line whole', async () => {
    const big = 'x'.repeat(10 * 1024 * 1024);
    const r = await readAll(tmp.file(`long-${engine}.csv`, `a,b\n1,${big}\n2,"${big}"\n`), { engine, chunkSize: 1 << 16 }, ['a']);
    expect(r.rows).toEqual([[2, '1'], [3, '2']]);
  }, 60_000);
});

describe('ReadSummary', () => {
  it('is incomplete until batches are read to the end, and its diagnostics format to one line', async () => {
    const f = tmp.file('partial.csv', 'a,b\n1\n2,3\n');
    const t = await openTable(f, { batchSize: 1 });
    expect(t.summary().complete).toBe(false);
    const it = t.batches(['b'])[Symbol.asyncIterator]();
    await it.next();
    expect(t.summary().complete).toBe(false);
    while (!(await it.next()).done);
    const s = t.summary();
    expect(s.complete).toBe(true);
    expect(formatDiagnostic(s.examples[0]!)).toBe(`${f}:2: value "1": expected 2 fields as in the header, found 1`);
  });

  it('reads header-only and blank-only bodies as zero rows', async () => {
    for (const text of ['a,b', 'a,b\n', 'a,b\n\n\n']) {
      const r = await readAll(tmp.file(`hdr-${text.length}.csv`, text));
      expect(r.rows).toEqual([]);
      expect(r.summary.rowsRead).toBe(0);
      expect(r.summary.blankLines).toBe(text.length - 4 < 0 ? 0 : Math.max(0, text.split('\n').length - 2));
    }
  });
});
