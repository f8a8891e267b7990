// Ranges on one shared axis, one lane per range, for one key. Overlaps are cross-hatched bands with a
// triangle marker; holes are white bands with a dashed outline and the word "hole". Closed ends are filled
// dots, open ends hollow dots (number-line notation); unbounded ends run to the edge as arrows.
import { scaleLinear, scaleUtc } from 'd3-scale';
import { html, type SafeHtml } from './escape.js';
import { markStyle, r1, svgChart, triangle } from './svg.js';
import { PALETTE } from './style.js';
import { formatNumber } from '../terminal.js';

export interface LaneRange {
  label: string;
  /** null: unbounded below. */
  low: number | null;
  /** null: unbounded above. */
  high: number | null;
  lowClosed?: boolean;
  highClosed?: boolean;
}

export interface LaneMark {
  kind: 'overlap' | 'hole';
  low: number;
  high: number;
}

export interface RangeLanesSpec {
  id: string;
  title: string;
  summary: string;
  ranges: readonly LaneRange[];
  marks: readonly LaneMark[];
  /** Tick and tooltip format; e.g. an ISO date for epoch-ms axes. */
  format?: (v: number) => string;
  /** Epoch-millisecond axis: calendar ticks (UTC) instead of round numbers. */
  time?: boolean;
  width?: number;
}

/** An SVG with one lane per range over a shared axis. */
export function rangeLanes(spec: RangeLanesSpec): SafeHtml {
  const width = spec.width ?? 680;
  const f = spec.format ?? formatNumber;
  const longest = Math.max(4, ...spec.ranges.map((r) => Array.from(r.label).length));
  const labelW = Math.min(Math.round(width * 0.35), Math.max(60, Math.round(longest * 6.3 + 12)));
  const lane = 20;
  const top = 6;
  const pad = 22; // room for unbounded ends
  const finite = [...spec.ranges.flatMap((r) => [r.low, r.high]), ...spec.marks.flatMap((m) => [m.low, m.high])].filter(
    (v): v is number => v !== null && Number.isFinite(v),
  );
  let lo = finite.length ? Math.min(...finite) : 0;
  let hi = finite.length ? Math.max(...finite) : 1;
  if (lo === hi) { lo -= 1; hi += 1; }
  // Unbounded ends run a tenth of the span past the last bound, so `85+` reads as a range, not a point.
  const span = hi - lo;
  if (spec.ranges.some((r) => r.low === null)) lo -= span / 10;
  if (spec.ranges.some((r) => r.high === null)) hi += span / 10;
  const range = [labelW + pad, width - pad - 8];
  const x = spec.time ? scaleUtc().domain([lo, hi]).range(range) : scaleLinear().domain([lo, hi]).range(range);
  const xs = (v: number) => x(v);
  const plotBottom = top + spec.ranges.length * lane;
  const bands = spec.marks.map((m) => {
    const s = markStyle(m.kind, spec.id);
    const x0 = xs(m.low);
    const w = Math.max(3, xs(m.high) - x0);
    const cx = x0 + w / 2;
    const tip = html`<title>${m.kind} from ${f(m.low)} to ${f(m.high)}</title>`;
    return m.kind === 'overlap'
      ? html`<g class="q-overlap"><rect x="${r1(x0)}" y="${top - 2}" width="${r1(w)}" height="${r1(plotBottom - top + 4)}" fill="${s.fill}" stroke="${s.stroke}" opacity="0.9"/>${triangle(cx, plotBottom + 9, 9, PALETTE.overlap)}${tip}</g>`
      : html`<g class="q-hole"><rect x="${r1(x0)}" y="${top - 2}" width="${r1(w)}" height="${r1(plotBottom - top + 4)}" fill="#fff" stroke="${s.stroke}" stroke-dasharray="3 2" stroke-width="1.2"/><text x="${r1(cx)}" y="${plotBottom + 14}" text-anchor="middle" fill="${PALETTE.hole}">hole</text>${tip}</g>`;
  });
  const lanes = spec.ranges.map((r, i) => {
    const y = top + i * lane + lane / 2;
    const x0 = r.low === null ? labelW + 4 : xs(r.low);
    const x1 = r.high === null ? width - 6 : xs(r.high);
    // Filled dot: the end belongs to the range; hollow: it does not; a plain tick when the caller did not say.
    const dot = (cx: number, closed: boolean | undefined) =>
      closed === undefined
        ? html`<line x1="${r1(cx)}" x2="${r1(cx)}" y1="${r1(y - 5)}" y2="${r1(y + 5)}" stroke="${PALETTE.bar}" stroke-width="2"/>`
        : html`<circle cx="${r1(cx)}" cy="${r1(y)}" r="3.6" fill="${closed ? PALETTE.bar : '#fff'}" stroke="${PALETTE.bar}" stroke-width="1.6"/>`;
    const arrow = (tip: number, dir: 1 | -1) => html`<path d="M${r1(tip)} ${r1(y)}l${-7 * dir} -5v10z" fill="${PALETTE.bar}"/>`;
    const name = `${r.label}: ${r.low === null ? 'unbounded' : f(r.low)} to ${r.high === null ? 'unbounded' : f(r.high)}`;
    return html`<g class="q-range"><text x="${labelW - 6}" y="${r1(y + 3.5)}" text-anchor="end">${r.label}</text><line x1="${r1(x0)}" x2="${r1(x1)}" y1="${r1(y)}" y2="${r1(y)}" stroke="${PALETTE.bar}" stroke-width="5" stroke-linecap="butt"/>${r.low === null ? arrow(x0, -1) : dot(x0, r.lowClosed)}${r.high === null ? arrow(x1, 1) : dot(x1, r.highClosed)}<title>${name}</title></g>`;
  });
  const ticks = (x.ticks(Math.max(2, Math.floor((width - labelW) / 90))) as Array<number | Date>).map((t) => Number(t));
  const axisY = plotBottom + 20;
  const axis = html`<g class="q-axis" aria-hidden="true"><line x1="${labelW + pad}" x2="${width - pad - 8}" y1="${axisY}" y2="${axisY}" stroke="#1d2433"/>${ticks.map(
    (t) => html`<line x1="${r1(xs(t))}" x2="${r1(xs(t))}" y1="${axisY}" y2="${axisY + 4}" stroke="#1d2433"/><text x="${r1(xs(t))}" y="${axisY + 15}" text-anchor="middle">${f(t)}</text>`,
  )}</g>`;
  const height = axisY + 22;
  return svgChart({ id: spec.id, width, height, title: spec.title, summary: spec.summary }, html`${bands}${lanes}${axis}`);
}
