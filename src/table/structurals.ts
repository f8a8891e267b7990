// The records of quote-free delimited text, found by the WebAssembly SIMD kernel of structurals.wat:
// its delimiters and line breaks sixteen bytes per step, walked into record ends, field counts and the
// bounds of the wanted fields. fast-body.ts hands it the quote-free stretches the JavaScript word loop
// read before (that loop stays where no kernel runs, and for files whose wanted fields it cannot hold).
import { STRUCTURALS_WASM } from './structurals-wasm.js';

/** Bytes handed to the kernel per call. */
export const RECORD_SPAN = 1 << 16;
/** Most wanted fields per record, and the highest field number one may have plus one. */
export const MAX_WANTED = 8;
export const MAX_WANTED_FIELD = 32;
/** Where STATE and OUTPUT begin in the kernel's memory (see structurals.wat). */
const STATE = 65_600;
const OUTPUT = 65_728;

/** Why the last `records` call stopped (STATE's status). */
export const enum KernelStop {
  /** At the end of its input. */
  Spent = 0,
  /** At a CR that is the buffer's last byte. */
  LoneCrAtEnd = 1,
  /** After the first record ending at or past `stop`. */
  Stop = 2,
}

/** One thread's kernel (see structurals.wat for the layout of its memory). */
export interface RecordKernel {
  /** The input area: RECORD_SPAN bytes, then the byte after them. */
  readonly input: Uint8Array;
  /** STATE as i32: record start, field start, field number, LF to skip, wanted slot, status. */
  readonly state: Int32Array;
  /** OUTPUT as i32: per record `stride` values (end, fields, then start and end per wanted field). */
  readonly output: Int32Array;
  /** Walks input[0, length) (byte i being `base` + i of the caller's buffer); returns records written. */
  records(length: number, base: number, want: number, stride: number, stop: number, ahead: 0 | 1, delimiter: number): number;
}

let shared: RecordKernel | null | undefined;

/** The little of the WebAssembly JavaScript API used here (ES2022's lib, without the DOM, omits it). */
interface WasmApi {
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: Record<string, unknown> };
}

/**
 * The kernel of this thread, made on first use; null where WebAssembly or its SIMD instructions are
 * missing (the caller then scans in JavaScript). Every use runs to its end without yielding, so one
 * instance serves every reader of a thread.
 */
export function recordKernel(): RecordKernel | null {
  if (shared !== undefined) return shared;
  const wasm = (globalThis as { WebAssembly?: WasmApi }).WebAssembly;
  if (wasm === undefined) return (shared = null);
  try {
    const module = new wasm.Module(Buffer.from(STRUCTURALS_WASM, 'base64'));
    const instance = new wasm.Instance(module, {});
    const memory = (instance.exports['memory'] as { buffer: ArrayBuffer }).buffer;
    const records = instance.exports['records'] as RecordKernel['records'];
    shared = {
      input: new Uint8Array(memory, 0, RECORD_SPAN + 1),
      state: new Int32Array(memory, STATE, 8),
      output: new Int32Array(memory, OUTPUT, (memory.byteLength - OUTPUT) >> 2),
      records,
    };
  } catch {
    shared = null;
  }
  return shared;
}

/** The bit mask of wanted fields the kernel takes, or null when a field number is too high or too many are wanted. */
export function wantedMask(fields: readonly number[]): number | null {
  if (fields.length > MAX_WANTED) return null;
  let mask = 0;
  for (const f of fields) {
    if (f >= MAX_WANTED_FIELD) return null;
    mask |= 1 << f;
  }
  return mask;
}
