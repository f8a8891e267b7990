// detectGrain format evidence: day-first and month-first dates decided by the first value only one reading
// accepts (even far past the head sample), ambiguity kept when nothing decides, epoch and spreadsheet serial
// columns, and invalid values counted with their lines. Dates are generated with the Temporal polyfill.
import { describe, expect, it, vi } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { detectGrain } from '../../src/grain/index.js';
import { writeColumns } from './helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

const two = (n: number): string => String(n).padStart(2, '0');

/** `n` dates whose day and month are both 12 or below (so dd/mm and mm/dd both read them), in order. */
function lowDays(n: number): Temporal.PlainDate[] {
  const out: Temporal.PlainDate[] = [];
  for (let d = Temporal.PlainDate.from('2001-01-01'); out.length < n; d = d.add({ days: 1 })) if (d.day <= 12) out.push(d);
  return out;
}

async function column(values: string[], options = {}, name = 'when') {
  return (await detectGrain(writeColumns({ [name]: values }), options)).columns[0]!;
}

describe('detectGrain(file) decides day-first or month-first from evidence', () => {
  it('a day above 12 on row 1,401, past the 1,000-value head, settles the column as day-first', async () => {
    const values = lowDays(1400).map((d) => `${two(d.day)}/${two(d.month)}/${d.year}`);
    values.push('25/06/2021');
    const c = await column(values);
    expect(c.format).toBe('day-month-year');
    expect(c.ambiguity).toBeNull();
    expect(c.values).toEqual({ parsed: 1401, empty: 0, invalid: 0 });
    expect(c.formatEvidence).toContain('line 1402'); // header on line 1, so row 1,401 is on line 1,402
    expect(c.grain).toMatchObject({ unit: 'day' });
  });

  it('a second field above 12 settles the column as month-first', async () => {
    const values = lowDays(50).map((d) => `${two(d.month)}/${two(d.day)}/${d.year}`);
    values.push('06/25/2021');
    const c = await column(values);
    expect(c.format).toBe('month-day-year');
  });

  it('dates that never show a field above 12 stay ambiguous, and --day-first settles them', async () => {
    const values = lowDays(60).map((d) => `${two(d.day)}/${two(d.month)}/${d.year}`);
    const c = await column(values);
    expect(c.ambiguity).not.toBeNull();
    expect(c.ambiguity).toHaveLength(2);
    expect(c.findings.join(' ')).toContain('--day-first or --month-first');
    expect(c.findings.join(' ')).toContain('The grain is the same under either reading.');
    const settled = await column(values, { dayFirst: true });
    expect(settled.format).toBe('day-month-year');
    expect(settled.ambiguity).toBeNull();
  });

  it('--day-first with --month-first is misuse (E_USAGE)', async () => {
    await expect(detectGrain(writeColumns({ when: ['2024-01-01'] }), { dayFirst: true, monthFirst: true }))
      .rejects.toMatchObject({ code: 'E_USAGE' });
  });

  it('an unknown --zone is misuse (E_ZONE)', async () => {
    await expect(detectGrain(writeColumns({ when: ['2024-01-01'] }), { zone: 'Mars/Olympus' }))
      .rejects.toMatchObject({ code: 'E_ZONE' });
  });
});

describe('detectGrain(file) reads numbers that are times', () => {
  it('epoch seconds of UTC midnights are days in UTC', async () => {
    const d0 = Temporal.PlainDate.from('2024-01-01');
    const values = Array.from({ length: 100 }, (_, k) => String(d0.add({ days: k }).toZonedDateTime('UTC').epochMilliseconds / 1000));
    expect(values[0]).toBe('1704067200'); // POSIX seconds of 2024-01-01 (REFERENCES §4)
    const c = await column(values);
    expect(c.format).toBe('epoch-seconds');
    expect(c.grain).toMatchObject({ unit: 'day' });
    expect(c.zone).toBe('UTC');
  });

  it('spreadsheet serial days (1900 system) in a date-named column are days; serials ending .5 are noons', async () => {
    // ECMA-376 1900 date system: 2024-01-01 = 45292 (REFERENCES §3, computed with Temporal).
    const days = Array.from({ length: 60 }, (_, k) => String(45292 + k));
    const c = await column(days, {}, 'visit_date');
    expect(c.format).toBe('serial-1900');
    expect(c.grain).toMatchObject({ unit: 'day' });
    expect(c.first).toBe('45292');
    const noons = await column(days.map((d) => `${d}.5`), {}, 'visit_date');
    expect(noons.grain).toMatchObject({ unit: 'hour', step: 12 });
  });
});

describe('detectGrain(file) counts every value', () => {
  it('parsed + empty + invalid add up to the rows, with the first invalid values and their lines', async () => {
    const values = Array.from({ length: 30 }, (_, k) => Temporal.PlainDate.from('2024-01-01').add({ days: k }).toString());
    values[5] = '';
    values[7] = '2024-02-30'; // February 2024 has 29 days (Temporal.PlainDate.from('2024-02-01').daysInMonth)
    values[9] = '  ';
    const report = await detectGrain(writeColumns({ id: values.map((_, k) => String(k)), when: values }), { columns: ['when'] });
    const c = report.columns[0]!;
    expect(report.rows).toBe(30);
    expect(c.values).toEqual({ parsed: 27, empty: 2, invalid: 1 });
    expect(c.invalidExamples[0]).toMatchObject({ line: 9, value: '2024-02-30' });
  });
});
