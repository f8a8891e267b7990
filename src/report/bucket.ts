// Human and JSON renderings of a bucket run: each range with its count and share as bars, then where
// every other row went, so the reader sees the counts add up to the rows read.
import type { BucketRunResult, BucketScheme, Outcome } from '../bins/index.js';
import { formatDiagnostic } from '../errors.js';
import { barChart, formatNumber, terminalSafe } from './terminal.js';

export interface BucketTextOptions { color?: boolean; width?: number }

const pct = (x: number) => `${(x * 100).toFixed(1)}%`;

function examples(o: Outcome): string {
  if (o.examples.length === 0) return '';
  return ` e.g. ${o.examples.slice(0, 3).map((e) => `line ${e.line} ${JSON.stringify(terminalSafe(e.value))}`).join(', ')}`;
}

function reasons(by: Record<string, number>): string {
  const parts = Object.entries(by).map(([k, v]) => `${k} ${formatNumber(v)}`);
  return parts.length === 0 ? '' : ` (${parts.join(', ')})`;
}

/** The summary of a bucket run as text: bars per range, then the row accounting and notes. */
export function bucketSummaryText(result: BucketRunResult, options: BucketTextOptions = {}): string {
  const s = result.summary;
  const kind = s.discrete ? 'whole numbers, labels inclusive' : `interval labels, closed ${s.closed}`;
  const lines = [`${terminalSafe(s.value)} in ${terminalSafe(s.file)}: ${s.source} — ${s.buckets.length} ranges (${kind})`, ''];
  lines.push(barChart(s.buckets.map((b) => ({ label: b.name ? `${b.label} ${b.name}` : b.label, value: b.count, note: pct(b.share) })), { width: options.width ?? 72, color: options.color, maxLabel: 28 }));
  lines.push('');
  const rejected = s.rowsRejected;
  lines.push(`rows read ${formatNumber(s.rowsRead)} = ${formatNumber(s.bucketed)} bucketed + ${formatNumber(s.below.count)} below + ${formatNumber(s.above.count)} above`
    + (s.between.count > 0 ? ` + ${formatNumber(s.between.count)} between ranges` : '')
    + ` + ${formatNumber(s.empty.count)} empty + ${formatNumber(s.invalid.count)} invalid + ${formatNumber(rejected)} rejected rows`);
  if (s.below.count > 0) lines.push(`  below the first range: ${formatNumber(s.below.count)}${examples(s.below)}`);
  if (s.above.count > 0) lines.push(`  above the last range: ${formatNumber(s.above.count)}${examples(s.above)}`);
  if (s.between.count > 0) lines.push(`  between ranges: ${formatNumber(s.between.count)}${examples(s.between)}`);
  if (s.empty.count > 0) lines.push(`  empty: ${formatNumber(s.empty.count)}${reasons(s.empty.byReason)}${examples(s.empty)}`);
  if (s.invalid.count > 0) lines.push(`  invalid: ${formatNumber(s.invalid.count)}${reasons(s.invalid.byReason)}${examples(s.invalid)}`);
  if (rejected > 0) lines.push(`  rejected rows: ${formatNumber(rejected)}${reasons(s.rejectedByReason)}`);
  for (const d of s.rejectedExamples) lines.push(`    ${terminalSafe(formatDiagnostic(d))}`);
  if (s.nonInteger.count > 0) lines.push(`  note: ${formatNumber(s.nonInteger.count)} values have a fraction; whole-number ranges count completed units (4.5 is in 0-4)${examples(s.nonInteger)}`);
  for (const m of s.merged) lines.push(`  note: edge ${m.value} appeared ${m.times} times (ties) and was merged`);
  for (const n of s.notes) lines.push(`  note: ${n}`);
  const nf = result.numberFormat;
  if (nf.inferred?.decision === 'ambiguous') lines.push('  note: values like 1,234 are ambiguous in this column (thousands or decimals?); give --decimal . or --decimal ,');
  if (nf.inferred?.decision === 'conflict') lines.push(`  note: the column writes decimals both ways; read with decimal mark "${nf.format.decimal}"`);
  if (result.passes === 2) lines.push('  read twice: once to compute the edges, once to assign the rows');
  return `${lines.join('\n')}\n`;
}

/** The summary of a bucket run as JSON (what `--json` prints). */
export function bucketSummaryJson(result: BucketRunResult): string {
  const { summary, numberFormat, passes } = result;
  return `${JSON.stringify({ ...summary, numberFormat: { decimal: numberFormat.format.decimal, group: numberFormat.format.group, decision: numberFormat.inferred?.decision ?? 'given' }, passes }, null, 2)}\n`;
}

/** The named schemes with their groups and sources, for `quern bucket --list-schemes`. */
export function schemesText(schemes: readonly BucketScheme[]): string {
  const out: string[] = [];
  for (const s of schemes) {
    out.push(`${s.name}  ${s.title}`);
    out.push(`  source: ${s.source}`);
    const labels = s.buckets.map((b) => (b.name ? `${b.label} (${b.name})` : b.label)).join(', ');
    out.push(`  ranges (${s.buckets.length}): ${labels}`);
    if (s.weights !== undefined) out.push(`  weights: ${s.weights}: ${s.buckets.map((b) => formatNumber(b.weight!)).join(', ')}`);
    out.push('');
  }
  return out.join('\n');
}
