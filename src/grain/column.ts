// The streaming accumulator of one date-like column: a bounded head sample chooses the format; every value is
// then parsed once and counted (parsed, empty, invalid with first examples). When the head sample cannot tell
// two formats apart (03/04/2021), each candidate reads the whole column in parallel and the rest of the file
// decides: the first value only one reading accepts is the evidence.
import type { TimeFormat } from '../time/format.js';
import type { InferHints, InferResult } from '../time/infer-types.js';
import { makeTimeParser, type TimeParser } from '../time/parser.js';
import { emptyParsedTime, type ParsedTime } from '../time/types.js';
import { inferTimeFormat } from '../time/infer.js';
import { DistinctStore } from './store.js';
import type { ValueExample } from './types.js';

/** Non-empty values read before the format is chosen. */
export const HEAD_SAMPLE = 1_000;
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
  private readonly parse: TimeParser;
  private readonly out = emptyParsedTime();

  constructor(readonly format: TimeFormat) {
    this.parse = makeTimeParser(format);
  }

  read(text: string, line: number): void {
    const out = this.out;
    const reason = this.parse(text, out);
    if (reason !== null) {
      this.invalid++;
      if (this.invalidExamples.length < MAX_INVALID_EXAMPLES) this.invalidExamples.push({ line, value: text, reason });
      return;
    }
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
      this.min = { line, value: text };
    }
    if (ms > this.maxMs) {
      this.maxMs = ms;
      this.max = { line, value: text };
    }
    this.store.add(ms, offset, line, text);
  }

  /** Written offsets (minutes) and their rows. */
  get offsets(): ReadonlyMap<number, number> {
    this.startRun(NaN);
    return this.offsetRows;
  }

  private startRun(offset: number): void {
    if (this.run > 0) this.offsetRows.set(this.runOffset, (this.offsetRows.get(this.runOffset) ?? 0) + this.run);
    this.runOffset = offset;
    this.run = Number.isNaN(offset) ? 0 : 1;
  }
}

export interface GrainColumnOptions {
  dayFirst?: boolean;
  monthFirst?: boolean;
}

/** Accumulates one column in one pass. `push` each value; `finish` once at the end. */
export class GrainColumn {
  empty = 0;
  /** The inference result on the head sample; null until chosen. */
  inference: InferResult | null = null;
  readings: Reading[] = [];
  /** True once the head sample showed no time format (the column is not date-like). */
  notTime = false;
  private head: Array<{ text: string; line: number }> | null = [];

  constructor(readonly name: string, private readonly options: GrainColumnOptions = {}) {}

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
    const result = inferTimeFormat(head.map((h) => h.text), hints);
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
