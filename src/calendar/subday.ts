// Sub-day units (millisecond, second, minute, hour, with any step) on the local wall clock.
//
// A period starts whenever the local clock shows a multiple of the step counted from the wall-clock origin
// (default 1970-01-01T00:00 local, so steps that divide a day sit on the same clock times every day:
// 15-minute slots at :00/:15/:30/:45, 6-hour slots at 00, 06, 12, 18 local), and at the first instant
// after a spring-forward gap that skipped such a time. A repeated clock time starts a period at each of
// its instants (the hour 01:00–02:00 of a fall-back day is two hours, 01:00-04:00 and 01:00-05:00).
// Periods are consecutive integer keys. The key is floor(wall position / step) − J, where J sums one
// correction per offset transition between the origin and the instant, cached per table block. Beyond
// 2100, where every zone follows its annual rule (`annualRule` below), J is summed from that rule per
// 400-year cycle instead of from the transition table of every year.
import type { Zone, ZoneChunk, ZoneTransition } from '../time/zone.js';
import { ZONE_CHUNK_MS } from '../time/zone.js';
import { civilFromDays, daysFromCivil, daysInMonth, isoWeekday, MS_PER_DAY, yearOfDays } from './civil.js';

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
    // Walk from the nearest known block towards `idx`, carrying J across block boundaries.
    const o = this.originChunk;
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

// ---- The annual rule of a zone far out ----
//
// A zone's offsets after its last listed transition follow one annual rule (the POSIX TZ string of the
// TZif footer, RFC 8536 §3.3: month/week/weekday `Mm.w.d`, Julian `Jn` or zero-based day `n`, each with a
// time of day). tzdb's longest explicit predictions end in 2087 (from memory), so from RULE_START_MS on the
// rule alone gives every transition. The rule is read back from the zone's own table for 2100 and checked
// against the table in nine consecutive years and in far years (leap and non-leap centuries, 9999); any
// mismatch, or two readings of the rule that disagree, leaves the zone without a rule (the table walk).
// A Gregorian 400-year cycle is 146097 days, a whole number of weeks, so the rule repeats exactly after it.

const DAY = MS_PER_DAY;
const CYCLE_MS = 146_097 * DAY;
/** The first table block wholly at or after 2100-01-01T00:00Z. */
const RULE_CHUNK = Math.ceil((daysFromCivil(2100, 1, 1) * DAY) / ZONE_CHUNK_MS);
const RULE_START_MS = RULE_CHUNK * ZONE_CHUNK_MS;

interface RuleTransition {
  at: number;
  before: number;
  after: number;
}

interface DateRule {
  /** Day number (days since 1970-01-01) of the rule's date in `year`. */
  day(year: number): number;
  /** Instant of the transition minus 00:00Z of that day (any sign, several days at most). */
  tau: number;
}

function nthWeekday(y: number, m: number, wd: number, n: number): number {
  const first = daysFromCivil(y, m, 1);
  return first + ((wd - isoWeekday(first) + 7) % 7) + 7 * (n - 1);
}

function lastWeekday(y: number, m: number, wd: number): number {
  const last = daysFromCivil(y, m, daysInMonth(y, m));
  return last - ((isoWeekday(last) - wd + 7) % 7);
}

/** Every reading of a transition at instant `at` as an annual rule (dates up to 9 days either side). */
function readings(at: number): DateRule[] {
  const out: DateRule[] = [];
  const base = Math.floor(at / DAY);
  for (let k = -9; k <= 9; k++) {
    const x = base + k;
    const [y, m, d] = civilFromDays(x) as [number, number, number];
    const tau = at - x * DAY;
    const wd = isoWeekday(x);
    const n = Math.ceil(d / 7);
    if (n <= 4) out.push({ day: (Y) => nthWeekday(Y, m, wd, n), tau });
    if (d > daysInMonth(y, m) - 7) out.push({ day: (Y) => lastWeekday(Y, m, wd), tau });
    if (!(m === 2 && d === 29)) out.push({ day: (Y) => daysFromCivil(Y, m, d), tau });
    const yd = x - daysFromCivil(y, 1, 1);
    out.push({ day: (Y) => daysFromCivil(Y, 1, 1) + yd, tau });
  }
  return out;
}

/** Instants of rule `r` within [s, e). */
function predict(r: DateRule, s: number, e: number): number[] {
  const out: number[] = [];
  const y1 = yearOfDays(Math.floor(e / DAY)) + 1;
  for (let y = yearOfDays(Math.floor(s / DAY)) - 1; y <= y1; y++) {
    const at = r.day(y) * DAY + r.tau;
    if (at >= s && at < e) out.push(at);
  }
  return out;
}

function yearSpan(y: number): [number, number] {
  return [daysFromCivil(y, 1, 1) * DAY, daysFromCivil(y + 1, 1, 1) * DAY];
}

const VERIFY_YEARS = [2100, 2101, 2102, 2103, 2104, 2105, 2106, 2107, 2108, 2203, 2400, 2401, 2500, 3001, 5000, 9999];

/** The transitions of one 400-year cycle from RULE_START_MS, read from the zone's rule; null when unsure. */
function readCycle(zone: Zone): RuleTransition[] | null {
  const spans = VERIFY_YEARS.map(yearSpan);
  const seen = spans.map(([s, e]) => zone.transitions(s, e));
  const refs = zone.transitions(RULE_START_MS, RULE_START_MS + 372 * DAY);
  const rules: (DateRule & { before: number; after: number })[] = [];
  for (const ref of refs) {
    const fits = (r: DateRule, s: number, e: number, got: readonly ZoneTransition[]): boolean =>
      predict(r, s, e).every((at) => got.some((o) => o.at === at && o.beforeMs === ref.beforeMs && o.afterMs === ref.afterMs));
    let ok = readings(ref.at).filter((r) => spans.every(([s, e], i) => fits(r, s, e, seen[i]!)));
    // Readings that agree in the checked years but not in some other year of the cycle: the table decides.
    for (let y = 2100; y < 2500 && ok.length > 1; y++) {
      const at = ok[0]!.day(y) * DAY + ok[0]!.tau;
      if (ok.every((r) => r.day(y) * DAY + r.tau === at)) continue;
      const [s, e] = yearSpan(y);
      const got = zone.transitions(s - 10 * DAY, e + 10 * DAY);
      ok = ok.filter((r) => fits(r, s - 10 * DAY, e + 10 * DAY, got));
    }
    if (ok.length === 0) return null;
    const r0 = ok[0]!;
    if (!rules.some((q) => q.day(2200) * DAY + q.tau === r0.day(2200) * DAY + r0.tau)) {
      rules.push({ day: r0.day, tau: r0.tau, before: ref.beforeMs, after: ref.afterMs });
    }
  }
  // The rule must give every transition the table holds in the checked years, and the offsets in force.
  for (let i = 0; i < spans.length; i++) {
    const [s, e] = spans[i]!;
    const got = rules.flatMap((r) => predict(r, s, e)).sort((a, b) => a - b);
    const want = seen[i]!;
    if (got.length !== want.length || got.some((at, k) => at !== want[k]!.at)) return null;
  }
  const cycle: RuleTransition[] = [];
  for (const r of rules) {
    for (const at of predict(r, RULE_START_MS, RULE_START_MS + CYCLE_MS)) cycle.push({ at, before: r.before, after: r.after });
  }
  cycle.sort((a, b) => a.at - b.at);
  for (let i = 0; i < cycle.length; i++) {
    const prev = i > 0 ? cycle[i - 1]!.after : zone.offsetMsAt(RULE_START_MS);
    if (cycle[i]!.before !== prev) return null;
  }
  if (cycle.length > 0 && cycle[cycle.length - 1]!.after !== zone.offsetMsAt(RULE_START_MS)) return null;
  if (cycle.length === 0 && spans.some(([s]) => zone.offsetMsAt(s) !== zone.offsetMsAt(RULE_START_MS))) return null;
  return cycle;
}

const cycles = new Map<string, RuleTransition[] | null>();

/** The zone's transitions in [RULE_START_MS, +400 years), cached per zone name; null without a sure rule. */
function ruleCycle(zone: Zone): RuleTransition[] | null {
  if (!cycles.has(zone.name)) cycles.set(zone.name, readCycle(zone));
  return cycles.get(zone.name)!;
}
