// Gaps longer than a duration between instants without a regular grain, in memory that grows with the
// series' span divided by the duration, not with its rows: instants are bucketed by floor(t / gap) and
// each bucket keeps only its earliest and latest instant. Two instants in one bucket are less than `gap`
// apart, so every longer gap lies between the latest instant of an occupied bucket and the earliest of
// the next occupied one — the answer is exact, whatever the order of the rows.
import { QuernError } from '../errors.js';
import type { IsoDuration } from '../time/duration.js';

/** A gap between consecutive instants: the last one before it and the first one after it. */
export interface InstantGap {
  after: number;
  before: number;
  /** before − after, in ms. */
  length: number;
}

/** The fixed length in ms of a duration of weeks, days, hours, minutes and seconds (a day = 24 h). */
export function fixedDurationMs(d: IsoDuration, text: string): number {
  if (d.years !== 0 || d.months !== 0) {
    throw new QuernError('E_VALUE', `--max-gap ${text}: years and months have no fixed length`, 'give weeks, days or a clock duration such as P1D, PT6H or PT30M');
  }
  const ms = ((d.weeks * 7 + d.days) * 24 * 3600 + d.hours * 3600 + d.minutes * 60 + d.seconds) * 1000 + d.milliseconds;
  if (d.sign < 0 || ms <= 0) throw new QuernError('E_VALUE', `--max-gap ${text} is not a positive duration`, 'e.g. --max-gap PT30M');
  return ms;
}

/** The instants of one series, bucketed by the gap length. */
export class InstantBuckets {
  private readonly gap: number;
  private readonly index = new Map<number, number>();
  private lo: Float64Array = new Float64Array(64);
  private hi: Float64Array = new Float64Array(64);
  private bucket: Float64Array = new Float64Array(64);
  private n = 0;
  /** Instants added. */
  count = 0;
  first = Infinity;
  last = -Infinity;

  constructor(gapMs: number) {
    this.gap = gapMs;
  }

  /** Adds one instant. */
  add(t: number): void {
    this.count++;
    if (t < this.first) this.first = t;
    if (t > this.last) this.last = t;
    const b = Math.floor(t / this.gap);
    let i = this.index.get(b);
    if (i === undefined) {
      i = this.n++;
      if (i === this.lo.length) this.grow();
      this.index.set(b, i);
      this.bucket[i] = b;
      this.lo[i] = t;
      this.hi[i] = t;
      return;
    }
    if (t < this.lo[i]!) this.lo[i] = t;
    if (t > this.hi[i]!) this.hi[i] = t;
  }

  /** Every gap strictly longer than the duration, in time order. */
  gaps(): InstantGap[] {
    const order = Array.from({ length: this.n }, (_, i) => i).sort((a, b) => this.bucket[a]! - this.bucket[b]!);
    const out: InstantGap[] = [];
    for (let j = 1; j < order.length; j++) {
      const after = this.hi[order[j - 1]!]!;
      const before = this.lo[order[j]!]!;
      if (before - after > this.gap) out.push({ after, before, length: before - after });
    }
    return out;
  }

  private grow(): void {
    const n = this.lo.length * 2;
    for (const name of ['lo', 'hi', 'bucket'] as const) {
      const a = new Float64Array(n);
      a.set(this[name]);
      this[name] = a;
    }
  }
}
