// Reading the measure columns of aggregates: numbers through the column's number format, texts for
// distinct counts; every empty and invalid value counted by reason.
import type { Diagnostic } from '../errors.js';
import { shortValue } from '../errors.js';
import { emptyParsedNumber, makeNumberParser } from '../numbers/index.js';
import type { NumberFormat, NumberParser, ParsedNumber } from '../numbers/index.js';
import type { CellStore, MeasureNeeds } from './accumulate.js';
import type { AggSpec } from './aggregates.js';
import { needsBuffer, needsNumber } from './aggregates.js';
import type { MeasureSummary } from './types.js';

/** One measure column as the hot path reads it. */
export interface MeasureReader {
  column: string;
  /** Position of the column among the requested batch columns. */
  slot: number;
  needs: MeasureNeeds;
  parser: NumberParser | null;
  out: ParsedNumber;
  summary: MeasureSummary;
}

/** The needs of each measure column, from the aggregates that read it. */
export function measureNeeds(columns: readonly string[], aggs: readonly AggSpec[]): MeasureNeeds[] {
  return columns.map((col) => {
    const on = aggs.filter((a) => a.column === col);
    return {
      numbers: on.some((a) => needsNumber(a.kind)),
      buffer: on.some((a) => needsBuffer(a.kind)),
      distinct: on.some((a) => a.kind === 'distinct'),
    };
  });
}

/**
 * Measure readers for `columns` (at batch positions `slots`), reading numbers in `formats` (one per column:
 * the format inferred from the column's first rows; null for a column read as text only).
 */
export function makeMeasureReaders(columns: readonly string[], needs: readonly MeasureNeeds[], slots: readonly number[],
  formats: readonly (NumberFormat | null)[]): MeasureReader[] {
  return columns.map((column, i) => {
    const f = formats[i] ?? null;
    const parser = needs[i]!.numbers && f !== null ? makeNumberParser(f) : null;
    return {
      column, slot: slots[i]!, needs: needs[i]!, parser, out: emptyParsedNumber(),
      summary: { column, valid: 0, empty: 0, rejected: 0, rejectedByReason: {} },
    };
  });
}

/** What reading one measure value found. */
export const enum ValueRead {
  /** Empty or rejected: the value joins no aggregate. */
  None = 0,
  /** A number, now in `m.out.value`. */
  Number = 1,
  /** Non-empty text for a column read only as text (distinct, count:COL). */
  Text = 2,
}

/**
 * Reads the value `text` of measure `m` once per row, counting it as valid, empty or rejected (the
 * first rejected values go to `examples`).
 */
export function readMeasure(m: MeasureReader, text: string, file: string, line: number, examples: Diagnostic[], maxExamples: number): ValueRead {
  if (isBlank(text)) {
    m.summary.empty++;
    return ValueRead.None;
  }
  if (m.parser === null) {
    m.summary.valid++;
    return ValueRead.Text;
  }
  const status = m.parser.parse(text, m.out);
  if (status === 'ok') {
    m.summary.valid++;
    return ValueRead.Number;
  }
  if (status === 'empty') {
    m.summary.empty++;
    return ValueRead.None;
  }
  const reason = m.out.reason ?? 'malformed';
  m.summary.rejected++;
  m.summary.rejectedByReason[reason] = (m.summary.rejectedByReason[reason] ?? 0) + 1;
  if (examples.length < maxExamples) {
    examples.push({ code: reason, file, line, column: m.column, value: shortValue(text), message: `${m.column} is not a number (${reason}); left out of its aggregates` });
  }
  return ValueRead.None;
}

/** Adds a value read by readMeasure to cell `c` of measure `mi` with weight `w` (1, or a day share). */
export function addMeasure(store: CellStore, mi: number, m: MeasureReader, read: ValueRead, c: number, text: string, w: number): void {
  if (read === ValueRead.None) return;
  store.measures[mi]!.present[c] += w;
  if (read === ValueRead.Number) store.addNumber(c, mi, m.out.value, w);
  if (m.needs.distinct) store.addDistinct(c, mi, text);
}

/** True for '' and text of only spaces and tabs. */
export function isBlank(text: string): boolean {
  const n = text.length;
  if (n === 0) return true;
  const c = text.charCodeAt(0);
  if (c !== 32 && c !== 9) return false;
  for (let i = 1; i < n; i++) {
    const d = text.charCodeAt(i);
    if (d !== 32 && d !== 9) return false;
  }
  return true;
}
