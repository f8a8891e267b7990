// DuckDB spelling of the core primitives (DuckDB 1.x with its ICU extension, which the npm package and the
// standard builds load by default). `timestamptz AT TIME ZONE 'Zone'` gives the wall clock as a TIMESTAMP;
// epoch_ms of a TIMESTAMP reads it as if it were UTC, so the pair is wall-clock milliseconds. Integer
// division is `//` (`/` divides as DOUBLE). Week-years: isoyear() and weekofyear() follow ISO 8601; no
// epidemiological helper exists, so epi weeks come from day arithmetic (see period SQL).
import type { Dialect } from './dialect.js';
import { quoteName, quoteString } from './quote.js';

export const duckdb: Dialect = {
  name: 'duckdb',
  ident: (name) => quoteName(name, 'duckdb'),
  str: (text) => quoteString(text, 'duckdb'),
  big: (n) => `CAST(${n} AS BIGINT)`,
  quot: (a, b) => `(${a} // ${b})`,
  rem: (a, b) => `(${a} % ${b})`,
  floorDiv: (a, b) => `CAST(floor(CAST(${a} AS DOUBLE) / ${b}) AS BIGINT)`,
  asInstant: (ts) => `CAST(${ts} AS TIMESTAMPTZ)`,
  instantMs: (ts) => `epoch_ms(${ts})`,
  wallMsIana: (ts, zone) => `epoch_ms(${ts} AT TIME ZONE ${zone})`,
  instantOfMs: (ms) => `make_timestamptz(${ms} * 1000)`,
  dateOfDays: (days) => `CAST(DATE '1970-01-01' + CAST(${days} AS INTEGER) AS DATE)`,
  year: (d) => `CAST(year(${d}) AS BIGINT)`,
  month: (d) => `CAST(month(${d}) AS BIGINT)`,
  dayOfMonth: (d) => `CAST(day(${d}) AS BIGINT)`,
  dayOfYear: (d) => `CAST(dayofyear(${d}) AS BIGINT)`,
  isoWeekYear: (d) => `CAST(isoyear(${d}) AS BIGINT)`,
  isoWeek: (d) => `CAST(weekofyear(${d}) AS BIGINT)`,
  monthStartDays: (mi) =>
    `CAST(make_date(CAST((${mi}) // 12 AS BIGINT), CAST((${mi}) % 12 + 1 AS BIGINT), 1) - DATE '1970-01-01' AS BIGINT)`,
  text: (x) => `CAST(${x} AS VARCHAR)`,
  dateText: (d) => `strftime(${d}, '%Y-%m-%d')`,
  keySeries: (span, lo, hi) => `SELECT unnest(generate_series(${lo}, ${hi})) AS k FROM ${span}`,
  bind: (value, name, body) => `list_transform([${value}], ${name} -> ${body})[1]`,
  instantType: 'TIMESTAMPTZ',
  notes: [
    'DuckDB: needs the ICU extension (built into the standard distributions) for AT TIME ZONE with IANA names.',
    'The column must be TIMESTAMPTZ (an instant); a TIMESTAMP would be read as wall-clock time instead.',
  ],
};
