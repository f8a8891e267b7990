// The --threads option shared by the commands that can read a big file in parallel.
import { QuernError } from '../src/errors.js';

/**
 * Help text of --threads. One thread is the default: on the two-core machine of the benchmark, two threads
 * made a 10M-row profile about a fifth faster but rebin about two fifths slower, for more CPU and memory
 * (DEVELOPERS.md, Performance), so more threads are for a machine with idle cores.
 */
export const THREADS_HELP = 'threads reading a plain CSV/TSV file of 32 MB or more (default 1; worth raising only when cores are idle)';

/** `--threads`: a whole number from 1 to 64; 1 when absent. Throws QuernError('E_USAGE') otherwise. */
export function parseThreads(flag: string | undefined): number {
  if (flag === undefined) return 1;
  const n = Number(flag);
  if (!Number.isSafeInteger(n) || n < 1 || n > 64) {
    throw new QuernError('E_USAGE', `--threads ${JSON.stringify(flag)} is not a whole number from 1 to 64`, 'for example --threads 2, or --threads 1 to read on one thread');
  }
  return n;
}
