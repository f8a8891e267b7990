// The catalogue of time-value formats a column can be written in: stable ids, plain-words labels, the
// Unicode date pattern where one applies (UTS #35 date field symbols), and what kind of value each names.
import type { UnitName, FiscalStart } from '../calendar/types.js';
import type { TimeKind } from './types.js';

/** Stable ids of every format quern reads. Printed in reports and accepted back on the command line. */
export type TimeFormatId =
  | 'iso-date-time-offset' // 2021-04-05T13:30:00+02:00, …Z
  | 'iso-date-time' // 2021-04-05T13:30:00 (no offset: a wall-clock reading)
  | 'iso-date' // 2021-04-05
  | 'iso-basic-date-time-offset' // 20210405T133000Z
  | 'iso-basic-date-time' // 20210405T1330
  | 'iso-basic-date' // 20210405
  | 'iso-week-date' // 2021-W14-3
  | 'iso-week' // 2021-W14
  | 'iso-ordinal-date' // 2021-095
  | 'iso-year-month' // 2021-04
  | 'iso-year' // 2021
  | 'iso-interval' // 2021-04-05/2021-04-12, 2021-04-05/P1W
  | 'quarter' // 2021-Q2, 2021Q2, Q2 2021
  | 'half' // 2021-H1
  | 'fiscal-year' // FY2022
  | 'epi-week' // 2024-EW07
  | 'month-name-year' // Apr 2021, April 2021
  | 'month-name-day-year' // April 5, 2021
  | 'day-month-name-year' // 5 Apr 2021, 05-Apr-21 (two-digit years only with a pivot)
  | 'day-month-year' // 05/04/2021, 05.04.2021, 05-04-2021 read day first
  | 'month-day-year' // 04/05/2021 read month first
  | 'year-month-day' // 2021/04/05, 2021.04.05
  | 'epoch-seconds'
  | 'epoch-milliseconds'
  | 'epoch-microseconds'
  | 'epoch-nanoseconds'
  | 'epoch-auto' // epoch numbers whose unit is told per value by its digit count (only when asked for)
  | 'serial-1900' // spreadsheet serial day numbers, ECMA-376 1900 date system (1900-01-01 = 1)
  | 'serial-1904'; // spreadsheet serial day numbers, ECMA-376 1904 date system (1904-01-01 = 0)

/** Units of epoch numbers. */
export type EpochUnit = 's' | 'ms' | 'us' | 'ns';

/** A column's format: what `inferTimeFormat` chooses and `makeTimeParser` compiles. */
export interface TimeFormat {
  id: TimeFormatId;
  /** Plain words, e.g. "ISO 8601 date-time with offset", "day/month/year (DD/MM/YYYY)". */
  label: string;
  /** Unicode (UTS #35) date pattern of the form seen, e.g. "dd/MM/yyyy"; null where none applies. */
  pattern: string | null;
  /** What the values are: instants (offset written), local wall-clock readings, or named periods. */
  kind: TimeKind;
  /** For period formats: the unit the notation names ('day', 'month', 'quarter', …); else null. */
  unit: UnitName | null;
  /** Separator between numeric day, month and year fields ('/', '.', '-'), where the format has one. */
  separator?: string;
  /** Unit of epoch numbers ('auto' only for 'epoch-auto'). */
  epochUnit?: EpochUnit | 'auto';
  /** First year of the 100-year window two-digit years are read in (1950 reads 49 as 2049, 50 as 1950). */
  twoDigitYearPivot?: number;
  /** Fiscal-year convention for 'fiscal-year' labels (default: US federal, starts October 1, named by end year). */
  fiscalStart?: FiscalStart;
  fiscalLabel?: 'end' | 'start';
}

interface FormatInfo {
  label: string;
  pattern: string | null;
  kind: TimeKind;
  unit: UnitName | null;
}

const INFO: Record<TimeFormatId, FormatInfo> = {
  'iso-date-time-offset': { label: 'ISO 8601 date-time with offset', pattern: "yyyy-MM-dd'T'HH:mm:ssXXX", kind: 'instant', unit: null },
  'iso-date-time': { label: 'ISO 8601 local date-time (no offset)', pattern: "yyyy-MM-dd'T'HH:mm:ss", kind: 'local', unit: null },
  'iso-date': { label: 'ISO 8601 calendar date (YYYY-MM-DD)', pattern: 'yyyy-MM-dd', kind: 'period', unit: 'day' },
  'iso-basic-date-time-offset': { label: 'ISO 8601 basic date-time with offset', pattern: "yyyyMMdd'T'HHmmssXX", kind: 'instant', unit: null },
  'iso-basic-date-time': { label: 'ISO 8601 basic local date-time', pattern: "yyyyMMdd'T'HHmmss", kind: 'local', unit: null },
  'iso-basic-date': { label: 'ISO 8601 basic calendar date (YYYYMMDD)', pattern: 'yyyyMMdd', kind: 'period', unit: 'day' },
  'iso-week-date': { label: 'ISO 8601 week date (YYYY-Www-D)', pattern: "YYYY-'W'ww-e", kind: 'period', unit: 'day' },
  'iso-week': { label: 'ISO 8601 week (YYYY-Www)', pattern: "YYYY-'W'ww", kind: 'period', unit: 'iso-week' },
  'iso-ordinal-date': { label: 'ISO 8601 ordinal date (YYYY-DDD)', pattern: 'yyyy-DDD', kind: 'period', unit: 'day' },
  'iso-year-month': { label: 'ISO 8601 year and month (YYYY-MM)', pattern: 'yyyy-MM', kind: 'period', unit: 'month' },
  'iso-year': { label: 'ISO 8601 year (YYYY)', pattern: 'yyyy', kind: 'period', unit: 'year' },
  'iso-interval': { label: 'ISO 8601 time interval (start/end or start/duration)', pattern: null, kind: 'period', unit: null },
  quarter: { label: 'quarter (YYYY-Qn)', pattern: "yyyy-'Q'Q", kind: 'period', unit: 'quarter' },
  half: { label: 'half-year (YYYY-Hn)', pattern: null, kind: 'period', unit: 'half' },
  'fiscal-year': { label: 'fiscal year (FYYYYY)', pattern: null, kind: 'period', unit: 'fiscal-year' },
  'epi-week': { label: 'epidemiological week (YYYY-EWww)', pattern: null, kind: 'period', unit: 'epi-week' },
  'month-name-year': { label: 'English month name and year (Apr 2021)', pattern: 'MMM yyyy', kind: 'period', unit: 'month' },
  'month-name-day-year': { label: 'English month name, day, year (April 5, 2021)', pattern: 'MMMM d, yyyy', kind: 'period', unit: 'day' },
  'day-month-name-year': { label: 'day, English month name, year (5 Apr 2021)', pattern: 'd MMM yyyy', kind: 'period', unit: 'day' },
  'day-month-year': { label: 'day/month/year (DD/MM/YYYY)', pattern: 'dd/MM/yyyy', kind: 'period', unit: 'day' },
  'month-day-year': { label: 'month/day/year (MM/DD/YYYY)', pattern: 'MM/dd/yyyy', kind: 'period', unit: 'day' },
  'year-month-day': { label: 'year/month/day (YYYY/MM/DD)', pattern: 'yyyy/MM/dd', kind: 'period', unit: 'day' },
  'epoch-seconds': { label: 'Unix epoch seconds', pattern: null, kind: 'instant', unit: null },
  'epoch-milliseconds': { label: 'Unix epoch milliseconds', pattern: null, kind: 'instant', unit: null },
  'epoch-microseconds': { label: 'Unix epoch microseconds', pattern: null, kind: 'instant', unit: null },
  'epoch-nanoseconds': { label: 'Unix epoch nanoseconds', pattern: null, kind: 'instant', unit: null },
  'epoch-auto': { label: 'Unix epoch number, unit told per value by its digit count', pattern: null, kind: 'instant', unit: null },
  'serial-1900': { label: 'spreadsheet serial day number, 1900 date system (ECMA-376)', pattern: null, kind: 'local', unit: null },
  'serial-1904': { label: 'spreadsheet serial day number, 1904 date system (ECMA-376)', pattern: null, kind: 'local', unit: null },
};

/** Every format id, in catalogue order. */
export const TIME_FORMAT_IDS: readonly TimeFormatId[] = Object.keys(INFO) as TimeFormatId[];

/** True when `id` is a known format id. */
export function isTimeFormatId(id: string): id is TimeFormatId {
  return Object.prototype.hasOwnProperty.call(INFO, id);
}

/** The catalogue entry of a format id as a fresh TimeFormat, with `extra` fields (separator, pattern…) laid over it. */
export function timeFormat(id: TimeFormatId, extra: Partial<Omit<TimeFormat, 'id'>> = {}): TimeFormat {
  const info = INFO[id];
  const base: TimeFormat = { id, label: info.label, pattern: info.pattern, kind: info.kind, unit: info.unit };
  if (id.startsWith('epoch-') && id !== 'epoch-auto') base.epochUnit = EPOCH_UNIT_OF[id] ?? 's';
  if (id === 'epoch-auto') base.epochUnit = 'auto';
  return { ...base, ...extra };
}

const EPOCH_UNIT_OF: Partial<Record<TimeFormatId, EpochUnit>> = {
  'epoch-seconds': 's',
  'epoch-milliseconds': 'ms',
  'epoch-microseconds': 'us',
  'epoch-nanoseconds': 'ns',
};

/** The epoch format id of a unit. */
export function epochFormatId(unit: EpochUnit): TimeFormatId {
  return unit === 's' ? 'epoch-seconds' : unit === 'ms' ? 'epoch-milliseconds' : unit === 'us' ? 'epoch-microseconds' : 'epoch-nanoseconds';
}
