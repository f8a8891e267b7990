// Renderings of a rebin result: table cells for CSV, JSON and NDJSON records, and the human summary that
// goes to standard error. No domain rules here: the result already holds every number.
import { formatDiagnostic } from '../errors.js';
import type { RebinResult, RebinRow, RebinSummary } from '../rebin/types.js';
import { formatNumber, terminalSafe } from './terminal.js';

/** An aggregate as CSV text: '' for empty, shortest round-trip digits otherwise. */
export function numberCell(v: number | null): string {
  return v === null || Number.isNaN(v) ? '' : String(v);
}

/** Cells of one output row in `result.columns` order. */
export function rebinRowCells(row: RebinRow): string[] {
  return [row.period, row.start, row.end, ...row.group, ...row.values.map(numberCell)];
}

/** One output row as a plain record keyed by column name (aggregates as numbers, empty as null). */
export function rebinRowRecord(result: RebinResult, row: RebinRow): Record<string, string | number | null> {
  const rec: Record<string, string | number | null> = { period: row.period, start: row.start, end: row.end };
  result.groupColumns.forEach((g, i) => { rec[g] = row.group[i]!; });
  result.aggregates.forEach((a, i) => { rec[a] = row.values[i] ?? null; });
  return rec;
}

/** The whole result as one JSON document: calendar, columns, rows as records, summary. */
export function rebinJson(result: RebinResult): string {
  const { rows, summary, ...head } = result;
  return `${JSON.stringify({ ...head, rows: rows.map((r) => rebinRowRecord(result, r)), summary }, null, 2)}\n`;
}

/** The rows as NDJSON, one record a line (the summary goes to standard error). */
export function rebinNdjson(result: RebinResult): string {
  let out = '';
  for (const r of result.rows) out += `${JSON.stringify(rebinRowRecord(result, r))}\n`;
  return out;
}

function article(word: string): string {
  return /^[aeiouh]/.test(word) && !word.startsWith('half') ? 'an' : 'a';
}

function reasons(by: Record<string, number>): string {
  const parts = Object.entries(by).sort((a, b) => b[1] - a[1]).map(([k, v]) => `${k} ${formatNumber(v)}`);
  return parts.length === 0 ? '' : ` (${parts.join(', ')})`;
}

/** `n` and the word, singular for one ("1 row", "2 rows"). */
const counted = (n: number, one: string, many = `${one}s`): string => `${formatNumber(n)} ${n === 1 ? one : many}`;

/** The human summary: row accounting that adds up, periods, groups, values, local times, notes. */
export function rebinSummaryText(result: RebinResult): string {
  const s: RebinSummary = result.summary;
  const unit = result.step === 1 ? result.unit : `${result.step}-${result.unit}`;
  const lines: string[] = [];
  lines.push(`${counted(s.rowsRead, 'row')} read from ${terminalSafe(s.file)}: ${formatNumber(s.rowsUsed)} used, ` +
    `${formatNumber(s.rowsEmpty)} with an empty time, ${formatNumber(s.rowsRejected)} rejected${reasons(s.rejectedByReason)}` +
    (s.rowsOutside > 0 ? `, ${formatNumber(s.rowsOutside)} outside --from/--until` : ''));
  const sp = s.sourcePeriods;
  const source = sp === null ? '' : sp.straddling === 0
    ? `; ${formatNumber(sp.rows)} ${sp.unit ?? 'source'} values, all nested in ${unit} periods`
    : `; ${formatNumber(sp.rows)} ${sp.unit ?? 'source'} values, ${formatNumber(sp.straddling)} straddling ${article(unit)} ${unit} boundary` +
      (sp.policy ? ` (--assign ${sp.policy})` : '');
  lines.push(`time values: ${s.timeFormat.label}${source}`);
  const groups = result.groupColumns.length > 0 ? ` × ${counted(s.groups, 'group')} of ${result.groupColumns.join(', ')}` : '';
  lines.push(`${counted(s.periods, `${unit} period`)} in ${result.zone}${groups} → ${counted(result.rows.length, 'row')}` +
    (s.filledRows > 0 ? ` (${formatNumber(s.filledRows)} filled: count 0, other aggregates empty)` : ''));
  for (const m of s.measures) {
    lines.push(`${terminalSafe(m.column)}: ${counted(m.valid, 'value')}, ${formatNumber(m.empty)} empty, ${formatNumber(m.rejected)} rejected${reasons(m.rejectedByReason)}`);
  }
  if (s.localTime.nonexistent + s.localTime.repeated > 0) {
    lines.push(`local times: ${formatNumber(s.localTime.nonexistent)} skipped by a clock change, ${formatNumber(s.localTime.repeated)} repeated (${s.localTime.rule})`);
  }
  for (const d of s.examples) lines.push(`  ${terminalSafe(formatDiagnostic(d))}`);
  for (const n of s.notes) lines.push(`note: ${n}`);
  return `${lines.join('\n')}\n`;
}
