/**
 * The page's one door into the library: every figure the page shows comes from a call in this file, and
 * every input is read by the parsers the CLI uses, so the page and the CLI give the same numbers and the
 * same messages. The page itself only formats and draws.
 *
 *   form fields (flag names, as typed) ─▶ chartView: family · sheet datasets · bracketing sheets
 *                                      └▶ loadsView: the column check, as `pmchart check --json` prints it
 *
 * Swap points for the integrator:
 *  - the column check: `loadsView` parses the flags with the CLI's `computeCheck`, which calls the engine's
 *    `checkColumn`; the JSON and the effects text are the report views of that one result;
 *  - the flag readers are src/flags/ (shared with the CLI, below it); pasted CSV reaches the load reader
 *    through virtual-fs.ts, offered as a file.
 */
import { computeFamily, type CurveFamily } from '../analysis/family.js';
import { buildSheet, type BuiltSheet } from '../chart/sheet-data.js';
import { computeCheck, type CheckOptions } from '../flags/check-flags.js';
import { checkJson, effectsText } from '../report/check-view.js';
import { sheetSetFromFlags, type SheetOptions } from '../flags/sheet-flags.js';
import { familyFor, resolveTableOptions, type TableRequest } from '../flags/table-flags.js';
import type { ResolvedChartSet } from '../config/types.js';
import { bracketingGammas, readSheet, type SheetReading } from '../design/chart-reading.js';
import { isPmError } from '../errors.js';
import { SHEET_BASE_POINTS } from '../sheet/curves.js';
import { generatorLabel } from '../version.js';
import { putVirtualFile } from './virtual-fs.js';

/** The page's inputs under the CLI's flag names (commander's camelCase), as the user typed them. */
export type PageFields = SheetOptions & CheckOptions;

/** A problem with the inputs: the flag (or CSV line) it concerns and the CLI's one-line message. */
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
    if (isPmError(e)) return { ok: false, problem: { path: e.path, message: e.message } };
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
}

/** The column check for the page's section and loads; the chart sheets read are those of the chosen grid. */
export function loadsView(fields: PageFields, loads: PageLoads, grid: number): Promise<Outcome<LoadsView>> {
  return attempt(() => {
    const o: CheckOptions = { ...checkFlags(fields, loads, grid), json: true };
    if (loads.kind === 'csv') putVirtualFile(PASTED_LOADS, loads.text);
    // flags → ColumnCheckInput (the CLI's parsers) → checkColumn → the JSON view, as `pmchart check --json`
    const { check } = computeCheck(o);
    return { json: JSON.parse(checkJson(check, generatorLabel())) as CheckJson, effectsText: effectsText(check).trim() };
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

/** The caution every page view and export carries (the CLI's words). */
export { CAUTION as PAGE_CAUTION } from '../report/caution.js';
