// Finding the zones that explain a column's instants: zones whose offsets equal the written ones, or whose
// wall clock puts the values on local boundaries (midnight, hour starts). Every IANA zone is a candidate;
// a cheap Intl probe on a spread sample rules most out, the exact tables of src/time/zone.ts confirm the
// rest on every distinct value, and zones that behave identically over the data's span are grouped.
import { getZone, type Zone } from '../time/zone.js';
import { probeOffsetMs } from './zone-probe.js';
import { byPreference, candidateZoneNames, currentZoneName } from './zone-names.js';
import { holds } from './tolerance.js';

/** A distinct instant of the column: epoch ms, written offset (minutes, NaN if none) and its weight in rows. */
export interface TimedValue {
  ms: number;
  offset: number;
  weight: number;
  line: number;
  text: string;
}

/** Decides whether a zone with offset `offsetMs` at `v.ms` explains value `v` (`zone` given in the exact check). */
export type ZoneTest = (offsetMs: number, v: TimedValue, zone?: Zone) => boolean;

/** Zones that explain the values identically, with the rows they explain. */
export interface ZoneGroup {
  /** Current IANA names, the one to name first. */
  zones: string[];
  /** The zone's distinct offsets over the values, in minutes, ascending. */
  offsets: number[];
  matched: number;
  total: number;
}

/** The zone's offset equals the offset written on the value. */
export const sameOffset: ZoneTest = (off, v) => off === v.offset * 60_000;

/**
 * The value falls on a multiple of `unitMs` of the zone's wall clock (local midnight for a day), or, for days,
 * is the first instant of a day whose midnight the zone skips (checked exactly when `zone` is given).
 */
export function onLocalBoundary(unitMs: number): ZoneTest {
  return (off, v, zone) => {
    const wall = v.ms + off;
    if (((wall % unitMs) + unitMs) % unitMs === 0) return true;
    if (zone === undefined || unitMs !== 86_400_000) return false;
    return zone.startOfWall(Math.floor(wall / unitMs) * unitMs) === v.ms;
  };
}

const PROBES = 24;
const PROBE_MISSES = 2;

/** Up to `n` values spread over the list (first, last and evenly between). */
function spread(values: readonly TimedValue[], n: number): TimedValue[] {
  if (values.length <= n) return [...values];
  const out: TimedValue[] = [];
  for (let i = 0; i < n; i++) out.push(values[Math.round((i * (values.length - 1)) / (n - 1))]!);
  return out;
}

function survivesProbe(zone: string, probes: readonly TimedValue[], test: ZoneTest): boolean {
  let misses = 0;
  for (const v of probes) {
    if (!test(probeOffsetMs(zone, v.ms), v) && ++misses > PROBE_MISSES) return false;
  }
  return true;
}

/** Probe-time signature of a zone: its offsets at the probe values. */
function probeSignature(zone: string, probes: readonly TimedValue[]): string {
  return probes.map((v) => probeOffsetMs(zone, v.ms)).join(',');
}

/** True when `member` shows the same offsets as the exact zone just before and at each of its transitions. */
function sameTransitions(member: string, at: readonly number[], expect: (ms: number) => number): boolean {
  for (const t of at) if (probeOffsetMs(member, t) !== expect(t)) return false;
  return true;
}

/**
 * Groups of zones that explain at least 99% of the rows of `values` under `test` (the tolerance rule),
 * best first. Zones that survive the probe are grouped by their offsets at the probe values; the group's
 * first zone is counted exactly on every value (up to `exactLimit` distinct values); the others are kept
 * when they show the same offsets at the span's ends and around each of its transitions.
 */
export function matchZones(values: readonly TimedValue[], test: ZoneTest, exactLimit = 200_000): ZoneGroup[] {
  if (values.length === 0) return [];
  const probes = spread(values, PROBES);
  const checked = values.length > exactLimit ? spread(values, exactLimit) : values;
  let total = 0;
  let from = Infinity;
  let to = -Infinity;
  for (const v of checked) {
    total += v.weight;
    if (v.ms < from) from = v.ms;
    if (v.ms > to) to = v.ms;
  }
  const bySignature = new Map<string, string[]>();
  for (const name of candidateZoneNames()) {
    if (!survivesProbe(name, probes, test)) continue;
    const key = probeSignature(name, probes);
    const list = bySignature.get(key);
    if (list) list.push(name);
    else bySignature.set(key, [name]);
  }
  const out: ZoneGroup[] = [];
  for (const names of bySignature.values()) {
    names.sort((a, b) => byPreference(currentZoneName(a), currentZoneName(b)));
    // Zones that agree at the probes may still differ between them: split the probe group by exact behaviour.
    let remaining = names;
    while (remaining.length > 0) {
      const zone = getZone(remaining[0]!);
      let matched = 0;
      const offsets = new Set<number>();
      for (const v of checked) {
        const off = zone.offsetMsAt(v.ms);
        offsets.add(off / 60_000);
        if (test(off, v, zone)) matched += v.weight;
      }
      const at = [from, to];
      for (const t of zone.transitions(from, to + 1)) at.push(t.at - 1, t.at);
      const members = remaining.filter((n, i) => i === 0 || sameTransitions(n, at, (ms) => zone.offsetMsAt(ms)));
      remaining = remaining.filter((n) => !members.includes(n));
      if (holds(matched, total)) out.push({ zones: members.map(currentZoneName), offsets: [...offsets].sort((a, b) => a - b), matched, total });
    }
  }
  return out.sort((a, b) => b.matched - a.matched || a.offsets.length - b.offsets.length || byPreference(a.zones[0]!, b.zones[0]!));
}
