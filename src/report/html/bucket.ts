// HTML report of `quern bucket`: the ranges as an ordered histogram with counts and shares, and apart from
// it, the rows that fell in no range (below, above, between ranges, empty, invalid, rejected).
import type { BucketRunResult, Outcome } from '../../bins/index.js';
import { formatNumber } from '../terminal.js';
import { accountingFigure, notesList, reasons, share } from './common.js';
import { columnChart } from './columns.js';
import { hbarChart } from './hbars.js';
import { html, type SafeHtml } from './escape.js';
import { renderPage, section } from './page.js';
import { legend } from './svg.js';
import { dataTable, figure } from './table.js';

export interface BucketReportOptions {
  version?: string;
}

/** A range in interval notation: [0, 5), (10, +∞) (ISO 80000-2 writes half-open intervals this way). */
function interval(b: { low: number | null; high: number | null; lowClosed: boolean; highClosed: boolean }): string {
  const lo = b.low === null ? '(−∞' : `${b.lowClosed ? '[' : '('}${formatNumber(b.low)}`;
  const hi = b.high === null ? '+∞)' : `${formatNumber(b.high)}${b.highClosed ? ']' : ')'}`;
  return `${lo}, ${hi}`;
}

function examplesCell(o: Outcome): string | null {
  return o.examples.length ? o.examples.slice(0, 3).map((e) => `line ${e.line}: ${e.value}`).join('; ') : null;
}

/** Renders a bucket run as a complete HTML page. */
export function renderBucketReport(result: BucketRunResult, options: BucketReportOptions = {}): string {
  const s = result.summary;
  const weights = s.buckets.some((b) => b.weight !== undefined);
  const names = s.buckets.some((b) => b.name !== undefined);
  const top = s.buckets.reduce<(typeof s.buckets)[number] | null>((a, b) => (a === null || b.count > a.count ? b : a), null);
  const few = s.buckets.length <= 24;
  const chart = columnChart({
    id: 'bucket-ranges',
    title: `${s.value} by range`,
    summary: `${s.value}: ${formatNumber(s.bucketed)} values in ${s.buckets.length} ranges from ${s.buckets[0]?.label ?? '—'} to ${s.buckets[s.buckets.length - 1]?.label ?? '—'}${top ? `; the largest is ${top.label} with ${formatNumber(top.count)} (${share(top.count, s.bucketed)})` : ''}; ${formatNumber(s.rowsRead - s.bucketed)} rows in no range are shown apart.`,
    valueLabel: 'values',
    data: s.buckets.map((b) => ({ label: b.label, value: b.count })),
    showValues: few,
    valueText: few && s.buckets.length <= 12 ? (d) => `${formatNumber(d.value ?? 0)} · ${share(d.value ?? 0, s.bucketed) ?? ''}` : undefined,
    width: 760,
    height: 260,
  });
  const table = dataTable({
    caption: `Ranges of ${s.value}`,
    columns: [
      { label: 'range' },
      ...(names ? [{ label: 'name' }] : []),
      { label: 'holds' },
      { label: 'values', numeric: true },
      { label: 'share', numeric: true },
      ...(weights ? [{ label: 'weight', numeric: true }] : []),
    ],
    rows: s.buckets.map((b) => [b.label, ...(names ? [b.name ?? null] : []), interval(b), b.count, share(b.count, s.bucketed), ...(weights ? [b.weight ?? null] : [])]),
  });
  const apart = [
    ['below the first range', s.below],
    ['above the last range', s.above],
    ['between ranges (a hole)', s.between],
    ['empty', s.empty],
    ['not a number', s.invalid],
  ] as const;
  const outsideRows = [...apart.map(([label, o]) => ({ label, value: o.count, other: true })), { label: 'rejected rows', value: s.rowsRejected, other: true }];
  const outsideTotal = outsideRows.reduce((a, r) => a + r.value, 0);
  const outsideChart = outsideTotal === 0
    ? html`<p>No row fell outside the ranges: every one of the ${formatNumber(s.rowsRead)} rows read is in a range.</p>`
    : hbarChart({
        id: 'bucket-outside',
        title: `${s.value}: rows in no range`,
        summary: `Rows in no range: ${apart.map(([l, o]) => `${l} ${formatNumber(o.count)}`).join(', ')}, rejected rows ${formatNumber(s.rowsRejected)}.`,
        valueLabel: 'rows',
        data: outsideRows,
        total: s.rowsRead,
        width: 520,
      });
  const outsideTable = dataTable({
    caption: 'Rows in no range',
    columns: [{ label: 'where' }, { label: 'rows', numeric: true }, { label: 'examples' }],
    rows: [...apart.map(([label, o]) => [label, o.count, examplesCell(o)] as const), ['rejected rows', s.rowsRejected, reasons(s.rejectedByReason)] as const],
  });
  const kind = s.discrete ? 'whole numbers; a label such as 0-4 holds 0, 1, 2, 3 and 4' : `numbers; each range holds its ${s.closed} end`;
  const notes = [
    ...s.notes,
    ...s.merged.map((m) => `edge ${m.value} appeared ${m.times} times (ties) and was merged`),
    ...(s.nonInteger.count ? [`${formatNumber(s.nonInteger.count)} values have a fraction; whole-number ranges count completed units (4.5 is in 0-4)`] : []),
  ];
  const body = html`${legend('bucket-legend', [['value', 'values in a range'], ['filled', 'rows in no range (hatched, drawn apart)']])}
${section('Ranges', figure(html`<b>${s.value}</b> in ${s.buckets.length} ranges, in their order (${kind}).`, chart, table))}
${section('Rows in no range', figure(html`Rows that no range holds, kept apart so they never hide in the first or last range.`, outsideChart, outsideTable))}
${section('Rows', accountingFigure('bucket-rows', s.rowsRead, [
    { label: 'in a range', rows: s.bucketed },
    ...apart.map(([label, o]) => ({ label, rows: o.count })),
    { label: 'rejected rows', rows: s.rowsRejected },
  ]), notesList(notes))}`;
  return renderPage({
    command: 'bucket',
    title: `${s.file}: ${s.value} in ranges`,
    lede: html`How the values of ${s.value} fall into ${s.source}: counts and shares per range, and every row the ranges do not hold.`,
    facts: [
      ['Rows read', formatNumber(s.rowsRead)],
      ['In a range', `${formatNumber(s.bucketed)} (${share(s.bucketed, s.rowsRead) ?? '—'})`],
      ['Ranges', formatNumber(s.buckets.length)],
      ['Scheme', s.source],
    ],
    body,
    version: options.version,
  });
}
