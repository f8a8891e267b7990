// Renderings of a gaps result: a compact strip per series (present and missing periods at a glance), the
// missing runs and duplicates in words, and the JSON document. No domain rules here.
import { formatDiagnostic } from '../errors.js';
import type { GapSeries, GapsResult, InstantGapReport, MissingRun } from '../gaps/types.js';
import type { PeriodState } from './terminal.js';
import { formatNumber, periodStrip, terminalSafe } from './terminal.js';

/** How many runs and duplicates to list per series before "… and N more". */
const LIST = 8;

const PLURAL: Record<string, string> = {
  millisecond: 'milliseconds', second: 'seconds', minute: 'minutes', hour: 'hours', day: 'days', week: 'weeks',
  'iso-week': 'weeks', 'epi-week': 'weeks', month: 'months', quarter: 'quarters', half: 'halves', year: 'years',
  'fiscal-year': 'fiscal years', 'fiscal-quarter': 'fiscal quarters', 'fiscal-month': 'fiscal months',
};

/** "3 weeks", "1 day", "24 periods of 15 minutes". */
export function periodsWords(n: number, unit: string | null, step: number): string {
  const plural = PLURAL[unit ?? ''] ?? 'periods';
  if (step !== 1) return `${formatNumber(n)} ${n === 1 ? 'period' : 'periods'} of ${step} ${plural}${clockWords(n * step, unit)}`;
  if (n === 1) return `1 ${plural.endsWith('ves') ? 'half' : plural.replace(/s$/, '')}`;
  return `${formatNumber(n)} ${plural}`;
}

const UNIT_SECONDS: Record<string, number> = { second: 1, minute: 60, hour: 3600 };

// " (9 h)", " (1 d 6 h)" for runs of clock units; '' otherwise.
function clockWords(units: number, unit: string | null): string {
  const s = UNIT_SECONDS[unit ?? ''];
  if (s === undefined) return '';
  const total = units * s;
  const d = Math.floor(total / 86_400);
  const h = Math.floor((total % 86_400) / 3600);
  const m = Math.floor((total % 3600) / 60);
  const parts = [d ? `${d} d` : '', h ? `${h} h` : '', m ? `${m} min` : ''].filter(Boolean);
  return parts.length ? ` (${parts.join(' ')})` : '';
}

/** `2021-W14 … 2021-W16, 3 weeks` (one period: `2021-W14, 1 week`). */
export function runWords(r: MissingRun, unit: string | null, step: number): string {
  const span = r.from === r.to ? r.from : `${r.from} … ${r.to}`;
  return `${terminalSafe(span)}, ${periodsWords(r.periods, unit, step)}`;
}

/** The states of a series' expected periods in order, for the strip. */
export function seriesStates(s: GapSeries): PeriodState[] {
  const states: PeriodState[] = new Array<PeriodState>(s.expected).fill('present');
  for (const r of s.missing) for (let i = 0; i < r.periods; i++) states[r.index + i] = 'missing';
  for (const d of s.duplicates) states[d.index] = 'duplicated';
  return states;
}

function percent(x: number): string {
  const p = x * 100;
  return `${p === 100 || p === 0 ? p.toFixed(0) : p > 99.9 ? p.toFixed(2) : p.toFixed(1)}%`;
}

function periodSeries(s: GapSeries, r: GapsResult, color: boolean, width: number): string[] {
  const lines = [`${s.key === '' ? '(all rows)' : terminalSafe(s.key)}: ${s.first ?? '—'} … ${s.last ?? '—'}, ` +
    `${formatNumber(s.present)} of ${formatNumber(s.expected)} expected periods present (coverage ${percent(s.coverage)}), ${formatNumber(s.rows)} rows`];
  if (s.expected > 0) lines.push(...periodStrip(seriesStates(s), { width, color }).split('\n').map((l) => `  ${l}`));
  s.missing.slice(0, LIST).forEach((m) => lines.push(`  missing ${runWords(m, r.unit, r.step)}${m === s.longestGap && s.missing.length > 1 ? '  (longest)' : ''}`));
  if (s.missing.length > LIST) lines.push(`  … and ${formatNumber(s.missing.length - LIST)} more missing runs (see --json)`);
  s.duplicates.slice(0, LIST).forEach((d) => lines.push(`  duplicated ${terminalSafe(d.period)}: ${formatNumber(d.count)} rows`));
  if (s.duplicates.length > LIST) lines.push(`  … and ${formatNumber(s.duplicates.length - LIST)} more duplicated periods (see --json)`);
  if (r.duplicatesReported && s.duplicates.length > 0 && s.duplicates.length * 2 > s.present) {
    lines.push('  note: most periods hold several rows, as in an event log; pass --no-duplicates to report missing periods only');
  }
  if (s.unexpected > 0) lines.push(`  ${formatNumber(s.unexpected)} periods hold rows although the calendar skips them (weekends or listed dates)`);
  return lines;
}

function instantSeries(s: GapSeries, r: GapsResult): string[] {
  const gaps = s.gaps ?? [];
  const lines = [`${s.key === '' ? '(all rows)' : terminalSafe(s.key)}: ${s.first ?? '—'} … ${s.last ?? '—'}, ${formatNumber(s.rows)} rows, ` +
    `${formatNumber(gaps.length)} ${gaps.length === 1 ? 'gap' : 'gaps'} longer than ${r.maxGap}`];
  const longest = s.longestGap as InstantGapReport | null;
  gaps.slice(0, LIST).forEach((g) => lines.push(`  gap ${g.from} → ${g.to}, ${g.length}${g === longest && gaps.length > 1 ? '  (longest)' : ''}`));
  if (gaps.length > LIST) lines.push(`  … and ${formatNumber(gaps.length - LIST)} more gaps (see --json)`);
  return lines;
}

/** The human report: one block per series with its strip, then the row accounting. */
export function gapsText(r: GapsResult, options: { color?: boolean; width?: number } = {}): string {
  const unit = r.unit === null ? 'instants' : r.step === 1 ? `${r.unit} periods` : `${r.step}-${r.unit} periods`;
  const skips = [r.weekdays ? 'Monday–Friday only' : '', r.skippedDates > 0 ? `${formatNumber(r.skippedDates)} listed dates skipped` : ''].filter(Boolean).join(', ');
  const lines = [`${unit} in ${r.zone} (${r.unitBasis})${skips ? `; ${skips}` : ''}`];
  for (const s of r.series) {
    lines.push('');
    lines.push(...(r.unit === null ? instantSeries(s, r) : periodSeries(s, r, options.color ?? false, options.width ?? 60)));
  }
  const m = r.summary;
  lines.push('');
  lines.push(`${formatNumber(m.rowsRead)} rows read: ${formatNumber(m.rowsUsed)} used, ${formatNumber(m.rowsEmpty)} with an empty time, ` +
    `${formatNumber(m.rowsRejected)} rejected${Object.keys(m.rejectedByReason).length ? ` (${Object.entries(m.rejectedByReason).map(([k, v]) => `${k} ${v}`).join(', ')})` : ''}` +
    (m.rowsOutside > 0 ? `, ${formatNumber(m.rowsOutside)} outside --from/--until` : ''));
  for (const d of m.examples) lines.push(`  ${terminalSafe(formatDiagnostic(d))}`);
  if (m.localTime.nonexistent + m.localTime.repeated > 0) {
    lines.push(`local times: ${m.localTime.nonexistent} skipped by a clock change (moved forward), ${m.localTime.repeated} repeated (earlier instant taken)`);
  }
  const withGaps = r.series.filter((s) => s.missing.length > 0 || (s.gaps?.length ?? 0) > 0).length;
  const withDups = r.series.filter((s) => s.duplicates.length > 0).length;
  const of = (n: number) => `${formatNumber(n)} of ${formatNumber(r.series.length)} series`;
  lines.push(r.problems
    ? `result: ${[withGaps ? `gaps in ${of(withGaps)}` : '', withDups ? `duplicates in ${of(withDups)}` : ''].filter(Boolean).join(', ')}`
    : `result: no gaps${r.duplicatesReported ? ', no duplicates' : ''}`);
  return `${lines.join('\n')}\n`;
}

/** The JSON document: `{ unit, series: [ { key, first, last, expected, present, missing, duplicates, coverage } ] }` and more. */
export function gapsJson(r: GapsResult): string {
  return `${JSON.stringify(r, null, 2)}\n`;
}
