// `quern overlaps` at scale: every finding is counted, each list is capped (--max-pairs, --max-listed),
// the text says how many were left out, and the JSON carries the counts and a `truncated` flag. The
// expected values are worked out by hand from the generated inputs (arithmetic on the rows written here).
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { overlapsJson, overlapsJsonParts, type OverlapsResult, type OverlapsSeries } from '../../src/index.js';
import { runCli } from '../helpers/cli.js';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
const json = (s: string) => JSON.parse(s) as Record<string, any>;
const dir = mkdtempSync(join(tmpdir(), 'quern-test-overlaps-limits-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** `rows` copies of the range 5-10, after the header `s,e` (data lines 2 … rows + 1). */
const identical = (rows: number) => `s,e\n${'5,10\n'.repeat(rows)}`;
/** Single whole numbers 0, 2, 4, … (n ranges): a one-value hole at every odd number between them, n - 1 holes. */
const evens = (n: number) => `s,e\n${Array.from({ length: n }, (_, i) => `${2 * i},${2 * i}\n`).join('')}`;

describe('quern overlaps --max-listed', () => {
  it('lists the first 1,000 of 100,000 copies of one range by default, and counts all of them', async () => {
    const r = await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--json'], { stdin: identical(100_000) });
    expect(r.status).toBe(0);
    const s = json(r.stdout).series[0];
    expect(s.duplicateCount).toBe(1);
    expect(s.duplicates).toHaveLength(1);
    expect(s.duplicates[0].count).toBe(100_000);
    // The first data line is line 2 (line 1 is the header, RFC 4180 §2.3); the first 1,000 copies in file order.
    expect(s.duplicates[0].lines).toEqual(Array.from({ length: 1000 }, (_, i) => i + 2));
    expect(s.truncated).toBe(true);
    expect(json(r.stdout).limits).toEqual({ pairs: 1000, listed: 1000 });
    // 1,000 line numbers, not 100,000: the JSON stays small.
    expect(r.stdout.length).toBeLessThan(40_000);
  });

  it('says in text how many copies were not listed', async () => {
    const r = await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--max-listed', '20'], { stdin: identical(5000) });
    // 8 lines are shown (2 … 9) of 5,000 copies: 4,992 more.
    expect(r.stdout).toContain('duplicate 5-10 ×5000 on lines 2, 3, 4, 5, 6, 7, 8, 9, … and 4,992 more');
  });

  it('lists the first N holes in order and counts all of them, in the series, the totals and the text', async () => {
    const r = await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--json', '--max-listed', '10'], { stdin: evens(2000) });
    const j = json(r.stdout);
    const s = j.series[0];
    expect(s.holeCount).toBe(1999);
    // Holes 1, 3, 5, … 19: each a single whole number (0-0 and 2-2 leave 1 uncovered).
    expect(s.holes.map((h: { from: number; to: number }) => [h.from, h.to])).toEqual(Array.from({ length: 10 }, (_, i) => [2 * i + 1, 2 * i + 1]));
    expect(s.truncated).toBe(true);
    expect(j.totals).toMatchObject({ holes: 1999, overlaps: 0, duplicates: 0, series: 1, seriesWithProblems: 1 });
    const t = await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--max-listed', '10'], { stdin: evens(2000) });
    expect(t.stdout).toContain('2,000 ranges — 0 overlaps, 1,999 holes, 0 duplicates');
    expect(t.stdout).toContain('  … and 1,989 more holes (--max-listed)');
    expect(t.stdout.match(/^ {2}hole {6}/gm)).toHaveLength(10);
  });

  it('caps the groups of duplicates and the lines of each group separately', async () => {
    // 50 distinct ranges written 3 times each, in blocks: k,k+1 on lines 2+3k, 3+3k, 4+3k.
    const csv = `s,e\n${Array.from({ length: 50 }, (_, k) => `${10 * k},${10 * k + 1}\n`.repeat(3)).join('')}`;
    const s = json((await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--json', '--max-listed', '2'], { stdin: csv })).stdout).series[0];
    expect(s.duplicateCount).toBe(50);
    expect(s.duplicates).toEqual([
      { range: '0-1', lines: [2, 3], count: 3 },
      { range: '10-11', lines: [5, 6], count: 3 },
    ]);
  });

  it('caps empty ranges and ranges outside the domain, in file order, counting all', async () => {
    const csv = `r\n${'"[5,5)"\n'.repeat(30)}0-4\n${Array.from({ length: 12 }, (_, i) => `${100 + 10 * i}-${105 + 10 * i}\n`).join('')}`;
    const s = json((await runCli(['overlaps', '-', '--range', 'r', '--json', '--max-listed', '3', '--domain', '0..99'], { stdin: csv })).stdout).series[0];
    // [5,5) holds no value (half-open with equal ends, ISO 80000-2 2-7.7): 30 of them, lines 2 … 31.
    expect(s.emptyCount).toBe(30);
    expect(s.empty).toEqual([{ line: 2, range: '[5,5)' }, { line: 3, range: '[5,5)' }, { line: 4, range: '[5,5)' }]);
    // 100-105 … 210-215 lie outside 0..99: 12 of them, from line 33.
    expect(s.outsideCount).toBe(12);
    expect(s.outside.map((o: { line: number }) => o.line)).toEqual([33, 34, 35]);
    expect(s.truncated).toBe(true);
  });

  it('--max-listed 0 --max-pairs 0 lists nothing, still counts everything, and --check still fails', async () => {
    const csv = 's,e\n0,4\n2,6\n2,6\n10,12\n';
    const r = await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--json', '--max-listed', '0', '--max-pairs', '0', '--check'], { stdin: csv });
    expect(r.status).toBe(1); // cli/exit.ts: --check found problems
    const s = json(r.stdout).series[0];
    // 0-4 overlaps 2-6 (one pair of distinct ranges; the copy is a duplicate); 7-9 is a hole.
    expect([s.overlapCount, s.holeCount, s.duplicateCount]).toEqual([1, 1, 1]);
    expect([s.overlaps, s.holes, s.duplicates]).toEqual([[], [], []]);
    expect(s.truncated).toBe(true);
  });

  it('a series whose lists are complete says truncated: false', async () => {
    const s = json((await runCli(['overlaps', 'fixtures/age-bands.csv', '--range', 'label', '--json'])).stdout).series[0];
    expect(s.truncated).toBe(false);
    expect([s.holeCount, s.holes.length]).toEqual([1, 1]); // the demo table's one hole (fixtures/generate.mjs)
  });

  it.each([['-1'], ['x'], ['1.5'], ['']])('--max-listed %j is a usage error (status 2)', async (n) => {
    const r = await runCli(['overlaps', 'fixtures/age-bands.csv', '--range', 'label', '--max-listed', n]);
    expect(r.status).toBe(2); // cli/exit.ts: usage
    expect(r.stderr).toMatch(/--max-listed .* is not a whole number/);
  });

  it('--help names --max-listed and documents the JSON count fields', async () => {
    const r = await runCli(['overlaps', '--help']);
    for (const word of ['--max-listed', 'holeCount', 'duplicateCount', 'emptyCount', 'outsideCount', 'truncated', 'limits']) expect(r.stdout).toContain(word);
  });
});

describe('quern overlaps with many keys', () => {
  // 3,000 keys K0 … K2999, each with 0-4, 3-9 (overlapping 0-4: 3 and 4 shared) and 20-29 (a hole 10-19).
  const csv = `k,s,e\n${Array.from({ length: 3000 }, (_, i) => `K${i},0,4\nK${i},3,9\nK${i},20,29\n`).join('')}`;

  it('writes one series per key in order of first appearance, with totals that add up', async () => {
    const j = json((await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--by', 'k', '--json'], { stdin: csv })).stdout);
    expect(j.series).toHaveLength(3000);
    expect(j.series.slice(0, 3).map((s: { key: string }) => s.key)).toEqual(['K0', 'K1', 'K2']);
    expect(j.series[2999]).toMatchObject({ key: 'K2999', ranges: 3, overlapCount: 1, holeCount: 1, duplicateCount: 0 });
    expect(j.series[2999].holes).toEqual([{ from: 10, to: 19, range: '10-19' }]);
    expect(j.totals).toEqual({ overlaps: 3000, holes: 3000, duplicates: 0, series: 3000, seriesWithProblems: 3000 });
  });

  it('the written JSON and text are the same whether the series are streamed or collected for --report', async () => {
    // Differential test of two ways of writing one result: streamed (no --report) and whole (--report).
    const argv = ['overlaps', '-', '--start', 's', '--end', 'e', '--by', 'k'];
    const small = csv.split('\n').slice(0, 31).join('\n') + '\n';
    for (const extra of [['--json'], [], ['--no-chart'], ['--max-listed', '0', '--max-pairs', '0']]) {
      const report = join(dir, `r${extra.join('')}.html`);
      const streamed = await runCli([...argv, ...extra], { stdin: small });
      const whole = await runCli([...argv, ...extra, '--report', report], { stdin: small });
      expect(whole.status).toBe(0);
      expect(streamed.stdout).toBe(whole.stdout);
      expect(readFileSync(report, 'utf8')).toContain('<html');
    }
  });

  it('prints the totals first in text, then every key', async () => {
    const r = await runCli(['overlaps', '-', '--start', 's', '--end', 'e', '--by', 'k', '--no-chart'], { stdin: csv });
    const lines = r.stdout.split('\n');
    expect(lines[1]).toBe('3,000 overlapping pairs, 3,000 holes, 0 duplicated ranges; 3,000 of 3,000 series with problems');
    expect(r.stdout.match(/^K\d+: 3 ranges — 1 overlap, 1 hole, 0 duplicates$/gm)).toHaveLength(3000);
  });
});

describe('quern overlaps on a million identical ranges', () => {
  it('--json lists 1,000 lines of the one duplicate and counts 1,000,000, in a small output', async () => {
    const f = join(dir, 'million.csv');
    writeFileSync(f, identical(1_000_000));
    const r = await runCli(['overlaps', f, '--start', 's', '--end', 'e', '--json']);
    expect(r.status).toBe(0);
    const s = json(r.stdout).series[0];
    expect([s.ranges, s.duplicateCount, s.duplicates[0].count, s.duplicates[0].lines.length, s.overlapCount]).toEqual([1_000_000, 1, 1_000_000, 1000, 0]);
    expect(r.stdout.length).toBeLessThan(40_000); // was about 20 MB when every line was listed
  });
});

describe('overlapsJson(result) written in pieces', () => {
  const series = (key: string, holes: number): OverlapsSeries => ({
    key, ranges: 2, overlaps: [], overlapCount: 0, holes: Array.from({ length: holes }, (_, i) => ({ from: i, to: i, range: String(i) })), holeCount: holes,
    duplicates: [{ range: '5-9', lines: [3, 4], count: 2 }], duplicateCount: 1, empty: [], emptyCount: 0, outside: [], outsideCount: 0,
    truncated: false, domain: '0-9', covers: holes === 0, partition: false,
  });
  const result = (n: number): OverlapsResult => ({
    file: 'x.csv', ranges: 2 * n, rowsRead: 2 * n, rejected: { count: 0, byReason: {}, examples: [] }, kind: 'number', ends: 'whole numbers',
    domainGiven: false, limits: { pairs: 1000, listed: 1000 }, series: Array.from({ length: n }, (_, i) => series(`k${i}`, i)),
    totals: { overlaps: 0, holes: (n * (n - 1)) / 2, duplicates: n, series: n, seriesWithProblems: n }, chart: [],
  });

  it.each([[0], [1], [3]])('overlapsJson of %i series is the text JSON.stringify(result without chart, null, 2) writes', (n) => {
    // The oracle is the JavaScript built-in (ECMA-262 JSON.stringify with an indent of 2), not quern's code.
    const { chart: _c, ...plain } = result(n);
    expect(overlapsJson(result(n))).toBe(`${JSON.stringify(plain, null, 2)}\n`);
    const { series: s, totals, chart: _d, ...head } = result(n);
    expect([...overlapsJsonParts(head, s, () => totals)]).toHaveLength(n + 2); // head, one piece per series, totals
  });
});
