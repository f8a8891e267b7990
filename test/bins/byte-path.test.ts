// Differential tests: the byte path of `bucket` (values parsed from byte batches, rows written as CSV
// bytes) against the string path (string batches, csvRow), which is the reference: on generated files
// with every CSV feature the results and the output bytes must be identical. Expected values come from
// the reference path, never from the code under test alone.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { bucketFile } from '../../src/bins/parallel.js';
import { bucketTable, bucketTableCsv, type BucketPlan, type BucketRunOptions, type BucketSink } from '../../src/bins/index.js';
import { csvRow, openTable, type TableOptions } from '../../src/table/index.js';
import { seeded } from '../helpers/seeded.js';

let dir = '';
beforeAll(async () => { dir = await mkdtemp(join(tmpdir(), 'quern-bins-bytes-')); });
afterAll(async () => { await rm(dir, { recursive: true, force: true }); });

const pick = <T,>(r: () => number, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;

// Values on and around the edges, empty cells, missing markers, signs, exponents, percent signs,
// thousands separators, words and junk: each kind the number parser treats apart (src/numbers).
const VALUES_DOT = ['0', '4', '5', '14.5', '15', '-3', '65', '99', '120', '', ' ', 'NA', '-', '1e1', '2.5E1', '12%', '1,234', '1,234.5', 'abc', 'NaN', 'Infinity', '-0', '007', '4.999', '45 ', ' 25', '+5', '=1+2', '"quoted 5"', '1e400', '9999', '1000', '0000', '0065', '00015', '12345'];
const VALUES_COMMA = ['0', '4', '5', '14,5', '15', '-3', '65', '99,9', '', 'NA', '1.234,5', '2,5', 'x', '12%', '45,0'];
const TEXTS = ['plain', 'with,comma', 'with "quotes"', 'line\nbreak', 'cr\rinside', '=cmd()', '+x', '-y', '@at', '\ttab', 'café', '→ arrow', '', ' spaced '];

// Cells without quotes, delimiters or line breaks, formula-like ones included: whole batches without a quote.
const PLAIN_TEXTS = ['plain', '=cmd()', '+x', '-y', '@at', '\ttab', 'café', '', ' spaced ', '-5', '+1e3', '-'];

function cell(r: () => number, v: string, delim: string, quotes: boolean): string {
  const must = v.includes(delim) || v.includes('"') || v.includes('\n') || v.includes('\r');
  return must || (quotes && r() < 0.1) ? `"${v.replaceAll('"', '""')}"` : v;
}

/** A CSV/TSV file with quoting, mixed line ends, BOM, blank lines, ragged rows, bad quotes and undecodable bytes. */
function generate(seed: number, delim: string, comma: boolean, rows: number, quotes = true): Buffer {
  const r = seeded(seed);
  const parts: Buffer[] = [];
  if (r() < 0.3) parts.push(Buffer.from([0xef, 0xbb, 0xbf]));
  const ends = ['\n', '\r\n', '\r'];
  const end = () => (r() < 0.8 ? '\n' : pick(r, ends));
  parts.push(Buffer.from(['id', 'label', 'v', 'note'].join(delim) + end()));
  for (let i = 0; i < rows; i++) {
    const roll = r();
    if (roll < 0.02) { parts.push(Buffer.from(end())); continue; } // blank line
    if (roll < 0.04) { parts.push(Buffer.from(`${i}${delim}ragged${end()}`)); continue; }
    if (roll < 0.05 && quotes) { parts.push(Buffer.from(`${i}${delim}bad"quote${delim}5${delim}x${end()}`)); continue; }
    if (roll < 0.06) { parts.push(Buffer.concat([Buffer.from(`${i}${delim}`), Buffer.from([0x63, 0x61, 0x66, 0xe9]), Buffer.from(`${delim}5${delim}x${end()}`)])); continue; }
    const v = pick(r, (comma ? VALUES_COMMA : VALUES_DOT).filter((x) => quotes || !x.includes('"') && !x.includes(delim)));
    const texts = quotes ? TEXTS : PLAIN_TEXTS;
    const fields = [String(i), pick(r, texts), v, pick(r, texts)].map((f) => cell(r, f, delim, quotes));
    parts.push(Buffer.from(fields.join(delim) + (i === rows - 1 && r() < 0.5 ? '' : end()), 'utf8'));
  }
  return Buffer.concat(parts);
}

/** The string path's CSV, as the CLI wrote rows before the byte path (csvRow for the header and every row). */
function referenceSink(neutralise: boolean, value: string): { sink: BucketSink; text: () => string } {
  let text = '';
  const csv = { neutraliseFormulas: neutralise };
  return {
    text: () => text,
    sink: {
      async start(header) { text += csvRow([...header, `${value}_range`, `${value}_range_index`], csv); },
      async batch(batch, labels, indices) {
        const row: string[] = new Array(batch.values.length + 2);
        for (let i = 0; i < batch.length; i++) {
          for (let c = 0; c < batch.values.length; c++) row[c] = batch.values[c]![i]!;
          row[batch.values.length] = labels[i]!;
          row[batch.values.length + 1] = indices[i]!;
          text += csvRow(row, csv);
        }
      },
    },
  };
}

const PLANS: Array<[string, BucketPlan]> = [
  ['edges 0,5,15,65 open both ends', { kind: 'edges', edges: [0, 5, 15, 65], openLow: true, openHigh: true }],
  ['edges 0,2.5,10,50', { kind: 'edges', edges: [0, 2.5, 10, 50] }],
  ['scheme five-year-85', { kind: 'scheme', name: 'five-year-85' }],
  ['quantile 4', { kind: 'quantile', bins: 4 }],
  ['ckmeans 3', { kind: 'ckmeans', bins: 3 }],
  ['equal width 5', { kind: 'equal-width', bins: 5 }],
  ['Sturges rule', { kind: 'rule', rule: 'sturges' }],
];

interface Case { name: string; seed: number; delim: string; comma: boolean; ext: string; table: TableOptions; quotes?: boolean }
const CASES: Case[] = [
  { name: 'comma CSV, default sizes', seed: 1, delim: ',', comma: false, ext: 'csv', table: {} },
  { name: 'comma CSV without quotes (rows copied as they are), formula-like cells, 300-byte chunks', seed: 7, delim: ',', comma: false, ext: 'csv', table: { chunkSize: 300, batchSize: 20 }, quotes: false },
  { name: 'comma CSV without quotes, default sizes', seed: 8, delim: ',', comma: false, ext: 'csv', table: {}, quotes: false },
  { name: 'comma CSV, 97-byte chunks and 7-row batches', seed: 2, delim: ',', comma: false, ext: 'csv', table: { chunkSize: 97, batchSize: 7 } },
  { name: 'comma CSV, 1 KiB chunks, 50-row batches', seed: 3, delim: ',', comma: false, ext: 'csv', table: { chunkSize: 1024, batchSize: 50 } },
  { name: 'semicolon CSV with decimal commas, small chunks', seed: 4, delim: ';', comma: true, ext: 'csv', table: { chunkSize: 211, batchSize: 13 } },
  { name: 'TSV', seed: 5, delim: '\t', comma: false, ext: 'tsv', table: { batchSize: 64 } },
  { name: 'comma CSV through the reference engine (csv-parse)', seed: 6, delim: ',', comma: false, ext: 'csv', table: { engine: 'reference', batchSize: 33 } },
];

describe('bucket byte path against the string path (differential)', () => {
  for (const c of CASES) {
    describe(c.name, () => {
      let file = '';
      beforeAll(async () => {
        file = join(dir, `${c.seed}.${c.ext}`);
        await writeFile(file, generate(c.seed, c.delim, c.comma, 600, c.quotes ?? true));
      });
      const open = () => openTable(file, c.table);

      it('the generated file holds every outcome the comparison must cover: bucketed, below, above, empty, invalid and rejected rows', async () => {
        const none: BucketSink = { async start() {}, async batch() {} };
        const { summary: s } = await bucketTable(open, { value: 'v', plan: { kind: 'edges', edges: [0, 5, 15, 65] } }, none);
        expect(s.bucketed).toBeGreaterThan(0);
        expect(s.below.count).toBeGreaterThan(0);
        expect(s.above.count).toBeGreaterThan(0);
        expect(s.empty.count).toBeGreaterThan(0);
        expect(s.invalid.count).toBeGreaterThan(0);
        if (c.table.engine !== 'reference') expect(s.rowsRejected).toBeGreaterThan(0);
      });

      it.each(PLANS)('bucketTable(%s) without a sink gives the result of the string path', async (_n, plan) => {
        const o: BucketRunOptions = { value: 'v', plan };
        const none: BucketSink = { async start() {}, async batch() {} };
        const ref = await bucketTable(open, o, none).catch((e: unknown) => e);
        const got = await bucketTable(open, o).catch((e: unknown) => e);
        expect(got).toEqual(ref);
      });

      it.each(PLANS)('bucketTableCsv(%s) writes the very bytes csvRow writes on the string path, neutralising and not', async (_n, plan) => {
        for (const neutralise of [true, false]) {
          const o: BucketRunOptions = { value: 'v', plan, closed: plan.kind === 'quantile' ? 'right' : 'left' };
          const ref = referenceSink(neutralise, 'v');
          const refResult = await bucketTable(open, o, ref.sink);
          const chunks: Buffer[] = [];
          const got = await bucketTableCsv(open, o, { neutraliseFormulas: neutralise, write: async (b) => { chunks.push(Buffer.from(b)); } });
          expect(Buffer.concat(chunks).toString('utf8')).toBe(ref.text());
          expect(got).toEqual(refResult);
          // Whole rows copied in JavaScript instead of by the WebAssembly loop (row-gather.wat).
          const js: Buffer[] = [];
          const gotJs = await bucketTableCsv(open, o, { neutraliseFormulas: neutralise, wasm: false, write: async (b) => { js.push(Buffer.from(b)); } });
          expect(Buffer.concat(js).toString('utf8')).toBe(ref.text());
          expect(gotJs).toEqual(refResult);
        }
      });
    });
  }

  it.each([[',', 'csv', 1], [';', 'csv', 2], ['\t', 'tsv', 3]] as const)('bucketFile on %j-separated ranges of ~1.5 KB on 2 threads counts what one bucketTable read counts (differential; examples on file lines)', async (delim, ext, seed) => {
    const file = join(dir, `ranges-${seed}.${ext}`);
    await writeFile(file, generate(40 + seed, delim, delim === ';', 1500));
    const o: BucketRunOptions = { value: 'v', plan: { kind: 'edges', edges: [0, 5, 15, 65], openHigh: true } };
    const one = await bucketTable(() => openTable(file), o);
    const many = await bucketFile(file, o, {}, { threads: 2, bytesPerRange: 1500, minBytes: 0 });
    expect(many).toEqual(one);
    expect(one.summary.rowsRejected).toBeGreaterThan(0);
    expect(one.summary.invalid.examples.length).toBe(5);
  });

  it('bucketTableCsv on NDJSON input writes what the string path writes (byte batches made from strings)', async () => {
    const file = join(dir, 'rows.ndjson');
    const r = seeded(9);
    const lines = Array.from({ length: 300 }, (_, i) => JSON.stringify({ id: i, label: pick(r, TEXTS), v: pick(r, VALUES_DOT), note: pick(r, TEXTS) }));
    await writeFile(file, `${lines.join('\n')}\n`);
    const open = () => openTable(file, { batchSize: 17 });
    const o: BucketRunOptions = { value: 'v', plan: { kind: 'edges', edges: [0, 5, 15, 65], openHigh: true } };
    const ref = referenceSink(true, 'v');
    const refResult = await bucketTable(open, o, ref.sink);
    const chunks: Buffer[] = [];
    const got = await bucketTableCsv(open, o, { write: async (b) => { chunks.push(Buffer.from(b)); } });
    expect(Buffer.concat(chunks).toString('utf8')).toBe(ref.text());
    expect(got).toEqual(refResult);
  });

  it('bucketTableCsv on a one-column file with quoted and unquoted values writes what the string path writes', async () => {
    const file = join(dir, 'one.csv');
    await writeFile(file, 'v\n5\n"7"\n"1,5"\n""\n"=2"\n-1\n"a""b"\n12\n');
    const open = () => openTable(file);
    const o: BucketRunOptions = { value: 'v', plan: { kind: 'edges', edges: [0, 5, 10] } };
    const ref = referenceSink(true, 'v');
    const refResult = await bucketTable(open, o, ref.sink);
    const chunks: Buffer[] = [];
    const got = await bucketTableCsv(open, o, { write: async (b) => { chunks.push(Buffer.from(b)); } });
    expect(Buffer.concat(chunks).toString('utf8')).toBe(ref.text());
    expect(got).toEqual(refResult);
  });

  it('bucketTableCsv on a header-only file writes the header and counts no rows, as the string path', async () => {
    const file = join(dir, 'empty.csv');
    await writeFile(file, 'id,v\n');
    const open = () => openTable(file);
    const o: BucketRunOptions = { value: 'v', plan: { kind: 'edges', edges: [0, 5] } };
    const ref = referenceSink(true, 'v');
    const refResult = await bucketTable(open, o, ref.sink);
    const chunks: Buffer[] = [];
    const got = await bucketTableCsv(open, o, { write: async (b) => { chunks.push(Buffer.from(b)); } });
    expect(Buffer.concat(chunks).toString('utf8')).toBe('id,v,v_range,v_range_index\n'); // csvRow of the header (RFC 4180)
    expect(ref.text()).toBe('id,v,v_range,v_range_index\n');
    expect(got).toEqual(refResult);
  });
});
