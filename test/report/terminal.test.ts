import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  barChart,
  formatNumber,
  histogram,
  periodStrip,
  rangeAxis,
  sparkline,
  terminalSafe,
  type PeriodState,
} from '../../src/report/terminal.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 200);
const ESC = '\u001b';
const PARTS = ' ▏▎▍▌▋▊▉';
/** Length of the bar in a line, in eighths of a cell (Unicode block elements U+2588–U+258F). */
const eighths = (line: string) => Array.from(line).reduce((n, ch) => n + (ch === '█' ? 8 : Math.max(0, PARTS.indexOf(ch))), 0);
const width = (line: string) => Array.from(line.replace(/\u001b\[[0-9;]*m/g, '')).length;

describe('barChart(rows, {width})', () => {
  const rows = Object.freeze([
    Object.freeze({ label: 'Alderbrook', value: 400 }),
    Object.freeze({ label: 'Fennick Cross', value: 200 }),
    Object.freeze({ label: 'Marrow Hill', value: 0, note: 'filled' }),
    Object.freeze({ label: 'Quillon Bay', value: null }),
  ]);

  it('barChart(rows) draws bars proportional to the values, in the caller order', () => {
    const lines = barChart(rows, { width: 40 }).split('\n');
    expect(lines).toHaveLength(4);
    const blocks = lines.map(eighths);
    expect(Math.abs(blocks[0] - 2 * blocks[1])).toBeLessThanOrEqual(1); // 400 is twice 200, to an eighth of a cell
    expect(blocks[2]).toBe(0);
    expect(lines[0]).toMatch(/^Alderbrook\s+█+\s+400$/);
    expect(lines[1]).toContain('Fennick Cross');
  });

  it('barChart(rows) prints — for a null value and the note after a filled zero', () => {
    const lines = barChart(rows, { width: 40 }).split('\n');
    expect(lines[3]).toMatch(/—$/);
    expect(lines[2]).toMatch(/ 0  filled$/);
  });

  it('barChart(rows, {width}) never exceeds the width (notes excluded)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ label: fc.string({ maxLength: 30 }), value: fc.option(fc.integer({ min: -1e6, max: 1e6 })) }), { minLength: 1, maxLength: 20 }),
        fc.integer({ min: 20, max: 120 }),
        (data, w) => {
          for (const line of barChart(data, { width: w }).split('\n')) expect(width(line)).toBeLessThanOrEqual(w);
        },
      ),
      { numRuns: RUNS },
    );
  });

  it('barChart(rows) draws negative values left of a zero line', () => {
    const lines = barChart([{ label: 'a', value: -5 }, { label: 'b', value: 5 }], { width: 30 }).split('\n');
    const zeroA = lines[0].indexOf('│');
    expect(zeroA).toBeGreaterThan(0);
    expect(lines[1].indexOf('│')).toBe(zeroA);
    expect(lines[0].slice(0, zeroA)).toContain('█');
    expect(lines[1].slice(zeroA + 1)).toContain('█');
  });

  it('barChart(rows) adds ANSI colour only when color: true', () => {
    expect(barChart(rows)).not.toContain(ESC);
    expect(barChart(rows, { color: true })).toContain(`${ESC}[36m`); // ECMA-48 SGR 36 = cyan foreground
  });

  it('barChart(rows) shows control characters in labels as visible pictures, never raw', () => {
    const out = barChart([{ label: `evil${ESC}[2J`, value: 1 }]);
    expect(out).not.toContain(ESC);
    expect(out).toContain('\u241b'); // Unicode Control Pictures: U+241B SYMBOL FOR ESCAPE
  });

  it('barChart([]) says there are no rows', () => {
    expect(barChart([])).toBe('(no rows)');
  });
});

describe('periodStrip(states, {width})', () => {
  it('periodStrip(states) draws one distinct glyph per state, readable without colour', () => {
    const out = periodStrip(['present', 'missing', 'duplicated', 'present']);
    const [strip, legend] = out.split('\n');
    expect(strip).toBe('█·▲█');
    expect(legend).toBe('█ once 2  · missing 1  ▲ more than once 1');
  });

  it('periodStrip(states, {width}) folds long series and keeps a single missing period visible', () => {
    const states: PeriodState[] = Array.from({ length: 1000 }, (_, i) => (i === 517 ? 'missing' : 'present'));
    const [strip, legend] = periodStrip(states, { width: 50 }).split('\n');
    expect(Array.from(strip)).toHaveLength(50);
    expect(strip.split('·')).toHaveLength(2); // exactly one missing cell
    expect(strip.indexOf('·')).toBe(Math.floor(517 / 20));
    expect(legend).toContain('1 cell = 20 periods');
    expect(legend).toContain('missing 1');
  });

  it('periodStrip(states) counts add up to the number of periods', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom<PeriodState>('present', 'missing', 'duplicated'), { maxLength: 300 }), (states) => {
        const legend = periodStrip(states, { width: 40 }).split('\n')[1];
        const counts = [...legend.matchAll(/(once|missing|more than once) ([\d,]+)/g)].map((m) => Number(m[2].replace(/,/g, '')));
        expect(counts.reduce((a, b) => a + b, 0)).toBe(states.length);
      }),
      { numRuns: RUNS },
    );
  });

  it('periodStrip(states, {legend: false}) returns the strip alone', () => {
    expect(periodStrip(['missing'], { legend: false })).toBe('·');
  });
});

describe('sparkline(values)', () => {
  it('sparkline(values) maps the lowest value to ▁ and the highest to █ (Unicode block elements U+2581–U+2588)', () => {
    expect(sparkline([0, 1, 2, 3, 4, 5, 6, 7])).toBe('▁▂▃▄▅▆▇█');
  });

  it('sparkline(values) leaves a gap for null and NaN', () => {
    expect(sparkline([0, null, 7, Number.NaN, 0])).toBe('▁ █ ▁');
  });

  it('sparkline(values, {width}) averages into width cells', () => {
    expect(sparkline([0, 0, 10, 10], { width: 2 })).toBe('▁█');
  });

  it('sparkline(constant) draws a flat middle line', () => {
    expect(sparkline([3, 3, 3])).toBe('▄▄▄');
  });
});

describe('histogram(bins)', () => {
  const bins = [
    { low: 0, high: 10, count: 10 },
    { low: 10, high: 20, count: 5 },
    { low: 20, high: 30, count: 0 },
    { low: 30, high: 40, count: 1 },
  ];

  it('histogram(bins, {height}) draws columns scaled to the largest count, with the edges beneath', () => {
    const lines = histogram(bins, { height: 2 }).split('\n');
    expect(lines).toEqual(['█    10', '██ ▂', '0 40']); // 1 of 10 over 2 rows = 1.6 eighths, rounded to ▂
  });

  it('histogram(bins) keeps a non-zero bin visible and an empty bin blank', () => {
    const bottom = histogram(bins, { height: 4 }).split('\n')[3];
    expect(bottom[2]).toBe(' ');
    expect(bottom[3]).not.toBe(' ');
  });
});

describe('rangeAxis(ranges, {marks})', () => {
  const ranges = [
    { label: '0-4', low: 0, high: 5 },
    { label: '5-9', low: 5, high: 10 },
    { label: '8-14', low: 8, high: 15 },
    { label: '20+', low: 20, high: null },
  ];

  it('rangeAxis(ranges) draws each range on one shared axis, open ends with an arrow', () => {
    const lines = rangeAxis(ranges, { width: 50 }).split('\n');
    expect(lines).toHaveLength(5);
    expect(lines[0]).toMatch(/^0-4\s+├─+┤$/);
    expect(lines[3]).toMatch(/├─+▸$/);
    // touching ranges share the boundary column
    expect(lines[0].indexOf('┤')).toBe(lines[1].indexOf('├'));
  });

  it('rangeAxis(ranges, {marks}) marks overlaps with ▲ and holes with ·, even when narrow', () => {
    const out = rangeAxis(ranges, { width: 50, marks: [{ kind: 'overlap', low: 8, high: 10 }, { kind: 'hole', low: 15, high: 15.01 }] });
    const marks = out.split('\n').find((l) => l.startsWith('marks'))!;
    expect(marks).toContain('▲');
    expect(marks).toContain('·');
    expect(out).toContain('▲ overlap  · hole');
  });

  it('rangeAxis([]) says there are no ranges', () => {
    expect(rangeAxis([])).toBe('(no ranges)');
  });
});

describe('formatNumber(value) and terminalSafe(text)', () => {
  it.each([
    // common practice: thousands grouped by commas, no locale
    [1234567, '1,234,567'],
    [0, '0'],
    [-1200, '-1,200'],
    [3.14159, '3.142'],
    [1234.56, '1,234.6'],
    [0.5, '0.5'],
    [Number.NaN, 'NaN'],
  ])('formatNumber(%s) is %s', (v, text) => {
    expect(formatNumber(v)).toBe(text);
  });

  it.each([
    // Unicode Control Pictures block: U+2400 + code for C0 controls, U+2421 for DEL
    ['a\u0007b', 'a\u2407b'],
    ['\r\n', '\u240d\u240a'],
    ['x\u007f', 'x\u2421'],
    // Unicode bidi overrides (UAX #9, "Trojan Source") replaced by U+FFFD
    ['\u202eabc', '\ufffdabc'],
  ])('terminalSafe(%j) is %j', (input, out) => {
    expect(terminalSafe(input)).toBe(out);
  });
});
