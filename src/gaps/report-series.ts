// One series' result from its period counts: the walk over expected periods, labelled for people.
import type { Calendar } from '../calendar/types.js';
import { formatLocalIso } from '../rebin/rows.js';
import type { Zone } from '../time/zone.js';
import type { SeriesState } from './gaps.js';
import { longestRun, walkSeries } from './runs.js';
import type { GapSeries, InstantGapReport, MissingRun } from './types.js';

/** The report of a series over the periods `first`..`last` of `cal`. */
export function seriesReport(group: string[], s: SeriesState, cal: Calendar, first: number, last: number,
  expected: (k: number) => boolean): GapSeries {
  const label = (k: number): string => cal.label(cal.startOf(k));
  const has = Number.isFinite(first) && Number.isFinite(last) && last >= first;
  const w = has ? walkSeries(first, last, s.counts, expected) : { expected: 0, present: 0, unexpected: 0, runs: [], duplicates: [] };
  const missing: MissingRun[] = w.runs.map((r) => ({ from: label(r.first), to: label(r.last), periods: r.periods, index: r.index }));
  const longest = longestRun(w.runs);
  return {
    key: group.join(' / '), group,
    first: has ? label(first) : null, last: has ? label(last) : null,
    rows: s.rows, expected: w.expected, present: w.present, missing,
    duplicates: w.duplicates.map((d) => ({ period: label(d.key), count: d.count, index: d.index })),
    coverage: w.expected === 0 ? 1 : w.present / w.expected,
    longestGap: longest === null ? null : missing[w.runs.indexOf(longest)]!,
    unexpected: w.unexpected,
  };
}

/** The report of a series of instants checked with --max-gap. */
export function instantSeriesReport(group: string[], s: SeriesState, zone: Zone): GapSeries {
  const b = s.buckets!;
  const gaps: InstantGapReport[] = b.gaps().map((g) => ({
    from: formatLocalIso(g.after, zone), to: formatLocalIso(g.before, zone), length: isoDurationOfMs(g.length), ms: g.length,
  }));
  let longest: InstantGapReport | null = null;
  for (const g of gaps) if (longest === null || g.ms > longest.ms) longest = g;
  return {
    key: group.join(' / '), group,
    first: b.count > 0 ? formatLocalIso(b.first, zone) : null, last: b.count > 0 ? formatLocalIso(b.last, zone) : null,
    rows: s.rows, expected: 0, present: 0, missing: [], duplicates: [],
    coverage: 1, longestGap: longest,
    unexpected: 0, gaps,
  };
}

/** A length in ms as an ISO 8601 duration of days and clock time: 22500000 → PT6H15M, 90000000 → P1DT1H. */
export function isoDurationOfMs(ms: number): string {
  let rest = Math.round(ms);
  const d = Math.floor(rest / 86_400_000);
  rest -= d * 86_400_000;
  const h = Math.floor(rest / 3_600_000);
  rest -= h * 3_600_000;
  const m = Math.floor(rest / 60_000);
  rest -= m * 60_000;
  const s = rest / 1000;
  const time = `${h ? `${h}H` : ''}${m ? `${m}M` : ''}${s ? `${s}S` : ''}`;
  const text = `P${d ? `${d}D` : ''}${time ? `T${time}` : ''}`;
  return text === 'P' ? 'PT0S' : text;
}
