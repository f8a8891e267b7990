// Entry of a column thread (see split.ts): profiles the columns of `workerData` and posts the result back.
import { parentPort, workerData } from 'node:worker_threads';
import { isQuernError } from '../errors.js';
import { profileColumns, type ColumnsJob } from './columns-task.js';

// Loaded outside a worker (a tool that imports every module), it does nothing.
const port = parentPort;
if (port !== null && workerData !== null) {
  profileColumns(workerData as ColumnsJob).then(
    (result) => port.postMessage({ ok: true, result }),
    (e: unknown) => {
      const err = e instanceof Error ? e : new Error(String(e));
      port.postMessage({ ok: false, error: { name: err.name, message: err.message, code: isQuernError(e) ? e.code : undefined, hint: isQuernError(e) ? e.hint : undefined } });
    },
  );
}
