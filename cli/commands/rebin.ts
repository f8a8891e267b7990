// `quern rebin`: events to calendar periods, with aggregates, groups and empty periods filled.
// Options → RebinOptions → rebin() → RebinResult → CSV / JSON / NDJSON and a summary on stderr.
import { statSync } from 'node:fs';
import { resolve as resolvePath } from 'node:path';
import { Command, Option } from 'commander';
// The concepts' own indexes (re-exported by src/index.ts), so that a run loads only what rebin needs;
// the HTML report is loaded only with --report.
import { QuernError } from '../../src/errors.js';
import { parseFiscalStart, parseUnitName, parseWeekStart } from '../../src/calendar/index.js';
import { boundInstant, parseAggSpecs, parseAssignPolicy, parseQuantileType, rebinFile } from '../../src/rebin/index.js';
import { rebinJson, rebinNdjson, rebinRowCells, rebinSummaryText } from '../../src/report/rebin.js';
import { csvRow, openOutput } from '../../src/table/index.js';
import { REPORT_HELP, writeReport } from '../report-output.js';
import type { CalendarOptions, RebinOptions, RebinResult } from '../../src/index.js';
import type { CommandContext } from '../program.js';
import { parseThreads, THREADS_HELP } from '../threads.js';
import { makeProgress } from '../progress.js';

const collect = (v: string, prev: string[] | undefined): string[] => [...(prev ?? []), v];

const EXAMPLES = `
Examples (demo files of the invented Harrowmere District Health Service):
  quern rebin fixtures/visits.csv --time visit_time --unit epi-week --zone America/Chicago
  quern rebin fixtures/visits.csv --time visit_time --unit fiscal-quarter --fiscal-start 10 --zone America/Chicago \\
      --by clinic --agg count --agg mean:wait_minutes --agg p90:wait_minutes --agg distinct:area_code
  quern rebin fixtures/visits.csv --time visit_time --unit month --zone America/Chicago --format json --out visits-monthly.json
  quern rebin fixtures/weekly-cases.csv --time epi_week --unit month --zone America/Chicago --by clinic \\
      --agg sum:cases --assign apportion
  quern rebin fixtures/weekly-cases.csv --time week_ending --source-unit epi-week --source-anchor end \\
      --unit fiscal-quarter --zone America/Chicago --agg sum:cases --assign end
  quern rebin fixtures/fridge-temps.csv --time reading_time --unit hour --step 6 --by fridge_id --agg mean:temp_c --agg max:temp_c

Rules:
  Values with an offset are converted to --zone before flooring; values without one are wall-clock time in
  --zone (UTC when none is given). A wall-clock time skipped by a daylight-saving change moves forward by the
  gap; a repeated one takes the earlier instant; both are counted in the summary.
  Empty periods between the first and last period (or --from/--until) are filled for every group: count 0,
  distinct 0, other aggregates empty. Sums use compensated (Neumaier) summation; median and pNN are exact
  (Hyndman-Fan type 7 unless --quantile-type), keeping each period's values; distinct counts are exact.
  Source values that are periods (weeks, months) must nest in the target unit, or take --assign.
  Rows read = used + empty time + rejected + outside --from/--until; the summary shows each.
  A plain CSV/TSV file of 32 MB or more is read on --threads threads in byte ranges merged in file order:
  the result, line numbers included, is that of one read (--assign apportion, standard input and gzip are
  read on one thread).
  CSV cells a spreadsheet would run as formulas (a leading =, +, -, @, tab, CR or LF) are neutralised with a
  leading ' (OWASP CSV injection guidance); plain numbers such as -5 stay numbers. --no-neutralise turns this
  off for trusted pipelines.

Caution: ISO weeks start on Monday, epidemiological (CDC MMWR) weeks on Sunday, and week 1, week 53 and
fiscal-year names differ between authorities (US federal FY2024 = 2023-10-01..2024-09-30). Check the
conventions your reporting authority uses before publishing counts.
`;

interface RebinFlags {
  time: string; unit: string; step?: string; zone?: string; weekStart?: string; fiscalStart?: string; fiscalLabel?: 'end' | 'start';
  agg?: string[]; by?: string[]; fill: boolean; from?: string; until?: string; maxPeriods?: string; assign?: string;
  sourceUnit?: string; sourceAnchor?: 'start' | 'end'; timeFormat?: string; dayFirst?: boolean; monthFirst?: boolean; quantileType?: string;
  format: 'csv' | 'json' | 'ndjson'; out: string; delimiter?: string; maxBuffered?: string; maxDistinct?: string; quiet?: boolean;
  report?: string; neutralise: boolean; threads?: string;
}

export function registerRebin(program: Command, ctx: CommandContext): void {
  program
    .command('rebin')
    .description('Count and aggregate events per calendar period (weeks, months, quarters, fiscal years, N-minute slots) in a zone')
    .argument('<file>', "table to read (CSV, TSV, NDJSON, optionally gzipped; '-' for standard input)")
    .requiredOption('--time <column>', 'the time column')
    .requiredOption('--unit <unit>', 'target unit: minute, hour, day, week, iso-week, epi-week, month, quarter, half, year, fiscal-year, fiscal-quarter, fiscal-month')
    .option('--step <n>', 'periods of n units (15 with --unit minute)')
    .option('--zone <zone>', 'IANA zone or offset in which periods are cut (default UTC)')
    .option('--week-start <day>', 'first day of --unit week (monday … sunday)')
    .option('--fiscal-start <month[-day]>', 'first day of the fiscal year (default 10: 1 October, US federal)')
    .addOption(new Option('--fiscal-label <end|start>', 'name fiscal years by the year they end (default) or start').choices(['end', 'start']))
    .option('--agg <spec>', 'aggregate, repeatable: count, count:COL, sum:COL, mean:COL, median:COL, min:COL, max:COL, pNN:COL, distinct:COL', collect)
    .option('--by <column>', 'group column, repeatable: one series per group', collect)
    .option('--no-fill', 'do not fill empty periods')
    .option('--from <time>', 'first period to include (the one holding this time)')
    .option('--until <time>', 'last period to include (the one holding this time)')
    .option('--max-periods <n>', 'most periods fill may build (default: as many as 20 years hold, 250 to 500,000)')
    .option('--assign <policy>', 'for source periods that straddle a target boundary: start, end or apportion')
    .option('--source-unit <unit>', 'the period each source date stands for (epi-week for week-ending dates)')
    .addOption(new Option('--source-anchor <start|end>', 'a source date is the first (default) or last day of its period').choices(['start', 'end']))
    .option('--day-first', 'numeric dates are day first (05/04/2021 is 5 April)')
    .option('--month-first', 'numeric dates are month first (05/04/2021 is May 4)')
    .option('--time-format <id>', 'how the time values are written, instead of inferring it (e.g. day-month-year)')
    .option('--quantile-type <1-9>', 'Hyndman-Fan quantile type for median and pNN (default 7)')
    .addOption(new Option('--format <format>', 'output format').choices(['csv', 'json', 'ndjson']).default('csv'))
    .option('--out <file>', "write to a file (atomically) instead of standard output", '-')
    .option('--delimiter <char>', 'input field delimiter (default: sniffed)')
    .option('--no-neutralise', 'do not neutralise formula-like cells in CSV output (trusted pipelines only)')
    .option('--max-buffered <n>', 'values kept for exact medians and quantiles, all periods together (default 20,000,000)')
    .option('--max-distinct <n>', 'values kept for distinct counts, all periods together (default 2,000,000)')
    .option('--threads <n>', THREADS_HELP)
    .option('-q, --quiet', 'no summary on standard error')
    .option('--report <file.html>', REPORT_HELP)
    .addHelpText('after', EXAMPLES)
    .action(async (file: string, flags: RebinFlags) => {
      const options = rebinOptions(flags);
      const threads = parseThreads(flags.threads);
      const progress = makeProgress(ctx.io, sizeOf(file, ctx), { label: file });
      let result: RebinResult;
      try {
        result = await rebinFile(file, options, {
          cwd: ctx.io.cwd, stdin: ctx.io.stdin, onProgress: (b, t) => progress.onProgress(b, t ?? 0), ...(flags.delimiter ? { delimiter: flags.delimiter } : {}),
        }, { threads });
      } finally {
        progress.stop();
      }
      await writeResult(result, flags, ctx);
      await writeReport(flags.report, async () => (await import('../../src/report/index.js')).renderRebinReport(result), ctx.io);
      if (!flags.quiet && flags.format !== 'json') ctx.io.stderr.write(rebinSummaryText(result));
    });
}

function rebinOptions(f: RebinFlags): RebinOptions {
  const calendar: CalendarOptions = { unit: parseUnitName(f.unit) };
  if (f.step !== undefined) calendar.step = count(f.step, '--step');
  if (f.zone !== undefined) calendar.zone = f.zone;
  if (f.weekStart !== undefined) calendar.weekStart = parseWeekStart(f.weekStart);
  if (f.fiscalStart !== undefined) calendar.fiscalStart = parseFiscalStart(f.fiscalStart);
  if (f.fiscalLabel !== undefined) calendar.fiscalLabel = f.fiscalLabel;
  const zone = f.zone ?? 'UTC';
  const limits: RebinOptions['limits'] = {};
  if (f.maxBuffered !== undefined) limits.maxBuffered = count(f.maxBuffered, '--max-buffered');
  if (f.maxDistinct !== undefined) limits.maxDistinct = count(f.maxDistinct, '--max-distinct');
  return {
    time: f.time, calendar, aggregates: parseAggSpecs(f.agg ?? []), by: f.by ?? [], fill: f.fill,
    from: f.from === undefined ? null : boundInstant(f.from, zone),
    until: f.until === undefined ? null : boundInstant(f.until, zone),
    ...(f.maxPeriods !== undefined ? { maxPeriods: count(f.maxPeriods, '--max-periods') } : {}),
    assign: f.assign === undefined ? null : parseAssignPolicy(f.assign),
    sourceUnit: f.sourceUnit === undefined ? null : parseUnitName(f.sourceUnit),
    sourceAnchor: f.sourceAnchor ?? 'start',
    timeFormat: f.timeFormat ?? null, dayOrder: dayOrderOf(f),
    ...(f.quantileType !== undefined ? { quantileType: parseQuantileType(f.quantileType) } : {}),
    limits,
  };
}

function count(text: string, option: string): number {
  const n = Number(text.replaceAll('_', '').replaceAll(',', ''));
  if (!Number.isSafeInteger(n) || n < 1) throw new QuernError('E_USAGE', `${option} ${JSON.stringify(text)} is not a whole number of 1 or more`);
  return n;
}

async function writeResult(result: RebinResult, f: RebinFlags, ctx: CommandContext): Promise<void> {
  const out = await openOutput(f.out, { stdout: ctx.io.stdout, cwd: ctx.io.cwd });
  try {
    if (f.format === 'json') await out.write(rebinJson(result));
    else if (f.format === 'ndjson') await out.write(rebinNdjson(result));
    else {
      const csv = { neutraliseFormulas: f.neutralise };
      let chunk = csvRow(result.columns, csv);
      for (const row of result.rows) {
        chunk += csvRow(rebinRowCells(row), csv);
        if (chunk.length > 1 << 16) {
          await out.write(chunk);
          chunk = '';
        }
      }
      await out.write(chunk);
    }
    await out.commit();
  } catch (e) {
    await out.abort();
    throw e;
  }
}

// The input's size for the progress bar; 0 (unknown) for standard input or an unreadable path.
function sizeOf(file: string, ctx: CommandContext): number {
  if (file === '-') return 0;
  try {
    return statSync(resolvePath(ctx.io.cwd, file)).size;
  } catch {
    return 0;
  }
}

function dayOrderOf(f: { dayFirst?: boolean; monthFirst?: boolean }): 'day-first' | 'month-first' | null {
  if (f.dayFirst && f.monthFirst) throw new QuernError('E_USAGE', 'dates cannot be both day first and month first', 'give --day-first or --month-first, not both');
  return f.dayFirst ? 'day-first' : f.monthFirst ? 'month-first' : null;
}
