// The partial result of a rebin over one byte range, and the exact merge of such partials in file order:
// cells joined by (group values, period key), counts added, and every line number (examples, extremes,
// the first straddling value, the first leap second) shifted from the range's own lines to the file's.
import type { Diagnostic } from '../errors.js';
import type { StorePartial } from './accumulate.js';
import type { LocalResolutions } from './local-time.js';
import type { ScanCounts, ScanSetup } from './scan.js';
import type { MeasureSummary } from './types.js';

/** A QuernError a range met, as plain data. */
export interface RangeError {
  code: string;
  message: string;
  hint?: string;
}

/** ScanCounts as plain data (the offsets as an array, in first-seen order). */
export type CountsPartial = Omit<ScanCounts, 'offsets'> & { offsets: number[] };

/** What a range task of a parallel rebin hands back (structured-clonable). Lines are the range's own. */
export interface RebinPartial {
  /** The QuernError the range stopped on, or null; the caller then reads the file on one thread. */
  error: RangeError | null;
  /** The values of each local group id. */
  groups: string[][];
  store: StorePartial;
  counts: CountsPartial;
  localTime: LocalResolutions;
  measures: MeasureSummary[];
}

/** The partial of a finished range scan. */
export function partialOf(setup: ScanSetup, c: ScanCounts): RebinPartial {
  const groups: string[][] = [];
  for (let g = 0; g < setup.groups.size; g++) groups.push([...setup.groups.tuple(g)]);
  return {
    error: null, groups, store: setup.store.toPartial(),
    counts: { ...c, offsets: [...c.offsets], examples: c.examples.map((e) => ({ ...e })), extremes: { ...c.extremes }, rejectedByReason: { ...c.rejectedByReason } },
    localTime: { ...setup.resolver.counts },
    measures: setup.measures.map((m) => ({ ...m.summary, rejectedByReason: { ...m.summary.rejectedByReason } })),
  };
}

/**
 * Merges range partials, in file order, into `setup` (fresh cells and groups, as a whole read starts) and
 * returns the counts of the whole file: the same as one read gives, with range k's lines shifted by
 * `bases[k]`. Throws what the cells throw when the merged values pass a limit (QuernError 'E_DATA').
 */
export function mergePartials(partials: readonly RebinPartial[], bases: readonly number[], setup: ScanSetup): ScanCounts {
  const m: ScanCounts = {
    used: 0, empty: 0, outside: 0, rejected: 0, rejectedByReason: {}, examples: [], extremes: { minKey: Infinity, minLine: 0, minText: '', maxKey: -Infinity, maxLine: 0, maxText: '' },
    periodRows: 0, straddling: 0, firstStraddle: null, sourceUnit: null, offsets: new Set(), leapSeconds: 0, firstLeapSecondLine: 0,
  };
  partials.forEach((p, k) => {
    const base = bases[k]!;
    const ids = p.groups.map((t) => setup.groups.idOfTuple(t));
    setup.store.mergePartial(p.store, (id) => ids[id]!);
    mergeCounts(m, p.counts, base, setup.maxExamples);
    setup.resolver.counts.nonexistent += p.localTime.nonexistent;
    setup.resolver.counts.repeated += p.localTime.repeated;
    p.measures.forEach((s, i) => addMeasureSummary(setup.measures[i]!.summary, s));
  });
  return m;
}

function mergeCounts(m: ScanCounts, c: CountsPartial, base: number, maxExamples: number): void {
  m.used += c.used;
  m.empty += c.empty;
  m.outside += c.outside;
  m.rejected += c.rejected;
  addReasons(m.rejectedByReason, c.rejectedByReason);
  for (const e of c.examples) if (m.examples.length < maxExamples) m.examples.push(shifted(e, base));
  // Strict comparisons: on a tie the earlier range (the earlier line) keeps the extreme, as in one read.
  const x = m.extremes;
  const y = c.extremes;
  if (y.minKey < x.minKey) Object.assign(x, { minKey: y.minKey, minLine: y.minLine + base, minText: y.minText });
  if (y.maxKey > x.maxKey) Object.assign(x, { maxKey: y.maxKey, maxLine: y.maxLine + base, maxText: y.maxText });
  m.periodRows += c.periodRows;
  m.straddling += c.straddling;
  if (m.firstStraddle === null && c.firstStraddle !== null) m.firstStraddle = { line: c.firstStraddle.line + base, text: c.firstStraddle.text };
  // The unit of the last period row read (as one read leaves it).
  if (c.sourceUnit !== null) m.sourceUnit = c.sourceUnit;
  // The first four distinct offsets of the file are among the first four of each range, in file order.
  for (const o of c.offsets) if (m.offsets.size < 4) m.offsets.add(o);
  if (c.leapSeconds > 0 && m.leapSeconds === 0) m.firstLeapSecondLine = c.firstLeapSecondLine + base;
  m.leapSeconds += c.leapSeconds;
}

function shifted(e: Diagnostic, base: number): Diagnostic {
  return { ...e, line: e.line + base };
}

function addReasons(into: Record<string, number>, from: Readonly<Record<string, number>>): void {
  for (const [k, v] of Object.entries(from)) into[k] = (into[k] ?? 0) + v;
}

function addMeasureSummary(into: MeasureSummary, from: MeasureSummary): void {
  into.valid += from.valid;
  into.empty += from.empty;
  into.rejected += from.rejected;
  addReasons(into.rejectedByReason, from.rejectedByReason);
}
