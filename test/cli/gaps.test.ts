// `quern gaps` through runCli on the demo files: the fridge log's outage and duplicate, --check, --json.
// The outage is located here from the fixture's own rows (sorted readings and their spacing).
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';

const tmp = mkdtempSync(join(tmpdir(), 'quern-cli-gaps-'));
const fridge = readFileSync(new URL('../../fixtures/fridge-temps.csv', import.meta.url), 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));

/** The fixture's gaps longer than 15 minutes per fridge, found by sorting its instants (independent of quern). */
function fixtureGaps(): Map<string, { after: number; before: number }[]> {
  const by = new Map<string, number[]>();
  for (const [id, t] of fridge) by.set(id!, [...(by.get(id!) ?? []), Date.parse(t!)]);
  const out = new Map<string, { after: number; before: number }[]>();
  for (const [id, ts] of by) {
    const s = [...new Set(ts)].sort((a, b) => a - b);
    out.set(id, s.slice(1).flatMap((t, i) => (t - s[i]! > 900_000 ? [{ after: s[i]!, before: t }] : [])));
  }
  return out;
}

describe('quern gaps (demo fridge log)', () => {
  it('shows the outage of the one fridge and the duplicated reading, using the detected 15-minute grain', async () => {
    const r = await runCli(['gaps', 'fixtures/fridge-temps.csv', '--time', 'reading_time', '--by', 'fridge_id']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('detected grain: 15-minute');
    const [[id, [gap]]] = [...fixtureGaps()].filter(([, g]) => g.length > 0) as [string, { after: number; before: number }[]][];
    const slots = (gap!.before - gap!.after) / 900_000 - 1;
    expect(r.stdout).toContain(`${id}:`);
    expect(r.stdout).toContain(`missing ${new Date(gap!.after + 900_000).toISOString().slice(0, 16)}`);
    expect(r.stdout).toContain(`${slots} periods of 15 minutes`);
    expect(r.stdout).toMatch(/duplicated .*: 2 rows/);
    expect(r.stdout).toContain('·'); // the strip shows missing periods
    expect(r.stdout).toContain('result: gaps in 1 of 2 series, duplicates in 1 of 2 series');
  });

  it('--check exits 1 when gaps or duplicates are found, 0 when none are', async () => {
    const bad = await runCli(['gaps', 'fixtures/fridge-temps.csv', '--time', 'reading_time', '--by', 'fridge_id', '--unit', 'minute', '--step', '15', '--check']);
    expect(bad.status).toBe(1);
    const f = join(tmp, 'complete.csv');
    writeFileSync(f, 'day\n2024-03-01\n2024-03-02\n2024-03-03\n');
    const good = await runCli(['gaps', f, '--time', 'day', '--unit', 'day', '--check']);
    expect(good.status).toBe(0);
    expect(good.stdout).toContain('result: no gaps, no duplicates');
  });

  it('--json gives the shape of the issue: unit, series with key, first, last, expected, present, missing, duplicates, coverage', async () => {
    const r = await runCli(['gaps', 'fixtures/fridge-temps.csv', '--time', 'reading_time', '--by', 'fridge_id', '--unit', 'minute', '--step', '15', '--json']);
    const doc = JSON.parse(r.stdout);
    expect(doc.unit).toBe('minute');
    expect(doc.series).toHaveLength(2);
    for (const s of doc.series) {
      for (const k of ['key', 'first', 'last', 'expected', 'present', 'missing', 'duplicates', 'coverage']) expect(s).toHaveProperty(k);
      for (const m of s.missing) expect(Object.keys(m)).toEqual(expect.arrayContaining(['from', 'to', 'periods']));
      for (const d of s.duplicates) expect(Object.keys(d)).toEqual(expect.arrayContaining(['period', 'count']));
      expect(s.present + s.missing.reduce((a: number, m: { periods: number }) => a + m.periods, 0)).toBe(s.expected);
    }
    expect(doc.summary.rowsRead).toBe(fridge.length);
  });

  it('--max-gap PT1H lists the gap between the readings on either side of the outage', async () => {
    const r = await runCli(['gaps', 'fixtures/fridge-temps.csv', '--time', 'reading_time', '--by', 'fridge_id', '--max-gap', 'PT1H', '--json']);
    const doc = JSON.parse(r.stdout);
    const expected = [...fixtureGaps()].flatMap(([, g]) => g.filter((x) => x.before - x.after > 3600_000));
    const got = doc.series.flatMap((s: { gaps: { from: string; to: string }[] }) => s.gaps).map((g: { from: string; to: string }) => ({ after: Date.parse(g.from), before: Date.parse(g.to) }));
    expect(got).toEqual(expected);
  });
});

describe('quern gaps (other cases)', () => {
  it('takes epidemiological weeks from the weekly table labels and finds the missing weeks per clinic', async () => {
    const r = await runCli(['gaps', 'fixtures/weekly-cases.csv', '--time', 'epi_week', '--by', 'clinic', '--json']);
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.unit).toBe('epi-week');
    const rows = readFileSync(new URL('../../fixtures/weekly-cases.csv', import.meta.url), 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));
    for (const s of doc.series) expect(s.present).toBe(new Set(rows.filter((x) => x[2] === s.key).map((x) => x[0])).size);
  });

  it('--weekdays with --skip-dates FILE expects neither weekends nor the listed holidays', async () => {
    const data = join(tmp, 'office.csv');
    // 2024-12-23 (Mon) … 2025-01-03 (Fri): weekdays except 2024-12-25 and 2025-01-01 (US federal holidays, 5 U.S.C. §6103).
    writeFileSync(data, 'day\n2024-12-23\n2024-12-24\n2024-12-26\n2024-12-27\n2024-12-30\n2024-12-31\n2025-01-02\n2025-01-03\n');
    const holidays = join(tmp, 'holidays.txt');
    writeFileSync(holidays, '2024-12-25\n2025-01-01\n');
    const r = await runCli(['gaps', data, '--time', 'day', '--unit', 'day', '--weekdays', '--skip-dates', holidays, '--check']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('8 of 8 expected periods present');
    const without = await runCli(['gaps', data, '--time', 'day', '--unit', 'day', '--weekdays', '--check']);
    expect(without.status).toBe(1);
    expect(without.stdout).toContain('missing 2024-12-25, 1 day');
  });

  it('asks for --unit or --max-gap when the detected grain has no regular cadence (exit 2)', async () => {
    const r = await runCli(['gaps', 'fixtures/visits.csv', '--time', 'visit_time']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('--max-gap');
  });

  it('--help shows the demo examples', async () => {
    const r = await runCli(['gaps', '--help']);
    expect(r.stdout).toContain('quern gaps fixtures/fridge-temps.csv --time reading_time --by fridge_id');
    expect(r.stdout).toContain('Caution');
  });
});

describe('quern gaps --no-duplicates (event logs)', () => {
  it('reports only missing days of the visits log, where many visits a day are normal', async () => {
    const r = await runCli(['gaps', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'day', '--zone', 'America/Chicago', '--by', 'clinic', '--weekdays', '--no-duplicates', '--json']);
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.duplicatesReported).toBe(false);
    for (const s of doc.series) expect(s.duplicates).toEqual([]);
    const withDups = await runCli(['gaps', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'day', '--zone', 'America/Chicago']);
    expect(withDups.stdout).toContain('pass --no-duplicates');
  });
});
