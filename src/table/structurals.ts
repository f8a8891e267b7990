// The records of delimited text, found by the WebAssembly SIMD kernel of structurals.wat: its delimiters,
// quotes and line breaks sixteen bytes per step, walked into record ends, field counts and the bounds of
// the wanted fields. One walk reads quote-free text; the other also reads quoted fields without quotes or
// line breaks inside, and stops at a record with anything else, which fast-body.ts hands to the
// JavaScript scanner. (The JavaScript word loop stays where no kernel runs, and for files whose wanted
// fields it cannot hold.)
import { STRUCTURALS_WASM } from './structurals-wasm.js';

/** Bytes handed to the kernel per call. */
export const RECORD_SPAN = 1 << 16;
/** Most wanted fields per record, and the highest field number one may have plus one. */
export const MAX_WANTED = 8;
export const MAX_WANTED_FIELD = 32;
/** Where STATE and OUTPUT begin in the kernel's memory (see structurals.wat), and where OUTPUT ends: the
 *  pages after it are TALLY's (src/rebin/instant-tally.wat). */
const STATE = 65_600;
const OUTPUT = 65_728;
const OUTPUT_END = 80 * 65_536;

/** Why the last `records` call stopped (STATE's status). */
export const enum KernelStop {
  /** At the end of its input. */
  Spent = 0,
  /** At a CR, or a quote inside quotes, that is the buffer's last byte (what follows decides what it is). */
  UndecidedAtEnd = 1,
  /** After the first record ending at or past `stop`. */
  Stop = 2,
  /** At the start of a record with a quote or a quoted line break that the kernel leaves to the scanner. */
  Quote = 3,
}

/** One thread's kernel (see structurals.wat for the layout of its memory). */
export interface RecordKernel {
  /** The input area: RECORD_SPAN bytes, then the byte after them. */
  readonly input: Uint8Array;
  /** STATE as i32: record start, field start, field number, LF to skip, wanted slot, status, quote state. */
  readonly state: Int32Array;
  /** OUTPUT as i32: per record `stride` values (end, fields, then start and end per wanted field). */
  readonly output: Int32Array;
  /** The kernel's memory, for modules that read its input and output in place (src/rebin/instant-tally.wat). */
  readonly memory: object;
  /** Walks quote-free input[0, length) (byte i being `base` + i of the caller's buffer); returns records written. */
  records(length: number, base: number, want: number, stride: number, stop: number, ahead: 0 | 1, delimiter: number): number;
  /** The same walk over input that may hold quotes: reads simple quoted fields, stops at other quotes (KernelStop.Quote). */
  quotedRecords(length: number, base: number, want: number, stride: number, stop: number, ahead: 0 | 1, delimiter: number): number;
  /** The first of OUTPUT's records from..n-1 whose field count is not `width`, or n. */
  firstOther(from: number, n: number, stride: number, width: number): number;
}

let shared: RecordKernel | null | undefined;

/** The little of the WebAssembly JavaScript API quern uses (ES2022's lib, without the DOM, omits it). */
export interface WasmApi {
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: Record<string, unknown> };
}

/** The runtime's WebAssembly, or undefined where there is none. */
export function wasmApi(): WasmApi | undefined {
  return (globalThis as { WebAssembly?: WasmApi }).WebAssembly;
}

/**
 * The kernel of this thread, made on first use; null where WebAssembly or its SIMD instructions are
 * missing (the caller then scans in JavaScript). Every use runs to its end without yielding, so one
 * instance serves every reader of a thread.
 */
export function recordKernel(): RecordKernel | null {
  if (shared !== undefined) return shared;
  const wasm = wasmApi();
  if (wasm === undefined) return (shared = null);
  try {
    const module = new wasm.Module(Buffer.from(STRUCTURALS_WASM, 'base64'));
    const instance = new wasm.Instance(module, {});
    const memoryObject = instance.exports['memory'] as { buffer: ArrayBuffer };
    const memory = memoryObject.buffer;
    const records = instance.exports['records'] as RecordKernel['records'];
    const quotedRecords = instance.exports['quotedRecords'] as RecordKernel['quotedRecords'];
    const firstOther = instance.exports['firstOther'] as RecordKernel['firstOther'];
    shared = {
      input: new Uint8Array(memory, 0, RECORD_SPAN + 1),
      state: new Int32Array(memory, STATE, 8),
      output: new Int32Array(memory, OUTPUT, (OUTPUT_END - OUTPUT) >> 2),
      memory: memoryObject,
      records,
      quotedRecords,
      firstOther,
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

/**
 * A consumer that counts some of the kernel's records itself, before they would become batches (rebin's
 * instant tally). Set as `tally` in a byte read's options; a reader asks it afresh at every buffer.
 */
export interface KernelTally {
  /** False once it takes no more records: the reader then hands them all on as batches. */
  readonly active: boolean;
  /**
   * Counts what it can of OUTPUT's records from..n-1, on the consecutive lines from `line`, whose wanted
   * field `slot` is the field it reads (input byte i being byte `base` + i of `buf`); returns the first
   * record it did not count, or n. The records are whole rows of the header's width, or, when `width` is
   * given, records it counts only when they have `width` fields (it stops at the first that has not). The
   * reader hands the record it stopped at on (as a batch row, or as a row of another width) and calls
   * again from the next.
   */
  take(kernel: RecordKernel, buf: Buffer, from: number, n: number, stride: number, slot: number, base: number, line: number, width?: number): number;
}
