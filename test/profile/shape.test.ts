// Table shape: aggregated when a combination of categorical or period columns is unique on every row with a
// count beside it; items otherwise. Weeks are generated with the Temporal polyfill.
import { describe, expect, it, vi } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { profileTable } from '../../src/profile/index.js';
import { seeded, writeColumns } from '../grain/helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

describe('profileTable(file).shape', () => {
  it('week × clinic unique with a cases column is aggregated, keyed by week and clinic', async () => {
    const clinics = ['Alderbrook', 'Fennick Cross', 'Marrow Hill', 'Quillon Bay'];
    const week: string[] = [];
    const clinic: string[] = [];
    const cases: string[] = [];
    const rnd = seeded(5);
    for (let w = 0; w < 30; w++) {
      for (const c of clinics) {
        week.push(Temporal.PlainDate.from('2024-01-06').add({ weeks: w }).toString()); // Saturdays
        clinic.push(c);
        cases.push(String(Math.floor(rnd() * 30)));
      }
    }
    const r = await profileTable(writeColumns({ week_ending: week, clinic, cases }));
    expect(r.shape).toMatchObject({ kind: 'aggregated', key: ['week_ending', 'clinic'], measures: ['cases'], checkedRows: 120 });
  });

  it('rows of events with an id are items keyed by the id, even when the id is unique', async () => {
    const rnd = seeded(9);
    const n = 300;
    const r = await profileTable(writeColumns({
      visit_id: Array.from({ length: n }, (_, i) => String(1000 + i)),
      clinic: Array.from({ length: n }, () => ['A', 'B', 'C'][Math.floor(rnd() * 3)]!),
      wait_minutes: Array.from({ length: n }, () => (rnd() * 60).toFixed(1)),
    }));
    expect(r.shape).toMatchObject({ kind: 'items', key: ['visit_id'] });
  });

  it('a unique combination without any count beside it is not called aggregated', async () => {
    const r = await profileTable(writeColumns({ region: ['N', 'N', 'S', 'S'], year_label: ['a', 'b', 'a', 'b'], note: ['x', 'y', 'z', 'w'] }));
    expect(r.shape.kind).toBe('items');
  });
});
