// rebin's instant tally (src/rebin/instant-tally.wat and .ts), which counts ISO 8601 instants into periods
// straight from the record kernel's output: the instants it reads against the Temporal polyfill's
// Instant.from (an independent reader of RFC 3339 / ISO 8601 date-times) and against the JavaScript lane it
// stands for (src/time/iso-bytes.ts); and whole rebins that use it against the csv-parse reference path,
// which never does, on files with every shape of value it must leave to the ordinary path.
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { makeCalendar } from '../../src/calendar/index.js';
import type { UnitName } from '../../src/calendar/types.js';
import { CellStore } from '../../src/rebin/accumulate.js';
import { emptyExtremes } from '../../src/rebin/fill.js';
import { parseAggSpecs, rebin } from '../../src/rebin/index.js';
import { InstantTally, MAX_TALLY_PERIODS } from '../../src/rebin/instant-tally.js';
import { INSTANT_TALLY_WASM } from '../../src/rebin/instant-tally-wasm.js';
import type { RebinOptions } from '../../src/rebin/types.js';
import { recordKernel } from '../../src/table/structurals.js';
import { openTable } from '../../src/table/index.js';
import { FIRST_READ } from '../../src/table/source.js';
import { fastIsoBytes } from '../../src/time/iso-bytes.js';
import { emptyParsedTime } from '../../src/time/types.js';
import { seeded, tableFile } from './helpers.js';
// @ts-expect-error a plain JavaScript helper shared with the build script
import { compileWat } from '../wasm/compile.mjs';

const BASE = Date.UTC(2024, 1, 29, 23, 59, 50); // a leap day, ten seconds before midnight

/**
 * Runs the tally over `texts`, one value per record, each record offered alone (as the reader offers the
 * one after a record the tally left); returns which records it counted and the count per period key.
 */
function tallyEach(texts: string[], unit: UnitName, zone: string, offsets = new Set<number>()): { counted: boolean[]; keys: Map<number, number> } {
  const k = recordKernel()!;
  const cal = makeCalendar({ unit, zone });
  const store = new CellStore([]);
  const tally = new InstantTally({ cal, store, fromKey: -Infinity, untilKey: Infinity, offsets });
  const buf = Buffer.from(`${texts.join('\n')}\n`, 'utf8');
  expect(buf.length).toBeLessThan(65_536);
  k.state.set([0, 0, 0, -1, 0, 0, 0]);
  k.input.set(buf);
  // Tab-separated, so that a decimal comma stays inside the field.
  const n = k.records(buf.length, 0, 1, 4, 0x7fffffff, 0, 9);
  expect(n).toBe(texts.length);
  const counted: boolean[] = [];
  for (let r = 0; r < n; r++) counted.push(tally.take(k, buf, r, r + 1, 4, 0, 0, 2 + r) === r + 1);
  tally.finish(emptyExtremes());
  const keys = new Map<number, number>();
  for (let c = 0; c < store.size; c++) keys.set(store.key[c]!, store.count[c]!);
  return { counted, keys };
}

/** The instant the JavaScript lane reads in `text`, with its offset, or null when it reads none there. */
function laneInstant(text: string): { ms: number; offset: number } | null {
  const pt = emptyParsedTime();
  const b = Buffer.from(text, 'utf8');
  if (!fastIsoBytes(b, 0, b.length, pt) || pt.kind !== 'instant') return null;
  return { ms: pt.ms, offset: pt.offset };
}

const pad = (n: number, w: number): string => String(n).padStart(w, '0');

/** Date-times near BASE in every written form the lane reads, and near misses of each part. */
const isoText = fc.record({
  ms: fc.integer({ min: BASE - 20_000, max: BASE + 20_000 }),
  sep: fc.constantFrom('T', 't', ' ', 'T', 'T', '_'),
  frac: fc.oneof(fc.constant(''), fc.stringMatching(/^[.,][0-9]{1,9}$/), fc.constantFrom('.', ',5', '.1234567890123')),
  tail: fc.constantFrom('Z', 'z', '+00:00', '-00:00', '+05:45', '-03:30', '+14:00', '', 'Z ', '+5:45', '+24:00', '-03:60', 'UTC', '+0545'),
  break: fc.option(fc.record({ at: fc.integer({ min: 0, max: 18 }), to: fc.constantFrom('/', '9', '0', ':', 'a', '\u0660') }), { freq: 3 }),
}).map(({ ms, sep, frac, tail, break: br }) => {
  const d = new Date(ms);
  let text = `${pad(d.getUTCFullYear(), 4)}-${pad(d.getUTCMonth() + 1, 2)}-${pad(d.getUTCDate(), 2)}${sep}` +
    `${pad(d.getUTCHours(), 2)}:${pad(d.getUTCMinutes(), 2)}:${pad(d.getUTCSeconds(), 2)}${frac}${tail}`;
  if (br !== null) text = text.slice(0, br.at) + br.to + text.slice(br.at + 1);
  return text;
});

describe('the instant tally reads instants as the JavaScript lane and Temporal do', () => {
  it('is the module its source compiles to', async () => {
    const source = readFileSync(new URL('../../src/rebin/instant-tally.wat', import.meta.url), 'utf8');
    expect(Buffer.from(await compileWat(source, 'instant-tally.wat')).toString('base64')).toBe(INSTANT_TALLY_WASM);
  });

  it('counts exactly the UTC and noted-offset instants the lane reads, each in its millisecond', () => {
    fc.assert(fc.property(fc.array(isoText, { minLength: 1, maxLength: 40 }), (texts) => {
      // +05:45 is noted by the scan; -03:30 and +14:00 are not yet, so the tally leaves them to it.
      // Each value in a tally of its own (a value far from the first would be outside its table).
      const each = texts.map((t) => tallyEach([t], 'millisecond', 'UTC', new Set([345])));
      const counted = each.map((e) => e.counted[0]);
      const keys = new Map<number, number>();
      for (const e of each) for (const [k, v] of e.keys) keys.set(k, (keys.get(k) ?? 0) + v);
      const expected = new Map<number, number>();
      texts.forEach((text, r) => {
        const lane = laneInstant(text);
        const takes = lane !== null && (lane.offset === 0 || lane.offset === 345);
        expect({ text, counted: counted[r] }).toEqual({ text, counted: takes });
        if (!takes) return;
        // Temporal.Instant.from reads RFC 3339 date-times (T, t or space; Z, z or an offset; up to 9
        // fraction digits, '.' or ','); epochMilliseconds floors the nanoseconds, as the tally drops digits.
        if (!/[.,][0-9]{10,}/.test(text)) expect(lane.ms).toBe(Temporal.Instant.from(text).epochMilliseconds);
        expected.set(lane.ms, (expected.get(lane.ms) ?? 0) + 1);
      });
      expect(keys).toEqual(expected);
    }), { numRuns: 300 });
  });

  it('checks every date part: month lengths, leap years (Gregorian), years 0000 to 9999', () => {
    const texts = [
      '2023-02-29T12:00:00Z', '2024-02-29T12:00:00Z', '1900-02-29T12:00:00Z', '2000-02-29T12:00:00Z', '2100-02-29T00:00:00Z',
      '2023-04-31T00:00:00Z', '2023-04-30T00:00:00Z', '2023-06-31T00:00:00Z', '2023-09-31T00:00:00Z', '2023-11-31T00:00:00Z',
      '2023-07-31T00:00:00Z', '2023-08-31T00:00:00Z', '2023-12-31T23:59:59Z', '2023-13-01T00:00:00Z', '2023-00-10T00:00:00Z',
      '2023-01-00T00:00:00Z', '0000-01-01T00:00:00Z', '0000-02-29T00:00:00Z', '9999-12-31T23:59:59.999Z', '2023-01-01T24:00:00Z',
      '2023-01-01T23:59:60Z', '2023-01-01T23:60:00Z', '2023-01-01T30:00:00Z', '2023/01/01T00:00:00Z', '2023-01-01T00-00-00Z',
      '\u0000\u0000\u0000\u0000\u0000\u0000\u0000\u0000\u0000\u0000T00:00:00Z', ' 2023-01-01T00:00:00Z',
    ];
    // Each value in a tally of its own, so that none is too far from the first to be in its table.
    const each = texts.map((t) => tallyEach([t], 'day', 'UTC'));
    const counted = each.map((e) => e.counted[0]);
    // Gregorian calendar rules (ISO 8601 §4.3.2, from memory): 1900 and 2100 are not leap years, 2000 and 0000 are.
    const takes = texts.map((t) => laneInstant(t) !== null);
    expect(counted).toEqual(takes);
    expect(takes.filter(Boolean).length).toBe(9);
    const days = each.flatMap((e) => [...e.keys.keys()]).map((d) => new Date(d * 86_400_000).toISOString().slice(0, 10));
    expect(days).toContain('0000-02-29');
    expect(days).toContain('9999-12-31');
    expect(days).toContain('2024-02-29');
    expect(days).not.toContain('2023-03-01');
  });
});

/** A file of `rows` rows whose time column mixes every shape of value, in a seeded order. */
function mixed(rows: number, seed: number, crlf: boolean, spread = 3 * 365 * 86_400_000): string {
  const rnd = seeded(seed);
  const start = Date.UTC(2022, 0, 1);
  const odd = [
    '2023-06-01T08:00:00', '2023-03-26T01:30:00', '2023-02-29T10:00:00Z', '2023-01-01T24:00:00Z',
    '2016-12-31T23:59:60Z', '', '  ', 'soon', ' 2023-05-05T05:05:05Z', '2023-05-05T05:05:05+01:00', '2023-05-05T05:05:05-07:00',
    '2023-05-05T05:05:05+05:45', '2023-05-05T05:05:05+09:30', '2023-05-05T05:05:05-03:30', '2023-05-05T05:05:05-00:00',
    '"2023-07-07T07:07:07Z"', '"2023-07-07T07:07:07.5+02:00"', '2001-01-01T00:00:00Z', '2039-12-31T23:59:59.999Z',
  ];
  const lines = ['ts,site,n'];
  for (let i = 0; i < rows; i++) {
    const roll = rnd();
    let ts: string;
    if (roll < 0.04) ts = odd[Math.floor(rnd() * odd.length)]!;
    else {
      // Mostly in time order, with a little jitter and now and then a value from anywhere in the spread.
      const ms = roll < 0.06 ? start + Math.floor(rnd() * spread) : start + Math.floor((i / rows) * spread + rnd() * 600_000);
      const iso = new Date(ms).toISOString();
      ts = roll < 0.5 ? iso.slice(0, 19) + 'Z' : roll < 0.55 ? iso.replace('T', ' ') : iso;
    }
    lines.push(roll > 0.999 ? ts : `${ts},s${i % 7},${i % 13}`); // a few ragged rows
  }
  const eol = crlf ? '\r\n' : '\n';
  return lines.join(eol) + eol;
}

async function rebinFile(file: string, options: RebinOptions, engine: 'fast' | 'reference', chunkSize?: number) {
  const reader = await openTable(file, { engine, ...(chunkSize !== undefined ? { chunkSize } : {}) });
  try {
    return await rebin(reader, options);
  } finally {
    reader.close();
  }
}

describe('rebin with the instant tally is rebin without it', () => {
  afterEach(() => vi.restoreAllMocks());

  const UNITS: UnitName[] = ['minute', 'hour', 'day', 'week', 'iso-week', 'epi-week', 'month', 'quarter', 'half', 'year', 'fiscal-year', 'fiscal-quarter', 'fiscal-month'];
  const ZONES = ['UTC', 'America/New_York', 'Australia/Lord_Howe', 'Asia/Kathmandu'];
  const plain = tableFile(mixed(12_000, 11, false));
  const crlf = tableFile(mixed(12_000, 12, true));

  it.each(UNITS.flatMap((u) => ZONES.map((z) => [u, z] as const)))('count per %s in %s: rows and summary as the reference path gives', async (unit, zone) => {
    const finish = vi.spyOn(InstantTally.prototype, 'finish');
    for (const file of [plain, crlf]) {
      const options: RebinOptions = {
        time: 'ts', calendar: { unit, zone }, aggregates: parseAggSpecs(['count']),
        fill: unit !== 'minute' && unit !== 'hour', maxPeriods: 500_000,
      };
      const fast = await rebinFile(file, options, 'fast', 1 << 14);
      const reference = await rebinFile(file, options, 'reference');
      expect(fast.rows).toEqual(reference.rows);
      expect(fast.summary).toEqual(reference.summary);
      expect(fast.summary.rowsRead).toBe(12_000);
    }
    // The tally did count most rows (the check would hold vacuously without it), except for minutes:
    // 11 rows a day over three years are too few to pay for moving its table along 1.6 million periods.
    const used = finish.mock.results.map((r) => r.value as number);
    expect(used.length).toBe(2);
    for (const u of used) expect(u).toBeGreaterThan(unit === 'minute' ? 0 : 8_000);
  });

  it('gives the same first and last periods, lines and values included, and the same offset note', async () => {
    const options: RebinOptions = { time: 'ts', calendar: { unit: 'day' }, aggregates: parseAggSpecs(['count']), maxPeriods: 500_000 };
    const fast = await rebinFile(plain, options, 'fast', 1 << 12);
    const reference = await rebinFile(plain, options, 'reference');
    expect(fast.summary).toEqual(reference.summary);
    expect(fast.rows[0]!.period).toBe('2001-01-01');
    expect(fast.rows.at(-1)!.period).toBe('2039-12-31');
    expect(fast.summary.notes.join(' ')).toMatch(/offsets/);
  });

  it('keeps --from and --until: rows outside them are counted as outside', async () => {
    const options: RebinOptions = {
      time: 'ts', calendar: { unit: 'week' }, aggregates: parseAggSpecs(['count']),
      from: Date.UTC(2022, 5, 1), until: Date.UTC(2023, 5, 1),
    };
    const fast = await rebinFile(plain, options, 'fast', 1 << 13);
    const reference = await rebinFile(plain, options, 'reference');
    expect(fast.rows).toEqual(reference.rows);
    expect(fast.summary).toEqual(reference.summary);
    expect(fast.summary.rowsOutside).toBeGreaterThan(5_000);
  });

  it('moves its table over more periods than it holds, in time order and in no order', async () => {
    // Minutes over 60 days (86,400 periods) are more than the table holds.
    expect(60 * 1440).toBeGreaterThan(MAX_TALLY_PERIODS);
    const sorted = tableFile(mixed(30_000, 21, false, 60 * 86_400_000));
    const rnd = seeded(22);
    const shuffled = tableFile(['ts', ...Array.from({ length: 30_000 }, () => new Date(Date.UTC(2024, 0, 1) + Math.floor(rnd() * 60 * 86_400_000)).toISOString())].join('\n') + '\n');
    for (const file of [sorted, shuffled]) {
      const options: RebinOptions = { time: 'ts', calendar: { unit: 'minute', zone: 'Europe/Berlin' }, aggregates: parseAggSpecs(['count']), fill: false };
      const fast = await rebinFile(file, options, 'fast', 1 << 15);
      const reference = await rebinFile(file, options, 'reference');
      expect(fast.rows).toEqual(reference.rows);
      expect(fast.summary).toEqual(reference.summary);
    }
  });

  it('gives each of two rebins read at once in one thread its own counts', async () => {
    const a: RebinOptions = { time: 'ts', calendar: { unit: 'month', zone: 'America/New_York' }, aggregates: parseAggSpecs(['count']), maxPeriods: 500_000 };
    const b: RebinOptions = { time: 'ts', calendar: { unit: 'hour' }, aggregates: parseAggSpecs(['count']), fill: false };
    const [fa, fb] = await Promise.all([rebinFile(plain, a, 'fast', 1 << 12), rebinFile(crlf, b, 'fast', 1 << 12)]);
    expect(fa.rows).toEqual((await rebinFile(plain, a, 'reference')).rows);
    expect(fb.rows).toEqual((await rebinFile(crlf, b, 'reference')).rows);
    expect(fa.summary.rowsUsed + fa.summary.rowsEmpty + fa.summary.rowsRejected).toBe(12_000);
  });

  it('counts every row after the first read, records across the kernel\'s 64 KiB spans included', async () => {
    // The first read's rows settle the formats and go the ordinary way; from the next read on, the tally
    // is there (the first batch is handed on as soon as its read is walked), and no row crosses a span
    // (each span begins at the record the last one left unfinished), so it counts every later row.
    for (const eol of ['\n', '\r\n']) {
      const rnd = seeded(eol.length);
      const rows = Array.from({ length: 40_000 }, (_, i) =>
        `${new Date(Date.UTC(2024, 0, 1) + i * 60_000).toISOString().slice(0, 19)}Z,${'s'.repeat(Math.floor(rnd() * 20))},${i}`);
      const text = ['ts,site,n', ...rows].join(eol) + eol;
      let inFirst = 0;
      for (let at = text.indexOf(eol) + eol.length, r = 0; r < rows.length; r++) {
        at += rows[r]!.length + eol.length;
        if (at <= FIRST_READ) inFirst++;
      }
      const file = tableFile(text);
      const finish = vi.spyOn(InstantTally.prototype, 'finish');
      const options: RebinOptions = { time: 'ts', calendar: { unit: 'hour' }, aggregates: parseAggSpecs(['count']), fill: false };
      const fast = await rebinFile(file, options, 'fast');
      expect(fast.rows).toEqual((await rebinFile(file, options, 'reference')).rows);
      expect(inFirst).toBeGreaterThan(2_000);
      expect(finish.mock.results.map((r) => r.value)).toEqual([rows.length - inFirst]);
      finish.mockRestore();
    }
  });

  it('is not used for groups or measures, and stops after many values it cannot read', async () => {
    const finish = vi.spyOn(InstantTally.prototype, 'finish');
    const take = vi.spyOn(InstantTally.prototype, 'take');
    const dates = tableFile(['ts', ...Array.from({ length: 20_000 }, (_, i) => new Date(Date.UTC(2020, 0, 1) + i * 3_600_000).toISOString().slice(0, 10))].join('\n') + '\n');
    const options: RebinOptions = { time: 'ts', calendar: { unit: 'month' }, aggregates: parseAggSpecs(['count']), maxPeriods: 500_000 };
    const fast = await rebinFile(dates, options, 'fast', 1 << 12);
    expect(fast.rows).toEqual((await rebinFile(dates, options, 'reference')).rows);
    expect(finish.mock.results.map((r) => r.value)).toEqual([0]);
    // Offered the dates one by one, it gave up after a few hundred (not 18,000).
    expect(take.mock.calls.length).toBeGreaterThan(100);
    expect(take.mock.calls.length).toBeLessThan(400);
    await rebinFile(plain, { ...options, by: ['site'] }, 'fast');
    await rebinFile(plain, { ...options, aggregates: parseAggSpecs(['count', 'sum:n']) }, 'fast');
    expect(finish).toHaveBeenCalledTimes(1);
  });
});
