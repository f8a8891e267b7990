// One reading of a date column under one format: every value is parsed once (from its text, or from its bytes
// on the hot path) and counted — parsed, invalid with first examples, value kinds, written offsets, first and
// last values — and handed to the column's distinct-value store.
import type { TimeFormat } from '../time/format.js';
import { isoFastLane, makeTimeBytesParser, type TimeBytesParser } from '../time/bytes-parser.js';
import { fastIsoBytes, newIsoDateMemo, type IsoDateMemo } from '../time/iso-bytes.js';
import { makeTimeParser, type TimeParser } from '../time/parser.js';
import { emptyParsedTime, type ParsedTime } from '../time/types.js';
import type { ByteBatch } from '../table/types.js';
import { ParsedRows } from './parsed-rows.js';
import { DistinctStore } from './store.js';
import { OneText, type TextAt } from './text-at.js';
import type { ValueExample } from './types.js';

/** Invalid examples kept per reading. */
export const MAX_INVALID_EXAMPLES = 5;

/** One reading of the column under one format. */
export class Reading {
  parsed = 0;
  invalid = 0;
  readonly invalidExamples: ValueExample[] = [];
  readonly store = new DistinctStore();
  /** Rows per value kind ('instant', 'local', 'period') and the notation unit of periods. */
  readonly kinds = { instant: 0, local: 0, period: 0 };
  periodUnit: ParsedTime['unit'] = null;
  /** Rows of the current run of one written offset, added to the map when the offset changes. */
  private runOffset = NaN;
  private run = 0;
  private readonly offsetRows = new Map<number, number>();
  min: ValueExample | null = null;
  max: ValueExample | null = null;
  minMs = Infinity;
  maxMs = -Infinity;
  /** Rows of the batch being read whose texts become `min` and `max` at `endBatch` (-1: none pending). */
  private minAt = -1;
  private minLine = 0;
  private maxAt = -1;
  private maxLine = 0;
  private readonly parse: TimeParser;
  private readonly parseBytes: TimeBytesParser;
  /** For ISO formats, the memo of the byte fast lane the hot loop calls first (then `parseBytes`). */
  private readonly lane: IsoDateMemo | null;
  private readonly out = emptyParsedTime();
  private readonly one = new OneText();
  private readonly rows = new ParsedRows();

  constructor(readonly format: TimeFormat) {
    this.parse = makeTimeParser(format);
    this.parseBytes = makeTimeBytesParser(format);
    this.lane = isoFastLane(format) ? newIsoDateMemo() : null;
  }

  /** Reads one value given as text. */
  read(text: string, line: number): void {
    const reason = this.parse(text, this.out);
    if (reason !== null) return this.reject(line, text, reason);
    this.one.value = text;
    this.count(line, this.one, 0, false);
  }

  /**
   * Reads one value given as the UTF-8 bytes buf[start, end): row `i` of `src`, whose text is made only when
   * kept. Call `endBatch(src)` before the batch's rows are gone. Same counts as `read` of the same text.
   */
  readBytes(buf: Buffer, start: number, end: number, line: number, src: TextAt, i: number): void {
    const reason = this.parseBytes(buf, start, end, this.out);
    if (reason !== null) return this.reject(line, src.text(i), reason);
    this.count(line, src, i, true);
  }

  /**
   * Reads rows [from, length) of byte column `c` of `b` — the same counts as `readBytes` of each non-blank
   * value in order — and returns how many were blank (empty or spaces and tabs only). `at` makes row texts.
   */
  readBatch(b: ByteBatch, c: number, from: number, at: TextAt): number {
    const n = b.length;
    const p = this.rows;
    p.reset(n, b.lines, at);
    const starts = b.starts[c]!;
    const ends = b.ends[c]!;
    const decoded = b.decoded[c]!;
    const parse = this.parseBytes;
    const lane = this.lane;
    const out = this.out;
    const { ms: msOf, offset: offsetOf, wall: wallOf, row: rowOf } = p;
    const kinds = this.kinds;
    let blank = 0;
    let k = 0;
    const main = b.buf;
    const side = b.side;
    for (let i = from; i < n; i++) {
      const buf = decoded[i] === 1 ? side : main;
      const s = starts[i]!;
      const e = ends[i]!;
      if (s === e || ((buf[s] === 32 || buf[s] === 9) && isBlankBytes(buf, s, e))) {
        blank++;
        continue;
      }
      // The fast lane first, as the compiled parser itself does (bytes-parser.ts); it falls back the same way.
      if (lane === null || !fastIsoBytes(buf, s, e, out, lane)) {
        const reason = parse(buf, s, e, out);
        if (reason !== null) {
          this.reject(b.lines[i]!, at.text(i), reason);
          continue;
        }
      }
      const ms = out.ms;
      let offset = NaN;
      const kind = out.kind;
      if (kind === 'instant') {
        kinds.instant++;
        offset = out.offset;
        if (offset === this.runOffset) this.run++;
        else this.startRun(offset);
      } else if (kind === 'local') {
        kinds.local++;
      } else {
        kinds.period++;
        if (this.periodUnit === null) this.periodUnit = out.unit;
      }
      msOf[k] = ms;
      offsetOf[k] = offset;
      wallOf[k] = offset !== offset ? ms : ms + offset * 60_000;
      rowOf[k] = i;
      k++;
    }
    p.length = k;
    this.parsed += k;
    this.extremes(p);
    this.store.addRows(p);
    this.endBatch(at);
    return blank;
  }

  /** Notes the rows of the first and last values among `p` (texts made at `endBatch`). */
  private extremes(p: ParsedRows): void {
    const ms = p.ms;
    let minMs = this.minMs;
    let maxMs = this.maxMs;
    for (let j = 0; j < p.length; j++) {
      const v = ms[j]!;
      if (v < minMs) {
        minMs = v;
        this.minAt = p.row[j]!;
      }
      if (v > maxMs) {
        maxMs = v;
        this.maxAt = p.row[j]!;
      }
    }
    this.minMs = minMs;
    this.maxMs = maxMs;
    if (this.minAt >= 0) this.minLine = p.lines[this.minAt]!;
    if (this.maxAt >= 0) this.maxLine = p.lines[this.maxAt]!;
  }

  /** Makes the texts of the first and last values found in the batch read by `readBytes`. */
  endBatch(src: TextAt): void {
    if (this.minAt >= 0) {
      this.min = { line: this.minLine, value: src.text(this.minAt) };
      this.minAt = -1;
    }
    if (this.maxAt >= 0) {
      this.max = { line: this.maxLine, value: src.text(this.maxAt) };
      this.maxAt = -1;
    }
  }

  /** Written offsets (minutes) and their rows. */
  get offsets(): ReadonlyMap<number, number> {
    this.startRun(NaN);
    return this.offsetRows;
  }

  private reject(line: number, text: string, reason: string): void {
    this.invalid++;
    if (this.invalidExamples.length < MAX_INVALID_EXAMPLES) this.invalidExamples.push({ line, value: text, reason });
  }

  /** Counts the value just parsed into `out`; `lazy` defers the texts of new first and last values. */
  private count(line: number, src: TextAt, i: number, lazy: boolean): void {
    const out = this.out;
    this.parsed++;
    const kind = out.kind;
    let offset = NaN;
    if (kind === 'instant') {
      this.kinds.instant++;
      offset = out.offset;
      if (offset === this.runOffset) this.run++;
      else this.startRun(offset);
    } else if (kind === 'local') {
      this.kinds.local++;
    } else {
      this.kinds.period++;
      if (this.periodUnit === null) this.periodUnit = out.unit;
    }
    const ms = out.ms;
    if (ms < this.minMs) {
      this.minMs = ms;
      if (lazy) {
        this.minAt = i;
        this.minLine = line;
      } else {
        this.min = { line, value: src.text(i) };
        this.minAt = -1;
      }
    }
    if (ms > this.maxMs) {
      this.maxMs = ms;
      if (lazy) {
        this.maxAt = i;
        this.maxLine = line;
      } else {
        this.max = { line, value: src.text(i) };
        this.maxAt = -1;
      }
    }
    this.store.add(ms, offset, line, src, i);
  }

  private startRun(offset: number): void {
    if (this.run > 0) this.offsetRows.set(this.runOffset, (this.offsetRows.get(this.runOffset) ?? 0) + this.run);
    this.runOffset = offset;
    this.run = Number.isNaN(offset) ? 0 : 1;
  }
}

/** Spaces and tabs only (UTF-8 bytes of other characters are never 32 or 9). */
export function isBlankBytes(b: Buffer, s: number, e: number): boolean {
  for (let i = s; i < e; i++) {
    const c = b[i]!;
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}
