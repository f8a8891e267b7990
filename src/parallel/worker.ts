// The entry of a range worker thread: loads the task module once, then runs the ranges it is sent.
import { parentPort, workerData, type MessagePort } from 'node:worker_threads';
import { isQuernError } from '../errors.js';
import type { RangeTask } from './types.js';
import type { FromWorker, ToWorker, WorkerSetup } from './messages.js';

type FromWorkerError = Extract<FromWorker, { type: 'error' }>['error'];

/** Posts progress at most every 4 MiB of a range, so messages cost nothing measurable. */
const STEP = 4 << 20;

// Loaded outside a worker (a tool that imports every module), it does nothing.
if (parentPort !== null && workerData !== null) await serve(parentPort, workerData as WorkerSetup);

/** Answers the pool: runs each range it is sent and posts its outcome, progress or error. */
async function serve(port: MessagePort, setup: WorkerSetup): Promise<void> {
  const mod = (await import(setup.moduleUrl)) as Record<string, RangeTask<unknown, unknown>>;
  const task = mod[setup.exportName];
  port.on('message', (msg: ToWorker) => {
    if (msg.type === 'stop') {
      port.close();
      return;
    }
    const { range } = msg;
    if (task === undefined) {
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
    task(setup.file, setup.options, range, { onProgress }).then(
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
