// Differential tests: profileTable reads the fast engine's byte batches by default; the report must be the one
// the string path gives (`bytes: false`, the code before the byte path) and the one csv-parse gives
// (`engine: 'reference'`, an independent tokenizer) — the expected values here are those other paths' results,
// never numbers written by hand. Files are generated with a seeded generator (mulberry32) and carry what a
// real export carries: RFC 4180 quoting (embedded delimiters, doubled quotes, line breaks inside quotes), CRLF
// line ends, ragged rows (rejected), blank values, identifiers, zero-padded codes, an ordered vocabulary,
// numbers with signs, decimals and exponents, dates and date-times, latitude/longitude pairs, non-ASCII text
// in some batches, and columns past the exact distinct cap (10,000) so the sketch takes over. Small batch and
// chunk sizes cut the byte batches at many places (the heads of 1,000 values then straddle batches).
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { Readable } from 'node:stream';
import { gzipSync } from 'node:zlib';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { ProfileColumn, profileTable } from '../../src/profile/index.js';
import { openTable } from '../../src/table/open.js';
import type { TableOptions } from '../../src/table/types.js';
import { seeded } from '../helpers/seeded.js';

// Whole-file reads, three times per case: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 120_000 });

const dir = mkdtempSync(join(tmpdir(), 'quern-profile-bytes-'));
let files = 0;

interface Shape {
  rows: number;
  seed: number;
  crlf?: boolean;
  /** Lone CR line ends (old Mac exports). */
  cr?: boolean;
  /** A UTF-8 byte order mark before the header. */
  bom?: boolean;
  /** Share of rows with a field too many or too few (rejected as ragged). */
  ragged?: number;
  /** Share of text values written with non-ASCII letters. */
  accents?: number;
  /** Quote every field (RFC 4180 §2.5 allows it). */
  quoteAll?: boolean;
}

type Gen = (i: number, rnd: () => number) => string;

const pick = <T>(xs: readonly T[], rnd: () => number): T => xs[Math.floor(rnd() * xs.length)]!;

/** The columns of the generated table: name → value of row i. */
function columns(accents: number): Record<string, Gen> {
  const t0 = Date.UTC(2023, 0, 1);
  return {
    visit_id: (i) => String(100_001 + i),
    visit_time: (i, r) => (r() < 0.01 ? '' : new Date(t0 + i * 600_000 + Math.floor(r() * 5) * 60_000).toISOString().slice(0, 19) + 'Z'),
    visit_date: (i) => new Date(t0 + Math.floor(i / 40) * 86_400_000).toISOString().slice(0, 10),
    area_code: (_, r) => `0${4500 + Math.floor(r() * 60)}`,
    triage: (_, r) => (r() < 0.02 ? '  ' : pick(['low', 'medium', 'high'], r)),
    clinic: (_, r) => (r() < accents ? pick(['Quillon Bay, ouest', 'Fenník Cross', 'Marrow "Hill"', 'Stenby\nMoor'], r) : pick(['Alderbrook', 'Fennick Cross', 'Marrow Hill'], r)),
    patient_age: (_, r) => String(Math.floor(r() * 100)),
    change: (_, r) => (r() < 0.05 ? pick(['1e3', '-2.5E-2', '+4', '.5', '5.', '-0', ' 7 ', '1,234'], r) : (r() * 200 - 100).toFixed(Math.floor(r() * 4))),
    amount: (_, r) => (r() * 5000).toFixed(2),
    ref: (_, r) => `R${Math.floor(r() * 1e9).toString(36)}`,
    lat: (_, r) => (51 + r()).toFixed(5),
    lon: (_, r) => (-1 - r()).toFixed(5),
    note: (_, r) => (r() < 0.3 ? '' : pick(['called back', 'referred, urgent', 'said "later"', 'x'], r)),
    mixed: (_, r) => (r() < 0.9 ? String(Math.floor(r() * 50)) : pick(['n/a', 'unknown', '12a'], r)),
  };
}

function cell(v: string, quoteAll: boolean): string {
  return quoteAll || /[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

/** Writes a generated table and returns its path. */
function writeTable(shape: Shape): string {
  const rnd = seeded(shape.seed);
  const cols = columns(shape.accents ?? 0);
  const names = Object.keys(cols);
  const eol = shape.crlf ? '\r\n' : shape.cr ? '\r' : '\n';
  const out: string[] = [names.join(',')];
  for (let i = 0; i < shape.rows; i++) {
    const row = names.map((n) => cell(cols[n]!(i, rnd), shape.quoteAll ?? false));
    const r = rnd();
    if (r < (shape.ragged ?? 0) / 2) row.push('extra');
    else if (r < (shape.ragged ?? 0)) row.pop();
    out.push(row.join(','));
  }
  const file = join(dir, `t${++files}.csv`);
  writeFileSync(file, (shape.bom ? '\ufeff' : '') + out.join(eol) + eol);
  return file;
}

/** Everything a column's accumulator gathered, byte path or string path (finer than the report it feeds). */
async function evidence(file: string, table: TableOptions, bytes: boolean): Promise<unknown[]> {
  const reader = await openTable(file, table);
  const cols = reader.header.map((n) => new ProfileColumn(n));
  if (bytes) {
    for await (const b of reader.byteBatches([...reader.header])) cols.forEach((col, c) => col.pushBatch(b, c));
  } else {
    for await (const b of reader.batches([...reader.header])) cols.forEach((col, c) => { for (let i = 0; i < b.length; i++) col.push(b.values[c]![i]!, b.lines[i]!); });
  }
  return cols.map((col) => {
    col.finish();
    return {
      name: col.name, empty: col.empty, values: col.values, totalLength: col.totalLength, numbersStopped: col.numbersStopped,
      numeric: col.numeric?.s ?? null, counts: [...col.distinct.counts], distinct: col.distinctCount(), grain: col.grain.readings.length,
    };
  });
}

async function threeWays(file: string, table: TableOptions = {}): Promise<void> {
  const bytes = await profileTable(file, { table });
  const strings = await profileTable(file, { table, bytes: false });
  const reference = await profileTable(file, { table: { ...table, engine: 'reference' } });
  expect(bytes).toEqual(strings);
  expect(bytes).toEqual(reference);
  expect(await evidence(file, table, true)).toEqual(await evidence(file, table, false));
}

describe('profileTable(file) byte path', () => {
  it.each([
    // [case, shape, table options]; each row compared with the string path and the reference engine.
    ['plain LF, 3,000 rows', { rows: 3_000, seed: 1 }, {}],
    ['CRLF with ragged rows', { rows: 3_000, seed: 2, crlf: true, ragged: 0.01 }, {}],
    ['every field quoted, small batches', { rows: 2_500, seed: 3, quoteAll: true }, { batchSize: 97 }],
    ['non-ASCII and quoted line breaks in some batches, small chunks', { rows: 2_500, seed: 4, accents: 0.002 }, { chunkSize: 4096 }],
    ['byte order mark, lone CR line ends', { rows: 2_200, seed: 9, bom: true, cr: true, ragged: 0.005 }, { chunkSize: 8192 }],
    ['non-ASCII often, tiny chunks and batches', { rows: 1_500, seed: 5, accents: 0.05, crlf: true }, { chunkSize: 1024, batchSize: 50 }],
  ] as Array<[string, Shape, TableOptions]>)('%s: the same report as the string path and csv-parse', async (_, shape, table) => {
    await threeWays(writeTable(shape), table);
  });

  it('past the exact distinct cap (10,000) the sketch and the frozen counts agree too', async () => {
    const file = writeTable({ rows: 12_500, seed: 6, ragged: 0.002 });
    await threeWays(file, { chunkSize: 65_536 });
    // The case is what it claims: some columns are past the cap (estimated), others exact.
    const r = await profileTable(file);
    const byName = Object.fromEntries(r.columns.map((c) => [c.name, c]));
    expect(byName.ref!.distinctExact).toBe(false);
    expect(byName.amount!.distinctExact).toBe(false);
    expect(byName.clinic!.distinctExact).toBe(true);
  });

  it('rows with undecodable bytes and bad quotes (rejected by the reader) leave the same report', async () => {
    const file = writeTable({ rows: 2_300, seed: 10 });
    const lines = readFileSync(file, 'latin1').split('\n');
    // RFC 4180 §2.5–2.7: a quote inside an unquoted field, and a quoted field with text after its closing quote.
    for (let i = 1500; i < lines.length - 1; i += 97) lines[i] = lines[i]!.replace(/,/, ',ab"c');
    for (let i = 1550; i < lines.length - 1; i += 131) lines[i] = lines[i]!.replace(/,/, ',"x"y');
    const bytes = Buffer.from(lines.join('\n'), 'latin1');
    // 0xFF never appears in UTF-8 (RFC 3629 §1): rows holding it are undecodable.
    for (let at = bytes.indexOf(0x0a, 30_000); at > 0 && at < bytes.length - 200; at = bytes.indexOf(0x0a, at + 9_000)) bytes[at + 3] = 0xff;
    const bad = `${file}.bad.csv`;
    writeFileSync(bad, bytes);
    const r = await profileTable(bad);
    expect(r.rejectedRows).toBeGreaterThan(10);
    await threeWays(bad, { chunkSize: 16_384 });
  });

  it('a gzipped file and standard input: the same report as the string path', async () => {
    const file = writeTable({ rows: 2_200, seed: 8, crlf: true, ragged: 0.005 });
    const gz = `${file}.gz`;
    writeFileSync(gz, gzipSync(readFileSync(file)));
    expect(await profileTable(gz)).toEqual(await profileTable(gz, { bytes: false }));
    const viaStdin = (bytes: boolean): Promise<unknown> => profileTable('-', { table: { stdin: Readable.from([readFileSync(file)]) }, bytes });
    expect(await viaStdin(true)).toEqual(await viaStdin(false));
  });

  it('the generated columns get the roles the generator gave them (so the comparison covers every role path)', async () => {
    // Roles by construction of the generator above (common practice of the roles table in src/profile/types.ts).
    const r = await profileTable(writeTable({ rows: 3_000, seed: 7, crlf: true, ragged: 0.01 }));
    const roles = Object.fromEntries(r.columns.map((c) => [c.name, c.role]));
    expect(roles).toMatchObject({
      visit_id: 'identifier', visit_time: 'time', visit_date: 'time', area_code: 'code', triage: 'ordered-vocabulary',
      clinic: 'category', patient_age: 'measure', amount: 'measure', lat: 'latitude', lon: 'longitude',
    });
    expect(r.rejectedRows).toBeGreaterThan(0);
  });

  it.each([
    // [pool, seed]: ASCII only (every batch read from its bytes), then with non-ASCII values (batches holding
    // them are read as strings, the others as bytes).
    ['ASCII', 11], ['ASCII', 12], ['with non-ASCII', 13],
  ])('columns of random cells from a pool of CSV-hostile strings (%s, seed %d)', async (kind, seed) => {
    // Values chosen to hit every branch of the byte scan: signs alone, points alone, 15 and 16 digits, spaces,
    // tabs, quotes, delimiters, exponents, leading zeros; and non-ASCII text.
    const ascii = ['', ' ', '\t', '-', '+', '.', '-.', '0', '00', '007', '-0.0', '+12.50', '123456789012345', '1234567890123456',
      '1.', '.25', '1e5', '1E-3', '12,5', 'a,b', 'say "hi"', ' 42', '42 ', 'NaN', 'Infinity', '0x1f', '1_000', '-07', '+0'];
    const pool = kind === 'ASCII' ? ascii : [...ascii, 'é', '€5', '٣'];
    const rnd = seeded(seed);
    const lines = ['v,w'];
    // w draws mostly numbers, so that it stays a number candidate past its head; v draws from the whole pool.
    const numbers = ['0', '00', '007', '-0.0', '+12.50', '123456789012345', '1234567890123456', '1.', '.25', '1e5', '-07', '+0', ' '];
    for (let i = 0; i < 2_400; i++) lines.push(`${cell(pick(pool, rnd), false)},${cell(pick(numbers, rnd), false)}`);
    const file = join(dir, `pool${seed}.csv`);
    writeFileSync(file, lines.join('\n') + '\n');
    await threeWays(file, { chunkSize: 2048 });
  });
});

describe('profileTable(file, { threads: 2 }) with the columns split between two threads', () => {
  it.each([
    // [case, shape, table options]: the report of one thread (the expected value) against two.
    ['CRLF, ragged rows, past the distinct cap', { rows: 11_000, seed: 21, crlf: true, ragged: 0.003 }, {}],
    ['non-ASCII and quoted line breaks, small chunks', { rows: 2_500, seed: 22, accents: 0.01 }, { chunkSize: 4096, batchSize: 300 }],
  ] as Array<[string, Shape, TableOptions]>)('%s: the one-thread report', async (_, shape, table) => {
    const file = writeTable(shape);
    const one = await profileTable(file, { table });
    const two = await profileTable(file, { table, threads: 2, splitMinBytes: 0 });
    expect(two).toEqual(one);
  });

  it('a file of one batch is read on the main thread alone (same report)', async () => {
    const file = writeTable({ rows: 900, seed: 24 });
    expect(await profileTable(file, { threads: 2, splitMinBytes: 0, table: { batchSize: 5_000 } })).toEqual(await profileTable(file));
  });

  it("threads 'auto' gives the one-thread report (a small file: one thread)", async () => {
    const file = writeTable({ rows: 1_500, seed: 25 });
    expect(await profileTable(file, { threads: 'auto' })).toEqual(await profileTable(file));
  });

  it('below the size threshold, and for standard input, reads in one thread (same report)', async () => {
    const file = writeTable({ rows: 1_200, seed: 23 });
    expect(await profileTable(file, { threads: 2 })).toEqual(await profileTable(file));
  });

  it('a missing file rejects with E_FILE, as in one thread', async () => {
    await expect(profileTable(join(dir, 'no-such.csv'), { threads: 2, splitMinBytes: 0 })).rejects.toMatchObject({ code: 'E_FILE' });
  });
});
