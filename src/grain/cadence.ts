// Cadence: how the distinct periods of a column are spaced — regular every N units, weekdays only, one day
// in each week, one day in each month, or irregular. Period keys are computed with civil-date arithmetic
// (src/calendar/civil.ts) on the wall clock for days and coarser, and on elapsed time below a day.
import { civilFromDays, isoWeekday, MS_PER_DAY } from '../calendar/civil.js';
import type { UnitName } from '../calendar/types.js';
import { weekIndex } from './candidates.js';
import type { Cadence, Grain } from './types.js';

const UNIT_MS: Partial<Record<UnitName, number>> = { millisecond: 1, second: 1000, minute: 60_000, hour: 3_600_000 };

/** Integer key, in units of the grain's unit, of the period that holds a value (wall ms; instant ms below a day). */
export function periodKey(grain: Grain, wall: number, instant: number): number {
  const unitMs = UNIT_MS[grain.unit];
  if (unitMs !== undefined) return Math.floor(instant / unitMs);
  const days = Math.floor(wall / MS_PER_DAY);
  if (grain.unit === 'day') return days;
  if (grain.unit === 'week' || grain.unit === 'iso-week' || grain.unit === 'epi-week') return weekIndex(days, grain.weekStart ?? 1);
  const [y, m] = civilFromDays(days);
  const months = y! * 12 + (m! - 1);
  switch (grain.unit) {
    case 'month': return months;
    case 'quarter': return Math.floor(months / 3);
    case 'half': return Math.floor(months / 6);
    case 'fiscal-year': return Math.floor((months - ((grain.fiscalStart?.month ?? 1) - 1)) / 12);
    default: return y!;
  }
}

/** The most common value of a list of positive integers, the smallest on ties. */
function mode(xs: readonly number[]): number {
  const counts = new Map<number, number>();
  let best = xs[0]!;
  let bestCount = 0;
  for (const x of xs) {
    const c = (counts.get(x) ?? 0) + 1;
    counts.set(x, c);
    if (c > bestCount || (c === bestCount && x < best)) {
      best = x;
      bestCount = c;
    }
  }
  return best;
}

/** Share of items satisfying `f`. */
function share<T>(xs: readonly T[], f: (x: T) => boolean): number {
  let n = 0;
  for (const x of xs) if (f(x)) n++;
  return xs.length === 0 ? 0 : n / xs.length;
}

/**
 * Cadence of sorted distinct period keys (`keys`, ascending, in units of the grain) whose rows number `rows`.
 * Regular when at least 99% of gaps are multiples of the most common gap; `missing` counts the skipped steps.
 */
export function cadenceOf(grain: Grain, keys: readonly number[], rows: number): Cadence {
  const base: Cadence = {
    kind: 'single', every: null, unit: null, distinct: keys.length, distinctExact: true, missing: 0,
    repeated: rows - keys.length, typicalGap: null,
  };
  if (keys.length < 2) return base;
  const gaps: number[] = [];
  for (let i = 1; i < keys.length; i++) gaps.push(keys[i]! - keys[i - 1]!);
  const g = mode(gaps);
  base.typicalGap = g;
  if (grain.unit === 'day') {
    const weekdays = weekdaysOnly(base, keys);
    if (weekdays) return weekdays;
  }
  if (share(gaps, (x) => x % g === 0) >= 0.99 && share(gaps, (x) => x === g) >= 0.5) {
    let missing = 0;
    for (const x of gaps) if (x % g === 0) missing += x / g - 1;
    // Regular only when at least half of the expected periods are there.
    if (missing <= keys.length) return { ...base, kind: 'regular', every: g, unit: grain.unit, missing };
  }
  if (grain.unit === 'day') return dayPattern(base, keys);
  return { ...base, kind: 'irregular' };
}

/** Daily keys on Monday to Friday only, spanning weekends, holding at least 90% of the weekdays between first and last. */
function weekdaysOnly(base: Cadence, days: readonly number[]): Cadence | null {
  const first = days[0]!;
  const last = days[days.length - 1]!;
  if (last - first < 7 || share(days, (d) => isoWeekday(d) <= 5) !== 1) return null;
  let weekdays = 0;
  for (let d = first; d <= last; d++) if (isoWeekday(d) <= 5) weekdays++;
  return days.length >= 0.9 * weekdays ? { ...base, kind: 'weekdays', missing: weekdays - days.length } : null;
}

/** For daily keys that are not evenly spaced: one day a week, one day a month. */
function dayPattern(base: Cadence, days: readonly number[]): Cadence {
  const weeks = days.map((d) => weekIndex(d, 1));
  if (new Set(weeks).size === days.length && consecutiveShare(weeks) >= 0.9) return { ...base, kind: 'weekly' };
  const months = days.map((d) => {
    const [y, m] = civilFromDays(d);
    return y! * 12 + m!;
  });
  if (new Set(months).size === days.length && consecutiveShare(months) >= 0.9) return { ...base, kind: 'monthly' };
  return { ...base, kind: 'irregular' };
}

function consecutiveShare(sorted: readonly number[]): number {
  let n = 0;
  for (let i = 1; i < sorted.length; i++) if (sorted[i]! - sorted[i - 1]! === 1) n++;
  return sorted.length < 2 ? 0 : n / (sorted.length - 1);
}
