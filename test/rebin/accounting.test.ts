// Every row is accounted for: used, empty, rejected (by reason, with line) or outside the range; the
// summary adds up to the rows read. Local wall-clock times are placed by the documented rule and counted.
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { describe, expect, it } from 'vitest';
import { parseAggSpecs } from '../../src/rebin/index.js';
import { FUZZ_RUNS, rebinText } from './helpers.js';

describe('rebin(reader) row accounting', () => {
  it('counts empty times, invalid times and ragged rows by reason, with lines', async () => {
    const t = [
      'ts,v',
      '2024-01-01T00:00:00Z,1', // line 2: used
      ',2', // line 3: empty time
      '2024-02-30T00:00:00Z,3', // line 4: no such day (February 2024 has 29 days)
      'yesterday,4', // line 5: not a time
      '2024-01-01T05:00:00Z', // line 6: ragged (one field)
      '   ,5', // line 7: blank time
      '2024-01-02T00:00:00Z,6', // line 8: used
    ].join('\n');
    const r = await rebinText(`${t}\n`, { time: 'ts', calendar: { unit: 'day' } });
    const s = r.summary;
    expect(s).toMatchObject({ rowsRead: 7, rowsUsed: 2, rowsEmpty: 2, rowsRejected: 3, rowsOutside: 0 });
    expect(s.rejectedByReason).toEqual({ 'invalid-date': 1, 'not-recognised': 1, 'ragged-row': 1 });
    expect(s.examples.map((d) => d.line).sort()).toEqual([4, 5, 6]);
  });

  it('adds up for any mix of valid, empty, invalid and ragged rows (property)', async () => {
    const cell = fc.oneof(
      fc.integer({ min: 0, max: 10_000 }).map((h) => ({ kind: 'used', text: `${new Date(Date.UTC(2024, 0, 1) + h * 3600_000).toISOString()},1` })),
      fc.constant({ kind: 'empty', text: ',1' }),
      fc.constantFrom('2024-13-01T00:00:00Z,1', 'not a date,1', '2024-02-30,1').map((text) => ({ kind: 'rejected', text })),
      fc.constant({ kind: 'rejected', text: '2024-01-01T00:00:00Z,1,extra' }),
    );
    // At least one readable time, from which the column's format is inferred (a column with none is E_FORMAT).
    const first = { kind: 'used', text: '2024-01-01T00:00:00Z,1' };
    await fc.assert(fc.asyncProperty(fc.array(cell, { maxLength: 60 }).map((xs) => [first, ...xs]), async (rows) => {
      const r = await rebinText(`ts,v\n${rows.map((x) => x.text).join('\n')}\n`, { time: 'ts', calendar: { unit: 'week' }, aggregates: parseAggSpecs(['count', 'sum:v']) });
      const s = r.summary;
      const n = (k: string) => rows.filter((x) => x.kind === k).length;
      expect(s.rowsRead).toBe(rows.length);
      expect(s.rowsUsed).toBe(n('used'));
      expect(s.rowsEmpty).toBe(n('empty'));
      expect(s.rowsRejected).toBe(n('rejected'));
      expect(Object.values(s.rejectedByReason).reduce((a, b) => a + b, 0)).toBe(s.rowsRejected);
      expect(r.rows.reduce((a, x) => a + (x.values[0] ?? 0), 0)).toBe(n('used'));
    }), { numRuns: Math.min(FUZZ_RUNS, 200) });
  });
});

describe('rebin(reader) with an unreadable time column', () => {
  it('throws E_FORMAT when no value of the first rows is a time', async () => {
    await expect(rebinText('ts\nsoon\nlater\n', { time: 'ts', calendar: { unit: 'day' } })).rejects.toMatchObject({ code: 'E_FORMAT' });
  });
});

describe('rebin(reader) with wall-clock times (no offset) in a zone', () => {
  it('moves a skipped time forward and gives a repeated one the earlier instant, as Temporal "compatible" does', async () => {
    // New York 2024-03-10 02:30 does not exist (02:00 → 03:00); 2024-11-03 01:30 occurs twice (REFERENCES.md §5).
    const walls = ['2024-03-10T01:30:00', '2024-03-10T02:30:00', '2024-03-10T03:30:00', '2024-11-03T01:30:00', '2024-11-03T02:30:00'];
    const r = await rebinText(`ts\n${walls.join('\n')}\n`, { time: 'ts', calendar: { unit: 'hour', zone: 'America/New_York' }, fill: false });
    // Oracle: Temporal's 'compatible' disambiguation (forward for gaps, earlier for repeats).
    const expected = walls.map((w) => Temporal.PlainDateTime.from(w).toZonedDateTime('America/New_York', { disambiguation: 'compatible' }));
    const hourStart = (z: Temporal.ZonedDateTime) => z.round({ smallestUnit: 'hour', roundingMode: 'floor' }).epochMilliseconds;
    const starts = [...new Set(expected.map(hourStart))].sort((a, b) => a - b);
    expect(r.rows.map((x) => Date.parse(x.start))).toEqual(starts);
    // 02:30 (skipped) lands with 03:30 in the 03:00 EDT hour: that hour holds two rows.
    expect(r.rows.find((x) => x.start === '2024-03-10T03:00:00-04:00')?.values[0]).toBe(2);
    expect(r.rows.find((x) => x.start === '2024-11-03T01:00:00-04:00')?.values[0]).toBe(1); // the earlier 01:30 (EDT)
    expect(r.summary.localTime).toMatchObject({ nonexistent: 1, repeated: 1 });
  });

  it('notes that periods were cut in UTC when the values carry other offsets and no zone was given', async () => {
    const r = await rebinText('ts\n2024-01-01T23:30:00-06:00\n', { time: 'ts', calendar: { unit: 'day' } });
    expect(r.rows[0]!.period).toBe('2024-01-02'); // 23:30−06:00 is 05:30Z the next day
    expect(r.summary.notes.join(' ')).toContain('-06:00');
  });
});
