// Pieces every report shares: the row accounting (every input row is used, empty or rejected), the
// first rejected rows with line and reason, and plain-words notes.
import type { Diagnostic } from '../../errors.js';
import { formatNumber } from '../terminal.js';
import { html, type SafeHtml } from './escape.js';
import { hbarChart } from './hbars.js';
import { dataTable, figure } from './table.js';

/** One line of the row accounting. */
export interface AccountLine {
  label: string;
  rows: number;
}

/**
 * The row accounting as bars with a table: the lines should add up to `rowsRead`; when they do not, the
 * report says so plainly rather than hiding the difference.
 */
export function accountingFigure(id: string, rowsRead: number, lines: readonly AccountLine[]): SafeHtml {
  const sum = lines.reduce((a, l) => a + l.rows, 0);
  const chart = hbarChart({
    id,
    title: 'Where every row went',
    valueLabel: 'rows',
    total: rowsRead,
    data: lines.map((l) => ({ label: l.label, value: l.rows })),
    summary: `Of ${formatNumber(rowsRead)} rows read: ${lines.map((l) => `${formatNumber(l.rows)} ${l.label}`).join(', ')}.`,
  });
  const table = dataTable({
    caption: 'Row accounting',
    columns: [{ label: 'rows' }, { label: 'count', numeric: true }, { label: 'share', numeric: true }],
    rows: [
      ...lines.map((l) => [l.label, l.rows, share(l.rows, rowsRead)] as const),
      ['read (total)', rowsRead, share(rowsRead, rowsRead)] as const,
    ],
  });
  const check =
    sum === rowsRead
      ? html`The lines add up to the ${formatNumber(rowsRead)} rows read.`
      : html`<span class="q-warn">The lines add up to ${formatNumber(sum)}, not to the ${formatNumber(rowsRead)} rows read.</span>`;
  return figure(html`<b>Row accounting.</b> ${check}`, chart, table);
}

/** A share as a percentage with one decimal always (so a column of shares lines up), or null when the whole is zero. */
export function share(part: number, whole: number): string | null {
  return whole > 0 ? `${((part / whole) * 100).toFixed(1)}%` : null;
}

/** The first rejected rows: file, line, column, value (as inert text) and reason. */
export function diagnosticsTable(examples: readonly Diagnostic[], caption = 'First rejected rows'): SafeHtml | '' {
  if (examples.length === 0) return '';
  return dataTable({
    caption,
    columns: [{ label: 'line', numeric: true }, { label: 'column' }, { label: 'value' }, { label: 'code' }, { label: 'reason' }],
    rows: examples.map((d) => [d.line, d.column ?? null, d.value ?? null, d.code, d.message]),
  });
}

/** Plain-words notes as a list (escaped). */
export function notesList(notes: readonly string[]): SafeHtml | '' {
  if (notes.length === 0) return '';
  return html`<ul class="q-notes">${notes.map((n) => html`<li>${n}</li>`)}</ul>`;
}

/** Counts by reason as "reason: n" pieces. */
export function reasons(byReason: Record<string, number>): string {
  const parts = Object.entries(byReason).map(([k, v]) => `${k}: ${formatNumber(v)}`);
  return parts.length ? parts.join(', ') : 'none';
}
