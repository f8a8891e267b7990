// TableReader.byteBatches: the byte-level batches of hot paths read every generated file exactly as
// `batches` does — same rows, same start lines, same strings (byteFieldString), same row accounting —
// on every engine and format, with every CSV feature of RFC 4180 §2 (quoted fields holding delimiters,
// doubled quotes and line breaks; CRLF, LF and lone CR; an optional last line end) and the rejections.
import { gzipSync } from 'node:zlib';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { byteFieldString, openTable } from '../../src/table/index.js';
import type { ByteBatch, ReadSummary, TableOptions } from '../../src/table/index.js';
import { readAll, tempDir } from './helpers.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());
const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 120);

interface BytesRead {
  rows: (string | number)[][];
  summary: ReadSummary;
  batches: ByteBatch[];
}

/** Reads a table through byteBatches into rows [line, ...byte columns, ...string columns]. */
async function readBytes(file: string, options: TableOptions, bytes: readonly string[], strings: readonly string[]): Promise<BytesRead> {
  const t = await openTable(file, options);
  const rows: (string | number)[][] = [];
  const batches: ByteBatch[] = [];
  for await (const b of t.byteBatches(bytes, strings)) {
    batches.push(b);
    expect(b.lines.length).toBe(b.length);
    expect(b.starts.length).toBe(bytes.length);
    expect(b.values.length).toBe(strings.length);
    for (let i = 0; i < b.length; i++) {
      const row: (string | number)[] = [b.lines[i]!];
      for (let c = 0; c < bytes.length; c++) {
        const v = byteFieldString(b, c, i);
        // The bytes themselves are the UTF-8 of the value: in the input buffer, or decoded in the side buffer.
        const from = b.decoded[c]![i] === 1 ? b.side : b.buf;
        expect(from.subarray(b.starts[c]![i], b.ends[c]![i]).equals(Buffer.from(v))).toBe(true);
        if (b.ascii) expect(/^[\x00-\x7f]*$/.test(v)).toBe(true);
        row.push(v);
      }
      for (let c = 0; c < strings.length; c++) row.push(b.values[c]![i]!);
      rows.push(row);
    }
  }
  return { rows, summary: t.summary(), batches };
}

const DELIMS = [',', ';', '\t', '|'];
const PIECES = ['a', '7', '-1.5', ' ', 'é', '日本', '😀', '"', '""', '\n', '\r\n', '\r', ',', ';', '\t', '|', '2024-03-10T08:15:00-05:00'];
const cellArb = fc.record({ pieces: fc.array(fc.constantFrom(...PIECES), { maxLength: 3 }), quote: fc.boolean(), badByte: fc.integer({ min: 0, max: 40 }) });
const rowArb = fc.record({ blank: fc.integer({ min: 0, max: 15 }), delta: fc.constantFrom(0, 0, 0, 0, 0, 0, 1, -1), cells: fc.array(cellArb, { minLength: 5, maxLength: 5 }), end: fc.constantFrom('\n', '\r\n', '\r') });
const fileArb = fc.record({
  width: fc.integer({ min: 1, max: 4 }),
  delimiter: fc.constantFrom(...DELIMS),
  bom: fc.boolean(),
  gzip: fc.integer({ min: 0, max: 4 }),
  trailing: fc.boolean(),
  rows: fc.array(rowArb, { maxLength: 30 }),
  chunkSize: fc.constantFrom(1, 2, 5, 16, 64, 65536),
  batchSize: fc.constantFrom(1, 3, 8192),
  pick: fc.array(fc.nat(3), { minLength: 1, maxLength: 4 }),
  split: fc.nat(4),
});
type FileSpec = typeof fileArb extends fc.Arbitrary<infer T> ? T : never;

/** The bytes of a generated file; quoting by RFC 4180 §2.6–2.7 (a quote inside a field is doubled). */
function build(spec: FileSpec): Buffer {
  const d = spec.delimiter;
  const parts: Buffer[] = [];
  if (spec.bom) parts.push(Buffer.from('\uFEFF'));
  parts.push(Buffer.from(Array.from({ length: spec.width }, (_, i) => `c${i}`).join(d) + '\n'));
  let prevEnd = '\n';
  spec.rows.forEach((r, idx) => {
    let end = idx === spec.rows.length - 1 && !spec.trailing ? '' : r.end;
    if (r.blank === 0) {
      if (end === '') return;
      if (prevEnd === '\r' && end !== '\r') end = '\r'; // CR then LF would read as one CRLF
      parts.push(Buffer.from(end));
      prevEnd = end;
      return;
    }
    const n = Math.max(1, spec.width + r.delta);
    for (let k = 0; k < n; k++) {
      const c = r.cells[k]!;
      const v = c.pieces.join('');
      const quote = c.quote || n === 1 || /["\r\n]/.test(v) || v.includes(d);
      let cell = Buffer.from(quote ? `"${v.replaceAll('"', '""')}"` : v);
      // A byte that is not UTF-8 (inside the quotes, so the quoting stays sound): the row is rejected.
      if (c.badByte === 0) cell = Buffer.concat([cell.subarray(0, quote ? 1 : 0), Buffer.from([0xff]), cell.subarray(quote ? 1 : 0)]);
      parts.push(cell);
      if (k < n - 1) parts.push(Buffer.from(d));
    }
    parts.push(Buffer.from(end));
    if (end !== '') prevEnd = end;
  });
  const raw = Buffer.concat(parts);
  return spec.gzip === 0 ? gzipSync(raw) : raw;
}

const accounting = (s: ReadSummary): unknown => ({ ...s, file: '', examples: s.examples.map((e) => ({ ...e, file: '' })) });

let n = 0;
describe('TableReader.byteBatches(byteColumns, stringColumns)', () => {
  it('reads generated files with every CSV feature as batches does, on both engines', async () => {
    await fc.assert(
      fc.asyncProperty(fileArb, async (spec) => {
        const file = tmp.file(`b${n++}.csv${spec.gzip === 0 ? '.gz' : ''}`, build(spec));
        const cols = spec.pick.map((p) => `c${p % spec.width}`);
        const cut = spec.split % (cols.length + 1);
        const bytes = cols.slice(0, cut);
        const strings = cols.slice(cut);
        const opts = { chunkSize: spec.chunkSize, batchSize: spec.batchSize, delimiter: spec.delimiter };
        const reference = await readAll(file, { ...opts, engine: 'reference' }, cols);
        for (const engine of ['fast', 'reference'] as const) {
          const want = await readAll(file, { ...opts, engine }, cols);
          const got = await readBytes(file, { ...opts, engine }, bytes, strings);
          expect(got.rows).toEqual(want.rows);
          expect(got.rows).toEqual(reference.rows);
          expect(accounting(got.summary)).toEqual(accounting(want.summary));
          for (const b of got.batches) expect(b.length).toBeLessThanOrEqual(spec.batchSize);
        }
      }),
      { numRuns: RUNS },
    );
  }, 600_000);

  it('delivers a quoted field with doubled quotes decoded, and plain quoted fields in place', async () => {
    // RFC 4180 §2.7: "a ""quoted"" word" holds a "quoted" word; §2.6: a quoted field may hold a line break.
    const f = tmp.file('quoted.csv', 'a,b\r\n"x,""y""",2\r\n"line\r\nbreak",3\r\n');
    const r = await readBytes(f, {}, ['a', 'b'], []);
    expect(r.rows).toEqual([[2, 'x,"y"', '2'], [3, 'line\r\nbreak', '3']]);
    const b = r.batches[0]!;
    expect([b.decoded[0]![0], b.decoded[0]![1], b.decoded[1]![0]]).toEqual([1, 0, 0]);
    expect(b.side.toString()).toBe('x,"y"');
  });

  it('reads NDJSON through the same interface', async () => {
    const f = tmp.file('rows.ndjson', '{"t":"2024-01-01","n":"é"}\n{"t":"2024-01-02","n":"x"}\nnot json\n');
    const want = await readAll(f, {}, ['t', 'n']);
    const got = await readBytes(f, {}, ['t'], ['n']);
    expect(got.rows).toEqual(want.rows);
    expect(got.summary.rejectedByReason).toEqual({ 'bad-json': 1 });
  });

  it('throws E_USAGE when a table is read a second time, and E_COLUMN for an unknown column', async () => {
    const f = tmp.file('twice.csv', 'a\n1\n');
    const t = await openTable(f);
    expect(() => t.byteBatches(['nope'])).toThrow(expect.objectContaining({ code: 'E_COLUMN' }));
    for await (const _ of t.byteBatches(['a'])) void _;
    expect(() => t.batches(['a'])).toThrow(expect.objectContaining({ code: 'E_USAGE' }));
    expect(t.summary().complete).toBe(true);
  });
});

describe('byteBatches and the reuse of read buffers and batch arrays', () => {
  // A file of many 4 KiB reads, every record quote-free (the kernel's path) but some with quotes.
  const lines = ['id,ts,note'];
  for (let i = 0; i < 20_000; i++) lines.push(`${i},2024-03-${String(1 + (i % 28)).padStart(2, '0')}T08:15:00Z,${i % 50 === 0 ? '"a, ""b"""' : `n${i}`}`);
  const text = lines.join('\n') + '\n';
  const want = lines.slice(1).map((l, i) => [i + 2, l.split(',')[1]!]);
  const strings = (bs: ByteBatch[]): (string | number)[][] =>
    bs.flatMap((b) => Array.from({ length: b.length }, (_, i) => [b.lines[i]!, byteFieldString(b, 0, i)]));

  it('leaves every batch intact for a consumer that keeps them all (not transient)', async () => {
    const t = await openTable(tmp.file('keep.csv', text), { chunkSize: 4096, batchSize: 300 });
    const kept: ByteBatch[] = [];
    for await (const b of t.byteBatches(['ts'])) kept.push(b);
    expect(kept.length).toBeGreaterThan(60);
    expect(strings(kept)).toEqual(want);
  });

  it('gives the same values to a transient consumer that reads each batch at once, from the first', async () => {
    const t = await openTable(tmp.file('transient.csv', text), { chunkSize: 4096, batchSize: 300 });
    const seen: (string | number)[][] = [];
    for await (const b of t.byteBatches(['ts'], [], { transient: true })) seen.push(...strings([b]));
    expect(seen).toEqual(want);
    expect(t.summary().rowsPassed).toBe(20_000);
  });

  it('gives the same values when the consumer turns transient after keeping its first batches', async () => {
    const t = await openTable(tmp.file('later.csv', text), { chunkSize: 4096, batchSize: 300 });
    const read = { transient: false };
    const first: ByteBatch[] = [];
    const seen: (string | number)[][] = [];
    for await (const b of t.byteBatches(['ts'], [], read)) {
      if (first.length < 5) {
        first.push(b);
        if (first.length === 5) {
          read.transient = true;
          seen.push(...strings(first));
        }
      } else seen.push(...strings([b]));
    }
    expect(seen).toEqual(want);
  });
});
