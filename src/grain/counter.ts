// Counts, for every candidate grain, how many values (rows and distinct values) lie on its boundaries,
// keeping the first few values that do not. Fed with wall-clock milliseconds of one reading of the column.
import { civilFromDays, daysInMonth, isoWeekday } from '../calendar/civil.js';
import { CANDIDATES, DAY, type ValueParts } from './candidates.js';
import type { ValueExample } from './types.js';

/** How many non-matching examples each candidate keeps. */
export const MAX_EXAMPLES = 5;

export class BoundaryCounter {
  /** Rows and distinct values fed in. */
  rows = 0;
  distinct = 0;
  readonly rowsOn: Float64Array;
  readonly distinctOn: Float64Array;
  /** Per candidate, the first values not on it, in the order fed. */
  readonly misses: ValueExample[][];
  private readonly parts: ValueParts = { tod: 0, days: 0, year: 0, month: 0, day: 0, weekday: 0, daysInMonth: 0 };
  private readonly ymd = [0, 0, 0];

  constructor() {
    this.rowsOn = new Float64Array(CANDIDATES.length);
    this.distinctOn = new Float64Array(CANDIDATES.length);
    this.misses = CANDIDATES.map(() => []);
  }

  /**
   * Adds one wall-clock value standing for `weight` rows (`distinct` true when it is a new distinct value).
   * `line` and `text` describe its first row, for examples.
   */
  add(wallMs: number, weight: number, distinct: boolean, line: number, text: string): void {
    const p = this.parts;
    const days = Math.floor(wallMs / DAY);
    p.days = days;
    p.tod = wallMs - days * DAY;
    const wholeDay = p.tod === 0 || p.tod === DAY - 1 || p.tod === DAY - 1000;
    if (wholeDay) {
      // Civil fields are read only by the whole-day candidates.
      civilFromDays(days, this.ymd);
      p.year = this.ymd[0]!;
      p.month = this.ymd[1]!;
      p.day = this.ymd[2]!;
      p.weekday = isoWeekday(days);
      p.daysInMonth = daysInMonth(p.year, p.month);
    }
    this.rows += weight;
    if (distinct) this.distinct++;
    for (let c = 0; c < CANDIDATES.length; c++) {
      const cand = CANDIDATES[c]!;
      const on = cand.ms > 0 ? (p.tod + cand.gap) % cand.ms === 0 : wholeDay && cand.test(p);
      if (on) {
        this.rowsOn[c] += weight;
        if (distinct) this.distinctOn[c] += 1;
      } else {
        const list = this.misses[c]!;
        if (list.length < MAX_EXAMPLES) list.push({ line, value: text });
      }
    }
  }
}
