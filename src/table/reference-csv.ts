// The reference CSV path: csv-parse tokenizes, quern keeps its own row accounting and line numbers.
// Slower than the fast path but independent of it; the differential test compares the two.
import { isAscii, isUtf8 } from 'node:buffer';
import { finished } from 'node:stream/promises';
import { parse } from 'csv-parse';
import type { BodyContext } from './body.js';
import { rejectMalformed, rejectRagged, rejectUndecodable } from './body.js';
import { BatchBuilder } from './batch.js';
import type { ColumnBatch } from './types.js';

const LF = 0x0a;
const CR = 0x0d;

/** Physical line numbers of byte offsets, counted over the bytes fed to the parser (read once, in order). */
class LineIndex {
  private chunks: Buffer[] = [];
  private base = 0; // offset of chunks[0]
  private cursor = 0; // offsets below this are counted
  private line: number;
  private prevCR = false;

  constructor(startLine: number) {
    this.line = startLine;
  }

  feed(chunk: Buffer): void {
    this.chunks.push(chunk);
  }

  /** Line on which the byte at `offset` stands (1 + line ends before it). */
  lineAt(offset: number): number {
    while (this.cursor < offset && this.chunks.length > 0) {
      const chunk = this.chunks[0]!;
      const stop = Math.min(offset - this.base, chunk.length);
      for (let i = this.cursor - this.base; i < stop; i++) {
        const c = chunk[i];
        if (c === CR || (c === LF && !this.prevCR)) this.line++;
        this.prevCR = c === CR;
      }
      this.cursor = this.base + stop;
      if (stop === chunk.length) {
        this.base += chunk.length;
        this.chunks.shift();
      }
    }
    return this.line;
  }
}

/** Line ends in a latin1-decoded raw record (CRLF once). */
function breaksIn(raw: string): number {
  let n = 0;
  for (let i = 0; i < raw.length; i++) {
    const c = raw.charCodeAt(i);
    if (c === CR || (c === LF && (i === 0 || raw.charCodeAt(i - 1) !== CR))) n++;
  }
  return n;
}

/** Reads the body of a CSV/TSV input through csv-parse, in batches of the requested columns. */
export async function* referenceCsvBatches(ctx: BodyContext): AsyncGenerator<ColumnBatch> {
  const { source, account, width, columns } = ctx;
  const builder = new BatchBuilder(columns.length, ctx.batchSize);
  const lines = new LineIndex(ctx.startLine);
  let lastEndLine = ctx.startLine;
  let skipLine = 0;
  let skipParserLine = -1;
  let endsWithBreak = ctx.headerEndsWithBreak;
  let fed = 0;
  const onRecord = (ext: { record: string[]; raw: string }, offset: number): void => {
    const { record, raw } = ext;
    const end = lines.lineAt(offset);
    const line = end - breaksIn(raw);
    lastEndLine = end;
    skipParserLine = -1;
    const bytes = Buffer.from(raw, 'latin1');
    if (record.length === 1 && record[0] === '' && /^(\r\n|\r|\n)$/.test(raw)) {
      account.blankLines++;
    } else if (!isUtf8(bytes)) {
      const bad = record.findIndex((f) => !isUtf8(Buffer.from(f, 'latin1')));
      rejectUndecodable(ctx, line, bad, () => preview(raw));
    } else if (record.length !== width) {
      rejectRagged(ctx, line, record.length, () => preview(raw));
    } else {
      const out = builder.columns;
      const n = builder.length;
      // latin1 text of ASCII bytes is already the right string; other bytes are re-read as UTF-8.
      const ascii = isAscii(bytes);
      for (let c = 0; c < columns.length; c++) {
        const f = record[columns[c]!]!;
        out[c]![n] = ascii ? f : Buffer.from(f, 'latin1').toString('utf8');
      }
      builder.commit(line);
      account.pass();
    }
  };
  const onSkip = (err: { code?: string; lines?: number } | undefined, raw: string | undefined): void => {
    const parserLine = err?.lines ?? 0;
    const line = skipParserLine < 0 ? lastEndLine : skipLine + (parserLine - skipParserLine);
    skipLine = line;
    skipParserLine = parserLine;
    const reason = err?.code === 'CSV_QUOTE_NOT_CLOSED' ? 'unterminated-quote' : 'bad-quote';
    rejectMalformed(ctx, reason, line, -1, () => preview(raw ?? ''));
  };
  const parser = parse({
    delimiter: String.fromCharCode(ctx.delimiter),
    encoding: 'latin1',
    record_delimiter: ['\r\n', '\n', '\r'],
    relax_column_count: true,
    skip_empty_lines: false,
    skip_records_with_error: true,
    raw: true,
    info: false,
    bom: false,
    on_skip: onSkip as never,
  });
  // Records are taken as csv-parse pushes them, synchronously, with its byte count at that moment
  // (its on_record hook would copy its whole info object per record, which costs more than parsing).
  const push = parser.push.bind(parser);
  parser.push = (chunk: unknown): boolean => {
    if (chunk === null) return push(null);
    onRecord(chunk as { record: string[]; raw: string }, parser.info.bytes);
    return true;
  };
  parser.resume();
  const done = finished(parser);
  done.catch(() => undefined);
  for (;;) {
    const chunk = await source.read();
    if (chunk === null) break;
    if (chunk.length === 0) continue;
    endsWithBreak = chunk[chunk.length - 1] === LF || chunk[chunk.length - 1] === CR;
    lines.feed(chunk);
    fed += chunk.length;
    await new Promise<void>((res, rej) => parser.write(chunk, (e) => (e ? rej(e) : res())));
    for (const b of builder.take()) yield b;
  }
  parser.end();
  await done;
  for (const b of builder.take(true)) yield b;
  account.lines = lines.lineAt(fed) - (endsWithBreak ? 1 : 0);
}

function preview(raw: string): string {
  return Buffer.from(raw.slice(0, 120).replace(/[\r\n]+$/, ''), 'latin1').toString('utf8');
}
