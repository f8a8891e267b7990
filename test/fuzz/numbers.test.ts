// fast-check properties of the number parser (src/numbers): no exception escapes; a result is ok with a
// finite number, or empty/invalid with a reason and NaN; numbers written by JavaScript (ECMA-262
// Number::toString) and by Intl.NumberFormat (CLDR en-US and de-DE symbols) read back exactly.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { emptyParsedNumber, inferNumberFormat, makeNumberParser, parseNumber } from '../../src/numbers/index.js';
import { caseCounter, fuzzRuns } from './runs.js';

const count = caseCounter('numbers');
const plain = makeNumberParser();
const us = makeNumberParser({ decimal: '.', group: ',' });
const de = makeNumberParser({ decimal: ',', group: '.' });
const numberish = fc.oneof(
  fc.string({ maxLength: 20 }),
  fc.array(fc.constantFrom('0', '1', '5', '9', '.', ',', '-', '+', 'e', 'E', '%', ' ', '\u00a0', "'", 'N', 'a', 'I', 'n', 'f'), { maxLength: 16 }).map((c) => c.join('')),
);

describe('makeNumberParser on any text', () => {
  it('never throws, and status, value and reason agree', () => {
    const out = emptyParsedNumber();
    const parsers = [plain, us, de, makeNumberParser({ decimal: ',', group: ' ', percent: 'fraction' }), makeNumberParser({ group: ',', unresolved: true })];
    fc.assert(fc.property(numberish, (text) => {
      count('any text');
      for (const p of parsers) {
        const s = p.parse(text, out);
        expect(s).toBe(out.status);
        if (s === 'ok') {
          expect(Number.isFinite(out.value)).toBe(true);
          expect(out.reason).toBeNull();
        } else {
          expect(out.value).toBeNaN();
          expect(out.reason).not.toBeNull();
        }
      }
    }), { numRuns: fuzzRuns(1000) });
  });

  it('reads back any finite double as JavaScript writes it (ECMA-262 Number::toString)', () => {
    const out = emptyParsedNumber();
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
      count('double round trip');
      expect(plain.parse(String(x), out), String(x)).toBe('ok');
      expect(out.value).toBe(x === 0 ? 0 : x); // -0 reads as 0 (src/numbers/types.ts)
    }), { numRuns: fuzzRuns(1000) });
  });

  it('reads en-US and de-DE grouped numbers as Intl.NumberFormat writes them (CLDR symbols)', () => {
    const out = emptyParsedNumber();
    const fmtUs = new Intl.NumberFormat('en-US', { maximumFractionDigits: 3 });
    const fmtDe = new Intl.NumberFormat('de-DE', { maximumFractionDigits: 3 });
    fc.assert(fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.integer({ min: 0, max: 999 }), (whole, thousandths) => {
      count('Intl grouped');
      const x = whole + Math.sign(whole || 1) * thousandths / 1000;
      const u = fmtUs.format(x).replace('\u2212', '-');
      expect(us.parse(u, out), u).toBe('ok');
      expect(out.value).toBeCloseTo(x, 6);
      const d = fmtDe.format(x).replace('\u2212', '-');
      expect(de.parse(d, out), d).toBe('ok');
      expect(out.value).toBeCloseTo(x, 6);
    }), { numRuns: fuzzRuns(1000) });
  });

  it('inferNumberFormat counts every sample value once as ok, empty or invalid', () => {
    fc.assert(fc.property(fc.array(numberish, { maxLength: 15 }), (sample) => {
      count('inference');
      const r = inferNumberFormat(sample);
      expect(r.ok + r.empty + r.invalid).toBe(sample.length);
      // Parsing the sample under the decided format gives the same tally.
      const tally = { ok: 0, empty: 0, invalid: 0 };
      for (const v of sample) tally[parseNumber(v, r.format).status]++;
      expect(tally).toEqual({ ok: r.ok, empty: r.empty, invalid: r.invalid });
    }), { numRuns: fuzzRuns(500) });
  });
});
