// Ordered columns: one bar per period or ordered category, in the caller's order. Filled periods (no rows,
// shown as zero or no value) carry a hatched band over their whole slot, so a filled zero never reads as a
// measured zero; values outside a scheme can be drawn apart in a second colour with an outline.
import { scaleBand, scaleLinear } from 'd3-scale';
import { html, type SafeHtml } from './escape.js';
import { bandLabels, markStyle, r1, svgChart, valueAxis } from './svg.js';
import { formatNumber } from '../terminal.js';

export interface ColumnDatum {
  label: string;
  value: number | null;
  /** A period with no rows that the rebin filled (with 0 or no value). */
  filled?: boolean;
  /** Draw apart, e.g. values below or above a bucket scheme. */
  outside?: boolean;
}

export interface ColumnChartSpec {
  id: string;
  title: string;
  /** Text alternative; a summary sentence is made from the data when absent. */
  summary?: string;
  /** What the values are ('visits', 'mean wait_minutes'). */
  valueLabel: string;
  data: readonly ColumnDatum[];
  /** Shared top of the value scale (small multiples); default the largest value. */
  yMax?: number;
  width?: number;
  height?: number;
  /** Print each value above its bar (for a few bars); `valueText` formats it (e.g. with its share). */
  showValues?: boolean;
  valueText?: (d: ColumnDatum) => string;
}

/** The summary sentence spoken instead of the chart. */
export function columnSummary(spec: ColumnChartSpec): string {
  const d = spec.data;
  if (d.length === 0) return `${spec.title}: no values.`;
  const values = d.filter((x) => x.value !== null && !x.filled);
  const top = values.reduce<ColumnDatum | null>((a, b) => (a === null || (b.value ?? 0) > (a.value ?? 0) ? b : a), null);
  const filled = d.filter((x) => x.filled).length;
  const parts = [`${spec.title}: ${formatNumber(d.length)} bars from ${d[0].label} to ${d[d.length - 1].label}`];
  if (top) parts.push(`highest ${spec.valueLabel} ${formatNumber(top.value ?? 0)} at ${top.label}`);
  parts.push(filled ? `${formatNumber(filled)} filled with no rows (hatched)` : 'no filled bars');
  return `${parts.join('; ')}.`;
}

/** An SVG column chart of `data` in order. */
export function columnChart(spec: ColumnChartSpec): SafeHtml {
  const width = spec.width ?? 640;
  const height = spec.height ?? 220;
  const m = { top: spec.showValues ? 18 : 10, right: 8, bottom: 38, left: 48 };
  const finite = spec.data.map((d) => d.value).filter((v): v is number => v !== null && Number.isFinite(v));
  const max = Math.max(spec.yMax ?? 0, ...finite, 0);
  const min = Math.min(0, ...finite);
  const x = scaleBand<number>()
    .domain(spec.data.map((_, i) => i))
    .range([m.left, Math.min(width - m.right, m.left + Math.max(1, spec.data.length) * 72)])
    .paddingInner(spec.data.length > 60 ? 0.05 : 0.18);
  const y = scaleLinear().domain([min, max || 1]).nice(4).range([height - m.bottom, m.top]);
  const bw = x.bandwidth();
  const titles = spec.data.length <= 600;
  const filledStyle = markStyle('filled', spec.id);
  const bars = spec.data.map((d, i) => {
    const x0 = x(i) ?? 0;
    const tip = titles ? html`<title>${d.label}: ${d.value === null ? 'no value' : formatNumber(d.value)}${d.filled ? ' (filled: no rows)' : ''}</title>` : '';
    const band = d.filled
      ? html`<rect x="${r1(x0)}" y="${m.top}" width="${r1(Math.max(bw, 1))}" height="${r1(height - m.bottom - m.top)}" fill="${filledStyle.fill}" opacity="0.55" class="q-filled"/>`
      : '';
    if (d.value === null || !Number.isFinite(d.value) || d.value === 0) {
      return html`<g>${band}${d.value === 0 && !d.filled ? html`<rect x="${r1(x0)}" y="${r1(y(0) - 1)}" width="${r1(Math.max(bw, 1))}" height="1.5" fill="${markStyle('value', spec.id).fill}"/>` : ''}${tip}</g>`;
    }
    const s = markStyle(d.outside ? 'outside' : 'value', spec.id);
    const top = y(Math.max(0, d.value));
    const h = Math.abs(y(d.value) - y(0));
    const text = spec.showValues ? html`<text x="${r1(x0 + bw / 2)}" y="${r1(top - 3)}" text-anchor="middle" class="q-value">${spec.valueText ? spec.valueText(d) : formatNumber(d.value)}</text>` : '';
    return html`<g>${band}<rect x="${r1(x0)}" y="${r1(top)}" width="${r1(Math.max(bw, 1))}" height="${r1(Math.max(h, 0.5))}" fill="${s.fill}" stroke="${s.stroke}" stroke-width="${d.outside ? 1 : 0}" class="${d.outside ? 'q-outside' : 'q-bar'}"/>${text}${tip}</g>`;
  });
  const labels = bandLabels(spec.data.map((d) => d.label), (i) => (x(i) ?? 0) + bw / 2, height - m.bottom + 14, x.step());
  const body = html`${valueAxis(y, m.left, width - m.right, formatNumber, finite.every((v) => Number.isInteger(v)))}${bars}<line x1="${m.left}" x2="${width - m.right}" y1="${r1(y(0))}" y2="${r1(y(0))}" stroke="#1d2433"/>${labels}`;
  return svgChart({ id: spec.id, width, height, title: spec.title, summary: spec.summary ?? columnSummary(spec) }, body);
}
