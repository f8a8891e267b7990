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
  holes: Array<{ from: number | string; to: number | string; range: string }>;
  duplicates: Array<{ range: string; lines: number[]; count: number }>;
  /** Ranges that hold no value ([5,5)). */
  empty: RangeRef[];
  /** Ranges reaching outside --domain. */
  outside: RangeRef[];
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
  series: OverlapsSeries[];
  totals: { overlaps: number; holes: number; duplicates: number; series: number; seriesWithProblems: number };
  /** Drawing data for the text chart, per series (not part of the JSON). */
  chart?: Array<{ ranges: AxisRange[]; marks: AxisMark[]; format: (v: number) => string } | null>;
}

/** The JSON of the result, in the shape the issue gives, plus totals and rejections. */
export function overlapsJson(r: OverlapsResult): string {
  const { chart: _chart, ...rest } = r;
  return `${JSON.stringify(rest, null, 2)}\n`;
}

const plural = (n: number, one: string, many = `${one}s`) => `${formatNumber(n)} ${n === 1 ? one : many}`;
const ref = (x: RangeRef) => `line ${x.line} ${terminalSafe(x.range)}`;

function seriesText(s: OverlapsSeries, chart: NonNullable<OverlapsResult['chart']>[number] | undefined, o: { color?: boolean; width?: number }, domainGiven: boolean): string[] {
  const head = s.key === null ? '' : `${terminalSafe(s.key)}: `;
  const cover = s.domain === null || !domainGiven ? '' : `; ${s.covers ? 'covers' : 'does not cover'} ${s.domain}${s.partition ? ' exactly (a partition)' : ''}`;
  const lines = [`${head}${plural(s.ranges, 'range')} — ${plural(s.overlapCount, 'overlap')}, ${plural(s.holes.length, 'hole')}, ${plural(s.duplicates.length, 'duplicate')}${cover}`];
  for (const p of s.overlaps) lines.push(`  overlap   ${ref(p.a)} ${p.relation} ${ref(p.b)} (shared ${terminalSafe(p.shared)})`);
  if (s.overlapCount > s.overlaps.length) lines.push(`  … and ${formatNumber(s.overlapCount - s.overlaps.length)} more overlapping pairs (--max-pairs)`);
  for (const h of s.holes) lines.push(`  hole      ${terminalSafe(h.range)}`);
  for (const d of s.duplicates) lines.push(`  duplicate ${terminalSafe(d.range)} ×${d.count} on lines ${d.lines.slice(0, 8).join(', ')}${d.lines.length > 8 ? ', …' : ''}`);
  for (const e of s.empty) lines.push(`  empty     ${ref(e)} holds no value`);
  for (const e of s.outside) lines.push(`  outside   ${ref(e)} reaches outside the domain`);
  if (chart) lines.push(...rangeAxis(chart.ranges, { marks: chart.marks, format: chart.format, width: o.width ?? 72, color: o.color, maxLabel: 24 }).split('\n').map((l) => `  ${l}`));
  return lines;
}

/** The result as text: a headline, then each series with its findings and (for small series) a chart. */
export function overlapsText(r: OverlapsResult, options: { color?: boolean; width?: number } = {}): string {
  const t = r.totals;
  const out = [`${plural(r.ranges, 'range')} in ${plural(t.series, 'series', 'series')} from ${terminalSafe(r.file)} (${r.kind === 'time' ? 'time ranges' : 'numeric ranges'}: ${r.ends})`,
    `${plural(t.overlaps, 'overlapping pair')}, ${plural(t.holes, 'hole')}, ${plural(t.duplicates, 'duplicated range')}; ${formatNumber(t.seriesWithProblems)} of ${formatNumber(t.series)} series with problems`];
  if (r.rejected.count > 0) {
    const why = Object.entries(r.rejected.byReason).map(([k, v]) => `${k} ${formatNumber(v)}`).join(', ');
    out.push(`rows read ${formatNumber(r.rowsRead)} = ${formatNumber(r.ranges)} ranges + ${formatNumber(r.rejected.count)} rejected (${why})`);
    for (const e of r.rejected.examples) out.push(`  rejected  line ${e.line} ${JSON.stringify(terminalSafe(e.value))}: ${e.reason}`);
  }
  r.series.forEach((s, i) => { out.push('', ...seriesText(s, r.chart?.[i] ?? undefined, options, r.domainGiven)); });
  return `${out.join('\n')}\n`;
}
