// A zone's UTC offset across the years the data covers: a step line with each daylight-saving change dated,
// so a reader sees which offsets the column's values should carry and when they switch.
import { daysFromCivil, MS_PER_DAY } from '../../calendar/civil.js';
import { formatOffset, getZone } from '../../time/zone.js';
import { html, type SafeHtml } from './escape.js';
import { stepLine } from './stepline.js';
import { dataTable, figure } from './table.js';

function wallDate(ms: number, zone: ReturnType<typeof getZone>): string {
  return new Date(zone.toWall(ms)).toISOString().slice(0, 16).replace('T', ' ');
}

/**
 * The offsets of `zoneName` from 1 January of `fromYear` to 1 January after `toYear` (at most 3 years), or
 * null when the zone name is unknown. A fixed zone shows one flat line.
 */
export function zoneYearFigure(id: string, zoneName: string, fromYear: number, toYear: number, seen: readonly number[]): SafeHtml | null {
  let zone;
  try {
    zone = getZone(zoneName);
  } catch {
    return null;
  }
  const last = Math.min(toYear, fromYear + 2);
  const start = daysFromCivil(fromYear, 1, 1) * MS_PER_DAY;
  const end = daysFromCivil(last + 1, 1, 1) * MS_PER_DAY;
  const t0 = start - zone.offsetMsAt(start);
  const t1 = end - zone.offsetMsAt(end);
  const changes = zone.transitions(t0, t1);
  const points = [
    { at: t0, value: zone.offsetAt(t0) },
    ...changes.map((c) => ({ at: c.at, value: c.after, label: `${wallDate(c.at, zone).slice(0, 10)} → ${formatOffset(c.after)}` })),
  ];
  const years = fromYear === last ? String(fromYear) : `${fromYear}–${last}`;
  const distinct = [...new Set(points.map((p) => p.value))].map(formatOffset);
  const summary = changes.length
    ? `${zone.name} in ${years}: ${changes.length} offset changes, between ${distinct.join(' and ')}.`
    : `${zone.name} in ${years}: one offset all year, ${distinct[0]}.`;
  const chart = stepLine({
    id,
    title: `UTC offset of ${zone.name}, ${years}`,
    summary,
    points,
    end: t1,
    formatValue: (v) => `UTC${formatOffset(v)}`,
    formatTime: (ms) => new Date(zone.toWall(ms)).toISOString().slice(0, 7),
    width: 620,
  });
  const table = dataTable({
    caption: `Offset changes of ${zone.name}`,
    columns: [{ label: 'from (local wall clock)' }, { label: 'offset' }],
    rows: points.map((p) => [wallDate(p.at, zone), formatOffset(p.value)]),
  });
  const seenText = seen.length ? ` The column's values carry ${seen.map(formatOffset).join(', ')}.` : '';
  return figure(html`<b>Zone.</b> ${summary}${seenText}`, chart, table);
}
