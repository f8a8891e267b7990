import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { emptyParsedNumber, makeNumberParser, parseNumber } from '../../src/numbers/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);

describe('makeNumberParser(plain)', () => {
  // Expected values are the IEEE 754 doubles that ECMA-262 Number() gives for the same decimal text
  // (ECMA-262 §7.1.4.1.1 StringToNumber), written here as literals.
  it.each([
    ['12', 12], ['-12.5', -12.5], ['+3', 3], ['.5', 0.5], ['5.', 5], ['1e3', 1000], ['1.5E-3', 0.0015],
    ['007', 7], [' 42 ', 42], ['1e308', 1e308], ['\u22127', -7], ['1.7976931348623157e308', Number.MAX_VALUE],
  ])('parse(%j) reads %d', (text, expected) => {
    const r = parseNumber(text);
    expect(r.status).toBe('ok');
    expect(r.value).toBe(expected);
  });

  it('parse("-0") reads 0, not -0 (documented rule: -0 reads as 0)', () => {
    expect(Object.is(parseNumber('-0').value, 0)).toBe(true);
    expect(Object.is(parseNumber('-0.0e5').value, 0)).toBe(true);
  });

  it('parse("007") flags a leading zero (codes, not quantities — common practice)', () => {
    expect(parseNumber('007').leadingZero).toBe(true);
    expect(parseNumber('0.7').leadingZero).toBe(false);
  });

  // Words that JavaScript would read as NaN/Infinity are invalid with a reason, never silent.
  it.each([
    ['NaN', 'not-a-number'], ['nan', 'not-a-number'], ['Infinity', 'infinite'], ['-Infinity', 'infinite'],
    ['inf', 'infinite'], ['∞', 'infinite'], ['1e309', 'out-of-range'], ['-1e400', 'out-of-range'],
    ['abc', 'malformed'], ['0x1F', 'malformed'], ['1e', 'malformed'], ['+', 'malformed'], ['12abc', 'malformed'],
    ['1,234', 'unexpected-separator'], ['1 234', 'unexpected-separator'],
  ])('parse(%j) is invalid with reason %s', (text, reason) => {
    const r = parseNumber(text);
    expect(r.status).toBe('invalid');
    expect(r.reason).toBe(reason);
    expect(r.value).toBeNaN();
  });

  it.each([['', 'blank'], ['   ', 'blank'], ['NA', 'missing-marker'], ['N/A', 'missing-marker'], ['null', 'missing-marker'], ['-', 'missing-marker']])(
    'parse(%j) is empty with reason %s', (text, reason) => {
      const r = parseNumber(text);
      expect(r.status).toBe('empty');
      expect(r.reason).toBe(reason);
    });

  it('parse(text, out) reuses the out-record across calls', () => {
    const p = makeNumberParser();
    const out = emptyParsedNumber();
    expect(p.parse('1.5', out)).toBe('ok');
    expect(p.parse('x', out)).toBe('invalid');
    expect(out.value).toBeNaN();
    expect(p.parse('2', out)).toBe('ok');
    expect(out.reason).toBeNull();
  });

  it('parse agrees with Number() on every plain decimal (ECMA-262 StringToNumber as oracle)', () => {
    const p = makeNumberParser();
    const out = emptyParsedNumber();
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
      const text = String(x);
      p.parse(text, out);
      expect(out.status).toBe('ok');
      expect(out.value).toBe(x === 0 ? 0 : x);
    }), { numRuns: RUNS });
  });

  it('parse never throws on arbitrary text and always gives a reason when not ok', () => {
    const p = makeNumberParser({ decimal: ',', group: '.' });
    const out = emptyParsedNumber();
    fc.assert(fc.property(fc.string(), (s) => {
      const st = p.parse(s, out);
      if (st === 'ok') expect(Number.isFinite(out.value)).toBe(true);
      else expect(out.reason).not.toBeNull();
    }), { numRuns: RUNS });
  });
});

describe('makeNumberParser(with separators)', () => {
  // Written forms are what Intl.NumberFormat (ICU/CLDR) prints for these locales; see the oracle test below.
  it.each([
    [{ decimal: '.', group: ',' }, '1,234,567.891', 1234567.891], // en-US (CLDR)
    [{ decimal: ',', group: '.' }, '1.234.567,891', 1234567.891], // de-DE (CLDR)
    [{ decimal: ',', group: ' ' }, '1\u202f234\u202f567,891', 1234567.891], // fr-FR narrow no-break space (CLDR)
    [{ decimal: '.', group: "'" }, "1'234'567.891", 1234567.891], // de-CH (CLDR)
    [{ decimal: ',', group: '.' }, '-1.234,5', -1234.5],
    [{ decimal: ',', group: null }, '0,25', 0.25],
    [{ decimal: ',', group: null }, '1,5e3', 1500],
  ] as const)('parse under %o reads %j as %d', (fmt, text, expected) => {
    expect(parseNumber(text, fmt).value).toBe(expected);
  });

  it.each([
    [{ decimal: '.', group: ',' }, '1,23', 'bad-grouping'],
    [{ decimal: '.', group: ',' }, '1234,567', 'bad-grouping'],
    [{ decimal: '.', group: ',' }, ',123', 'bad-grouping'],
    [{ decimal: ',', group: '.' }, '1.5', 'bad-grouping'],
    [{ decimal: '.', group: null, unresolved: true }, '1,234', 'ambiguous-separator'],
    [{ decimal: '.', group: null, unresolved: true }, '1.234', 'ambiguous-separator'],
  ] as const)('parse under %o rejects %j with %s', (fmt, text, reason) => {
    const r = parseNumber(text, fmt);
    expect(r.status).toBe('invalid');
    expect(r.reason).toBe(reason);
  });

  it('parse under an unresolved format still reads values that do not depend on the comma', () => {
    expect(parseNumber('1.5', { unresolved: true }).value).toBe(1.5);
    expect(parseNumber('1234.567', { unresolved: true }).value).toBe(1234.567);
  });

  it.each([
    ['12%', 'keep', 12], ['12.5 %', 'keep', 12.5], ['12%', 'fraction', 0.12], ['-3%', 'keep', -3],
  ] as const)('parse(%j) with percent %s reads %d and flags the sign', (text, percent, expected) => {
    const r = parseNumber(text, { percent });
    expect(r.value).toBe(expected);
    expect(r.percent).toBe(true);
  });

  it('parse reads back what Intl.NumberFormat writes (ICU/CLDR as an independent oracle)', () => {
    const locales = [['en-US', { decimal: '.', group: ',' }], ['de-DE', { decimal: ',', group: '.' }],
      ['fr-FR', { decimal: ',', group: ' ' }], ['de-CH', { decimal: '.', group: "'" }]] as const;
    fc.assert(fc.property(fc.integer({ min: -1e9, max: 1e9 }), fc.integer({ min: 0, max: 999 }), fc.constantFrom(...locales),
      (int, milli, [loc, fmt]) => {
        const x = int + Math.sign(int || 1) * milli / 1000;
        const text = new Intl.NumberFormat(loc, { maximumFractionDigits: 3 }).format(x);
        const r = parseNumber(text, fmt);
        expect(r.status).toBe('ok');
        expect(r.value).toBeCloseTo(x, 6);
      }), { numRuns: RUNS });
  });
});
