// The bytes of an input: a file or standard input, gunzipped when compressed, read in chunks
// with progress, and every failure turned into one clear QuernError('E_FILE') line.
import { open, stat } from 'node:fs/promises';
import { resolve } from 'node:path';
import { Readable, pipeline } from 'node:stream';
import { createGunzip } from 'node:zlib';
import { QuernError } from '../errors.js';

/** Decoded bytes of one input, read once, in order. */
export interface ByteSource {
  /** The file as the user named it ('-' for standard input). */
  readonly name: string;
  readonly totalBytes: number | undefined;
  readonly gzip: boolean;
  /** Next chunk of decoded bytes, or null at the end. Throws QuernError('E_FILE') on a read failure. */
  read(): Promise<Buffer | null>;
  /** Puts bytes back in front of the stream (used after peeking at the start). */
  unshift(chunk: Buffer): void;
  bytesRead(): number;
  bytesDecoded(): number;
  close(): void;
}

export interface SourceOptions {
  stdin?: NodeJS.ReadableStream;
  cwd?: string;
  chunkSize?: number;
  onProgress?: (bytesRead: number, totalBytes: number | undefined) => void;
  /** Offset of a plain file at which to begin reading (default 0); progress counts from there. */
  position?: number;
}

const GZIP_MAGIC_0 = 0x1f; // RFC 1952 §2.3.1: ID1 = 31, ID2 = 139
const GZIP_MAGIC_1 = 0x8b;

/** Opens a file (or '-' for standard input) for reading; gzip is recognised by `.gz` or its magic bytes. */
export async function openSource(file: string, options: SourceOptions = {}): Promise<ByteSource> {
  const raw = file === '-' ? stdinStream(options) : await fileStream(file, options);
  const counter = { raw: 0, decoded: 0 };
  const rawIter = countingIterator(raw.stream, file, counter, raw.totalBytes, options.onProgress);
  const first = await rawIter.next();
  const head = first.done ? Buffer.alloc(0) : first.value;
  const gzip = /\.gz$/i.test(file) || (head.length >= 2 && head[0] === GZIP_MAGIC_0 && head[1] === GZIP_MAGIC_1);
  async function* rawAll(): AsyncGenerator<Buffer> {
    if (head.length > 0) yield head;
    for (;;) {
      const r = await rawIter.next();
      if (r.done) return;
      yield r.value;
    }
  }
  const decoded = gzip ? gunzipIterator(rawAll(), file) : rawAll();
  const pending: Buffer[] = [];
  return {
    name: file,
    totalBytes: raw.totalBytes,
    gzip,
    async read() {
      const back = pending.pop();
      if (back !== undefined) return back;
      const r = await decoded.next();
      if (r.done) return null;
      counter.decoded += r.value.length;
      return r.value;
    },
    unshift(chunk) {
      if (chunk.length > 0) pending.push(chunk);
    },
    bytesRead: () => counter.raw,
    bytesDecoded: () => counter.decoded,
    close() {
      // Standard input belongs to the caller; a file stream is ours to close.
      if (file !== '-') raw.stream.destroy?.();
    },
  };
}

interface RawStream {
  stream: NodeJS.ReadableStream & { destroy?: () => void };
  totalBytes: number | undefined;
}

function stdinStream(options: SourceOptions): RawStream {
  if (options.stdin === undefined) {
    throw new QuernError('E_USAGE', 'file "-" means standard input, but no input stream was given');
  }
  return { stream: options.stdin, totalBytes: undefined };
}

async function fileStream(file: string, options: SourceOptions): Promise<RawStream> {
  const path = resolve(options.cwd ?? process.cwd(), file);
  let size: number;
  try {
    const st = await stat(path);
    if (st.isDirectory()) throw new QuernError('E_FILE', `${file}: is a folder, not a file`, 'name a CSV, TSV or NDJSON file');
    size = st.size;
  } catch (e) {
    throw fileError(file, e);
  }
  try {
    const handle = await open(path, 'r');
    const stream = handle.createReadStream({ highWaterMark: options.chunkSize ?? 1 << 20, start: options.position ?? 0 });
    return { stream, totalBytes: size };
  } catch (e) {
    throw fileError(file, e);
  }
}

/** One-line E_FILE error for a failed open or read. */
export function fileError(file: string, e: unknown): QuernError {
  if (e instanceof QuernError) return e;
  const code = (e as NodeJS.ErrnoException).code;
  const reason =
    code === 'ENOENT' ? 'no such file'
    : code === 'EACCES' || code === 'EPERM' ? 'permission denied'
    : code === 'EISDIR' ? 'is a folder, not a file'
    : code === 'ENOTDIR' ? 'a part of the path is not a folder'
    : `cannot be read (${code ?? (e as Error).message})`;
  const hint = code === 'ENOENT' ? 'check the path; a relative path is read from the current folder' : undefined;
  return new QuernError('E_FILE', `${file}: ${reason}`, hint);
}

async function* countingIterator(
  stream: NodeJS.ReadableStream,
  file: string,
  counter: { raw: number },
  total: number | undefined,
  onProgress: SourceOptions['onProgress'],
): AsyncGenerator<Buffer> {
  try {
    for await (const chunk of stream as AsyncIterable<Buffer | string>) {
      const buf = typeof chunk === 'string' ? Buffer.from(chunk) : chunk;
      counter.raw += buf.length;
      onProgress?.(counter.raw, total);
      yield buf;
    }
  } catch (e) {
    throw fileError(file, e);
  }
}

async function* gunzipIterator(raw: AsyncGenerator<Buffer>, file: string): AsyncGenerator<Buffer> {
  const gunzip = createGunzip();
  pipeline(Readable.from(raw), gunzip, () => undefined);
  let sawInput = false;
  try {
    for await (const chunk of gunzip as AsyncIterable<Buffer>) {
      sawInput = true;
      yield chunk;
    }
  } catch (e) {
    if (e instanceof QuernError) throw e;
    const msg = (e as Error).message;
    const cut = /unexpected end/i.test(msg);
    throw new QuernError(
      'E_FILE',
      cut
        ? `${file}: gzip data ends early (the file is cut short${sawInput ? '' : ' before any data'})`
        : `${file}: gzip data is damaged (${msg})`,
      'recompress or download the file again',
    );
  }
}
