// Renderings of the library's result objects: compact text charts for the terminal and the HTML report kit.
export {
  barChart,
  periodStrip,
  sparkline,
  histogram,
  rangeAxis,
  terminalSafe,
  formatNumber,
  STRIP_GLYPHS,
} from './terminal.js';
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
} from './terminal.js';
export {
  escapeHtml,
  renderPage,
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
} from './html/index.js';
export type {
  CycleCounts,
  ProfileReportOptions,
  GrainReportOptions,
  RebinReportOptions,
  GapsReportOptions,
  BucketReportOptions,
  OverlapsReportOptions,
} from './html/index.js';
