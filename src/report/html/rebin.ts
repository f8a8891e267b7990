// HTML report of `quern rebin`: for each aggregate, bars in period order with filled periods hatched; with
// groups, one small chart per group on a shared scale; the numbers in a period × group table beside them.
import type { RebinResult, RebinRow } from '../../rebin/types.js';
import { formatNumber } from '../terminal.js';
import { accountingFigure, diagnosticsTable, notesList, reasons } from './common.js';
import { columnChart, type ColumnDatum } from './columns.js';
import { html, makeId, type SafeHtml } from './escape.js';
import { smallMultiples } from './multiples.js';
import { renderPage, section } from './page.js';
import { legend } from './svg.js';
import { dataTable, figure, type TableCell } from './table.js';

export interface ReportOptions {
  /** quern version for the footer. */
  version?: string;
  /** Most groups drawn as small charts (all are in the table); default 24. */
  maxGroups?: number;
}

const FILLED_NOTE = html` <span class="q-note">(filled)</span>`;

interface GroupSeries {
  key: string;
  name: string;
  rows: RebinRow[];
}

function groupSeries(result: RebinResult): GroupSeries[] {
  const byKey = new Map<string, GroupSeries>();
  for (const row of result.rows) {
    const key = JSON.stringify(row.group);
    let g = byKey.get(key);
    if (!g) {
      g = { key, name: row.group.length ? row.group.join(' · ') : 'all rows', rows: [] };
      byKey.set(key, g);
    }
    g.rows.push(row);
  }
  return [...byKey.values()];
}

function datum(row: RebinRow, k: number): ColumnDatum {
  return { label: row.period, value: row.values[k], filled: row.filled };
}

function valueCell(row: RebinRow | undefined, k: number): TableCell {
  if (!row) return null;
  const v = row.values[k];
  const text = v === null ? '—' : formatNumber(v);
  return row.filled ? html`${text}${FILLED_NOTE}` : text;
}

/** The section of one aggregate: one chart (no groups) or small multiples, and the table of numbers. */
function aggregateSection(result: RebinResult, groups: GroupSeries[], k: number, o: ReportOptions): SafeHtml {
  const agg = result.aggregates[k];
  const id = makeId('rebin', agg);
  const unit = result.step === 1 ? result.unit : `${result.step} × ${result.unit}`;
  const periods = [...new Set(result.rows.map((r) => r.period))];
  if (result.groupColumns.length === 0) {
    const rows = groups[0]?.rows ?? [];
    const chart = columnChart({ id, title: `${agg} per ${unit}`, valueLabel: agg, data: rows.map((r) => datum(r, k)), width: 720 });
    const table = dataTable({
      caption: `${agg} per ${unit}`,
      columns: [{ label: 'period' }, { label: agg, numeric: true }],
      rows: rows.map((r) => [r.period, valueCell(r, k)]),
      flagged: (i) => rows[i].filled,
    });
    const filled = rows.filter((r) => r.filled).length;
    return section(agg, figure(html`<b>${agg}</b> in ${formatNumber(rows.length)} periods, in period order; ${formatNumber(filled)} filled period${filled === 1 ? '' : 's'} (no rows) hatched.`, chart, table));
  }
  const max = o.maxGroups ?? 24;
  const shown = [...groups]
    .sort((a, b) => total(b, k) - total(a, k) || (a.name < b.name ? -1 : 1))
    .slice(0, max)
    .sort((a, b) => groups.indexOf(a) - groups.indexOf(b));
  const multiples = smallMultiples({ id, valueLabel: agg, groups: shown.map((g) => ({ name: g.name, data: g.rows.map((r) => datum(r, k)) })) });
  const index = groups.map((g) => new Map(g.rows.map((r) => [r.period, r])));
  const table = dataTable({
    caption: `${agg} per ${unit} and ${result.groupColumns.join(', ')}`,
    columns: [{ label: 'period' }, ...groups.map((g) => ({ label: g.name, numeric: true }))],
    rows: periods.map((p) => [p, ...index.map((m) => valueCell(m.get(p), k))]),
  });
  const more = groups.length > shown.length ? ` The ${shown.length} largest of ${groups.length} groups are drawn; all are in the table.` : '';
  return section(
    agg,
    html`<p>One chart per ${result.groupColumns.join(', ')}, every chart on the same scale so heights compare across groups; hatched slots are periods with no rows (filled).${more}</p>`,
    multiples,
    table,
  );
}

function total(g: GroupSeries, k: number): number {
  return g.rows.reduce((a, r) => a + (r.values[k] ?? 0), 0);
}

/** Renders a rebin result as a complete HTML page. */
export function renderRebinReport(result: RebinResult, options: ReportOptions = {}): string {
  const s = result.summary;
  const groups = groupSeries(result);
  const unit = result.step === 1 ? result.unit : `${result.step} × ${result.unit}`;
  const key = legend('rebin-legend', [
    ['value', 'rows in the period, or the aggregate'],
    ['filled', 'filled period: no rows (0 for counts and sums, no value otherwise)'],
  ]);
  const body = html`${key}${result.aggregates.map((_, k) => aggregateSection(result, groups, k, options))}
${section(
  'Rows',
  accountingFigure('rebin-rows', s.rowsRead, [
    { label: 'used', rows: s.rowsUsed },
    { label: 'empty time', rows: s.rowsEmpty },
    { label: 'rejected', rows: s.rowsRejected },
    { label: 'outside --from/--until', rows: s.rowsOutside },
  ]),
  html`<p>Rejected by reason: ${reasons(s.rejectedByReason)}. Local times a daylight-saving change skips: ${formatNumber(s.localTime.nonexistent)}; repeats: ${formatNumber(s.localTime.repeated)} (rule: ${s.localTime.rule}).</p>`,
  diagnosticsTable(s.examples),
  notesList(s.notes),
)}`;
  return renderPage({
    command: 'rebin',
    title: `${s.file}: ${result.aggregates.join(', ')} per ${unit}`,
    lede: html`Rows of ${s.file} counted into calendar periods of one ${unit} in ${result.zone}, in period order; periods with no rows that were filled are hatched.`,
    facts: [
      ['Rows read', formatNumber(s.rowsRead)],
      ['Periods', formatNumber(s.periods)],
      ['Filled rows', formatNumber(s.filledRows)],
      ['Groups', result.groupColumns.length ? `${formatNumber(s.groups)} (${result.groupColumns.join(', ')})` : 'none'],
      ['Zone', result.zone],
      ['Time values', s.timeFormat.label],
    ],
    body,
    version: options.version,
  });
}
