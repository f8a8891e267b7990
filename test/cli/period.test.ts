// `quern period` in-process through run(): exit codes, human output, JSON and one-line errors.
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';

async function json(argv: string[]) {
  const r = await runCli([...argv, '--json']);
  expect(r.status).toBe(0);
  expect(r.stderr).toBe('');
  return JSON.parse(r.stdout) as Record<string, unknown>;
}

describe('quern period', () => {
  it('answers "which epidemiological week is 2025-01-01?" (REFERENCES.md §2: 2025 week 1 = 2024-12-29..2025-01-04)', async () => {
    const r = await runCli(['period', '2025-01-01', '--unit', 'epi-week']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('2025-EW01  epidemiological week 1 of 2025, Sunday to Saturday');
    expect(r.stdout).toContain('start   2024-12-29T00:00:00+00:00  (Sunday 2024-12-29)');
    expect(r.stdout).toContain('end     2025-01-05T00:00:00+00:00  (exclusive; last day Saturday 2025-01-04)');
    expect(r.stdout).toContain('length  7 days');
    expect(r.stdout).toMatch(/Caution: week and fiscal-year conventions differ/);
  });

  it('answers "which days does FY2024-Q1 cover?" (31 U.S.C. §1102: FY2024 starts 2023-10-01)', async () => {
    const j = await json(['period', 'FY2024-Q1', '--zone', 'America/Chicago']);
    expect(j).toMatchObject({
      label: 'FY2024-Q1', unit: 'fiscal-quarter', start: '2023-10-01T00:00:00-05:00', end: '2024-01-01T00:00:00-06:00',
      firstDate: '2023-10-01', lastDate: '2023-12-31', dates: 92, parts: { year: 2024, quarter: 1 },
      fiscalStart: { month: 10, day: 1 }, fiscalLabel: 'end',
    });
  });

  it('prints the numbered parts of an ISO week in JSON (REFERENCES.md §1: 2021-01-03 is 2020-W53-7)', async () => {
    const j = await json(['period', '2021-01-03', '--unit', 'iso-week']);
    expect(j).toMatchObject({ label: '2020-W53', parts: { year: 2020, week: 53 }, start: '2020-12-28T00:00:00+00:00', end: '2021-01-04T00:00:00+00:00', weekStart: 1 });
  });

  it('shows a 23-hour day in New York on 2024-03-10 (REFERENCES.md §5, US Mar rule)', async () => {
    const r = await runCli(['period', '2024-03-10', '--unit', 'day', '--zone', 'America/New_York']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('length  23 hours');
    expect(r.stdout).toContain('start   2024-03-10T00:00:00-05:00');
    expect(r.stdout).toContain('end     2024-03-11T00:00:00-04:00');
  });

  it('starts Havana 2024-11-03 at the earlier midnight: 25 hours (REFERENCES.md §5, §13.3)', async () => {
    const j = await json(['period', '2024-11-03', '--zone', 'America/Havana']);
    expect(j).toMatchObject({ start: '2024-11-03T00:00:00-04:00', end: '2024-11-04T00:00:00-05:00', length: '25 hours' });
  });

  it('reads a local date-time in the zone and says when the clocks skipped it', async () => {
    const j = await json(['period', '2024-03-10T02:30', '--unit', 'minute', '--step', '15', '--zone', 'America/New_York']);
    expect(j.label).toBe('2024-03-10T03:30-04:00/PT15M'); // moved forward by the 1-hour gap (Temporal 'compatible')
    expect(j.readAs).toBe('local');
    expect(j.notes).toEqual(['2024-03-10T02:30 does not exist in America/New_York (the clocks skipped it); read as 2024-03-10T03:30:00-04:00']);
  });

  it('reads a date-time with an offset as that instant', async () => {
    const j = await json(['period', '2024-11-03T01:30-05:00', '--unit', 'hour', '--zone', 'America/New_York']);
    expect(j).toMatchObject({ readAs: 'instant', label: '2024-11-03T01:00-05:00', start: '2024-11-03T01:00:00-05:00', end: '2024-11-03T02:00:00-05:00' });
  });

  it('names the UK tax year by its start year with --fiscal-label start (Income Tax Act 2007 s.4)', async () => {
    const j = await json(['period', '2024-04-06', '--unit', 'fiscal-year', '--fiscal-start', '04-06', '--fiscal-label', 'start', '--zone', 'Europe/London']);
    expect(j).toMatchObject({ label: 'FY2024', start: '2024-04-06T00:00:00+01:00', end: '2025-04-06T00:00:00+01:00', lastDate: '2025-04-05' });
  });

  it('takes weeks of any start day and labels them start/P1W', async () => {
    const j = await json(['period', '2024-03-13', '--unit', 'week', '--week-start', 'sunday']);
    expect(j).toMatchObject({ label: '2024-03-10/P1W', weekStart: 7 });
  });

  it('says a skipped date is an empty period (Pacific/Apia 2011-12-30, REFERENCES.md §5)', async () => {
    const r = await runCli(['period', '2011-12-30', '--zone', 'Pacific/Apia']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('never happened in Pacific/Apia');
    expect(r.stdout).toContain('the period is empty');
  });

  it('has --help with real examples and the caution', async () => {
    const r = await runCli(['period', '--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('quern period 2025-01-01 --unit epi-week');
    expect(r.stdout).toContain('quern period FY2024-Q1');
    expect(r.stdout).toMatch(/Caution: ISO weeks start on Monday/);
  });

  it.each<[string[], number, RegExp]>([
    [['period', '2024-03-10', '--unit', 'fortnight'], 2, /^quern: unknown unit "fortnight"\nhint: use one of: millisecond/],
    [['period', '2024-03-10', '--zone', 'Mars/Olympus'], 2, /^quern: unknown time zone "Mars\/Olympus"\nhint: /],
    [['period', '2021-W53'], 2, /^quern: bad iso-week label "2021-W53": 2021 has 52 ISO weeks\nhint: write it like 2024-W07\n$/],
    [['period', '2024-EW54', '--unit', 'epi-week'], 2, /^quern: bad epi-week label "2024-EW54": 2024 has 52 epidemiological weeks\n/],
    [['period', 'next tuesday'], 2, /^quern: "next tuesday" is not a time value quern can read: .*\nhint: /],
    [['period', '2024-03-10T08:15'], 2, /^quern: name the unit to look up "2024-03-10T08:15" in\nhint: add --unit/],
    [['period', '2024-03-10', '--unit', 'minute', '--step', '0'], 2, /^quern: bad step "0"/],
    [['period', '2024-03-10', '--unit', 'week', '--week-start', 'funday'], 2, /^quern: unknown week start "funday"\n/],
    [['period', '2024-03-10', '--unit', 'fiscal-year', '--fiscal-start', '13'], 2, /^quern: bad fiscal-year start "13"\n/],
    [['period', '2024-03-10', '--unit', 'epi-week', '--week-start', 'monday'], 2, /^quern: --week-start does not apply to epi-week/],
    [['period', '2024-02-30'], 2, /^quern: bad day label "2024-02-30": 2024-02 has no day 30\n/],
  ])('%j exits %d with a one-line error', async (argv, status, stderr) => {
    const r = await runCli(argv);
    expect(r.status).toBe(status);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(stderr);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
  });
});
