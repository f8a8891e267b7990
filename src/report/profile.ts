// Text rendering of a table profile: the shape in a sentence, then one line per column (level, role,
// distinct, empty, reason), and the time columns' grain findings in brief.
import { formatDiagnostic } from '../errors.js';
import type { ProfileReport } from '../profile/types.js';
import { bold, wrap, type TextOptions } from './grain.js';
import { terminalSafe } from './terminal.js';

function pad(s: string, n: number): string {
  return s.length >= n ? s : s + ' '.repeat(n - s.length);
}

function num(n: number, exact = true): string {
  return `${exact ? '' : '≈'}${n.toLocaleString('en-US')}`;
}

/** "1 row", "13,513 rows". */
function plural(n: number, noun: string): string {
  return `${num(n)} ${noun}${n === 1 ? '' : 's'}`;
}

/** The human output of `quern profile`. */
export function renderProfileText(report: ProfileReport, options: TextOptions = {}): string {
  const width = Math.max(60, options.width ?? 100);
  const out: string[] = [];
  const rejected = report.rejectedRows > 0 ? ` (${num(report.rejectedRows)} rejected by the reader)` : '';
  const cols = report.columns.length;
  out.push(`${terminalSafe(report.file)}: ${plural(report.rows, 'row')}${rejected}, ${plural(cols, 'column')}`);
  for (const d of report.rejectedExamples ?? []) out.push(`  ${terminalSafe(formatDiagnostic(d))}`);
  const s = report.shape;
  const kind = s.kind === 'aggregated' ? `aggregated, key ${s.key.join(' × ')}` : `items${s.key.length ? `, key ${s.key.join(' × ')}` : ''}`;
  out.push(wrap(`Shape: ${kind} — ${terminalSafe(s.reason)}.`, width, '  ', ''));
  if (s.alternatives.length) out.push(`  Also unique: ${s.alternatives.map((a) => a.join(' × ')).join('; ')}.`);
  out.push('');
  const nameW = Math.min(24, Math.max(6, ...report.columns.map((c) => c.name.length)));
  const header = `${pad('column', nameW)}  ${pad('level', 12)}  ${pad('role', 18)}  ${pad('distinct', 9)}  ${pad('empty', 6)}  reason`;
  out.push(bold(header, options.color));
  for (const c of report.columns) {
    const name = terminalSafe(c.name.length > nameW ? `${c.name.slice(0, nameW - 1)}…` : c.name);
    const lead = `${pad(name, nameW)}  ${pad(c.level, 12)}  ${pad(c.role, 18)}  ${pad(num(c.distinct, c.distinctExact), 9)}  ${pad(num(c.empty), 6)}  `;
    out.push(`${lead}${terminalSafe(c.reason)}`);
  }
  const times = report.columns.filter((c) => c.grain);
  if (times.length) {
    out.push('');
    out.push('Time columns (quern grain tells more):');
    for (const c of times) {
      const g = c.grain!;
      const grainLine = g.findings.find((f) => /so this column holds/.test(f));
      const zoneLine = g.findings.find((f) => /^(The written offsets|Every value is written|Read in)/.test(f));
      out.push(wrap(terminalSafe(`${c.name}: ${grainLine ?? g.levelReason}`), width, '    ', '  • '));
      if (zoneLine && g.zoneFinding.basis !== 'none') out.push(wrap(terminalSafe(zoneLine), width, '    ', '    '));
    }
  }
  return `${out.join('\n')}\n`;
}
