// What both CSV engines share when reading the rows after the header: the context they run in and
// the wording of each rejection, so the fast path and the reference path report alike.
import type { RowAccount } from './accounting.js';
import type { ByteSource } from './source.js';
import type { ByteReadOptions } from './types.js';

/** Everything a body reader needs: the source positioned just after the header. */
export interface BodyContext {
  source: ByteSource;
  /** Fields per row (the header's length). */
  width: number;
  header: readonly string[];
  /** Indexes of the requested columns, in the order of the batch's values. */
  columns: readonly number[];
  /** Delimiter byte. */
  delimiter: number;
  account: RowAccount;
  batchSize: number;
  /** Physical line on which the first body row starts. */
  startLine: number;
  /** Whether the input so far (the header) ends with a line break. */
  headerEndsWithBreak: boolean;
  /** Offset in the decoded input of the source's next byte (just after the header, or a range's start). */
  offset: number;
  /** Records are read while they start before this offset (a byte range's end); Infinity for all. */
  end: number;
  /**
   * The consumer's promise, read afresh at every buffer: while `transient` is true it holds no batch
   * once it asks for the next, so read buffers and batch arrays may be reused; its `tally`, when set,
   * counts rows itself (TableReader.byteBatches).
   */
  read: ByteReadOptions;
  /** Whether the SIMD kernel may find a comma-separated file's delimiters (TableOptions.simd). */
  simd: boolean;
}

const PREVIEW_BYTES = 120;

/** The start of a row's text for a diagnostic, without its line end. */
export function rowPreview(buf: Buffer, start: number, end: number): string {
  let e = Math.min(end, start + PREVIEW_BYTES);
  while (e > start && (buf[e - 1] === 0x0a || buf[e - 1] === 0x0d)) e--;
  return buf.toString('utf8', start, e);
}

/** Rejects a row with the wrong number of fields. */
export function rejectRagged(ctx: BodyContext, line: number, found: number, preview: () => string): void {
  const { account, width } = ctx;
  const wants = account.examples.length < account.maxExamples;
  account.reject(
    'ragged-row',
    line,
    `expected ${width} field${width === 1 ? '' : 's'} as in the header, found ${found}`,
    wants ? preview() : undefined,
  );
}

/** Rejects a row holding bytes that are not UTF-8; names the first such column when known. */
export function rejectUndecodable(ctx: BodyContext, line: number, field: number, preview: () => string): void {
  const { account, header } = ctx;
  const wants = account.examples.length < account.maxExamples;
  account.reject(
    'undecodable-bytes',
    line,
    'bytes that are not valid UTF-8 (is the file in another encoding, such as Latin-1 or Windows-1252?)',
    wants ? preview() : undefined,
    field >= 0 && field < header.length ? header[field] : undefined,
  );
}

/** Rejects a row whose quoting is broken: an unclosed quote, or a quote where none may stand.
 *  `breaks` is the number of line ends the row spans, or -1 when unknown. */
export function rejectMalformed(
  ctx: BodyContext,
  reason: 'bad-quote' | 'unterminated-quote',
  line: number,
  breaks: number,
  preview: () => string,
): void {
  const { account } = ctx;
  const wants = account.examples.length < account.maxExamples;
  const message =
    reason === 'bad-quote'
      ? 'a double quote inside an unquoted field, or text after a closing quote (RFC 4180 §2.5–2.7)'
      : breaks < 0
        ? 'a quoted field opened in this row is never closed; the rest of the input was read as this one row'
        : `a quoted field opened in this row is never closed; the rest of the input (${breaks + 1} line${breaks === 0 ? '' : 's'}) was read as this one row`;
  account.reject(reason, line, message, wants ? preview() : undefined);
}
