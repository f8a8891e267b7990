// Human and JSON renderings of `quern overlaps`: per series, every overlapping pair with its Allen
// relation and both lines, the holes, the duplicates, coverage of the domain, and a range axis chart.
import { formatNumber, rangeAxis, terminalSafe, type AxisMark, type AxisRange } from './terminal.js';

export interface RangeRef { line: number; range: string }

export interface OverlapsSeries {
  key: string | null;
  ranges: number;
  overlaps: Array<{ a: RangeRef; b: RangeRef; relation: string; shared: string }>;
  /** All overlapping pairs of distinct ranges; `overlaps` lists at most --max-pairs of them. */
  overlapCount: number;
  /** The holes in order, at most --max-listed of them; `holeCount` counts them all. */
  holes: Array<{ from: number | string; to: number | string; range: string }>;
  holeCount: number;
  /** Ranges written more than once (at most --max-listed groups; `duplicateCount` counts all): `count`
   * copies in all, `lines` the first --max-listed of them in file order. */
  duplicates: Array<{ range: string; lines: number[]; count: number }>;
  duplicateCount: number;
  /** Ranges that hold no value ([5,5)), the first --max-listed; `emptyCount` counts them all. */
  empty: RangeRef[];
  emptyCount: number;
  /** Ranges reaching outside --domain, the first --max-listed; `outsideCount` counts them all. */
  outside: RangeRef[];
  outsideCount: number;
  /** True when some list above (or the lines of a duplicate) is shorter than its count. */
  truncated: boolean;
  domain: string | null;
  covers: boolean;
  partition: boolean;
}

/** The result of `quern overlaps` (what `--json` prints, without `chart`). */
export interface OverlapsResult {
  file: string;
  /** Ranges checked. */
  ranges: number;
  /** Data rows read: ranges + rejected. */
  rowsRead: number;
  rejected: { count: number; byReason: Record<string, number>; examples: Array<{ line: number; value: string; reason: string }> };
  kind: 'number' | 'time';
  ends: string;
  /** True when --domain was given; else each series' domain runs from its lowest to its highest end. */
  domainGiven: boolean;
  /** How many overlapping pairs (--max-pairs) and other items (--max-listed) each series lists. */
  limits: { pairs: number; listed: number };
  series: OverlapsSeries[];
  totals: { overlaps: number; holes: number; duplicates: number; series: number; seriesWithProblems: number };
  /** Drawing data for the text chart, per series (not part of the JSON). */
  chart?: Array<{ ranges: AxisRange[]; marks: AxisMark[]; format: (v: number) => string } | null>;
}

/** What comes before the series: everything of the result but the series, their totals and charts. */
export type OverlapsHead = Omit<OverlapsResult, 'series' | 'totals' | 'chart'>;
export type OverlapsTotals = OverlapsResult['totals'];
export type OverlapsChart = NonNullable<OverlapsResult['chart']>[number];

/** The JSON of the result, in the shape the issue gives, plus totals and rejections. */
export function overlapsJson(r: OverlapsResult): string {
  const { chart: _chart, series, totals, ...head } = r;
  return [...overlapsJsonParts(head, series, () => totals)].join('');
}

/**
 * The same JSON text as overlapsJson, in pieces: the head, then each series as `series` yields it, then
 * the totals (asked for last, so they may be summed while the series go by). A result of 100,000 series
 * is then written without ever holding all of it, nor its text, in memory.
 */
export function* overlapsJsonParts(head: OverlapsHead, series: Iterable<OverlapsSeries>, totals: () => OverlapsTotals): Generator<string> {
  const top = JSON.stringify(head, null, 2);
  yield `${top.slice(0, -2)},\n  "series": [`;
  let first = true;
  for (const s of series) {
    yield `${first ? '' : ','}\n    ${JSON.stringify(s, null, 2).replaceAll('\n', '\n    ')}`;
    first = false;
  }
  yield `${first ? '' : '\n  '}],\n  "totals": ${JSON.stringify(totals(), null, 2).replaceAll('\n', '\n  ')}\n}\n`;
}

const plural = (n: number, one: string, many = `${one}s`) => `${formatNumber(n)} ${n === 1 ? one : many}`;
const ref = (x: RangeRef) => `line ${x.line} ${terminalSafe(x.range)}`;

/** The line that says how many items of a list were left out, or nothing when none was. */
function more(total: number, listed: number, what: string, option: string): string[] {
  return total > listed ? [`  … and ${formatNumber(total - listed)} more ${what} (${option})`] : [];
}

/** Options of the text rendering. */
export interface OverlapsTextOptions { color?: boolean; width?: number }

/** One series as text: its headline, each finding (lists capped, with what was left out), and its chart. */
export function overlapsSeriesText(s: OverlapsSeries, chart: OverlapsChart | undefined, o: OverlapsTextOptions, domainGiven: boolean): string {
  const head = s.key === null ? '' : `${terminalSafe(s.key)}: `;
  const cover = s.domain === null || !domainGiven ? '' : `; ${s.covers ? 'covers' : 'does not cover'} ${s.domain}${s.partition ? ' exactly (a partition)' : ''}`;
  const lines = [`${head}${plural(s.ranges, 'range')} — ${plural(s.overlapCount, 'overlap')}, ${plural(s.holeCount, 'hole')}, ${plural(s.duplicateCount, 'duplicate')}${cover}`];
  for (const p of s.overlaps) lines.push(`  overlap   ${ref(p.a)} ${p.relation} ${ref(p.b)} (shared ${terminalSafe(p.shared)})`);
  lines.push(...more(s.overlapCount, s.overlaps.length, 'overlapping pairs', '--max-pairs'));
  for (const h of s.holes) lines.push(`  hole      ${terminalSafe(h.range)}`);
  lines.push(...more(s.holeCount, s.holes.length, 'holes', '--max-listed'));
  for (const d of s.duplicates) {
    const rest = d.count - Math.min(d.lines.length, 8);
    lines.push(`  duplicate ${terminalSafe(d.range)} ×${d.count} on lines ${d.lines.slice(0, 8).join(', ')}${rest > 0 ? `, … and ${formatNumber(rest)} more` : ''}`);
  }
  lines.push(...more(s.duplicateCount, s.duplicates.length, 'duplicated ranges', '--max-listed'));
  for (const e of s.empty) lines.push(`  empty     ${ref(e)} holds no value`);
  lines.push(...more(s.emptyCount, s.empty.length, 'empty ranges', '--max-listed'));
  for (const e of s.outside) lines.push(`  outside   ${ref(e)} reaches outside the domain`);
  lines.push(...more(s.outsideCount, s.outside.length, 'ranges outside the domain', '--max-listed'));
  if (chart) lines.push(...rangeAxis(chart.ranges, { marks: chart.marks, format: chart.format, width: o.width ?? 72, color: o.color, maxLabel: 24 }).split('\n').map((l) => `  ${l}`));
  return `${lines.join('\n')}\n`;
}

/** The result as text: a headline, then each series with its findings and (for small series) a chart. */
export function overlapsText(r: OverlapsResult, options: OverlapsTextOptions = {}): string {
  const parts = [overlapsHeadText(r, r.totals)];
  r.series.forEach((s, i) => { parts.push('\n', overlapsSeriesText(s, r.chart?.[i] ?? undefined, options, r.domainGiven)); });
  return parts.join('');
}

/** The headline of the text: what was read, the totals, and the rejected rows (then come the series). */
export function overlapsHeadText(r: OverlapsHead, t: OverlapsTotals): string {
  const out = [`${plural(r.ranges, 'range')} in ${plural(t.series, 'series', 'series')} from ${terminalSafe(r.file)} (${r.kind === 'time' ? 'time ranges' : 'numeric ranges'}: ${r.ends})`,
    `${plural(t.overlaps, 'overlapping pair')}, ${plural(t.holes, 'hole')}, ${plural(t.duplicates, 'duplicated range')}; ${formatNumber(t.seriesWithProblems)} of ${formatNumber(t.series)} series with problems`];
  if (r.rejected.count > 0) {
    const why = Object.entries(r.rejected.byReason).map(([k, v]) => `${k} ${formatNumber(v)}`).join(', ');
    out.push(`rows read ${formatNumber(r.rowsRead)} = ${formatNumber(r.ranges)} ranges + ${formatNumber(r.rejected.count)} rejected (${why})`);
    for (const e of r.rejected.examples) out.push(`  rejected  line ${e.line} ${JSON.stringify(terminalSafe(e.value))}: ${e.reason}`);
  }
  return `${out.join('\n')}\n`;
}
