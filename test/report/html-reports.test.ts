import { describe, expect, it } from 'vitest';
import type { RebinResult } from '../../src/rebin/types.js';
import type { GapsResult } from '../../src/gaps/types.js';
import type { BucketRunResult } from '../../src/bins/index.js';
import type { ProfileReport } from '../../src/profile/types.js';
import type { GrainReport } from '../../src/grain/types.js';
import type { OverlapsResult } from '../../src/report/overlaps.js';
import { renderRebinReport } from '../../src/report/html/rebin.js';
import { renderGapsReport } from '../../src/report/html/gaps.js';
import { renderBucketReport } from '../../src/report/html/bucket.js';
import { renderProfileReport } from '../../src/report/html/profile.js';
import { renderGrainReport } from '../../src/report/html/grain.js';
import { renderOverlapsReport } from '../../src/report/html/overlaps.js';
import { addToCycles, emptyCycles } from '../../src/report/html/cycles.js';

const EVIL = '<script>alert(1)</script>';
const IMG = '<img src=x onerror=alert(1)>';
const count = (text: string, re: RegExp) => (text.match(re) ?? []).length;

/** Nothing from the data may become markup: no script, no img, no event handler, no link. */
function expectInert(page: string): void {
  expect(page).not.toMatch(/<script/i);
  expect(page).not.toMatch(/<img/i);
  expect(page).not.toMatch(/<[a-z][^>]*\son[a-z]+=/i); // no event-handler attribute inside any tag
  expect(page).not.toMatch(/<a\s/i);
  expect(page).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
}

function row(period: string, group: string[], value: number | null, filled = false) {
  return { period, start: `${period}T00:00-06:00`, end: '', group, values: [value], filled };
}

const rebin: RebinResult = {
  unit: 'month', step: 1, zone: 'America/Chicago', weekStart: 1, fiscalStart: { month: 10, day: 1 }, fiscalLabel: 'end', quantileType: 7,
  columns: ['period', 'start', 'end', 'clinic', 'count'], groupColumns: ['clinic'], aggregates: ['count'],
  rows: [row('2024-01', ['Alderbrook'], 5), row('2024-02', ['Alderbrook'], 0, true), row('2024-01', [EVIL], 2), row('2024-02', [EVIL], 7)],
  summary: {
    file: 'visits.csv', rowsRead: 15, rowsUsed: 14, rowsEmpty: 1, rowsRejected: 0, rejectedByReason: {}, rowsOutside: 0,
    examples: [{ code: 'invalid-date', file: 'visits.csv', line: 9, column: 'visit_time', value: IMG, message: 'not a date' }],
    periods: 2, groups: 2, filledRows: 1, localTime: { nonexistent: 0, repeated: 0, rule: 'compatible' },
    timeFormat: { id: 'iso', label: 'ISO 8601', kind: 'instant' }, sourcePeriods: null, measures: [], notes: [],
  },
};

describe('renderRebinReport(result)', () => {
  const page = renderRebinReport(rebin);

  it('renderRebinReport(result) draws one small chart per group on a shared scale, filled periods hatched', () => {
    expect(count(page, /<svg class="q-chart"/g)).toBe(3); // two groups + the row accounting
    expect(count(page, /Shared scale up to 7\./g)).toBe(2);
    expect(count(page, /class="q-filled"/g)).toBe(1);
    expect(page).toContain('(filled)');
  });

  it('renderRebinReport(result) lays the numbers out as a period × group table', () => {
    expect(page).toContain('<caption>count per month and clinic</caption>');
    expect(page).toMatch(/<th scope="row">2024-02<\/th><td class="q-n">0 <span class="q-note">\(filled\)<\/span><\/td><td class="q-n">7<\/td>/);
  });

  it('renderRebinReport(result) accounts for every row and escapes group names and rejected values', () => {
    expect(page).toContain('The lines add up to the 15 rows read.');
    expectInert(page);
  });

  it('renderRebinReport(result) warns when the accounting does not add up', () => {
    const broken = renderRebinReport({ ...rebin, summary: { ...rebin.summary, rowsRead: 16 } });
    expect(broken).toContain('The lines add up to 15, not to the 16 rows read.');
  });
});

const gaps: GapsResult = {
  unit: 'day', step: 1, zone: 'UTC', unitBasis: 'given', weekdays: false, skippedDates: 0, maxGap: null, problems: true,
  series: [{
    key: EVIL, group: [EVIL], first: '2024-01-01', last: '2024-01-10', rows: 10, expected: 10, present: 8,
    missing: [{ from: '2024-01-04', to: '2024-01-05', periods: 2, index: 3 }], duplicates: [{ period: '2024-01-08', count: 2, index: 7 }],
    coverage: 0.8, longestGap: { from: '2024-01-04', to: '2024-01-05', periods: 2, index: 3 }, unexpected: 0,
  }],
  summary: { file: 'f.csv', rowsRead: 10, rowsUsed: 10, rowsEmpty: 0, rowsRejected: 0, rejectedByReason: {}, rowsOutside: 0, examples: [], localTime: { nonexistent: 0, repeated: 0 }, timeFormat: { id: 'd', label: 'date', kind: 'local' } },
};

describe('renderGapsReport(result)', () => {
  const page = renderGapsReport(gaps);

  it('renderGapsReport(result) draws each series as a calendar with real period labels', () => {
    expect(page).toContain('<title>2024-01-04 to 2024-01-05 (2): missing</title>');
    expect(page).toContain('<title>2024-01-08: duplicated, 2 rows</title>');
    expect(count(page, /class="q-missing"/g)).toBe(1);
    expect(page).toContain('>Mon</text>');
  });

  it('renderGapsReport(result) lists missing runs and duplicates beside the grid', () => {
    expect(page).toMatch(/<th scope="row">2024-01-04 … 2024-01-05<\/th><td>missing<\/td><td class="q-n">2<\/td>/);
    expect(page).toContain('duplicated (2 rows)');
    expectInert(page);
  });
});

const bucket: BucketRunResult = {
  summary: {
    file: 'v.csv', value: 'patient_age', source: 'edges 0,5', discrete: true, closed: 'left', rowsRead: 10, rowsRejected: 0, rejectedByReason: {}, bucketed: 6,
    buckets: [
      { index: 0, label: '0-4', low: 0, high: 5, lowClosed: true, highClosed: false, count: 4, share: 4 / 6 },
      { index: 1, label: EVIL, low: 5, high: null, lowClosed: true, highClosed: false, count: 2, share: 2 / 6 },
    ],
    below: { count: 1, examples: [{ line: 3, value: '-1' }] }, above: { count: 0, examples: [] }, between: { count: 0, examples: [] },
    empty: { count: 2, examples: [], byReason: {} }, invalid: { count: 1, examples: [{ line: 7, value: IMG }], byReason: {} },
    nonInteger: { count: 0, examples: [] }, merged: [], notes: [],
  },
  set: { buckets: [], discrete: true, closed: 'left', source: 'edges 0,5', merged: [], notes: [] },
  numberFormat: { format: { decimal: '.', group: '' } as never, inferred: null },
  passes: 1,
};

describe('renderBucketReport(result)', () => {
  const page = renderBucketReport(bucket);

  it('renderBucketReport(result) draws the ranges in order with counts and shares', () => {
    expect(page).toContain('4 · 66.7%');
    expect(page).toMatch(/<th scope="row">0-4<\/th><td>\[0, 5\)<\/td><td class="q-n">4<\/td><td class="q-n">66.7%<\/td>/);
    expect(page).toContain('[5, +∞)');
  });

  it('renderBucketReport(result) shows the rows in no range apart, and they add up', () => {
    expect(page).toContain('below the first range: 1');
    expect(page).toContain('The lines add up to the 10 rows read.');
    expectInert(page);
  });
});

const profile: ProfileReport = {
  file: 'v.csv', rows: 10, rejectedRows: 0,
  shape: { kind: 'items', key: ['id'], measures: [], alternatives: [], reason: 'id names each row', checkedRows: 10 },
  columns: [
    { name: 'clinic', level: 'categorical', role: 'category', reason: '2 labels', distinct: 2, distinctExact: true, empty: 0, values: 10, spatial: false, top: [{ value: EVIL, count: 6 }, { value: 'B', count: 3 }] },
    { name: 'triage', level: 'ordinal', role: 'ordered-vocabulary', reason: 'low < high', distinct: 2, distinctExact: true, empty: 0, values: 10, spatial: false, order: ['low', 'high'], top: [{ value: 'high', count: 7 }, { value: 'low', count: 3 }] },
    { name: 'age', level: 'quantitative', role: 'measure', reason: 'integers', distinct: 9, distinctExact: true, empty: 1, values: 9, spatial: false, min: 1, max: 90 },
  ],
};

describe('renderProfileReport(report)', () => {
  const page = renderProfileReport(profile);

  it('renderProfileReport(report) gives one card per column with level, role and counts', () => {
    expect(count(page, /<article class="q-card"/g)).toBe(3);
    expect(page).toContain('data-mark="▤">ordinal</li>');
    expect(page).toContain('<b>empty:</b> 1 (10.0%)');
  });

  it('renderProfileReport(report) draws ordered levels in their order, not by frequency', () => {
    const triage = page.slice(page.indexOf('<h3 id="profile-triage'));
    expect(triage.indexOf('>low</th>')).toBeLessThan(triage.indexOf('>high</th>'));
    expect(page).toContain('all other values');
    expectInert(page);
  });
});

const cycles = emptyCycles();
for (let d = 1; d <= 28; d++) addToCycles(cycles, Date.UTC(2024, 1, d)); // every day of February 2024 at midnight

const grain: GrainReport = {
  file: 'g.csv', rows: 28, rejectedRows: 0, skipped: [{ name: EVIL, reason: 'no time format reads these values' }],
  columns: [{
    name: 'day', format: 'iso-date', formatLabel: 'ISO 8601 date', formatEvidence: null, ambiguity: null, values: { parsed: 28, empty: 0, invalid: 0 }, invalidExamples: [],
    grain: { unit: 'day', step: 1, anchor: 'start', weekStart: null }, zone: 'America/Chicago',
    zoneFinding: { zone: 'America/Chicago', basis: 'given', offsets: [-360], alternatives: [], sampled: false },
    level: 'ordinal', levelReason: 'days', coverage: { onGrain: 28, share: 1, exceptions: 0, examples: [] }, cadence: null,
    first: '2024-02-01', last: '2024-02-28', findings: ['Every value is a whole day.'],
  }],
};

describe('renderGrainReport(report, {cycles})', () => {
  const page = renderGrainReport(grain, { cycles: { day: cycles } });

  it('renderGrainReport(...) shows where the values fall: all at hour 00, over 28 days, in one month', () => {
    expect(page).toContain('all 28 rows at hour 00');
    expect(page).toContain('rows spread over 28 of 31 days');
    expect(page).toContain('all 28 rows at month Feb');
    expect(page).not.toContain('Minute of the hour'); // every value at midnight: no minute chart
  });

  it('renderGrainReport(...) draws the zone offsets across the year with its two 2024 changes', () => {
    // US daylight saving 2024: 10 March and 3 November (Energy Policy Act of 2005, 15 U.S.C. §260a)
    expect(page).toContain('2024-03-10 → -05:00');
    expect(page).toContain('2024-11-03 → -06:00');
    expectInert(page);
  });
});

const overlaps: OverlapsResult = {
  file: 'bands.csv', ranges: 3, rowsRead: 4, kind: 'number', ends: 'discrete', domainGiven: true,
  rejected: { count: 1, byReason: { unreadable: 1 }, examples: [{ line: 5, value: IMG, reason: 'not a range' }] },
  series: [{
    key: EVIL, ranges: 3, overlaps: [{ a: { line: 2, range: '0-9' }, b: { line: 3, range: '5-14' }, relation: 'overlaps', shared: '5-9' }], overlapCount: 1,
    holes: [{ from: 15, to: 20, range: '15-19' }], duplicates: [], empty: [], outside: [], domain: '0..', covers: false, partition: false,
  }],
  totals: { overlaps: 1, holes: 1, duplicates: 0, series: 1, seriesWithProblems: 1 },
  chart: [{ ranges: [{ label: '0-9', low: 0, high: 10 }, { label: '5-14', low: 5, high: 15 }, { label: '20+', low: 20, high: null }], marks: [{ kind: 'overlap', low: 5, high: 10 }, { kind: 'hole', low: 15, high: 20 }], format: String }],
};

describe('renderOverlapsReport(result)', () => {
  const page = renderOverlapsReport(overlaps);

  it('renderOverlapsReport(result) draws the ranges on one axis with the overlap and the hole marked', () => {
    expect(count(page, /class="q-range"/g)).toBe(3);
    expect(count(page, /class="q-overlap"/g)).toBe(1);
    expect(count(page, /class="q-hole"/g)).toBe(1);
  });

  it('renderOverlapsReport(result) lists each pair with its Allen relation and counts relations', () => {
    expect(page).toMatch(/<th scope="row">line 2 0-9<\/th><td>overlaps<\/td><td>line 3 5-14<\/td><td>5-9<\/td>/);
    expect(page).toContain('<caption>Pairs by relation</caption>');
    expect(page).toContain('Does not cover 0..');
    expectInert(page);
  });
});
