// `quern profile`: the measurement level and role of every column, and the table's shape.
// Options → ProfileOptions → profileTable() → ProfileReport → text or JSON.
import type { Command } from 'commander';
import { QuernError, profileEvidence, profileTable, renderProfileReport, renderProfileText } from '../../src/index.js';
import { REPORT_HELP, writeReport } from '../report-output.js';
import type { CommandContext } from '../program.js';
import { PROFILE_THREADS_HELP, parseProfileThreads } from '../threads.js';
import { useColor } from '../io.js';

const EXAMPLES = `
Examples (demo files of the invented Harrowmere District Health Service):
  quern profile fixtures/visits.csv             items: visit_id identifies rows, area_code is a code, triage is ordinal
  quern profile fixtures/weekly-cases.csv       aggregated: epi_week × clinic is unique, cases are counts
  quern profile fixtures/age-bands.csv --json   range labels 0-4 … 85+ in their order

What it tells:
  Levels of measurement in the usual three-way form of Stevens (1946): categorical, ordinal, quantitative.
  Roles: time (with its grain, as quern grain finds it), identifier, code (zero-padded or named codes),
  ordered-vocabulary (low/medium/high, agreement scales, month and weekday names), range-label (0-4, 85+,
  [10,20)), latitude, longitude, country-code (ISO 3166-1), count (non-negative integers), measure, boolean,
  category, text. Distinct counts are exact up to 10,000 values a column, then estimated (shown with ≈).
  The table is "aggregated" when a combination of categorical or period columns is unique on every row with
  a count- or total-like column beside it (checked exactly on the first 200,000 rows).
`;

interface ProfileFlags {
  json?: boolean;
  threads?: string;
  report?: string;
  delimiter?: string;
}

export function registerProfile(program: Command, ctx: CommandContext): void {
  program
    .command('profile')
    .description('Give every column its measurement level and role, and say whether the table lists items or is aggregated')
    .argument('<file>', "table to read (CSV, TSV, NDJSON, optionally gzipped; '-' for standard input)")
    .option('--json', 'print the result as JSON')
    .option('--delimiter <char>', 'input field delimiter (default: sniffed)')
    .option('--threads <n>', PROFILE_THREADS_HELP)
    .option('--report <file.html>', REPORT_HELP)
    .addHelpText('after', EXAMPLES)
    .action(async (file: string, flags: ProfileFlags) => {
      const report = await profileTable(file, {
        table: { cwd: ctx.io.cwd, stdin: ctx.io.stdin, ...(flags.delimiter ? { delimiter: flags.delimiter } : {}) },
        threads: parseProfileThreads(flags.threads),
      });
      if (flags.json) ctx.io.stdout.write(`${JSON.stringify(report, null, 2)}\n`);
      else ctx.io.stdout.write(renderProfileText(report, { width: ctx.io.stdout.columns ?? 100, color: useColor(ctx.io) }));
      await writeReport(flags.report, async () => renderProfileReport(report, { evidence: await profileEvidence(file, report, { cwd: ctx.io.cwd, ...(flags.delimiter ? { delimiter: flags.delimiter } : {}) }) }), ctx.io);
    });
}
