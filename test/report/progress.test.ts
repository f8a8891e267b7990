import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { formatBytes, makeProgress, PROGRESS_MIN_BYTES } from '../../cli/progress.js';
import type { CliIO } from '../../cli/io.js';

const MiB = 1024 * 1024;

function fakeIO(tty: boolean): { io: CliIO; err: () => string; writes: () => number } {
  let err = '';
  let writes = 0;
  const io: CliIO = {
    stdout: { write: () => true, isTTY: tty, columns: 100 },
    stderr: { write: (s: string) => { err += s; writes++; return true; }, isTTY: tty, columns: 100 },
    stdin: Readable.from([]),
    env: {},
    cwd: '.',
  };
  return { io, err: () => err, writes: () => writes };
}

/** A clock the test moves by hand. */
function clock(start = 1_000_000) {
  let t = start;
  return { now: () => t, advance: (ms: number) => { t += ms; } };
}

describe('makeProgress(io, totalBytes)', () => {
  it('makeProgress(io, big) is silent when stderr is not a terminal', () => {
    const { io, err } = fakeIO(false);
    const p = makeProgress(io, 100 * MiB);
    p.onProgress(50 * MiB, 100 * MiB, 1000);
    p.stop();
    expect(p.active).toBe(false);
    expect(err()).toBe('');
  });

  it('makeProgress(io, small) is silent under the size threshold on a terminal', () => {
    const { io, err } = fakeIO(true);
    const p = makeProgress(io, PROGRESS_MIN_BYTES - 1);
    p.onProgress(1000, PROGRESS_MIN_BYTES - 1);
    p.stop();
    expect(err()).toBe('');
  });

  it('makeProgress(io, big) draws bytes, rows, percentage and rate on a terminal', () => {
    const { io, err } = fakeIO(true);
    const c = clock();
    const p = makeProgress(io, 100 * MiB, { now: c.now, label: 'visits.csv' });
    p.onProgress(0, 100 * MiB, 0);
    c.advance(2000);
    p.onProgress(50 * MiB, 100 * MiB, 123456);
    const text = err();
    p.stop();
    expect(text).toContain('visits.csv');
    expect(text).toContain('50%');
    expect(text).toContain('50 MiB of 100 MiB');
    expect(text).toContain('123,456 rows');
    expect(text).toContain('25 MiB/s'); // 50 MiB in 2 s
    expect(text).toContain('█');
  });

  it('makeProgress(io, big) throttles: a million callbacks within 100 ms draw at most a couple of times', () => {
    const { io, writes } = fakeIO(true);
    const c = clock();
    const p = makeProgress(io, 100 * MiB, { now: c.now });
    p.onProgress(0, 100 * MiB);
    const before = writes();
    for (let i = 0; i < 1_000_000; i++) p.onProgress(i, 100 * MiB);
    expect(writes() - before).toBeLessThanOrEqual(4);
    p.stop();
  });

  it('makeProgress(io, unknown size) starts once the threshold is passed and shows bytes read, no percentage', () => {
    const { io, err } = fakeIO(true);
    const c = clock();
    const p = makeProgress(io, 0, { now: c.now });
    p.onProgress(MiB, 0);
    expect(err()).toBe('');
    c.advance(1000);
    p.onProgress(8 * MiB, 0, 10);
    expect(err()).toContain('8.0 MiB read');
    expect(err()).not.toContain('%');
    p.stop();
  });

  it('stop() clears the line and is safe to call twice', () => {
    const { io, err } = fakeIO(true);
    const c = clock();
    const p = makeProgress(io, 100 * MiB, { now: c.now });
    p.onProgress(MiB, 100 * MiB);
    p.stop();
    const after = err();
    p.stop();
    p.onProgress(2 * MiB, 100 * MiB);
    expect(err()).toBe(after);
    expect(after.endsWith('\u001b[2K') || after.includes('\u001b[2K')).toBe(true); // ECMA-48 EL 2: erase the whole line
  });
});

describe('formatBytes(bytes)', () => {
  it.each([
    // IEC 80000-13 binary prefixes: 1 KiB = 1024 B, 1 MiB = 1024 KiB
    [512, '512 B'],
    [1024, '1.0 KiB'],
    [1536, '1.5 KiB'],
    [10 * MiB, '10 MiB'],
    [1024 * MiB, '1.0 GiB'],
  ])('formatBytes(%d) is %s', (n, text) => {
    expect(formatBytes(n)).toBe(text);
  });
});

describe('makeProgress(io) with the size known only to the reader', () => {
  it('makeProgress(io) takes the total from the callback and stays silent for a small input', () => {
    const { io, err } = fakeIO(true);
    const c = clock();
    const p = makeProgress(io, undefined, { now: c.now });
    p.onProgress(100, 1000);
    c.advance(500);
    p.onProgress(1000, 1000);
    p.stop();
    expect(err()).toBe('');
  });

  it('makeProgress(io) draws a percentage when the callback carries a big total', () => {
    const { io, err } = fakeIO(true);
    const c = clock();
    const p = makeProgress(io, undefined, { now: c.now });
    p.onProgress(0, 40 * MiB);
    c.advance(1000);
    p.onProgress(10 * MiB, 40 * MiB);
    expect(err()).toContain('25%');
    p.stop();
  });
});
