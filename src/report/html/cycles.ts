// The evidence of a date column's grain: how its values fall over the cycles of the calendar (minute of
// the hour, hour of the day, day of the month, month of the year, weekday). A column of days has every
// value at 00:00; a column of quarters has every value on day 1 of January, April, July and October.
import { civilFromDays, daysInMonth, isoWeekday, MS_PER_DAY } from '../../calendar/civil.js';
import { formatNumber } from '../terminal.js';
import { columnChart } from './columns.js';
import { html, type SafeHtml } from './escape.js';
import { dataTable, figure, tiles } from './table.js';

/** Rows by position in each calendar cycle, read on the wall clock of the column's zone. */
export interface CycleCounts {
  /** 60 counts: minute 0 … 59 of the hour. */
  minuteOfHour: number[];
  /** 24 counts: hour 0 … 23. */
  hourOfDay: number[];
  /** 31 counts: day 1 … 31 (index 0 is day 1). */
  dayOfMonth: number[];
  /** 12 counts: January … December. */
  monthOfYear: number[];
  /** 7 counts: ISO weekday Monday … Sunday. */
  weekday: number[];
  /** Rows on the last day of their month (a column of month ends shows here, not on day 1). */
  lastDayOfMonth: number;
  /** Rows with a time of day other than 00:00:00.000. */
  offMidnight: number;
  /** Rows counted. */
  rows: number;
}

/** Empty counts. */
export function emptyCycles(): CycleCounts {
  return {
    minuteOfHour: Array(60).fill(0), hourOfDay: Array(24).fill(0), dayOfMonth: Array(31).fill(0),
    monthOfYear: Array(12).fill(0), weekday: Array(7).fill(0), lastDayOfMonth: 0, offMidnight: 0, rows: 0,
  };
}

const ymd = [0, 0, 0];

/** Adds `weight` rows at wall-clock milliseconds `wallMs` (the epoch ms the same reading has in UTC). */
export function addToCycles(c: CycleCounts, wallMs: number, weight = 1): void {
  const days = Math.floor(wallMs / MS_PER_DAY);
  const tod = wallMs - days * MS_PER_DAY;
  civilFromDays(days, ymd);
  c.minuteOfHour[Math.floor(tod / 60_000) % 60] += weight;
  c.hourOfDay[Math.floor(tod / 3_600_000)] += weight;
  c.dayOfMonth[ymd[2] - 1] += weight;
  c.monthOfYear[ymd[1] - 1] += weight;
  c.weekday[isoWeekday(days) - 1] += weight;
  if (ymd[2] === daysInMonth(ymd[0], ymd[1])) c.lastDayOfMonth += weight;
  if (tod !== 0) c.offMidnight += weight;
  c.rows += weight;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];

interface Cycle {
  key: keyof Pick<CycleCounts, 'minuteOfHour' | 'hourOfDay' | 'dayOfMonth' | 'monthOfYear' | 'weekday'>;
  title: string;
  position: string;
  labels: string[];
}

const CYCLES: Cycle[] = [
  { key: 'hourOfDay', title: 'Time of day', position: 'hour', labels: Array.from({ length: 24 }, (_, i) => String(i).padStart(2, '0')) },
  { key: 'minuteOfHour', title: 'Minute of the hour', position: 'minute', labels: Array.from({ length: 60 }, (_, i) => `:${String(i).padStart(2, '0')}`) },
  { key: 'dayOfMonth', title: 'Day of the month', position: 'day', labels: Array.from({ length: 31 }, (_, i) => String(i + 1)) },
  { key: 'monthOfYear', title: 'Month of the year', position: 'month', labels: MONTHS },
  { key: 'weekday', title: 'Weekday', position: 'weekday', labels: WEEKDAYS },
];

/** One sentence: where the values concentrate, e.g. "all 460 rows at hour 00" or "spread over 24 hours". */
export function cycleSentence(counts: readonly number[], labels: readonly string[], position: string): string {
  const total = counts.reduce((a, b) => a + b, 0);
  if (total === 0) return 'no rows';
  const used = counts.map((n, i) => [n, i] as const).filter(([n]) => n > 0);
  if (used.length === 1) return `all ${formatNumber(total)} rows at ${position} ${labels[used[0][1]]}`;
  if (used.length <= 4) return `every row at ${position} ${used.map(([, i]) => labels[i]).join(', ')}`;
  const top = used.reduce((a, b) => (b[0] > a[0] ? b : a));
  return `rows spread over ${used.length} of ${counts.length} ${position}s; most at ${labels[top[1]]} (${formatNumber(top[0])})`;
}

/** Tiles for each cycle (the minute chart only when the values are not all on the hour). */
export function cycleFigures(id: string, column: string, c: CycleCounts): SafeHtml {
  const onTheHour = c.minuteOfHour[0] === c.rows;
  const midnight = c.offMidnight === 0;
  const figures = CYCLES.filter((cy) => !(cy.key === 'minuteOfHour' && (onTheHour || midnight))).map((cy) => {
    const counts = c[cy.key];
    const sentence = cycleSentence(counts, cy.labels, cy.position);
    const chart = columnChart({
      id: `${id}-${cy.key}`,
      title: `${column}: ${cy.title.toLowerCase()}`,
      summary: `${cy.title} of ${column}: ${sentence}.`,
      valueLabel: 'rows',
      data: counts.map((n, i) => ({ label: cy.labels[i], value: n })),
      width: 420,
      height: 150,
    });
    const table = dataTable({
      caption: `${cy.title}: rows`,
      columns: [{ label: cy.position }, { label: 'rows', numeric: true }],
      rows: counts.map((n, i) => [cy.labels[i], n]),
    });
    return figure(html`<b>${cy.title}.</b> ${sentence}.`, chart, table, 'stacked');
  });
  return tiles(figures);
}
