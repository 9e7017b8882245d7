/**
 * Checking factored loads on a sized column, pure (no I/O):
 *
 *   loads ─▶ normalise ─▶ exact ρg required ─▶ chart readings ─▶ strain state ─▶ utilisation
 *                                   │
 *   all loads ───────────────────────┴─▶ governing load first ─▶ bar proposals for the column
 *
 * One `LoadResult` per load is built in `checkLoad`; further checks add their fields there.
 */
import { layoutBars } from '../section/arrangements.js';
import { prepareSection } from '../analysis/prepared-section.js';
import type { Basis, CapContext, StrainClass } from '../codes/types.js';
import type { BarSize } from '../section/bar-tables.js';
import { grossArea, sectionDepth } from '../section/geometry.js';
import type { Arrangement, Shape } from '../section/types.js';
import { isSelectableKind, proposeBars, type BarProposal, type Detailing } from './bar-selection.js';
import { buildChartSet, readCharts, type ChartReading, type ChartSet, type SheetReading } from './chart-reading.js';
import { capacityAlongRay, strainReport, tabulate, type NormalisedLoad, type RayTable } from './ray.js';
import { rhoRequired, type RhoStatus } from './rho-required.js';

/** A factored load in internal units (kip, kip·in or N, N·mm); tension negative. */
export interface FactoredLoad {
  id: string;
  Pu: number;
  Mu: number;
  /** moment about the y axis for the biaxial check (src/cli/check-effects.ts); absent: uniaxial */
  Muy?: number;
  /** end moments for the slenderness check (src/design/column-effects.ts) */
  M1?: number;
  M2?: number;
  M1y?: number;
  M2y?: number;
}

/** A given layout to check: discrete bars of total area `area` at `gamma`. */
export interface GivenLayout {
  arrangement: Arrangement;
  area: number;
  gamma: number;
  description: string;
}

export interface CheckRequest {
  basis: Basis;
  /** actual section, internal units */
  shape: Shape;
  arrangement: Arrangement;
  gamma: number;
  capContext?: CapContext;
  loads: readonly FactoredLoad[];
  /** a given ρg to check (smeared bars at γ) */
  rho?: number;
  /** a given bar layout to check */
  layout?: GivenLayout;
  /** chart sheet γ step (default 0.05) */
  chartGammaStep?: number;
  /** bar selection; omitted → none */
  barSelection?: { detailing: Detailing; sizes: readonly BarSize[]; aggregate?: number; count?: number };
}

export interface LoadResult {
  id: string;
  /** input order */
  index: number;
  Pu: number;
  Mu: number;
  /** moment used: |Mu| raised to the basis minimum where one applies */
  Mdesign: number;
  /** eOverH: null where there is no axial load to divide by (pure bending): outputs stay finite */
  normalised: { P: number; M: number; eOverH: number | null };
  rhoRequired: number | null;
  rhoStatus: RhoStatus;
  governedBy: 'curve' | 'cap' | 'minimum';
  /** Ast at rhoRequired, internal area units */
  steelRequired: number | null;
  rhoFromChart: number | null;
  rhoRoundedDown: number | null;
  chartSheets: SheetReading[];
  /** (rhoRoundedDown − rhoRequired)·Ag */
  extraSteelRoundedDown: number | null;
  /** at the checked reinforcement, else at rhoRequired (at the maximum when not possible) */
  strain: { cOverH: number; epsT: number; phi: number; class: StrainClass; atRho: number; capGoverns: boolean };
  /** demand ÷ capacity along the ray at strain.atRho (ranks loads that need the same ρg) */
  demandRatio: number;
  /** demand ÷ capacity along the ray for the given ρg or layout; null when neither is given */
  utilisation: number | null;
  /** capacity along the ray for the checked reinforcement, internal units */
  capacity: { P: number; M: number } | null;
  governing: boolean;
  notes: string[];
}

export interface CheckOutcome {
  results: LoadResult[];
  governingId: string | null;
  bars: BarProposal[];
  /** bar proposals were not sought, with why */
  barsSkipped: string | null;
  area: number;
  depth: number;
  limits: { min: number; max: number };
  chart: { gammaStep: number; lower: number; upper: number | null; rhos: readonly number[] };
  checked: { kind: 'rho' | 'layout'; rho: number; description: string } | null;
  notes: string[];
}

/** Everything prepared once per section and shared by every load. */
export interface CheckContext {
  basis: Basis;
  shape: Shape;
  area: number;
  depth: number;
  table: RayTable;
  charts: ChartSet;
  checked: { table: RayTable; rho: number } | null;
}

/** Normalised demand: Pu/Ag and Mu/(Ag·h) (Ag·D for circles); the moment sign is dropped (symmetric sections). */
export function normaliseLoad(basis: Basis, shape: Shape, load: FactoredLoad): { load: NormalisedLoad; Mdesign: number } {
  const area = grossArea(shape);
  const depth = sectionDepth(shape);
  const Mdesign = Math.max(Math.abs(load.Mu), basis.minimumMoment(load.Pu, depth));
  return { load: { P: load.Pu / area, M: Mdesign / (area * depth) }, Mdesign };
}

/** M/P, 0 for no load, null where it is not finite (no axial load, or one too small to divide by). */
function eccentricityRatio(P: number, M: number): number | null {
  if (P === 0 && M === 0) return 0;
  const r = M / P;
  return Number.isFinite(r) ? r : null;
}

export function prepareCheck(req: CheckRequest): CheckContext {
  const { basis, shape } = req;
  const area = grossArea(shape);
  const depth = sectionDepth(shape);
  const capContext = req.capContext ?? {};
  const smeared = prepareSection(basis, shape, layoutBars(shape, req.arrangement, 1, { gamma: req.gamma }), capContext);
  const table = tabulate(smeared, 128);
  const charts = buildChartSet({
    basis,
    shape,
    arrangement: req.arrangement,
    gamma: req.gamma,
    capContext,
    rhoLimits: basis.rhoLimits,
    ...(req.chartGammaStep !== undefined ? { gammaStep: req.chartGammaStep } : {}),
  });
  let checked: CheckContext['checked'] = null;
  if (req.layout) {
    const bars = layoutBars(shape, req.layout.arrangement, req.layout.area, { gamma: req.layout.gamma });
    checked = { table: tabulate(prepareSection(basis, shape, bars, capContext), 128), rho: req.layout.area / area };
  } else if (req.rho !== undefined) {
    checked = { table, rho: req.rho };
  }
  return { basis, shape, area, depth, table, charts, checked };
}

/** ρg limits for an axial demand (basis.steelAreaLimits over Ag). */
export function rhoLimitsFor(basis: Basis, Pu: number, area: number): { min: number; max: number } {
  const l = basis.steelAreaLimits(Pu, area);
  return { min: l.min / area, max: l.max / area };
}

/** The whole result for one load. */
export function checkLoad(ctx: CheckContext, load: FactoredLoad, index: number): LoadResult {
  const { basis, area } = ctx;
  const { load: n, Mdesign } = normaliseLoad(basis, ctx.shape, load);
  const limits = rhoLimitsFor(basis, load.Pu, area);
  const req = rhoRequired(ctx.table, n, limits);
  const reading = withMinimum(readCharts(ctx.charts, n), limits.min, ctx.charts.rhos);
  const notes: string[] = [];
  if (req.status === 'not-possible') notes.push(`not possible within ρg ≤ ${fmtRho(limits.max)}`);
  if (req.status === 'minimum-governs') notes.push(`minimum ρg = ${fmtRho(limits.min)} governs`);
  if (req.governedBy === 'cap') notes.push('axial cap governs ρg');
  if (Mdesign > Math.abs(load.Mu)) notes.push('moment raised to the basis minimum');
  if (reading.rhoFromChart === null) notes.push('off the charted range');

  const strainRho = ctx.checked ? ctx.checked.rho : (req.rho ?? limits.max);
  const strainTable = ctx.checked ? ctx.checked.table : ctx.table;
  const cap = capacityAlongRay(strainTable, strainRho, n);
  const s = strainReport(strainTable, cap);
  const zero = n.P === 0 && n.M === 0;
  return {
    id: load.id,
    index,
    Pu: load.Pu,
    Mu: load.Mu,
    Mdesign,
    normalised: { P: n.P, M: n.M, eOverH: eccentricityRatio(n.P, n.M) },
    rhoRequired: req.rho,
    rhoStatus: req.status,
    governedBy: req.governedBy,
    steelRequired: req.rho === null ? null : req.rho * area,
    rhoFromChart: reading.rhoFromChart,
    rhoRoundedDown: reading.rhoRoundedDown,
    chartSheets: reading.sheets,
    extraSteelRoundedDown: req.rho === null || reading.rhoRoundedDown === null ? null : (reading.rhoRoundedDown - req.rho) * area,
    strain: { ...s, atRho: strainRho, capGoverns: cap.capGoverns },
    demandRatio: cap.utilisation,
    utilisation: ctx.checked ? cap.utilisation : null,
    capacity: ctx.checked && !zero ? { P: cap.P * area, M: cap.M * area * ctx.depth } : null,
    governing: false,
    notes,
  };
}

/**
 * A reader applies the basis minimum to what the chart gives: EN 1992-1-1 9.5.2(2) makes it depend on
 * NEd, so it can exceed the lowest curve. The rounded reading is then the next curve at or above it.
 */
export function withMinimum(r: ChartReading, min: number, rhos: readonly number[]): ChartReading {
  const rounded = r.rhoRoundedDown === null || r.rhoRoundedDown >= min - 1e-12 ? r.rhoRoundedDown : (rhos.find((x) => x >= min - 1e-12) ?? null);
  return { ...r, rhoFromChart: r.rhoFromChart === null ? null : Math.max(r.rhoFromChart, min), rhoRoundedDown: rounded };
}

const fmtRho = (r: number): string => String(Number(r.toFixed(4)));

/** Governing first: by utilisation when reinforcement is given, else by required ρg (not possible first). */
function governingOrder(a: LoadResult, b: LoadResult): number {
  if (a.utilisation !== null && b.utilisation !== null && a.utilisation !== b.utilisation) return b.utilisation - a.utilisation;
  const ra = a.rhoStatus === 'not-possible' ? Infinity : a.rhoRequired!;
  const rb = b.rhoStatus === 'not-possible' ? Infinity : b.rhoRequired!;
  if (ra !== rb) return rb - ra;
  return b.demandRatio - a.demandRatio || a.index - b.index;
}

export function checkLoads(req: CheckRequest): CheckOutcome {
  const ctx = prepareCheck(req);
  const results = req.loads.map((l, i) => checkLoad(ctx, l, i));
  results.sort(governingOrder);
  if (results[0]) results[0].governing = true;

  const notes: string[] = [];
  let bars: BarProposal[] = [];
  let barsSkipped: string | null = null;
  const kind = req.arrangement.kind;
  if (!req.barSelection) barsSkipped = 'bar selection not requested';
  else if (!isSelectableKind(kind)) barsSkipped = 'bar selection needs a regular arrangement (two-faces, four-faces, side-faces or ring)';
  else if (results.some((r) => r.rhoStatus === 'not-possible')) barsSkipped = 'a load needs more than the maximum ρg: enlarge the section';
  else if (results.length === 0) barsSkipped = 'no loads';
  else {
    const limits = req.loads.reduce(
      (acc, l) => {
        const x = req.basis.steelAreaLimits(l.Pu, ctx.area);
        return { min: Math.max(acc.min, x.min), max: Math.min(acc.max, x.max) };
      },
      { min: 0, max: Infinity },
    );
    // a loop, not Math.max(...list): 200k loads overflow the call stack as spread arguments
    const requiredArea = results.reduce((m, r) => Math.max(m, r.steelRequired ?? 0), 0);
    const sel = req.barSelection;
    bars = proposeBars({
      basis: req.basis,
      shape: req.shape,
      kind,
      detailing: sel.detailing,
      sizes: sel.sizes,
      requiredArea,
      areaLimits: limits,
      loads: req.loads.map((l) => normaliseLoad(req.basis, req.shape, l).load),
      ...(sel.aggregate !== undefined ? { aggregate: sel.aggregate } : {}),
      ...(req.capContext ? { capContext: req.capContext } : {}),
      ...(sel.count !== undefined ? { count: sel.count } : {}),
    });
    if (bars.length === 0) barsSkipped = 'no single-size layout satisfies the spacing, steel and capacity limits';
  }

  const checked = req.layout
    ? { kind: 'layout' as const, rho: req.layout.area / ctx.area, description: req.layout.description }
    : req.rho !== undefined
      ? { kind: 'rho' as const, rho: req.rho, description: `given ρg` }
      : null;
  if (req.arrangement.kind === 'custom') notes.push('custom bar layout: the moment sign is ignored, so the layout is taken as symmetric about the bending axis');
  return {
    results,
    governingId: results[0]?.id ?? null,
    bars,
    barsSkipped,
    area: ctx.area,
    depth: ctx.depth,
    limits: rhoLimitsFor(req.basis, 0, ctx.area),
    chart: { gammaStep: ctx.charts.gammaStep, lower: ctx.charts.lower.gamma, upper: ctx.charts.upper?.gamma ?? null, rhos: ctx.charts.rhos },
    checked,
    notes,
  };
}
