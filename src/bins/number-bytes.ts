// Reading numbers straight from a field's UTF-8 bytes, with exactly the acceptance, values and reasons of
// the string parser of src/numbers (makeNumberParser): plain decimals (`-12.5`, `45`) are read from the
// bytes; every other value (separators, spaces, words, percent signs, exponents…) is decoded as UTF-8 and
// handed to the string parser of the same format.
import { makeNumberParser, type NumberFormat, type NumberParser, type NumberStatus, type ParsedNumber } from '../numbers/index.js';

const C0 = 48, C9 = 57, DOT = 46, PLUS = 43, MINUS = 45, LE = 101, UE = 69;

// 10^0 … 10^22 are exact doubles, so m / 10^f with m < 2^53 is one correctly rounded division: the very
// double that Number() gives for the decimal text (Clinger, "How to read floating point numbers
// accurately", PLDI 1990, the fast path).
const POW10 = [1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15];

/** A parser of byte ranges that agrees with `makeNumberParser(format)` on every value. */
export interface NumberBytesParser {
  readonly format: NumberFormat;
  /** Parses the UTF-8 bytes buf[start, end) into `out` and returns its status. */
  parse(buf: Uint8Array, start: number, end: number, out: ParsedNumber): NumberStatus;
}

function text(buf: Uint8Array, s: number, e: number): string {
  return s === e ? '' : Buffer.from(buf.buffer, buf.byteOffset + s, e - s).toString('utf8');
}

/**
 * Compiles the byte twin of a number parser (or of `makeNumberParser(format)`). The plain grammar is
 * the string parser's fast path, `[+-]?\d*(\.\d*)?([eE][+-]?\d+)?` with at least one digit (the dot only
 * when the dot marks decimals and the format is resolved); up to 15 digits without an exponent are
 * computed from the bytes, longer ones and exponents are read by Number() from the same text.
 */
export function makeNumberBytesParser(parserOrFormat: NumberParser | Partial<NumberFormat> = {}): NumberBytesParser {
  const parser = 'parse' in parserOrFormat && typeof parserOrFormat.parse === 'function' ? parserOrFormat as NumberParser : makeNumberParser(parserOrFormat as Partial<NumberFormat>);
  const f = parser.format;
  const allowDot = f.decimal === '.' && !f.unresolved;
  return {
    format: f,
    parse(buf, s, e, out) {
      let i = s;
      let c = i < e ? buf[i]! : 0;
      const neg = c === MINUS;
      if (c === PLUS || c === MINUS) i++;
      const intStart = i;
      let m = 0;
      while (i < e && (c = buf[i]!) >= C0 && c <= C9) { m = m * 10 + (c - C0); i++; }
      let digits = i - intStart;
      const lead = digits > 1 && buf[intStart] === C0;
      let frac = 0;
      if (i < e && buf[i] === DOT) {
        if (!allowDot) return parser.parse(text(buf, s, e), out);
        i++;
        const from = i;
        while (i < e && (c = buf[i]!) >= C0 && c <= C9) { m = m * 10 + (c - C0); i++; }
        frac = i - from;
        digits += frac;
      }
      if (digits === 0) return parser.parse(text(buf, s, e), out);
      let exact = digits <= 15;
      if (i < e && ((c = buf[i]!) === LE || c === UE)) {
        i++;
        if (i < e && ((c = buf[i]!) === PLUS || c === MINUS)) i++;
        const from = i;
        while (i < e && (c = buf[i]!) >= C0 && c <= C9) i++;
        if (i === from) return parser.parse(text(buf, s, e), out);
        exact = false;
      }
      if (i !== e) return parser.parse(text(buf, s, e), out);
      let v: number;
      if (exact) {
        v = frac === 0 ? m : m / POW10[frac]!;
        if (neg) v = -v;
      } else v = Number(text(buf, s, e));
      if (!Number.isFinite(v)) {
        out.status = 'invalid'; out.value = NaN; out.reason = 'out-of-range'; out.percent = false; out.leadingZero = false; out.grouped = false;
        return 'invalid';
      }
      out.status = 'ok'; out.value = v === 0 ? 0 : v; out.reason = null; out.percent = false; out.leadingZero = lead; out.grouped = false;
      return 'ok';
    },
  };
}
