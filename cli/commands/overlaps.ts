// `quern overlaps`: overlaps, holes and duplicates in sets of numeric or temporal ranges, per key.
// Options → readRanges() → checkRangeColumns() per key → series → text or JSON; --check sets exit 1.
// Without --report the series are written as they are made (a table of 100,000 keys never holds all its
// findings in memory); with --report the whole OverlapsResult is made, for the page.
import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { Command, Option } from 'commander';
import {
  QuernError, checkRangeColumns, formatRange, openOutput, openTable, overlapsHeadText, overlapsJson, overlapsJsonParts, overlapsSeriesText,
  overlapsText, parseDomain, renderOverlapsReport,
} from '../../src/index.js';
import { REPORT_HELP, writeReport } from '../report-output.js';
import type { EndsRule, InferHints, OverlapsChart, OverlapsHead, OverlapsResult, OverlapsSeries, OverlapsTotals, Range, RangeCheck } from '../../src/index.js';
import type { CommandContext } from '../program.js';
import { useColor } from '../io.js';
import { readRanges, type RangeRows, type RangeSource } from './overlaps-input.js';

const EXAMPLES = `
Examples (demo files of the invented Harrowmere District Health Service):
  quern overlaps fixtures/age-bands.csv --range label --domain 0..
  quern overlaps fixtures/reporting-periods.csv --start period_start --end period_end --by programme \\
      --domain 2024-01-01..2024-12-31
  quern overlaps fixtures/reporting-periods.csv --start period_start --end period_end --by programme --check --json
  quern bucket fixtures/visits.csv --value patient_age --method quantile --bins 5 --spec-out bands.json --summary
  quern overlaps --spec bands.json --domain 0..

How ends are read (--ends auto, the default):
  integer numbers and labels are whole-number ranges: 0-4 and 5-9 touch without a hole (0-4 holds 0..4);
  other numbers are half-open [start, end); labels in interval notation ([5,10), (5,10]) say their ends;
  dates written as whole days (and periods such as 2024-Q1) are inclusive day ranges: 2024-01-01 to
  2024-03-31 holds the whole of March 31; date-times are half-open [start, end).
  --ends discrete|closed|half-open|open-closed overrides this for the whole column.
Reports: each overlapping pair with its Allen relation (J. F. Allen, CACM 26(11), 1983) and both lines,
  the holes between ranges, copies of one range, and with --domain whether the ranges cover it and
  partition it. Rows read = ranges + rejected rows (empty, unreadable or reversed ends).
  Every finding is counted; each list shows at most --max-pairs pairs and --max-listed other items
  (holes, duplicated ranges and the lines of each, empty ranges, ranges outside the domain) per series,
  and the text says how many more there are.
JSON (--json), per series: overlaps (listed) and overlapCount (all); holes and holeCount; duplicates
  (each with count, all its copies, and lines, the first --max-listed in file order) and duplicateCount;
  empty and emptyCount; outside and outsideCount; truncated is true when any of these lists is cut.
  limits gives both caps; totals count everything, listed or not.
`;

interface OverlapsFlags {
  start?: string; end?: string; range?: string; spec?: string; by?: string; ends: EndsRule; domain?: string;
  check?: boolean; json?: boolean; maxPairs: string; maxListed: string; delimiter?: string; dayFirst?: boolean; monthFirst?: boolean; chart: boolean; report?: string;
}

export function registerOverlaps(program: Command, ctx: CommandContext): void {
  program
    .command('overlaps')
    .description('Find overlaps, holes and duplicates in sets of numeric or date ranges, per key')
    .argument('[file]', "table to read (CSV, TSV, NDJSON, optionally gzipped; '-' for standard input)")
    .option('--start <column>', 'column of range starts (with --end)')
    .option('--end <column>', 'column of range ends (with --start)')
    .option('--range <column>', 'column of range labels (0-4, 85+, [5,10), 2024-Q1, 2024-01-01/2024-03-31)')
    .option('--spec <file>', 'check the ranges of a bucket spec file')
    .option('--by <column>', 'check each key\'s ranges separately')
    .addOption(new Option('--ends <rule>', 'how the two ends are read').choices(['auto', 'discrete', 'closed', 'half-open', 'open-closed']).default('auto'))
    .option('--domain <range>', 'the span the ranges should cover, e.g. 0.. or 0..120 or 2024-01-01..2024-12-31')
    .option('--check', 'exit with status 1 when an overlap, hole or duplicate is found')
    .option('--json', 'print the result as JSON (fields below)')
    .option('--max-pairs <n>', 'overlapping pairs to list per series (all are counted)', '1000')
    .option('--max-listed <n>', 'holes, duplicates, lines of a duplicate, empty and outside ranges to list per series (all are counted)', '1000')
    .option('--no-chart', 'no text chart of the ranges')
    .option('--report <file.html>', REPORT_HELP)
    .option('--day-first', 'numeric dates are day first (05/04/2024 = 5 April)')
    .option('--month-first', 'numeric dates are month first (05/04/2024 = May 4)')
    .option('--delimiter <char>', 'input field delimiter (default: sniffed)')
    .addHelpText('after', EXAMPLES)
    .action(async (file: string | undefined, flags: OverlapsFlags) => {
      const source = await sourceOf(file, flags, ctx);
      const hints: InferHints = { ...(flags.dayFirst ? { dayFirst: true } : {}), ...(flags.monthFirst ? { monthFirst: true } : {}) };
      const open = file === undefined ? null : () => openTable(file, { cwd: ctx.io.cwd, stdin: ctx.io.stdin, ...(flags.delimiter ? { delimiter: flags.delimiter } : {}) });
      const plan = planOf(file ?? flags.spec!, await readRanges(open, source, flags.by, flags.ends, hints), flags);
      const out = await openOutput('-', { stdout: ctx.io.stdout });
      const text = { color: useColor(ctx.io), width: Math.min(ctx.io.stdout.columns ?? 80, 100) };
      let totals: OverlapsTotals;
      let whole: OverlapsResult | null = null;
      if (flags.report !== undefined) {
        // The page needs the whole result (and its charts, unless --no-chart).
        whole = collect(plan, flags.chart);
        await out.write(flags.json ? overlapsJson(whole) : overlapsText(whole, text));
        totals = whole.totals;
      } else if (flags.json) {
        const tally = new Tally();
        for (const piece of overlapsJsonParts(plan.head, tally.through(eachSeries(plan, false)), () => tally.totals)) {
          await out.write(piece);
          if (out.closed) break;
        }
        totals = tally.totals;
      } else {
        totals = countAll(plan); // the headline comes first: a counting pass, then the series one by one
        await out.write(overlapsHeadText(plan.head, totals));
        for (const { s, chart } of eachSeries(plan, flags.chart)) {
          await out.write(`\n${overlapsSeriesText(s, chart ?? undefined, text, plan.head.domainGiven)}`);
          if (out.closed) break;
        }
      }
      await out.commit();
      if (flags.check && (totals.overlaps > 0 || totals.holes > 0 || totals.duplicates > 0)) ctx.setExit(1);
      await writeReport(flags.report, () => renderOverlapsReport(whole ?? collect(plan, flags.chart)), ctx.io);
    });
}

async function sourceOf(file: string | undefined, f: OverlapsFlags, ctx: CommandContext): Promise<RangeSource> {
  const modes = [f.range !== undefined, f.start !== undefined || f.end !== undefined, f.spec !== undefined].filter(Boolean).length;
  if (modes !== 1) throw new QuernError('E_USAGE', 'give one of --start COL --end COL, --range COL or --spec FILE', 'quern overlaps --help shows examples');
  if (f.spec !== undefined) {
    let text: string;
    try { text = await readFile(resolve(ctx.io.cwd, f.spec), 'utf8'); } catch (e) { throw new QuernError('E_FILE', `cannot read the spec file ${f.spec}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`); }
    try { return { kind: 'spec', spec: JSON.parse(text) }; } catch { throw new QuernError('E_VALUE', `the spec file ${f.spec} is not JSON`); }
  }
  if (file === undefined) throw new QuernError('E_USAGE', 'quern overlaps needs a FILE');
  if (f.range !== undefined) return { kind: 'range', column: f.range };
  if (f.start === undefined || f.end === undefined) throw new QuernError('E_USAGE', '--start and --end go together');
  return { kind: 'start-end', start: f.start, end: f.end };
}

function wholeNumber(option: string, text: string): number {
  const n = Number(text);
  if (text.trim() === '' || !Number.isSafeInteger(n) || n < 0) throw new QuernError('E_USAGE', `${option} ${JSON.stringify(text)} is not a whole number`, `give ${option} 0 or more`);
  return n;
}

function label(rows: RangeRows, r: Range): string {
  return rows.time !== null ? rows.time.format!(r) : formatRange(r);
}

/** The values shared by two overlapping ranges. */
function shared(a: Range, b: Range): Range {
  const lowA = a.low ?? -Infinity, lowB = b.low ?? -Infinity, highA = a.high ?? Infinity, highB = b.high ?? Infinity;
  const low = lowA === lowB ? { v: lowA, c: a.lowClosed && b.lowClosed } : lowA > lowB ? { v: lowA, c: a.lowClosed } : { v: lowB, c: b.lowClosed };
  const high = highA === highB ? { v: highA, c: a.highClosed && b.highClosed } : highA < highB ? { v: highA, c: a.highClosed } : { v: highB, c: b.highClosed };
  return { low: Number.isFinite(low.v) ? low.v : null, high: Number.isFinite(high.v) ? high.v : null, lowClosed: low.c, highClosed: high.c, discrete: a.discrete && b.discrete };
}

function holeEnds(rows: RangeRows, h: Range): { from: number | string; to: number | string } {
  const t = rows.time;
  if (t !== null) {
    const whole = rows.ends.startsWith('whole') && h.high !== null && h.high % 86_400_000 === 0;
    return { from: h.low === null ? '' : t.formatPoint(h.low), to: h.high === null ? '' : t.formatPoint(whole ? h.high - 86_400_000 : h.high) };
  }
  return { from: h.low ?? '-inf', to: h.high === null ? 'inf' : h.discrete ? h.high - 1 : h.high };
}

/** Everything the series are made from: the ranges, the domain, the list caps, and the rows of each key. */
interface Plan {
  rows: RangeRows;
  head: OverlapsHead;
  domain: Range | undefined;
  keyed: boolean;
  /** Row ids grouped by key id (a counting sort, so a million rows cost one typed array): key g holds order[start[g] .. start[g+1]). */
  order: Uint32Array;
  start: Uint32Array;
}

function planOf(file: string, rows: RangeRows, f: OverlapsFlags): Plan {
  const limits = { pairs: wholeNumber('--max-pairs', f.maxPairs), listed: wholeNumber('--max-listed', f.maxListed) };
  const domain = f.domain === undefined ? undefined : parseDomain(f.domain, { ends: rows.kind === 'number' && !rows.allDiscrete ? 'closed' : 'auto', ...(rows.time ? { time: rows.time } : {}) });
  if (domain === null) throw new QuernError('E_VALUE', `--domain ${JSON.stringify(f.domain)} is not a range`, 'write 0.., 0..120, or 2024-01-01..2024-12-31');
  const n = rows.keyNames.length;
  const start = new Uint32Array(n + 1);
  for (let i = 0; i < rows.keys.length; i++) start[rows.keys[i]! + 1]!++;
  for (let g = 0; g < n; g++) start[g + 1]! += start[g]!;
  const at = start.slice(0, n), order = new Uint32Array(rows.keys.length);
  for (let i = 0; i < rows.keys.length; i++) order[at[rows.keys[i]!]!++] = i;
  const head: OverlapsHead = { file, ranges: rows.ranges.length, rowsRead: rows.rowsRead, rejected: rows.rejected, kind: rows.kind, ends: rows.ends, domainGiven: domain !== undefined, limits };
  return { rows, head, domain, keyed: f.by !== undefined, order, start };
}

/** The check of key g's ranges (row ids in file order) under the plan's caps. */
function checkKey(p: Plan, g: number, pairs: number, listed: number): { ids: Uint32Array; check: RangeCheck } {
  const ids = p.order.subarray(p.start[g]!, p.start[g + 1]!);
  return { ids, check: checkRangeColumns(p.rows.ranges, ids, { ...(p.domain ? { domain: p.domain } : {}), maxPairs: pairs, maxListed: listed }) };
}

function seriesOf(p: Plan, g: number): { s: OverlapsSeries; ids: Uint32Array; check: RangeCheck } {
  const rows = p.rows;
  const { ids, check } = checkKey(p, g, p.head.limits.pairs, p.head.limits.listed);
  const at = (k: number) => rows.range(ids[k]!);
  const ref = (k: number) => ({ line: rows.lines[ids[k]!]!, range: rows.text(ids[k]!) });
  const duplicates = check.duplicates.map((d) => ({ range: rows.text(ids[d.indices[0]!]!), lines: d.indices.map((k) => rows.lines[ids[k]!]!), count: d.count }));
  const s: OverlapsSeries = {
    key: p.keyed ? rows.keyNames[g]! : null, ranges: check.ranges,
    overlaps: check.overlaps.map((q) => ({ a: ref(q.a), b: ref(q.b), relation: q.relation, shared: label(rows, shared(at(q.a), at(q.b))) })),
    overlapCount: check.overlapCount,
    holes: check.holes.map((h) => ({ ...holeEnds(rows, h), range: label(rows, h) })), holeCount: check.holeCount,
    duplicates, duplicateCount: check.duplicateCount,
    empty: check.empty.map(ref), emptyCount: check.emptyCount, outside: check.outside.map(ref), outsideCount: check.outsideCount,
    truncated: check.overlapCount > check.overlaps.length || check.holeCount > check.holes.length || check.duplicateCount > check.duplicates.length
      || check.emptyCount > check.empty.length || check.outsideCount > check.outside.length || duplicates.some((d) => d.count > d.lines.length),
    domain: check.domain === null ? null : label(rows, check.domain), covers: check.covers, partition: check.partition,
  };
  return { s, ids, check };
}

/** Drawing data of a small series (at most 40 ranges), made only when a chart is drawn; it marks every overlap and hole, listed or not. */
function chartOf(p: Plan, ids: Uint32Array, listed: RangeCheck): OverlapsChart {
  if (ids.length > 40 || ids.length === 0) return null;
  const rows = p.rows;
  const capped = listed.overlapCount > listed.overlaps.length || listed.holeCount > listed.holes.length;
  const check = capped ? checkRangeColumns(rows.ranges, ids, { ...(p.domain ? { domain: p.domain } : {}), maxPairs: Infinity }) : listed;
  const at = (k: number) => rows.range(ids[k]!);
  const fmt = rows.time !== null ? (v: number) => rows.time!.formatPoint(Math.round(v)) : (v: number) => String(v);
  const marks = [...check.overlaps.map((q) => shared(at(q.a), at(q.b))).map((r) => ({ kind: 'overlap' as const, low: r.low ?? 0, high: r.high ?? 0 })),
    ...check.holes.filter((h) => h.low !== null && h.high !== null).map((h) => ({ kind: 'hole' as const, low: h.low!, high: h.high! }))];
  return { ranges: Array.from(ids, (i) => ({ label: rows.text(i), low: rows.range(i).low, high: rows.range(i).high })), marks, format: fmt };
}

/** Each key's series in order of first appearance, made one at a time (with its chart when asked). */
function* eachSeries(p: Plan, withChart: boolean): Generator<{ s: OverlapsSeries; chart: OverlapsChart }> {
  for (let g = 0; g + 1 < p.start.length; g++) {
    const { s, ids, check } = seriesOf(p, g);
    yield { s, chart: withChart ? chartOf(p, ids, check) : null };
  }
}

/** Totals summed as series go by. */
class Tally {
  totals: OverlapsTotals = { overlaps: 0, holes: 0, duplicates: 0, series: 0, seriesWithProblems: 0 };
  add(overlaps: number, holes: number, duplicates: number): void {
    const t = this.totals;
    t.overlaps += overlaps; t.holes += holes; t.duplicates += duplicates; t.series++;
    if (overlaps + holes + duplicates > 0) t.seriesWithProblems++;
  }
  *through(series: Iterable<{ s: OverlapsSeries }>): Generator<OverlapsSeries> {
    for (const { s } of series) { this.add(s.overlapCount, s.holeCount, s.duplicateCount); yield s; }
  }
}

/** The totals alone: every key checked with nothing listed. */
function countAll(p: Plan): OverlapsTotals {
  const tally = new Tally();
  for (let g = 0; g + 1 < p.start.length; g++) {
    const { check } = checkKey(p, g, 0, 0);
    tally.add(check.overlapCount, check.holeCount, check.duplicateCount);
  }
  return tally.totals;
}

/** The whole result, every series in memory (for --report). */
function collect(p: Plan, withChart: boolean): OverlapsResult {
  const tally = new Tally();
  const series: OverlapsSeries[] = [];
  const chart: NonNullable<OverlapsResult['chart']> = [];
  for (const { s, chart: c } of eachSeries(p, withChart)) {
    tally.add(s.overlapCount, s.holeCount, s.duplicateCount);
    series.push(s);
    chart.push(c);
  }
  return { ...p.head, series, totals: tally.totals, chart };
}
