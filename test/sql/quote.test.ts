// Quoting rules of the emitted SQL (src/sql/quote.ts). Identifier and literal syntax: SQL:2016 Part 2 §5.2–5.3
// (delimited identifiers with doubled quotes, character literals with doubled apostrophes), PostgreSQL docs
// §4.1.1–4.1.2.2 (E'…' escape strings), Spark SQL reference "Identifiers" (backquotes) and "Literals"
// (backslash escapes in '…', X'…' binary literals) — from memory of those references.
import { describe, expect, it } from 'vitest';
import { QuernError } from '../../src/errors.js';
import { checkRawExpression, numberLiteral, parseDialect, quoteName, quoteString } from '../../src/sql/quote.js';

const code = (f: () => unknown): string | undefined => {
  try { f(); } catch (e) { return e instanceof QuernError ? e.code : 'not a QuernError'; }
  return undefined;
};

describe('quoteName', () => {
  it.each([
    ['visit_time', 'postgres', '"visit_time"'],
    ['events.visit_time', 'duckdb', '"events"."visit_time"'],
    ['My "odd" col', 'trino', '"My ""odd"" col"'],
    ['a`b', 'spark', '`a``b`'],
    ['ts"; DROP TABLE t; --', 'postgres', '"ts""; DROP TABLE t; --"'],
  ] as const)('quoteName(%j, %s) is %s', (name, dialect, expected) => {
    expect(quoteName(name, dialect)).toBe(expected);
  });
  it('quoteName rejects empty parts and NUL with E_USAGE / E_VALUE', () => {
    expect(code(() => quoteName('a..b', 'postgres'))).toBe('E_USAGE');
    expect(code(() => quoteName('', 'duckdb'))).toBe('E_USAGE');
    expect(code(() => quoteName('a\u0000b', 'duckdb'))).toBe('E_VALUE');
  });
});

describe('quoteString', () => {
  it.each([
    ["0-4", 'postgres', "'0-4'"],
    ["it's", 'duckdb', "'it''s'"],
    ["a\\b'c", 'postgres', "E'a\\\\b''c'"],
    ["a\\b'c", 'duckdb', "'a\\b''c'"],
    ["a\\b'c", 'trino', "'a\\b''c'"],
    ["a\\'", 'spark', "decode(X'615C27', 'UTF-8')"],
    ["85+", 'spark', "'85+'"],
    ['line\nbreak', 'spark', "decode(X'6C696E650A627265616B', 'UTF-8')"],
  ] as const)('quoteString(%j, %s) is %s', (text, dialect, expected) => {
    expect(quoteString(text, dialect)).toBe(expected);
  });
});

describe('numberLiteral', () => {
  it.each([
    [5, '5'], [-3, '-3'], [0.1, '0.1'], [1e-7, '0.0000001'], [1.5e21, '1500000000000000000000'], [2.5e-10, '0.00000000025'],
  ] as const)('numberLiteral(%d) is %s', (n, text) => {
    expect(numberLiteral(n)).toBe(text);
  });
  it('numberLiteral rejects NaN and Infinity with E_VALUE', () => {
    expect(code(() => numberLiteral(NaN))).toBe('E_VALUE');
    expect(code(() => numberLiteral(Infinity))).toBe('E_VALUE');
  });
});

describe('checkRawExpression', () => {
  it('wraps a balanced expression in parentheses', () => {
    expect(checkRawExpression("to_timestamp(epoch_s) AT TIME ZONE 'UTC'")).toBe("(to_timestamp(epoch_s) AT TIME ZONE 'UTC')");
    expect(checkRawExpression("coalesce(a, 'x;y')")).toBe("(coalesce(a, 'x;y'))");
  });
  it.each([
    ['ts; DROP TABLE t'], ['ts) FROM t; --'], ['ts -- comment'], ['ts /* c */'], ["'open"], ['f(a'], ['a)'], ['   '],
  ])('checkRawExpression(%j) throws E_USAGE', (expr) => {
    expect(code(() => checkRawExpression(expr))).toBe('E_USAGE');
  });
});

describe('parseDialect', () => {
  it('reads the four dialects and aliases; E_USAGE otherwise', () => {
    expect(parseDialect('DuckDB')).toBe('duckdb');
    expect(parseDialect('postgresql')).toBe('postgres');
    expect(parseDialect('spark')).toBe('spark');
    expect(code(() => parseDialect('oracle'))).toBe('E_USAGE');
  });
});
