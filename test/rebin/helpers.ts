// Helpers of the rebin and gaps tests: tables written to a temporary folder, a seeded random generator.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openTable } from '../../src/table/index.js';
import { rebin } from '../../src/rebin/index.js';
import type { RebinOptions, RebinResult } from '../../src/rebin/index.js';

const dir = mkdtempSync(join(tmpdir(), 'quern-rebin-test-'));
let n = 0;

/** Writes `text` to a fresh file in the test folder and returns its path. */
export function tableFile(text: string, ext = 'csv'): string {
  const path = join(dir, `t${++n}.${ext}`);
  writeFileSync(path, text);
  return path;
}

/** Rebins CSV text. */
export async function rebinText(text: string, options: RebinOptions): Promise<RebinResult> {
  const reader = await openTable(tableFile(text));
  try {
    return await rebin(reader, options);
  } finally {
    reader.close();
  }
}

export { seeded } from '../helpers/seeded.js';

/** Property-test runs: QUERN_FUZZ_RUNS when set, else a CI-friendly default. */
export const FUZZ_RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 60);

/** Counts of a result keyed by period label (and group values joined by '|'). */
export function countsOf(r: RebinResult, agg = 0): Map<string, number | null> {
  const m = new Map<string, number | null>();
  for (const row of r.rows) m.set([row.period, ...row.group].join('|'), row.values[agg]!);
  return m;
}
