/**
 * pmchart library API: the product surface (README, "Use as a library").
 *
 *   computeFamily   basis + section → one sweep in neutral-axis depth → a family of normalised ρg curves
 *   checkColumn     a column and its loads → one frozen ColumnCheck (status, ρg required, readings, bars)
 *   checkSchedule   a schedule of column marks and their loads → one checkColumn per mark, rows by mark, counts by status
 *   computeBiaxialFamily  basis + section + axial levels → normalised Mx–My contours per ρg, with Mxo, Myo, fitted α
 *   readChartSet    a chart-set file's text → the resolved set (field paths in errors)
 *   makeChartSet    a resolved set → sheets, tables and the bound book on disk
 *   renderSheet     one sheet of a set → SVG, PNG or PDF bytes
 *
 * Start reading at analysis/family.ts (`computeFamily`) and design/column-check.ts (`checkColumn`).
 * Render modules (canvas, vega, pdf-lib) load only when a drawing function is called.
 */
export * from './errors.js';
export * from './units/index.js';
export * from './materials/index.js';
export * from './codes/index.js';
export * from './section/index.js';
export * from './analysis/index.js';
export {
  checkColumn,
  checkColumnLoads,
  prepareColumnCheck,
  rankColumnCheck,
  describeCheck,
  layoutVerifier,
  LOAD_STATUSES,
  isLoadStatus,
  type ColumnCheck,
  type ColumnCheckHead,
  type RankedColumnCheck,
  type ColumnCheckInput,
  type ColumnLoadResult,
  type LoadStatus,
  type GoverningMeasure,
  type VariantInfo,
} from './design/column-check.js';
export type { FactoredLoad, GivenLayout } from './design/check.js';
export {
  checkSchedule,
  scheduleMarks,
  matchMarks,
  summariseSchedule,
  compareMarks,
  type ScheduleEntry,
  type ScheduleCheck,
  type ScheduleMarkResult,
  type ScheduleRowFacts,
  type ScheduleSummary,
  type ScheduleOptions,
} from './design/schedule.js';
export { BiaxialCharts, DEFAULT_CHART_AXIAL_STEP, type BiaxialChartReading, type BiaxialLevelReading } from './design/biaxial-chart-reading.js';
export type { SlendernessRequest, AxisMember } from './design/column-effects.js';
export type { BarProposal, Detailing } from './design/bar-selection.js';
export { checkJson, checkText, checkReportText, checkJsonPieces, checkTextPieces, checkReportPieces, textSizer } from './report/check-view.js';
export { CAUTION } from './report/caution.js';
export { readChartSet, readChartSetReport } from './config/read.js';
export type { ResolvedChartSet } from './config/types.js';
export { GENERATOR } from './version.js';

/** Builds a chart set on disk (sheets, tables, book); loads the renderer on first use. */
export async function makeChartSet(...args: Parameters<typeof import('./sheet/pipeline.js').makeChartSet>): ReturnType<typeof import('./sheet/pipeline.js').makeChartSet> {
  const m = await import('./sheet/pipeline.js');
  return m.makeChartSet(...args);
}

/** Draws one sheet of a resolved chart set to SVG (text), PNG or PDF (bytes); loads the renderer on first use. */
export async function renderSheet(...args: Parameters<typeof import('./sheet/render-sheet.js').renderSheet>): ReturnType<typeof import('./sheet/render-sheet.js').renderSheet> {
  const m = await import('./sheet/render-sheet.js');
  return m.renderSheet(...args);
}
