// Time zones as tables of offset transitions, built once with luxon and looked up without calling luxon
// per value. Offsets inside are integer milliseconds; `offsetAt` reports minutes as the contract asks.
//
// THE RULE FOR LOCAL TIMES (applied everywhere in quern):
// - a wall-clock time that a zone skips (spring-forward gap) is moved forward by the gap's length
//   ('compatible', as the Temporal proposal's default disambiguation);
// - a wall-clock time that a zone repeats (fall-back) takes the earlier instant;
// - so a day, week or month starts at the first instant of its first date: at local midnight where it exists
//   (the earlier one where midnight occurs twice) and, where midnight is skipped, at the first instant that
//   exists, i.e. the end of the gap (`startOfWall`). luxon itself picks the later offset for repeated times,
//   so quern never relies on luxon's resolution: it computes it from the transition table.
import { IANAZone } from 'luxon';
import { QuernError } from '../errors.js';
import type { LocalTimeRule } from './types.js';
import { formatOffset, ianaName, nearestZoneName, parseFixedOffset } from './zone-names.js';

export { formatOffset, parseFixedOffset };

const DAY = 86_400_000;
/**
 * Sampling interval of the table: no two transitions anywhere in the tz database lie closer than six
 * days (the survey of minimum spacings in the Temporal polyfill, which samples at 6–19 days), so 4-day
 * samples see every change; each change is then located to the second by bisection.
 */
export const SAMPLE_MS = 4 * DAY;
/** The range of ECMAScript time values (±8.64e15 ms); outside it offsets are NaN. */
const MAX_MS = 8.64e15;
/** Span of one cached block of the transition table (2^35 ms, about 398 days). */
export const ZONE_CHUNK_MS = 2 ** 35;
/**
 * The table block holding 1800-01-01T00:00Z. Before it every zone keeps one offset (its local mean
 * time): the tz database's first transitions come later (from memory, the earliest in the 1840s), and
 * this was checked for all 418 zones of the runtime's ICU data, sampled monthly over 1600–1800 and every
 * ten years from the year −2000 (none differs from its 1800 offset). So the far past costs no look-ups.
 */
export const EARLY_CHUNK = Math.floor(Date.UTC(1800, 0, 1) / ZONE_CHUNK_MS);

/** One cached block of the table: the offset at its start and the transitions inside it, in order. */
export interface ZoneChunk {
  readonly start: number;
  readonly end: number;
  readonly offsetAtStart: number; // ms
  /** Transition instants inside [start, end), ascending. */
  readonly at: readonly number[];
  /** Offset (ms) in force from at[i] on. */
  readonly after: readonly number[];
}

/** A transition of a zone's offset: from `before` to `after` minutes (and the same in ms) at instant `at`. */
export interface ZoneTransition {
  at: number;
  before: number;
  after: number;
  beforeMs: number;
  afterMs: number;
}

/** A compiled time zone. Every method is pure; offsets are cached per daylight-saving transition. */
export interface Zone {
  /** The name as resolved ('America/New_York', 'UTC', '+05:30'). */
  readonly name: string;
  /** True for 'UTC' and fixed offsets: no transitions ever. */
  readonly fixed: boolean;
  /** Offset from UTC in minutes at instant `ms` (may be fractional for historical local mean time). */
  offsetAt(ms: number): number;
  /** Offset from UTC in milliseconds at instant `ms`. */
  offsetMsAt(ms: number): number;
  /** Wall-clock milliseconds (the epoch ms the same reading would have in UTC) of instant `ms`. */
  toWall(ms: number): number;
  /** The instant of a wall-clock reading under `rule` (default 'compatible'); NaN when 'reject' refuses. */
  fromWall(wallMs: number, rule?: LocalTimeRule): number;
  /** Alias of fromWall, the name used in the team contract. */
  fromLocal(wallMs: number, rule?: LocalTimeRule): number;
  /** First instant at which the clock reads `wallMs`; when a gap skips it, the first instant after the gap. */
  startOfWall(wallMs: number): number;
  /** Transitions with from <= at < to, ascending. */
  transitions(from: number, to: number): ZoneTransition[];
  /** The cached table block holding `ms` (for calendar code that walks offset segments). */
  chunkAt(ms: number): ZoneChunk;
}

const cache = new Map<string, Zone>();

/**
 * The zone named `name`: an IANA name ('Europe/London'), 'UTC' (also 'Z', 'GMT'), or a fixed offset
 * ('+05:30', '-03', '+0545', 'UTC+05:30'). Cached per name. Unknown names throw QuernError 'E_ZONE'.
 */
export function getZone(name: string): Zone {
  const hit = cache.get(name);
  if (hit) return hit;
  const zone = buildZone(name);
  cache.set(name, zone);
  return zone;
}

function buildZone(name: string): Zone {
  const trimmed = name.trim();
  if (/^(utc|z|gmt|etc\/utc|etc\/gmt)$/i.test(trimmed)) return new FixedZone('UTC', 0);
  const fixed = parseFixedOffset(trimmed);
  if (fixed !== null) return new FixedZone(formatOffset(fixed / 60_000), fixed);
  const resolved = ianaName(trimmed);
  if (resolved !== null) return new TableZone(resolved, IANAZone.create(trimmed));
  const near = nearestZoneName(trimmed);
  throw new QuernError(
    'E_ZONE',
    `unknown time zone ${JSON.stringify(name)}`,
    (near ? `did you mean ${near}? ` : '') + "use an IANA name such as Europe/London, 'UTC', or an offset such as +05:30",
  );
}

/** Shared resolution of wall-clock readings from a zone's offsets near the reading. */
abstract class BaseZone implements Zone {
  abstract readonly name: string;
  abstract readonly fixed: boolean;
  abstract offsetMsAt(ms: number): number;
  abstract chunkAt(ms: number): ZoneChunk;
  abstract transitions(from: number, to: number): ZoneTransition[];

  offsetAt(ms: number): number {
    return this.offsetMsAt(ms) / 60_000;
  }

  toWall(ms: number): number {
    return ms + this.offsetMsAt(ms);
  }

  fromLocal(wallMs: number, rule: LocalTimeRule = 'compatible'): number {
    return this.fromWall(wallMs, rule);
  }

  fromWall(wallMs: number, rule: LocalTimeRule = 'compatible'): number {
    const r = this.resolve(wallMs);
    if (r.first === r.last) return r.first; // one instant, or NaN for a gap (handled below)
    if (!Number.isNaN(r.first)) {
      if (rule === 'reject') return NaN;
      return rule === 'later' ? r.last : r.first; // repeated time: 'compatible' and 'earlier' take the earlier
    }
    if (r.gap === null || rule === 'reject') return NaN;
    // Skipped time: 'compatible' and 'later' move forward by the gap's length, 'earlier' back by it.
    return wallMs - (rule === 'earlier' ? r.gap.afterMs : r.gap.beforeMs);
  }

  startOfWall(wallMs: number): number {
    const r = this.resolve(wallMs);
    if (!Number.isNaN(r.first)) return r.first;
    return r.gap === null ? NaN : r.gap.at;
  }

  /** The instants that show `wallMs` (earliest, latest), or the gap that skips it. */
  private resolve(wallMs: number): { first: number; last: number; gap: ZoneTransition | null } {
    let first = NaN;
    let last = NaN;
    if (!Number.isFinite(wallMs) || Math.abs(wallMs) > MAX_MS) return { first, last, gap: null };
    // Fast path: the same offset two days either side means no transition near (they lie >= 6 days apart).
    const o0 = this.offsetMsAt(wallMs - 2 * DAY);
    if (o0 === this.offsetMsAt(wallMs + 2 * DAY)) {
      const t = wallMs - o0;
      return { first: t, last: t, gap: null };
    }
    const near = this.transitions(wallMs - 2 * DAY, wallMs + 2 * DAY);
    const offsets = [this.offsetMsAt(wallMs - 2 * DAY), ...near.map((t) => t.afterMs)];
    for (const o of offsets) {
      const t = wallMs - o;
      if (this.offsetMsAt(t) !== o) continue;
      if (Number.isNaN(first) || t < first) first = t;
      if (Number.isNaN(last) || t > last) last = t;
    }
    return { first, last, gap: Number.isNaN(first) ? findGap(near, wallMs) : null };
  }
}

/** The spring-forward transition whose skipped wall-clock range holds `wallMs`, if any. */
function findGap(near: ZoneTransition[], wallMs: number): ZoneTransition | null {
  for (const tr of near) {
    const lo = tr.at + tr.beforeMs;
    const hi = tr.at + tr.afterMs;
    if (hi > lo && wallMs >= lo && wallMs < hi) return tr;
  }
  return null;
}

class FixedZone extends BaseZone {
  readonly fixed = true;
  constructor(
    readonly name: string,
    private readonly offset: number,
  ) {
    super();
  }
  offsetMsAt(ms: number): number {
    return Math.abs(ms) <= MAX_MS ? this.offset : NaN;
  }
  chunkAt(ms: number): ZoneChunk {
    const start = Math.floor(ms / ZONE_CHUNK_MS) * ZONE_CHUNK_MS;
    return { start, end: start + ZONE_CHUNK_MS, offsetAtStart: this.offset, at: [], after: [] };
  }
  transitions(): ZoneTransition[] {
    return [];
  }
}

/** An IANA zone: offsets sampled every SAMPLE_MS with luxon, each change located to the second by bisection. */
class TableZone extends BaseZone {
  readonly fixed = false;
  private readonly chunks = new Map<number, ZoneChunk>();
  private last: ZoneChunk | null = null;

  constructor(
    readonly name: string,
    private readonly luxonZone: IANAZone,
  ) {
    super();
  }

  private luxonOffsetMs(ms: number): number {
    return Math.round(this.luxonZone.offset(Math.max(-MAX_MS, Math.min(MAX_MS, ms))) * 60_000);
  }

  chunkAt(ms: number): ZoneChunk {
    const last = this.last;
    if (last !== null && ms >= last.start && ms < last.end) return last;
    const k = Math.floor(ms / ZONE_CHUNK_MS);
    if (k < EARLY_CHUNK) {
      const start = k * ZONE_CHUNK_MS;
      return { start, end: start + ZONE_CHUNK_MS, offsetAtStart: this.chunkAt(EARLY_CHUNK * ZONE_CHUNK_MS).offsetAtStart, at: [], after: [] };
    }
    let chunk = this.chunks.get(k);
    if (chunk === undefined) {
      chunk = this.buildChunk(k * ZONE_CHUNK_MS);
      this.chunks.set(k, chunk);
    }
    this.last = chunk;
    return chunk;
  }

  private buildChunk(start: number): ZoneChunk {
    const end = start + ZONE_CHUNK_MS;
    const at: number[] = [];
    const after: number[] = [];
    const offsetAtStart = this.luxonOffsetMs(start);
    let prevT = start;
    let prevO = offsetAtStart;
    for (let probe = Math.min(start + SAMPLE_MS, end - 1); ; probe = Math.min(probe + SAMPLE_MS, end - 1)) {
      for (let o = this.luxonOffsetMs(probe); o !== prevO && !Number.isNaN(o); o = this.luxonOffsetMs(probe)) {
        // Bisect whole seconds (luxon offsets change on whole seconds) for the first one with a new offset.
        let lo = Math.floor(prevT / 1000);
        let hi = Math.floor(probe / 1000);
        while (hi - lo > 1) {
          const mid = Math.floor((lo + hi) / 2);
          if (this.luxonOffsetMs(mid * 1000) === prevO) lo = mid;
          else hi = mid;
        }
        prevT = hi * 1000;
        prevO = this.luxonOffsetMs(prevT);
        at.push(prevT);
        after.push(prevO);
      }
      prevT = probe;
      if (probe >= end - 1) break;
    }
    return { start, end, offsetAtStart, at, after };
  }

  offsetMsAt(ms: number): number {
    if (!(Math.abs(ms) <= MAX_MS)) return NaN;
    const c = this.chunkAt(ms);
    let o = c.offsetAtStart;
    for (let i = 0; i < c.at.length && c.at[i]! <= ms; i++) o = c.after[i]!;
    return o;
  }

  transitions(from: number, to: number): ZoneTransition[] {
    const out: ZoneTransition[] = [];
    if (!(to > from)) return out;
    for (let s = Math.max(Math.floor(from / ZONE_CHUNK_MS), EARLY_CHUNK) * ZONE_CHUNK_MS; s < to; s += ZONE_CHUNK_MS) {
      const c = this.chunkAt(s);
      let before = c.offsetAtStart;
      for (let i = 0; i < c.at.length; i++) {
        const at = c.at[i]!;
        const after = c.after[i]!;
        if (at >= from && at < to) out.push({ at, before: before / 60_000, after: after / 60_000, beforeMs: before, afterMs: after });
        before = after;
      }
    }
    return out;
  }
}
