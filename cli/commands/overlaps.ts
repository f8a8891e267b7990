// `quern overlaps`: overlaps, holes and duplicates in sets of numeric or temporal ranges, per key.
// Options → readRanges() → checkRanges() per key → OverlapsResult → text or JSON; --check sets exit 1.
import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { Command, Option } from 'commander';
import { QuernError, checkRangeColumns, formatRange, openTable, overlapsJson, overlapsText, parseDomain, renderOverlapsReport } from '../../src/index.js';
import { REPORT_HELP, writeReport } from '../report-output.js';
import type { EndsRule, InferHints, OverlapsResult, OverlapsSeries, Range, RangeCheck } from '../../src/index.js';
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
`;

interface OverlapsFlags {
  start?: string; end?: string; range?: string; spec?: string; by?: string; ends: EndsRule; domain?: string;
  check?: boolean; json?: boolean; maxPairs: string; delimiter?: string; dayFirst?: boolean; monthFirst?: boolean; chart: boolean; report?: string;
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
    .option('--json', 'print the result as JSON')
    .option('--max-pairs <n>', 'overlapping pairs to list per series (all are counted)', '1000')
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
      const rows = await readRanges(open, source, flags.by, flags.ends, hints);
      const result = analyse(file ?? flags.spec!, rows, flags);
      const stream = ctx.io.stdout;
      stream.write(flags.json ? overlapsJson(result) : overlapsText(result, { color: useColor(ctx.io), width: Math.min(stream.columns ?? 80, 100) }));
      if (flags.check && (result.totals.overlaps > 0 || result.totals.holes > 0 || result.totals.duplicates > 0)) ctx.setExit(1);
      await writeReport(flags.report, () => renderOverlapsReport(result), ctx.io);
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

function maxPairs(text: string): number {
  const n = Number(text);
  if (!Number.isSafeInteger(n) || n < 0) throw new QuernError('E_USAGE', `--max-pairs ${JSON.stringify(text)} is not a whole number`);
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

function seriesOf(key: string | null, idx: number[], rows: RangeRows, domain: Range | undefined, limit: number): { s: OverlapsSeries; check: RangeCheck; at: (k: number) => Range } {
  const at = (k: number) => rows.range(idx[k]!);
  const check = checkRangeColumns(rows.ranges, Uint32Array.from(idx), { ...(domain ? { domain } : {}), maxPairs: limit });
  const ref = (k: number) => ({ line: rows.lines[idx[k]!]!, range: rows.text(idx[k]!) });
  const s: OverlapsSeries = {
    key, ranges: check.ranges,
    overlaps: check.overlaps.map((p) => ({ a: ref(p.a), b: ref(p.b), relation: p.relation, shared: label(rows, shared(at(p.a), at(p.b))) })),
    overlapCount: check.overlapCount,
    holes: check.holes.map((h) => ({ ...holeEnds(rows, h), range: label(rows, h) })),
    duplicates: check.duplicates.map((d) => ({ range: rows.text(idx[d.indices[0]!]!), lines: d.indices.map((k) => rows.lines[idx[k]!]!).sort((x, y) => x - y), count: d.indices.length })),
    empty: check.empty.map(ref), outside: check.outside.map(ref),
    domain: check.domain === null ? null : label(rows, check.domain), covers: check.covers, partition: check.partition,
  };
  return { s, check, at };
}

function chartOf(rows: RangeRows, idx: number[], check: RangeCheck, at: (k: number) => Range): NonNullable<OverlapsResult['chart']>[number] {
  if (idx.length > 40 || idx.length === 0) return null;
  const fmt = rows.time !== null ? (v: number) => rows.time!.formatPoint(Math.round(v)) : (v: number) => String(v);
  const marks = [...check.overlaps.map((p) => shared(at(p.a), at(p.b))).map((r) => ({ kind: 'overlap' as const, low: r.low ?? 0, high: r.high ?? 0 })),
    ...check.holes.filter((h) => h.low !== null && h.high !== null).map((h) => ({ kind: 'hole' as const, low: h.low!, high: h.high! }))];
  return { ranges: idx.map((i) => ({ label: rows.text(i), low: rows.range(i).low, high: rows.range(i).high })), marks, format: fmt };
}

function analyse(file: string, rows: RangeRows, f: OverlapsFlags): OverlapsResult {
  const limit = maxPairs(f.maxPairs);
  const domain = f.domain === undefined ? undefined : parseDomain(f.domain, { ends: rows.kind === 'number' && !rows.allDiscrete ? 'closed' : 'auto', ...(rows.time ? { time: rows.time } : {}) });
  if (domain === null) throw new QuernError('E_VALUE', `--domain ${JSON.stringify(f.domain)} is not a range`, 'write 0.., 0..120, or 2024-01-01..2024-12-31');
  const groups = new Map<number, number[]>();
  rows.keys.forEach((k, i) => { const g = groups.get(k); if (g) g.push(i); else groups.set(k, [i]); });
  const series: OverlapsSeries[] = [];
  const chart: NonNullable<OverlapsResult['chart']> = [];
  for (const [key, idx] of groups) {
    const { s, check, at } = seriesOf(f.by === undefined ? null : rows.keyNames[key]!, idx, rows, domain, limit);
    series.push(s);
    chart.push(f.chart ? chartOf(rows, idx, check, at) : null);
  }
  const totals = {
    overlaps: series.reduce((a, s) => a + s.overlapCount, 0), holes: series.reduce((a, s) => a + s.holes.length, 0),
    duplicates: series.reduce((a, s) => a + s.duplicates.length, 0), series: series.length,
    seriesWithProblems: series.filter((s) => s.overlapCount + s.holes.length + s.duplicates.length > 0).length,
  };
  return { file, ranges: rows.ranges.length, rowsRead: rows.rowsRead, rejected: rows.rejected, kind: rows.kind, ends: rows.ends, domainGiven: domain !== undefined, series, totals, chart };
}
