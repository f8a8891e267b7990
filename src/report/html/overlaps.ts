// HTML report of `quern overlaps`: per key, the ranges drawn on one axis with overlaps cross-hatched and
// holes outlined, and beside them every overlapping pair with its Allen relation, the holes and duplicates.
import type { OverlapsResult, OverlapsSeries } from '../overlaps.js';
import { formatNumber } from '../terminal.js';
import { accountingFigure } from './common.js';
import { html, makeId, type SafeHtml } from './escape.js';
import { hbarChart } from './hbars.js';
import { rangeLanes } from './lanes.js';
import { renderPage, section } from './page.js';
import { legend } from './svg.js';
import { dataTable, figure } from './table.js';

export interface OverlapsReportOptions {
  version?: string;
}

type Chart = NonNullable<OverlapsResult['chart']>[number];

/** A row saying how many findings of a kind the capped list leaves out, or none. */
function moreRow(count: number, listed: number, what: string): Array<readonly [string, string, null, null]> {
  return count > listed ? [[`and ${formatNumber(count - listed)} more ${what}`, 'raise --max-listed, or see --json', null, null] as const] : [];
}

function findingsTable(s: OverlapsSeries, name: string): SafeHtml {
  const rows = [
    ...s.overlaps.map((p) => [`line ${p.a.line} ${p.a.range}`, p.relation, `line ${p.b.line} ${p.b.range}`, p.shared] as const),
    ...s.holes.map((h) => ['hole', 'no range holds', h.range, null] as const),
    ...s.duplicates.map((d) => [`${d.range} ×${d.count}`, 'duplicate', `lines ${d.lines.slice(0, 8).join(', ')}${d.lines.length > 8 ? ', …' : ''}`, null] as const),
    ...s.empty.map((e) => [`line ${e.line} ${e.range}`, 'empty', 'holds no value', null] as const),
    ...s.outside.map((e) => [`line ${e.line} ${e.range}`, 'outside', 'reaches outside the domain', null] as const),
  ];
  const more = [
    moreRow(s.overlapCount, s.overlaps.length, 'overlapping pairs'),
    moreRow(s.holeCount, s.holes.length, 'holes'),
    moreRow(s.duplicateCount, s.duplicates.length, 'duplicated ranges'),
    moreRow(s.emptyCount, s.empty.length, 'empty ranges'),
    moreRow(s.outsideCount, s.outside.length, 'ranges outside the domain'),
  ].flat();
  return dataTable({
    caption: `Findings for ${name}`,
    columns: [{ label: 'range' }, { label: 'relation' }, { label: 'other range' }, { label: 'shared' }],
    rows: rows.length ? [...rows, ...more] : [['none', 'no overlap, hole or duplicate', null, null]],
  });
}

function seriesSection(r: OverlapsResult, s: OverlapsSeries, chart: Chart | undefined, i: number): SafeHtml {
  const name = s.key === null ? 'All ranges' : s.key;
  const id = makeId('overlaps', `${i}-${name}`);
  const gist = `${formatNumber(s.ranges)} ranges; ${formatNumber(s.overlapCount)} overlapping pair${s.overlapCount === 1 ? '' : 's'}, ${formatNumber(s.holeCount)} hole${s.holeCount === 1 ? '' : 's'}, ${formatNumber(s.duplicateCount)} duplicate${s.duplicateCount === 1 ? '' : 's'}`;
  const cover = r.domainGiven && s.domain ? `${s.covers ? 'Covers' : 'Does not cover'} ${s.domain}${s.partition ? ' exactly: a partition' : ''}.` : '';
  const lanes = chart
    ? rangeLanes({
        id,
        title: `${name}: ranges on one axis`,
        summary: `${name}: ${gist}. ${s.overlaps.map((p) => `${p.a.range} ${p.relation} ${p.b.range}`).join('; ')}${s.holes.length ? `; holes ${s.holes.map((h) => h.range).join(', ')}${s.holeCount > s.holes.length ? ` and ${formatNumber(s.holeCount - s.holes.length)} more` : ''}` : ''}.`,
        ranges: chart.ranges.map((a) => ({ label: a.label, low: a.low, high: a.high })),
        marks: chart.marks,
        format: chart.format,
        time: r.kind === 'time',
        width: 760,
      })
    : html`<p class="q-note">No drawing for this key (over 40 ranges, or --no-chart); every finding is in the table.</p>`;
  return section(name, figure(html`<b>${name}:</b> ${gist}. ${cover}`, lanes, findingsTable(s, name)));
}

/** Counts of each Allen relation over all listed pairs, most frequent first. */
function relationsFigure(r: OverlapsResult): SafeHtml | '' {
  const counts = new Map<string, number>();
  for (const s of r.series) for (const p of s.overlaps) counts.set(p.relation, (counts.get(p.relation) ?? 0) + 1);
  if (counts.size === 0) return '';
  const data = [...counts.entries()].sort((a, b) => b[1] - a[1]).map(([label, value]) => ({ label, value }));
  const chart = hbarChart({ id: 'overlaps-relations', title: 'Overlapping pairs by Allen relation', valueLabel: 'pairs', data, width: 460 });
  const table = dataTable({ caption: 'Pairs by relation', columns: [{ label: 'relation' }, { label: 'pairs', numeric: true }], rows: data.map((d) => [d.label, d.value]) });
  return section('Relations', figure(html`How the overlapping pairs overlap, in the thirteen relations of J. F. Allen (1983): <i>overlaps</i> shares an inner stretch, <i>during</i> lies inside, <i>starts</i>/<i>finishes</i> share one end, <i>equals</i> shares both.`, chart, table));
}

/** Renders an overlaps result as a complete HTML page. */
export function renderOverlapsReport(result: OverlapsResult, options: OverlapsReportOptions = {}): string {
  const t = result.totals;
  const key = legend('overlaps-legend', [['value', 'a range, drawn from its low to its high end (the table gives its exact ends)'], ['overlap', 'overlap: two or more ranges hold these values (▲)'], ['hole', 'hole: no range holds these values']]);
  const rejected = result.rejected.examples.length
    ? dataTable({ caption: 'Rejected rows (first few)', columns: [{ label: 'line', numeric: true }, { label: 'value' }, { label: 'why' }], rows: result.rejected.examples.map((e) => [e.line, e.value, e.reason]) })
    : '';
  const body = html`${key}${result.series.map((s, i) => seriesSection(result, s, result.chart?.[i] ?? undefined, i))}${relationsFigure(result)}
${section('Rows', accountingFigure('overlaps-rows', result.rowsRead, [{ label: 'ranges', rows: result.ranges }, { label: 'rejected', rows: result.rejected.count }]), rejected)}`;
  return renderPage({
    command: 'overlaps',
    title: `${result.file}: overlaps and holes`,
    lede: html`Where the ranges of each key overlap, where they leave holes, and how each overlapping pair relates.`,
    facts: [
      ['Ranges', formatNumber(result.ranges)],
      ['Series', formatNumber(t.series)],
      ['With problems', formatNumber(t.seriesWithProblems)],
      ['Overlapping pairs', formatNumber(t.overlaps)],
      ['Holes', formatNumber(t.holes)],
      ['Duplicates', formatNumber(t.duplicates)],
      ['Ends', result.ends],
    ],
    body,
    version: options.version,
  });
}
