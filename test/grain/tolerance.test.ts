// The tolerance rule (src/grain/tolerance.ts) both ways: a few stray values do not hide a clear grain, and a
// few aligned values among many others do not fake one; and no grain is claimed from too few values.
// Values are built with the Temporal polyfill.
import { describe, expect, it, vi } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { detectGrain, distinctNeeded, holds } from '../../src/grain/index.js';
import { writeColumns } from './helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

const DAY = 86_400_000;
const t0 = Temporal.Instant.from('2024-01-01T00:00:00Z').epochMilliseconds;
const iso = (ms: number): string => Temporal.Instant.fromEpochMilliseconds(ms).toString();

async function column(values: string[], name = 'when') {
  return (await detectGrain(writeColumns({ [name]: values }))).columns[0]!;
}

describe('holds(onGrain, total) and distinctNeeded(ratio)', () => {
  it.each([
    // The rule as written in tolerance.ts: at least 99% on the grain.
    [99, 100, true], [98, 100, false], [990, 1000, true], [989, 1000, false], [0, 0, false],
  ])('holds(%i, %i) is %s', (on, total, expected) => {
    expect(holds(on, total)).toBe(expected);
  });

  it.each([
    // n with (1/r)^n < 1/1000, at least 5: r = 24 → 5 (the minimum), r = 3 → 7, r = 2 → 10 (log 1000 / log r).
    [24, 5], [3, 7], [2, 10], [1000, 5],
  ])('distinctNeeded(%i) is %i', (ratio, n) => {
    expect(distinctNeeded(ratio)).toBe(n);
  });
});

describe('detectGrain(file) tolerates strays', () => {
  it('3 stray times among 500 midnights do not hide the day grain; they are reported with their lines', async () => {
    const values = Array.from({ length: 500 }, (_, k) => iso(t0 + k * DAY));
    values[10] = iso(t0 + 10 * DAY + 3_600_000 * 9 + 60_000 * 17);
    values[200] = iso(t0 + 200 * DAY + 1_000);
    values[499] = iso(t0 + 499 * DAY + 43_200_000);
    const c = await column(values);
    expect(c.grain).toMatchObject({ unit: 'day' });
    expect(c.coverage).toMatchObject({ onGrain: 497, exceptions: 3 });
    // Data row k sits on line k + 2 (line 1 is the header).
    expect(c.coverage!.examples.map((e) => e.line)).toEqual([12, 202, 501]);
    expect(c.coverage!.examples[0]!.value).toBe(values[10]);
    expect(c.findings.join(' ')).toMatch(/497 of 500 values \(99\.40%\)/);
  });

  it('4 midnights among 500 random instants do not fake a day grain', async () => {
    const values = Array.from({ length: 500 }, (_, k) => iso(t0 + k * 7_654_321));
    for (const k of [3, 50, 100, 400]) values[k] = iso(t0 + k * DAY);
    const c = await column(values);
    expect(c.grain!.unit).toBe('millisecond');
    expect(c.level).toBe('quantitative');
  });

  it('6 strays in 500 (1.2%) are too many: the grain falls back to the finer one that holds', async () => {
    const values = Array.from({ length: 500 }, (_, k) => iso(t0 + k * DAY));
    for (const k of [1, 2, 3, 4, 5, 6]) values[k] = iso(t0 + k * DAY + 3_600_000);
    const c = await column(values);
    expect(c.grain).toMatchObject({ unit: 'hour', step: 1 });
  });
});

describe('detectGrain(file) never claims a grain from too few values', () => {
  it('4 midnights are not enough to call date-times days (minimum 5 distinct values)', async () => {
    const c = await column([0, 1, 2, 3].map((k) => iso(t0 + k * DAY)));
    expect(c.grain!.unit).not.toBe('day');
  });

  it('5 midnights are enough', async () => {
    const c = await column([0, 1, 2, 3, 4].map((k) => iso(t0 + k * DAY)));
    expect(c.grain!.unit).toBe('day');
  });

  it('6 quarter starts are months, not quarters: 3 months a quarter needs 7 distinct values', async () => {
    const dates = ['2020-01-01', '2020-04-01', '2020-07-01', '2020-10-01', '2021-01-01', '2021-04-01'];
    expect((await column(dates)).grain!.unit).toBe('month');
    expect((await column([...dates, '2021-07-01'])).grain!.unit).toBe('quarter');
  });

  it('repeated rows of few distinct values do not count as more evidence', async () => {
    const values = Array.from({ length: 400 }, (_, k) => iso(t0 + (k % 3) * DAY));
    const c = await column(values);
    expect(c.grain!.unit).not.toBe('day');
  });
});
