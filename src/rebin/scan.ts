// The hot path of rebin: each batch of rows is parsed, placed in a period and added to its cell, with no
// per-row objects. Instants go straight to the calendar; wall-clock readings are placed in the zone first;
// values that are periods go through the period-source policy.
import type { Calendar, UnitName } from '../calendar/types.js';
import type { Diagnostic } from '../errors.js';
import { QuernError, shortValue } from '../errors.js';
import type { ByteBatch, ColumnBatch } from '../table/types.js';
import { byteFieldString } from '../table/byte-batch.js';
import type { ParsedTime } from '../time/types.js';
import { emptyParsedTime } from '../time/types.js';
import { fastIsoBytes, newIsoDateMemo } from '../time/iso-bytes.js';
import { InstantTally } from './instant-tally.js';
import type { CellStore } from './accumulate.js';
import type { KeyExtremes } from './fill.js';
import { emptyExtremes, noteExtreme } from './fill.js';
import type { GroupIndex } from './groups.js';
import type { LocalResolver } from './local-time.js';
import type { MeasureReader } from './measures.js';
import { addMeasure, isBlank, readMeasure } from './measures.js';
import type { ValueRead } from './measures.js';
import type { AssignPolicy } from './period-source.js';
import { emptyPlacement, placePeriod, refuseFinerTarget } from './period-source.js';
import { splitReason } from './time-column.js';
import type { TimeReading } from './time-column.js';

/** Everything the scan needs, fixed for one rebin. */
export interface ScanSetup {
  file: string;
  /** Name of the time column, for diagnostics. */
  timeColumn: string;
  cal: Calendar;
  time: TimeReading;
  resolver: LocalResolver;
  store: CellStore;
  groups: GroupIndex;
  /** Positions of the `--by` columns among the batch columns. */
  bySlots: number[];
  measures: MeasureReader[];
  fromKey: number | null;
  untilKey: number | null;
  assign: AssignPolicy | null;
  /** A calendar of the unit each source date stands for, with its anchor (week-ending dates). */
  source: { cal: Calendar; anchor: 'start' | 'end' } | null;
  maxExamples: number;
}

/** Running counts of a scan. */
export interface ScanCounts {
  used: number;
  empty: number;
  outside: number;
  rejected: number;
  rejectedByReason: Record<string, number>;
  examples: Diagnostic[];
  extremes: KeyExtremes;
  periodRows: number;
  straddling: number;
  /** First straddling value, for the message when no policy is chosen. */
  firstStraddle: { line: number; text: string } | null;
  sourceUnit: UnitName | null;
  /** Distinct written offsets (minutes) of instants, up to a few, for the zone note. */
  offsets: Set<number>;
  /** Values written as a leap second (23:59:60), read as 23:59:59.999, and the line of the first. */
  leapSeconds: number;
  firstLeapSecondLine: number;
}

/** True when the bytes buf[s, e) are empty or only spaces and tabs (as `isBlank` says of their text). */
function blankBytes(buf: Buffer, s: number, e: number): boolean {
  for (let i = s; i < e; i++) {
    const c = buf[i];
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}

/** Streams batches into the cells of `setup.store`. */
export class RebinScan {
  readonly counts: ScanCounts = {
    used: 0, empty: 0, outside: 0, rejected: 0, rejectedByReason: {}, examples: [], extremes: emptyExtremes(),
    periodRows: 0, straddling: 0, firstStraddle: null, sourceUnit: null, offsets: new Set(), leapSeconds: 0, firstLeapSecondLine: 0,
  };
  private readonly s: ScanSetup;
  private readonly pt: ParsedTime = emptyParsedTime();
  private readonly memo = newIsoDateMemo();
  private readonly placement = emptyPlacement();
  private readonly toWall: (ms: number) => number;
  private checkedUnit: UnitName | null = null;
  private readonly reads: ValueRead[] = [];
  /** The period of the previous instant row, [lastLo, lastHi) with key lastKey. */
  private lastKey = 0;
  private lastLo = Infinity;
  private lastHi = -Infinity;
  private tally: InstantTally | null = null;

  constructor(setup: ScanSetup, toWall: (ms: number) => number) {
    this.s = setup;
    this.toWall = toWall;
  }

  /** Adds every row of batch `b` (columns: time, by columns, measure columns). */
  batch(b: ColumnBatch): void {
    const { s, pt, counts } = this;
    const times = b.values[0]!;
    const ungrouped = s.bySlots.length === 0;
    for (let i = 0; i < b.length; i++) {
      const text = times[i]!;
      if (isBlank(text)) {
        counts.empty++;
        continue;
      }
      const reason = s.time.parse(text, pt);
      if (reason !== null) {
        const r = splitReason(reason);
        this.reject(r.code, b.lines[i]!, text, r.message);
        continue;
      }
      if (pt.leapSecond && counts.leapSeconds++ === 0) counts.firstLeapSecondLine = b.lines[i]!;
      if (pt.kind === 'period') {
        this.addPeriodRow(b, i, text);
        continue;
      }
      const key = this.keyOf(pt);
      if ((s.fromKey !== null && key < s.fromKey) || (s.untilKey !== null && key > s.untilKey)) {
        counts.outside++;
        continue;
      }
      counts.used++;
      noteExtreme(counts.extremes, key, b.lines[i]!, text);
      const g = ungrouped ? 0 : s.groups.idOfRow(b.values, s.bySlots, i);
      this.add(b, i, s.store.cell(g, key), 1, 0);
    }
  }

  /**
   * Adds every row of byte batch `b`, whose byte column 0 is the time column; `view` holds the other
   * columns as strings at their slots (slot 0 unused). Same results as `batch` on the same rows: the
   * time is parsed from its bytes, and its text is made only for the rows that need it (rejections,
   * source periods, new extremes).
   */
  bytes(b: ByteBatch, view: ColumnBatch): void {
    const { s, pt, counts, memo } = this;
    const starts = b.starts[0]!;
    const ends = b.ends[0]!;
    const decoded = b.decoded[0]!;
    const ungrouped = s.bySlots.length === 0;
    const countOnly = s.measures.length === 0;
    const fast = s.time.isoFast;
    const store = s.store;
    const fromKey = s.fromKey ?? -Infinity;
    const untilKey = s.untilKey ?? Infinity;
    const x = counts.extremes;
    let used = 0;
    for (let i = 0; i < b.length; i++) {
      const buf = decoded[i] === 1 ? b.side : b.buf;
      const st = starts[i]!;
      const en = ends[i]!;
      // The ISO fast lane first: a value it reads is neither blank nor a leap second.
      if (!fast || !fastIsoBytes(buf, st, en, pt, memo)) {
        if (blankBytes(buf, st, en)) {
          counts.empty++;
          continue;
        }
        const reason = s.time.parseBytes(buf, st, en, pt);
        if (reason !== null) {
          const r = splitReason(reason);
          this.reject(r.code, b.lines[i]!, byteFieldString(b, 0, i), r.message);
          continue;
        }
        if (pt.leapSecond && counts.leapSeconds++ === 0) counts.firstLeapSecondLine = b.lines[i]!;
      }
      if (pt.kind === 'period') {
        this.addPeriodRow(view, i, byteFieldString(b, 0, i));
        continue;
      }
      const key = this.keyOf(pt);
      if (key < fromKey || key > untilKey) {
        counts.outside++;
        continue;
      }
      used++;
      if (key < x.minKey || key > x.maxKey) noteExtreme(x, key, b.lines[i]!, byteFieldString(b, 0, i));
      const c = store.cell(ungrouped ? 0 : s.groups.idOfRow(view.values, s.bySlots, i), key);
      if (countOnly) store.count[c] += 1;
      else this.add(view, i, c, 1, 0);
    }
    // Added once a batch (nothing reads it before the batch ends; a throw discards the scan).
    counts.used += used;
  }

  /**
   * A tally that counts this scan's instants straight from the record kernel (see instant-tally.ts), for
   * a count with no groups and no measures of a column read in ISO 8601; null otherwise. Its rows take no
   * part in `bytes`: `finishTally` adds them in.
   */
  startTally(): InstantTally | null {
    const s = this.s;
    if (this.tally !== null || s.measures.length > 0 || s.bySlots.length > 0 || !s.time.isoFast) return this.tally;
    this.tally = new InstantTally({ cal: s.cal, store: s.store, fromKey: s.fromKey ?? -Infinity, untilKey: s.untilKey ?? Infinity, offsets: this.counts.offsets });
    return this.tally;
  }

  /** Adds the tally's counts, rows and extremes to the scan's, once the read has ended. */
  finishTally(): void {
    if (this.tally === null) return;
    this.counts.used += this.tally.finish(this.counts.extremes);
    this.tally = null;
  }

  /** The period key of an instant or wall-clock reading in `pt`, through the last-period cache. */
  private keyOf(pt: ParsedTime): number {
    const { s, counts } = this;
    let ms = pt.ms;
    if (pt.kind === 'local') ms = s.resolver.resolve(ms);
    else if (pt.offset !== 0 && counts.offsets.size < 4) counts.offsets.add(pt.offset);
    // Event logs are mostly in time order: reuse the last period while the instant stays inside it.
    if (ms >= this.lastLo && ms < this.lastHi) return this.lastKey;
    const key = s.cal.index(ms);
    this.lastKey = key;
    this.lastLo = s.cal.startOf(key);
    this.lastHi = s.cal.startOf(key + 1);
    return key;
  }

  private add(b: ColumnBatch, i: number, c: number, w: number, piece: number): void {
    const s = this.s;
    s.store.count[c] += w;
    const ms = s.measures;
    for (let m = 0; m < ms.length; m++) {
      const r = ms[m]!;
      const text = b.values[r.slot]![i]!;
      // A row split over several periods is read (and counted) once, then added to each piece.
      if (piece === 0) this.reads[m] = readMeasure(r, text, s.file, b.lines[i]!, this.counts.examples, s.maxExamples);
      addMeasure(s.store, m, r, this.reads[m]!, c, text, w);
    }
  }

  private addPeriodRow(b: ColumnBatch, i: number, text: string): void {
    const { s, pt, counts } = this;
    const line = b.lines[i]!;
    let start = s.resolver.resolve(pt.ms);
    let end = s.resolver.resolve(pt.endMs);
    let unit = pt.unit;
    if (s.source !== null) {
      const k = s.source.cal.floor(start);
      const e = s.source.cal.next(start);
      const anchored = s.source.anchor === 'start' ? k === start : e === end;
      if (!anchored) {
        this.reject(s.source.anchor === 'start' ? 'not-period-start' : 'not-period-end', line, text,
          `not the ${s.source.anchor === 'start' ? 'first' : 'last'} day of a ${s.source.cal.unit} period`);
        return;
      }
      start = k;
      end = e;
      unit = s.source.cal.unit;
    }
    if (unit !== null && unit !== this.checkedUnit) {
      refuseFinerTarget(unit, s.cal);
      this.checkedUnit = unit;
      counts.sourceUnit = unit;
    }
    counts.periodRows++;
    const p = placePeriod(s.cal, start, end, s.assign, this.toWall, this.placement);
    if (p.straddles) {
      counts.straddling++;
      if (counts.firstStraddle === null) counts.firstStraddle = { line, text };
      if (p.n === 0) return; // no policy yet: counted, reported at the end
    }
    let inside = 0;
    let g = -1;
    for (let j = 0; j < p.n; j++) {
      const key = p.keys[j]!;
      if ((s.fromKey !== null && key < s.fromKey) || (s.untilKey !== null && key > s.untilKey)) continue;
      if (g < 0) g = s.bySlots.length === 0 ? 0 : s.groups.idOfRow(b.values, s.bySlots, i);
      noteExtreme(counts.extremes, key, line, text);
      this.add(b, i, s.store.cell(g, key), p.shares[j]!, inside++);
    }
    if (inside > 0) counts.used++;
    else counts.outside++;
  }

  private reject(code: string, line: number, text: string, why: string): void {
    const c = this.counts;
    c.rejected++;
    c.rejectedByReason[code] = (c.rejectedByReason[code] ?? 0) + 1;
    if (c.examples.length < this.s.maxExamples) {
      c.examples.push({ code, file: this.s.file, line, column: this.s.timeColumn, value: shortValue(text), message: why });
    }
  }

  /** Throws QuernError 'E_POLICY' when source periods straddle target boundaries and no policy was chosen. */
  requirePolicy(): void {
    requirePolicy(this.counts, this.s.assign, this.s.cal);
  }
}

/** Throws QuernError 'E_POLICY' when the counted source periods straddle target boundaries and no policy was chosen. */
export function requirePolicy(c: ScanCounts, assign: AssignPolicy | null, cal: Calendar): void {
  if (c.straddling === 0 || assign !== null) return;
  const unit = c.sourceUnit ?? 'source';
  const target = cal.step === 1 ? cal.unit : `${cal.step}-${cal.unit}`;
  const first = c.firstStraddle!;
  throw new QuernError('E_POLICY',
    `${c.straddling.toLocaleString('en-US')} of ${c.periodRows.toLocaleString('en-US')} ${unit} values straddle a ${target} boundary ` +
    `(first: ${JSON.stringify(first.text)} on line ${first.line}), so they do not nest`,
    'choose --assign start (by the first day), --assign end (by the last day) or --assign apportion (count and sum split by day share)');
}
