// Messages between the pool and its range workers (structured-clonable plain data).
import type { ByteRange, RangeOutcome } from './types.js';

/** What a worker is started with: the task it runs. The file and options come with each range. */
export interface WorkerSetup {
  moduleUrl: string;
  exportName: string;
}

export type ToWorker = { type: 'range'; range: ByteRange; file: string; options: unknown } | { type: 'stop' };

export type FromWorker =
  | { type: 'ready' }
  | { type: 'progress'; index: number; bytes: number }
  | { type: 'done'; index: number; outcome: RangeOutcome<unknown> }
  | { type: 'error'; index: number; error: { name: string; message: string; code?: string; hint?: string; stack?: string } };
