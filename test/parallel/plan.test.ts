// The default size of the byte ranges of a parallel read (src/parallel/plan.ts) and the ranges planned
// with it: about RANGES_PER_THREAD ranges a thread, none under 8 MiB, each starting just after a line feed.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { defaultBytesPerRange, planRanges, RANGES_PER_THREAD } from '../../src/parallel/index.js';

const MiB = 1 << 20;
const dir = mkdtempSync(join(tmpdir(), 'quern-plan-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('defaultBytesPerRange', () => {
  it('gives each thread RANGES_PER_THREAD ranges of a big file', () => {
    expect(RANGES_PER_THREAD).toBe(2);
    // The benchmark file: 374,249,166 bytes on two threads → four ranges of 93,562,292 bytes (rounded up).
    expect(defaultBytesPerRange(374_249_166, 2)).toBe(Math.ceil(374_249_166 / 4));
    expect(defaultBytesPerRange(1 << 30, 8)).toBe((1 << 30) / 16);
  });

  it('never goes under 8 MiB, so a small file is a few ranges at most', () => {
    expect(defaultBytesPerRange(40 * MiB, 4)).toBe(8 * MiB);
    expect(defaultBytesPerRange(1, 64)).toBe(8 * MiB);
  });
});

describe('planRanges with the default size', () => {
  it('cuts an 18 MiB file on two threads into two ranges (8 MiB and the rest) meeting just after a line feed', async () => {
    const line = '2024-01-01T00:00:00Z,site1,42,1.50\n'; // 35 bytes
    const file = join(dir, 'a.csv');
    const body = line.repeat(Math.ceil((18 * MiB) / line.length));
    writeFileSync(file, 'ts,site,age,amount\n' + body);
    const size = 19 + body.length;
    const ranges = await planRanges(file, size, defaultBytesPerRange(size, 2), { bodyStart: 19 });
    expect(ranges).toHaveLength(2);
    expect(ranges[0]!.start).toBe(0);
    expect(ranges[1]!.end).toBe(size);
    expect(ranges[0]!.end).toBe(ranges[1]!.start);
    expect((ranges[1]!.start - 19) % line.length).toBe(0); // just after a line feed of the body
    expect(ranges[1]!.start).toBeGreaterThanOrEqual(8 * MiB);
  });
});
