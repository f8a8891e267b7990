// Profiles: the measurement level and role of every column, and the table's shape.
export { profileTable } from './profile.js';
export type { ProfileOptions } from './profile.js';
export { classifyColumn } from './classify.js';
export { ProfileColumn } from './column.js';
export { HyperLogLog } from './hll.js';
export { matchVocabulary, VOCABULARIES } from './vocabularies.js';
export type { Vocabulary, VocabularyMatch } from './vocabularies.js';
export { ISO_ALPHA2, ISO_ALPHA3, countryCodeKind } from './country-codes.js';
export { SHAPE_ROWS } from './shape.js';
export type { MeasurementLevel, ColumnRole, ColumnProfile, TableShape, ProfileReport } from './types.js';
