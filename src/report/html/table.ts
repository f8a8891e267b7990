// Tables of the numbers behind every chart: a caption, header cells with scope, right-aligned numbers.
import { dataText, html, type HtmlValue, SafeHtml } from './escape.js';
import { formatNumber } from '../terminal.js';

export interface TableColumn {
  label: string;
  /** Right-align and use tabular figures. */
  numeric?: boolean;
}

/** A cell: numbers are formatted, strings are shown as inert data text, SafeHtml is kept. */
export type TableCell = string | number | null | SafeHtml;

export interface TableSpec {
  caption: string;
  columns: readonly TableColumn[];
  rows: ReadonlyArray<readonly TableCell[]>;
  /** Rows to highlight (e.g. filled or missing periods); highlighted rows also carry a text marker. */
  flagged?: (rowIndex: number) => boolean;
  /** Label for the scrollable region (defaults to the caption). */
  regionLabel?: string;
}

function cell(value: TableCell): HtmlValue {
  if (value === null) return html`<span aria-label="no value">—</span>`;
  if (typeof value === 'number') return formatNumber(value);
  if (value instanceof SafeHtml) return value;
  return dataText(value);
}

/**
 * A data table in a keyboard-scrollable box; the first column is a row header. Print CSS drops the
 * box so every row prints.
 */
export function dataTable(spec: TableSpec): SafeHtml {
  const head = spec.columns.map((c) => html`<th scope="col"${c.numeric ? html` class="q-n"` : ''}>${c.label}</th>`);
  const body = spec.rows.map((row, r) => {
    const flag = spec.flagged?.(r) ?? false;
    const cells = row.map((v, i) => {
      const num = spec.columns[i]?.numeric ? html` class="q-n"` : '';
      return i === 0 ? html`<th scope="row"${num}>${cell(v)}</th>` : html`<td${num}>${cell(v)}</td>`;
    });
    return html`<tr${flag ? html` class="q-flag"` : ''}>${cells}</tr>`;
  });
  return html`<div class="q-table-box" role="region" tabindex="0" aria-label="${spec.regionLabel ?? spec.caption}"><table class="q-table"><caption>${spec.caption}</caption><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table></div>`;
}

/** Layout of a figure: chart beside its table (default), or stacked in a compact tile of a grid. */
export type FigureLayout = 'beside' | 'stacked';

/** A figure: a chart (or several) with its caption and the table of its numbers beside (or under) it. */
export function figure(caption: HtmlValue, chart: HtmlValue, table: HtmlValue, layout: FigureLayout = 'beside'): SafeHtml {
  const cap = caption === '' || caption === null || caption === undefined ? '' : html`<figcaption>${caption}</figcaption>`;
  return html`<figure class="q-figure${layout === 'stacked' ? ' q-stacked' : ''}">${cap}<div>${chart}</div>${table}</figure>`;
}

/** Figures laid out as tiles of a grid (each stacked: chart over a short table). */
export function tiles(figures: readonly HtmlValue[]): SafeHtml {
  return html`<div class="q-tiles">${figures}</div>`;
}
