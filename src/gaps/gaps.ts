// gaps: per series, the expected periods between its first and last, which are missing (as runs), which
// hold more than one row, and the coverage — or, for instants without a regular grain, every gap longer
// than a duration. Streams the table once; memory grows with periods × series, not with rows.
import { makeCalendar } from '../calendar/index.js';
import type { Calendar, CalendarOptions } from '../calendar/types.js';
import { QuernError, shortValue } from '../errors.js';
import { GroupIndex } from '../rebin/groups.js';
import { LocalResolver } from '../rebin/local-time.js';
import { isBlank } from '../rebin/measures.js';
import { splitReason, timeHints, timeReading } from '../rebin/time-column.js';
import type { TimeReading } from '../rebin/time-column.js';
import type { ColumnBatch, TableReader } from '../table/types.js';
import type { ParsedTime } from '../time/types.js';
import { emptyParsedTime } from '../time/types.js';
import { getZone } from '../time/zone.js';
import type { Zone } from '../time/zone.js';
import { expectedTest } from './expected.js';
import { InstantBuckets } from './max-gap.js';
import { seriesReport, instantSeriesReport } from './report-series.js';
import type { GapsOptions, GapsResult, GapsSummary } from './types.js';

/** The running state of one series. */
export interface SeriesState {
  counts: Map<number, number>;
  minKey: number;
  maxKey: number;
  rows: number;
  buckets: InstantBuckets | null;
}

interface Run {
  o: GapsOptions;
  zone: Zone;
  resolver: LocalResolver;
  time: TimeReading;
  cal: Calendar | null;
  unitBasis: string;
  groups: GroupIndex;
  series: SeriesState[];
  bySlots: number[];
  fromKey: number | null;
  untilKey: number | null;
  summary: GapsSummary;
}

/**
 * Finds missing and duplicated periods per series of `reader`. The expected periods come from
 * `options.calendar`, or from the values' own notation when they are periods (epidemiological-week labels);
 * with `maxGapMs`, gaps between instants longer than it are reported instead. Misuse throws QuernError.
 */
export async function findGaps(reader: TableReader, options: GapsOptions): Promise<GapsResult> {
  if (options.maxGapMs != null && options.calendar !== null) {
    throw new QuernError('E_USAGE', '--max-gap and --unit ask two different questions', 'give --unit for regular periods, or --max-gap for instants without a regular grain');
  }
  if (options.calendar === null && options.maxGapMs != null && (options.weekdays || (options.skipDays?.size ?? 0) > 0)) {
    throw new QuernError('E_USAGE', '--weekdays and --skip-dates remove expected periods, which --max-gap does not have', 'give --unit day (or a shorter unit) with them');
  }
  const by = [...(options.by ?? [])];
  const columns = [options.time, ...by.filter((b) => b !== options.time)];
  for (const c of columns) reader.columnIndex(c);
  let run: Run | null = null;
  const pt = emptyParsedTime();
  for await (const b of reader.batches(columns)) {
    run ??= await start(reader, options, b, columns, by, pt);
    addBatch(run, b, pt);
  }
  run ??= await start(reader, options, { length: 0, lines: [], values: columns.map(() => []) }, columns, by, pt);
  return finish(run, reader);
}

async function start(reader: TableReader, o: GapsOptions, first: ColumnBatch, columns: string[], by: string[], pt: ParsedTime): Promise<Run> {
  let zoneName = o.calendar?.zone ?? o.zone ?? 'UTC';
  const time = timeReading(first.values[0]!.slice(0, 2000), o.timeFormat ?? null, timeHints(o.time, o.dayOrder));
  let cal: Calendar | null = null;
  let unitBasis = o.unitBasis ?? 'given with --unit';
  let weekdays = o.weekdays ?? false;
  if (o.calendar !== null) cal = makeCalendar({ ...o.calendar, zone: zoneName });
  else if (o.maxGapMs == null) {
    const unit = notationUnit(first.values[0]!, time, pt);
    if (unit !== null) {
      const opts: CalendarOptions = { unit, zone: zoneName };
      cal = makeCalendar(opts);
      unitBasis = `from the values' notation: ${time.label}`;
    } else if (o.detect) {
      const choice = await o.detect();
      zoneName = o.zone ?? choice.calendar.zone ?? zoneName; // the detected zone unless one was given
      cal = makeCalendar({ ...choice.calendar, zone: zoneName });
      unitBasis = choice.basis;
      weekdays = weekdays || choice.weekdays;
    } else {
      throw new QuernError('E_USAGE', 'gaps needs the period unit of the expected series',
        'give --unit (e.g. --unit day, or --unit minute --step 15), or --max-gap PT30M for instants without a regular grain');
    }
  } else unitBasis = `gaps between instants longer than ${o.maxGapText ?? `${o.maxGapMs} ms`}`;
  const zone = getZone(zoneName);
  const groups = new GroupIndex(by.length);
  if (by.length === 0) groups.idOf1('');
  return {
    o: { ...o, weekdays }, zone, resolver: new LocalResolver(zone), time, cal, unitBasis, groups, series: [],
    bySlots: by.map((b) => columns.indexOf(b)),
    fromKey: cal === null || o.from == null ? null : cal.index(o.from),
    untilKey: cal === null || o.until == null ? null : cal.index(o.until),
    summary: {
      file: reader.file, rowsRead: 0, rowsUsed: 0, rowsEmpty: 0, rowsRejected: 0, rejectedByReason: {}, rowsOutside: 0, examples: [],
      localTime: { nonexistent: 0, repeated: 0 }, timeFormat: { id: time.id, label: time.label, kind: time.kind },
    },
  };
}

// The unit the values name when they are periods (all of one unit): '2024-EW07' → epi-week.
function notationUnit(sample: readonly string[], time: TimeReading, pt: ParsedTime): CalendarOptions['unit'] | null {
  if (time.kind !== 'period') return null;
  for (const v of sample) {
    if (isBlank(v) || time.parse(v, pt) !== null) continue;
    if (pt.kind === 'period' && pt.unit !== null) return pt.unit;
  }
  return null;
}

function seriesOf(run: Run, b: ColumnBatch, i: number): SeriesState {
  const g = run.bySlots.length === 0 ? 0 : run.groups.idOfRow(b.values, run.bySlots, i);
  let s = run.series[g];
  if (s === undefined) {
    s = { counts: new Map(), minKey: Infinity, maxKey: -Infinity, rows: 0, buckets: run.cal === null ? new InstantBuckets(run.o.maxGapMs!) : null };
    run.series[g] = s;
  }
  return s;
}

function addBatch(run: Run, b: ColumnBatch, pt: ParsedTime): void {
  const times = b.values[0]!;
  const sum = run.summary;
  for (let i = 0; i < b.length; i++) {
    const text = times[i]!;
    if (isBlank(text)) {
      sum.rowsEmpty++;
      continue;
    }
    const reason = run.time.parse(text, pt);
    if (reason !== null) {
      reject(run, splitReason(reason), b.lines[i]!, text);
      continue;
    }
    const startMs = pt.kind === 'instant' ? pt.ms : run.resolver.resolve(pt.ms);
    if (run.cal === null) {
      if ((run.o.from != null && startMs < run.o.from) || (run.o.until != null && startMs > run.o.until)) {
        sum.rowsOutside++;
        continue;
      }
      sum.rowsUsed++;
      const s = seriesOf(run, b, i);
      s.rows++;
      s.buckets!.add(startMs);
      continue;
    }
    const k0 = run.cal.index(startMs);
    const k1 = pt.kind === 'period' ? Math.max(k0, run.cal.index(run.resolver.resolve(pt.endMs) - 1)) : k0;
    const lo = run.fromKey === null ? k0 : Math.max(k0, run.fromKey);
    const hi = run.untilKey === null ? k1 : Math.min(k1, run.untilKey);
    if (hi < lo) {
      sum.rowsOutside++;
      continue;
    }
    sum.rowsUsed++;
    const s = seriesOf(run, b, i);
    s.rows++;
    for (let k = lo; k <= hi; k++) s.counts.set(k, (s.counts.get(k) ?? 0) + 1);
    if (lo < s.minKey) s.minKey = lo;
    if (hi > s.maxKey) s.maxKey = hi;
  }
}

function reject(run: Run, r: { code: string; message: string }, line: number, text: string): void {
  const sum = run.summary;
  sum.rowsRejected++;
  sum.rejectedByReason[r.code] = (sum.rejectedByReason[r.code] ?? 0) + 1;
  if (sum.examples.length < (run.o.maxExamples ?? 5)) {
    sum.examples.push({ code: r.code, file: sum.file, line, column: run.o.time, value: shortValue(text), message: r.message });
  }
}

function finish(run: Run, reader: TableReader): GapsResult {
  const t = reader.summary();
  const sum = run.summary;
  sum.rowsRead = t.rowsRead;
  sum.rowsRejected += t.rowsRejected;
  for (const [k, v] of Object.entries(t.rejectedByReason)) sum.rejectedByReason[k] = (sum.rejectedByReason[k] ?? 0) + v;
  sum.examples = [...t.examples, ...sum.examples].slice(0, run.o.maxExamples ?? 5);
  sum.localTime = { ...run.resolver.counts };
  if (sum.rowsUsed + sum.rowsEmpty + sum.rowsRejected + sum.rowsOutside !== sum.rowsRead) {
    throw new QuernError('E_INTERNAL', `row accounting is off: ${sum.rowsUsed + sum.rowsEmpty + sum.rowsRejected + sum.rowsOutside} rows counted, ${sum.rowsRead} read`);
  }
  const cal = run.cal;
  const expected = cal === null ? null : expectedTest(cal, (ms) => run.zone.toWall(ms), { weekdays: run.o.weekdays ?? false, skipDays: run.o.skipDays ?? new Set() });
  const series = run.groups.sortedIds().flatMap((g) => {
    const s = run.series[g];
    if (s === undefined) return [];
    const group = [...run.groups.tuple(g)];
    if (cal === null) return [instantSeriesReport(group, s, run.zone)];
    const first = run.fromKey ?? s.minKey;
    const last = run.untilKey ?? s.maxKey;
    const rep = seriesReport(group, s, cal, first, last, expected!);
    if (run.o.duplicates === false) rep.duplicates = [];
    return [rep];
  });
  const problems = series.some((s) => s.missing.length > 0 || s.duplicates.length > 0 || (s.gaps?.length ?? 0) > 0);
  return {
    unit: cal?.unit ?? null, step: cal?.step ?? 1, zone: run.zone.name, unitBasis: run.unitBasis,
    duplicatesReported: run.o.duplicates !== false, weekdays: run.o.weekdays ?? false, skippedDates: run.o.skipDays?.size ?? 0, maxGap: run.o.maxGapText ?? null,
    series, problems, summary: sum,
  };
}

