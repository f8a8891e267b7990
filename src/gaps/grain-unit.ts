// The expected periods of `gaps` when no unit is given: the time column's detected grain and cadence.
import type { CalendarOptions } from '../calendar/types.js';
import { QuernError } from '../errors.js';
import { detectGrain } from '../grain/index.js';
import type { ColumnGrain } from '../grain/index.js';
import type { TableOptions } from '../table/types.js';

/** The calendar gaps will expect, and in plain words why. */
export interface GapsUnitChoice {
  calendar: CalendarOptions;
  basis: string;
  /** The cadence is Monday–Friday. */
  weekdays: boolean;
}

/**
 * The calendar of a column's detected grain: its unit and step, or the regular cadence's spacing when it
 * is coarser (readings every 15 minutes at minute resolution), weeks starting on the detected weekday.
 * Throws QuernError 'E_USAGE' when the grain or cadence gives no regular series to check.
 */
export function gapsUnitFromGrain(col: ColumnGrain | null, zone: string): GapsUnitChoice {
  const g = col?.grain ?? null;
  const cad = col?.cadence ?? null;
  if (g === null) {
    throw new QuernError('E_USAGE', 'no grain could be detected in the time column, so the expected periods are unknown', 'give --unit, or --max-gap PT30M for instants');
  }
  const regular = cad !== null && cad.kind === 'regular' && cad.unit === g.unit && cad.every !== null;
  // Calendar grains (days and longer) are periods people expect in full; sub-day readings only when regular.
  const subDay = g.unit === 'millisecond' || g.unit === 'second' || g.unit === 'minute' || g.unit === 'hour';
  if (subDay && !regular && cad !== null) {
    throw new QuernError('E_USAGE', `the time column's detected grain is ${g.step === 1 ? g.unit : `${g.step}-${g.unit}`} with an ${cad.kind} cadence, so it has no regular periods to expect`,
      'give --unit (e.g. --unit day), or --max-gap DURATION to find long gaps between instants');
  }
  const step = regular ? Math.max(g.step, cad!.every!) : g.step;
  const calendar: CalendarOptions = { unit: g.unit, step, zone };
  if (g.weekStart !== null && g.unit === 'week') calendar.weekStart = g.weekStart;
  if (g.fiscalStart) calendar.fiscalStart = g.fiscalStart;
  const words = `${step === 1 ? g.unit : `${step}-${g.unit}`}${cad ? `, ${cad.kind} cadence` : ''}`;
  return { calendar, basis: `detected grain: ${words}`, weekdays: cad?.kind === 'weekdays' };
}

/** Detects the grain of `time` in `file` (one extra pass over the file) and chooses the expected calendar. */
export async function detectGapsUnit(file: string, time: string, zone: string | undefined, table: TableOptions = {},
  dayOrder: 'day-first' | 'month-first' | null = null): Promise<GapsUnitChoice> {
  const order = dayOrder === 'day-first' ? { dayFirst: true } : dayOrder === 'month-first' ? { monthFirst: true } : {};
  const report = await detectGrain(file, { columns: [time], ...(zone !== undefined ? { zone } : {}), ...order, table });
  return gapsUnitFromGrain(report.columns[0] ?? null, zone ?? report.columns[0]?.zone ?? 'UTC');
}
