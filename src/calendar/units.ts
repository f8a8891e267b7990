// Unit names, week starts and fiscal starts as people write them, checked once with helpful errors.
import { QuernError } from '../errors.js';
import type { CalendarOptions, FiscalStart, UnitName } from './types.js';

/** Every unit, in the order help texts list them. */
export const UNIT_NAMES: readonly UnitName[] = [
  'millisecond', 'second', 'minute', 'hour', 'day', 'week', 'iso-week', 'epi-week',
  'month', 'quarter', 'half', 'year', 'fiscal-year', 'fiscal-quarter', 'fiscal-month',
];

/** Fixed length in ms of the sub-day units (the only units whose arithmetic is plain milliseconds). */
export const FIXED_UNIT_MS: Partial<Record<UnitName, number>> = {
  millisecond: 1, second: 1000, minute: 60_000, hour: 3_600_000,
};

const ALIASES: Record<string, UnitName> = {
  ms: 'millisecond', milliseconds: 'millisecond', msec: 'millisecond',
  s: 'second', sec: 'second', secs: 'second', seconds: 'second',
  min: 'minute', mins: 'minute', minutes: 'minute',
  h: 'hour', hr: 'hour', hrs: 'hour', hours: 'hour',
  d: 'day', days: 'day', date: 'day',
  w: 'week', weeks: 'week',
  isoweek: 'iso-week', 'iso-weeks': 'iso-week', iso_week: 'iso-week',
  epiweek: 'epi-week', 'epi-weeks': 'epi-week', epi_week: 'epi-week', 'mmwr-week': 'epi-week', mmwr: 'epi-week',
  mon: 'month', months: 'month', m: 'month',
  q: 'quarter', quarters: 'quarter', qtr: 'quarter',
  'half-year': 'half', halfyear: 'half', halves: 'half',
  y: 'year', yr: 'year', years: 'year',
  fy: 'fiscal-year', fiscalyear: 'fiscal-year', fiscal_year: 'fiscal-year', 'fiscal-years': 'fiscal-year',
  fq: 'fiscal-quarter', fiscalquarter: 'fiscal-quarter', fiscal_quarter: 'fiscal-quarter',
  fm: 'fiscal-month', fiscalmonth: 'fiscal-month', fiscal_month: 'fiscal-month',
};

/** True when `text` is exactly one of quern's unit names. */
export function isUnitName(text: string): text is UnitName {
  return (UNIT_NAMES as readonly string[]).includes(text);
}

/** Reads a unit as written on the command line ('iso-week', 'isoweek', 'weeks', 'fy'…); E_UNIT otherwise. */
export function parseUnitName(text: string): UnitName {
  const key = text.trim().toLowerCase();
  if (isUnitName(key)) return key;
  const alias = ALIASES[key];
  if (alias !== undefined) return alias;
  throw new QuernError('E_UNIT', `unknown unit ${JSON.stringify(text)}`, `use one of: ${UNIT_NAMES.join(', ')}`);
}

const WEEKDAYS = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'];

/** Reads a week start: 'monday'/'mon'/'mo'/'1' … 'sunday'/'sun'/'7' (also '0' for Sunday); ISO weekday number. */
/** Reads a step typed on a command line (`--step 15`): a whole number of units, 1 or more. */
export function parseStep(text: string): number {
  if (!/^\d+$/.test(text.trim()) || Number(text) < 1) {
    throw new QuernError('E_UNIT', `bad step ${JSON.stringify(text)}: a step is a whole number of units, 1 or more`, 'for example --step 15 --unit minute');
  }
  return Number(text);
}

export function parseWeekStart(text: string): number {
  const key = text.trim().toLowerCase();
  if (/^[0-7]$/.test(key)) return key === '0' ? 7 : Number(key);
  if (key.length >= 2) {
    const i = WEEKDAYS.findIndex((d) => d.startsWith(key));
    if (i >= 0 && (key.length >= 3 || key === d2(WEEKDAYS[i]!))) return i + 1;
  }
  throw new QuernError('E_UNIT', `unknown week start ${JSON.stringify(text)}`, 'use a weekday name (monday, sun) or its ISO number 1 (Monday) to 7 (Sunday)');
}

function d2(day: string): string {
  return day.slice(0, 2);
}

/** Reads a fiscal-year start: '10' (October 1), '10-01', '04-06' (UK tax year), '7'; E_UNIT otherwise. */
export function parseFiscalStart(text: string): FiscalStart {
  const m = /^\s*(\d{1,2})(?:[-/](\d{1,2}))?\s*$/.exec(text);
  if (m) {
    const start = { month: Number(m[1]), day: m[2] === undefined ? 1 : Number(m[2]) };
    if (isValidFiscalStart(start)) return start;
  }
  throw new QuernError(
    'E_UNIT',
    `bad fiscal-year start ${JSON.stringify(text)}`,
    'write the month, or month-day, on which the fiscal year starts: 10 (1 October), 04-06 (6 April), 07-01; days 1 to 28',
  );
}

function isValidFiscalStart(f: FiscalStart): boolean {
  return Number.isInteger(f.month) && Number.isInteger(f.day) && f.month >= 1 && f.month <= 12 && f.day >= 1 && f.day <= 28;
}

/** Options with every default filled in, after validation. */
export interface ResolvedOptions {
  unit: UnitName;
  step: number;
  zone: string;
  weekStart: number;
  fiscalStart: FiscalStart;
  fiscalLabel: 'end' | 'start';
  origin: number | undefined;
}

/** Checks calendar options and fills the defaults; throws QuernError 'E_UNIT' for a bad unit or option. */
export function resolveOptions(options: CalendarOptions): ResolvedOptions {
  const unit = isUnitName(options.unit) ? options.unit : parseUnitName(String(options.unit));
  const step = options.step ?? 1;
  if (!Number.isSafeInteger(step) || step < 1) {
    throw new QuernError('E_UNIT', `bad step ${String(step)}: a step is a whole number of units, 1 or more`, 'for example --step 15 with --unit minute');
  }
  const asked = options.weekStart ?? 1;
  if (!Number.isInteger(asked) || asked < 1 || asked > 7) {
    throw new QuernError('E_UNIT', `bad week start ${String(asked)}`, 'use an ISO weekday number, 1 (Monday) to 7 (Sunday)');
  }
  // ISO weeks always start on Monday and epidemiological weeks on Sunday: weekStart applies to 'week' only.
  const weekStart = unit === 'iso-week' ? 1 : unit === 'epi-week' ? 7 : asked;
  const fiscalStart = options.fiscalStart ?? { month: 10, day: 1 };
  if (!isValidFiscalStart(fiscalStart)) {
    throw new QuernError('E_UNIT', `bad fiscal-year start month ${fiscalStart.month} day ${fiscalStart.day}`, 'months 1 to 12, days 1 to 28');
  }
  const fiscalLabel = options.fiscalLabel ?? 'end';
  if (fiscalLabel !== 'end' && fiscalLabel !== 'start') {
    throw new QuernError('E_UNIT', `bad fiscal label ${JSON.stringify(fiscalLabel)}`, "use 'end' (named by the year it ends, as US FY2024) or 'start'");
  }
  const origin = options.origin;
  if (origin !== undefined && !Number.isFinite(origin)) {
    throw new QuernError('E_UNIT', 'the origin of steps must be a finite instant', 'give the origin as epoch milliseconds');
  }
  return { unit, step, zone: options.zone ?? 'UTC', weekStart, fiscalStart: { ...fiscalStart }, fiscalLabel, origin };
}
