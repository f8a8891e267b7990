// Range tasks for the pool's tests: a small quote-aware record counter that reads a file's bytes
// directly (independent of src/table), and a task that fails on one range.
import { readFileSync } from 'node:fs';
import { threadId } from 'node:worker_threads';
import { QuernError } from '../../src/errors.js';
import type { ByteRange, RangeOutcome } from '../../src/parallel/index.js';
import type { ReadSummary } from '../../src/table/types.js';

export interface CountPartial {
  records: string[];
  thread: number;
}

function summaryOf(file: string, rows: number, lines: number): ReadSummary {
  return {
    file, rowsRead: rows, rowsPassed: rows, rowsRejected: 0, rejectedByReason: {}, examples: [], bytesRead: 0, bytesDecoded: 0,
    blankLines: 0, lines, unknownKeys: {}, format: 'csv', delimiter: ',', engine: 'fast', complete: true,
  } as ReadSummary;
}

/** Records (RFC 4180 quoting, LF line ends) starting in [start, end); range 0 skips the first line (the header). */
export async function countRecords(file: string, _options: unknown, range: ByteRange): Promise<RangeOutcome<CountPartial>> {
  const b = readFileSync(file);
  let pos = range.start;
  if (range.index === 0 && range.start === 0) pos = b.indexOf(10) + 1;
  const records: string[] = [];
  let breaks = 0;
  while (pos < range.end && pos < b.length) {
    let i = pos;
    let quoted = false;
    for (; i < b.length; i++) {
      if (b[i] === 0x22) quoted = !quoted;
      else if (b[i] === 10) {
        breaks++;
        if (!quoted) break;
      }
    }
    records.push(b.toString('utf8', pos, i));
    pos = Math.min(i + 1, b.length);
  }
  const lines = range.start === 0 ? breaks + 1 : breaks;
  return { range, stop: pos, breaks, summary: summaryOf(file, records.length, lines), partial: { records, thread: threadId } };
}

/** Fails with a QuernError on the range of index 1. */
export async function failOnSecond(file: string, options: unknown, range: ByteRange): Promise<RangeOutcome<CountPartial>> {
  if (range.index === 1) throw new QuernError('E_DATA', `range ${range.index} of ${file} is bad`, 'a hint');
  return countRecords(file, options, range);
}
