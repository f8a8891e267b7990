// Every zone's offsets over a span of years, read from Intl once at build time and kept in one file, so
// that the zone probe of grain and profile (zone-probe.ts) need not build an Intl formatter for each of
// about 420 zones in every run (65-80 ms, most of the time of a small file). An atlas holds only what the
// probe would read: it is used only under the runtime it was read under (the versions of Node, V8, ICU and
// the tz data), and only for instants inside its span; everything else is asked of Intl as before.
import { SAMPLE_MS } from '../time/zone.js';

/** A zone's offsets in the atlas: offset[i] (ms) is in force from at[i] to at[i + 1]; at[0] is the span's start. */
export interface AtlasZone {
  readonly at: Float64Array;
  readonly offset: Float64Array;
}

/** The offsets of many zones over [from, to), as read under `runtime`. */
export interface ZoneAtlas {
  /** The runtime the offsets were read under (runtimeKey()). */
  readonly runtime: string;
  readonly from: number;
  readonly to: number;
  readonly zones: ReadonlyMap<string, AtlasZone>;
}

const MAGIC = 'quern zone atlas 1\n';

/** The versions whose tz rules and Intl readings an atlas depends on, as one string. */
export function runtimeKey(): string {
  const v = process.versions as Record<string, string | undefined>;
  return ['node', 'v8', 'icu', 'tz', 'unicode', 'cldr'].map((k) => `${k}=${v[k] ?? ''}`).join(' ');
}

/**
 * Reads the offsets of `zones` over [from, to) through `offsetMs` (the probe's Intl reading): sampled every
 * SAMPLE_MS (no two transitions of the tz database lie closer, see src/time/zone.ts), each change located to
 * the millisecond by bisection.
 */
export function readZoneAtlas(zones: readonly string[], from: number, to: number, offsetMs: (zone: string, ms: number) => number): ZoneAtlas {
  const out = new Map<string, AtlasZone>();
  for (const zone of zones) {
    const at = [from];
    const offset = [offsetMs(zone, from)];
    let lo = from;
    let before = offset[0]!;
    for (let t = Math.min(from + SAMPLE_MS, to - 1); ; t = Math.min(t + SAMPLE_MS, to - 1)) {
      const now = offsetMs(zone, t);
      if (now !== before) {
        // offsetMs(zone, lo) === before and offsetMs(zone, hi) !== before: find the first instant of the change.
        let hi = t;
        while (hi - lo > 1) {
          const mid = Math.floor((lo + hi) / 2);
          if (offsetMs(zone, mid) === before) lo = mid;
          else hi = mid;
        }
        at.push(hi);
        offset.push(now);
        before = now;
      }
      lo = t;
      if (t >= to - 1) break;
    }
    out.set(zone, { at: Float64Array.from(at), offset: Float64Array.from(offset) });
  }
  return { runtime: runtimeKey(), from, to, zones: out };
}

/** The offset (ms) of `z` at `ms`, which lies in its atlas's span. */
export function atlasOffsetMs(z: AtlasZone, ms: number): number {
  const at = z.at;
  let lo = 0;
  let hi = at.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (at[mid]! <= ms) lo = mid;
    else hi = mid - 1;
  }
  return z.offset[lo]!;
}

/** The atlas as bytes: a text head (magic line, then JSON of the runtime, span and zone sizes) and the numbers. */
export function encodeZoneAtlas(atlas: ZoneAtlas): Buffer {
  const names = [...atlas.zones.keys()];
  const head = JSON.stringify({ runtime: atlas.runtime, from: atlas.from, to: atlas.to, zones: names.map((n) => [n, atlas.zones.get(n)!.at.length]) });
  const headBytes = Buffer.from(MAGIC + head + '\n', 'utf8');
  const pad = (8 - ((headBytes.length + 4) % 8)) % 8;
  let count = 0;
  for (const z of atlas.zones.values()) count += 2 * z.at.length;
  const numbers = new Float64Array(count);
  let k = 0;
  for (const n of names) {
    const z = atlas.zones.get(n)!;
    numbers.set(z.at, k);
    numbers.set(z.offset, k + z.at.length);
    k += 2 * z.at.length;
  }
  const length = Buffer.alloc(4);
  length.writeUInt32LE(headBytes.length + pad);
  return Buffer.concat([length, headBytes, Buffer.alloc(pad, 0x20), Buffer.from(numbers.buffer)]);
}

/** The atlas in `bytes` (as encodeZoneAtlas wrote it), or null when they are not one. */
export function decodeZoneAtlas(bytes: Buffer): ZoneAtlas | null {
  if (bytes.length < 4) return null;
  const headLength = bytes.readUInt32LE(0);
  if (4 + headLength > bytes.length || (4 + headLength) % 8 !== 0) return null;
  const text = bytes.toString('utf8', 4, 4 + headLength);
  if (!text.startsWith(MAGIC)) return null;
  let head: { runtime: string; from: number; to: number; zones: Array<[string, number]> };
  try {
    head = JSON.parse(text.slice(MAGIC.length)) as typeof head;
  } catch {
    return null;
  }
  const body = bytes.subarray(4 + headLength);
  let total = 0;
  for (const [, n] of head.zones) total += 2 * n;
  if (body.length !== total * 8) return null;
  // A copy, so that the numbers are aligned whatever the buffer's offset in its memory.
  const numbers = new Float64Array(body.buffer.slice(body.byteOffset, body.byteOffset + body.length));
  const zones = new Map<string, AtlasZone>();
  let k = 0;
  for (const [name, n] of head.zones) {
    zones.set(name, { at: numbers.subarray(k, k + n), offset: numbers.subarray(k + n, k + 2 * n) });
    k += 2 * n;
  }
  return { runtime: head.runtime, from: head.from, to: head.to, zones };
}
