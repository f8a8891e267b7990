// periodSql: the label, start and end of the period that holds each value of a timestamp column, as SQL
// expressions that mean exactly what quern's calendar means (src/calendar). The options are the calendar's
// own (unit, step, zone, week start, fiscal start and label, origin), checked by makeCalendar.
import { FIXED_UNIT_MS, makeCalendar, type CalendarOptions, type UnitName } from '../calendar/index.js';
import { QuernError } from '../errors.js';
import { getZone } from '../time/zone.js';
import { COMMON_NOTES, inlineBinder, makeBinder, type Binder, type Dialect } from './dialect.js';
import { dialectOf } from './dialects.js';
import { dateUnitSql, originBaseKey, type DateUnitSql } from './date-units.js';
import { sqlZoneOf, zoneSql, type ZoneSql } from './local.js';
import { checkRawExpression, type DialectName } from './quote.js';
import { subdaySql, type SubdaySql } from './subday.js';

const DAY = 86_400_000;

/** Calendar options plus the column and the dialect to write. */
export interface PeriodSqlOptions extends CalendarOptions {
  dialect: DialectName;
  /** A column name or dotted name, quoted as an identifier (never spliced as SQL). */
  column?: string;
  /** A trusted raw SQL expression instead of `column` (checked for ';', comments and balance only). */
  columnExpr?: string;
}

/** SQL expressions for one calendar over one column. */
export interface PeriodSql {
  /** The period's label as text (src/calendar label notation). */
  label: string;
  /** The period's first instant, a timestamp with time zone. */
  start: string;
  /** The period's end (exclusive), a timestamp with time zone. */
  end: string;
  /** Lines for a comment block that explains the emitted SQL. */
  notes: string[];
}

/** A compiled calendar for one dialect: a date unit keyed by period number, or a sub-day unit keyed by start. */
export interface CompiledCalendar {
  d: Dialect;
  z: ZoneSql;
  unit: UnitName;
  step: number;
  date: DateUnitSql | null;
  subday: SubdaySql | null;
  notes: string[];
}

/** Checks calendar options with makeCalendar and compiles them for `dialect`. */
export function compileCalendar(options: CalendarOptions & { dialect: DialectName }): CompiledCalendar {
  const cal = makeCalendar(options); // throws E_UNIT / E_ZONE for bad options
  const d = dialectOf(options.dialect);
  const z = zoneSql(sqlZoneOf(options.zone ?? 'UTC'), d);
  const originWall = options.origin === undefined ? undefined : getZone(cal.zone).toWall(options.origin);
  const notes = [...COMMON_NOTES, ...d.notes, `Zone: ${z.zone.kind === 'iana' ? z.zone.name : `fixed offset ${z.zone.offsetMs / 60_000} min`}.`];
  if (FIXED_UNIT_MS[cal.unit] !== undefined) {
    const subday = subdaySql(cal.unit, cal.step, originWall ?? 0, z, d);
    notes.push('Sub-day unit: exact wherever the zone changes its offset on a grid reading (see README).');
    return { d, z, unit: cal.unit, step: cal.step, date: null, subday, notes };
  }
  const date = dateUnitSql({
    unit: cal.unit, step: cal.step, weekStart: cal.weekStart, fiscalStart: cal.fiscalStart, fiscalLabel: cal.fiscalLabel,
    originKey: originBaseKey(cal.unit, cal.weekStart, cal.fiscalStart, originWall),
  }, d);
  if (date.note !== null) notes.push(date.note);
  return { d, z, unit: cal.unit, step: cal.step, date, subday: null, notes };
}

/** The SQL text of the value column: a quoted (dotted) identifier, or a checked trusted expression. */
export function columnSql(options: { column?: string; columnExpr?: string }, d: Dialect): string {
  if (options.columnExpr !== undefined && options.column !== undefined) {
    throw new QuernError('E_USAGE', 'both a column and a column expression were given', 'use --column for a name or --column-expr for an expression, not both');
  }
  if (options.columnExpr !== undefined) return checkRawExpression(options.columnExpr);
  if (options.column === undefined) throw new QuernError('E_USAGE', 'no column named', 'name the timestamp column with --column');
  return d.ident(options.column);
}

/** Epoch ms of the start of period key `k` (a date-unit key) in the compiled calendar. */
export function dateStartMs(c: CompiledCalendar, k: string, bind: Binder = inlineBinder): string {
  return c.z.startOfWall(`(${c.date!.firstDay(k)} * ${c.d.big(DAY)})`, bind);
}

/**
 * The label, start and end of the period holding each value of a timestamp column, as SQL expressions of
 * `dialect`. Identifiers are quoted; labels and zone names are literals (see src/sql/quote.ts).
 */
export function periodSql(options: PeriodSqlOptions): PeriodSql {
  const c = compileCalendar(options);
  const col = columnSql(options, c.d);
  const { d } = c;
  const bind = makeBinder(d);
  if (c.date !== null) {
    const u = c.date;
    const key = (): string => bind(d.floorDiv(c.z.wallOfInstant(col), d.big(DAY)), (dn) => u.keyOfDay(dn));
    return {
      label: bind(key(), (k) => bind(u.baseOfKey(k), (b) => bind(u.firstDay(k), (fd) => u.labelOf(b, fd, bind)))),
      start: d.instantOfMs(bind(key(), (k) => dateStartMs(c, k, bind))),
      end: d.instantOfMs(bind(key(), (k) => dateStartMs(c, `(${k} + 1)`, bind))),
      notes: c.notes,
    };
  }
  const s = c.subday!;
  const start = (): string => s.floorMs(d.instantMs(d.asInstant(col)), bind);
  return {
    label: s.label(start(), bind),
    start: d.instantOfMs(start()),
    end: d.instantOfMs(s.endMs(start(), bind)),
    notes: c.notes,
  };
}

/** Formats notes as `--` comment lines; line breaks in a note are flattened, so no note can end its comment. */
export function commentBlock(lines: readonly string[]): string {
  return lines.map((l) => `-- ${l.replace(/[\r\n]+/g, ' ')}`).join('\n');
}
