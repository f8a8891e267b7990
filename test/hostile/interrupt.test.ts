// Ctrl-C at any point of a run with `--out FILE` (issue #9, "Load"): the built program is interrupted with
// SIGINT at several moments — at once, as soon as it has opened its input, part way through its input,
// with all of its input but before its end, and while it writes its output — and each time it ends with
// status 130 (128 + SIGINT, the shell convention of POSIX 2.8.2 "Exit Status for Commands"), leaves no
// temporary file beside the output, and leaves a pre-existing output file exactly as it was
// (src/table/output.ts writes to a temporary file in the same folder and renames it only when complete).
// The moments part way through are made exact by feeding the generated file through standard input: the
// test writes 40% (or 85%, or all) of its bytes and sends the signal while the program waits for the rest.
// Needs the build (`npx tsc -p .`).
import { spawn } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, readdirSync, readlinkSync, statSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BIN, STACK_LINE, scratch } from './helpers.js';

const SKIP = existsSync(BIN) ? '' : '(skipped: dist/quern.cjs is not built; run npm run build)';
const linux = process.platform === 'linux' && existsSync('/proc/self/fd');

const tmp = scratch('interrupt');
afterAll(() => tmp.cleanup());
let input = '';
let bytes = Buffer.alloc(0);
const BEFORE = 'an earlier result that must survive\n';

beforeAll(() => {
  if (SKIP) return;
  // 240,000 rows, one per minute from 2024-01-01T00:00Z: about 7 MB.
  input = join(tmp.dir, 'minutes.csv');
  const fd = openSync(input, 'w');
  writeSync(fd, 't,v\n');
  const t0 = Date.UTC(2024, 0, 1);
  let chunk = '';
  for (let i = 0; i < 240_000; i++) {
    chunk += `${new Date(t0 + i * 60_000).toISOString()},${i % 1000}\n`;
    if (chunk.length > 1 << 20) { writeSync(fd, chunk); chunk = ''; }
  }
  writeSync(fd, chunk);
  closeSync(fd);
  bytes = readFileSync(input);
});

/** True when the process has the file open (Linux /proc/PID/fd). */
function hasOpen(pid: number, path: string): boolean {
  for (const fd of readdirSync(`/proc/${pid}/fd`)) {
    try {
      if (readlinkSync(`/proc/${pid}/fd/${fd}`) === path) return true;
    } catch {
      // the descriptor closed while listing
    }
  }
  return false;
}

function tempBytes(dir: string): number {
  const t = readdirSync(dir).find((n) => n.includes('quern-tmp'));
  if (t === undefined) return 0;
  try { return statSync(join(dir, t)).size; } catch { return 0; }
}

/**
 * A moment to interrupt at. `feed` (a fraction of the input's bytes) reads the input from standard input,
 * written by the test up to that fraction and left open; otherwise the input is the file, and `reached`
 * says when the moment has come.
 */
interface Moment { name: string; feed?: number; reached?: (pid: number, dir: string) => boolean; linuxOnly?: boolean }
const MOMENTS: Moment[] = [
  { name: 'at once (before the program may have set its handlers)', reached: () => true },
  { name: 'as soon as it has opened the input', reached: (pid) => hasOpen(pid, input), linuxOnly: true },
  { name: 'part way through the input (40% of its bytes)', feed: 0.4 },
  { name: 'near the end of the input (85% of its bytes)', feed: 0.85 },
  { name: 'with all of the input but before its end', feed: 1 },
  { name: 'while the output is being written', reached: (_pid, dir) => tempBytes(dir) > 0 },
];

interface Outcome { reached: boolean; code: number | null; signal: NodeJS.Signals | null; stderr: string }

/** Writes `data` to the child's standard input in 64 KiB pieces (a pipe's capacity), each once the last is taken. */
async function feed(stdin: NodeJS.WritableStream, data: Buffer): Promise<void> {
  for (let at = 0; at < data.length; at += 1 << 16) {
    await new Promise<void>((res, rej) => stdin.write(data.subarray(at, at + (1 << 16)), (e) => (e ? rej(e) : res())));
  }
}

/** Runs quern with `argv` (FILE standing for the input), sends SIGINT at `moment`, and waits for it to end. */
async function interrupt(argv: string[], dir: string, moment: Moment): Promise<Outcome> {
  const piped = moment.feed !== undefined;
  const child = spawn(process.execPath, [BIN, ...argv.map((a) => (a === 'FILE' ? (piped ? '-' : input) : a))], { stdio: [piped ? 'pipe' : 'ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr!.on('data', (d: Buffer) => { stderr += d.toString(); });
  const done = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((res) => child.on('close', (code, signal) => res({ code, signal })));
  let reached = false;
  if (piped) {
    child.stdin!.on('error', () => undefined); // the child may go before it has read everything
    await feed(child.stdin!, bytes.subarray(0, Math.floor(bytes.length * moment.feed!)));
    reached = child.exitCode === null && child.signalCode === null;
  } else {
    for (const until = Date.now() + 90_000; Date.now() < until && child.exitCode === null && child.signalCode === null;) {
      try {
        if (moment.reached!(child.pid!, dir)) { reached = true; break; }
      } catch {
        break; // the child is gone
      }
      await new Promise((r) => setTimeout(r, 2));
    }
  }
  child.kill('SIGINT');
  return { reached, ...(await done), stderr };
}

const COMMANDS: Array<[string, string[]]> = [
  // rebin aggregates while reading and writes its 240,000 minute periods at the end.
  ['rebin', ['--time', 't', '--unit', 'minute']],
  // bucket writes a row out for every row read, so its temporary file grows while it reads.
  ['bucket', ['--value', 'v', '--edges', '0,100,500', '--open-high']],
];

describe.skipIf(SKIP !== '')(`Ctrl-C at any point of quern … --out FILE ${SKIP}`, () => {
  describe.each(COMMANDS)('quern %s', (command, args) => {
    // The moment "opened the input" needs Linux's /proc; elsewhere it is left out.
    it.each(MOMENTS.filter((m) => linux || !m.linuxOnly).map((m) => [m.name, m] as const))('SIGINT %s: status 130, no temporary file, the earlier output unchanged', async (_name, moment) => {
      const dir = join(tmp.dir, `${command}-${MOMENTS.indexOf(moment)}`);
      mkdirSync(dir);
      const out = join(dir, 'result.csv');
      writeFileSync(out, BEFORE);
      const r = await interrupt([command, 'FILE', ...args, '--out', out], dir, moment);
      expect(r.reached, `the run ended before the moment "${moment.name}" (status ${r.code})`).toBe(true);
      // Signalled before Node ran cli/main.ts's handler, the child dies of SIGINT itself, which a shell
      // reports as 130 too; from the moment the input is open the handler must exit with 130 itself.
      if (moment === MOMENTS[0]) expect(r.code === 130 || r.signal === 'SIGINT', `code ${r.code} signal ${r.signal}`).toBe(true);
      else expect([r.code, r.signal]).toEqual([130, null]);
      expect(r.stderr).not.toMatch(STACK_LINE);
      expect(readdirSync(dir)).toEqual(['result.csv']);
      expect(readFileSync(out, 'utf8')).toBe(BEFORE);
    }, 120_000);

    it('runs to the end when not interrupted, replacing the earlier output (the control case)', async () => {
      const dir = join(tmp.dir, `${command}-control`);
      mkdirSync(dir);
      const out = join(dir, 'result.csv');
      writeFileSync(out, BEFORE);
      const child = spawn(process.execPath, [BIN, command, input, ...args, '--out', out, '-q'], { stdio: 'ignore' });
      const code = await new Promise((res) => child.on('close', res));
      expect(code).toBe(0);
      expect(readdirSync(dir)).toEqual(['result.csv']);
      const text = readFileSync(out, 'utf8');
      expect(text).not.toBe(BEFORE);
      // 240,000 rows in: rebin writes 240,000 minute periods, bucket 240,000 rows (plus the header).
      expect(text.split('\n').filter((l) => l !== '')).toHaveLength(240_001);
    }, 120_000);
  });
});
