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
  type StatusCause,
  type LoadNote,
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
import * as core from './design/column-check.js';
import type { ColumnCheck, ColumnCheckInput } from './design/column-check.js';
import * as analysis from './analysis/index.js';
import type { BiaxialFamilyRequest, CurveFamily, FamilyRequest } from './analysis/index.js';
import { BiaxialRequestSchema, checkGivenRho, checkLibraryInput, CheckInputSchema, FamilyRequestSchema, MakeSetOptionsSchema } from './input/library.js';
export { BiaxialCharts, DEFAULT_CHART_AXIAL_STEP, type BiaxialChartReading, type BiaxialLevelReading } from './design/biaxial-chart-reading.js';
export type { SlendernessRequest, AxisMember, SwayMember, EndMoments } from './design/column-effects.js';
export type { SwayInput, SwayMethod, SwayInputs } from './codes/slenderness.js';
export type { BarProposal, Detailing } from './design/bar-selection.js';
export { checkJson, checkText, checkReportText, checkJsonPieces, checkTextPieces, checkReportPieces, textSizer, statusReasonOf, loadNoteText } from './report/check-view.js';
export { CAUTION } from './report/caution.js';
export { readChartSet, readChartSetReport } from './config/read.js';
/** file access for readChartSet's `files` option: the office file and logo a chart set names, relative to `baseDir` */
export { nodeFileAccess } from './io/read.js';
export { cleanSvg } from './config/logo.js';
export type { ResolvedChartSet } from './config/types.js';
export { GENERATOR } from './version.js';

/**
 * The entry points that take a caller's data check it first with the zod schemas and limits the CLI uses
 * (src/input/library.ts): a PmError naming the field path, never a result for NaN, a negative size or a
 * count that would hang; null gives a PmError, not a TypeError.
 */
export function checkColumn(input: ColumnCheckInput): ColumnCheck {
  checkInput(input);
  return core.checkColumn(input);
}
/** The per-load results one at a time (streaming), after the same input check as `checkColumn`. */
export function checkColumnLoads(...args: Parameters<typeof core.checkColumnLoads>): ReturnType<typeof core.checkColumnLoads> {
  // a context from prepareColumnCheck was checked when it was made
  if (args[0] === null || typeof args[0] !== 'object' || !('variants' in args[0])) checkInput(args[0] as ColumnCheckInput);
  return core.checkColumnLoads(...args);
}
/** The check's shared context (for `rankColumnCheck`), after the same input check as `checkColumn`. */
export function prepareColumnCheck(...args: Parameters<typeof core.prepareColumnCheck>): ReturnType<typeof core.prepareColumnCheck> {
  checkInput(args[0]);
  return core.prepareColumnCheck(...args);
}
function checkInput(input: ColumnCheckInput): void {
  checkLibraryInput(CheckInputSchema, input, 'input');
  // a null input was refused above; the basis passed the schema
  checkGivenRho(input.rho, input.basis.rhoLimits);
}
/** A family of normalised ρg curves (analysis/family.ts), after the library's input check. */
export function computeFamily(request: FamilyRequest): CurveFamily {
  checkLibraryInput(FamilyRequestSchema, request, 'request');
  return analysis.computeFamily(request);
}
/** Normalised Mx–My contours per axial level and ρg (analysis/biaxial-family.ts), after the library's input check. */
export function computeBiaxialFamily(request: BiaxialFamilyRequest): ReturnType<typeof analysis.computeBiaxialFamily> {
  checkLibraryInput(BiaxialRequestSchema, request, 'request');
  return analysis.computeBiaxialFamily(request);
}

/** Builds a chart set on disk (sheets, tables, book); loads the renderer on first use. */
export async function makeChartSet(...args: Parameters<typeof import('./sheet/pipeline.js').makeChartSet>): ReturnType<typeof import('./sheet/pipeline.js').makeChartSet> {
  checkLibraryInput(MakeSetOptionsSchema, args[1], 'options');
  const m = await import('./sheet/pipeline.js');
  return m.makeChartSet(...args);
}

/** Draws one sheet of a resolved chart set to SVG (text), PNG or PDF (bytes); loads the renderer on first use. */
export async function renderSheet(...args: Parameters<typeof import('./sheet/render-sheet.js').renderSheet>): ReturnType<typeof import('./sheet/render-sheet.js').renderSheet> {
  const m = await import('./sheet/render-sheet.js');
  return m.renderSheet(...args);
}
