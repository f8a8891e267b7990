// Splitting a big plain file's columns between two threads: a worker thread reads the file for one half of
// the columns while the main thread reads it for the other half and the table's shape. Both halves are
// exact (each column is read whole, in order, by one accumulator), so no merge is needed; the cost is a
// second tokenizing pass, paid on another core.
import { Worker } from 'node:worker_threads';
import { QuernError, type ErrorCode } from '../errors.js';
import type { TableOptions } from '../table/types.js';
import type { ColumnsJob, ColumnsResult } from './columns-task.js';

/** Smallest plain file whose columns are split between threads. */
export const SPLIT_MIN_BYTES = 32 << 20;

/** Which columns (header indices) the worker thread reads: every other one from the first. */
export function workerColumns(width: number): number[] {
  return Array.from({ length: width }, (_, k) => k).filter((k) => k % 2 === 0);
}

/** The table options a worker can be sent (functions and streams stay behind). */
export function cloneableTable(t: TableOptions = {}): TableOptions {
  const { stdin: _stdin, onProgress: _progress, ...rest } = t;
  return rest;
}

/** Runs profileColumns(job) in a worker thread. */
export function runColumnsWorker(job: ColumnsJob): { result: Promise<ColumnsResult>; stop: () => void } {
  const worker = spawn(job);
  const result = new Promise<ColumnsResult>((resolve, reject) => {
    let settled = false;
    worker.on('message', (m: WorkerReply) => {
      settled = true;
      if (m.ok) resolve(m.result);
      else reject(m.error.code !== undefined ? new QuernError(m.error.code as ErrorCode, m.error.message, m.error.hint) : Object.assign(new Error(m.error.message), { name: m.error.name }));
      void worker.terminate();
    });
    worker.on('error', (e) => {
      settled = true;
      reject(e);
    });
    worker.on('exit', (code) => {
      if (!settled) reject(new Error(`profile column thread stopped early (exit ${code})`));
    });
  });
  return { result, stop: () => void worker.terminate() };
}

type WorkerReply =
  | { ok: true; result: ColumnsResult }
  | { ok: false; error: { name: string; message: string; code?: string; hint?: string } };

/** The worker: column-worker.js from dist, or the TypeScript source through tsx's loader (tests). */
function spawn(job: ColumnsJob): Worker {
  const here = import.meta.url;
  if (!here.endsWith('.ts')) return new Worker(new URL('./column-worker.js', here), { workerData: job });
  const url = new URL('./column-worker.ts', here).href;
  const boot = `import('tsx/esm/api').then((a) => { a.register(); return import(${JSON.stringify(url)}); })`;
  return new Worker(boot, { eval: true, workerData: job });
}
