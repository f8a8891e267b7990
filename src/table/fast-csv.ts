// The fast CSV path: scans Buffers record by record and decodes only the requested fields.
// No object per row and no string for a field nobody asked for.
import type { BodyContext } from './body.js';
import type { ByteSource } from './source.js';
import { FastBody } from './fast-body.js';
import { ByteBatchBuilder } from './byte-batch.js';
import { nextBuffer } from './chunks.js';
import { StringSink, type RowSink } from './row-sink.js';
import type { ByteBatch, ColumnBatch } from './types.js';

/** Reads the body of a CSV/TSV input in batches of the requested columns. */
export function fastCsvBatches(ctx: BodyContext): AsyncGenerator<ColumnBatch> {
  return fastCsvRead(ctx, new StringSink(ctx.columns, ctx.batchSize));
}

/** Reads the body of a CSV/TSV input in byte batches: offsets of `ctx.columns`, strings of `stringColumns`. */
export function fastCsvByteBatches(ctx: BodyContext, stringColumns: readonly number[]): AsyncGenerator<ByteBatch> {
  return fastCsvRead(ctx, new ByteBatchBuilder(ctx.columns, stringColumns, ctx.batchSize));
}

async function* fastCsvRead<B>(ctx: BodyContext, sink: RowSink<B>): AsyncGenerator<B> {
  const body = new FastBody(ctx, sink);
  let carry: Buffer | null = null;
  // Offset in the input of carry[0] (or of the next chunk): each buffer consumed starts there.
  let offset = ctx.offset;
  const end = ctx.end;
  // The buffer read in the previous turn: once the next is in hand (its carried tail copied), and the
  // consumer has asked for more, nothing views it any more when the consumer's batches are transient.
  let spent: Buffer | null = null;
  // With `read.early`, the first buffer's rows are handed on as soon as it is walked (ByteReadOptions).
  let first = ctx.read.early === true;
  for (;;) {
    if (offset >= end) {
      // A byte range's last record is read: stop before reading on.
      for (const b of sink.take(true)) yield b;
      break;
    }
    const next: { buf: Buffer | null; final: boolean; used: number } =
      carry !== null && carry.length <= BRIDGE
        ? await bridged(body, ctx.source, carry, end - offset)
        : { ...(await nextBuffer(ctx.source, carry)), used: 0 };
    const { buf, final } = next;
    offset += next.used;
    carry = null;
    const transient = ctx.read.transient === true;
    if (transient && spent !== null && (buf === null || buf.buffer !== spent.buffer)) ctx.source.release(spent);
    // Every turn, so that a sink never keeps track of batches it may not fill again.
    sink.handedOver?.(transient);
    spent = buf;
    if (buf !== null) {
      const pos = body.consume(buf, final, end - offset);
      offset += pos;
      if (pos < buf.length) carry = buf.subarray(pos);
    }
    for (const b of sink.take(final || first)) yield b;
    first = false;
    if (final) break;
  }
  // The last batches are consumed: the last buffer is free too.
  if (ctx.read.transient === true && spent !== null) ctx.source.release(spent);
  ctx.account.lines = body.line - (body.endsWithBreak ? 1 : 0);
  ctx.account.breaks = body.line - ctx.startLine;
  ctx.account.stop = offset;
}

const BRIDGE = 1 << 16;
/** Bytes of the next chunk joined to a carried tail beyond the tail's own length. */
const BRIDGE_AHEAD = 4096;

/**
 * Finishes a short carried tail on a small joined buffer (the tail and the start of the next chunk),
 * then hands on the rest of that chunk without copying it; `used` is how much of the bridge was read.
 * Falls back to joining whole buffers when the tail's record runs past the bridge.
 */
async function bridged<B>(body: FastBody<B>, source: ByteSource, carry: Buffer, limit: number): Promise<{ buf: Buffer | null; final: boolean; used: number }> {
  const chunk = await source.read();
  if (chunk === null) return { buf: carry, final: true, used: 0 };
  // Enough of the chunk to finish a record of ordinary length (copying 64 KiB per chunk cost 5% of a read).
  const bridge = Buffer.concat([carry, chunk.subarray(0, Math.min(chunk.length, carry.length + BRIDGE_AHEAD))]);
  const used = body.consume(bridge, false, limit);
  // The carried record began at 0 and was unfinished, so it ends inside the chunk, or at the carry's end
  // (a lone CR there needed the next byte to tell it from CRLF), or not within the bridge at all.
  if (used > 0) return { buf: chunk.subarray(used - carry.length), final: false, used };
  return { buf: Buffer.concat([carry, chunk]), final: false, used: 0 };
}
