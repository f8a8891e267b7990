// PostgreSQL spelling of the core primitives (PostgreSQL 12+; tested on PostgreSQL 18 through PGlite).
// `timestamptz AT TIME ZONE 'Zone'` gives the wall clock as a timestamp, and EXTRACT(EPOCH FROM timestamp)
// reads it "without regard to timezone" (PostgreSQL docs, 9.9.1), so the pair is wall-clock seconds. EXTRACT
// returns numeric, so every field is cast to BIGINT before integer arithmetic. Week-years: EXTRACT(ISOYEAR)
// and EXTRACT(WEEK) follow ISO 8601; no epidemiological helper exists, so epi weeks come from day
// arithmetic. Dates are formatted with to_char so the session's DateStyle cannot change a label.
import type { Dialect } from './dialect.js';
import { quoteName, quoteString } from './quote.js';

const field = (f: string, d: string): string => `CAST(EXTRACT(${f} FROM ${d}) AS BIGINT)`;

export const postgres: Dialect = {
  name: 'postgres',
  ident: (name) => quoteName(name, 'postgres'),
  str: (text) => quoteString(text, 'postgres'),
  big: (n) => `CAST(${n} AS BIGINT)`,
  quot: (a, b) => `(${a} / ${b})`,
  rem: (a, b) => `(${a} % ${b})`,
  floorDiv: (a, b) => `CAST(floor(CAST(${a} AS DOUBLE PRECISION) / ${b}) AS BIGINT)`,
  asInstant: (ts) => `CAST(${ts} AS timestamptz)`,
  instantMs: (ts) => `CAST(floor(EXTRACT(EPOCH FROM ${ts}) * 1000) AS BIGINT)`,
  wallMsIana: (ts, zone) => `CAST(floor(EXTRACT(EPOCH FROM (${ts} AT TIME ZONE ${zone})) * 1000) AS BIGINT)`,
  instantOfMs: (ms) => `(TIMESTAMPTZ 'epoch' + ${ms} * INTERVAL '1 millisecond')`,
  dateOfDays: (days) => `(DATE '1970-01-01' + CAST(${days} AS INTEGER))`,
  year: (d) => field('YEAR', d),
  month: (d) => field('MONTH', d),
  dayOfMonth: (d) => field('DAY', d),
  dayOfYear: (d) => field('DOY', d),
  isoWeekYear: (d) => field('ISOYEAR', d),
  isoWeek: (d) => field('WEEK', d),
  monthStartDays: (mi) =>
    `CAST(make_date(CAST((${mi}) / 12 AS INTEGER), CAST((${mi}) % 12 + 1 AS INTEGER), 1) - DATE '1970-01-01' AS BIGINT)`,
  text: (x) => `CAST(${x} AS TEXT)`,
  dateText: (d) => `to_char(${d}, 'YYYY-MM-DD')`,
  keySeries: (span, lo, hi) => `SELECT generate_series(${lo}, ${hi}) AS k FROM ${span}`,
  // OFFSET 0 keeps the planner from pulling the subquery up, which would copy `value` into every use again.
  bind: (value, name, body) => `(SELECT ${body} FROM (SELECT ${value} AS ${name} OFFSET 0) AS ${name}_q)`,
  instantType: 'timestamptz',
  notes: [
    'PostgreSQL: zones come from the server\'s tz database (pg_timezone_names).',
    'The column must be timestamptz (an instant); a timestamp would be read as wall-clock time instead.',
  ],
};
