// Shared helpers of the table tests: temporary files and reading a whole table into plain rows.
import { expect } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { byteFieldString, openTable } from '../../src/table/index.js';
import type { ReadSummary, TableOptions } from '../../src/table/index.js';

/** A fresh temporary folder; call the returned cleanup in afterAll. */
export function tempDir(): { dir: string; file: (name: string, content: string | Buffer) => string; cleanup: () => void } {
  const dir = mkdtempSync(join(tmpdir(), 'quern-table-test-'));
  return {
    dir,
    file(name, content) {
      const p = join(dir, name);
      writeFileSync(p, content);
      return p;
    },
    cleanup: () => rmSync(dir, { recursive: true, force: true }),
  };
}

export interface ReadResult {
  header: readonly string[];
  delimiter: string;
  format: string;
  /** Each row as [line, ...values of the requested columns]. */
  rows: (string | number)[][];
  summary: ReadSummary;
}

/** Reads every requested column (all by default) of a table into rows. */
export async function readAll(file: string, options: TableOptions = {}, columns?: readonly string[]): Promise<ReadResult> {
  const t = await openTable(file, options);
  const rows: (string | number)[][] = [];
  for await (const b of t.batches(columns ?? t.header)) {
    expect(b.lines.length).toBe(b.length);
    for (const v of b.values) expect(v.length).toBe(b.length);
    for (let i = 0; i < b.length; i++) rows.push([b.lines[i]!, ...b.values.map((v) => v[i]!)]);
  }
  return { header: t.header, delimiter: t.delimiter, format: t.format, rows, summary: t.summary() };
}

/** Reads the requested columns (all by default) as byte batches, each field decoded to a string. */
export async function readAllBytes(file: string, options: TableOptions = {}, columns?: readonly string[]): Promise<ReadResult> {
  const t = await openTable(file, options);
  const cols = columns ?? t.header;
  const rows: (string | number)[][] = [];
  for await (const b of t.byteBatches(cols)) {
    expect(b.lines.length).toBe(b.length);
    for (let i = 0; i < b.length; i++) rows.push([b.lines[i]!, ...cols.map((_, c) => byteFieldString(b, c, i))]);
  }
  return { header: t.header, delimiter: t.delimiter, format: t.format, rows, summary: t.summary() };
}

/** Values only (no line numbers). */
export function valuesOf(r: ReadResult): string[][] {
  return r.rows.map((row) => row.slice(1) as string[]);
}

/** The accounting identity every read must satisfy. */
export function expectAddsUp(s: ReadSummary): void {
  expect(s.rowsRead).toBe(s.rowsPassed + s.rowsRejected);
  expect(Object.values(s.rejectedByReason).reduce((a, b) => a + b, 0)).toBe(s.rowsRejected);
  expect(s.complete).toBe(true);
}
