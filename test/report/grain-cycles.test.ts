import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { detectGrain } from '../../src/grain/index.js';
import { grainCycles } from '../../src/report/html/grain-cycles.js';

const dir = mkdtempSync(join(tmpdir(), 'quern-cycles-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Instants across the 2024 US daylight-saving changes (10 March, 3 November), written in UTC.
const INSTANTS = ['2024-03-10T07:30:00Z', '2024-03-10T08:30:00Z', '2024-07-04T17:00:00Z', '2024-11-03T06:30:00Z', '2024-11-03T07:30:00Z', '2024-12-31T23:59:00Z'];

describe('grainCycles(file, report)', () => {
  it('grainCycles(...) counts each value on the wall clock of the zone, as Temporal reads it', async () => {
    const file = join(dir, 'instants.csv');
    writeFileSync(file, `t\n${INSTANTS.join('\n')}\n`);
    const report = await detectGrain(file, { zone: 'America/Chicago' });
    const cycles = (await grainCycles(file, report)).t;
    expect(cycles.rows).toBe(INSTANTS.length);
    // oracle: temporal-polyfill's ZonedDateTime in America/Chicago
    const hours = Array(24).fill(0);
    const weekdays = Array(7).fill(0);
    for (const text of INSTANTS) {
      const z = Temporal.Instant.from(text).toZonedDateTimeISO('America/Chicago');
      hours[z.hour]++;
      weekdays[z.dayOfWeek - 1]++;
    }
    expect(cycles.hourOfDay).toEqual(hours);
    expect(cycles.weekday).toEqual(weekdays);
  });

  it('grainCycles(...) returns nothing for standard input, which cannot be read twice', async () => {
    expect(await grainCycles('-', { columns: [] })).toEqual({});
  });
});
