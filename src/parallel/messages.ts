// Messages between the pool and its range workers (structured-clonable plain data).
import type { ByteRange, RangeOutcome } from './types.js';

/** What a worker is started with. */
export interface WorkerSetup {
  moduleUrl: string;
  exportName: string;
  file: string;
  options: unknown;
}

export type ToWorker = { type: 'range'; range: ByteRange } | { type: 'stop' };

export type FromWorker =
  | { type: 'ready' }
  | { type: 'progress'; index: number; bytes: number }
  | { type: 'done'; index: number; outcome: RangeOutcome<unknown> }
  | { type: 'error'; index: number; error: { name: string; message: string; code?: string; hint?: string; stack?: string } };
