// makeTimeBytesParser: the byte-level twin of makeTimeParser, for hot paths that hold a field as bytes
// (a ByteBatch of src/table). ISO 8601 values in the common shapes are read from the bytes; every other
// value, and every other format, is decoded as UTF-8 and read by the string parser of the same format,
// so results and reasons are those of makeTimeParser on the same text.
import { makeTimeParser, type TimeParserOptions } from './parser.js';
import { type TimeFormat, type TimeFormatId, isTimeFormatId, timeFormat } from './format.js';
import { fastIsoBytes, newIsoDateMemo } from './iso-bytes.js';
import type { ParsedTime } from './types.js';

/** Reads the UTF-8 bytes buf[start, end) into `out`; returns null on success, else a reason code and words. */
export type TimeBytesParser = (buf: Buffer, start: number, end: number, out: ParsedTime) => string | null;

/**
 * True when a value that `fastIsoBytes` reads is read the same by `makeTimeParser(format, options)`:
 * the ISO 8601 formats (not intervals) without `strictKind`. A hot path may then call fastIsoBytes first
 * and the compiled parser only when it returns false.
 */
export function isoFastLane(format: TimeFormat | TimeFormatId | string, options: TimeParserOptions = {}): boolean {
  const f = typeof format === 'string' ? (isTimeFormatId(format) ? timeFormat(format) : null) : format;
  return f !== null && f.id.startsWith('iso-') && f.id !== 'iso-interval' && options.strictKind !== true;
}

/**
 * Compiles a format (or format id) into a parser of bytes that agrees with `makeTimeParser(format, options)`
 * on every value. Throws what makeTimeParser throws (QuernError 'E_USAGE' for an unknown id or a bad option).
 */
export function makeTimeBytesParser(format: TimeFormat | TimeFormatId | string, options: TimeParserOptions = {}): TimeBytesParser {
  const text = makeTimeParser(format, options);
  const f = typeof format === 'string' ? (isTimeFormatId(format) ? timeFormat(format) : null) : format;
  const decode = (buf: Buffer, s: number, e: number): string => (s === e ? '' : buf.toString('utf8', s, e));
  if (f === null || !f.id.startsWith('iso-') || f.id === 'iso-interval') {
    return (buf, s, e, out) => text(decode(buf, s, e), out);
  }
  // Each parser keeps its own memo of the last date read (neighbouring rows share it).
  const memo = newIsoDateMemo();
  if (options.strictKind !== true) {
    return (buf, s, e, out) => (fastIsoBytes(buf, s, e, out, memo) ? null : text(decode(buf, s, e), out));
  }
  const want = f.kind;
  // A value of another kind goes to the string parser, which words the 'other-kind' reason.
  return (buf, s, e, out) => (fastIsoBytes(buf, s, e, out, memo) && out.kind === want ? null : text(decode(buf, s, e), out));
}
