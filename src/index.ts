// The public API of quern, named explicitly (no `export *`). Each concept keeps its own section.

// --- errors ---
export { QuernError, isQuernError, shortValue, formatDiagnostic } from './errors.js';
export type { ErrorCode, Diagnostic } from './errors.js';

// --- calendar ---
export type { UnitName, ZoneName, FiscalStart, CalendarOptions, Period, PeriodParts, Calendar } from './calendar/index.js';

// --- time ---
export type { TimeKind, LocalTimeRule, ParsedTime } from './time/types.js';
export { emptyParsedTime } from './time/types.js';

// --- table ---
export type { TableFormat, TableOptions, ColumnBatch, ReadSummary, TableReader } from './table/types.js';

// --- grain ---

// --- profile ---

// --- ranges ---

// --- bins ---

// --- rebin ---

// --- gaps ---

// --- report ---

// --- sql ---
