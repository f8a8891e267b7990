// Test helper: an embedded DuckDB and an in-process PostgreSQL (PGlite), loaded with event tables, and
// runners that return every result as plain rows { period, start, end, count } with instants in epoch ms.
import { DuckDBInstance, type DuckDBConnection } from '@duckdb/node-api';
import { PGlite } from '@electric-sql/pglite';

export interface ResultRow {
  period: string;
  start: number;
  end: number;
  count: number;
}

export interface Engines {
  duck: DuckDBConnection;
  pg: PGlite;
  close(): Promise<void>;
}

/** Opens both engines; the session zone is set away from UTC so nothing depends on it. */
export async function openEngines(): Promise<Engines> {
  const instance = await DuckDBInstance.create(':memory:');
  const duck = await instance.connect();
  await duck.run("SET TimeZone = 'Pacific/Chatham'");
  const pg = await PGlite.create();
  await pg.exec("SET TIME ZONE 'Pacific/Chatham'");
  return {
    duck,
    pg,
    async close() {
      duck.closeSync();
      instance.closeSync();
      await pg.close();
    },
  };
}

/** Creates table `name` with one TIMESTAMPTZ column `ts` holding the instants `ms` in both engines. */
export async function loadEvents(e: Engines, name: string, ms: readonly number[]): Promise<void> {
  const list = ms.length === 0 ? '' : ms.map((v) => String(v)).join(',');
  await e.duck.run(`DROP TABLE IF EXISTS ${name}`);
  await e.duck.run(ms.length === 0
    ? `CREATE TABLE ${name} (ts TIMESTAMPTZ)`
    : `CREATE TABLE ${name} AS SELECT make_timestamptz(CAST(v AS BIGINT) * 1000) AS ts FROM unnest([${list}]) t(v)`);
  await e.pg.exec(`DROP TABLE IF EXISTS ${name}`);
  await e.pg.exec(ms.length === 0
    ? `CREATE TABLE ${name} (ts timestamptz)`
    : `CREATE TABLE ${name} AS SELECT TIMESTAMPTZ 'epoch' + v * INTERVAL '1 millisecond' AS ts FROM unnest(ARRAY[${list}]::bigint[]) AS t(v)`);
}

function msOfDuck(v: unknown): number {
  if (v === null) return NaN;
  const micros = (v as { micros: bigint }).micros;
  return Number(micros / 1000n);
}

/** Runs a rebin query in DuckDB. */
export async function runDuck(e: Engines, sql: string): Promise<ResultRow[]> {
  const reader = await e.duck.runAndReadAll(sql);
  return reader.getRows().map((r) => ({ period: String(r[0]), start: msOfDuck(r[1]), end: msOfDuck(r[2]), count: Number(r[3]) }));
}

/** Runs a rebin query in PGlite. */
export async function runPg(e: Engines, sql: string): Promise<ResultRow[]> {
  const res = await e.pg.query<unknown[]>(sql, [], { rowMode: 'array' });
  return res.rows.map((r) => ({ period: String(r[0]), start: (r[1] as Date).getTime(), end: (r[2] as Date).getTime(), count: Number(r[3]) }));
}

/** Runs `SELECT label, start, end` expressions over table rows in both engines: rows in ts order, instants in ms. */
export async function runExpressions(e: Engines, which: 'duck' | 'pg', sql: string): Promise<Array<{ ts: number; period: string; start: number; end: number }>> {
  if (which === 'duck') {
    const reader = await e.duck.runAndReadAll(sql);
    return reader.getRows().map((r) => ({ ts: msOfDuck(r[0]), period: String(r[1]), start: msOfDuck(r[2]), end: msOfDuck(r[3]) }));
  }
  const res = await e.pg.query<unknown[]>(sql, [], { rowMode: 'array' });
  return res.rows.map((r) => ({ ts: (r[0] as Date).getTime(), period: String(r[1]), start: (r[2] as Date).getTime(), end: (r[3] as Date).getTime() }));
}

export { seeded } from '../helpers/seeded.js';
