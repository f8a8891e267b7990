// Text rendering of a grain report: one block per date-like column, a title line, then each finding as a
// plain sentence, wrapped to the terminal width.
import { formatDiagnostic } from '../errors.js';
import type { ColumnGrain, GrainReport } from '../grain/types.js';
import { grainWords } from '../grain/words.js';
import { terminalSafe } from './terminal.js';

export interface TextOptions {
  /** Wrap width in characters; default 100. */
  width?: number;
  /** ANSI bold for titles (only on a terminal without NO_COLOR). */
  color?: boolean;
}

/** Wraps `text` to `width` columns, indenting every line by `indent` (the first by `first`). */
export function wrap(text: string, width: number, indent: string, first = indent): string {
  const words = text.split(/ +/);
  const lines: string[] = [];
  let line = first;
  let fresh = true;
  for (const w of words) {
    if (!fresh && line.length + 1 + w.length > width) {
      lines.push(line);
      line = indent + w;
    } else {
      line += (fresh ? '' : ' ') + w;
    }
    fresh = false;
  }
  lines.push(line);
  return lines.join('\n');
}

export function bold(text: string, color: boolean | undefined): string {
  return color ? `\u001b[1m${text}\u001b[0m` : text;
}

function title(c: ColumnGrain): string {
  const parts = [c.grain ? grainWords(c.grain) : 'no grain', c.level ?? 'no level'];
  parts.push(c.zone === null ? 'no zone' : `zone ${c.zone}`);
  return parts.join(' · ');
}

/** The human output of `quern grain`. */
export function renderGrainText(report: GrainReport, options: TextOptions = {}): string {
  const width = Math.max(40, options.width ?? 100);
  const n = report.columns.length;
  const skipped = report.skipped.map((s) => terminalSafe(s.name));
  const rejected = report.rejectedRows > 0 ? ` (${report.rejectedRows.toLocaleString('en-US')} rejected by the reader, so no column counts them)` : '';
  const head = `${terminalSafe(report.file)}: ${report.rows.toLocaleString('en-US')} rows${rejected}; ${n} date-like ${n === 1 ? 'column' : 'columns'}`
    + (skipped.length ? ` (not date-like: ${skipped.join(', ')})` : '');
  const out = [wrap(head, width, '  ', '')];
  for (const d of report.rejectedExamples ?? []) out.push(`  ${terminalSafe(formatDiagnostic(d))}`);
  if (n === 0) out.push('No column holds dates, date-times or periods that quern can read.');
  for (const c of report.columns) {
    out.push('');
    out.push(`${bold(terminalSafe(c.name), options.color)} — ${title(c)}`);
    for (const f of c.findings) out.push(wrap(terminalSafe(f), width, '    ', '  • '));
  }
  return `${out.join('\n')}\n`;
}
