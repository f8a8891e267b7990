// Text rendering of a period look-up (`quern period`): label, bounds, length, numbered parts and the
// convention in force. No calendar rules here: every value comes from the PeriodLookup.
import type { PeriodLookup } from '../calendar/lookup.js';
import { terminalSafe } from './terminal.js';

const WEEKDAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];
const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

const PLURALS: Record<string, string> = {
  'iso-week': 'ISO weeks', 'epi-week': 'epidemiological weeks', half: 'halves', 'fiscal-year': 'fiscal years',
  'fiscal-quarter': 'fiscal quarters', 'fiscal-month': 'fiscal months',
};

function weekdayOf(date: string): string {
  const d = new Date(`${date}T00:00:00Z`).getUTCDay();
  return WEEKDAYS[(d + 6) % 7]!;
}

function longDate(date: string): string {
  const [y, m, d] = date.split('-').map(Number);
  return `${weekdayOf(date)} ${d} ${MONTHS[m! - 1]} ${y}`;
}

function fiscalWords(r: PeriodLookup): string {
  const f = r.fiscalStart!;
  const naming = r.fiscalLabel === 'start' ? 'named by the year it starts' : 'named by the year it ends';
  return `fiscal year starting ${f.day} ${MONTHS[f.month - 1]}, ${naming}`;
}

/** One line saying what the period is: "epidemiological week 1 of 2025", "March 2024", … */
export function describePeriod(r: PeriodLookup): string {
  const p = r.parts;
  if (r.step !== 1) return `${r.step} ${PLURALS[r.unit] ?? `${r.unit}s`} starting ${r.dates === null ? r.start : longDate(r.firstDate)}`;
  switch (r.unit) {
    case 'day': return r.lengthMs === 0 ? `${longDate(r.label)}, a date this zone skipped` : longDate(r.firstDate);
    case 'week': return `week starting ${longDate(r.firstDate)} (week ${p.week} of ${p.year} counting the week holding 4 January as week 1)`;
    case 'iso-week': return `ISO week ${p.week} of ${p.year}, Monday to Sunday`;
    case 'epi-week': return `epidemiological week ${p.week} of ${p.year}, Sunday to Saturday`;
    case 'month': return `${MONTHS[p.month! - 1]} ${p.year}`;
    case 'quarter': return `quarter ${p.quarter} of ${p.year}`;
    case 'half': return `half ${p.half} of ${p.year}`;
    case 'year': return `the year ${p.year}`;
    case 'fiscal-year': return `fiscal year ${p.year} (${fiscalWords(r)})`;
    case 'fiscal-quarter': return `quarter ${p.quarter} of fiscal year ${p.year} (${fiscalWords(r)})`;
    case 'fiscal-month': return `month ${p.month} of fiscal year ${p.year} (${fiscalWords(r)})`;
    default: return `${r.unit} starting ${r.start}`;
  }
}

/** The rule behind a week or fiscal unit, with the standard it comes from. */
export function conventionLine(r: PeriodLookup): string | null {
  switch (r.unit) {
    case 'iso-week': return 'ISO 8601 weeks: Monday to Sunday; week 1 holds 4 January (the first Thursday).';
    case 'epi-week': return 'Epidemiological (CDC MMWR) weeks: Sunday to Saturday; week 1 is the first week with at least four days in the year.';
    case 'week': return `Weeks start on ${WEEKDAYS[(r.weekStart ?? 1) - 1]}.`;
    case 'fiscal-year': case 'fiscal-quarter': case 'fiscal-month': {
      const f = r.fiscalStart!;
      return `Fiscal year starts ${f.day} ${MONTHS[f.month - 1]} (--fiscal-start ${String(f.month).padStart(2, '0')}-${String(f.day).padStart(2, '0')}), ${r.fiscalLabel === 'start' ? 'named by the calendar year in which it starts' : 'named by the calendar year in which it ends'}.`;
    }
    default: return null;
  }
}

function partsLine(r: PeriodLookup): string {
  const order: Array<keyof PeriodLookup['parts']> = ['year', 'half', 'quarter', 'month', 'week', 'day', 'hour', 'minute', 'second'];
  return order.filter((k) => r.parts[k] !== undefined).map((k) => `${k} ${r.parts[k]}`).join(' · ');
}

/** Renders a look-up for the terminal; `color` bolds the label. */
export function renderPeriodText(r: PeriodLookup, options: { color?: boolean } = {}): string {
  const bold = (s: string) => (options.color ? `\u001b[1m${s}\u001b[22m` : s);
  const dateUnit = r.dates !== null;
  const lines = [`${bold(terminalSafe(r.label))}  ${describePeriod(r)}`];
  if (r.lengthMs === 0) {
    lines.push(`  start   ${r.start}`);
    lines.push(`  end     ${r.end}  (the same instant: the period is empty)`);
  } else {
    lines.push(`  start   ${r.start}${dateUnit ? `  (${weekdayOf(r.firstDate)} ${r.firstDate})` : ''}`);
    lines.push(`  end     ${r.end}  (exclusive${dateUnit ? `; last day ${weekdayOf(r.lastDate)} ${r.lastDate}` : ''})`);
  }
  lines.push(`  length  ${r.length}`);
  lines.push(`  zone    ${r.zone}`);
  lines.push(`  parts   ${partsLine(r)}`);
  const rule = conventionLine(r);
  if (rule !== null) lines.push(`  rule    ${rule}`);
  for (const n of r.notes) lines.push(`  note    ${terminalSafe(n)}`);
  if (rule !== null) {
    lines.push('Caution: week and fiscal-year conventions differ between authorities; confirm against your reporting authority\'s calendar.');
  }
  return `${lines.join('\n')}\n`;
}
