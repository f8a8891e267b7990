// `quern period`: calendar look-ups. Options → LookupOptions → lookupPeriod() → PeriodLookup → text or JSON.
import { Command, Option } from 'commander';
import { QuernError, lookupPeriod, parseFiscalStart, parseUnitName, parseStep, parseWeekStart, renderPeriodText } from '../../src/index.js';
import type { LookupOptions } from '../../src/index.js';
import { useColor } from '../io.js';
import type { CommandContext } from '../program.js';

const EXAMPLES = `
VALUE is a date (2025-01-01), a date-time with or without an offset (2024-03-10T08:15, read as wall-clock
time in --zone; 2024-03-10T08:15-05:00), or a period label of any unit: 2024-03-10, 2024-03, 2024-Q1,
2024-H1, 2024, 2024-W07 (ISO week), 2024-EW07 (epidemiological week), FY2024, FY2024-Q1, FY2024-M01,
2024-03-10/P1W, 2024-03-10T08:15-05:00/PT15M. Without --unit, a label is looked up in its own unit.

Examples:
  Which epidemiological week is 2025-01-01?
    quern period 2025-01-01 --unit epi-week
  Which days does FY2024-Q1 cover (US federal year, starting 1 October)?
    quern period FY2024-Q1
  The UK tax year holding a date, named by the year it starts:
    quern period 2024-04-05 --unit fiscal-year --fiscal-start 04-06 --fiscal-label start --zone Europe/London
  How long was 3 November 2024 in New York?
    quern period 2024-11-03 --unit day --zone America/New_York
  The 15-minute slot of a local time, as JSON:
    quern period 2024-03-10T03:20 --unit minute --step 15 --zone America/New_York --json

Rules: periods are half-open, [start, end). A local time the clocks skip is moved forward by the gap; a
local time that happens twice is the earlier one; a day starts at its first instant (01:00 where midnight
is skipped). Steps count from 1970-01-01 local midnight (days, weeks, sub-day units) or January of year 0
(months), unless --origin names another start.

Caution: ISO weeks start on Monday and epidemiological (CDC MMWR) weeks on Sunday; other authorities
number weeks and name fiscal years differently. Confirm against your reporting authority's calendar.
`;

interface PeriodFlags {
  unit?: string;
  step?: string;
  zone?: string;
  weekStart?: string;
  fiscalStart?: string;
  fiscalLabel?: 'end' | 'start';
  origin?: string;
  json?: boolean;
}

export function registerPeriod(program: Command, ctx: CommandContext): void {
  program
    .command('period')
    .description('Look up the calendar period holding a date, a date-time or a label: bounds, length, numbered parts')
    .argument('<value>', 'a date, a date-time, or a period label such as 2024-EW07 or FY2024-Q1')
    .option('--unit <unit>', 'day, week, iso-week, epi-week, month, quarter, half, year, fiscal-year, fiscal-quarter, fiscal-month, hour, minute, second, millisecond')
    .option('--step <n>', 'periods of n units (15 with --unit minute)')
    .option('--zone <zone>', 'IANA zone or offset (default UTC)')
    .option('--week-start <day>', 'first day of --unit week (monday … sunday; default monday)')
    .option('--fiscal-start <month[-day]>', 'first day of the fiscal year: 10 (1 October, default), 04-06, 07-01')
    .addOption(new Option('--fiscal-label <end|start>', 'name fiscal years by the year they end (default) or start').choices(['end', 'start']))
    .option('--origin <time>', 'count steps from the period holding this date or date-time')
    .option('--json', 'print one JSON object')
    .addHelpText('after', EXAMPLES)
    .action((value: string, flags: PeriodFlags) => {
      const result = lookupPeriod(value, lookupOptions(flags));
      ctx.io.stdout.write(flags.json ? `${JSON.stringify(result, null, 2)}\n` : renderPeriodText(result, { color: useColor(ctx.io) }));
    });
}

function lookupOptions(f: PeriodFlags): LookupOptions {
  const o: LookupOptions = {};
  if (f.unit !== undefined) o.unit = parseUnitName(f.unit);
  if (f.step !== undefined) o.step = parseStep(f.step);
  if (f.zone !== undefined) o.zone = f.zone;
  if (f.weekStart !== undefined) {
    o.weekStart = parseWeekStart(f.weekStart);
    if (o.unit === 'iso-week' || o.unit === 'epi-week') {
      throw new QuernError('E_UNIT', `--week-start does not apply to ${o.unit}: ISO weeks start on Monday, epidemiological weeks on Sunday`, 'use --unit week with --week-start for weeks starting on another day');
    }
  }
  if (f.fiscalStart !== undefined) o.fiscalStart = parseFiscalStart(f.fiscalStart);
  if (f.fiscalLabel !== undefined) o.fiscalLabel = f.fiscalLabel;
  if (f.origin !== undefined) o.origin = lookupPeriod(f.origin, { unit: 'millisecond', zone: o.zone ?? 'UTC' }).startMs;
  return o;
}
