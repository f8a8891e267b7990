// Throughput of quern's allocation-free ISO 8601 path (values per second), beside Date.parse and the
// Temporal polyfill on the same strings for scale, and a bare loop that reads every char once (the floor
// on this machine). Strings are generated (seeded) before timing.
//   node test/bench/time-parse.mjs [values=1000000]
import { tsImport } from 'tsx/esm/api';
import { Temporal } from 'temporal-polyfill';
import { PerformanceObserver } from 'node:perf_hooks';

const { makeTimeParser, emptyParsedTime } = await tsImport('../../src/time/index.ts', import.meta.url);

const n = Number(process.argv[2] ?? 1_000_000);
let seed = 7;
const rnd = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
const pad = (x) => String(x).padStart(2, '0');

/** Generated values of one shape, from 2000 to 2030. */
function make(shape) {
  const list = new Array(n);
  for (let i = 0; i < n; i++) {
    const t = Date.UTC(2000, 0, 1) + Math.floor(rnd() * 30 * 365.25 * 864e5);
    const iso = new Date(t).toISOString();
    if (shape === 'offset') {
      const off = Math.floor(rnd() * 27) - 12;
      list[i] = `${iso.slice(0, 19)}${off < 0 ? '-' : '+'}${pad(Math.abs(off))}:00`;
    } else if (shape === 'z-ms') list[i] = iso;
    else if (shape === 'date') list[i] = iso.slice(0, 10);
    else list[i] = iso.slice(0, 19);
  }
  return JSON.parse(JSON.stringify(list)); // flat strings, as a table reader hands them over
}

let gcRuns = 0;
new PerformanceObserver((list) => { gcRuns += list.getEntries().length; }).observe({ entryTypes: ['gc'] });
const tick = () => new Promise((resolve) => setTimeout(resolve, 20));

async function time(label, values, fn) {
  for (let i = 0; i < Math.min(values.length, 50_000); i++) fn(values[i]); // warm up
  await tick();
  const gc0 = gcRuns;
  const t0 = process.hrtime.bigint();
  let sink = 0;
  for (let i = 0; i < values.length; i++) sink += fn(values[i]) ? 1 : 0;
  const s = Number(process.hrtime.bigint() - t0) / 1e9;
  await tick();
  const gc = gcRuns - gc0;
  console.log(`${label.padEnd(46)} ${(values.length / s / 1e6).toFixed(2).padStart(7)} M values/s  ${String(gc).padStart(4)} GC runs  (${sink} ok)`);
}

const out = emptyParsedTime();
const readAll = (v) => { let k = 0; for (let i = 0; i < v.length; i++) k += v.charCodeAt(i); return k > 0; };
for (const shape of ['offset', 'z-ms', 'local', 'date']) {
  const values = make(shape);
  const parse = makeTimeParser(shape === 'date' ? 'iso-date' : shape === 'local' ? 'iso-date-time' : 'iso-date-time-offset');
  await time(`quern iso ${shape} (${values[0]})`, values, (v) => parse(v, out) === null);
  await time(`  floor: charCodeAt over every char`, values, readAll);
  if (shape !== 'local' && shape !== 'date') await time(`  Date.parse, same values`, values, (v) => !Number.isNaN(Date.parse(v)));
  if (shape === 'offset') {
    const few = values.slice(0, Math.min(n, 100_000));
    await time(`  Temporal.Instant.from, ${few.length} values`, few, (v) => Temporal.Instant.from(v).epochMilliseconds > 0);
  }
}
