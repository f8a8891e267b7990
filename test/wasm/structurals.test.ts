// The WebAssembly record kernel (src/table/structurals.wat) against the text it is built from and against a
// plain JavaScript model of RFC 4180 records without quotes (§2.1 line ends CRLF; a lone LF or CR also ends
// a record, common practice), on random bytes cut into random spans.
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

interface Found {
  records: Array<{ end: number; fields: number; bounds: number[] }>;
  status: number;
}

/** The model: records of buf[pos, regionEnd) in the order RFC 4180 reads them, as the kernel should report. */
function model(buf: Uint8Array, pos: number, regionEnd: number, wanted: number[], stop: number, delimiter = COMMA): Found {
  const records: Found['records'] = [];
  let field = pos;
  let f = 0;
  let bounds: number[] = [];
  let skip = -1;
  for (let i = pos; i < regionEnd; i++) {
    const c = buf[i]!;
    if ((c !== delimiter && c !== LF && c !== CR) || i === skip) continue;
    if (wanted.includes(f)) bounds.push(field, i);
    f++;
    if (c === delimiter) {
      field = i + 1;
      continue;
    }
    let end = i + 1;
    if (c === CR) {
      if (i + 1 >= buf.length) return { records, status: KernelStop.LoneCrAtEnd };
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

/** The kernel driven as fast-body.ts drives it, over spans of the given lengths (cycled). */
function kernel(buf: Uint8Array, pos: number, regionEnd: number, wanted: number[], stop: number, spans: number[], delimiter = COMMA): Found {
  const k = recordKernel()!;
  const want = wantedMask(wanted)!;
  const stride = 2 + 2 * wanted.length;
  k.state.set([pos, pos, 0, -1, 0, 0]);
  const records: Found['records'] = [];
  let span = pos;
  let turn = 0;
  let status: number = KernelStop.Spent;
  while (span < regionEnd) {
    const spanEnd = Math.min(regionEnd, span + spans[turn++ % spans.length]!);
    const ahead = spanEnd < buf.length ? 1 : 0;
    k.input.set(buf.subarray(span, spanEnd + ahead));
    const n = k.records(spanEnd - span, span, want, stride, stop, ahead, delimiter);
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

  it('reads "a,b\\r\\nc,d\\n" as two records of two fields, the CRLF as one line end', () => {
    const buf = Buffer.from('a,b\r\nc,d\n');
    const got = kernel(buf, 0, buf.length, [0, 1], 0x7fffffff, [RECORD_SPAN]);
    expect(got).toEqual({ status: KernelStop.Spent, records: [{ end: 5, fields: 2, bounds: [0, 1, 2, 3] }, { end: 9, fields: 2, bounds: [5, 6, 7, 8] }] });
  });

  it('stops at a CR that ends the buffer, which may be half a CRLF', () => {
    const buf = Buffer.from('a,b\nc,d\r');
    const got = kernel(buf, 0, buf.length, [1], 0x7fffffff, [RECORD_SPAN]);
    expect(got).toEqual({ status: KernelStop.LoneCrAtEnd, records: [{ end: 4, fields: 2, bounds: [2, 3] }] });
  });

  it('keeps the wanted bounds of a record that runs on past the end of a call', () => {
    // The first call (5 bytes) ends one record and starts the next, whose field 0 it finds.
    const buf = Buffer.from('a,b\nc,d,e\n');
    const got = kernel(buf, 0, buf.length, [0, 1, 2], 0x7fffffff, [6, 100]);
    expect(got.records[1]).toEqual({ end: 10, fields: 3, bounds: [4, 5, 6, 7, 8, 9] });
  });

  const bytes = fc.uint8Array({ maxLength: 300, size: 'max' }).chain((raw) =>
    // Half the bytes drawn from CSV's own (commas most), so records have several fields.
    fc.array(fc.constantFrom(COMMA, COMMA, COMMA, 9, 9, 59, 124, LF, CR, 0x61, 0x22, 0xff, 0x00, 0x20), { minLength: raw.length, maxLength: raw.length })
      .map((pick) => Uint8Array.from(raw, (b, i) => (b % 2 === 0 ? pick[i]! : b))));

  it('finds the records the model finds, for any bytes, delimiter, spans, wanted fields, region and stop', () => {
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
          const want = defined(model(buf, pos, regionEnd, wanted, stop, delimiter), wanted);
          expect(defined(kernel(buf, pos, regionEnd, wanted, stop, spans, delimiter), wanted)).toEqual(want);
        },
      ),
      { numRuns: 3000 },
    );
  });

  it('finds the records of whole spans of 64 KiB as of short ones', () => {
    let s = 99;
    const rnd = (): number => ((s = (s * 1103515245 + 12345) >>> 0) / 2 ** 32);
    const alphabet = [COMMA, LF, CR, 0x61, 0x62, 0x31, 0x20];
    const buf = Uint8Array.from({ length: 150_000 }, () => alphabet[Math.floor(rnd() * alphabet.length)]!);
    const wanted = [0, 2, 3];
    const whole = defined(kernel(buf, 0, buf.length, wanted, 0x7fffffff, [RECORD_SPAN]), wanted);
    expect(whole.records.length).toBeGreaterThan(40_000);
    expect(JSON.stringify(whole)).toBe(JSON.stringify(defined(kernel(buf, 0, buf.length, wanted, 0x7fffffff, [1000, 17]), wanted)));
    expect(JSON.stringify(whole)).toBe(JSON.stringify(defined(model(buf, 0, buf.length, wanted, 0x7fffffff), wanted)));
  });

  it('takes at most 8 wanted fields, numbered below 32', () => {
    expect(wantedMask([0, 31])).toBe((1 | (1 << 31)) | 0);
    expect(wantedMask([32])).toBeNull();
    expect(wantedMask([0, 1, 2, 3, 4, 5, 6, 7, 8])).toBeNull();
  });
});
