// BoundaryCounter counts per class of values (boundary-classes.ts) instead of testing every candidate on
// every value. Differential check: the counts, distinct counts and first misses must equal those of testing
// every candidate on every value, with each value's civil fields (date, weekday, days in month) taken from
// an independent oracle, the Temporal polyfill, rather than from quern's calendar code.
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { describe, expect, it } from 'vitest';
import { CANDIDATES, DAY, type ValueParts } from '../../src/grain/candidates.js';
import { BoundaryCounter, MAX_EXAMPLES } from '../../src/grain/counter.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 60);

/** Civil fields of a wall-clock value, read through Temporal in UTC (wall ms are UTC-shaped). */
function partsOf(wallMs: number): ValueParts {
  const days = Math.floor(wallMs / DAY);
  const d = Temporal.Instant.fromEpochMilliseconds(days * DAY).toZonedDateTimeISO('UTC');
  return { tod: wallMs - days * DAY, days, year: d.year, month: d.month, day: d.day, weekday: d.dayOfWeek, daysInMonth: d.daysInMonth };
}

/** The per-value rule, written out directly: a value is on a candidate when the candidate's test passes. */
function reference(values: ReadonlyArray<{ wall: number; weight: number; distinct: boolean }>) {
  const rowsOn = new Array<number>(CANDIDATES.length).fill(0);
  const distinctOn = new Array<number>(CANDIDATES.length).fill(0);
  const misses: number[][] = CANDIDATES.map(() => []);
  values.forEach((v, k) => {
    const p = partsOf(v.wall);
    const wholeDay = p.tod === 0 || p.tod === DAY - 1 || p.tod === DAY - 1000;
    CANDIDATES.forEach((c, i) => {
      const on = c.ms > 0 ? (p.tod + c.gap) % c.ms === 0 : wholeDay && c.test(p);
      if (on) {
        rowsOn[i] += v.weight;
        if (v.distinct) distinctOn[i] += 1;
      } else if (misses[i]!.length < MAX_EXAMPLES) misses[i]!.push(k + 1);
    });
  });
  return { rowsOn, distinctOn, misses };
}

// Times of day that sit on and just off the boundaries every candidate family tests (common practice).
const TIMES = [0, DAY - 1, DAY - 1000, 1000, 999, 1999, 5000, 15 * 60_000, 15 * 60_000 - 1000, 3_600_000 - 1,
  6 * 3_600_000, 8 * 3_600_000 - 1000, 12 * 3_600_000, 20 * 60_000, 7, 59_999, 86_399_000, 0.5];

const value = fc.record({
  // Days from 1600 to 2400 (leap years, century rules), and a few months of 2024 so values share classes.
  days: fc.oneof(fc.integer({ min: -135_000, max: 157_000 }), fc.integer({ min: 19_720, max: 19_760 })),
  tod: fc.oneof(fc.constantFrom(0, DAY - 1, DAY - 1000), fc.constantFrom(...TIMES), fc.integer({ min: 0, max: DAY - 1 }), fc.integer({ min: 0, max: 86_399 }).map((s) => s * 1000)),
  weight: fc.integer({ min: 1, max: 5 }),
  distinct: fc.boolean(),
});

describe('BoundaryCounter.add()', () => {
  it('counts every candidate exactly as testing each value would (Temporal polyfill as the civil oracle)', () => {
    fc.assert(fc.property(fc.array(value, { minLength: 1, maxLength: 120 }), (raw) => {
      const values = raw.map((r) => ({ wall: r.days * DAY + r.tod, weight: r.weight, distinct: r.distinct }));
      const counter = new BoundaryCounter();
      values.forEach((v, k) => counter.add(v.wall, v.weight, v.distinct, k + 1, String(v.wall)));
      const want = reference(values);
      expect([...counter.rowsOn]).toEqual(want.rowsOn);
      expect([...counter.distinctOn]).toEqual(want.distinctOn);
      expect(counter.misses.map((list) => list.map((e) => e.line))).toEqual(want.misses);
      expect(counter.rows).toBe(values.reduce((a, v) => a + v.weight, 0));
    }), { numRuns: RUNS });
  });

  it('BoundaryCounter.rowsOn reads fortnights by week parity: 2024-01-01, -15 and -29 share one, 2024-01-08 not', () => {
    // 2024-01-01 is a Monday (Temporal polyfill): Mondays two weeks apart fall on the same fortnight phase.
    const monday = Temporal.PlainDate.from('2024-01-01');
    expect(monday.dayOfWeek).toBe(1);
    const ms = (d: Temporal.PlainDate): number => d.toZonedDateTime('UTC').epochMilliseconds;
    const c = new BoundaryCounter();
    for (const d of [monday, monday.add({ days: 14 }), monday.add({ days: 28 })]) c.add(ms(d), 1, true, 1, d.toString());
    const fortnights = CANDIDATES.map((cand, i) => ({ cand, i })).filter(({ cand }) => cand.grain.unit === 'week' && cand.grain.step === 2 && cand.grain.weekStart === 1);
    const on = fortnights.map(({ i }) => c.rowsOn[i]);
    expect(on.sort()).toEqual([0, 3]);
    // Adding the Monday between them puts one value on the other phase: neither fortnight holds all four.
    c.add(ms(monday.add({ days: 7 })), 1, true, 4, 'between');
    expect(fortnights.map(({ i }) => c.rowsOn[i]).sort()).toEqual([1, 3]);
  });
});
