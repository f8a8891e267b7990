// Differential test of the fast path's quote-free loops (src/table/fast-body.ts: the WebAssembly record
// kernel and the JavaScript word loop) against csv-parse, the
// reference engine: bodies longer than the 64 KiB read at the start, so records straddle chunk ends, for
// every delimiter the sniffer knows (comma has its own loop), every line end (LF, CRLF, lone CR: common
// practice; RFC 4180 §2.1 names CRLF), and quotes absent, sparse (the next quote is looked up again),
// dense (the general scanner takes the rest of a buffer) or around every field. Rows carry RFC 4180 §2.6–2.7
// quoting, ragged rows, blank lines, bad quotes and bytes that are not UTF-8 now and then.
import { afterAll, describe, expect, it } from 'vitest';
import type { TableOptions } from '../../src/table/index.js';
import { readAll, readAllBytes, tempDir, type ReadResult } from './helpers.js';
import { seeded } from '../helpers/seeded.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());

// 'simple': every field quoted, mostly as the kernel's walk with quotes reads them (RFC 4180 §2.5–2.6: a
// delimiter inside, empty), now and then with what it leaves to the scanner.
type Quotes = 'none' | 'sparse' | 'dense' | 'all' | 'simple';

/** A seeded body of about `size` bytes (test/helpers/seeded.ts, so every run builds the same file). */
function body(delimiter: string, end: string, quotes: Quotes, seed: number, size = 150_000): Buffer {
  const rnd = seeded(seed);
  const d = delimiter;
  const parts: Buffer[] = [Buffer.from(['ts', 'site', 'age', 'note'].join(d) + end)];
  let total = 0;
  for (let i = 0; total < size; i++) {
    const r = rnd();
    let text: string;
    const quoteThis = quotes === 'all' || quotes === 'simple' || (quotes === 'dense' && r < 0.9) || (quotes === 'sparse' && r < 0.02);
    const q = (v: string): string => (quoteThis ? `"${v.replaceAll('"', '""')}"` : v);
    const breakInside = `two${end === '\r' ? '\n' : '\r\n'}lines`;
    const pick = rnd();
    const note = quotes === 'simple'
      ? (pick < 0.02 ? `say ""hi""` : pick < 0.04 ? breakInside : pick < 0.1 ? '' : `n${i}${d} ok`)
      : quoteThis ? (pick < 0.5 ? `say ""hi""${d} ok` : breakInside) : `n${i}`;
    const cells = [q(`2024-03-${String(1 + (i % 28)).padStart(2, '0')}T08:${String(i % 60).padStart(2, '0')}:00Z`), q(i % 3 === 0 ? 'Fennick Cross' : 'Alderbrook'), q(String(i % 100))];
    // Quoted notes hold a delimiter, doubled quotes or a line break (RFC 4180 §2.6–2.7).
    cells.push(quoteThis ? `"${note}"` : note);
    if (r > 0.995) text = ''; // a blank line
    else if (r > 0.99) text = cells.slice(0, 3).join(d); // ragged: one field short
    else if (r > 0.985) text = `${cells.join(d)}${d}extra`; // ragged: one field more
    else if (r > 0.98) text = `bad"quote${d}${cells.slice(1).join(d)}`; // a quote inside an unquoted field
    else if (r > 0.97 && quotes === 'simple') text = `"bad"after${d}${cells.slice(1).join(d)}`; // text after a closing quote
    else text = cells.join(d);
    let line = Buffer.from(text + end);
    if (r > 0.975 && r <= 0.98) line = Buffer.concat([Buffer.from([0xff]), line]); // not UTF-8
    parts.push(line);
    total += line.length;
  }
  return Buffer.concat(parts);
}

function comparable(r: ReadResult): unknown {
  const s = r.summary;
  return {
    header: r.header,
    rows: r.rows,
    rowsRead: s.rowsRead,
    rejectedByReason: s.rejectedByReason,
    blankLines: s.blankLines,
    lines: s.lines,
    breaks: s.breaks,
    stop: s.stop,
    examples: s.examples,
  };
}

const CASES: [string, string, Quotes][] = [];
for (const d of [',', '\t', ';', '|']) for (const e of ['\n', '\r\n', '\r']) for (const q of ['none', 'sparse', 'dense', 'all', 'simple'] as Quotes[]) CASES.push([d, e, q]);

describe('fast path quote-free loops vs csv-parse on bodies spanning many chunks', () => {
  it.each(CASES)('delimiter %j, line end %j, quotes %s: the same rows, lines and rejections', async (d, e, q) => {
    const bytes = body(d, e, q, d.charCodeAt(0) * 31 + e.length * 7 + q.length);
    const file = tmp.file(`loops-${d.charCodeAt(0)}-${e.length}-${q}.csv`, bytes);
    for (const chunkSize of [4093, 65_536, 1 << 20]) {
      const options: TableOptions = { delimiter: d, chunkSize, maxExamples: 50, batchSize: 1000 };
      const fast = await readAll(file, options);
      const ref = await readAll(file, { ...options, engine: 'reference' });
      expect(fast.summary.rowsRead).toBeGreaterThan(1000);
      expect(comparable(fast)).toEqual(comparable(ref));
      // The comma's quote-free records are read by the WebAssembly kernel by default, and by the
      // JavaScript word loop without it.
      const loop = await readAll(file, { ...options, simd: false });
      expect(comparable(loop)).toEqual(comparable(ref));
      // Byte batches take the kernel's records a block at a time: every column, and two of them out of order.
      expect(comparable(await readAllBytes(file, options))).toEqual(comparable(ref));
      const two = ['note', 'site'];
      const refTwo = await readAll(file, { ...options, engine: 'reference' }, two);
      expect(comparable(await readAllBytes(file, options, two))).toEqual(comparable(refTwo));
      expect(comparable(await readAllBytes(file, { ...options, simd: false }, two))).toEqual(comparable(refTwo));
    }
  });
});
