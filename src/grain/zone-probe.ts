// A cheap one-off reading of a zone's offset, used only to rule zones out before the exact transition
// tables of src/time/zone.ts confirm the few that remain. The reading is Intl's (ECMA-402 'longOffset'
// names). Building a formatter per zone costs about 0.2 ms, 65-80 ms for all of them in every run, so the
// build reads every zone once into an atlas (zone-atlas.ts, dist/zone-atlas.bin), which answers instead
// wherever it holds exactly what Intl would say: under the runtime it was read under, inside its span.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { atlasOffsetMs, decodeZoneAtlas, runtimeKey, type ZoneAtlas } from './zone-atlas.js';

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterOf(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (f === undefined) {
    f = new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: 'longOffset', year: 'numeric' });
    formatters.set(zone, f);
  }
  return f;
}

/** Offset of `zone` at instant `ms` in milliseconds, from its Intl name ("GMT-05:00", "GMT+05:45", "GMT"). */
export function intlOffsetMs(zone: string, ms: number): number {
  const text = formatterOf(zone).format(ms);
  const m = /GMT([+-\u2212])(\d{2}):(\d{2})(?::(\d{2}))?/.exec(text);
  if (m === null) return 0; // "GMT" alone: offset zero
  const sign = m[1] === '+' ? 1 : -1;
  return sign * ((Number(m[2]) * 60 + Number(m[3])) * 60 + Number(m[4] ?? 0)) * 1000;
}

/** The atlas in use: undefined until first needed (then the build's, or null when there is none that fits). */
let atlas: ZoneAtlas | null | undefined;

/** Where the build writes the atlas: dist/zone-atlas.bin, two folders up from this module in dist/src/grain. */
const BUNDLED = new URL('../../zone-atlas.bin', import.meta.url);

/** Zones and instants checked against Intl before an atlas is trusted (whole-hour, half-hour and 30-minute daylight saving). */
const SPOT_ZONES = ['America/New_York', 'America/St_Johns', 'Australia/Lord_Howe'];
const SPOT_TIMES = [Date.UTC(1975, 6, 1), Date.UTC(2000, 0, 1), Date.UTC(2021, 9, 3, 12), Date.UTC(2030, 3, 1)];

/**
 * Sets the atlas the probe reads (null: Intl only). An atlas read under another runtime, or that
 * disagrees with Intl at a few spot checks, is not used. Returns whether it will be.
 */
export function useZoneAtlas(a: ZoneAtlas | null): boolean {
  atlas = a !== null && fits(a) ? a : null;
  return atlas !== null;
}

function fits(a: ZoneAtlas): boolean {
  if (a.runtime !== runtimeKey()) return false;
  for (const zone of SPOT_ZONES) {
    const z = a.zones.get(zone);
    if (z === undefined) return false;
    for (const t of SPOT_TIMES) if (t >= a.from && t < a.to && atlasOffsetMs(z, t) !== intlOffsetMs(zone, t)) return false;
  }
  return true;
}

function bundledAtlas(): ZoneAtlas | null {
  let bytes: Buffer;
  try {
    bytes = readFileSync(fileURLToPath(BUNDLED));
  } catch {
    return null; // no atlas (the TypeScript sources, or a build that made none): Intl answers
  }
  return decodeZoneAtlas(bytes);
}

/** Offset of `zone` at instant `ms` in milliseconds, as Intl reads it: from the atlas where it holds it. */
export function probeOffsetMs(zone: string, ms: number): number {
  if (atlas === undefined) useZoneAtlas(bundledAtlas());
  const a = atlas!;
  if (a !== null && ms >= a.from && ms < a.to) {
    const z = a.zones.get(zone);
    if (z !== undefined) return atlasOffsetMs(z, ms);
  }
  return intlOffsetMs(zone, ms);
}
