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
const QUOTE = 0x22;

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

/**
 * The bytes from the start of the current record on. When csv-parse meets a bad quote, quern does not
 * follow csv-parse's own recovery (it resumes inside the broken line, so one record can count twice and
 * a stray quote can swallow the next row); it skips to the line end, as RFC 4180 §2.5–2.7 draws records
 * and as the fast engine does, and starts a fresh parser there. These bytes are what it restarts from.
 */
class ByteWindow {
  private chunks: Buffer[] = [];
  private base = 0; // offset of chunks[0]
  end = 0; // offset just after the last byte held

  push(chunk: Buffer): void {
    this.chunks.push(chunk);
    this.end += chunk.length;
  }

  /** Forgets whole chunks that lie before `offset`. */
  release(offset: number): void {
    while (this.chunks.length > 0 && this.base + this.chunks[0]!.length <= offset) {
      this.base += this.chunks[0]!.length;
      this.chunks.shift();
    }
  }

  /** The bytes [from, to) (both within what is held). */
  slice(from: number, to: number): Buffer {
    const parts: Buffer[] = [];
    let at = this.base;
    for (const c of this.chunks) {
      const a = Math.max(from, at);
      const b = Math.min(to, at + c.length);
      if (a < b) parts.push(c.subarray(a - at, b - at));
      at += c.length;
    }
    return parts.length === 1 ? parts[0]! : Buffer.concat(parts);
  }

  /**
   * Offset just after the first line end (LF, CRLF or CR) at or after `from`, quotes ignored; when the
   * input has `ended` without one, its end. `{ end: -1, resume }` when more bytes are needed.
   */
  lineEnd(from: number, ended: boolean): { end: number; resume: number } {
    const bytes = this.slice(from, this.end);
    for (let i = 0; i < bytes.length; i++) {
      const c = bytes[i];
      if (c === LF) return { end: from + i + 1, resume: from };
      if (c !== CR) continue;
      if (i + 1 < bytes.length) return { end: from + i + (bytes[i + 1] === LF ? 2 : 1), resume: from };
      return ended ? { end: from + i + 1, resume: from } : { end: -1, resume: from + i };
    }
    return ended ? { end: this.end, resume: from } : { end: -1, resume: this.end };
  }
}

/** Thrown from csv-parse's on_skip to stop a parser at a bad quote (csv-parse hands it back as the error). */
const STOP = new Error('quern: bad quote, parser stopped');

/** Reads the body of a CSV/TSV input through csv-parse, in batches of the requested columns. */
export async function* referenceCsvBatches(ctx: BodyContext): AsyncGenerator<ColumnBatch> {
  const { source, account, width, columns } = ctx;
  const builder = new BatchBuilder(columns.length, ctx.batchSize);
  const lines = new LineIndex(ctx.startLine);
  const window = new ByteWindow();
  let endsWithBreak = ctx.headerEndsWithBreak;
  let base = 0; // offset where the current parser's bytes begin
  let written = 0; // bytes handed to parsers
  let recStart = 0; // offset where the current record begins
  let errAt = -1; // set by a bad quote: offset of the byte after it, from where the line end is sought
  let skipFrom = -1; // while skipping a rejected record to its line end: where the search resumes
  const onRecord = (ext: { record: string[]; raw: string }, bytesRead: number): void => {
    const { record, raw } = ext;
    const nul = raw.includes('\0') ? nulAfterClosingQuote(raw, ctx.delimiter) : -1;
    if (nul >= 0) {
      // csv-parse takes NUL after a closing quote as a field's end; RFC 4180 §2.7 does not (see below):
      // the record breaks there, and like any broken record it runs to its line end, quotes ignored.
      errAt = recStart + nul;
      throw STOP;
    }
    const line = lines.lineAt(recStart);
    recStart = base + bytesRead;
    lines.lineAt(recStart);
    window.release(recStart);
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
  const onSkip = (err: { code?: string } | undefined, raw: string | undefined): void => {
    const nul = raw?.includes('\0') ? nulAfterClosingQuote(raw, ctx.delimiter) : -1;
    if (nul >= 0) {
      // The record broke earlier, at a NUL after a closing quote that csv-parse let pass.
      errAt = recStart + nul;
      throw STOP;
    }
    if (err?.code === 'CSV_QUOTE_NOT_CLOSED') {
      // Only at the end of the input: the record runs from its start to the end, as on the fast path.
      const line = lines.lineAt(recStart);
      rejectMalformed(ctx, 'unterminated-quote', line, lines.lineAt(window.end) - line, () => preview(raw ?? ''));
      return;
    }
    // raw holds the record's bytes (latin1, one char a byte) up to and including the bad quote.
    errAt = recStart + (raw ?? '').length;
    throw STOP;
  };
  const start = (at: number): ReturnType<typeof parse> => {
    const p = parse({
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
    base = at;
    recStart = at;
    written = at;
    // Records are taken as csv-parse pushes them, synchronously, with its byte count at that moment
    // (its on_record hook would copy its whole info object per record, which costs more than parsing).
    const push = p.push.bind(p);
    p.push = (chunk: unknown): boolean => {
      if (chunk === null) return push(null);
      onRecord(chunk as { record: string[]; raw: string }, p.info.bytes);
      return true;
    };
    // A stopped parser errors with STOP; write callbacks and finished() still see every error.
    p.on('error', () => undefined);
    p.resume();
    return p;
  };
  let parser = start(0);
  let restarted = false; // whether the last skip started a parser after the broken record
  /** Rejects the record stopped at a bad quote once its line end is known, then restarts after it. */
  const skip = (ended: boolean): boolean => {
    const { end, resume } = window.lineEnd(skipFrom, ended);
    if (end < 0) {
      skipFrom = resume;
      return false;
    }
    const from = recStart;
    rejectMalformed(ctx, 'bad-quote', lines.lineAt(from), -1, () => bytePreview(window.slice(from, Math.min(end, from + 120))));
    skipFrom = -1;
    lines.lineAt(end);
    window.release(end);
    // Bytes after the broken record are parsed afresh, also when the input has already ended.
    restarted = !ended || end < window.end;
    if (restarted) parser = start(end);
    return true;
  };
  /** Hands the bytes not yet parsed to the parser, skipping and restarting at each bad quote. */
  const drain = async (): Promise<void> => {
    for (;;) {
      if (skipFrom >= 0 && !skip(false)) return;
      if (written >= window.end) return;
      const bytes = window.slice(written, window.end);
      written = window.end;
      const p = parser;
      try {
        await new Promise<void>((res, rej) => p.write(bytes, (e) => (e ? rej(e) : res())));
      } catch (e) {
        if (e !== STOP) throw e;
      }
      if (errAt < 0) return;
      skipFrom = errAt;
      errAt = -1;
      p.destroy();
    }
  };
  for (;;) {
    const chunk = await source.read();
    if (chunk === null) break;
    if (chunk.length === 0) continue;
    endsWithBreak = chunk[chunk.length - 1] === LF || chunk[chunk.length - 1] === CR;
    lines.feed(chunk);
    window.push(chunk);
    await drain();
    for (const b of builder.take()) yield b;
  }
  // At the end of the input: the last record, without a line end, is parsed only now and may hold a bad
  // quote too; each broken record is skipped to its line end and the bytes after it parsed afresh.
  for (;;) {
    if (skipFrom >= 0) {
      skip(true);
      if (!restarted) break;
      await drain();
      continue;
    }
    const done = finished(parser);
    done.catch(() => undefined);
    parser.end();
    try {
      await done;
    } catch (e) {
      if (e !== STOP) throw e;
      skipFrom = errAt;
      errAt = -1;
      continue;
    }
    break;
  }
  for (const b of builder.take(true)) yield b;
  const lastLine = lines.lineAt(window.end);
  account.lines = lastLine - (endsWithBreak ? 1 : 0);
  account.breaks = lastLine - ctx.startLine;
}

/**
 * Index in a raw record of a NUL byte standing right after a closing quote, or -1. csv-parse 7 tests the
 * byte after a closing quote for truthiness, so it takes NUL (0) there as the end of the field and keeps
 * it as data; RFC 4180 §2.5–2.7 allow only a delimiter or a line end after a closing quote.
 */
function nulAfterClosingQuote(raw: string, delimiter: number): number {
  let quoted = false;
  let fieldStart = true;
  let afterClose = false;
  for (let i = 0; i < raw.length; i++) {
    const c = raw.charCodeAt(i);
    if (quoted) {
      if (c !== QUOTE) continue;
      if (raw.charCodeAt(i + 1) === QUOTE) i++;
      else {
        quoted = false;
        afterClose = true;
      }
    } else if (afterClose) {
      if (c === 0) return i;
      afterClose = false;
      fieldStart = c === delimiter;
    } else if (c === delimiter) fieldStart = true;
    else {
      if (c === QUOTE && fieldStart) quoted = true;
      fieldStart = false;
    }
  }
  return -1;
}

function bytePreview(bytes: Buffer): string {
  let e = bytes.length;
  while (e > 0 && (bytes[e - 1] === LF || bytes[e - 1] === CR)) e--;
  return bytes.toString('utf8', 0, e);
}

function preview(raw: string): string {
  return Buffer.from(raw.slice(0, 120).replace(/[\r\n]+$/, ''), 'latin1').toString('utf8');
}
