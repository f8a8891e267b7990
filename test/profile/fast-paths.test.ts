// The profile's allocation-free paths must give what the general code gives: the plain-decimal scan of
// NumericEvidence the same numbers as ECMA-262 StringToNumber (`Number(text)`, the oracle), and the string
// table of DistinctCounter the same distinct values and rows as a JavaScript Map.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { makeNumberParser } from '../../src/numbers/parse.js';
import { DistinctCounter, packShortHi, packShortLo } from '../../src/profile/distinct.js';
import { NumericEvidence } from '../../src/profile/numeric.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 200);

describe('NumericEvidence.add()', () => {
  it.each([
    // Values Number() reads exactly as written (ECMA-262 StringToNumber); 0.1 + 0.2 style decimals included.
    ['0.1', 0.1], ['123.456', 123.456], ['-0', 0], ['-2.50', -2.5], ['.5', 0.5], ['5.', 5], ['007', 7],
    ['999999999999999', 999999999999999], ['1234567890.12345', 1234567890.12345], ['+4', 4],
  ])('reads %s as %d, as Number() does', (text, want) => {
    const n = new NumericEvidence(makeNumberParser());
    expect(n.add(text)).toBe(true);
    expect(Object.is(n.s.min, want)).toBe(true);
  });

  it('gives the same summary as Number() over random plain decimals (digits, signs, leading zeros)', () => {
    const decimal = fc.tuple(fc.constantFrom('', '-', '+'), fc.stringMatching(/^[0-9]{1,9}$/), fc.option(fc.stringMatching(/^[0-9]{0,8}$/)))
      .map(([sign, int, frac]) => `${sign}${int}${frac === null ? '' : `.${frac}`}`);
    fc.assert(fc.property(fc.array(decimal, { minLength: 1, maxLength: 50 }), (texts) => {
      const n = new NumericEvidence(makeNumberParser());
      for (const t of texts) n.add(t);
      const xs = texts.map((t) => Number(t) || 0);
      expect(n.s.numbers).toBe(texts.length);
      expect(n.s.min).toBe(Math.min(...xs));
      expect(n.s.max).toBe(Math.max(...xs));
      expect(n.s.integers).toBe(xs.filter((x) => Number.isInteger(x)).length);
      expect(n.s.negatives).toBe(xs.filter((x) => x < 0).length);
      expect(n.s.digitOnly).toBe(texts.filter((t) => /^[0-9]+$/.test(t)).length);
      expect(n.s.zeroPadded).toBe(texts.filter((t) => /^0[0-9]+$/.test(t)).length);
      const decimals = texts.map((t) => (/^[+-]?[0-9]*\.([0-9]*)$/.exec(t)?.[1]?.length ?? 0));
      expect(n.s.maxDecimals).toBe(Math.max(0, ...decimals));
    }), { numRuns: RUNS });
  });

  it('leaves a decimal-comma column to its parser: 1.5 is not a number there, 1,5 is', () => {
    const n = new NumericEvidence(makeNumberParser({ decimal: ',', group: null }));
    expect(n.add('1.5')).toBe(false);
    expect(n.add('1,5')).toBe(true);
    expect(n.s.min).toBe(1.5);
  });
});

describe('DistinctCounter.add()', () => {
  it('keeps the distinct values and rows a Map keeps, in order of first appearance', () => {
    fc.assert(fc.property(fc.array(fc.string({ maxLength: 4 }), { maxLength: 400 }), (values) => {
      const d = new DistinctCounter(1_000);
      const m = new Map<string, number>();
      for (const v of values) {
        d.add(v);
        m.set(v, (m.get(v) ?? 0) + 1);
      }
      expect([...d.counts]).toEqual([...m]);
      expect(d.count()).toBe(m.size);
    }), { numRuns: RUNS });
  });

  it('at its cap still counts values it holds, and starts estimating at the first new one', () => {
    const d = new DistinctCounter(3);
    for (const v of ['a', 'b', 'c', 'a', 'a']) d.add(v);
    expect(d.exact).toBe(true);
    expect(d.counts.get('a')).toBe(3);
    d.add('z');
    expect(d.exact).toBe(false);
    expect(d.counts.has('z')).toBe(false);
  });
});

describe('packShortLo and packShortHi', () => {
  // The key of a short value must be the value exactly: two values of at most six bytes share a key only
  // when their bytes are equal (a JavaScript string comparison is the oracle), whatever bytes follow them in
  // the buffer and wherever the buffer ends.
  const value = fc.uint8Array({ maxLength: 6 });
  it('give equal keys to equal values and different keys to different ones, whatever follows them', () => {
    fc.assert(
      fc.property(value, value, fc.uint8Array({ maxLength: 8 }), fc.uint8Array({ maxLength: 8 }), (a, b, tailA, tailB) => {
        const ba = Buffer.concat([a, tailA]);
        const bb = Buffer.concat([Buffer.from([7, 7]), b, tailB]);
        const ka = [packShortLo(ba, 0, a.length), packShortHi(ba, 0, a.length)];
        const kb = [packShortLo(bb, 2, b.length), packShortHi(bb, 2, b.length)];
        const same = Buffer.from(a).equals(Buffer.from(b));
        expect(ka[0] === kb[0] && ka[1] === kb[1]).toBe(same);
      }),
      { numRuns: RUNS * 5 },
    );
  });

  it('give the same key at the end of a buffer (the byte-by-byte fallback) as inside one', () => {
    fc.assert(
      fc.property(value, fc.uint8Array({ minLength: 6, maxLength: 8 }), (v, tail) => {
        const atEnd = Buffer.from(v);
        const inside = Buffer.concat([v, tail]);
        expect([packShortLo(atEnd, 0, v.length), packShortHi(atEnd, 0, v.length)]).toEqual([packShortLo(inside, 0, v.length), packShortHi(inside, 0, v.length)]);
      }),
      { numRuns: RUNS * 5 },
    );
  });
});
