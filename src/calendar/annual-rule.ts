// The annual rule of a zone far out, for sub-day keys beyond 2100 (see subday.ts).
//
// A zone's offsets after its last listed transition follow one annual rule (the POSIX TZ string of the
// TZif footer, RFC 8536 §3.3: month/week/weekday `Mm.w.d`, Julian `Jn` or zero-based day `n`, each with a
// time of day). tzdb's longest explicit predictions end in 2087 (from memory), so from RULE_START_MS on the
// rule alone gives every transition. The rule is read back from the zone's own table for 2100 and checked
// against the table in nine consecutive years and in far years (leap and non-leap centuries, 9999); any
// mismatch, or two readings of the rule that disagree, leaves the zone without a rule (the table walk).
// A Gregorian 400-year cycle is 146097 days, a whole number of weeks, so the rule repeats exactly after it.
import type { Zone, ZoneTransition } from '../time/zone.js';
import { ZONE_CHUNK_MS } from '../time/zone.js';
import { civilFromDays, daysFromCivil, daysInMonth, isoWeekday, MS_PER_DAY, yearOfDays } from './civil.js';

const DAY = MS_PER_DAY;
export const CYCLE_MS = 146_097 * DAY;
/** The first table block wholly at or after 2100-01-01T00:00Z. */
export const RULE_CHUNK = Math.ceil((daysFromCivil(2100, 1, 1) * DAY) / ZONE_CHUNK_MS);
export const RULE_START_MS = RULE_CHUNK * ZONE_CHUNK_MS;

export interface RuleTransition {
  at: number;
  before: number;
  after: number;
}

interface DateRule {
  /** Day number (days since 1970-01-01) of the rule's date in `year`. */
  day(year: number): number;
  /** Instant of the transition minus 00:00Z of that day (any sign, several days at most). */
  tau: number;
}

function nthWeekday(y: number, m: number, wd: number, n: number): number {
  const first = daysFromCivil(y, m, 1);
  return first + ((wd - isoWeekday(first) + 7) % 7) + 7 * (n - 1);
}

function lastWeekday(y: number, m: number, wd: number): number {
  const last = daysFromCivil(y, m, daysInMonth(y, m));
  return last - ((isoWeekday(last) - wd + 7) % 7);
}

/** Every reading of a transition at instant `at` as an annual rule (dates up to 9 days either side). */
function readings(at: number): DateRule[] {
  const out: DateRule[] = [];
  const base = Math.floor(at / DAY);
  for (let k = -9; k <= 9; k++) {
    const x = base + k;
    const [y, m, d] = civilFromDays(x) as [number, number, number];
    const tau = at - x * DAY;
    const wd = isoWeekday(x);
    const n = Math.ceil(d / 7);
    if (n <= 4) out.push({ day: (Y) => nthWeekday(Y, m, wd, n), tau });
    if (d > daysInMonth(y, m) - 7) out.push({ day: (Y) => lastWeekday(Y, m, wd), tau });
    if (!(m === 2 && d === 29)) out.push({ day: (Y) => daysFromCivil(Y, m, d), tau });
    const yd = x - daysFromCivil(y, 1, 1);
    out.push({ day: (Y) => daysFromCivil(Y, 1, 1) + yd, tau });
  }
  return out;
}

/** Instants of rule `r` within [s, e). */
function predict(r: DateRule, s: number, e: number): number[] {
  const out: number[] = [];
  const y1 = yearOfDays(Math.floor(e / DAY)) + 1;
  for (let y = yearOfDays(Math.floor(s / DAY)) - 1; y <= y1; y++) {
    const at = r.day(y) * DAY + r.tau;
    if (at >= s && at < e) out.push(at);
  }
  return out;
}

function yearSpan(y: number): [number, number] {
  return [daysFromCivil(y, 1, 1) * DAY, daysFromCivil(y + 1, 1, 1) * DAY];
}

const VERIFY_YEARS = [2100, 2101, 2102, 2103, 2104, 2105, 2106, 2107, 2108, 2203, 2400, 2401, 2500, 3001, 5000, 9999];

/** The transitions of one 400-year cycle from RULE_START_MS, read from the zone's rule; null when unsure. */
function readCycle(zone: Zone): RuleTransition[] | null {
  const spans = VERIFY_YEARS.map(yearSpan);
  const seen = spans.map(([s, e]) => zone.transitions(s, e));
  const refs = zone.transitions(RULE_START_MS, RULE_START_MS + 372 * DAY);
  const rules: (DateRule & { before: number; after: number })[] = [];
  for (const ref of refs) {
    const fits = (r: DateRule, s: number, e: number, got: readonly ZoneTransition[]): boolean =>
      predict(r, s, e).every((at) => got.some((o) => o.at === at && o.beforeMs === ref.beforeMs && o.afterMs === ref.afterMs));
    let ok = readings(ref.at).filter((r) => spans.every(([s, e], i) => fits(r, s, e, seen[i]!)));
    // Readings that agree in the checked years but not in some other year of the cycle: the table decides.
    for (let y = 2100; y < 2500 && ok.length > 1; y++) {
      const at = ok[0]!.day(y) * DAY + ok[0]!.tau;
      if (ok.every((r) => r.day(y) * DAY + r.tau === at)) continue;
      const [s, e] = yearSpan(y);
      const got = zone.transitions(s - 10 * DAY, e + 10 * DAY);
      ok = ok.filter((r) => fits(r, s - 10 * DAY, e + 10 * DAY, got));
    }
    if (ok.length === 0) return null;
    const r0 = ok[0]!;
    if (!rules.some((q) => q.day(2200) * DAY + q.tau === r0.day(2200) * DAY + r0.tau)) {
      rules.push({ day: r0.day, tau: r0.tau, before: ref.beforeMs, after: ref.afterMs });
    }
  }
  // The rule must give every transition the table holds in the checked years, and the offsets in force.
  for (let i = 0; i < spans.length; i++) {
    const [s, e] = spans[i]!;
    const got = rules.flatMap((r) => predict(r, s, e)).sort((a, b) => a - b);
    const want = seen[i]!;
    if (got.length !== want.length || got.some((at, k) => at !== want[k]!.at)) return null;
  }
  const cycle: RuleTransition[] = [];
  for (const r of rules) {
    for (const at of predict(r, RULE_START_MS, RULE_START_MS + CYCLE_MS)) cycle.push({ at, before: r.before, after: r.after });
  }
  cycle.sort((a, b) => a.at - b.at);
  for (let i = 0; i < cycle.length; i++) {
    const prev = i > 0 ? cycle[i - 1]!.after : zone.offsetMsAt(RULE_START_MS);
    if (cycle[i]!.before !== prev) return null;
  }
  if (cycle.length > 0 && cycle[cycle.length - 1]!.after !== zone.offsetMsAt(RULE_START_MS)) return null;
  if (cycle.length === 0 && spans.some(([s]) => zone.offsetMsAt(s) !== zone.offsetMsAt(RULE_START_MS))) return null;
  return cycle;
}

const cycles = new Map<string, RuleTransition[] | null>();

/** The zone's transitions in [RULE_START_MS, +400 years), cached per zone name; null without a sure rule. */
export function ruleCycle(zone: Zone): RuleTransition[] | null {
  if (!cycles.has(zone.name)) cycles.set(zone.name, readCycle(zone));
  return cycles.get(zone.name)!;
}
