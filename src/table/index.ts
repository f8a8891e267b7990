// Table input and output: streaming readers (CSV, TSV, NDJSON, gzip, stdin) with row accounting,
// and writers that neither harm the next program nor leave half a file.
export type {
  TableFormat,
  TableEngine,
  TableOptions,
  ColumnBatch,
  ByteBatch,
  ReadSummary,
  TableReader,
} from './types.js';
export { openTable } from './open.js';
export { byteFieldString } from './byte-batch.js';
export type { RejectReason } from './accounting.js';
export { editDistance, nearestName } from './columns.js';
export { formatFromName, sniffDelimiter, sniffFormat, parseDelimiter, CANDIDATE_DELIMITERS } from './sniff.js';
export { csvCell, csvRow, ndjsonLine, isFormulaLike } from './write.js';
export type { CsvWriteOptions } from './write.js';
export { openOutput, abortOpenOutputs, abortOpenOutputsSync } from './output.js';
export type { OutputTarget, OutputOptions, StdoutLike } from './output.js';
