// Format inference for ISO 8601 values: which ISO shapes a sample holds, and the Unicode pattern of the
// most common one. The ISO parser reads every ISO shape; the chosen id names the dominant one.
import { DateForm, type Scan, newScan } from './scan.js';
import { scanIso, skipBlanks, trimEnd } from './iso.js';
import { type TimeFormat, type TimeFormatId, timeFormat } from './format.js';
import type { Candidate } from './infer-types.js';

/** The format id of one scanned ISO value. */
function isoIdOf(sc: Scan): TimeFormatId {
  if (sc.timeMs >= 0) {
    const off = sc.offset === sc.offset;
    if (sc.basic) return off ? 'iso-basic-date-time-offset' : 'iso-basic-date-time';
    return off ? 'iso-date-time-offset' : 'iso-date-time';
  }
  switch (sc.dateForm) {
    case DateForm.Year: return 'iso-year';
    case DateForm.YearMonth: return 'iso-year-month';
    case DateForm.Week: return 'iso-week';
    case DateForm.WeekDate: return 'iso-week-date';
    case DateForm.Ordinal: return 'iso-ordinal-date';
    default: return sc.basic ? 'iso-basic-date' : 'iso-date';
  }
}

function datePattern(sc: Scan): string {
  const b = sc.basic;
  switch (sc.dateForm) {
    case DateForm.WeekDate: return b ? "YYYY'W'wwe" : "YYYY-'W'ww-e";
    case DateForm.Ordinal: return b ? 'yyyyDDD' : 'yyyy-DDD';
    default: return b ? 'yyyyMMdd' : 'yyyy-MM-dd';
  }
}

/** Unicode (UTS #35) pattern of a scanned ISO date-time: date, separator, precision, fraction, offset. */
export function isoPattern(sc: Scan): string | null {
  if (sc.timeMs < 0) return null;
  const colon = sc.basic ? '' : ':';
  let p = datePattern(sc) + (sc.sep === 32 ? ' ' : "'T'") + 'HH';
  if (sc.precision >= 2) p += `${colon}mm`;
  if (sc.precision >= 3) p += `${colon}ss`;
  if (sc.fracDigits > 0) p += `.${'S'.repeat(Math.min(sc.fracDigits, 9))}`;
  if (sc.offsetForm === 1) p += 'X';
  else if (sc.offsetForm === 2) p += 'X';
  else if (sc.offsetForm === 3) p += sc.basic ? 'XX' : 'XXX';
  return p;
}

const SHAPE_WORDS: Partial<Record<TimeFormatId, string>> = {
  'iso-date-time-offset': 'date-times with an offset',
  'iso-date-time': 'date-times without an offset',
  'iso-basic-date-time-offset': 'basic date-times with an offset',
  'iso-basic-date-time': 'basic date-times without an offset',
  'iso-date': 'dates',
  'iso-basic-date': 'basic dates (YYYYMMDD)',
  'iso-week-date': 'week dates',
  'iso-week': 'weeks',
  'iso-ordinal-date': 'ordinal dates',
  'iso-year-month': 'year-months',
  'iso-year': 'years',
};

/** True when four-digit years alone look like years rather than codes: 1800–2200, or a column named for years. */
function plausibleYears(values: readonly string[], columnName: string | undefined): boolean {
  if (columnName !== undefined && /year|yr/i.test(columnName)) return true;
  for (const v of values) {
    const y = Number(v.trim());
    if (!(y >= 1800 && y <= 2200)) return false;
  }
  return true;
}

/** Counts the ISO 8601 shapes in the sample; returns the candidate for the dominant shape, or null. */
export function inferIso(values: readonly string[], columnName: string | undefined): Candidate | null {
  const sc = newScan();
  const counts = new Map<TimeFormatId, number>();
  const patterns = new Map<TimeFormatId, Map<string, number>>();
  let matched = 0;
  for (const v of values) {
    const i = skipBlanks(v, 0, v.length);
    if (scanIso(v, i, trimEnd(v, i, v.length), sc) !== null) continue;
    matched++;
    const id = isoIdOf(sc);
    counts.set(id, (counts.get(id) ?? 0) + 1);
    const p = isoPattern(sc);
    if (p !== null) {
      const m = patterns.get(id) ?? new Map<string, number>();
      m.set(p, (m.get(p) ?? 0) + 1);
      patterns.set(id, m);
    }
  }
  if (matched === 0) return null;
  const ranked = [...counts.entries()].sort((a, b) => b[1] - a[1]);
  const [topId, topCount] = ranked[0]!;
  if (topId === 'iso-year' && (ranked.length === 1 || topCount === matched) && !plausibleYears(values, columnName)) return null;
  const extra: Partial<TimeFormat> = {};
  const pats = patterns.get(topId);
  if (pats !== undefined) extra.pattern = [...pats.entries()].sort((a, b) => b[1] - a[1])[0]![0];
  const format = timeFormat(topId, extra);
  const parts = ranked.map(([id, n]) => `${SHAPE_WORDS[id] ?? id} (${n})`);
  const evidence = ranked.length === 1
    ? `${matched} of ${values.length} values are ISO 8601 ${SHAPE_WORDS[topId] ?? topId}`
    : `${matched} of ${values.length} values are ISO 8601 — ${parts.join(', ')}; the column is read as ${format.label}, and each value keeps its own kind`;
  return { format, matched, evidence };
}
