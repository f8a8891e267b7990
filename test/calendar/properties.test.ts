// Invariants of every calendar, over random options, zones and instants (fast-check).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { makeCalendar, UNIT_NAMES, type CalendarOptions, type UnitName } from '../../src/calendar/index.js';

const RUNS = Math.max(200, Math.ceil(Number(process.env.QUERN_FUZZ_RUNS ?? 20_000) / 10));
const ZONES = ['UTC', 'America/New_York', 'Europe/London', 'Australia/Lord_Howe', 'Asia/Kathmandu', 'America/Havana',
  'America/St_Johns', 'America/Sao_Paulo', 'Pacific/Apia', 'Asia/Kolkata', '-03:30'];
const FROM = Date.UTC(1965, 0, 1);
const UNTIL = Date.UTC(2055, 0, 1);
const SUBDAY_STEPS: Record<string, number[]> = {
  millisecond: [1, 250], second: [1, 10, 45], minute: [1, 5, 15, 45, 90, 7], hour: [1, 2, 6, 7, 24],
};

const optionsArb: fc.Arbitrary<CalendarOptions> = fc
  .record({
    unit: fc.constantFrom(...UNIT_NAMES),
    pickStep: fc.nat(),
    dateStep: fc.integer({ min: 1, max: 5 }),
    zone: fc.constantFrom(...ZONES),
    weekStart: fc.integer({ min: 1, max: 7 }),
    fiscalStart: fc.constantFrom({ month: 10, day: 1 }, { month: 4, day: 6 }, { month: 7, day: 1 }, { month: 1, day: 1 }, { month: 2, day: 28 }),
    fiscalLabel: fc.constantFrom('end' as const, 'start' as const),
    origin: fc.option(fc.integer({ min: FROM, max: UNTIL }), { nil: undefined }),
  })
  .map((r) => {
    const steps = SUBDAY_STEPS[r.unit];
    const step = steps ? steps[r.pickStep % steps.length]! : r.pickStep % 3 === 0 ? r.dateStep : 1;
    const o: CalendarOptions = { unit: r.unit as UnitName, step, zone: r.zone, weekStart: r.weekStart, fiscalStart: r.fiscalStart, fiscalLabel: r.fiscalLabel };
    if (r.origin !== undefined) o.origin = r.origin;
    return o;
  });

const instant = fc.integer({ min: FROM, max: UNTIL });

describe('Calendar invariants', () => {
  it('floor(ms) is idempotent, never after ms, and next(ms) > ms', () => {
    fc.assert(fc.property(optionsArb, instant, (o, ms) => {
      const cal = makeCalendar(o);
      const f = cal.floor(ms);
      expect(f).toBeLessThanOrEqual(ms);
      expect(cal.floor(f)).toBe(f);
      const n = cal.next(ms);
      expect(n).toBeGreaterThan(ms);
      expect(cal.floor(n)).toBe(n);
      expect(cal.floor(n - 1)).toBe(f);
    }), { numRuns: RUNS });
  }, 120_000);

  it('startOf(index(ms)) === floor(ms) and consecutive periods have consecutive keys', () => {
    fc.assert(fc.property(optionsArb, instant, (o, ms) => {
      const cal = makeCalendar(o);
      const k = cal.index(ms);
      expect(Number.isSafeInteger(k)).toBe(true);
      expect(cal.startOf(k)).toBe(cal.floor(ms));
      expect(cal.startOf(k + 1)).toBe(cal.next(ms));
      const kn = cal.index(cal.next(ms));
      // Only a date that never happened (Pacific/Apia 2011-12-30) leaves an empty key between two periods.
      for (let j = k + 1; j < kn; j++) expect(cal.startOf(j)).toBe(cal.startOf(j + 1));
      expect(kn === k + 1 || o.zone === 'Pacific/Apia').toBe(true);
    }), { numRuns: RUNS });
  }, 120_000);

  it('labels round-trip: parseLabel(label(ms)) is the period holding ms', () => {
    fc.assert(fc.property(optionsArb, instant, (o, ms) => {
      const cal = makeCalendar(o);
      const p = cal.period(ms);
      const back = cal.parseLabel(p.label);
      expect(back).toEqual(p);
      expect(cal.tryParseLabel(p.label)).toEqual(p);
    }), { numRuns: RUNS });
  }, 120_000);

  it('index is monotone and count(a, b) equals the periods walked with next()', () => {
    fc.assert(fc.property(optionsArb, instant, fc.integer({ min: 0, max: 40 }), (o, a, n) => {
      const cal = makeCalendar(o);
      let t = cal.floor(a);
      for (let i = 0; i < n; i++) t = cal.next(t);
      const b = t;
      expect(cal.index(b)).toBeGreaterThanOrEqual(cal.index(a));
      expect(cal.index(Math.max(a, b - 1))).toBeLessThanOrEqual(cal.index(b));
      // Walking with next() skips the empty key of a date that never happened (Pacific/Apia 2011-12-30).
      if (o.zone !== 'Pacific/Apia') expect(cal.count(a, b)).toBe(n);
      expect(cal.count(b, a) + cal.count(a, b)).toBe(0);
    }), { numRuns: RUNS });
  }, 120_000);

  it('period(ms) holds ms: start <= ms < end, with the calendar unit, step and zone', () => {
    fc.assert(fc.property(optionsArb, instant, (o, ms) => {
      const cal = makeCalendar(o);
      const p = cal.period(ms);
      expect(p.start <= ms && ms < p.end).toBe(true);
      expect([p.unit, p.step, p.zone]).toEqual([cal.unit, cal.step, cal.zone]);
    }), { numRuns: RUNS });
  }, 120_000);
});
