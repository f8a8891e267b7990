// Whole quote-free rows, each followed by its bucket cells, copied by the WebAssembly loop of
// row-gather.wat: bucket's row output moves every input byte once more, and per row of about 40 bytes the
// JavaScript copy through DataViews measured about 48 ns against about 10 ns here (CPU profiles of a
// 10M-row `quern bucket --edges` run).
import { ROW_GATHER_WASM } from './row-gather-wasm.js';
import { wasmApi, type WasmApi } from '../table/structurals.js';

const PAGE = 65_536;
/** Room left past each region for the eight-byte moves that run over their end. */
const SLACK = 16;

interface Memory { buffer: ArrayBuffer; grow(pages: number): number }
type Gather = (n: number, firsts: number, lasts: number, ks: number, table: number, none: number, base: number, out: number) => number;
type Formulas = (n: number, firsts: number, lasts: number, base: number, flags: number) => number;

/** Where a loaded batch lies in the module's memory (see RowGather.load). */
interface Loaded {
  /** Rows loaded: [from, from + n) of the caller's arrays. */
  from: number;
  n: number;
  /** Input offset of the first row's first byte, minus where it was put: memory offset = input offset - base. */
  base: number;
  firsts: number;
  lasts: number;
  ks: number;
  flags: number;
  output: number;
}

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

  private loaded: Loaded | null = null;

  private constructor(
    private readonly memory: Memory,
    private readonly gather: Gather,
    private readonly formulas: Formulas,
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
    const wasm = wasmApi();
    if (wasm === undefined || suffixes.length === 0) return null;
    const module = gatherModule(wasm);
    if (module === null) return null;
    try {
      const instance = new wasm.Instance(module, {});
      return new RowGather(instance.exports['memory'] as Memory, instance.exports['gather'] as Gather, instance.exports['formulas'] as Formulas, suffixes, Math.max(...suffixes.map((s) => s.length)));
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
    if (to - from <= 0) return true;
    return this.load(buf, firsts, lasts, from, to) && this.copyLoaded(ks, from, to, out);
  }

  /**
   * Puts rows from..to-1 (row i being buf[firsts[i], lasts[i]), rows in increasing order) into the module's
   * memory for formulaRows and copyLoaded, which read them until the next load. False when the memory
   * cannot grow to hold them (nothing is loaded).
   */
  load(buf: Uint8Array, firsts: Int32Array, lasts: Int32Array, from: number, to: number): boolean {
    this.loaded = null;
    const n = to - from;
    if (n <= 0) return false;
    const start = firsts[from]!;
    const size = lasts[to - 1]! - start;
    const input = this.tableEnd;
    const fs = (input + size + SLACK + 7) & ~7;
    const ls = fs + 4 * n;
    const kk = ls + 4 * n;
    const flags = kk + 4 * n;
    const output = (flags + n + 7) & ~7;
    if (!this.ensure(output + size + n * this.longest + SLACK)) return false;
    this.u8.set(buf.subarray(start, Math.min(buf.length, start + size + SLACK)), input);
    this.i32.set(firsts.subarray(from, to), fs >> 2);
    this.i32.set(lasts.subarray(from, to), ls >> 2);
    this.loaded = { from, n, base: start - input, firsts: fs, lasts: ls, ks: kk, flags, output };
    return true;
  }

  /**
   * For the loaded rows of quote-free, comma-separated bytes: flags[i - from] = 1 when a field of row i
   * starts with = + - @ or TAB (it may be formula-like; the caller checks those rows in full), else 0.
   * Returns how many rows were flagged.
   */
  formulaRows(flags: Uint8Array): number {
    const l = this.loaded!;
    const count = this.formulas(l.n, l.firsts, l.lasts, l.base, l.flags);
    flags.set(this.u8.subarray(l.flags, l.flags + l.n));
    return count;
  }

  /** copy() of loaded rows from..to-1 (within those loaded). */
  copyLoaded(ks: Int32Array, from: number, to: number, out: GatherTarget): boolean {
    const l = this.loaded!;
    const n = to - from;
    if (n <= 0) return true;
    const at = from - l.from;
    this.i32.set(ks.subarray(from, to), l.ks >> 2);
    const end = this.gather(n, l.firsts + 4 * at, l.lasts + 4 * at, l.ks, 0, this.none, l.base, l.output);
    const bytes = end - l.output;
    out.reserve(bytes);
    out.bytes.set(this.u8.subarray(l.output, end), out.length);
    out.length += bytes;
    return true;
  }
}
