// Splits a plain file into byte ranges for parallel reading. Each range after the first starts just after
// a line feed: a record start unless a quoted field holds that line feed, which the pool detects and mends.
import { open, type FileHandle } from 'node:fs/promises';
import { resolve } from 'node:path';
import { fileError } from '../table/source.js';
import type { ByteRange } from './types.js';

const LF = 0x0a;
const WINDOW = 64 * 1024;

/**
 * Ranges a thread takes by default. Each range costs its thread a start (header, buffers, warming the
 * scan) of some milliseconds: on the two-core benchmark machine, rebin on 10M rows on two threads took
 * 0.80-0.83 s with eight ranges a thread and 0.71-0.79 s with two (one thread: 0.79-0.82 s). Two still
 * let a thread that started late take fewer.
 */
export const RANGES_PER_THREAD = 2;

/** The default bytes per range of a file of `size` bytes read on `threads` threads: at least 8 MiB. */
export function defaultBytesPerRange(size: number, threads: number): number {
  return Math.max(8 << 20, Math.ceil(size / (threads * RANGES_PER_THREAD)));
}

/**
 * Ranges of about `bytesPerRange` bytes covering a plain file of `size` bytes; every boundary is just after
 * a line feed and past `bodyStart` (a lower bound of where the header ends). One range when the file is
 * smaller than two ranges. Throws QuernError 'E_FILE' when the file cannot be read.
 */
export async function planRanges(
  file: string,
  size: number,
  bytesPerRange: number,
  options: { cwd?: string; bodyStart?: number } = {},
): Promise<ByteRange[]> {
  const starts = [0];
  const bodyStart = options.bodyStart ?? 0;
  const path = resolve(options.cwd ?? process.cwd(), file);
  if (size >= 2 * bytesPerRange) {
    let handle;
    try {
      handle = await open(path, 'r');
      const buf = Buffer.allocUnsafe(WINDOW);
      for (let nominal = bytesPerRange; nominal < size - bytesPerRange / 2; nominal += bytesPerRange) {
        const from = Math.max(nominal, bodyStart, starts[starts.length - 1]! + 1);
        const at = await lineStartAtOrAfter(handle, buf, from, size);
        if (at < 0 || at >= size) break;
        starts.push(at);
      }
    } catch (e) {
      throw fileError(file, e);
    } finally {
      await handle?.close();
    }
  }
  return starts.map((start, index) => ({ index, start, end: index + 1 < starts.length ? starts[index + 1]! : size }));
}

/** Offset just after the first line feed at or after `from` - 1 (so `from` itself when a line feed precedes it), or -1. */
async function lineStartAtOrAfter(handle: FileHandle, buf: Buffer, from: number, size: number): Promise<number> {
  for (let pos = from - 1; pos < size; pos += WINDOW) {
    const { bytesRead } = await handle.read(buf, 0, WINDOW, pos);
    if (bytesRead <= 0) return -1;
    const i = buf.subarray(0, bytesRead).indexOf(LF);
    if (i >= 0) return pos + i + 1;
  }
  return -1;
}
