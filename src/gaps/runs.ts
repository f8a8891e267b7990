// Missing periods as runs: one walk over a series' period keys, in order, that finds the stretches of
// expected periods with no row, and the position of each among the expected periods (for the strip).

/** A run of missing periods, by key: first and last missing key, how many expected periods it holds. */
export interface KeyRun {
  first: number;
  last: number;
  periods: number;
  /** Position of its first period among the series' expected periods (0-based). */
  index: number;
}

/** A period with more than one row. */
export interface KeyDuplicate {
  key: number;
  count: number;
  index: number;
}

/** What one walk over a series finds. */
export interface SeriesWalk {
  expected: number;
  /** Expected periods with at least one row. */
  present: number;
  /** Periods with rows that the calendar does not expect (a Saturday under --weekdays, a holiday). */
  unexpected: number;
  runs: KeyRun[];
  duplicates: KeyDuplicate[];
}

/**
 * Walks keys `first`..`last`: a period is expected when `expected(k)`; its rows are `counts.get(k)`.
 * Unexpected periods between two missing ones do not break a run (a weekend inside an outage is one gap).
 */
export function walkSeries(first: number, last: number, counts: ReadonlyMap<number, number>, expected: (k: number) => boolean): SeriesWalk {
  const w: SeriesWalk = { expected: 0, present: 0, unexpected: 0, runs: [], duplicates: [] };
  let run: KeyRun | null = null;
  for (let k = first; k <= last; k++) {
    const n = counts.get(k) ?? 0;
    if (!expected(k)) {
      if (n > 0) w.unexpected++;
      continue;
    }
    const index = w.expected++;
    if (n === 0) {
      if (run === null) {
        run = { first: k, last: k, periods: 1, index };
        w.runs.push(run);
      } else {
        run.last = k;
        run.periods++;
      }
      continue;
    }
    run = null;
    w.present++;
    if (n > 1) w.duplicates.push({ key: k, count: n, index });
  }
  return w;
}

/** The run with the most periods (the earliest of equals), or null. */
export function longestRun(runs: readonly KeyRun[]): KeyRun | null {
  let best: KeyRun | null = null;
  for (const r of runs) if (best === null || r.periods > best.periods) best = r;
  return best;
}
