// The entry of a range worker thread: loads the task module once, then runs the ranges it is sent.
import { parentPort, workerData } from 'node:worker_threads';
import { isQuernError } from '../errors.js';
import type { RangeTask } from './types.js';
import type { FromWorker, ToWorker, WorkerSetup } from './messages.js';

const setup = workerData as WorkerSetup;
const port = parentPort!;
const mod = (await import(setup.moduleUrl)) as Record<string, RangeTask<unknown, unknown>>;
const task = mod[setup.exportName];

/** Posts progress at most every 4 MiB of a range, so messages cost nothing measurable. */
const STEP = 4 << 20;

port.on('message', (msg: ToWorker) => {
  if (msg.type === 'stop') {
    port.close();
    return;
  }
  const { range } = msg;
  let posted = 0;
  const onProgress = (bytes: number): void => {
    if (bytes - posted >= STEP) {
      posted = bytes;
      port.postMessage({ type: 'progress', index: range.index, bytes } satisfies FromWorker);
    }
  };
  if (task === undefined) {
    port.postMessage({ type: 'error', index: range.index, error: { name: 'Error', message: `${setup.moduleUrl} has no export ${setup.exportName}` } } satisfies FromWorker);
    return;
  }
  task(setup.file, setup.options, range, { onProgress }).then(
    (outcome) => port.postMessage({ type: 'done', index: range.index, outcome } satisfies FromWorker),
    (e: unknown) => port.postMessage({ type: 'error', index: range.index, error: serialiseError(e) } satisfies FromWorker),
  );
});
port.postMessage({ type: 'ready' } satisfies FromWorker);

function serialiseError(e: unknown): FromWorkerError {
  if (isQuernError(e)) return { name: 'QuernError', code: e.code, message: e.message, hint: e.hint };
  const err = e instanceof Error ? e : new Error(String(e));
  return { name: err.name, message: err.message, stack: err.stack };
}

type FromWorkerError = Extract<FromWorker, { type: 'error' }>['error'];
