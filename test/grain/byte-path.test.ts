// detectGrain reads values as bytes (TableReader.byteBatches) and makes strings only for the values it keeps.
// Differential tests (the expected result is not computed here; the paths are held to each other): on
// generated files with every CSV feature and many date formats, the byte path must give exactly the report
// of the string path it replaced (detectGrainFromStrings, one string per value through `batches`), on the
// fast tokenizer and on the reference one (csv-parse), whatever the batch and chunk sizes.
// Generated values are written with the Temporal polyfill (an independent oracle) in real IANA zones.
import { writeFileSync } from 'node:fs';
import { Readable } from 'node:stream';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { describe, expect, it, vi } from 'vitest';
import { detectGrain, detectGrainFromStrings, HEAD_ROWS, type GrainOptions } from '../../src/grain/detect.js';
import type { GrainReport } from '../../src/grain/types.js';
import { DISTINCT_CAP } from '../../src/grain/store.js';
import { HEAD_SAMPLE } from '../../src/grain/column.js';
import { seeded } from './helpers.js';
import { tmpFile } from './tmp.js';

vi.setConfig({ testTimeout: 120_000 });

type Gen = (i: number, rnd: () => number) => string;

const BASE = Temporal.Instant.from('2023-10-28T00:00:00Z');

/** Instants every 15 minutes (with a jitter of whole seconds on some rows) written in `zone` with its offset. */
function zoned(zone: string, z: boolean): Gen {
  return (i, rnd) => {
    const at = BASE.add({ seconds: i * 900 + (rnd() < 0.2 ? Math.floor(rnd() * 60) : 0) });
    const d = at.toZonedDateTimeISO(zone);
    const wall = d.toPlainDateTime().toString({ smallestUnit: 'second' });
    return z ? `${wall}Z` : `${wall}${d.offset}`;
  };
}

const pad = (n: number, w = 2): string => String(n).padStart(w, '0');

// Each generator writes one format; the comment names where the notation comes from.
const FORMATS: Record<string, Gen> = {
  // ISO 8601-1:2019 §5.4.2 date-time with UTC designator Z, to the second.
  utc: zoned('UTC', true),
  // ISO 8601 with numeric offsets that change with America/Chicago's daylight saving (IANA tz database).
  chicago: zoned('America/Chicago', false),
  // ISO 8601 local date-times (no offset), with fractions of a second on some rows and a space separator on others.
  local: (i, rnd) => {
    const t = Temporal.PlainDateTime.from('2024-03-09T00:00:00').add({ minutes: i * 5 });
    const s = t.toString({ smallestUnit: 'second' });
    return rnd() < 0.1 ? `${s.replace('T', ' ')}` : rnd() < 0.1 ? `${s}.250` : s;
  },
  // ISO 8601 calendar dates (YYYY-MM-DD), one per day with repeats.
  day: (i) => Temporal.PlainDate.from('2024-02-20').add({ days: Math.floor(i / 3) }).toString(),
  // Unix epoch seconds (POSIX.1-2017 §4.16 "Seconds Since the Epoch"), hourly.
  epoch: (i) => String(1_700_000_000 + i * 3600),
  // ISO 8601 week labels YYYY-Www.
  week: (i) => {
    const d = Temporal.PlainDate.from('2024-01-01').add({ weeks: Math.floor(i / 4) });
    return `${d.yearOfWeek}-W${pad(d.weekOfYear!)}`;
  },
  // Epidemiological week labels YYYY-EWww (the project's agreed notation; weeks 1..52 of 2024 here).
  epi: (i) => `2024-EW${pad((Math.floor(i / 5) % 52) + 1)}`,
  // Numeric dates day first: ambiguous until a day above 12 appears (common practice).
  dmy: (i) => {
    const d = Temporal.PlainDate.from('2024-01-01').add({ days: i % 300 });
    return `${pad(d.day)}/${pad(d.month)}/${d.year}`;
  },
};

/** A field as a CSV writer would quote it (RFC 4180 §2.6–2.7), quoting some plain fields too. */
function cell(v: string, rnd: () => number): string {
  if (/[",\r\n]/.test(v) || rnd() < 0.05) return `"${v.replace(/"/g, '""')}"`;
  return v;
}

interface FileShape {
  rows: number;
  eol: () => string;
  columns: string[];
  /** Share of rows with a damaged time value (empty, blank, invalid, non-ASCII, doubled quotes). */
  noise: number;
  /** Share of rows broken as CSV (ragged, bad quote, undecodable bytes). */
  broken: number;
  bom?: boolean;
}

const NOISE = ['', '   ', '\t', 'n/a', '2024-02-30', '2024-13-01T00:00:00Z', 'héllo', 'a"b', '12:00'];
const NOTES = ['plain', 'with, comma', 'say "hi"', 'two\nlines', 'crlf\r\ninside', 'naïve café', ''];

/** Writes a generated file and returns its path. */
function writeShape(seed: number, shape: FileShape): string {
  const rnd = seeded(seed);
  const parts: Buffer[] = [];
  if (shape.bom) parts.push(Buffer.from([0xef, 0xbb, 0xbf]));
  parts.push(Buffer.from(`id,${shape.columns.join(',')},note${shape.eol()}`));
  for (let i = 0; i < shape.rows; i++) {
    const fields = [String(i)];
    for (const c of shape.columns) {
      const v = rnd() < shape.noise ? NOISE[Math.floor(rnd() * NOISE.length)]! : FORMATS[c]!(i, rnd);
      fields.push(cell(v, rnd));
    }
    fields.push(cell(NOTES[Math.floor(rnd() * NOTES.length)]!, rnd));
    let line = fields.join(',');
    const broken = rnd() < shape.broken ? Math.floor(rnd() * 3) : -1;
    if (broken === 0) line = fields.slice(0, -1).join(','); // ragged: one field short
    if (broken === 1) line = `${line}x"y`; // bad quote: a quote inside an unquoted field (RFC 4180 §2.5)
    parts.push(Buffer.from(line));
    if (broken === 2) parts.push(Buffer.from([0xff, 0xfe])); // bytes that are not UTF-8
    parts.push(Buffer.from(shape.eol()));
  }
  const file = tmpFile('csv');
  writeFileSync(file, Buffer.concat(parts));
  return file;
}

const lf = (): string => '\n';
const crlf = (): string => '\r\n';
const mixedEol = (rnd: () => number) => (): string => (rnd() < 0.5 ? '\r\n' : '\n');

/** Holds the byte path to the string path on one file under one set of options (differential). */
async function expectSame(file: string, options: GrainOptions = {}): Promise<GrainReport> {
  const strings = await detectGrainFromStrings(file, options);
  const bytes = await detectGrain(file, options);
  expect(bytes).toEqual(strings);
  return bytes;
}

/** What a generated file must exercise for the comparison to mean something. */
function expectExercised(r: GrainReport, shape: FileShape): void {
  expect(r.columns.length).toBeGreaterThanOrEqual(shape.columns.length - 1);
  if (shape.broken > 0) expect(r.rejectedRows).toBeGreaterThan(0);
  if (shape.noise > 0) {
    expect(r.columns.some((c) => c.values.empty > 0)).toBe(true);
    expect(r.columns.some((c) => c.values.invalid > 0)).toBe(true);
  }
}

describe('detectGrain byte path equals the string path (differential)', () => {
  const all = Object.keys(FORMATS);
  const shapes: Array<[string, number, FileShape]> = [
    ['every format, LF, light noise', 1, { rows: 3000, eol: lf, columns: all, noise: 0.01, broken: 0 }],
    ['every format, CRLF, BOM, rejections', 2, { rows: 2500, eol: crlf, columns: all, noise: 0.02, broken: 0.01, bom: true }],
    ['mixed line ends, heavy noise and broken rows', 3, { rows: 2500, eol: mixedEol(seeded(33)), columns: all, noise: 0.2, broken: 0.05 }],
    ['offsets and Z only, clean', 4, { rows: 4000, eol: lf, columns: ['utc', 'chicago'], noise: 0, broken: 0 }],
    ['a head shorter than the head sample', 5, { rows: Math.floor(HEAD_SAMPLE / 3), eol: crlf, columns: all, noise: 0.05, broken: 0.02 }],
  ];

  it.each(shapes)('%s (seed %i): fast and reference tokenizers, several batch sizes', async (_name, seed, shape) => {
    const file = writeShape(seed, shape);
    expectExercised(await expectSame(file), shape);
    for (const engine of ['fast', 'reference'] as const) {
      if (engine === 'reference') await expectSame(file, { table: { engine } });
      await expectSame(file, { table: { engine, batchSize: 7 } });
    }
    await expectSame(file, { table: { chunkSize: 4096 } });
    await expectSame(file, { table: { batchSize: 333, chunkSize: 1000 } });
  });

  it('both tokenizers give the same report through the byte path', async () => {
    const file = writeShape(6, { rows: 2000, eol: crlf, columns: all, noise: 0.03, broken: 0.02 });
    expect(await detectGrain(file, { table: { engine: 'reference' } })).toEqual(await detectGrain(file));
  });

  it('named columns, a given zone and a day order keep their effect', async () => {
    const file = writeShape(7, { rows: 2000, eol: lf, columns: all, noise: 0.01, broken: 0.01 });
    await expectSame(file, { columns: ['chicago', 'dmy', 'id'] });
    await expectSame(file, { zone: 'America/Chicago' });
    await expectSame(file, { zone: '+05:30', columns: ['utc', 'local'] });
    await expectSame(file, { dayFirst: true });
    await expectSame(file, { monthFirst: true, columns: ['dmy'] });
  });

  it('standard input is read in one pass (no head look-ahead) with the same report', async () => {
    const file = writeShape(8, { rows: 1500, eol: crlf, columns: all, noise: 0.02, broken: 0.01 });
    const { readFileSync } = await import('node:fs');
    const data = readFileSync(file);
    const fromStdin = await detectGrain('-', { table: { stdin: Readable.from([data]) } });
    const fromFile = await detectGrainFromStrings(file);
    // Rejected rows are named after the input as given: '-' here, the path there.
    const named = (fromStdin.rejectedExamples ?? []).map((d) => ({ ...d, file }));
    expect(named.length).toBeGreaterThan(0);
    expect({ ...fromStdin, file, rejectedExamples: named }).toEqual(fromFile);
  });

  it('ambiguous day/month columns read under every candidate format give the same findings', async () => {
    // 01/02/2024 … 12/12/2024 only: day and month cannot be told apart (common practice).
    const rnd = seeded(9);
    const dates = Array.from({ length: 1800 }, () => `${pad(1 + Math.floor(rnd() * 12))}/${pad(1 + Math.floor(rnd() * 12))}/2024`);
    dates[1500] = '25/12/2024'; // past the head: settles the column as day first
    const file = tmpFile('csv');
    writeFileSync(file, `d,e\n${dates.map((d, i) => `${d},${dates[(i * 7) % dates.length]}`).join('\n')}\n`);
    await expectSame(file);
    await expectSame(file, { table: { batchSize: 5 } });
  });
});

describe('detectGrain byte path past the distinct-value cap and the head look-ahead (differential)', () => {
  it(`more than DISTINCT_CAP (${DISTINCT_CAP}) distinct instants: sketch, reservoir and streamed counts agree`, async () => {
    const rnd = seeded(10);
    const rows = DISTINCT_CAP + 20_000;
    const lines = ['ts,late,site'];
    for (let i = 0; i < rows; i++) {
      // Seconds apart with a few off-second values and invalid ones; `late` is empty through the head look-ahead.
      const at = BASE.add({ seconds: i * 7, milliseconds: rnd() < 0.003 ? 500 : 0 });
      const ts = rnd() < 0.001 ? 'bad' : at.toString();
      const late = i < HEAD_ROWS + 100 ? '' : BASE.add({ hours: i }).toString();
      lines.push(`${ts},${late},site${i % 13}`);
    }
    const file = tmpFile('csv');
    writeFileSync(file, `${lines.join('\r\n')}\r\n`);
    const strings = await detectGrainFromStrings(file);
    const bytes = await detectGrain(file);
    expect(bytes).toEqual(strings);
    // The case reaches what it is meant to test: the cap was passed and the late column was read.
    expect(bytes.columns[0]!.cadence?.distinctExact).toBe(false);
    expect(bytes.columns.map((c) => c.name)).toEqual(['ts', 'late']);
    expect(bytes.skipped.map((s) => s.name)).toEqual(['site']);
  });
});

describe('detectGrain byte path equals the string path on random small tables (property, differential)', () => {
  const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 25);
  // Values from every format above plus damaged ones; fields quoted at random (RFC 4180 §2.6–2.7).
  const value = fc.oneof(
    fc.constantFrom(...NOISE, '2024-01-01', '2024-01-01T00:00:00Z', '2024-03-10T02:30:00-06:00', '2024-W07', '2024-EW07', '1700000000', '05/04/2024'),
    fc.integer({ min: 0, max: 5000 }).map((i) => FORMATS.utc!(i, () => 0.5)),
    fc.integer({ min: 0, max: 5000 }).map((i) => FORMATS.chicago!(i, () => 0.1)),
    fc.integer({ min: 0, max: 5000 }).map((i) => FORMATS.day!(i, () => 0.5)),
  );
  const row = fc.tuple(value, value, fc.boolean(), fc.boolean());
  it('random rows past the head sample, quoting, CRLF or LF, batch size 1–50', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(row, { minLength: 1, maxLength: 60 }), fc.boolean(), fc.integer({ min: 1, max: 50 }), async (rows, crlf, batchSize) => {
        const eol = crlf ? '\r\n' : '\n';
        const q = (v: string, on: boolean): string => (on || /[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
        // Past the head sample (HEAD_SAMPLE values), so the byte hot loop runs: the rows repeat in turn.
        const all = Array.from({ length: HEAD_SAMPLE + 200 + rows.length }, (_, k) => rows[(k * 7) % rows.length]!);
        const text = `a,b${eol}${all.map(([a, b, qa, qb]) => `${q(a, qa)},${q(b, qb)}`).join(eol)}${eol}`;
        const file = tmpFile('csv');
        writeFileSync(file, text);
        await expectSame(file, { table: { batchSize } });
      }),
      { numRuns: RUNS },
    );
  });
});
