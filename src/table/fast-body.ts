// The hot loop of the fast CSV path over one buffer. Where WebAssembly SIMD runs, the record kernel
// (structurals.wat) reads quote-free text and simple quoted fields; records with doubled quotes or line
// breaks inside quotes, malformed quotes and a CR or quote at the buffer's end go through the general
// RFC 4180 scanner (csv-scan.ts). Without the kernel, comma records that lie before the buffer's next
// double quote (found with memchr-fast `indexOf`) are read by a tight loop that skips field text a 32-bit
// word at a time, and the scanner reads the rest. All fill the same field bounds and the same accounting.
import { isAscii, isUtf8 } from 'node:buffer';
import { CsvScanner, Scan } from './csv-scan.js';
import type { BodyContext } from './body.js';
import { rowPreview, rejectMalformed, rejectRagged, rejectUndecodable } from './body.js';
import type { RowSink } from './row-sink.js';
import { ByteBatchBuilder } from './byte-batch.js';
import { KernelStop, RECORD_SPAN, recordKernel, wantedMask, type KernelTally, type RecordKernel } from './structurals.js';

const LF = 0x0a;
const CR = 0x0d;
const QUOTE = 0x22;
/** After this many quotes met one record apart (or records the kernel leaves, one after another), the
 *  rest of a buffer is read by the general scanner. */
const DENSE_QUOTES = 8;
/** The kernel's shortest first span after a record it left to the scanner. */
const MIN_SPAN = 1024;
const NO_WORDS = new Int32Array(0);

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

/** The state of one read, and the loops over one buffer (kept out of the generator, which V8 optimises less). */
export class FastBody<B> {
  readonly scanner: CsvScanner;
  line: number;
  endsWithBreak: boolean;
  /** Rows passed in the current buffer. */
  private passed = 0;
  private readonly delimiter: number;
  /** True when the general scanner has left quoted-field marks in `scanner.escaped`. */
  private dirty = false;
  /** The sink when it takes byte batches: called from a call site of its own, so that each call site
   *  sees one class even when a process reads strings before bytes (as rebin does to infer formats). */
  private readonly bytes: ByteBatchBuilder | null;
  /** The SIMD kernel that walks quote-free text into records, or null (the JavaScript loop reads it). */
  private readonly kernel: RecordKernel | null;
  /** The fields the sink reads, ascending and distinct; their bit mask; i32 per record in the kernel's output. */
  private readonly wanted: Int32Array;
  private readonly want: number;
  private readonly stride: number;
  /** The slot among `wanted` of the byte sink's first column (the one a tally reads), or -1. */
  private readonly tallySlot: number;

  constructor(
    private readonly ctx: BodyContext,
    private readonly sink: RowSink<B>,
  ) {
    this.scanner = new CsvScanner(ctx.delimiter, ctx.width + 1);
    this.line = ctx.startLine;
    this.endsWithBreak = ctx.headerEndsWithBreak;
    this.delimiter = ctx.delimiter;
    this.bytes = sink instanceof ByteBatchBuilder ? sink : null;
    this.wanted = Int32Array.from(new Set(sink.fields)).sort();
    const want = wantedMask([...this.wanted]);
    this.want = want ?? 0;
    this.stride = 2 + 2 * this.wanted.length;
    this.tallySlot = this.bytes !== null && this.bytes.byteColumnCount > 0 ? this.wanted.indexOf(this.bytes.fields[0]!) : -1;
    this.kernel = ctx.simd && want !== null ? recordKernel() : null;
  }

  /**
   * Reads the whole records in buf that start before `limit`; returns the offset where the unfinished
   * tail (or the first record not to read) begins.
   */
  consume(buf: Buffer, final: boolean, limit: number): number {
    const len = buf.length;
    const region = buf.subarray(0, final ? len : afterLastBreak(buf));
    const ascii = isAscii(region);
    const valid = ascii || isUtf8(region);
    this.sink.begin(buf, ascii);
    this.passed = 0;
    const stop = Math.min(len, limit);
    const pos = this.kernel !== null
      ? this.kernelRun(this.kernel, buf, stop, final, ascii, valid)
      : this.wordRun(buf, stop, final, ascii, valid);
    if (pos > 0) this.endsWithBreak = buf[pos - 1] === LF || buf[pos - 1] === CR;
    this.ctx.account.passMany(this.passed);
    return pos;
  }

  /**
   * The buffer's records by the SIMD kernel. Its quote-free walk (the faster one, see structurals.wat)
   * reads up to the record holding the next quote, which the general scanner reads. When that record's
   * quotes are ones the walk with quotes can read (quoted fields without quotes or line breaks inside),
   * the walk with quotes goes on from there until it meets a record it leaves (another quote, a quoted
   * line break, a CR or quote that ends the buffer), which the general scanner reads in turn; otherwise
   * the quote-free walk goes on to the next quote. Once DENSE_QUOTES walks in a row read no record, the
   * general scanner reads the rest of the buffer. Returns where it stopped.
   */
  private kernelRun(kernel: RecordKernel, buf: Buffer, stop: number, final: boolean, ascii: boolean, valid: boolean): number {
    const len = buf.length;
    let quoteAt = -1;
    let quoted = false;
    let pos = 0;
    let idle = 0;
    let span = RECORD_SPAN;
    while (pos < stop) {
      if (idle >= DENSE_QUOTES) return this.generalRun(buf, pos, stop, final, ascii, valid);
      this.plainEscapes();
      let next: number;
      if (quoted) {
        next = this.runKernel(kernel, true, buf, pos, len, stop, span, ascii, valid);
        // The kernel copies its input a span at a time: after a record it left, its next walk starts with
        // a span about twice what this one read, so records left now and then do not cost 64 KiB copies.
        span = Math.min(RECORD_SPAN, Math.max(MIN_SPAN, 2 * (next - pos)));
      } else {
        if (quoteAt < pos) quoteAt = firstQuote(buf, pos, len);
        next = this.runKernel(kernel, false, buf, pos, quoteAt, stop, RECORD_SPAN, ascii, valid);
      }
      idle = next > pos ? 0 : idle + 1;
      pos = next;
      if (pos >= stop) break;
      const end = this.general(buf, pos, final, ascii, valid);
      if (end < 0) break;
      quoted = quoteAt < end && this.simpleQuotes();
      pos = end;
    }
    return pos;
  }

  /** The kernel and the word loop leave `escaped` alone: make it all plain again after the scanner's quoted records. */
  private plainEscapes(): void {
    if (!this.dirty) return;
    this.scanner.escaped.fill(0);
    this.dirty = false;
  }

  /** True when the scanner's last record is on one line and no field of it holds doubled quotes. */
  private simpleQuotes(): boolean {
    const { scanner } = this;
    if (scanner.breaks !== 1) return false;
    const n = Math.min(scanner.fieldCount, scanner.escaped.length);
    for (let k = 0; k < n; k++) if (scanner.escaped[k] === 1) return false;
    return true;
  }

  /**
   * The buffer's records without the kernel: for the comma, the word loop reads the records before the
   * next quote, the general scanner the record holding it; for other delimiters (and once quotes stand in
   * record after record) the general scanner reads them all. Returns where it stopped.
   */
  private wordRun(buf: Buffer, stop: number, final: boolean, ascii: boolean, valid: boolean): number {
    const len = buf.length;
    // Without the kernel only the comma has a quote-free loop (for others a variable delimiter compared
    // per byte measured slower than the scanner's table look-up). -1 sends every record to the general
    // scanner.
    let quoteAt = this.delimiter === 44 ? firstQuote(buf, 0, len) : -1;
    let dense = 0;
    let pos = 0;
    while (pos < stop) {
      if (quoteAt < 0) {
        pos = this.generalRun(buf, pos, stop, final, ascii, valid);
        break;
      }
      if (pos < quoteAt) {
        this.plainEscapes();
        const next = this.runComma(buf, pos, quoteAt, stop, ascii, valid);
        dense = next > pos ? 0 : dense;
        pos = next;
        if (pos >= stop) break;
      }
      const end = this.general(buf, pos, final, ascii, valid);
      if (end < 0) break;
      pos = end;
      if (pos > quoteAt && quoteAt >= 0) {
        // The quote is read: find the next one, unless quotes stand in record after record (then -1
        // sends the rest of the buffer to the general scanner).
        dense++;
        quoteAt = dense >= DENSE_QUOTES ? -1 : firstQuote(buf, pos, len);
      }
    }
    return pos;
  }

  /**
   * Records from `pos` through the general scanner alone, while they start before `stop`, in a loop
   * over locals (the shape the fast path had before the quote-free loop, kept for other delimiters and
   * quote-dense buffers). Returns where it stopped: at `stop`, or at an unfinished record.
   */
  private generalRun(buf: Buffer, pos: number, stop: number, final: boolean, ascii: boolean, valid: boolean): number {
    const { scanner, sink } = this;
    const len = buf.length;
    const width = this.ctx.width;
    let line = this.line;
    let passed = 0;
    this.dirty = true;
    while (pos < stop) {
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
    this.passed += passed;
    return pos;
  }

  /** One record through the general scanner; its end, or -1 when the buffer ends inside it. */
  private general(buf: Buffer, pos: number, final: boolean, ascii: boolean, valid: boolean): number {
    const { scanner } = this;
    const len = buf.length;
    const plain = scanner.scanPlain(buf, pos, len);
    const r = plain ? Scan.Record : scanner.scan(buf, pos, len, final);
    if (r === Scan.NeedMore) return -1;
    const line = this.line;
    if (r === Scan.Record && !scanner.blank && scanner.fieldCount === this.ctx.width && (valid || isUtf8(buf.subarray(pos, scanner.end)))) {
      this.sink.row(buf, ascii, scanner, line);
      this.passed++;
    } else this.other(r, buf, pos, line, valid);
    this.line = line + scanner.breaks;
    if (!plain) this.dirty = true;
    return scanner.end;
  }

  /**
   * Reads quote-free records from `pos` while they start before `stop` and end before `quoteAt`, for the
   * comma: comma 44, LF 10 and CR 13 are all below 45, so field text is skipped four bytes a step and
   * tested byte by byte with one comparison, the bytes written as literals (V8 compares against a
   * literal faster than against a variable or a module constant: 0.89 s against 1.31 s per 374 MB;
   * words 0.72 s against bytes 0.97 s, in a loop over 40 MB of the bench file). Returns where it stopped.
   */
  private runComma(buf: Buffer, pos: number, quoteAt: number, stop: number, ascii: boolean, valid: boolean): number {
    const { scanner, sink, bytes } = this;
    const { starts, ends } = scanner;
    const cap = starts.length;
    const width = this.ctx.width;
    const len = buf.length;
    const qa = quoteAt < len ? quoteAt : len;
    // The buffer as 32-bit words from its first 4-byte aligned byte, a0.
    const a0 = (4 - (buf.byteOffset & 3)) & 3;
    const words = len - a0 >= 4 ? new Int32Array(buf.buffer, buf.byteOffset + a0, (len - a0) >> 2) : NO_WORDS;
    let line = this.line;
    let passed = 0;
    while (pos < stop) {
      let i = pos;
      let start = pos;
      let f = 0;
      let c = 0;
      let end = 0;
      for (;;) {
        scan: for (;;) {
          // Bytes up to a 4-byte boundary, then whole words while none holds a byte below 45 (the
          // test of "Determine if a word has a byte less than n", Bit Twiddling Hacks, S. E. Anderson:
          // exact about whether such a byte exists), then the bytes of the word that does.
          while (i < qa && ((i - a0) & 3) !== 0) {
            c = buf[i]!;
            if (c <= 44 && (c === 44 || c === 10 || c === 13)) break scan; // comma, LF, CR
            i++;
          }
          while (i + 4 <= qa) {
            const x = words[(i - a0) >> 2]!;
            if (((x - 0x2d2d2d2d) & ~x & 0x80808080) !== 0) break;
            i += 4;
          }
          const e = i + 4 < qa ? i + 4 : qa;
          for (; i < e; i++) {
            c = buf[i]!;
            if (c <= 44 && (c === 44 || c === 10 || c === 13)) break scan;
          }
          if (i >= qa) break;
        }
        if (i >= qa) break;
        if (f < cap) {
          starts[f] = start;
          ends[f] = i;
        }
        f++;
        if (c === 44) {
          start = ++i;
          continue;
        }
        end = i + 1;
        if (c === CR) {
          // A CR as the buffer's last byte may be half a CRLF: the general scanner decides.
          if (end >= len) end = 0;
          else if (buf[end] === LF) end++;
        }
        break;
      }
      if (end === 0) break;
      if (f === width && !(f === 1 && ends[0] === pos) && (valid || isUtf8(buf.subarray(pos, end)))) {
        scanner.fieldCount = f;
        if (bytes !== null) bytes.row(buf, ascii, scanner, line);
        else sink.row(buf, ascii, scanner, line);
        passed++;
      } else this.plainOther(buf, pos, end, f, line, valid);
      line++;
      pos = end;
    }
    this.line = line;
    this.passed += passed;
    return pos;
  }

  /**
   * Records from `pos` by the SIMD kernel (its quote-free walk unless `quotes`), while they start before
   * `stop` and end before `regionEnd`: the text is copied to the kernel a span at a time (with the byte
   * after it, for CRLF and closing quotes; the first span `first` bytes, each next one twice the last, up
   * to RECORD_SPAN), and the records it writes are handed to the sink. Returns where it stopped: at
   * `stop`, at an unfinished record, or at one the kernel leaves.
   */
  private runKernel(kernel: RecordKernel, quotes: boolean, buf: Buffer, pos: number, regionEnd: number, stop: number, first: number, ascii: boolean, valid: boolean): number {
    const { scanner, sink, bytes, wanted, want, stride } = this;
    const { starts, ends } = scanner;
    const { input, output, state } = kernel;
    const nw = wanted.length;
    const len = buf.length;
    const width = this.ctx.width;
    const until = stop < 0x7fffffff ? stop : 0x7fffffff;
    let line = this.line;
    let passed = 0;
    let record = pos;
    state[0] = pos; // record start
    state[1] = pos; // field start
    state[2] = 0; // field number
    state[3] = -1; // LF to skip
    state[4] = 0; // wanted slot
    state[6] = 0; // outside quotes
    let span = pos;
    let size = first;
    while (span < regionEnd) {
      const spanEnd = regionEnd - span > size ? span + size : regionEnd;
      size = size < RECORD_SPAN ? Math.min(RECORD_SPAN, 2 * size) : RECORD_SPAN;
      const ahead = spanEnd < len ? 1 : 0;
      input.set(buf.subarray(span, spanEnd + ahead));
      const n = quotes
        ? kernel.quotedRecords(spanEnd - span, span, want, stride, until, ahead, this.delimiter)
        : kernel.records(spanEnd - span, span, want, stride, until, ahead, this.delimiter);
      if (bytes !== null && bytes.takesBlocks) {
        // Runs of records the sink takes go to the batch builder a block at a time, and each record between
        // runs is read again for its diagnostics. For valid UTF-8 with more than one column a record is
        // taken when it is as wide as the header (a blank line has one field), so the kernel finds where a
        // run ends (firstOther); checking each record here instead cost about 4 ns a row (the range task
        // over 10M rows: 0.61 s against 0.65-0.67 s, 3 runs each). Otherwise each record is checked here.
        // A tally (see KernelTally) checks the widths itself as it counts, when they are what decides.
        const byWidth = valid && width > 1;
        const tally = this.ctx.read.tally;
        const tallying = tally != null && tally.active && this.tallySlot >= 0;
        let from = 0;
        while (from < n) {
          let other: number;
          if (tallying && byWidth) other = this.tallied(tally, kernel, bytes, buf, from, n, span, line, width);
          else {
            other = byWidth ? kernel.firstOther(from, n, stride, width) : this.firstNotTaken(buf, output, from, n, stride, record, valid);
            if (other > from) {
              if (tallying) this.tallied(tally, kernel, bytes, buf, from, other, span, line, -1);
              else bytes.kernelRows(output, from * stride, other - from, stride, this.wanted, line);
            }
          }
          if (other > from) {
            passed += other - from;
            line += other - from;
            record = output[(other - 1) * stride]!;
          }
          if (other >= n) break;
          this.kernelOther(buf, record, line, valid);
          line++;
          record = output[other * stride]!;
          from = other + 1;
        }
        if (state[5] !== KernelStop.Spent) break;
        span = nextSpan(state, span, spanEnd, regionEnd);
        continue;
      }
      for (let r = 0, o = 0; r < n; r++, o += stride) {
        const end = output[o]!;
        const f = output[o + 1]!;
        if (this.takes(buf, record, end, f, valid)) {
          for (let k = 0; k < nw; k++) {
            const field = wanted[k]!;
            starts[field] = output[o + 2 + 2 * k]!;
            ends[field] = output[o + 3 + 2 * k]!;
          }
          scanner.fieldCount = f;
          if (bytes !== null) bytes.row(buf, ascii, scanner, line);
          else sink.row(buf, ascii, scanner, line);
          passed++;
        } else this.kernelOther(buf, record, line, valid);
        line++;
        record = end;
      }
      if (state[5] !== KernelStop.Spent) break;
      span = nextSpan(state, span, spanEnd, regionEnd);
    }
    this.line = line;
    this.passed += passed;
    return record;
  }

  /**
   * The kernel's records from..to-1, on the lines from `line`, through the tally: the rows it does not
   * count go to the batch builder one by one, and all that follow once it stops taking any. With `width`
   * (not -1) they are taken as rows while they have that many fields, and it returns the first that has
   * not (the caller reads it again), else `to`; with -1 they are all whole rows.
   */
  private tallied(tally: KernelTally, kernel: RecordKernel, bytes: ByteBatchBuilder, buf: Buffer, from: number, to: number, span: number, line: number, width: number): number {
    const { stride, wanted } = this;
    const output = kernel.output;
    let r = from;
    while (r < to) {
      const t = tally.take(kernel, buf, r, to, stride, this.tallySlot, span, line + (r - from), width);
      if (t >= to) return to;
      if (width >= 0 && output[t * stride + 1] !== width) return t;
      bytes.kernelRows(output, t * stride, 1, stride, wanted, line + (t - from));
      r = t + 1;
      if (!tally.active) {
        const end = width >= 0 ? kernel.firstOther(r, to, stride, width) : to;
        if (end > r) bytes.kernelRows(output, r * stride, end - r, stride, wanted, line + (r - from));
        return end;
      }
    }
    return to;
  }

  /**
   * The first of the kernel's records from..n-1 (the first starting at `start`) that `takes` refuses, or n:
   * firstOther's answer when records may be blank lines of a one-column table or not UTF-8.
   */
  private firstNotTaken(buf: Buffer, output: Int32Array, from: number, n: number, stride: number, start: number, valid: boolean): number {
    let record = start;
    for (let r = from, o = from * stride; r < n; r++, o += stride) {
      const end = output[o]!;
      if (!this.takes(buf, record, end, output[o + 1]!, valid)) return r;
      record = end;
    }
    return n;
  }

  /** True when the kernel's record buf[record, end) of `f` fields is a whole row: as wide as the header, not a blank line, UTF-8. */
  private takes(buf: Buffer, record: number, end: number, f: number, valid: boolean): boolean {
    const c0 = buf[record]!;
    return f === this.ctx.width && !(f === 1 && (c0 === LF || c0 === CR)) && (valid || isUtf8(buf.subarray(record, end)));
  }

  /** A record the kernel found and the sink does not take: scanned again in full, for its diagnostics. */
  private kernelOther(buf: Buffer, record: number, line: number, valid: boolean): void {
    // The record ends in a line break inside the buffer, with no line break inside quotes: scanPlain
    // reads it whole when it has no quote, scan otherwise (the record is whole, so it never needs more).
    const { scanner } = this;
    const plain = scanner.scanPlain(buf, record, buf.length);
    this.other(plain ? Scan.Record : scanner.scan(buf, record, buf.length, false), buf, record, line, valid);
    // The kernel's next records in this span are handed over with `escaped` as it is: keep it plain.
    if (!plain) scanner.escaped.fill(0);
  }

  /** A quote-free record the loops do not pass on: its bounds are left in the scanner as `scan` would. */
  private plainOther(buf: Buffer, pos: number, end: number, f: number, line: number, valid: boolean): void {
    const { scanner } = this;
    scanner.fieldCount = f;
    scanner.end = end;
    scanner.breaks = 1;
    scanner.blank = f === 1 && scanner.ends[0] === pos;
    this.other(Scan.Record, buf, pos, line, valid);
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

/** Offset of the first double quote in buf[from, len), or len. */
function firstQuote(buf: Buffer, from: number, len: number): number {
  const q = buf.indexOf(QUOTE, from);
  return q < 0 ? len : q;
}

/** The first field of the last record whose bytes are not valid UTF-8. */
function firstBadField(buf: Buffer, scanner: CsvScanner): number {
  const n = Math.min(scanner.fieldCount, scanner.starts.length);
  for (let k = 0; k < n; k++) {
    if (!isUtf8(buf.subarray(scanner.starts[k], scanner.ends[k]))) return k;
  }
  return -1;
}

/**
 * Where the kernel's next span begins, once it has spent span..spanEnd: at the start of the record left
 * unfinished, walked again from its first byte with STATE set as at any record start, so that every
 * record that fits in a span lies whole in one (the instant tally reads only fields inside its span, and
 * left the record across each 64 KiB boundary to the batch path: 5,192 rows of the benchmark's 10M).
 * A record longer than the span, and the region's last, are carried on in STATE as they are.
 */
function nextSpan(state: Int32Array, span: number, spanEnd: number, regionEnd: number): number {
  const rest = state[0]!;
  if (rest <= span || spanEnd >= regionEnd) return spanEnd;
  state[1] = rest; // field start
  state[2] = 0; // field number
  state[4] = 0; // wanted slot
  state[6] = 0; // outside quotes
  return rest;
}
