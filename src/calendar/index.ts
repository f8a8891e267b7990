// Public surface of the calendar engine: the only home of calendar rules.
export type { UnitName, ZoneName, FiscalStart, CalendarOptions, Period, PeriodParts, Calendar } from './types.js';
