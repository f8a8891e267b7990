// openOutput: atomic file output (temporary file renamed on commit) and quiet ends on a closed pipe.
import { existsSync, readdirSync, readFileSync, statSync, chmodSync } from 'node:fs';
import { join } from 'node:path';
import { PassThrough, Writable } from 'node:stream';
import { afterAll, describe, expect, it } from 'vitest';
import { QuernError } from '../../src/errors.js';
import { abortOpenOutputs, abortOpenOutputsSync, openOutput } from '../../src/table/index.js';
import { tempDir } from './helpers.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());

describe('openOutput(path) to a file', () => {
  it('writes nothing at the target until commit(), then renames the temporary file over it', async () => {
    const target = join(tmp.dir, 'out.csv');
    const out = await openOutput(target);
    await out.write('a,b\n');
    await out.write('x'.repeat(200_000) + '\n');
    expect(existsSync(target)).toBe(false);
    expect(readdirSync(tmp.dir).some((n) => n.startsWith('.out.csv.') && n.endsWith('.quern-tmp'))).toBe(true);
    await out.commit();
    expect(readFileSync(target, 'utf8')).toBe('a,b\n' + 'x'.repeat(200_000) + '\n');
    expect(readdirSync(tmp.dir).filter((n) => n.endsWith('.quern-tmp'))).toEqual([]);
  });

  it('writes bytes in order with the text around them', async () => {
    const target = join(tmp.dir, 'bytes.csv');
    const out = await openOutput(target);
    await out.write('a,b\n');
    const chunk = Buffer.from('1,2\n3,4\n');
    await out.writeBytes(chunk);
    chunk.fill(0x7a); // reusable once the promise resolved
    await out.write('5,6\n');
    await out.commit();
    expect(readFileSync(target, 'utf8')).toBe('a,b\n1,2\n3,4\n5,6\n');
  });

  it('leaves an existing file intact after abort()', async () => {
    const target = tmp.file('keep.csv', 'precious\n');
    const out = await openOutput(target);
    await out.write('half a result');
    await out.abort();
    await out.abort(); // twice is fine
    expect(readFileSync(target, 'utf8')).toBe('precious\n');
    expect(readdirSync(tmp.dir).filter((n) => n.endsWith('.quern-tmp'))).toEqual([]);
  });

  it('keeps the permission bits of the file it replaces', async () => {
    const target = tmp.file('mode.csv', 'old\n');
    chmodSync(target, 0o640);
    const out = await openOutput(target);
    await out.write('new\n');
    await out.commit();
    expect(statSync(target).mode & 0o777).toBe(0o640);
    expect(readFileSync(target, 'utf8')).toBe('new\n');
  });

  it('refuses writes after commit, and abortOpenOutputs() removes uncommitted temporary files', async () => {
    const a = await openOutput(join(tmp.dir, 'a.csv'));
    await a.commit();
    await expect(a.write('x')).rejects.toMatchObject({ code: 'E_INTERNAL' });
    const b = await openOutput(join(tmp.dir, 'b.csv'));
    await b.write('x');
    await abortOpenOutputs();
    const c = await openOutput(join(tmp.dir, 'c.csv'));
    abortOpenOutputsSync();
    expect(readdirSync(tmp.dir).filter((n) => n.endsWith('.quern-tmp'))).toEqual([]);
    expect(existsSync(join(tmp.dir, 'b.csv'))).toBe(false);
    void c;
  });

  it.each([
    ['a folder', () => tmp.dir, 'is a folder, not a file'],
    ['a missing folder', () => join(tmp.dir, 'no', 'such', 'x.csv'), 'its folder does not exist'],
  ])('throws E_OUTPUT for %s', async (_name, path, message) => {
    const p = path();
    const e = await openOutput(p).then(() => undefined, (err: unknown) => err);
    expect(e).toBeInstanceOf(QuernError);
    expect((e as QuernError).code).toBe('E_OUTPUT');
    expect((e as QuernError).message).toBe(`${p}: ${message}`);
  });
});

describe("openOutput('-', { stdout })", () => {
  it('writes through to the stream on commit', async () => {
    let text = '';
    const out = await openOutput('-', { stdout: { write: (s: string) => { text += s; return true; } } });
    await out.write('a\n');
    await out.write('b\n');
    await out.commit();
    expect(text).toBe('a\nb\n');
  });

  it('ends quietly when the reader has gone (EPIPE), dropping later writes', async () => {
    const dead = new Writable({
      write(_chunk, _enc, cb) {
        cb(Object.assign(new Error('write EPIPE'), { code: 'EPIPE' }));
      },
    });
    const out = await openOutput('-', { stdout: dead });
    for (let i = 0; i < 50 && !out.closed; i++) await out.write('y'.repeat(70_000));
    await out.commit();
    await new Promise((r) => setImmediate(r));
    expect(out.closed).toBe(true);
    await out.write('more');
    await out.commit();
  });

  it('waits for drain under backpressure', async () => {
    const slow = new PassThrough({ highWaterMark: 16 });
    let received = 0;
    const out = await openOutput('-', { stdout: slow });
    const writing = (async () => {
      for (let i = 0; i < 10; i++) await out.write('z'.repeat(70_000));
      await out.commit();
    })();
    slow.on('data', (c: Buffer) => (received += c.length));
    await writing;
    await new Promise((r) => setImmediate(r));
    expect(received).toBe(700_000);
  });

  it('writes bytes after the queued text, and a reused chunk reaches a slow reader as it was when written', async () => {
    // A Writable that takes each chunk later (as a pipe to a slow reader does) and keeps it un-copied.
    const got: Buffer[] = [];
    const lazy = new Writable({
      highWaterMark: 1 << 22,
      write(chunk: Buffer, _enc, cb) {
        setTimeout(() => { got.push(Buffer.from(chunk)); cb(); }, 5);
      },
    });
    const out = await openOutput('-', { stdout: lazy });
    await out.write('head\n');
    const chunk = Buffer.alloc(100_000);
    for (let i = 0; i < 5; i++) {
      chunk.fill(0x61 + i); // the writer refills the same buffer, as CsvByteWriter does
      await out.writeBytes(chunk);
    }
    await out.write('tail\n');
    await out.commit();
    await new Promise<void>((r) => lazy.end(r));
    const expected = 'head\n' + ['a', 'b', 'c', 'd', 'e'].map((c) => c.repeat(100_000)).join('') + 'tail\n';
    expect(Buffer.concat(got).toString('latin1')).toBe(expected);
  });

  it('needs a stream', async () => {
    await expect(openOutput('-')).rejects.toMatchObject({ code: 'E_USAGE' });
  });
});
