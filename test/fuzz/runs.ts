// Run counts of the fuzz properties: QUERN_FUZZ_RUNS when set (`npm run fuzz` sets 200000), else a CI
// default that keeps the whole folder to a few minutes on two cores. Each property counts the cases it
// ran; each file prints one line with its total.
import fc from 'fast-check';
import { afterAll, vi } from 'vitest';

// A long run (QUERN_FUZZ_RUNS set) may take many minutes per property: lift the 60 s test timeout for
// the fuzz files only.
export const FUZZ_TIMEOUT = process.env.QUERN_FUZZ_RUNS ? 4 * 3_600_000 : 300_000;
vi.setConfig({ testTimeout: FUZZ_TIMEOUT });

// A long run on a shared machine may cap each property's time: QUERN_FUZZ_SECONDS=<s> stops a property
// after s seconds and counts it as passed when no counterexample was found in the cases it ran (fast-check's
// interruptAfterTimeLimit); the per-file line below then says how many cases really ran.
const seconds = Number(process.env.QUERN_FUZZ_SECONDS);
if (Number.isFinite(seconds) && seconds > 0) {
  fc.configureGlobal({ ...fc.readConfigureGlobal(), interruptAfterTimeLimit: seconds * 1000, markInterruptAsFailure: false });
}

/** Cases per property: QUERN_FUZZ_RUNS, or `ciDefault` (chosen per property by its cost). */
export function fuzzRuns(ciDefault: number): number {
  const env = Number(process.env.QUERN_FUZZ_RUNS);
  return Number.isSafeInteger(env) && env > 0 ? env : ciDefault;
}

/** A per-file tally of cases run per property, printed as one line when the file ends. */
export function caseCounter(area: string): (property: string) => void {
  const counts = new Map<string, number>();
  afterAll(() => {
    const total = [...counts.values()].reduce((a, b) => a + b, 0);
    const parts = [...counts].map(([k, v]) => `${k} ${v}`).join(', ');
    console.log(`fuzz ${area}: ${total} cases in ${counts.size} properties (${parts})`);
  });
  return (property) => counts.set(property, (counts.get(property) ?? 0) + 1);
}
