#!/usr/bin/env node
// Peak memory of every streaming command on generated tables (issue #9, "Load"): for each command, the
// wall time, CPU time (user + system) and peak resident memory that /usr/bin/time reports for the built
// CLI, printed as a markdown table. The data are written into a temporary folder (os.tmpdir(), never
// committed) and deleted at the end. `period` and `sql` read no data file, so they are not measured.
//
//   npx tsc -p . && node test/bench/memory.mjs [--rows 10000000] [--only rebin,overlaps] [--threads 1]
//     [--cli path/to/quern.cjs] [--keep]
//
// One command runs at a time. On a shared machine run it under `nice`, and read the wall column with the
// load average printed above the table.
import { spawnSync } from 'node:child_process';
import { closeSync, existsSync, mkdtempSync, openSync, readFileSync, rmSync, statSync, writeSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : dflt;
};
const rows = Number(opt('rows', '10000000'));
const threads = opt('threads', '1');
const only = opt('only', '') ? new Set(opt('only', '').split(',')) : null;
const cli = opt('cli', join(root, 'dist', 'quern.cjs'));
if (!Number.isSafeInteger(rows) || rows < 1) {
  console.error('memory bench: --rows needs a whole number');
  process.exit(2);
}
if (!existsSync(cli)) {
  console.error(`memory bench: build first (npx tsc -p .): ${cli} is missing`);
  process.exit(2);
}
if (!existsSync('/usr/bin/time')) {
  console.error('memory bench: needs /usr/bin/time (GNU time) for CPU and peak memory');
  process.exit(2);
}

/** A seeded generator (mulberry32), so every run measures the same files. */
function seeded(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Writes `header` and `rows` lines made by `line(i)`, 100,000 lines per write. */
function write(path, header, line) {
  const fd = openSync(path, 'w');
  writeSync(fd, `${header}\n`);
  let chunk = [];
  for (let i = 0; i < rows; i++) {
    chunk.push(line(i));
    if (chunk.length === 100_000) {
      writeSync(fd, `${chunk.join('\n')}\n`);
      chunk = [];
    }
  }
  if (chunk.length) writeSync(fd, `${chunk.join('\n')}\n`);
  closeSync(fd);
}

const dir = mkdtempSync(join(tmpdir(), 'quern-bench-memory-'));
const DAY = 86_400_000;
const files = {
  // The shape of the speed benchmark's table: ISO 8601 UTC instants over three years, 40 sites, ages, amounts.
  events: {
    name: 'events.csv',
    make(path) {
      const rand = seeded(12345);
      const start = Date.UTC(2021, 0, 1), span = 3 * 365 * DAY;
      write(path, 'ts,site,age,amount', (i) => {
        const ms = start + Math.floor((i / rows) * span) + Math.floor(rand() * 60_000);
        return `${new Date(ms).toISOString().slice(0, 19)}Z,site${Math.floor(rand() * 40)},${Math.floor(rand() * 95)},${(rand() * 500).toFixed(2)}`;
      });
    },
  },
  // Whole-number ranges: 100,000 keys with one range per round, each round's ranges touching the next
  // (0-99, 100-199, …) except about 1 in 100 whose start moves by up to 2: an overlap or a hole.
  numeric: {
    name: 'numeric-ranges.csv',
    make(path) {
      const rand = seeded(20240310);
      write(path, 'key,start,end', (i) => {
        const a = Math.floor(i / 100_000) * 100, shift = rand() < 0.01 ? Math.floor(rand() * 5) - 2 : 0;
        return `K${i % 100_000},${a + shift},${a + 99}`;
      });
    },
  },
  // Inclusive date ranges: 100,000 people with a run of 30-day spells, each touching the next, except about
  // 1 in 100 whose start moves by up to 2 days.
  dates: {
    name: 'date-ranges.csv',
    make(path) {
      const rand = seeded(20240311);
      const day = (d) => new Date(Date.UTC(2000, 0, 1) + d * DAY).toISOString().slice(0, 10);
      write(path, 'person,start,end', (i) => {
        const s = Math.floor(i / 100_000) * 30, shift = rand() < 0.01 ? Math.floor(rand() * 5) - 2 : 0;
        return `P${i % 100_000},${day(s + shift)},${day(s + 29)}`;
      });
    },
  },
};

const EDGES = Array.from({ length: 18 }, (_, i) => 5 * i).join(',');
const cases = [
  { id: 'profile', file: 'events', argv: ['profile', '@', '--json'] },
  { id: 'grain', file: 'events', argv: ['grain', '@', '--column', 'ts', '--json'] },
  { id: 'rebin', file: 'events', argv: ['rebin', '@', '--time', 'ts', '--unit', 'iso-week', '-q'] },
  { id: 'rebin', file: 'events', argv: ['rebin', '@', '--time', 'ts', '--unit', 'quarter', '--zone', 'America/New_York', '-q'] },
  { id: 'rebin', file: 'events', argv: ['rebin', '@', '--time', 'ts', '--unit', 'day', '--by', 'site', '--agg', 'count', '--agg', 'sum:amount', '--agg', 'median:amount', '-q'] },
  { id: 'gaps', file: 'events', argv: ['gaps', '@', '--time', 'ts', '--unit', 'hour', '--json'] },
  { id: 'gaps', file: 'events', argv: ['gaps', '@', '--time', 'ts', '--unit', 'day', '--by', 'site', '--json'] },
  { id: 'overlaps', file: 'numeric', argv: ['overlaps', '@', '--start', 'start', '--end', 'end', '--json'] },
  { id: 'overlaps', file: 'numeric', argv: ['overlaps', '@', '--start', 'start', '--end', 'end', '--by', 'key', '--json'] },
  { id: 'overlaps', file: 'dates', argv: ['overlaps', '@', '--start', 'start', '--end', 'end', '--json'] },
  { id: 'overlaps', file: 'dates', argv: ['overlaps', '@', '--start', 'start', '--end', 'end', '--by', 'person', '--json'] },
  { id: 'bucket', file: 'events', argv: ['bucket', '@', '--value', 'age', '--edges', EDGES, '--open-high', '--out', '/dev/null', '-q'] },
  { id: 'bucket', file: 'events', argv: ['bucket', '@', '--value', 'amount', '--method', 'quantile', '--bins', '5', '--summary', '--json'] },
  { id: 'bucket', file: 'events', argv: ['bucket', '@', '--value', 'amount', '--method', 'ckmeans', '--bins', '5', '--summary', '--json'] },
];

/** True when `quern COMMAND --help` lists the option (so the bench runs on builds with and without it). */
const helpCache = new Map();
function hasOption(command, option) {
  if (!helpCache.has(command)) helpCache.set(command, spawnSync(process.execPath, [cli, command, '--help'], { encoding: 'utf8' }).stdout ?? '');
  return helpCache.get(command).includes(option);
}

/** Runs one command under /usr/bin/time, standard output thrown away; returns its figures. */
function measure(argv) {
  const report = join(dir, 'time.txt');
  const r = spawnSync('/usr/bin/time', ['-o', report, '-f', '%e %M %U %S', process.execPath, cli, ...argv], {
    cwd: root, stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8', maxBuffer: 1 << 24,
  });
  const [wall, kb, user, sys] = readFileSync(report, 'utf8').trim().split('\n').pop().split(' ').map(Number);
  const err = (r.stderr ?? '').trim().split('\n').filter((l) => !l.startsWith('Command exited')).pop() ?? '';
  return { wall, cpu: user + sys, mb: kb / 1024, status: r.status, err };
}

const made = new Set();
const table = [];
console.log(`quern memory benchmark — ${new Date().toISOString()}, ${rows.toLocaleString('en-US')} rows, ${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, Node ${process.version}, load ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
for (const c of cases) {
  if (only && !only.has(c.id)) continue;
  const f = files[c.file];
  const path = join(dir, f.name);
  if (!made.has(c.file)) {
    const t0 = Date.now();
    f.make(path);
    made.add(c.file);
    console.log(`generated ${f.name}: ${(statSync(path).size / 1e6).toFixed(0)} MB in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
  }
  const argv = c.argv.map((a) => (a === '@' ? path : a));
  if (hasOption(c.id, '--threads')) argv.push('--threads', threads);
  const m = measure(argv);
  const mbs = statSync(path).size / 1e6 / m.wall;
  const shown = argv.map((a) => (a === path ? f.name : a)).join(' ');
  table.push(`| \`quern ${shown}\` | ${m.wall.toFixed(2)} | ${m.cpu.toFixed(2)} | ${m.mb.toFixed(0)} | ${mbs.toFixed(1)} | ${m.status}${m.status > 1 ? ` ${m.err.slice(0, 80).replaceAll('|', '/')}` : ''} |`);
  console.log(table[table.length - 1]);
}
console.log('');
console.log(`| command (${rows.toLocaleString('en-US')} rows) | wall s | CPU s (user+sys) | peak RSS MB | MB/s (wall) | exit |`);
console.log('| --- | ---: | ---: | ---: | ---: | --- |');
for (const line of table) console.log(line);
console.log(`\nload average at the end: ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
if (args.includes('--keep')) console.log(`data kept in ${dir}`);
else rmSync(dir, { recursive: true, force: true });
