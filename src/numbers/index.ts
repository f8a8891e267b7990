// Public surface of number parsing, used by every command that reads quantities.
export type { DecimalMark, GroupMark, NumberFormat, NumberStatus, NumberReason, ParsedNumber, NumberParser, NumberFormatInference } from './types.js';
export { makeNumberParser, parseNumber, emptyParsedNumber, PLAIN_NUMBER_FORMAT, DEFAULT_MISSING_MARKERS } from './parse.js';
export { inferNumberFormat } from './infer.js';
