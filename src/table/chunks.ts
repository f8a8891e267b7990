// Joining the unfinished tail of one chunk with the next ones, without quadratic copying.
import type { ByteSource } from './source.js';

/**
 * The next buffer to scan: the carried tail followed by at least one new chunk, or by as many as it
 * takes to double an unfinished tail (so a 10 MB line is scanned O(log n) times, not once per chunk).
 * `final` is true when the input has ended; buf is null when nothing is left at all.
 */
export async function nextBuffer(source: ByteSource, carry: Buffer | null): Promise<{ buf: Buffer | null; final: boolean }> {
  const first = await source.read();
  if (first === null) return { buf: carry, final: true };
  if (carry === null) return { buf: first, final: false };
  const parts = [carry, first];
  let size = carry.length + first.length;
  const want = carry.length * 2;
  while (size < want) {
    const next = await source.read();
    if (next === null) return { buf: Buffer.concat(parts, size), final: true };
    parts.push(next);
    size += next.length;
  }
  return { buf: Buffer.concat(parts, size), final: false };
}
