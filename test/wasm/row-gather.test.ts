// The WebAssembly row copier (src/bins/row-gather.wat) against the text it is built from and against a
// plain JavaScript model (each row's bytes, then its suffix), on random rows, suffixes and offsets.
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ROW_GATHER_WASM } from '../../src/bins/row-gather-wasm.js';
import { RowGather, type GatherTarget } from '../../src/bins/row-gather.js';
// @ts-expect-error a plain JavaScript helper shared with the build script
import { compileWat } from './compile.mjs';

/** A growable byte target shaped like CsvByteWriter. */
function target(prefix: Uint8Array): GatherTarget & { result(): Buffer } {
  let buf = Buffer.alloc(64);
  const t = {
    length: 0,
    get bytes() { return buf; },
    reserve(n: number) {
      if (t.length + n > buf.length) { const b = Buffer.alloc(2 * (t.length + n)); buf.copy(b, 0, 0, t.length); buf = b; }
      return buf;
    },
    result: () => Buffer.from(buf.subarray(0, t.length)),
  };
  t.reserve(prefix.length).set(prefix, 0);
  t.length = prefix.length;
  return t;
}

describe('row-gather.wat', () => {
  it('is the module row-gather-wasm.ts holds (run `npm run wasm` after editing the .wat)', async () => {
    const wat = readFileSync(new URL('../../src/bins/row-gather.wat', import.meta.url), 'utf8');
    const bytes: Uint8Array = await compileWat(wat, 'row-gather.wat');
    expect(Buffer.from(bytes).toString('base64')).toBe(ROW_GATHER_WASM);
  });

  it('appends each row of the range and then its suffix (the last suffix for a negative index), as the model does', () => {
    const row = fc.uint8Array({ maxLength: 70 });
    fc.assert(
      fc.property(
        fc.array(row, { minLength: 1, maxLength: 200, size: 'max' }),
        fc.array(fc.uint8Array({ maxLength: 40 }), { minLength: 1, maxLength: 9 }),
        fc.uint8Array({ maxLength: 30 }),
        fc.nat(1000),
        fc.nat(),
        (rows, suffixes, prefix, lead, pickSeed) => {
          // Rows laid out in one buffer after `lead` bytes, one separator byte between them (as line ends are).
          const parts = [Buffer.alloc(lead, 0x7e)];
          const firsts: number[] = [], lasts: number[] = [];
          let at = lead;
          for (const r of rows) {
            firsts.push(at); lasts.push(at + r.length);
            parts.push(Buffer.from(r), Buffer.from([0x0a]));
            at += r.length + 1;
          }
          const buf = Buffer.concat(parts);
          const ks = Int32Array.from(rows, (_, i) => ((pickSeed + i * 7) % (suffixes.length + 1)) - 1);
          const from = pickSeed % rows.length;
          const to = from + ((pickSeed >> 3) % (rows.length - from)) + 1;
          const gather = RowGather.make(suffixes)!;
          const out = target(prefix);
          expect(gather.copy(buf, Int32Array.from(firsts), Int32Array.from(lasts), ks, from, to, out)).toBe(true);
          const model: Buffer[] = [Buffer.from(prefix)];
          for (let i = from; i < to; i++) model.push(Buffer.from(rows[i]!), Buffer.from(suffixes[ks[i]! < 0 ? suffixes.length - 1 : ks[i]!]!));
          expect(out.result().equals(Buffer.concat(model))).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('grows its memory for a range larger than it holds, and is reused after', () => {
    const gather = RowGather.make([Buffer.from(',x,0\n'), Buffer.from(',,\n')])!;
    for (const size of [3_000_000, 100]) {
      const rows = Math.floor(size / 30);
      const buf = Buffer.alloc(rows * 30, 0x61);
      const firsts = Int32Array.from({ length: rows }, (_, i) => i * 30);
      const lasts = Int32Array.from({ length: rows }, (_, i) => i * 30 + 29);
      const ks = new Int32Array(rows);
      const out = target(new Uint8Array(0));
      expect(gather.copy(buf, firsts, lasts, ks, 0, rows, out)).toBe(true);
      expect(out.length).toBe(rows * (29 + 5));
      expect(out.result().subarray(-34).toString('latin1')).toBe('a'.repeat(29) + ',x,0\n');
    }
  });

  it('formulaRows flags exactly the rows with a field starting with = + - @ or TAB, as the model does', () => {
    // The OWASP CSV Injection first bytes (= + - @ TAB; CR and LF cannot start an unquoted field). Fields are
    // drawn from bytes that make the sweep's edge cases: formula bytes inside fields, commas (empty fields),
    // rows of every length around the 16-byte steps, junk between rows (rejected rows: no row's bytes).
    const alphabet = [0x3d, 0x2b, 0x2d, 0x40, 0x09, 0x61, 0x31, 0x2e, 0x20];
    const field = fc.array(fc.constantFrom(...alphabet), { maxLength: 9 });
    const rowArb = fc.array(field, { minLength: 1, maxLength: 5 });
    const junk = fc.array(fc.constantFrom(0x2c, 0x3d, 0x2d, 0x0a, 0x0d, 0x61), { maxLength: 6 });
    fc.assert(
      fc.property(
        fc.array(fc.record({ fields: rowArb, crlf: fc.boolean(), junk }), { minLength: 1, maxLength: 120, size: 'max' }),
        fc.nat(40),
        fc.nat(),
        (rows, lead, pickSeed) => {
          const bytes: number[] = Array.from({ length: lead }, () => 0x2c);
          const firsts: number[] = [], lasts: number[] = [], model: number[] = [];
          for (const r of rows) {
            firsts.push(bytes.length);
            r.fields.forEach((f, c) => { if (c > 0) bytes.push(0x2c); bytes.push(...f); });
            lasts.push(bytes.length);
            model.push(r.fields.some((f) => f.length > 0 && [0x3d, 0x2b, 0x2d, 0x40, 0x09].includes(f[0]!)) ? 1 : 0);
            bytes.push(...(r.crlf ? [0x0d, 0x0a] : [0x0a]));
            // Junk after a line end is a rejected row; it ends with a line end of its own.
            if (r.junk.length > 0) bytes.push(...r.junk, 0x0a);
          }
          const buf = Buffer.from(bytes);
          const from = pickSeed % rows.length;
          const to = from + ((pickSeed >> 3) % (rows.length - from)) + 1;
          const gather = RowGather.make([Buffer.from(',,\n')])!;
          expect(gather.load(buf, Int32Array.from(firsts), Int32Array.from(lasts), from, to)).toBe(true);
          const flags = new Uint8Array(to - from);
          const count = gather.formulaRows(flags);
          expect([...flags]).toEqual(model.slice(from, to));
          expect(count).toBe(model.slice(from, to).reduce((a, b) => a + b, 0));
        },
      ),
      { numRuns: 500 },
    );
  });

  it('copyLoaded copies a part of the loaded rows, as copy does', () => {
    const rows = ['a,b', '=1,c', 'dd,ee,ff', 'x'];
    const buf = Buffer.from(rows.join('\n') + '\n');
    const firsts: number[] = [], lasts: number[] = [];
    let at = 0;
    for (const r of rows) { firsts.push(at); lasts.push(at + r.length); at += r.length + 1; }
    const gather = RowGather.make([Buffer.from(',L,0\n'), Buffer.from(',,\n')])!;
    const ks = Int32Array.from([0, 0, -1, 0]);
    expect(gather.load(buf, Int32Array.from(firsts), Int32Array.from(lasts), 0, 4)).toBe(true);
    const out = target(new Uint8Array(0));
    expect(gather.copyLoaded(ks, 2, 4, out)).toBe(true);
    expect(out.result().toString('latin1')).toBe('dd,ee,ff,,\nx,L,0\n');
  });
});
