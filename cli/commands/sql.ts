// `quern sql`: quern's calendar periods and bucket schemes compiled into SQL for DuckDB, PostgreSQL, Spark SQL
// and Trino. Options → PeriodSqlOptions / bucket spec → periodSql(), rebinQuerySql(), bucketCaseSql() → text.
import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { Command, Option } from 'commander';
import {
  QuernError, bucketCaseSql, bucketQuerySql, commentBlock, lookupPeriod, parseDialect, parseFiscalStart, parseUnitName, parseStep,
  parseWeekStart, periodSql, rebinQuerySql,
} from '../../src/index.js';
import type { ColumnRef, DialectName, RebinQueryOptions } from '../../src/index.js';
import type { CommandContext } from '../program.js';

const EXAMPLES = `
Examples (the demo table of the invented Harrowmere District Health Service, zone America/Chicago):
  Epidemiological weeks of visits as a DuckDB query, piped into the DuckDB shell:
    quern sql --unit epi-week --zone America/Chicago --column visit_time --table visits --dialect duckdb --query | duckdb clinic.db
  US federal fiscal quarters (from 1 October) as PostgreSQL expressions for your own SELECT:
    quern sql --unit fiscal-quarter --fiscal-start 10 --zone America/Chicago --column visit_time --dialect postgres
  15-minute slots in Kathmandu (+05:45) for Trino, for the periods holding two instants:
    quern sql --unit minute --step 15 --zone Asia/Kathmandu --column events.recorded_at --table events --dialect trino --from 2024-03-01 --until 2024-03-31 --query
  Age bands saved by quern bucket --spec-out, as a Spark SQL CASE:
    quern sql --spec age-bands.json --column patient_age --dialect spark

Output: without --query, the label, start and end expressions (and, with --table, the complete query);
with --query, the query alone. The query returns period, start, end, count in period order, every period
from the first to the last (or --from/--until) listed, empty ones with count 0.

Safety: --column and --table take a name or a dotted name (schema.table, t.visit_time); each part is quoted
as an identifier, so a name can never run as SQL. --column-expr takes a trusted raw SQL expression instead
(checked only for ';', comments and unbalanced quotes or parentheses). Labels and zone names are always
string literals. The column must hold instants: timestamptz (PostgreSQL), TIMESTAMPTZ (DuckDB), TIMESTAMP
(Spark), TIMESTAMP WITH TIME ZONE (Trino). DuckDB needs its ICU extension (built in to the standard builds).

Rules: the same as quern's calendar. Periods are half-open, [start, end); a period starts at the first
instant of its first date (01:00 where midnight is skipped; the earlier midnight where it repeats). ISO
weeks use the engine's ISO week-year functions; epidemiological weeks, which no engine has, use day
arithmetic. DuckDB and PostgreSQL are tested against quern; Spark SQL and Trino are written from their
function references and not tested by quern.

Caution: ISO weeks start on Monday and epidemiological (CDC MMWR) weeks on Sunday; other authorities
number weeks and name fiscal years differently. Confirm against your reporting authority's calendar.
`;

interface SqlFlags {
  unit?: string; step?: string; zone?: string; weekStart?: string; fiscalStart?: string; fiscalLabel?: 'end' | 'start';
  origin?: string; column?: string; columnExpr?: string; dialect?: string; table?: string; query?: boolean;
  from?: string; until?: string; spec?: string;
}

export function registerSql(program: Command, ctx: CommandContext): void {
  program
    .command('sql')
    .description('Compile calendar periods (rebin) and bucket schemes into SQL for DuckDB, PostgreSQL, Spark SQL or Trino')
    .option('--unit <unit>', 'day, week, iso-week, epi-week, month, quarter, half, year, fiscal-year, fiscal-quarter, fiscal-month, hour, minute, second, millisecond')
    .option('--step <n>', 'periods of n units (15 with --unit minute)')
    .option('--zone <zone>', 'IANA zone or offset (default UTC)')
    .option('--week-start <day>', 'first day of --unit week (monday … sunday; default monday)')
    .option('--fiscal-start <month[-day]>', 'first day of the fiscal year: 10 (1 October, default), 04-06, 07-01')
    .addOption(new Option('--fiscal-label <end|start>', 'name fiscal years by the year they end (default) or start').choices(['end', 'start']))
    .option('--origin <time>', 'count steps from the period holding this date or date-time')
    .option('--column <name>', 'the timestamp (or, with --spec, numeric) column: a name or dotted name, quoted as an identifier')
    .option('--column-expr <sql>', 'a trusted raw SQL expression instead of --column')
    .option('--dialect <name>', 'duckdb, postgres, spark or trino')
    .option('--table <name>', 'the table to rebin or bucket: a name or dotted name, quoted as an identifier')
    .option('--query', 'print the complete query alone (needs --table)')
    .option('--from <time>', 'first period: the one holding this date, date-time or label (query only)')
    .option('--until <time>', 'last period: the one holding this date, date-time or label (query only)')
    .option('--spec <file>', 'a bucket spec written by quern bucket --spec-out: compile it into a CASE')
    .addHelpText('after', EXAMPLES)
    .action(async (flags: SqlFlags) => {
      const dialect = requireDialect(flags);
      const text = flags.spec !== undefined ? await specText(flags, dialect, ctx) : periodText(flags, dialect);
      ctx.io.stdout.write(text);
    });
}

function requireDialect(f: SqlFlags): DialectName {
  if (f.dialect === undefined) throw new QuernError('E_USAGE', 'no --dialect given', 'use --dialect duckdb, postgres, spark or trino');
  if (f.column === undefined && f.columnExpr === undefined) {
    throw new QuernError('E_USAGE', 'no --column given', 'name the column with --column (or give a trusted expression with --column-expr)');
  }
  if (f.query && f.table === undefined) throw new QuernError('E_USAGE', '--query needs --table', 'name the table to query with --table');
  return parseDialect(f.dialect);
}

function instantOf(text: string, zone: string | undefined): number {
  return lookupPeriod(text, { unit: 'millisecond', zone: zone ?? 'UTC' }).startMs;
}

function rebinOptions(f: SqlFlags, dialect: DialectName): Omit<RebinQueryOptions, 'table'> {
  if (f.unit === undefined) throw new QuernError('E_USAGE', 'no --unit given', 'use --unit epi-week, month, fiscal-quarter, … (or --spec FILE for a bucket scheme)');
  const o: Omit<RebinQueryOptions, 'table'> = { unit: parseUnitName(f.unit), dialect };
  if (f.step !== undefined) o.step = parseStep(f.step);
  if (f.zone !== undefined) o.zone = f.zone;
  if (f.weekStart !== undefined) {
    if (o.unit !== 'week') throw new QuernError('E_UNIT', `--week-start does not apply to ${o.unit}`, 'ISO weeks start on Monday and epidemiological weeks on Sunday; use --unit week for another start day');
    o.weekStart = parseWeekStart(f.weekStart);
  }
  if (f.fiscalStart !== undefined) o.fiscalStart = parseFiscalStart(f.fiscalStart);
  if (f.fiscalLabel !== undefined) o.fiscalLabel = f.fiscalLabel;
  if (f.origin !== undefined) o.origin = instantOf(f.origin, f.zone);
  if (f.from !== undefined) o.from = instantOf(f.from, f.zone);
  if (f.until !== undefined) o.until = instantOf(f.until, f.zone);
  if (f.column !== undefined) o.column = f.column;
  if (f.columnExpr !== undefined) o.columnExpr = f.columnExpr;
  return o;
}

function periodText(f: SqlFlags, dialect: DialectName): string {
  const o = rebinOptions(f, dialect);
  const query = f.table === undefined ? null : `${rebinQuerySql({ ...o, table: f.table })};\n`;
  if (f.query) return query!;
  if (f.from !== undefined || f.until !== undefined) {
    if (query === null) throw new QuernError('E_USAGE', '--from and --until apply to the query', 'add --table NAME');
  }
  const p = periodSql(o);
  const parts = [
    commentBlock([`quern sql: ${o.step && o.step > 1 ? `${o.step}-` : ''}${o.unit} periods in ${o.zone ?? 'UTC'} for ${dialect}.`, ...p.notes]),
    '', '-- period label (text)', `${p.label}`,
    '', '-- period start (first instant)', `${p.start}`,
    '', '-- period end (exclusive)', `${p.end}`, '',
  ];
  if (query !== null) parts.push('-- rebin query', query);
  return `${parts.join('\n')}${query === null ? '' : ''}`;
}

async function specText(f: SqlFlags, dialect: DialectName, ctx: CommandContext): Promise<string> {
  if (f.unit !== undefined) throw new QuernError('E_USAGE', '--spec and --unit do not go together', 'compile either a bucket spec or a calendar unit');
  let raw: string;
  try {
    raw = await readFile(resolve(ctx.io.cwd, f.spec!), 'utf8');
  } catch (e) {
    throw new QuernError('E_FILE', `cannot read the spec file ${f.spec}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`, 'write one with quern bucket --spec-out FILE');
  }
  let spec: unknown;
  try {
    spec = JSON.parse(raw);
  } catch {
    throw new QuernError('E_VALUE', `the spec file ${f.spec} is not JSON`, 'write one with quern bucket --spec-out FILE');
  }
  const column: ColumnRef = f.columnExpr !== undefined ? { expr: f.columnExpr } : f.column!;
  if (f.columnExpr !== undefined && f.column !== undefined) {
    throw new QuernError('E_USAGE', 'both a column and a column expression were given', 'use --column or --column-expr, not both');
  }
  const query = f.table === undefined ? null : `${bucketQuerySql(spec, column, dialect, f.table)};\n`;
  if (f.query) return query!;
  const c = bucketCaseSql(spec, column, dialect);
  const parts = [
    commentBlock([`quern sql: bucket scheme of ${f.spec} for ${dialect}; NULL outside every range and for NULL, NaN or infinite values.`]),
    '', '-- bucket label (text)', c.label, '', '-- bucket order index (integer; sort by it, not by the label)', c.index, '',
  ];
  if (query !== null) parts.push('-- count query', query);
  return parts.join('\n');
}
