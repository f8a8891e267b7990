// Whole quote-free rows, each followed by its bucket cells, copied by the WebAssembly loop of
// row-gather.wat: bucket's row output moves every input byte once more, and per row of about 40 bytes the
// JavaScript copy through DataViews measured about 48 ns against about 10 ns here (CPU profiles of a
// 10M-row `quern bucket --edges` run).
import { ROW_GATHER_WASM } from './row-gather-wasm.js';

const PAGE = 65_536;
/** Room left past each region for the eight-byte moves that run over their end. */
const SLACK = 16;

/** The little of the WebAssembly JavaScript API used here (ES2022's lib, without the DOM, omits it). */
interface WasmApi {
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: Record<string, unknown> };
}
interface Memory { buffer: ArrayBuffer; grow(pages: number): number }
type Gather = (n: number, firsts: number, lasts: number, ks: number, table: number, none: number, base: number, out: number) => number;

let compiled: object | null | undefined;

function gatherModule(wasm: WasmApi): object | null {
  if (compiled === undefined) {
    try {
      compiled = new wasm.Module(Buffer.from(ROW_GATHER_WASM, 'base64'));
    } catch {
      compiled = null;
    }
  }
  return compiled;
}

/** Where the rows go: room reserved, then bytes appended (CsvByteWriter's shape). */
export interface GatherTarget {
  reserve(n: number): Uint8Array;
  readonly bytes: Uint8Array;
  length: number;
}

/** Copies rows with their suffixes; one per encoder, as the suffixes live in its memory. */
export class RowGather {
  private u8: Uint8Array;
  private i32: Int32Array;
  /** Offset of the first byte after the suffix table and the suffixes. */
  private readonly tableEnd: number;
  private readonly none: number;

  private constructor(
    private readonly memory: Memory,
    private readonly gather: Gather,
    suffixes: readonly Uint8Array[],
    private readonly longest: number,
  ) {
    this.u8 = new Uint8Array(memory.buffer);
    this.i32 = new Int32Array(memory.buffer);
    // The table: (offset, length) of each suffix, then their bytes, each on an 8-byte boundary.
    let at = (8 * suffixes.length + 7) & ~7;
    this.ensure(at + suffixes.reduce((a, s) => a + ((s.length + SLACK + 7) & ~7), 0));
    suffixes.forEach((s, k) => {
      this.i32[2 * k] = at;
      this.i32[2 * k + 1] = s.length;
      this.u8.set(s, at);
      at += (s.length + SLACK + 7) & ~7;
    });
    this.tableEnd = at;
    this.none = suffixes.length - 1;
  }

  /**
   * A gatherer for `suffixes` (the last one is used for a negative bucket index), or null where
   * WebAssembly is missing (the caller copies in JavaScript).
   */
  static make(suffixes: readonly Uint8Array[]): RowGather | null {
    const wasm = (globalThis as { WebAssembly?: WasmApi }).WebAssembly;
    if (wasm === undefined || suffixes.length === 0) return null;
    const module = gatherModule(wasm);
    if (module === null) return null;
    try {
      const instance = new wasm.Instance(module, {});
      return new RowGather(instance.exports['memory'] as Memory, instance.exports['gather'] as Gather, suffixes, Math.max(...suffixes.map((s) => s.length)));
    } catch {
      return null;
    }
  }

  /** Grows the memory to at least `bytes`; false when it cannot. */
  private ensure(bytes: number): boolean {
    const have = this.memory.buffer.byteLength;
    if (bytes <= have) return true;
    try {
      this.memory.grow(Math.ceil((bytes - have) / PAGE));
    } catch {
      return false;
    }
    this.u8 = new Uint8Array(this.memory.buffer);
    this.i32 = new Int32Array(this.memory.buffer);
    return true;
  }

  /**
   * Appends rows from..to-1 to `out`: row i is buf[firsts[i], lasts[i]) and then suffix ks[i]. False
   * (nothing written) when the memory cannot grow to hold them.
   */
  copy(buf: Uint8Array, firsts: Int32Array, lasts: Int32Array, ks: Int32Array, from: number, to: number, out: GatherTarget): boolean {
    const n = to - from;
    if (n <= 0) return true;
    const base = firsts[from]!;
    const size = lasts[to - 1]! - base;
    const input = this.tableEnd;
    const fs = (input + size + SLACK + 7) & ~7;
    const ls = fs + 4 * n;
    const kk = ls + 4 * n;
    const output = (kk + 4 * n + 7) & ~7;
    const most = size + n * this.longest;
    if (!this.ensure(output + most + SLACK)) return false;
    const u8 = this.u8, i32 = this.i32;
    u8.set(buf.subarray(base, Math.min(buf.length, base + size + 8)), input);
    i32.set(firsts.subarray(from, to), fs >> 2);
    i32.set(lasts.subarray(from, to), ls >> 2);
    i32.set(ks.subarray(from, to), kk >> 2);
    const end = this.gather(n, fs, ls, kk, 0, this.none, base - input, output);
    const bytes = end - output;
    out.reserve(bytes);
    out.bytes.set(u8.subarray(output, end), out.length);
    out.length += bytes;
    return true;
  }
}
