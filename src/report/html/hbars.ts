// Horizontal bars for categories and ordered levels: label, bar and value on one line, in the caller's
// order (frequency order for categories, the scale's order for ordinal levels).
import { scaleLinear } from 'd3-scale';
import { html, type SafeHtml } from './escape.js';
import { markStyle, r1, svgChart } from './svg.js';
import { formatNumber } from '../terminal.js';

export interface HBarDatum {
  label: string;
  value: number;
  /** Drawn hatched: e.g. an "all other values" row or empty cells. */
  other?: boolean;
}

export interface HBarSpec {
  id: string;
  title: string;
  summary?: string;
  valueLabel: string;
  data: readonly HBarDatum[];
  width?: number;
  /** Total used for shares in the value text; no shares when absent. */
  total?: number;
}

function clip(text: string, max: number): string {
  const c = Array.from(text);
  return c.length <= max ? text : `${c.slice(0, max - 1).join('')}…`;
}

/** An SVG of horizontal bars, one row per datum, labelled with value and share. */
export function hbarChart(spec: HBarSpec): SafeHtml {
  const width = spec.width ?? 420;
  const row = 18;
  const labelW = Math.min(150, Math.max(40, 6.2 * Math.max(...spec.data.map((d) => Math.min(24, d.label.length)), 4)));
  const valueW = 84;
  const height = Math.max(row, spec.data.length * row) + 6;
  const max = Math.max(1, ...spec.data.map((d) => d.value));
  const x = scaleLinear().domain([0, max]).range([labelW + 6, width - valueW]);
  const rows = spec.data.map((d, i) => {
    const y = 3 + i * row;
    const s = markStyle(d.other ? 'filled' : 'value', spec.id);
    const share = spec.total ? ` (${formatNumber(Math.round((d.value / spec.total) * 1000) / 10)}%)` : '';
    return html`<g><text x="${labelW}" y="${y + 12.5}" text-anchor="end">${clip(d.label === '' ? '(empty)' : d.label, 24)}</text><rect x="${r1(x(0))}" y="${y + 2}" width="${r1(Math.max(d.value > 0 ? 1 : 0, x(d.value) - x(0)))}" height="${row - 5}" fill="${s.fill}" stroke="${d.other ? s.stroke : 'none'}" class="q-bar"/><text x="${r1(x(d.value) + 4)}" y="${y + 12.5}" class="q-num">${formatNumber(d.value)}${share}</text><title>${d.label}: ${formatNumber(d.value)}${share}</title></g>`;
  });
  const top = spec.data.reduce<HBarDatum | null>((a, b) => (a === null || b.value > a.value ? b : a), null);
  const summary =
    spec.summary ??
    (top ? `${spec.title}: ${spec.data.length} bars; the largest is ${top.label} with ${formatNumber(top.value)} ${spec.valueLabel}.` : `${spec.title}: no values.`);
  return svgChart({ id: spec.id, width, height, title: spec.title, summary }, html`${rows}<line x1="${r1(x(0))}" x2="${r1(x(0))}" y1="0" y2="${height}" stroke="#1d2433"/>`);
}
