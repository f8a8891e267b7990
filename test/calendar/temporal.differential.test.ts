// Differential property test: quern's calendar against an independent implementation, the Temporal
// polyfill (temporal-polyfill). The oracle uses only Temporal's own calendar fields and arithmetic
// (startOfDay, dayOfWeek, yearOfWeek/weekOfYear, with({ day: 1 }), round, PlainDate.add) — never quern code.
// For each random instant and zone we compare the floor, the label and the bounds: quern's end must be the
// first instant whose Temporal floor differs (oracleFloor(end − 1) = start and oracleFloor(end) = end).
// Runs: QUERN_FUZZ_RUNS instants in total (default 100,000), split evenly across the calendar variants.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { makeCalendar, type Calendar, type CalendarOptions } from '../../src/calendar/index.js';

const ZONES = [
  'Asia/Kolkata', 'Asia/Kathmandu', 'Australia/Eucla', 'Australia/Lord_Howe', 'Australia/Sydney',
  'America/Sao_Paulo', 'America/Havana', 'America/St_Johns', 'Pacific/Apia', 'Europe/London',
  'America/New_York', 'UTC', '+05:30',
];
const FROM = Date.UTC(1960, 0, 1);
const UNTIL = Date.UTC(2060, 0, 1);

type Zdt = Temporal.ZonedDateTime;
type PD = Temporal.PlainDate;

interface Variant {
  name: string;
  options: Omit<CalendarOptions, 'zone'>;
  /** Temporal floor of an instant. */
  floor(z: Zdt): Zdt;
  /** The label of the period starting at `start`, from Temporal fields. */
  label(start: Zdt): string;
}

const startOfDate = (d: PD, zone: string): Zdt => d.toZonedDateTime({ timeZone: zone });
const pad = (n: number) => String(n).padStart(2, '0');
const weekBack = (d: PD, weekStart: number) => d.subtract({ days: (d.dayOfWeek - weekStart + 7) % 7 });

type SubUnit = 'millisecond' | 'second' | 'minute' | 'hour';

/**
 * The oracle's sub-day floor: the latest instant at or before `z` at which the clock showed a multiple of the
 * step, or the end of a gap that skipped one. Where no offset change lies between them this is exactly
 * Temporal's round({ roundingMode: 'floor' }). Near a change Temporal's round is not a floor: it moves a skipped
 * time forward by the gap, past the instant (St John's 1987-04-05, 00:01 → 01:01: 01:01's hour "floors" to
 * 02:00), and it falls back to the other offset for a repeated time (St John's 2001-10-28: 23:01 NST, after
 * the 00:01 NDT → 23:01 NST change, "floors" to 23:00 NDT, before the 00:00 NDT boundary). So the oracle then
 * walks back over Temporal's own transitions, with Temporal PlainDateTime rounding for the grid.
 */
function floorSubday(z: Zdt, unit: SubUnit, step: number): Zdt {
  const opts = { smallestUnit: unit, roundingIncrement: step, roundingMode: 'floor' } as const;
  let cur = z;
  for (;;) {
    const r = cur.round(opts);
    if (Temporal.ZonedDateTime.compare(r, cur) <= 0 && r.offsetNanoseconds === cur.offsetNanoseconds) return r;
    const tr = cur.add({ nanoseconds: 1 }).getTimeZoneTransition('previous')!;
    const before = tr.subtract({ nanoseconds: 1 }).toPlainDateTime();
    const after = tr.toPlainDateTime();
    const gap = Temporal.PlainDateTime.compare(after, before) > 0;
    const startsPeriod = gap
      ? Temporal.PlainDateTime.compare(after.round(opts), before) > 0 // the gap skipped a grid time
      : after.round(opts).equals(after); // the clock went back onto a grid time
    if (startsPeriod) return tr;
    cur = tr.subtract({ nanoseconds: 1 });
  }
}

function subday(name: string, unit: SubUnit, step: number, suffix: string): Variant {
  const smallest = unit === 'hour' ? 'minute' : unit;
  return {
    name, options: { unit, step },
    floor: (z) => floorSubday(z, unit, step),
    label: (s) => s.toString({ smallestUnit: smallest, timeZoneName: 'never' }) + suffix,
  };
}

/** Epidemiological year and week of a Sunday `s`, from the CDC rule: week 1 is the Sunday week holding January 4. */
function epiWeek(s: PD): string {
  const year = s.add({ days: 3 }).year;
  const jan4 = Temporal.PlainDate.from({ year, month: 1, day: 4 });
  const week1 = jan4.subtract({ days: jan4.dayOfWeek % 7 });
  return `${year}-EW${pad(week1.until(s).days / 7 + 1)}`;
}

/** First day of the fiscal year (start month `m`, day `d`) holding date `x`, by Temporal date comparison. */
function fiscalStart(x: PD, m: number, d: number): PD {
  const here = Temporal.PlainDate.from({ year: x.year, month: m, day: d });
  return Temporal.PlainDate.compare(x, here) >= 0 ? here : here.subtract({ years: 1 });
}

/** Start of the fiscal sub-period of `months` months holding `x`, and its 1-based number. */
function fiscalPart(x: PD, m: number, d: number, months: number): { start: PD; n: number; fy: PD } {
  const fy = fiscalStart(x, m, d);
  let start = fy;
  let n = 1;
  while (Temporal.PlainDate.compare(start.add({ months }), x) <= 0) {
    start = start.add({ months });
    n++;
  }
  return { start, n, fy };
}

const VARIANTS: Variant[] = [
  subday('millisecond', 'millisecond', 1, ''),
  subday('second', 'second', 1, ''),
  subday('minute', 'minute', 1, ''),
  subday('15 minutes', 'minute', 15, '/PT15M'),
  subday('hour', 'hour', 1, ''),
  subday('6 hours', 'hour', 6, '/PT6H'),
  { name: 'day', options: { unit: 'day' }, floor: (z) => z.startOfDay(), label: (s) => s.toPlainDate().toString() },
  {
    name: 'week from Wednesday', options: { unit: 'week', weekStart: 3 },
    floor: (z) => startOfDate(weekBack(z.toPlainDate(), 3), z.timeZoneId),
    label: (s) => `${s.toPlainDate().toString()}/P1W`,
  },
  {
    name: 'iso-week', options: { unit: 'iso-week' },
    floor: (z) => startOfDate(weekBack(z.toPlainDate(), 1), z.timeZoneId),
    label: (s) => `${s.toPlainDate().yearOfWeek}-W${pad(s.toPlainDate().weekOfYear!)}`,
  },
  {
    name: 'epi-week', options: { unit: 'epi-week' },
    floor: (z) => startOfDate(weekBack(z.toPlainDate(), 7), z.timeZoneId),
    label: (s) => epiWeek(s.toPlainDate()),
  },
  {
    name: 'month', options: { unit: 'month' },
    floor: (z) => startOfDate(z.toPlainDate().with({ day: 1 }), z.timeZoneId),
    label: (s) => s.toPlainDate().toPlainYearMonth().toString(),
  },
  {
    name: 'quarter', options: { unit: 'quarter' },
    floor: (z) => startOfDate(z.toPlainDate().with({ month: Math.floor((z.month - 1) / 3) * 3 + 1, day: 1 }), z.timeZoneId),
    label: (s) => `${s.year}-Q${Math.floor((s.month - 1) / 3) + 1}`,
  },
  {
    name: 'half', options: { unit: 'half' },
    floor: (z) => startOfDate(z.toPlainDate().with({ month: z.month <= 6 ? 1 : 7, day: 1 }), z.timeZoneId),
    label: (s) => `${s.year}-H${s.month <= 6 ? 1 : 2}`,
  },
  {
    name: 'year', options: { unit: 'year' },
    floor: (z) => startOfDate(z.toPlainDate().with({ month: 1, day: 1 }), z.timeZoneId),
    label: (s) => String(s.year),
  },
  {
    name: 'fiscal-year (US, 1 October)', options: { unit: 'fiscal-year', fiscalStart: { month: 10, day: 1 } },
    floor: (z) => startOfDate(fiscalStart(z.toPlainDate(), 10, 1), z.timeZoneId),
    label: (s) => `FY${s.year + 1}`, // named by the calendar year in which it ends (REFERENCES.md §6)
  },
  {
    name: 'fiscal-quarter (UK tax year, 6 April)', options: { unit: 'fiscal-quarter', fiscalStart: { month: 4, day: 6 }, fiscalLabel: 'start' },
    floor: (z) => startOfDate(fiscalPart(z.toPlainDate(), 4, 6, 3).start, z.timeZoneId),
    label: (s) => {
      const p = fiscalPart(s.toPlainDate(), 4, 6, 3);
      return `FY${p.fy.year}-Q${p.n}`;
    },
  },
  {
    name: 'fiscal-month (1 July)', options: { unit: 'fiscal-month', fiscalStart: { month: 7, day: 1 } },
    floor: (z) => startOfDate(fiscalPart(z.toPlainDate(), 7, 1, 1).start, z.timeZoneId),
    label: (s) => {
      const p = fiscalPart(s.toPlainDate(), 7, 1, 1);
      return `FY${p.fy.year + 1}-M${pad(p.n)}`;
    },
  },
];

const TOTAL = Number(process.env.QUERN_FUZZ_RUNS ?? 100_000);
const RUNS = Math.ceil(TOTAL / VARIANTS.length);

const calendars = new Map<string, Calendar>();
function calendarFor(v: Variant, zone: string): Calendar {
  const key = `${v.name}|${zone}`;
  let cal = calendars.get(key);
  if (!cal) {
    cal = makeCalendar({ ...v.options, zone });
    calendars.set(key, cal);
  }
  return cal;
}

/** Every transition of `zone` in [FROM, UNTIL), as Temporal reports them (computed once per zone). */
const transitionCache = new Map<string, number[]>();
function temporalTransitions(zone: string): number[] {
  let list = transitionCache.get(zone);
  if (list) return list;
  list = [];
  let z: Zdt | null = Temporal.Instant.fromEpochMilliseconds(FROM).toZonedDateTimeISO(zone);
  while ((z = z.getTimeZoneTransition('next')) !== null && z.epochMilliseconds < UNTIL) list.push(z.epochMilliseconds);
  transitionCache.set(zone, list);
  return list;
}

/** Instants: half uniform over 1960–2060, half within a day of a transition that Temporal reports. */
const instantArb = fc
  .tuple(fc.constantFrom(...ZONES), fc.integer({ min: FROM, max: UNTIL }), fc.boolean(), fc.nat(), fc.integer({ min: -86_400_000, max: 86_400_000 }))
  .map(([zone, ms, nearTransition, pick, shift]) => {
    const list = temporalTransitions(zone);
    if (!nearTransition || list.length === 0) return { zone, ms };
    return { zone, ms: list[pick % list.length]! + shift };
  });

describe('makeCalendar(options) against Temporal', () => {
  it.each(VARIANTS.map((v) => [v.name, v] as const))('%s: floor, label and bounds agree', (_name, v) => {
    fc.assert(
      fc.property(instantArb, ({ zone, ms }) => {
        const cal = calendarFor(v, zone);
        const z = Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(zone);
        const start = v.floor(z);
        const p = cal.period(ms);
        expect(p.start).toBe(start.epochMilliseconds);
        expect(p.label).toBe(v.label(start));
        const endZ = Temporal.Instant.fromEpochMilliseconds(p.end).toZonedDateTimeISO(zone);
        expect(v.floor(endZ).epochMilliseconds).toBe(p.end);
        const lastZ = Temporal.Instant.fromEpochMilliseconds(p.end - 1).toZonedDateTimeISO(zone);
        expect(v.floor(lastZ).epochMilliseconds).toBe(p.start);
      }),
      { numRuns: RUNS },
    );
  }, 300_000);
});
