// rebinFile(file, options, table, { threads }) on several threads gives the result of one whole read —
// rows, summary, examples, line numbers, notes and errors — on generated files with every CSV feature
// (RFC 4180 quoting with embedded delimiters, quotes and line breaks, CRLF, blank lines, ragged rows,
// undecodable bytes, a BOM), rejected and odd time values, groups, fills, units and zones. Ranges are
// forced small so splits fall inside quoted fields (the pool reads such a range again from the true
// record start). Differential test: the one-thread rebin is the reference (no outside oracle is needed
// for "the same answer twice"; rebin itself is held to outside oracles in oracle.test.ts).
import { describe, expect, it } from 'vitest';
import type { UnitName } from '../../src/calendar/types.js';
import { parseAggSpecs, rebin, rebinFile } from '../../src/rebin/index.js';
import type { RebinOptions, RebinPlan, RebinResult } from '../../src/rebin/index.js';
import { openTable } from '../../src/table/index.js';
import { seeded, tableFile } from './helpers.js';

// Odd time values, each with why it is there (DEVELOPERS.md "Time values"; RFC 4180 §2.7 for quotes).
const ODD = [
  '', // empty
  '   ', // blank
  ' 2024-03-10T08:15:00Z ', // padded
  '"2024-03-10T08:15:00Z"', // quoted
  '2021-02-29T10:00:00Z', // no such day
  '2024-03-10T24:01:00Z', // nothing after 24:00
  '2024-03-10T24:00:00Z', // end of day
  '2016-12-31T23:59:60Z', // leap second (RFC 3339 §5.7)
  '2024-03-10T08:15:00+25:00', // no such offset
  '2024-03-10T08:15:00.123456-05:00', // fraction truncated
  '2024-03-10 08:15:00+05:30', // space separator, an offset
  '2024-03-10T02:30:00', // no offset: a wall-clock reading (skipped in New York)
  '2024-11-03T01:30:00', // no offset: repeated in New York
  '"2024-06-01T10:00:00Z\n"', // a line break inside the quoted value
];
// Group values: plain, quoted with a comma, with a doubled quote, and with line breaks inside quotes.
const SITES = ['north', '"south, annex"', '"say ""hi"""', '"two\nlines"', '"three\r\nline\nvalue"', 'east'];

function generated(rows: number, seed: number, crlf: boolean, extras: boolean): string {
  const rnd = seeded(seed);
  const eol = crlf ? '\r\n' : '\n';
  const lines = [`${extras ? '\ufeff' : ''}ts,site,kind,amount`];
  for (let i = 0; i < rows; i++) {
    const t = Date.UTC(2023, 0, 1) + Math.floor(rnd() * 2 * 365 * 86_400) * 1000;
    const ts = rnd() < 0.12 ? ODD[Math.floor(rnd() * ODD.length)]! : new Date(t).toISOString().replace('.000Z', rnd() < 0.5 ? 'Z' : '-05:00');
    const amount = rnd() < 0.05 ? 'n/a' : rnd() < 0.05 ? '' : (rnd() * 100).toFixed(2);
    lines.push(`${ts},${SITES[i % SITES.length]},k${i % 3},${amount}`);
    if (extras && i % 97 === 5) lines.push(''); // a blank line
    if (extras && i % 131 === 7) lines.push(`${new Date(t).toISOString()},ragged`); // too few fields
  }
  return `${lines.join(eol)}${eol}`;
}

async function whole(file: string, options: RebinOptions): Promise<RebinResult> {
  const reader = await openTable(file);
  try {
    return await rebin(reader, options);
  } finally {
    reader.close();
  }
}

async function outcome<T>(run: () => Promise<T>): Promise<T | { error: string; message: string }> {
  try {
    return await run();
  } catch (e) {
    const err = e as { code?: string; message: string };
    return { error: err.code ?? 'thrown', message: err.message };
  }
}

const opts = (unit: UnitName, zone: string, extra: Partial<RebinOptions> = {}): RebinOptions => ({
  time: 'ts', calendar: { unit, zone }, by: ['site'], fill: true,
  aggregates: parseAggSpecs(['count', 'count:amount', 'sum:amount', 'mean:amount', 'min:amount', 'max:amount', 'median:amount', 'p90:amount', 'distinct:kind']),
  ...extra,
});

describe('rebinFile(file, options, table, { threads }) equals one whole read', () => {
  const plain = tableFile(generated(1500, 6001, false, false));
  const crlf = tableFile(generated(1500, 6002, true, true));
  const CASES: Array<['LF' | 'CRLF+BOM+blank+ragged', UnitName, string, Partial<RebinOptions>]> = [
    ['LF', 'iso-week', 'UTC', {}],
    ['LF', 'quarter', 'America/New_York', {}],
    ['LF', 'hour', 'Asia/Kolkata', { fill: false }],
    ['CRLF+BOM+blank+ragged', 'month', 'America/New_York', {}],
    ['CRLF+BOM+blank+ragged', 'epi-week', 'UTC', { by: ['site', 'kind'] }],
    ['CRLF+BOM+blank+ragged', 'day', 'Australia/Lord_Howe', { by: [], from: Date.UTC(2023, 5, 1), until: Date.UTC(2024, 2, 1) }],
  ];
  it.each(CASES)('%s file → %s in %s (%j): 2 threads = 1 thread', async (what, unit, zone, extra) => {
    const file = what === 'LF' ? plain : crlf;
    const options = opts(unit, zone, extra);
    const want = await whole(file, options);
    let plan: RebinPlan | null = null;
    const got = await rebinFile(file, options, {}, { threads: 2, bytesPerRange: 600, minBytes: 0, onPlan: (p) => (plan = p) });
    expect(JSON.parse(JSON.stringify(got))).toEqual(JSON.parse(JSON.stringify(want)));
    // It did run on two threads over many ranges, some of which began inside a quoted field.
    expect(plan).toMatchObject({ threads: 2, serial: null });
    expect(plan!.ranges).toBeGreaterThan(20);
    expect(plan!.mended).toBeGreaterThan(0);
    // The generated file has something of every kind, so the comparison is not empty.
    expect(want.summary.rowsRejected).toBeGreaterThan(0);
    expect(want.summary.rowsEmpty).toBeGreaterThan(0);
    expect(want.summary.examples.length).toBeGreaterThan(0);
  }, 120_000);

  it('splits that fall inside quoted fields are mended: examples keep their file lines', async () => {
    const options = opts('month', 'UTC', { maxExamples: 50 });
    const want = await whole(crlf, options);
    let plan: RebinPlan | null = null;
    const got = await rebinFile(crlf, options, {}, { threads: 2, bytesPerRange: 300, minBytes: 0, onPlan: (p) => (plan = p) });
    expect(plan).toMatchObject({ threads: 2, serial: null });
    expect(plan!.mended).toBeGreaterThan(0);
    expect(got.summary.examples).toEqual(want.summary.examples);
    expect(got.summary.examples.length).toBeGreaterThan(10);
  }, 120_000);

  it('an error that names a line names the same line (a stray 1970 value past --max-periods; a straddling week)', async () => {
    // A value far from the rest, late in the file: the fill guard names it and its line (src/rebin/fill.ts rule).
    const text = generated(800, 6003, false, false).replace(/\n([^\n]*)\n$/, '\n1970-01-05T00:00:00Z,north,k0,1\n$1\n');
    const file = tableFile(text);
    const options = opts('day', 'UTC');
    const want = await outcome(() => whole(file, options));
    expect(want).toMatchObject({ error: 'E_DATA' });
    let plan: RebinPlan | null = null;
    expect(await outcome(() => rebinFile(file, options, {}, { threads: 2, bytesPerRange: 700, minBytes: 0, onPlan: (p) => (plan = p) }))).toEqual(want);
    expect(plan).toMatchObject({ threads: 2, serial: null }); // the guard runs after the merge, on the shifted lines
    // ISO weeks straddle month ends (ISO 8601): without --assign rebin stops on the first one, with its line.
    const weeks = ['wk,n', ...Array.from({ length: 300 }, (_, i) => `${2020 + Math.floor(i / 52)}-W${String((i % 52) + 1).padStart(2, '0')},${i}`)].join('\n');
    const wf = tableFile(`${weeks}\n`);
    const wo: RebinOptions = { time: 'wk', calendar: { unit: 'month' }, aggregates: parseAggSpecs(['sum:n']) };
    const wantW = await outcome(() => whole(wf, wo));
    expect(wantW).toMatchObject({ error: 'E_POLICY' });
    expect(await outcome(() => rebinFile(wf, wo, {}, { threads: 2, bytesPerRange: 500, minBytes: 0, onPlan: (p) => (plan = p) }))).toEqual(wantW);
    expect(plan).toMatchObject({ threads: 2, serial: null }); // the policy check runs after the merge
    // Too many distinct values kept: met inside a range or at the merge, the same E_DATA either way.
    const lim = opts('month', 'UTC', { limits: { maxDistinct: 20 } });
    const wantL = await outcome(() => whole(plain, lim));
    expect(wantL).toMatchObject({ error: 'E_DATA' });
    expect(await outcome(() => rebinFile(plain, lim, {}, { threads: 2, bytesPerRange: 2000, minBytes: 0 }))).toEqual(wantL);
    // One thread, or a file under minBytes, is one whole read.
    await rebinFile(plain, lim, {}, { threads: 1, onPlan: (p) => (plan = p) }).catch(() => undefined);
    expect(plan).toMatchObject({ threads: 1, serial: 'not-eligible' });
  }, 120_000);

  it('source periods with a policy, and apportioned ones (read on one thread), agree', async () => {
    // Epidemiological weeks (CDC MMWR) as week-ending Saturdays, rebinned to months by their last day.
    const rows = ['week_ending,cases', ...Array.from({ length: 400 }, (_, i) => `${new Date(Date.UTC(2021, 0, 2) + i * 7 * 86_400_000).toISOString().slice(0, 10)},${i % 17}`)];
    const file = tableFile(`${rows.join('\n')}\n`);
    for (const assign of ['end', 'apportion'] as const) {
      const options: RebinOptions = { time: 'week_ending', calendar: { unit: 'month', zone: 'America/Chicago' }, sourceUnit: 'epi-week', sourceAnchor: 'end', assign, aggregates: parseAggSpecs(['sum:cases']) };
      const want = await whole(file, options);
      const got = await rebinFile(file, options, {}, { threads: 2, bytesPerRange: 512, minBytes: 0 });
      expect(JSON.parse(JSON.stringify(got))).toEqual(JSON.parse(JSON.stringify(want)));
    }
  }, 120_000);
});
