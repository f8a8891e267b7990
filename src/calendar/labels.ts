// Period labels: ISO 8601 where it defines one, trade notation otherwise.
//   day 2024-03-10 · month 2024-03 · year 2024 · ISO week 2024-W07 (ISO 8601 week date)
//   quarter 2024-Q1 · half 2024-H1 · epidemiological week 2024-EW07 (never read as an ISO week)
//   fiscal year FY2024 · fiscal quarter FY2024-Q1 · fiscal month FY2024-M01 (named by the year it ends,
//   or starts, as the calendar says)
//   weeks of another start day, and any date unit with a step > 1: ISO 8601 start/duration,
//   2024-03-10/P1W, 2024-01-01/P2M
//   sub-day units: local ISO date-time with the zone's offset, 2024-11-03T01:00-05:00, with /PT15M for steps.
// Years outside 0000–9999 use ISO 8601 expanded years (+012345, -000001).
import { civilFromDays } from './civil.js';
import { weekNumberOf } from './date-scheme.js';
import { formatOffset } from '../time/zone.js';
import type { FiscalStart, PeriodParts, UnitName } from './types.js';

const DAY = 86_400_000;
const scratch = [0, 0, 0];

export function pad2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}

/** A year as ISO 8601 writes it: four digits, or sign and six digits outside 0000–9999. */
export function formatYear(y: number): string {
  if (y >= 0 && y <= 9999) return String(y).padStart(4, '0');
  return (y < 0 ? '-' : '+') + String(Math.abs(y)).padStart(6, '0');
}

/** ISO 8601 calendar date of a day number. */
export function formatDate(dn: number): string {
  civilFromDays(dn, scratch);
  return `${formatYear(scratch[0]!)}-${pad2(scratch[1]!)}-${pad2(scratch[2]!)}`;
}

/** Local date-time of wall-clock ms with an offset: minutes always, seconds and ms only when present. */
export function formatWallDateTime(wallMs: number, offsetMinutes: number, precision: 'minute' | 'second' | 'millisecond' = 'minute'): string {
  const dn = Math.floor(wallMs / DAY);
  const inDay = wallMs - dn * DAY;
  const h = Math.floor(inDay / 3_600_000);
  const mi = Math.floor((inDay % 3_600_000) / 60_000);
  const s = Math.floor((inDay % 60_000) / 1000);
  const ms = inDay % 1000;
  let time = `${pad2(h)}:${pad2(mi)}`;
  if (precision !== 'minute' || s !== 0 || ms !== 0) time += `:${pad2(s)}`;
  if (precision === 'millisecond' || ms !== 0) time += `.${String(ms).padStart(3, '0')}`;
  return `${formatDate(dn)}T${time}${formatOffset(offsetMinutes)}`;
}

/** The ISO 8601 duration of `step` sub-day units: PT15M, PT6H, PT30S, PT0.250S. */
export function subdayDuration(unit: UnitName, step: number): string {
  if (unit === 'hour') return `PT${step}H`;
  if (unit === 'minute') return `PT${step}M`;
  if (unit === 'second') return `PT${step}S`;
  const s = Math.floor(step / 1000);
  return `PT${s}.${String(step % 1000).padStart(3, '0')}S`;
}

/** The ISO 8601 duration of `step` date units: P2D, P1W, P3M, P6M (two quarters), P1Y. */
export function dateDuration(unit: UnitName, step: number): string {
  switch (unit) {
    case 'day': return `P${step}D`;
    case 'week': case 'iso-week': case 'epi-week': return `P${step}W`;
    case 'month': case 'fiscal-month': return `P${step}M`;
    case 'quarter': case 'fiscal-quarter': return `P${3 * step}M`;
    case 'half': return `P${6 * step}M`;
    default: return `P${step}Y`;
  }
}

/** What the label and parts of a date unit need to know of the calendar. */
export interface DateLabelContext {
  unit: UnitName;
  step: number;
  weekStart: number;
  fiscalStart: FiscalStart;
  fiscalLabel: 'end' | 'start';
}

/** The year that names a fiscal year starting in calendar year `startYear`. */
export function fiscalYearName(startYear: number, ctx: DateLabelContext): number {
  const startsJan1 = ctx.fiscalStart.month === 1 && ctx.fiscalStart.day === 1;
  return ctx.fiscalLabel === 'start' || startsJan1 ? startYear : startYear + 1;
}

/** Numbered parts of the date-unit period with base key `bk` and first day `dn`. */
export function dateParts(bk: number, dn: number, ctx: DateLabelContext): PeriodParts {
  switch (ctx.unit) {
    case 'week': case 'iso-week': case 'epi-week': {
      const w = weekNumberOf(dn, ctx.weekStart);
      return { year: w.year, week: w.week };
    }
    case 'month': return { year: Math.floor(bk / 12), month: bk - 12 * Math.floor(bk / 12) + 1 };
    case 'quarter': return { year: Math.floor(bk / 4), quarter: bk - 4 * Math.floor(bk / 4) + 1 };
    case 'half': return { year: Math.floor(bk / 2), half: bk - 2 * Math.floor(bk / 2) + 1 };
    case 'year': return { year: bk };
    case 'fiscal-year': return { year: fiscalYearName(bk, ctx) };
    case 'fiscal-quarter': {
      const sy = Math.floor(bk / 4);
      return { year: fiscalYearName(sy, ctx), quarter: bk - 4 * sy + 1 };
    }
    case 'fiscal-month': {
      const sy = Math.floor(bk / 12);
      return { year: fiscalYearName(sy, ctx), month: bk - 12 * sy + 1 };
    }
    default: {
      civilFromDays(dn, scratch);
      return { year: scratch[0]!, month: scratch[1]!, day: scratch[2]! };
    }
  }
}

/** Label of the date-unit period with base key `bk` (its first unit) and first day `dn`. */
export function dateLabel(bk: number, dn: number, ctx: DateLabelContext): string {
  if (ctx.step !== 1 || ctx.unit === 'week') return `${formatDate(dn)}/${dateDuration(ctx.unit, ctx.step)}`;
  const p = dateParts(bk, dn, ctx);
  const y = formatYear(p.year);
  switch (ctx.unit) {
    case 'day': return formatDate(dn);
    case 'iso-week': return `${y}-W${pad2(p.week!)}`;
    case 'epi-week': return `${y}-EW${pad2(p.week!)}`;
    case 'month': return `${y}-${pad2(p.month!)}`;
    case 'quarter': return `${y}-Q${p.quarter!}`;
    case 'half': return `${y}-H${p.half!}`;
    case 'year': return y;
    case 'fiscal-year': return `FY${y}`;
    case 'fiscal-quarter': return `FY${y}-Q${p.quarter!}`;
    case 'fiscal-month': return `FY${y}-M${pad2(p.month!)}`;
    default: return formatDate(dn);
  }
}

/** An example label of each unit, for hints. */
export const EXAMPLE_LABELS: Record<UnitName, string> = {
  millisecond: '2024-03-10T08:15:00.250-05:00', second: '2024-03-10T08:15:30-05:00', minute: '2024-03-10T08:15-05:00',
  hour: '2024-03-10T08:00-05:00', day: '2024-03-10', week: '2024-03-10/P1W', 'iso-week': '2024-W07',
  'epi-week': '2024-EW07', month: '2024-03', quarter: '2024-Q1', half: '2024-H1', year: '2024',
  'fiscal-year': 'FY2024', 'fiscal-quarter': 'FY2024-Q1', 'fiscal-month': 'FY2024-M01',
};
