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

/** mulberry32: a small seeded generator (public domain), so generated tests are reproducible. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Property-test runs: QUERN_FUZZ_RUNS when set, else a CI-friendly default. */
export const FUZZ_RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 60);

/** Counts of a result keyed by period label (and group values joined by '|'). */
export function countsOf(r: RebinResult, agg = 0): Map<string, number | null> {
  const m = new Map<string, number | null>();
  for (const row of r.rows) m.set([row.period, ...row.group].join('|'), row.values[agg]!);
  return m;
}
