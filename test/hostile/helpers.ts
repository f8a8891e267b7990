// Shared helpers of the hostile-input corpus: a scratch folder, the one-line-error check, and the row
// accounting of rebin's and bucket's JSON summaries.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';
import { runCli, type CliResult } from '../helpers/cli.js';

/** The repository root, for the committed inputs and the built binary. */
export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
/** Hand-written hostile inputs committed beside the tests. */
export const INPUTS = fileURLToPath(new URL('./inputs/', import.meta.url));
/** The built command-line program (`npx tsc -p .` makes it). */
export const BIN = join(ROOT, 'dist/quern.cjs');

export interface Scratch {
  dir: string;
  /** Writes a file in the scratch folder and returns its path. */
  file(name: string, content: string | Buffer): string;
  cleanup(): void;
}

export function scratch(prefix: string): Scratch {
  const dir = mkdtempSync(join(tmpdir(), `quern-hostile-${prefix}-`));
  return {
    dir,
    file(name, content) {
      const p = join(dir, name);
      writeFileSync(p, content);
      return p;
    },
    cleanup() {
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A stack-trace line: must never reach the user. */
export const STACK_LINE = /^\s+at /m;

/**
 * Asserts the run failed with one `quern: …` line (an optional `hint:` line after it), the given exit
 * status (cli/exit.ts), no stack trace, and each fragment in the message.
 */
export function expectOneLineError(r: CliResult, status: number, ...fragments: string[]): string {
  expect(r.status, r.stderr).toBe(status);
  expect(r.stderr).not.toMatch(STACK_LINE);
  const lines = r.stderr.trimEnd().split('\n');
  expect(lines[0]).toMatch(/^quern: \S/);
  expect(lines.length, r.stderr).toBeLessThanOrEqual(2);
  if (lines.length === 2) expect(lines[1]).toMatch(/^hint: /);
  for (const f of fragments) expect(lines[0]).toContain(f);
  return lines[0]!;
}

export interface RebinAccount {
  read: number;
  used: number;
  empty: number;
  rejected: number;
  outside: number;
  why: Record<string, number>;
  examples: { code: string; line: number; column?: string; value?: string; message: string }[];
  rows: Record<string, unknown>[];
  format: string | undefined;
}

/** Runs `quern rebin … --format json` and returns its row accounting, asserting that it adds up. */
export async function rebinAccount(argv: string[]): Promise<RebinAccount> {
  const r = await runCli(['rebin', ...argv, '--format', 'json']);
  expect(r.stderr).not.toMatch(STACK_LINE);
  expect(r.status, r.stderr).toBe(0);
  const j = JSON.parse(r.stdout) as { rows: Record<string, unknown>[]; summary: Record<string, unknown> };
  const s = j.summary as {
    rowsRead: number; rowsUsed: number; rowsEmpty: number; rowsRejected: number; rowsOutside: number;
    rejectedByReason: Record<string, number>; examples: RebinAccount['examples']; timeFormat?: { id: string };
  };
  // Every row is accounted for: read = used + empty + rejected (+ outside --from/--until).
  expect(s.rowsUsed + s.rowsEmpty + s.rowsRejected + s.rowsOutside).toBe(s.rowsRead);
  expect(Object.values(s.rejectedByReason).reduce((a, b) => a + b, 0)).toBe(s.rowsRejected);
  return {
    read: s.rowsRead, used: s.rowsUsed, empty: s.rowsEmpty, rejected: s.rowsRejected, outside: s.rowsOutside,
    why: s.rejectedByReason, examples: s.examples, rows: j.rows, format: s.timeFormat?.id,
  };
}

/** Sum of a rebin result's count column. */
export function countSum(rows: Record<string, unknown>[]): number {
  return rows.reduce((a, r) => a + Number(r['count'] ?? 0), 0);
}
