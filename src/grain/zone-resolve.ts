// Which zone a column's wall clock is read in: the one named with --zone, the IANA zone whose daylight-saving
// changes match the written offsets, a zone in which UTC-stamped values fall on local boundaries, or the
// written offset itself. Returns the finding and the wall-clock function the grain is then computed with.
import { getZone, formatOffset, type Zone } from '../time/zone.js';
import { DAY } from './candidates.js';
import { matchZones, onLocalBoundary, sameOffset, type ZoneGroup } from './zones.js';
import type { StoredValue } from './store.js';
import type { ZoneFinding } from './types.js';

const HOUR = 3_600_000;

export interface ZoneResolution {
  finding: ZoneFinding;
  /** Wall-clock ms of a stored value in the resolved zone. */
  wall: (v: StoredValue) => number;
}

const asWritten = (v: StoredValue): number => v.wall;

/**
 * Wall clock of instants in `zone`, where the first instant of a day whose midnight the zone skips
 * (America/Sao_Paulo 2018-11-04 starts at 01:00) reads as that day's midnight: a day starts at the first
 * instant that exists (the rule of src/time/zone.ts).
 */
export function zoneWall(zone: Zone): (ms: number) => number {
  return (ms) => {
    const w = zone.toWall(ms);
    const day = Math.floor(w / DAY) * DAY;
    const tod = w - day;
    if (tod === 0 || tod > 3 * HOUR || zone.fixed) return w;
    return zone.startOfWall(day) === ms ? day : w;
  };
}

/** Canonical name of a zone the user named (throws QuernError 'E_ZONE' for an unknown one). */
export function givenZone(name: string): string {
  return getZone(name).name;
}

/** Zone of values that carry no offset, or that the user placed with --zone. */
export function resolveGiven(values: readonly StoredValue[], hasInstants: boolean, zone: string | undefined, sampled: boolean): ZoneResolution {
  if (zone === undefined) return { finding: { zone: null, basis: 'none', offsets: [], alternatives: [], sampled: false }, wall: asWritten };
  const z = getZone(zone);
  if (!hasInstants) return { finding: { zone: z.name, basis: 'given', offsets: [], alternatives: [], sampled: false }, wall: asWritten };
  const offsets = new Set<number>();
  for (const v of values) offsets.add(z.offsetAt(v.ms));
  const wall = zoneWall(z);
  return {
    finding: { zone: z.name, basis: 'given', offsets: [...offsets].sort((a, b) => a - b), alternatives: [], sampled },
    wall: (v) => (Number.isNaN(v.offset) ? v.ms : wall(v.ms)),
  };
}

function fromGroup(g: ZoneGroup, basis: ZoneFinding['basis'], sampled: boolean): ZoneFinding {
  const fixed = g.offsets.length === 1;
  const zone = fixed && basis === 'aligned' ? fixedName(g.offsets[0]!) : g.zones[0]!;
  return { zone, basis, offsets: g.offsets, alternatives: g.zones.filter((z) => z !== zone), sampled };
}

function fixedName(minutes: number): string {
  return minutes === 0 ? 'UTC' : formatOffset(minutes);
}

/** Zone of instants whose written offsets change (−06:00 and −05:00): the IANA zones that change the same way. */
export function resolveChangingOffsets(values: readonly StoredValue[], offsets: number[], sampled: boolean): ZoneResolution {
  const groups = matchZones(values, sameOffset);
  const best = groups[0];
  if (best === undefined) return { finding: { zone: null, basis: 'written', offsets, alternatives: [], sampled }, wall: asWritten };
  return { finding: fromGroup(best, 'offsets', sampled), wall: asWritten };
}

/** Distinct values of `f` over the values, stopping once there are more than `limit`. */
function fewDistinct(values: readonly StoredValue[], f: (v: StoredValue) => number, limit: number): boolean {
  const seen = new Set<number>();
  for (const v of values) {
    seen.add(f(v));
    if (seen.size > limit) return false;
  }
  return true;
}

/**
 * Zone of instants written with one offset: a zone in which they fall at local midnight (or at local hour
 * starts), when their UTC times of day take only a few values; else the written offset. `unitMs` is the
 * length of the grain found as written.
 */
export function resolveOneOffset(values: readonly StoredValue[], offset: number, writtenGrainMs: number, sampled: boolean): ZoneResolution {
  const written: ZoneResolution = {
    finding: { zone: fixedName(offset), basis: 'written', offsets: [offset], alternatives: [], sampled }, wall: asWritten,
  };
  const targets: number[] = [];
  if (writtenGrainMs < DAY && fewDistinct(values, (v) => ((v.ms % DAY) + DAY) % DAY, 6)) targets.push(DAY);
  if (writtenGrainMs < HOUR && fewDistinct(values, (v) => ((v.ms % HOUR) + HOUR) % HOUR, 2)) targets.push(HOUR);
  for (const unit of targets) {
    const groups = matchZones(values, onLocalBoundary(unit));
    const g = groups[0];
    if (g === undefined) continue;
    const finding = fromGroup(g, 'aligned', sampled);
    // Zones of other groups that explain as many rows (at hour level every zone of a :30 offset does).
    for (const other of groups.slice(1)) if (other.matched === g.matched) finding.alternatives.push(...other.zones);
    if (finding.zone === fixedName(offset)) return written;
    const wall = zoneWall(getZone(g.zones[0]!));
    return { finding, wall: (v) => wall(v.ms) };
  }
  return writtenOffset(values, offset, sampled);
}

/**
 * Instants read with the one offset they are written with; the zones that keep that offset over all the
 * values are its alternatives (none listed for UTC).
 */
export function writtenOffset(values: readonly StoredValue[], offset: number, sampled: boolean): ZoneResolution {
  const written: ZoneResolution = {
    finding: { zone: fixedName(offset), basis: 'written', offsets: [offset], alternatives: [], sampled }, wall: asWritten,
  };
  if (offset !== 0) {
    const same = matchZones(values, sameOffset).find((g) => g.offsets.length === 1);
    if (same) written.finding.alternatives = same.zones;
  }
  return written;
}
