// rebin's summary notes: a filled period next to rejected rows says that it may be empty only because its
// row was rejected. Expected periods from the ISO 8601 calendar (January–March 2024 are three months, from memory).
import { describe, expect, it } from 'vitest';
import { parseAggSpecs } from '../../src/rebin/index.js';
import { rebinText } from './helpers.js';

const options = { time: 'ts', calendar: { unit: 'month' as const }, aggregates: parseAggSpecs(['count']) };

describe('rebin(reader) summary notes on rejected rows', () => {
  it('a month left empty while a February value was rejected gets the note', async () => {
    // 2024-02-30 is no date (February 2024 has 29 days), so February is filled with count 0.
    const r = await rebinText('ts\n2024-01-10T00:00:00Z\n2024-02-30T00:00:00Z\n2024-03-10T00:00:00Z\n', options);
    expect(r.rows.map((x) => [x.period, x.values[0], x.filled])).toEqual([['2024-01', 1, false], ['2024-02', 0, true], ['2024-03', 1, false]]);
    expect(r.summary.notes).toContain('1 filled row holds no source row while 1 row was rejected: a period may be empty only because its row was rejected (see the examples)');
  });

  it('no note when nothing was rejected, or when no period was filled', async () => {
    const gap = await rebinText('ts\n2024-01-10T00:00:00Z\n2024-03-10T00:00:00Z\n', options);
    expect(gap.summary.filledRows).toBe(1);
    expect(gap.summary.notes.some((n) => n.includes('rejected'))).toBe(false);
    const full = await rebinText('ts\n2024-01-10T00:00:00Z\nnot a time\n2024-02-10T00:00:00Z\n', options);
    expect(full.summary.rowsRejected).toBe(1);
    expect(full.summary.notes.some((n) => n.includes('rejected'))).toBe(false);
  });
});
