// Puts the line numbers and row accounting of separately read ranges back together.
import type { ReadSummary } from '../table/types.js';
import type { RangeOutcome } from './types.js';

/**
 * Lines before each range: the first range counts lines from the file's start, every other range from
 * its own start (its first line is 1), so range k's lines are shifted by the lines of the ranges before it.
 */
export function lineBases(outcomes: ReadonlyArray<RangeOutcome<unknown>>): number[] {
  const bases: number[] = [];
  let before = 0;
  for (const o of outcomes) {
    bases.push(before);
    before += linesOf(o);
  }
  return bases;
}

/** Physical lines a range consumed (none when it read nothing). */
function linesOf(o: RangeOutcome<unknown>): number {
  return o.stop === o.range.start && o.range.start > 0 ? 0 : o.summary.lines;
}

/** One summary for the whole file: counts added, examples shifted to file lines and the first `maxExamples` kept. */
export function mergeSummaries(outcomes: ReadonlyArray<RangeOutcome<unknown>>, bases: readonly number[], maxExamples: number): ReadSummary {
  const first = outcomes[0]!.summary;
  const merged: ReadSummary = {
    ...first,
    rowsRead: 0, rowsPassed: 0, rowsRejected: 0, rejectedByReason: {}, examples: [], bytesRead: 0, bytesDecoded: 0,
    blankLines: 0, lines: 0, unknownKeys: {}, complete: true,
  };
  outcomes.forEach((o, k) => {
    const s = o.summary;
    merged.rowsRead += s.rowsRead;
    merged.rowsPassed += s.rowsPassed;
    merged.rowsRejected += s.rowsRejected;
    for (const [reason, count] of Object.entries(s.rejectedByReason)) merged.rejectedByReason[reason] = (merged.rejectedByReason[reason] ?? 0) + count;
    for (const ex of s.examples) if (merged.examples.length < maxExamples) merged.examples.push({ ...ex, line: ex.line + bases[k]! });
    merged.bytesRead += s.bytesRead;
    merged.bytesDecoded += s.bytesDecoded;
    merged.blankLines += s.blankLines;
    merged.lines += linesOf(o);
    merged.complete &&= s.complete;
  });
  return merged;
}
