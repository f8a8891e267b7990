// Finding a column by name, with a helpful error naming the columns that exist and the nearest spelling.
import { QuernError } from '../errors.js';

/** Levenshtein edit distance (insertions, deletions, substitutions each cost 1). */
export function editDistance(a: string, b: string): number {
  const prev = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    let diag = prev[0]!;
    prev[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const up = prev[j]!;
      prev[j] = Math.min(up + 1, prev[j - 1]! + 1, diag + (a[i - 1] === b[j - 1] ? 0 : 1));
      diag = up;
    }
  }
  return prev[b.length]!;
}

/** The header name closest to `name` (ignoring case first), if it is close enough to be a likely typo. */
export function nearestName(name: string, header: readonly string[]): string | undefined {
  const lower = name.toLowerCase();
  const sameCase = header.find((h) => h.toLowerCase() === lower);
  if (sameCase !== undefined) return sameCase;
  let best: string | undefined;
  let bestD = Infinity;
  for (const h of header) {
    const d = editDistance(lower, h.toLowerCase());
    if (d < bestD) {
      bestD = d;
      best = h;
    }
  }
  const limit = Math.max(2, Math.floor(name.length / 3));
  if (bestD <= limit) return best;
  // A name that holds the other (site / site_name) is a likely slip too.
  return header.find((h) => h.length >= 3 && lower.length >= 3 && (h.toLowerCase().includes(lower) || lower.includes(h.toLowerCase())));
}

/** Index of `name` in `header`; throws QuernError('E_COLUMN') listing the columns and the nearest name. */
export function findColumn(file: string, header: readonly string[], name: string): number {
  const i = header.indexOf(name);
  if (i >= 0) return i;
  const near = nearestName(name, header);
  const listed = header.map((h) => JSON.stringify(h)).join(', ');
  const guess = near !== undefined ? `; did you mean ${JSON.stringify(near)}?` : '';
  throw new QuernError(
    'E_COLUMN',
    `${file} has no column ${JSON.stringify(name)}${guess}`,
    `columns: ${listed}`,
  );
}
