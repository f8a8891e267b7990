// Counting a column into buckets: every value is bucketed, below, above, between buckets, empty or
// invalid, with a few examples of each, so the summary adds up to the rows read.
import type { Diagnostic } from '../errors.js';
import type { ParsedNumber } from '../numbers/index.js';
import { ABOVE, BELOW, makeBucketer, type Bucketer } from './bucketer.js';
import type { BucketSet, ClosedSide, MergedEdge } from './types.js';

export interface BucketExample { line: number; value: string }
export interface Outcome { count: number; examples: BucketExample[] }

export interface BucketCount {
  index: number; label: string; name?: string; weight?: number;
  low: number | null; high: number | null; lowClosed: boolean; highClosed: boolean;
  count: number;
  /** count / bucketed values (0 when none). */
  share: number;
}

/** The summary of one `bucket` run (what `--json` prints). */
export interface BucketSummary {
  file: string;
  value: string;
  source: string;
  discrete: boolean;
  closed: ClosedSide;
  /** Data rows read, header excluded: bucketed + below + above + between + empty + invalid + rejected. */
  rowsRead: number;
  /** Rows the table reader rejected (ragged rows…), by reason. */
  rowsRejected: number;
  rejectedByReason: Record<string, number>;
  /** The first few rejected rows, with line and reason (the table reader's examples). */
  rejectedExamples: Diagnostic[];
  bucketed: number;
  buckets: BucketCount[];
  below: Outcome;
  above: Outcome;
  /** Values in a hole between the ranges of a spec. */
  between: Outcome;
  empty: Outcome & { byReason: Record<string, number> };
  invalid: Outcome & { byReason: Record<string, number> };
  /** Values with a fraction put in whole-number buckets (completed units: 4.5 is in 0-4). */
  nonInteger: Outcome;
  /** Values written with a percent sign, bucketed as the number before it (12% as 12). */
  percent: Outcome;
  merged: MergedEdge[];
  notes: string[];
}

const outcome = (): Outcome => ({ count: 0, examples: [] });

/** A tally as plain data: what a range task hands back (lines relative to its range). */
export interface TallyPartial {
  counts: number[];
  below: Outcome; above: Outcome; between: Outcome;
  empty: Outcome & { byReason: Record<string, number> };
  invalid: Outcome & { byReason: Record<string, number> };
  nonInteger: Outcome; percent: Outcome;
}

/** tryCount's answer when the value needs `record` (outside the buckets, or a note to take). */
export const NOT_COUNTED = -9;
/** How many whole numbers from 0 up smallWholes answers for. */
export const SMALL_WHOLE = 10_000;

/** Accumulates counts for one bucket set; `record` returns the bucket index or a negative outcome. */
export class BucketTally {
  private readonly bucketer: Bucketer;
  private readonly counts: Float64Array;
  readonly below = outcome();
  readonly above = outcome();
  readonly between = outcome();
  readonly empty = { ...outcome(), byReason: {} as Record<string, number> };
  readonly invalid = { ...outcome(), byReason: {} as Record<string, number> };
  readonly nonInteger = outcome();
  readonly percent = outcome();

  constructor(readonly set: BucketSet, private readonly maxExamples = 5) {
    this.bucketer = makeBucketer(set.buckets);
    this.counts = new Float64Array(set.buckets.length);
  }

  private note(o: Outcome, line: number, value: string): void {
    o.count++;
    if (o.examples.length < this.maxExamples) o.examples.push({ line, value: value.length > 80 ? `${value.slice(0, 79)}…` : value });
  }

  /**
   * The bucket tryCount gives each whole number 0..SMALL_WHOLE-1, NOT_COUNTED where it counts none: a hot
   * loop looks a small whole number up here instead of searching the edges, then counts it by addCounts.
   */
  smallWholes(): Int32Array {
    const t = new Int32Array(SMALL_WHOLE);
    for (let v = 0; v < SMALL_WHOLE; v++) {
      const k = this.bucketer.assign(v);
      t[v] = k >= 0 ? k : NOT_COUNTED;
    }
    return t;
  }

  /** Adds counts per bucket index that a caller made from smallWholes. */
  addCounts(counts: Float64Array): void {
    for (let k = 0; k < counts.length; k++) this.counts[k]! += counts[k]!;
  }

  /**
   * The hot path for a parsed number without a percent sign: counts it and returns its bucket when it
   * lands in one and needs no note; otherwise returns NOT_COUNTED and the caller calls `record`.
   */
  tryCount(x: number): number {
    const k = this.bucketer.assign(x);
    if (k >= 0 && (!this.set.discrete || Number.isInteger(x))) {
      this.counts[k]!++;
      return k;
    }
    return NOT_COUNTED;
  }

  /** Records one parsed value of the row starting on `line`. */
  record(line: number, text: string, parsed: ParsedNumber): number {
    if (parsed.status === 'empty') {
      this.note(this.empty, line, text);
      this.empty.byReason[parsed.reason!] = (this.empty.byReason[parsed.reason!] ?? 0) + 1;
      return -4;
    }
    if (parsed.status === 'invalid') {
      this.note(this.invalid, line, text);
      this.invalid.byReason[parsed.reason!] = (this.invalid.byReason[parsed.reason!] ?? 0) + 1;
      return -5;
    }
    if (parsed.percent) this.note(this.percent, line, text);
    const k = this.bucketer.assign(parsed.value);
    if (k >= 0) {
      this.counts[k]!++;
      if (this.set.discrete && !Number.isInteger(parsed.value)) this.note(this.nonInteger, line, text);
    } else this.note(k === BELOW ? this.below : k === ABOVE ? this.above : this.between, line, text);
    return k;
  }

  /** The counts as plain data (structured-clonable), for a range read on another thread. */
  partial(): TallyPartial {
    const { below, above, between, empty, invalid, nonInteger, percent } = this;
    return { counts: Array.from(this.counts), below, above, between, empty, invalid, nonInteger, percent };
  }

  /** Adds the partial of the next range in file order; its lines are shifted by `base` (lines before the range). */
  absorb(p: TallyPartial, base: number): void {
    p.counts.forEach((c, k) => { this.counts[k]! += c; });
    const add = (into: Outcome, from: Outcome): void => {
      into.count += from.count;
      for (const ex of from.examples) if (into.examples.length < this.maxExamples) into.examples.push({ line: ex.line + base, value: ex.value });
    };
    const reasons = (into: Record<string, number>, from: Record<string, number>): void => {
      for (const [r, n] of Object.entries(from)) into[r] = (into[r] ?? 0) + n;
    };
    add(this.below, p.below); add(this.above, p.above); add(this.between, p.between);
    add(this.empty, p.empty); reasons(this.empty.byReason, p.empty.byReason);
    add(this.invalid, p.invalid); reasons(this.invalid.byReason, p.invalid.byReason);
    add(this.nonInteger, p.nonInteger); add(this.percent, p.percent);
  }

  /** The summary, given the table reader's row accounting. */
  summary(file: string, value: string, rowsRead: number, rejectedByReason: Record<string, number>, rejectedExamples: readonly Diagnostic[] = []): BucketSummary {
    const bucketed = this.counts.reduce((a, b) => a + b, 0);
    const rowsRejected = Object.values(rejectedByReason).reduce((a, b) => a + b, 0);
    const buckets = this.set.buckets.map((b, i): BucketCount => ({
      index: b.index, label: b.label, ...(b.name !== undefined ? { name: b.name } : {}), ...(b.weight !== undefined ? { weight: b.weight } : {}),
      low: b.range.low, high: b.range.high, lowClosed: b.range.lowClosed, highClosed: b.range.highClosed,
      count: this.counts[i]!, share: bucketed === 0 ? 0 : this.counts[i]! / bucketed,
    }));
    const { discrete, closed, source, merged } = this.set;
    const notes = [...this.set.notes];
    const p = this.percent;
    if (p.count > 0) {
      const first = p.examples[0]!;
      notes.push(`${p.count} value${p.count === 1 ? '' : 's'} carried a percent sign and ${p.count === 1 ? 'was' : 'were'} bucketed as the number before it (first: ${JSON.stringify(first.value)} on line ${first.line})`);
    }
    return {
      file, value, source, discrete, closed, rowsRead, rowsRejected, rejectedByReason, rejectedExamples: [...rejectedExamples], bucketed, buckets,
      below: this.below, above: this.above, between: this.between, empty: this.empty, invalid: this.invalid,
      nonInteger: this.nonInteger, percent: this.percent, merged, notes,
    };
  }
}
