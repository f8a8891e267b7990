// Numeric evidence of a column, gathered in one pass: how many values are numbers, integers, negative,
// zero-padded or of one fixed width, their range and decimals, and whether integers run one by one.
import type { NumberParser, ParsedNumber } from '../numbers/types.js';
import { emptyParsedNumber } from '../numbers/parse.js';
import { asciiString } from '../table/ascii.js';
import type { FieldScan } from './byte-scan.js';

export interface NumericSummary {
  /** Non-empty values read as numbers. */
  numbers: number;
  integers: number;
  negatives: number;
  /** Digit-only values with a leading zero and more than one digit (04519). */
  zeroPadded: number;
  /** First zero-padded value seen. */
  zeroPaddedExample: string | null;
  /** Digit-only values, and their shortest and longest widths. */
  digitOnly: number;
  minWidth: number;
  maxWidth: number;
  min: number;
  max: number;
  /** Most digits after the decimal mark. */
  maxDecimals: number;
  /** Values equal to the previous value plus one, in file order. */
  stepsOfOne: number;
}

export class NumericEvidence {
  readonly s: NumericSummary = {
    numbers: 0, integers: 0, negatives: 0, zeroPadded: 0, zeroPaddedExample: null, digitOnly: 0,
    minWidth: Infinity, maxWidth: 0, min: Infinity, max: -Infinity, maxDecimals: 0, stepsOfOne: 0,
  };
  private readonly out: ParsedNumber = emptyParsedNumber();
  private prev = NaN;
  /** The value and shape (PLAIN_DIGITS, PLAIN_ZERO_PADDED) of the last value addPlainBytes took, for addRepeat. */
  plainValue = NaN;
  plainShape = 0;

  /** True when a point marks decimals in this column's number format (the plain-decimal scan applies). */
  readonly dotIsDecimal: boolean;

  constructor(private readonly parser: NumberParser) {
    this.dotIsDecimal = parser.format.decimal === '.' && !parser.format.unresolved;
  }

  /** Reads one non-empty value; returns true when it is a number. */
  add(text: string): boolean {
    return this.addPlain(text) || this.addOther(text);
  }

  /** add() for a value that is not a plain decimal (the caller's addPlainBytes said false). */
  addOther(text: string): boolean {
    const s = this.s;
    if (this.parser.parse(text, this.out) !== 'ok') {
      this.prev = NaN;
      return false;
    }
    const x = this.out.value;
    s.numbers++;
    if (Number.isInteger(x)) s.integers++;
    if (x < 0) s.negatives++;
    if (x < s.min) s.min = x;
    if (x > s.max) s.max = x;
    if (x === this.prev + 1) s.stepsOfOne++;
    this.prev = x;
    const t = text.trim();
    if (isDigits(t)) {
      s.digitOnly++;
      if (t.length < s.minWidth) s.minWidth = t.length;
      if (t.length > s.maxWidth) s.maxWidth = t.length;
      if (t.length > 1 && t.charCodeAt(0) === 48) {
        s.zeroPadded++;
        if (s.zeroPaddedExample === null) s.zeroPaddedExample = t;
      }
    } else {
      const dot = Math.max(t.lastIndexOf('.'), this.parser.format.decimal === ',' ? t.lastIndexOf(',') : -1);
      if (dot >= 0 && !/[eE]/.test(t)) s.maxDecimals = Math.max(s.maxDecimals, t.length - dot - 1);
    }
    return true;
  }

  /**
   * One scan of a plain decimal (`-?digits[.digits]`, at most 15 digits, the dot only where it marks
   * decimals): the value is the digits as an exact integer divided by an exact power of ten, which IEEE 754
   * division rounds correctly — the same number `Number(text)` gives (Clinger, "How to read floating point
   * numbers accurately", PLDI 1990: the exact fast path). Returns false, touching nothing, for any other text.
   */
  private addPlain(text: string): boolean {
    const n = text.length;
    let i = 0;
    let c = n > 0 ? text.charCodeAt(0) : 0;
    const negative = c === 45;
    if (negative || c === 43) i++;
    const intStart = i;
    let digits = 0;
    let value = 0;
    while (i < n && (c = text.charCodeAt(i)) >= 48 && c <= 57) {
      value = value * 10 + (c - 48);
      i++;
    }
    digits = i - intStart;
    let decimals = -1;
    if (i < n && c === 46) {
      if (!this.dotIsDecimal) return false;
      const f = ++i;
      while (i < n && (c = text.charCodeAt(i)) >= 48 && c <= 57) {
        value = value * 10 + (c - 48);
        i++;
      }
      decimals = i - f;
      digits += decimals;
    }
    if (i !== n || digits === 0 || digits > 15) return false;
    let x = decimals > 0 ? value / POW10[decimals]! : value;
    if (negative && x !== 0) x = -x;
    this.record(x);
    const s = this.s;
    if (decimals < 0 && intStart === 0) {
      s.digitOnly++;
      if (n < s.minWidth) s.minWidth = n;
      if (n > s.maxWidth) s.maxWidth = n;
      if (n > 1 && text.charCodeAt(0) === 48) {
        s.zeroPadded++;
        if (s.zeroPaddedExample === null) s.zeroPaddedExample = text;
      }
    } else if (decimals >= 0 && decimals > s.maxDecimals) {
      s.maxDecimals = decimals;
    }
    return true;
  }

  /**
   * addPlain() on the ASCII bytes buf[start, end) of a value: the same evidence, read from the bytes.
   * Returns false, touching nothing, when the value is not a plain decimal (then call addOther(text)).
   */
  addPlainBytes(buf: Uint8Array, start: number, end: number): boolean {
    let i = start;
    let c = start < end ? buf[start]! : 0;
    const negative = c === 45;
    if (negative || c === 43) i++;
    const intStart = i;
    let value = 0;
    while (i < end && (c = buf[i]!) >= 48 && c <= 57) {
      value = value * 10 + (c - 48);
      i++;
    }
    let digits = i - intStart;
    let decimals = -1;
    if (i < end && c === 46) {
      if (!this.dotIsDecimal) return false;
      const f = ++i;
      while (i < end && (c = buf[i]!) >= 48 && c <= 57) {
        value = value * 10 + (c - 48);
        i++;
      }
      decimals = i - f;
      digits += decimals;
    }
    if (i !== end || digits === 0 || digits > 15) return false;
    let x = decimals > 0 ? value / POW10[decimals]! : value;
    if (negative && x !== 0) x = -x;
    this.record(x);
    this.plainValue = x;
    const s = this.s;
    const n = end - start;
    if (decimals < 0 && intStart === start) {
      s.digitOnly++;
      if (n < s.minWidth) s.minWidth = n;
      if (n > s.maxWidth) s.maxWidth = n;
      if (n > 1 && buf[start] === 48) {
        s.zeroPadded++;
        if (s.zeroPaddedExample === null) s.zeroPaddedExample = asciiString(buf, start, end);
        this.plainShape = PLAIN_DIGITS | PLAIN_ZERO_PADDED;
      } else {
        this.plainShape = PLAIN_DIGITS;
      }
    } else {
      if (decimals >= 0 && decimals > s.maxDecimals) s.maxDecimals = decimals;
      this.plainShape = 0;
    }
    return true;
  }

  /**
   * addPlainBytes() again for a value it took before (true) whose `plainShape` was `shape`: the same
   * evidence, from the value and its shape (its widths, decimals and example were noted the first time).
   */
  addRepeat(x: number, shape: number): void {
    this.record(x);
    if ((shape & PLAIN_DIGITS) !== 0) {
      const s = this.s;
      s.digitOnly++;
      if ((shape & PLAIN_ZERO_PADDED) !== 0) s.zeroPadded++;
    }
  }

  /**
   * addPlainBytes() of a value scanField found plain (`scan.plain`), from the scan's digits: the same evidence.
   * `buf[start, end)` are the value's bytes.
   */
  addScanned(scan: FieldScan, buf: Uint8Array, start: number, end: number): void {
    const decimals = scan.decimals;
    let x = decimals > 0 ? scan.digits / POW10[decimals]! : scan.digits;
    if (scan.negative && x !== 0) x = -x;
    this.record(x);
    const s = this.s;
    const n = end - start;
    if (decimals < 0 && !scan.signed) {
      s.digitOnly++;
      if (n < s.minWidth) s.minWidth = n;
      if (n > s.maxWidth) s.maxWidth = n;
      if (n > 1 && buf[start] === 48) {
        s.zeroPadded++;
        if (s.zeroPaddedExample === null) s.zeroPaddedExample = asciiString(buf, start, end);
      }
    } else if (decimals >= 0 && decimals > s.maxDecimals) {
      s.maxDecimals = decimals;
    }
  }

  private record(x: number): void {
    const s = this.s;
    s.numbers++;
    if (Number.isInteger(x)) s.integers++;
    if (x < 0) s.negatives++;
    if (x < s.min) s.min = x;
    if (x > s.max) s.max = x;
    if (x === this.prev + 1) s.stepsOfOne++;
    this.prev = x;
  }
}

/** Bits of NumericEvidence.plainShape: digits only (no sign, no point); and a leading zero before more digits. */
export const PLAIN_DIGITS = 1;
export const PLAIN_ZERO_PADDED = 2;

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15];

function isDigits(t: string): boolean {
  if (t.length === 0) return false;
  for (let i = 0; i < t.length; i++) {
    const c = t.charCodeAt(i);
    if (c < 48 || c > 57) return false;
  }
  return true;
}
