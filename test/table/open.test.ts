// openTable: formats, delimiters, line ends, quoting, BOM, gzip and standard input.
import { Readable } from 'node:stream';
import { gzipSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { openTable } from '../../src/table/index.js';
import type { TableEngine } from '../../src/table/index.js';
import { expectAddsUp, readAll, tempDir, valuesOf } from './helpers.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());
const engines: TableEngine[] = ['fast', 'reference'];

describe.each(engines)('openTable(file, { engine: %s }) on RFC 4180 §2 examples', (engine) => {
  // Each row is one of the numbered rules of RFC 4180 §2 with its example (header line added, rule 3).
  it.each([
    ['§2.1 records end with CRLF', 'h1,h2,h3\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]],
    ['§2.2 last record without a line break', 'h1,h2,h3\r\naaa,bbb,ccc\r\nzzz,yyy,xxx', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]],
    ['§2.4 spaces are part of a field', 'h1,h2,h3\r\naaa , bbb,ccc \r\n', [['aaa ', ' bbb', 'ccc ']]],
    ['§2.5 fields enclosed in double quotes', 'h1,h2,h3\r\n"aaa","bbb","ccc"\r\nzzz,yyy,xxx\r\n', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]],
    ['§2.6 quoted CRLF, quote and comma', 'h1,h2,h3\r\n"aaa","b\r\nbb","c,cc"\r\nzzz,yyy,xxx\r\n', [['aaa', 'b\r\nbb', 'c,cc'], ['zzz', 'yyy', 'xxx']]],
    ['§2.7 doubled quote inside a quoted field', 'h1,h2,h3\r\n"aaa","b""bb","ccc"\r\n', [['aaa', 'b"bb', 'ccc']]],
  ])('%s', async (_rule, text, expected) => {
    const r = await readAll(tmp.file(`rfc-${engine}-${expected.length}-${text.length}.csv`, text), { engine });
    expect(r.header).toEqual(['h1', 'h2', 'h3']);
    expect(valuesOf(r)).toEqual(expected);
    expectAddsUp(r.summary);
  });

  it('gives the 1-based physical line on which each row starts, across quoted line breaks', async () => {
    const r = await readAll(tmp.file(`lines-${engine}.csv`, 'a,b\n1,"x\ny\nz"\n2,3\r\n"4\r\n",5\r6,7'), { engine });
    expect(r.rows.map((row) => row[0])).toEqual([2, 5, 6, 8]); // common practice: CR, LF and CRLF each end one line
    expect(r.summary.lines).toBe(8);
  });

  it('treats LF, CRLF and a lone CR alike, mixed in one file', async () => {
    const r = await readAll(tmp.file(`mixed-${engine}.csv`, 'a,b\r\n1,2\n3,4\r5,6\r\n'), { engine });
    expect(r.rows).toEqual([[2, '1', '2'], [3, '3', '4'], [4, '5', '6']]);
  });

  it('strips a UTF-8 BOM before the header', async () => {
    const r = await readAll(tmp.file(`bom-${engine}.csv`, '\uFEFFname,n\nÅsa,1\n'), { engine });
    expect(r.header).toEqual(['name', 'n']); // the BOM is EF BB BF (Unicode §23.8), not part of the first name
    expect(valuesOf(r)).toEqual([['Åsa', '1']]);
  });

  it('keeps an empty field empty and reads "" as an empty value', async () => {
    const r = await readAll(tmp.file(`empty-${engine}.csv`, 'a,b,c\n,,\n"",x,""\n'), { engine });
    expect(valuesOf(r)).toEqual([['', '', ''], ['', 'x', '']]);
  });
});

describe('openTable(file) sniffs the delimiter', () => {
  // common practice: the candidate that splits the header and the rows alike wins.
  it.each([
    ['comma', 'a,b,c\n1,2,3\n', ','],
    ['semicolon (decimal commas in the data)', 'a;b;c\n1,5;2,5;3\n', ';'],
    ['tab', 'a\tb\tc\n1\t2\t3\n', '\t'],
    ['pipe', 'a|b|c\n1|2|3\n', '|'],
    ['comma inside quotes is not counted', 'a;b\n"x,y,z";2\n', ';'],
    ['a single column has none', 'value\n1\n2\n', ','],
  ])('%s', async (_name, text, delimiter) => {
    const r = await readAll(tmp.file(`sniff-${text.length}-${delimiter.charCodeAt(0)}.txt`, text));
    expect(r.delimiter).toBe(delimiter);
    expect(r.summary.rowsRejected).toBe(0);
  });

  it('takes a given delimiter over the sniffed one, and tab for .tsv', async () => {
    const f = tmp.file('given.csv', 'a;b,c\n1;2,3\n');
    expect((await readAll(f, { delimiter: ';' })).header).toEqual(['a', 'b,c']);
    expect((await readAll(tmp.file('t.tsv', 'a,b\tc\n1,2\t3\n'))).header).toEqual(['a,b', 'c']);
    expect((await readAll(f, { delimiter: 'tab' })).delimiter).toBe('\t');
  });
});

describe('openTable(file) reads gzip and standard input', () => {
  const text = 'ts,n\n2024-01-01T00:00:00Z,1\n2024-01-02T00:00:00Z,2\n';
  it('gunzips a .gz file', async () => {
    const r = await readAll(tmp.file('g.csv.gz', gzipSync(text)), {}, ['n']);
    expect(r.rows).toEqual([[2, '1'], [3, '2']]);
    expect(r.summary.bytesDecoded).toBe(Buffer.byteLength(text));
    expect(r.summary.bytesRead).toBeLessThan(r.summary.bytesDecoded + 30);
  });

  it('recognises gzip by its magic bytes 1f 8b (RFC 1952 §2.3.1) without the extension', async () => {
    const r = await readAll(tmp.file('g-no-ext.csv', gzipSync(text)), {}, ['ts']);
    expect(r.rows.map((row) => row[1])).toEqual(['2024-01-01T00:00:00Z', '2024-01-02T00:00:00Z']);
  });

  it("reads '-' from options.stdin, in chunks split anywhere", async () => {
    const bytes = Buffer.from('a;b\r\n"x\r\ny";2\r\n3;4\r\n');
    const chunks = [...bytes].map((b) => Buffer.from([b])); // one byte per chunk
    const r = await readAll('-', { stdin: Readable.from(chunks) });
    expect(r.rows).toEqual([[2, 'x\r\ny', '2'], [4, '3', '4']]);
    expect(r.summary.file).toBe('-');
    const t = await openTable('-', { stdin: Readable.from([bytes]) });
    expect(t.totalBytes).toBeUndefined();
  });

  it("gunzips '-' when standard input starts with the gzip magic bytes", async () => {
    const r = await readAll('-', { stdin: Readable.from([gzipSync(text)]) }, ['n']);
    expect(r.rows).toEqual([[2, '1'], [3, '2']]);
  });

  it('reports progress as bytes read against the file size', async () => {
    const f = tmp.file('progress.csv', 'a\n' + '1\n'.repeat(5000));
    const seen: [number, number | undefined][] = [];
    await readAll(f, { chunkSize: 1024, onProgress: (n, total) => seen.push([n, total]) });
    expect(seen.length).toBeGreaterThan(5);
    expect(seen.at(-1)).toEqual([10002, 10002]);
    for (let i = 1; i < seen.length; i++) expect(seen[i]![0]).toBeGreaterThan(seen[i - 1]![0]);
  });
});

describe('openTable(file) reads NDJSON', () => {
  it('takes the first object\'s keys as the header and writes values as text', async () => {
    const f = tmp.file('e.ndjson', '{"id":1,"when":"2024-01-01","ok":true,"tags":["a"]}\n{"id":2,"when":null}\n');
    const r = await readAll(f);
    expect(r.format).toBe('ndjson');
    expect(r.header).toEqual(['id', 'when', 'ok', 'tags']);
    expect(valuesOf(r)).toEqual([['1', '2024-01-01', 'true', '["a"]'], ['2', '', '', '']]);
    expectAddsUp(r.summary);
  });

  it('counts keys the first object lacks, per key, and passes those rows on', async () => {
    const f = tmp.file('unknown.jsonl', '{"a":1}\n{"a":2,"b":3}\n{"a":4,"b":5,"c":6}\n');
    const r = await readAll(f);
    expect(r.rows).toEqual([[1, '1'], [2, '2'], [3, '4']]);
    expect(r.summary.unknownKeys).toEqual({ b: 2, c: 1 });
  });

  it('sniffs NDJSON from a leading { when the name does not say', async () => {
    const r = await readAll(tmp.file('events.txt', '\n{"a":"x"}\r\n{"a":"y"}'));
    expect(r.format).toBe('ndjson');
    expect(r.rows).toEqual([[2, 'x'], [3, 'y']]);
    expect(r.summary.blankLines).toBe(1);
  });

  it('rejects lines that are not JSON objects, with line and reason', async () => {
    const r = await readAll(tmp.file('bad.ndjson', '{"a":1}\nnot json\n[1,2]\n\n{"a":2}\n'));
    expect(r.rows).toEqual([[1, '1'], [5, '2']]);
    expect(r.summary.rejectedByReason).toEqual({ 'bad-json': 1, 'not-an-object': 1 });
    expect(r.summary.examples.map((d) => [d.code, d.line, d.value])).toEqual([
      ['bad-json', 2, 'not json'],
      ['not-an-object', 3, '[1,2]'],
    ]);
    expect(r.summary.blankLines).toBe(1);
    expectAddsUp(r.summary);
  });
});
