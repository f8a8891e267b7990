// Plain result types of a table profile.
import type { Diagnostic } from '../errors.js';
import type { ColumnGrain } from '../grain/types.js';

/** Levels of measurement in the trade's three-way form of Stevens (1946), "On the theory of scales of measurement". */
export type MeasurementLevel = 'categorical' | 'ordinal' | 'quantitative';

/** What a column is for. */
export type ColumnRole =
  | 'time' // dates, date-times, periods: see `grain`
  | 'identifier' // unique sequential integers or unique strings naming each row
  | 'code' // zero-padded, fixed-width or named codes (area codes, postal codes) that look numeric but are not quantities
  | 'ordered-vocabulary' // low/medium/high, agreement scales, month and weekday names
  | 'range-label' // 0-4, 5-9, 85+, [10,20)
  | 'latitude'
  | 'longitude'
  | 'country-code' // ISO 3166-1 alpha-2 or alpha-3
  | 'count' // non-negative integers: counts and totals
  | 'measure' // other quantities
  | 'boolean'
  | 'category'
  | 'text' // free text: long, mostly distinct values
  | 'empty';

export interface ColumnProfile {
  name: string;
  level: MeasurementLevel;
  role: ColumnRole;
  /** The reason in a few words. */
  reason: string;
  /** Distinct non-empty values: exact up to 10,000, then a HyperLogLog estimate (`distinctExact` false). */
  distinct: number;
  distinctExact: boolean;
  /** Blank values. */
  empty: number;
  /** Non-empty values. */
  values: number;
  /** True for latitude, longitude and country codes. */
  spatial: boolean;
  /** Ordered vocabularies and range labels: the values in their order. */
  order?: string[];
  /** Numbers: smallest and largest value. */
  min?: number;
  max?: number;
  /** Time columns: everything `quern grain` finds. */
  grain?: ColumnGrain;
  /** The most frequent values (for categories), most frequent first. */
  top?: Array<{ value: string; count: number }>;
}

export interface TableShape {
  kind: 'items' | 'aggregated';
  /** Columns whose combination is unique on every row (the key); for items, a unique identifier if any. */
  key: string[];
  /** Count- or total-like columns beside the key (aggregated tables). */
  measures: string[];
  /** Other keys found equally small. */
  alternatives: string[][];
  reason: string;
  /** Rows over which uniqueness was checked exactly (the check is bounded; see shape.ts). */
  checkedRows: number;
}

export interface ProfileReport {
  file: string;
  rows: number;
  /** Rows the table reader rejected (ragged, undecodable), with the reason counts. */
  rejectedRows: number;
  /** The first few rejected rows, with line and reason (the table reader's examples). */
  rejectedExamples?: Diagnostic[];
  shape: TableShape;
  columns: ColumnProfile[];
}
