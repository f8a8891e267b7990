// Range worker threads, started ahead of the ranges they will read: a caller starts them as soon as it
// knows the read will be split, so their start-up (a fresh JavaScript isolate loading its modules) overlaps
// the main thread's own preparation. The binary ships its workers bundled into one file each
// (dist/workers, made by cli/bundle.mjs), which start in about half the time of the compiled modules.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { WorkerSetup } from './messages.js';
import { isSourceModule, siblingModule } from './module-url.js';

/** Worker threads started for one task, handed to `runRanges`, which stops them when it is done. */
export interface RangeWorkers {
  readonly setup: WorkerSetup;
  readonly threads: Worker[];
  /** Stops every thread (safe to call more than once, and after runRanges). */
  stop(): void;
}

/** Starts `count` worker threads for `exportName` of `moduleUrl` (none when count is 0 or less). */
export function startRangeWorkers(moduleUrl: string, exportName: string, count: number): RangeWorkers {
  const setup: WorkerSetup = { moduleUrl, exportName };
  const threads: Worker[] = [];
  for (let w = 0; w < count; w++) threads.push(spawnWorker(setup));
  return { setup, threads, stop: () => { for (const t of threads) void t.terminate(); } };
}

/**
 * The bundled worker next to the compiled modules (dist/workers/<name>.js), when the build made one; null
 * otherwise (the TypeScript sources, or a build without bundles).
 */
export function bundledWorker(importMetaUrl: string, name: string): URL | null {
  if (isSourceModule(importMetaUrl)) return null;
  const url = new URL(`../../workers/${name}.js`, importMetaUrl);
  return existsSync(fileURLToPath(url)) ? url : null;
}

/** A range worker: the bundled one, the compiled worker entry, or the TypeScript source through tsx (tests). */
function spawnWorker(setup: WorkerSetup): Worker {
  const here = import.meta.url;
  const bundled = bundledWorker(here, 'range-worker');
  if (bundled !== null) return new Worker(bundled, { workerData: setup });
  const url = siblingModule(here, 'worker-entry');
  if (!isSourceModule(here)) return new Worker(new URL(url), { workerData: setup });
  const boot = `import('tsx/esm/api').then((a) => { a.register(); return import(${JSON.stringify(url)}); })`;
  return new Worker(boot, { eval: true, workerData: setup });
}
