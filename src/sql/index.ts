// Public surface of the SQL compiler: quern's calendar periods and bucket schemes as SQL for DuckDB,
// PostgreSQL, Spark SQL and Trino.
export type { DialectName } from './quote.js';
export { DIALECTS, parseDialect, quoteIdentifier, quoteName, quoteString, numberLiteral, checkRawExpression } from './quote.js';
export type { PeriodSqlOptions, PeriodSql } from './period.js';
export { periodSql, commentBlock } from './period.js';
export type { RebinQueryOptions } from './rebin.js';
export { rebinQuerySql } from './rebin.js';
export type { BucketCaseSql, ColumnRef } from './bucket.js';
export { bucketCaseSql, bucketQuerySql } from './bucket.js';
export { DIALECT_DIFFERENCES } from './differences.js';
export type { DialectDifference } from './differences.js';
