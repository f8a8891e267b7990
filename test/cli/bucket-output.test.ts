// Where `quern bucket` writes its rows: a file (atomically), or a target that is not a regular file — a
// FIFO here, a character device such as /dev/null in the bench — written in place, never replaced by a file.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { createReadStream } from 'node:fs';
import { mkdtemp, readFile, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../helpers/cli.js';

const VISITS = 'fixtures/visits.csv';
let dir = '';
let fifoOk = true;
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'quern-bucket-out-'));
  try { execFileSync('mkfifo', [join(dir, 'pipe')]); } catch { fifoOk = false; }
});
afterAll(async () => { await rm(dir, { recursive: true, force: true }); });

describe('quern bucket --out', () => {
  it('quern bucket --out FIFO writes the rows into the FIFO, which stays a FIFO (POSIX mkfifo; common practice: never rename over a device)', async (t) => {
    if (!fifoOk) t.skip();
    const args = ['bucket', VISITS, '--value', 'patient_age', '--edges', '0,5,15,45,65', '--open-high', '-q'];
    const file = await runCli([...args, '--out', join(dir, 'rows.csv')]);
    expect(file.status).toBe(0);
    const fifo = join(dir, 'pipe');
    const chunks: Buffer[] = [];
    const read = new Promise<void>((res, rej) => createReadStream(fifo).on('data', (c) => chunks.push(c as Buffer)).on('end', () => res()).on('error', rej));
    const r = await runCli([...args, '--out', fifo]);
    await read;
    expect(r.status).toBe(0);
    expect(Buffer.concat(chunks).equals(await readFile(join(dir, 'rows.csv')))).toBe(true);
    expect((await stat(fifo)).isFIFO()).toBe(true);
  });

  it('quern bucket --out FILE writes a header with the label and index columns and one row per data row of the demo visits', async () => {
    const out = join(dir, 'visits-banded.csv');
    const r = await runCli(['bucket', VISITS, '--value', 'patient_age', '--scheme', 'five-year-85', '--out', out, '-q']);
    expect(r.status).toBe(0);
    const lines = (await readFile(out, 'utf8')).trimEnd().split('\n');
    const source = (await readFile(VISITS, 'utf8')).trimEnd().split('\n');
    expect(lines[0]).toBe(`${source[0]},patient_age_range,patient_age_range_index`);
    expect(lines.length).toBe(source.length); // the demo file has no quoted line breaks (fixtures/generate.mjs)
    // A row's label and index match its age under the five-year groups (common practice, ages in completed years).
    const [ageAt] = [source[0]!.split(',').indexOf('patient_age')];
    for (const line of lines.slice(1, 200)) {
      const cells = line.split(',');
      const age = Number(cells[ageAt]);
      const k = Math.min(Math.floor(age / 5), 17);
      expect(cells.at(-1)).toBe(String(k));
      expect(cells.at(-2)).toBe(k === 17 ? '85+' : `${5 * k}-${5 * k + 4}`);
    }
  });

  it('quern bucket --summary --threads 0 is a usage error (exit 2, cli/exit.ts) naming the option', async () => {
    const r = await runCli(['bucket', VISITS, '--value', 'patient_age', '--scheme', 'five-year-85', '--summary', '--threads', '0']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('--threads "0"');
  });

  it('quern bucket --summary --json gives the same counts with --threads 1 and --threads 2 (the demo file is read on one thread below 32 MB)', async () => {
    const args = ['bucket', VISITS, '--value', 'patient_age', '--scheme', 'five-year-85', '--summary', '--json'];
    const one = await runCli([...args, '--threads', '1']);
    const two = await runCli([...args, '--threads', '2']);
    expect(one.status).toBe(0);
    expect(two.stdout).toBe(one.stdout);
  });
});
