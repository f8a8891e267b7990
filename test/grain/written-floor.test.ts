// Instants and wall-clock readings are never reported finer than the notation writes them: values written
// to the second hold seconds however few they are (tolerance rule 2 stops the climb above the notation,
// never below it). Values are written by the Temporal polyfill with a chosen smallestUnit.
import { describe, expect, it, vi } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { detectGrain } from '../../src/grain/index.js';
import { writeColumns } from './helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in the benchmark).
vi.setConfig({ testTimeout: 60_000 });

type Unit = 'minute' | 'second' | 'millisecond';
const write = (iso: string, smallestUnit: Unit): string => Temporal.Instant.from(iso).toString({ smallestUnit });

async function grainOf(values: string[]) {
  return (await detectGrain(writeColumns({ when: values }))).columns[0]!;
}

const THREE = ['2024-03-05T08:15:00Z', '2024-03-05T09:40:00Z', '2024-03-06T11:02:00Z'];

describe('detectGrain: the written clock unit is the floor for instants', () => {
  it('three values written to the second are seconds, not milliseconds, and the finding says why', async () => {
    const c = await grainOf(THREE.map((t) => write(t, 'second')));
    expect(c.grain).toMatchObject({ unit: 'second', step: 1, anchor: 'start' });
    expect(c.notationUnit).toBe('second');
    expect(c.level).toBe('quantitative');
    expect(c.findings.join(' ')).toMatch(/All 3 values are written to the second, and too few of them lie on coarser boundaries/);
  });

  it('the same instants written with three fraction digits (.000) stay milliseconds: the notation claims them', async () => {
    const c = await grainOf(THREE.map((t) => write(t, 'millisecond')));
    expect(c.grain!.unit).toBe('millisecond');
    expect(c.notationUnit).toBeNull();
  });

  it('two values written to the minute are minutes', async () => {
    const c = await grainOf(THREE.slice(0, 2).map((t) => write(t, 'minute')));
    expect(c.grain).toMatchObject({ unit: 'minute', step: 1 });
    expect(c.findings.join(' ')).toMatch(/Both values are written to the minute/);
  });

  it('one value written with a fraction among values written to the second makes the column milliseconds', async () => {
    const values = THREE.map((t) => write(t, 'second'));
    values.push('2024-03-07T10:00:00.250Z');
    const c = await grainOf(values);
    expect(c.grain!.unit).toBe('millisecond');
  });

  it('the floor does not stop the climb: 24 hourly values written to the second are hours (rule 2: 5 distinct for 60×)', async () => {
    const t0 = Temporal.Instant.from('2024-03-05T00:00:00Z');
    const values = Array.from({ length: 24 }, (_, k) => t0.add({ hours: k * 5 }).toString({ smallestUnit: 'second' }));
    const c = await grainOf(values);
    expect(c.grain).toMatchObject({ unit: 'hour', step: 1 });
    expect(c.notationUnit).toBe('second');
  });

  it('wall-clock readings written to the minute (no offset) are minutes', async () => {
    const c = await grainOf(['2024-03-05 08:15', '2024-03-05 09:41', '2024-03-07 17:03']);
    expect(c.grain).toMatchObject({ unit: 'minute', step: 1 });
    expect(c.zone).toBeNull();
  });

  it('a few epoch seconds are seconds; a few epoch milliseconds are milliseconds (POSIX seconds since the Epoch)', async () => {
    // 1709626500 s = 2024-03-05T08:15:00Z (Temporal.Instant.fromEpochMilliseconds(1709626500000).toString()).
    expect(Temporal.Instant.fromEpochMilliseconds(1709626500000).toString()).toBe('2024-03-05T08:15:00Z');
    const s = await grainOf(['1709626500', '1709631600', '1709722920']);
    expect(s.format).toBe('epoch-seconds');
    expect(s.grain!.unit).toBe('second');
    const ms = await grainOf(['1709626500000', '1709631600000', '1709722920000']);
    expect(ms.format).toBe('epoch-milliseconds');
    expect(ms.grain!.unit).toBe('millisecond');
  });

  it('day/month/year dates with a time written to the minute are minutes', async () => {
    const c = await grainOf(['25/03/2024 08:15', '26/03/2024 09:41', '27/03/2024 17:03']);
    expect(c.formatLabel).toMatch(/day\/month\/year/);
    expect(c.grain).toMatchObject({ unit: 'minute', step: 1 });
  });
});
