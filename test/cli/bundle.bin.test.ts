// The bundled binary (dist/quern.cjs, made by cli/bundle.mjs) starts its bundled worker threads
// (dist/workers): a run on two threads must give what one thread gives. The file is over 32 MB, the size
// from which the CLI reads a file in byte ranges (cli/threads.ts).
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { cachePathOf, compileBundle } from '../../cli/code-cache.js';
import { timeFormat } from '../../src/time/format.js';
import { afterAll, describe, expect, it } from 'vitest';

const main = fileURLToPath(new URL('../../dist/quern.cjs', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'quern-bundle-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function quern(args: string[]): string {
  return execFileSync(process.execPath, [main, ...args], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' }, maxBuffer: 1 << 26 });
}

describe('dist/quern.cjs on two threads', () => {
  it.skipIf(!existsSync(main))('rebin, bucket and profile give the one-thread results (workers find their modules)', () => {
    const file = join(dir, 'events.csv');
    const rows: string[] = ['ts,age'];
    const start = Date.UTC(2024, 0, 1);
    for (let i = 0; i < 1_250_000; i++) rows.push(`${new Date(start + i * 47_000).toISOString()},${i % 97}`);
    writeFileSync(file, rows.join('\n') + '\n');
    const rebin = ['rebin', file, '--time', 'ts', '--unit', 'iso-week', '--agg', 'count', '--format', 'json'];
    const one = JSON.parse(quern([...rebin, '--threads', '1']));
    const two = JSON.parse(quern([...rebin, '--threads', '2']));
    expect(two).toEqual(one);
    expect(one.rows.length).toBeGreaterThan(40);
    const bucket = ['bucket', file, '--value', 'age', '--edges', '0,5,15,65', '--summary', '--json'];
    const b1 = JSON.parse(quern([...bucket, '--threads', '1']));
    const b2 = JSON.parse(quern([...bucket, '--threads', '2']));
    expect(b2).toEqual(b1);
    expect(b1.rowsRead).toBe(1_250_000);
    // profile splits the columns: the worker thread takes ts (the costly, date-like column).
    const p1 = JSON.parse(quern(['profile', file, '--json', '--threads', '1']));
    const p2 = JSON.parse(quern(['profile', file, '--json', '--threads', '2']));
    expect(p2).toEqual(p1);
    expect(p1.columns.map((c: { role: string }) => c.role)[0]).toBe('time');
  });

  const rangeWorker = fileURLToPath(new URL('../../dist/workers/range-worker.cjs', import.meta.url));
  it.skipIf(!existsSync(main))('the bundled range worker carries its tasks: it runs rebinRange without importing the module named', async () => {
    expect(existsSync(rangeWorker)).toBe(true);
    expect(existsSync(fileURLToPath(new URL('../../dist/workers/column-worker.cjs', import.meta.url)))).toBe(true);
    const file = join(dir, 'small.csv');
    writeFileSync(file, 'ts\n2024-01-01T00:00:00Z\n2024-01-08T00:00:00Z\n2024-01-09T00:00:00Z\n');
    // A module URL that does not exist: a worker that imported it would fail.
    const worker = new Worker(rangeWorker, { workerData: { moduleUrl: 'file:///no/such/range-task.js', exportName: 'rebinRange' } });
    try {
      const outcome = await new Promise<{ partial: { counts: { used: number }; error: unknown } }>((resolve, reject) => {
        worker.on('error', reject);
        worker.on('message', (m: { type: string; outcome?: never; error?: { message: string } }) => {
          if (m.type === 'ready') {
            worker.postMessage({
              type: 'range', range: { index: 0, start: 0, end: 1 << 20 }, file,
              options: { options: { time: 'ts', calendar: { unit: 'iso-week', zone: 'UTC' } }, formats: { time: timeFormat('iso-date-time-offset'), numbers: [] } },
            });
          } else if (m.type === 'done') resolve(m.outcome!);
          else if (m.type === 'error') reject(new Error(m.error!.message));
        });
      });
      expect(outcome.partial.error).toBeNull();
      expect(outcome.partial.counts.used).toBe(3);
    } finally {
      await worker.terminate();
    }
  });
});

describe('the code caches of the bundles (cli/bundle.mjs, cli/code-cache.ts)', () => {
  const bundles = ['../../dist/quern.bundle.cjs', '../../dist/workers/range-worker.bundle.cjs', '../../dist/workers/column-worker.bundle.cjs'].map((u) => fileURLToPath(new URL(u, import.meta.url)));
  it.skipIf(!existsSync(main))('are accepted by the V8 that made them, for every bundle', () => {
    for (const file of bundles) {
      const cache = readFileSync(cachePathOf(file));
      expect(cache.length, file).toBeGreaterThan(10_000);
      expect(compileBundle(file, cache).rejected, file).toBe(false);
    }
  });

  it.skipIf(!existsSync(main))('are refused when the bundle changed, and the bundle then compiles as usual', () => {
    // V8 checks the source against the cache (a changed length is refused).
    const file = join(dir, 'changed.cjs');
    writeFileSync(file, readFileSync(bundles[1]!, 'utf8') + '\n;');
    const { script, rejected } = compileBundle(file, readFileSync(cachePathOf(bundles[1]!)));
    expect(rejected).toBe(true);
    expect(typeof script.runInThisContext()).toBe('function');
  });

  it.skipIf(!existsSync(main))('keep the non-ASCII text of regular expressions: age bands written with en dashes are range labels', () => {
    const file = join(dir, 'ages.csv');
    writeFileSync(file, 'age_band,n\n0–4,3\n5–14,7\n15–64,12\n65+,4\n');
    const profile = JSON.parse(quern(['profile', file, '--json']));
    expect(profile.columns[0].role).toBe('range-label');
  });
});
