// `quern rebin --threads N`: the option is documented, checked, and gives the output of one thread.
// The demo file is under the 32 MB a parallel read needs, so this checks the CLI wiring; the parallel
// read itself is held to one whole read in test/rebin/parallel.test.ts (forced small ranges).
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';

describe('quern rebin --threads', () => {
  it('--help names --threads and its default', async () => {
    const r = await runCli(['rebin', '--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/--threads <n>/);
    expect(r.stdout).toMatch(/\(default\s+1;/);
  });

  it.each(['0', '-2', 'two', '1.5'])('--threads %s is a usage error (exit 2, common practice)', async (n) => {
    const r = await runCli(['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'month', '--threads', n]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--threads/);
  });

  it('--threads 1 and --threads 3 print the same rows and summary', async () => {
    const args = ['rebin', 'fixtures/visits.csv', '--time', 'visit_time', '--unit', 'epi-week', '--zone', 'America/Chicago', '--by', 'clinic', '--agg', 'count', '--agg', 'mean:wait_minutes'];
    const one = await runCli([...args, '--threads', '1']);
    const three = await runCli([...args, '--threads', '3']);
    expect(one.status).toBe(0);
    expect(three.stdout).toBe(one.stdout);
    expect(three.stderr).toBe(one.stderr);
    expect(one.stdout.split('\n').length).toBeGreaterThan(300); // 65 weeks × 5 clinics
  });
});
