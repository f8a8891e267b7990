// Public surface of time-value parsing: formats, inference, the allocation-free parsers, durations.
export type { TimeKind, LocalTimeRule, ParsedTime } from './types.js';
export { emptyParsedTime } from './types.js';
export type { TimeFormatId, TimeFormat, EpochUnit } from './format.js';
export { TIME_FORMAT_IDS, isTimeFormatId, timeFormat } from './format.js';
export type { InferHints, InferResult, InferStatus, Candidate } from './infer-types.js';
export { inferTimeFormat, type InferScope } from './infer.js';
export type { TimeParser, TimeParserOptions } from './parser.js';
export { makeTimeParser } from './parser.js';
export type { IsoDuration } from './duration.js';
export { parseIsoDuration, addDurationToWall } from './duration.js';
export { parseTimeText } from './text.js';
export { epochUnitOfDigits } from './epoch.js';
export { serialFractionMs } from './serial.js';
export { fastIsoBytes, parseIsoBytes } from './iso-bytes.js';
export type { TimeBytesParser } from './bytes-parser.js';
export { makeTimeBytesParser } from './bytes-parser.js';
