// The streaming accumulator of one column for the profile: emptiness, distinct values, lengths, numeric
// evidence (under the column's own number format, inferred from its head) and, for date-like columns,
// everything grain detection gathers — all in the same single pass.
import { GrainColumn } from '../grain/column.js';
import { inferNumberFormat } from '../numbers/infer.js';
import { makeNumberParser } from '../numbers/parse.js';
import { DistinctCounter } from './distinct.js';
import { NumericEvidence } from './numeric.js';

/** Non-empty values from the head of the column used to infer its number format. */
export const NUMBER_HEAD = 1_000;

export class ProfileColumn {
  empty = 0;
  values = 0;
  totalLength = 0;
  readonly distinct = new DistinctCounter();
  readonly grain: GrainColumn;
  numeric: NumericEvidence | null = null;
  /** True when numeric evidence stopped after the head (the head was mostly not numbers). */
  numbersStopped = false;
  private timeMode: boolean | null = null;
  private head: string[] | null = [];

  constructor(readonly name: string) {
    this.grain = new GrainColumn(name);
  }

  push(text: string, line: number): void {
    if (isBlank(text)) {
      this.empty++;
      this.grain.push(text, line);
      return;
    }
    this.values++;
    this.totalLength += text.length;
    // A date-like column's distinct values are counted by its grain store (as instants): no second table.
    if (!this.timeDistinct()) this.distinct.add(text);
    this.grain.push(text, line);
    const head = this.head;
    if (head !== null) {
      head.push(text);
      if (head.length >= NUMBER_HEAD) this.startNumbers();
      return;
    }
    if (!this.numbersStopped) this.numeric!.add(text);
  }

  /**
   * True once the head (the first 1,000 values) showed one time format reading at least 95% of it: from then
   * on the grain store counts the distinct values (as instants) and the string table stops. Decided once.
   */
  timeDistinct(): boolean {
    if (this.timeMode === null) {
      if (this.grain.inference === null) return false;
      const r = this.grain.readings.length === 1 ? this.grain.readings[0]! : null;
      this.timeMode = r !== null && r.format.id !== 'iso-year' && r.invalid * 20 <= r.parsed;
    }
    return this.timeMode;
  }

  /** Distinct non-empty values: from the grain store for date-like columns, else from the distinct counter. */
  distinctCount(): { count: number; exact: boolean } {
    if (this.timeMode === true) {
      const r = this.grain.readings[0]!;
      const d = r.store.distinctCount();
      return r.invalid === 0 ? d : { count: d.count + r.invalid, exact: false };
    }
    return { count: this.distinct.count(), exact: this.distinct.exact };
  }

  finish(): void {
    if (this.head !== null) this.startNumbers();
    this.grain.finish();
  }

  private startNumbers(): void {
    const head = this.head!;
    this.head = null;
    const inference = inferNumberFormat(head);
    const numeric = new NumericEvidence(makeNumberParser(inference.format));
    for (const t of head) numeric.add(t);
    // A column whose head is mostly not numbers cannot reach the 95% a quantity needs: stop reading numbers.
    this.numeric = numeric;
    this.numbersStopped = numeric.s.numbers < 0.5 * head.length;
  }
}

function isBlank(s: string): boolean {
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}
