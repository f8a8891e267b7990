// `quern profile` through runCli on the demo files (invented data; column roles from the fixture brief:
// visit_id unique sequential integers, area_code zero-padded 5-digit codes, triage low/medium/high,
// weekly-cases an aggregated table).
import { describe, expect, it, vi } from 'vitest';
import { runCli } from '../helpers/cli.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

describe('quern profile', () => {
  it('--json keeps the shape the issue gives: rows, shape {kind, key}, columns {name, level, role, distinct, empty}', async () => {
    const r = await runCli(['profile', 'fixtures/visits.csv', '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.rows).toBe(13513);
    expect(out.shape).toMatchObject({ kind: 'items', key: ['visit_id'] });
    const byName = Object.fromEntries(out.columns.map((c: { name: string }) => [c.name, c]));
    for (const c of out.columns) expect(Object.keys(c)).toEqual(expect.arrayContaining(['name', 'level', 'role', 'distinct', 'empty']));
    expect(byName.visit_id).toMatchObject({ level: 'categorical', role: 'identifier' });
    expect(byName.visit_time).toMatchObject({ level: 'quantitative', role: 'time' });
    expect(byName.area_code).toMatchObject({ level: 'categorical', role: 'code' });
    expect(byName.triage).toMatchObject({ level: 'ordinal', role: 'ordered-vocabulary', order: ['low', 'medium', 'high'] });
    expect(byName.wait_minutes).toMatchObject({ level: 'quantitative', role: 'measure' });
    expect(byName.clinic).toMatchObject({ level: 'categorical', role: 'category', distinct: 5 });
  });

  it('weekly cases are an aggregated table keyed by epi_week × clinic', async () => {
    const r = await runCli(['profile', 'fixtures/weekly-cases.csv']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('Shape: aggregated, key epi_week × clinic');
    expect(r.stdout).toMatch(/cases\s+quantitative\s+count/);
  });

  it('age bands: range labels in their order', async () => {
    const out = JSON.parse((await runCli(['profile', 'fixtures/age-bands.csv', '--json'])).stdout);
    const label = out.columns.find((c: { name: string }) => c.name === 'label');
    expect(label).toMatchObject({ level: 'ordinal', role: 'range-label' });
    expect(label.order[0]).toBe('0-4');
    expect(label.order[label.order.length - 1]).toBe('85+');
  });

  it('a missing file exits 3 with one line and a hint', async () => {
    const r = await runCli(['profile', 'fixtures/no-such-file.csv']);
    expect(r.status).toBe(3);
    expect(r.stderr.split('\n')[0]).toMatch(/^quern: /);
  });

  it('--help shows examples on the demo files', async () => {
    const r = await runCli(['profile', '--help']);
    expect(r.stdout).toContain('quern profile fixtures/weekly-cases.csv');
    expect(r.stdout).toContain('Stevens (1946)');
  });
});
