import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { makeNumberBytesParser } from '../../src/bins/index.js';
import { emptyParsedNumber, makeNumberParser, type NumberFormat } from '../../src/numbers/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 2000);

// The formats a column can have (src/numbers/types.ts): both decimal marks, every group mark, unresolved.
const FORMATS: Array<Partial<NumberFormat>> = [
  {}, { decimal: '.', group: ',' }, { decimal: ',', group: '.' }, { decimal: ',', group: ' ' }, { decimal: '.', group: "'" },
  { decimal: '.', group: null, unresolved: true }, { decimal: '.', group: null, percent: 'fraction' }, { decimal: ',', group: null },
];

function both(text: string, format: Partial<NumberFormat>) {
  const a = emptyParsedNumber(), b = emptyParsedNumber();
  const sa = makeNumberParser(format).parse(text, a);
  const buf = Buffer.from(`x${text}y`, 'utf8'); // the field sits inside a larger buffer, as in a byte batch
  const sb = makeNumberBytesParser(format).parse(buf, 1, buf.length - 1, b);
  return { sa, sb, a, b };
}

describe('makeNumberBytesParser(format).parse(bytes) agrees with makeNumberParser(format).parse(text)', () => {
  // Values whose reading ECMA-262 Number() fixes (plain decimals), or the string parser's reasons
  // (src/numbers/types.ts): the byte parser must give the very same status, value, reason and flags.
  it.each([
    '45', '-0', '+7', '007', '408.97', '-12.5', '.5', '5.', '-.5', '0.1', '123456789012345', '1234567890123456789', '9007199254740993',
    '1e5', '1E-3', '2.5e+10', '1e400', '-1e400', '1e', '1e+', '', ' ', ' 45', '45 ', 'NA', '-', '.', 'NaN', 'Infinity', '−5', '1,234', '1.234',
    '1,5', '12%', '1 234,5', '1\u00a0234', "1'234.5", '٣', '４５', '4_5', '0x1f', '++1', '1..2', '0.30000000000000004', '179769313486231570000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000',
  ])('the value %j reads the same from bytes and text under every column format', (text) => {
    for (const f of FORMATS) {
      const { sa, sb, a, b } = both(text, f);
      expect(sb).toBe(sa);
      expect(b).toEqual(a);
    }
  });

  it('agrees on random text over digits, signs, marks, spaces and letters, under every format (differential, property)', () => {
    const ch = fc.constantFrom('0', '1', '2', '5', '9', '.', ',', '-', '+', 'e', 'E', ' ', '%', '\u00a0', "'", 'N', 'A', 'a', '\u2212', 'é');
    fc.assert(fc.property(fc.array(ch, { maxLength: 24 }).map((a) => a.join('')), fc.constantFrom(...FORMATS), (text, f) => {
      const { sa, sb, a, b } = both(text, f);
      expect(sb).toBe(sa);
      expect(b).toEqual(a);
    }), { numRuns: RUNS });
  });

  it('agrees on every double written by Number#toString and toFixed (shortest round trip, ECMA-262 Number::toString; differential, property)', () => {
    fc.assert(fc.property(fc.double({ noNaN: true }), fc.integer({ min: 0, max: 17 }), (x, digits) => {
      for (const text of [String(x), Number.isFinite(x) && Math.abs(x) < 1e21 ? x.toFixed(digits) : String(x)]) {
        const { sa, sb, a, b } = both(text, {});
        expect(sb).toBe(sa);
        expect(b).toEqual(a);
      }
    }), { numRuns: RUNS });
  });
});
