// detectGrain zone inference on generated local midnights and hour starts. Each value is a start of day or
// hour computed with the Temporal polyfill (PlainDate.toZonedDateTime gives the first instant of the day,
// also where midnight is skipped), then written in UTC or with its own offset.
import { describe, expect, it, vi } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { detectGrain } from '../../src/grain/index.js';
import { writeColumns } from './helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

/** Starts of `n` consecutive days from `start` in `zone`, as UTC instants (Temporal start of day). */
function dayStartsUtc(zone: string, start: string, n: number): string[] {
  const d0 = Temporal.PlainDate.from(start);
  return Array.from({ length: n }, (_, k) => d0.add({ days: k }).toZonedDateTime(zone).toInstant().toString());
}

/** Starts of days in `zone` written with their own offset (ZonedDateTime.toString without the zone name). */
function dayStartsWithOffset(zone: string, start: string, n: number): string[] {
  const d0 = Temporal.PlainDate.from(start);
  return Array.from({ length: n }, (_, k) => d0.add({ days: k }).toZonedDateTime(zone).toString({ timeZoneName: 'never' }));
}

async function column(values: string[], options = {}) {
  const report = await detectGrain(writeColumns({ when: values }), options);
  return report.columns[0]!;
}

describe('detectGrain(file) infers the zone of UTC-written local midnights', () => {
  it('America/New_York midnights (05:00Z in winter, 04:00Z in summer) are days in America/New_York', async () => {
    // Offsets −05:00/−04:00: US rule "Mar Sun>=8 2:00 … Nov Sun>=1 2:00" (REFERENCES §5), via Temporal.
    const c = await column(dayStartsUtc('America/New_York', '2023-01-01', 730));
    expect(c.grain).toMatchObject({ unit: 'day', anchor: 'start' });
    expect(c.zone).toBe('America/New_York');
    expect(c.zoneFinding).toMatchObject({ basis: 'aligned', offsets: [-300, -240] });
    expect(c.zoneFinding.alternatives).toContain('America/Detroit'); // same rules over 2023–2024 (tz "US" rules)
    expect(c.coverage).toMatchObject({ exceptions: 0, share: 1 });
    expect(c.findings.join(' ')).toContain('local midnight in America/New_York (UTC\u221205:00 in winter, UTC\u221204:00 in summer)');
  });

  it('Australia/Sydney midnights (southern hemisphere: summer time in January) are days in Australia/Sydney', async () => {
    // Sydney: +11:00 AEDT until 2024-04-07, +10:00 until 2024-10-06 (REFERENCES §5, Temporal hoursInDay).
    const c = await column(dayStartsUtc('Australia/Sydney', '2024-01-01', 366));
    expect(c.grain).toMatchObject({ unit: 'day' });
    expect(c.zone).toBe('Australia/Sydney');
    expect(c.zoneFinding.offsets).toEqual([600, 660]);
    expect(c.findings.join(' ')).toContain('UTC+10:00 in winter, UTC+11:00 in summer');
  });

  it('Asia/Kolkata midnights (18:30Z) are days at the fixed offset +05:30', async () => {
    // Asia/Kolkata is +05:30 all year (REFERENCES §5, "Other odd offsets").
    const c = await column(dayStartsUtc('Asia/Kolkata', '2024-01-01', 200));
    expect(c.grain).toMatchObject({ unit: 'day' });
    expect(c.zone).toBe('+05:30');
    expect(c.zoneFinding.alternatives).toContain('Asia/Kolkata');
  });

  it('Asia/Kathmandu midnights (18:15Z) are days at +05:45', async () => {
    // Asia/Kathmandu +05:45 since 1986 (REFERENCES §5).
    const c = await column(dayStartsUtc('Asia/Kathmandu', '2024-01-01', 200));
    expect(c.zone).toBe('+05:45');
    expect(c.zoneFinding.alternatives).toContain('Asia/Kathmandu');
    expect(c.grain).toMatchObject({ unit: 'day' });
  });

  it('America/Sao_Paulo 2018: the day of 2018-11-04 starts at 01:00 (midnight skipped) and still counts as a day start', async () => {
    // Brazil 2018 "Nov Sun>=1 0:00": 2018-11-04 starts at 01:00 −02:00 (REFERENCES §5; Temporal startOfDay).
    const start = Temporal.PlainDate.from('2018-11-04').toZonedDateTime('America/Sao_Paulo');
    expect(start.hour).toBe(1);
    const c = await column(dayStartsUtc('America/Sao_Paulo', '2018-06-01', 300));
    expect(c.zone).toBe('America/Sao_Paulo');
    expect(c.grain).toMatchObject({ unit: 'day' });
    expect(c.coverage!.exceptions).toBe(0);
  });

  it('Asia/Kolkata hour starts written in UTC (hh:30Z) are hours at +05:30', async () => {
    const t0 = Temporal.ZonedDateTime.from('2024-03-01T00:00[Asia/Kolkata]');
    const values = Array.from({ length: 300 }, (_, k) => t0.add({ hours: k * 7 + ((k * k) % 5) }).toInstant().toString());
    const c = await column(values);
    // Hour starts cannot tell one half-hour offset from another: the others are listed as equal matches
    // (Australia/Darwin +09:30 and America/St_Johns −03:30/−02:30, REFERENCES §5 "Other odd offsets").
    expect(c.zone).toBe('+05:30');
    expect(c.zoneFinding.alternatives).toEqual(expect.arrayContaining(['Asia/Kolkata', 'Australia/Darwin', 'America/St_Johns']));
    expect(c.grain).toMatchObject({ unit: 'hour', step: 1 });
  });
});

describe('detectGrain(file) reads written offsets', () => {
  it('America/Chicago midnights written with their own offsets (−06:00/−05:00) are days in America/Chicago', async () => {
    const c = await column(dayStartsWithOffset('America/Chicago', '2023-06-01', 400));
    expect(c.grain).toMatchObject({ unit: 'day' });
    expect(c.zone).toBe('America/Chicago');
    expect(c.zoneFinding.basis).toBe('offsets');
  });

  it('--zone places UTC instants in the named zone and says so', async () => {
    const c = await column(dayStartsUtc('Europe/London', '2024-01-01', 200), { zone: 'Europe/London' });
    expect(c.zoneFinding.basis).toBe('given');
    expect(c.zone).toBe('Europe/London');
    expect(c.grain).toMatchObject({ unit: 'day' });
  });

  it('UTC instants at random times stay instants in UTC: no zone puts them on local boundaries', async () => {
    const t0 = Temporal.Instant.from('2024-01-01T00:00:00Z').epochMilliseconds;
    const values = Array.from({ length: 300 }, (_, k) => Temporal.Instant.fromEpochMilliseconds(t0 + k * 7_777_000).toString());
    const c = await column(values);
    expect(c.zone).toBe('UTC');
    expect(c.zoneFinding.basis).toBe('written');
    expect(c.level).toBe('quantitative');
  });
});

describe('detectGrain(file) claims no zone from too few values', () => {
  // Tolerance rule 2 (src/grain/tolerance.ts): a grain coarser than the notation needs at least 5 distinct
  // values. Two values at 10:00Z are local midnights in −10:00, but two cannot show days there, so they
  // cannot show the zone either: the written offset (UTC) stands.
  it('two values at 10:00Z, a day apart: read as written in UTC, no zone from the alignment', async () => {
    const c = await column(['2024-01-01T10:00:00Z', '2024-01-02T10:00:00Z']);
    expect(c.zone).toBe('UTC');
    expect(c.zoneFinding.basis).toBe('written');
    expect(c.findings.join(' ')).not.toContain('-10:00');
  });

  it('the same hour over a fortnight is enough: the zone is found by alignment', async () => {
    // 14 distinct local midnights of −10:00 (Pacific/Honolulu keeps −10:00 all year; IANA tzdb, from memory).
    const values = Array.from({ length: 14 }, (_, k) => new Date(Date.UTC(2024, 0, 1 + k, 10)).toISOString().replace('.000', ''));
    const c = await column(values);
    expect(c.zoneFinding.basis).toBe('aligned');
    expect(c.grain).toMatchObject({ unit: 'day' });
  });
});

