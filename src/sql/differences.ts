// How the four dialects differ where quern's calendar touches them, for help texts and the README.
import type { DialectName } from './quote.js';

/** One row of the dialect table. */
export interface DialectDifference {
  dialect: DialectName;
  /** Instant → wall clock in an IANA zone. */
  zone: string;
  /** ISO week-year and week number. */
  isoWeek: string;
  /** Epidemiological (CDC MMWR) week. */
  epiWeek: string;
  /** Integer division and day numbers (quern never truncates timestamps with date_trunc; see below). */
  arithmetic: string;
  /** What the engine's own date_trunc would do with a zoned timestamp (quern does not use it). */
  truncation: string;
  /** The period series for zero-filling. */
  series: string;
  /** Tested by quern against a real engine. */
  tested: boolean;
}

/**
 * Why no date_trunc: date_trunc on a zoned timestamp truncates in the session zone (DuckDB ICU, PostgreSQL
 * timestamptz, Spark) and cannot express fiscal starts, week starts other than Monday, steps or quern's
 * first-instant rule, so every dialect works on wall-clock milliseconds and day numbers instead.
 */
export const DIALECT_DIFFERENCES: readonly DialectDifference[] = [
  {
    dialect: 'duckdb', zone: "ts AT TIME ZONE 'Zone' (ICU extension, built into the standard builds), epoch_ms()",
    isoWeek: 'isoyear(), weekofyear()', epiWeek: 'day arithmetic (no helper)', arithmetic: '`//` (`/` is DOUBLE), date + INTEGER',
    truncation: 'date_trunc on TIMESTAMPTZ truncates in the session TimeZone (ICU)',
    series: 'unnest(generate_series(lo, hi))', tested: true,
  },
  {
    dialect: 'postgres', zone: "ts AT TIME ZONE 'Zone', EXTRACT(EPOCH FROM timestamp) (numeric)",
    isoWeek: 'EXTRACT(ISOYEAR), EXTRACT(WEEK)', epiWeek: 'day arithmetic (no helper)', arithmetic: 'integer `/`, date + integer, to_char for dates',
    truncation: "date_trunc(f, timestamptz) uses the session TimeZone; date_trunc(f, ts, 'Zone') since PostgreSQL 12",
    series: 'generate_series(lo, hi)', tested: true,
  },
  {
    dialect: 'spark', zone: "from_utc_timestamp(ts, 'Zone') then unix_millis() (session-zone independent)",
    isoWeek: 'EXTRACT(YEAROFWEEK), weekofyear()', epiWeek: 'day arithmetic (no helper)', arithmetic: '`DIV`, date_from_unix_date(), backtick identifiers, hex literals for backslashes',
    truncation: 'date_trunc(fmt, ts) and to_date(ts) use spark.sql.session.timeZone',
    series: 'explode(sequence(lo, hi))', tested: false,
  },
  {
    dialect: 'trino', zone: "CAST(ts AT TIME ZONE 'Zone' AS TIMESTAMP), date_diff('millisecond', …)",
    isoWeek: 'year_of_week(), week_of_year()', epiWeek: 'day arithmetic (no helper)', arithmetic: 'integer `/`, date_add(\'day\'), no make_date (date_add(\'month\'))',
    truncation: "date_trunc on TIMESTAMP WITH TIME ZONE truncates in the value's own zone",
    series: 'two sequence() of ≤ 10,000 crossed', tested: false,
  },
];
