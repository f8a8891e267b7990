// Public surface of the calendar engine: the only home of calendar rules.
export type { UnitName, ZoneName, FiscalStart, CalendarOptions, Period, PeriodParts, Calendar } from './types.js';
export { makeCalendar } from './calendar.js';
export { UNIT_NAMES, FIXED_UNIT_MS, isUnitName, parseUnitName, parseStep, parseWeekStart, parseFiscalStart } from './units.js';
export { weekNumberOf, weekStartDay, weeksInWeekYear } from './date-scheme.js';
export { formatYear, formatDate, formatWallDateTime, EXAMPLE_LABELS } from './labels.js';
export {
  MS_PER_DAY, daysFromCivil, civilFromDays, yearOfDays, isoWeekday, isLeapYear, daysInMonth,
  weekStartOnOrBefore, isoWeekYearStart, epiWeekYearStart, isoWeeksInYear, epiWeeksInYear,
} from './civil.js';
export { lookupPeriod, isoWithOffset, describeLength } from './lookup.js';
export type { LookupOptions, PeriodLookup } from './lookup.js';
export { detectLabelNotation } from './detect-label.js';
export type { LabelNotation } from './detect-label.js';
