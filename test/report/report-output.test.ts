import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { afterAll, describe, expect, it } from 'vitest';
import { writeReport } from '../../cli/report-output.js';
import type { CliIO } from '../../cli/io.js';
import { isQuernError } from '../../src/index.js';

const dir = mkdtempSync(join(tmpdir(), 'quern-report-out-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const io: CliIO = { stdout: { write: () => true }, stderr: { write: () => true }, stdin: Readable.from([]), env: {}, cwd: dir };

describe('writeReport(path, render, io)', () => {
  it('writeReport(undefined, ...) writes nothing and never renders', async () => {
    let rendered = false;
    await writeReport(undefined, () => { rendered = true; return 'x'; }, io);
    expect(rendered).toBe(false);
  });

  it('writeReport(path, ...) writes the page relative to io.cwd and leaves no temporary file', async () => {
    await writeReport('r.html', async () => '<!DOCTYPE html><p>ok</p>', io);
    expect(readFileSync(join(dir, 'r.html'), 'utf8')).toBe('<!DOCTYPE html><p>ok</p>');
    expect(readdirSync(dir)).toEqual(['r.html']);
  });

  it('writeReport(path, failing render) keeps the old file and throws the render error', async () => {
    await expect(writeReport('r.html', () => { throw new Error('boom'); }, io)).rejects.toThrow('boom');
    expect(readFileSync(join(dir, 'r.html'), 'utf8')).toBe('<!DOCTYPE html><p>ok</p>');
    expect(readdirSync(dir)).toEqual(['r.html']);
  });

  it("writeReport('-', ...) is a usage error: standard output keeps the command's own output", async () => {
    const e = await writeReport('-', () => 'x', io).catch((x: unknown) => x);
    expect(isQuernError(e, 'E_USAGE')).toBe(true);
  });

  it('writeReport(path in a missing folder, ...) fails with E_OUTPUT', async () => {
    const e = await writeReport(join('no', 'such', 'dir', 'r.html'), () => 'x', io).catch((x: unknown) => x);
    expect(isQuernError(e, 'E_OUTPUT')).toBe(true);
    expect(existsSync(join(dir, 'no'))).toBe(false);
  });
});
