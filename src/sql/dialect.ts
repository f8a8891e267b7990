// The primitives every dialect provides. quern's calendar is compiled onto a small common core: instants
// become epoch milliseconds, a zone turns an instant into wall-clock milliseconds (the epoch ms the same
// reading would have in UTC), and every calendar rule is integer arithmetic on those numbers plus a few
// date functions. Each dialect only says how to spell the core; nothing else differs between engines.
import type { DialectName } from './quote.js';

/** A zone as the emitted SQL needs it: an IANA name read by the engine, or a fixed offset in ms. */
export type SqlZone = { kind: 'iana'; name: string } | { kind: 'fixed'; offsetMs: number };

/** How one engine spells the core operations; every argument and result is an SQL expression text. */
export interface Dialect {
  readonly name: DialectName;
  /** Quotes a (dotted) identifier. */
  ident(name: string): string;
  /** A string literal. */
  str(text: string): string;
  /** An exact BIGINT literal. */
  big(n: number): string;
  /** Quotient of BIGINT `a` by BIGINT `b`, truncated toward zero (exact where `b` divides `a`). */
  quot(a: string, b: string): string;
  /** Remainder of BIGINT `a` by `b` with the sign of `a` (SQL `%`). */
  rem(a: string, b: string): string;
  /** Floor of BIGINT `a` over a positive constant `b` (exact through DOUBLE for |a| < 2^52). */
  floorDiv(a: string, b: string): string;
  /** The user's column as the engine's instant type (a no-op for a column of that type). */
  asInstant(ts: string): string;
  /** Epoch milliseconds (BIGINT, floored) of an instant (a timestamp with time zone). */
  instantMs(ts: string): string;
  /** Wall-clock milliseconds (BIGINT) of an instant in an IANA zone, through the engine's tz database. */
  wallMsIana(ts: string, zone: string): string;
  /** The instant (timestamp with time zone) of epoch milliseconds `ms`. */
  instantOfMs(ms: string): string;
  /** The DATE of day number `days` (days since 1970-01-01). */
  dateOfDays(days: string): string;
  /** Calendar fields of a DATE as BIGINT. */
  year(d: string): string;
  month(d: string): string;
  dayOfMonth(d: string): string;
  dayOfYear(d: string): string;
  /** ISO 8601 week-year and week number of a DATE, through the engine's own helper. */
  isoWeekYear(d: string): string;
  isoWeek(d: string): string;
  /** Day number of the first day of month index `mi` (year × 12 + month − 1). */
  monthStartDays(mi: string): string;
  /** A BIGINT as text. */
  text(x: string): string;
  /** A DATE as 'YYYY-MM-DD', whatever the session's date style. */
  dateText(d: string): string;
  /** A SELECT giving one row per integer `k` from `lo` to `hi`, columns of the one-row relation `span`. */
  keySeries(span: string, lo: string, hi: string): string;
  /**
   * `body` with `name` bound to `value`, evaluating `value` once: a lambda over a one-element array where the
   * engine has lambdas (DuckDB, Spark, Trino), a scalar subquery otherwise (PostgreSQL).
   */
  bind(value: string, name: string, body: string): string;
  /** The SQL type name of a timestamp with time zone (for documentation and casts). */
  readonly instantType: string;
  /** Lines for the comment block at the head of emitted SQL (how this engine reads zones and weeks). */
  readonly notes: readonly string[];
}

/** Binds a value to a fresh name for the body built from it (see Dialect.bind). */
export type Binder = (value: string, body: (ref: string) => string) => string;

/** A binder of dialect `d` with names quern_v1, quern_v2, … unique within one expression. */
export function makeBinder(d: Dialect): Binder {
  let n = 0;
  return (value, body) => {
    n++;
    const name = `quern_v${n}`;
    return d.bind(value, name, body(name));
  };
}

/** A binder that writes the value in place (for values that are already column names). */
export const inlineBinder: Binder = (value, body) => body(value);

/** Notes shared by all dialects for emitted SQL. */
export const COMMON_NOTES = [
  'Instants are compared as epoch milliseconds; periods are half-open [start, end).',
  'Local rule: a period starts at the first instant of its wall-clock start; a repeated reading takes the earlier',
  'instant; a reading skipped by a daylight-saving gap moves forward by the gap (tested against quern).',
];
