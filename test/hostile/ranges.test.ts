// Hostile ranges through `quern overlaps` and the range model: reversed ranges are rejected with their
// line, zero-length ranges are listed as holding nothing, and a million identical ranges are one
// duplicate group found in seconds (a sweep, not all pairs).
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { checkRanges, makeRange, parseRangeLabel, type Range } from '../../src/index.js';
import { runCli } from '../helpers/cli.js';
import { INPUTS, STACK_LINE, scratch } from './helpers.js';

const tmp = scratch('ranges');
afterAll(() => tmp.cleanup());

interface OverlapsJson {
  ranges: number; rowsRead: number;
  rejected: { count: number; byReason: Record<string, number>; examples: { line: number; value: string; reason: string }[] };
  series: { ranges: number; overlapCount: number; duplicates: { range: string; lines: number[] }[]; empty: { line: number; range: string }[] }[];
  totals: { overlaps: number; holes: number; duplicates: number };
}

async function overlapsJson(argv: string[]): Promise<OverlapsJson> {
  const r = await runCli(['overlaps', ...argv, '--json']);
  expect(r.stderr).not.toMatch(STACK_LINE);
  expect(r.status, r.stderr).toBe(0);
  const j = JSON.parse(r.stdout) as OverlapsJson;
  // Every row is a range or rejected (empty ranges are ranges that hold nothing).
  expect(j.ranges + j.rejected.count).toBe(j.rowsRead);
  return j;
}

describe('quern overlaps on reversed and zero-length ranges', () => {
  it('rejects a range whose end is before its start, naming its line, and lists [3,3) as empty', async () => {
    const j = await overlapsJson([join(INPUTS, 'reversed-ranges.csv'), '--start', 's', '--end', 'e', '--ends', 'half-open']);
    expect(j.rowsRead).toBe(4);
    expect(j.rejected.byReason).toEqual({ 'reversed-range': 1 });
    expect(j.rejected.examples[0]).toMatchObject({ line: 2, value: '10/5', reason: 'reversed-range' });
    // [3,3) holds no value (a half-open interval with equal ends is empty: ISO 80000-2 2-7.7).
    expect(j.series[0]!.empty).toEqual([{ line: 3, range: '[3,3)' }]);
    // [0,2) and [2,3) meet (Allen 1983): no overlap, no hole.
    expect(j.totals).toMatchObject({ overlaps: 0, holes: 0, duplicates: 0 });
  });

  it('reads an inclusive zero-length range 3-3 as the single value 3 (discrete: 3..3), not as empty', async () => {
    const f = tmp.file('zero-discrete.csv', 's,e\n3,3\n0,2\n');
    const j = await overlapsJson([f, '--start', 's', '--end', 'e', '--ends', 'discrete']);
    expect(j.series[0]!.empty).toEqual([]);
    expect(j.totals).toMatchObject({ overlaps: 0, holes: 0 });
  });

  it('rejects a reversed date range', async () => {
    const f = tmp.file('reversed-dates.csv', 's,e\n2024-03-01,2024-01-01\n2024-01-01,2024-01-31\n');
    const j = await overlapsJson([f, '--start', 's', '--end', 'e']);
    expect(j.rejected.count).toBe(1);
    expect(j.rejected.examples[0]!.line).toBe(2);
  });

  it.each([
    ['10-5', 'a reversed dash label'],
    ['[5,3)', 'reversed interval notation'],
  ])('parseRangeLabel(%j) is null (%s)', (label) => {
    expect(parseRangeLabel(label)).toBeNull();
  });
});

describe('a million identical ranges', () => {
  it('checkRanges finds one duplicate group of 1,000,000 and no overlapping pairs, in seconds', () => {
    const r: Range = makeRange(5, 10, true, false);
    const ranges = Array.from({ length: 1_000_000 }, () => ({ ...r }));
    const frozen = Object.freeze(ranges.slice(0, 3));
    const t0 = performance.now();
    const c = checkRanges(ranges);
    const ms = performance.now() - t0;
    expect(c.duplicates).toHaveLength(1);
    expect(c.duplicates[0]!.indices).toHaveLength(1_000_000);
    expect([c.overlapCount, c.holes.length, c.ranges]).toEqual([0, 0, 1_000_000]);
    // A hang guard, not a benchmark: all pairs would be 5e11 comparisons.
    expect(ms).toBeLessThan(30_000);
    expect(checkRanges(frozen).duplicates[0]!.indices).toEqual([0, 1, 2]);
  });

  it('quern overlaps --check on a million identical rows reports one duplicate and exits 1, in seconds', async () => {
    const f = tmp.file('million.csv', `s,e\n${'5,10\n'.repeat(1_000_000)}`);
    const t0 = performance.now();
    const r = await runCli(['overlaps', f, '--start', 's', '--end', 'e', '--check']);
    expect(performance.now() - t0).toBeLessThan(60_000);
    expect(r.stderr).not.toMatch(STACK_LINE);
    expect(r.status).toBe(1); // cli/exit.ts: --check found problems
    expect(r.stdout).toContain('1,000,000 ranges');
    expect(r.stdout).toMatch(/duplicate 5-10 ×1000000 on lines 2, 3, 4/);
  });
});
