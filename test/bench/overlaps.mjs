#!/usr/bin/env node
// Benchmark of `quern overlaps` on generated files (written into a temporary folder, never committed):
// a million random numeric ranges, a million identical ranges, and a million date ranges over many keys.
// Prints wall time, user CPU and peak resident memory of the built CLI, as /usr/bin/time reports them.
//
//   npx tsc -p . && node test/bench/overlaps.mjs [--rows 1000000] [--repeat 1] [--only random,identical] [--keep]
//     [--cli path/to/quern.cjs] [--text]   (--text times the human output instead of --json)
import { spawnSync } from 'node:child_process';
import { closeSync, existsSync, mkdtempSync, openSync, rmSync, writeSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : dflt;
};
const rows = Number(opt('rows', '1000000'));
const repeat = Number(opt('repeat', '1'));
const extra = opt('args', '') ? opt('args', '').split(' ') : ['--json'];
const only = opt('only', '') ? new Set(opt('only', '').split(',')) : null;
const cli = opt('cli', join(root, 'dist', 'quern.cjs'));
if (!existsSync(cli)) {
  console.error('bench: build first (npx tsc -p .)');
  process.exit(2);
}
if (!existsSync('/usr/bin/time')) {
  console.error('bench: needs /usr/bin/time for CPU and peak memory');
  process.exit(2);
}

/** A seeded generator (mulberry32), so every run checks the same files. */
function seeded(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function write(path, header, line) {
  const fd = openSync(path, 'w');
  writeSync(fd, `${header}\n`);
  let chunk = [];
  for (let i = 0; i < rows; i++) {
    chunk.push(line(i));
    if (chunk.length === 100_000) { writeSync(fd, `${chunk.join('\n')}\n`); chunk = []; }
  }
  if (chunk.length) writeSync(fd, `${chunk.join('\n')}\n`);
  closeSync(fd);
}

const dir = mkdtempSync(join(tmpdir(), 'quern-bench-overlaps-'));
const rand = seeded(20240310);
const day = (d) => new Date(Date.UTC(2020, 0, 1) + d * 86_400_000).toISOString().slice(0, 10);
const cases = [
  {
    name: 'random integer ranges (start/end)',
    id: 'random',
    file: 'random.csv',
    make: (p) => write(p, 'start,end', () => {
      const a = Math.floor(rand() * 100_000_000);
      return `${a},${a + Math.floor(rand() * 200)}`;
    }),
    argv: ['--start', 'start', '--end', 'end'],
  },
  { name: 'identical ranges (start/end)', id: 'identical', file: 'identical.csv', make: (p) => write(p, 'start,end', () => '5,10'), argv: ['--start', 'start', '--end', 'end'] },
  {
    name: 'random range labels (--range)',
    id: 'labels',
    file: 'labels.csv',
    make: (p) => write(p, 'band', () => {
      const a = Math.floor(rand() * 100_000_000);
      return `${a}-${a + Math.floor(rand() * 200)}`;
    }),
    argv: ['--range', 'band'],
  },
  {
    name: 'date ranges per key (--by, 100,000 keys)',
    id: 'keys',
    file: 'keys.csv',
    make: (p) => write(p, 'person,start,end', (i) => {
      const k = i % 100_000;
      const s = Math.floor(i / 100_000) * 30 + Math.floor(rand() * 3);
      return `P${k},${day(s)},${day(s + 29 + Math.floor(rand() * 3) - 1)}`;
    }),
    argv: ['--start', 'start', '--end', 'end', '--by', 'person'],
  },
];

function timed(argv) {
  const r = spawnSync('/usr/bin/time', ['-f', '%e %U %S %M', 'node', cli, 'overlaps', ...argv], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 28 });
  if (r.status !== 0 && r.status !== 1) throw new Error(`quern overlaps ${argv.join(' ')} failed (${r.status}): ${r.stderr.slice(-500)}`);
  const [wall, user, sys, kb] = r.stderr.trim().split('\n').pop().split(' ').map(Number);
  return { wall, user, sys, rss: kb / 1024, status: r.status, out: r.stdout };
}

/** The totals of a --json output, and its size. */
function jsonSummary(out) {
  const j = JSON.parse(out);
  return `${j.ranges} ranges, ${j.totals.overlaps} overlaps, ${j.totals.holes} holes, ${j.totals.duplicates} duplicates, ${j.totals.series} series; ${(out.length / 1e6).toFixed(1)} MB of JSON`;
}

console.log(`quern overlaps benchmark — ${new Date().toISOString()}, ${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, Node ${process.version}, load ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
console.log(`${'case'.padEnd(44)}${'rows'.padStart(11)}${'wall s'.padStart(8)}${'user s'.padStart(8)}${'sys s'.padStart(7)}${'peak MB'.padStart(9)}  result`);
for (const c of cases) {
  if (only && !only.has(c.id)) continue;
  const path = join(dir, c.file);
  c.make(path);
  for (let i = 0; i < repeat; i++) {
    const t = timed([path, ...c.argv, ...extra]);
    const summary = extra.includes('--json') ? jsonSummary(t.out) : `${(t.out.length / 1e6).toFixed(1)} MB of text: ${t.out.split('\n', 2).join(' / ')}`;
    console.log(`${c.name.padEnd(44)}${rows.toLocaleString('en-US').padStart(11)}${t.wall.toFixed(2).padStart(8)}${t.user.toFixed(2).padStart(8)}${t.sys.toFixed(2).padStart(7)}${t.rss.toFixed(0).padStart(9)}  ${summary}`);
  }
}
if (args.includes('--keep')) console.log(`data kept in ${dir}`);
else rmSync(dir, { recursive: true, force: true });
