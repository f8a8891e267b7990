// A far-future outlier must not stall quern: one value in year 9999 among recent ones, rebinned to
// hours in a zone with daylight saving. Runs the built program under a kill timer (a hang guard, not a
// benchmark: the run should take well under a second for two rows).
import { spawnSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { BIN, scratch } from './helpers.js';

const tmp = scratch('slow-zone');
afterAll(() => tmp.cleanup());

describe('quern rebin on a year-9999 value in a daylight-saving zone', () => {
  it('finishes a day rebin of it at once (the control)', () => {
    const f = tmp.file('far-day.csv', 't\n2024-03-01T10:00:00Z\n9999-12-31T12:00:00Z\n');
    const r = spawnSync(process.execPath, [BIN, 'rebin', f, '--time', 't', '--unit', 'day', '--zone', 'America/Chicago', '--no-fill', '-q'],
      { timeout: 10_000, encoding: 'utf8' });
    expect(r.signal).toBeNull();
    expect(r.stdout).toContain('9999-12-31,');
  });

  // Was a bug (~30 s): the sub-day key correction walked every zone-table block from 1970 to the value.
  // Far out the zone's annual rule now gives the correction per 400-year cycle. The expected label is
  // 12:00Z at UTC−6 (Chicago standard time in December, per the US rule, common practice).
  it('finishes an hour rebin of it within 5 seconds', () => {
    const f = tmp.file('far-hour.csv', 't\n2024-03-01T10:00:00Z\n9999-12-31T12:00:00Z\n');
    const r = spawnSync(process.execPath, [BIN, 'rebin', f, '--time', 't', '--unit', 'hour', '--zone', 'America/Chicago', '--no-fill', '-q'],
      { timeout: 5_000, encoding: 'utf8' });
    expect(r.signal).toBeNull();
    expect(r.stdout).toContain('9999-12-31T06:00-06:00');
  });
});
