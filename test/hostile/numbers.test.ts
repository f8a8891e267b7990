// Hostile numbers through `quern bucket` and the number parser: NaN, infinities, -0, the largest doubles,
// grouping and decimal marks, percent signs and values exactly on bucket edges. Every row lands in one
// place: a range, below, above, between, empty, invalid or rejected.
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parseNumber } from '../../src/index.js';
import { runCli } from '../helpers/cli.js';
import { INPUTS, STACK_LINE, scratch } from './helpers.js';

const tmp = scratch('numbers');
afterAll(() => tmp.cleanup());

interface BucketJson {
  rowsRead: number; rowsRejected: number; bucketed: number;
  buckets: { label: string; count: number }[];
  below: { count: number; examples: { line: number; value: string }[] };
  above: { count: number }; between: { count: number };
  empty: { count: number; byReason: Record<string, number> };
  invalid: { count: number; byReason: Record<string, number>; examples: { line: number; value: string }[] };
  notes: string[];
  numberFormat: { decimal: string; group: string | null; decision: string };
}

/** Runs `quern bucket --summary --json` and checks that every row is accounted for. */
async function bucketJson(argv: string[]): Promise<BucketJson> {
  const r = await runCli(['bucket', ...argv, '--summary', '--json']);
  expect(r.stderr).not.toMatch(STACK_LINE);
  expect(r.status, r.stderr).toBe(0);
  const j = JSON.parse(r.stdout) as BucketJson;
  expect(j.bucketed).toBe(j.buckets.reduce((a, b) => a + b.count, 0));
  expect(j.bucketed + j.below.count + j.above.count + j.between.count + j.empty.count + j.invalid.count + j.rowsRejected)
    .toBe(j.rowsRead);
  return j;
}

/** Runs `quern bucket` writing rows, and returns value → [label, index] (CSV rows without inner commas). */
async function bucketRows(argv: string[]): Promise<string[][]> {
  const r = await runCli(['bucket', ...argv, '-q']);
  expect(r.status, r.stderr).toBe(0);
  // value,label,index where only the label may be quoted (RFC 4180 §2.6).
  return r.stdout.trimEnd().split('\n').slice(1).map((l) => {
    const m = /^([^,]*),("[^"]*"|[^,]*),(\d*)$/.exec(l)!;
    return [m[1]!, m[2]!.replace(/^"|"$/g, ''), m[3]!];
  });
}

const numbers = join(INPUTS, 'numbers.csv');

describe('quern bucket on hostile numbers accounts for every row', () => {
  it('counts NaN and ±Infinity as invalid with their reasons, NA as empty, -0 and 1e308 as numbers', async () => {
    const j = await bucketJson([numbers, '--value', 'age', '--edges', '0,5,10', '--open-high', '--labels', 'interval']);
    expect(j.rowsRead).toBe(13); // 14 data lines, one of them completely blank (not a row: ReadSummary)
    expect(j.invalid.byReason).toEqual({ 'not-a-number': 1, infinite: 2 });
    expect(j.invalid.examples.map((e) => e.line)).toEqual([2, 3, 4]);
    expect(j.empty.byReason).toEqual({ 'missing-marker': 1 });
    // -0 is zero (IEEE 754 §5.11: -0 compares equal to +0) and falls in 0-4; -1e308 and -5 are below.
    expect(j.below.examples.map((e) => e.value)).toEqual(['-1e308', '-5']);
    expect(j.buckets.map((b) => [b.label, b.count])).toEqual([['[0,5)', 3], ['[5,10)', 1], ['[10,inf)', 3]]);
  });

  it('puts values exactly on the edges in the range they start when closed left (5 in [5,10), 10 in [10,inf))', async () => {
    const rows = await bucketRows([numbers, '--value', 'age', '--edges', '0,5,10', '--open-high', '--labels', 'interval']);
    const at = (v: string) => rows.find((r) => r[0] === v)!.slice(1);
    // Half-open [a, b) ranges hold their lower edge (common practice; ISO 80000-2 2-7.7 interval notation).
    expect([at('0'), at('5'), at('10'), at('-0'), at('4.999')]).toEqual([['[0,5)', '0'], ['[5,10)', '1'], ['[10,inf)', '2'], ['[0,5)', '0'], ['[0,5)', '0']]);
  });

  it('puts values exactly on the edges in the range they end when closed right (5 in (0,5], 0 below)', async () => {
    const j = await bucketJson([numbers, '--value', 'age', '--edges', '0,5,10', '--closed', 'right']);
    expect(j.buckets.map((b) => [b.label, b.count])).toEqual([['(0,5]', 2], ['(5,10]', 1]]);
    // 0 and -0 are below (0,5]; 1e308 and 12% lie above 10.
    expect(j.below.count).toBe(4);
    expect(j.above.count).toBe(2);
  });

  it('counts 1e309 and -1e309 as out of range, not as infinities (beyond the largest double, IEEE 754 binary64)', async () => {
    const j = await bucketJson([tmp.file('huge.csv', 'x\n1e309\n-1e309\n1.7976931348623157e308\n'), '--value', 'x', '--edges', '0,1', '--open-high']);
    expect(j.invalid.byReason).toEqual({ 'out-of-range': 2 });
    expect(j.bucketed).toBe(1);
  });

  it('reads thousands separators in groups of three and rejects a bad grouping', async () => {
    const f = tmp.file('grouped.csv', 'x\n"1,234.5"\n"12,345"\n"1,000,000"\n"1,2345"\n');
    const j = await bucketJson([f, '--value', 'x', '--edges', '0,1000,100000', '--open-high']);
    expect(j.buckets.map((b) => b.count)).toEqual([0, 2, 1]);
    expect(j.invalid.byReason).toEqual({ 'bad-grouping': 1 });
  });

  it('reads decimal commas with dot grouping when the column proves it ("1.234,5" can only be comma-decimal)', async () => {
    const f = tmp.file('decimal-comma.csv', 'x\n"1.234,5"\n"12,5"\n"0,5"\n');
    const j = await bucketJson([f, '--value', 'x', '--edges', '0,1,100', '--open-high']);
    expect(j.numberFormat).toMatchObject({ decimal: ',', group: '.', decision: 'decided' });
    expect(j.buckets.map((b) => b.count)).toEqual([1, 1, 1]);
  });

  it('rejects "1,234" as ambiguous when nothing in the column says what the comma is (parseNumber)', () => {
    // 1,234 is 1234 in en-US and 1.234 in de-DE (CLDR number symbols): never guessed.
    const p = parseNumber('1,234', { group: ',', unresolved: true });
    expect([p.status, p.reason]).toEqual(['invalid', 'ambiguous-separator']);
  });

  it.each([
    ['NaN', 'invalid', 'not-a-number'],
    ['Infinity', 'invalid', 'infinite'],
    ['-Infinity', 'invalid', 'infinite'],
    ['1e400', 'invalid', 'out-of-range'],
    ['', 'empty', 'blank'],
    ['12,5', 'invalid', 'unexpected-separator'],
  ])('parseNumber(%j) under the plain format is %s (%s)', (text, status, reason) => {
    const p = parseNumber(text);
    expect([p.status, p.reason]).toEqual([status, reason]);
  });

  it('parseNumber("-0") reads zero, and parseNumber("12%") says the value carried a percent sign', () => {
    expect(Object.is(parseNumber('-0').value, 0)).toBe(true); // types.ts: -0 reads as 0
    const p = parseNumber('12%');
    expect([p.status, p.value, p.percent]).toEqual(['ok', 12, true]);
  });

  // No silent coercion: a value read with its percent sign dropped is counted and noted, with its line.
  it('says in the bucket summary that a value carried a percent sign', async () => {
    const j = await bucketJson([numbers, '--value', 'age', '--edges', '0,5,10', '--open-high']);
    expect(JSON.stringify({ notes: j.notes, keys: Object.keys(j) })).toMatch(/percent|%/);
  });
});
