#!/usr/bin/env node
// `npm run bench`: generates event files into a temporary folder (never committed), then times each
// approach on them in one run, in rounds (each approach once a round; the median of each is shown), and
// prints a table of wall time, MB/s, rows/s, peak memory and ratios.
//
//   node test/bench/run.mjs [--sizes 1000000,10000000] [--repeat 5] [--skip duckdb,naive,quoted] [--only rebin]
//                           [--cli path/to/quern.cjs] [--keep] [--keep-env]
//
// Needs the built CLI (`npm run build`). Peak memory is the child's maximum resident set size as
// reported by /usr/bin/time (NaN without it). Every approach is a fresh process, so wall times include
// Node's start-up. The rebin outputs are checked against DuckDB's counts for the same periods.
// Two newline counts: a byte loop (the baseline of the ratios: reading every byte in JavaScript) and
// Buffer.indexOf (memchr in native code: close to the speed of reading the file, listed for reference).
// Ratios: ×newline is wall / the byte-loop newline count's wall, and the
// same for CPU time (user + system), which a busy shared machine disturbs less than wall time; ×DuckDB and
// ×naive say how many times faster than DuckDB (2 threads) and than csv-parse + luxon doing the same
// aggregation (naive: by rows per second, as it runs on 1M rows only).
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync, openSync, writeSync, closeSync } from 'node:fs';
import { tmpdir, cpus, loadavg } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : dflt;
};
const cli = opt('cli', join(root, 'dist', 'quern.cjs'));
const sizes = opt('sizes', '1000000,10000000').split(',').map(Number);
const repeat = Number(opt('repeat', '5'));
const skip = new Set(opt('skip', '').split(',').filter(Boolean));
const keep = args.includes('--keep');
const only = opt('only', '');

if (!existsSync(cli)) {
  console.error('bench: build first (npm run build)');
  process.exit(2);
}
const dir = mkdtempSync(join(tmpdir(), 'quern-bench-'));
const hasTime = existsSync('/usr/bin/time');
// NODE_EXTRA_CA_CERTS makes every Node process read and parse a certificate file as it starts (about 40 ms
// on the machine the README's figures come from, which sets it for its network): none of the approaches
// uses TLS, so every child process, each approach alike, runs without it unless --keep-env is given.
const childEnv = { ...process.env };
const droppedEnv = args.includes('--keep-env') ? [] : ['NODE_EXTRA_CA_CERTS'].filter((k) => childEnv[k] !== undefined);
for (const k of droppedEnv) delete childEnv[k];

/** Seeded events `ts,site,age,amount`: ISO 8601 UTC timestamps over three years; every field in quotes with `quoted`. */
function generate(path, rows, quoted = false) {
  let a = 12345;
  const rand = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const fd = openSync(path, 'w');
  writeSync(fd, quoted ? '"ts","site","age","amount"\n' : 'ts,site,age,amount\n');
  const start = Date.UTC(2021, 0, 1);
  const span = 3 * 365 * 86_400_000;
  let chunk = [];
  for (let i = 0; i < rows; i++) {
    const ms = start + Math.floor((i / rows) * span) + Math.floor(rand() * 60_000);
    const ts = new Date(ms).toISOString().slice(0, 19) + 'Z';
    const cells = [ts, `site${Math.floor(rand() * 40)}`, Math.floor(rand() * 95), (rand() * 500).toFixed(2)];
    chunk.push(quoted ? `"${cells.join('","')}"` : cells.join(','));
    if (chunk.length === 100_000) {
      writeSync(fd, chunk.join('\n') + '\n');
      chunk = [];
    }
  }
  if (chunk.length) writeSync(fd, chunk.join('\n') + '\n');
  closeSync(fd);
}

// One aggregation per process: 'week' (ISO weeks in UTC) or 'quarter' (quarters in America/New_York).
// DuckDB and the naive script print "start-epoch-ms,count" per period, for the check against quern.
const scripts = {
  newlinesIndexOf: `const fs=require('fs');const fd=fs.openSync(process.argv[1],'r');const b=Buffer.allocUnsafe(1<<20);let n=0,r;while((r=fs.readSync(fd,b,0,b.length,null))>0){let i=-1;const v=r===b.length?b:b.subarray(0,r);while((i=v.indexOf(10,i+1))!==-1)n++;}console.log(n);`,
  newlines: `const fs=require('fs');const fd=fs.openSync(process.argv[1],'r');const b=Buffer.allocUnsafe(1<<20);let n=0,r;while((r=fs.readSync(fd,b,0,b.length,null))>0){for(let i=0;i<r;i++)if(b[i]===10)n++;}console.log(n);`,
  duckdb: `const {DuckDBInstance}=require('@duckdb/node-api');(async()=>{const [f0,threads,which]=process.argv.slice(1);const db=await DuckDBInstance.create(':memory:',{threads});const c=await db.connect();const f=f0.replace(/'/g,"''");
const zone=which==='week'?'UTC':'America/New_York';const unit=which==='week'?'week':'quarter';
await c.run("SET TimeZone='"+zone+"'");
const r=await c.runAndReadAll("SELECT epoch_ms(date_trunc('"+unit+"', ts)) AS p, count(*) AS n FROM read_csv('"+f+"', header=true, columns={'ts':'TIMESTAMPTZ','site':'VARCHAR','age':'INTEGER','amount':'DOUBLE'}) GROUP BY 1 ORDER BY 1");
console.log(r.getRows().map(x=>x[0]+','+x[1]).join('\\n'));})();`,
  naive: `const {parse}=require('csv-parse');const {DateTime}=require('luxon');const fs=require('fs');const which=process.argv[2];const m=new Map();
fs.createReadStream(process.argv[1]).pipe(parse({columns:true})).on('data',r=>{let t=DateTime.fromISO(r.ts,{zone:'utc'});
const k=which==='week'?t.startOf('week').toMillis():t.setZone('America/New_York').startOf('quarter').toMillis();m.set(k,(m.get(k)||0)+1);})
.on('end',()=>console.log([...m].sort((a,b)=>a[0]-b[0]).map(x=>x.join(',')).join('\\n')));`,
};

function timed(cmd, argv) {
  const full = hasTime ? ['/usr/bin/time', ['-f', '%e %M %U %S', cmd, ...argv]] : [cmd, argv];
  const t0 = process.hrtime.bigint();
  const r = spawnSync(full[0], full[1], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 26, env: childEnv });
  const wall = Number(process.hrtime.bigint() - t0) / 1e9;
  if (r.status !== 0) throw new Error(`${cmd} ${argv.join(' ')} failed: ${r.stderr.slice(-500)}`);
  let rss = NaN;
  let cpu = NaN;
  if (hasTime) {
    const last = r.stderr.trim().split('\n').pop().split(' ');
    rss = Number(last[1]) / 1024;
    cpu = Number(last[2]) + Number(last[3]);
  }
  return { wall, rss, cpu, stdout: r.stdout };
}

/** Every approach on one file: name, command, the aggregation it does ('week', 'quarter' or none). */
function approaches(file, rows) {
  const q = (...a) => ['node', [cli, ...a]];
  const out = (which) => join(dir, `quern-${which}-${rows}.csv`);
  const list = [
    { name: 'Node start-up alone (node -e 0)', startup: true, run: ['node', ['-e', '0']] },
    { name: 'newline count (chunked read)', run: ['node', ['-e', scripts.newlines, file]] },
    { name: 'newline count (chunked read, indexOf)', run: ['node', ['-e', scripts.newlinesIndexOf, file]] },
    { name: 'quern rebin --unit iso-week', pair: 'week', out: out('week'), run: q('rebin', file, '--time', 'ts', '--unit', 'iso-week', '--out', out('week'), '-q') },
    { name: 'quern rebin --unit quarter --zone America/New_York', pair: 'quarter', out: out('quarter'),
      run: q('rebin', file, '--time', 'ts', '--unit', 'quarter', '--zone', 'America/New_York', '--out', out('quarter'), '-q') },
    { name: 'quern rebin --unit iso-week --threads 2', run: q('rebin', file, '--time', 'ts', '--unit', 'iso-week', '--threads', '2', '--out', out('week2'), '-q') },
    { name: 'quern rebin --unit quarter --zone America/New_York --threads 2',
      run: q('rebin', file, '--time', 'ts', '--unit', 'quarter', '--zone', 'America/New_York', '--threads', '2', '--out', out('quarter2'), '-q') },
    { name: 'quern grain', run: q('grain', file, '--json') },
    { name: 'quern profile (default: --threads auto)', run: q('profile', file, '--json') },
    { name: 'quern profile --threads 1', run: q('profile', file, '--json', '--threads', '1') },
    { name: 'quern profile --threads 2', run: q('profile', file, '--json', '--threads', '2') },
    { name: 'quern bucket --edges (fixed)', run: q('bucket', file, '--value', 'age', '--edges', '0,5,15,25,45,65', '--open-high', '--out', '/dev/null') },
    { name: 'quern bucket --edges (fixed) to a file', run: q('bucket', file, '--value', 'age', '--edges', '0,5,15,25,45,65', '--open-high', '--out', out('bucket')) },
    { name: 'quern bucket --edges --summary (counts only)', run: q('bucket', file, '--value', 'age', '--edges', '0,5,15,25,45,65', '--open-high', '--summary') },
    { name: 'quern bucket --method quantile', run: q('bucket', file, '--value', 'amount', '--method', 'quantile', '--bins', '5', '--out', '/dev/null') },
    { name: 'quern bucket --method ckmeans', run: q('bucket', file, '--value', 'amount', '--method', 'ckmeans', '--bins', '5', '--out', '/dev/null') },
  ];
  if (!skip.has('duckdb')) {
    list.push({ name: 'DuckDB 2 threads, ISO week UTC', pair: 'week', ref: 'duckdb', run: ['node', ['-e', scripts.duckdb, file, '2', 'week']] });
    list.push({ name: 'DuckDB 2 threads, quarter New York', pair: 'quarter', ref: 'duckdb', run: ['node', ['-e', scripts.duckdb, file, '2', 'quarter']] });
    list.push({ name: 'DuckDB 1 thread, ISO week UTC', run: ['node', ['-e', scripts.duckdb, file, '1', 'week']] });
  }
  if (!skip.has('naive') && rows <= 1_000_000) {
    list.push({ name: 'csv-parse + luxon per row (naive), ISO week', pair: 'week', ref: 'naive', once: true, run: ['node', ['-e', scripts.naive, file, 'week']] });
    list.push({ name: 'csv-parse + luxon per row (naive), quarter', pair: 'quarter', ref: 'naive', once: true, run: ['node', ['-e', scripts.naive, file, 'quarter']] });
  }
  const wanted = only.split(',').filter(Boolean);
  return list.filter((a) => wanted.length === 0 || a.name.startsWith('newline') || wanted.some((w) => a.name.includes(w)));
}

/** The approaches run again on the same events with every field quoted (RFC 4180 §2.5), as some exports write them. */
function quotedApproaches(file, rows) {
  const q = (...a) => ['node', [cli, ...a]];
  const list = [
    { name: 'quern rebin --unit iso-week, every field quoted', run: q('rebin', file, '--time', 'ts', '--unit', 'iso-week', '--out', join(dir, `quern-quoted-${rows}.csv`), '-q') },
    { name: 'quern bucket --edges --summary, every field quoted', run: q('bucket', file, '--value', 'age', '--edges', '0,5,15,25,45,65', '--open-high', '--summary') },
  ];
  const wanted = only.split(',').filter(Boolean);
  return list.filter((a) => wanted.length === 0 || wanted.some((w) => a.name.includes(w)));
}

/** Period start (epoch ms) → count from a quern rebin CSV (period,start,end,count). */
function quernCounts(path) {
  const lines = readFileSync(path, 'utf8').trim().split('\n').slice(1);
  return new Map(lines.map((l) => l.split(',')).filter((c) => Number(c[3]) > 0).map((c) => [Date.parse(c[1]), Number(c[3])]));
}

/** Checks quern's counts against another tool's "start-ms,count" lines; returns a one-line verdict. */
function check(name, path, stdout) {
  const mine = quernCounts(path);
  const theirs = new Map(stdout.trim().split('\n').map((l) => l.split(',').map(Number)));
  const same = mine.size === theirs.size && [...theirs].every(([k, v]) => mine.get(k) === v);
  return `${same ? 'same' : 'DIFFERENT'} counts as ${name} (${theirs.size} periods)`;
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const load0 = loadavg();
const results = [];
const checks = [];
for (const rows of sizes) {
  const file = join(dir, `events-${rows}.csv`);
  process.stderr.write(`bench: generating ${rows.toLocaleString('en-US')} rows… `);
  generate(file, rows);
  const mb = statSync(file).size / 1e6;
  process.stderr.write(`${mb.toFixed(0)} MB\n`);
  const runs0 = approaches(file, rows);
  let quotedFile = null;
  if (!skip.has('quoted') && quotedApproaches(file, rows).length > 0) {
    quotedFile = join(dir, `events-quoted-${rows}.csv`);
    generate(quotedFile, rows, true);
  }
  const all = [...runs0.map((a) => ({ ...a, file, mb })), ...(quotedFile === null ? [] : quotedApproaches(quotedFile, rows).map((a) => ({ ...a, file: quotedFile, mb: statSync(quotedFile).size / 1e6 })))];
  // Rounds: each approach runs once a round, in the same order, so that a machine that slows down or
  // speeds up during the run shifts every approach alike and the ratios of the medians hold.
  const runsOf = all.map(() => []);
  const failed = new Set();
  for (let i = 0; i < repeat; i++) {
    process.stderr.write(`  round ${i + 1} of ${repeat}\n`);
    for (const [k, a] of all.entries()) {
      if (failed.has(k) || (a.once && i > 0)) continue;
      try {
        runsOf[k].push(timed(...a.run));
      } catch (e) {
        process.stderr.write(`bench: ${a.name}: ${e.message}\n`);
        failed.add(k);
      }
    }
  }
  for (const [k, a] of all.entries()) {
    if (failed.has(k)) continue;
    const runs = runsOf[k];
    const wall = median(runs.map((r) => r.wall));
    const rss = Math.max(...runs.map((r) => r.rss));
    const cpu = median(runs.map((r) => r.cpu));
    results.push({ rows, mb: a.mb, name: a.name, pair: a.pair, ref: a.ref, startup: a.startup === true, wall, cpu, rss });
    process.stderr.write(`  ${a.name}: ${wall.toFixed(2)} s\n`);
    if (a.ref !== undefined) {
      const q = approaches(file, rows).find((x) => x.pair === a.pair && x.out !== undefined);
      if (q !== undefined && existsSync(q.out)) checks.push(`${rows.toLocaleString('en-US')} rows, ${q.name}: ${check(a.name, q.out, runs[0].stdout)}`);
    }
  }
  const weekOut = join(dir, `quern-week-${rows}.csv`);
  const quotedOut = join(dir, `quern-quoted-${rows}.csv`);
  if (existsSync(weekOut) && existsSync(quotedOut)) {
    const a = quernCounts(weekOut);
    const b = quernCounts(quotedOut);
    const same = a.size === b.size && [...a].every(([k, v]) => b.get(k) === v);
    checks.push(`${rows.toLocaleString('en-US')} rows, quern rebin --unit iso-week: ${same ? 'same' : 'DIFFERENT'} counts with every field quoted (${a.size} periods)`);
  }
  if (quotedFile !== null && !keep) rmSync(quotedFile, { force: true });
}

const pad = (s, n) => String(s).padEnd(n);
const lpad = (s, n) => String(s).padStart(n);
const fmt = (x, d = 2) => (x === undefined || Number.isNaN(x) ? '-' : x.toFixed(d));
const table = [];
const header = ['approach', 'rows', 'wall s', 'cpu s', 'MB/s', 'Mrows/s', 'peak MB', '×newline', '×newline cpu', '×faster DuckDB', '×faster naive'];
for (const r of results) {
  const same = results.filter((x) => x.rows === r.rows);
  const nl = same.find((x) => x.name === 'newline count (chunked read)');
  const dk = r.pair && !r.ref ? same.find((x) => x.pair === r.pair && x.ref === 'duckdb') : undefined;
  // The naive script runs on 1M rows only: compare rows per second.
  const nv = r.pair && !r.ref ? results.find((x) => x.pair === r.pair && x.ref === 'naive') : undefined;
  if (r.startup) {
    // Reads no file: its wall time is the part of every other row's that is Node starting.
    table.push([r.name, '-', fmt(r.wall), fmt(r.cpu), '-', '-', fmt(r.rss, 0), '-', '-', '-', '-']);
    continue;
  }
  table.push([
    r.name, r.rows.toLocaleString('en-US'), fmt(r.wall), fmt(r.cpu), fmt(r.mb / r.wall, 0), fmt(r.rows / r.wall / 1e6), fmt(r.rss, 0),
    nl ? fmt(r.wall / nl.wall) : '-', nl ? fmt(r.cpu / nl.cpu) : '-', dk ? fmt(dk.wall / r.wall, 1) : '-', nv ? fmt(r.rows / r.wall / (nv.rows / nv.wall), 0) : '-',
  ]);
}
const load1 = loadavg();
const machine = `${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC, ${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, Node ${process.version}, ` +
  `load average ${load0.map((x) => x.toFixed(1)).join(' ')} → ${load1.map((x) => x.toFixed(1)).join(' ')}`;
const widths = header.map((h, c) => Math.max(h.length, ...table.map((row) => String(row[c]).length)) + 2);
console.log(`\nquern benchmark — ${machine}`);
console.log(header.map((h, c) => (c === 0 ? pad(h, widths[c]) : lpad(h, widths[c]))).join(''));
for (const row of table) console.log(row.map((v, c) => (c === 0 ? pad(v, widths[c]) : lpad(v, widths[c]))).join(''));
const notes = [`times are medians of ${repeat} rounds, each approach once a round (the naive script once)`];
if (droppedEnv.length > 0) notes.push(`child processes ran without ${droppedEnv.join(', ')} (set on this machine; see the top of test/bench/run.mjs), every approach alike`);
for (const c of checks) console.log(`check: ${c}`);
for (const n of notes) console.log(`note: ${n}`);
const md = [`quern benchmark — ${machine}`, '', `| ${header.join(' | ')} |`, `|${header.map((_, c) => (c === 0 ? ' --- ' : ' ---: ')).join('|')}|`,
  ...table.map((row) => `| ${row.join(' | ')} |`), '', ...checks.map((c) => `- check: ${c}`), ...notes.map((n) => `- note: ${n}`)].join('\n');
mkdirSync(join(root, 'test-output'), { recursive: true });
writeFileSync(join(root, 'test-output', 'bench.json'), JSON.stringify({ machine, results, checks, notes }, null, 2));
writeFileSync(join(root, 'test-output', 'bench.md'), `${md}\n`);
if (!keep) rmSync(dir, { recursive: true, force: true });
else console.log(`data kept in ${dir}`);
