// The tolerance rule of grain detection, in one place.
//
// THE RULE
// 1. A grain holds when at least 99% of the parsed values lie on its boundaries. The values that do not
//    are reported as exceptions: their count and the first five with their lines. So a few stray values
//    cannot hide a clear grain, and a few aligned values among many others cannot fake one.
// 2. A grain coarser than the one the written notation already states is claimed only from enough distinct
//    values: at least 5, and enough that values of the finer grain already found would land on the coarser
//    one by chance less than once in a thousand times — n distinct values with (1/r)^n < 1/1000, where r is
//    how many finer periods make one coarser period (r = 24 hours a day needs 5; r = 2 for fortnights over
//    weeks needs 10; r = 3 for quarters over months needs 7).
// 3. Among grains that hold, the coarsest wins; at equal length a start anchor wins over an end anchor.

/** Smallest share of parsed values that must lie on a grain. */
export const MIN_SHARE = 0.99;

/** Fewest distinct values from which a grain coarser than the notation is ever claimed. */
export const MIN_DISTINCT = 5;

/** Chance below which alignment by luck is ruled out (rule 2). */
export const CHANCE = 1 / 1000;

/** True when `onGrain` of `total` values is enough for the grain to hold (rule 1). */
export function holds(onGrain: number, total: number): boolean {
  return total > 0 && onGrain >= MIN_SHARE * total;
}

/** Distinct values needed to claim a grain `ratio` times coarser than the one already found (rule 2). */
export function distinctNeeded(ratio: number): number {
  if (!(ratio > 1)) return MIN_DISTINCT;
  return Math.max(MIN_DISTINCT, Math.ceil(Math.log(1 / CHANCE) / Math.log(ratio)));
}
