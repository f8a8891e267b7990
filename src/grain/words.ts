// Plain words for grains, zones and offsets, shared by the findings and the text report.
import type { Grain } from './types.js';

const WEEKDAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];
const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** English name of an ISO weekday number (Monday 1 … Sunday 7). */
export function weekdayName(isoWeekday: number): string {
  return WEEKDAYS[(isoWeekday - 1 + 7) % 7]!;
}

/** English name of a month number 1–12. */
export function monthName(month: number): string {
  return MONTHS[month - 1]!;
}

/** Digits grouped by thousands ("8,412"). */
export function count(n: number): string {
  return Math.round(n).toLocaleString('en-US');
}

/** A share as a percentage with enough digits not to round 99.96% up to 100%. */
export function percent(share: number): string {
  if (share === 1) return '100%';
  const p = share * 100;
  const digits = p >= 99 ? 2 : p >= 10 ? 1 : 2;
  return `${Math.min(p, 99.99).toFixed(digits)}%`;
}

/** An offset in minutes as "UTC−05:00" (U+2212 minus sign, as typeset) or "UTC". */
export function utcOffset(minutes: number): string {
  if (minutes === 0) return 'UTC+00:00';
  const sign = minutes < 0 ? '\u2212' : '+';
  const a = Math.abs(minutes);
  const h = Math.floor(a / 60);
  const m = Math.round(a % 60);
  return `UTC${sign}${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`;
}

const UNIT_PLURAL: Record<string, string> = {
  millisecond: 'milliseconds', second: 'seconds', minute: 'minutes', hour: 'hours', day: 'days', week: 'weeks',
  'iso-week': 'ISO weeks', 'epi-week': 'epidemiological weeks', month: 'months', quarter: 'quarters', half: 'half-years',
  year: 'years', 'fiscal-year': 'fiscal years', 'fiscal-quarter': 'fiscal quarters', 'fiscal-month': 'fiscal months',
};

/** Plural name of a unit ("minutes", "epidemiological weeks"). */
export function unitPlural(unit: string): string {
  return UNIT_PLURAL[unit] ?? `${unit}s`;
}

/** The periods a grain names, in words: "15-minute slots", "weeks ending Saturday", "months, marked by their last day". */
export function grainWords(g: Grain): string {
  const singular = unitPlural(g.unit).replace(/s$/, '');
  let base = g.step === 1 ? unitPlural(g.unit) : `${g.step}-${singular} ${g.unit === 'week' ? 'periods' : 'slots'}`;
  if (g.unit === 'iso-week') return 'ISO weeks (Monday to Sunday)';
  if (g.unit === 'epi-week') return 'epidemiological weeks (Sunday to Saturday)';
  if (g.unit === 'week' && g.weekStart !== null) {
    base += g.anchor === 'end' ? ` ending ${weekdayName(g.weekStart - 1 || 7)}` : ` starting ${weekdayName(g.weekStart)}`;
    return base;
  }
  if (g.unit === 'fiscal-year' && g.fiscalStart) base += ` starting ${g.fiscalStart.day} ${monthName(g.fiscalStart.month)}`;
  if (g.anchor === 'end') {
    const dayLevel = g.unit === 'month' || g.unit === 'quarter' || g.unit === 'half' || g.unit === 'year' || g.unit === 'fiscal-year';
    base += dayLevel ? ', each marked by its last day' : ', each marked by its last instant';
  }
  return base;
}

/** The boundary a grain's values sit on, in words: "local midnight", "15-minute boundaries", "the 1st of a month". */
export function boundaryWords(g: Grain): string {
  const end = g.anchor === 'end';
  switch (g.unit) {
    case 'day': return end ? 'the last instant of a day' : 'midnight';
    case 'week': case 'iso-week': case 'epi-week':
      return `a ${weekdayName(end ? (g.weekStart ?? 1) - 1 || 7 : g.weekStart ?? 1)}${g.step > 1 ? ` every ${g.step} weeks` : ''}`;
    case 'month': return end ? 'the last day of a month' : 'the 1st of a month';
    case 'quarter': return end ? 'the last day of a quarter' : 'the first day of a quarter';
    case 'half': return end ? 'the last day of a half-year' : 'the first day of a half-year';
    case 'year': return end ? '31 December' : '1 January';
    case 'fiscal-year': return end ? 'the last day of a fiscal year' : `the first day of a fiscal year`;
    default: {
      const what = g.step === 1 ? `${g.unit} boundaries` : `${g.step}-${g.unit} boundaries`;
      return end ? `the last instant before ${what}` : what;
    }
  }
}
