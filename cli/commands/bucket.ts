// `quern bucket`: quantities such as ages into ordered, labelled ranges.
// Options → BucketRunOptions → bucketTable() → BucketRunResult → rows (CSV) and a summary (text or JSON).
import { createWriteStream } from 'node:fs';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { Command, Option } from 'commander';
import {
  BIN_RULES, BUCKET_SCHEMES, QuernError, bucketFile, bucketSpecOf, bucketSummaryJson, bucketSummaryText, bucketTableCsv,
  openOutput, openTable, renderBucketReport, schemesText,
} from '../../src/index.js';
import { REPORT_HELP, writeReport } from '../report-output.js';
import type { BinRule, BucketPlan, BucketSpec, BucketRunOptions, BucketRunResult, CsvRowsOutput, NumberFormat, OutputTarget, QuantileType, TableOptions } from '../../src/index.js';
import type { CommandContext } from '../program.js';
import { parseThreads, THREADS_HELP } from '../threads.js';
import { useColor } from '../io.js';

const EXAMPLES = `
Examples (demo files of the invented Harrowmere District Health Service):
  quern bucket fixtures/visits.csv --value patient_age --scheme five-year-85 --summary
  quern bucket fixtures/visits.csv --value patient_age --edges 0,5,15,45,65 --open-high --out visits-banded.csv
  quern bucket fixtures/visits.csv --value wait_minutes --method quantile --bins 4 --summary --json
  quern bucket fixtures/visits.csv --value wait_minutes --method ckmeans --bins 5 --spec-out wait-bands.json --summary
  quern bucket fixtures/visits.csv --value wait_minutes --spec wait-bands.json --out next-month-banded.csv
  quern bucket fixtures/visits.csv --value wait_minutes --rule freedman-diaconis --closed right --summary
  quern bucket --list-schemes

Rules:
  Each range holds one end: --closed left (default) is [a, b), right is (a, b]; a value on an edge lands in
  exactly one range. Whole-number data gets inclusive integer labels (0-4, 5-9, 85+; stored as [0,5)); other
  data interval labels ([0,2.5)). Values with a fraction in whole-number ranges count as completed units.
  Data-driven edges include the data's minimum and maximum. Equal edges (quantiles on heavy ties) are
  merged and reported, never left as empty ranges. Quantiles are Hyndman-Fan type 7 unless --quantile-type.
  Every row is written with two more columns, the range label and its order index (sort by the index, not
  the label); rows in no range get empty cells. The summary goes to standard error when rows go to
  standard output, else to standard output. Rows read = bucketed + below + above + empty + invalid + rejected.
  Numbers: thousands separators and decimal commas are read when the column shows which is which; a lone
  1,234 is never guessed (give --decimal). NaN, Infinity and unreadable values are counted as invalid.
  Methods that need every value read the input twice (standard input is first copied to a temporary file).
  Ckmeans natural breaks are exact (Wang & Song 2011), never from a sample: they are computed on the distinct
  values weighted by their counts (equal values always share a range), up to 2,000,000 distinct values and
  20,000,000 bins x distinct values; beyond that quern stops and says so (use quantiles or round the values).
  Cells a spreadsheet would run as formulas are neutralised (OWASP); --no-neutralise turns this off for
  trusted pipelines.
`;

interface BucketFlags {
  value?: string; edges?: string; openLow?: boolean; openHigh?: boolean; scheme?: string; listSchemes?: boolean;
  method?: 'equal-width' | 'quantile' | 'ckmeans'; bins?: string; rule?: BinRule; quantileType?: string; round: boolean;
  spec?: string; specOut?: string; closed: 'left' | 'right'; labels: 'auto' | 'integer' | 'interval';
  decimal?: '.' | ','; group?: string; labelColumn?: string; indexColumn?: string;
  out: string; summary?: boolean; json?: boolean; quiet?: boolean; delimiter?: string; neutralise: boolean;
  report?: string; threads?: string;
}

export function registerBucket(program: Command, ctx: CommandContext): void {
  program
    .command('bucket')
    .description('Put quantities such as ages into ordered, labelled ranges (edges, named schemes, quantiles, natural breaks)')
    .argument('[file]', "table to read (CSV, TSV, NDJSON, optionally gzipped; '-' for standard input)")
    .option('--value <column>', 'the numeric column to bucket')
    .option('--edges <list>', 'edges by hand, e.g. 0,5,10,15,65')
    .option('--open-low', 'with --edges: add a first range below the lowest edge')
    .option('--open-high', 'with --edges: add a last range above the highest edge (65+)')
    .option('--scheme <name>', 'a named scheme (see --list-schemes)')
    .option('--list-schemes', 'print the named schemes with their published sources')
    .addOption(new Option('--method <name>', 'edges from the data').choices(['equal-width', 'quantile', 'ckmeans']))
    .option('--bins <n>', 'number of ranges for --method')
    .addOption(new Option('--rule <name>', 'number of equal-width ranges from a rule').choices([...BIN_RULES]))
    .option('--quantile-type <1-9>', 'Hyndman-Fan quantile type for --method quantile (default 7)')
    .option('--no-round', 'equal-width edges exactly from min to max instead of round numbers')
    .option('--spec <file>', 'apply ranges from a spec file written by --spec-out')
    .option('--spec-out <file>', 'write the ranges as a spec file')
    .addOption(new Option('--closed <side>', 'which end of each range holds its edge').choices(['left', 'right']).default('left'))
    .addOption(new Option('--labels <kind>', 'integer labels (0-4), interval labels ([0,5)) or auto').choices(['auto', 'integer', 'interval']).default('auto'))
    .addOption(new Option('--decimal <mark>', 'decimal mark of the value column (default: from evidence in the column)').choices(['.', ',']))
    .option('--group <mark>', "thousands separator with --decimal: ',', '.', space, apostrophe or none")
    .option('--label-column <name>', 'name of the label column written (default VALUE_range)')
    .option('--index-column <name>', 'name of the order-index column written (default VALUE_range_index)')
    .option('--out <file>', 'write rows to a file (atomically) instead of standard output', '-')
    .option('--summary', 'print only the summary, no rows')
    .option('--json', 'summary as JSON')
    .option('-q, --quiet', 'no summary')
    .option('--delimiter <char>', 'input field delimiter (default: sniffed)')
    .option('--no-neutralise', 'do not neutralise formula-like cells in CSV output (trusted pipelines only)')
    .option('--threads <n>', `with --summary and fixed ranges: ${THREADS_HELP}`)
    .option('--report <file.html>', REPORT_HELP)
    .addHelpText('after', EXAMPLES)
    .action(async (file: string | undefined, flags: BucketFlags) => {
      if (flags.listSchemes) { ctx.io.stdout.write(schemesText(BUCKET_SCHEMES)); return; }
      if (file === undefined) throw new QuernError('E_USAGE', 'quern bucket needs a FILE', 'quern bucket FILE --value COLUMN --scheme five-year-85');
      if (flags.value === undefined) throw new QuernError('E_USAGE', 'quern bucket needs --value COLUMN');
      const options = runOptions(flags, await planOf(flags, ctx));
      await withInput(file, ctx, async (path) => {
        const table = { cwd: ctx.io.cwd, ...(flags.delimiter ? { delimiter: flags.delimiter } : {}) };
        await runBucket(file, { path, table }, options, flags, ctx);
      });
    });
}

async function planOf(f: BucketFlags, ctx: CommandContext): Promise<BucketPlan> {
  const given = [f.edges, f.scheme, f.method, f.rule, f.spec].filter((x) => x !== undefined).length;
  if (given !== 1) throw new QuernError('E_USAGE', 'give exactly one of --edges, --scheme, --method, --rule or --spec', 'quern bucket --help shows examples');
  if (f.edges !== undefined) return { kind: 'edges', edges: parseEdges(f.edges), openLow: f.openLow === true, openHigh: f.openHigh === true };
  if (f.scheme !== undefined) return { kind: 'scheme', name: f.scheme };
  if (f.rule !== undefined) return { kind: 'rule', rule: f.rule, round: f.round };
  if (f.spec !== undefined) return { kind: 'spec', spec: (await readSpec(f.spec, ctx)) as BucketSpec };
  const bins = wholeNumber(f.bins, '--bins');
  if (f.method === 'quantile') return { kind: 'quantile', bins, type: quantileType(f.quantileType) };
  if (f.method === 'ckmeans') return { kind: 'ckmeans', bins };
  return { kind: 'equal-width', bins, round: f.round };
}

function parseEdges(text: string): number[] {
  const parts = text.split(text.includes(';') ? ';' : ',').map((s) => s.trim());
  return parts.map((p) => {
    const x = p === '' ? NaN : Number(p);
    if (!Number.isFinite(x)) throw new QuernError('E_USAGE', `--edges: ${JSON.stringify(p)} is not a number`, 'write edges as 0,5,10,15,65 (or 0;2,5;5 with decimal commas)');
    return x;
  });
}

function wholeNumber(text: string | undefined, option: string): number {
  if (text === undefined) throw new QuernError('E_USAGE', `--method needs ${option} N`);
  const n = Number(text);
  if (!Number.isSafeInteger(n) || n < 1 || n > 10_000) throw new QuernError('E_USAGE', `${option} ${JSON.stringify(text)} is not a whole number from 1 to 10000`);
  return n;
}

function quantileType(text: string | undefined): QuantileType {
  if (text === undefined) return 7;
  const t = Number(text);
  if (!Number.isInteger(t) || t < 1 || t > 9) throw new QuernError('E_USAGE', `--quantile-type ${JSON.stringify(text)} is not 1 to 9`, 'Hyndman & Fan (1996) define types 1 to 9; 7 is the usual default');
  return t as QuantileType;
}

async function readSpec(path: string, ctx: CommandContext): Promise<unknown> {
  let text: string;
  try { text = await readFile(resolve(ctx.io.cwd, path), 'utf8'); } catch (e) {
    throw new QuernError('E_FILE', `cannot read the spec file ${path}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`);
  }
  try { return JSON.parse(text); } catch { throw new QuernError('E_VALUE', `the spec file ${path} is not JSON`, 'write one with quern bucket --spec-out FILE'); }
}

function runOptions(f: BucketFlags, plan: BucketPlan): BucketRunOptions {
  const o: BucketRunOptions = { value: f.value!, plan, closed: f.closed };
  if (f.labels !== 'auto') o.discrete = f.labels === 'integer';
  if (f.decimal !== undefined) {
    const groups: Record<string, NumberFormat['group']> = { ',': ',', '.': '.', space: ' ', ' ': ' ', "'": "'", apostrophe: "'", none: null };
    const group = f.group === undefined ? (f.decimal === '.' ? ',' : '.') : groups[f.group];
    if (group === undefined || group === f.decimal) throw new QuernError('E_USAGE', `--group ${JSON.stringify(f.group)} is not a thousands separator other than the decimal mark`, "use ',', '.', space, apostrophe or none");
    o.numberFormat = { decimal: f.decimal, group };
  } else if (f.group !== undefined) throw new QuernError('E_USAGE', '--group needs --decimal');
  return o;
}

/** Standard input is copied to a temporary file so a two-pass method can read it twice. */
async function withInput(file: string, ctx: CommandContext, body: (path: string) => Promise<void>): Promise<void> {
  if (file !== '-') return body(file);
  const dir = await mkdtemp(join(tmpdir(), 'quern-bucket-'));
  try {
    const path = join(dir, 'stdin');
    await pipeline(ctx.io.stdin, createWriteStream(path));
    await body(path);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** Rows as CSV bytes to an output target (chunks end on whole rows, so whole UTF-8 characters). */
function targetRows(out: OutputTarget, f: BucketFlags): CsvRowsOutput {
  return { ...rowNames(f), write: (chunk) => out.writeBytes(chunk) };
}

function rowNames(f: BucketFlags): Omit<CsvRowsOutput, 'write'> {
  return { neutraliseFormulas: f.neutralise, ...(f.labelColumn !== undefined ? { labelColumn: f.labelColumn } : {}), ...(f.indexColumn !== undefined ? { indexColumn: f.indexColumn } : {}) };
}

/** The file to read (standard input already copied to a file) and how to open it. */
interface Input { path: string; table: TableOptions }

/** Buckets the rows into the output the flags name; null output with --summary. */
async function bucketRows(input: Input, options: BucketRunOptions, f: BucketFlags, ctx: CommandContext): Promise<BucketRunResult> {
  const open = () => openTable(input.path, input.table);
  if (f.summary) return bucketFile(input.path, options, input.table, { threads: parseThreads(f.threads) });
  // openOutput writes a device or FIFO (--out /dev/null) in place and a file atomically.
  const out = await openOutput(f.out, { stdout: ctx.io.stdout, cwd: ctx.io.cwd });
  try {
    const result = await bucketTableCsv(open, options, targetRows(out, f));
    await out.commit();
    return result;
  } catch (e) {
    await out.abort();
    throw e;
  }
}

async function runBucket(file: string, input: Input, options: BucketRunOptions, f: BucketFlags, ctx: CommandContext): Promise<void> {
  const result = await bucketRows(input, options, f, ctx);
  result.summary.file = file;
  // Standard input was read from a temporary copy: its rows are named after '-', not the copy.
  result.summary.rejectedExamples = result.summary.rejectedExamples.map((d) => ({ ...d, file }));
  if (f.specOut !== undefined) {
    try { await writeFile(resolve(ctx.io.cwd, f.specOut), `${JSON.stringify(bucketSpecOf(result.set, options.value), null, 2)}\n`); } catch (e) {
      throw new QuernError('E_OUTPUT', `cannot write the spec file ${f.specOut}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`);
    }
  }
  await writeReport(f.report, () => renderBucketReport(result), ctx.io);
  if (f.quiet) return;
  const stream = !f.summary && f.out === '-' ? ctx.io.stderr : ctx.io.stdout;
  stream.write(f.json ? bucketSummaryJson(result) : bucketSummaryText(result, { color: useColor(ctx.io, stream), width: Math.min(stream.columns ?? 80, 100) }));
}
