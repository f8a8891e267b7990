// The WebAssembly record kernel (src/table/structurals.wat) against the text it is built from and against a
// plain JavaScript model of RFC 4180 records (§2.1 line ends CRLF; a lone LF or CR also ends a record, common
// practice) whose quoted fields (§2.5) hold no quote and no line break (the kernel stops at any other
// quote, §2.7, and leaves the record to the scanner), on random bytes cut into random spans.
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { STRUCTURALS_WASM } from '../../src/table/structurals-wasm.js';
import { KernelStop, RECORD_SPAN, recordKernel, wantedMask } from '../../src/table/structurals.js';
// @ts-expect-error a plain JavaScript helper shared with the build script
import { compileStructurals } from './compile.mjs';

const LF = 10;
const CR = 13;
const COMMA = 44;
const QUOTE = 34;

interface Found {
  records: Array<{ end: number; fields: number; bounds: number[] }>;
  status: number;
}

/**
 * The model: records of buf[pos, regionEnd) in the order RFC 4180 reads them, as the kernel should report;
 * with `quotes` false, as the quote-free walk reads them (a quote is text).
 */
function model(buf: Uint8Array, pos: number, regionEnd: number, wanted: number[], stop: number, delimiter = COMMA, quotes = true): Found {
  const records: Found['records'] = [];
  let field = pos;
  let f = 0;
  let bounds: number[] = [];
  let skip = -1;
  // 0 outside quotes, 1 inside a quoted field, 2 just after its closing quote.
  let inQuotes = 0;
  for (let i = pos; i < regionEnd; i++) {
    const c = buf[i]!;
    if ((c !== delimiter && c !== LF && c !== CR && (c !== QUOTE || !quotes)) || i === skip) continue;
    if (c === QUOTE) {
      if (inQuotes === 1) {
        // Closing when a delimiter or a line break follows (§2.5); a doubled quote (§2.7) or text after it
        // is the scanner's.
        if (i + 1 >= buf.length) return { records, status: KernelStop.UndecidedAtEnd };
        const next = buf[i + 1]!;
        if (next !== delimiter && next !== LF && next !== CR) return { records, status: KernelStop.Quote };
        inQuotes = 2;
        continue;
      }
      if (inQuotes === 0 && i === field) {
        inQuotes = 1;
        field = i + 1;
        continue;
      }
      return { records, status: KernelStop.Quote };
    }
    if (inQuotes === 1) {
      if (c === delimiter) continue; // text (§2.6)
      return { records, status: KernelStop.Quote }; // a line break inside quotes (§2.6): the scanner's
    }
    if (wanted.includes(f)) bounds.push(field, inQuotes === 2 ? i - 1 : i);
    inQuotes = 0;
    f++;
    if (c === delimiter) {
      field = i + 1;
      continue;
    }
    let end = i + 1;
    if (c === CR) {
      if (i + 1 >= buf.length) return { records, status: KernelStop.UndecidedAtEnd };
      if (buf[i + 1] === LF) {
        skip = i + 1;
        end++;
      }
    }
    records.push({ end, fields: f, bounds });
    field = end;
    f = 0;
    bounds = [];
    if (end >= stop) return { records, status: KernelStop.Stop };
  }
  return { records, status: KernelStop.Spent };
}

/** The kernel driven as fast-body.ts drives it, over spans of the given lengths (cycled); `quotes` picks the walk. */
function kernel(buf: Uint8Array, pos: number, regionEnd: number, wanted: number[], stop: number, spans: number[], delimiter = COMMA, quotes = true): Found {
  const k = recordKernel()!;
  const want = wantedMask(wanted)!;
  const stride = 2 + 2 * wanted.length;
  k.state.set([pos, pos, 0, -1, 0, 0, 0]);
  const records: Found['records'] = [];
  let span = pos;
  let turn = 0;
  let status: number = KernelStop.Spent;
  while (span < regionEnd) {
    const spanEnd = Math.min(regionEnd, span + spans[turn++ % spans.length]!);
    const ahead = spanEnd < buf.length ? 1 : 0;
    k.input.set(buf.subarray(span, spanEnd + ahead));
    const n = quotes
      ? k.quotedRecords(spanEnd - span, span, want, stride, stop, ahead, delimiter)
      : k.records(spanEnd - span, span, want, stride, stop, ahead, delimiter);
    for (let r = 0; r < n; r++) {
      const o = r * stride;
      records.push({ end: k.output[o]!, fields: k.output[o + 1]!, bounds: [...k.output.subarray(o + 2, o + stride)] });
    }
    status = k.state[5]!;
    if (status !== KernelStop.Spent) break;
    span = spanEnd;
  }
  return { records, status };
}

// Only the bounds of records with every wanted field are defined (the kernel leaves the rest stale).
const defined = (f: Found, wanted: number[]): Found => ({
  status: f.status,
  records: f.records.map((r) => ({ ...r, bounds: r.fields > Math.max(-1, ...wanted) ? r.bounds.slice(0, 2 * wanted.length) : [] })),
});

describe('the WebAssembly record kernel', () => {
  it('is the compiled form of structurals.wat (wabt, the WebAssembly Binary Toolkit, as the assembler)', async () => {
    const wat = readFileSync(new URL('../../src/table/structurals.wat', import.meta.url), 'utf8');
    const bytes = (await compileStructurals(wat)) as Uint8Array;
    expect(Buffer.from(bytes).toString('base64')).toBe(STRUCTURALS_WASM);
  });

  it('runs on this Node (WebAssembly SIMD, part of the WebAssembly 2.0 core specification)', () => {
    expect(recordKernel()).not.toBeNull();
  });

  it.each([['quote-free walk', false], ['walk with quotes', true]])('%s: reads "a,b\\r\\nc,d\\n" as two records of two fields, the CRLF as one line end', (_walk, quotes) => {
    const buf = Buffer.from('a,b\r\nc,d\n');
    const got = kernel(buf, 0, buf.length, [0, 1], 0x7fffffff, [RECORD_SPAN], COMMA, quotes);
    expect(got).toEqual({ status: KernelStop.Spent, records: [{ end: 5, fields: 2, bounds: [0, 1, 2, 3] }, { end: 9, fields: 2, bounds: [5, 6, 7, 8] }] });
  });

  it.each([['quote-free walk', false], ['walk with quotes', true]])('%s: stops at a CR that ends the buffer, which may be half a CRLF', (_walk, quotes) => {
    const buf = Buffer.from('a,b\nc,d\r');
    const got = kernel(buf, 0, buf.length, [1], 0x7fffffff, [RECORD_SPAN], COMMA, quotes);
    expect(got).toEqual({ status: KernelStop.UndecidedAtEnd, records: [{ end: 4, fields: 2, bounds: [2, 3] }] });
  });

  it('reads a quoted field holding a delimiter as one field, its bounds inside the quotes (RFC 4180 §2.5-2.6)', () => {
    const buf = Buffer.from('"a,b",c\n"",x\n');
    const got = kernel(buf, 0, buf.length, [0, 1], 0x7fffffff, [RECORD_SPAN]);
    expect(got).toEqual({ status: KernelStop.Spent, records: [{ end: 8, fields: 2, bounds: [1, 4, 6, 7] }, { end: 13, fields: 2, bounds: [9, 9, 11, 12] }] });
  });

  it('finds the closing quote across spans, from the byte after the span', () => {
    const buf = Buffer.from('x,"abc"\ny,"d"\r\n');
    // Spans of 7 bytes end at the closing quote of "abc": the byte after it (LF) is read ahead.
    const got = kernel(buf, 0, buf.length, [1], 0x7fffffff, [7, 3]);
    expect(got).toEqual({ status: KernelStop.Spent, records: [{ end: 8, fields: 2, bounds: [3, 6] }, { end: 15, fields: 2, bounds: [11, 12] }] });
  });

  it.each([
    ['a doubled quote (§2.7)', 'a,b\n"x""y",z\n'],
    ['a line break inside quotes (§2.6)', 'a,b\nz,"x\ny"\n'],
    ['a quote inside an unquoted field', 'a,b\nx"y,z\n'],
    ['text after a closing quote', 'a,b\n"x"y,z\n'],
  ])('leaves the record holding %s to the scanner, after the records before it', (_what, text) => {
    const buf = Buffer.from(text);
    const got = kernel(buf, 0, buf.length, [0], 0x7fffffff, [RECORD_SPAN]);
    expect(got).toEqual({ status: KernelStop.Quote, records: [{ end: 4, fields: 2, bounds: [0, 1] }] });
  });

  it('cannot tell a quote inside quotes that ends the buffer: closing, or the first of two', () => {
    const buf = Buffer.from('a,"b"');
    expect(kernel(buf, 0, buf.length, [1], 0x7fffffff, [RECORD_SPAN]).status).toBe(KernelStop.UndecidedAtEnd);
  });

  it.each([['quote-free walk', false], ['walk with quotes', true]])('%s: keeps the wanted bounds of a record that runs on past the end of a call', (_walk, quotes) => {
    // The first call (5 bytes) ends one record and starts the next, whose field 0 it finds.
    const buf = Buffer.from('a,b\nc,d,e\n');
    const got = kernel(buf, 0, buf.length, [0, 1, 2], 0x7fffffff, [6, 100], COMMA, quotes);
    expect(got.records[1]).toEqual({ end: 10, fields: 3, bounds: [4, 5, 6, 7, 8, 9] });
  });

  const bytes = fc.uint8Array({ maxLength: 300, size: 'max' }).chain((raw) =>
    // Half the bytes drawn from CSV's own (commas most), so records have several fields.
    fc.array(fc.constantFrom(COMMA, COMMA, COMMA, 9, 9, 59, 124, LF, CR, 0x61, QUOTE, QUOTE, 0xff, 0x00, 0x20), { minLength: raw.length, maxLength: raw.length })
      .map((pick) => Uint8Array.from(raw, (b, i) => (b % 2 === 0 ? pick[i]! : b))));

  it.each([['quote-free walk', false], ['walk with quotes', true]])('%s: finds the records the model finds, for any bytes, delimiter, spans, wanted fields, region and stop', (_walk, quotes) => {
    fc.assert(
      fc.property(
        bytes,
        fc.oneof(fc.uniqueArray(fc.nat(3), { minLength: 1, maxLength: 3 }), fc.uniqueArray(fc.nat(31), { maxLength: 8 })).map((w) => w.sort((a, b) => a - b)),
        fc.array(fc.integer({ min: 1, max: 70 }), { minLength: 1, maxLength: 5 }),
        fc.nat(), fc.nat(), fc.option(fc.nat(), { nil: undefined }),
        // The delimiters the sniffer knows: comma, tab, semicolon, pipe.
        fc.constantFrom(COMMA, 9, 59, 124),
        (buf, wanted, spans, a, b, stopAt, delimiter) => {
          const pos = buf.length === 0 ? 0 : a % (buf.length + 1);
          const regionEnd = pos + (buf.length - pos === 0 ? 0 : b % (buf.length - pos + 1));
          const stop = stopAt === undefined ? 0x7fffffff : pos + (stopAt % (buf.length + 2));
          const want = defined(model(buf, pos, regionEnd, wanted, stop, delimiter, quotes), wanted);
          expect(defined(kernel(buf, pos, regionEnd, wanted, stop, spans, delimiter, quotes), wanted)).toEqual(want);
        },
      ),
      { numRuns: 3000 },
    );
  });

  // CSV-like text in tokens: plain and quoted fields (with a delimiter inside, empty), and now and then
  // what the kernel leaves to the scanner (a doubled quote, a line break inside quotes, stray quotes).
  const tokens = fc.array(
    fc.constantFrom('a', 'bc', ',', ',', ',', '\n', '\r\n', '\r', '"x,y"', '"z"', '""', '"q"', '"a""b"', '"l\nm"', 'k"', '"p"r', '"'),
    { maxLength: 80 },
  ).map((t) => Buffer.from(t.join('')));

  it('finds the records the model finds in CSV-like text with quoted fields, for any spans, wanted fields and region', () => {
    fc.assert(
      fc.property(
        tokens,
        fc.uniqueArray(fc.nat(4), { minLength: 1, maxLength: 4 }).map((w) => w.sort((a, b) => a - b)),
        fc.array(fc.integer({ min: 1, max: 40 }), { minLength: 1, maxLength: 5 }),
        fc.nat(), fc.nat(),
        (buf, wanted, spans, a, b) => {
          const pos = buf.length === 0 ? 0 : a % (buf.length + 1);
          const regionEnd = pos + (buf.length - pos === 0 ? 0 : b % (buf.length - pos + 1));
          const want = defined(model(buf, pos, regionEnd, wanted, 0x7fffffff), wanted);
          expect(defined(kernel(buf, pos, regionEnd, wanted, 0x7fffffff, spans), wanted)).toEqual(want);
        },
      ),
      { numRuns: 3000 },
    );
  });

  it.each([['quote-free walk', false], ['walk with quotes', true]])('%s: finds the records of whole spans of 64 KiB as of short ones', (_walk, quotes) => {
    let s = 99;
    const rnd = (): number => ((s = (s * 1103515245 + 12345) >>> 0) / 2 ** 32);
    const alphabet = [COMMA, LF, CR, 0x61, 0x62, 0x31, 0x20];
    // Quoted fields the kernel reads: a delimiter inside, or none (§2.5-2.6).
    const quoted = [QUOTE, 0x61, COMMA, 0x62, QUOTE];
    const bytes: number[] = [];
    while (bytes.length < 150_000) {
      if (rnd() < 0.1 && (bytes.length === 0 || [COMMA, LF, CR].includes(bytes[bytes.length - 1]!))) bytes.push(...quoted, COMMA);
      else bytes.push(alphabet[Math.floor(rnd() * alphabet.length)]!);
    }
    const buf = Uint8Array.from(bytes);
    const wanted = [0, 2, 3];
    const whole = defined(kernel(buf, 0, buf.length, wanted, 0x7fffffff, [RECORD_SPAN], COMMA, quotes), wanted);
    expect(whole.records.length).toBeGreaterThan(30_000);
    expect(JSON.stringify(whole)).toBe(JSON.stringify(defined(kernel(buf, 0, buf.length, wanted, 0x7fffffff, [1000, 17], COMMA, quotes), wanted)));
    expect(JSON.stringify(whole)).toBe(JSON.stringify(defined(model(buf, 0, buf.length, wanted, 0x7fffffff, COMMA, quotes), wanted)));
  });

  it('finds the first record whose field count is not the header\'s, from any record on (firstOther)', () => {
    const k = recordKernel()!;
    // Model: the first r in [from, n) with output[r * stride + 1] !== width, else n.
    fc.assert(fc.property(
      fc.integer({ min: 2, max: 18 }), fc.array(fc.integer({ min: 1, max: 6 }), { maxLength: 300 }), fc.integer({ min: 1, max: 6 }), fc.nat(),
      (stride, counts, width, start) => {
        for (let r = 0; r < counts.length; r++) {
          k.output[r * stride] = 1000 + r; // record end
          k.output[r * stride + 1] = counts[r]!;
        }
        const from = counts.length === 0 ? 0 : start % (counts.length + 1);
        let expected = from;
        while (expected < counts.length && counts[expected] === width) expected++;
        expect(k.firstOther(from, counts.length, stride, width)).toBe(expected);
      },
    ), { numRuns: 500 });
  });

  it('takes at most 8 wanted fields, numbered below 32', () => {
    expect(wantedMask([0, 31])).toBe((1 | (1 << 31)) | 0);
    expect(wantedMask([32])).toBeNull();
    expect(wantedMask([0, 1, 2, 3, 4, 5, 6, 7, 8])).toBeNull();
  });
});
