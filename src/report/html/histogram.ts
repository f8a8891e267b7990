// A histogram of a quantity: adjacent bars over a true linear axis, so unequal bins keep their widths.
import { scaleLinear } from 'd3-scale';
import { html, type SafeHtml } from './escape.js';
import { markStyle, r1, svgChart, valueAxis } from './svg.js';
import { formatNumber, type HistogramBin } from '../terminal.js';

export interface HistogramSpec {
  id: string;
  title: string;
  summary?: string;
  /** What is counted ('rows'). */
  countLabel: string;
  /** Bins in ascending order, half-open [low, high) except the last, closed. */
  bins: readonly HistogramBin[];
  width?: number;
  height?: number;
  format?: (v: number) => string;
}

/** Summary sentence: range, number of bins and the fullest bin. */
export function histogramSummary(spec: HistogramSpec): string {
  const b = spec.bins;
  if (b.length === 0) return `${spec.title}: no values.`;
  const f = spec.format ?? formatNumber;
  const total = b.reduce((a, x) => a + x.count, 0);
  const top = b.reduce((a, x) => (x.count > a.count ? x : a), b[0]);
  return `${spec.title}: ${formatNumber(total)} ${spec.countLabel} from ${f(b[0].low)} to ${f(b[b.length - 1].high)} in ${b.length} bins; the fullest bin, ${f(top.low)} to ${f(top.high)}, holds ${formatNumber(top.count)}.`;
}

/** An SVG histogram. */
export function histogramChart(spec: HistogramSpec): SafeHtml {
  const width = spec.width ?? 480;
  const height = spec.height ?? 200;
  const m = { top: 10, right: 12, bottom: 30, left: 44 };
  const f = spec.format ?? formatNumber;
  const bins = spec.bins;
  const lo = bins.length ? bins[0].low : 0;
  const hi = bins.length ? bins[bins.length - 1].high : 1;
  const x = scaleLinear().domain([lo, hi === lo ? lo + 1 : hi]).range([m.left, width - m.right]);
  const y = scaleLinear().domain([0, Math.max(1, ...bins.map((b) => b.count))]).nice(4).range([height - m.bottom, m.top]);
  const fill = markStyle('value', spec.id).fill;
  const bars = bins.map((b) => {
    const x0 = x(b.low);
    const w = Math.max(0.8, x(b.high) - x0 - 0.8);
    const h = y(0) - y(b.count);
    return html`<rect x="${r1(x0)}" y="${r1(y(b.count))}" width="${r1(w)}" height="${r1(b.count > 0 ? Math.max(h, 1) : 0)}" fill="${fill}" class="q-bar"><title>${f(b.low)} to ${f(b.high)}: ${formatNumber(b.count)}</title></rect>`;
  });
  const ticks = x.ticks(Math.min(8, Math.max(2, Math.floor(width / 70))));
  const axis = html`<g class="q-axis" aria-hidden="true">${ticks.map(
    (t) => html`<line x1="${r1(x(t))}" x2="${r1(x(t))}" y1="${r1(y(0))}" y2="${r1(y(0) + 4)}" stroke="#1d2433"/><text x="${r1(x(t))}" y="${r1(y(0) + 15)}" text-anchor="middle">${f(t)}</text>`,
  )}</g>`;
  const body = html`${valueAxis(y, m.left, width - m.right, formatNumber, true)}${bars}<line x1="${m.left}" x2="${width - m.right}" y1="${r1(y(0))}" y2="${r1(y(0))}" stroke="#1d2433"/>${axis}`;
  return svgChart({ id: spec.id, width, height, title: spec.title, summary: spec.summary ?? histogramSummary(spec) }, body);
}
