// Table-reading throughput: the fast byte-level path against the csv-parse reference path and a
// plain chunked newline count of the same file. Data is generated into the system's temporary folder.
//   node test/bench/table-read.mjs [rows=2000000] [referenceRows=300000]
import { createReadStream, createWriteStream, statSync, rmSync, mkdtempSync } from 'node:fs';
import os, { tmpdir } from 'node:os';
import { join } from 'node:path';
import { once } from 'node:events';
import { tsImport } from 'tsx/esm/api';

const { openTable } = await tsImport('../../src/table/index.ts', import.meta.url);
const { makeTimeParser, makeTimeBytesParser, emptyParsedTime } = await tsImport('../../src/time/index.ts', import.meta.url);

const rows = Number(process.argv[2] ?? 2_000_000);
const refRows = Number(process.argv[3] ?? 300_000);
const dir = mkdtempSync(join(tmpdir(), 'quern-bench-'));

/**
 * Writes `n` rows of ts,site,age,amount with ISO 8601 UTC timestamps (seeded, deterministic), with the
 * delimiter `d`, every field quoted when `quoted` (RFC 4180 §2.5).
 */
async function generate(file, n, d = ',', quoted = false) {
  const out = createWriteStream(file);
  let seed = 42;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
  const sites = ['Alderbrook', 'Fennick Cross', 'Marrow Hill', 'Quillon Bay', 'Stenby Moor'];
  let t = Date.UTC(2023, 0, 1);
  const q = quoted ? (v) => `"${v}"` : (v) => v;
  let buf = ['ts', 'site', 'age', 'amount'].join(d) + '\n';
  for (let i = 0; i < n; i++) {
    t += Math.floor(rnd() * 6000);
    buf += [`${new Date(t).toISOString().slice(0, 19)}Z`, sites[i % 5], String(Math.floor(rnd() * 100)), (rnd() * 500).toFixed(2)].map(q).join(d) + '\n';
    if (buf.length > 1 << 16) {
      if (!out.write(buf)) await once(out, 'drain');
      buf = '';
    }
  }
  out.end(buf);
  await once(out, 'finish');
}

async function newlineCount(file) {
  let n = 0;
  for await (const chunk of createReadStream(file, { highWaterMark: 1 << 20 })) {
    let i = -1;
    while ((i = chunk.indexOf(10, i + 1)) !== -1) n++;
  }
  return n;
}

async function readTable(file, engine, columns) {
  const t = await openTable(file, { engine });
  let n = 0;
  for await (const b of t.batches(columns)) n += b.length;
  const s = t.summary();
  if (s.rowsRead !== n || s.rowsRejected !== 0) throw new Error(`accounting mismatch ${JSON.stringify(s)}`);
  return n;
}

/** Byte batches of `columns`; `simd` false keeps to the JavaScript word loop, `transient` lets buffers be reused. */
async function readBytes(file, columns, { simd = true, transient = false } = {}) {
  const t = await openTable(file, { simd });
  let n = 0;
  for await (const b of t.byteBatches(columns, [], { transient })) n += b.length;
  const s = t.summary();
  if (s.rowsRead !== n || s.rowsRejected !== 0) throw new Error(`accounting mismatch ${JSON.stringify(s)}`);
  return n;
}

/** Reads and parses the ts column: from strings (batches) or from bytes (byteBatches). */
async function parseTimes(file, bytes) {
  const t = await openTable(file);
  const out = emptyParsedTime();
  let n = 0;
  let sum = 0;
  if (bytes) {
    const parse = makeTimeBytesParser('iso-date-time-offset');
    for await (const b of t.byteBatches(['ts'])) {
      const s = b.starts[0];
      const e = b.ends[0];
      for (let i = 0; i < b.length; i++) if (b.decoded[0][i] === 0 && parse(b.buf, s[i], e[i], out) === null) sum += out.ms;
      n += b.length;
    }
  } else {
    const parse = makeTimeParser('iso-date-time-offset');
    for await (const b of t.batches(['ts'])) {
      const v = b.values[0];
      for (let i = 0; i < b.length; i++) if (parse(v[i], out) === null) sum += out.ms;
      n += b.length;
    }
  }
  if (!(sum > 0)) throw new Error('nothing parsed');
  return n;
}

/** Median wall time and best CPU time (user + system) of 3 runs; CPU time is the fairer figure on a shared machine. */
async function measure(label, file, fn) {
  const size = statSync(file).size;
  const runs = [];
  for (let r = 0; r < 3; r++) {
    const t0 = process.hrtime.bigint();
    const c0 = process.cpuUsage();
    const n = await fn();
    const c = process.cpuUsage(c0);
    runs.push({ s: Number(process.hrtime.bigint() - t0) / 1e9, cpu: (c.user + c.system) / 1e6, n });
  }
  const wall = runs.map((r) => r.s).sort((a, b) => a - b)[1];
  const cpu = Math.min(...runs.map((r) => r.cpu));
  const mb = size / 1e6;
  console.log(
    `${label.padEnd(40)} ${mb.toFixed(1).padStart(6)} MB | wall ${wall.toFixed(3).padStart(6)} s ${(mb / wall).toFixed(0).padStart(5)} MB/s | cpu ${cpu.toFixed(3).padStart(6)} s ${(mb / cpu).toFixed(0).padStart(5)} MB/s ${(runs[0].n / cpu / 1e6).toFixed(2).padStart(5)} M rows/s`,
  );
}

const big = join(dir, 'events.csv');
const small = join(dir, 'events-small.csv');
const tabbed = join(dir, 'events.tsv');
const quoted = join(dir, 'events-quoted.csv');
await generate(big, rows);
await generate(small, refRows);
await generate(tabbed, rows, '\t');
await generate(quoted, rows, ',', true);
console.log(`node ${process.version}; load average ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}; ${os.cpus().length} cores`);
await measure('newline count (chunked indexOf)', big, () => newlineCount(big));
await measure('fast path, all 4 columns', big, () => readTable(big, 'fast', ['ts', 'site', 'age', 'amount']));
await measure('fast path, ts only', big, () => readTable(big, 'fast', ['ts']));
await measure('byte batches, all 4 columns', big, () => readBytes(big, ['ts', 'site', 'age', 'amount']));
await measure('byte batches, ts only', big, () => readBytes(big, ['ts']));
await measure('byte batches, ts only, transient', big, () => readBytes(big, ['ts'], { transient: true }));
await measure('byte batches, ts only, transient, no SIMD', big, () => readBytes(big, ['ts'], { transient: true, simd: false }));
await measure('byte batches, all 4, transient, no SIMD', big, () => readBytes(big, ['ts', 'site', 'age', 'amount'], { transient: true, simd: false }));
await measure('byte batches, all 4 columns, transient', big, () => readBytes(big, ['ts', 'site', 'age', 'amount'], { transient: true }));
await measure('byte batches, ts only, tab-separated', tabbed, () => readBytes(tabbed, ['ts']));
await measure('byte batches, ts only, every field quoted', quoted, () => readBytes(quoted, ['ts']));
await measure('ts parsed from strings', big, () => parseTimes(big, false));
await measure('ts parsed from bytes', big, () => parseTimes(big, true));
await measure('reference (csv-parse), all 4 columns', small, () => readTable(small, 'reference', ['ts', 'site', 'age', 'amount']));
await measure('fast path on the same small file', small, () => readTable(small, 'fast', ['ts', 'site', 'age', 'amount']));
console.log(`peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB (whole script)`);
rmSync(dir, { recursive: true, force: true });
