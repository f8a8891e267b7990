// The finest clock unit a time value's text writes: 'second' for 2024-03-05T08:15:00Z, 'minute' for
// 08:15, 'hour' for 2024-03-05T08Z or epoch seconds. Grain detection takes it as the notation's floor for
// instants and wall-clock readings, as it takes 'day' for 2024-03-05: a value written to the second is
// never reported as finer than seconds, however few values there are.
import type { UnitName } from '../calendar/types.js';
import { type NumericOrder, newNumericFields, parseNumericDateInto } from './daymonth.js';
import { type TimeFormat } from './format.js';
import { scanIso, skipBlanks, trimEnd } from './iso.js';
import { fastIso } from './iso-fast.js';
import { makeMonthNameParser } from './monthname.js';
import { countDigits, newScan, type Scan } from './scan.js';
import { emptyParsedTime } from './types.js';

/** A clock unit a notation can stop at; 'millisecond' stands for any decimal fraction (the finest grain tested). */
export type ClockUnit = Extract<UnitName, 'hour' | 'minute' | 'second' | 'millisecond'>;

/** Reads the clock unit of one value's text; null when it writes no time of day or it cannot be read. */
export type WrittenUnitReader = (text: string) => ClockUnit | null;

function unitOfScan(sc: Scan): ClockUnit | null {
  if (sc.timeMs < 0 || sc.precision === 0) return null;
  if (sc.fracDigits > 0) return 'millisecond';
  return sc.precision === 1 ? 'hour' : sc.precision === 2 ? 'minute' : 'second';
}

/** Epoch numbers: whole seconds write seconds; a fraction of a second, or any finer unit, writes milliseconds. */
function epochUnit(format: TimeFormat): WrittenUnitReader {
  return (text) => {
    const i = skipBlanks(text, 0, text.length);
    const end = trimEnd(text, i, text.length);
    if (i === end) return null;
    const sign = text.charCodeAt(i) === 45 || text.charCodeAt(i) === 43 ? 1 : 0;
    const n = countDigits(text, i + sign, end);
    if (n === 0) return null;
    const whole = i + sign + n === end;
    let unit = format.epochUnit;
    if (unit === 'auto') {
      let z = i + sign;
      while (z < i + sign + n - 1 && text.charCodeAt(z) === 48) z++;
      const digits = i + sign + n - z;
      unit = digits === 9 || digits === 10 ? 's' : 'ms';
    }
    return unit === 's' && whole ? 'second' : 'millisecond';
  };
}

/**
 * Compiles a reader of the clock unit each value of `format` writes. Formats that write no clock time
 * (dates, weeks, quarters, intervals) and spreadsheet serial numbers (whose fraction of a day has no unit)
 * read as null for every value.
 */
export function makeWrittenUnitReader(format: TimeFormat): WrittenUnitReader {
  const id = format.id;
  const sc = newScan();
  const out = emptyParsedTime();
  if (id.startsWith('iso-') && id !== 'iso-interval') {
    return (text) => {
      // The fast lane's shapes write whole seconds, with a fraction when a decimal sign follows them.
      if (fastIso(text, out)) {
        const c = text.charCodeAt(19);
        return out.kind === 'period' ? null : c === 46 || c === 44 ? 'millisecond' : 'second';
      }
      const start = skipBlanks(text, 0, text.length);
      const end = trimEnd(text, start, text.length);
      return start < end && scanIso(text, start, end, sc) === null ? unitOfScan(sc) : null;
    };
  }
  if (id.startsWith('epoch-')) return epochUnit(format);
  if (id === 'day-month-year' || id === 'month-day-year' || id === 'year-month-day') {
    const order: NumericOrder = id === 'day-month-year' ? 'dmy' : id === 'month-day-year' ? 'mdy' : 'ymd';
    const f = newNumericFields();
    const pivot = format.twoDigitYearPivot;
    return (text) => (parseNumericDateInto(text, order, pivot, 0, out, sc, f) === null ? unitOfScan(sc) : null);
  }
  if (id === 'month-name-day-year' || id === 'day-month-name-year') {
    const parse = makeMonthNameParser(id, format.twoDigitYearPivot, sc);
    return (text) => (parse(text, out) === null ? unitOfScan(sc) : null);
  }
  return () => null;
}

/** Lengths in milliseconds, to compare clock units. */
const UNIT_MS: Record<ClockUnit, number> = { hour: 3_600_000, minute: 60_000, second: 1000, millisecond: 1 };

/**
 * The clock unit every one of `texts` writes at least: the finest unit among them. Null when any of them
 * writes no clock time, or there are none.
 */
export function commonWrittenUnit(reader: WrittenUnitReader, texts: Iterable<string>): ClockUnit | null {
  let finest: ClockUnit | null = null;
  for (const t of texts) {
    const u = reader(t);
    if (u === null) return null;
    if (finest === null || UNIT_MS[u] < UNIT_MS[finest]) finest = u;
    if (finest === 'millisecond') return finest;
  }
  return finest;
}
