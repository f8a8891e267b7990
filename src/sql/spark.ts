// Spark SQL spelling of the core primitives (Spark 3.1+), written from the Spark SQL built-in function
// reference; not run by quern's tests. Spark's TIMESTAMP is an instant shown in the session zone, and
// from_utc_timestamp(ts, 'Zone') shifts it so that, read as UTC, it shows the zone's wall clock; unix_millis
// of that shifted value is the wall-clock milliseconds, independent of spark.sql.session.timeZone. Because
// year(), to_date() and date_trunc() on a TIMESTAMP read the session zone, the emitted SQL never applies them
// to timestamps: it works on day numbers and DATEs only (date_from_unix_date, unix_date). Integer division
// is `DIV`. Week-years: EXTRACT(YEAROFWEEK) and weekofyear() follow ISO 8601; epi weeks use day arithmetic.
// Identifiers are quoted with backticks; string literals that hold a backslash are written as hex bytes,
// because Spark reads backslash escapes inside '…'. keySeries uses sequence(), which has no length cap.
import type { Dialect } from './dialect.js';
import { quoteName, quoteString } from './quote.js';

export const spark: Dialect = {
  name: 'spark',
  ident: (name) => quoteName(name, 'spark'),
  str: (text) => quoteString(text, 'spark'),
  big: (n) => `CAST(${n} AS BIGINT)`,
  quot: (a, b) => `(${a} DIV ${b})`,
  rem: (a, b) => `(${a} % ${b})`,
  floorDiv: (a, b) => `CAST(floor(CAST(${a} AS DOUBLE) / ${b}) AS BIGINT)`,
  asInstant: (ts) => `CAST(${ts} AS TIMESTAMP)`,
  instantMs: (ts) => `unix_millis(${ts})`,
  wallMsIana: (ts, zone) => `unix_millis(from_utc_timestamp(${ts}, ${zone}))`,
  instantOfMs: (ms) => `timestamp_millis(${ms})`,
  dateOfDays: (days) => `date_from_unix_date(CAST(${days} AS INT))`,
  year: (d) => `CAST(year(${d}) AS BIGINT)`,
  month: (d) => `CAST(month(${d}) AS BIGINT)`,
  dayOfMonth: (d) => `CAST(dayofmonth(${d}) AS BIGINT)`,
  dayOfYear: (d) => `CAST(dayofyear(${d}) AS BIGINT)`,
  isoWeekYear: (d) => `CAST(EXTRACT(YEAROFWEEK FROM ${d}) AS BIGINT)`,
  isoWeek: (d) => `CAST(weekofyear(${d}) AS BIGINT)`,
  monthStartDays: (mi) =>
    `CAST(unix_date(make_date(CAST((${mi}) DIV 12 AS INT), CAST((${mi}) % 12 + 1 AS INT), 1)) AS BIGINT)`,
  text: (x) => `CAST(${x} AS STRING)`,
  dateText: (d) => `CAST(${d} AS STRING)`,
  keySeries: (span, lo, hi) => `SELECT explode(sequence(${lo}, ${hi})) AS k FROM ${span}`,
  bind: (value, name, body) => `transform(array(${value}), ${name} -> ${body})[0]`,
  instantType: 'TIMESTAMP',
  notes: [
    'Spark SQL 3.1+: zones come from the JVM tz database; the result does not depend on spark.sql.session.timeZone.',
    'The column must be TIMESTAMP (an instant in Spark); a TIMESTAMP_NTZ is read in the session zone by the cast.',
  ],
};
