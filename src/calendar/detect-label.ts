// Which unit a period label's notation names (for look-ups of a label of any unit).
import type { UnitName } from './types.js';

/** The unit (and step, for start/duration labels) that a label's notation names, or null. */
export interface LabelNotation {
  unit: UnitName;
  step: number;
  /** For start/duration week labels: the ISO weekday of the start date, a natural week start. */
  startDate?: string;
}

const Y = '(?:\\d{4}|[+-]\\d{6})';
const DATE = `${Y}-\\d{2}-\\d{2}`;

const SIMPLE: Array<[RegExp, UnitName]> = [
  [new RegExp(`^FY${Y}-Q\\d$`, 'i'), 'fiscal-quarter'],
  [new RegExp(`^FY${Y}-M\\d{1,2}$`, 'i'), 'fiscal-month'],
  [new RegExp(`^FY${Y}$`, 'i'), 'fiscal-year'],
  [new RegExp(`^${Y}-EW\\d{2}$`, 'i'), 'epi-week'],
  [new RegExp(`^${Y}-W\\d{2}$`, 'i'), 'iso-week'],
  [new RegExp(`^${Y}-Q\\d$`, 'i'), 'quarter'],
  [new RegExp(`^${Y}-H\\d$`, 'i'), 'half'],
  [new RegExp(`^${Y}-\\d{2}$`), 'month'],
  [new RegExp(`^${Y}$`), 'year'],
  [new RegExp(`^${DATE}$`), 'day'],
];

const DATE_DURATION = new RegExp(`^(${DATE})/P(\\d+)([DWMY])$`, 'i');
const TIME_DURATION = new RegExp(`^${DATE}T[0-9:.]+(?:Z|[+-]\\d{2}:\\d{2}(?::\\d{2})?)/PT(\\d+(?:\\.\\d+)?)([HMS])$`, 'i');

/** Reads the notation of `text` (trimmed): '2024-EW07' → epi-week, 'FY2024-Q1' → fiscal-quarter, … */
export function detectLabelNotation(text: string): LabelNotation | null {
  for (const [re, unit] of SIMPLE) if (re.test(text)) return { unit, step: 1 };
  const d = DATE_DURATION.exec(text);
  if (d) {
    const n = Number(d[2]);
    const letter = d[3]!.toUpperCase();
    if (letter === 'D') return { unit: 'day', step: n };
    if (letter === 'W') return { unit: 'week', step: n, startDate: d[1]! };
    if (letter === 'Y') return { unit: 'year', step: n };
    return { unit: 'month', step: n };
  }
  const t = TIME_DURATION.exec(text);
  if (t) {
    const letter = t[2]!.toUpperCase();
    const n = Number(t[1]);
    if (letter === 'H') return { unit: 'hour', step: n };
    if (letter === 'M') return { unit: 'minute', step: n };
    return Number.isInteger(n) ? { unit: 'second', step: n } : { unit: 'millisecond', step: Math.round(n * 1000) };
  }
  return null;
}
