// HTML report of `quern grain`: for each date-like column, the grain found and the evidence behind it — how
// the values fall over time of day, day of month, month of year and weekday — and the zone's offsets across
// the years the data covers.
import type { ColumnGrain, GrainReport } from '../../grain/types.js';
import { formatNumber } from '../terminal.js';
import { share } from './common.js';
import { type CycleCounts, cycleFigures } from './cycles.js';
import { html, makeId, type SafeHtml } from './escape.js';
import { renderPage, section } from './page.js';
import { dataTable, type TableCell } from './table.js';
import { zoneYearFigure } from './zone-year.js';

export interface GrainReportOptions {
  version?: string;
  /** Cycle counts per column name, when the result does not carry them itself (`distribution`). */
  cycles?: Readonly<Record<string, CycleCounts>>;
}

/** A column as the report reads it: the grain result, with cycle counts when the engine provides them. */
type ColumnWithCycles = ColumnGrain & { distribution?: CycleCounts | null };

function grainText(c: ColumnGrain): string {
  const g = c.grain;
  if (!g) return 'no grain found';
  const step = g.step === 1 ? '' : `${g.step} `;
  const anchor = g.anchor === 'end' ? ', values mark period ends' : '';
  return `${step}${g.unit}${anchor}`;
}

function badge(mark: string, label: string, value: string): SafeHtml {
  return html`<li class="q-badge" data-mark="${mark}"><span>${label}: </span><b>${value}</b></li>`;
}

function factsTable(c: ColumnGrain): SafeHtml {
  const v = c.values;
  const total = v.parsed + v.empty + v.invalid;
  const rows: Array<readonly [string, TableCell]> = [
    ['format', c.formatLabel],
    ['why this format', c.formatEvidence],
    ['ambiguous between', c.ambiguity ? c.ambiguity.join('; ') : null],
    ['values parsed', `${formatNumber(v.parsed)} (${share(v.parsed, total) ?? '—'})`],
    ['empty', formatNumber(v.empty)],
    ['invalid', formatNumber(v.invalid)],
    ['on the grain', c.coverage ? `${formatNumber(c.coverage.onGrain)} (${share(c.coverage.onGrain, v.parsed) ?? '—'}); ${formatNumber(c.coverage.exceptions)} exceptions` : null],
    ['level', c.level ? `${c.level}: ${c.levelReason}` : c.levelReason],
    ['cadence', c.cadence ? `${c.cadence.kind}${c.cadence.every ? ` every ${c.cadence.every} ${c.cadence.unit}` : ''}` : null],
    ['distinct periods', c.cadence ? `${formatNumber(c.cadence.distinct)}${c.cadence.distinctExact ? '' : ' (estimate)'}` : null],
    ['missing periods', c.cadence ? c.cadence.missing : null],
    ['periods with several rows', c.cadence ? c.cadence.repeated : null],
    ['first value', c.first],
    ['last value', c.last],
  ];
  return dataTable({ caption: `What quern found in ${c.name}`, columns: [{ label: 'finding' }, { label: 'value' }], rows: rows.filter(([, x]) => x !== null) });
}

function examplesTable(caption: string, examples: ReadonlyArray<{ line: number; value: string; reason?: string }>): SafeHtml | '' {
  if (examples.length === 0) return '';
  return dataTable({
    caption,
    columns: [{ label: 'line', numeric: true }, { label: 'value' }, { label: 'why' }],
    rows: examples.map((e) => [e.line, e.value, e.reason ?? null]),
  });
}

function yearOf(text: string | null): number | null {
  const m = text ? /^([+-]?\d{4,6})/.exec(text) : null;
  return m ? Number(m[1]) : null;
}

function columnSection(c: ColumnWithCycles, options: GrainReportOptions): SafeHtml {
  const id = makeId('grain', c.name);
  const z = c.zoneFinding;
  const cycles = c.distribution ?? options.cycles?.[c.name] ?? null;
  const badges = html`<ul class="q-badges">${badge('▦', 'grain', grainText(c))}${c.level ? badge('◆', 'level', c.level) : ''}${badge('◷', 'zone', z.zone ? `${z.zone} (${z.basis})` : 'none written')}${c.cadence ? badge('↻', 'cadence', c.cadence.kind) : ''}</ul>`;
  const findings = c.findings.length ? html`<ul>${c.findings.map((f) => html`<li>${f}</li>`)}</ul>` : '';
  const evidence = cycles
    ? html`<h3>How the values fall over the calendar</h3><p>Counted on the wall clock of ${z.zone ?? 'the values as written'}: a column of days sits at 00:00, a column of months on day 1${cycles.lastDayOfMonth ? html` (here ${formatNumber(cycles.lastDayOfMonth)} rows fall on the last day of their month)` : ''}, a column of quarters in four months.</p>${cycleFigures(id, c.name, cycles)}`
    : html`<p class="q-note">This result carries no counts by time of day, day of month, month or weekday.</p>`;
  const y0 = yearOf(c.first);
  const y1 = yearOf(c.last) ?? y0;
  const zoneFig = z.zone && y0 !== null && y1 !== null ? zoneYearFigure(`${id}-zone`, z.zone, y0, y1, z.offsets) : null;
  const alternatives = z.alternatives.length ? html`<p>Other zones that fit these values equally well: ${z.alternatives.join(', ')}.</p>` : '';
  return section(
    c.name,
    badges,
    findings,
    factsTable(c),
    evidence,
    zoneFig ? html`<h3>The zone across the year</h3>${zoneFig}${alternatives}` : '',
    examplesTable('Values off the grain (first few)', c.coverage?.examples ?? []),
    examplesTable('Invalid values (first few)', c.invalidExamples),
  );
}

/** Renders a grain result as a complete HTML page. */
export function renderGrainReport(report: GrainReport, options: GrainReportOptions = {}): string {
  const skipped = report.skipped.length
    ? section(
        'Columns that are not dates',
        dataTable({ caption: 'Skipped columns', columns: [{ label: 'column' }, { label: 'why' }], rows: report.skipped.map((s) => [s.name, s.reason]) }),
      )
    : '';
  const summary = report.columns.map((c) => `${c.name}: ${grainText(c)}`).join('; ');
  return renderPage({
    command: 'grain',
    title: `${report.file}: the grain of its date columns`,
    lede: report.columns.length
      ? html`What each date column really holds — ${summary} — and the evidence: where its values fall in the day, the month, the year and the week.`
      : html`No column of this table holds dates or times.`,
    facts: [
      ['Rows read', formatNumber(report.rows)],
      ['Rows rejected', formatNumber((report as { rejectedRows?: number }).rejectedRows ?? 0)],
      ['Date columns', formatNumber(report.columns.length)],
      ['Other columns', formatNumber(report.skipped.length)],
    ],
    body: html`${report.columns.map((c) => columnSection(c as ColumnWithCycles, options))}${skipped}`,
    version: options.version,
  });
}
