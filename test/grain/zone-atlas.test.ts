// The zone atlas (src/grain/zone-atlas.ts): every zone's offsets read once, answering the zone probe in
// place of an Intl formatter per zone. Checked against the Temporal polyfill's transitions (an independent
// search of the same tz rules), against Intl itself around every transition and at random instants, and
// by grain's zone findings, which must not change when the atlas answers.
import { readFileSync, existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterEach, describe, expect, it, vi } from 'vitest';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { atlasOffsetMs, decodeZoneAtlas, encodeZoneAtlas, readZoneAtlas, runtimeKey, type ZoneAtlas } from '../../src/grain/zone-atlas.js';
import { intlOffsetMs, probeOffsetMs, useZoneAtlas } from '../../src/grain/zone-probe.js';
import { candidateZoneNames } from '../../src/grain/zone-names.js';
import { detectGrain } from '../../src/grain/index.js';
import { writeColumns } from './helpers.js';

vi.setConfig({ testTimeout: 60_000 });

const FROM = Date.UTC(1970, 0, 1);
const TO = Date.UTC(2040, 0, 1);
/** Zones with unusual histories: 30-minute DST (Lord_Howe), a skipped day (Apia, 2011), DST paused for
 *  Ramadan (Casablanca), +05:45 (Kathmandu, spelled Katmandu in ICU's list), DST ended (Sao_Paulo, 2019);
 *  New York, St John's and Lord Howe are also the zones useZoneAtlas spot-checks. */
const ZONES = ['America/New_York', 'America/St_Johns', 'Europe/London', 'Australia/Lord_Howe', 'Pacific/Apia', 'Africa/Casablanca',
  'Asia/Katmandu', 'America/Sao_Paulo', 'UTC'].filter((z) => candidateZoneNames().includes(z));

let small: ZoneAtlas | null = null;
function smallAtlas(): ZoneAtlas {
  return (small ??= readZoneAtlas(ZONES, FROM, TO, intlOffsetMs));
}

/** The build's atlas (dist/zone-atlas.bin), when the project is built (CI builds before testing). */
const BUILT = fileURLToPath(new URL('../../dist/zone-atlas.bin', import.meta.url));

afterEach(() => {
  useZoneAtlas(null);
});

describe('readZoneAtlas', () => {
  it('finds the transitions the Temporal polyfill finds, 1970-2039, to the millisecond', () => {
    // Oracle: temporal-polyfill's ZonedDateTime.getTimeZoneTransition('next') (TC39 Temporal), run from the span's start.
    const atlas = smallAtlas();
    for (const zone of ZONES) {
      const expected: Array<[number, number]> = [];
      let z = Temporal.Instant.fromEpochMilliseconds(FROM).toZonedDateTimeISO(zone);
      for (;;) {
        const next = z.getTimeZoneTransition('next');
        if (next === null || next.epochMilliseconds >= TO) break;
        expected.push([next.epochMilliseconds, next.offsetNanoseconds / 1e6]);
        z = next;
      }
      const got = atlas.zones.get(zone)!;
      const pairs = [...got.at].map((t, i) => [t, got.offset[i]!] as [number, number]);
      expect(pairs[0]).toEqual([FROM, Temporal.Instant.fromEpochMilliseconds(FROM).toZonedDateTimeISO(zone).offsetNanoseconds / 1e6]);
      expect(pairs.slice(1), zone).toEqual(expected);
    }
    // New York's first change in 1970: 26 April 1970, 02:00 EST = 07:00Z (tz "US" rules, from memory; Temporal agrees above).
    expect(atlas.zones.get('America/New_York')!.at[1]).toBe(Date.UTC(1970, 3, 26, 7));
  });

  it('answers as Intl does a millisecond either side of each transition and at random instants', () => {
    const atlas = smallAtlas();
    for (const zone of ZONES) {
      const z = atlas.zones.get(zone)!;
      for (const t of z.at) {
        for (const ms of [t - 1, t, t + 1]) if (ms >= FROM && ms < TO) expect(atlasOffsetMs(z, ms), `${zone} ${ms}`).toBe(intlOffsetMs(zone, ms));
      }
    }
    fc.assert(fc.property(fc.constantFrom(...ZONES), fc.integer({ min: FROM, max: TO - 1 }), (zone, ms) => {
      expect(atlasOffsetMs(atlas.zones.get(zone)!, ms)).toBe(intlOffsetMs(zone, ms));
    }), { numRuns: 2000 });
  });
});

describe('encodeZoneAtlas and decodeZoneAtlas', () => {
  it('give back the same atlas, and refuse bytes that are not one', () => {
    const atlas = smallAtlas();
    const back = decodeZoneAtlas(encodeZoneAtlas(atlas))!;
    expect(back).toMatchObject({ runtime: atlas.runtime, from: FROM, to: TO });
    expect([...back.zones.keys()]).toEqual(ZONES);
    for (const zone of ZONES) {
      expect([...back.zones.get(zone)!.at]).toEqual([...atlas.zones.get(zone)!.at]);
      expect([...back.zones.get(zone)!.offset]).toEqual([...atlas.zones.get(zone)!.offset]);
    }
    const bytes = encodeZoneAtlas(atlas);
    expect(decodeZoneAtlas(bytes.subarray(0, bytes.length - 8))).toBeNull(); // a number short
    expect(decodeZoneAtlas(Buffer.from('not an atlas at all, just some text'))).toBeNull();
    expect(decodeZoneAtlas(Buffer.alloc(2))).toBeNull();
  });
});

describe('useZoneAtlas', () => {
  it('uses an atlas of this runtime and refuses one read under another or that disagrees with Intl', () => {
    const atlas = smallAtlas();
    expect(useZoneAtlas(atlas)).toBe(true);
    expect(useZoneAtlas({ ...atlas, runtime: runtimeKey().replace(/tz=\S*/, 'tz=1999z') })).toBe(false);
    // New York an hour off from 1970 on: the spot check against Intl catches it.
    const wrong = new Map(atlas.zones);
    const ny = atlas.zones.get('America/New_York')!;
    wrong.set('America/New_York', { at: ny.at, offset: ny.offset.map((o) => o + 3_600_000) });
    expect(useZoneAtlas({ ...atlas, zones: wrong })).toBe(false);
    expect(useZoneAtlas(null)).toBe(false);
  });

  it('makes probeOffsetMs answer from the atlas inside its span and from Intl outside it or for other zones', () => {
    const atlas = smallAtlas();
    // A doctored copy (New York one hour off after 2030) shows which source answers; its spot checks still pass.
    const ny = atlas.zones.get('America/New_York')!;
    const marked = new Map(atlas.zones);
    const keep = ny.at.findIndex((t) => t >= Date.UTC(2035, 0, 1));
    marked.set('America/New_York', {
      at: Float64Array.from([...ny.at.subarray(0, keep), Date.UTC(2035, 0, 1)]),
      offset: Float64Array.from([...ny.offset.subarray(0, keep), -7 * 3_600_000]),
    });
    expect(useZoneAtlas({ ...atlas, zones: marked })).toBe(true);
    expect(probeOffsetMs('America/New_York', Date.UTC(2036, 0, 1))).toBe(-7 * 3_600_000); // from the atlas
    expect(probeOffsetMs('America/New_York', Date.UTC(2041, 0, 1))).toBe(-5 * 3_600_000); // after its span: Intl
    expect(probeOffsetMs('America/Chicago', Date.UTC(2036, 0, 1))).toBe(-6 * 3_600_000); // not in it: Intl
  });
});

describe.skipIf(!existsSync(BUILT))('the atlas the build writes (dist/zone-atlas.bin)', () => {
  const built = existsSync(BUILT) ? decodeZoneAtlas(readFileSync(BUILT)) : null;

  it('fits this runtime and holds every candidate zone over 1970-2039', () => {
    expect(built).not.toBeNull();
    expect(useZoneAtlas(built)).toBe(true);
    expect(built!).toMatchObject({ from: FROM, to: TO });
    expect([...built!.zones.keys()].sort()).toEqual([...candidateZoneNames()].sort());
  });

  it('agrees with Intl for every zone at random instants', () => {
    const names = [...built!.zones.keys()];
    fc.assert(fc.property(fc.constantFrom(...names), fc.integer({ min: FROM, max: TO - 1 }), (zone, ms) => {
      expect(atlasOffsetMs(built!.zones.get(zone)!, ms)).toBe(intlOffsetMs(zone, ms));
    }), { numRuns: 3000 });
  });

  it('leaves grain\'s zone findings as they are without it', async () => {
    // Starts of days and hours in zones with daylight saving, written with their offsets (Temporal polyfill).
    const columns: Record<string, string[]> = {};
    for (const [name, zone] of [['chicago', 'America/Chicago'], ['lord_howe', 'Australia/Lord_Howe'], ['london', 'Europe/London']] as const) {
      const d0 = Temporal.PlainDate.from('2023-01-01');
      columns[name] = Array.from({ length: 400 }, (_, k) => d0.add({ days: k }).toZonedDateTime(zone).toString({ timeZoneName: 'never' }));
    }
    const file = writeColumns(columns);
    useZoneAtlas(null);
    const plain = await detectGrain(file, {});
    useZoneAtlas(built);
    const withAtlas = await detectGrain(file, {});
    expect(withAtlas.columns.map((c) => [c.zone, c.zoneFinding])).toEqual(plain.columns.map((c) => [c.zone, c.zoneFinding]));
    expect(plain.columns.map((c) => c.zone)).toEqual(['America/Chicago', 'Australia/Lord_Howe', 'Europe/London']);
  });
});
