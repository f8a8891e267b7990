// runRanges/planRanges: every record of a file is counted once, in file order, whatever the split —
// including splits that fall inside a quoted field (a line feed inside quotes, RFC 4180 §2.6).
import { mkdtempSync, writeFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { threadId } from 'node:worker_threads';
import { lineBases, planRanges, runRanges, siblingModule, startRangeWorkers, type ByteRange } from '../../src/parallel/index.js';
import { isQuernError } from '../../src/errors.js';
import type { CountPartial } from './tasks.js';

const dir = mkdtempSync(join(tmpdir(), 'quern-parallel-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const tasks = siblingModule(import.meta.url, 'tasks');

/** A CSV whose every 7th record holds a quoted field with line feeds in it. */
function writeFile(name: string, rows: number): { path: string; records: string[] } {
  const records: string[] = [];
  for (let i = 0; i < rows; i++) records.push(i % 7 === 3 ? `${i},"two\nline ""quoted""\nvalue"` : `${i},plain value ${i}`);
  const path = join(dir, name);
  writeFileSync(path, `id,text\n${records.join('\n')}\n`);
  return { path, records };
}

/** Ranges cut at fixed byte offsets, each start just after a line feed (the way planRanges cuts). */
async function cutEvery(path: string, bytes: number): Promise<ByteRange[]> {
  const size = statSync(path).size;
  return planRanges(path, size, bytes);
}

describe('runRanges', () => {
  it('planRanges(file, size, n) starts every range just after a line feed and covers the file', async () => {
    const { path } = writeFile('plan.csv', 2000);
    const size = statSync(path).size;
    const ranges = await planRanges(path, size, 4096);
    const { readFileSync } = await import('node:fs');
    const b = readFileSync(path);
    expect(ranges.length).toBeGreaterThan(5);
    expect(ranges[0]!.start).toBe(0);
    expect(ranges[ranges.length - 1]!.end).toBe(size);
    for (let k = 1; k < ranges.length; k++) {
      expect(ranges[k]!.start).toBe(ranges[k - 1]!.end);
      expect(b[ranges[k]!.start - 1]).toBe(10); // LF just before (the split rule)
    }
  });

  it('runRanges uses threads started ahead that said they were ready before it listened', async () => {
    const { path, records } = writeFile('ahead.csv', 1500);
    const ranges = await cutEvery(path, 2048);
    const workers = startRangeWorkers(tasks, 'countRecords', 2);
    // Wait until both have posted 'ready' (a listener of the test's own): the pool's lanes come later.
    await Promise.all(workers.threads.map((t) => new Promise<void>((resolve) => {
      const on = (m: { type: string }): void => {
        if (m.type === 'ready') {
          t.worker.off('message', on);
          resolve();
        }
      };
      t.worker.on('message', on);
    })));
    const outcomes = await runRanges<unknown, CountPartial>({ moduleUrl: tasks, exportName: 'countRecords', file: path, options: {}, ranges, threads: 2, workers, mainTakesPart: false });
    expect(outcomes.flatMap((o) => o.partial.records)).toEqual(records);
    // Both threads read ranges (the main thread only mends splits inside quotes).
    expect(new Set(outcomes.map((o) => o.partial.thread).filter((t) => t !== threadId)).size).toBe(2);
  }, 20_000);

  it.each([1, 2, 3])('runRanges on %i thread(s) gives every record once, in order, mending splits inside quotes', async (threads) => {
    const { path, records } = writeFile(`t${threads}.csv`, 3000);
    const ranges = await cutEvery(path, 2048);
    const outcomes = await runRanges<unknown, CountPartial>({ moduleUrl: tasks, exportName: 'countRecords', file: path, options: {}, ranges, threads,
      // Workers alone, so the test sees them share the ranges (the main thread would be faster than their start-up).
      mainTakesPart: threads === 1 });
    expect(outcomes.map((o) => o.range.index)).toEqual(ranges.map((r) => r.index));
    // Splits at a line feed inside quotes were read again from the true record start (the previous stop).
    for (let k = 1; k < outcomes.length; k++) expect(outcomes[k]!.range.start).toBe(outcomes[k - 1]!.stop);
    expect(outcomes.flatMap((o) => o.partial.records)).toEqual(records);
    // The split did fall inside quotes somewhere, so the mending was exercised.
    expect(outcomes.some((o, k) => o.range.start !== ranges[k]!.start)).toBe(true);
    if (threads > 1) expect(new Set(outcomes.map((o) => o.partial.thread)).size).toBeGreaterThan(1);
    else expect(outcomes.every((o) => o.partial.thread === threadId)).toBe(true);
  }, 60_000);

  it('lineBases(outcomes) shifts each range to its first physical line', async () => {
    const { path, records } = writeFile('lines.csv', 500);
    const ranges = await cutEvery(path, 1024);
    const outcomes = await runRanges<unknown, CountPartial>({ moduleUrl: tasks, exportName: 'countRecords', file: path, options: {}, ranges, threads: 1 });
    const bases = lineBases(outcomes);
    // Line of the first record of each range = 1 + line feeds before it (header is line 1).
    const { readFileSync } = await import('node:fs');
    const b = readFileSync(path);
    for (let k = 1; k < outcomes.length; k++) {
      let lf = 0;
      for (let i = 0; i < outcomes[k]!.range.start; i++) if (b[i] === 10) lf++;
      expect(bases[k]! + 1).toBe(lf + 1);
    }
    expect(outcomes.reduce((a, o) => a + o.partial.records.length, 0)).toBe(records.length);
  });

  it('runRanges rejects with the QuernError a worker range throws, code and hint kept', async () => {
    const { path } = writeFile('fail.csv', 2000);
    const ranges = await cutEvery(path, 2048);
    const run = runRanges({ moduleUrl: tasks, exportName: 'failOnSecond', file: path, options: {}, ranges, threads: 2, mainTakesPart: false });
    const e = await run.catch((x: unknown) => x);
    expect(isQuernError(e, 'E_DATA')).toBe(true);
    expect((e as Error).message).toBe(`range 1 of ${path} is bad`);
    expect((e as { hint?: string }).hint).toBe('a hint');
  }, 60_000);
});
