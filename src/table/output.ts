// Output targets that lose nothing and leave no half-written file: a file is written to a temporary
// file in the same folder and renamed over the target only on commit(); standard output ends quietly
// when the reader goes away (EPIPE).
import { unlinkSync } from 'node:fs';
import { chmod, open, rename, stat, unlink, type FileHandle } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import { QuernError } from '../errors.js';

/** Where a command writes its result. */
export interface OutputTarget {
  /** The target as the user named it ('-' for standard output). */
  readonly path: string;
  /** True once the reader of standard output has gone away; later writes are dropped. */
  readonly closed: boolean;
  /** Queues text; resolves when it may continue (after a flush when the buffer is full). */
  write(text: string): Promise<void>;
  /**
   * Writes bytes after the text queued so far (whole UTF-8 characters; large outputs such as bucket's rows,
   * which skip the round trip through a string); `chunk` may be reused once the promise resolves.
   */
  writeBytes(chunk: Uint8Array): Promise<void>;
  /** Flushes and, for a file, moves the temporary file over the target. */
  commit(): Promise<void>;
  /** Discards everything written; an existing target file is left as it was. Safe to call twice. */
  abort(): Promise<void>;
}

/** The parts of a stream openOutput uses: CliIO's stdout, or a Node Writable. */
export interface StdoutLike {
  write(chunk: string | Uint8Array, cb?: (err?: Error | null) => void): unknown;
  once?(event: 'drain' | 'close' | 'error', listener: (...args: never[]) => void): unknown;
  removeListener?(event: 'drain' | 'close' | 'error', listener: (...args: never[]) => void): unknown;
  on?(event: 'error', listener: (err: NodeJS.ErrnoException) => void): unknown;
  /** Bytes queued and not yet written (a Node Writable's). */
  readonly writableLength?: number;
}

export interface OutputOptions {
  /** Required when path is '-'. */
  stdout?: StdoutLike;
  /** Folder against which a relative path is resolved; default the process's working folder. */
  cwd?: string;
}

const FLUSH_AT = 1 << 16;
// Temporary files of outputs not yet committed or aborted, so an interrupted run can remove them.
const uncommitted = new Map<OutputTarget, string>();

/** Aborts every file output not yet committed; for a signal handler (Ctrl-C) in the CLI's entry file. */
export async function abortOpenOutputs(): Promise<void> {
  await Promise.all([...uncommitted.keys()].map((o) => o.abort()));
}

/** Deletes the temporary files of uncommitted outputs at once; for a process 'exit' handler. */
export function abortOpenOutputsSync(): void {
  for (const temp of uncommitted.values()) {
    try {
      unlinkSync(temp);
    } catch {
      // already gone
    }
  }
  uncommitted.clear();
}

/** Opens '-' (standard output) or a file for atomic writing; throws QuernError('E_OUTPUT') when it cannot. */
export async function openOutput(path: string, options: OutputOptions = {}): Promise<OutputTarget> {
  if (path === '-') {
    if (options.stdout === undefined) throw new QuernError('E_USAGE', 'output "-" means standard output, but no output stream was given');
    return stdoutTarget(options.stdout);
  }
  return fileTarget(path, resolve(options.cwd ?? process.cwd(), path));
}

function isPipeClosed(e: unknown): boolean {
  const code = (e as NodeJS.ErrnoException | null)?.code;
  return code === 'EPIPE' || code === 'ERR_STREAM_DESTROYED' || code === 'ERR_STREAM_WRITE_AFTER_END';
}

/** Resolves on 'drain', or when the stream closes or fails (a dead pipe never drains). */
function drained(out: StdoutLike): Promise<void> {
  const { once, removeListener } = out;
  if (once === undefined) return Promise.resolve();
  return new Promise<void>((res) => {
    const done = (): void => {
      for (const ev of ['drain', 'close', 'error'] as const) removeListener?.call(out, ev, done);
      res();
    };
    for (const ev of ['drain', 'close', 'error'] as const) once.call(out, ev, done);
  });
}

function stdoutTarget(out: StdoutLike): OutputTarget {
  let closed = false;
  let pending = '';
  out.on?.('error', (e) => {
    if (isPipeClosed(e)) closed = true;
  });
  async function flush(): Promise<void> {
    if (closed || pending === '') return;
    const text = pending;
    pending = '';
    await send(text);
  }
  async function send(chunk: string | Uint8Array): Promise<void> {
    try {
      let written = (): void => undefined;
      const done = new Promise<void>((res) => { written = res; });
      const ok = out.write(chunk, (e) => {
        if (e && isPipeClosed(e)) closed = true;
        written();
      });
      if (ok === false) await drained(out);
      // Bytes the stream still holds (a pipe not yet drained) must be written before their buffer is reused.
      else if (typeof chunk !== 'string' && (out.writableLength ?? 0) > 0) await done;
    } catch (e) {
      if (!isPipeClosed(e)) throw new QuernError('E_OUTPUT', `standard output: ${(e as Error).message}`);
      closed = true;
    }
  }
  return {
    path: '-',
    get closed() {
      return closed;
    },
    async write(text) {
      if (closed) return;
      pending += text;
      if (pending.length >= FLUSH_AT) await flush();
    },
    async writeBytes(chunk) {
      if (closed) return;
      await flush();
      if (!closed && chunk.byteLength > 0) await send(chunk);
    },
    commit: flush,
    async abort() {
      pending = '';
    },
  };
}

/**
 * Text queued for a file handle and written in blocks of FLUSH_AT characters; a failed write calls
 * `fail` (which aborts the target) and throws one E_OUTPUT line.
 */
function textQueue(shown: string, handle: FileHandle, fail: () => Promise<void>): { add(text: string): Promise<void>; bytes(chunk: Uint8Array): Promise<void>; flush(): Promise<void>; drop(): void } {
  let pending = '';
  const flush = async (): Promise<void> => {
    if (pending === '') return;
    const text = pending;
    pending = '';
    try {
      await handle.write(text);
    } catch (e) {
      await fail();
      throw outputError(shown, e);
    }
  };
  return {
    async add(text) {
      pending += text;
      if (pending.length >= FLUSH_AT) await flush();
    },
    async bytes(chunk) {
      await flush();
      try {
        for (let at = 0; at < chunk.byteLength;) at += (await handle.write(chunk, at, chunk.byteLength - at)).bytesWritten;
      } catch (e) {
        await fail();
        throw outputError(shown, e);
      }
    },
    flush,
    drop: () => {
      pending = '';
    },
  };
}

/** A target that is not a regular file: written directly, as it cannot be replaced atomically. */
async function deviceTarget(shown: string, target: string): Promise<OutputTarget> {
  let handle: FileHandle;
  try {
    handle = await open(target, 'w');
  } catch (e) {
    throw outputError(shown, e);
  }
  let isOpen = true;
  const queue = textQueue(shown, handle, () => out.abort());
  const out: OutputTarget = {
    path: shown,
    closed: false,
    async write(text) {
      if (!isOpen) throw new QuernError('E_INTERNAL', `${shown}: written after it was closed`);
      await queue.add(text);
    },
    async writeBytes(chunk) {
      if (!isOpen) throw new QuernError('E_INTERNAL', `${shown}: written after it was closed`);
      await queue.bytes(chunk);
    },
    async commit() {
      if (!isOpen) return;
      await queue.flush();
      isOpen = false;
      await handle.close().catch((e: unknown) => {
        throw outputError(shown, e);
      });
    },
    async abort() {
      if (!isOpen) return;
      isOpen = false;
      queue.drop();
      await handle.close().catch(() => undefined);
    },
  };
  return out;
}

function outputError(path: string, e: unknown): QuernError {
  if (e instanceof QuernError) return e;
  const code = (e as NodeJS.ErrnoException).code;
  const reason =
    code === 'ENOENT' ? 'its folder does not exist'
    : code === 'EACCES' || code === 'EPERM' ? 'permission denied'
    : code === 'EISDIR' ? 'is a folder'
    : code === 'ENOSPC' ? 'the disk is full'
    : `cannot be written (${code ?? (e as Error).message})`;
  return new QuernError('E_OUTPUT', `${path}: ${reason}`);
}

async function fileTarget(shown: string, target: string): Promise<OutputTarget> {
  let mode: number | undefined;
  try {
    const st = await stat(target);
    if (st.isDirectory()) throw new QuernError('E_OUTPUT', `${shown}: is a folder, not a file`);
    // A device, pipe or socket (/dev/null, a named pipe) is written in place: renaming a file over it
    // would replace the device.
    if (!st.isFile()) return deviceTarget(shown, target);
    mode = st.mode & 0o7777;
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== 'ENOENT') throw outputError(shown, e);
  }
  const temp = join(dirname(target), `.${basename(target)}.${tempSuffix()}.quern-tmp`);
  let handle: FileHandle;
  try {
    handle = await open(temp, 'wx', 0o666);
    if (mode !== undefined) await chmod(temp, mode);
  } catch (e) {
    throw outputError(shown, e);
  }
  let state: 'open' | 'committed' | 'aborted' = 'open';
  const queue = textQueue(shown, handle, () => target_.abort());
  const target_: OutputTarget = {
    path: shown,
    closed: false,
    async write(text) {
      if (state !== 'open') throw new QuernError('E_INTERNAL', `${shown}: written after ${state === 'committed' ? 'commit' : 'abort'}`);
      await queue.add(text);
    },
    async writeBytes(chunk) {
      if (state !== 'open') throw new QuernError('E_INTERNAL', `${shown}: written after ${state === 'committed' ? 'commit' : 'abort'}`);
      await queue.bytes(chunk);
    },
    async commit() {
      if (state !== 'open') return;
      await queue.flush();
      try {
        await handle.sync();
        await handle.close();
        await rename(temp, target);
      } catch (e) {
        await target_.abort();
        throw outputError(shown, e);
      }
      state = 'committed';
      uncommitted.delete(target_);
    },
    async abort() {
      if (state !== 'open') return;
      state = 'aborted';
      uncommitted.delete(target_);
      queue.drop();
      await handle.close().catch(() => undefined);
      await unlink(temp).catch(() => undefined);
    },
  };
  uncommitted.set(target_, temp);
  return target_;
}

let temps = 0;
/**
 * A name part no other write is using: this process's id, the time, a count and a random part (opened
 * with 'wx', so a clash fails rather than overwrites). Not from node:crypto, whose loading cost every run
 * about 7 ms of start-up.
 */
function tempSuffix(): string {
  return `${process.pid.toString(36)}-${Date.now().toString(36)}-${(temps++).toString(36)}-${Math.floor(Math.random() * 2 ** 32).toString(36)}`;
}
