// Telling what an input is from its name and first bytes: the format and the field delimiter.
import { QuernError } from '../errors.js';
import type { TableFormat } from './types.js';

/** Delimiters tried when none is given, in order of preference on a tie. */
export const CANDIDATE_DELIMITERS = [',', '\t', ';', '|'] as const;

/** The format named by a file's extension (a trailing .gz is looked through), if any. */
export function formatFromName(file: string): TableFormat | undefined {
  const name = file.toLowerCase().replace(/\.gz$/, '');
  if (name.endsWith('.csv')) return 'csv';
  if (name.endsWith('.tsv') || name.endsWith('.tab')) return 'tsv';
  if (name.endsWith('.ndjson') || name.endsWith('.jsonl')) return 'ndjson';
  return undefined;
}

/** NDJSON when the first byte that is not white space opens a JSON object, else CSV. */
export function sniffFormat(prefix: Buffer): TableFormat {
  for (const b of prefix) {
    if (b === 0x20 || b === 0x09 || b === 0x0a || b === 0x0d) continue;
    return b === 0x7b ? 'ndjson' : 'csv';
  }
  return 'csv';
}

const NAMED: Record<string, string> = { comma: ',', tab: '\t', '\\t': '\t', semicolon: ';', pipe: '|' };

/** Checks a delimiter given by the user: one ASCII character that is not a quote or a line end. */
export function parseDelimiter(given: string): string {
  const d = NAMED[given.toLowerCase()] ?? given;
  if (d.length !== 1 || d.charCodeAt(0) > 0x7f || d === '"' || d === '\n' || d === '\r') {
    throw new QuernError(
      'E_USAGE',
      `delimiter ${JSON.stringify(given)} must be one ASCII character other than a quote or a line end`,
      'use , ; | or tab',
    );
  }
  return d;
}

/** Counts of each candidate delimiter outside quotes, per record, over the first `maxRecords` records. */
function countPerRecord(prefix: Buffer, final: boolean, maxRecords: number): number[][] {
  const codes = CANDIDATE_DELIMITERS.map((d) => d.charCodeAt(0));
  const rows: number[][] = [];
  let counts = codes.map(() => 0);
  let inQuotes = false;
  let empty = true;
  for (let i = 0; i < prefix.length && rows.length < maxRecords; i++) {
    const b = prefix[i]!;
    if (b === 0x22) inQuotes = !inQuotes;
    if (inQuotes) {
      empty = false;
      continue;
    }
    if (b === 0x0a || b === 0x0d) {
      if (!empty) rows.push(counts);
      counts = codes.map(() => 0);
      empty = true;
      continue;
    }
    empty = false;
    const k = codes.indexOf(b);
    if (k >= 0) counts[k]!++;
  }
  if (final && !empty && !inQuotes && rows.length < maxRecords) rows.push(counts);
  return rows;
}

/**
 * Picks the delimiter among comma, tab, semicolon and pipe that splits the header and the next rows
 * into the same number of fields (common practice); a file with none of them has one column.
 */
export function sniffDelimiter(prefix: Buffer, final: boolean): string {
  const rows = countPerRecord(prefix, final, 20);
  if (rows.length === 0) return ',';
  const head = rows[0]!;
  let best = -1;
  let bestScore = -1;
  for (let k = 0; k < CANDIDATE_DELIMITERS.length; k++) {
    const n = head[k]!;
    if (n === 0) continue;
    const agreeing = rows.filter((r) => r[k] === n).length;
    const score = (agreeing / rows.length) * 1e6 + n;
    if (score > bestScore) {
      bestScore = score;
      best = k;
    }
  }
  return best < 0 ? ',' : CANDIDATE_DELIMITERS[best]!;
}
