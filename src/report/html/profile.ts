// HTML report of `quern profile`: what the table is (items or aggregated, and its key), then one card per
// column with its level, role, reason, distinct and empty counts and a small chart of its values: bars for
// categories and ordered levels (in their order), a histogram for quantities, a period chart for time.
import type { ColumnProfile, ProfileReport } from '../../profile/types.js';
import { formatNumber, type HistogramBin } from '../terminal.js';
import { share } from './common.js';
import { columnChart } from './columns.js';
import type { CycleCounts } from './cycles.js';
import type { ProfileEvidence } from './profile-evidence.js';
import { html, makeId, type SafeHtml } from './escape.js';
import { hbarChart } from './hbars.js';
import { histogramChart } from './histogram.js';
import { rangeLanes } from './lanes.js';
import { renderPage, section } from './page.js';
import { dataTable, figure } from './table.js';

export interface ProfileReportOptions {
  version?: string;
  /** Evidence the profile does not carry (see profileEvidence): calendar cycles, histograms, level counts. */
  evidence?: ProfileEvidence;
}

/** Optional evidence a profile may carry beyond its contract; each chart uses it when present. */
type ProfileColumnPlus = ColumnProfile & {
  /** Quantities: counts in ascending bins. */
  histogram?: HistogramBin[];
  /** Ordered levels: the count of every level, in order. */
  levels?: Array<{ value: string; count: number }>;
  /** Time: rows per period of the column's grain, in order. */
  periods?: Array<{ label: string; count: number }>;
};

const LEVEL_MARK: Record<string, string> = { categorical: '◇', ordinal: '▤', quantitative: '∿' };
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

function badges(c: ColumnProfile): SafeHtml {
  const level = html`<li class="q-badge" data-mark="${LEVEL_MARK[c.level] ?? '•'}">${c.level}</li>`;
  const role = html`<li class="q-badge" data-mark="${c.role === 'time' ? '◷' : '→'}">${c.role}</li>`;
  const spatial = c.spatial ? html`<li class="q-badge" data-mark="⌖">spatial</li>` : '';
  return html`<ul class="q-badges">${level}${role}${spatial}</ul>`;
}

function counts(c: ColumnProfile, rows: number): SafeHtml {
  const approx = c.distinctExact ? '' : 'about ';
  // a code's digits are not a quantity: its numeric range would mislead
  const range = c.min !== undefined && c.max !== undefined && (c.level === 'quantitative' || c.role === 'identifier') ? html`<li><b>range:</b> ${formatNumber(c.min)} to ${formatNumber(c.max)}</li>` : '';
  return html`<ul class="q-facts"><li><b>values:</b> ${formatNumber(c.values)}</li><li><b>distinct:</b> ${approx}${formatNumber(c.distinct)}</li><li><b>empty:</b> ${formatNumber(c.empty)} (${share(c.empty, rows) ?? '—'})</li>${range}</ul>`;
}

/** The chart and table of a column, by what its profile holds. */
function chartOf(c: ProfileColumnPlus, id: string, given: CycleCounts | undefined): SafeHtml | '' {
  if (c.histogram?.length) {
    const chart = histogramChart({ id, title: `${c.name}: distribution`, countLabel: 'values', bins: c.histogram, width: 400, height: 150 });
    const table = dataTable({ caption: `${c.name}: values per bin`, columns: [{ label: 'from' }, { label: 'to' }, { label: 'values', numeric: true }], rows: c.histogram.map((b) => [formatNumber(b.low), formatNumber(b.high), b.count]) });
    return figure('', chart, table, 'stacked');
  }
  const levels = c.levels ?? (c.order && c.top ? c.order.map((v) => ({ value: v, count: c.top!.find((t) => t.value === v)?.count ?? 0 })) : null);
  if (c.level === 'ordinal' && levels?.length) {
    const chart = columnChart({ id, title: `${c.name}: levels in order`, valueLabel: 'rows', data: levels.map((l) => ({ label: l.value, value: l.count })), width: 400, height: 150, showValues: levels.length <= 12 });
    return figure('', chart, valueTable(c.name, 'level', levels), 'stacked');
  }
  if (c.periods?.length) {
    const chart = columnChart({ id, title: `${c.name}: rows per period`, valueLabel: 'rows', data: c.periods.map((p) => ({ label: p.label, value: p.count })), width: 400, height: 150 });
    return figure('', chart, valueTable(c.name, 'period', c.periods.map((p) => ({ value: p.label, count: p.count }))), 'stacked');
  }
  const cycles = (c.grain as { distribution?: CycleCounts | null } | undefined)?.distribution ?? given;
  if (c.role === 'time' && cycles) {
    const data = cycles.monthOfYear.map((n, i) => ({ value: MONTHS[i], count: n }));
    const chart = columnChart({ id, title: `${c.name}: rows by month of the year`, valueLabel: 'rows', data: data.map((d) => ({ label: d.value, value: d.count })), width: 400, height: 150 });
    return figure('', chart, valueTable(c.name, 'month', data), 'stacked');
  }
  if (c.top?.length && c.level !== 'quantitative') {
    const shown = c.top.reduce((a, t) => a + t.count, 0);
    const data = [...c.top.map((t) => ({ label: t.value, value: t.count })), ...(c.values > shown ? [{ label: 'all other values', value: c.values - shown, other: true }] : [])];
    const chart = hbarChart({ id, title: `${c.name}: most frequent values`, valueLabel: 'rows', data, total: c.values, width: 400 });
    return figure('', chart, valueTable(c.name, 'value', data.map((d) => ({ value: d.label, count: d.value }))), 'stacked');
  }
  if (c.level === 'quantitative' && c.role !== 'identifier' && c.min !== undefined && c.max !== undefined && c.min < c.max) {
    return rangeLanes({ id, title: `${c.name}: range of values`, summary: `${c.name} runs from ${formatNumber(c.min)} to ${formatNumber(c.max)}.`, ranges: [{ label: 'values', low: c.min, high: c.max }], marks: [], width: 400 });
  }
  return '';
}

function valueTable(name: string, what: string, rows: ReadonlyArray<{ value: string; count: number }>): SafeHtml {
  return dataTable({ caption: `${name}: rows per ${what}`, columns: [{ label: what }, { label: 'rows', numeric: true }], rows: rows.map((r) => [r.value, r.count]) });
}

function grainLine(c: ColumnProfile): SafeHtml | '' {
  const g = c.grain;
  if (!g || !g.grain) return '';
  const step = g.grain.step === 1 ? '' : `${g.grain.step} `;
  return html`<p><b>Grain:</b> ${step}${g.grain.unit}${g.zone ? ` in ${g.zone}` : ''}; from ${g.first ?? '—'} to ${g.last ?? '—'}.</p>`;
}

/** The column with the histogram or level counts of `evidence` when it has none of its own. */
function withEvidence(c: ColumnProfile, e: ProfileEvidence | undefined): ProfileColumnPlus {
  const plus = c as ProfileColumnPlus;
  if (!e) return plus;
  return { ...plus, histogram: plus.histogram ?? e.histograms[c.name], levels: plus.levels ?? e.levels[c.name] };
}

function card(c: ProfileColumnPlus, rows: number, cycles: CycleCounts | undefined): SafeHtml {
  const id = makeId('profile', c.name);
  return html`<article class="q-card" aria-labelledby="${id}-h"><h3 id="${id}-h">${c.name}</h3>${badges(c)}<p>${c.reason}</p>${counts(c, rows)}${grainLine(c)}${chartOf(c, id, cycles)}</article>`;
}

function overview(report: ProfileReport): SafeHtml {
  return dataTable({
    caption: 'Every column at a glance',
    columns: [{ label: 'column' }, { label: 'level' }, { label: 'role' }, { label: 'distinct', numeric: true }, { label: 'empty', numeric: true }, { label: 'why' }],
    rows: report.columns.map((c) => [c.name, c.level, c.role, c.distinctExact ? c.distinct : `≈${formatNumber(c.distinct)}`, c.empty, c.reason]),
  });
}

/** Renders a profile as a complete HTML page. */
export function renderProfileReport(report: ProfileReport, options: ProfileReportOptions = {}): string {
  const s = report.shape;
  const kind = s.kind === 'items' ? 'lists items: one row per thing counted' : 'is aggregated: each row already holds a count or total';
  const shape = section(
    'What the table is',
    html`<p class="q-lede">This table ${kind}. ${s.reason.replace(/\.$/, '')}.</p><ul class="q-facts"><li><b>key:</b> ${s.key.length ? s.key.join(' + ') : 'none found'}</li><li><b>measures:</b> ${s.measures.length ? s.measures.join(', ') : 'none'}</li>${s.alternatives.length ? html`<li><b>other keys:</b> ${s.alternatives.map((k) => k.join(' + ')).join('; ')}</li>` : ''}<li><b>checked over:</b> ${formatNumber(s.checkedRows)} rows</li></ul>`,
    overview(report),
  );
  const cards = section('Columns', html`<div class="q-cards">${report.columns.map((c) => card(withEvidence(c, options.evidence), report.rows, options.evidence?.cycles[c.name]))}</div>`);
  return renderPage({
    command: 'profile',
    title: `${report.file}: what each column is`,
    lede: html`The measurement level and role of each of the ${formatNumber(report.columns.length)} columns, with the reason, and whether the table lists items or is aggregated.`,
    facts: [
      ['Rows read', formatNumber(report.rows)],
      ['Rows rejected', formatNumber(report.rejectedRows)],
      ['Columns', formatNumber(report.columns.length)],
      ['Shape', s.kind],
    ],
    body: html`${shape}${cards}`,
    version: options.version,
  });
}
