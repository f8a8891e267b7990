// Malformed quoting, NUL bytes and other hostile shapes: every row is still accounted for.
// Both engines recover alike: a broken record is rejected up to its line end and reading resumes there.
import { afterAll, describe, expect, it } from 'vitest';
import { expectAddsUp, readAll, tempDir } from './helpers.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());

describe('openTable(file) on malformed quoting', () => {
  const text = 'a,b\n1,"x"y\n2,ok\n3,4\n';

  it.each(['fast', 'reference'] as const)('%s: rejects text after a closing quote (RFC 4180 §2.5) and resumes on the next line', async (engine) => {
    const r = await readAll(tmp.file(`after-${engine}.csv`, text), { engine });
    // RFC 4180 §2.5–2.7: line 2's record is malformed; lines 3 and 4 are whole records of their own.
    expect(r.rows).toEqual([[3, '2', 'ok'], [4, '3', '4']]);
    expect(r.summary.rejectedByReason).toEqual({ 'bad-quote': 1 });
    expect(r.summary.examples[0]).toMatchObject({ code: 'bad-quote', line: 2, value: '1,"x"y' });
    expectAddsUp(r.summary);
  });

  it.each(['fast', 'reference'] as const)('%s: a quote opening mid-file and never closing takes the rest as one rejected row', async (engine) => {
    const r = await readAll(tmp.file(`open-${engine}.csv`, 'a,b\n1,2\n3,"x\n4,5\n6,7'), { engine });
    expect(r.rows).toEqual([[2, '1', '2']]);
    expect(r.summary.rejectedByReason).toEqual({ 'unterminated-quote': 1 });
    expect(r.summary.lines).toBe(5);
  });
});

describe('openTable(file) on other hostile shapes', () => {
  it.each(['fast', 'reference'] as const)('%s: keeps NUL bytes as data (valid UTF-8, U+0000)', async (engine) => {
    const r = await readAll(tmp.file(`nul-${engine}.csv`, Buffer.from('a,b\n1,x\u0000y\n')), { engine });
    expect(r.rows).toEqual([[2, '1', 'x\u0000y']]);
  });

  it('mixed delimiters: the sniffed one splits, rows that disagree are ragged', async () => {
    const r = await readAll(tmp.file('mixdelim.csv', 'a,b,c\n1,2,3\n4;5;6\n7,8,9\n'));
    expect(r.delimiter).toBe(',');
    expect(r.rows).toEqual([[2, '1', '2', '3'], [4, '7', '8', '9']]);
    expect(r.summary.examples[0]).toMatchObject({ code: 'ragged-row', line: 3, value: '4;5;6' });
  });

  it('a BOM after the start is data, not stripped', async () => {
    const r = await readAll(tmp.file('bom2.csv', 'a\n\uFEFFx\n'));
    expect(r.rows).toEqual([[2, '\uFEFFx']]);
  });

  it('a trailing delimiter makes an extra, empty field (RFC 4180 §2.4: no trailing comma)', async () => {
    const r = await readAll(tmp.file('trail.csv', 'a,b\n1,2,\n'));
    expect(r.summary.rejectedByReason).toEqual({ 'ragged-row': 1 });
  });
});
