// Newline-delimited JSON: one object per line; the first object's keys are the header.
//
// Rules chosen (documented in the summary type): lines end at LF, CRLF or a lone CR (JSON text
// cannot hold a raw line end); a line that is empty or only white space is a blank line, not a row;
// a line that is not JSON is rejected as 'bad-json', a JSON value that is not an object as
// 'not-an-object'. A key absent from a row gives an empty value; null gives an empty value; numbers
// and booleans are written as JSON writes them; arrays and objects as their JSON text. Keys that the
// first object lacks are counted per key in `unknownKeys` and their rows are passed on.
import { isAscii, isUtf8 } from 'node:buffer';
import { QuernError } from '../errors.js';
import type { RowAccount } from './accounting.js';
import { BatchBuilder } from './batch.js';
import { nextBuffer } from './chunks.js';
import { checkHeaderNames } from './header.js';
import type { ByteSource } from './source.js';
import type { ColumnBatch } from './types.js';

const LF = 0x0a;
const CR = 0x0d;

/** The next line in buf from pos: [start, contentEnd) and the offset after its line end; null if unfinished. */
function nextLine(buf: Buffer, pos: number, final: boolean): { contentEnd: number; end: number } | null {
  let i = pos;
  while (i < buf.length && buf[i] !== LF && buf[i] !== CR) i++;
  if (i >= buf.length) return final ? { contentEnd: i, end: i } : null;
  if (buf[i] === LF) return { contentEnd: i, end: i + 1 };
  if (i + 1 >= buf.length && !final) return null;
  return { contentEnd: i, end: buf[i + 1] === LF ? i + 2 : i + 1 };
}

function isBlank(buf: Buffer, s: number, e: number): boolean {
  for (let i = s; i < e; i++) {
    const b = buf[i];
    if (b !== 0x20 && b !== 0x09) return false;
  }
  return true;
}

/** The header found in the first bytes: keys of the first object. */
export interface NdjsonHeader {
  names: string[];
  end: number;
  nextLine: number;
  blankLines: number;
  endsWithBreak: boolean;
}

/** Finds the first object line and takes its keys as the header; null when more bytes are needed. */
export function scanNdjsonHeader(file: string, buf: Buffer, final: boolean): NdjsonHeader | null {
  let pos = 0;
  let line = 1;
  let blankLines = 0;
  while (pos < buf.length) {
    const l = nextLine(buf, pos, final);
    if (l === null) return null;
    if (isBlank(buf, pos, l.contentEnd)) {
      blankLines += l.end > l.contentEnd ? 1 : 0;
      line++;
      pos = l.end;
      continue;
    }
    const text = buf.toString('utf8', pos, l.contentEnd);
    let obj: unknown;
    try {
      obj = JSON.parse(text);
    } catch {
      obj = undefined;
    }
    if (obj === null || typeof obj !== 'object' || Array.isArray(obj)) {
      throw new QuernError('E_HEADER', `${file}:${line}: the first line is not a JSON object, so it cannot name the columns`, 'each NDJSON line must be one JSON object');
    }
    const names = Object.keys(obj);
    if (names.length === 0) throw new QuernError('E_HEADER', `${file}:${line}: the first object has no keys to name the columns`);
    checkHeaderNames(file, names);
    return { names, end: pos, nextLine: line, blankLines, endsWithBreak: pos > 0 };
  }
  if (!final) return null;
  throw new QuernError('E_HEADER', `${file}: has no JSON object to name the columns (the input is empty)`);
}

/** Text of one JSON value as a cell. */
function cell(v: unknown): string {
  if (v === undefined || v === null) return '';
  if (typeof v === 'string') return v;
  if (typeof v === 'object') return JSON.stringify(v);
  return String(v);
}

/** Reads NDJSON rows (from the first object line on) in batches of the requested columns. */
export async function* ndjsonBatches(ctx: {
  source: ByteSource;
  header: readonly string[];
  columns: readonly number[];
  account: RowAccount;
  batchSize: number;
  startLine: number;
}): AsyncGenerator<ColumnBatch> {
  const { source, account, header } = ctx;
  const names = ctx.columns.map((k) => header[k]!);
  const known = new Set(header);
  const builder = new BatchBuilder(names.length, ctx.batchSize);
  let line = ctx.startLine;
  let carry: Buffer | null = null;
  let endsWithBreak = false;
  for (;;) {
    const { buf, final } = await nextBuffer(source, carry);
    carry = null;
    if (buf === null) {
      for (const b of builder.take(true)) yield b;
      break;
    }
    if (buf.length > 0) endsWithBreak = buf[buf.length - 1] === LF || buf[buf.length - 1] === CR;
    const ascii = isAscii(buf);
    let pos = 0;
    while (pos < buf.length) {
      const l = nextLine(buf, pos, final);
      if (l === null) break;
      if (isBlank(buf, pos, l.contentEnd)) account.blankLines++;
      else if (!ascii && !isUtf8(buf.subarray(pos, l.contentEnd))) {
        account.reject('undecodable-bytes', line, 'bytes that are not valid UTF-8 (is the file in another encoding?)', buf.toString('utf8', pos, Math.min(l.contentEnd, pos + 120)));
      } else readObject(buf.toString(ascii ? 'latin1' : 'utf8', pos, l.contentEnd), line);
      line++;
      pos = l.end;
    }
    if (pos < buf.length) carry = buf.subarray(pos);
    for (const b of builder.take(final)) yield b;
    if (final) break;
  }
  account.lines = line - (endsWithBreak ? 1 : 0);
  // Every line read was counted in `line`; the last one holds no break when the input ends without one.
  account.breaks = line - ctx.startLine - (endsWithBreak || line === ctx.startLine ? 0 : 1);

  function readObject(text: string, at: number): void {
    let obj: unknown;
    try {
      obj = JSON.parse(text);
    } catch (e) {
      account.reject('bad-json', at, `not valid JSON (${(e as Error).message})`, text);
      return;
    }
    if (obj === null || typeof obj !== 'object' || Array.isArray(obj)) {
      account.reject('not-an-object', at, 'a JSON value that is not an object', text);
      return;
    }
    const rec = obj as Record<string, unknown>;
    for (const k in rec) if (!known.has(k)) account.unknownKey(k);
    const out = builder.columns;
    const n = builder.length;
    for (let c = 0; c < names.length; c++) out[c]![n] = cell(rec[names[c]!]);
    builder.commit(at);
    account.pass();
  }
}
