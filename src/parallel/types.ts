// Plain data of a read split into byte ranges: what a range is and what a range task hands back.
import type { ReadSummary } from '../table/types.js';
import type { RangeWorkers } from './workers.js';

/** Bytes [start, end) of a plain file whose records are read by one task; start 0 means "after the header". */
export interface ByteRange {
  /** Position of the range in file order. */
  index: number;
  start: number;
  end: number;
}

/**
 * What a range task returns: its range, the table reader's summary of that range (lines relative to the
 * range's start for every range but the first) and the task's own partial result.
 */
export interface RangeOutcome<P> {
  range: ByteRange;
  /** File offset just after the last record read: the start of the next record. */
  stop: number;
  /** Line breaks consumed in the range (blank lines and breaks inside quoted fields included). */
  breaks: number;
  summary: ReadSummary;
  partial: P;
}

/** Hooks the pool gives a range task. */
export interface RangeHooks {
  /** Bytes of the range read so far. */
  onProgress?: (bytesRead: number) => void;
}

/** A range task: reads `range` of `file` under `options` and returns its outcome. */
export type RangeTask<O, P> = (file: string, options: O, range: ByteRange, hooks: RangeHooks) => Promise<RangeOutcome<P>>;

/** Which task to run where, and on how many threads. */
export interface RangeRun<O> {
  /** URL of the module exporting the task (see `siblingModule`). */
  moduleUrl: string;
  exportName: string;
  /**
   * The same task, already loaded, for the ranges the main thread reads. Without it the main thread imports
   * `moduleUrl`, which in the bundled binary loads a second copy of the modules (about 0.1 s) and warms its
   * code apart from the copy already warm.
   */
  task?: RangeTask<O, unknown>;
  file: string;
  /** Worker threads already started for this task (startRangeWorkers); runRanges stops them when done. */
  workers?: RangeWorkers;
  /** Structured-clonable options handed to every task. */
  options: O;
  ranges: ByteRange[];
  /** Threads in all, the main thread included; 1 runs every range in the main thread. */
  threads: number;
  /** False leaves every range to worker threads (`threads` of them); default true. */
  mainTakesPart?: boolean;
  /** Total bytes read so far across ranges. */
  onProgress?: (bytesRead: number) => void;
}
