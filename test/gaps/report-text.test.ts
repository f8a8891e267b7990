// The words and strip of `quern gaps` (src/report/gaps.ts): runs read as the issue writes them.
import { describe, expect, it } from 'vitest';
import { gapsText, periodsWords, runWords, seriesStates } from '../../src/index.js';
import type { GapSeries, GapsResult } from '../../src/index.js';

describe('runWords(run, unit, step)', () => {
  it.each([
    // [from, to, periods, unit, step, words] — the form of the issue: "2021-W14 … 2021-W16, 3 weeks"
    ['2021-W14', '2021-W16', 3, 'iso-week', 1, '2021-W14 … 2021-W16, 3 weeks'],
    ['2024-05-29', '2024-05-29', 1, 'day', 1, '2024-05-29, 1 day'],
    ['2024-EW52', '2025-EW02', 3, 'epi-week', 1, '2024-EW52 … 2025-EW02, 3 weeks'],
    ['FY2024-Q1', 'FY2024-Q1', 1, 'fiscal-quarter', 1, 'FY2024-Q1, 1 fiscal quarter'],
    ['a', 'b', 36, 'minute', 15, 'a … b, 36 periods of 15 minutes (9 h)'],
    ['a', 'b', 1, 'hour', 6, 'a … b, 1 period of 6 hours (6 h)'],
  ])('runWords(%s … %s, %i %s×%i) is %j', (from, to, periods, unit, step, words) => {
    expect(runWords({ from, to, periods, index: 0 }, unit, step)).toBe(words);
  });

  it('periodsWords says "1 half" and "2 halves"', () => {
    expect(periodsWords(1, 'half', 1)).toBe('1 half');
    expect(periodsWords(2, 'half', 1)).toBe('2 halves');
  });
});

const series: GapSeries = {
  key: 'F-02', group: ['F-02'], first: 'w1', last: 'w8', rows: 7, expected: 8, present: 6,
  missing: [{ from: 'w3', to: 'w4', periods: 2, index: 2 }], duplicates: [{ period: 'w6', count: 2, index: 5 }],
  coverage: 0.75, longestGap: null, unexpected: 0,
};

describe('seriesStates(series) and gapsText(result)', () => {
  it('marks missing and duplicated positions among the expected periods', () => {
    expect(seriesStates(series)).toEqual(['present', 'present', 'missing', 'missing', 'present', 'duplicated', 'present', 'present']);
  });

  it('draws a strip and lists runs and duplicates per series', () => {
    const result: GapsResult = {
      unit: 'iso-week', step: 1, zone: 'UTC', unitBasis: 'given with --unit', weekdays: false, skippedDates: 0, maxGap: null,
      duplicatesReported: true, series: [series], problems: true,
      summary: { file: 'f.csv', rowsRead: 7, rowsUsed: 7, rowsEmpty: 0, rowsRejected: 0, rejectedByReason: {}, rowsOutside: 0, examples: [], localTime: { nonexistent: 0, repeated: 0 }, timeFormat: { id: 'iso-week', label: 'ISO week', kind: 'period' } },
    };
    const text = gapsText(result);
    expect(text).toContain('██··█▲██');
    expect(text).toContain('missing w3 … w4, 2 weeks');
    expect(text).toContain('duplicated w6: 2 rows');
    expect(text).toContain('coverage 75.0%');
    expect(text).toContain('result: gaps in 1 of 1 series, duplicates in 1 of 1 series');
  });
});
