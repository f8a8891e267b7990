// `quern gaps`: missing and duplicated periods per series, or gaps between instants longer than a duration.
// Options → GapsOptions (unit given, or the detected grain) → findGaps() → GapsResult → strip text or JSON.
import { statSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { Command, Option } from 'commander';
import {
  QuernError, boundInstant, detectGapsUnit, findGaps, fixedDurationMs, gapsJson, gapsText, openTable, parseFiscalStart,
  parseIsoDuration, parseSkipDates, parseUnitName, parseWeekStart, renderGapsReport,
} from '../../src/index.js';
import { REPORT_HELP, writeReport } from '../report-output.js';
import type { CalendarOptions, GapsOptions } from '../../src/index.js';
import { useColor } from '../io.js';
import type { CommandContext } from '../program.js';
import { makeProgress } from '../progress.js';

const collect = (v: string, prev: string[] | undefined): string[] => [...(prev ?? []), v];

const EXAMPLES = `
Examples (demo files of the invented Harrowmere District Health Service):
  quern gaps fixtures/fridge-temps.csv --time reading_time --by fridge_id
  quern gaps fixtures/fridge-temps.csv --time reading_time --by fridge_id --unit minute --step 15 --check
  quern gaps fixtures/fridge-temps.csv --time reading_time --by fridge_id --max-gap PT1H --json
  quern gaps fixtures/weekly-cases.csv --time epi_week --by clinic
  quern gaps fixtures/visits.csv --time visit_time --unit day --zone America/Chicago --by clinic --weekdays \\
      --skip-dates holidays.txt --no-duplicates

Rules:
  Without --unit, the expected periods come from the values' notation (epidemiological-week labels) or
  from the column's detected grain and cadence; the report says which. Each series is checked from its
  own first to its last period, or over --from/--until. --weekdays and --skip-dates (one YYYY-MM-DD a
  line) take days out of what is expected. --max-gap DURATION (ISO 8601, e.g. PT30M) reports gaps
  between instants longer than it, for series without a regular grain. --check exits 1 when a gap or a
  duplicate is found.

Caution: ISO weeks start on Monday, epidemiological (CDC MMWR) weeks on Sunday, and fiscal years are named
differently by different authorities; check the conventions your reporting authority uses.
`;

interface GapsFlags {
  time: string; unit?: string; step?: string; zone?: string; weekStart?: string; fiscalStart?: string; fiscalLabel?: 'end' | 'start';
  by?: string[]; weekdays?: boolean; skipDates?: string; maxGap?: string; from?: string; until?: string;
  duplicates: boolean; check?: boolean; json?: boolean; timeFormat?: string; dayFirst?: boolean; monthFirst?: boolean; delimiter?: string;
  report?: string;
}

export function registerGaps(program: Command, ctx: CommandContext): void {
  program
    .command('gaps')
    .description('Find missing and duplicated periods per series (or gaps longer than a duration)')
    .argument('<file>', "table to read (CSV, TSV, NDJSON, optionally gzipped; '-' for standard input)")
    .requiredOption('--time <column>', 'the time column')
    .option('--unit <unit>', 'expected period unit (default: from the values or their detected grain)')
    .option('--step <n>', 'periods of n units (15 with --unit minute)')
    .option('--zone <zone>', 'IANA zone or offset in which periods are cut (default UTC)')
    .option('--week-start <day>', 'first day of --unit week (monday … sunday)')
    .option('--fiscal-start <month[-day]>', 'first day of the fiscal year (default 10: 1 October)')
    .addOption(new Option('--fiscal-label <end|start>', 'name fiscal years by the year they end (default) or start').choices(['end', 'start']))
    .option('--by <column>', 'series column, repeatable', collect)
    .option('--weekdays', 'only Monday–Friday are expected')
    .option('--skip-dates <file>', 'dates not expected (holidays), one YYYY-MM-DD a line')
    .option('--max-gap <duration>', 'report gaps between instants longer than this ISO 8601 duration (e.g. PT30M)')
    .option('--from <time>', 'first expected period (the one holding this time)')
    .option('--until <time>', 'last expected period (the one holding this time)')
    .option('--no-duplicates', 'do not report periods with several rows (event logs, where that is normal)')
    .option('--check', 'exit 1 when a gap or a duplicate is found')
    .option('--json', 'print the whole result as JSON')
    .option('--day-first', 'numeric dates are day first (05/04/2021 is 5 April)')
    .option('--month-first', 'numeric dates are month first (05/04/2021 is May 4)')
    .option('--time-format <id>', 'how the time values are written, instead of inferring it')
    .option('--delimiter <char>', 'input field delimiter (default: sniffed)')
    .option('--report <file.html>', REPORT_HELP)
    .addHelpText('after', EXAMPLES)
    .action(async (file: string, flags: GapsFlags) => {
      const options = await gapsOptions(file, flags, ctx);
      const progress = makeProgress(ctx.io, sizeOf(file, ctx), { label: file });
      const reader = await openTable(file, {
        cwd: ctx.io.cwd, stdin: ctx.io.stdin, onProgress: (b, t) => progress.onProgress(b, t ?? 0), ...(flags.delimiter ? { delimiter: flags.delimiter } : {}),
      });
      try {
        const result = await findGaps(reader, options);
        ctx.io.stdout.write(flags.json ? gapsJson(result) : gapsText(result, { color: useColor(ctx.io), width: Math.min(80, (ctx.io.stdout.columns ?? 80) - 4) }));
        if (flags.check && result.problems) ctx.setExit(1);
        await writeReport(flags.report, () => renderGapsReport(result), ctx.io);
      } finally {
        progress.stop();
        reader.close();
      }
    });
}

async function gapsOptions(file: string, f: GapsFlags, ctx: CommandContext): Promise<GapsOptions> {
  const zone = f.zone ?? 'UTC';
  const o: GapsOptions = {
    time: f.time, calendar: null, by: f.by ?? [], weekdays: f.weekdays ?? false, duplicates: f.duplicates, ...(f.zone !== undefined ? { zone: f.zone } : {}),
    from: f.from === undefined ? null : boundInstant(f.from, zone),
    until: f.until === undefined ? null : boundInstant(f.until, zone),
    timeFormat: f.timeFormat ?? null, dayOrder: dayOrderOf(f),
  };
  if (f.skipDates !== undefined) o.skipDays = parseSkipDates(await readText(f.skipDates, ctx), f.skipDates);
  if (f.maxGap !== undefined) {
    if (f.unit !== undefined) throw new QuernError('E_USAGE', '--max-gap and --unit ask two different questions', 'give --unit for regular periods, or --max-gap for instants without a regular grain');
    o.maxGapMs = fixedDurationMs(parseIsoDuration(f.maxGap), f.maxGap);
    o.maxGapText = f.maxGap;
    return o;
  }
  if (f.unit !== undefined) {
    const cal: CalendarOptions = { unit: parseUnitName(f.unit), zone };
    if (f.step !== undefined) cal.step = stepOf(f.step);
    if (f.weekStart !== undefined) cal.weekStart = parseWeekStart(f.weekStart);
    if (f.fiscalStart !== undefined) cal.fiscalStart = parseFiscalStart(f.fiscalStart);
    if (f.fiscalLabel !== undefined) cal.fiscalLabel = f.fiscalLabel;
    o.calendar = cal;
    return o;
  }
  // Standard input cannot be read twice: there only the values' own notation (2024-EW07) can tell the unit.
  if (file !== '-') o.detect = () => detectGapsUnit(file, f.time, f.zone, { cwd: ctx.io.cwd, ...(f.delimiter ? { delimiter: f.delimiter } : {}) }, o.dayOrder ?? null);
  return o;
}

function stepOf(text: string): number {
  const n = Number(text);
  if (!Number.isSafeInteger(n) || n < 1) throw new QuernError('E_USAGE', `--step ${JSON.stringify(text)} is not a whole number of 1 or more`);
  return n;
}

async function readText(path: string, ctx: CommandContext): Promise<string> {
  try {
    return await readFile(resolve(ctx.io.cwd, path), 'utf8');
  } catch (e) {
    throw new QuernError('E_FILE', `cannot read ${JSON.stringify(path)}: ${(e as Error).message}`, 'give a file with one date (YYYY-MM-DD) a line');
  }
}

// The input's size for the progress bar; 0 (unknown) for standard input or an unreadable path.
function sizeOf(file: string, ctx: CommandContext): number {
  if (file === '-') return 0;
  try {
    return statSync(resolve(ctx.io.cwd, file)).size;
  } catch {
    return 0;
  }
}

function dayOrderOf(f: { dayFirst?: boolean; monthFirst?: boolean }): 'day-first' | 'month-first' | null {
  if (f.dayFirst && f.monthFirst) throw new QuernError('E_USAGE', 'dates cannot be both day first and month first', 'give --day-first or --month-first, not both');
  return f.dayFirst ? 'day-first' : f.monthFirst ? 'month-first' : null;
}
