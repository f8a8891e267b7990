// makeCalendar: one unit, step, zone and week/fiscal convention compiled into pure methods over epoch ms.
// Date units work on local civil dates (field arithmetic for months and years, day numbers for days and
// weeks) and start each period at the first instant of its first date (zone.startOfWall: the earlier
// midnight when it repeats, the end of the gap when it is skipped). Sub-day units use the wall-clock grid
// of subday.ts. The k-th boundary is always computed from its key, never by adding to the previous one.
import { QuernError } from '../errors.js';
import { getZone, type Zone } from '../time/zone.js';
import { dateSchemeFor, type DateScheme } from './date-scheme.js';
import { dateLabel, dateParts, EXAMPLE_LABELS, formatWallDateTime, subdayDuration, type DateLabelContext } from './labels.js';
import { isSubdayUnit, readDateLabel, readInstantLabel } from './label-parse.js';
import { SubdayGrid } from './subday.js';
import { FIXED_UNIT_MS, resolveOptions, type ResolvedOptions } from './units.js';
import type { Calendar, CalendarOptions, Period, PeriodParts } from './types.js';

const DAY = 86_400_000;

/** The moving parts that differ between date units and sub-day units. */
interface Engine {
  index(t: number): number;
  startOf(k: number): number;
  floor(t: number): number;
  next(t: number): number;
  label(k: number, start: number): string;
  parts(k: number, start: number): PeriodParts;
  /** Key of the period a canonical label names, or a reason. */
  read(text: string): number | string;
}

/**
 * Compiles a calendar (see types.ts for the contract). Throws QuernError 'E_UNIT' for a bad unit, step,
 * week start or fiscal start, and 'E_ZONE' for an unknown zone.
 */
export function makeCalendar(options: CalendarOptions): Calendar {
  const o = resolveOptions(options);
  const zone = getZone(o.zone);
  const scheme = dateSchemeFor(o.unit, o.weekStart, o.fiscalStart);
  const engine = scheme === null ? subdayEngine(o, zone) : dateEngine(o, zone, scheme);
  const zoneName = zone.name;
  const period = (ms: number): Period => {
    const k = engine.index(ms);
    const start = engine.startOf(k);
    return { label: engine.label(k, start), start, end: engine.startOf(k + 1), unit: o.unit, step: o.step, zone: zoneName };
  };
  const tryParseLabel = (text: string): Period | null => {
    const k = engine.read(text.trim().toUpperCase());
    return typeof k === 'string' ? null : periodOfKey(k);
  };
  const periodOfKey = (k: number): Period => {
    const start = engine.startOf(k);
    return { label: engine.label(k, start), start, end: engine.startOf(k + 1), unit: o.unit, step: o.step, zone: zoneName };
  };
  return {
    unit: o.unit,
    step: o.step,
    zone: zoneName,
    weekStart: o.weekStart,
    fiscalStart: { ...o.fiscalStart },
    fiscalLabel: o.fiscalLabel,
    floor: (ms) => engine.floor(ms),
    next: (ms) => engine.next(ms),
    index: (ms) => engine.index(ms),
    startOf: (k) => engine.startOf(k),
    period,
    label: (ms) => {
      const k = engine.index(ms);
      return engine.label(k, engine.startOf(k));
    },
    parts: (ms) => {
      const k = engine.index(ms);
      return engine.parts(k, engine.startOf(k));
    },
    parseLabel(text) {
      const k = engine.read(text.trim().toUpperCase());
      if (typeof k === 'string') {
        const what = o.step === 1 ? o.unit : `${o.step}-${o.unit}`;
        throw new QuernError('E_LABEL', `bad ${what} label ${JSON.stringify(text)}: ${k}`, `write it like ${exampleLabel(o)}`);
      }
      return periodOfKey(k);
    },
    tryParseLabel,
    count: (from, until) => engine.index(until) - engine.index(from),
  };
}

function exampleLabel(o: ResolvedOptions): string {
  if (o.step === 1) return EXAMPLE_LABELS[o.unit];
  return isSubdayUnit(o.unit) ? `2024-03-10T08:00-05:00/${subdayDuration(o.unit, o.step)}` : `${EXAMPLE_LABELS.day}/P${o.step}…`;
}

function dateEngine(o: ResolvedOptions, zone: Zone, scheme: DateScheme): Engine {
  const ctx: DateLabelContext = { unit: o.unit, step: o.step, weekStart: o.weekStart, fiscalStart: o.fiscalStart, fiscalLabel: o.fiscalLabel };
  const step = o.step;
  const dayOf = (t: number): number => Math.floor(zone.toWall(t) / DAY);
  const originKey = o.origin === undefined ? 0 : scheme.keyOfDay(dayOf(o.origin));
  const keyOfDay = (dn: number): number => Math.floor((scheme.keyOfDay(dn) - originKey) / step);
  const baseOf = (k: number): number => originKey + k * step;
  let memoKey = NaN;
  let memoStart = NaN;
  const startOf = (k: number): number => {
    if (k !== memoKey) {
      memoStart = zone.startOfWall(scheme.firstDayOfKey(baseOf(k)) * DAY);
      memoKey = k;
    }
    return memoStart;
  };
  const index = (t: number): number => keyOfDay(dayOf(t));
  const label = (k: number): string => dateLabel(baseOf(k), scheme.firstDayOfKey(baseOf(k)), ctx);
  return {
    index,
    startOf,
    floor: (t) => startOf(index(t)),
    next: (t) => startOf(index(t) + 1),
    label,
    parts: (k) => dateParts(baseOf(k), scheme.firstDayOfKey(baseOf(k)), ctx),
    read(text) {
      const r = readDateLabel(text, ctx);
      if ('reason' in r) return r.reason;
      const k = keyOfDay(r.dn);
      const canonical = label(k);
      if (canonical !== text) return `not a period of this calendar; ${text.split('/')[0]} falls in ${canonical}`;
      return k;
    },
  };
}

function subdayEngine(o: ResolvedOptions, zone: Zone): Engine {
  const stepMs = FIXED_UNIT_MS[o.unit]! * o.step;
  const grid = new SubdayGrid(zone, stepMs, o.origin === undefined ? 0 : zone.toWall(o.origin));
  const precision = o.unit === 'millisecond' ? 'millisecond' : o.unit === 'second' ? 'second' : 'minute';
  const duration = o.step === 1 ? null : subdayDuration(o.unit, o.step);
  const label = (_k: number, start: number): string => {
    const text = formatWallDateTime(zone.toWall(start), zone.offsetAt(start), precision);
    return duration === null ? text : `${text}/${duration}`;
  };
  return {
    index: (t) => grid.index(t),
    startOf: (k) => grid.startOf(k),
    floor: (t) => grid.floor(t),
    next: (t) => grid.next(t),
    label,
    parts(_k, start) {
      const wall = zone.toWall(start);
      const d = new Date(wall);
      return {
        year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate(),
        hour: d.getUTCHours(), minute: d.getUTCMinutes(), second: d.getUTCSeconds(),
      };
    },
    read(text) {
      const r = readInstantLabel(text);
      if ('reason' in r) return r.reason;
      if (r.duration !== duration && !(duration === null && r.duration === subdayDuration(o.unit, 1))) {
        return duration === null ? `a ${o.unit} label has no duration` : `the duration must be ${duration}`;
      }
      const k = grid.index(r.ms);
      const start = grid.startOf(k);
      if (start !== r.ms) return `not the start of a period; that instant falls in ${label(k, start)}`;
      return k;
    },
  };
}
