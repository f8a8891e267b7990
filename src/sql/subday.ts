// Sub-day units (millisecond, second, minute, hour with a step) in SQL, mirroring src/calendar/subday.ts:
// a period starts whenever the local clock shows a multiple of the step counted from the wall-clock origin
// (default 1970-01-01T00:00 local), at each instant of a repeated reading, and at the end of a gap that
// skipped such a reading. The floor of an instant i with offset o: the grid reading W at or before its wall
// clock, at W − o when the offset there is still o (no change in between, nearly always); across a
// spring-forward change, at W read with the earlier offset (the end of the gap when the gap starts on the
// grid); across a fall-back change, at the last grid reading before it. This is exact whenever every offset
// change of the zone happens on a grid reading — true of whole- and half-hour changes for steps that
// divide 30 minutes, and of the zones in quern's tests; see the README's note on sub-day SQL.
import { FIXED_UNIT_MS, type UnitName } from '../calendar/index.js';
import { formatOffset } from '../time/zone.js';
import { inlineBinder, type Binder, type Dialect } from './dialect.js';
import type { ZoneSql } from './local.js';
import { yearText } from './date-units.js';

const DAY = 86_400_000;

/** SQL for a sub-day unit; periods are keyed by their start instant (epoch ms). */
export interface SubdaySql {
  readonly stepMs: number;
  readonly wallOrigin: number;
  /** Epoch ms of the start of the period holding epoch ms `ms`. */
  floorMs(ms: string, bind?: Binder): string;
  /** Epoch ms of the end of the period starting at epoch ms `start`. */
  endMs(start: string, bind?: Binder): string;
  /** Label of the period starting at epoch ms `start`. */
  label(start: string, bind?: Binder): string;
  /**
   * A SELECT adding column `s` (the period start) to `inner`, a SELECT with columns `t` (epoch ms) and
   * `o` (the offset at t), in stages so each step is written once.
   */
  floorSelect(inner: string): string;
  /** Grid index of a wall-clock ms expression (for enumerating periods). */
  gridOfWall(wall: string): string;
  /** Wall-clock ms of grid index `g`. */
  wallOfGrid(g: string): string;
}

/** Compiles a sub-day unit of `step` in the zone of `z` for dialect `d`. */
export function subdaySql(unit: UnitName, step: number, wallOrigin: number, z: ZoneSql, d: Dialect): SubdaySql {
  const stepMs = FIXED_UNIT_MS[unit]! * step;
  const S = d.big(stepMs);
  const wo = d.big(wallOrigin);
  const gridFloor = (wall: string): string => `(${wall} - ${d.rem(`(${d.rem(`(${wall} - ${wo})`, S)} + ${S})`, S)})`;
  const floorMs = (ms: string, bind: Binder = inlineBinder): string => bind(ms, (t) => {
    if (z.zone.kind === 'fixed') return `(${gridFloor(`(${t} + ${z.offsetAt(t)})`)} - ${z.offsetAt(t)})`;
    return bind(z.offsetAt(t), (o) => bind(gridFloor(`(${t} + ${o})`), (w) => bind(z.offsetAt(`(${w} - ${o})`), (p) =>
      bind(`(${gridFloor(`(${t} + ${p})`)} - ${p})`, (b2) =>
        `(CASE WHEN ${p} = ${o} THEN (${w} - ${o}) WHEN ${o} > ${p} THEN (${w} - ${p}) ` +
        `WHEN ${z.offsetAt(b2)} = ${p} THEN ${b2} ELSE (${b2} - ${S}) END)`))));
  });
  const endMs = (start: string, bind: Binder = inlineBinder): string => bind(start, (s0) => {
    if (z.zone.kind === 'fixed') return `(${s0} + ${S})`;
    return bind(floorMs(`(${s0} + ${S})`, bind), (e1) =>
      `(CASE WHEN ${e1} > ${s0} THEN ${e1} ELSE ${floorMs(`(${s0} + 2 * ${S})`, bind)} END)`);
  });
  const precision = unit === 'millisecond' ? 'millisecond' : unit === 'second' ? 'second' : 'minute';
  const duration = step === 1 ? '' : `/${subdayDuration(unit, step)}`;
  const label = (start: string, bind: Binder = inlineBinder): string => bind(start, (s0) => bind(z.wallOfMs(s0), (wall) =>
    bind(d.floorDiv(wall, d.big(DAY)), (dn) => bind(`(${wall} - ${dn} * ${d.big(DAY)})`, (inDay) => {
    const hh = d.quot(inDay, '3600000');
    const mi = d.quot(d.rem(inDay, '3600000'), '60000');
    const ss = d.quot(d.rem(inDay, '60000'), '1000');
    const ms = d.rem(inDay, '1000');
    const p2 = (x: string): string => `lpad(${d.text(x)}, 2, '0')`;
    const sec = precision === 'minute' ? `CASE WHEN ${d.rem(inDay, '60000')} <> 0 THEN concat(':', ${p2(ss)}) ELSE '' END` : `concat(':', ${p2(ss)})`;
    const milli = precision === 'millisecond' ? `concat('.', lpad(${d.text(ms)}, 3, '0'))` : `CASE WHEN ${ms} <> 0 THEN concat('.', lpad(${d.text(ms)}, 3, '0')) ELSE '' END`;
    const date = d.dateOfDays(dn);
    const ymd = `concat(${yearText(d, d.year(date), bind)}, '-', ${p2(d.month(date))}, '-', ${p2(d.dayOfMonth(date))})`;
    return `concat(${ymd}, 'T', ${p2(hh)}, ':', ${p2(mi)}, ${sec}, ${milli}, ${offsetText(d, z, s0, bind)}, '${duration}')`;
  }))));
  const floorSelect = (inner: string): string => {
    const g = (x: string): string => gridFloor(x);
    if (z.zone.kind === 'fixed') return `SELECT t, ${g('(t + o)')} - o AS s FROM (${inner}) quern_q0`;
    return `SELECT t, CASE WHEN p = o THEN w - o WHEN o > p THEN w - p WHEN ${z.offsetAt('b2')} = p THEN b2 ELSE b2 - ${S} END AS s ` +
      `FROM (SELECT t, o, w, p, ${g('(t + p)')} - p AS b2 ` +
      `FROM (SELECT t, o, w, ${z.offsetAt('(w - o)')} AS p ` +
      `FROM (SELECT t, o, ${g('(t + o)')} AS w FROM (${inner}) quern_q0) quern_q1) quern_q2) quern_q3`;
  };
  return {
    stepMs,
    wallOrigin,
    floorMs,
    floorSelect,
    endMs,
    label,
    gridOfWall: (wall) => d.floorDiv(`(${wall} - ${wo})`, S),
    wallOfGrid: (g) => `(${wo} + ${g} * ${S})`,
  };
}

/** ±HH:MM of the offset at epoch ms `ms` (±HH:MM:SS when it has seconds, as src/time/zone.ts writes it). */
function offsetText(d: Dialect, z: ZoneSql, ms: string, bind: Binder): string {
  if (z.zone.kind === 'fixed') return `'${formatOffset(z.zone.offsetMs / 60_000)}'`;
  return bind(z.offsetAt(ms), (o) => {
  const a = `abs(${o})`;
  const p2 = (x: string): string => `lpad(${d.text(x)}, 2, '0')`;
  const secs = d.quot(a, '1000');
  const hh = d.quot(secs, '3600');
  const mm = d.quot(d.rem(secs, '3600'), '60');
  const ss = d.rem(secs, '60');
  return `concat(CASE WHEN ${o} < 0 THEN '-' ELSE '+' END, ${p2(hh)}, ':', ${p2(mm)}, ` +
    `CASE WHEN ${ss} <> 0 THEN concat(':', ${p2(ss)}) ELSE '' END)`;
  });
}

function subdayDuration(unit: UnitName, step: number): string {
  if (unit === 'hour') return `PT${step}H`;
  if (unit === 'minute') return `PT${step}M`;
  if (unit === 'second') return `PT${step}S`;
  return `PT${Math.floor(step / 1000)}.${String(step % 1000).padStart(3, '0')}S`;
}
