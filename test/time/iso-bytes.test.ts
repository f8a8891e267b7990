// parseIsoBytes and makeTimeBytesParser: the byte-level ISO 8601 path gives exactly the result and the
// reason of the string path (makeTimeParser) on the same text — a differential property test over random
// valid values, near-valid mutations and garbage, each embedded among other bytes so that a read past
// the field's end would show. Valid RFC 3339 values are also checked against the Temporal polyfill.
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { emptyParsedTime, makeTimeParser, makeTimeBytesParser, parseIsoBytes, fastIsoBytes } from '../../src/time/index.js';
import { newIsoDateMemo } from '../../src/time/iso-bytes.js';
import type { ParsedTime } from '../../src/time/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 2000);
const p2 = (n: number): string => String(n).padStart(2, '0');

// Shapes of the fast lane and of its edges: seconds out of range, 24:00, leap seconds, impossible days,
// offsets past 23:59, lowercase t and z, a space separator, fractions with point or comma.
const valueArb = fc
  .record({
    y: fc.oneof(fc.integer({ min: 0, max: 9999 }), fc.constantFrom(1900, 2000, 2024, 2100)),
    m: fc.integer({ min: 0, max: 13 }),
    d: fc.integer({ min: 0, max: 32 }),
    hh: fc.integer({ min: 0, max: 25 }),
    mm: fc.integer({ min: 0, max: 60 }),
    ss: fc.integer({ min: 0, max: 61 }),
    frac: fc.stringMatching(/^([.,][0-9]{0,10})?$/),
    sep: fc.constantFrom('T', 't', ' ', '_'),
    off: fc.oneof(fc.constantFrom('', 'Z', 'z', '+00:00', '-05:00', '+05:30', '+24:00', '-03:60', '+0530', '+05', 'GMT'),
      fc.integer({ min: -1439, max: 1439 }).map((o) => `${o < 0 ? '-' : '+'}${p2(Math.floor(Math.abs(o) / 60))}:${p2(Math.abs(o) % 60)}`)),
    dateOnly: fc.integer({ min: 0, max: 5 }),
  })
  .map((v) => {
    const date = `${String(v.y).padStart(4, '0')}-${p2(v.m)}-${p2(v.d)}`;
    return v.dateOnly === 0 ? date : `${date}${v.sep}${p2(v.hh)}:${p2(v.mm)}:${p2(v.ss)}${v.frac}${v.off}`;
  });

// A value changed in one place: a byte replaced (by ASCII, by non-ASCII), inserted or deleted, or padded.
const NOISE = ['0', '9', '-', ':', 'T', 'Z', '+', '.', ',', ' ', 'é', '日', '😀', '\u2212', 'W', '/'];
const mutatedArb = fc
  .tuple(valueArb, fc.integer({ min: 0, max: 3 }), fc.nat(40), fc.constantFrom(...NOISE))
  .map(([v, op, at, ch]) => {
    const i = at % (v.length + 1);
    if (op === 0) return v.slice(0, i) + ch + v.slice(i + 1);
    if (op === 1) return v.slice(0, i) + ch + v.slice(i);
    if (op === 2) return v.slice(0, i) + v.slice(i + 1);
    return ` ${v} `;
  });
const textArb = fc.oneof(valueArb, mutatedArb, fc.string({ maxLength: 30 }), fc.constantFrom('', ' ', '2024-W07', '2024-070', '2024', '2024-02'));
// Bytes around the field: what a CSV line puts there, and digits or signs a careless lane would read on.
const aroundArb = fc.constantFrom('', ',', '.', '5', '+01:00', 'Z', '"', '\n', ',2024');

function same(a: ParsedTime, b: ParsedTime): void {
  expect(b.kind).toBe(a.kind);
  expect(Object.is(b.ms, a.ms)).toBe(true);
  expect(Object.is(b.offset, a.offset)).toBe(true);
  expect(b.unit).toBe(a.unit);
  expect(Object.is(b.endMs, a.endMs)).toBe(true);
  expect(b.leapSecond).toBe(a.leapSecond);
}

describe('parseIsoBytes(buf, start, end, out) agrees with the string parser', () => {
  const text = makeTimeParser('iso-date-time-offset');
  it(`gives the same result and reason on ${RUNS} random values, mutations and garbage`, () => {
    const a = emptyParsedTime();
    const b = emptyParsedTime();
    fc.assert(
      fc.property(textArb, aroundArb, aroundArb, (value, before, after) => {
        const pre = Buffer.from(before);
        const field = Buffer.from(value);
        const buf = Buffer.concat([pre, field, Buffer.from(after)]);
        const want = text(value, a);
        const got = parseIsoBytes(buf, pre.length, pre.length + field.length, b);
        expect(got).toBe(want);
        if (want === null) same(a, b);
      }),
      { numRuns: RUNS },
    );
  });

  it.each([
    // [value, expected epoch ms or reason code]; instants from the Temporal polyfill, reasons as DEVELOPERS.md states them
    ['2024-03-10T08:15:00-05:00', Temporal.Instant.from('2024-03-10T08:15:00-05:00').epochMilliseconds],
    ['2020-12-31T23:59:59.9999Z', Temporal.Instant.from('2020-12-31T23:59:59.999Z').epochMilliseconds], // fractions truncated
    ['2021-02-29T00:00:00Z', 'invalid-date'], // 2021 is not a leap year (ISO 8601 proleptic Gregorian)
    ['2024-03-10T24:01:00Z', 'invalid-time'], // only 24:00 ends a day
    ['2024-03-10T25:00:00Z', 'invalid-time'],
  ])('parseIsoBytes(%j) → %j', (value, expected) => {
    const out = emptyParsedTime();
    const buf = Buffer.from(`x,${value},y`);
    const r = parseIsoBytes(buf, 2, 2 + Buffer.byteLength(value), out);
    if (typeof expected === 'number') {
      expect(r).toBeNull();
      expect(out.ms).toBe(expected);
    } else expect(r?.split(':')[0]).toBe(expected);
  });

  it('fastIsoBytes reads an RFC 3339 instant as Temporal.Instant.from does, without the bytes after it', () => {
    const out = emptyParsedTime();
    fc.assert(
      fc.property(fc.integer({ min: Date.UTC(1000, 0, 1), max: Date.UTC(9000, 0, 1) }), fc.integer({ min: -1439, max: 1439 }), (ms, off) => {
        const wall = new Date(ms + off * 60_000).toISOString().slice(0, 23);
        const value = `${wall}${off < 0 ? '-' : '+'}${p2(Math.floor(Math.abs(off) / 60))}:${p2(Math.abs(off) % 60)}`;
        const buf = Buffer.from(`${value}5:00,`);
        expect(fastIsoBytes(buf, 0, value.length, out)).toBe(true);
        expect(out.ms).toBe(Temporal.Instant.from(value).epochMilliseconds); // Temporal polyfill as the oracle
        expect(out.offset).toBe(off);
      }),
      { numRuns: Math.min(RUNS, 500) },
    );
  });
});

// Runs of values that share their date (as the rows of a log do), so the memo of the last date is hit,
// missed and replaced: a value whose date bytes equal the memo's, then a near-valid mutation of it.
const runArb = fc.array(
  fc.tuple(fc.oneof(valueArb, mutatedArb), fc.array(fc.oneof(fc.constant(''), mutatedArb, valueArb.map((v) => v.slice(10))), { maxLength: 4 })),
  { minLength: 1, maxLength: 8 },
).map((runs) => runs.flatMap(([first, tails]) => [first, ...tails.map((t) => first.slice(0, 10) + t)]));

describe('fastIsoBytes(buf, start, end, out, memo) agrees with fastIsoBytes without a memo', () => {
  // Differential test: the memo lane against the plain lane and against the string parser (no oracle
  // outside quern is needed for "the same answer twice"; the plain lane is held to Temporal above).
  const text = makeTimeParser('iso-date-time-offset');
  it(`gives the same answer on ${Math.ceil(RUNS / 4)} runs of values sharing their date, in one buffer and in fresh ones`, () => {
    const a = emptyParsedTime();
    const b = emptyParsedTime();
    const c = emptyParsedTime();
    fc.assert(
      fc.property(runArb, aroundArb, fc.boolean(), (values, around, oneBuffer) => {
        const memo = newIsoDateMemo();
        const pad = Buffer.from(around);
        const parts: Buffer[] = [];
        const at: Array<[number, number]> = [];
        let pos = 0;
        for (const v of values) {
          const field = Buffer.from(v);
          parts.push(pad, field);
          at.push([pos + pad.length, pos + pad.length + field.length]);
          pos += pad.length + field.length;
        }
        parts.push(pad);
        const joined = Buffer.concat(parts);
        values.forEach((v, i) => {
          const [s, e] = at[i]!;
          const buf = oneBuffer ? joined : Buffer.concat([pad, Buffer.from(v), pad]);
          const off = oneBuffer ? 0 : s - pad.length;
          const plain = fastIsoBytes(buf, s - off, e - off, a);
          expect(fastIsoBytes(buf, s - off, e - off, b, memo)).toBe(plain);
          if (plain) {
            same(a, b);
            expect(text(v, c)).toBeNull();
            same(c, b);
          }
        });
      }),
      { numRuns: Math.ceil(RUNS / 4) },
    );
  });

  it.each([
    // [first, second]: the second shares the first's date bytes; expected from ISO 8601 / RFC 3339 rules (from memory)
    ['2021-02-28T10:00:00Z', '2021-02-28T24:00:00Z'], // 24:00 is left to the general scanner
    ['2021-02-28T10:00:00Z', '2021-02-28'], // a date alone after a date-time of the same day
    ['2021-02-28T10:00:00Z', '2021-02-28T10:00:60Z'], // a leap second is left to the general scanner
    ['2024-02-29T10:00:00Z', '2024-02-29 10:00:00+05:30'], // a space separator and an offset
  ])('a memo holding %j reads %j as no memo does', (first, second) => {
    const memo = newIsoDateMemo();
    const x = emptyParsedTime();
    const y = emptyParsedTime();
    expect(fastIsoBytes(Buffer.from(first), 0, first.length, x, memo)).toBe(true);
    const buf = Buffer.from(`,${second},`);
    const plain = fastIsoBytes(buf, 1, 1 + second.length, x);
    expect(fastIsoBytes(buf, 1, 1 + second.length, y, memo)).toBe(plain);
    if (plain) same(x, y);
  });

  it('a memo never accepts an invalid date because its bytes came after a valid one (2021-02-29 is no date)', () => {
    // 2021 is not a leap year (ISO 8601 proleptic Gregorian calendar, from memory)
    const memo = newIsoDateMemo();
    const out = emptyParsedTime();
    expect(fastIsoBytes(Buffer.from('2021-02-28T00:00:00Z'), 0, 20, out, memo)).toBe(true);
    expect(fastIsoBytes(Buffer.from('2021-02-29T00:00:00Z'), 0, 20, out, memo)).toBe(false);
    expect(fastIsoBytes(Buffer.from('2021-02-29T00:00:00Z'), 0, 20, out, memo)).toBe(false);
  });
});

describe('makeTimeBytesParser(format) agrees with makeTimeParser(format)', () => {
  const FORMATS = ['iso-date-time-offset', 'iso-date-time', 'iso-date', 'iso-week', 'epoch-seconds', 'day-month-year', 'quarter', 'epi-week', 'iso-interval'];
  const anyArb = fc.oneof(textArb, fc.constantFrom('1700000000', '05/04/2021', '2021-Q2', '2024-EW07', '2021-04-05/P1W', 'Q2 2021'));
  it.each(FORMATS.flatMap((f) => [[f, false], [f, true]] as const))('%s (strictKind %s)', (format, strictKind) => {
    const text = makeTimeParser(format, { strictKind });
    const bytes = makeTimeBytesParser(format, { strictKind });
    const a = emptyParsedTime();
    const b = emptyParsedTime();
    fc.assert(
      fc.property(anyArb, aroundArb, (value, around) => {
        const field = Buffer.from(value);
        const buf = Buffer.concat([Buffer.from(around), field, Buffer.from(around)]);
        const s = Buffer.byteLength(around);
        const want = text(value, a);
        expect(bytes(buf, s, s + field.length, b)).toBe(want);
        if (want === null) same(a, b);
      }),
      { numRuns: Math.ceil(RUNS / 10) },
    );
  });

  it('throws the same E_USAGE as makeTimeParser for an unknown format', () => {
    expect(() => makeTimeBytesParser('no-such-format')).toThrow(expect.objectContaining({ code: 'E_USAGE' }));
  });
});
