// Byte batches for the paths that make strings anyway (csv-parse as the reference engine, NDJSON):
// the requested byte columns' strings are written out as UTF-8, so every reader offers `byteBatches`.
import { isAscii } from 'node:buffer';
import type { ByteBatch, ColumnBatch } from './types.js';

/** A byte batch of a string batch whose first `nBytes` columns are to be bytes and the rest strings. */
export function toByteBatch(b: ColumnBatch, nBytes: number): ByteBatch {
  const starts: Int32Array[] = [];
  const ends: Int32Array[] = [];
  const decoded: Uint8Array[] = [];
  const parts: string[] = [];
  let total = 0;
  for (let c = 0; c < nBytes; c++) {
    const col = b.values[c]!;
    const s = new Int32Array(b.length);
    const e = new Int32Array(b.length);
    for (let i = 0; i < b.length; i++) {
      const v = col[i]!;
      s[i] = total;
      total += Buffer.byteLength(v, 'utf8');
      e[i] = total;
      parts.push(v);
    }
    starts.push(s);
    ends.push(e);
    decoded.push(new Uint8Array(b.length));
  }
  const buf = Buffer.from(parts.join(''), 'utf8');
  return { length: b.length, lines: b.lines, buf, side: Buffer.alloc(0), ascii: isAscii(buf), starts, ends, decoded, values: b.values.slice(nBytes) };
}

/** The byte batches of a stream of string batches (see `toByteBatch`). */
export async function* toByteBatches(batches: AsyncIterable<ColumnBatch>, nBytes: number): AsyncGenerator<ByteBatch> {
  for await (const b of batches) yield toByteBatch(b, nBytes);
}
