// Splitting a big plain file's columns between two threads: a worker thread reads the file for some of the
// columns while the main thread reads it for the others and the table's shape. Both halves are
// exact (each column is read whole, in order, by one accumulator), so no merge is needed; the cost is a
// second tokenizing pass, paid on another core.
import type { Worker } from 'node:worker_threads';
import { QuernError, type ErrorCode } from '../errors.js';
import type { TableOptions } from '../table/types.js';
import { bundledWorker, workerClass } from '../parallel/workers.js';
import type { ColumnsJob, ColumnsResult } from './columns-task.js';

/** Smallest plain file whose columns are split between threads. */
export const SPLIT_MIN_BYTES = 32 << 20;

/**
 * Smallest plain file that `threads: 'auto'` reads on two threads. On the benchmark's two-core machine (min
 * of 5 runs) two threads took the benchmark's 374 MB file from 2.25 to 1.73 s and a 225 MB one from 1.38 to
 * 1.14 s, but gained little or nothing on 110 MB and 37 MB (0.82 against 0.79 s, 0.54 against 0.58 s): the
 * worker's start-up and its second tokenizing pass eat the gain on small files.
 */
export const AUTO_SPLIT_BYTES = 128 << 20;

/** Threads for `threads: 'auto'`: two for a file of at least AUTO_SPLIT_BYTES when two cores are there. */
export function autoThreads(fileBytes: number, cores: number): number {
  return cores >= 2 && fileBytes >= AUTO_SPLIT_BYTES ? 2 : 1;
}

/** What the table's shape costs the main thread, in the units of `ProfileColumn.splitCost`. */
export const SHAPE_COST = 1;

/**
 * Which columns (header indices) the worker thread reads, given each column's cost for the rest of the file
 * (ProfileColumn.splitCost): the costliest first, each to the thread with less work so far, the main thread
 * starting with the shape. Both threads tokenize the whole file, so only the column work is balanced. The
 * worker gets at least one column; the result is in header order.
 */
export function workerColumns(costs: readonly number[]): number[] {
  const order = costs.map((_, k) => k).sort((a, b) => costs[b]! - costs[a]! || a - b);
  const theirs: number[] = [];
  let main = SHAPE_COST;
  let worker = 0;
  for (const k of order) {
    if (worker < main || theirs.length === 0) {
      theirs.push(k);
      worker += costs[k]!;
    } else {
      main += costs[k]!;
    }
  }
  return theirs.sort((a, b) => a - b);
}

/** The table options a worker can be sent (functions and streams stay behind). */
export function cloneableTable(t: TableOptions = {}): TableOptions {
  const { stdin: _stdin, onProgress: _progress, ...rest } = t;
  return rest;
}

/** A column thread at work: its answer to come, and a way to stop it. */
export interface ColumnsWorker {
  result: Promise<ColumnsResult>;
  stop: () => void;
}

/** Runs profileColumns(job) in a worker thread. */
export function runColumnsWorker(job: ColumnsJob): ColumnsWorker {
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

/** The worker: the binary's bundled one, column-worker.js from dist, or the TypeScript source through tsx (tests). */
function spawn(job: ColumnsJob): Worker {
  const Worker = workerClass();
  const here = import.meta.url;
  const bundled = bundledWorker(here, 'column-worker');
  if (bundled !== null) return new Worker(bundled, { workerData: job });
  if (!here.endsWith('.ts')) return new Worker(new URL('./column-worker.js', here), { workerData: job });
  const url = new URL('./column-worker.ts', here).href;
  const boot = `import('tsx/esm/api').then((a) => { a.register(); return import(${JSON.stringify(url)}); })`;
  return new Worker(boot, { eval: true, workerData: job });
}
