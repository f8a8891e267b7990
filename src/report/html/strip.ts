// A period grid: the periods of a series in order, wrapped `perRow` to a line (96 quarter-hours a day, 12
// months a year…) or, as a calendar, flowing down columns of 7 weekdays. Each period is present, missing
// or duplicated; runs of one state merge into one shape to keep the file small. Missing runs are dotted
// with a red outline; duplicated periods are amber with a triangle: shape and pattern tell the states apart
// without colour. A margin at the end of each line counts its missing (·) and duplicated (▲) periods.
import { html, type SafeHtml, trusted } from './escape.js';
import { markStyle, r1, svgChart } from './svg.js';
import { PALETTE } from './style.js';
import { formatNumber, type PeriodState } from '../terminal.js';

export interface GridCell {
  label: string;
  state: PeriodState;
  /** Rows in the period (shown in tooltips). */
  count?: number;
}

export interface PeriodGridSpec {
  id: string;
  title: string;
  summary?: string;
  cells: readonly GridCell[];
  /** Cells per line (per column with `flow: 'columns'`). */
  perRow: number;
  /** 'rows' (default): lines left to right, top to bottom; 'columns': a calendar, columns of `perRow`. */
  flow?: 'rows' | 'columns';
  /** Blank cells before the first one, to align a calendar (e.g. a first day that is a Wednesday). */
  lead?: number;
  /** Label of each line (rows flow) or column (columns flow); default from its first cell's label. */
  lineLabel?: (line: number, first: GridCell | undefined) => string;
  /** Labels across the lines: over the columns (rows flow) or beside the rows (columns flow), thinned. */
  crossLabels?: readonly string[];
  width?: number;
}

/** Summary: how many periods in each state, and how many runs of missing ones. */
export function gridSummary(spec: PeriodGridSpec): string {
  const c = spec.cells;
  if (c.length === 0) return `${spec.title}: no periods.`;
  const n = (s: PeriodState) => c.filter((x) => x.state === s).length;
  let runs = 0;
  for (let i = 0; i < c.length; i++) if (c[i].state === 'missing' && (i === 0 || c[i - 1].state !== 'missing')) runs++;
  return `${spec.title}: ${formatNumber(c.length)} periods from ${c[0].label} to ${c[c.length - 1].label}; ${formatNumber(n('present'))} present, ${formatNumber(n('missing'))} missing in ${formatNumber(runs)} run${runs === 1 ? '' : 's'}, ${formatNumber(n('duplicated'))} duplicated.`;
}

interface Geometry {
  /** Top-left of a (line, position) slot and the slot size along and across the flow. */
  x(line: number, pos: number): number;
  y(line: number, pos: number): number;
  along: number;
  across: number;
  columns: boolean;
}

/** An SVG period grid. */
export function periodGrid(spec: PeriodGridSpec): SafeHtml {
  const width = spec.width ?? 720;
  const per = Math.max(1, spec.perRow);
  const lead = Math.max(0, Math.min(per - 1, spec.lead ?? 0));
  const lines = Math.ceil((spec.cells.length + lead) / per);
  const columns = spec.flow === 'columns';
  const labelW = columns ? 40 : 92;
  const marginW = 56;
  const top = columns ? 16 : spec.crossLabels ? 16 : 4;
  const inner = width - labelW - marginW;
  const slot = columns ? Math.min(18, inner / Math.max(1, lines)) : inner / per;
  const across = columns ? slot : Math.max(8, Math.min(18, slot));
  const g: Geometry = columns
    ? { x: (l) => labelW + l * slot, y: (_, p) => top + p * (slot + 1), along: slot + 1, across: slot, columns }
    : { x: (_, p) => labelW + p * slot, y: (l) => top + l * (across + 2), along: slot, across, columns };
  const height = columns ? top + per * (slot + 1) + 8 : top + lines * (across + 2) + 4;
  const parts: SafeHtml[] = [];
  let lastLabel = '';
  // Lines thinner than the text: label every k-th line and every line that holds a mark, and drop the
  // regular labels next to a marked line so they never overprint it.
  const every = columns ? 1 : Math.ceil(12 / (across + 2));
  const marked = new Set<number>();
  spec.cells.forEach((c, i) => { if (c.state !== 'present') marked.add(Math.floor((i + lead) / per)); });
  const near = (l: number) => { for (let d = 1; d < every; d++) if (marked.has(l - d) || marked.has(l + d)) return true; return false; };
  for (let l = 0; l < lines; l++) {
    const firstIdx = Math.max(0, l * per - lead);
    const label = spec.lineLabel ? spec.lineLabel(l, spec.cells[firstIdx]) : (spec.cells[firstIdx]?.label ?? '');
    let missing = 0;
    let dup = 0;
    let pos = l === 0 ? lead : 0;
    let i = l * per + pos - lead;
    while (pos < per && i < spec.cells.length) {
      const state = spec.cells[i].state;
      let len = 1;
      while (pos + len < per && i + len < spec.cells.length && spec.cells[i + len].state === state) len++;
      if (state === 'missing') missing += len;
      if (state === 'duplicated') dup += len;
      parts.push(runShape(spec, g, state, l, pos, len, i));
      pos += len;
      i += len;
    }
    if (columns) {
      if (label !== lastLabel && label !== '') parts.push(html`<text x="${r1(g.x(l, 0))}" y="11" class="q-axis-t">${label}</text>`);
      lastLabel = label;
    } else {
      const cy = r1(g.y(l, 0) + across / 2 + 3.5);
      if (missing || dup || (l % every === 0 && !near(l))) parts.push(html`<text x="${labelW - 5}" y="${cy}" text-anchor="end"${missing || dup ? html` font-weight="bold"` : ''}>${label}</text>`);
      const note = [missing ? `·${formatNumber(missing)}` : '', dup ? `▲${formatNumber(dup)}` : ''].filter(Boolean).join(' ');
      if (note) parts.push(html`<text x="${width - marginW + 5}" y="${cy}" fill="${missing ? PALETTE.missing : PALETTE.ink}">${note}</text>`);
    }
  }
  const cross = spec.crossLabels ?? [];
  const crossEvery = columns ? 1 : Math.max(1, Math.ceil((Math.max(1, ...cross.map((c) => c.length)) * 6 + 4) / slot));
  const crossText = cross.map((c, p) => {
    if (c === '' || p % crossEvery !== 0) return '';
    return columns
      ? html`<text x="${labelW - 5}" y="${r1(g.y(0, p) + slot / 2 + 3.5)}" text-anchor="end">${c}</text>`
      : html`<text x="${r1(labelW + p * slot + slot / 2)}" y="11" text-anchor="middle">${c}</text>`;
  });
  const body = html`<g class="q-axis" aria-hidden="true">${crossText}</g>${parts}`;
  return svgChart({ id: spec.id, width, height, title: spec.title, summary: spec.summary ?? gridSummary(spec) }, body);
}

function runShape(spec: PeriodGridSpec, g: Geometry, state: PeriodState, line: number, pos: number, len: number, first: number): SafeHtml {
  const x = g.x(line, pos);
  const y = g.y(line, pos);
  const gap = g.along > 4 ? 1 : 0;
  const w = g.columns ? g.across : Math.max(0.8, len * g.along - gap);
  const h = g.columns ? Math.max(0.8, len * g.along - gap) : g.across;
  const a = spec.cells[first];
  const b = spec.cells[first + len - 1];
  const what = len === 1 ? a.label : `${a.label} to ${b.label} (${len})`;
  const rows = len === 1 && a.count !== undefined ? `, ${formatNumber(a.count)} rows` : '';
  const tip = html`<title>${what}: ${state}${rows}</title>`;
  const box = `x="${r1(x)}" y="${r1(y)}" width="${r1(w)}" height="${r1(h)}"`;
  if (state === 'present') return html`<rect ${trusted(box)} fill="${PALETTE.bar}" class="q-present">${tip}</rect>`;
  const s = markStyle(state, spec.id);
  if (state === 'missing') return html`<rect ${trusted(box)} fill="${s.fill}" stroke="${s.stroke}" stroke-width="1.4" class="q-missing">${tip}</rect>`;
  // One path holds every triangle of the run (one per cell when cells are wide enough, else one).
  const size = Math.max(5, Math.min(g.across - 2, 11));
  const each = g.along >= 7;
  let d = '';
  for (let k = 0; k < (each ? len : 1); k++) {
    const cx = g.columns ? x + g.across / 2 : each ? x + k * g.along + g.along / 2 : x + w / 2;
    const cy = g.columns ? (each ? y + k * g.along + g.along / 2 : y + h / 2) : y + g.across / 2;
    d += `M${r1(cx)} ${r1(cy - size / 2)}l${r1(size / 2)} ${r1(size * 0.9)}h${r1(-size)}z`;
  }
  return html`<g class="q-duplicated"><rect ${trusted(box)} fill="#fff3d6" stroke="${s.fill}" stroke-width="1.2"/><path d="${trusted(d)}" fill="${PALETTE.duplicated}" stroke="${PALETTE.ink}" stroke-width="0.5"/>${tip}</g>`;
}
