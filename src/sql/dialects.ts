// The dialect table.
import type { Dialect } from './dialect.js';
import type { DialectName } from './quote.js';
import { duckdb } from './duckdb.js';
import { postgres } from './postgres.js';
import { spark } from './spark.js';
import { trino } from './trino.js';

const TABLE: Record<DialectName, Dialect> = { duckdb, postgres, spark, trino };

/** The primitives of dialect `name`. */
export function dialectOf(name: DialectName): Dialect {
  return TABLE[name];
}
