// Property: for any zone of a varied list and any start date, a year of that zone's starts of day written in
// UTC is found to be days in a zone that behaves like it — the zone itself or one listed as an equal match.
// Starts of day come from the Temporal polyfill (PlainDate.toZonedDateTime), the independent oracle.
import { describe, expect, it, vi } from 'vitest';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { detectGrain } from '../../src/grain/index.js';
import { writeColumns } from './helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

const ZONES = ['America/New_York', 'Europe/Berlin', 'Australia/Sydney', 'America/Sao_Paulo', 'Asia/Kolkata',
  'Asia/Kathmandu', 'Pacific/Auckland', 'America/Havana', 'Asia/Beirut', 'Australia/Lord_Howe', 'Africa/Cairo'];
const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 6);

describe('detectGrain(file) on UTC-written starts of day in any zone', () => {
  it('finds days in a zone that behaves like the generating zone', async () => {
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...ZONES), fc.integer({ min: 0, max: 365 * 20 }), async (zone, offsetDays) => {
        const d0 = Temporal.PlainDate.from('2005-01-01').add({ days: offsetDays });
        const values = Array.from({ length: 200 }, (_, k) => d0.add({ days: 2 * k }).toZonedDateTime(zone).toInstant().toString());
        const c = (await detectGrain(writeColumns({ day: values }))).columns[0]!;
        expect(c.grain!.unit).toBe('day');
        const named = [c.zone, ...c.zoneFinding.alternatives];
        const z = Temporal.PlainDate.from('2005-01-01').toZonedDateTime(zone).timeZoneId;
        expect(named).toContain(z);
      }),
      { numRuns: RUNS, seed: 20241202 },
    );
  });
});
