// bucketCaseSql and bucketQuerySql in DuckDB and PostgreSQL: every value gets the label and order index
// quern's own bucketer gives (makeBucketer over bucketsFromSpec), with the published age groups of the US
// 2000 standard population (REFERENCES §8, Census P25-1130 via SEER "stdpop.19ages") checked by value.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bucketsFromSpec, makeBucketer } from '../../src/bins/index.js';
import { bucketCaseSql, bucketQuerySql } from '../../src/sql/bucket.js';
import { openEngines, seeded, type Engines } from './engines.js';

// US 2000 standard population, 19 groups: 00, 01-04, 05-09, …, 80-84, 85+ (REFERENCES §8).
const US2000 = {
  kind: 'quern-bucket-spec', version: 1, value: 'age', discrete: true, closed: 'left', source: 'US 2000 standard, 19 groups',
  ranges: [
    { index: 0, label: '00', low: 0, high: 1, lowClosed: true, highClosed: false },
    { index: 1, label: '01-04', low: 1, high: 5, lowClosed: true, highClosed: false },
    ...Array.from({ length: 16 }, (_, i) => ({
      index: i + 2, label: `${String(5 * (i + 1)).padStart(2, '0')}-${String(5 * (i + 1) + 4).padStart(2, '0')}`,
      low: 5 * (i + 1), high: 5 * (i + 2), lowClosed: true, highClosed: false,
    })),
    { index: 18, label: '85+', low: 85, high: null, lowClosed: true, highClosed: false },
  ],
};

// A right-closed continuous scheme with a hole (10, 20] missing and open below: (-inf, 0], (0, 10], (20, 30.5].
const RIGHT = {
  kind: 'quern-bucket-spec', version: 1, value: 'x', discrete: false, closed: 'right', source: 'edges by hand',
  ranges: [
    { index: 0, label: '<=0', low: null, high: 0, lowClosed: false, highClosed: true },
    { index: 1, label: '(0, 10]', low: 0, high: 10, lowClosed: false, highClosed: true },
    { index: 2, label: '(20, 30.5]', low: 20, high: 30.5, lowClosed: false, highClosed: true },
  ],
};

let engines: Engines;
beforeAll(async () => {
  engines = await openEngines();
}, 120_000);
afterAll(async () => { await engines?.close(); });

async function load(values: readonly (number | null)[]): Promise<void> {
  const rows = (dbl: string): string =>
    values.map((v, i) => `(${i}, CAST(${v === null ? 'NULL' : Number.isNaN(v) ? "'NaN'" : `'${v}'`} AS ${dbl}))`).join(', ');
  await engines.duck.run('DROP TABLE IF EXISTS vals');
  await engines.duck.run(`CREATE TABLE vals AS SELECT i, v FROM (VALUES ${rows('DOUBLE')}) t(i, v)`);
  await engines.pg.exec(`DROP TABLE IF EXISTS vals; CREATE TABLE vals AS SELECT i, v FROM (VALUES ${rows('double precision')}) t(i, v)`);
}

async function labelsIn(spec: unknown): Promise<{ duck: unknown[][]; pg: unknown[][] }> {
  const d = bucketCaseSql(spec, 'v', 'duckdb');
  const p = bucketCaseSql(spec, 'v', 'postgres');
  const duck = (await engines.duck.runAndReadAll(`SELECT ${d.label}, ${d.index} FROM vals ORDER BY i`)).getRows().map((r) => [r[0], r[1] === null ? null : Number(r[1])]);
  const pg = (await engines.pg.query<unknown[]>(`SELECT ${p.label}, ${p.index} FROM vals ORDER BY i`, [], { rowMode: 'array' })).rows.map((r) => [r[0], r[1] === null ? null : Number(r[1])]);
  return { duck, pg };
}

function quernLabels(spec: unknown, values: readonly (number | null)[]): unknown[][] {
  const set = bucketsFromSpec(spec);
  const b = makeBucketer(set.buckets);
  return values.map((v) => {
    if (v === null || !Number.isFinite(v)) return [null, null];
    const k = b.assign(v);
    return k < 0 ? [null, null] : [set.buckets[k]!.label, k];
  });
}

describe('bucketCaseSql', () => {
  it.each([
    [0, '00'], [1, '01-04'], [4, '01-04'], [5, '05-09'], [84, '80-84'], [85, '85+'], [100, '85+'], // REFERENCES §8 bucketing checks
  ])('US 2000 groups: age %d is %s in DuckDB and PostgreSQL', async (age, label) => {
    await load([age]);
    const { duck, pg } = await labelsIn(US2000);
    expect(duck[0]![0]).toBe(label);
    expect(pg[0]![0]).toBe(label);
  });

  it.each([['US 2000', US2000], ['right-closed with a hole', RIGHT]] as const)('%s: every value gets quern\'s label and index in both engines', async (_name, spec) => {
    const rnd = seeded(85);
    const values: (number | null)[] = [null, NaN, -1, 0, 0.5, 1, 4.999, 5, 10, 10.0001, 15, 20, 20.5, 30.5, 31, 84, 85, 120];
    for (let i = 0; i < 300; i++) values.push(Math.round((rnd() * 140 - 20) * 4) / 4);
    await load(values);
    const expected = quernLabels(spec, values);
    expect(expected.some((e) => e[0] === null)).toBe(true);
    const { duck, pg } = await labelsIn(spec);
    expect(duck).toEqual(expected);
    expect(pg).toEqual(expected);
  });

  it('bucketQuerySql lists every bucket in order with quern\'s counts, and one NULL row for values in none', async () => {
    const values = [0, 0, 3, 7, 85, 99, -5, null, NaN];
    await load(values);
    const expected = [['00', 0, 2], ['01-04', 1, 1], ['05-09', 2, 1], ...US2000.ranges.slice(3, 18).map((r) => [r.label, r.index, 0]), ['85+', 18, 2], [null, null, 3]];
    const duck = (await engines.duck.runAndReadAll(bucketQuerySql(US2000, 'v', 'duckdb', 'vals'))).getRows().map((r) => [r[0], r[1] === null ? null : Number(r[1]), Number(r[2])]);
    const pg = (await engines.pg.query<unknown[]>(bucketQuerySql(US2000, 'v', 'postgres', 'vals'), [], { rowMode: 'array' })).rows.map((r) => [r[0], r[1] === null ? null : Number(r[1]), Number(r[2])]);
    expect(duck).toEqual(expected);
    expect(pg).toEqual(expected);
  });

  it('a malformed spec throws E_VALUE from the spec reader', () => {
    let code: string | undefined;
    try { bucketCaseSql({ kind: 'nope' }, 'v', 'duckdb'); } catch (e) { code = (e as { code?: string }).code; }
    expect(code).toBe('E_VALUE');
  });
});
