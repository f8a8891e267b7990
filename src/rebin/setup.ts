// The fixed setup of one rebin scan: the calendar, how the time and measure columns are read, the cells
// and groups to fill. Made from the first rows (formats inferred from them) or from formats already
// inferred — a range task of a parallel rebin is handed the formats the main thread inferred, so every
// range reads values exactly as one whole read would.
import { makeCalendar } from '../calendar/index.js';
import type { Calendar } from '../calendar/types.js';
import { inferNumberFormat } from '../numbers/index.js';
import type { NumberFormat } from '../numbers/index.js';
import type { TimeFormat } from '../time/format.js';
import type { ColumnBatch } from '../table/types.js';
import type { CellStore, MeasureNeeds } from './accumulate.js';
import type { GroupIndex } from './groups.js';
import type { LocalResolver } from './local-time.js';
import { makeMeasureReaders } from './measures.js';
import type { ScanSetup } from './scan.js';
import { inferTimeReadingFormat, timeHints, timeReadingOf } from './time-column.js';
import type { RebinOptions } from './types.js';

/** Values of the time column (and of each measure column) sampled to infer its format. */
export const SAMPLE = 2000;

/** How the columns are read: the time column's format and each measure column's number format (null: text only). */
export interface ReadFormats {
  time: TimeFormat;
  numbers: (NumberFormat | null)[];
}

/** Where the columns sit among the batch columns, and what each measure column needs kept. */
export interface ColumnPlan {
  /** The batch columns: time first, then the `--by` and measure columns, each once. */
  columns: readonly string[];
  by: readonly string[];
  measureCols: readonly string[];
  needs: readonly MeasureNeeds[];
}

/** Position of `name` among the plan's batch columns. */
export function slotOf(plan: ColumnPlan, name: string): number {
  return plan.columns.indexOf(name);
}

/**
 * The formats the first rows `first` (a batch of all plan columns) are written in: the time format named
 * by `o.timeFormat` or inferred (QuernError 'E_FORMAT' when none fits), and each measure column's number
 * format (for columns read as numbers).
 */
export function inferFormats(o: RebinOptions, cal: Calendar, plan: ColumnPlan, first: ColumnBatch): ReadFormats {
  const sample = (s: number): readonly string[] => first.values[s]!.slice(0, SAMPLE);
  const time = inferTimeReadingFormat(sample(0), o.timeFormat ?? null, hintsOf(o, cal));
  const numbers = plan.measureCols.map((col, i) => (plan.needs[i]!.numbers ? inferNumberFormat(sample(slotOf(plan, col))).format : null));
  return { time, numbers };
}

/** The scan setup of a rebin reading the columns in `formats` into `store` and `groups`. */
export function makeSetup(file: string, o: RebinOptions, cal: Calendar, plan: ColumnPlan, formats: ReadFormats,
  store: CellStore, groups: GroupIndex, resolver: LocalResolver): ScanSetup {
  const time = timeReadingOf(formats.time, hintsOf(o, cal));
  const measures = makeMeasureReaders(plan.measureCols, plan.needs, plan.measureCols.map((c) => slotOf(plan, c)), formats.numbers);
  const source = o.sourceUnit ? { cal: makeCalendar({ ...o.calendar, unit: o.sourceUnit, step: 1 }), anchor: o.sourceAnchor ?? 'start' } : null;
  return {
    file, timeColumn: o.time, cal, time, resolver, store, groups, bySlots: plan.by.map((n) => slotOf(plan, n)), measures,
    fromKey: o.from == null ? null : cal.index(o.from), untilKey: o.until == null ? null : cal.index(o.until),
    assign: o.assign ?? null, source, maxExamples: o.maxExamples ?? 5,
  };
}

function hintsOf(o: RebinOptions, cal: Calendar): ReturnType<typeof timeHints> & { fiscalStart: Calendar['fiscalStart']; fiscalLabel: Calendar['fiscalLabel'] } {
  return { ...timeHints(o.time, o.dayOrder), fiscalStart: cal.fiscalStart, fiscalLabel: cal.fiscalLabel };
}
