// A step line over time (d3-shape, curveStepAfter): a value that holds until it changes, such as a zone's
// UTC offset across a year. Each change is marked with a dot and labelled with its date.
import { scaleLinear, scaleUtc } from 'd3-scale';
import { curveStepAfter, line } from 'd3-shape';
import { html, type SafeHtml, trusted } from './escape.js';
import { r1, svgChart } from './svg.js';
import { PALETTE } from './style.js';

export interface StepPoint {
  /** Epoch milliseconds from which `value` holds. */
  at: number;
  value: number;
  /** Text beside the change (e.g. '2024-03-10 −05:00'). */
  label?: string;
}

export interface StepLineSpec {
  id: string;
  title: string;
  summary: string;
  /** Points in time order; the last value holds until `end`. */
  points: readonly StepPoint[];
  end: number;
  formatValue: (v: number) => string;
  formatTime: (ms: number) => string;
  width?: number;
  height?: number;
}

/** An SVG step line with labelled changes. */
export function stepLine(spec: StepLineSpec): SafeHtml {
  const width = spec.width ?? 560;
  const height = spec.height ?? 150;
  const m = { top: 22, right: 16, bottom: 28, left: 64 };
  const pts = spec.points;
  const start = pts.length ? pts[0].at : spec.end - 1;
  const x = scaleUtc().domain([start, spec.end]).range([m.left, width - m.right]);
  const values = pts.map((p) => p.value);
  const vlo = Math.min(...values);
  const vhi = Math.max(...values);
  const y = scaleLinear().domain(vlo === vhi ? [vlo - 60, vhi + 60] : [vlo - (vhi - vlo) * 0.4, vhi + (vhi - vlo) * 0.4]).range([height - m.bottom, m.top]);
  const data: Array<[number, number]> = pts.map((p) => [x(p.at), y(p.value)]);
  if (pts.length) data.push([x(spec.end), y(pts[pts.length - 1].value)]);
  const d = line().curve(curveStepAfter)(data) ?? '';
  const levels = [...new Set(values)].sort((a, b) => a - b);
  const yAxis = levels.map((v) => html`<line x1="${m.left}" x2="${width - m.right}" y1="${r1(y(v))}" y2="${r1(y(v))}" stroke-dasharray="2 3"/><text x="${m.left - 6}" y="${r1(y(v) + 3)}" text-anchor="end">${spec.formatValue(v)}</text>`);
  const ticks = x.ticks(6).map((t) => Number(t));
  const xAxis = ticks.map((t) => html`<text x="${r1(x(t))}" y="${height - 10}" text-anchor="middle">${spec.formatTime(t)}</text>`);
  const changes = pts.slice(1).map((p, i) => {
    const cx = x(p.at);
    const anchor = cx > width - 120 ? 'end' : 'start';
    return html`<circle cx="${r1(cx)}" cy="${r1(y(p.value))}" r="4" fill="#fff" stroke="${PALETTE.ink}" stroke-width="1.5"/><text x="${r1(cx + (anchor === 'start' ? 6 : -6))}" y="${r1(y(p.value) - 7 - (i % 2) * 0)}" text-anchor="${anchor}">${p.label ?? ''}</text>`;
  });
  const body = html`<g class="q-axis" aria-hidden="true">${yAxis}${xAxis}</g><path d="${trusted(d)}" fill="none" stroke="${PALETTE.bar}" stroke-width="2.5"/>${changes}`;
  return svgChart({ id: spec.id, width, height, title: spec.title, summary: spec.summary }, body);
}
