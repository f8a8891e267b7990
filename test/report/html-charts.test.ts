import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { columnChart } from '../../src/report/html/columns.js';
import { hbarChart } from '../../src/report/html/hbars.js';
import { histogramChart } from '../../src/report/html/histogram.js';
import { rangeLanes } from '../../src/report/html/lanes.js';
import { smallMultiples } from '../../src/report/html/multiples.js';
import { periodGrid } from '../../src/report/html/strip.js';
import { stepLine } from '../../src/report/html/stepline.js';
import { dataTable } from '../../src/report/html/table.js';
import { addToCycles, cycleSentence, emptyCycles } from '../../src/report/html/cycles.js';
import { binEdges } from '../../src/report/html/profile-evidence.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 100);
const count = (text: string, re: RegExp) => (text.match(re) ?? []).length;
const HOSTILE = ['<script>alert(1)</script>', '<img src=x onerror=alert(1)>', '"><svg onload=alert(1)>', 'javascript:alert(1)', '=HYPERLINK("http://x.invalid")'];

/** Every chart is an image with a title and a description (WAI-ARIA 1.2 role img; SVG 2 title/desc). */
function expectAccessible(svg: string): void {
  expect(svg).toMatch(/^<svg class="q-chart"[^>]* role="img" aria-labelledby="([^" ]+)-t \1-d"/);
  expect(svg).toMatch(/<title id="[^"]+-t">[^<]+<\/title><desc id="[^"]+-d">[^<]+<\/desc>/);
}

describe('columnChart(spec)', () => {
  const data = Object.freeze([
    { label: '2024-W01', value: 10 },
    { label: '2024-W02', value: 0, filled: true },
    { label: '2024-W03', value: 5 },
    { label: '2024-W04', value: 0 },
  ]);

  it('columnChart(spec) draws one bar per non-zero value and a hatched band per filled period', () => {
    const svg = columnChart({ id: 'c', title: 'visits', valueLabel: 'visits', data }).value;
    expectAccessible(svg);
    expect(count(svg, /class="q-bar"/g)).toBe(2);
    expect(count(svg, /class="q-filled"/g)).toBe(1);
    expect(svg).toContain('fill="url(#c-hatch)"');
    expect(svg).toContain('<pattern id="c-hatch"');
  });

  it('columnChart(spec) says in its text alternative how many periods were filled and where the peak is', () => {
    const svg = columnChart({ id: 'c', title: 'visits', valueLabel: 'visits', data }).value;
    expect(svg).toContain('4 bars from 2024-W01 to 2024-W04; highest visits 10 at 2024-W01; 1 filled with no rows (hatched).');
  });

  it('columnChart(spec) scales bar heights linearly from zero', () => {
    const svg = columnChart({ id: 'c', title: 't', valueLabel: 'v', data: [{ label: 'a', value: 10 }, { label: 'b', value: 5 }] }).value;
    const heights = [...svg.matchAll(/class="q-bar"/g)].map((m) => {
      const rect = svg.slice(svg.lastIndexOf('<rect', m.index), m.index);
      return Number(/height="([\d.]+)"/.exec(rect)![1]);
    });
    expect(heights[0] / heights[1]).toBeCloseTo(2, 1);
  });
});

describe('hbarChart(spec) and dataTable(spec) with hostile labels', () => {
  it.each(HOSTILE)('hbarChart labels %j as text only', (label) => {
    const svg = hbarChart({ id: 'h', title: label, valueLabel: 'rows', data: [{ label, value: 3 }] }).value;
    expect(svg).not.toContain('<script');
    expect(svg).not.toContain('<img');
    expect(svg).not.toMatch(/<svg[^>]*onload/);
    expect(svg).not.toMatch(/href=/);
  });

  it('dataTable(spec) escapes every cell and guards formula-like text', () => {
    const t = dataTable({ caption: 'c', columns: [{ label: 'v' }, { label: 'n', numeric: true }], rows: HOSTILE.map((h) => [h, 1]) }).value;
    expect(t).not.toContain('<script');
    expect(t).not.toContain('<img');
    expect(t).toContain("'=HYPERLINK(");
    expect(count(t, /<th scope="row">/g)).toBe(HOSTILE.length);
    expect(t).toContain('role="region" tabindex="0"');
  });

  it('any label text never appears unescaped in a chart (our markup never has a <q- tag)', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 30 }), (text) => {
        const label = `<q-${text}`;
        const svg = hbarChart({ id: 'p', title: label, valueLabel: 'v', data: [{ label, value: 1 }] }).value;
        const grid = periodGrid({ id: 'p', title: label, cells: [{ label, state: 'missing' }], perRow: 1 }).value;
        return !svg.includes('<q-') && !grid.includes('<q-');
      }),
      { numRuns: RUNS },
    );
  });
});

describe('periodGrid(spec)', () => {
  const cells = [
    { label: 'd1', state: 'present' as const },
    { label: 'd2', state: 'present' as const },
    { label: 'd3', state: 'missing' as const },
    { label: 'd4', state: 'missing' as const },
    { label: 'd5', state: 'present' as const },
    { label: 'd6', state: 'duplicated' as const, count: 2 },
  ];

  it('periodGrid(spec) merges runs of one state into one shape per line', () => {
    const svg = periodGrid({ id: 'g', title: 'series', cells, perRow: 6 }).value;
    expectAccessible(svg);
    expect(count(svg, /class="q-present"/g)).toBe(2);
    expect(count(svg, /class="q-missing"/g)).toBe(1);
    expect(count(svg, /class="q-duplicated"/g)).toBe(1);
    expect(svg).toContain('<title>d3 to d4 (2): missing</title>');
    expect(svg).toContain('<title>d6: duplicated, 2 rows</title>');
  });

  it('periodGrid(spec) wraps at perRow and counts the marks of each line in the margin', () => {
    const svg = periodGrid({ id: 'g', title: 'series', cells, perRow: 3 }).value;
    expect(count(svg, /class="q-missing"/g)).toBe(2); // the run is cut by the line break
    expect(svg).toContain('>·1</text>');
    expect(svg).toContain('>·1 ▲1</text>');
  });

  it('periodGrid(spec) summary counts each state and the missing runs', () => {
    const svg = periodGrid({ id: 'g', title: 'series', cells, perRow: 6 }).value;
    expect(svg).toContain('6 periods from d1 to d6; 3 present, 2 missing in 1 run, 1 duplicated.');
  });

  it('periodGrid(spec, flow columns) lays a calendar out in columns of perRow', () => {
    const days = Array.from({ length: 14 }, (_, i) => ({ label: `2024-01-${String(i + 1).padStart(2, '0')}`, state: 'present' as const }));
    const svg = periodGrid({ id: 'g', title: 'days', cells: days, perRow: 7, flow: 'columns', crossLabels: ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'] }).value;
    expect(count(svg, /class="q-present"/g)).toBe(2); // one column shape per week
    expect(svg).toContain('>Mon</text>');
  });
});

describe('rangeLanes(spec)', () => {
  it('rangeLanes(spec) draws one lane per range, arrows for unbounded ends and marks for overlaps and holes', () => {
    const svg = rangeLanes({
      id: 'r', title: 'bands', summary: 'two bands overlap; one hole',
      ranges: [{ label: '0-4', low: 0, high: 5, lowClosed: true, highClosed: false }, { label: '3-9', low: 3, high: 10 }, { label: '20+', low: 20, high: null }],
      marks: [{ kind: 'overlap', low: 3, high: 5 }, { kind: 'hole', low: 10, high: 20 }],
    }).value;
    expectAccessible(svg);
    expect(count(svg, /class="q-range"/g)).toBe(3);
    expect(count(svg, /class="q-overlap"/g)).toBe(1);
    expect(count(svg, /class="q-hole"/g)).toBe(1);
    expect(svg).toContain('>hole</text>');
    expect(svg).toMatch(/<path d="M[\d.]+ [\d.]+l-7 -5v10z"/); // the arrow of 20+
    expect(svg).toContain('fill="#fff" stroke="#2f6f8f"'); // the hollow (open) end of 0-4
  });
});

describe('smallMultiples(spec)', () => {
  it('smallMultiples(spec) puts every group on the same value scale', () => {
    const out = smallMultiples({
      id: 'm', valueLabel: 'visits',
      groups: [{ name: 'big', data: [{ label: 'a', value: 100 }] }, { name: 'small', data: [{ label: 'a', value: 10 }] }],
    }).value;
    const tops = [...out.matchAll(/Shared scale up to ([\d,]+)/g)].map((m) => m[1]);
    expect(tops).toEqual(['100', '100']);
    const axes = [...out.matchAll(/<g class="q-axis" aria-hidden="true">(.*?)<\/g>/g)].map((m) => m[1]).filter((a) => a.includes('text-anchor="end"'));
    expect(axes[0]).toBe(axes[1]);
  });
});

describe('histogramChart(spec) and stepLine(spec)', () => {
  it('histogramChart(spec) draws one bar per bin on a linear axis', () => {
    const svg = histogramChart({ id: 'h', title: 'age', countLabel: 'rows', bins: [{ low: 0, high: 10, count: 4 }, { low: 10, high: 30, count: 2 }] }).value;
    expectAccessible(svg);
    expect(count(svg, /class="q-bar"/g)).toBe(2);
    const widths = [...svg.matchAll(/<rect x="[\d.]+" y="[\d.]+" width="([\d.]+)"[^>]*class="q-bar"/g)].map((m) => Number(m[1]));
    expect(widths[1] / widths[0]).toBeGreaterThan(1.8); // the bin twice as wide is drawn twice as wide
  });

  it('stepLine(spec) draws a step path with a marker per change', () => {
    const svg = stepLine({ id: 's', title: 'offset', summary: 'two changes', points: [{ at: 0, value: -360 }, { at: 100, value: -300, label: 'a' }, { at: 200, value: -360, label: 'b' }], end: 300, formatValue: String, formatTime: String }).value;
    expectAccessible(svg);
    expect(count(svg, /<circle cx="[\d.]+" cy="[\d.]+" r="4"/g)).toBe(2); // the dots pattern has its own circle
    // curveStepAfter (d3-shape): every segment is horizontal or vertical — the offset holds, then jumps
    const d = [...svg.matchAll(/<path d="(M[\d.]+,[^"]+)"/g)].map((m) => m[1])[0];
    const pts = d.slice(1).split('L').map((p) => p.split(',').map(Number));
    expect(pts.length).toBeGreaterThanOrEqual(6);
    for (let i = 1; i < pts.length; i++) expect(pts[i][0] === pts[i - 1][0] || pts[i][1] === pts[i - 1][1]).toBe(true);
  });
});

describe('addToCycles(counts, wallMs)', () => {
  it.each([
    // 2024-03-10T08:15:00 wall clock was a Sunday (ISO weekday 7) — checked against date-fns getISODay
    [Date.UTC(2024, 2, 10, 8, 15), { hour: 8, minute: 15, day: 10, month: 3, weekday: 7, last: false }],
    // 2024-02-29 is the last day of February in a leap year (Gregorian rule)
    [Date.UTC(2024, 1, 29), { hour: 0, minute: 0, day: 29, month: 2, weekday: 4, last: true }],
  ])('addToCycles(%d) counts hour, minute, day, month, weekday', (ms, e) => {
    const c = emptyCycles();
    addToCycles(c, ms);
    expect(c.hourOfDay[e.hour]).toBe(1);
    expect(c.minuteOfHour[e.minute]).toBe(1);
    expect(c.dayOfMonth[e.day - 1]).toBe(1);
    expect(c.monthOfYear[e.month - 1]).toBe(1);
    expect(c.weekday[e.weekday - 1]).toBe(1);
    expect(c.lastDayOfMonth).toBe(e.last ? 1 : 0);
    expect(c.rows).toBe(1);
  });

  it('cycleSentence(counts) names a single position, a few, or the spread', () => {
    expect(cycleSentence([5, 0, 0], ['00', '01', '02'], 'hour')).toBe('all 5 rows at hour 00');
    expect(cycleSentence([1, 0, 1], ['a', 'b', 'c'], 'month')).toBe('every row at month a, c');
    expect(cycleSentence([1, 2, 3, 4, 5], ['a', 'b', 'c', 'd', 'e'], 'day')).toBe('rows spread over 5 of 5 days; most at e (5)');
  });
});

describe('binEdges(min, max, integers)', () => {
  it.each([
    // d3-array tickStep(0, 99, 12) is 10 (steps of 1, 2 or 5 × 10^k — the d3 ticks rule)
    [0, 99, true, [0, 10, 20, 30, 40, 50, 60, 70, 80, 90, 100]],
    // tickStep(1.1, 258.6, 12) is 20; the first edge is the step at or below the minimum
    [1.1, 258.6, false, [0, 20, 40, 60, 80, 100, 120, 140, 160, 180, 200, 220, 240, 260]],
    // integers never get fractional steps: tickStep(0, 3, 12) is 0.2, rounded up to 1
    [0, 3, true, [0, 1, 2, 3, 4]],
  ])('binEdges(%d, %d, %s) covers the range with round edges', (min, max, integers, edges) => {
    expect(binEdges(min as number, max as number, integers as boolean)).toEqual(edges);
  });
});
