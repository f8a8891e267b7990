// Runs a range task over the byte ranges of a file on several threads, the main thread included, and
// hands the outcomes back in file order with every boundary verified: a range that did not start where
// the previous one stopped (a line feed inside a quoted field) is read again from that stop.
import { QuernError, type ErrorCode } from '../errors.js';
import type { FromWorker, ToWorker } from './messages.js';
import { startRangeWorkers, type RangeThread } from './workers.js';
import type { ByteRange, RangeOutcome, RangeRun, RangeTask } from './types.js';

/** Runs `run.exportName` of `run.moduleUrl` over every range; rejects with the first error a range throws. */
export async function runRanges<O, P>(run: RangeRun<O>): Promise<Array<RangeOutcome<P>>> {
  const task = run.task !== undefined ? (run.task as RangeTask<O, P>) : await loadTask<O, P>(run.moduleUrl, run.exportName);
  const n = run.ranges.length;
  const outcomes = new Array<RangeOutcome<P>>(n);
  const progress = new Float64Array(n);
  const onBytes = (index: number, bytes: number): void => {
    progress[index] = bytes;
    if (run.onProgress !== undefined) {
      let total = 0;
      for (let i = 0; i < n; i++) total += progress[i]!;
      run.onProgress(total);
    }
  };
  let next = 0;
  let failed = false;
  const take = (): ByteRange | undefined => (failed || next >= n ? undefined : run.ranges[next++]);
  const inMain = async (range: ByteRange): Promise<RangeOutcome<P>> =>
    task(run.file, run.options, range, { onProgress: (b) => onBytes(range.index, b) });

  const mainLane = async (): Promise<void> => {
    for (let r = take(); r !== undefined; r = take()) outcomes[r.index] = await inMain(r);
  };
  const main = run.mainTakesPart !== false;
  const workerCount = main ? Math.max(0, Math.min(run.threads - 1, n - 1)) : Math.max(1, Math.min(run.threads, n));
  const started = run.workers;
  if (started !== undefined && (started.setup.moduleUrl !== run.moduleUrl || started.setup.exportName !== run.exportName)) {
    started.stop();
    throw new Error(`range workers started for ${started.setup.exportName} cannot run ${run.exportName}`);
  }
  // Threads started ahead are used first (the extra ones stopped); more are started if they are too few.
  const ahead = started?.threads ?? [];
  const workers: RangeThread[] = ahead.slice(0, workerCount);
  for (const extra of ahead.slice(workerCount)) void extra.worker.terminate();
  const more = startRangeWorkers(run.moduleUrl, run.exportName, workerCount - workers.length);
  workers.push(...more.threads);
  const lanes: Array<Promise<void>> = [];
  const job = { file: run.file, options: run.options };
  for (const worker of workers) lanes.push(workerLane(worker, job, take, (o) => (outcomes[o.range.index] = o as RangeOutcome<P>), onBytes));
  if (main) lanes.unshift(mainLane());
  try {
    const settled = await Promise.allSettled(lanes.map((l) => l.catch((e: unknown) => { failed = true; throw e; })));
    const bad = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected');
    if (bad !== undefined) throw bad.reason;
  } finally {
    for (const w of workers) void w.worker.terminate();
  }
  // Mend boundaries in file order: each range must begin where the one before it stopped.
  for (let k = 1; k < n; k++) {
    const prevStop = outcomes[k - 1]!.stop;
    const o = outcomes[k]!;
    if (o.range.start !== prevStop) outcomes[k] = await inMain({ index: k, start: prevStop, end: Math.max(prevStop, o.range.end) });
  }
  return outcomes;
}

async function loadTask<O, P>(moduleUrl: string, exportName: string): Promise<RangeTask<O, P>> {
  const mod = (await import(moduleUrl)) as Record<string, unknown>;
  const task = mod[exportName];
  if (typeof task !== 'function') throw new Error(`${moduleUrl} has no range task ${exportName}`);
  return task as RangeTask<O, P>;
}

/** Feeds ranges to one worker until none are left; rejects on the worker's first error. */
function workerLane(
  thread: RangeThread,
  job: { file: string; options: unknown },
  take: () => ByteRange | undefined,
  done: (o: RangeOutcome<unknown>) => void,
  onBytes: (index: number, bytes: number) => void,
): Promise<void> {
  return new Promise((resolve, reject) => {
    let finished = false;
    const end = (e?: unknown): void => {
      if (finished) return;
      finished = true;
      thread.worker.postMessage({ type: 'stop' } satisfies ToWorker);
      if (e === undefined) resolve();
      else reject(e);
    };
    const feed = (): void => {
      const r = take();
      if (r === undefined) end();
      else thread.worker.postMessage({ type: 'range', range: r, file: job.file, options: job.options } satisfies ToWorker);
    };
    // The thread's events from its start: one started ahead may have said it is ready long ago.
    thread.listen((event) => {
      if (event.kind === 'error') return end(event.error);
      if (event.kind === 'exit') return end(finished ? undefined : new Error(`range worker stopped early (exit ${event.code})`));
      const m: FromWorker = event.message;
      if (m.type === 'ready') feed();
      else if (m.type === 'progress') onBytes(m.index, m.bytes);
      else if (m.type === 'done') {
        done(m.outcome);
        feed();
      } else end(rebuildError(m.error));
    });
  });
}

function rebuildError(e: Extract<FromWorker, { type: 'error' }>['error']): Error {
  if (e.name === 'QuernError') return new QuernError(e.code as ErrorCode, e.message, e.hint);
  const err = new Error(e.message);
  err.name = e.name;
  if (e.stack !== undefined) err.stack = e.stack;
  return err;
}
