// Turns one accumulated column into its findings: the reading kept, the zone, the grain under the tolerance
// rule, the level, the cadence and the first and last values.
import type { UnitName } from '../calendar/types.js';
import { commonWrittenUnit, makeWrittenUnitReader } from '../time/written-unit.js';
import { CANDIDATES, isPeriodGrain } from './candidates.js';
import { cadenceOf, periodKey } from './cadence.js';
import type { GrainColumn, Reading } from './column.js';
import { BoundaryCounter } from './counter.js';
import { chooseGrain, namesAnEnd, notationGrain, type GrainChoice } from './decide.js';
import { explainColumn } from './explain.js';
import type { StoredValue } from './store.js';
import type { Cadence, ColumnGrain, Grain } from './types.js';
import { grainWords } from './words.js';
import { resolveChangingOffsets, resolveGiven, resolveOneOffset, writtenOffset, type ZoneResolution } from './zone-resolve.js';

export interface AnalyseOptions {
  /** Zone to read instants in (--zone); otherwise inferred. */
  zone?: string;
}

/** The reading kept: the one with fewest invalid values; ties between readings make the format ambiguous. */
function pickReading(col: GrainColumn): { reading: Reading; ambiguity: string[] | null; evidence: string | null } {
  const sorted = [...col.readings].sort((a, b) => a.invalid - b.invalid);
  const best = sorted[0]!;
  const inference = col.inference!;
  if (sorted.length === 1) return { reading: best, ambiguity: null, evidence: inference.evidence.join('; ') || null };
  const tied = sorted.filter((r) => r.invalid === best.invalid);
  if (tied.length > 1) return { reading: best, ambiguity: tied.map((r) => r.format.label), evidence: inference.reason };
  const rival = sorted[1]!;
  const proof = rival.invalidExamples[0];
  const evidence = proof
    ? `the head of the file fitted both ${best.format.label} and ${rival.format.label}; line ${proof.line} (${JSON.stringify(proof.value)}) reads only as ${best.format.label}`
    : `${best.format.label} reads ${rival.invalid - best.invalid} more values than ${rival.format.label}`;
  return { reading: best, ambiguity: null, evidence };
}

function storedValues(r: Reading): { values: StoredValue[]; sampled: boolean } {
  const values = r.store.values;
  return values !== null ? { values, sampled: false } : { values: r.store.reservoir, sampled: true };
}

function counterOf(values: readonly StoredValue[], wall: (v: StoredValue) => number): BoundaryCounter {
  const c = new BoundaryCounter();
  for (const v of values) c.add(wall(v), v.weight, true, v.line, v.text);
  return c;
}

function resolveZone(r: Reading, values: StoredValue[], sampled: boolean, written: GrainChoice | null, options: AnalyseOptions): ZoneResolution {
  const hasInstants = r.kinds.instant > 0;
  if (options.zone !== undefined || !hasInstants) return resolveGiven(values, hasInstants, options.zone, sampled);
  const offsets = [...r.offsets.keys()].sort((a, b) => a - b);
  if (offsets.length > 1) return resolveChangingOffsets(values, offsets, sampled);
  const grainMs = written ? CANDIDATES[written.candidate]!.approxMs : 1;
  return resolveOneOffset(values, offsets[0] ?? 0, grainMs, sampled);
}

/** True when `a` is a coarser grain than `b` (no grain counts as the finest). */
function coarser(a: GrainChoice | null, b: GrainChoice | null): boolean {
  const ms = (c: GrainChoice | null): number => (c === null ? 0 : CANDIDATES[c.candidate]!.approxMs);
  return ms(a) > ms(b);
}

/**
 * The grain the notation itself states: the unit periods name ('day' for 2021-04-05), or for instants and
 * wall-clock readings the clock unit every value writes ('second' for 08:15:00, none when any value writes
 * a fraction). Read from the stored values, the exact distinct values or the sample.
 */
function notationOf(r: Reading, values: readonly StoredValue[]): { grain: Grain; unit: UnitName } | null {
  if (r.kinds.period === 0) {
    const unit = commonWrittenUnit(makeWrittenUnitReader(r.format), values.map((v) => v.text));
    const grain = unit === null ? null : notationGrain(unit);
    return grain === null ? null : { grain, unit: unit! };
  }
  if (r.kinds.period < r.parsed) return null;
  const unit = r.periodUnit ?? r.format.unit;
  const grain = notationGrain(unit, r.format.fiscalStart?.month ?? 10);
  return grain === null ? null : { grain, unit: unit! };
}

function cadence(grain: Grain, values: readonly StoredValue[], wall: (v: StoredValue) => number, rows: number): Cadence {
  const keys = new Set<number>();
  for (const v of values) keys.add(periodKey(grain, wall(v), v.ms));
  const sorted = [...keys].sort((a, b) => a - b);
  return cadenceOf(grain, sorted, rows);
}

/** Weeks named by ISO or epidemiological week labels keep the notation's unit when the values say no more. */
function withNotationUnit(g: Grain, unit: Reading['periodUnit']): Grain {
  const weekUnit = unit === 'iso-week' ? 1 : unit === 'epi-week' ? 7 : 0;
  if (g.unit === 'week' && g.step === 1 && g.anchor === 'start' && g.weekStart === weekUnit) return { ...g, unit: unit! };
  return g;
}

/** Findings for one column, or null when the column is not date-like. */
export function analyseColumn(col: GrainColumn, options: AnalyseOptions = {}): ColumnGrain | null {
  if (col.notTime || col.readings.length === 0) return null;
  const { reading: r, ambiguity, evidence } = pickReading(col);
  const { values, sampled } = storedValues(r);
  const notation = notationOf(r, values);
  const choose = { notation: notation?.grain ?? null, endHint: namesAnEnd(col.name) };
  const writtenCounter = r.store.stream ?? counterOf(values, (v) => v.wall);
  const written = chooseGrain(writtenCounter, { ...choose, distinctKnown: r.store.stream === null });
  let zone = resolveZone(r, values, sampled, written, options);
  const sameWall = zone.finding.basis !== 'aligned' && zone.finding.basis !== 'given';
  let choice = sameWall ? written : chooseGrain(counterOf(values, zone.wall), { ...choose, distinctKnown: !sampled });
  if (zone.finding.basis === 'aligned' && !coarser(choice, written)) {
    // The zone was found because the values fall on its local hours or days, but too few of them to claim
    // that coarser grain (the tolerance rule): the same few values cannot name the zone either. Keep the
    // written offset.
    zone = writtenOffset(values, [...r.offsets.keys()][0] ?? 0, sampled);
    choice = written;
  }
  const grain = choice ? withNotationUnit(choice.grain, r.periodUnit) : null;
  const distinct = r.store.distinctCount();
  let cad: Cadence | null = null;
  if (grain !== null && !sampled) cad = cadence(grain, values, zone.wall, r.parsed);
  else if (grain !== null) cad = { kind: 'irregular', every: null, unit: null, distinct: distinct.count, distinctExact: false, missing: 0, repeated: 0, typicalGap: null };
  const level = grain === null ? null : isPeriodGrain(grain) ? 'ordinal' : 'quantitative';
  const result: ColumnGrain = {
    name: col.name,
    format: r.format.id,
    formatLabel: r.format.label,
    formatEvidence: evidence,
    ambiguity,
    notationUnit: notation?.unit ?? null,
    values: { parsed: r.parsed, empty: col.empty, invalid: r.invalid },
    invalidExamples: r.invalidExamples.map((e) => ({ ...e })),
    grain,
    zone: zone.finding.zone,
    zoneFinding: zone.finding,
    level,
    levelReason: '',
    coverage: choice?.coverage ?? null,
    cadence: cad,
    first: r.min?.value ?? null,
    last: r.max?.value ?? null,
    findings: [],
  };
  explainColumn(result, r.kinds, r.minMs);
  if (ambiguity && grain) result.findings.push(otherReadings(col, r, grain, choose));
  return result;
}

/** Whether the readings the values cannot tell apart give the same grain (they often do: days either way). */
function otherReadings(col: GrainColumn, kept: Reading, grain: Grain, choose: { notation: Grain | null; endHint: boolean }): string {
  const differ: string[] = [];
  for (const other of col.readings) {
    if (other === kept || other.invalid !== kept.invalid) continue;
    const { values } = storedValues(other);
    const g = chooseGrain(counterOf(values, (v) => v.wall), { ...choose, notation: notationOf(other, values)?.grain ?? null })?.grain;
    if (g && (g.unit !== grain.unit || g.step !== grain.step || g.anchor !== grain.anchor)) differ.push(`${other.format.label}: ${grainWords(g)}`);
  }
  return differ.length === 0
    ? 'The grain is the same under either reading.'
    : `The grain depends on the reading (${differ.join('; ')}): settle the format before relying on it.`;
}
