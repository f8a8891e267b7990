// Small multiples: one column chart per group, all on the same value scale, so heights compare across
// groups at a glance. The shared top is stated in each chart's text alternative.
import { html, type SafeHtml, makeId } from './escape.js';
import { columnChart, columnSummary, type ColumnDatum } from './columns.js';
import { formatNumber } from '../terminal.js';

export interface MultipleGroup {
  name: string;
  data: readonly ColumnDatum[];
}

export interface SmallMultiplesSpec {
  id: string;
  valueLabel: string;
  groups: readonly MultipleGroup[];
  width?: number;
  height?: number;
}

/** The largest finite value across all groups: the shared top of every small chart. */
export function sharedMax(groups: readonly MultipleGroup[]): number {
  let max = 0;
  for (const g of groups) for (const d of g.data) if (d.value !== null && Number.isFinite(d.value) && d.value > max) max = d.value;
  return max;
}

/** A grid of small column charts on one shared scale, each titled with its group. */
export function smallMultiples(spec: SmallMultiplesSpec): SafeHtml {
  const yMax = sharedMax(spec.groups);
  const charts = spec.groups.map((g) => {
    const id = makeId(spec.id, g.name);
    const base = { id, title: g.name === '' ? '(empty)' : g.name, valueLabel: spec.valueLabel, data: g.data, yMax };
    const summary = `${columnSummary(base)} Shared scale up to ${formatNumber(yMax)}.`;
    return html`<div><h3>${base.title}</h3>${columnChart({ ...base, summary, width: spec.width ?? 420, height: spec.height ?? 160 })}</div>`;
  });
  return html`<div class="q-multiples">${charts}</div>`;
}
