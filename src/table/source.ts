// The bytes of an input: a file or standard input, gunzipped when compressed, read in chunks
// with progress, and every failure turned into one clear QuernError('E_FILE') line.
import { open, stat, type FileHandle } from 'node:fs/promises';
import { resolve } from 'node:path';
import { Readable, pipeline } from 'node:stream';
import { createRequire } from 'node:module';
import { QuernError } from '../errors.js';

/** Decoded bytes of one input, read once, in order. */
export interface ByteSource {
  /** The file as the user named it ('-' for standard input). */
  readonly name: string;
  readonly totalBytes: number | undefined;
  readonly gzip: boolean;
  /** Next chunk of decoded bytes, or null at the end. Throws QuernError('E_FILE') on a read failure. */
  read(): Promise<Buffer | null>;
  /**
   * Says the caller holds no view of `chunk` (a chunk `read` returned, or a part of one) any more, so
   * its memory may be filled by a later read. Chunks never released are left to the garbage collector.
   */
  release(chunk: Buffer): void;
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
  const rawIter = countingIterator(raw.chunks, file, counter, raw.totalBytes, options.onProgress);
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
    release(chunk) {
      // Decoded gzip chunks belong to zlib; only a plain file's own read buffers go back to its pool.
      if (!gzip) raw.pool?.release(chunk);
    },
    bytesRead: () => counter.raw,
    bytesDecoded: () => counter.decoded,
    close() {
      // Standard input belongs to the caller; a file is ours to close.
      if (file !== '-') raw.close();
    },
  };
}

interface RawStream {
  chunks: AsyncIterable<Buffer | string>;
  totalBytes: number | undefined;
  /** The read buffers of a regular file, reused once released; none for a stream. */
  pool: BufferPool | null;
  close(): void;
}

function stdinStream(options: SourceOptions): RawStream {
  if (options.stdin === undefined) {
    throw new QuernError('E_USAGE', 'file "-" means standard input, but no input stream was given');
  }
  return { chunks: options.stdin as AsyncIterable<Buffer | string>, totalBytes: undefined, pool: null, close: () => undefined };
}

/**
 * Read buffers of one size, handed out again once released. A fresh buffer per read costs the kernel a
 * page fault per 4 KiB: reusing three buffers took a newline count over 374 MB from 0.94 s to 0.58 s
 * (benchmark file, one run each), and rebin's system time falls with it.
 */
export class BufferPool {
  /** Buffers remembered as lent, and kept free, at most. */
  private static readonly KEEP = 8;
  private readonly free: Buffer[] = [];
  /**
   * The buffers handed out most recently, the only ones taken back (a ring: a buffer a reader never
   * releases drops out of it and is left to the garbage collector; a WeakSet of every buffer made kept
   * them from being collected promptly and tripled the peak memory of readers that release nothing).
   */
  private readonly lent: Array<ArrayBufferLike | null> = new Array<ArrayBufferLike | null>(BufferPool.KEEP).fill(null);
  private next = 0;

  constructor(readonly size: number) {}

  /** A buffer of `size` bytes whose contents are undefined. */
  take(): Buffer {
    const b = this.free.pop() ?? Buffer.allocUnsafeSlow(this.size);
    this.lent[this.next] = b.buffer;
    this.next = (this.next + 1) % BufferPool.KEEP;
    return b;
  }

  /** Takes back the buffer `view` lies in, when this pool lent it lately. */
  release(view: Uint8Array): void {
    const k = this.lent.indexOf(view.buffer);
    if (k < 0 || this.free.length >= BufferPool.KEEP) return;
    this.lent[k] = null;
    this.free.push(Buffer.from(view.buffer, 0, this.size));
  }
}

/**
 * One pool per read size for the whole thread: the ranges of a parallel read, opened one after another,
 * reuse the buffers of those before them. Each reader releases only buffers it was handed.
 */
const pools = new Map<number, BufferPool>();
function poolFor(size: number): BufferPool {
  let p = pools.get(size);
  if (p === undefined) pools.set(size, (p = new BufferPool(size)));
  return p;
}

/** The reads of a pooled file stream not yet handed on: a promise that settles with each, and its buffer. */
type InFlight = Map<Promise<unknown>, Buffer>;

/**
 * The first read of a file is at most this long: a reader that looks at the first rows before it settles
 * on how to read the rest (rebin infers its formats from 2,000 rows, then counts instants in WebAssembly)
 * reads the rest of a first chunk the slow way, and a whole 1 MiB chunk held 28,000 rows of the
 * benchmark's file (rebin on 10M rows: 0.511 s against 0.519 s with a first read of 1 MiB, medians of 11
 * runs interleaved).
 */
export const FIRST_READ = 1 << 17;

/** Chunks of a regular file read into pooled buffers, with the next reads already under way. */
function pooledReads(handle: FileHandle, pool: BufferPool, position: number, state: InFlight): AsyncIterable<Buffer> {
  let size = Math.min(pool.size, FIRST_READ);
  const readAt = (at: number, len: number): Promise<{ buf: Buffer; n: number; len: number }> => {
    const buf = pool.take();
    const p = handle.read(buf, 0, len, at).then((r) => ({ buf, n: r.bytesRead, len }));
    state.set(p.catch(() => undefined), buf);
    return p;
  };
  /** The read whose buffer is `buf` is no longer the stream's to release on close. */
  const settle = (buf: Buffer): void => {
    for (const [k, b] of state) if (b === buf) state.delete(k);
  };
  return {
    async *[Symbol.asyncIterator]() {
      const queue: Array<Promise<{ buf: Buffer; n: number; len: number }>> = [];
      let ahead = position;
      const more = (): void => {
        while (queue.length < AHEAD) {
          queue.push(readAt(ahead, size));
          ahead += size;
          size = pool.size;
        }
      };
      more();
      // Reads still under way are dropped: their buffers go back to the pool once they are done.
      const drop = (): void => {
        for (const q of queue) {
          void q.then((r) => {
            settle(r.buf);
            pool.release(r.buf);
          }, () => undefined);
        }
        queue.length = 0;
      };
      for (;;) {
        const { buf, n, len } = await queue.shift()!;
        settle(buf);
        if (n === 0) {
          pool.release(buf);
          drop();
          return;
        }
        position += n;
        if (n < len) {
          // A short read (the end of the file, or a file that changed): the reads after it start again here.
          drop();
          ahead = position;
        }
        more();
        yield buf.subarray(0, n);
      }
    },
  };
}

/**
 * Reads under way at once. With one, rebin on 10M rows waited for the disk cache now and then (0.52 s
 * against 0.50 s with two, medians of 9 runs interleaved).
 */
const AHEAD = 2;

async function fileStream(file: string, options: SourceOptions): Promise<RawStream> {
  const path = resolve(options.cwd ?? process.cwd(), file);
  let size: number;
  let regular: boolean;
  try {
    const st = await stat(path);
    if (st.isDirectory()) throw new QuernError('E_FILE', `${file}: is a folder, not a file`, 'name a CSV, TSV or NDJSON file');
    size = st.size;
    regular = st.isFile();
  } catch (e) {
    throw fileError(file, e);
  }
  try {
    const handle = await open(path, 'r');
    const chunkSize = options.chunkSize ?? 1 << 20;
    const start = options.position ?? 0;
    if (!regular) {
      // A FIFO or a device: read as a stream, which waits for a writer and never seeks.
      const stream = handle.createReadStream({ highWaterMark: chunkSize, start });
      return { chunks: stream, totalBytes: size, pool: null, close: () => stream.destroy() };
    }
    const pool = poolFor(chunkSize);
    const state: InFlight = new Map();
    let closed = false;
    const close = (): void => {
      if (closed) return;
      closed = true;
      // Reads may still be under way: once they have settled, their buffers (read for nobody) go back
      // to the pool and the handle is closed.
      const pending = [...state];
      void Promise.all(pending.map(([settled]) => settled))
        .then(() => {
          for (const [, buf] of pending) pool.release(buf);
          return handle.close();
        })
        .catch(() => undefined);
    };
    return { chunks: pooledReads(handle, pool, start, state), totalBytes: size, pool, close };
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
  stream: AsyncIterable<Buffer | string>,
  file: string,
  counter: { raw: number },
  total: number | undefined,
  onProgress: SourceOptions['onProgress'],
): AsyncGenerator<Buffer> {
  try {
    for await (const chunk of stream) {
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
  // node:zlib is loaded only for gzip input (loading it cost every run about 3 ms of start-up).
  const { createGunzip } = createRequire(import.meta.url)('node:zlib') as typeof import('node:zlib');
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
