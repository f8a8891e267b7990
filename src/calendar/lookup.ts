// lookupPeriod: the calendar look-up behind `quern period` ("which epidemiological week is 2025-01-01?",
// "which days does FY2024-Q1 cover?"). VALUE is a period label of any unit, an ISO 8601 date, or a
// date-time with or without an offset (without one it is a wall-clock reading in the zone, placed by the
// rule in time/zone.ts: skipped times move forward by the gap, repeated times take the earlier instant).
import { QuernError } from '../errors.js';
import { getZone, type Zone } from '../time/zone.js';
import { parseTimeText } from '../time/text.js';
import { makeCalendar } from './calendar.js';
import { detectLabelNotation } from './detect-label.js';
import { formatDate, formatWallDateTime } from './labels.js';
import { readDate } from './label-parse.js';
import { isoWeekday } from './civil.js';
import type { Calendar, CalendarOptions, FiscalStart, Period, PeriodParts, UnitName } from './types.js';

const DAY = 86_400_000;

/** Options of a look-up: the calendar options, with the unit optional when VALUE is a label. */
export type LookupOptions = Partial<CalendarOptions>;

/** The answer of a look-up: plain data, printed as it is by `--json`. */
export interface PeriodLookup {
  value: string;
  /** How VALUE was read: a period label, a date, an instant with an offset, or a local date-time. */
  readAs: 'label' | 'date' | 'instant' | 'local';
  label: string;
  unit: UnitName;
  step: number;
  zone: string;
  /** ISO 8601 date-times with the zone's offset; end exclusive. */
  start: string;
  end: string;
  startMs: number;
  endMs: number;
  /** First and last (inclusive) local dates the period touches. */
  firstDate: string;
  lastDate: string;
  /** Elapsed length in ms and in words ("7 days", "23 hours"). */
  lengthMs: number;
  length: string;
  /** Local calendar dates the period covers (date units) — a 23-hour day is still 1 date. */
  dates: number | null;
  parts: PeriodParts;
  weekStart?: number;
  fiscalStart?: FiscalStart;
  fiscalLabel?: 'end' | 'start';
  /** Plain-words remarks: how a nonexistent or repeated local time was placed, a unit change, … */
  notes: string[];
}


/** Looks up the period of `options.unit` (or of the unit VALUE's notation names) that holds VALUE. */
export function lookupPeriod(value: string, options: LookupOptions = {}): PeriodLookup {
  const text = value.trim();
  const zone = getZone(options.zone ?? 'UTC');
  const notes: string[] = [];
  const read = readValue(text, options, zone, notes);
  const unit = options.unit ?? read.unit;
  if (unit === undefined) {
    throw new QuernError('E_USAGE', `name the unit to look up ${JSON.stringify(text)} in`, 'add --unit, e.g. --unit epi-week, --unit fiscal-quarter or --unit hour');
  }
  const cal = read.calendar ?? makeCalendar({ ...options, unit, zone: zone.name });
  if (read.unit !== undefined && read.unit !== unit && read.readAs === 'label') {
    notes.push(`${text} names a ${read.unit}; this is the ${unit} holding its start`);
  }
  // A label of this very calendar keeps its own period (even an empty one, a date that was skipped).
  const p = read.period ?? cal.period(read.ms);
  const dayOf = (ms: number) => Math.floor(zone.toWall(ms) / DAY);
  const subday = unit === 'millisecond' || unit === 'second' || unit === 'minute' || unit === 'hour';
  const dates = subday ? null : dayOf(p.end) - dayOf(p.start);
  if (!subday && p.end === p.start) notes.push(`${p.label} never happened in ${zone.name}: its local dates were skipped`);
  const result: PeriodLookup = {
    value: text,
    readAs: read.readAs,
    label: p.label,
    unit,
    step: cal.step,
    zone: zone.name,
    start: isoWithOffset(zone, p.start),
    end: isoWithOffset(zone, p.end),
    startMs: p.start,
    endMs: p.end,
    firstDate: formatDate(dayOf(p.start)),
    lastDate: formatDate(dayOf(Math.max(p.start, p.end - 1))),
    lengthMs: p.end - p.start,
    length: describeLength(p.end - p.start, dates, unit, cal.step),
    dates,
    parts: cal.parts(p.start),
    notes,
  };
  if (unit === 'week' || unit === 'iso-week' || unit === 'epi-week') result.weekStart = cal.weekStart;
  if (unit.startsWith('fiscal-')) {
    result.fiscalStart = cal.fiscalStart;
    result.fiscalLabel = cal.fiscalLabel;
  }
  return result;
}

/** An instant as an ISO 8601 date-time with the zone's offset at it (seconds, and ms when present). */
export function isoWithOffset(zone: Zone, ms: number): string {
  return formatWallDateTime(zone.toWall(ms), zone.offsetAt(ms), 'second');
}

interface ReadValue {
  ms: number;
  /** Set when VALUE is a label of the calendar that will answer: that calendar and its period. */
  period?: Period;
  calendar?: Calendar;
  readAs: PeriodLookup['readAs'];
  unit?: UnitName;
}

function readValue(text: string, options: LookupOptions, zone: Zone, notes: string[]): ReadValue {
  if (options.unit !== undefined) {
    const own = makeCalendar({ ...options, unit: options.unit, zone: zone.name }).tryParseLabel(text);
    if (own !== null) return { ms: own.start, period: own, readAs: RE_PLAIN_DATE.test(text) ? 'date' : 'label' };
  }
  const notation = detectLabelNotation(text);
  if (notation !== null) {
    const weekStart = notation.startDate !== undefined && options.weekStart === undefined ? weekdayOf(notation.startDate) : options.weekStart;
    const cal = makeCalendar({ ...options, unit: notation.unit, step: notation.step, zone: zone.name, ...(weekStart === undefined ? {} : { weekStart }), origin: undefined });
    const p = cal.parseLabel(text); // throws E_LABEL with the reason
    const readAs = notation.unit === 'day' ? 'date' : 'label';
    if (options.unit === undefined) return { ms: p.start, period: p, calendar: cal, readAs, unit: notation.unit };
    return { ms: p.start, readAs, unit: notation.unit };
  }
  // Dates, week dates and date-times are read by the one time-value parser (src/time).
  const t = parseTimeText(text);
  if (t.kind === 'instant') return { ms: t.ms, readAs: 'instant' };
  if (t.kind === 'period') return { ms: zone.startOfWall(t.ms), readAs: 'date', unit: t.unit ?? 'day' };
  return placeWallTime(text, t.ms, zone, notes);
}

const RE_PLAIN_DATE = /^\d{4}-\d{2}-\d{2}$/;

function weekdayOf(date: string): number {
  const dn = readDate(Number(date.slice(0, 4)), Number(date.slice(5, 7)), Number(date.slice(8, 10)));
  return typeof dn === 'number' ? isoWeekday(dn) : 1;
}

/** Places a wall-clock reading in the zone by the one rule of time/zone.ts, noting a skipped or repeated time. */
function placeWallTime(text: string, wall: number, zone: Zone, notes: string[]): ReadValue {
  const first = zone.fromWall(wall, 'earlier');
  const last = zone.fromWall(wall, 'later');
  const ms = zone.fromWall(wall, 'compatible');
  if (zone.toWall(ms) !== wall) {
    notes.push(`${text} does not exist in ${zone.name} (the clocks skipped it); read as ${isoWithOffset(zone, ms)}`);
  } else if (first !== last) {
    notes.push(`${text} happens twice in ${zone.name}; the earlier, ${isoWithOffset(zone, first)}, is used`);
  }
  return { ms, readAs: 'local' };
}

/** "7 days", "23 hours", "1 day (25 hours)", "15 minutes". */
export function describeLength(ms: number, dates: number | null, unit: UnitName, step: number): string {
  const hours = ms / 3_600_000;
  if (dates === null) {
    if (ms % 3_600_000 === 0) return plural(hours, 'hour');
    if (ms % 60_000 === 0) return plural(ms / 60_000, 'minute');
    if (ms % 1000 === 0) return plural(ms / 1000, 'second');
    return plural(ms, 'millisecond');
  }
  if (unit === 'day' && step === 1) return plural(hours, 'hour');
  const text = plural(dates, 'day');
  return hours === dates * 24 ? text : `${text} (${plural(hours, 'hour')})`;
}

function plural(n: number, word: string): string {
  const shown = Number.isInteger(n) ? String(n) : String(Math.round(n * 1000) / 1000);
  return `${shown} ${word}${n === 1 ? '' : 's'}`;
}
