/**
 * The page's one door into the library: every figure the page shows comes from a call in this file, and
 * every input is read by the parsers the CLI uses, so the page and the CLI give the same numbers and the
 * same messages. The page itself only formats and draws.
 *
 *   form fields (flag names, as typed) ─▶ chartView: family · sheet datasets · bracketing sheets
 *                                      └▶ loadsView: the column check, as `pmchart check --json` prints it
 *                                                   └▶ biaxialView: Mx–My contours at the levels the check read
 *   schedule + loads text (pasted or dropped) ─▶ scheduleView: each mark's status, as `pmchart schedule` prints it
 *
 * Swap points for the integrator:
 *  - the column check: `loadsView` parses the flags with the CLI's `computeCheck`, which calls the engine's
 *    `checkColumn`; the JSON and the effects text are the report views of that one result;
 *  - the flag readers are src/flags/ (shared with the CLI, below it); pasted CSV reaches the load reader
 *    through virtual-fs.ts, offered as a file.
 */
import type { BiaxialFamily } from '../analysis/biaxial-family.js';
import { checkBiaxialFamily } from '../design/check-curves.js';
import { computeFamily, type CurveFamily } from '../analysis/family.js';
import type { ColumnCheck } from '../design/column-check.js';
import { grossArea, sectionDepth, sectionWidth } from '../section/geometry.js';
import { buildSheet, type BuiltSheet } from '../chart/sheet-data.js';
import { computeCheck, type CheckOptions } from '../flags/check-flags.js';
import { checkJson, effectsText } from '../report/check-view.js';
import { sheetSetFromFlags, type SheetOptions } from '../flags/sheet-flags.js';
import { familyFor, resolveTableOptions, type TableRequest } from '../flags/table-flags.js';
import type { ResolvedChartSet } from '../config/types.js';
import { bracketingGammas, readSheet, type SheetReading } from '../design/chart-reading.js';
import { summariseSchedule, type ScheduleSummary } from '../design/schedule.js';
import { isPmError } from '../errors.js';
import { checkRows, readSchedule, type MarkRow } from '../flags/schedule-rows.js';
import { SHEET_BASE_POINTS } from '../sheet/curves.js';
import { generatorLabel } from '../version.js';
import { pageMessage } from './fields.js';
import { putVirtualFile } from './virtual-fs.js';

/** The page's inputs under the CLI's flag names (commander's camelCase), as the user typed them. */
export type PageFields = SheetOptions & CheckOptions;

/** A problem with the inputs: the flag (or CSV line) it concerns, and the CLI's one-line message in the page's words (field names, not flags). */
export interface FieldProblem {
  path: string;
  message: string;
}

export type Outcome<T> = { ok: true; value: T } | { ok: false; problem: FieldProblem };

/** Print grids of the "between sheets" view (γ steps of printed sets, common practice). */
export const GRID_STEPS = [0.05, 0.1] as const;

export interface ChartView {
  request: TableRequest;
  set: ResolvedChartSet;
  /** the family as `pmchart table` computes it, before any thinning for drawing */
  family: CurveFamily;
  built: BuiltSheet;
  /** the printed sheets that bracket γ on the chosen grid (one when γ sits on the grid) */
  sheets: { gamma: number; family: CurveFamily }[];
  /** 1, or the normalising stress on dimensionless charts (chart value × divisor = stress) */
  divisor: number;
}

/** Name under which pasted load CSV text is offered to the CLI's reader. */
export const PASTED_LOADS = 'pasted-loads.csv';

async function attempt<T>(fn: () => Promise<T> | T): Promise<Outcome<T>> {
  try {
    return { ok: true, value: await fn() };
  } catch (e) {
    if (isPmError(e)) return { ok: false, problem: { path: e.path, message: pageMessage(e) } };
    throw e;
  }
}

/** Section, family and sheet datasets for the chart; `grid` is the γ step of the bracketing sheets. */
export function chartView(fields: PageFields, grid: number, date: string): Promise<Outcome<ChartView>> {
  return attempt(async () => {
    const request = resolveTableOptions({ ...fields, format: 'json' });
    const { set } = await sheetSetFromFlags({ ...fields, date });
    const family = familyFor(request);
    const built = buildSheet({ set, sheet: set.sheets[0]!, family, sheetNumber: 1, sheetCount: 1, generator: generatorLabel() });
    const s = request.section;
    const { lower, upper } = bracketingGammas(s.gamma, grid);
    const sheets = [lower, ...(upper === null ? [] : [upper])].map((gamma) => ({
      gamma,
      family: computeFamily({ basis: s.basis, shape: s.shape, arrangement: s.arrangement, gamma, ...(s.gammaB !== undefined ? { gammaX: s.gammaB } : {}), rhos: request.rhos, capContext: s.capContext, basePoints: SHEET_BASE_POINTS }),
    }));
    return { request, set, family, built, sheets, divisor: set.normalisation === 'dimensionless' ? s.basis.normalisingStress : 1 };
  });
}

/** The reading under the pointer: ρg a design curve through (M, P) would have, read as `rhoFromChart` reads a sheet. */
export function readingAt(view: ChartView, M: number, P: number): { P: number; M: number; eOverH: number; reading: SheetReading } {
  const load = { P: P * view.divisor, M: M * view.divisor };
  return { ...load, eOverH: load.P === 0 ? Infinity : load.M / load.P, reading: readSheet({ gamma: view.family.gamma, family: view.family }, load) };
}

/** Loads as the page takes them: one typed load, or CSV text as `pmchart check --loads` reads it. */
export type PageLoads = { kind: 'typed'; pu: string; mu: string; muy?: string } | { kind: 'csv'; text: string };

/** What `pmchart check --json` prints for the same flags (parsed). */
export type CheckJson = Record<string, unknown> & { results: Record<string, unknown>[]; caution: string; assumptions: string[] };

/** The check as the page shows it: the JSON, and the text the CLI prints about Muy and slenderness (often empty). */
export interface LoadsView {
  json: CheckJson;
  effectsText: string;
  /** the check itself, for the biaxial view (`biaxialView`) */
  check: ColumnCheck;
}

/** The column check for the page's section and loads; the chart sheets read are those of the chosen grid. */
export function loadsView(fields: PageFields, loads: PageLoads, grid: number): Promise<Outcome<LoadsView>> {
  return attempt(() => {
    const o: CheckOptions = { ...checkFlags(fields, loads, grid), json: true };
    if (loads.kind === 'csv') putVirtualFile(PASTED_LOADS, loads.text);
    // flags → ColumnCheckInput (the CLI's parsers) → checkColumn → the JSON view, as `pmchart check --json`
    const { check } = computeCheck(o);
    return { json: JSON.parse(checkJson(check, generatorLabel())) as CheckJson, effectsText: effectsText(check).trim(), check };
  });
}

/** The `pmchart check` flags that reproduce the page's check (the copyable command line prints these). */
export function checkFlags(fields: PageFields, loads: PageLoads, grid: number): CheckOptions {
  const { rho: _r, omega: _w, families: _f, dimensionless: _d, eccentricities: _e, paper: _p, portrait: _o, ...section } = fields;
  const o: CheckOptions = { ...section, proposals: '0', ...(grid !== 0.05 ? { chartGammaStep: String(grid) } : {}) };
  if (loads.kind === 'typed') Object.assign(o, { pu: loads.pu, mu: loads.mu }, loads.muy ? { muy: loads.muy } : {});
  else o.loads = PASTED_LOADS;
  return o;
}

/** A load with Muy, normalised as the biaxial panels: mx = Mux/(Ag·h), my = Muy/(Ag·b) (stress units), ν = Pu/(stress·Ag). */
export interface BiaxialLoadPoint {
  id: string;
  level: number;
  mx: number;
  my: number;
  governing: boolean;
}

/** The biaxial view of one load: the ρg family of factored Mx–My contours at the axial levels its sheet reading used. */
export interface BiaxialView {
  /** the load whose levels are drawn */
  id: string;
  /** its axial level ν = Pu/(normalising stress·Ag) */
  level: number;
  /** one call: the contours at the levels read (one level when ν sits on the grid) */
  family: BiaxialFamily;
  /** every load with Muy, normalised as the panels (signed; the view folds them into the first quadrant when that is all it draws) */
  loads: BiaxialLoadPoint[];
  /** loads that can be drawn, in the check's order (governing first) */
  choices: string[];
}

/**
 * The biaxial view for the load `id` (default: the first load with a biaxial sheet reading, which is the
 * governing one when it has Muy): computeBiaxialFamily on the section the check read its sheets from —
 * same basis, arrangement, γ, γB and ρg family (`biaxialChart.rhos`), unit depth as the sheets are drawn —
 * at the levels in that load's `chartLevels`. Null when no load has a biaxial sheet reading.
 */
export function biaxialView(check: ColumnCheck, id?: string): BiaxialView | null {
  const bc = check.biaxialChart;
  if (!bc) return null;
  const readable = check.results.filter((r) => (r.biaxial?.chartLevels.length ?? 0) > 0);
  const load = readable.find((r) => r.id === id) ?? readable[0];
  if (!load) return null;
  const shape = check.shape;
  const family = checkBiaxialFamily(check, load.biaxial!.chartLevels.map((l) => l.level))!;
  const ag = grossArea(shape);
  const stress = check.basis.normalisingStress;
  // the moments the sheets were read with: after slenderness and the minimum moment, signed
  const loads = check.results
    .filter((r) => r.Muy !== null && Number.isFinite(r.Mu) && Number.isFinite(r.Muy!))
    .map((r) => ({ id: r.id, level: r.Pu / (stress * ag), mx: r.Mu / (ag * sectionDepth(shape)), my: r.Muy! / (ag * sectionWidth(shape)), governing: r.governing }));
  return { id: load.id, level: load.Pu / (stress * ag), family, loads, choices: readable.map((r) => r.id) };
}

/** Where the schedule panel's problems are placed: the schedule text, its loads. */
export const SCHEDULE_AT = 'schedule';
export const SCHEDULE_LOADS_AT = 'schedule loads';

/** A schedule checked as `pmchart schedule` checks it: one row per mark (sorted), the summary and the notes. */
export interface ScheduleView {
  rows: MarkRow[];
  summary: ScheduleSummary;
  exitCode: 0 | 1;
  notes: string[];
}

/**
 * The schedule panel: a schedule and its loads, as texts pasted or dropped into the page, read by the CLI's
 * schedule reader (`readSchedule`: the same schema, units, export map and sign) and every mark checked by
 * the engine, as `pmchart schedule` does without --jobs or --report (no bar proposals).
 */
export function scheduleView(scheduleText: string, loadsText: string, o: { columns?: string; compression?: string; allowMissing?: boolean }): Promise<Outcome<ScheduleView>> {
  return attempt(() => {
    const read = readSchedule(scheduleText, loadsText, { ...o, proposals: 0 }, SCHEDULE_AT, SCHEDULE_LOADS_AT);
    const rows: MarkRow[] = [];
    for (const { check: _c, ...row } of checkRows(read.rows, read.loads, 0, SCHEDULE_AT, false)) rows.push(row);
    const { summary, exitCode } = summariseSchedule(rows);
    return { rows, summary, exitCode, notes: read.notes };
  });
}

/** The caution every page view and export carries (the CLI's words). */
export { CAUTION as PAGE_CAUTION } from '../report/caution.js';
