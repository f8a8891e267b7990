// One pass over the ASCII bytes of a value for the profile's hot loop: the 32-bit hash the distinct counter
// uses (hashString of the same text, see hll.ts) and, in the same loop, the value read as a plain decimal
// (`[+-]digits[.digits]`, at most 15 digits) when it is one. Reading a number and hashing the value cost one
// walk over its bytes instead of two.

/** What scanField found; overwritten by every call. */
export interface FieldScan {
  /** hashString of the value's text. */
  hash: number;
  /** True when the value is a plain decimal of at most 15 digits (then `value`, `decimals`, `signed` hold). */
  plain: boolean;
  /** The digits as an exact integer (without the decimal point or sign). */
  digits: number;
  /** Digits after the point; -1 when there is no point. */
  decimals: number;
  /** True when a sign (+ or -) leads; `negative` when it is '-'. */
  signed: boolean;
  negative: boolean;
}

/** A fresh record for scanField. */
export function emptyFieldScan(): FieldScan {
  return { hash: 0, plain: false, digits: 0, decimals: -1, signed: false, negative: false };
}

/**
 * Hashes buf[start, end) (FNV-1a with the murmur3 finish, exactly hashString's steps on ASCII text) and reads
 * it as a plain decimal; `dotIsDecimal` false makes a point end the number (the column's decimal mark is a comma).
 */
export function scanField(buf: Uint8Array, start: number, end: number, dotIsDecimal: boolean, out: FieldScan): void {
  let h = 0x811c9dc5;
  let i = start;
  let c = start < end ? buf[start]! : 0;
  const negative = c === 45;
  const signed = negative || c === 43;
  if (signed) {
    h = Math.imul(h ^ c, 0x01000193);
    i++;
  }
  const intStart = i;
  let value = 0;
  while (i < end && (c = buf[i]!) >= 48 && c <= 57) {
    h = Math.imul(h ^ c, 0x01000193);
    value = value * 10 + (c - 48);
    i++;
  }
  let digits = i - intStart;
  let decimals = -1;
  if (i < end && c === 46 && dotIsDecimal) {
    h = Math.imul(h ^ c, 0x01000193);
    const f = ++i;
    while (i < end && (c = buf[i]!) >= 48 && c <= 57) {
      h = Math.imul(h ^ c, 0x01000193);
      value = value * 10 + (c - 48);
      i++;
    }
    decimals = i - f;
    digits += decimals;
  }
  out.plain = i === end && digits > 0 && digits <= 15;
  for (; i < end; i++) h = Math.imul(h ^ buf[i]!, 0x01000193);
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  out.hash = h >>> 0;
  out.digits = value;
  out.decimals = decimals;
  out.signed = signed;
  out.negative = negative;
}
