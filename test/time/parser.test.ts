// makeTimeParser(format): every catalogue format compiles, misuse throws QuernError, and no parser throws on
// random or mutated text (issue 9 property fuzzing).
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { makeTimeParser, emptyParsedTime, TIME_FORMAT_IDS, timeFormat, isQuernError } from '../../src/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 1000);

// One valid value per format (notations of issue 2 §3), used as seeds for mutation.
const SEEDS: Record<string, string> = {
  'iso-date-time-offset': '2024-03-10T08:15:00-05:00', 'iso-date-time': '2024-03-10T08:15:00', 'iso-date': '2024-03-10',
  'iso-basic-date-time-offset': '20240310T081500Z', 'iso-basic-date-time': '20240310T0815', 'iso-basic-date': '20240310',
  'iso-week-date': '2024-W10-7', 'iso-week': '2024-W10', 'iso-ordinal-date': '2024-070', 'iso-year-month': '2024-03', 'iso-year': '2024',
  'iso-interval': '2024-03-10/P1W', quarter: '2024-Q1', half: '2024-H1', 'fiscal-year': 'FY2024', 'epi-week': '2024-EW07',
  'month-name-year': 'Mar 2024', 'month-name-day-year': 'March 10, 2024', 'day-month-name-year': '10-Mar-24',
  'day-month-year': '10/03/2024', 'month-day-year': '03/10/2024', 'year-month-day': '2024/03/10',
  'epoch-seconds': '1710058500', 'epoch-milliseconds': '1710058500000', 'epoch-microseconds': '1710058500000000',
  'epoch-nanoseconds': '1710058500000000000', 'epoch-auto': '1710058500', 'serial-1900': '45361.34375', 'serial-1904': '43899.5',
};

describe('makeTimeParser(format)', () => {
  it('compiles every format of the catalogue and reads its seed value', () => {
    const out = emptyParsedTime();
    for (const id of TIME_FORMAT_IDS) {
      const parse = makeTimeParser(id, { twoDigitYearPivot: 1950 });
      expect(parse(SEEDS[id]!, out), id).toBeNull();
    }
  });

  it('gives each value the kind its catalogue format names', () => {
    const out = emptyParsedTime();
    for (const id of TIME_FORMAT_IDS) {
      makeTimeParser(id, { twoDigitYearPivot: 1950 })(SEEDS[id]!, out);
      expect(out.kind, id).toBe(timeFormat(id).kind);
    }
  });

  it('throws E_USAGE for an unknown format id or a bad pivot', () => {
    const codeOf = (f: () => unknown) => {
      try { f(); } catch (e) { return isQuernError(e) ? e.code : 'other'; }
      return 'none';
    };
    expect(codeOf(() => makeTimeParser('iso-datetime'))).toBe('E_USAGE');
    expect(codeOf(() => makeTimeParser('day-month-year', { twoDigitYearPivot: 19.5 }))).toBe('E_USAGE');
    expect(codeOf(() => makeTimeParser('fiscal-year', { fiscalStart: { month: 13, day: 1 } }))).toBe('E_UNIT');
  });

  it(`no parser throws on ${RUNS} random or mutated values, and every refusal has a reason code`, () => {
    const parsers = TIME_FORMAT_IDS.map((id) => [id, makeTimeParser(id, { twoDigitYearPivot: 1950 })] as const);
    const out = emptyParsedTime();
    const mutated = fc.constantFrom(...Object.values(SEEDS)).chain((seed) =>
      fc.tuple(fc.integer({ min: 0, max: seed.length }), fc.string({ maxLength: 4 }), fc.integer({ min: 0, max: 4 }))
        .map(([at, ins, del]) => seed.slice(0, at) + ins + seed.slice(at + del)));
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 30 }), fc.string({ unit: 'binary', maxLength: 12 }), mutated), (text) => {
        for (const [id, parse] of parsers) {
          const r = parse(text, out);
          if (r === null) {
            expect(Number.isFinite(out.ms), `${id} ${text}`).toBe(true);
            if (out.kind === 'period') expect(out.endMs > out.ms, `${id} ${text}`).toBe(true);
          } else {
            expect(r, `${id} ${text}`).toMatch(/^[a-z][a-z-]*: \S/);
          }
        }
      }),
      { numRuns: RUNS },
    );
  }, 60_000 + RUNS * 5);
});
