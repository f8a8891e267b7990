// Property tests on hostile bytes: no exception escapes but QuernError, and the accounting always adds up.
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { isQuernError } from '../../src/errors.js';
import type { TableEngine } from '../../src/table/index.js';
import { expectAddsUp, readAll, tempDir } from './helpers.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());
const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 200);
// Bytes that matter to a CSV reader, plus NUL, a BOM, Latin-1 and UTF-8 lead/continuation bytes.
const BYTES = [0x61, 0x31, 0x2c, 0x3b, 0x09, 0x7c, 0x22, 0x0a, 0x0d, 0x20, 0x00, 0xef, 0xbb, 0xbf, 0xe9, 0xc3, 0xa9, 0x80, 0xff, 0x7b, 0x7d, 0x3a];
let n = 0;

describe.each(['fast', 'reference'] as TableEngine[])('openTable(file, { engine: %s }) on random bytes', (engine) => {
  it('throws only QuernError and accounts for every row otherwise', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.constantFrom(...BYTES), { maxLength: 300 }),
        fc.constantFrom(1, 5, 64, 65536),
        fc.constantFrom('csv', 'ndjson', 'sniff'),
        async (bytes, chunkSize, kind) => {
          const name = `fuzz-${n++}.${kind === 'sniff' ? 'txt' : kind}`;
          const f = tmp.file(name, Buffer.from(bytes));
          try {
            const r = await readAll(f, { engine, chunkSize });
            expectAddsUp(r.summary);
            expect(r.rows.length).toBe(r.summary.rowsPassed);
            for (let i = 1; i < r.rows.length; i++) expect(r.rows[i]![0]).toBeGreaterThan(r.rows[i - 1]![0] as number);
            for (const row of r.rows) expect(row.length).toBe(r.header.length + 1);
            for (const d of r.summary.examples) expect(d.line).toBeGreaterThanOrEqual(1);
          } catch (e) {
            if (!isQuernError(e)) throw e;
            expect(['E_HEADER', 'E_FILE']).toContain(e.code);
          }
        },
      ),
      { numRuns: RUNS },
    );
  }, 600_000);
});
