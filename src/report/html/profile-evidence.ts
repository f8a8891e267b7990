// The evidence behind profile cards, for profiles that do not carry it: one more streaming pass that bins
// each quantity between the profile's own min and max (round edges from d3-array's ticks), counts each
// ordered level in its order, and counts time columns over the calendar. Standard input cannot be re-read.
import { tickStep } from 'd3-array';
import { inferNumberFormat } from '../../numbers/infer.js';
import { emptyParsedNumber, makeNumberParser } from '../../numbers/parse.js';
import type { ProfileReport } from '../../profile/types.js';
import { openTable } from '../../table/open.js';
import type { TableOptions } from '../../table/types.js';
import type { HistogramBin } from '../terminal.js';
import type { CycleCounts } from './cycles.js';
import { grainCycles } from './grain-cycles.js';

export interface ProfileEvidence {
  cycles: Record<string, CycleCounts>;
  histograms: Record<string, HistogramBin[]>;
  levels: Record<string, Array<{ value: string; count: number }>>;
}

/** Round bin edges covering [min, max] (about 12 bins of a d3-array tick step; whole steps for integers). */
export function binEdges(min: number, max: number, integers: boolean): number[] {
  if (!(max > min)) return [min, min + 1];
  let step = tickStep(min, max, 12);
  if (integers) step = Math.max(1, Math.round(step));
  const start = Math.floor(min / step) * step;
  const edges = [start];
  for (let k = 1; edges[edges.length - 1] <= max; k++) edges.push(start + k * step);
  return edges;
}

/** Counts the values of quantities and ordered levels, and the time columns over the calendar. */
export async function profileEvidence(file: string, report: ProfileReport, table: TableOptions = {}): Promise<ProfileEvidence> {
  const empty: ProfileEvidence = { cycles: {}, histograms: {}, levels: {} };
  if (file === '-') return empty;
  const grains = report.columns.flatMap((c) => (c.role === 'time' && c.grain ? [c.grain] : []));
  const cycles = grains.length ? await grainCycles(file, { columns: grains }, table) : {};
  const quantities = report.columns.filter((c) => c.level === 'quantitative' && c.role !== 'time' && c.role !== 'identifier' && c.min !== undefined && c.max !== undefined);
  const ordinals = report.columns.filter((c) => c.level === 'ordinal' && c.order?.length && c.role !== 'time');
  const names = [...quantities.map((c) => c.name), ...ordinals.map((c) => c.name)];
  if (names.length === 0) return { ...empty, cycles };
  const hist = quantities.map((c) => {
    const edges = binEdges(c.min!, c.max!, Number.isInteger(c.min) && Number.isInteger(c.max));
    return { name: c.name, edges, counts: new Float64Array(edges.length - 1), parser: null as ReturnType<typeof makeNumberParser> | null };
  });
  const lev = ordinals.map((c) => ({ name: c.name, order: c.order!, index: new Map(c.order!.map((v, i) => [v.trim().toLowerCase(), i])), counts: new Float64Array(c.order!.length) }));
  const reader = await openTable(file, table);
  const out = emptyParsedNumber();
  for await (const batch of reader.batches(names)) {
    hist.forEach((h, c) => {
      const col = batch.values[c];
      h.parser ??= makeNumberParser(inferNumberFormat(col.slice(0, 1000)).format);
      for (let i = 0; i < batch.length; i++) {
        if (h.parser.parse(col[i], out) !== 'ok') continue;
        let k = Math.floor(((out.value - h.edges[0]) / (h.edges[1] - h.edges[0])));
        k = Math.max(0, Math.min(h.counts.length - 1, k));
        h.counts[k]++;
      }
    });
    lev.forEach((l, j) => {
      const col = batch.values[hist.length + j];
      for (let i = 0; i < batch.length; i++) {
        const k = l.index.get(col[i].trim().toLowerCase());
        if (k !== undefined) l.counts[k]++;
      }
    });
  }
  return {
    cycles,
    histograms: Object.fromEntries(hist.map((h) => [h.name, Array.from(h.counts, (count, k) => ({ low: h.edges[k], high: h.edges[k + 1], count }))])),
    levels: Object.fromEntries(lev.map((l) => [l.name, l.order.map((value, k) => ({ value, count: l.counts[k] }))])),
  };
}
