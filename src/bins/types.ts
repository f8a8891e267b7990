// Plain data types of buckets: ordered, labelled, non-overlapping ranges and the spec file that stores them.
import type { Range } from '../ranges/index.js';

/** Which end of each range holds its edge value: 'left' is [a, b), 'right' is (a, b]. */
export type ClosedSide = 'left' | 'right';

/** One bucket: its order index, label and range, with an optional display name and published weight. */
export interface Bucket {
  index: number;
  label: string;
  range: Range;
  /** Display name (life stages: "children"). */
  name?: string;
  /** The published standard-population weight of the group, where the scheme has one. */
  weight?: number;
}

/** A named scheme with its published source. */
export interface BucketScheme {
  name: string;
  title: string;
  /** The publication the groups come from, or "common practice". */
  source: string;
  /** What `weight` means for this scheme, when weights are given. */
  weights?: string;
  buckets: readonly Bucket[];
}

/** An edge that appeared more than once (quantiles on heavy ties) and was merged. */
export interface MergedEdge {
  value: number;
  /** How many computed edges had this value. */
  times: number;
}

/** A bucket set ready to apply, with how it was made. */
export interface BucketSet {
  buckets: Bucket[];
  discrete: boolean;
  closed: ClosedSide;
  /** "scheme five-year-85", "edges 0,5,10", "quantiles type 7 of 4", … */
  source: string;
  /** Edges merged because they were equal. */
  merged: MergedEdge[];
  /** Extra facts about how edges were computed (rule bin count, data min/max…). */
  notes: string[];
}

/** The bucket spec file (`--spec-out`, read by `--spec`): see the team brief. */
export interface BucketSpec {
  kind: 'quern-bucket-spec';
  version: 1;
  value: string;
  discrete: boolean;
  closed: ClosedSide;
  source: string;
  ranges: Array<{ index: number; label: string; low: number | null; high: number | null; lowClosed: boolean; highClosed: boolean; name?: string; weight?: number }>;
}
