// fast-check properties of the CSV reader (openTable on standard input, split into random chunks): no
// exception escapes but QuernError; every row is passed or rejected and the summary adds up; on tables
// written by RFC 4180 §2 rules the reader gives back exactly the fields written (an independent encoder
// here is the oracle); the fast tokenizer and the csv-parse reference engine agree.
import { Readable } from 'node:stream';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isQuernError } from '../../src/errors.js';
import { openTable, type ReadSummary, type TableEngine } from '../../src/table/index.js';
import { FUZZ_TIMEOUT, caseCounter, fuzzRuns } from './runs.js';

const count = caseCounter('csv');

interface Read { header: readonly string[]; rows: string[][]; lines: number[]; summary: ReadSummary }

/** Reads a whole table from bytes given as `chunks`, every column. */
async function readChunks(chunks: Buffer[], engine: TableEngine, delimiter?: string, simd = true): Promise<Read> {
  const t = await openTable('-', { stdin: Readable.from(chunks), format: 'csv', engine, batchSize: 7, simd, ...(delimiter ? { delimiter } : {}) });
  const rows: string[][] = [];
  const lines: number[] = [];
  for await (const b of t.batches(t.header)) {
    expect(b.values.length).toBe(t.header.length);
    for (let i = 0; i < b.length; i++) {
      rows.push(b.values.map((v) => v[i]!));
      lines.push(b.lines[i]!);
    }
  }
  return { header: t.header, rows, lines, summary: t.summary() };
}

/** Splits bytes at the given cut points (so reads end inside quotes, CRLF pairs and UTF-8 sequences). */
function cut(buf: Buffer, cuts: number[]): Buffer[] {
  const at = [...new Set(cuts.map((c) => c % (buf.length + 1)))].sort((a, b) => a - b);
  const parts: Buffer[] = [];
  let prev = 0;
  for (const c of at) { parts.push(buf.subarray(prev, c)); prev = c; }
  parts.push(buf.subarray(prev));
  return parts.filter((p) => p.length > 0);
}

/** What an engine makes of the bytes: rows, lines and rejections, or the QuernError code. */
async function outcome(buf: Buffer, engine: TableEngine, simd = true): Promise<object> {
  try {
    const r = await readChunks([buf], engine, ',', simd);
    return { rows: r.rows, lines: r.lines, read: r.summary.rowsRead, rejected: r.summary.rejectedByReason };
  } catch (e) {
    if (!isQuernError(e)) throw e;
    return { code: e.code };
  }
}

function expectAddsUp(s: ReadSummary, r: Read): void {
  expect(s.rowsRead).toBe(s.rowsPassed + s.rowsRejected);
  expect(Object.values(s.rejectedByReason).reduce((a, b) => a + b, 0)).toBe(s.rowsRejected);
  expect(r.rows.length).toBe(s.rowsPassed);
  expect(s.complete).toBe(true);
  for (let i = 1; i < r.lines.length; i++) expect(r.lines[i]!).toBeGreaterThan(r.lines[i - 1]!);
}

const SEED_CSV = 't,v,name\n2024-01-01,1,"a, b"\n2024-01-02,"2","say ""hi"""\n2024-01-03,3,café\n';
// Bytes a CSV reader must survive: delimiters, quotes, line ends, NUL, a BOM, Latin-1 and UTF-8 pieces.
const HOSTILE_BYTES = [0x2c, 0x3b, 0x09, 0x22, 0x0a, 0x0d, 0x00, 0xef, 0xbb, 0xbf, 0xe9, 0xc3, 0xa9, 0x80, 0xff, 0x20, 0x61];

/** A seed CSV with random bytes inserted, overwritten or deleted. */
const mutatedCsv = fc.array(
  fc.tuple(fc.constantFrom('insert', 'replace', 'delete'), fc.nat(), fc.constantFrom(...HOSTILE_BYTES)),
  { maxLength: 12 },
).map((edits) => {
  const bytes = [...Buffer.from(SEED_CSV)];
  for (const [op, pos, byte] of edits) {
    const i = pos % (bytes.length + 1);
    if (op === 'insert') bytes.splice(i, 0, byte);
    else if (op === 'replace' && i < bytes.length) bytes[i] = byte;
    else if (op === 'delete') bytes.splice(i, 1);
  }
  return Buffer.from(bytes);
});

describe('openTable on hostile bytes', () => {
  it('throws only QuernError, and otherwise passes or rejects every row with the summary adding up', async () => {
    await fc.assert(fc.asyncProperty(mutatedCsv, fc.array(fc.nat(), { maxLength: 6 }), fc.constantFrom<TableEngine>('fast', 'reference'),
      async (buf, cuts, engine) => {
        count('mutated bytes');
        try {
          const r = await readChunks(cut(buf, cuts), engine);
          expectAddsUp(r.summary, r);
          for (const d of r.summary.examples) expect(d.line).toBeGreaterThanOrEqual(1);
        } catch (e) {
          if (!isQuernError(e)) throw e;
          expect(['E_HEADER', 'E_FILE']).toContain(e.code);
        }
      }), { numRuns: fuzzRuns(300) });
  }, FUZZ_TIMEOUT);

  // The csv-parse reference engine once followed csv-parse's own recovery after a quote error, counting one
  // physical record as two rejected rows and swallowing the next, valid row; it now skips the broken record
  // to its line end (RFC 4180 §2.5–2.7 records), as the fast engine does. The CI seed (test/setup.ts) is
  // the seed that found the bug; a long run with QUERN_FUZZ_SEED explores others.
  it('the fast tokenizer and the csv-parse reference agree on rows and rejections', async () => {
    await fc.assert(fc.asyncProperty(mutatedCsv, async (buf) => {
      count('fast = reference');
      const ref = await outcome(buf, 'reference');
      // The fast engine with its WebAssembly kernel (the default) and with its JavaScript loop alone.
      expect(await outcome(buf, 'fast')).toEqual(ref);
      expect(await outcome(buf, 'fast', false)).toEqual(ref);
    }), { numRuns: fuzzRuns(300) });
  }, FUZZ_TIMEOUT);

  it.each([
    // [bytes, what the fast engine (and RFC 4180 §2.5) gives: rows read, passed lines, rejected]
    [Buffer.concat([Buffer.from('t,v,me\n2024-01-01,1,"a, b"'), Buffer.from([0x80]), Buffer.from('\n2024-01-02,"2","say ""hi"""\n2024-01-03,3,x\n')])],
    [Buffer.concat([Buffer.from('t,v,me\n2024-01-01,1,'), Buffer.from([0xff]), Buffer.from('"a, b"\n2024-01-02,"2","say ""hi"""\n2024-01-03,3,x\n')])],
    // NUL after a closing quote: csv-parse 7 lets it pass (it tests the next byte for truthiness); RFC 4180 §2.7 does not.
    [Buffer.concat([Buffer.from('t,v,me\n2024-01-01,1,"a, b"'), Buffer.from([0x00]), Buffer.from('\n2024-01-02,"2","say ""hi"""\n2024-01-03,3,x\n')])],
  ])('openTable(engine reference) rejects only line 2 of a file with a quote error there, as the fast engine does (%#)', async (buf) => {
    const want = { rows: [['2024-01-02', '2', 'say "hi"'], ['2024-01-03', '3', 'x']], lines: [3, 4], read: 3, rejected: { 'bad-quote': 1 } };
    expect(await outcome(buf, 'fast')).toEqual(want);
    expect(await outcome(buf, 'reference')).toEqual(want);
  });
  // Found by the long run (npm run fuzz, seed -1985200229): NUL after a closing quote, then a quoted field
  // left open up to the line end. The fast engine skips the broken record to its line break (RFC 4180
  // §2.5–2.7 records) and reads line 3; the reference engine used to swallow line 3 without counting it when
  // the broken record was found only at the end of the input. Both must read line 3.
  it('openTable(engine reference) reads line 3 after a bad quote whose record leaves a quote open, as the fast engine does', async () => {
    const buf = Buffer.concat([Buffer.from('t,v,name\n2024-01-01,1,"a, b"'), Buffer.from([0x00]), Buffer.from('2024-01-02,"2","say ""hi""\n2024-01-03,3,café\n')]);
    const want = { rows: [['2024-01-03', '3', 'café']], lines: [3], read: 2, rejected: { 'bad-quote': 1 } };
    expect(await outcome(buf, 'fast')).toEqual(want);
    expect(await outcome(buf, 'reference')).toEqual(want);
  });
  // Found by the next long run with the same seed, once the case above was fixed: the NUL breaks line 2 at
  // once, so line 2 ends at its own line feed even though a quote opens after the NUL; line 3 (`2","say…`)
  // has a quote inside an unquoted field and is rejected on its own (RFC 4180 §2.5–2.7, the documented rule).
  it('openTable(engine reference) ends a record broken by NUL at its own line end, as the fast engine does', async () => {
    const buf = Buffer.concat([Buffer.from('t,v,name\n2024-01-01,1,"a, b"'), Buffer.from([0x00]), Buffer.from('2024-01-02,"\n2","say ""hi"""\n2024-01-03,3,café\n')]);
    const want = { rows: [['2024-01-03', '3', 'café']], lines: [4], read: 3, rejected: { 'bad-quote': 2 } };
    expect(await outcome(buf, 'fast')).toEqual(want);
    expect(await outcome(buf, 'reference')).toEqual(want);
  });
});

// Field text drawn from characters that need quoting (RFC 4180 §2.6) and ones that do not.
const field = fc.array(fc.constantFrom('a', 'Z', '1', ' ', ',', '"', '\n', '\r', 'é', '€', '\u0000'), { maxLength: 6 }).map((cs) => cs.join(''));

/** RFC 4180 §2.6–2.7 encoding, written here independently of quern: quote when needed, double quotes. */
function encode(value: string): string {
  return value === '' || /[,"\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}

describe('openTable on tables written by RFC 4180 rules', () => {
  it('gives back exactly the fields written, whatever the line ends and chunk boundaries', async () => {
    const table = fc.integer({ min: 1, max: 4 }).chain((width) =>
      fc.record({
        width: fc.constant(width),
        rows: fc.array(fc.array(field, { minLength: width, maxLength: width }), { maxLength: 8 }),
        eol: fc.constantFrom('\n', '\r\n', '\r'),
        finalEol: fc.boolean(),
      }));
    await fc.assert(fc.asyncProperty(table, fc.array(fc.nat(), { maxLength: 6 }), fc.constantFrom<TableEngine>('fast', 'reference'),
      async ({ width, rows, eol, finalEol }, cuts, engine) => {
        count('RFC 4180 round trip');
        const header = Array.from({ length: width }, (_, i) => `h${i}`);
        const text = [header, ...rows].map((r) => r.map(encode).join(',')).join(eol) + (finalEol ? eol : '');
        const r = await readChunks(cut(Buffer.from(text), cuts), engine, ',');
        expect(r.header).toEqual(header);
        expect(r.rows).toEqual(rows);
        expect(r.summary.rowsRejected).toBe(0);
        expectAddsUp(r.summary, r);
      }), { numRuns: fuzzRuns(300) });
  }, FUZZ_TIMEOUT);

  it('rejects exactly the rows whose field count differs from the header, naming their lines', async () => {
    const plain = fc.array(fc.constantFrom('a', '1', ' ', 'é'), { minLength: 1, maxLength: 4 }).map((cs) => cs.join(''));
    const rows = fc.array(fc.array(plain, { minLength: 1, maxLength: 4 }), { maxLength: 10 });
    await fc.assert(fc.asyncProperty(rows, async (body) => {
      count('ragged rows');
      const text = ['a,b', ...body.map((r) => r.join(','))].join('\n') + '\n';
      const r = await readChunks([Buffer.from(text)], 'fast', ',');
      const bad = body.map((row, i) => [row.length, i + 2] as const).filter(([n]) => n !== 2).map(([, line]) => line);
      expect(r.summary.rowsRead).toBe(body.length);
      expect(r.summary.rowsRejected).toBe(bad.length);
      expect(r.summary.examples.map((d) => d.line)).toEqual(bad.slice(0, 5));
      expect(r.rows).toEqual(body.filter((row) => row.length === 2));
    }), { numRuns: fuzzRuns(300) });
  }, FUZZ_TIMEOUT);
});
