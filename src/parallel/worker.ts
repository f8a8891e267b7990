// The serving loop of a range worker thread: loads the task once, then runs the ranges it is sent. Started
// by worker-entry.ts (the compiled modules) or by the binary's bundled worker, which hands it its tasks.
import { parentPort, workerData, type MessagePort } from 'node:worker_threads';
import { isQuernError } from '../errors.js';
import type { RangeTask } from './types.js';
import type { FromWorker, ToWorker, WorkerSetup } from './messages.js';

type FromWorkerError = Extract<FromWorker, { type: 'error' }>['error'];

/** Posts progress at most every 4 MiB of a range, so messages cost nothing measurable. */
const STEP = 4 << 20;

/**
 * Serves the pool when run in a range worker (does nothing elsewhere). `known` maps export names to tasks
 * already loaded (the bundled worker's); a task not among them is imported from the setup's module URL.
 */
export async function serveRanges(known: Readonly<Record<string, RangeTask<unknown, unknown>>> = {}): Promise<void> {
  if (parentPort === null || workerData === null) return;
  await serve(parentPort, workerData as WorkerSetup, known);
}

async function serve(port: MessagePort, setup: WorkerSetup, known: Readonly<Record<string, RangeTask<unknown, unknown>>>): Promise<void> {
  const task = Object.prototype.hasOwnProperty.call(known, setup.exportName)
    ? known[setup.exportName]
    : ((await import(setup.moduleUrl)) as Record<string, RangeTask<unknown, unknown>>)[setup.exportName];
  port.on('message', (msg: ToWorker) => {
    if (msg.type === 'stop') {
      port.close();
      return;
    }
    const { range } = msg;
    if (typeof task !== 'function') {
      port.postMessage({ type: 'error', index: range.index, error: { name: 'Error', message: `${setup.moduleUrl} has no export ${setup.exportName}` } } satisfies FromWorker);
      return;
    }
    let posted = 0;
    const onProgress = (bytes: number): void => {
      if (bytes - posted >= STEP) {
        posted = bytes;
        port.postMessage({ type: 'progress', index: range.index, bytes } satisfies FromWorker);
      }
    };
    task(msg.file, msg.options, range, { onProgress }).then(
      (outcome) => port.postMessage({ type: 'done', index: range.index, outcome } satisfies FromWorker),
      (e: unknown) => port.postMessage({ type: 'error', index: range.index, error: serialiseError(e) } satisfies FromWorker),
    );
  });
  port.postMessage({ type: 'ready' } satisfies FromWorker);
}

function serialiseError(e: unknown): FromWorkerError {
  if (isQuernError(e)) return { name: 'QuernError', code: e.code, message: e.message, hint: e.hint };
  const err = e instanceof Error ? e : new Error(String(e));
  return { name: err.name, message: err.message, stack: err.stack };
}
