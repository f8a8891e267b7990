// Wall clock and instants in a zone, in SQL. An instant becomes wall-clock milliseconds through the engine's
// own IANA support; the way back (the instant a wall-clock reading starts at) is computed here, because the
// engines resolve repeated readings to the later instant (PostgreSQL's DetermineTimeZoneOffset rule, and
// DuckDB's ICU) while quern takes the earlier one. The method is the Temporal proposal's: read the offsets a
// day before and a day after, try both, keep the valid candidates (the earlier of two), and for a reading
// in a daylight-saving gap take the one moved forward by the gap, which is the gap's end whenever the gap
// starts on the reading (every skipped midnight in tzdata 1970-2037; see test/sql/zone-gaps.test.ts).
import { QuernError } from '../errors.js';
import { getZone } from '../time/zone.js';
import { inlineBinder, type Binder, type Dialect, type SqlZone } from './dialect.js';

const DAY = 86_400_000;

/** Resolves a zone name for SQL: UTC and fixed offsets become arithmetic, other names stay IANA names. */
export function sqlZoneOf(name: string): SqlZone {
  const zone = getZone(name); // throws QuernError E_ZONE for an unknown name
  if (zone.fixed) return { kind: 'fixed', offsetMs: zone.offsetMsAt(0) };
  const trimmed = name.trim();
  if (!/^[A-Za-z0-9_+\-/]+$/.test(trimmed)) {
    throw new QuernError('E_ZONE', `zone name ${JSON.stringify(name)} has characters no IANA name uses`, 'write it like America/New_York');
  }
  return { kind: 'iana', name: trimmed };
}

/** SQL builders for one zone in one dialect. */
export interface ZoneSql {
  readonly zone: SqlZone;
  /** Wall-clock ms of the user's column (cast to the engine's instant type). */
  wallOfInstant(ts: string): string;
  /** Wall-clock ms of the instant at epoch ms `ms`. */
  wallOfMs(ms: string): string;
  /** Offset in ms at epoch ms `ms`. */
  offsetAt(ms: string): string;
  /** Epoch ms of the first instant of wall-clock reading `wall` under quern's rule. */
  startOfWall(wall: string, bind?: Binder): string;
  /** The two candidate instants of `wall`: read with the offset a day before and a day after. */
  candidates(wall: string): [string, string];
  /** The first instant of `wall` from its candidates (column names or small expressions). */
  pick(wall: string, c1: string, c2: string): string;
}

/** The zone builders of `zone` in dialect `d`. */
export function zoneSql(zone: SqlZone, d: Dialect): ZoneSql {
  if (zone.kind === 'fixed') {
    const off = d.big(zone.offsetMs);
    return {
      zone,
      wallOfInstant: (ts) => `(${d.instantMs(d.asInstant(ts))} + ${off})`,
      wallOfMs: (ms) => `(${ms} + ${off})`,
      offsetAt: () => off,
      startOfWall: (wall, bind = inlineBinder) => bind(wall, (w) => `(${w} - ${off})`),
      candidates: (wall) => [`(${wall} - ${off})`, `(${wall} - ${off})`],
      pick: (_wall, c1) => c1,
    };
  }
  const z = d.str(zone.name);
  const wallOfMs = (ms: string): string => d.wallMsIana(d.instantOfMs(ms), z);
  const offsetAt = (ms: string): string => `(${wallOfMs(ms)} - ${ms})`;
  const day = d.big(DAY);
  const candidates = (wall: string): [string, string] =>
    [`(${wall} - ${offsetAt(`(${wall} - ${day})`)})`, `(${wall} - ${offsetAt(`(${wall} + ${day})`)})`];
  // Both valid: the reading repeats, take the earlier; one valid: it; none: a gap, read with the earlier offset.
  const pick = (wall: string, c1: string, c2: string): string =>
    `(CASE WHEN ${c1} = ${c2} THEN ${c1} WHEN ${wallOfMs(c1)} = ${wall} AND ${wallOfMs(c2)} = ${wall} THEN least(${c1}, ${c2}) ` +
    `WHEN ${wallOfMs(c2)} = ${wall} THEN ${c2} ELSE ${c1} END)`;
  return {
    zone,
    wallOfInstant: (ts) => d.wallMsIana(d.asInstant(ts), z),
    wallOfMs,
    offsetAt,
    startOfWall(wall, bind = inlineBinder) {
      return bind(wall, (w) => {
        const [c1, c2] = candidates(w);
        return bind(c1, (x1) => bind(c2, (x2) => pick(w, x1, x2)));
      });
    },
    candidates,
    pick,
  };
}
