// The calendar-cycle counts behind a grain report, for results that do not carry them: one more streaming
// pass over the date columns, parsing each value under the format grain chose and reading it on the wall
// clock of the zone grain found. Memory stays constant; standard input cannot be read twice.
import type { GrainReport } from '../../grain/types.js';
import { openTable } from '../../table/open.js';
import type { TableOptions } from '../../table/types.js';
import { makeTimeParser } from '../../time/parser.js';
import { emptyParsedTime } from '../../time/types.js';
import { getZone } from '../../time/zone.js';
import { addToCycles, type CycleCounts, emptyCycles } from './cycles.js';

interface Reader {
  name: string;
  parse: ReturnType<typeof makeTimeParser>;
  toWall: ((ms: number) => number) | null;
  counts: CycleCounts;
}

/** Counts, per date column of `report`, where its values fall in the day, month, year and week. */
export async function grainCycles(file: string, report: Pick<GrainReport, 'columns'>, table: TableOptions = {}): Promise<Record<string, CycleCounts>> {
  if (file === '-') return {};
  const readers: Reader[] = [];
  for (const c of report.columns) {
    if (c.format === null) continue;
    let parse;
    try {
      parse = makeTimeParser(c.format);
    } catch {
      continue;
    }
    const zone = c.zoneFinding.zone;
    readers.push({ name: c.name, parse, toWall: zone ? getZone(zone).toWall.bind(getZone(zone)) : null, counts: emptyCycles() });
  }
  if (readers.length === 0) return {};
  const reader = await openTable(file, table);
  const out = emptyParsedTime();
  for await (const batch of reader.batches(readers.map((r) => r.name))) {
    readers.forEach((r, c) => {
      const col = batch.values[c];
      for (let i = 0; i < batch.length; i++) {
        if (r.parse(col[i], out) !== null) continue;
        const wall = out.kind !== 'instant' ? out.ms : r.toWall ? r.toWall(out.ms) : out.ms + (Number.isNaN(out.offset) ? 0 : out.offset * 60_000);
        if (Number.isFinite(wall)) addToCycles(r.counts, wall);
      }
    });
  }
  return Object.fromEntries(readers.map((r) => [r.name, r.counts]));
}
