import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { isFormulaLikeBytes, isPlainNumberBytes } from '../../src/bins/index.js';
import { CsvByteWriter } from '../../src/bins/csv-bytes.js';
import { csvCell, isFormulaLike } from '../../src/table/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 2000);
const ch = fc.constantFrom('=', '+', '-', '@', '\t', '\r', '\n', '"', ',', ';', '1', '0', '.', 'e', 'E', 'a', ' ', "'", 'é', '→');
const cellText = fc.array(ch, { maxLength: 12 }).map((a) => a.join(''));

async function cellOf(value: string, neutralise: boolean): Promise<string> {
  let got = '';
  const w = new CsvByteWriter(async (chunk) => { got += Buffer.from(chunk).toString('utf8'); }, neutralise, 64);
  const buf = Buffer.from(`[${value}]`, 'utf8');
  w.cell(buf, 1, buf.length - 1);
  await w.flush();
  return got;
}

describe('CSV cells as bytes (src/bins/csv-bytes.ts) against csvCell (src/table/write.ts)', () => {
  // OWASP CSV Injection: = + - @ TAB CR LF start a formula; plain numbers such as -5 stay numbers.
  it.each([['=1+2', true], ['-5', false], ['+3.2', false], ['-1e5', false], ['-.5', false], ['-', true], ['@SUM(A1)', true], ['\tx', true], ['-1e', true], ['45', false], ['', false]] as const)(
    'isFormulaLikeBytes(%j) is %s, as isFormulaLike (OWASP CSV Injection)', (value, expected) => {
      const b = Buffer.from(value);
      expect(isFormulaLikeBytes(b, 0, b.length)).toBe(expected);
      expect(isFormulaLike(value)).toBe(expected);
    });

  it('isPlainNumberBytes and isFormulaLikeBytes agree with the string rules on random text (differential, property)', () => {
    fc.assert(fc.property(cellText, (value) => {
      const b = Buffer.from(value, 'utf8');
      expect(isFormulaLikeBytes(b, 0, b.length)).toBe(isFormulaLike(value));
      expect(isPlainNumberBytes(b, 0, b.length)).toBe(/^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/.test(value));
    }), { numRuns: RUNS });
  });

  it('CsvByteWriter.cell writes every cell as csvCell does, neutralising or not (RFC 4180 §2.6–2.7 quoting; differential, property)', async () => {
    await fc.assert(fc.asyncProperty(cellText, fc.boolean(), async (value, neutralise) => {
      expect(await cellOf(value, neutralise)).toBe(csvCell(value, { neutraliseFormulas: neutralise }));
    }), { numRuns: RUNS });
  });

  it('CsvByteWriter fills a second buffer while a chunk is written, and never touches a chunk before its write resolves', async () => {
    const got: string[] = [];
    // A slow sink that reads each chunk only after a delay, as a busy disk or pipe would.
    const w = new CsvByteWriter((chunk) => new Promise<void>((res) => setTimeout(() => { got.push(Buffer.from(chunk).toString('latin1')); res(); }, 3)), false, 16);
    const rows: string[] = [];
    for (let i = 0; i < 40; i++) {
      const row = `${String.fromCharCode(97 + (i % 26)).repeat(10)}${i}\n`;
      rows.push(row);
      const b = Buffer.from(row, 'latin1');
      w.raw(b, 0, b.length);
      if (w.full) await w.flush();
    }
    await w.end();
    expect(got.join('')).toBe(rows.join(''));
    expect(got.length).toBeGreaterThan(10); // many chunks, each written while the next was filled
  });

  it('CsvByteWriter throws a failed write at the next flush or at end', async () => {
    let calls = 0;
    const w = new CsvByteWriter(async () => { calls++; if (calls === 1) throw new Error('disk full'); }, false, 4);
    w.raw(Buffer.from('abcdef'), 0, 6);
    await w.flush(); // the write starts; its failure comes later
    w.raw(Buffer.from('ghijkl'), 0, 6);
    await expect(w.end()).rejects.toThrow('disk full');
  });
});
