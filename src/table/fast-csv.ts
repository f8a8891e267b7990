// The fast CSV path: scans Buffers record by record and decodes only the requested fields.
// No object per row and no string for a field nobody asked for.
import { isAscii, isUtf8 } from 'node:buffer';
import { CsvScanner, Scan } from './csv-scan.js';
import type { BodyContext } from './body.js';
import type { ByteSource } from './source.js';
import { rowPreview, rejectMalformed, rejectRagged, rejectUndecodable } from './body.js';
import { ByteBatchBuilder } from './byte-batch.js';
import { nextBuffer } from './chunks.js';
import { StringSink, type RowSink } from './row-sink.js';
import type { ByteBatch, ColumnBatch } from './types.js';

const LF = 0x0a;
const CR = 0x0d;

/**
 * Index just after the last line-break byte in buf, or 0; UTF-8 sequences never contain CR or LF.
 * Only the bytes after the last LF are searched for a CR (a file without CR would otherwise be
 * searched end to end, once more per chunk).
 */
function afterLastBreak(buf: Buffer): number {
  const a = buf.lastIndexOf(LF);
  for (let i = buf.length - 1; i > a; i--) if (buf[i] === CR) return i + 1;
  return a + 1;
}

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
  for (;;) {
    const next: { buf: Buffer | null; final: boolean } =
      carry !== null && carry.length <= BRIDGE ? await bridged(body, ctx.source, carry) : await nextBuffer(ctx.source, carry);
    const { buf, final } = next;
    carry = null;
    if (buf !== null) {
      const pos = body.consume(buf, final);
      if (pos < buf.length) carry = buf.subarray(pos);
    }
    for (const b of sink.take(final)) yield b;
    if (final) break;
  }
  ctx.account.lines = body.line - (body.endsWithBreak ? 1 : 0);
}

const BRIDGE = 1 << 16;

/**
 * Finishes a short carried tail on a small joined buffer (the tail and the start of the next chunk),
 * then hands on the rest of that chunk without copying it. Falls back to joining whole buffers when
 * the tail's record runs past the bridge.
 */
async function bridged<B>(body: FastBody<B>, source: ByteSource, carry: Buffer): Promise<{ buf: Buffer | null; final: boolean }> {
  const chunk = await source.read();
  if (chunk === null) return { buf: carry, final: true };
  const bridge = Buffer.concat([carry, chunk.subarray(0, Math.min(chunk.length, BRIDGE))]);
  const used = body.consume(bridge, false);
  // The carried record began at 0 and was unfinished, so it either ends inside the chunk or not at all.
  if (used > carry.length) return { buf: chunk.subarray(used - carry.length), final: false };
  return { buf: Buffer.concat([carry, chunk]), final: false };
}

/** The state of one read, and the hot loop over one buffer (kept out of the generator, which V8 optimises less). */
class FastBody<B> {
  readonly scanner: CsvScanner;
  line: number;
  endsWithBreak: boolean;

  constructor(
    private readonly ctx: BodyContext,
    private readonly sink: RowSink<B>,
  ) {
    this.scanner = new CsvScanner(ctx.delimiter, ctx.width + 1);
    this.line = ctx.startLine;
    this.endsWithBreak = ctx.headerEndsWithBreak;
  }

  /** Reads the whole records in buf; returns the offset where the unfinished tail begins. */
  consume(buf: Buffer, final: boolean): number {
    const { ctx, scanner, sink } = this;
    const { account, width } = ctx;
    const len = buf.length;
    if (len > 0) this.endsWithBreak = buf[len - 1] === LF || buf[len - 1] === CR;
    const region = buf.subarray(0, final ? len : afterLastBreak(buf));
    const ascii = isAscii(region);
    const valid = ascii || isUtf8(region);
    sink.begin(buf, ascii);
    let line = this.line;
    let pos = 0;
    let passed = 0;
    while (pos < len) {
      const r = scanner.scanPlain(buf, pos, len) ? Scan.Record : scanner.scan(buf, pos, len, final);
      if (r === Scan.NeedMore) break;
      if (r === Scan.Record && !scanner.blank && scanner.fieldCount === width && (valid || isUtf8(buf.subarray(pos, scanner.end)))) {
        sink.row(buf, ascii, scanner, line);
        passed++;
      } else this.other(r, buf, pos, line, valid);
      line += scanner.breaks;
      pos = scanner.end;
    }
    this.line = line;
    account.passMany(passed);
    return pos;
  }

  /** Blank lines and rejected rows: the rare cases, kept out of the hot loop. */
  private other(r: Scan, buf: Buffer, pos: number, line: number, valid: boolean): void {
    const { ctx, scanner } = this;
    const end = scanner.end;
    const preview = (): string => rowPreview(buf, pos, end);
    if (r !== Scan.Record) rejectMalformed(ctx, r === Scan.BadQuote ? 'bad-quote' : 'unterminated-quote', line, scanner.breaks, preview);
    else if (scanner.blank) ctx.account.blankLines++;
    else if (!valid && !isUtf8(buf.subarray(pos, end))) rejectUndecodable(ctx, line, firstBadField(buf, scanner), preview);
    else rejectRagged(ctx, line, scanner.fieldCount, preview);
  }
}

/** The first field of the last record whose bytes are not valid UTF-8. */
function firstBadField(buf: Buffer, scanner: CsvScanner): number {
  const n = Math.min(scanner.fieldCount, scanner.starts.length);
  for (let k = 0; k < n; k++) {
    if (!isUtf8(buf.subarray(scanner.starts[k], scanner.ends[k]))) return k;
  }
  return -1;
}
