// Compact text charts for human output: bars, period strips, sparklines, histograms and range axes.
// Pure functions returning strings (lines joined by '\n', no trailing newline). Colour (ANSI SGR) only
// when the caller passes `color: true`; every chart also reads without colour, through shapes and labels.

/** A row of a horizontal bar chart. `note` is printed after the value (e.g. 'filled'). */
export interface BarRow {
  label: string;
  value: number | null;
  note?: string;
}

export interface BarChartOptions {
  /** Total width in characters, labels and values included; default 60. */
  width?: number;
  color?: boolean;
  /** Formats a value; default: digits grouped by thousands, at most 3 significant decimals. */
  format?: (value: number) => string;
  /** Widest label before it is cut with '…'; default 24. */
  maxLabel?: number;
}

export type PeriodState = 'present' | 'missing' | 'duplicated';

export interface StripOptions {
  /** Cells per line; longer series are folded so each cell stands for several periods; default 60. */
  width?: number;
  color?: boolean;
  /** Append the legend line with counts; default true. */
  legend?: boolean;
}

export interface HistogramBin {
  low: number;
  high: number;
  count: number;
}

export interface HistogramOptions {
  /** Rows of bar height; default 5. */
  height?: number;
  color?: boolean;
  format?: (value: number) => string;
}

/** A range on a shared axis; `null` bounds are open (drawn to the edge with an arrow). */
export interface AxisRange {
  label: string;
  low: number | null;
  high: number | null;
}

/** A stretch of the axis to mark below the ranges: where ranges overlap or where none covers. */
export interface AxisMark {
  kind: 'overlap' | 'hole';
  low: number;
  high: number;
}

export interface RangeAxisOptions {
  /** Total width in characters; default 60. */
  width?: number;
  color?: boolean;
  marks?: readonly AxisMark[];
  format?: (value: number) => string;
  maxLabel?: number;
}

const SGR = { bar: '36', missing: '31', duplicated: '33', overlap: '35', hole: '31', dim: '2' } as const;
const EIGHTHS = ['', '▏', '▎', '▍', '▌', '▋', '▊', '▉'];
const LEVELS = ['▁', '▂', '▃', '▄', '▅', '▆', '▇', '█'];
/** Strip glyphs: shape alone tells the states apart, colour only adds to it. */
export const STRIP_GLYPHS: Readonly<Record<PeriodState, string>> = { present: '█', missing: '·', duplicated: '▲' };

function paint(text: string, code: string, color: boolean | undefined): string {
  return color && text !== '' ? `\u001b[${code}m${text}\u001b[0m` : text;
}

/**
 * Makes a value from the data safe to print on a terminal: control characters (which could move the
 * cursor or recolour the screen) and bidirectional overrides become visible placeholders.
 */
export function terminalSafe(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g, (ch) => {
    const code = ch.charCodeAt(0);
    if (code < 0x20) return String.fromCharCode(0x2400 + code); // Unicode control pictures
    return code === 0x7f ? '\u2421' : '\ufffd';
  });
}

/** Default number format: grouped integers, otherwise at most 3 significant decimals; no locale. */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return Number.isNaN(value) ? 'NaN' : value > 0 ? '∞' : '-∞';
  const digits = Math.abs(value) >= 100 || Number.isInteger(value) ? (Number.isInteger(value) ? 0 : 1) : 3;
  const fixed = Math.abs(value).toFixed(digits);
  const [int, frac] = fixed.split('.');
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const trimmed = frac === undefined ? '' : frac.replace(/0+$/, '');
  return `${value < 0 && Number(fixed) !== 0 ? '-' : ''}${grouped}${trimmed ? `.${trimmed}` : ''}`;
}

function chars(text: string): string[] {
  return Array.from(text);
}

function fit(text: string, width: number): string {
  const c = chars(terminalSafe(text));
  if (c.length <= width) return c.join('') + ' '.repeat(width - c.length);
  return `${c.slice(0, Math.max(0, width - 1)).join('')}…`;
}

function padStart(text: string, width: number): string {
  const n = chars(text).length;
  return n >= width ? text : ' '.repeat(width - n) + text;
}

/** A bar of `cells` character cells (fractional, in eighths). */
function bar(cells: number): string {
  const eighths = Math.max(0, Math.round(cells * 8));
  return '█'.repeat(Math.floor(eighths / 8)) + EIGHTHS[eighths % 8];
}

/**
 * Horizontal bars with labels and values, one row per line, in the caller's order. Negative values grow
 * left of a zero line; a null value prints '—' and no bar, so "no value" never looks like zero.
 */
export function barChart(rows: readonly BarRow[], options: BarChartOptions = {}): string {
  if (rows.length === 0) return '(no rows)';
  const format = options.format ?? formatNumber;
  const width = options.width ?? 60;
  const texts = rows.map((r) => (r.value === null || Number.isNaN(r.value) ? '—' : format(r.value)));
  const valueWidth = Math.max(...texts.map((t) => chars(t).length));
  const longest = Math.max(...rows.map((r) => chars(terminalSafe(r.label)).length));
  // Labels give way before bars do: a bar narrower than 4 cells says nothing.
  const labelWidth = Math.max(1, Math.min(options.maxLabel ?? 24, longest, width - valueWidth - 7));
  const barWidth = Math.max(4, width - labelWidth - valueWidth - 3);
  const finite = rows.map((r) => r.value).filter((v): v is number => v !== null && Number.isFinite(v));
  const lo = Math.min(0, ...finite);
  const hi = Math.max(0, ...finite);
  const span = hi - lo || 1;
  const cells = lo < 0 ? barWidth - 1 : barWidth; // room for the zero line
  const negCells = lo < 0 ? Math.round((-lo / span) * cells) : 0;
  const posCells = cells - negCells;
  return rows
    .map((r, i) => {
      const v = r.value;
      const len = v !== null && Number.isFinite(v) ? (Math.abs(v) / span) * cells : 0;
      // Leftward bars use whole cells: the eighth blocks are all left-aligned.
      const left = v !== null && v < 0 ? '█'.repeat(Math.min(negCells, Math.round(len))) : '';
      const right = v !== null && v > 0 ? bar(Math.min(len, posCells)) : '';
      const neg = negCells ? `${' '.repeat(Math.max(0, negCells - chars(left).length))}${paint(left, SGR.bar, options.color)}│` : '';
      const gap = ' '.repeat(Math.max(0, posCells - chars(right).length));
      const note = r.note ? `  ${paint(terminalSafe(r.note), SGR.dim, options.color)}` : '';
      const drawn = `${neg}${paint(right, SGR.bar, options.color)}${gap}`;
      return `${fit(r.label, labelWidth)} ${drawn} ${padStart(texts[i], valueWidth)}${note}`.trimEnd();
    })
    .join('\n');
}

/** Folds states into `width` cells: a cell shows missing if any period in it is missing, then duplicated. */
function foldStates(states: readonly PeriodState[], width: number): { cells: PeriodState[]; per: number } {
  const per = Math.max(1, Math.ceil(states.length / width));
  const cells: PeriodState[] = [];
  for (let i = 0; i < states.length; i += per) {
    const chunk = states.slice(i, i + per);
    cells.push(chunk.includes('missing') ? 'missing' : chunk.includes('duplicated') ? 'duplicated' : 'present');
  }
  return { cells, per };
}

/**
 * A strip of periods in order: █ present, · missing, ▲ duplicated, with a legend of counts. When there
 * are more periods than `width`, each cell stands for several periods and shows the worst of them.
 */
export function periodStrip(states: readonly PeriodState[], options: StripOptions = {}): string {
  const width = Math.max(1, options.width ?? 60);
  const { cells, per } = foldStates(states, width);
  const strip = cells.map((s) => (s === 'present' ? STRIP_GLYPHS[s] : paint(STRIP_GLYPHS[s], SGR[s], options.color))).join('');
  if (options.legend === false) return strip;
  const count = (s: PeriodState) => states.filter((x) => x === s).length;
  // A duplicated period is present too: the legend says "once" and "more than once" so its counts add up.
  const words: Record<PeriodState, string> = { present: 'once', missing: 'missing', duplicated: 'more than once' };
  const parts = (['present', 'missing', 'duplicated'] as const).map(
    (s) => `${paint(STRIP_GLYPHS[s], s === 'present' ? SGR.bar : SGR[s], options.color)} ${words[s]} ${formatNumber(count(s))}`,
  );
  const scale = per > 1 ? `  (1 cell = ${per} periods; a cell shows missing or duplicated if any of its periods is)` : '';
  return `${strip}\n${parts.join('  ')}${scale}`;
}

/** A one-line sparkline (▁…█) of a series; null or NaN prints a space. Longer series are averaged into `width` cells. */
export function sparkline(values: readonly (number | null)[], options: { width?: number; color?: boolean } = {}): string {
  const width = Math.max(1, options.width ?? values.length);
  const per = Math.max(1, Math.ceil(values.length / width));
  const cells: (number | null)[] = [];
  for (let i = 0; i < values.length; i += per) {
    const ok = values.slice(i, i + per).filter((v): v is number => v !== null && Number.isFinite(v));
    cells.push(ok.length ? ok.reduce((a, b) => a + b, 0) / ok.length : null);
  }
  const finite = cells.filter((v): v is number => v !== null);
  const lo = Math.min(...finite);
  const hi = Math.max(...finite);
  const line = cells
    .map((v) => (v === null ? ' ' : hi === lo ? LEVELS[3] : LEVELS[Math.min(7, Math.floor(((v - lo) / (hi - lo)) * 8))]))
    .join('');
  return paint(line, SGR.bar, options.color);
}

/**
 * A small vertical histogram: one column per bin, `height` rows of eighth-block cells, the largest count on
 * the top line and the lowest and highest edges beneath.
 */
export function histogram(bins: readonly HistogramBin[], options: HistogramOptions = {}): string {
  if (bins.length === 0) return '(no values)';
  const height = Math.max(1, options.height ?? 5);
  const format = options.format ?? formatNumber;
  const max = Math.max(...bins.map((b) => b.count));
  const lines: string[] = [];
  for (let row = height - 1; row >= 0; row--) {
    const line = bins
      .map((b) => {
        const eighths = max === 0 ? 0 : Math.round((b.count / max) * height * 8) - row * 8;
        if (eighths >= 8) return '█';
        if (eighths <= 0) return row === 0 && b.count > 0 ? '▁' : ' ';
        return LEVELS[eighths - 1];
      })
      .join('');
    lines.push(paint(line, SGR.bar, options.color) + (row === height - 1 ? ` ${formatNumber(max)}` : ''));
  }
  const low = format(bins[0].low);
  const high = format(bins[bins.length - 1].high);
  const gap = Math.max(1, bins.length - chars(low).length - chars(high).length);
  lines.push(`${low}${' '.repeat(gap)}${high}`);
  return lines.map((l) => l.trimEnd()).join('\n');
}

/**
 * Ranges drawn on one shared axis, one line each (├───┤; an open end runs to the edge as ◂ or ▸), then a line
 * marking overlaps (▲) and holes (·) passed in `marks`, then the axis extent. Marks of any positive length
 * take at least one cell, so a narrow hole never disappears.
 */
export function rangeAxis(ranges: readonly AxisRange[], options: RangeAxisOptions = {}): string {
  if (ranges.length === 0) return '(no ranges)';
  const format = options.format ?? formatNumber;
  const marks = options.marks ?? [];
  const bounds = [...ranges.flatMap((r) => [r.low, r.high]), ...marks.flatMap((m) => [m.low, m.high])].filter(
    (v): v is number => v !== null && Number.isFinite(v),
  );
  const min = bounds.length ? Math.min(...bounds) : 0;
  const max = bounds.length ? Math.max(...bounds) : 1;
  const labelWidth = Math.min(options.maxLabel ?? 16, Math.max(7, ...ranges.map((r) => chars(terminalSafe(r.label)).length)));
  const cells = Math.max(8, (options.width ?? 60) - labelWidth - 1);
  // Open ends need room beyond the last finite bound, so `85+` reads as a range and not as a point.
  const padLow = ranges.some((r) => r.low === null) ? 3 : 0;
  const padHigh = ranges.some((r) => r.high === null) ? 3 : 0;
  const inner = cells - padLow - padHigh;
  const at = (v: number) => padLow + (max === min ? 0 : Math.round(((v - min) / (max - min)) * (inner - 1)));
  const lines = ranges.map((r) => {
    const a = r.low === null ? 0 : at(r.low);
    const b = r.high === null ? cells - 1 : Math.max(a, at(r.high));
    const row = Array<string>(cells).fill(' ');
    for (let i = a; i <= b; i++) row[i] = '─';
    row[a] = r.low === null ? '◂' : '├';
    row[b] = r.high === null ? '▸' : a === b ? '┼' : '┤';
    return `${fit(r.label, labelWidth)} ${paint(row.join(''), SGR.bar, options.color)}`.trimEnd();
  });
  if (marks.length) {
    const row = Array<string>(cells).fill(' ');
    for (const m of marks) {
      const a = at(m.low);
      const b = Math.max(a, at(m.high) - (at(m.high) > a ? 1 : 0));
      for (let i = a; i <= b; i++) row[i] = paint(m.kind === 'overlap' ? '▲' : '·', SGR[m.kind], options.color);
    }
    lines.push(`${fit('marks', labelWidth)} ${row.join('')}`.trimEnd());
  }
  const lowText = format(min);
  const highText = format(max);
  const axis = `${lowText}${' '.repeat(Math.max(1, inner - chars(lowText).length - chars(highText).length))}${highText}`;
  lines.push(`${' '.repeat(labelWidth + padLow)} ${axis}`);
  if (marks.length) lines.push(`${' '.repeat(labelWidth)} ▲ overlap  · hole`);
  return lines.join('\n');
}
