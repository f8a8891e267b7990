// Sub-day units (millisecond, second, minute, hour, with any step) on the local wall clock.
//
// A period starts whenever the local clock shows a multiple of the step counted from the wall-clock origin
// (default 1970-01-01T00:00 local, so steps that divide a day sit on the same clock times every day:
// 15-minute slots at :00/:15/:30/:45, 6-hour slots at 00, 06, 12, 18 local), and at the first instant
// after a spring-forward gap that skipped such a time. A repeated clock time starts a period at each of
// its instants (the hour 01:00–02:00 of a fall-back day is two hours, 01:00-04:00 and 01:00-05:00).
// Periods are consecutive integer keys. The key is floor(wall position / step) − J, where J sums one
// correction per offset transition between the origin and the instant, cached per table block. Beyond
// 2100, where every zone follows its annual rule (annual-rule.ts), J is summed from that rule per
// 400-year cycle instead of from the transition table of every year.
import type { Zone, ZoneChunk } from '../time/zone.js';
import { EARLY_CHUNK, ZONE_CHUNK_MS } from '../time/zone.js';
import { CYCLE_MS, RULE_CHUNK, RULE_START_MS, ruleCycle, type RuleTransition } from './annual-rule.js';

function floorDiv(a: number, b: number): number {
  return Math.floor(a / b);
}

function mod(a: number, b: number): number {
  const r = a % b;
  return r < 0 ? r + b : r;
}

interface ChunkKeys {
  chunk: ZoneChunk;
  /** J at the chunk start. */
  j0: number;
  /** J from transition i on. */
  j: number[];
  /** Whether transition i starts a period. */
  starts: boolean[];
}

/** True for finite instants within the ECMAScript time range (±8.64e15 ms). */
function isTimeValue(t: number): boolean {
  return Math.abs(t) <= 8.64e15;
}

function lastJ(ck: ChunkKeys): number {
  return ck.j.length > 0 ? ck.j[ck.j.length - 1]! : ck.j0;
}

/** A wall-clock grid of `stepMs` in `zone`, counted from wall-clock time `wallOrigin`. */
export class SubdayGrid {
  private readonly keys = new Map<number, ChunkKeys>();
  private readonly originChunk: number;
  /** J at RULE_START_MS, then after each further whole 400-year cycle (filled as needed). */
  private ruleSums: number[] | null = null;

  constructor(
    private readonly zone: Zone,
    private readonly stepMs: number,
    private readonly wallOrigin: number,
  ) {
    this.originChunk = Math.floor(wallOrigin / ZONE_CHUNK_MS);
  }

  /** Integer key of the period holding instant `t`. */
  index(t: number): number {
    if (!isTimeValue(t)) return NaN;
    const ck = this.chunkKeys(t);
    let o = ck.chunk.offsetAtStart;
    let j = ck.j0;
    const at = ck.chunk.at;
    for (let i = 0; i < at.length && at[i]! <= t; i++) {
      o = ck.chunk.after[i]!;
      j = ck.j[i]!;
    }
    return floorDiv(t + o - this.wallOrigin, this.stepMs) - j;
  }

  /** Start of the period holding `t`. */
  floor(t: number): number {
    if (!isTimeValue(t)) return NaN;
    for (;;) {
      const ck = this.chunkKeys(t);
      const c = ck.chunk;
      let o = c.offsetAtStart;
      let s = c.start;
      let startsPeriod = false;
      for (let i = 0; i < c.at.length && c.at[i]! <= t; i++) {
        o = c.after[i]!;
        s = c.at[i]!;
        startsPeriod = ck.starts[i]!;
      }
      const b = t - mod(t + o - this.wallOrigin, this.stepMs);
      if (b >= s) return b;
      if (startsPeriod) return s;
      t = s - 1; // the period began in an earlier offset segment
    }
  }

  /** First period start strictly after `t`. */
  next(t: number): number {
    if (!isTimeValue(t)) return NaN;
    let x = Math.floor(t) + 1;
    for (;;) {
      const ck = this.chunkKeys(x);
      const c = ck.chunk;
      let o = c.offsetAtStart;
      let s = c.start;
      let startsPeriod = false;
      let e = c.end;
      let i = 0;
      for (; i < c.at.length && c.at[i]! <= x; i++) {
        o = c.after[i]!;
        s = c.at[i]!;
        startsPeriod = ck.starts[i]!;
      }
      if (i < c.at.length) e = c.at[i]!;
      if (x === s && startsPeriod) return x;
      const b = x + mod(this.wallOrigin - x - o, this.stepMs);
      if (b < e) return b;
      x = e;
    }
  }

  /** Start of the period with key `k`. */
  startOf(k: number): number {
    if (!Number.isFinite(k)) return NaN;
    const guessWall = this.wallOrigin + k * this.stepMs;
    let t = guessWall - this.zone.offsetMsAt(guessWall);
    for (let n = 0; n < 6; n++) {
      const kk = this.index(t);
      if (kk === k) return this.floor(t);
      t += (k - kk) * this.stepMs;
    }
    let kk = this.index(t);
    while (kk < k) { t = this.next(t); kk++; }
    while (kk > k) { t = this.floor(t) - 1; kk = this.index(t); }
    return this.floor(t);
  }

  private chunkKeys(t: number): ChunkKeys {
    const idx = Math.floor(t / ZONE_CHUNK_MS);
    const hit = this.keys.get(idx);
    if (hit) return hit;
    if (this.zone.fixed) {
      const ck = this.buildKeys(idx, 0);
      this.keys.set(idx, ck);
      return ck;
    }
    const cycle = idx > RULE_CHUNK ? ruleCycle(this.zone) : null;
    if (cycle !== null) {
      const ck = this.buildKeys(idx, this.ruleJ0(idx, cycle));
      this.keys.set(idx, ck);
      return ck;
    }
    // No transitions before EARLY_CHUNK: J there is J at EARLY_CHUNK, and a walk from an origin in that
    // far past may start at EARLY_CHUNK instead.
    if (idx < EARLY_CHUNK) {
      const ck = this.buildKeys(idx, this.chunkKeys(EARLY_CHUNK * ZONE_CHUNK_MS).j0);
      this.keys.set(idx, ck);
      return ck;
    }
    // Walk from the nearest known block towards `idx`, carrying J across block boundaries.
    const o = Math.max(this.originChunk, EARLY_CHUNK);
    const dir = idx >= o ? -1 : 1;
    let i = idx;
    while (i !== o && !this.keys.has(i)) i += dir;
    if (!this.keys.has(i)) this.keys.set(i, this.buildKeys(i, 0));
    for (let m = i - dir; dir < 0 ? m <= idx : m >= idx; m -= dir) {
      const known = this.keys.get(m + dir)!;
      if (dir < 0) {
        this.keys.set(m, this.buildKeys(m, lastJ(known)));
      } else {
        const probe = this.buildKeys(m, 0);
        this.keys.set(m, this.buildKeys(m, known.j0 - lastJ(probe)));
      }
    }
    return this.keys.get(idx)!;
  }

  /** Whether the transition at `tr` from offset `before` to `after` starts a period. */
  private startsAt(tr: number, before: number, after: number): boolean {
    const lastBefore = floorDiv(tr - 1 + before - this.wallOrigin, this.stepMs);
    const u = tr + after - this.wallOrigin;
    // A gap starts a period when it skipped a grid time; a fall-back when it lands on one.
    return after > before ? floorDiv(u, this.stepMs) >= lastBefore + 1 : mod(u, this.stepMs) === 0;
  }

  /** The change of J at the transition at `tr` from offset `before` to `after`. */
  private correction(tr: number, before: number, after: number): number {
    const lastBefore = floorDiv(tr - 1 + before - this.wallOrigin, this.stepMs);
    const first = floorDiv(tr + after - this.wallOrigin, this.stepMs);
    return first - lastBefore - (this.startsAt(tr, before, after) ? 1 : 0);
  }

  private buildKeys(idx: number, j0: number): ChunkKeys {
    const chunk = this.zone.chunkAt(idx * ZONE_CHUNK_MS);
    const j: number[] = [];
    const starts: boolean[] = [];
    let before = chunk.offsetAtStart;
    let acc = j0;
    for (let i = 0; i < chunk.at.length; i++) {
      const tr = chunk.at[i]!;
      const after = chunk.after[i]!;
      acc += this.correction(tr, before, after);
      j.push(acc);
      starts.push(this.startsAt(tr, before, after));
      before = after;
    }
    return { chunk, j0, j, starts };
  }

  /** J at chunk `idx` (> RULE_CHUNK) from the zone's annual rule: whole 400-year cycles, then the rest. */
  private ruleJ0(idx: number, cycle: readonly RuleTransition[]): number {
    if (this.ruleSums === null) this.ruleSums = [this.chunkKeys(RULE_START_MS).j0];
    const sums = this.ruleSums;
    const x = idx * ZONE_CHUNK_MS;
    const n = Math.floor((x - RULE_START_MS) / CYCLE_MS);
    const sumOf = (m: number, until: number): number => {
      let acc = 0;
      for (const tr of cycle) {
        const at = tr.at + m * CYCLE_MS;
        if (at >= until) break;
        acc += this.correction(at, tr.before, tr.after);
      }
      return acc;
    };
    if (CYCLE_MS % this.stepMs === 0) {
      // Every correction depends on instants only modulo the step, so each cycle adds the same amount.
      if (sums.length < 2) sums.push(sums[0]! + sumOf(0, Infinity));
      return sums[0]! + n * (sums[1]! - sums[0]!) + sumOf(n, x);
    }
    while (sums.length <= n) sums.push(sums[sums.length - 1]! + sumOf(sums.length - 1, Infinity));
    return sums[n]! + sumOf(n, x);
  }
}
