// Injection attempts through the column, the table, a bucket label and the zone must not run in the engines:
// each attempt either fails as an unknown identifier or comes back as plain data, and the victim table keeps
// its row. Both engines run every statement of a multi-statement text (DuckDB runAndReadAll, PGlite exec),
// so a spliced "; DROP TABLE" would take effect if quoting failed (common practice: OWASP SQL Injection
// Prevention Cheat Sheet, "Defense Option 4: escaping" and allow-listed identifiers — from memory).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QuernError } from '../../src/errors.js';
import { bucketCaseSql, bucketQuerySql } from '../../src/sql/bucket.js';
import { periodSql } from '../../src/sql/period.js';
import { rebinQuerySql } from '../../src/sql/rebin.js';
import { openEngines, type Engines } from './engines.js';

let engines: Engines;
beforeAll(async () => {
  engines = await openEngines();
  for (const sql of ['CREATE TABLE victims (v INTEGER)', 'INSERT INTO victims VALUES (1)', 'CREATE TABLE ev (ts TIMESTAMPTZ, age INTEGER)',
    "INSERT INTO ev VALUES ('2024-03-10 12:00:00+00', 4)"]) {
    await engines.duck.run(sql);
    await engines.pg.exec(sql);
  }
}, 120_000);
afterAll(async () => { await engines?.close(); });

async function victimsLeft(): Promise<[number, number]> {
  const d = await engines.duck.runAndReadAll('SELECT count(*) FROM victims');
  const p = await engines.pg.query<{ n: number }>('SELECT count(*)::int AS n FROM victims');
  return [Number(d.getRows()[0]![0]), p.rows[0]!.n];
}

async function runBoth(duckSql: string, pgSql: string): Promise<[unknown, unknown]> {
  let a: unknown, b: unknown;
  try { a = (await engines.duck.runAndReadAll(duckSql)).getRows(); } catch (e) { a = e; }
  try { b = (await engines.pg.exec(pgSql)).map((r) => r.rows); } catch (e) { b = e; }
  return [a, b];
}

const ATTEMPTS = [
  'ts; DROP TABLE victims; --',
  'ts"; DROP TABLE victims; --',
  "ts'); DROP TABLE victims; --",
  'ts" FROM ev; DROP TABLE victims; SELECT "x',
];

describe('quoted identifiers', () => {
  it.each(ATTEMPTS)('periodSql with column %j fails as an unknown column and drops nothing', async (column) => {
    const d = periodSql({ unit: 'day', zone: 'America/New_York', column, dialect: 'duckdb' });
    const p = periodSql({ unit: 'day', zone: 'America/New_York', column, dialect: 'postgres' });
    const [a, b] = await runBoth(`SELECT ${d.label} FROM ev`, `SELECT ${p.label} FROM ev`);
    expect(a).toBeInstanceOf(Error);
    expect(String((a as Error).message)).toMatch(/not found|does not exist|Referenced column/i);
    expect(b).toBeInstanceOf(Error);
    expect(String((b as Error).message)).toMatch(/does not exist/);
    expect(await victimsLeft()).toEqual([1, 1]);
  });

  it.each(ATTEMPTS)('rebinQuerySql with table %j fails as an unknown table and drops nothing', async (table) => {
    const [a, b] = await runBoth(
      rebinQuerySql({ unit: 'epi-week', zone: 'America/Chicago', column: 'ts', table, dialect: 'duckdb' }),
      rebinQuerySql({ unit: 'epi-week', zone: 'America/Chicago', column: 'ts', table, dialect: 'postgres' }),
    );
    expect(a).toBeInstanceOf(Error);
    expect(b).toBeInstanceOf(Error);
    expect(String((b as Error).message)).toMatch(/does not exist/);
    expect(await victimsLeft()).toEqual([1, 1]);
  });
});

describe('literals', () => {
  const evilLabels = ["0-4'); DROP TABLE victims; --", "x\\'; DROP TABLE victims; --", 'a\nb -- c', "'' OR 1=1 --"];
  it.each(evilLabels)('a bucket label %j comes back as the exact text', async (label) => {
    const spec = { kind: 'quern-bucket-spec', version: 1, value: 'age', discrete: true, closed: 'left', source: "test'; DROP TABLE victims; --\nx",
      ranges: [{ index: 0, label, low: 0, high: 5, lowClosed: true, highClosed: false }] };
    const d = bucketCaseSql(spec, 'age', 'duckdb');
    const p = bucketCaseSql(spec, 'age', 'postgres');
    const [a, b] = await runBoth(`SELECT ${d.label} FROM ev`, `SELECT ${p.label} AS l FROM ev`);
    expect((a as unknown[][])[0]![0]).toBe(label);
    expect(((b as Array<Array<{ l: string }>>)[0]!)[0]!.l).toBe(label);
    const [qa, qb] = await runBoth(bucketQuerySql(spec, 'age', 'duckdb', 'ev'), bucketQuerySql(spec, 'age', 'postgres', 'ev'));
    expect((qa as unknown[][])[0]![0]).toBe(label);
    expect(((qb as Array<Array<{ bucket: string }>>)[0]!)[0]!.bucket).toBe(label);
    expect(await victimsLeft()).toEqual([1, 1]);
  });

  it("a zone name with a quote is refused before any SQL is written (E_ZONE)", () => {
    let caught: unknown;
    try { periodSql({ unit: 'day', zone: "UTC'; DROP TABLE victims; --", column: 'ts', dialect: 'postgres' }); } catch (e) { caught = e; }
    expect(caught).toBeInstanceOf(QuernError);
    expect((caught as QuernError).code).toBe('E_ZONE');
  });

  it('a raw column expression holding ";" is refused (E_USAGE)', () => {
    let caught: unknown;
    try { periodSql({ unit: 'day', columnExpr: 'ts; DROP TABLE victims', dialect: 'duckdb' }); } catch (e) { caught = e; }
    expect((caught as QuernError).code).toBe('E_USAGE');
  });

  it('a trusted raw column expression runs as an expression', async () => {
    const d = periodSql({ unit: 'day', zone: 'UTC', columnExpr: "ts + INTERVAL '1 day'", dialect: 'duckdb' });
    const p = periodSql({ unit: 'day', zone: 'UTC', columnExpr: "ts + INTERVAL '1 day'", dialect: 'postgres' });
    const [a, b] = await runBoth(`SELECT ${d.label} FROM ev`, `SELECT ${p.label} AS l FROM ev`);
    expect((a as unknown[][])[0]![0]).toBe('2024-03-11'); // the event is 2024-03-10 12:00 UTC, one day later
    expect(((b as Array<Array<{ l: string }>>)[0]!)[0]!.l).toBe('2024-03-11');
  });
});
