// detectGrain on generated columns whose true grain is known by construction. Every value is built with
// the Temporal polyfill (an independent implementation of ISO 8601 and IANA zone rules), never with quern's
// calendar code.
import { describe, expect, it, vi } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { detectGrain } from '../../src/grain/index.js';
import { seeded, writeColumns } from './helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

const N = 400;

/** Instants `start + k·step` written as ISO 8601 UTC (Temporal.Instant.toString). */
function instants(startIso: string, stepMs: number, n = N, jitter?: (k: number) => number): string[] {
  const t0 = Temporal.Instant.from(startIso).epochMilliseconds;
  return Array.from({ length: n }, (_, k) =>
    Temporal.Instant.fromEpochMilliseconds(t0 + k * stepMs + (jitter ? jitter(k) : 0)).toString());
}

/** Consecutive calendar dates chosen by `keep` (Temporal.PlainDate arithmetic). */
function dates(start: string, count: number, keep: (d: Temporal.PlainDate) => boolean, stepDays = 1): string[] {
  const out: string[] = [];
  for (let d = Temporal.PlainDate.from(start); out.length < count; d = d.add({ days: stepDays })) if (keep(d)) out.push(d.toString());
  return out;
}

async function grainOf(values: string[], name = 'when', options = {}) {
  const report = await detectGrain(writeColumns({ [name]: values }), options);
  expect(report.columns).toHaveLength(1);
  return report.columns[0]!;
}

describe('detectGrain(file) finds sub-day grains of UTC instants', () => {
  const rnd = seeded(7);
  it.each([
    // [label, start, step ms, jitter, unit, step] — steps from the construction; Temporal writes the values.
    ['milliseconds', '2024-01-01T00:00:00Z', 1000, () => 1 + Math.floor(rnd() * 998), 'millisecond', 1],
    ['seconds', '2024-01-01T00:00:00Z', 1000, () => 1000 * Math.floor(rnd() * 3600), 'second', 1],
    ['minutes', '2024-01-01T00:00:00Z', 60_000, () => 60_000 * Math.floor(rnd() * 1000), 'minute', 1],
    ['5-minute slots', '2024-01-01T00:05:00Z', 300_000, undefined, 'minute', 5],
    ['15-minute slots', '2024-01-01T00:00:00Z', 900_000, undefined, 'minute', 15],
    ['30-minute slots', '2024-01-01T00:30:00Z', 1_800_000, undefined, 'minute', 30],
    ['hours', '2024-01-01T01:00:00Z', 3_600_000, undefined, 'hour', 1],
    ['6-hour slots', '2024-01-01T06:00:00Z', 6 * 3_600_000, undefined, 'hour', 6],
  ] as const)('%s', async (_label, start, step, jitter, unit, gstep) => {
    const c = await grainOf(instants(start, step, N, jitter));
    expect(c.grain).toMatchObject({ unit, step: gstep, anchor: 'start' });
    expect(c.level).toBe('quantitative');
    expect(c.coverage!.exceptions).toBe(0);
    expect(c.zone).toBe('UTC');
  });

  it('midnights written in UTC are days (ordinal); last instants of days (23:59:59) are days anchored at the end', async () => {
    const starts = await grainOf(instants('2024-01-01T00:00:00Z', 86_400_000));
    expect(starts.grain).toMatchObject({ unit: 'day', step: 1, anchor: 'start' });
    expect(starts.level).toBe('ordinal');
    const ends = await grainOf(instants('2024-01-01T23:59:59Z', 86_400_000));
    expect(ends.grain).toMatchObject({ unit: 'day', anchor: 'end' });
    const endsMs = await grainOf(instants('2024-01-01T23:59:59.999Z', 86_400_000));
    expect(endsMs.grain).toMatchObject({ unit: 'day', anchor: 'end' });
  });
});

describe('detectGrain(file) finds calendar grains of dates', () => {
  it.each([
    // Dates chosen with Temporal.PlainDate fields: dayOfWeek (ISO, Monday 1), day, month, daysInMonth.
    ['weeks starting Monday', dates('2023-01-02', 120, () => true, 7), 'week', 1, 'start', 1],
    ['weeks starting Sunday', dates('2023-01-01', 120, () => true, 7), 'week', 1, 'start', 7],
    ['fortnights starting Wednesday', dates('2023-01-04', 60, () => true, 14), 'week', 2, 'start', 3],
    ['months (1st)', dates('2015-01-01', 100, (d) => d.day === 1), 'month', 1, 'start', null],
    ['months (last day)', dates('2015-01-01', 100, (d) => d.day === d.daysInMonth), 'month', 1, 'end', null],
    ['quarters (first day)', dates('2000-01-01', 60, (d) => d.day === 1 && d.month % 3 === 1), 'quarter', 1, 'start', null],
    ['quarters (last day)', dates('2000-01-01', 60, (d) => d.day === d.daysInMonth && d.month % 3 === 0), 'quarter', 1, 'end', null],
    ['half-years', dates('1990-01-01', 40, (d) => d.day === 1 && (d.month === 1 || d.month === 7)), 'half', 1, 'start', null],
    ['years (1 January)', dates('1990-01-01', 20, (d) => d.day === 1 && d.month === 1), 'year', 1, 'start', null],
    ['years (31 December)', dates('1990-01-01', 20, (d) => d.day === 31 && d.month === 12), 'year', 1, 'end', null],
  ] as const)('%s', async (_label, values, unit, step, anchor, weekStart) => {
    const c = await grainOf([...values]);
    expect(c.grain).toMatchObject({ unit, step, anchor, weekStart });
    expect(c.level).toBe('ordinal');
    expect(c.cadence).toMatchObject({ kind: 'regular', every: step, missing: 0 });
  });

  it('fiscal years starting 1 October (US federal, 31 U.S.C. §1102) are fiscal years, not calendar years', async () => {
    const c = await grainOf(dates('2000-01-01', 12, (d) => d.day === 1 && d.month === 10));
    expect(c.grain).toMatchObject({ unit: 'fiscal-year', anchor: 'start', fiscalStart: { month: 10, day: 1 } });
  });

  it('a column named week_ending of Saturdays holds weeks ending Saturday (weeks starting Sunday, anchor end)', async () => {
    // 2024-01-06 is a Saturday: Temporal.PlainDate.from('2024-01-06').dayOfWeek === 6.
    expect(Temporal.PlainDate.from('2024-01-06').dayOfWeek).toBe(6);
    const c = await grainOf(dates('2024-01-06', 50, () => true, 7), 'week_ending');
    expect(c.grain).toMatchObject({ unit: 'week', anchor: 'end', weekStart: 7 });
  });

  it('the last instant of each month (local 23:59:59, no offset) is a month anchored at the end', async () => {
    const values = dates('2020-01-01', 40, (d) => d.day === d.daysInMonth).map((d) => `${d}T23:59:59`);
    const c = await grainOf(values);
    expect(c.grain).toMatchObject({ unit: 'month', anchor: 'end' });
    expect(c.zone).toBeNull();
    expect(c.zoneFinding.basis).toBe('none');
  });
});

describe('detectGrain(file) reads notations: a period column has at least the grain its notation states', () => {
  it('quarter labels that are all Q1 are years; month labels on quarter months are quarters', async () => {
    const q1 = Array.from({ length: 12 }, (_, i) => `${2010 + i}-Q1`);
    expect((await grainOf(q1)).grain).toMatchObject({ unit: 'year' });
    const months = Array.from({ length: 24 }, (_, i) => `${2010 + Math.floor(i / 4)}-${String(1 + 3 * (i % 4)).padStart(2, '0')}`);
    expect((await grainOf(months)).grain).toMatchObject({ unit: 'quarter' });
    const mixed = Array.from({ length: 24 }, (_, i) => `${2010 + Math.floor(i / 12)}-${String(1 + (i % 12)).padStart(2, '0')}`);
    expect((await grainOf(mixed)).grain).toMatchObject({ unit: 'month' });
  });

  it('epidemiological week labels keep the epi-week unit (Sunday start)', async () => {
    const c = await grainOf(Array.from({ length: 30 }, (_, i) => `2024-EW${String(i + 1).padStart(2, '0')}`));
    expect(c.grain).toMatchObject({ unit: 'epi-week', weekStart: 7 });
    expect(c.cadence).toMatchObject({ kind: 'regular', every: 1 });
  });

  it('a year column of plain integers holds years', async () => {
    const c = await grainOf(Array.from({ length: 15 }, (_, i) => String(2010 + i)), 'year');
    expect(c.format).toBe('iso-year');
    expect(c.grain).toMatchObject({ unit: 'year', step: 1 });
    expect(c.level).toBe('ordinal');
  });
});
