#!/usr/bin/env node
// `npm run bench`: generates event files into a temporary folder (never committed), then times each
// approach on them in one run and prints a table of wall time, MB/s, rows/s, peak memory and ratios.
//
//   node test/bench/run.mjs [--sizes 1000000,10000000] [--repeat 3] [--skip duckdb,naive] [--keep]
//
// Needs the built CLI (`npm run build`). Peak memory is the child's maximum resident set size as
// reported by /usr/bin/time when present, else by the child itself.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, statSync, writeFileSync, openSync, writeSync, closeSync } from 'node:fs';
import { tmpdir, cpus } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const cli = join(root, 'dist', 'cli', 'main.js');
const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : dflt;
};
const sizes = opt('sizes', '1000000,10000000').split(',').map(Number);
const repeat = Number(opt('repeat', '3'));
const skip = new Set(opt('skip', '').split(',').filter(Boolean));
const keep = args.includes('--keep');

if (!existsSync(cli)) {
  console.error('bench: build first (npm run build)');
  process.exit(2);
}
const dir = mkdtempSync(join(tmpdir(), 'quern-bench-'));
const hasTime = existsSync('/usr/bin/time');

/** Seeded events `ts,site,age,amount`: ISO 8601 UTC timestamps over three years. */
function generate(path, rows) {
  let a = 12345;
  const rand = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const fd = openSync(path, 'w');
  writeSync(fd, 'ts,site,age,amount\n');
  const start = Date.UTC(2021, 0, 1);
  const span = 3 * 365 * 86_400_000;
  let chunk = [];
  for (let i = 0; i < rows; i++) {
    const ms = start + Math.floor((i / rows) * span) + Math.floor(rand() * 60_000);
    const ts = new Date(ms).toISOString().slice(0, 19) + 'Z';
    chunk.push(`${ts},site${Math.floor(rand() * 40)},${Math.floor(rand() * 95)},${(rand() * 500).toFixed(2)}`);
    if (chunk.length === 100_000) {
      writeSync(fd, chunk.join('\n') + '\n');
      chunk = [];
    }
  }
  if (chunk.length) writeSync(fd, chunk.join('\n') + '\n');
  closeSync(fd);
}

const scripts = {
  newlines: `const fs=require('fs');const fd=fs.openSync(process.argv[1],'r');const b=Buffer.allocUnsafe(1<<20);let n=0,r;while((r=fs.readSync(fd,b,0,b.length,null))>0){for(let i=0;i<r;i++)if(b[i]===10)n++;}console.log(n);`,
  duckdb: `const {DuckDBInstance}=require('@duckdb/node-api');(async()=>{const db=await DuckDBInstance.create(':memory:',{threads:process.argv[3]});const c=await db.connect();const f=process.argv[1].replace(/'/g,"''");
const a=await c.runAndReadAll("SELECT date_trunc('week', ts) AS w, count(*) FROM read_csv('"+f+"', header=true, columns={'ts':'TIMESTAMPTZ','site':'VARCHAR','age':'INTEGER','amount':'DOUBLE'}) GROUP BY 1 ORDER BY 1");
const b=await c.runAndReadAll("SET TimeZone='America/New_York'; SELECT date_trunc('quarter', ts) AS q, count(*) FROM read_csv('"+f+"', header=true, columns={'ts':'TIMESTAMPTZ','site':'VARCHAR','age':'INTEGER','amount':'DOUBLE'}) GROUP BY 1 ORDER BY 1");
console.log(a.getRows().length,b.getRows().length);})();`,
  naive: `const {parse}=require('csv-parse');const {DateTime}=require('luxon');const fs=require('fs');const w=new Map(),q=new Map();
fs.createReadStream(process.argv[1]).pipe(parse({columns:true})).on('data',r=>{const t=DateTime.fromISO(r.ts,{zone:'utc'});const k=t.toISOWeekDate().slice(0,8);w.set(k,(w.get(k)||0)+1);const n=t.setZone('America/New_York');const kq=n.year+'-Q'+n.quarter;q.set(kq,(q.get(kq)||0)+1);}).on('end',()=>console.log(w.size,q.size));`,
};

function timed(cmd, argv) {
  const full = hasTime ? ['/usr/bin/time', ['-f', '%e %M', cmd, ...argv]] : [cmd, argv];
  const t0 = process.hrtime.bigint();
  const r = spawnSync(full[0], full[1], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 26 });
  const wall = Number(process.hrtime.bigint() - t0) / 1e9;
  if (r.status !== 0) throw new Error(`${cmd} ${argv.join(' ')} failed: ${r.stderr.slice(-500)}`);
  let rss = NaN;
  if (hasTime) {
    const last = r.stderr.trim().split('\n').pop().split(' ');
    rss = Number(last[1]) / 1024;
  }
  return { wall, rss };
}

function approaches(file, rows) {
  const q = (...a) => ['node', [cli, ...a]];
  const list = [
    ['newline count (chunked read)', ['node', ['-e', scripts.newlines, file]]],
    ['quern rebin --unit iso-week', q('rebin', file, '--time', 'ts', '--unit', 'iso-week', '--out', '/dev/null')],
    ['quern rebin --unit quarter --zone America/New_York', q('rebin', file, '--time', 'ts', '--unit', 'quarter', '--zone', 'America/New_York', '--out', '/dev/null')],
    ['quern grain', q('grain', file, '--json')],
    ['quern profile', q('profile', file, '--json')],
    ['quern bucket --edges (fixed)', q('bucket', file, '--value', 'age', '--edges', '0,5,15,25,45,65', '--open-high', '--out', '/dev/null')],
    ['quern bucket --method quantile', q('bucket', file, '--value', 'amount', '--method', 'quantile', '--bins', '5', '--out', '/dev/null')],
    ['quern bucket --method ckmeans', q('bucket', file, '--value', 'amount', '--method', 'ckmeans', '--bins', '5', '--out', '/dev/null')],
  ];
  if (!skip.has('duckdb')) {
    list.push(['DuckDB (2 threads), both aggregations', ['node', ['-e', scripts.duckdb, file, '2']]]);
    list.push(['DuckDB (1 thread), both aggregations', ['node', ['-e', scripts.duckdb, file, '1']]]);
  }
  if (!skip.has('naive') && rows <= 1_000_000) list.push(['csv-parse + luxon per row (naive), both', ['node', ['-e', scripts.naive, file]]]);
  return list;
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const results = [];
for (const rows of sizes) {
  const file = join(dir, `events-${rows}.csv`);
  process.stderr.write(`bench: generating ${rows.toLocaleString('en-US')} rows… `);
  generate(file, rows);
  const mb = statSync(file).size / 1e6;
  process.stderr.write(`${mb.toFixed(0)} MB\n`);
  for (const [name, [cmd, argv]] of approaches(file, rows)) {
    const runs = [];
    const n = name.includes('naive') ? 1 : repeat;
    try {
      for (let i = 0; i < n; i++) runs.push(timed(cmd, argv));
    } catch (e) {
      process.stderr.write(`bench: ${name}: ${e.message}\n`);
      continue;
    }
    const wall = median(runs.map((r) => r.wall));
    const rss = Math.max(...runs.map((r) => r.rss));
    results.push({ rows, mb, name, wall, rss });
    process.stderr.write(`  ${name}: ${wall.toFixed(2)} s\n`);
  }
}

const pad = (s, n) => String(s).padEnd(n);
const lpad = (s, n) => String(s).padStart(n);
console.log(`\nquern benchmark — ${new Date().toISOString().slice(0, 10)}, ${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, Node ${process.version}`);
console.log(`${pad('approach', 52)}${lpad('rows', 11)}${lpad('wall s', 8)}${lpad('MB/s', 8)}${lpad('Mrows/s', 9)}${lpad('peak MB', 9)}${lpad('×newline', 10)}${lpad('×DuckDB2', 10)}`);
for (const r of results) {
  const same = results.filter((x) => x.rows === r.rows);
  const nl = same.find((x) => x.name.startsWith('newline'));
  const dk = same.find((x) => x.name.startsWith('DuckDB (2'));
  console.log(
    `${pad(r.name, 52)}${lpad(r.rows.toLocaleString('en-US'), 11)}${lpad(r.wall.toFixed(2), 8)}${lpad((r.mb / r.wall).toFixed(0), 8)}` +
      `${lpad((r.rows / r.wall / 1e6).toFixed(2), 9)}${lpad(Number.isNaN(r.rss) ? '-' : r.rss.toFixed(0), 9)}` +
      `${lpad(nl ? (r.wall / nl.wall).toFixed(2) : '-', 10)}${lpad(dk ? (r.wall / dk.wall).toFixed(2) : '-', 10)}`,
  );
}
mkdirSync(join(root, 'test-output'), { recursive: true });
writeFileSync(join(root, 'test-output', 'bench.json'), JSON.stringify(results, null, 2));
if (!keep) rmSync(dir, { recursive: true, force: true });
else console.log(`data kept in ${dir}`);
