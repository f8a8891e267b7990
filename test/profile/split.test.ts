// How profile shares a big file's columns between two threads (src/profile/split.ts): which columns the
// worker takes, when 'auto' takes two threads, and what a column's cost is. The report itself is the same on
// one thread and two (test/profile/byte-path.test.ts compares them); these pin the choices made on the way.
import { describe, expect, it } from 'vitest';
import { ProfileColumn } from '../../src/profile/column.js';
import { AUTO_SPLIT_BYTES, SHAPE_COST, autoThreads, workerColumns } from '../../src/profile/split.js';

/** The work each thread is left with by workerColumns (the main thread carries the shape). */
function loads(costs: number[]): { worker: number; main: number } {
  const theirs = new Set(workerColumns(costs));
  let worker = 0;
  let main = SHAPE_COST;
  costs.forEach((c, k) => (theirs.has(k) ? (worker += c) : (main += c)));
  return { worker, main };
}

describe('workerColumns(costs)', () => {
  it('gives the worker the one date-like column of the benchmark file (ts,site,age,amount) and the rest to the main thread', () => {
    // CPU profiles of the benchmark's 10M-row file on two threads: ts about 0.8 s, each other column 0.25 to 0.4 s.
    expect(workerColumns([3, 1, 1, 1])).toEqual([0]);
  });

  it('sends two date-like columns to different threads', () => {
    const theirs = workerColumns([1, 3, 1, 1, 3, 1]);
    expect(theirs.filter((k) => k === 1 || k === 4)).toHaveLength(1);
  });

  it('alternates columns of equal cost, the main thread keeping one less for the shape', () => {
    expect(workerColumns([1, 1, 1, 1])).toEqual([0, 2]);
    expect(workerColumns([1, 1])).toEqual([0]);
  });

  it('always gives the worker a column, in header order; cheap columns may all go to it', () => {
    // Two columns of half the shape's cost: the main thread keeps only the shape (0.5 + 0.5 against 1).
    expect(workerColumns([0.5, 0.5])).toEqual([0, 1]);
    const theirs = workerColumns([1, 2, 3, 4, 5, 6, 7]);
    expect(theirs.length).toBeGreaterThan(0);
    expect([...theirs].sort((a, b) => a - b)).toEqual(theirs);
  });

  it('leaves the two threads within one column of each other (greedy longest-first; common practice)', () => {
    for (const costs of [[3, 1, 1, 1], [1, 3, 1, 1, 3, 1], [3, 3, 2, 2, 2], [3, 3, 3, 1], [1, 1, 1, 1, 1, 1, 1, 1, 1]]) {
      const { worker, main } = loads(costs);
      expect(Math.abs(worker - main)).toBeLessThanOrEqual(Math.max(...costs));
    }
  });
});

describe('autoThreads(fileBytes, cores)', () => {
  it('takes two threads from AUTO_SPLIT_BYTES on, with two cores or more', () => {
    expect(autoThreads(AUTO_SPLIT_BYTES, 2)).toBe(2);
    expect(autoThreads(AUTO_SPLIT_BYTES * 4, 8)).toBe(2);
  });

  it('takes one below it, or on one core', () => {
    expect(autoThreads(AUTO_SPLIT_BYTES - 1, 2)).toBe(1);
    expect(autoThreads(AUTO_SPLIT_BYTES * 4, 1)).toBe(1);
    expect(autoThreads(0, 2)).toBe(1);
  });
});

describe('ProfileColumn.splitCost', () => {
  it('is three for a column grain reads as time, one for text and numbers', () => {
    const ts = new ProfileColumn('ts');
    const site = new ProfileColumn('site');
    const amount = new ProfileColumn('amount');
    for (let i = 0; i < 1_200; i++) {
      ts.push(new Date(Date.UTC(2024, 0, 1) + i * 61_000).toISOString(), i + 2);
      site.push(`site${i % 40}`, i + 2);
      amount.push((i * 0.37).toFixed(2), i + 2);
    }
    expect([ts.splitCost, site.splitCost, amount.splitCost]).toEqual([3, 1, 1]);
  });
});
