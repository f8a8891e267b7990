// Output rows: periods in ordinal order (by period key, never by label text), then groups in order,
// each with its aggregates; empty periods filled with count 0 and the other aggregates empty.
import type { Calendar } from '../calendar/types.js';
import { civilFromDays, MS_PER_DAY } from '../calendar/civil.js';
import type { Zone } from '../time/zone.js';
import type { CellStore } from './accumulate.js';
import type { AggSpec } from './aggregates.js';
import type { KeyRange } from './fill.js';
import type { GroupIndex } from './groups.js';
import type { QuantileType } from '../bins/quantile.js';
import { quantileOfSorted } from '../bins/quantile.js';
import type { RebinRow } from './types.js';

/** Sorted period keys that hold at least one cell. */
export function occupiedKeys(store: CellStore): number[] {
  const keys = new Set<number>();
  for (let c = 0; c < store.size; c++) keys.add(store.key[c]!);
  return [...keys].sort((a, b) => a - b);
}

/** What buildRows needs. */
export interface RowsSetup {
  cal: Calendar;
  zone: Zone;
  store: CellStore;
  groups: GroupIndex;
  aggs: readonly AggSpec[];
  /** Index of each aggregate's column among the measure columns (-1 for row count). */
  measureOf: readonly number[];
  quantileType: QuantileType;
  /** The periods to emit: a filled range, or null to emit only periods that hold rows. */
  range: KeyRange | null;
}

/** The output rows, in period order then group order. */
export function buildRows(s: RowsSetup): RebinRow[] {
  const keys = s.range === null ? occupiedKeys(s.store) : null;
  const first = s.range?.first ?? 0;
  const n = keys === null ? s.range!.last - s.range!.first + 1 : keys.length;
  const groupIds = s.groups.sortedIds();
  const rows: RebinRow[] = [];
  for (let i = 0; i < n; i++) {
    const k = keys === null ? first + i : keys[i]!;
    const start = s.cal.startOf(k);
    const end = s.cal.startOf(k + 1);
    const period = s.cal.label(start);
    const startText = formatLocalIso(start, s.zone);
    const endText = formatLocalIso(end, s.zone);
    for (const g of groupIds) {
      const c = s.store.find(g, k);
      if (c < 0 && keys !== null) continue;
      rows.push({ period, start: startText, end: endText, group: [...s.groups.tuple(g)], values: values(s, c), filled: c < 0 });
    }
  }
  return rows;
}

/**
 * Rounds to 15 significant digits, the most a double always holds (IEEE 754 binary64), so float noise
 * such as 58.93999999999998 prints as 58.94 while every decimal input of up to 15 digits survives.
 */
export function tidyNumber(v: number | null): number | null {
  if (v === null || !Number.isFinite(v) || Number.isInteger(v)) return v;
  return Number(v.toPrecision(15));
}

function values(s: RowsSetup, c: number): (number | null)[] {
  return s.aggs.map((a, i) => tidyNumber(aggregateValue(s, c, a, i)));
}

function aggregateValue(s: RowsSetup, c: number, a: AggSpec, i: number): number | null {
  const m = s.measureOf[i]!;
  if (a.kind === 'count') {
    if (c < 0) return 0;
    return m < 0 ? s.store.count[c]! : s.store.measures[m]!.present[c]!;
  }
  if (a.kind === 'distinct') return c < 0 ? 0 : s.store.measures[m]!.distinct[c]?.size ?? 0;
  if (c < 0) return null;
  const slots = s.store.measures[m]!;
  if (slots.n[c] === 0) return null;
  switch (a.kind) {
    case 'sum': return s.store.sumOf(c, m);
    case 'mean': return s.store.sumOf(c, m) / slots.n[c]!;
    case 'min': return slots.min[c]!;
    case 'max': return slots.max[c]!;
    default: return quantileOfSorted(s.store.sortedValues(c, m), a.p, s.quantileType);
  }
}

/**
 * An instant as local ISO 8601 date-time with the zone's offset (`2024-03-10T00:00:00-06:00`; `Z` in UTC),
 * with milliseconds only when present.
 */
export function formatLocalIso(ms: number, zone: Zone): string {
  const off = zone.offsetMsAt(ms);
  const wall = ms + off;
  const days = Math.floor(wall / MS_PER_DAY);
  const [y, mo, d] = civilFromDays(days);
  const t = wall - days * MS_PER_DAY;
  const h = Math.floor(t / 3_600_000);
  const mi = Math.floor(t / 60_000) % 60;
  const sec = Math.floor(t / 1000) % 60;
  const frac = t % 1000;
  const year = y! >= 0 && y! <= 9999 ? String(y).padStart(4, '0') : (y! < 0 ? '-' : '+') + String(Math.abs(y!)).padStart(6, '0');
  const time = `${p2(h)}:${p2(mi)}:${p2(sec)}${frac === 0 ? '' : `.${String(frac).padStart(3, '0')}`}`;
  return `${year}-${p2(mo!)}-${p2(d!)}T${time}${offsetText(off, zone.name)}`;
}

function offsetText(offMs: number, zoneName: string): string {
  if (offMs === 0 && zoneName === 'UTC') return 'Z';
  const total = Math.round(Math.abs(offMs) / 1000);
  const sign = offMs < 0 ? '-' : '+';
  const h = Math.floor(total / 3600);
  const m = Math.floor(total / 60) % 60;
  const sec = total % 60;
  return `${sign}${p2(h)}:${p2(m)}${sec === 0 ? '' : `:${p2(sec)}`}`;
}

function p2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}
