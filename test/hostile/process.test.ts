// The built program as a child process: a reader that goes away (`quern rebin big.csv | head -1`) ends it
// quietly, and Ctrl-C (SIGINT) part way through `--out FILE` leaves neither the file nor half of it.
// Needs the build (`npx tsc -p .`, done by `npm run build` in CI).
import { spawn } from 'node:child_process';
import { closeSync, existsSync, openSync, readdirSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BIN, STACK_LINE, scratch } from './helpers.js';

const tmp = scratch('process');
afterAll(() => tmp.cleanup());
let big = '';

/** One row per minute for `rows` minutes from 2024-01-01T00:00Z: every row its own minute period. */
function writeMinutes(path: string, rows: number): void {
  const fd = openSync(path, 'w');
  writeSync(fd, 't,v\n');
  const t0 = Date.UTC(2024, 0, 1);
  let chunk = '';
  for (let i = 0; i < rows; i++) {
    chunk += `${new Date(t0 + i * 60_000).toISOString()},${i}\n`;
    if (chunk.length > 1 << 20) { writeSync(fd, chunk); chunk = ''; }
  }
  writeSync(fd, chunk);
  closeSync(fd);
}

beforeAll(() => {
  big = join(tmp.dir, 'big.csv');
  writeMinutes(big, 400_000); // ~14 MB in, 400,000 periods out (under the 500,000 --max-periods cap)
});

interface Ended { code: number | null; signal: string | null; stderr: string }

function ended(child: ReturnType<typeof spawn>, stderr: { text: string }): Promise<Ended> {
  return new Promise((res) => child.on('close', (code, signal) => res({ code, signal, stderr: stderr.text })));
}

describe('quern as a child process', () => {
  it('rebin big.csv | head -1 ends quietly with status 0 and no stack trace when the reader goes away', async () => {
    const child = spawn(process.execPath, [BIN, 'rebin', big, '--time', 't', '--unit', 'minute'], { stdio: ['ignore', 'pipe', 'pipe'] });
    const err = { text: '' };
    child.stderr!.on('data', (d: Buffer) => { err.text += d.toString(); });
    let first = '';
    child.stdout!.once('data', (d: Buffer) => {
      first = d.toString().split('\n')[0]!;
      child.stdout!.destroy(); // what `head -1` does after its first line
    });
    const r = await ended(child, err);
    expect(first).toBe('period,start,end,count');
    expect(r.stderr).not.toMatch(STACK_LINE);
    expect(r.stderr).not.toMatch(/EPIPE|Error/);
    expect([r.code, r.signal]).toEqual([0, null]);
  });

  it.each([
    ['rebin', ['--time', 't', '--unit', 'minute']],
    ['bucket', ['--value', 'v', '--edges', '0,1000,100000', '--open-high']],
  ])('%s --out FILE interrupted by SIGINT part way leaves no output file', async (command, args) => {
    const dir = join(tmp.dir, `sigint-${command}`);
    const out = join(dir, 'result.csv');
    await import('node:fs/promises').then((fs) => fs.mkdir(dir));
    const child = spawn(process.execPath, [BIN, command, big, ...args, '--out', out], { stdio: ['ignore', 'ignore', 'pipe'] });
    const err = { text: '' };
    child.stderr!.on('data', (d: Buffer) => { err.text += d.toString(); });
    const done = ended(child, err);
    // Interrupt once the temporary file exists (the run is part way through writing), or after 120 s.
    let sawTemp = false;
    for (const until = Date.now() + 120_000; Date.now() < until && child.exitCode === null;) {
      if (readdirSync(dir).some((n) => n.includes('quern-tmp'))) { sawTemp = true; break; }
      await new Promise((r) => setTimeout(r, 10));
    }
    child.kill('SIGINT');
    const r = await done;
    expect(sawTemp, 'the run ended before it could be interrupted').toBe(true);
    expect(r.stderr).not.toMatch(STACK_LINE);
    expect(existsSync(out)).toBe(false);
  }, 180_000);

  // Ctrl-C during `--out FILE`: cli/main.ts removes the half-written temporary file and exits 130.
  it('rebin --out FILE interrupted by SIGINT leaves no temporary file either', async () => {
    const dir = join(tmp.dir, 'sigint-temp');
    await import('node:fs/promises').then((fs) => fs.mkdir(dir));
    const child = spawn(process.execPath, [BIN, 'rebin', big, '--time', 't', '--unit', 'minute', '--out', join(dir, 'r.csv')], { stdio: 'ignore' });
    const done = new Promise((res) => child.on('close', res));
    let sawTemp = false;
    for (const until = Date.now() + 120_000; Date.now() < until && child.exitCode === null;) {
      if (readdirSync(dir).some((n) => n.includes('quern-tmp'))) { sawTemp = true; break; }
      await new Promise((r) => setTimeout(r, 10));
    }
    child.kill('SIGINT');
    await done;
    expect(sawTemp, 'the run ended before it could be interrupted').toBe(true);
    expect(readdirSync(dir)).toEqual([]);
  }, 180_000);
});
