// Writes generated columns to CSV files in the system temporary folder for detectGrain/profileTable tests.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const dir = mkdtempSync(join(tmpdir(), 'quern-grain-test-'));
let n = 0;

/** Writes `columns` (name → values, all the same length) as a CSV file and returns its path. */
export function writeColumns(columns: Record<string, readonly string[]>): string {
  const names = Object.keys(columns);
  const rows = columns[names[0]!]!.length;
  const lines = [names.join(',')];
  for (let i = 0; i < rows; i++) lines.push(names.map((c) => csvCell(columns[c]![i]!)).join(','));
  const file = join(dir, `t${++n}.csv`);
  writeFileSync(file, `${lines.join('\n')}\n`);
  return file;
}

function csvCell(v: string): string {
  return /[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

export { seeded } from '../helpers/seeded.js';
