// HTML report of `quern gaps`: each series as a grid of its expected periods — present, missing (dotted,
// outlined) or duplicated (triangle) — wrapped a day, a week or a year to a line, with the missing runs and
// duplicated periods listed beside it.
import { makeCalendar } from '../../calendar/index.js';
import type { GapSeries, GapsResult, InstantGapReport, MissingRun } from '../../gaps/types.js';
import { formatNumber, type PeriodState } from '../terminal.js';
import { accountingFigure, diagnosticsTable, reasons, share } from './common.js';
import { html, makeId, type SafeHtml } from './escape.js';
import { rangeLanes } from './lanes.js';
import { renderPage, section } from './page.js';
import { periodGrid, type GridCell } from './strip.js';
import { legend } from './svg.js';
import { dataTable, figure } from './table.js';

export interface GapsReportOptions {
  version?: string;
}

const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];
/** Most missing runs and duplicated periods listed per series (all are counted). */
const MAX_LISTED = 200;

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

interface Layout {
  perRow: number;
  flow: 'rows' | 'columns';
  cross?: string[];
  lineLabel?: (line: number, first: GridCell | undefined) => string;
}

/** The date part of a label that starts with one (2024-01-08T00:00+00:00/PT15M → 2024-01-08). */
function datePart(first: GridCell | undefined): string {
  const m = first ? /^\d{4}-\d{2}-\d{2}/.exec(first.label) : null;
  return m ? m[0] : (first?.label ?? '');
}

/** Month names over a calendar's week columns; the year in January. */
function monthOf(first: GridCell | undefined): string {
  const m = first ? /^(\d{4})-(\d{2})-\d{2}/.exec(first.label) : null;
  if (!m) return '';
  return m[2] === '01' ? m[1] : MONTHS[Number(m[2]) - 1];
}

/** Expected periods per line of the grid: a day of sub-day slots, a calendar of days, a year of months… */
function layout(result: GapsResult, labelled: boolean): Layout {
  const unit = result.unit;
  const step = Math.max(1, result.step);
  const perDay: Partial<Record<string, number>> = { second: 86_400, minute: 1_440, hour: 24 };
  const slots = unit ? perDay[unit] : undefined;
  if (slots !== undefined && slots % step === 0 && slots / step <= 288) {
    const n = slots / step;
    const hourEvery = n / 24;
    const cross = Array.from({ length: n }, (_, i) => (Number.isInteger(i / hourEvery) ? String(i / hourEvery).padStart(2, '0') : ''));
    return { perRow: n, flow: 'rows', cross, lineLabel: labelled ? (_, f) => datePart(f) : undefined };
  }
  if (unit === 'day' && step === 1 && labelled) return { perRow: 7, flow: 'columns', cross: WEEKDAYS, lineLabel: (_, f) => monthOf(f) };
  if (unit === 'day' && step === 1) return { perRow: result.weekdays ? 5 : 7, flow: 'rows' };
  if (unit === 'month' || unit === 'fiscal-month') return { perRow: 12, flow: 'rows' };
  if (unit === 'quarter' || unit === 'fiscal-quarter') return { perRow: 4, flow: 'rows' };
  if (unit === 'week' || unit === 'iso-week' || unit === 'epi-week') return { perRow: 13, flow: 'rows' };
  return { perRow: 30, flow: 'rows' };
}

/**
 * Labels of the k-th expected period of a series, from the calendar, when the expected periods are
 * consecutive (no --weekdays, no skipped dates) and the calendar gives back the series' own first and last
 * labels; otherwise null (cells are then numbered).
 */
function labeller(result: GapsResult, s: GapSeries): ((k: number) => string) | null {
  if (!result.unit || result.weekdays || result.skippedDates > 0 || s.first === null || s.last === null || s.expected === 0) return null;
  try {
    const cal = makeCalendar({ unit: result.unit, step: result.step, zone: result.zone });
    const p = cal.tryParseLabel(s.first);
    if (!p) return null;
    const k0 = cal.index(p.start);
    const label = (k: number) => cal.label(cal.startOf(k0 + k));
    return label(s.expected - 1) === s.last ? label : null;
  } catch {
    return null;
  }
}

/** Cells of a series in expected-period order. */
function cells(s: GapSeries, label: ((k: number) => string) | null): GridCell[] {
  const states: PeriodState[] = Array(s.expected).fill('present');
  for (const r of s.missing) for (let k = r.index; k < r.index + r.periods && k < s.expected; k++) states[k] = 'missing';
  const dup = new Map(s.duplicates.map((d) => [d.index, d.count]));
  for (const k of dup.keys()) if (k < s.expected) states[k] = 'duplicated';
  return states.map((state, k) => ({ label: label ? label(k) : `period ${k + 1}`, state, count: dup.get(k) }));
}

function runsTable(s: GapSeries): SafeHtml {
  const rows = [
    ...s.missing.map((r: MissingRun) => [r.from === r.to ? r.from : `${r.from} … ${r.to}`, 'missing', r.periods] as const),
    ...s.duplicates.map((d) => [d.period, `duplicated (${formatNumber(d.count)} rows)`, 1] as const),
  ].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  const shown = rows.slice(0, MAX_LISTED);
  const more = rows.length - shown.length;
  return dataTable({
    caption: `Missing and duplicated periods${s.key ? ` of ${s.key}` : ''}`,
    columns: [{ label: 'periods' }, { label: 'state' }, { label: 'n', numeric: true }],
    rows: rows.length ? [...shown, ...(more > 0 ? [[`and ${formatNumber(more)} more`, 'see --json for all', null] as const] : [])] : [['none', 'every expected period has exactly one row', 0]],
  });
}

function seriesSection(result: GapsResult, s: GapSeries): SafeHtml {
  const name = s.key === '' ? 'All rows' : s.key;
  const id = makeId('gaps', name);
  const gist = `${formatNumber(s.present)} of ${formatNumber(s.expected)} expected periods present (${share(s.present, s.expected) ?? '—'}), ${formatNumber(s.missing.reduce((a, r) => a + r.periods, 0))} missing in ${formatNumber(s.missing.length)} run${s.missing.length === 1 ? '' : 's'}, ${formatNumber(s.duplicates.length)} duplicated`;
  if (s.gaps) return section(name, instantFigure(id, name, s));
  const label = labeller(result, s);
  const list = cells(s, label);
  const lay = layout(result, label !== null);
  const lead = lay.flow === 'columns' ? (new Date(`${datePart(list[0])}T00:00:00Z`).getUTCDay() + 6) % 7 : 0;
  const grid = periodGrid({ id, title: `${name}: expected ${result.unit ?? 'periods'}`, cells: list, perRow: lay.perRow, flow: lay.flow, lead: Number.isFinite(lead) ? lead : 0, crossLabels: lay.cross, lineLabel: lay.lineLabel, width: 760 });
  const unexpected = s.unexpected ? html` ${formatNumber(s.unexpected)} periods with rows were not expected.` : '';
  return section(name, figure(html`<b>${name}:</b> ${gist}; from ${s.first ?? '—'} to ${s.last ?? '—'}.${unexpected}`, grid, runsTable(s)));
}

function instantFigure(id: string, name: string, s: GapSeries): SafeHtml {
  const gaps = s.gaps ?? [];
  const t0 = s.first ? Date.parse(s.first) : NaN;
  const t1 = s.last ? Date.parse(s.last) : NaN;
  const iso = (ms: number) => new Date(ms).toISOString().slice(0, 16).replace('T', ' ');
  const marks = gaps.map((g: InstantGapReport) => ({ kind: 'hole' as const, low: Date.parse(g.from), high: Date.parse(g.to) })).filter((m) => Number.isFinite(m.low) && Number.isFinite(m.high));
  const chart = Number.isFinite(t0) && Number.isFinite(t1)
    ? rangeLanes({ id, title: `${name}: readings and gaps`, summary: `${name}: readings from ${s.first} to ${s.last}; ${gaps.length} gaps longer than the limit.`, ranges: [{ label: 'readings', low: t0, high: t1 }], marks, time: true, format: iso, width: 760 })
    : '';
  const table = dataTable({
    caption: `Gaps of ${name}`,
    columns: [{ label: 'after' }, { label: 'before' }, { label: 'length' }],
    rows: gaps.length ? gaps.map((g) => [g.from, g.to, g.length]) : [['none', null, null]],
  });
  return figure(html`<b>${name}:</b> ${formatNumber(gaps.length)} gaps between consecutive readings over the limit; longest ${s.longestGap && 'length' in s.longestGap ? s.longestGap.length : 'none'}.`, chart, table);
}

function overview(result: GapsResult): SafeHtml {
  return dataTable({
    caption: 'Series',
    columns: [{ label: 'series' }, { label: 'first' }, { label: 'last' }, { label: 'rows', numeric: true }, { label: 'expected', numeric: true }, { label: 'present', numeric: true }, { label: 'missing', numeric: true }, { label: 'duplicated', numeric: true }, { label: 'coverage', numeric: true }],
    rows: result.series.map((s) => [s.key || 'all rows', s.first, s.last, s.rows, s.expected, s.present, s.missing.reduce((a, r) => a + r.periods, 0), s.duplicates.length, share(s.present, s.expected)]),
    flagged: (i) => result.series[i].missing.length > 0 || result.series[i].duplicates.length > 0,
  });
}

/** Renders a gaps result as a complete HTML page. */
export function renderGapsReport(result: GapsResult, options: GapsReportOptions = {}): string {
  const sm = result.summary;
  const unit = result.unit ? `${result.step === 1 ? '' : `${result.step} × `}${result.unit}` : `gaps over ${result.maxGap}`;
  const key = legend('gaps-legend', [['value', 'present: one row or more'], ['missing', 'missing: expected, no row'], ['duplicated', 'duplicated: more than one row']]);
  const body = html`${section('Series', overview(result))}${key}${result.series.map((s) => seriesSection(result, s))}
${section('Rows', accountingFigure('gaps-rows', sm.rowsRead, [
    { label: 'used', rows: sm.rowsUsed },
    { label: 'empty time', rows: sm.rowsEmpty },
    { label: 'rejected', rows: sm.rowsRejected },
    { label: 'outside --from/--until', rows: sm.rowsOutside },
  ]), html`<p>Rejected by reason: ${reasons(sm.rejectedByReason)}.</p>`, diagnosticsTable(sm.examples))}`;
  return renderPage({
    command: 'gaps',
    title: `${sm.file}: missing and duplicated periods`,
    lede: result.problems
      ? html`Some series miss expected periods or hold duplicates. Each series is drawn below as a grid of its expected periods.`
      : html`Every series has exactly one row in each expected period.`,
    facts: [
      ['Rows read', formatNumber(sm.rowsRead)],
      ['Expected', `${unit} (${result.unitBasis})`],
      ['Zone', result.zone],
      ['Series', formatNumber(result.series.length)],
      ['Weekdays only', result.weekdays ? 'yes' : 'no'],
      ['Skipped dates', formatNumber(result.skippedDates)],
    ],
    body,
    version: options.version,
  });
}
