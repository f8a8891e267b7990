// The streaming accumulator of one date-like column: a bounded head sample chooses the format; every value is
// then parsed once and counted (parsed, empty, invalid with first examples). When the head sample cannot tell
// two formats apart (03/04/2021), each candidate reads the whole column in parallel and the rest of the file
// decides: the first value only one reading accepts is the evidence.
//
// Values arrive as strings (`push`) or, on the hot path, as a column of a byte batch (`pushBatch`), read from
// the bytes with no string per value; both give the same counts, examples and findings.
import type { TimeFormat } from '../time/format.js';
import type { InferHints, InferResult } from '../time/infer-types.js';
import { inferTimeFormat } from '../time/infer.js';
import type { ByteBatch } from '../table/types.js';
import { isBlankBytes, Reading } from './reading.js';
import { BatchText } from './text-at.js';

export { Reading, MAX_INVALID_EXAMPLES } from './reading.js';

/** Non-empty values read before the format is chosen. */
export const HEAD_SAMPLE = 1_000;

export interface GrainColumnOptions {
  dayFirst?: boolean;
  monthFirst?: boolean;
}

/** Accumulates one column in one pass. `push` each value (or `pushBatch` each batch); `finish` once at the end. */
export class GrainColumn {
  empty = 0;
  /** The inference result on the head sample; null until chosen. */
  inference: InferResult | null = null;
  readings: Reading[] = [];
  /** True once the head sample showed no time format (the column is not date-like). */
  notTime = false;
  private head: Array<{ text: string; line: number }> | null = [];
  private readonly at = new BatchText();

  /**
   * `known`, when given, is what inferTimeFormat gave on this column's head sample in an earlier look at the
   * same input (detect.ts): the head is then not inferred again.
   */
  constructor(readonly name: string, private readonly options: GrainColumnOptions = {}, private readonly known: InferResult | null = null) {}

  /** True once the format is chosen (or the column found not date-like). */
  get decided(): boolean {
    return this.head === null;
  }

  /** False once the column is known not to be date-like: its values need not be pushed any more. */
  get active(): boolean {
    return !this.notTime;
  }

  push(text: string, line: number): void {
    if (this.notTime) return;
    if (isBlank(text)) {
      this.empty++;
      return;
    }
    const head = this.head;
    if (head !== null) {
      head.push({ text, line });
      if (head.length >= HEAD_SAMPLE) this.decide();
      return;
    }
    for (const r of this.readings) r.read(text, line);
  }

  /** Reads byte column `c` of a batch: the same as `push` of each of its values in order. */
  pushBatch(b: ByteBatch, c: number): void {
    if (this.notTime) return;
    const at = this.at;
    at.batch = b;
    at.column = c;
    const starts = b.starts[c]!;
    const ends = b.ends[c]!;
    const decoded = b.decoded[c]!;
    const lines = b.lines;
    const n = b.length;
    let i = 0;
    while (i < n && this.head !== null) {
      const text = at.text(i);
      this.push(text, lines[i]!);
      i++;
    }
    if (this.notTime) return;
    const readings = this.readings;
    if (readings.length === 1) {
      this.empty += readings[0]!.readBatch(b, c, i, at);
      at.batch = null;
      return;
    }
    for (; i < n; i++) {
      const buf = decoded[i] === 1 ? b.side : b.buf;
      const s = starts[i]!;
      const e = ends[i]!;
      if (s === e || ((buf[s] === 32 || buf[s] === 9) && isBlankBytes(buf, s, e))) {
        this.empty++;
        continue;
      }
      for (const r of readings) r.readBytes(buf, s, e, lines[i]!, at, i);
    }
    for (const r of readings) r.endBatch(at);
    at.batch = null;
  }

  /** Ends the column: chooses a format from a short head if the file ended first. */
  finish(): void {
    if (this.head !== null) this.decide();
  }

  private decide(): void {
    const head = this.head!;
    this.head = null;
    const hints: InferHints = { columnName: this.name };
    if (this.options.dayFirst) hints.dayFirst = true;
    if (this.options.monthFirst) hints.monthFirst = true;
    const result = this.known ?? inferTimeFormat(head.map((h) => h.text), hints);
    this.inference = result;
    const formats = formatsToRead(result);
    if (formats.length === 0) {
      this.notTime = true;
      return;
    }
    this.readings = formats.map((f) => new Reading(f));
    for (const h of head) for (const r of this.readings) r.read(h.text, h.line);
  }
}

/** The chosen format, or up to three formats that read the whole head sample when it cannot choose. */
function formatsToRead(result: InferResult): TimeFormat[] {
  if (result.status === 'ok' && result.format !== null) return [result.format];
  if (result.status === 'ambiguous' || result.status === 'conflict') {
    const best = result.candidates[0]?.matched ?? 0;
    return result.candidates.filter((c) => c.matched === best && best > 0).slice(0, 3).map((c) => c.format);
  }
  return [];
}

function isBlank(s: string): boolean {
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}
