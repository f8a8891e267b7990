// SVG building blocks shared by the charts: the accessible frame, fill patterns, axes and legends.
// Every chart is `role="img"` with a <title> and a <desc> holding a summary sentence (WAI-ARIA 1.2, SVG 2).
import type { ScaleLinear } from 'd3-scale';
import { html, type HtmlValue, type SafeHtml } from './escape.js';
import { PALETTE } from './style.js';
import { formatNumber } from '../terminal.js';

/** Marks that a chart may use; each has a colour and a shape or pattern, so colour is never the only signal. */
export type MarkKind = 'value' | 'filled' | 'missing' | 'duplicated' | 'overlap' | 'hole' | 'outside';

export interface ChartFrame {
  /** Unique id prefix within the page (safe characters only; see makeId). */
  id: string;
  width: number;
  height: number;
  /** Short name of the chart. */
  title: string;
  /** One or two sentences a screen reader speaks instead of the picture. */
  summary: string;
}

/** Rounds a coordinate to 0.1 px to keep the file small. */
export function r1(v: number): string {
  return String(Math.round(v * 10) / 10);
}

/** Fill patterns, defined once per chart: diagonal hatch (filled), cross-hatch (overlap), dots (missing). */
function patterns(id: string): SafeHtml {
  return html`<defs>
<pattern id="${id}-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="6" height="6" fill="#fff"/><line x1="0" y1="0" x2="0" y2="6" stroke="${PALETTE.filled}" stroke-width="2"/></pattern>
<pattern id="${id}-cross" width="6" height="6" patternUnits="userSpaceOnUse"><rect width="6" height="6" fill="#f1e7f6"/><path d="M0 0L6 6M6 0L0 6" stroke="${PALETTE.overlap}" stroke-width="1.2"/></pattern>
<pattern id="${id}-dots" width="5" height="5" patternUnits="userSpaceOnUse"><rect width="5" height="5" fill="#fff"/><circle cx="2.5" cy="2.5" r="1.1" fill="${PALETTE.missing}"/></pattern>
</defs>`;
}

/** Fill and stroke of a mark kind inside a chart with id prefix `id`. */
export function markStyle(kind: MarkKind, id: string): { fill: string; stroke: string } {
  switch (kind) {
    case 'value': return { fill: PALETTE.bar, stroke: 'none' };
    case 'filled': return { fill: `url(#${id}-hatch)`, stroke: PALETTE.filled };
    case 'missing': return { fill: `url(#${id}-dots)`, stroke: PALETTE.missing };
    case 'duplicated': return { fill: PALETTE.duplicated, stroke: PALETTE.ink };
    case 'overlap': return { fill: `url(#${id}-cross)`, stroke: PALETTE.overlap };
    case 'hole': return { fill: '#fff', stroke: PALETTE.hole };
    case 'outside': return { fill: PALETTE.barSoft, stroke: PALETTE.ink };
  }
}

/** The accessible SVG frame: scales to its container, title and summary as its text alternative. */
export function svgChart(f: ChartFrame, body: HtmlValue): SafeHtml {
  return html`<svg class="q-chart" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${f.width} ${f.height}" width="${f.width}" height="${f.height}" style="max-width:${f.width / 16}rem" role="img" aria-labelledby="${f.id}-t ${f.id}-d" data-chart="${f.id}"><title id="${f.id}-t">${f.title}</title><desc id="${f.id}-d">${f.summary}</desc>${patterns(f.id)}${body}</svg>`;
}

/** A left value axis with grid lines from a linear scale (`ticks` values from d3-scale). */
export function valueAxis(y: ScaleLinear<number, number>, left: number, right: number, format = formatNumber, integers = false): SafeHtml {
  // counts have no fractional ticks: a count axis up to 1 shows 0 and 1, not 0.2 … 0.8
  const ticks = y.ticks(4).filter((t) => Number.isInteger(t) || (!integers && Math.abs(y.domain()[1]) < 10));
  return html`<g class="q-axis" aria-hidden="true">${ticks.map(
    (t) => html`<line x1="${left}" x2="${right}" y1="${r1(y(t))}" y2="${r1(y(t))}" stroke-dasharray="${t === 0 ? '' : '2 3'}"/><text x="${left - 4}" y="${r1(y(t) + 3)}" text-anchor="end">${format(t)}</text>`,
  )}</g>`;
}

/** Labels under band centres, thinned so they never collide: every k-th label is kept. */
export function bandLabels(labels: readonly string[], centreAt: (i: number) => number, y: number, step: number, charPx = 6): SafeHtml {
  const longest = Math.max(1, ...labels.map((l) => Array.from(l).length));
  const every = Math.max(1, Math.ceil((longest * charPx + 8) / Math.max(1, step)));
  return html`<g class="q-axis" aria-hidden="true">${labels.map((l, i) =>
    i % every === 0 ? html`<text x="${r1(centreAt(i))}" y="${y}" text-anchor="middle">${l}</text>` : '',
  )}</g>`;
}

/** A small swatch (for legends) drawing one mark kind, with its own pattern definitions. */
function swatch(kind: MarkKind, id: string): SafeHtml {
  const s = markStyle(kind, id);
  const shape =
    kind === 'duplicated'
      ? html`<rect x="1" y="1" width="14" height="14" fill="${PALETTE.bar}"/><path d="M8 2L14 13H2Z" fill="${s.fill}" stroke="${s.stroke}"/>`
      : kind === 'hole'
        ? html`<rect x="1" y="4" width="14" height="8" fill="#fff" stroke="${s.stroke}" stroke-dasharray="2 2"/>`
        : html`<rect x="1" y="1" width="14" height="14" fill="${s.fill}" stroke="${s.stroke === 'none' ? PALETTE.bar : s.stroke}"/>`;
  return html`<svg viewBox="0 0 16 16" aria-hidden="true" focusable="false">${patterns(id)}${shape}</svg>`;
}

/** A legend naming each mark kind in words beside its swatch. */
export function legend(id: string, items: ReadonlyArray<readonly [MarkKind, string]>): SafeHtml {
  return html`<ul class="q-legend">${items.map(([kind, label]) => html`<li>${swatch(kind, `${id}-${kind}`)}${label}</li>`)}</ul>`;
}

/** A triangle marker (duplicated periods, overlaps) centred at (x, y). */
export function triangle(x: number, y: number, size: number, fill: string): SafeHtml {
  const h = size * 0.9;
  return html`<path d="M${r1(x)} ${r1(y - h / 2)}L${r1(x + size / 2)} ${r1(y + h / 2)}L${r1(x - size / 2)} ${r1(y + h / 2)}Z" fill="${fill}" stroke="${PALETTE.ink}" stroke-width="0.6"/>`;
}
