// Cadence of the distinct periods of generated date columns (Temporal polyfill dates; weekday numbers are
// Temporal's ISO dayOfWeek, Monday 1 … Sunday 7).
import { describe, expect, it, vi } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { detectGrain } from '../../src/grain/index.js';
import { cadenceOf } from '../../src/grain/cadence.js';
import { seeded, writeColumns } from './helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

async function cadence(values: string[]) {
  const c = (await detectGrain(writeColumns({ when: values }))).columns[0]!;
  return { grain: c.grain!, cadence: c.cadence! };
}

function days(from: string, to: string, keep: (d: Temporal.PlainDate) => boolean): string[] {
  const out: string[] = [];
  const end = Temporal.PlainDate.from(to);
  for (let d = Temporal.PlainDate.from(from); Temporal.PlainDate.compare(d, end) <= 0; d = d.add({ days: 1 })) if (keep(d)) out.push(d.toString());
  return out;
}

describe('cadence of detectGrain(file)', () => {
  it('every day of 2024 is regular daily: 366 distinct periods (2024 is a leap year), none missing', async () => {
    const { cadence: c } = await cadence(days('2024-01-01', '2024-12-31', () => true));
    expect(c).toMatchObject({ kind: 'regular', every: 1, unit: 'day', distinct: 366, missing: 0, distinctExact: true });
  });

  it('Monday to Friday only is "weekdays"', async () => {
    const { cadence: c } = await cadence(days('2024-01-01', '2024-06-30', (d) => d.dayOfWeek <= 5));
    expect(c.kind).toBe('weekdays');
  });

  it('one day in each month on varying days is "monthly"', async () => {
    const rnd = seeded(3);
    const values: string[] = [];
    for (let m = 0; m < 36; m++) {
      const first = Temporal.PlainDate.from('2020-01-01').add({ months: m });
      values.push(first.add({ days: 1 + Math.floor(rnd() * (first.daysInMonth - 2)) }).toString());
    }
    const { grain, cadence: c } = await cadence(values);
    expect(grain.unit).toBe('day');
    expect(c.kind).toBe('monthly');
  });

  it('one day in each week on varying weekdays is "weekly"', async () => {
    const values: string[] = [];
    for (let w = 0; w < 40; w++) values.push(Temporal.PlainDate.from('2024-01-01').add({ days: 7 * w + (w % 5) }).toString());
    const { cadence: c } = await cadence(values);
    expect(c.kind).toBe('weekly');
  });

  it('a regular series with a gap counts the missing periods', async () => {
    const values = days('2024-01-01', '2024-03-31', (d) => !(d.month === 2 && d.day >= 10 && d.day < 20));
    const { cadence: c } = await cadence(values);
    expect(c).toMatchObject({ kind: 'regular', every: 1, missing: 10 });
  });

  it('cadenceOf(grain, keys, rows) calls uneven gaps irregular and counts repeated rows', () => {
    const c = cadenceOf({ unit: 'day', step: 1, anchor: 'start', weekStart: null }, [0, 1, 5, 6, 20, 21, 22, 40], 10);
    expect(c).toMatchObject({ kind: 'irregular', distinct: 8, repeated: 2, typicalGap: 1 });
    const single = cadenceOf({ unit: 'month', step: 1, anchor: 'start', weekStart: null }, [7], 3);
    expect(single).toMatchObject({ kind: 'single', distinct: 1, repeated: 2 });
  });
});
