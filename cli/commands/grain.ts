// `quern grain`: a date column's true resolution, format, zone and cadence.
// Options → GrainOptions → detectGrain() → GrainReport → text or JSON.
import type { Command } from 'commander';
import { QuernError, detectGrain, grainCycles, renderGrainReport, renderGrainText } from '../../src/index.js';
import { REPORT_HELP, writeReport } from '../report-output.js';
import type { GrainOptions } from '../../src/index.js';
import type { CommandContext } from '../program.js';
import { useColor } from '../io.js';

const EXAMPLES = `
Examples (demo files of the invented Harrowmere District Health Service):
  quern grain fixtures/visits.csv                        offsets −06:00/−05:00 → America/Chicago; instants to the second
  quern grain fixtures/fridge-temps.csv --json           15-minute readings in UTC, regular cadence
  quern grain fixtures/weekly-cases.csv                  epidemiological weeks; week_ending holds weeks ending Saturday
  quern grain fixtures/visits.csv --column visit_time --zone America/Chicago
  quern grain fixtures/reporting-periods.csv --column period_end
  quern grain fixtures/messy-visits.csv                  invalid values counted, with lines and reasons
  quern grain FILE --day-first                           settle numeric dates such as 03/04/2024 as 3 April

How a grain is decided:
  A grain holds when at least 99% of the parsed values lie on its boundaries; the others are reported as
  exceptions (count and first examples with lines). A grain coarser than the notation states is claimed only
  from at least 5 distinct values, and only when values of the finer grain would land on it by chance less
  than once in a thousand. The coarsest grain that holds wins. Instants are never finer than written: values
  written to the second (08:15:00) are at least seconds, to the minute (08:15) at least minutes. A zone other than the written offset is read
  from the values (UTC instants on another zone's local midnights) only with the same evidence. Periods (a
  day or longer) are ordinal; instants (finer than a day) are quantitative. Numeric dates such as 03/04/2024
  are never guessed: the column must show which field is the day, or you pass --day-first or --month-first.

Caution: week starts, epidemiological weeks and fiscal years are read from the values; confirm them against
  your reporting authority's calendar before counts by period are published.
`;

interface GrainFlags {
  column?: string[];
  zone?: string;
  dayFirst?: boolean;
  monthFirst?: boolean;
  json?: boolean;
  delimiter?: string;
  report?: string;
}

function collect(value: string, previous: string[] | undefined): string[] {
  return [...(previous ?? []), value];
}

export function registerGrain(program: Command, ctx: CommandContext): void {
  program
    .command('grain')
    .description("Find each date column's true resolution, format, zone and cadence")
    .argument('<file>', "table to read (CSV, TSV, NDJSON, optionally gzipped; '-' for standard input)")
    .option('--column <name>', 'look at this column only (repeat for several)', collect)
    .option('--zone <zone>', 'read instants in this zone (IANA name, UTC or +05:30) instead of inferring one')
    .option('--day-first', 'numeric dates are day first (03/04/2024 = 3 April)')
    .option('--month-first', 'numeric dates are month first (03/04/2024 = March 4)')
    .option('--json', 'print the result as JSON')
    .option('--delimiter <char>', 'input field delimiter (default: sniffed)')
    .option('--report <file.html>', REPORT_HELP)
    .addHelpText('after', EXAMPLES)
    .action(async (file: string, flags: GrainFlags) => {
      const options: GrainOptions = {
        table: { cwd: ctx.io.cwd, stdin: ctx.io.stdin, ...(flags.delimiter ? { delimiter: flags.delimiter } : {}) },
      };
      const named = flags.column ?? [];
      if (named.length) options.columns = named;
      if (flags.zone !== undefined) options.zone = flags.zone;
      if (flags.dayFirst) options.dayFirst = true;
      if (flags.monthFirst) options.monthFirst = true;
      const report = await detectGrain(file, options);
      if (named.length && report.columns.length === 0) {
        const why = report.skipped.map((s) => `${s.name}: ${s.reason}`).join('; ');
        throw new QuernError('E_FORMAT', `no named column is date-like (${why})`, 'name a column of dates, date-times or periods, or leave out --column');
      }
      if (flags.json) ctx.io.stdout.write(`${JSON.stringify(report, null, 2)}\n`);
      else ctx.io.stdout.write(renderGrainText(report, { width: ctx.io.stdout.columns ?? 100, color: useColor(ctx.io) }));
      await writeReport(flags.report, async () => renderGrainReport(report, { cycles: await grainCycles(file, report, { cwd: ctx.io.cwd, ...(flags.delimiter ? { delimiter: flags.delimiter } : {}) }) }), ctx.io);
    });
}
