// Trino spelling of the core primitives, written from the Trino function reference; not run by quern's
// tests. `ts AT TIME ZONE 'Zone'` keeps the instant and changes the zone; CAST(… AS TIMESTAMP) then keeps
// the wall clock, and date_diff('millisecond', TIMESTAMP '1970-01-01 00:00:00', wall) counts it exactly
// (to_unixtime returns DOUBLE, so it is avoided). Integer `/` truncates. Trino has no make_date, so a month
// start is date_add('month', …) from 1970-01. Week-years: year_of_week() and week_of_year() follow ISO 8601;
// epi weeks use day arithmetic. sequence() returns at most 10,000 elements, so keySeries crosses two.
import type { Dialect } from './dialect.js';
import { quoteName, quoteString } from './quote.js';

export const trino: Dialect = {
  name: 'trino',
  ident: (name) => quoteName(name, 'trino'),
  str: (text) => quoteString(text, 'trino'),
  big: (n) => `CAST(${n} AS BIGINT)`,
  quot: (a, b) => `(${a} / ${b})`,
  rem: (a, b) => `(${a} % ${b})`,
  floorDiv: (a, b) => `CAST(floor(CAST(${a} AS DOUBLE) / ${b}) AS BIGINT)`,
  asInstant: (ts) => `CAST(${ts} AS TIMESTAMP(3) WITH TIME ZONE)`,
  instantMs: (ts) => `date_diff('millisecond', TIMESTAMP '1970-01-01 00:00:00 UTC', ${ts})`,
  wallMsIana: (ts, zone) =>
    `date_diff('millisecond', TIMESTAMP '1970-01-01 00:00:00', CAST(${ts} AT TIME ZONE ${zone} AS TIMESTAMP(3)))`,
  instantOfMs: (ms) => `date_add('millisecond', ${ms}, TIMESTAMP '1970-01-01 00:00:00.000 UTC')`,
  dateOfDays: (days) => `date_add('day', ${days}, DATE '1970-01-01')`,
  year: (d) => `year(${d})`,
  month: (d) => `month(${d})`,
  dayOfMonth: (d) => `day(${d})`,
  dayOfYear: (d) => `day_of_year(${d})`,
  isoWeekYear: (d) => `year_of_week(${d})`,
  isoWeek: (d) => `week_of_year(${d})`,
  monthStartDays: (mi) => `date_diff('day', DATE '1970-01-01', date_add('month', (${mi}) - 23640, DATE '1970-01-01'))`,
  text: (x) => `CAST(${x} AS VARCHAR)`,
  dateText: (d) => `CAST(${d} AS VARCHAR)`,
  keySeries: (span, lo, hi) => `SELECT ${lo} + hi_part * 10000 + lo_part AS k FROM ${span} ` +
    `CROSS JOIN UNNEST(sequence(0, (${hi} - ${lo}) / 10000)) AS a (hi_part) ` +
    `CROSS JOIN UNNEST(sequence(0, 9999)) AS b (lo_part) WHERE ${lo} + hi_part * 10000 + lo_part <= ${hi}`,
  bind: (value, name, body) => `transform(ARRAY[${value}], ${name} -> ${body})[1]`,
  instantType: 'TIMESTAMP WITH TIME ZONE',
  notes: [
    'Trino: zones come from the JVM tz database.',
    'The column must be TIMESTAMP WITH TIME ZONE; a TIMESTAMP is read in the session zone by the cast.',
  ],
};
