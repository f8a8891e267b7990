// rebinQuerySql: a complete query that rebins the events of a table into quern's calendar periods with
// empty periods filled: a generated series of periods left-joined to the counts, returning `period`,
// `start`, `end` and `count` in period order, over the span of the data or the periods holding the given
// `from` and `until` instants (both periods included, as `quern rebin --from/--until`).
import { makeCalendar } from '../calendar/index.js';
import { makeBinder } from './dialect.js';
import { QuernError } from '../errors.js';
import { commentBlock, columnSql, compileCalendar, type CompiledCalendar, type PeriodSqlOptions } from './period.js';

const DAY = 86_400_000;

/** Options of rebinQuerySql: the calendar, the column, the table and an optional span of instants. */
export interface RebinQueryOptions extends PeriodSqlOptions {
  /** A table name or dotted name, quoted as an identifier. */
  table: string;
  /** First period to include: the one holding this instant (epoch ms); default the data's first. */
  from?: number;
  /** Last period to include: the one holding this instant (epoch ms); default the data's last. */
  until?: number;
}

function checkSpan(o: RebinQueryOptions): void {
  for (const [name, v] of [['from', o.from], ['until', o.until]] as const) {
    if (v !== undefined && !Number.isFinite(v)) throw new QuernError('E_VALUE', `--${name} is not a finite instant`, 'give an ISO 8601 date or date-time');
  }
  if (o.from !== undefined && o.until !== undefined && o.until < o.from) {
    throw new QuernError('E_USAGE', '--until is before --from', 'swap them');
  }
}

/**
 * A complete SELECT of `dialect` that counts the rows of `table` per period of the calendar, every period
 * from the first to the last present (filled with count 0), ordered by period.
 */
export function rebinQuerySql(options: RebinQueryOptions): string {
  checkSpan(options);
  const c = compileCalendar(options);
  const col = columnSql(options, c.d);
  const table = c.d.ident(options.table);
  const body = c.date !== null ? dateQuery(c, col, table, options) : subdayQuery(c, col, table, options);
  return `${commentBlock(['quern sql: rows of a table counted per calendar period, empty periods filled.', ...c.notes])}\n${body}`;
}

function outputs(c: CompiledCalendar): { period: string; start: string; end: string; count: string } {
  const q = (n: string): string => c.d.ident(n);
  return { period: q('period'), start: q('start'), end: q('end'), count: q('count') };
}

function dateQuery(c: CompiledCalendar, col: string, table: string, o: RebinQueryOptions): string {
  const { d, z } = c;
  const u = c.date!;
  const cal = makeCalendar(o);
  const fromKey = o.from === undefined ? null : cal.index(o.from);
  const untilKey = o.until === undefined ? null : cal.index(o.until);
  const within = [fromKey === null ? null : `k >= ${fromKey}`, untilKey === null ? null : `k <= ${untilKey}`].filter((x) => x !== null);
  const span = fromKey !== null && untilKey !== null
    ? `SELECT ${d.big(fromKey)} AS lo, ${d.big(untilKey)} AS hi`
    : `SELECT ${fromKey === null ? 'MIN(k)' : d.big(fromKey)} AS lo, ${untilKey === null ? 'MAX(k)' : d.big(untilKey)} AS hi FROM quern_counts`;
  const day = d.big(DAY);
  const [c1, c2] = z.candidates('w');
  const out = outputs(c);
  return [
    '-- each row\'s local date (day number), then its period key',
    'WITH quern_rows AS (',
    `  SELECT ${d.floorDiv(z.wallOfInstant(col), day)} AS dn FROM ${table} WHERE ${col} IS NOT NULL`,
    '),',
    `quern_keyed AS (SELECT ${u.keyOfDay('dn')} AS k FROM quern_rows),`,
    `quern_counts AS (SELECT k, COUNT(*) AS n FROM quern_keyed${within.length > 0 ? ` WHERE ${within.join(' AND ')}` : ''} GROUP BY k),`,
    `quern_span AS (${span}),`,
    '-- every period key from the first to one past the last, its first date and the wall-clock midnight of it',
    `quern_keys AS (${d.keySeries('quern_span', 'lo', '(hi + 1)')}),`,
    `quern_walls AS (SELECT k, ${u.baseOfKey('k')} AS b, ${u.firstDay('k')} AS fd FROM quern_keys),`,
    `quern_candidates AS (SELECT k, b, fd, w, ${c1} AS c1, ${c2} AS c2 FROM (SELECT k, b, fd, fd * ${day} AS w FROM quern_walls) quern_w),`,
    `quern_bounds AS (SELECT k, b, fd, ${z.pick('w', 'c1', 'c2')} AS start_ms FROM quern_candidates),`,
    'quern_periods AS (',
    `  SELECT k, ${u.labelOf('b', 'fd', makeBinder(d))} AS period,`,
    '    start_ms, LEAD(start_ms) OVER (ORDER BY k) AS end_ms',
    '  FROM quern_bounds',
    ')',
    `SELECT p.period AS ${out.period}, ${d.instantOfMs('p.start_ms')} AS ${out.start}, ${d.instantOfMs('p.end_ms')} AS ${out.end},`,
    `  COALESCE(c.n, 0) AS ${out.count}`,
    'FROM quern_periods p CROSS JOIN quern_span sp LEFT JOIN quern_counts c ON c.k = p.k',
    'WHERE p.k <= sp.hi',
    'ORDER BY p.k',
  ].join('\n');
}

function subdayQuery(c: CompiledCalendar, col: string, table: string, o: RebinQueryOptions): string {
  const { d, z } = c;
  const s = c.subday!;
  const cal = makeCalendar(o);
  const fromStart = o.from === undefined ? null : cal.floor(o.from);
  const untilStart = o.until === undefined ? null : cal.floor(o.until);
  const within = [fromStart === null ? null : `s >= ${d.big(fromStart)}`, untilStart === null ? null : `s <= ${d.big(untilStart)}`].filter((x) => x !== null);
  const lo = fromStart === null ? 'MIN(s)' : d.big(fromStart);
  const hi = untilStart === null ? 'MAX(s)' : d.big(untilStart);
  const [c1, c2] = z.candidates('w');
  const out = outputs(c);
  return [
    '-- each row\'s instant t and offset o, then the start s of its period',
    'WITH quern_rows AS (',
    `  ${s.floorSelect(`SELECT ${d.instantMs(d.asInstant(col))} AS t, ${z.wallOfInstant(col)} - ${d.instantMs(d.asInstant(col))} AS o FROM ${table} WHERE ${col} IS NOT NULL`)}`,
    '),',
    `quern_counts AS (SELECT s, COUNT(*) AS n FROM quern_rows${within.length > 0 ? ` WHERE ${within.join(' AND ')}` : ''} GROUP BY s),`,
    `quern_span AS (SELECT ${lo} AS lo, ${hi} AS hi${fromStart !== null && untilStart !== null ? '' : ' FROM quern_counts'}),`,
    '-- every grid reading from before the first period to past the last',
    `quern_grid AS (SELECT ${s.gridOfWall(z.wallOfMs('lo'))} - 1 AS glo, ${s.gridOfWall(z.wallOfMs('hi'))} + 2 AS ghi FROM quern_span),`,
    `quern_walls AS (SELECT ${s.wallOfGrid('k')} AS w FROM (${d.keySeries('quern_grid', 'glo', 'ghi')}) quern_g),`,
    '-- each reading with the offsets a day before and after: both instants where it repeats, the gap end where skipped',
    `quern_candidates AS (SELECT ${c1} AS t FROM quern_walls UNION SELECT ${c2} AS t FROM quern_walls),`,
    'quern_starts AS (',
    `  SELECT s FROM (${s.floorSelect(`SELECT t, ${z.offsetAt('t')} AS o FROM quern_candidates`)}) quern_f`,
    '  UNION',
    '  SELECT s FROM quern_counts',
    '),',
    'quern_periods AS (SELECT s, LEAD(s) OVER (ORDER BY s) AS e FROM quern_starts)',
    `SELECT ${s.label('p.s')} AS ${out.period}, ${d.instantOfMs('p.s')} AS ${out.start}, ${d.instantOfMs('p.e')} AS ${out.end},`,
    `  COALESCE(c.n, 0) AS ${out.count}`,
    'FROM quern_periods p CROSS JOIN quern_span sp LEFT JOIN quern_counts c ON c.s = p.s',
    'WHERE p.s >= sp.lo AND p.s <= sp.hi',
    'ORDER BY p.s',
  ].join('\n');
}
