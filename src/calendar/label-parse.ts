// Reading period labels back: each unit's notation to the first day (date units) or start instant (sub-day).
// The calendar then checks that the label is the canonical label of a period it makes, so that
// parseLabel(label(ms)).start === floor(ms) and nothing else parses.
import { daysFromCivil, daysInMonth } from './civil.js';
import { fiscalYearName, type DateLabelContext } from './labels.js';
import { weekStartDay, weeksInWeekYear } from './date-scheme.js';
import { parseFixedOffset } from '../time/zone.js';
import type { UnitName } from './types.js';

const DAY = 86_400_000;
const Y = '(\\d{4}|[+-]\\d{6})';

/** A label read into its first day, or a reason it cannot name a period. */
export type DateLabelRead = { dn: number; duration: string | null } | { reason: string };

const RE_DATE = new RegExp(`^${Y}-(\\d{2})-(\\d{2})(?:/(P[0-9A-Z.]+))?$`);
const RE_WEEK = new RegExp(`^${Y}-(E?)W(\\d{2})$`);
const RE_MONTH = new RegExp(`^${Y}-(\\d{2})$`);
const RE_QH = new RegExp(`^${Y}-([QH])(\\d)$`);
const RE_YEAR = new RegExp(`^${Y}$`);
const RE_FISCAL = new RegExp(`^FY${Y}(?:-([QM])(\\d{1,2}))?$`);

/** Day number of a calendar date, or a reason (no rollover: 2021-02-29 is refused). */
export function readDate(y: number, m: number, d: number): number | string {
  if (m < 1 || m > 12) return `month ${m} does not exist`;
  if (d < 1 || d > daysInMonth(y, m)) return `${y}-${String(m).padStart(2, '0')} has no day ${d}`;
  return daysFromCivil(y, m, d);
}

/** Reads the label `text` (already trimmed and upper-cased) of a date unit. */
export function readDateLabel(text: string, ctx: DateLabelContext): DateLabelRead {
  const date = RE_DATE.exec(text);
  if (date) {
    const dn = readDate(Number(date[1]), Number(date[2]), Number(date[3]));
    return typeof dn === 'string' ? { reason: dn } : { dn, duration: date[4] ?? null };
  }
  const week = RE_WEEK.exec(text);
  if (week) {
    const epi = week[2] === 'E';
    if (epi !== (ctx.unit === 'epi-week')) return { reason: epi ? 'an epidemiological week, not an ISO week' : 'an ISO week, not an epidemiological week' };
    const y = Number(week[1]);
    const w = Number(week[3]);
    const n = weeksInWeekYear(y, ctx.weekStart);
    if (w < 1 || w > n) return { reason: `${y} has ${n} ${epi ? 'epidemiological' : 'ISO'} weeks` };
    return { dn: weekStartDay(y, w, ctx.weekStart), duration: null };
  }
  const month = RE_MONTH.exec(text);
  if (month) {
    const m = Number(month[2]);
    if (m < 1 || m > 12) return { reason: `month ${m} does not exist` };
    return { dn: daysFromCivil(Number(month[1]), m, 1), duration: null };
  }
  const qh = RE_QH.exec(text);
  if (qh) {
    const n = Number(qh[3]);
    const size = qh[2] === 'Q' ? 3 : 6;
    if (n < 1 || n > 12 / size) return { reason: `${qh[2] === 'Q' ? 'quarter' : 'half'} ${n} does not exist` };
    return { dn: daysFromCivil(Number(qh[1]), (n - 1) * size + 1, 1), duration: null };
  }
  const year = RE_YEAR.exec(text);
  if (year) return { dn: daysFromCivil(Number(year[1]), 1, 1), duration: null };
  const fiscal = RE_FISCAL.exec(text);
  if (fiscal) return readFiscal(Number(fiscal[1]), fiscal[2], fiscal[3], ctx);
  return { reason: 'not a period label' };
}

function readFiscal(named: number, part: string | undefined, num: string | undefined, ctx: DateLabelContext): DateLabelRead {
  const startYear = fiscalYearName(0, ctx) === 0 ? named : named - 1;
  let months = 0;
  if (part !== undefined) {
    const n = Number(num);
    const most = part === 'Q' ? 4 : 12;
    if (n < 1 || n > most) return { reason: `fiscal ${part === 'Q' ? 'quarter' : 'month'} ${n} does not exist` };
    months = (n - 1) * (part === 'Q' ? 3 : 1);
  }
  const mk = startYear * 12 + (ctx.fiscalStart.month - 1) + months;
  const y = Math.floor(mk / 12);
  return { dn: daysFromCivil(y, mk - 12 * y + 1, ctx.fiscalStart.day), duration: null };
}

const RE_DATETIME = new RegExp(
  `^${Y}-(\\d{2})-(\\d{2})T(\\d{2}):(\\d{2})(?::(\\d{2})(?:\\.(\\d{1,3}))?)?(Z|[+-]\\d{2}:\\d{2}(?::\\d{2})?)(?:/(PT[0-9.]+[HMS]))?$`,
);

/** A sub-day label read into its start instant and written duration, or a reason. */
export type InstantLabelRead = { ms: number; duration: string | null } | { reason: string };

/** Reads a sub-day label: local date-time with offset, optionally /PTnU. */
export function readInstantLabel(text: string): InstantLabelRead {
  const m = RE_DATETIME.exec(text);
  if (!m) return { reason: 'not a local date-time with an offset' };
  const dn = readDate(Number(m[1]), Number(m[2]), Number(m[3]));
  if (typeof dn === 'string') return { reason: dn };
  const h = Number(m[4]);
  const mi = Number(m[5]);
  const s = m[6] === undefined ? 0 : Number(m[6]);
  const ms = m[7] === undefined ? 0 : Number(m[7].padEnd(3, '0'));
  if (h > 23 || mi > 59 || s > 59) return { reason: 'the time of day is out of range' };
  const offset = m[8] === 'Z' ? 0 : parseOffsetWithSeconds(m[8]!);
  if (offset === null) return { reason: `bad offset ${m[8]}` };
  return { ms: dn * DAY + h * 3_600_000 + mi * 60_000 + s * 1000 + ms - offset, duration: m[9] ?? null };
}

function parseOffsetWithSeconds(text: string): number | null {
  const base = parseFixedOffset(text.slice(0, 6));
  if (base === null) return null;
  if (text.length === 6) return base;
  const sec = Number(text.slice(7));
  return sec > 59 ? null : base + Math.sign(base || (text[0] === '-' ? -1 : 1)) * sec * 1000;
}

/** True for units whose labels are date-times. */
export function isSubdayUnit(unit: UnitName): boolean {
  return unit === 'millisecond' || unit === 'second' || unit === 'minute' || unit === 'hour';
}
