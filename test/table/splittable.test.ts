// TableReader.splittable: byte ranges need a plain CSV/TSV file read by the fast engine (common practice:
// a gzip stream or a pipe cannot be entered at an offset, and NDJSON/csv-parse take no byte ranges).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { gzipSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { openTable } from '../../src/table/index.js';
import type { TableOptions } from '../../src/table/types.js';

const dir = mkdtempSync(join(tmpdir(), 'quern-splittable-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const csv = 'a,b\n1,2\n';
writeFileSync(join(dir, 't.csv'), csv);
writeFileSync(join(dir, 't.csv.gz'), gzipSync(csv));
writeFileSync(join(dir, 't.ndjson'), '{"a":1,"b":2}\n');

describe('openTable(file).splittable', () => {
  it.each<[string, string, TableOptions, boolean]>([
    ['a plain CSV file', 't.csv', {}, true],
    ['a gzipped file', 't.csv.gz', {}, false],
    ['an NDJSON file', 't.ndjson', {}, false],
    ['the reference engine', 't.csv', { engine: 'reference' }, false],
  ])('%s: %s', async (_what, name, options, want) => {
    const r = await openTable(join(dir, name), options);
    expect(r.splittable).toBe(want);
    r.close();
  });

  it('is false for standard input', async () => {
    const r = await openTable('-', { stdin: Readable.from([Buffer.from(csv)]) });
    expect(r.splittable).toBe(false);
    r.close();
  });
});
