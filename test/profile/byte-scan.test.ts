// The byte-level pieces of the profile's hot loop held to their string twins (differential, property-based):
// hashBytes to hashString, scanField to the plain-decimal scan of NumericEvidence.add and to ECMA-262
// StringToNumber (`Number(text)`, the oracle for the value), StringTable.addBytes to a JavaScript Map, and
// DistinctCounter.addBytes/addHashed to DistinctCounter.add.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { makeNumberParser } from '../../src/numbers/parse.js';
import { emptyFieldScan, scanField } from '../../src/profile/byte-scan.js';
import { DistinctCounter } from '../../src/profile/distinct.js';
import { hashBytes, hashString } from '../../src/profile/hll.js';
import { NumericEvidence } from '../../src/profile/numeric.js';
import { StringTable } from '../../src/profile/string-table.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 200);

/** ASCII text, numbers and near-numbers: the shapes a CSV field takes. */
const asciiText = fc.oneof(
  fc.string({ unit: fc.constantFrom(...'0123456789+-.eE ,\t"ax'), maxLength: 20 }),
  fc.stringMatching(/^[+-]?[0-9]{0,17}(\.[0-9]{0,6})?$/),
  fc.string({ unit: 'binary-ascii', maxLength: 12 }),
);

const bytesOf = (s: string): Buffer => Buffer.from(s, 'latin1');

describe('hashBytes(buf, start, end)', () => {
  it('equals hashString of the same ASCII text, wherever the text sits in the buffer', () => {
    fc.assert(fc.property(asciiText, fc.string({ unit: 'binary-ascii', maxLength: 5 }), (text, pad) => {
      const buf = bytesOf(pad + text + pad);
      expect(hashBytes(buf, pad.length, pad.length + text.length)).toBe(hashString(text));
    }), { numRuns: RUNS });
  });
});

describe('scanField(buf, start, end, dotIsDecimal, out)', () => {
  it('hashes as hashString does and finds a plain decimal exactly where Number() reads the text (digits ≤ 15)', () => {
    const out = emptyFieldScan();
    fc.assert(fc.property(asciiText, fc.boolean(), (text, dot) => {
      scanField(bytesOf(text), 0, text.length, dot, out);
      expect(out.hash).toBe(hashString(text));
      const digits = text.replace(/[^0-9]/g, '').length;
      const plain = (dot ? /^[+-]?([0-9]+\.?[0-9]*|\.[0-9]+)$/ : /^[+-]?[0-9]+$/).test(text) && digits <= 15;
      expect(out.plain).toBe(plain);
      if (plain) {
        // ECMA-262 StringToNumber is the oracle for the value the digits stand for.
        const x = (out.decimals > 0 ? out.digits / 10 ** out.decimals : out.digits) * (out.negative ? -1 : 1);
        expect(x === 0 ? 0 : x).toBe(Number(text) === 0 ? 0 : Number(text));
      }
    }), { numRuns: RUNS });
  });

  it('NumericEvidence.addScanned/addPlainBytes/addOther give the summary add() gives (string path)', () => {
    fc.assert(fc.property(fc.array(asciiText, { maxLength: 60 }), (texts) => {
      const byString = new NumericEvidence(makeNumberParser());
      const byScan = new NumericEvidence(makeNumberParser());
      const byPlain = new NumericEvidence(makeNumberParser());
      const out = emptyFieldScan();
      for (const t of texts) {
        byString.add(t);
        const b = bytesOf(t);
        scanField(b, 0, b.length, byScan.dotIsDecimal, out);
        if (out.plain) byScan.addScanned(out, b, 0, b.length);
        else byScan.addOther(t);
        if (!byPlain.addPlainBytes(b, 0, b.length)) byPlain.addOther(t);
      }
      expect(byScan.s).toEqual(byString.s);
      expect(byPlain.s).toEqual(byString.s);
    }), { numRuns: RUNS });
  });
});

describe('StringTable.addBytes()', () => {
  it('keeps the keys and rows a Map keeps, in order of first appearance, mixed with add()', () => {
    fc.assert(fc.property(fc.array(fc.tuple(asciiText, fc.boolean()), { maxLength: 300 }), (rows) => {
      const t = new StringTable();
      const m = new Map<string, number>();
      for (const [text, asBytes] of rows) {
        const b = bytesOf(`#${text}`);
        if (asBytes) t.addBytes(b, 1, b.length, hashBytes(b, 1, b.length));
        else t.add(text, hashString(text));
        m.set(text, (m.get(text) ?? 0) + 1);
      }
      expect(t.keys).toEqual([...m.keys()]);
      expect([...t.rows.subarray(0, t.size)]).toEqual([...m.values()]);
    }), { numRuns: RUNS });
  });
});

describe('DistinctCounter.addBytes()', () => {
  it('gives the counts, exactness and estimate add() gives, across the cap (small cap of 50)', () => {
    fc.assert(fc.property(fc.array(fc.stringMatching(/^[a-c0-9]{0,3}$/), { maxLength: 400 }), (values) => {
      const byString = new DistinctCounter(50);
      const byBytes = new DistinctCounter(50);
      for (const v of values) {
        byString.add(v);
        byBytes.addBytes(bytesOf(v), 0, v.length);
      }
      expect([...byBytes.counts]).toEqual([...byString.counts]);
      expect(byBytes.exact).toBe(byString.exact);
      expect(byBytes.count()).toBe(byString.count());
    }), { numRuns: RUNS });
  });
});
