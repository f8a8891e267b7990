// Aggregates per period checked against simple-statistics and d3-array as independent oracles.
import { quantile as d3quantile } from 'd3-array';
import { max, mean, median, min, quantile as ssQuantile } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { isQuernError } from '../../src/errors.js';
import { parseAggSpec, parseAggSpecs, parseQuantileType } from '../../src/rebin/index.js';
import { CellStore } from '../../src/rebin/accumulate.js';
import { rebinText, seeded } from './helpers.js';

describe('parseAggSpec(text)', () => {
  it.each([
    // [spec, kind, column, p, output column] — names as the issue gives them (count, sum_amount, p90_amount…)
    ['count', 'count', null, NaN, 'count'],
    ['count:amount', 'count', 'amount', NaN, 'count_amount'],
    ['sum:amount', 'sum', 'amount', NaN, 'sum_amount'],
    ['mean:age', 'mean', 'age', NaN, 'mean_age'],
    ['median:age', 'median', 'age', 0.5, 'median_age'],
    ['p90:amount', 'quantile', 'amount', 0.9, 'p90_amount'],
    ['p2.5:amount', 'quantile', 'amount', 0.025, 'p2.5_amount'],
    ['distinct:clinic', 'distinct', 'clinic', NaN, 'distinct_clinic'],
    ['MAX:temp_c', 'max', 'temp_c', NaN, 'max_temp_c'],
  ])('parseAggSpec(%j) is %s of %s', (text, kind, column, p, name) => {
    const s = parseAggSpec(text);
    expect(s).toMatchObject({ kind, column, name });
    if (Number.isNaN(p)) expect(s.p).toBeNaN();
    else expect(s.p).toBeCloseTo(p, 12);
  });

  it.each(['avg:x', 'sum', 'p90', 'p101:x', 'sum:', 'median'])('parseAggSpec(%j) throws E_USAGE', (text) => {
    expect(() => parseAggSpec(text)).toThrow(expect.objectContaining({ code: 'E_USAGE' }));
  });

  it('parseAggSpecs refuses the same output column twice and defaults to count', () => {
    expect(parseAggSpecs([]).map((s) => s.name)).toEqual(['count']);
    let err: unknown;
    try { parseAggSpecs(['sum:a', 'sum:a']); } catch (e) { err = e; }
    expect(isQuernError(err, 'E_USAGE')).toBe(true);
  });

  it('parseQuantileType accepts the Hyndman–Fan types 1–9 only', () => {
    expect(parseQuantileType('6')).toBe(6);
    expect(() => parseQuantileType('10')).toThrow(expect.objectContaining({ code: 'E_USAGE' }));
  });
});

describe('CellStore.addNumber (Neumaier summation)', () => {
  it('keeps the small terms a naive sum loses: 1e16 + 1 − 1e16 = 1', () => {
    // Classic compensated-summation example (Neumaier 1974): a naive left-to-right double sum gives 0.
    const s = new CellStore([{ numbers: true, buffer: false, distinct: false }]);
    const c = s.cell(0, 0);
    for (const x of [1e16, 1, -1e16]) s.addNumber(c, 0, x, 1);
    expect(1e16 + 1 - 1e16).toBe(0);
    expect(s.sumOf(c, 0)).toBe(1);
  });

  it('sums 0.1 ten thousand times to 1000 (correctly rounded), where a naive loop drifts', () => {
    const s = new CellStore([{ numbers: true, buffer: false, distinct: false }]);
    const c = s.cell(0, 0);
    let naive = 0;
    for (let i = 0; i < 10_000; i++) { s.addNumber(c, 0, 0.1, 1); naive += 0.1; }
    expect(naive).not.toBe(1000);
    expect(s.sumOf(c, 0)).toBe(1000);
  });
});

describe('rebin(reader, {aggregates}) per period', () => {
  const rnd = seeded(7);
  const days = ['2024-05-01', '2024-05-02', '2024-05-03'];
  const rows: { day: string; amount: number; clinic: string }[] = [];
  for (let i = 0; i < 600; i++) {
    rows.push({ day: days[i % 3]!, amount: Math.round(rnd() * 100000) / 100, clinic: `c${Math.floor(rnd() * 7)}` });
  }
  const text = `ts,amount,clinic\n${rows.map((r, i) => `${r.day}T${String(i % 24).padStart(2, '0')}:00:00Z,${r.amount},${r.clinic}`).join('\n')}\n`;

  it('count, sum, mean, median, min, max, p90, p10 and distinct match simple-statistics and d3-array', async () => {
    const aggs = parseAggSpecs(['count', 'sum:amount', 'mean:amount', 'median:amount', 'min:amount', 'max:amount', 'p90:amount', 'p10:amount', 'distinct:clinic']);
    const r = await rebinText(text, { time: 'ts', calendar: { unit: 'day' }, aggregates: aggs });
    expect(r.columns).toEqual(['period', 'start', 'end', 'count', 'sum_amount', 'mean_amount', 'median_amount', 'min_amount', 'max_amount', 'p90_amount', 'p10_amount', 'distinct_clinic']);
    for (const row of r.rows) {
      const xs = rows.filter((x) => x.day === row.period).map((x) => x.amount);
      const [count, sum, avg, med, lo, hi, p90, p10, distinct] = row.values as number[];
      expect(count).toBe(xs.length);
      expect(sum).toBeCloseTo(xs.reduce((a, b) => a + b, 0), 6);
      expect(avg).toBeCloseTo(mean(xs), 9); // simple-statistics
      expect(med).toBeCloseTo(median(xs), 9);
      expect(lo).toBe(min(xs));
      expect(hi).toBe(max(xs));
      expect(p90).toBeCloseTo(d3quantile(xs, 0.9)!, 9); // d3-array: Hyndman–Fan type 7
      expect(p10).toBeCloseTo(ssQuantile(xs, 0.1), 9); // simple-statistics: also type 7
      expect(distinct).toBe(new Set(rows.filter((x) => x.day === row.period).map((x) => x.clinic)).size);
    }
  });

  it('quantileType 6 gives the Hyndman–Fan type 6 value, checked by hand', async () => {
    // Values 1..10, p = 0.9. Type 6 (Hyndman & Fan 1996): h = (n+1)p = 11 × 0.9 = 9.9 → x9 + 0.9 (x10 − x9) = 9.9.
    // Type 7 (the default): h = (n−1)p + 1 = 9.1 → 9.1.
    const t = `ts,v\n${Array.from({ length: 10 }, (_, i) => `2024-01-01T00:00:0${i}Z,${i + 1}`).join('\n')}\n`;
    const six = await rebinText(t, { time: 'ts', calendar: { unit: 'day' }, aggregates: parseAggSpecs(['p90:v']), quantileType: 6 });
    const seven = await rebinText(t, { time: 'ts', calendar: { unit: 'day' }, aggregates: parseAggSpecs(['p90:v']) });
    expect(six.rows[0]!.values[0]).toBeCloseTo(9.9, 12);
    expect(seven.rows[0]!.values[0]).toBeCloseTo(9.1, 12);
  });

  it('counts empty and invalid values per measure column and leaves them out of its aggregates', async () => {
    const t = 'ts,v\n2024-01-01T00:00:00Z,1\n2024-01-01T01:00:00Z,\n2024-01-01T02:00:00Z,abc\n2024-01-01T03:00:00Z,NA\n2024-01-01T04:00:00Z,3\n';
    const r = await rebinText(t, { time: 'ts', calendar: { unit: 'day' }, aggregates: parseAggSpecs(['count', 'count:v', 'mean:v']) });
    expect(r.rows[0]!.values).toEqual([5, 2, 2]); // mean of 1 and 3
    expect(r.summary.measures[0]).toMatchObject({ column: 'v', valid: 2, empty: 2, rejected: 1, rejectedByReason: { malformed: 1 } });
    expect(r.summary.examples.some((d) => d.line === 4 && d.column === 'v')).toBe(true);
  });

  it('limits the values kept for exact medians, with E_DATA', async () => {
    let err: unknown;
    try {
      await rebinText(text, { time: 'ts', calendar: { unit: 'day' }, aggregates: parseAggSpecs(['median:amount']), limits: { maxBuffered: 100 } });
    } catch (e) { err = e; }
    expect(isQuernError(err, 'E_DATA')).toBe(true);
  });
});
