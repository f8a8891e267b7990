// How a range task opens its part of the file: the records that start in its byte range, with the
// reading options of the whole run and the pool's progress hook.
import { openTable } from '../table/index.js';
import type { TableReader } from '../table/types.js';
import type { ByteRange, RangeHooks } from './types.js';

/** Reading options a range task is handed (structured-clonable). */
export interface RangeReadOptions {
  cwd?: string;
  delimiter?: string;
  /** Bytes per read (TableOptions.chunkSize). */
  chunkSize?: number;
}

/** Opens the records of `file` that start in `range` (lines relative to the range; see TableOptions.byteRange). */
export function openRange(file: string, range: ByteRange, o: RangeReadOptions, hooks: RangeHooks): Promise<TableReader> {
  return openTable(file, {
    byteRange: { start: range.start, end: range.end },
    ...(o.cwd !== undefined ? { cwd: o.cwd } : {}),
    ...(o.delimiter !== undefined ? { delimiter: o.delimiter } : {}),
    ...(o.chunkSize !== undefined ? { chunkSize: o.chunkSize } : {}),
    ...(hooks.onProgress !== undefined ? { onProgress: (b: number) => hooks.onProgress!(b) } : {}),
  });
}
