// Profile and grain throughput: generates a seeded 1M-row visits-like table into the system's temporary
// folder (visit_id, visit_time UTC, visit_date, clinic, patient_age, wait_minutes, triage, area_code), then
// times profileTable (every column, one pass) and detectGrain (every column) on it, printing rows/s, MB/s
// (by wall and by CPU time) and the peak resident set size of this process. `--file F` times an existing
// CSV instead; `--strings` also times profile's string path (`bytes: false`) and checks the two reports agree.
//   node test/bench/profile.mjs [rows=1000000] [--keep] [--file F.csv] [--strings]
import { createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { once } from 'node:events';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { tsImport } from 'tsx/esm/api';

const { profileTable } = await tsImport('../../src/profile/index.ts', import.meta.url);
const { detectGrain } = await tsImport('../../src/grain/index.ts', import.meta.url);

const given = process.argv.includes('--file') ? process.argv[process.argv.indexOf('--file') + 1] : undefined;
let rows = Number(process.argv.find((a) => /^\d+$/.test(a)) ?? 1_000_000);
const keep = process.argv.includes('--keep') || given !== undefined;
const strings = process.argv.includes('--strings');
const dir = given === undefined ? mkdtempSync(join(tmpdir(), 'quern-bench-profile-')) : '';
const file = given ?? join(dir, 'visits-1m.csv');

async function generate(path, n) {
  const out = createWriteStream(path);
  let seed = 20240310;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
  const clinics = ['Alderbrook', 'Fennick Cross', 'Marrow Hill', 'Quillon Bay', 'Stenby Moor'];
  const triage = ['low', 'medium', 'high'];
  let t = Date.UTC(2020, 0, 1, 14);
  let buf = 'visit_id,visit_time,visit_date,clinic,patient_age,wait_minutes,triage,area_code\n';
  for (let i = 0; i < n; i++) {
    t += Math.floor(rnd() * 120_000);
    const iso = new Date(t).toISOString();
    buf += `${100001 + i},${iso.slice(0, 19)}Z,${iso.slice(0, 10)},${clinics[i % 5]},${Math.floor(rnd() * 100)},`
      + `${(rnd() * 90).toFixed(1)},${triage[Math.floor(rnd() * 3)]},0${4500 + Math.floor(rnd() * 40)}\n`;
    if (buf.length > 1 << 16) {
      if (!out.write(buf)) await once(out, 'drain');
      buf = '';
    }
  }
  out.write(buf);
  out.end();
  await once(out, 'finish');
}

async function time(label, f) {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const result = await f();
  const s = (performance.now() - t0) / 1000;
  const c = process.cpuUsage(c0);
  const cpu = (c.user + c.system) / 1e6;
  const mb = statSync(file).size / 1e6;
  // CPU time is shown beside wall time: on a shared machine wall time also measures the neighbours.
  console.log(`${label.padEnd(14)} wall ${s.toFixed(2)} s (${Math.round(rows / s).toLocaleString('en-US')} rows/s, ${(mb / s).toFixed(1)} MB/s)`
    + `  cpu ${cpu.toFixed(2)} s (${Math.round(rows / cpu).toLocaleString('en-US')} rows/s)`);
  return result;
}

if (given === undefined) await generate(file, rows);
else rows = (await profileTable(file, { table: { batchSize: 65_536 } })).rows; // also warms the page cache
console.log(`file: ${rows.toLocaleString('en-US')} rows, ${(statSync(file).size / 1e6).toFixed(1)} MB (${file})`);
const p = await time('profileTable', () => profileTable(file));
console.log(`  shape ${p.shape.kind}; roles ${p.columns.map((c) => `${c.name}=${c.role}`).join(', ')}`);
if (strings) {
  const q = await time('  string path', () => profileTable(file, { bytes: false }));
  console.log(`  string path report ${JSON.stringify(q) === JSON.stringify(p) ? 'identical' : 'DIFFERENT'}`);
}
const g = await time('detectGrain', () => detectGrain(file));
console.log(`  grains ${g.columns.map((c) => `${c.name}=${c.grain?.unit}`).join(', ')}`);
console.log(`peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
if (!keep) rmSync(dir, { recursive: true, force: true });
