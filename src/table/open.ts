// openTable: the one entry to table input. Opens the file, reads just enough to know the format,
// delimiter and header, and then streams the requested columns once, in batches.
import { open } from 'node:fs/promises';
import { resolve } from 'node:path';
import { QuernError } from '../errors.js';
import { RowAccount } from './accounting.js';
import { findColumn } from './columns.js';
import { fastCsvBatches, fastCsvByteBatches } from './fast-csv.js';
import { scanCsvHeader } from './header.js';
import { ndjsonBatches, scanNdjsonHeader } from './ndjson.js';
import { referenceCsvBatches } from './reference-csv.js';
import { formatFromName, parseDelimiter, sniffDelimiter, sniffFormat } from './sniff.js';
import { fileError, openSource, type ByteSource } from './source.js';
import type { BodyContext } from './body.js';
import { toByteBatches } from './to-bytes.js';
import type { ByteBatch, ColumnBatch, TableEngine, TableFormat, TableOptions, TableReader } from './types.js';

const SNIFF_BYTES = 64 * 1024;
const BOM = [0xef, 0xbb, 0xbf];
const LF = 0x0a;
const CR = 0x0d;

/**
 * Reads chunks until at least `min` bytes are gathered or the input ends. The chunks read are copied
 * into the buffer returned, and released to the source.
 */
async function gather(source: ByteSource, start: Buffer, min: number): Promise<{ buf: Buffer; final: boolean }> {
  const parts = [start];
  let size = start.length;
  let final = false;
  while (size < min) {
    const c = await source.read();
    if (c === null) {
      final = true;
      break;
    }
    parts.push(c);
    size += c.length;
  }
  if (parts.length === 1) return { buf: start, final };
  const buf = Buffer.concat(parts, size);
  for (let k = 1; k < parts.length; k++) source.release(parts[k]!);
  return { buf, final };
}

interface Start {
  header: string[];
  /** Offset in the decoded input just after the header (the BOM counted). */
  bodyStart: number;
  format: TableFormat;
  delimiter: string;
  startLine: number;
  blankLines: number;
  endsWithBreak: boolean;
}

/** Reads the start of the input: strips a UTF-8 BOM, settles format and delimiter, finds the header. */
async function readStart(file: string, source: ByteSource, options: TableOptions): Promise<Start> {
  let { buf, final } = await gather(source, Buffer.alloc(0), SNIFF_BYTES);
  const bom = buf.length >= 3 && buf[0] === BOM[0] && buf[1] === BOM[1] && buf[2] === BOM[2] ? 3 : 0;
  buf = buf.subarray(bom);
  const format = options.format ?? formatFromName(file) ?? sniffFormat(buf);
  const delimiter =
    format === 'ndjson' ? '' : options.delimiter !== undefined ? parseDelimiter(options.delimiter) : format === 'tsv' ? '\t' : sniffDelimiter(buf, final);
  for (;;) {
    const found = format === 'ndjson' ? scanNdjsonHeader(file, buf, final) : scanCsvHeader(file, buf, final, delimiter);
    if (found !== null) {
      source.unshift(buf.subarray(found.end));
      return { header: found.names, bodyStart: bom + found.end, format, delimiter, startLine: found.nextLine, blankLines: found.blankLines, endsWithBreak: found.endsWithBreak };
    }
    ({ buf, final } = await gather(source, buf, buf.length * 2));
  }
}

/** Throws QuernError('E_USAGE') for a byte range that is malformed or asks for an input it cannot read. */
function checkRangeOptions(file: string, options: TableOptions, range: { start: number; end: number }): void {
  const { start, end } = range;
  // end <= start is an empty range (a range re-read from a stop past its end reads nothing).
  if (!Number.isSafeInteger(start) || !Number.isSafeInteger(end) || start < 0 || end < 0) {
    throw new QuernError('E_USAGE', `byte range ${start}-${end} must be two whole offsets, neither negative`);
  }
  if (file === '-') throw new QuernError('E_USAGE', 'a byte range needs a plain file, not standard input');
  if (options.engine === 'reference') throw new QuernError('E_USAGE', 'a byte range is read by the fast engine only, not the reference engine');
}

/** Progress of a range: bytes its source has read, up to the range's length (from the file's start for a first range). */
function rangeProgress(options: TableOptions, range: { start: number; end: number }): TableOptions['onProgress'] {
  const report = options.onProgress;
  if (report === undefined) return undefined;
  return (bytes, total) => {
    const length = Math.max(0, Math.min(range.end, total ?? range.end) - (range.start === 0 ? 0 : range.start));
    report(Math.min(bytes, length), length);
  };
}

/**
 * The source of a range starting after the header: the file read from `range.start`, which must be past
 * the header, within the file and just after a line break (LF, or a CR not followed by LF).
 */
async function openRangeSource(file: string, options: TableOptions, range: { start: number; end: number }, bodyStart: number, size: number): Promise<ByteSource> {
  const { start } = range;
  if (start < bodyStart) throw new QuernError('E_USAGE', `${file}: byte range start ${start} lies inside the header, which ends at ${bodyStart}`);
  if (start > size) throw new QuernError('E_USAGE', `${file}: byte range start ${start} lies past the end of the file (${size} bytes)`);
  if (start > bodyStart && start < size) {
    const around = await readAt(file, options, start - 1, 2);
    const ok = around[0] === LF || (around[0] === CR && around[1] !== LF);
    if (!ok) throw new QuernError('E_USAGE', `${file}: byte range start ${start} is not just after a line break`, 'start a range just after a line feed');
  }
  return openSource(file, { ...options, position: start, onProgress: rangeProgress(options, range) });
}

/** Up to `n` bytes of the file at `position`. */
async function readAt(file: string, options: TableOptions, position: number, n: number): Promise<Buffer> {
  const handle = await open(resolve(options.cwd ?? process.cwd(), file), 'r').catch((e: unknown) => {
    throw fileError(file, e);
  });
  try {
    const buf = Buffer.alloc(n);
    const { bytesRead } = await handle.read(buf, 0, n, position);
    return buf.subarray(0, bytesRead);
  } catch (e) {
    throw fileError(file, e);
  } finally {
    await handle.close();
  }
}

/**
 * Opens a CSV, TSV or NDJSON table (optionally gzipped; '-' is standard input) and reads its header.
 * Throws QuernError 'E_FILE' (missing, a folder, unreadable), 'E_HEADER' (empty or duplicate names,
 * no header) or 'E_USAGE' (a bad delimiter, a byte range where none can be read).
 */
export async function openTable(file: string, options: TableOptions = {}): Promise<TableReader> {
  const range = options.byteRange;
  if (range !== undefined) checkRangeOptions(file, options, range);
  // A range starting after the header reads the header with progress silent, in small reads (SNIFF_BYTES,
  // doubled while no header is found): its records' source reports, and reads the range in full-size
  // chunks. Reading the header in 1 MiB chunks, each copied, cost a range about 4 ms on a machine whose
  // fresh pages are slow (0.07 s of a 10M-row rebin on two threads when it read 16 ranges).
  const headerOnly = range !== undefined && range.start > 0;
  let source = await openSource(file, range === undefined ? options
    : { ...options, ...(headerOnly ? { chunkSize: SNIFF_BYTES } : {}), onProgress: range.start === 0 ? rangeProgress(options, range) : undefined });
  let start: Start;
  try {
    start = await readStart(file, source, options);
    if (range !== undefined) {
      if (source.gzip) throw new QuernError('E_USAGE', `${file}: a byte range needs a plain file, not gzip data`);
      if (start.format === 'ndjson') throw new QuernError('E_USAGE', `${file}: a byte range reads CSV or TSV, not NDJSON`);
    }
  } catch (e) {
    source.close();
    throw e;
  }
  if (range !== undefined && range.start > 0) {
    source.close();
    source = await openRangeSource(file, options, range, start.bodyStart, source.totalBytes ?? 0);
  }
  const relative = range !== undefined && range.start > 0;
  const engine: TableEngine = options.engine ?? 'fast';
  const account = new RowAccount(file, options.maxExamples ?? 5);
  account.blankLines = relative ? 0 : start.blankLines;
  account.lines = relative ? 0 : start.startLine - (start.endsWithBreak ? 1 : 0);
  const batchSize = options.batchSize ?? 8192;
  if (!Number.isInteger(batchSize) || batchSize < 1) throw new QuernError('E_USAGE', `batch size must be a positive integer, got ${batchSize}`);
  let used = false;
  const header = Object.freeze([...start.header]);
  // Where the records' bytes begin, and the offset from which a range's bytes are counted.
  const bodyOffset = relative ? range.start : start.bodyStart;
  const rangeBase = relative ? range.start : 0;
  const reader: TableReader = {
    file,
    header,
    format: start.format,
    delimiter: start.delimiter,
    engine,
    totalBytes: source.totalBytes,
    splittable: file !== '-' && !source.gzip && start.format !== 'ndjson' && engine === 'fast',
    bodyStart: start.bodyStart,
    headerLines: start.startLine - 1,
    batchSize,
    columnIndex: (name) => findColumn(file, header, name),
    batches(columns) {
      const idx = columns.map((c) => findColumn(file, header, c));
      if (used) throw new QuernError('E_USAGE', `${file}: batches() may be read only once per openTable`);
      used = true;
      return stream(idx);
    },
    byteBatches(byteColumns, stringColumns = [], read = {}) {
      const bytes = byteColumns.map((c) => findColumn(file, header, c));
      const strings = stringColumns.map((c) => findColumn(file, header, c));
      if (used) throw new QuernError('E_USAGE', `${file}: batches() may be read only once per openTable`);
      used = true;
      return byteStream(bytes, strings, read);
    },
    summary() {
      const s = account.summary({
        bytesRead: source.bytesRead(),
        bytesDecoded: source.bytesDecoded(),
        format: start.format,
        delimiter: start.delimiter,
        engine,
        stop: source.bytesDecoded(),
      });
      if (range !== undefined) {
        // A range's bytes are those of its records (the header's too for the first range), not the
        // chunks read ahead; before any record is read, none.
        s.stop = account.stop >= 0 ? account.stop : bodyOffset;
        s.bytesRead = s.bytesDecoded = account.stop >= 0 ? account.stop - rangeBase : 0;
      }
      return s;
    },
    close: () => source.close(),
  };
  const csvContext = (idx: readonly number[], read: BodyContext['read'] = {}): BodyContext => ({
    source,
    width: header.length,
    header,
    columns: idx,
    delimiter: start.delimiter.charCodeAt(0),
    account,
    batchSize,
    startLine: relative ? 1 : start.startLine,
    headerEndsWithBreak: relative ? true : start.endsWithBreak,
    offset: bodyOffset,
    end: range === undefined ? Infinity : range.end,
    read,
    simd: options.simd !== false,
  });
  const stringBody = (idx: readonly number[]): AsyncGenerator<ColumnBatch> =>
    start.format === 'ndjson'
      ? ndjsonBatches({ source, header, columns: idx, account, batchSize, startLine: start.startLine })
      : (engine === 'reference' ? referenceCsvBatches : fastCsvBatches)(csvContext(idx));
  async function* run<B>(body: AsyncGenerator<B>): AsyncGenerator<B> {
    try {
      yield* body;
      account.complete = true;
    } finally {
      source.close();
    }
  }
  const stream = (idx: number[]): AsyncGenerator<ColumnBatch> => run(stringBody(idx));
  // The fast CSV path delivers offsets into its own buffers; the others write their strings out as bytes.
  const byteStream = (bytes: number[], strings: number[], read: BodyContext['read']): AsyncGenerator<ByteBatch> =>
    run(
      start.format !== 'ndjson' && engine === 'fast'
        ? fastCsvByteBatches(csvContext(bytes, read), strings)
        : toByteBatches(stringBody([...bytes, ...strings]), bytes.length),
    );
  return reader;
}
