// rebin reads the time column from bytes on the fast engine and from strings on the reference engine
// (csv-parse, then the string parser): both give the same rows and the same summary — examples,
// reasons and extremes included — on files whose time values are everything a column may hold: blank,
// padded, quoted (with doubled quotes), invalid (2021-02-29, 24:01, a bad offset), 24:00, a leap
// second, local readings in a daylight-saving change, dates that are periods, and non-ASCII text.
import { describe, expect, it } from 'vitest';
import type { UnitName } from '../../src/calendar/types.js';
import { parseAggSpecs, rebin } from '../../src/rebin/index.js';
import type { RebinOptions } from '../../src/rebin/index.js';
import { openTable } from '../../src/table/index.js';
import { seeded, tableFile } from './helpers.js';

// Odd values, each with why it is there (rules from DEVELOPERS.md "Time values"; RFC 4180 §2.7 for quotes).
const ODD = [
  '', // empty: counted as empty
  '   ', // blank: counted as empty
  ' 2024-03-10T08:15:00Z ', // padded: read by the general path
  '"2024-03-10T08:15:00Z"', // quoted
  '"2024-03-10T08:15:00Z"""', // quoted with a doubled quote: not a time
  '2021-02-29T10:00:00Z', // no such day (2021 is not a leap year)
  '2024-03-10T24:01:00Z', // nothing comes after 24:00
  '2024-03-10T24:00:00Z', // the end of the day: the next day's 00:00
  '2016-12-31T23:59:60Z', // a leap second (RFC 3339 §5.7)
  '2024-03-10T08:15:00+25:00', // no such offset
  '2024-03-10T08:15:00.123456-05:00', // fraction truncated to the millisecond
  '2024-03-10t08:15:00z', // lowercase t and z (RFC 3339 §5.6 note)
  '2024-03-10 08:15:00+05:30', // space between date and time
  '2024-06-01T10:00:00Z\u00e9', // non-ASCII after a valid value
  '\u00e92024-06-01T10:00:00Z', // non-ASCII before it
];

function generated(rows: number, seed: number, crlf: boolean): string {
  const rnd = seeded(seed);
  const lines = ['ts,site,amount'];
  for (let i = 0; i < rows; i++) {
    const t = Date.UTC(2023, 0, 1) + Math.floor(rnd() * 2 * 365 * 86_400) * 1000;
    const ts = rnd() < 0.15 ? ODD[Math.floor(rnd() * ODD.length)]! : new Date(t).toISOString();
    lines.push(`${ts},${i % 3 === 0 ? '"a, ""b"""' : `s${i % 4}`},${(rnd() * 100).toFixed(2)}`);
  }
  return `${lines.join(crlf ? '\r\n' : '\n')}${crlf ? '\r\n' : '\n'}`;
}

async function both(file: string, options: RebinOptions) {
  const run = async (engine: 'fast' | 'reference') => {
    const reader = await openTable(file, { engine, chunkSize: 4096 });
    try {
      return await rebin(reader, options);
    } finally {
      reader.close();
    }
  };
  return Promise.all([run('fast'), run('reference')]);
}

describe('rebin(reader) reads the time column from bytes as from strings', () => {
  const UNITS: UnitName[] = ['hour', 'day', 'iso-week', 'epi-week', 'month', 'quarter', 'fiscal-year'];
  const ZONES = ['UTC', 'America/New_York', 'Asia/Kolkata'];
  const file = tableFile(generated(3000, 8601, true));
  it.each(UNITS.flatMap((u) => ZONES.map((z) => [u, z] as const)))('rebin(%s, %s): fast (bytes) = reference (strings)', async (unit, zone) => {
    const [fast, reference] = await both(file, {
      time: 'ts', calendar: { unit, zone }, by: ['site'], fill: unit !== 'hour', timeFormat: 'iso-date-time-offset', maxExamples: 50,
      aggregates: parseAggSpecs(['count', 'sum:amount']),
    });
    expect(fast.rows).toEqual(reference.rows);
    expect(fast.summary).toEqual(reference.summary);
    expect(fast.summary.rowsEmpty).toBeGreaterThan(0);
    expect(Object.keys(fast.summary.rejectedByReason).length).toBeGreaterThan(2);
  });

  it('infers the format from the same first rows on both paths, across chunk ends', async () => {
    const f = tableFile(generated(5000, 7, false));
    const [fast, reference] = await both(f, { time: 'ts', calendar: { unit: 'month', zone: 'Europe/London' } });
    expect(fast.summary.timeFormat).toEqual(reference.summary.timeFormat);
    expect(fast.rows).toEqual(reference.rows);
    expect(fast.summary).toEqual(reference.summary);
  });

  it('reads wall-clock readings (no offset) in a daylight-saving zone alike', async () => {
    // 2024-03-10 02:30 does not exist in New York and 2024-11-03 01:30 occurs twice (IANA tz database).
    const text = 'ts\n2024-03-10T02:30:00\n2024-11-03T01:30:00\n2024-11-03T03:00:00\n\n2024-13-01T00:00:00\n';
    const [fast, reference] = await both(tableFile(text), { time: 'ts', calendar: { unit: 'hour', zone: 'America/New_York' }, fill: false });
    expect(fast.rows).toEqual(reference.rows);
    expect(fast.summary).toEqual(reference.summary);
    expect(fast.summary.localTime.nonexistent).toBe(1);
    expect(fast.summary.localTime.repeated).toBe(1);
  });
});
