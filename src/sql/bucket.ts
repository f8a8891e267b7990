// bucketCaseSql: a bucket scheme (the spec file of `quern bucket --spec-out`) as SQL CASE expressions that
// give each value the same label and order index as quern's bucketer: the same closed and open ends, open
// below where `low` is null and open above where `high` is null, NULL for a value in no range (below, above
// or in a hole) and for NULL, NaN or an infinite value, which quern does not bucket either. Labels are
// always string literals (src/sql/quote.ts); bounds are plain decimals.
import { bucketsFromSpec, type BucketSet } from '../bins/index.js';
import { QuernError } from '../errors.js';
import { dialectOf } from './dialects.js';
import { commentBlock, columnSql } from './period.js';
import { numberLiteral, type DialectName } from './quote.js';

/** The CASE expressions of a bucket scheme over one column. */
export interface BucketCaseSql {
  /** The bucket's label (text), NULL outside every bucket. */
  label: string;
  /** The bucket's order index (integer), NULL outside every bucket. */
  index: string;
  /** The value expression used (quoted column or checked raw expression). */
  value: string;
}

/** A column name (quoted as an identifier) or a trusted raw expression. */
export type ColumnRef = string | { expr: string };

function finiteGuard(dialect: DialectName, v: string): string {
  switch (dialect) {
    case 'duckdb': return `NOT isfinite(CAST(${v} AS DOUBLE))`;
    case 'postgres': return `CAST(${v} AS DOUBLE PRECISION) IN ('NaN'::float8, 'Infinity'::float8, '-Infinity'::float8)`;
    case 'spark': return `(isnan(CAST(${v} AS DOUBLE)) OR abs(CAST(${v} AS DOUBLE)) = CAST('Infinity' AS DOUBLE))`;
    default: return `NOT is_finite(CAST(${v} AS DOUBLE))`;
  }
}

function conditionOf(v: string, r: BucketSet['buckets'][number]['range']): string {
  const parts: string[] = [];
  if (r.low !== null) parts.push(`${v} ${r.lowClosed ? '>=' : '>'} ${numberLiteral(r.low)}`);
  if (r.high !== null) parts.push(`${v} ${r.highClosed ? '<=' : '<'} ${numberLiteral(r.high)}`);
  return parts.length === 0 ? 'TRUE' : parts.join(' AND ');
}

function readSet(spec: unknown): BucketSet {
  const set = bucketsFromSpec(spec); // throws QuernError E_VALUE for a malformed spec
  if (set.buckets.length === 0) throw new QuernError('E_VALUE', 'bucket spec: no ranges', 'write one with quern bucket --spec-out FILE');
  return set;
}

/**
 * The label and order index of each value of `column` under a bucket spec, as two CASE expressions of
 * `dialect`. `column` is a name (quoted as an identifier) or `{ expr }`, a trusted raw expression.
 */
export function bucketCaseSql(spec: unknown, column: ColumnRef, dialect: DialectName): BucketCaseSql {
  const set = readSet(spec);
  const d = dialectOf(dialect);
  const v = columnSql(typeof column === 'string' ? { column } : { columnExpr: column.expr }, d);
  const guard = `WHEN ${v} IS NULL OR ${finiteGuard(dialect, v)} THEN NULL`;
  const whens = (value: (b: BucketSet['buckets'][number]) => string): string =>
    set.buckets.map((b) => `  WHEN ${conditionOf(v, b.range)} THEN ${value(b)}`).join('\n');
  return {
    label: `CASE ${guard}\n${whens((b) => d.str(b.label))}\nEND`,
    index: `CASE ${guard}\n${whens((b) => String(b.index))}\nEND`,
    value: v,
  };
}

/**
 * A complete SELECT counting the rows of `table` per bucket, every bucket listed in order (count 0 where
 * empty), plus one row with a NULL bucket for the rows in none; columns `bucket`, `index`, `count`.
 */
export function bucketQuerySql(spec: unknown, column: ColumnRef, dialect: DialectName, table: string): string {
  const set = readSet(spec);
  const d = dialectOf(dialect);
  const c = bucketCaseSql(spec, column, dialect);
  const rows = set.buckets.map((b) => `SELECT ${b.index} AS idx, ${d.str(b.label)} AS label`).join('\n  UNION ALL ');
  const q = (n: string): string => d.ident(n);
  return [
    commentBlock([`quern sql: rows of a table counted per bucket of the scheme "${set.source}" (${set.closed}-closed${set.discrete ? ', whole numbers' : ''}).`,
      'Rows in no bucket (below, above, in a hole, NULL or not finite) are counted on the last line with a NULL bucket.']),
    `WITH quern_buckets AS (\n  ${rows}\n),`,
    `quern_rows AS (SELECT ${c.index.replace(/\n/g, '\n    ')} AS idx FROM ${d.ident(table)}),`,
    'quern_counts AS (SELECT idx, COUNT(*) AS n FROM quern_rows GROUP BY idx)',
    `SELECT b.label AS ${q('bucket')}, b.idx AS ${q('index')}, COALESCE(c.n, 0) AS ${q('count')}`,
    'FROM quern_buckets b LEFT JOIN quern_counts c ON c.idx = b.idx',
    'UNION ALL',
    'SELECT NULL, NULL, n FROM quern_counts WHERE idx IS NULL',
    `ORDER BY ${q('index')} NULLS LAST`,
  ].join('\n');
}
