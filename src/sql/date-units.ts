// Date units (day and longer) in SQL, mirroring src/calendar/date-scheme.ts: a local day number maps to a
// base key on one unbroken scale (days since 1970-01-01; weeks since the week holding 1970-01-01; months as
// year × 12 + month − 1, less the fiscal start month, and counted from the fiscal start day), steps group
// `step` base keys from the origin's base key, and a period starts at the first instant of its first date.
// Labels follow src/calendar/labels.ts. Epidemiological weeks have no engine helper: their year and number
// come from day arithmetic on the week's Wednesday (the fourth day of a Sunday week decides its year, CDC
// MMWR rule), which the emitted SQL says in a comment.
import { civilFromDays, weekStartOnOrBefore } from '../calendar/index.js';
import type { FiscalStart, UnitName } from '../calendar/index.js';
import { inlineBinder, type Binder, type Dialect } from './dialect.js';

const DAY = 86_400_000;

/** The calendar settings a date unit needs, with defaults filled in. */
export interface DateUnitOptions {
  unit: UnitName;
  step: number;
  weekStart: number;
  fiscalStart: FiscalStart;
  fiscalLabel: 'end' | 'start';
  /** Base key of the origin's period (0 when no origin is given). */
  originKey: number;
}

/** SQL for a date unit: period key from a wall-clock ms expression, first day and label from the key. */
export interface DateUnitSql {
  keyOfWall(wall: string): string;
  /** Period key of local day number `dn`. */
  keyOfDay(dn: string): string;
  /** Base key (first unit) of period `k`. */
  baseOfKey(k: string): string;
  /** Label from the base key `b` and first day number `fd` of a period. */
  labelOf(b: string, fd: string, bind?: Binder): string;
  /** Day number (BIGINT) of the first date of period `k`. */
  firstDay(k: string): string;
  label(k: string): string;
  /** A note for the SQL comment block, or null. */
  note: string | null;
}

interface Scheme {
  base(dn: string): string;
  firstDayOfBase(b: string): string;
}

function monthGrid(d: Dialect, size: number, month: number, day: number): Scheme {
  return {
    base(dn) {
      const date = d.dateOfDays(dn);
      const early = day === 1 ? '' : ` - (CASE WHEN ${d.dayOfMonth(date)} < ${day} THEN 1 ELSE 0 END)`;
      const mk = `(${d.year(date)} * 12 + ${d.month(date)} - ${month}${early})`;
      return size === 1 ? mk : d.floorDiv(mk, String(size));
    },
    firstDayOfBase(b) {
      const mk = size === 1 ? b : `(${b} * ${size})`;
      const shifted = month === 1 ? mk : `(${mk} + ${month - 1})`;
      return day === 1 ? d.monthStartDays(shifted) : `(${d.monthStartDays(shifted)} + ${day - 1})`;
    },
  };
}

function schemeOf(o: DateUnitOptions, d: Dialect): Scheme {
  if (o.unit === 'day') return { base: (dn) => dn, firstDayOfBase: (b) => b };
  if (o.unit === 'week' || o.unit === 'iso-week' || o.unit === 'epi-week') {
    const w0 = weekStartOnOrBefore(0, o.weekStart);
    return {
      base: (dn) => d.floorDiv(`(${dn} ${w0 < 0 ? '+' : '-'} ${Math.abs(w0)})`, '7'),
      firstDayOfBase: (b) => `(${b} * 7 ${w0 < 0 ? '-' : '+'} ${Math.abs(w0)})`,
    };
  }
  const f = o.fiscalStart;
  switch (o.unit) {
    case 'month': return monthGrid(d, 1, 1, 1);
    case 'quarter': return monthGrid(d, 3, 1, 1);
    case 'half': return monthGrid(d, 6, 1, 1);
    case 'year': return monthGrid(d, 12, 1, 1);
    case 'fiscal-month': return monthGrid(d, 1, f.month, f.day);
    case 'fiscal-quarter': return monthGrid(d, 3, f.month, f.day);
    default: return monthGrid(d, 12, f.month, f.day);
  }
}

/** A year as quern writes it: four digits in 0000–9999, otherwise sign and six digits (ISO 8601 expanded). */
export function yearText(d: Dialect, year: string, bind: Binder = inlineBinder): string {
  return bind(year, (y) => `(CASE WHEN ${y} BETWEEN 0 AND 9999 THEN lpad(${d.text(y)}, 4, '0') ` +
    `ELSE concat(CASE WHEN ${y} < 0 THEN '-' ELSE '+' END, lpad(${d.text(`abs(${y})`)}, 6, '0')) END)`);
}

const pad2 = (d: Dialect, x: string): string => `lpad(${d.text(x)}, 2, '0')`;

function duration(unit: UnitName, step: number): string {
  switch (unit) {
    case 'day': return `P${step}D`;
    case 'week': case 'iso-week': case 'epi-week': return `P${step}W`;
    case 'month': case 'fiscal-month': return `P${step}M`;
    case 'quarter': case 'fiscal-quarter': return `P${3 * step}M`;
    case 'half': return `P${6 * step}M`;
    default: return `P${step}Y`;
  }
}

/** Compiles a date unit for dialect `d`. */
export function dateUnitSql(o: DateUnitOptions, d: Dialect): DateUnitSql {
  const scheme = schemeOf(o, d);
  const step = o.step;
  const baseOfKey = (k: string): string =>
    step === 1 && o.originKey === 0 ? k : `(${o.originKey} + ${k} * ${step})`;
  const keyOfDay = (dn: string): string => {
    const base = scheme.base(dn);
    if (step === 1 && o.originKey === 0) return base;
    return d.floorDiv(`(${base} - (${o.originKey}))`, String(step));
  };
  const keyOfWall = (wall: string): string => keyOfDay(d.floorDiv(wall, d.big(DAY)));
  const firstDay = (k: string): string => scheme.firstDayOfBase(baseOfKey(k));
  const fyShift = o.fiscalLabel === 'start' || (o.fiscalStart.month === 1 && o.fiscalStart.day === 1) ? 0 : 1;
  const labelOf = (b: string, fd: string, bind: Binder = inlineBinder): string => {
    const date = d.dateOfDays(fd);
    if (step !== 1 || o.unit === 'week') return `concat(${d.dateText(date)}, '/${duration(o.unit, step)}')`;
    const split = (n: number): [string, string] => {
      const y = d.floorDiv(b, String(n));
      return [y, `(${b} - ${n} * ${y} + 1)`];
    };
    switch (o.unit) {
      case 'day': return d.dateText(date);
      case 'iso-week': return `concat(${yearText(d, d.isoWeekYear(date), bind)}, '-W', ${pad2(d, d.isoWeek(date))})`;
      case 'epi-week': {
        const wed = d.dateOfDays(`(${fd} + 3)`);
        return `concat(${yearText(d, d.year(wed), bind)}, '-EW', ${pad2(d, `(${d.quot(`(${d.dayOfYear(wed)} - 1)`, '7')} + 1)`)})`;
      }
      case 'month': { const [y, m] = split(12); return `concat(${yearText(d, y, bind)}, '-', ${pad2(d, m)})`; }
      case 'quarter': { const [y, q] = split(4); return `concat(${yearText(d, y, bind)}, '-Q', ${d.text(q)})`; }
      case 'half': { const [y, h] = split(2); return `concat(${yearText(d, y, bind)}, '-H', ${d.text(h)})`; }
      case 'year': return yearText(d, b);
      case 'fiscal-year': return `concat('FY', ${yearText(d, `(${b} + ${fyShift})`, bind)})`;
      case 'fiscal-quarter': {
        const [y, q] = split(4);
        return `concat('FY', ${yearText(d, `(${y} + ${fyShift})`, bind)}, '-Q', ${d.text(q)})`;
      }
      default: {
        const [y, m] = split(12);
        return `concat('FY', ${yearText(d, `(${y} + ${fyShift})`, bind)}, '-M', ${pad2(d, m)})`;
      }
    }
  };
  const note = o.unit === 'epi-week'
    ? 'Epidemiological week: no engine helper; year and week number come from day arithmetic on the week\'s Wednesday (CDC MMWR: week 1 holds January 4).'
    : o.unit === 'iso-week' ? 'ISO week: the engine\'s ISO 8601 week-year and week functions.' : null;
  const label = (k: string): string => labelOf(baseOfKey(k), firstDay(k));
  return { keyOfWall, keyOfDay, baseOfKey, labelOf, firstDay, label, note };
}

/** Base key of the origin's period for a date unit, computed as src/calendar does (day number of the origin's wall clock). */
export function originBaseKey(unit: UnitName, weekStart: number, fiscal: FiscalStart, originWallMs: number | undefined): number {
  if (originWallMs === undefined) return 0;
  const dn = Math.floor(originWallMs / DAY);
  if (unit === 'day') return dn;
  if (unit === 'week' || unit === 'iso-week' || unit === 'epi-week') {
    return Math.floor((dn - weekStartOnOrBefore(0, weekStart)) / 7);
  }
  const [y, m, day] = civilFromDays(dn);
  const size = unit === 'month' || unit === 'fiscal-month' ? 1 : unit === 'quarter' || unit === 'fiscal-quarter' ? 3 : unit === 'half' ? 6 : 12;
  const fiscal_ = unit.startsWith('fiscal') ? fiscal : { month: 1, day: 1 };
  const mk = y! * 12 + (m! - 1) - (day! < fiscal_.day ? 1 : 0) - (fiscal_.month - 1);
  return Math.floor(mk / size);
}
