// Range worker threads, started ahead of the ranges they will read: a caller starts them as soon as it
// knows the read will be split, so their start-up (a fresh JavaScript isolate loading its modules) overlaps
// the main thread's own preparation. The binary ships its workers bundled into one file each
// (dist/workers, made by cli/bundle.mjs), which start in about half the time of the compiled modules.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { createRequire } from 'node:module';
import type { Worker } from 'node:worker_threads';
import type { FromWorker, WorkerSetup } from './messages.js';
import { isSourceModule, siblingModule } from './module-url.js';

/** What a range thread says or does: a message, an error, or its exit. */
export type ThreadEvent =
  | { kind: 'message'; message: FromWorker }
  | { kind: 'error'; error: Error }
  | { kind: 'exit'; code: number };

/**
 * A range worker thread whose events are held from its start until someone listens: a thread started ahead
 * may say it is ready (or fail) before its lane is set up, and a Worker's events with no listener are lost.
 */
export interface RangeThread {
  readonly worker: Worker;
  /** Hands every event to `on`, first those held so far; one listener per thread. */
  listen(on: (event: ThreadEvent) => void): void;
}

/** Worker threads started for one task, handed to `runRanges`, which stops them when it is done. */
export interface RangeWorkers {
  readonly setup: WorkerSetup;
  readonly threads: RangeThread[];
  /** Stops every thread (safe to call more than once, and after runRanges). */
  stop(): void;
}

/** Starts `count` worker threads for `exportName` of `moduleUrl` (none when count is 0 or less). */
export function startRangeWorkers(moduleUrl: string, exportName: string, count: number): RangeWorkers {
  const setup: WorkerSetup = { moduleUrl, exportName };
  const threads: RangeThread[] = [];
  for (let w = 0; w < count; w++) threads.push(holdEvents(spawnWorker(setup)));
  return { setup, threads, stop: () => { for (const t of threads) void t.worker.terminate(); } };
}

/** Listens to a new worker at once, keeping its events until `listen` is called. */
function holdEvents(worker: Worker): RangeThread {
  let held: ThreadEvent[] | null = [];
  let sink: ((event: ThreadEvent) => void) | null = null;
  const deliver = (event: ThreadEvent): void => {
    if (sink !== null) sink(event);
    else held!.push(event);
  };
  worker.on('message', (message: FromWorker) => deliver({ kind: 'message', message }));
  worker.on('error', (error: Error) => deliver({ kind: 'error', error }));
  worker.on('exit', (code: number) => deliver({ kind: 'exit', code }));
  return {
    worker,
    listen(on) {
      if (sink !== null) throw new Error('a range thread has one listener');
      sink = on;
      const early = held!;
      held = null;
      for (const event of early) on(event);
    },
  };
}

/**
 * The bundled worker's launcher next to the compiled modules (dist/workers/<name>.cjs), when the build made
 * one; null otherwise (the TypeScript sources, or a build without bundles).
 */
export function bundledWorker(importMetaUrl: string, name: string): URL | null {
  if (isSourceModule(importMetaUrl)) return null;
  const url = new URL(`../../workers/${name}.cjs`, importMetaUrl);
  return existsSync(fileURLToPath(url)) ? url : null;
}

let workerThreads: typeof import('node:worker_threads') | undefined;
/** node:worker_threads' Worker, loaded on first use (loading it cost every run about 3 ms of start-up). */
export function workerClass(): typeof Worker {
  return (workerThreads ??= createRequire(import.meta.url)('node:worker_threads') as typeof import('node:worker_threads')).Worker;
}

/** A range worker: the bundled one, the compiled worker entry, or the TypeScript source through tsx (tests). */
function spawnWorker(setup: WorkerSetup): Worker {
  const Worker = workerClass();
  const here = import.meta.url;
  const bundled = bundledWorker(here, 'range-worker');
  if (bundled !== null) return new Worker(bundled, { workerData: setup });
  const url = siblingModule(here, 'worker-entry');
  if (!isSourceModule(here)) return new Worker(new URL(url), { workerData: setup });
  const boot = `import('tsx/esm/api').then((a) => { a.register(); return import(${JSON.stringify(url)}); })`;
  return new Worker(boot, { eval: true, workerData: setup });
}
