// Splits a plain file into byte ranges for parallel reading. Each range after the first starts just after
// a line feed: a record start unless a quoted field holds that line feed, which the pool detects and mends.
import { open, type FileHandle } from 'node:fs/promises';
import { resolve } from 'node:path';
import { fileError } from '../table/source.js';
import type { ByteRange } from './types.js';

const LF = 0x0a;
const WINDOW = 64 * 1024;

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
