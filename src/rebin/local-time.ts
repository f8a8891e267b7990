// Places wall-clock readings (values written without an offset) in the zone, counting the readings that
// a daylight-saving change skips or repeats. The rule is quern's one rule (src/time/zone.ts): a skipped
// reading moves forward by the gap's length, a repeated one takes the earlier instant. Days far from any
// transition are cached with their offset, so most readings cost one Map look-up.
import type { Zone } from '../time/zone.js';

const DAY = 86_400_000;

/** How many readings needed the rule. */
export interface LocalResolutions {
  /** Readings that do not exist in the zone (spring forward), moved forward by the gap. */
  nonexistent: number;
  /** Readings that occur twice (fall back), given the earlier instant. */
  repeated: number;
}

/** Resolves wall-clock ms to instants in one zone; counts nonexistent and repeated readings. */
export class LocalResolver {
  readonly counts: LocalResolutions = { nonexistent: 0, repeated: 0 };
  private readonly zone: Zone;
  /** Wall-clock day number → offset in ms for days with no transition within a day; NaN otherwise. */
  private readonly days = new Map<number, number>();
  private lastDay = NaN;
  private lastOffset = NaN;

  constructor(zone: Zone) {
    this.zone = zone;
  }

  /** The instant of wall-clock reading `wall` (ms) under quern's rule; the last outcome is counted. */
  resolve(wall: number): number {
    const day = Math.floor(wall / DAY);
    let off = day === this.lastDay ? this.lastOffset : this.days.get(day);
    if (off === undefined) {
      off = this.plainOffset(day);
      this.days.set(day, off);
    }
    this.lastDay = day;
    this.lastOffset = off;
    if (!Number.isNaN(off)) return wall - off;
    return this.resolveNearTransition(wall);
  }

  // The offset in force all through wall-clock day `day` when no transition lies within a day of it.
  private plainOffset(day: number): number {
    if (this.zone.fixed) return this.zone.offsetMsAt(0);
    const lo = day * DAY - 2 * DAY;
    const hi = (day + 1) * DAY + 2 * DAY;
    if (this.zone.transitions(lo, hi).length > 0) return NaN;
    return this.zone.offsetMsAt(day * DAY);
  }

  private resolveNearTransition(wall: number): number {
    const t = this.zone.fromWall(wall, 'compatible');
    if (this.zone.toWall(t) !== wall) {
      this.counts.nonexistent++;
      return t;
    }
    if (this.zone.fromWall(wall, 'later') !== t) this.counts.repeated++;
    return t;
  }
}
