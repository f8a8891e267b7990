// TableOptions.byteRange: reading a plain CSV file in byte ranges, as parallel readers do. Differential
// test (the fast path held to itself, as the brief allows): a generated file with every CSV feature —
// RFC 4180 §2 quoting (delimiters, doubled quotes, CR, LF and CRLF inside quoted fields), CRLF, LF and
// lone-CR line ends (common practice), blank lines, ragged rows, bad quotes, bytes that are not UTF-8, a
// BOM, an unterminated quote at the end — is split just after line breaks; the ranges' rows, lines and
// rejections, shifted by the line breaks before each range, are exactly those of one whole read whenever
// each range's `stop` is the next range's start, and a split inside a quoted field shows as a mismatch.
// The whole read itself is held to csv-parse (the reference engine) on every generated file.
import { gzipSync } from 'node:zlib';
import { Readable } from 'node:stream';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { openTable } from '../../src/table/index.js';
import type { ReadSummary, TableOptions } from '../../src/table/index.js';
import type { Diagnostic } from '../../src/errors.js';
import { readAll, tempDir, type ReadResult } from './helpers.js';
import { seeded } from '../helpers/seeded.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());
const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 60);

const LF = 0x0a;
const CR = 0x0d;
const PIECES = ['a', 'Zq', '42', ' ', 'é', '日本', '😀', '"', '""', '\n', '\r\n', '\r', ',', ';', '\t', '|'];
const fieldArb = fc.record({ pieces: fc.array(fc.constantFrom(...PIECES), { maxLength: 4 }), forceQuote: fc.boolean() });
const rowArb = fc.record({
  // 0 blank line, 1 ragged, 2 undecodable byte, 3 bad quote inside a field, 4 text after a closing quote
  kind: fc.constantFrom(0, 1, 2, 3, 4, 5, 5, 5, 5, 5, 5, 5, 5, 5),
  fields: fc.array(fieldArb, { minLength: 5, maxLength: 5 }),
  end: fc.constantFrom('\n', '\r\n', '\r'),
});
const fileArb = fc.record({
  width: fc.integer({ min: 1, max: 4 }),
  delimiter: fc.constantFrom(',', ';', '\t', '|'),
  lineEnd: fc.constantFrom('\n', '\r\n', '\r', 'mixed'),
  bom: fc.boolean(),
  trailingEnd: fc.boolean(),
  unterminated: fc.integer({ min: 0, max: 5 }), // 0 → the file ends inside an open quoted field
  rows: fc.array(rowArb, { minLength: 1, maxLength: 25 }),
  chunkSize: fc.constantFrom(1, 3, 7, 64, 65536),
  batchSize: fc.constantFrom(1, 3, 8192),
});
type FileSpec = typeof fileArb extends fc.Arbitrary<infer T> ? T : never;

/** The file's bytes and the offsets where its records (rows and blank lines) start. */
function build(spec: FileSpec): { bytes: Buffer; recordStarts: Set<number> } {
  const d = spec.delimiter;
  const parts: Buffer[] = [];
  let size = 0;
  const push = (b: Buffer | string): void => {
    const buf = typeof b === 'string' ? Buffer.from(b) : b;
    parts.push(buf);
    size += buf.length;
  };
  const endOf = (e: string): string => (spec.lineEnd === 'mixed' ? e : spec.lineEnd);
  if (spec.bom) push('\uFEFF');
  let prevEnd = endOf('\n');
  push(Array.from({ length: spec.width }, (_, i) => `c${i}`).join(d) + prevEnd);
  const starts = new Set<number>();
  // Whether the last row has no line end (the file's last row, without trailingEnd).
  let open = false;
  spec.rows.forEach((row, idx) => {
    const last = idx === spec.rows.length - 1;
    let end = last && !spec.trailingEnd ? '' : endOf(row.end);
    if (row.kind === 0) {
      if (end === '') return;
      if (prevEnd === '\r' && end !== '\r') end = '\r'; // CR then LF would be one CRLF
      starts.add(size);
      push(end);
      prevEnd = end;
      return;
    }
    const n = row.kind === 1 ? spec.width + 1 : spec.width;
    // A row with a bad quote runs to its line end whatever the quotes say: keep its fields on one line.
    const oneLine = row.kind === 3 || row.kind === 4;
    const cells: string[] = [];
    for (let k = 0; k < n; k++) {
      const f = row.fields[k]!;
      const v = f.pieces.filter((p) => !oneLine || !/[\r\n]/.test(p)).join('');
      // RFC 4180 §2.6–2.7: quote a field holding the delimiter, a quote or a line break; double its quotes.
      const needs = v.includes(d) || v.includes('"') || v.includes('\n') || v.includes('\r');
      const quote = needs || f.forceQuote || (n === 1 && v === '');
      cells.push(quote ? `"${v.replaceAll('"', '""')}"` : v);
    }
    if (row.kind === 3) cells[0] = `x"y`;
    if (row.kind === 4) cells[0] = `"x"y`;
    starts.add(size);
    const text = Buffer.from(cells.join(d));
    push(row.kind === 2 ? Buffer.concat([text, Buffer.from([0xe9])]) : text);
    push(end);
    if (end !== '') prevEnd = end;
    open = end === '';
  });
  if (spec.unterminated === 0) {
    // The open quote starts a record of its own: after a line end (else it would run on the last row's line).
    if (open) push('\n');
    starts.add(size);
    push('"never\nclosed\r\n,' + d + '\rstill open\n');
  }
  return { bytes: Buffer.concat(parts), recordStarts: starts };
}

/** Offsets just after a line break (an LF, or a CR not followed by LF) at or past `from`: split candidates. */
function candidates(bytes: Buffer, from: number): number[] {
  const out: number[] = [];
  for (let i = from; i < bytes.length; i++) {
    const c = bytes[i];
    if (c === LF || (c === CR && bytes[i + 1] !== LF)) if (i + 1 > from && i + 1 < bytes.length) out.push(i + 1);
  }
  return out;
}

interface RangeRead {
  rows: (string | number)[][];
  summary: ReadSummary;
}

async function readRange(file: string, options: TableOptions, start: number, end: number, columns: readonly string[]): Promise<RangeRead> {
  const r = await readAll(file, { ...options, byteRange: { start, end } }, columns);
  return { rows: r.rows, summary: r.summary };
}

interface Merged {
  rows: (string | number)[][];
  counts: Record<string, unknown>;
  examples: Diagnostic[];
}

/** Joins range reads in file order, each range after the first shifted by the lines before it. */
function merge(headerLines: number, reads: RangeRead[]): Merged {
  const rows: (string | number)[][] = [];
  const examples: Diagnostic[] = [];
  const counts = { rowsRead: 0, rowsPassed: 0, rowsRejected: 0, blankLines: 0, lines: 0, breaks: 0, bytesRead: 0 };
  const byReason: Record<string, number> = {};
  let base = 0;
  reads.forEach((r, k) => {
    const shift = k === 0 ? 0 : base;
    for (const row of r.rows) rows.push([(row[0] as number) + shift, ...row.slice(1)]);
    for (const e of r.summary.examples) examples.push({ ...e, line: e.line! + shift });
    for (const key of Object.keys(counts) as (keyof typeof counts)[]) counts[key] += r.summary[key];
    for (const [reason, n] of Object.entries(r.summary.rejectedByReason)) byReason[reason] = (byReason[reason] ?? 0) + n;
    base = (k === 0 ? headerLines : base) + r.summary.breaks;
  });
  return { rows, counts: { ...counts, byReason, stop: reads[reads.length - 1]!.summary.stop }, examples };
}

function whole(r: ReadResult): Merged {
  const s = r.summary;
  return {
    rows: r.rows,
    counts: {
      rowsRead: s.rowsRead,
      rowsPassed: s.rowsPassed,
      rowsRejected: s.rowsRejected,
      blankLines: s.blankLines,
      lines: s.lines,
      breaks: s.breaks,
      bytesRead: s.bytesRead,
      byReason: s.rejectedByReason,
      stop: s.stop,
    },
    examples: s.examples,
  };
}

/**
 * Reads the file in ranges split at `splits`, mending as a parallel reader does: a range whose start is
 * not the previous range's stop is read again from that stop. Returns the reads and whether each split
 * agreed with the previous range's stop.
 */
async function readSplit(file: string, options: TableOptions, size: number, splits: number[], columns: readonly string[]): Promise<{ reads: RangeRead[]; agreed: boolean[] }> {
  const bounds = [0, ...splits, size];
  const reads: RangeRead[] = [];
  const agreed: boolean[] = [];
  for (let k = 0; k + 1 < bounds.length; k++) {
    let start = bounds[k]!;
    if (k > 0) {
      const prevStop = reads[k - 1]!.summary.stop;
      agreed.push(prevStop === start);
      start = prevStop;
    }
    reads.push(await readRange(file, options, start, bounds[k + 1]!, columns));
  }
  return { reads, agreed };
}

let counter = 0;

describe('openTable(file, { byteRange }) split at line breaks, against one whole read', () => {
  it('gives the rows, lines and rejections of one whole read, and a mismatch where a split is inside a quoted field', async () => {
    await fc.assert(
      fc.asyncProperty(fileArb, fc.array(fc.nat(), { maxLength: 4 }), async (spec, picks) => {
        const { bytes, recordStarts } = build(spec);
        const file = tmp.file(`range-${counter++}.csv`, bytes);
        const options: TableOptions = { delimiter: spec.delimiter, chunkSize: spec.chunkSize, batchSize: spec.batchSize, maxExamples: 1000 };
        const t = await openTable(file, options);
        const columns = t.header;
        const { bodyStart, headerLines } = t;
        t.close();
        const full = await readAll(file, options);
        // The whole read is the reference engine's (csv-parse), so the oracle of the ranges is independent.
        const ref = await readAll(file, { ...options, engine: 'reference' });
        expect(full.rows).toEqual(ref.rows);
        expect(full.summary.examples).toEqual(ref.summary.examples);
        expect(full.summary.stop).toBe(bytes.length);
        const cands = candidates(bytes, bodyStart);
        // Every split point at once: each range holds at most one line.
        const every = await readSplit(file, options, bytes.length, cands, columns);
        cands.forEach((c, k) => expect(every.agreed[k]).toBe(recordStarts.has(c)));
        expect(merge(headerLines, every.reads)).toEqual(whole(full));
        // A few splits at once, and every split alone.
        const some = [...new Set(picks.map((p) => cands[p % Math.max(1, cands.length)]!).filter((c) => c !== undefined))].sort((a, b) => a - b);
        const few = await readSplit(file, options, bytes.length, some, columns);
        expect(merge(headerLines, few.reads)).toEqual(whole(full));
        for (const c of cands) {
          const two = await readSplit(file, options, bytes.length, [c], columns);
          expect(two.agreed[0]).toBe(recordStarts.has(c));
          expect(merge(headerLines, two.reads)).toEqual(whole(full));
        }
      }),
      { numRuns: RUNS },
    );
  }, 600_000);

  it('reads a 2 MB file in 7 ranges alike through batches and byteBatches, records crossing chunk ends', async () => {
    // Seeded rows with quoted CRLF, doubled quotes, unicode, ragged rows and now and then a 100 KB field
    // (longer than the fast path's 64 KiB bridge between chunks), read in 50 000-byte chunks.
    const rnd = seeded(11);
    const rows = ['id,ts,note'];
    let size = 0;
    for (let i = 0; size < 2_000_000; i++) {
      const kind = Math.floor(rnd() * 10);
      const note =
        kind === 0 ? `"line\r\nbreak ""${i}"""` : kind === 1 ? 'x'.repeat(rnd() < 0.05 ? 100_000 : 40) : kind === 2 ? 'ümlaut 日本' : kind === 3 ? `${i},extra` : `n${i}`;
      const row = `${i},2024-03-${String(1 + (i % 28)).padStart(2, '0')}T08:15:00Z,${note}`;
      rows.push(row);
      size += row.length + 1;
    }
    const text = Buffer.from(rows.join('\n') + '\n');
    const file = tmp.file('range-big.csv', text);
    const options: TableOptions = { chunkSize: 50_000, maxExamples: 100_000 };
    const full = await readAll(file, options);
    const splits: number[] = [];
    for (let k = 1; k < 7; k++) splits.push(text.indexOf(LF, Math.floor((text.length * k) / 7)) + 1);
    const { reads } = await readSplit(file, options, text.length, splits, ['id', 'ts', 'note']);
    expect(merge(1, reads)).toEqual(whole(full));
    // byteBatches of each range give the same rows as batches of that range.
    for (let k = 0; k < reads.length; k++) {
      const start = k === 0 ? 0 : reads[k - 1]!.summary.stop;
      const t = await openTable(file, { ...options, byteRange: { start, end: k < splits.length ? splits[k]! : text.length } });
      const got: (string | number)[][] = [];
      for await (const b of t.byteBatches(['id', 'note'], ['ts'])) {
        for (let i = 0; i < b.length; i++) {
          const id = b.buf.toString('utf8', b.starts[0]![i], b.ends[0]![i]);
          const src = b.decoded[1]![i] === 1 ? b.side : b.buf;
          got.push([b.lines[i]!, id, b.values[0]![i]!, src.toString('utf8', b.starts[1]![i], b.ends[1]![i])]);
        }
      }
      expect(got).toEqual(reads[k]!.rows);
      expect(t.summary().stop).toBe(reads[k]!.summary.stop);
    }
  }, 120_000);
});

describe('openTable(file, { byteRange }) edges', () => {
  const text = '\uFEFFa,b\r\n1,2\r\n\r\n"3\n4",5\r\n6,7';
  const bytes = Buffer.from(text);
  const file = tmp.file('edges.csv', bytes);
  const at = (s: string): number => bytes.indexOf(s);

  it('starts at the first record after the header when start is 0, with the file\'s line numbers', async () => {
    const r = await readAll(file, { byteRange: { start: 0, end: at('\r\n\r\n') } });
    expect(r.rows).toEqual([[2, '1', '2']]);
    expect(r.summary.stop).toBe(at('\r\n\r\n') + 2);
    expect(r.summary.breaks).toBe(1);
    expect(r.summary.lines).toBe(2); // header line and one row
    expect(r.summary.bytesRead).toBe(at('\r\n\r\n') + 2); // BOM and header included for the first range
  });

  it('counts lines from the range start when start > 0 and reads a record that starts before end past end', async () => {
    const start = at('\r\n\r\n') + 2;
    const r = await readAll(file, { byteRange: { start, end: start + 3 } });
    // Blank line 1 (CRLF, RFC 4180 §2.1 line end), then the quoted record "3\n4" starting on line 2.
    expect(r.rows).toEqual([[2, '3\n4', '5']]);
    expect(r.summary.blankLines).toBe(1);
    expect(r.summary.breaks).toBe(3);
    expect(r.summary.stop).toBe(at('6,7'));
    expect(r.summary.bytesRead).toBe(at('6,7') - start);
  });

  it('reads nothing from an empty range, and from a range at the file end', async () => {
    const start = at('6,7');
    for (const range of [{ start, end: start }, { start: bytes.length, end: bytes.length + 10 }, { start, end: 0 }]) {
      const r = await readAll(file, { byteRange: range });
      expect(r.rows).toEqual([]);
      expect(r.summary.rowsRead).toBe(0);
      expect(r.summary.stop).toBe(range.start);
      expect(r.summary.breaks).toBe(0);
      expect(r.summary.lines).toBe(0);
    }
  });

  it('reads the last record without a line end, and reports stop as the file size', async () => {
    const r = await readAll(file, { byteRange: { start: at('6,7'), end: bytes.length } });
    expect(r.rows).toEqual([[1, '6', '7']]);
    expect(r.summary.stop).toBe(bytes.length);
    expect(r.summary.breaks).toBe(0);
    expect(r.summary.lines).toBe(1);
  });

  it('exposes bodyStart and headerLines, and a range starting at bodyStart counts lines from there', async () => {
    const t = await openTable(file);
    expect(t.bodyStart).toBe(at('1,2'));
    expect(t.headerLines).toBe(1);
    t.close();
    const r = await readAll(file, { byteRange: { start: at('1,2'), end: at('1,2') + 1 } });
    expect(r.rows).toEqual([[1, '1', '2']]);
  });

  it('reports progress within the range, never past its length', async () => {
    const seen: [number, number | undefined][] = [];
    const start = at('\r\n\r\n') + 2;
    await readAll(file, { chunkSize: 2, byteRange: { start, end: bytes.length }, onProgress: (b, total) => seen.push([b, total]) });
    expect(seen.length).toBeGreaterThan(0);
    for (const [b, total] of seen) {
      expect(total).toBe(bytes.length - start);
      expect(b).toBeLessThanOrEqual(bytes.length - start);
    }
    expect(seen[seen.length - 1]![0]).toBe(bytes.length - start);
    for (let i = 1; i < seen.length; i++) expect(seen[i]![0]).toBeGreaterThanOrEqual(seen[i - 1]![0]);
  });

  it.each([
    ['a start inside the header', { start: 2, end: 10 }],
    ['a start that is not just after a line break', { start: at('1,2') + 1, end: 20 }],
    ['a start between the CR and LF of a CRLF', { start: at('1,2') + 4, end: 20 }],
    ['a start past the end of the file', { start: bytes.length + 1, end: bytes.length + 2 }],
    ['a negative start', { start: -1, end: 4 }],
    ['a fractional end', { start: 0, end: 4.5 }],
  ])('throws E_USAGE for %s', async (_what, byteRange) => {
    await expect(openTable(file, { byteRange })).rejects.toMatchObject({ code: 'E_USAGE' });
  });

  it('throws E_USAGE for standard input, gzip, NDJSON and the reference engine', async () => {
    const range = { byteRange: { start: 0, end: 10 } };
    await expect(openTable('-', { ...range, stdin: Readable.from([Buffer.from('a\n1\n')]) })).rejects.toMatchObject({ code: 'E_USAGE' });
    await expect(openTable(tmp.file('r.csv.gz', gzipSync('a\n1\n')), range)).rejects.toMatchObject({ code: 'E_USAGE' });
    await expect(openTable(tmp.file('r.ndjson', '{"a":1}\n{"a":2}\n'), range)).rejects.toMatchObject({ code: 'E_USAGE' });
    await expect(openTable(file, { ...range, engine: 'reference' })).rejects.toMatchObject({ code: 'E_USAGE' });
  });
});

describe('ReadSummary.stop and .breaks of whole reads', () => {
  // Breaks counted independently of both parsers: every CRLF, lone CR and LF after the header (common practice).
  const breaksIn = (s: string): number => (s.match(/\r\n|\r|\n/g) ?? []).length;
  it.each([
    ['fast', 'csv', 'a,b\n1,"x\r\ny"\r\n\n2,3\r4,5'],
    ['reference', 'csv', 'a,b\n1,"x\r\ny"\r\n\n2,3\r4,5'],
    ['fast', 'csv', 'a,b\n1,2\n'],
    ['reference', 'csv', 'a,b\n1,2\n'],
    ['fast', 'ndjson', '{"a":1}\n{"a":2}\r\n\n{"a":3}'],
    ['fast', 'ndjson', '{"a":1}\n{"a":2}\n'],
  ] as const)('%s engine, %s: stop is the input size and breaks the line breaks after the header', async (engine, format, text) => {
    const r = await readAll(tmp.file(`whole-${counter++}.${format}`, text), { engine });
    expect(r.summary.stop).toBe(Buffer.byteLength(text));
    // NDJSON's header is the first object, which is also its first row: its breaks are all the input's.
    const after = format === 'ndjson' ? text : text.slice(text.indexOf('\n') + 1);
    expect(r.summary.breaks).toBe(breaksIn(after));
  });
});

describe('fast path, a lone CR at the end of a chunk (whole reads)', () => {
  it.each([2, 7, 4096])('reads each CR-ended row once with chunkSize %i, as csv-parse does', async (chunkSize) => {
    // Lone CR as a line end (common practice, old Mac files). A body longer than the 64 KiB read at the
    // start puts chunk ends right after a CR, where the next byte decides between CR and CRLF.
    const rows = ['a,b'];
    for (let i = 0; i < 9_000; i++) rows.push(`${i},x${i % 7 === 0 ? '\r\n' : ''}`);
    const file = tmp.file(`lone-cr-${chunkSize}.csv`, rows.join('\r') + '\r');
    const fast = await readAll(file, { chunkSize, maxExamples: 0 });
    const ref = await readAll(file, { chunkSize, maxExamples: 0, engine: 'reference' });
    expect(fast.rows.length).toBe(9_000);
    expect(fast.rows).toEqual(ref.rows);
    expect(fast.summary.lines).toBe(ref.summary.lines);
    expect(fast.summary.blankLines).toBe(ref.summary.blankLines);
  });
});
