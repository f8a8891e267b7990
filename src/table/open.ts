// openTable: the one entry to table input. Opens the file, reads just enough to know the format,
// delimiter and header, and then streams the requested columns once, in batches.
import { QuernError } from '../errors.js';
import { RowAccount } from './accounting.js';
import { findColumn } from './columns.js';
import { fastCsvBatches, fastCsvByteBatches } from './fast-csv.js';
import { scanCsvHeader } from './header.js';
import { ndjsonBatches, scanNdjsonHeader } from './ndjson.js';
import { referenceCsvBatches } from './reference-csv.js';
import { formatFromName, parseDelimiter, sniffDelimiter, sniffFormat } from './sniff.js';
import { openSource, type ByteSource } from './source.js';
import type { BodyContext } from './body.js';
import { toByteBatches } from './to-bytes.js';
import type { ByteBatch, ColumnBatch, TableEngine, TableFormat, TableOptions, TableReader } from './types.js';

const SNIFF_BYTES = 64 * 1024;
const BOM = [0xef, 0xbb, 0xbf];

/** Reads chunks until at least `min` bytes are gathered or the input ends. */
async function gather(source: ByteSource, start: Buffer, min: number): Promise<{ buf: Buffer; final: boolean }> {
  const parts = [start];
  let size = start.length;
  while (size < min) {
    const c = await source.read();
    if (c === null) return { buf: Buffer.concat(parts), final: true };
    parts.push(c);
    size += c.length;
  }
  return { buf: parts.length === 1 ? start : Buffer.concat(parts), final: false };
}

interface Start {
  header: string[];
  format: TableFormat;
  delimiter: string;
  startLine: number;
  blankLines: number;
  endsWithBreak: boolean;
}

/** Reads the start of the input: strips a UTF-8 BOM, settles format and delimiter, finds the header. */
async function readStart(file: string, source: ByteSource, options: TableOptions): Promise<Start> {
  let { buf, final } = await gather(source, Buffer.alloc(0), SNIFF_BYTES);
  if (buf.length >= 3 && buf[0] === BOM[0] && buf[1] === BOM[1] && buf[2] === BOM[2]) buf = buf.subarray(3);
  const format = options.format ?? formatFromName(file) ?? sniffFormat(buf);
  const delimiter =
    format === 'ndjson' ? '' : options.delimiter !== undefined ? parseDelimiter(options.delimiter) : format === 'tsv' ? '\t' : sniffDelimiter(buf, final);
  for (;;) {
    const found = format === 'ndjson' ? scanNdjsonHeader(file, buf, final) : scanCsvHeader(file, buf, final, delimiter);
    if (found !== null) {
      source.unshift(buf.subarray(found.end));
      return { header: found.names, format, delimiter, startLine: found.nextLine, blankLines: found.blankLines, endsWithBreak: found.endsWithBreak };
    }
    ({ buf, final } = await gather(source, buf, buf.length * 2));
  }
}

/**
 * Opens a CSV, TSV or NDJSON table (optionally gzipped; '-' is standard input) and reads its header.
 * Throws QuernError 'E_FILE' (missing, a folder, unreadable), 'E_HEADER' (empty or duplicate names,
 * no header) or 'E_USAGE' (a bad delimiter).
 */
export async function openTable(file: string, options: TableOptions = {}): Promise<TableReader> {
  const source = await openSource(file, options);
  let start: Start;
  try {
    start = await readStart(file, source, options);
  } catch (e) {
    source.close();
    throw e;
  }
  const engine: TableEngine = options.engine ?? 'fast';
  const account = new RowAccount(file, options.maxExamples ?? 5);
  account.blankLines = start.blankLines;
  account.lines = start.startLine - (start.endsWithBreak ? 1 : 0);
  const batchSize = options.batchSize ?? 8192;
  if (!Number.isInteger(batchSize) || batchSize < 1) throw new QuernError('E_USAGE', `batch size must be a positive integer, got ${batchSize}`);
  let used = false;
  const header = Object.freeze([...start.header]);
  const reader: TableReader = {
    file,
    header,
    format: start.format,
    delimiter: start.delimiter,
    engine,
    totalBytes: source.totalBytes,
    batchSize,
    columnIndex: (name) => findColumn(file, header, name),
    batches(columns) {
      const idx = columns.map((c) => findColumn(file, header, c));
      if (used) throw new QuernError('E_USAGE', `${file}: batches() may be read only once per openTable`);
      used = true;
      return stream(idx);
    },
    byteBatches(byteColumns, stringColumns = []) {
      const bytes = byteColumns.map((c) => findColumn(file, header, c));
      const strings = stringColumns.map((c) => findColumn(file, header, c));
      if (used) throw new QuernError('E_USAGE', `${file}: batches() may be read only once per openTable`);
      used = true;
      return byteStream(bytes, strings);
    },
    summary: () =>
      account.summary({ bytesRead: source.bytesRead(), bytesDecoded: source.bytesDecoded(), format: start.format, delimiter: start.delimiter, engine }),
    close: () => source.close(),
  };
  const csvContext = (idx: readonly number[]): BodyContext => ({
    source,
    width: header.length,
    header,
    columns: idx,
    delimiter: start.delimiter.charCodeAt(0),
    account,
    batchSize,
    startLine: start.startLine,
    headerEndsWithBreak: start.endsWithBreak,
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
  const byteStream = (bytes: number[], strings: number[]): AsyncGenerator<ByteBatch> =>
    run(
      start.format !== 'ndjson' && engine === 'fast'
        ? fastCsvByteBatches(csvContext(bytes), strings)
        : toByteBatches(stringBody([...bytes, ...strings]), bytes.length),
    );
  return reader;
}
