// Differential property test: quern's ISO 8601 path against the Temporal polyfill (an independent
// general-purpose implementation) over random valid ISO strings; random and mutated text never throws.
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { makeTimeParser, emptyParsedTime } from '../../src/time/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 1000);
const TIMEOUT = 60_000 + RUNS * 20; // Temporal takes about a millisecond a value
const p2 = (n: number) => String(n).padStart(2, '0');
const y4 = (n: number) => String(n).padStart(4, '0');

interface Parts {
  y: number; m: number; d: number; hh: number; mm: number; ss: number; frac: string;
  precision: 1 | 2 | 3; basic: boolean; sep: string; offset: 'none' | 'Z' | number;
}

const partsArb: fc.Arbitrary<Parts> = fc
  .record({
    y: fc.integer({ min: 1, max: 9999 }),
    m: fc.integer({ min: 1, max: 12 }),
    d: fc.integer({ min: 1, max: 31 }),
    hh: fc.integer({ min: 0, max: 23 }),
    mm: fc.integer({ min: 0, max: 59 }),
    ss: fc.integer({ min: 0, max: 59 }),
    frac: fc.stringMatching(/^[0-9]{0,9}$/),
    precision: fc.constantFrom(1 as const, 2 as const, 3 as const),
    basic: fc.boolean(),
    sep: fc.constantFrom('T', 't', ' '),
    offset: fc.oneof(fc.constant('none' as const), fc.constant('Z' as const), fc.integer({ min: -23 * 60 - 59, max: 23 * 60 + 59 })),
  })
  .map((p) => ({ ...p, d: Math.min(p.d, Temporal.PlainYearMonth.from({ year: p.y, month: p.m }).daysInMonth) }));

function write(p: Parts): string {
  const c = p.basic ? '' : ':';
  const date = p.basic ? `${y4(p.y)}${p2(p.m)}${p2(p.d)}` : `${y4(p.y)}-${p2(p.m)}-${p2(p.d)}`;
  // Temporal reads fractions of seconds only, so hour- and minute-precision values carry none.
  let time = `${p2(p.hh)}${p.precision >= 2 ? c + p2(p.mm) : ''}${p.precision === 3 ? c + p2(p.ss) : ''}`;
  if (p.precision === 3 && p.frac !== '') time += `.${p.frac}`;
  let off = '';
  if (p.offset === 'Z') off = 'Z';
  else if (p.offset !== 'none') {
    const a = Math.abs(p.offset);
    off = `${p.offset < 0 ? '-' : '+'}${p2(Math.floor(a / 60))}${c}${p2(a % 60)}`;
  }
  return `${date}${p.sep}${time}${off}`;
}

describe('makeTimeParser(iso) agrees with Temporal', () => {
  const parse = makeTimeParser('iso-date-time-offset');
  const out = emptyParsedTime();

  it(`reads ${RUNS} random valid date-times as Temporal.Instant.from / PlainDateTime.from do`, () => {
    fc.assert(
      fc.property(partsArb, (p) => {
        const text = write(p);
        expect(parse(text, out)).toBeNull();
        if (p.offset === 'none') {
          const wall = Temporal.PlainDateTime.from(text).toZonedDateTime('UTC').epochMilliseconds;
          expect(out.kind).toBe('local');
          expect(out.ms).toBe(wall);
        } else {
          expect(out.kind).toBe('instant');
          expect(out.ms).toBe(Temporal.Instant.from(text).epochMilliseconds);
          expect(out.offset).toBe(p.offset === 'Z' ? 0 : p.offset);
        }
      }),
      { numRuns: RUNS },
    );
  }, TIMEOUT);

  it(`reads ${RUNS} random dates, week dates and ordinal dates as the days Temporal names`, () => {
    const epoch = Temporal.PlainDate.from('1970-01-01');
    const first = Temporal.PlainDate.from('0001-01-01').since(epoch).days;
    const last = Temporal.PlainDate.from('9999-12-31').since(epoch).days;
    const dateArb = fc.integer({ min: first, max: last });
    fc.assert(
      fc.property(dateArb, fc.boolean(), (dayNumber, basic) => {
        const d = Temporal.PlainDate.from('1970-01-01').add({ days: dayNumber });
        const want = d.toZonedDateTime('UTC').epochMilliseconds;
        const c = basic ? '' : '-';
        const forms = [
          `${y4(d.year)}${c}${p2(d.month)}${c}${p2(d.day)}`,
          `${y4(d.yearOfWeek!)}${c}W${p2(d.weekOfYear!)}${c}${d.dayOfWeek}`,
          `${y4(d.year)}${c}${String(d.dayOfYear).padStart(3, '0')}`,
        ];
        for (const text of forms) {
          expect(parse(text, out), text).toBeNull();
          expect(out.kind).toBe('period');
          expect(out.unit).toBe('day');
          expect(out.ms, text).toBe(want);
          expect(out.endMs).toBe(d.add({ days: 1 }).toZonedDateTime('UTC').epochMilliseconds);
        }
      }),
      { numRuns: RUNS },
    );
  }, TIMEOUT);

  it(`never throws on ${RUNS} random or mutated strings, and agrees with Temporal wherever both read one`, () => {
    const mutated = partsArb.chain((p) => {
      const text = write(p);
      return fc.tuple(fc.integer({ min: 0, max: text.length }), fc.string({ maxLength: 3 }), fc.integer({ min: 0, max: 3 }))
        .map(([at, ins, del]) => text.slice(0, at) + ins + text.slice(at + del));
    });
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 40 }), mutated), (text) => {
        const r = parse(text, out);
        expect(r === null || typeof r === 'string').toBe(true);
        if (r !== null) {
          expect(r).toMatch(/^[a-z-]+: /);
          return;
        }
        if (out.leapSecond || out.kind === 'period') return; // Temporal reads a leap second as :59 (REFERENCES §4)
        let theirs: number | null = null;
        try {
          theirs = out.kind === 'instant'
            ? Temporal.Instant.from(text).epochMilliseconds
            : Temporal.PlainDateTime.from(text).toZonedDateTime('UTC').epochMilliseconds;
        } catch {
          theirs = null; // quern reads more notations than Temporal (hours-only offsets, fractions of minutes)
        }
        if (theirs !== null) expect(out.ms, text).toBe(theirs);
      }),
      { numRuns: RUNS },
    );
  }, TIMEOUT);
});
