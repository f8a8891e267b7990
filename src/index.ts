// The public API of quern, named explicitly (no `export *`). Each concept keeps its own section.

// --- errors ---
export { QuernError, isQuernError, shortValue, formatDiagnostic } from './errors.js';
export type { ErrorCode, Diagnostic } from './errors.js';

// --- calendar ---
export type { UnitName, ZoneName, FiscalStart, CalendarOptions, Period, PeriodParts, Calendar } from './calendar/index.js';
export {
  makeCalendar, UNIT_NAMES, FIXED_UNIT_MS, isUnitName, parseUnitName, parseStep, parseWeekStart, parseFiscalStart,
  weekNumberOf, weekStartDay, weeksInWeekYear, formatYear, formatDate, formatWallDateTime, EXAMPLE_LABELS,
  MS_PER_DAY, daysFromCivil, civilFromDays, yearOfDays, isoWeekday, isLeapYear, daysInMonth,
  weekStartOnOrBefore, isoWeekYearStart, epiWeekYearStart, isoWeeksInYear, epiWeeksInYear,
} from './calendar/index.js';
export { lookupPeriod, isoWithOffset, describeLength } from './calendar/index.js';
export type { LookupOptions, PeriodLookup } from './calendar/index.js';
export { renderPeriodText, describePeriod } from './report/period.js';
export { getZone, parseFixedOffset, formatOffset } from './time/zone.js';
export type { Zone, ZoneTransition } from './time/zone.js';

// --- time ---
export type { TimeKind, LocalTimeRule, ParsedTime } from './time/types.js';
export { emptyParsedTime } from './time/types.js';
export type { TimeFormatId, TimeFormat, EpochUnit, InferHints, InferResult, InferScope, InferStatus, Candidate } from './time/index.js';
export type { TimeParser, TimeParserOptions, IsoDuration } from './time/index.js';
export { TIME_FORMAT_IDS, isTimeFormatId, timeFormat, inferTimeFormat, makeTimeParser } from './time/index.js';
export { parseIsoDuration, addDurationToWall, parseTimeText, epochUnitOfDigits, serialFractionMs } from './time/index.js';

// --- table ---
export type {
  TableFormat,
  TableEngine,
  TableOptions,
  ColumnBatch,
  ByteBatch,
  ReadSummary,
  TableReader,
  RejectReason,
} from './table/index.js';
export type { CsvWriteOptions, OutputTarget, OutputOptions, StdoutLike } from './table/index.js';
export { openTable, byteFieldString, parseDelimiter, nearestName } from './table/index.js';
export { csvCell, csvRow, ndjsonLine, isFormulaLike, openOutput, abortOpenOutputs, abortOpenOutputsSync } from './table/index.js';

// --- grain ---
export { detectGrain, checkGrainOptions, MIN_SHARE, MIN_DISTINCT, grainWords } from './grain/index.js';
export type {
  GrainOptions, Anchor, Grain, ValueExample, ValueCounts, Coverage, ZoneBasis, ZoneFinding, CadenceKind, Cadence, Level,
  ColumnGrain, GrainReport,
} from './grain/index.js';
export { renderGrainText } from './report/grain.js';
export type { TextOptions } from './report/grain.js';

// --- profile ---
export { profileTable, HyperLogLog, matchVocabulary, VOCABULARIES, ISO_ALPHA2, ISO_ALPHA3, countryCodeKind } from './profile/index.js';
export type { ProfileOptions, Vocabulary, VocabularyMatch, MeasurementLevel, ColumnRole, ColumnProfile, TableShape, ProfileReport } from './profile/index.js';
export { renderProfileText } from './report/profile.js';

// --- numbers ---
export { makeNumberParser, parseNumber, emptyParsedNumber, inferNumberFormat, PLAIN_NUMBER_FORMAT, DEFAULT_MISSING_MARKERS } from './numbers/index.js';
export type { DecimalMark, GroupMark, NumberFormat, NumberStatus, NumberReason, ParsedNumber, NumberParser, NumberFormatInference } from './numbers/index.js';

// --- ranges ---
export { overlapsText, overlapsJson } from './report/overlaps.js';
export type { OverlapsResult, OverlapsSeries, RangeRef } from './report/overlaps.js';
export { makeRange, discreteRange, rangeContains, rangeEquals, compareRanges, isEmptyRange, allenRelation, ALLEN_INVERSE, OVERLAPPING_RELATIONS, parseRangeLabel, tryParseNumericRange, formatRange, rangeFromEndpoints, parseDomain, checkRanges, checkRangeColumns, RangeColumnsBuilder, IntColumn, rangeAt, rangeColumnsOf, rangeFlags, LOW_CLOSED, HIGH_CLOSED, DISCRETE } from './ranges/index.js';
export type { Range, EndsRule, TimeEndpoint, TimeEndpoints, RangeLabelOptions, AllenRelation, RangeCheck, RangeCheckOptions, OverlapPair, DuplicateGroup, RangeColumns } from './ranges/index.js';
export { overlapsJsonParts, overlapsHeadText, overlapsSeriesText } from './report/overlaps.js';
export type { OverlapsHead, OverlapsTotals, OverlapsChart, OverlapsTextOptions } from './report/overlaps.js';

// --- bins ---
export { bucketSummaryText, bucketSummaryJson, schemesText } from './report/bucket.js';
export type { BucketTextOptions } from './report/bucket.js';
export { BUCKET_SCHEMES, findScheme, bucketsFromEdges, bucketsFromExtents, mergeEdges, toDiscrete, quantileOfSorted, equalWidthEdges, quantileEdges, ckmeansExtents, ruleBinCount, BIN_RULES, CKMEANS_MAX_VALUES, makeBucketer, BELOW, ABOVE, BETWEEN, buildBuckets, planNeedsData, bucketSpecOf, bucketsFromSpec, BucketTally, NumberBuffer, bucketTable } from './bins/index.js';
export type { ClosedSide, Bucket, BucketScheme, MergedEdge, BucketSet, BucketSpec, EdgeOptions, QuantileType, BinRule, Extent, Bucketer, BucketPlan, BucketData, BuildOptions, BucketSummary, BucketCount, Outcome, BucketExample, BucketRunOptions, BucketSink, BucketRunResult } from './bins/index.js';
export { bucketTableCsv, bucketFile, BUCKET_PARALLEL_MIN_BYTES, makeNumberBytesParser, ckmeansWeighted, distinctWithCounts, CKMEANS_MAX_CELLS } from './bins/index.js';
export type { CsvRowsOutput, NumberBytesParser, BucketThreads } from './bins/index.js';

// --- rebin ---
export {
  rebin, parseAggSpec, parseAggSpecs, parseQuantileType, aggColumns, isAdditive, parseAssignPolicy, placePeriod, emptyPlacement,
  defaultMaxPeriods, nominalLength, DEFAULT_LIMITS, LocalResolver, boundInstant, formatLocalIso,
} from './rebin/index.js';
export type {
  RebinOptions, RebinResult, RebinRow, RebinSummary, MeasureSummary, AggKind, AggSpec, AssignPolicy, Placement,
  AccumulatorLimits, LocalResolutions,
} from './rebin/index.js';
export { rebinRowCells, rebinRowRecord, rebinJson, rebinNdjson, rebinSummaryText } from './report/rebin.js';
export { rebinFile, PARALLEL_MIN_BYTES } from './rebin/index.js';
export type { RebinThreads, RebinPlan } from './rebin/index.js';

// --- gaps ---
export {
  findGaps, expectedTest, parseSkipDates, isoDay, NO_SKIPS, walkSeries, longestRun, InstantBuckets, fixedDurationMs, isoDurationOfMs,
  gapsUnitFromGrain, detectGapsUnit,
} from './gaps/index.js';
export type {
  GapsOptions, GapsResult, GapSeries, GapsSummary, MissingRun, DuplicatePeriod, InstantGapReport, SkipRules, KeyRun, KeyDuplicate,
  SeriesWalk, InstantGap, GapsUnitChoice,
} from './gaps/index.js';
export { gapsText, gapsJson, seriesStates, runWords, periodsWords } from './report/gaps.js';

// --- report ---
export { barChart, periodStrip, sparkline, histogram, rangeAxis, terminalSafe, formatNumber, STRIP_GLYPHS } from './report/index.js';
export {
  escapeHtml,
  REPORT_CSP,
  emptyCycles,
  addToCycles,
  renderProfileReport,
  renderGrainReport,
  grainCycles,
  profileEvidence,
  renderRebinReport,
  renderGapsReport,
  renderBucketReport,
  renderOverlapsReport,
} from './report/index.js';
export type {
  CycleCounts,
  ProfileReportOptions,
  GrainReportOptions,
  RebinReportOptions,
  GapsReportOptions,
  BucketReportOptions,
  OverlapsReportOptions,
} from './report/index.js';
export type {
  BarRow,
  BarChartOptions,
  PeriodState,
  StripOptions,
  HistogramBin,
  HistogramOptions,
  AxisRange,
  AxisMark,
  RangeAxisOptions,
} from './report/index.js';

// --- sql ---
export type { DialectName, PeriodSqlOptions, PeriodSql, RebinQueryOptions, BucketCaseSql, ColumnRef, DialectDifference } from './sql/index.js';
export {
  DIALECTS, parseDialect, quoteIdentifier, quoteName, quoteString, numberLiteral, checkRawExpression,
  periodSql, commentBlock, rebinQuerySql, bucketCaseSql, bucketQuerySql, DIALECT_DIFFERENCES,
} from './sql/index.js';
