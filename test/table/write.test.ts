// CSV and NDJSON encoding: RFC 4180 quoting and OWASP CSV-injection neutralisation.
import { describe, expect, it } from 'vitest';
import { csvCell, csvRow, isFormulaLike, ndjsonLine } from '../../src/table/index.js';

describe('csvCell(value) quotes per RFC 4180 §2.6–2.7', () => {
  it.each([
    ['aaa', 'aaa'], // §2.5: quoting is optional when nothing needs it
    ['b,bb', '"b,bb"'], // §2.6: a comma
    ['b\r\nbb', '"b\r\nbb"'], // §2.6: a line break
    ['b"bb', '"b""bb"'], // §2.7: an inner quote is doubled — the RFC's own example "b""bb"
    [' padded ', ' padded '], // §2.4: spaces are part of the field
    ['', ''],
  ])('%j → %j', (value, cell) => expect(csvCell(value)).toBe(cell));

  it('quotes for the delimiter in use', () => {
    expect(csvCell('a;b', { delimiter: ';' })).toBe('"a;b"');
    expect(csvCell('a,b', { delimiter: ';' })).toBe('a,b');
  });
});

describe('csvCell(value) neutralises formulas (OWASP CSV Injection)', () => {
  // OWASP www-community pages/attacks/CSV_Injection.md: = + - @ TAB CR LF lead a formula; prefix ' inside quotes.
  it.each([
    ['=1+2', `"'=1+2"`],
    ['=1+2";=1+2', `"'=1+2"";=1+2"`], // the page's own example
    ['+A1', `"'+A1"`],
    ['-2+3', `"'-2+3"`],
    ['@SUM(A1:A2)', `"'@SUM(A1:A2)"`],
    ['\t=cmd', `"'\t=cmd"`],
    ['\r=cmd', `"'\r=cmd"`],
    ['\n=cmd', `"'\n=cmd"`], // LF added to the OWASP list in Aug 2025 (PR #1116)
    ["=HYPERLINK(\"http://x\",\"click\")", `"'=HYPERLINK(""http://x"",""click"")"`],
    ['-', `"'-"`],
  ])('%j → %j', (value, cell) => {
    expect(isFormulaLike(value)).toBe(true);
    expect(csvCell(value)).toBe(cell);
  });

  // common practice: signed plain numbers stay numbers so the next program still reads them as numbers.
  it.each(['-5', '+3.2', '-1e5', '-0', '-.5', '+7.', '-2.5E-3', '12', 'a=b', "'quoted"])('%j stays as it is', (value) => {
    expect(isFormulaLike(value)).toBe(false);
    expect(csvCell(value)).toBe(value);
  });

  it('can be turned off for trusted pipelines', () => {
    expect(csvCell('=1+2', { neutraliseFormulas: false })).toBe('=1+2');
    expect(csvCell('=1,2', { neutraliseFormulas: false })).toBe('"=1,2"');
  });
});

describe('csvRow(values)', () => {
  it('joins cells and ends the line with LF, or CRLF as RFC 4180 §2.1 names it', () => {
    expect(csvRow(['a', 'b,c', '=x'])).toBe(`a,"b,c","'=x"\n`);
    expect(csvRow(['a', 'b'], { lineEnd: '\r\n' })).toBe('a,b\r\n');
    expect(csvRow(['a', 'b'], { delimiter: '\t' })).toBe('a\tb\n');
  });

  it('does not change the caller\'s array', () => {
    const values = Object.freeze(['=1', '2']);
    expect(csvRow(values)).toBe(`"'=1",2\n`);
  });
});

describe('ndjsonLine(record)', () => {
  it('writes one JSON object per line and keeps NaN, Infinity and undefined visible', () => {
    expect(ndjsonLine({ a: 1, b: 'x\ny', c: null })).toBe('{"a":1,"b":"x\\ny","c":null}\n');
    expect(ndjsonLine({ n: NaN, p: Infinity, m: -Infinity, u: undefined })).toBe('{"n":"NaN","p":"Infinity","m":"-Infinity","u":null}\n');
    expect(JSON.parse(ndjsonLine({ s: '\u2028' }))).toEqual({ s: '\u2028' });
  });
});
