// Numeric evidence of a column, gathered in one pass: how many values are numbers, integers, negative,
// zero-padded or of one fixed width, their range and decimals, and whether integers run one by one.
import type { NumberParser, ParsedNumber } from '../numbers/types.js';
import { emptyParsedNumber } from '../numbers/parse.js';

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

  constructor(private readonly parser: NumberParser) {}

  /** Reads one non-empty value; returns true when it is a number. */
  add(text: string): boolean {
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
}

function isDigits(t: string): boolean {
  if (t.length === 0) return false;
  for (let i = 0; i < t.length; i++) {
    const c = t.charCodeAt(i);
    if (c < 48 || c > 57) return false;
  }
  return true;
}
