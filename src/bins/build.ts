// From a plan (edges, a named scheme, a spec file or a data-driven method) to the bucket set to apply.
import { QuernError } from '../errors.js';
import { BUCKET_SCHEMES, findScheme } from './schemes.js';
import { bucketsFromEdges, bucketsFromExtents } from './edges.js';
import { ckmeansExtents, equalWidthEdges, quantileEdges, ruleBinCount, type BinRule } from './breaks.js';
import type { QuantileType } from './quantile.js';
import type { BucketSet, BucketSpec, ClosedSide } from './types.js';
import { bucketsFromSpec } from './spec.js';

export type BucketPlan =
  | { kind: 'edges'; edges: readonly number[]; openLow?: boolean; openHigh?: boolean }
  | { kind: 'scheme'; name: string }
  | { kind: 'spec'; spec: BucketSpec }
  | { kind: 'equal-width'; bins: number; round?: boolean }
  | { kind: 'quantile'; bins: number; type?: QuantileType }
  | { kind: 'ckmeans'; bins: number }
  | { kind: 'rule'; rule: BinRule; round?: boolean };

/** The numbers a data-driven plan needs: sorted, with whether all are whole numbers. */
export interface BucketData {
  sorted: Float64Array;
  integers: boolean;
}

export interface BuildOptions {
  closed?: ClosedSide;
  /** Force whole-number (true) or interval (false) labels; default: whole numbers when edges and data are. */
  discrete?: boolean;
}

/** True when the plan needs every value before buckets can be made (a first pass over the data). */
export function planNeedsData(plan: BucketPlan): boolean {
  return plan.kind !== 'edges' && plan.kind !== 'scheme' && plan.kind !== 'spec';
}

function fromEdges(edges: readonly number[], source: string, closed: ClosedSide, o: { openLow?: boolean; openHigh?: boolean; includeEnds?: boolean; discrete?: boolean }): BucketSet {
  const bad = edges.find((e) => !Number.isFinite(e));
  if (bad !== undefined) throw new QuernError('E_VALUE', `bucket edge ${bad} is not a finite number`);
  const { buckets, merged, discrete } = bucketsFromEdges(edges, { closed, ...o });
  return { buckets, discrete, closed, source, merged, notes: [] };
}

function dataDriven(plan: BucketPlan, data: BucketData, closed: ClosedSide, discrete: boolean | undefined): BucketSet {
  const s = data.sorted;
  if (s.length === 0) throw new QuernError('E_DATA', 'no numbers to compute bucket edges from', 'check the --value column');
  const min = s[0]!, max = s[s.length - 1]!;
  const notes = [`data min ${min}, max ${max}, ${s.length} values`];
  let edges: number[];
  let source: string;
  if (plan.kind === 'equal-width') { edges = equalWidthEdges(min, max, plan.bins, plan.round ?? true); source = `equal width, ${plan.bins} bins requested`; }
  else if (plan.kind === 'quantile') { edges = quantileEdges(s, plan.bins, plan.type ?? 7); source = `quantiles type ${plan.type ?? 7}, ${plan.bins} bins (Hyndman & Fan 1996)`; }
  else if (plan.kind === 'ckmeans') return ckmeansSet(plan.bins, data, closed, discrete, notes);
  else if (plan.kind === 'rule') {
    const k = ruleBinCount(plan.rule, s, min, max);
    notes.push(`${plan.rule} rule suggests ${k} bins (d3-array thresholds)`);
    edges = equalWidthEdges(min, max, k, plan.round ?? true);
    source = `${plan.rule} rule, ${k} bins`;
  } else throw new QuernError('E_INTERNAL', `not a data-driven plan: ${plan.kind}`);
  const set = fromEdges(edges, source, closed, { includeEnds: true, discrete: discrete ?? data.integers });
  set.notes = notes;
  if (set.merged.length > 0) notes.push(`${set.merged.reduce((a, m) => a + m.times - 1, 0)} equal edges merged: ${set.buckets.length} buckets instead of ${plan.kind === 'rule' ? edges.length - 1 : plan.bins}`);
  return set;
}

function ckmeansSet(bins: number, data: BucketData, closed: ClosedSide, discrete: boolean | undefined, notes: string[]): BucketSet {
  const { extents, joined } = ckmeansExtents(data.sorted, bins);
  if (joined > 0) notes.push(`${joined} clusters that shared a value were joined: ${extents.length} buckets instead of ${bins}`);
  if (extents.length < bins && joined === 0) notes.push(`only ${extents.length} distinct clusters in the data`);
  const made = bucketsFromExtents(extents, closed, discrete ?? data.integers);
  return { buckets: made.buckets, discrete: made.discrete, closed, source: `Ckmeans natural breaks, ${bins} bins (Wang & Song 2011)`, merged: [], notes };
}

/** Makes the bucket set for a plan; data-driven plans need `data` (see planNeedsData). */
export function buildBuckets(plan: BucketPlan, options: BuildOptions = {}, data?: BucketData): BucketSet {
  const closed = options.closed ?? 'left';
  if (plan.kind === 'edges') {
    if (plan.edges.length === 0) throw new QuernError('E_USAGE', '--edges needs at least one number');
    return fromEdges(plan.edges, `edges ${plan.edges.join(',')}`, closed, { openLow: plan.openLow, openHigh: plan.openHigh, discrete: options.discrete });
  }
  if (plan.kind === 'scheme') {
    const scheme = findScheme(plan.name);
    if (scheme === undefined) {
      throw new QuernError('E_USAGE', `unknown scheme "${plan.name}"`, `known schemes: ${BUCKET_SCHEMES.map((s) => s.name).join(', ')} (quern bucket --list-schemes)`);
    }
    return { buckets: scheme.buckets.map((b) => ({ ...b })), discrete: true, closed: 'left', source: `scheme ${scheme.name}`, merged: [], notes: [] };
  }
  if (plan.kind === 'spec') return bucketsFromSpec(plan.spec);
  if (data === undefined) throw new QuernError('E_INTERNAL', `the ${plan.kind} method needs the data`);
  if (!(Number.isInteger(plan.kind === 'rule' ? 1 : plan.bins) && (plan.kind === 'rule' || plan.bins >= 1))) {
    throw new QuernError('E_USAGE', '--bins must be a whole number of at least 1');
  }
  return dataDriven(plan, data, closed, options.discrete);
}
