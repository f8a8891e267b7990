// The --threads option shared by the commands that can read a big file in parallel.
import { QuernError } from '../src/errors.js';

/**
 * Help text of --threads for rebin and bucket. One thread is the default: on the two-core machine of
 * the benchmark two threads made rebin on 10M rows about a tenth faster (0.71-0.79 s against 0.79-0.82 s)
 * for a quarter more CPU and more memory (DEVELOPERS.md, Performance), so more threads are for a machine
 * with idle cores. profile has its own default (below).
 */
export const THREADS_HELP = 'threads reading a plain CSV/TSV file of 32 MB or more (default 1; worth raising only when cores are idle)';

/** `--threads`: a whole number from 1 to 64; 1 when absent. Throws QuernError('E_USAGE') otherwise. */
export function parseThreads(flag: string | undefined): number {
  if (flag === undefined) return 1;
  return threadCount(flag, 'a whole number from 1 to 64', 'for example --threads 2, or --threads 1 to read on one thread');
}

/** The whole number from 1 to 64 that `flag` spells, or QuernError('E_USAGE') saying what was `expected`. */
function threadCount(flag: string, expected: string, hint: string): number {
  const n = Number(flag);
  if (!Number.isSafeInteger(n) || n < 1 || n > 64) throw new QuernError('E_USAGE', `--threads ${JSON.stringify(flag)} is not ${expected}`, hint);
  return n;
}

/** Help text of profile's --threads, whose default is 'auto' (autoThreads in src/profile/split.ts). */
export const PROFILE_THREADS_HELP =
  "threads: 'auto' (the default) takes two for a plain CSV/TSV file of 128 MiB or more when two cores are there, " +
  'one otherwise; a number from 1 to 64 sets it (two or more split the columns of a file of 32 MiB or more between two threads)';

/** profile's `--threads`: 'auto' when absent or 'auto', else a whole number from 1 to 64 (QuernError('E_USAGE') otherwise). */
export function parseProfileThreads(flag: string | undefined): number | 'auto' {
  if (flag === undefined || flag === 'auto') return 'auto';
  return threadCount(flag, "'auto' or a whole number from 1 to 64", 'for example --threads auto (the default), or --threads 1 to read on one thread');
}
