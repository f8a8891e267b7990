// Misuse and unreadable input: each a QuernError with a stable code and a one-line message.
import { gzipSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { QuernError } from '../../src/errors.js';
import { openTable, editDistance, nearestName, parseDelimiter } from '../../src/table/index.js';
import { fileError } from '../../src/table/source.js';
import { readAll, tempDir } from './helpers.js';

const tmp = tempDir();
afterAll(() => tmp.cleanup());

/** The QuernError a promise rejects with (fails the test when it resolves). */
async function rejection(p: Promise<unknown>): Promise<QuernError> {
  try {
    await p;
  } catch (e) {
    expect(e).toBeInstanceOf(QuernError);
    expect((e as Error).message).not.toContain('\n');
    return e as QuernError;
  }
  throw new Error('expected a QuernError');
}

function thrown(f: () => unknown): QuernError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(QuernError);
    return e as QuernError;
  }
  throw new Error('expected a QuernError');
}

describe('openTable(file) header errors', () => {
  it.each([
    ['duplicate names', 'a,b,a,c,b\n1,2,3,4,5\n', 'duplicate header names "a", "b"'],
    ['an empty name', 'a,,c\n1,2,3\n', 'header column 2 of 3 has an empty name'],
    ['two empty names', ',b,\n', 'header columns 1, 3 of 3 have an empty name'],
    ['an empty file', '', 'has no header row (the input is empty)'],
    ['blank lines only', '\n\r\n\n', 'has no header row (the input is empty)'],
    ['a broken quote', 'a,"b\n', 'the header row has a broken quote'],
    ['duplicate NDJSON keys', '{"a":1,"":2}\n', 'header column 2 of 2 has an empty name'],
  ])('%s → E_HEADER', async (_name, text, message) => {
    const f = tmp.file(`hdr-${text.length}-${message.length}.${text.startsWith('{') ? 'ndjson' : 'csv'}`, text);
    const e = await rejection(openTable(f));
    expect(e.code).toBe('E_HEADER');
    expect(e.message).toContain(message);
    expect(e.message.startsWith(f)).toBe(true);
  });

  it('rejects a header with undecodable bytes', async () => {
    const e = await rejection(openTable(tmp.file('hdr-latin1.csv', Buffer.from([0x6e, 0xe9, 0x0a, 0x31, 0x0a]))));
    expect([e.code, e.message.endsWith(':1: the header row holds bytes that are not valid UTF-8')]).toEqual(['E_HEADER', true]);
  });
});

describe('TableReader.columnIndex(name)', () => {
  it('finds a column, or throws E_COLUMN listing the columns and the nearest spelling', async () => {
    const f = tmp.file('cols.csv', 'visit_id,visit_time,clinic\n1,2,3\n');
    const t = await openTable(f);
    expect(t.columnIndex('clinic')).toBe(2);
    const e = thrown(() => t.columnIndex('vist_time'));
    expect(e.code).toBe('E_COLUMN');
    expect(e.message).toBe(`${f} has no column "vist_time"; did you mean "visit_time"?`);
    expect(e.hint).toBe('columns: "visit_id", "visit_time", "clinic"');
    expect(thrown(() => t.columnIndex('Clinic')).message).toContain('did you mean "clinic"?');
    expect(thrown(() => t.columnIndex('zzz')).message).toBe(`${f} has no column "zzz"`);
    expect(thrown(() => t.batches(['clinic', 'nope'])).code).toBe('E_COLUMN');
  });

  it('lets batches() run once only', async () => {
    const t = await openTable(tmp.file('once.csv', 'a\n1\n'));
    for await (const _ of t.batches(['a'])) void _;
    expect(thrown(() => t.batches(['a'])).code).toBe('E_USAGE');
  });
});

describe('editDistance / nearestName', () => {
  it.each([
    // Levenshtein's classic examples (common practice): kitten→sitting 3, flaw→lawn 2.
    ['kitten', 'sitting', 3],
    ['flaw', 'lawn', 2],
    ['', 'abc', 3],
    ['same', 'same', 0],
  ])('editDistance(%s, %s) = %i', (a, b, d) => expect(editDistance(a, b)).toBe(d));

  it('suggests a name that holds the other', () => {
    expect(nearestName('site_name', ['ts', 'site', 'n'])).toBe('site');
    expect(nearestName('qqqqqq', ['ts', 'site'])).toBeUndefined();
  });
});

describe('openTable(file) file errors → E_FILE, one line', () => {
  it('names a missing file', async () => {
    const e = await rejection(openTable(`${tmp.dir}/missing.csv`));
    expect([e.code, e.message]).toEqual(['E_FILE', `${tmp.dir}/missing.csv: no such file`]);
  });

  it('names a folder given as a file', async () => {
    const e = await rejection(openTable(tmp.dir));
    expect([e.code, e.message]).toEqual(['E_FILE', `${tmp.dir}: is a folder, not a file`]);
  });

  it('words permission errors (mapped from the system error code; tests may run as root)', () => {
    const err = Object.assign(new Error('EACCES: permission denied'), { code: 'EACCES' });
    expect(fileError('secret.csv', err).message).toBe('secret.csv: permission denied');
    expect(fileError('x/y.csv', Object.assign(new Error(''), { code: 'ENOTDIR' })).message).toBe('x/y.csv: a part of the path is not a folder');
  });

  it('reports a gzip file cut short as E_FILE, not a crash', async () => {
    const full = gzipSync('a,b\n' + '1,2\n'.repeat(20000));
    const f = tmp.file('cut.csv.gz', full.subarray(0, Math.floor(full.length / 2)));
    // The cut may show while the header is read or later, while rows are read: either way E_FILE.
    const e = await rejection(readAll(f, { chunkSize: 512 }));
    expect(e.code).toBe('E_FILE');
    expect(e.message).toBe(`${f}: gzip data ends early (the file is cut short)`);
  });

  it('reports damaged gzip data as E_FILE', async () => {
    const full = Buffer.from(gzipSync('a,b\n1,2\n'));
    full[12] = full[12]! ^ 0xff;
    full[13] = full[13]! ^ 0xff;
    const e = await rejection(readAll(tmp.file('damaged.csv.gz', full)));
    expect(e.code).toBe('E_FILE');
    expect(e.message).toMatch(/damaged\.csv\.gz: gzip data (is damaged|ends early)/);
  });

  it('needs options.stdin for "-"', async () => {
    expect((await rejection(openTable('-'))).code).toBe('E_USAGE');
  });
});

describe('parseDelimiter(given)', () => {
  it.each([
    [',', ','],
    ['tab', '\t'],
    ['\\t', '\t'],
    ['semicolon', ';'],
    ['pipe', '|'],
  ])('%s → %j', (given, d) => expect(parseDelimiter(given)).toBe(d));

  it.each(['"', '\n', ',,', '§', ''])('rejects %j with E_USAGE', (given) => {
    expect(thrown(() => parseDelimiter(given)).code).toBe('E_USAGE');
  });
});
