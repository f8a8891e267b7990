// Source values that are already periods (a weekly or monthly table): they nest in the target unit, or
// they straddle a target boundary and need a policy — assign by start, by end, or apportion additive
// measures by the share of days in each target period. Rebinning to a finer unit is refused.
import type { Calendar, UnitName } from '../calendar/types.js';
import { QuernError } from '../errors.js';
import type { AggSpec } from './aggregates.js';
import { isAdditive } from './aggregates.js';
import { nominalLength } from './fill.js';

/** What to do with a source period that straddles a target boundary. */
export type AssignPolicy = 'start' | 'end' | 'apportion';

/** Checks a `--assign` value; throws QuernError 'E_USAGE'. */
export function parseAssignPolicy(text: string): AssignPolicy {
  if (text === 'start' || text === 'end' || text === 'apportion') return text;
  throw new QuernError('E_USAGE', `--assign ${JSON.stringify(text)} is not start, end or apportion`,
    'start or end put a straddling period wholly in the target period of its first or last day; apportion splits additive measures by day share');
}

/**
 * Refuses a target unit finer than the source periods (weeks into days, months into weeks): the split
 * would be invented, not measured. Throws QuernError 'E_POLICY' with the reason.
 */
export function refuseFinerTarget(source: UnitName, cal: Calendar): void {
  if (nominalLength(source) <= nominalLength(cal.unit, cal.step) * 1.0001) return;
  const target = cal.step === 1 ? cal.unit : `${cal.step}-${cal.unit}`;
  throw new QuernError('E_POLICY',
    `the values are ${source} periods; rebinning them to ${target} periods, which are shorter, would invent how each ${source} splits`,
    `choose a unit at least as long as ${source}, or rebin the underlying events instead`);
}

/** Refuses to apportion aggregates that do not add up over parts; throws QuernError 'E_POLICY'. */
export function refuseNonAdditive(aggs: readonly AggSpec[]): void {
  const bad = aggs.filter((a) => !isAdditive(a.kind)).map((a) => a.name);
  if (bad.length === 0) return;
  throw new QuernError('E_POLICY',
    `--assign apportion splits values by day share, which is meaningless for ${bad.join(', ')}`,
    'apportion only count and sum aggregates, or use --assign start or --assign end');
}

/** Where one source period goes: `n` target keys with their shares (reused between rows). */
export interface Placement {
  n: number;
  keys: number[];
  shares: number[];
  /** True when the source period touches more than one target period. */
  straddles: boolean;
}

/** A Placement to reuse for every row. */
export function emptyPlacement(): Placement {
  return { n: 0, keys: [], shares: [], straddles: false };
}

/**
 * Places a source period [start, end) (instants) in the target calendar under `policy` (null: none
 * chosen yet; a straddling period then gets n = 0). `toWall` turns an instant into wall-clock ms of the
 * calendar's zone, so shares are shares of calendar days even across a daylight-saving change.
 */
export function placePeriod(cal: Calendar, start: number, end: number, policy: AssignPolicy | null,
  toWall: (ms: number) => number, out: Placement): Placement {
  const k0 = cal.index(start);
  const k1 = cal.index(end - 1);
  out.straddles = k1 !== k0;
  if (!out.straddles || policy === 'start') return one(out, k0);
  if (policy === 'end') return one(out, k1);
  if (policy === null) {
    out.n = 0;
    return out;
  }
  const w0 = toWall(start);
  const span = toWall(end) - w0;
  out.n = 0;
  for (let k = k0; k <= k1; k++) {
    const a = Math.max(w0, toWall(cal.startOf(k)));
    const b = Math.min(w0 + span, toWall(cal.startOf(k + 1)));
    if (b <= a) continue;
    out.keys[out.n] = k;
    out.shares[out.n] = (b - a) / span;
    out.n++;
  }
  return out;
}

function one(out: Placement, k: number): Placement {
  out.n = 1;
  out.keys[0] = k;
  out.shares[0] = 1;
  return out;
}
