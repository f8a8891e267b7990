// Picks the grain of a column from its boundary counts, under the tolerance rule of tolerance.ts.
import type { UnitName } from '../calendar/types.js';
import { CANDIDATES } from './candidates.js';
import type { BoundaryCounter } from './counter.js';
import { distinctNeeded, holds } from './tolerance.js';
import type { Coverage, Grain } from './types.js';

export interface GrainChoice {
  grain: Grain;
  coverage: Coverage;
  /** Index of the chosen candidate in CANDIDATES. */
  candidate: number;
}

export interface ChooseOptions {
  /** The grain the written notation already states (a month for '2021-04'); null for instants. */
  notation?: Grain | null;
  /** False when the counter was fed row by row, so distinct support is unknown (and taken as ample). */
  distinctKnown?: boolean;
  /** True when the column's name says its values end their periods ('week_ending'): weeks are read as ending. */
  endHint?: boolean;
}

/** Index of the candidate that stands for `g` (same unit, step, anchor, week start, fiscal start). */
export function candidateOf(g: Grain): number {
  return CANDIDATES.findIndex((c) => sameGrain(c.grain, g));
}

function sameGrain(a: Grain, b: Grain): boolean {
  return a.unit === b.unit && a.step === b.step && a.anchor === b.anchor && (a.weekStart ?? null) === (b.weekStart ?? null)
    && (a.fiscalStart?.month ?? 0) === (b.fiscalStart?.month ?? 0);
}

/** The candidate grain a notation unit states ('iso-week' → weeks starting Monday, 'epi-week' → Sunday). */
export function notationGrain(unit: UnitName | null, fiscalStartMonth = 10): Grain | null {
  switch (unit) {
    case null: return null;
    case 'iso-week': return { unit: 'week', step: 1, anchor: 'start', weekStart: 1 };
    case 'epi-week': return { unit: 'week', step: 1, anchor: 'start', weekStart: 7 };
    case 'fiscal-year': return { unit: 'fiscal-year', step: 1, anchor: 'start', weekStart: null, fiscalStart: { month: fiscalStartMonth, day: 1 } };
    case 'day': case 'month': case 'quarter': case 'half': case 'year': case 'hour': case 'minute': case 'second':
      return { unit, step: 1, anchor: 'start', weekStart: null };
    default: return null;
  }
}

/**
 * The coarsest candidate that holds (rule 1) with enough distinct support (rule 2), never finer than the
 * notation's own grain. Returns null when the counter saw no values.
 */
export function chooseGrain(counter: BoundaryCounter, options: ChooseOptions = {}): GrainChoice | null {
  const total = counter.rows;
  if (total === 0) return null;
  const known = options.distinctKnown ?? true;
  let chosen = 0;
  const floor = options.notation ? candidateOf(options.notation) : -1;
  if (floor >= 0 && holds(counter.rowsOn[floor]!, total)) chosen = floor;
  let acceptedMs = CANDIDATES[chosen]!.approxMs;
  for (let c = 0; c < CANDIDATES.length; c++) {
    const cand = CANDIDATES[c]!;
    if (cand.approxMs <= acceptedMs) continue;
    if (!holds(counter.rowsOn[c]!, total)) continue;
    const support = known ? counter.distinctOn[c]! : Infinity;
    if (support < distinctNeeded(cand.approxMs / acceptedMs)) continue;
    chosen = c;
    acceptedMs = cand.approxMs;
  }
  const grain: Grain = { ...CANDIDATES[chosen]!.grain };
  if (grain.unit === 'week' && options.endHint && grain.weekStart !== null) {
    // Values on weekday w that end their weeks: the weeks start the day after (a Saturday ending a Sunday week).
    grain.anchor = 'end';
    grain.weekStart = (grain.weekStart % 7) + 1;
  }
  const onGrain = counter.rowsOn[chosen]!;
  const coverage: Coverage = {
    onGrain,
    share: onGrain / total,
    exceptions: total - onGrain,
    examples: onGrain === total ? [] : counter.misses[chosen]!.map((e) => ({ ...e })),
  };
  return { grain, coverage, candidate: chosen };
}

/** True when a column name says its values end their periods ("week_ending", "period_end", "through"). */
export function namesAnEnd(name: string): boolean {
  return /(^|[^a-z])(end|ending|ended|ends|through|thru|until|to)([^a-z]|$)/i.test(name.replace(/([a-z])([A-Z])/g, '$1_$2'));
}
