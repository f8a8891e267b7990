// Aggregate specifications: what `--agg count --agg sum:amount --agg p90:amount` asks for, and the plain
// output column names (`count`, `sum_amount`, `p90_amount`).
import type { QuantileType } from '../bins/quantile.js';
import { QuernError } from '../errors.js';

/** The aggregates rebin computes per period (and group). */
export type AggKind = 'count' | 'sum' | 'mean' | 'median' | 'min' | 'max' | 'quantile' | 'distinct';

/** One requested aggregate. `column` is null only for `count` of rows. */
export interface AggSpec {
  kind: AggKind;
  column: string | null;
  /** For 'quantile' (and 'median', p = 0.5): the probability in [0, 1]. */
  p: number;
  /** Output column name: `count`, `sum_amount`, `p90_amount`, `distinct_clinic`. */
  name: string;
}

const NAMED: Record<string, AggKind> = {
  count: 'count',
  sum: 'sum',
  mean: 'mean',
  median: 'median',
  min: 'min',
  max: 'max',
  distinct: 'distinct',
};

/** Aggregates that add up over disjoint parts, so a value split by day share keeps its meaning. */
export function isAdditive(kind: AggKind): boolean {
  return kind === 'count' || kind === 'sum';
}

/** Aggregates that need the numeric value of their column. */
export function needsNumber(kind: AggKind): boolean {
  return kind !== 'count' && kind !== 'distinct';
}

/** Aggregates that need every value of a period kept (exact median and quantiles). */
export function needsBuffer(kind: AggKind): boolean {
  return kind === 'median' || kind === 'quantile';
}

/**
 * Parses one `--agg` value: `count`, `count:COL` (rows where COL is not empty), `sum:COL`, `mean:COL`,
 * `median:COL`, `min:COL`, `max:COL`, `pNN:COL` (NN percent, e.g. p90, p2.5, p99.9) or `distinct:COL`.
 * Throws QuernError 'E_USAGE' for anything else.
 */
export function parseAggSpec(text: string): AggSpec {
  const raw = text.trim();
  const colon = raw.indexOf(':');
  const head = (colon < 0 ? raw : raw.slice(0, colon)).trim().toLowerCase();
  const column = colon < 0 ? null : raw.slice(colon + 1).trim();
  if (column === '') throw usage(raw, 'the column after ":" is empty');
  const quantile = /^p(\d{1,2}(?:\.\d+)?|100)$/.exec(head);
  if (quantile) {
    if (column === null) throw usage(raw, `${head} needs a column, e.g. ${head}:amount`);
    const p = Number(quantile[1]) / 100;
    return { kind: 'quantile', column, p, name: `${head}_${column}` };
  }
  const kind = NAMED[head];
  if (kind === undefined) {
    throw usage(raw, 'unknown aggregate', 'use count, sum, mean, median, min, max, pNN (p90) or distinct, e.g. --agg sum:amount');
  }
  if (kind !== 'count' && column === null) throw usage(raw, `${kind} needs a column, e.g. ${kind}:amount`);
  const name = column === null ? 'count' : `${kind}_${column}`;
  return { kind, column, p: kind === 'median' ? 0.5 : NaN, name };
}

/**
 * Parses every `--agg` value (default: `count`) and refuses two aggregates with the same output name.
 * Returns a fresh array; the input is not changed.
 */
export function parseAggSpecs(texts: readonly string[]): AggSpec[] {
  const specs = (texts.length === 0 ? ['count'] : texts).map(parseAggSpec);
  const seen = new Set<string>();
  for (const s of specs) {
    if (seen.has(s.name)) throw new QuernError('E_USAGE', `aggregate ${s.name} is asked for twice`, 'give each --agg once');
    seen.add(s.name);
  }
  return specs;
}

/** The measure columns the aggregates read, each once, in the order first named. */
export function aggColumns(specs: readonly AggSpec[]): string[] {
  const out: string[] = [];
  for (const s of specs) if (s.column !== null && !out.includes(s.column)) out.push(s.column);
  return out;
}

function usage(raw: string, what: string, hint?: string): QuernError {
  return new QuernError('E_USAGE', `--agg ${JSON.stringify(raw)}: ${what}`, hint ?? 'e.g. --agg count --agg sum:amount --agg p90:amount');
}

/**
 * Checks a `--quantile-type` value: a Hyndman–Fan type 1–9 (Hyndman & Fan 1996, The American
 * Statistician 50(4):361–365); throws QuernError 'E_USAGE' otherwise. Type 7 is the default of R, NumPy
 * and d3-array.
 */
export function parseQuantileType(text: string): QuantileType {
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1 || n > 9) {
    throw new QuernError('E_USAGE', `--quantile-type ${JSON.stringify(text)} is not a Hyndman–Fan type 1–9`, 'the default 7 is the one of R, NumPy and d3-array');
  }
  return n as QuantileType;
}
