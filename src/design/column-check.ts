/**
 * The column-check engine: one pure entry, one immutable result that every view reads.
 *
 *   loads ─▶ 1. slenderness (basis method, per axis) ─▶ checked Mux, Muy (signs kept)
 *        ─▶ 2. uniaxial: normalise, minimum moment, every section variant the sign or orientation
 *              can load (mirrored layout for a negative moment, ring orientations) ─▶ the weakest
 *        ─▶ 3. biaxial (Muy given): exact capacity of the bars, or the exact ρg required
 *        ─▶ 4. detailing of the given reinforcement (src/design/detailing.ts); status (ok, fails, detailing,
 *              not possible, unstable, outside the method's scope) and measure
 *   all loads ─▶ 5. governing first ─▶ 6. bar proposals re-verified against every load with every effect
 *             ─▶ 7. summary and exit status
 *
 * `checkColumnLoads` yields the per-load results in input order (for streaming views);
 * `checkColumn` collects them and adds the ranking, proposals and summary. `rankColumnCheck` makes
 * the same check for load files too big to hold every result: it keeps a few numbers per load to
 * rank them and computes each result again, in ranked order, when a view reads it. No I/O, no CLI names.
 */
import { DEFAULT_ANGLE_STEP_DEG } from '../analysis/biaxial-family.js';
import { capacityAlongRay as biaxialRay, prepareBiaxial, type BiaxialSection } from '../analysis/biaxial.js';
import { prepareSection } from '../analysis/prepared-section.js';
import { goldenSection } from '../analysis/solve.js';
import type { RuleFinding } from '../codes/rules.js';
import type { Basis, CapContext, StrainClass } from '../codes/types.js';
import { layoutBars, mirroredBars, symmetricAboutBendingAxis, type LayoutOptions } from '../section/arrangements.js';
import type { BarSize } from '../section/bar-tables.js';
import { grossArea, sectionDepth } from '../section/geometry.js';
import type { Arrangement, Bar, Shape } from '../section/types.js';
import type { UnitSystem } from '../units/index.js';
import { isSelectableKind, proposeBars, type BarProposal, type Detailing } from './bar-selection.js';
import { checkBiaxial, type BiaxialResult } from './biaxial.js';
import { aggregateOf, breaksDetailing, loadSteelDetailing, sectionDetailing, type DetailingInput } from './detailing.js';
import { BiaxialCharts, type BiaxialLevelReading } from './biaxial-chart-reading.js';
import { rhoLimitsFor, withMinimum, type FactoredLoad, type GivenLayout } from './check.js';
import { buildChartSet, readCharts, type ChartSet, type SheetReading } from './chart-reading.js';
import { magnifyLoad, type EndMoments, type MagnifiedLoad, type SlendernessRequest } from './column-effects.js';
import { capacityAlongRay, strainReport, tabulate, type NormalisedLoad, type RayTable } from './ray.js';
import { rhoRequired, type RhoStatus } from './rho-required.js';

// ───────────────────────────── input ─────────────────────────────

export interface ColumnCheckInput {
  basis: Basis;
  /** actual section, internal units */
  shape: Shape;
  arrangement: Arrangement;
  /** bar-spacing ratio of the arrangement */
  gamma: number;
  /** γB: outer-column spacing ÷ b (rectangles); absent: the same cover as γ gives on h */
  gammaB?: number;
  /** where γ came from, for the views (default 'given'): given, or from the bars (cover, tie and bar; custom bar positions) */
  gammaSource?: 'given' | 'bars';
  /** what is known of the given bars beyond their area (bar and tie sizes, cover, aggregate), for the detailing rules */
  detailingInput?: DetailingInput;
  capContext?: CapContext;
  loads: readonly FactoredLoad[];
  /** a given ρg to check (bars smeared at γ in the arrangement) */
  rho?: number;
  /** a given bar layout to check */
  layout?: GivenLayout;
  /** second-order effects (braced, or sway where the member data say so); absent: short column */
  slenderness?: SlendernessRequest | null;
  /** chart sheet γ step (default 0.05) */
  chartGammaStep?: number;
  /** axial-level step of the biaxial sheets read for loads with Muy (default 0.1) */
  chartAxialStep?: number;
  /** bar selection; omitted → none */
  barSelection?: { detailing: Detailing; sizes: readonly BarSize[]; aggregate?: number; count?: number };
}

// ───────────────────────────── result ─────────────────────────────

export const LOAD_STATUSES = ['ok', 'fails', 'not-possible', 'unstable', 'outside-scope', 'detailing'] as const;
export type LoadStatus = (typeof LOAD_STATUSES)[number];
export const isLoadStatus = (s: unknown): s is LoadStatus => LOAD_STATUSES.includes(s as LoadStatus);

/** Worst first: the order in which statuses govern. */
const STATUS_RANK: Record<LoadStatus, number> = { unstable: 0, 'outside-scope': 1, 'not-possible': 2, detailing: 3, fails: 4, ok: 5 };

/** Which measure ranks the loads: utilisation of the given reinforcement, else the ρg required. */
export type GoverningMeasure = 'utilisation' | 'rhoRequired';



/** A note on one load's check, as a fact; report/check-view.ts `loadNoteText` puts it in words. */
export type LoadNote =
  | { readonly kind: 'rho-not-possible'; readonly rhoMax: number }
  | { readonly kind: 'rho-minimum-governs'; readonly rhoMin: number }
  | { readonly kind: 'cap-governs-rho' }
  /** the moment was raised to the basis minimum; both signs checked where the layout is not symmetric */
  | { readonly kind: 'moment-raised'; readonly bothSigns: boolean }
  | { readonly kind: 'method-minimum-both-signs' }
  /** a ring's weakest uniaxial orientation, degrees from a bar at the compression extreme */
  | { readonly kind: 'weakest-orientation'; readonly turnDeg: number }
  | { readonly kind: 'negative-branch-governs' }
  | { readonly kind: 'off-charts' }
  | { readonly kind: 'circle-resultant' }
  | { readonly kind: 'y-moment-raised' }
  | { readonly kind: 'exact-search'; readonly cause: 'ring-turned' | 'unsymmetric' };

/**
 * Why a load has its status, as facts: the slenderness method that stops (its axis and the method's own warning,
 * in the rulebook's words), the ρg beyond the basis maximum, the broken detailing rule, or the utilisation above 1
 * and where it comes from. `none` for `ok`. The views make the sentence (report/check-view.ts).
 */
export type StatusCause =
  | { readonly kind: 'none' }
  | { readonly kind: 'slenderness'; readonly axis: 'x' | 'y'; readonly warning: string | null }
  | { readonly kind: 'rho-beyond-maximum'; readonly rhoMax: number }
  | { readonly kind: 'detailing' }
  | { readonly kind: 'utilisation'; readonly value: number; readonly from: MeasureSource };

/** A section variant: the layout as the load's sign or orientation sees it. */
export interface VariantInfo {
  /** e.g. "as drawn", "branch with compression on the −y face", "ring turned 15°" */
  label: string;
  /** the face a branch of an unsymmetric layout compresses: +1 the +y face, −1 the −y face (the mirrored bars); 0 symmetric or ring */
  sign: -1 | 0 | 1;
  /** turn of the bar pattern, degrees (rings) */
  turnDeg: number;
}

export interface ColumnLoadResult {
  readonly id: string;
  /** input order */
  readonly index: number;
  readonly Pu: number;
  /** first-order moments as given (internal units) */
  readonly firstOrder: { readonly Mux: number; readonly Muy: number | null };
  /** moment about x after slenderness, signed, before the minimum */
  readonly Mu: number;
  /** moment about x actually checked: |Mu| raised to the basis minimum where one applies (magnitude) */
  readonly Mdesign: number;
  /** true when the basis minimum raised the moment */
  readonly momentRaised: boolean;
  /** moment about y after slenderness, signed; null for a uniaxial load */
  readonly Muy: number | null;
  /** normalised uniaxial demand (P/Ag, M/(Ag·h)), M ≥ 0 */
  /** eOverH: M/P, 0 for no load, null where it is not finite (no axial load): outputs stay finite */
  readonly normalised: { readonly P: number; readonly M: number; readonly eOverH: number | null };
  /** where the load sits on a chart of this layout: M signed where the chart has both branches (unsymmetric layouts), else M */
  readonly chartM: number;
  /** the same over the basis's normalising stress (ν and μ for EN 1992-1-1) */
  readonly dimensionless: { readonly P: number; readonly M: number };
  /** uniaxial (Mux) ρg required at the actual γ over every variant; null when not possible */
  readonly rhoRequired: number | null;
  readonly rhoStatus: RhoStatus;
  readonly governedBy: 'curve' | 'cap' | 'minimum';
  readonly steelRequired: number | null;
  readonly rhoFromChart: number | null;
  readonly rhoRoundedDown: number | null;
  readonly chartSheets: readonly SheetReading[];
  readonly extraSteelRoundedDown: number | null;
  readonly strain: { readonly cOverH: number; readonly epsT: number; readonly phi: number; readonly class: StrainClass; readonly atRho: number; readonly capGoverns: boolean };
  /** demand ÷ capacity along the ray at strain.atRho */
  readonly demandRatio: number;
  /** uniaxial utilisation of the given reinforcement (null when none is given) */
  readonly utilisation: number | null;
  readonly capacity: { readonly P: number; readonly M: number } | null;
  /** the variant that governs this load, and how many were checked */
  readonly variant: VariantInfo;
  readonly variantsChecked: number;
  readonly slenderness: MagnifiedLoad | null;
  /** biaxial results for a load with Muy: exact and approximate utilisations (given reinforcement), and the exact ρg required (none given) */
  readonly biaxial: (Partial<BiaxialResult> & { readonly rhoRequired: number | null; readonly rhoStatus: RhoStatus | null } & BiaxialChartFields) | null;
  readonly status: LoadStatus;
  /** why the load has its status, as facts (the views put it in words: report/check-view.ts `statusReasonOf`) */
  readonly statusCause: StatusCause;
  readonly statusClause: string | null;
  /** the binding detailing finding the given reinforcement breaks (status `detailing`); null otherwise */
  readonly statusFinding: RuleFinding | null;
  /** the ranking value: max of the uniaxial and exact biaxial figures of `ColumnCheck.measure` (Infinity when not possible) */
  readonly measureValue: number | null;
  readonly governing: boolean;
  /** what else the check found for this load, as facts (the views put them in words: report/check-view.ts loadNoteText) */
  readonly notes: readonly LoadNote[];
  /** the check about y alone (one axis at a time): the y minimum moment at the same Pu, with the y slenderness; null where nothing about y is checked alone */
  readonly yAxis: YAxisCheck | null;
  /** the exact biaxial search with Muy = 0, for a layout not symmetric about the bending plane (its neutral axis inclines); null otherwise */
  readonly exactUniaxial: ExactUniaxial | null;
  /** which check gives `measureValue` */
  readonly measureFrom: MeasureSource;
  /**
   * the rules applied around the section for this load: rule, clause, axis, outcome and figures — the minimum
   * moments and exact searches, then the detailing rules of the given reinforcement (none when none is given)
   */
  readonly findings: readonly RuleFinding[];
}

/** The check that gives a load's measure: about x (uniaxial or its exact search), about y alone (the same), or biaxial (Mux and Muy together). */
export const MEASURE_SOURCES = ['x', 'x-exact', 'y', 'y-exact', 'biaxial'] as const;
export type MeasureSource = (typeof MEASURE_SOURCES)[number];

/**
 * Bending about y alone at the same Pu (ACI 318-19 R6.6.4.5.4, EN 1992-1-1 5.8.9: a minimum moment acts about
 * one axis at a time): the section turned (b and h swapped, bars swapped), the moment about y after the y
 * slenderness raised to the y minimum, both signs (an accidental moment acts either way).
 */
export interface YAxisCheck {
  /** moment about y after slenderness (magnitude), before the section minimum */
  readonly Mu: number;
  /** the basis's section minimum about y (0 where it sets none) */
  readonly minimum: number;
  /** the moment checked about y alone (magnitude) */
  readonly Mdesign: number;
  /** section depth in this bending plane (b for a rectangle) */
  readonly depth: number;
  /** P/Ag and M/(Ag·depth) */
  readonly normalised: { readonly P: number; readonly M: number };
  /** ρg required about y (reinforcement smeared at γ); null when not possible */
  readonly rhoRequired: number | null;
  readonly rhoStatus: RhoStatus;
  /** utilisation of the given reinforcement about y; null when none is given */
  readonly utilisation: number | null;
  readonly capacity: { readonly P: number; readonly M: number } | null;
  /** the variant that governs (branch with compression on the ±x face, ring orientation) */
  readonly variant: VariantInfo;
  /** the exact search, for a layout not symmetric about this bending plane */
  readonly exact: ExactUniaxial | null;
}

/** The exact biaxial search of one axis's moment alone (the other moment 0), for a layout whose neutral axis inclines. */
export interface ExactUniaxial {
  /** exact utilisation of the given reinforcement over the signs searched; null when none is given */
  readonly utilisation: number | null;
  /** exact ρg required (bars smeared at γ) over the signs searched; null when not possible or reinforcement is given */
  readonly rhoRequired: number | null;
  readonly rhoStatus: RhoStatus | null;
  /** the moment signs searched: +1 compresses the + face */
  readonly signs: readonly (1 | -1)[];
  /** neutral-axis angle at the governing capacity, degrees (0: parallel to the bending axis); null without given reinforcement */
  readonly neutralAxisAngleDeg: number | null;
}

/** The reading off biaxial sheets (src/design/biaxial-chart-reading.ts); null where readings are off or the load is off the sheets. */
export interface BiaxialChartFields {
  readonly rhoFromChart: number | null;
  /** the sheets read: level, reading and where the point sat */
  readonly chartLevels: readonly BiaxialLevelReading[];
  /** rhoFromChart − rhoRequired (both biaxial); null when either is null */
  readonly chartMinusExact: number | null;
}

export interface ColumnCheck {
  readonly basis: Basis;
  readonly units: UnitSystem;
  readonly shape: Shape;
  readonly arrangement: Arrangement;
  readonly gamma: number;
  /** γB, outer-column spacing ÷ b, when given (null: the same cover as γ gives on h) */
  readonly gammaB: number | null;
  readonly gammaSource: 'given' | 'bars';
  readonly capContext: CapContext;
  readonly area: number;
  readonly depth: number;
  /** every load, governing first */
  readonly results: readonly ColumnLoadResult[];
  readonly governingId: string | null;
  readonly measure: GoverningMeasure;
  /** why the governing load governs, in words */
  readonly governingWhy: string;
  readonly summary: { readonly total: number; readonly counts: Readonly<Record<LoadStatus, number>>; readonly text: string };
  /** 0 when every load passes, 1 when any fails, is not possible, unstable or outside the scope */
  readonly exitCode: 0 | 1;
  readonly bars: readonly BarProposal[];
  readonly barsSkipped: string | null;
  /** ids of the loads the proposals do not cover (unstable, outside the slenderness method, or beyond the maximum ρg), in input order */
  readonly barsUnmet: readonly string[];
  readonly limits: { readonly min: number; readonly max: number };
  readonly chart: { readonly gammaStep: number; readonly lower: number; readonly upper: number | null; readonly rhos: readonly number[] };
  /** the biaxial sheets read for loads with Muy (axial-level step, moment-direction step of the drawn contours); null when none are read */
  readonly biaxialChart: { readonly axialStep: number; readonly angleStepDeg: number; readonly rhos: readonly number[] } | null;
  readonly checked: { readonly kind: 'rho' | 'layout'; readonly rho: number; readonly description: string; readonly bars: readonly Bar[] } | null;
  readonly slenderness: SlendernessRequest | null;
  /** how proposals placed their bars, and the aggregate size for the spacing rule (null: no proposals asked) */
  readonly barSelection: { readonly detailing: Detailing['kind']; readonly aggregate: number | null } | null;
  /** a load has Muy */
  readonly biaxial: boolean;
  readonly variants: readonly VariantInfo[];
  readonly notes: readonly string[];
  /** detailing of the given reinforcement: the rules that do not depend on the load (each load's `findings` adds the steel ratio), and the aggregate the spacing rule assumed */
  readonly detailing: { readonly findings: readonly RuleFinding[]; readonly aggregate: number; readonly aggregateAssumed: boolean };
}

// ───────────────────────────── section variants ─────────────────────────────

interface Variant extends VariantInfo {
  map: (bars: readonly Bar[]) => Bar[];
}

const turn = (deg: number) => {
  const t = (deg * Math.PI) / 180;
  const c = Math.cos(t);
  const s = Math.sin(t);
  return (bars: readonly Bar[]): Bar[] => bars.map((b) => ({ x: b.x * c - b.y * s, y: b.x * s + b.y * c, area: b.area }));
};

/** Ring orientations sampled over half a bar pitch (the capacity repeats every pitch and is even about 0 and π/n). */
const RING_TURNS = 4;

/**
 * Largest direction step of the exact ring search, degrees. In trials (4–10 bars, ρg 0.01–0.06, γ 0.6–0.8, the four
 * bases, 1,440 load directions) 1° steps with the golden-section refinement stayed within 0.1 % of a 600-step sweep
 * over half a pitch; 2.5° steps did not.
 */
const RING_SEARCH_STEP_DEG = 1;

/** The directions of the exact ring search: 0 (a bar at the compression extreme) to half a pitch (a mid-gap) inclusive. */
export function ringSearchTurns(bars: number): number[] {
  const half = 180 / bars;
  const k = Math.max(RING_TURNS, Math.ceil(half / RING_SEARCH_STEP_DEG));
  return Array.from({ length: k + 1 }, (_, i) => (i * half) / k);
}

/**
 * The layouts a load can meet. A ring in a circle can be loaded in any direction relative to its bars:
 * orientations over half a pitch, the weakest governs. Any other layout not symmetric about the bending
 * axis meets a negative moment as its mirror image. Symmetric layouts have one variant.
 */
export function sectionVariants(shape: Shape, arrangement: Arrangement, gamma: number, gammaB?: number, checked?: { readonly arrangement: Arrangement; readonly bars: readonly Bar[] }): Variant[] {
  if (shape.kind === 'circle' && arrangement.kind === 'ring' && (!checked || checked.arrangement.kind === 'ring')) {
    const pitch = 360 / arrangement.bars;
    return Array.from({ length: RING_TURNS + 1 }, (_, k) => {
      const deg = (k * pitch) / (2 * RING_TURNS);
      return { label: k === 0 ? 'ring with a bar at the compression extreme' : `ring turned ${fmtDeg(deg)}° from a bar at the compression extreme`, sign: 0 as const, turnDeg: deg, map: turn(deg) };
    });
  }
  const bars = layoutBars(shape, arrangement, 1, layoutOptions(gamma, gammaB));
  // the checked bars (a given layout) have their own symmetry: both must be symmetric for one variant
  const symmetric = symmetricAboutBendingAxis(bars, sectionDepth(shape)) && (!checked || symmetricAboutBendingAxis(checked.bars, sectionDepth(shape)));
  if (symmetric) return [{ label: 'as drawn', sign: 0, turnDeg: 0, map: (b) => [...b] }];
  return [
    { label: 'branch with compression on the +y face', sign: 1, turnDeg: 0, map: (b) => [...b] },
    { label: 'branch with compression on the −y face', sign: -1, turnDeg: 0, map: mirroredBars },
  ];
}

const fmtDeg = (d: number): string => String(Number(d.toFixed(2)));

/**
 * true when the bars are symmetric about the bending plane (x → −x for bending about x): only then does the
 * neutral axis stay parallel to the bending axis under a moment about that axis alone. Otherwise the exact
 * biaxial search (analysis/biaxial.ts) finds the inclined neutral axis.
 */
export function symmetricAboutBendingPlane(bars: readonly Bar[], depth: number): boolean {
  return symmetricAboutBendingAxis(swapAxes(bars), depth);
}

/** The bars seen for bending about y: x and y swapped (a reflection; the y-axis check's section). */
const swapAxes = (bars: readonly Bar[]): Bar[] => bars.map((b) => ({ x: b.y, y: b.x, area: b.area }));

/** The shape seen for bending about y: b and h swapped. */
const turnedShape = (shape: Shape): Shape => (shape.kind === 'rectangle' ? { ...shape, b: shape.h, h: shape.b } : shape);

/** The variants of the section turned for bending about y (rings: the same orientations; otherwise the ±x faces). */
function yVariants(shape: Shape, arrangement: Arrangement, unitBars: readonly Bar[], checked?: { readonly arrangement: Arrangement; readonly bars: readonly Bar[] }): Variant[] {
  if (shape.kind === 'circle' && arrangement.kind === 'ring' && (!checked || checked.arrangement.kind === 'ring')) return sectionVariants(shape, arrangement, 0.8 /* unused for rings */).map((v) => ({ ...v, map: (b) => v.map(swapAxes(b)) }));
  const depthY = sectionDepth(turnedShape(shape));
  if (symmetricAboutBendingAxis(swapAxes(unitBars), depthY) && (!checked || symmetricAboutBendingAxis(swapAxes(checked.bars), depthY))) return [{ label: 'as drawn, about y', sign: 0, turnDeg: 0, map: swapAxes }];
  return [
    { label: 'branch with compression on the +x face', sign: 1, turnDeg: 0, map: swapAxes },
    { label: 'branch with compression on the −x face', sign: -1, turnDeg: 0, map: (b) => mirroredBars(swapAxes(b)) },
  ];
}

/** Layout options of γ and, when given, γB (layoutBars' gammaX). */
const layoutOptions = (gamma: number, gammaB: number | undefined): LayoutOptions => (gammaB === undefined ? { gamma } : { gamma, gammaX: gammaB });

// ───────────────────────────── prepared context ─────────────────────────────

interface PreparedVariant {
  info: Variant;
  /** smeared bars at γ, ρg = 1 */
  table: RayTable;
  /** the checked reinforcement (given ρg or layout), or null */
  checked: RayTable | null;
}

export interface ColumnCheckContext {
  readonly input: ColumnCheckInput;
  readonly basis: Basis;
  readonly area: number;
  readonly depth: number;
  readonly capContext: CapContext;
  readonly variants: readonly PreparedVariant[];
  /** chart sheets for the readings; null when readings are not wanted (proposal verification) */
  readonly charts: ChartSet | null;
  /** biaxial sheets for the readings of loads with Muy; null when readings are off or no load has Muy */
  readonly biaxialCharts: BiaxialCharts | null;
  readonly checkedRho: number | null;
  /** the checked bars, actual areas and positions (as drawn) */
  readonly checkedBars: Bar[] | null;
  /** bar positions from γ and the arrangement (areas adding to Ag), for slenderness steps before bars are chosen */
  readonly positionBars: Bar[];
  /** biaxial surface of the checked bars */
  readonly checkedBiaxial: BiaxialSection | null;
  readonly biaxial: boolean;
  /** the bars are symmetric about the bending plane (x → −x): the uniaxial check about x is exact */
  readonly planeSymmetric: boolean;
  /** the bars are symmetric about the x axis (y → −y): the uniaxial check about y alone is exact */
  readonly axisSymmetric: boolean;
  /** the section turned for bending about y, prepared on first use */
  readonly yAxis: () => YAxisContext;
  /** detailing findings of the given reinforcement that do not depend on the load (empty when none is given) */
  readonly detailing: readonly RuleFinding[];
  /**
   * A ring in a circle: the directions of the exact search (degrees from a bar at the compression extreme, 0 to half
   * a pitch in steps of at most RING_SEARCH_STEP_DEG). A ring turned off a bar or a mid-gap is not symmetric about
   * the bending plane, so its capacity needs the exact search; empty for other layouts.
   */
  readonly ringTurns: readonly number[];
}

/** The section as the y-axis check sees it: b and h swapped, bars swapped, its variants. */
export interface YAxisContext {
  readonly shape: Shape;
  readonly depth: number;
  readonly variants: readonly PreparedVariant[];
}

/** Prepares everything shared by every load: variants, ray tables, chart sheets, the biaxial surface. */
export function prepareColumnCheck(input: ColumnCheckInput, opts: { readings?: boolean } = {}): ColumnCheckContext {
  const readings = opts.readings ?? true;
  const { basis, shape } = input;
  const area = grossArea(shape);
  const depth = sectionDepth(shape);
  const capContext = input.capContext ?? {};
  const at = layoutOptions(input.gamma, input.gammaB);
  const unit = layoutBars(shape, input.arrangement, 1, at);
  const checkedBars = input.layout
    ? layoutBars(shape, input.layout.arrangement, input.layout.area, layoutOptions(input.layout.gamma, input.gammaB))
    : input.rho !== undefined
      ? layoutBars(shape, input.arrangement, input.rho * area, at)
      : null;
  const checkedRho = input.layout ? input.layout.area / area : (input.rho ?? null);
  const chartReq = (arrangement: Arrangement) =>
    buildChartSet({ basis, shape, arrangement, gamma: input.gamma, ...(input.gammaB !== undefined ? { gammaB: input.gammaB } : {}), capContext, rhoLimits: basis.rhoLimits, ...(input.chartGammaStep !== undefined ? { gammaStep: input.chartGammaStep } : {}) });
  const charts = readings ? chartReq(input.arrangement) : null;
  // the symmetry of the bars checked, not only of the arrangement the sheets are drawn for
  const checkedLayout = checkedBars ? { arrangement: input.layout?.arrangement ?? input.arrangement, bars: checkedBars } : undefined;
  const variants = sectionVariants(shape, input.arrangement, input.gamma, input.gammaB, checkedLayout).map((info): PreparedVariant => {
    const table = tabulate(prepareSection(basis, shape, info.map(unit), capContext), 128);
    const checked = checkedBars ? tabulate(prepareSection(basis, shape, info.map(checkedBars), capContext), 128) : null;
    return { info, table, checked };
  });
  const biaxial = input.loads.some((l) => l.Muy !== undefined);
  const planeSymmetric = symmetricAboutBendingPlane(unit, depth) && (checkedBars === null || symmetricAboutBendingPlane(checkedBars, depth));
  const axisSymmetric = variants.every((v) => v.info.sign === 0) && (checkedBars === null || shape.kind === 'circle' || symmetricAboutBendingAxis(checkedBars, depth));
  // the exact surface serves loads with Muy and the exact search of a layout whose neutral axis inclines about x or y
  // a ring turned off its symmetric orientations (a bar, or a mid-gap, on the bending plane) inclines its neutral axis
  const ringTurns = shape.kind === 'circle' && input.arrangement.kind === 'ring' && variants.some((v) => v.info.turnDeg > 0) ? ringSearchTurns(input.arrangement.bars) : [];
  const checkedBiaxial = checkedBars && (biaxial || !planeSymmetric || !axisSymmetric || ringTurns.length > 0) ? prepareBiaxial(basis, shape, checkedBars, capContext) : null;
  let yAxisCtx: YAxisContext | null = null;
  const yAxis = (): YAxisContext => {
    if (yAxisCtx) return yAxisCtx;
    const shapeY = turnedShape(shape);
    const yv = yVariants(shape, input.arrangement, unit, checkedLayout).map(
      (info): PreparedVariant => ({
        info,
        table: tabulate(prepareSection(basis, shapeY, info.map(unit), capContext), 128),
        checked: checkedBars ? tabulate(prepareSection(basis, shapeY, info.map(checkedBars), capContext), 128) : null,
      }),
    );
    yAxisCtx = { shape: shapeY, depth: sectionDepth(shapeY), variants: yv };
    return yAxisCtx;
  };
  const positionBars = layoutBars(shape, input.arrangement, area, at);
  const biaxialCharts =
    readings && biaxial && input.arrangement.kind !== 'custom'
      ? new BiaxialCharts({
          basis,
          shape,
          arrangement: input.arrangement,
          gamma: input.gamma,
          ...(at.gammaX !== undefined ? { gammaX: at.gammaX } : {}),
          capContext,
          rhoLimits: basis.rhoLimits,
          ...(input.chartAxialStep !== undefined ? { axialStep: input.chartAxialStep } : {}),
        })
      : null;
  const detailing =
    checkedBars && checkedRho !== null
      ? sectionDetailing(
          {
            basis,
            shape,
            arrangement: input.layout?.arrangement ?? input.arrangement,
            gamma: input.layout?.gamma ?? input.gamma,
            ...(input.gammaB !== undefined ? { gammaB: input.gammaB } : {}),
            bars: checkedBars,
            ...(input.detailingInput ? { input: input.detailingInput } : {}),
          },
          checkedRho,
        )
      : [];
  return { input, basis, area, depth, capContext, variants, charts, biaxialCharts, checkedRho, checkedBars, positionBars, checkedBiaxial, biaxial, planeSymmetric, axisSymmetric, yAxis, detailing, ringTurns };
}

// ───────────────────────────── one load ─────────────────────────────

/** Normalised demand of a moment magnitude: P/Ag and M/(Ag·h) (Ag·D for circles). */
const normalise = (Pu: number, M: number, area: number, depth: number): NormalisedLoad => ({ P: Pu / area, M: M / (area * depth) });

interface VariantOutcome {
  v: PreparedVariant;
  req: ReturnType<typeof rhoRequired>;
  strainRho: number;
  cap: ReturnType<typeof capacityAlongRay>;
  strainTable: RayTable;
}

/** Worse of two outcomes: the higher utilisation when reinforcement is given, else the higher ρg required. */
function worse(a: VariantOutcome, b: VariantOutcome, checked: boolean): VariantOutcome {
  if (checked) return b.cap.utilisation > a.cap.utilisation ? b : a;
  const ra = a.req.rho === null ? Infinity : a.req.rho;
  const rb = b.req.rho === null ? Infinity : b.req.rho;
  if (rb !== ra) return rb > ra ? b : a;
  return b.cap.utilisation > a.cap.utilisation ? b : a;
}

/** Exact biaxial ρg required for the bars smeared at γ (bisection on the monotone exact utilisation). */
export function biaxialRhoRequired(
  basis: Basis,
  shape: Shape,
  arrangement: Arrangement,
  gamma: number,
  capContext: CapContext,
  load: { Pu: number; Mux: number; Muy: number },
  limits: { min: number; max: number },
  gammaB?: number,
): { rho: number | null; status: RhoStatus } {
  const area = grossArea(shape);
  const util = (rho: number) => biaxialRay(prepareBiaxial(basis, shape, layoutBars(shape, arrangement, rho * area, layoutOptions(gamma, gammaB)), capContext), load.Pu, load.Mux, load.Muy).utilisation;
  if (util(limits.min) <= 1) return { rho: limits.min, status: 'minimum-governs' };
  if (!(util(limits.max) <= 1)) return { rho: null, status: 'not-possible' };
  let lo = limits.min;
  let hi = limits.max;
  while (hi - lo > 1e-9 * Math.max(1, hi)) {
    const mid = (lo + hi) / 2;
    if (util(mid) <= 1) hi = mid;
    else lo = mid;
  }
  return { rho: hi, status: 'ok' };
}

/** M/P, 0 for no load, null where it is not finite (no axial load, or one too small to divide by). */
function eccentricityRatio(P: number, M: number): number | null {
  if (P === 0 && M === 0) return 0;
  const r = M / P;
  return Number.isFinite(r) ? r : null;
}


/** One variant with the load as it sees it, and the sign of the moment (+1 compresses the + face). */
interface Candidate {
  v: PreparedVariant;
  load: NormalisedLoad;
  sign: 1 | -1;
}

/** What a load demands of the section: slenderness applied, the moment raised to the minimum, the variants it meets. */
interface Demand {
  magnified: MagnifiedLoad | null;
  Mux: number;
  Muy: number | undefined;
  /** false when an unstable magnifier makes the moments unbounded */
  finiteMoments: boolean;
  Mdesign: number;
  /** the moment before the section minimum (magnitude; the resultant for a circle with Muy) */
  Mmag: number;
  raised: boolean;
  /** the moment's sign is free: raised to a minimum, a minimum (accidental) moment governs the slenderness, or Mux = 0 */
  signFree: boolean;
  /** the signs of the moment about x checked (+1 compresses the +y face) */
  signs: (1 | -1)[];
  n: NormalisedLoad;
  limits: { min: number; max: number };
  /** each variant with the load as it sees it (M signed for the two branches of an unsymmetric layout) */
  candidates: Candidate[];
  unsymmetric: boolean;
  /** the check about y alone; null where nothing about y is checked alone */
  y: YDemand | null;
}

/** The demand about y alone (one axis at a time). */
interface YDemand {
  /** moment about y after slenderness, magnitude, before the section minimum */
  Mu: number;
  minimum: number;
  Mdesign: number;
  raised: boolean;
  n: NormalisedLoad;
  candidates: Candidate[];
  axis: YAxisContext;
}

function demandOf(ctx: ColumnCheckContext, load: FactoredLoad): Demand {
  const { basis, area, depth, input } = ctx;
  // 1. slenderness about both axes: magnified moments keep their signs
  let magnified: MagnifiedLoad | null = null;
  let Mux = load.Mu;
  let Muy = load.Muy;
  if (input.slenderness) {
    // without bars, positions from γ and the arrangement (EN 1992-1-1 5.8.8.3(2) needs d and is before bars are chosen)
    const bars = ctx.checkedBars ?? ctx.positionBars;
    magnified = magnifyLoad(basis, input.shape, bars, { Pu: load.Pu, Mux: load.Mu, Muy: load.Muy ?? 0, ...endMoments(load), ...(load.betaDns !== undefined ? { betaDns: load.betaDns } : {}) }, input.slenderness, ctx.checkedBars === null);
    Mux = magnified.Mux;
    // a load without Muy stays uniaxial: its y slenderness feeds the check about y alone
    if (load.Muy !== undefined) Muy = magnified.Muy;
  }
  // an unstable magnifier gives unbounded moments: no section check applies (the status says why)
  const finiteMoments = Number.isFinite(Mux) && (Muy === undefined || Number.isFinite(Muy));

  // 2. uniaxial, every variant the sign or orientation can load
  const minimum = basis.minimumMoment(load.Pu, depth);
  // a circle has no preferred axis: its resultant moment acts on the weakest orientation
  const resultant = input.shape.kind === 'circle' && Muy !== undefined ? Math.hypot(Mux, Muy) : Math.abs(Mux);
  const Mmag = finiteMoments ? resultant : 0;
  const Mdesign = Math.max(Mmag, minimum);
  const raised = Mdesign > Mmag;
  const n = normalise(load.Pu, Mdesign, area, depth);
  // an unsymmetric layout is one closed curve of two branches: the load, with its sign, meets one of them.
  // A minimum moment is an accidental eccentricity and acts either way: where one governs (the basis minimum
  // raised the moment, or the slenderness method's minimum set it) both signs are taken; symmetric layouts and rings see |M|
  const unsymmetric = ctx.variants.some((v) => v.info.sign !== 0);
  const signFree = raised || Mux === 0 || (magnified?.minimum.x.governs ?? false);
  const signs: (1 | -1)[] = !unsymmetric ? [1] : signFree ? [1, -1] : [Mux < 0 ? -1 : 1];
  const candidates = signs.flatMap((sg) => ctx.variants.map((v): Candidate => ({ v, sign: sg, load: { P: n.P, M: v.info.sign === -1 ? -sg * n.M : sg * n.M } })));
  const y = finiteMoments ? yDemandOf(ctx, load, magnified, Muy) : null;
  return { magnified, Mux, Muy, finiteMoments, Mdesign, Mmag, raised, signFree, signs, n, limits: rhoLimitsFor(basis, load.Pu, area), candidates, unsymmetric, y };
}

/**
 * Bending about y alone at the same Pu (ACI 318-19 R6.6.4.5.4, EN 1992-1-1 5.8.9: minimum moments act about one
 * axis at a time): the moment about y after the y slenderness (0 for a load without Muy), raised to the basis
 * minimum about y. A load with Muy is checked with Mux and Muy together (biaxial), and about y alone only where
 * the section minimum raises its Muy. Both signs: the moment is accidental. Null where there is nothing to check.
 */
function yDemandOf(ctx: ColumnCheckContext, load: FactoredLoad, magnified: MagnifiedLoad | null, Muy: number | undefined): YDemand | null {
  const { basis, area, input } = ctx;
  const yMag = magnified?.y ? magnified.y.magnifiedMoment : Math.abs(load.Muy ?? 0);
  // an unstable magnifier about y: the status says so, no section check applies
  if (!Number.isFinite(yMag)) return null;
  const minimum = basis.minimumMoment(load.Pu, sectionDepth(turnedShape(input.shape)));
  const Mdesign = Math.max(Math.abs(yMag), minimum);
  if (!(Mdesign > 0)) return null;
  if (load.Muy !== undefined && !(Mdesign > Math.abs(Muy ?? 0) * (1 + 1e-9))) return null;
  const axis = ctx.yAxis();
  const n = normalise(load.Pu, Mdesign, area, axis.depth);
  const signs: (1 | -1)[] = axis.variants.some((v) => v.info.sign !== 0) ? [1, -1] : [1];
  const candidates = signs.flatMap((sg) => axis.variants.map((v): Candidate => ({ v, sign: sg, load: { P: n.P, M: v.info.sign === -1 ? -sg * n.M : sg * n.M } })));
  return { Mu: Math.abs(yMag), minimum, Mdesign, raised: Mdesign > Math.abs(yMag), n, candidates, axis };
}

/**
 * Utilisation of the checked reinforcement for one load with every effect: the worst variant about x and about y
 * alone (screened on the ray tables when `exact` is false), the exact search where the neutral axis inclines, and
 * the exact biaxial capacity where Muy is given. Infinity when the load is unstable or outside the slenderness method.
 */
function checkedUtilisation(ctx: ColumnCheckContext, load: FactoredLoad, exact: boolean): number {
  const d = demandOf(ctx, load);
  const bad = d.magnified && (!d.magnified.x.ok || (d.magnified.y && !d.magnified.y.ok));
  if (bad || !d.finiteMoments) return Infinity;
  let u = 0;
  for (const { v, load: l } of d.candidates) u = Math.max(u, capacityAlongRay(v.checked!, ctx.checkedRho!, l, exact).utilisation);
  if (d.y) for (const { v, load: l } of d.y.candidates) u = Math.max(u, capacityAlongRay(v.checked!, ctx.checkedRho!, l, exact).utilisation);
  if (exact && d.Muy !== undefined && ctx.checkedBiaxial) u = Math.max(u, biaxialRay(ctx.checkedBiaxial, load.Pu, d.Mux, d.Muy).utilisation);
  if (exact) {
    const ex = exactSearches(ctx, load.Pu, d);
    u = Math.max(u, ex.x?.utilisation ?? 0, ex.y?.utilisation ?? 0);
  }
  return u;
}

/**
 * The exact biaxial search of one axis's moment alone (the other 0), for a layout not symmetric about that
 * bending plane: its neutral axis inclines, so the uniaxial curve (neutral axis parallel to the axis) is not the
 * capacity. Checked reinforcement: the largest exact utilisation over the signs; else the largest exact ρg required.
 */
function exactAlone(ctx: ColumnCheckContext, Pu: number, axis: 'x' | 'y', M: number, signs: readonly (1 | -1)[], limits: { min: number; max: number }): ExactUniaxial {
  const { basis, input } = ctx;
  const vec = (sg: number) => (axis === 'x' ? { Mux: sg * M, Muy: 0 } : { Mux: 0, Muy: sg * M });
  if (ctx.checkedBiaxial) {
    let best: ReturnType<typeof biaxialRay> | null = null;
    for (const sg of signs) {
      const m = vec(sg);
      const r = biaxialRay(ctx.checkedBiaxial, Pu, m.Mux, m.Muy);
      if (!best || r.utilisation > best.utilisation) best = r;
    }
    // inclination of the neutral axis from the bending axis (θ = 0 about x, π/2 about y), degrees in (−180, 180]
    const deg = ((best!.point.theta - (axis === 'x' ? 0 : Math.PI / 2)) * 180) / Math.PI;
    const wrapped = deg - 360 * Math.ceil((deg - 180) / 360);
    return { utilisation: best!.utilisation, rhoRequired: null, rhoStatus: null, signs, neutralAxisAngleDeg: wrapped };
  }
  let rho = -Infinity;
  let status: RhoStatus = 'minimum-governs';
  for (const sg of signs) {
    const r = biaxialRhoRequired(basis, input.shape, input.arrangement, input.gamma, ctx.capContext, { Pu, ...vec(sg) }, limits, input.gammaB);
    if (r.rho === null) return { utilisation: null, rhoRequired: null, rhoStatus: 'not-possible', signs, neutralAxisAngleDeg: null };
    if (r.rho > rho) {
      rho = r.rho;
      status = r.status;
    }
  }
  return { utilisation: null, rhoRequired: rho, rhoStatus: status, signs, neutralAxisAngleDeg: null };
}

/**
 * The exact search of a ring over the directions of a moment relative to its bars: the actual ring (a bar at the
 * compression extreme as drawn) under the moment M turned by each direction in ctx.ringTurns (steps of at most
 * RING_SEARCH_STEP_DEG over half a bar pitch), the neutral axis free to incline, then a golden-section refinement
 * around the weakest step. The ring is even about a bar and about a mid-gap, so the direction's sign does not matter.
 * Checked reinforcement: the largest exact utilisation found; else the exact ρg required at the weakest sampled
 * orientations and at the weakest direction found at that ρg (bars smeared at γ).
 */
function exactRing(ctx: ColumnCheckContext, Pu: number, M: number, limits: { min: number; max: number }): ExactUniaxial {
  const { basis, input } = ctx;
  const vec = (deg: number) => ({ Mux: M * Math.cos((deg * Math.PI) / 180), Muy: M * Math.sin((deg * Math.PI) / 180) });
  if (ctx.checkedBiaxial) {
    const sec = ctx.checkedBiaxial;
    const worst = weakestDirection(ctx.ringTurns, (deg) => {
      const m = vec(deg);
      return biaxialRay(sec, Pu, m.Mux, m.Muy);
    });
    // inclination of the neutral axis from the turned bending axis, degrees in (−180, 180]
    const deg = (worst.r.point.theta * 180) / Math.PI - worst.deg;
    const wrapped = deg - 360 * Math.ceil((deg - 180) / 360);
    return { utilisation: worst.r.utilisation, rhoRequired: null, rhoStatus: null, signs: [1], neutralAxisAngleDeg: wrapped };
  }
  // ρg required: the weakest direction barely moves with ρg, so it is found at one ρg (the largest required at the
  // coarse orientations) and the ρg required there is added to the coarse ones
  const coarse = ringCoarseTurns(ctx.ringTurns);
  let rho = -Infinity;
  let status: RhoStatus = 'minimum-governs';
  const take = (deg: number): boolean => {
    const r = biaxialRhoRequired(basis, input.shape, input.arrangement, input.gamma, ctx.capContext, { Pu, ...vec(deg) }, limits, input.gammaB);
    if (r.rho === null) return false;
    if (r.rho > rho) {
      rho = r.rho;
      status = r.status;
    }
    return true;
  };
  const notPossible: ExactUniaxial = { utilisation: null, rhoRequired: null, rhoStatus: 'not-possible', signs: [1], neutralAxisAngleDeg: null };
  for (const deg of coarse) if (!take(deg)) return notPossible;
  const area = grossArea(input.shape);
  const sec = prepareBiaxial(basis, input.shape, layoutBars(input.shape, input.arrangement, rho * area, layoutOptions(input.gamma, input.gammaB)), ctx.capContext);
  const worst = weakestDirection(ctx.ringTurns, (deg) => {
    const m = vec(deg);
    return biaxialRay(sec, Pu, m.Mux, m.Muy);
  });
  if (!take(worst.deg)) return notPossible;
  return { utilisation: null, rhoRequired: rho, rhoStatus: status, signs: [1], neutralAxisAngleDeg: null };
}

/** Golden-section iterations of the ring direction refinement (the bracket shrinks to 0.618¹² ≈ 0.3 % of two steps). */
const RING_REFINE_ITERATIONS = 12;

/**
 * The direction of largest utilisation: every sampled direction, then a golden-section search on the two steps
 * around the worst sample. The largest utilisation seen anywhere is returned, so the refinement can only raise it.
 */
function weakestDirection(turns: readonly number[], at: (deg: number) => ReturnType<typeof biaxialRay>): { deg: number; r: ReturnType<typeof biaxialRay> } {
  let best: { deg: number; r: ReturnType<typeof biaxialRay> } | null = null;
  const see = (deg: number) => {
    const r = at(deg);
    if (!best || r.utilisation > best.r.utilisation) best = { deg, r };
    return r.utilisation;
  };
  let k = 0;
  let top = -Infinity;
  for (let i = 0; i < turns.length; i++) {
    const u = see(turns[i]!);
    if (u > top) {
      top = u;
      k = i;
    }
  }
  // the search minimises −u; `see` keeps the largest utilisation seen, so the refinement can only raise it
  goldenSection((x) => -see(x), turns[Math.max(0, k - 1)]!, turns[Math.min(turns.length - 1, k + 1)]!, (_l, _h, step) => step >= RING_REFINE_ITERATIONS);
  return best!;
}

/** Every fourth-of-a-half-pitch direction of a ring search (bar, quarter, mid, …): the coarse orientations of the ρg search. */
function ringCoarseTurns(turns: readonly number[]): number[] {
  const half = turns[turns.length - 1]!;
  return [1, 2, 3].map((k) => (k * half) / 4);
}

/**
 * The exact searches a load needs: about x where the layout is not symmetric about the bending plane, about y alone
 * where it is not symmetric about the x axis, and about each axis at a ring's turned orientations.
 */
function exactSearches(ctx: ColumnCheckContext, Pu: number, d: Demand): { x: ExactUniaxial | null; y: ExactUniaxial | null } {
  if (!d.finiteMoments) return { x: null, y: null };
  if (ctx.ringTurns.length > 0) {
    return { x: d.Mdesign > 0 ? exactRing(ctx, Pu, d.Mdesign, d.limits) : null, y: d.y ? exactRing(ctx, Pu, d.y.Mdesign, d.limits) : null };
  }
  const x = !ctx.planeSymmetric && d.Mdesign > 0 ? exactAlone(ctx, Pu, 'x', d.Mdesign, d.signs, d.limits) : null;
  const y = d.y && !ctx.axisSymmetric ? exactAlone(ctx, Pu, 'y', d.y.Mdesign, [1, -1], d.limits) : null;
  return { x, y };
}

/** The governing variant of a set of candidates, with every sign's worst measure (utilisation, or ρg required). */
function governingOf(ctx: ColumnCheckContext, candidates: readonly Candidate[], limits: { min: number; max: number }): { g: VariantOutcome; bySign: Map<1 | -1, number> } {
  const checked = ctx.checkedRho !== null;
  let gov: VariantOutcome | null = null;
  const bySign = new Map<1 | -1, number>();
  for (const { v, load: l, sign } of candidates) {
    const req = rhoRequired(v.table, l, limits);
    const strainRho = checked ? ctx.checkedRho! : (req.rho ?? limits.max);
    const strainTable = v.checked ?? v.table;
    const cap = capacityAlongRay(strainTable, strainRho, l);
    const o = { v, req, strainRho, cap, strainTable };
    gov = gov ? worse(gov, o, checked) : o;
    const m = checked ? cap.utilisation : (req.rho ?? Infinity);
    bySign.set(sign, Math.max(bySign.get(sign) ?? -Infinity, m));
  }
  return { g: gov!, bySign };
}

/** The whole result for one load. */
export function checkOneLoad(ctx: ColumnCheckContext, load: FactoredLoad, index: number): ColumnLoadResult {
  const { basis, area, depth, input } = ctx;
  const notes: LoadNote[] = [];
  const d = demandOf(ctx, load);
  const { magnified, Mux, Muy, finiteMoments, Mdesign, raised, n, limits, candidates, unsymmetric } = d;
  const checked = ctx.checkedRho !== null;
  const { g, bySign } = governingOf(ctx, candidates, limits);
  // the sheets of an unsymmetric layout draw both branches: read them with the signed moment
  const chartM = unsymmetric && Mux < 0 ? -n.M : n.M;
  const chartSet = ctx.charts;
  const reading = chartSet ? withMinimum(readCharts(chartSet, { P: n.P, M: chartM }), limits.min, chartSet.rhos) : { rhoFromChart: null, rhoRoundedDown: null, sheets: [] };
  if (g.req.status === 'not-possible') notes.push({ kind: 'rho-not-possible', rhoMax: limits.max });
  if (g.req.status === 'minimum-governs') notes.push({ kind: 'rho-minimum-governs', rhoMin: limits.min });
  if (g.req.governedBy === 'cap') notes.push({ kind: 'cap-governs-rho' });
  if (raised) notes.push({ kind: 'moment-raised', bothSigns: unsymmetric });
  else if (unsymmetric && Mux !== 0 && d.signs.length === 2) notes.push({ kind: 'method-minimum-both-signs' });
  if (g.v.info.turnDeg !== 0) notes.push({ kind: 'weakest-orientation', turnDeg: g.v.info.turnDeg });
  if (g.v.info.sign === -1) notes.push({ kind: 'negative-branch-governs' });
  if (chartSet && reading.rhoFromChart === null) notes.push({ kind: 'off-charts' });
  if (input.shape.kind === 'circle' && Muy !== undefined) notes.push({ kind: 'circle-resultant' });
  const s = strainReport(g.strainTable, g.cap);
  const zero = n.P === 0 && n.M === 0;

  // 3. biaxial
  let biaxial: ColumnLoadResult['biaxial'] = null;
  if (Muy !== undefined && finiteMoments) {
    const bl = { Pu: load.Pu, Mux, Muy };
    const chart = biaxialChartFields(ctx, bl, limits.min);
    const withChart = (rhoRequired: number | null) => ({ ...chart, chartMinusExact: rhoRequired === null || chart.rhoFromChart === null ? null : chart.rhoFromChart - rhoRequired });
    if (ctx.checkedBiaxial) {
      biaxial = { ...checkBiaxial(ctx.checkedBiaxial, bl), rhoRequired: null, rhoStatus: null, ...withChart(null) };
    } else if (input.shape.kind === 'circle') {
      biaxial = { rhoRequired: g.req.rho, rhoStatus: g.req.status, ...withChart(g.req.rho) };
    } else {
      const r = biaxialRhoRequired(basis, input.shape, input.arrangement, input.gamma, ctx.capContext, bl, limits, input.gammaB);
      biaxial = { rhoRequired: r.rho, rhoStatus: r.status, ...withChart(r.rho) };
    }
  }

  // 3b. about y alone, and the exact searches of layouts whose neutral axis inclines
  const ex = exactSearches(ctx, load.Pu, d);
  let yAxis: YAxisCheck | null = null;
  let yBySign: Map<1 | -1, number> | null = null;
  if (d.y) {
    const yo = governingOf(ctx, d.y.candidates, limits);
    yBySign = yo.bySign;
    const yg = yo.g;
    yAxis = {
      Mu: d.y.Mu,
      minimum: d.y.minimum,
      Mdesign: d.y.Mdesign,
      depth: d.y.axis.depth,
      normalised: { P: d.y.n.P, M: d.y.n.M },
      rhoRequired: yg.req.rho,
      rhoStatus: yg.req.status,
      utilisation: checked ? yg.cap.utilisation : null,
      capacity: checked && !(d.y.n.P === 0 && d.y.n.M === 0) ? { P: yg.cap.P * area, M: yg.cap.M * area * d.y.axis.depth } : null,
      variant: { label: yg.v.info.label, sign: yg.v.info.sign, turnDeg: yg.v.info.turnDeg },
      exact: ex.y,
    };
    if (d.y.raised) notes.push({ kind: 'y-moment-raised' });
  }
  if (ex.x) notes.push({ kind: 'exact-search', cause: ctx.ringTurns.length > 0 ? 'ring-turned' : 'unsymmetric' });

  // 4. status and measure: the largest of every figure
  const utilisation = checked ? g.cap.utilisation : null;
  const biaxialUtil = biaxial?.exact?.utilisation ?? null;
  const biaxialRho = biaxial && biaxial.rhoStatus !== null ? (biaxial.rhoRequired ?? Infinity) : null;
  const uniRho = g.req.rho ?? Infinity;
  const exactMeasure = (e: ExactUniaxial | null): number => (e === null ? 0 : checked ? (e.utilisation ?? 0) : e.rhoStatus === 'not-possible' ? Infinity : (e.rhoRequired ?? 0));
  const parts: [MeasureSource, number][] = [
    ['x', checked ? utilisation! : uniRho],
    ['x-exact', exactMeasure(ex.x)],
    ['y', yAxis === null ? 0 : checked ? yAxis.utilisation! : (yAxis.rhoRequired ?? Infinity)],
    ['y-exact', exactMeasure(ex.y)],
    ['biaxial', checked ? (biaxialUtil ?? 0) : (biaxialRho ?? 0)],
  ];
  let [measureFrom, measureValue] = parts[0]!;
  for (const [from, v] of parts.slice(1)) {
    if (v > measureValue) {
      measureFrom = from;
      measureValue = v;
    }
  }
  // detailing of the given reinforcement: the section's rules and this load's steel ratio (issue 19 U4)
  const detailingFindings = checked ? [...ctx.detailing, ...loadSteelDetailing(basis, load.Pu, area, ctx.checkedRho!, measureValue)] : [];
  const broken = detailingFindings.find((f) => breaksDetailing(basis, f));
  const st = statusOf({
    magnified,
    checked,
    measureValue,
    measureFrom,
    notPossible: !checked && !Number.isFinite(measureValue),
    finite: finiteMoments,
    limitsMax: limits.max,
    detailing: broken ? { clause: broken.clause } : null,
  });
  const findings = [...findingsOf(ctx, load, d, { bySign, yBySign, exX: ex.x, exY: ex.y, uniX: parts[0]![1], uniY: parts[2]![1] }), ...detailingFindings];

  const unbounded = !finiteMoments;
  return {
    id: load.id,
    index,
    Pu: load.Pu,
    firstOrder: { Mux: load.Mu, Muy: load.Muy ?? null },
    Mu: Mux,
    Mdesign,
    momentRaised: raised,
    Muy: Muy ?? null,
    normalised: { P: n.P, M: n.M, eOverH: eccentricityRatio(n.P, n.M) },
    dimensionless: { P: n.P / basis.normalisingStress, M: n.M / basis.normalisingStress },
    chartM,
    rhoRequired: unbounded ? null : g.req.rho,
    rhoStatus: g.req.status,
    governedBy: g.req.governedBy,
    steelRequired: unbounded || g.req.rho === null ? null : g.req.rho * area,
    rhoFromChart: unbounded ? null : reading.rhoFromChart,
    rhoRoundedDown: unbounded ? null : reading.rhoRoundedDown,
    chartSheets: reading.sheets,
    extraSteelRoundedDown: unbounded || g.req.rho === null || reading.rhoRoundedDown === null ? null : (reading.rhoRoundedDown - g.req.rho) * area,
    strain: { ...s, atRho: g.strainRho, capGoverns: g.cap.capGoverns },
    demandRatio: g.cap.utilisation,
    utilisation: unbounded ? null : utilisation,
    capacity: checked && !zero && !unbounded ? { P: g.cap.P * area, M: g.cap.M * area * depth } : null,
    variant: { label: g.v.info.label, sign: g.v.info.sign, turnDeg: g.v.info.turnDeg },
    variantsChecked: candidates.length,
    slenderness: magnified,
    biaxial,
    ...st,
    statusFinding: st.status === 'detailing' ? (broken ?? null) : null,
    // finite or null: a load beyond any capacity is a status, never ∞
    measureValue: Number.isFinite(measureValue) ? measureValue : null,
    governing: false,
    notes,
    yAxis,
    exactUniaxial: ex.x,
    measureFrom,
    findings,
  };
}

/**
 * The rules applied around the section for one load, as typed findings with the basis's clauses: the minimum
 * moment about each axis (the section minimum, and the slenderness method's minimum on a slender axis), both
 * signs where a minimum governs on an unsymmetric layout (value: the worse sign's measure, limit: the other's),
 * and the exact search where the neutral axis inclines (value: exact measure, limit: the uniaxial one).
 */
function findingsOf(
  ctx: ColumnCheckContext,
  load: FactoredLoad,
  d: Demand,
  f: { bySign: Map<1 | -1, number>; yBySign: Map<1 | -1, number> | null; exX: ExactUniaxial | null; exY: ExactUniaxial | null; uniX: number; uniY: number },
): RuleFinding[] {
  const cl = ctx.basis.checkClauses;
  const out: RuleFinding[] = [];
  if (!cl || !d.finiteMoments) return out;
  const checked = ctx.checkedRho !== null;
  const mx = d.magnified?.minimum.x;
  const my = d.magnified?.minimum.y;
  const minimumX = ctx.basis.minimumMoment(load.Pu, ctx.depth);
  // the minimum about x
  if (cl.minimumMoment && minimumX > 0) {
    out.push({ rule: 'min-moment', clause: cl.minimumMoment, axis: 'x', outcome: d.raised ? 'applied' : 'met', value: d.Mmag, limit: minimumX, quantity: 'moment' });
  }
  if (cl.slenderMinimumMoment && d.magnified && !d.magnified.x.neglected && mx && mx.firstOrder > 0) {
    out.push({ rule: 'min-moment', clause: cl.slenderMinimumMoment, axis: 'x', outcome: mx.governs ? 'applied' : 'met', value: mx.given, limit: mx.firstOrder, quantity: 'moment' });
  }
  // the minimum about y, checked alone
  if (d.y && cl.minimumMoment && d.y.minimum > 0) {
    out.push({ rule: 'min-moment', clause: cl.minimumMoment, axis: 'y', outcome: d.y.raised ? 'applied' : 'met', value: d.y.Mu, limit: d.y.minimum, quantity: 'moment' });
  }
  if (cl.slenderMinimumMoment && d.magnified?.y && !d.magnified.y.neglected && my && my.firstOrder > 0) {
    out.push({ rule: 'min-moment', clause: cl.slenderMinimumMoment, axis: 'y', outcome: my.governs ? 'applied' : 'met', value: my.given, limit: my.firstOrder, quantity: 'moment' });
  }
  // both signs of a governing minimum on an unsymmetric layout
  const signClause = (raisedBySection: boolean) => (raisedBySection ? cl.minimumMoment : cl.slenderMinimumMoment) ?? cl.minimumMoment ?? cl.slenderMinimumMoment;
  const bothSigns = (axis: 'x' | 'y', by: Map<1 | -1, number>, raisedBySection: boolean) => {
    const a = by.get(1);
    const b = by.get(-1);
    const clause = signClause(raisedBySection);
    if (a === undefined || b === undefined || !clause) return;
    out.push({ rule: 'min-moment-sign', clause, axis, outcome: 'applied', value: Math.max(a, b), limit: Math.min(a, b), quantity: 'ratio' });
  };
  if (d.unsymmetric && d.signs.length === 2 && (d.raised || (mx?.governs ?? false))) bothSigns('x', f.bySign, d.raised);
  if (d.y && f.yBySign && f.yBySign.size === 2) bothSigns('y', f.yBySign, d.y.raised);
  // the exact search where the neutral axis inclines
  const exact = (axis: 'x' | 'y', e: ExactUniaxial | null, uni: number) => {
    if (!e) return;
    const v = checked ? e.utilisation : e.rhoStatus === 'not-possible' ? null : e.rhoRequired;
    out.push({ rule: 'exact-section', clause: cl.sectionAnalysis, axis, outcome: 'applied', value: v, limit: Number.isFinite(uni) ? uni : null, quantity: 'ratio' });
  };
  exact('x', f.exX, f.uniX);
  exact('y', f.exY, f.uniY);
  return out;
}

/** The biaxial sheet reading of a load (minimum ρg applied as on the uniaxial readings), or nulls where there are no sheets. */
function biaxialChartFields(ctx: ColumnCheckContext, load: { Pu: number; Mux: number; Muy: number }, rhoMin: number): Omit<BiaxialChartFields, 'chartMinusExact'> {
  if (!ctx.biaxialCharts) return { rhoFromChart: null, chartLevels: [] };
  const r = ctx.biaxialCharts.read(load.Pu, load.Mux, load.Muy);
  return { rhoFromChart: r.rhoFromChart === null ? null : Math.max(r.rhoFromChart, rhoMin), chartLevels: r.levels };
}

/** End moments in either sign convention (ACI M1/M2; EN and CSA M01/M02), as given. */
const END_KEYS = ['M1', 'M2', 'M1y', 'M2y', 'M01', 'M02', 'M01y', 'M02y', 'M2s', 'M1s', 'M2sy', 'M1sy', 'M02s', 'M01s', 'M02sy', 'M01sy', 'Q', 'storeyPu', 'storeyPc'] as const;
const endMoments = (l: FactoredLoad): EndMoments => Object.fromEntries(END_KEYS.filter((k) => l[k] !== undefined).map((k) => [k, l[k]!])) as EndMoments;

/** Status from the checks, worst first: unstable, outside the method's scope, not possible, detailing (a binding rule broken by the given reinforcement), fails. */
function statusOf(x: { magnified: MagnifiedLoad | null; checked: boolean; measureValue: number; measureFrom: MeasureSource; notPossible: boolean; finite: boolean; limitsMax: number; detailing: { clause: string } | null }): {
  status: LoadStatus;
  statusCause: StatusCause;
  statusClause: string | null;
} {
  const axes = x.magnified ? ([['x', x.magnified.x], ['y', x.magnified.y]] as const) : [];
  for (const [axis, s] of axes) {
    if (s && !s.ok && !(s.delta < Infinity)) return { status: 'unstable', statusCause: { kind: 'slenderness', axis, warning: s.warnings[0] ?? null }, statusClause: s.limitClause ?? s.method };
  }
  for (const [axis, s] of axes) {
    if (s && !s.ok) return { status: 'outside-scope', statusCause: { kind: 'slenderness', axis, warning: s.warnings[0] ?? null }, statusClause: s.limitClause ?? s.method };
  }
  if (!x.finite || x.notPossible) return { status: 'not-possible', statusCause: { kind: 'rho-beyond-maximum', rhoMax: x.limitsMax }, statusClause: null };
  if (x.detailing) return { status: 'detailing', statusCause: { kind: 'detailing' }, statusClause: x.detailing.clause };
  if (x.checked && !(x.measureValue <= 1 + 1e-9)) return { status: 'fails', statusCause: { kind: 'utilisation', value: x.measureValue, from: x.measureFrom }, statusClause: null };
  return { status: 'ok', statusCause: { kind: 'none' }, statusClause: null };
}


// ───────────────────────────── all loads ─────────────────────────────

/** Per-load results in input order, one at a time (for streaming views). */
export function* checkColumnLoads(ctxOrInput: ColumnCheckContext | ColumnCheckInput): Generator<ColumnLoadResult, void, undefined> {
  const ctx = 'variants' in ctxOrInput ? ctxOrInput : prepareColumnCheck(ctxOrInput);
  let i = 0;
  for (const l of ctx.input.loads) yield checkOneLoad(ctx, l, i++);
}

/** What ranks a load: its status, its measure, its demand ratio, its input order. */
export type RankKey = Pick<ColumnLoadResult, 'status' | 'measureValue' | 'demandRatio' | 'index'>;

/** Governing first: status (worst first), then the measure, then input order. */
export function governingOrder(a: RankKey, b: RankKey): number {
  return compareRank(STATUS_RANK[a.status], a.measureValue ?? Infinity, a.demandRatio, a.index, STATUS_RANK[b.status], b.measureValue ?? Infinity, b.demandRatio, b.index);
}

/** The ranking on plain numbers (status rank, measure with ∞ for none, demand ratio, index), shared by both orderings. */
function compareRank(sa: number, ma: number, da: number, ia: number, sb: number, mb: number, db: number, ib: number): number {
  const s = sa - sb;
  if (s !== 0) return s;
  if (ma !== mb) return mb > ma ? 1 : -1;
  return db - da || ia - ib;
}

/**
 * Checks every load of a column and proposes bars: the one entry of the check engine.
 * The result is frozen; views format it and add no figure of their own.
 */
export function checkColumn(input: ColumnCheckInput, opts: { readings?: boolean } = {}): ColumnCheck {
  // readings: false leaves out the emulated chart readings (rhoFromChart …), which change no status, measure or ranking
  const ctx = prepareColumnCheck(input, opts);
  const results = [...checkColumnLoads(ctx)].sort(governingOrder).map((r, k) => (k === 0 ? { ...r, governing: true } : r));
  return summarise(ctx, results);
}

/** The fields of a check that no load's result changes: what a view needs to format one load's row. */
export type ColumnCheckFrame = Omit<ColumnCheck, 'results' | 'governingId' | 'governingWhy' | 'summary' | 'exitCode' | 'bars' | 'barsSkipped' | 'barsUnmet'>;
/** The check without its per-load results: what views print around the rows. */
export type ColumnCheckHead = Omit<ColumnCheck, 'results'>;

/** The frame of a check, from its prepared context alone. */
export function describeCheck(ctx: ColumnCheckContext): ColumnCheckFrame {
  const { input, basis } = ctx;
  const measure: GoverningMeasure = ctx.checkedRho !== null ? 'utilisation' : 'rhoRequired';
  const checked =
    ctx.checkedBars === null
      ? null
      : input.layout
        ? { kind: 'layout' as const, rho: ctx.checkedRho!, description: input.layout.description, bars: ctx.checkedBars }
        : { kind: 'rho' as const, rho: ctx.checkedRho!, description: 'given ρg', bars: ctx.checkedBars };
  const notes: string[] = [];
  if (ctx.variants.some((v) => v.info.sign !== 0)) {
    notes.push('The bar layout is not symmetric about the bending axis: its curves have two branches (compression on the +y face, and on the −y face, drawn at M < 0); each load is checked with its sign on the branch its ray meets, and moments keep their signs.');
  }
  if (ctx.variants.some((v) => v.info.turnDeg !== 0)) {
    notes.push(`Ring of bars in a circle: every uniaxial check takes the weakest of ${ctx.variants.length} orientations over half a bar pitch (0° = a bar at the compression extreme).`);
  }
  return {
    basis,
    units: basis.units,
    shape: input.shape,
    arrangement: input.arrangement,
    gamma: input.gamma,
    gammaB: input.gammaB ?? null,
    gammaSource: input.gammaSource ?? 'given',
    capContext: ctx.capContext,
    area: ctx.area,
    depth: ctx.depth,
    measure,
    limits: rhoLimitsFor(basis, 0, ctx.area),
    chart: ctx.charts
      ? { gammaStep: ctx.charts.gammaStep, lower: ctx.charts.lower.gamma, upper: ctx.charts.upper?.gamma ?? null, rhos: ctx.charts.rhos }
      : { gammaStep: 0, lower: 0, upper: null, rhos: [] },
    biaxialChart: ctx.biaxialCharts ? { axialStep: ctx.biaxialCharts.step, angleStepDeg: DEFAULT_ANGLE_STEP_DEG, rhos: ctx.biaxialCharts.rhos } : null,
    checked,
    slenderness: input.slenderness ?? null,
    barSelection: input.barSelection ? { detailing: input.barSelection.detailing.kind, aggregate: input.barSelection.aggregate ?? null } : null,
    biaxial: ctx.biaxial,
    variants: ctx.variants.map((v) => ({ label: v.info.label, sign: v.info.sign, turnDeg: v.info.turnDeg })),
    notes,
    detailing: { findings: ctx.detailing, ...aggregateFields(basis, input.detailingInput) },
  };
}

const aggregateFields = (basis: Basis, input: DetailingInput | undefined) => {
  const a = aggregateOf(basis, input);
  return { aggregate: a.value, aggregateAssumed: a.assumed };
};

/** What the summary and the bar proposals read of every load, gathered one load at a time. */
interface LoadDigest {
  counts: Record<LoadStatus, number>;
  /** input indices of the loads no layout can meet: unstable, outside the slenderness method, or needing more than the maximum ρg */
  unmet: number[];
  /** the largest steel area any load that can be met requires */
  requiredArea: number;
}

const newDigest = (): LoadDigest => ({ counts: Object.fromEntries(LOAD_STATUSES.map((s) => [s, 0])) as Record<LoadStatus, number>, unmet: [], requiredArea: 0 });

/** A load no bar layout within the basis's limits can meet (proposals leave it out and name it). */
const cannotBeMet = (r: ColumnLoadResult): boolean =>
  r.status === 'unstable' || r.status === 'outside-scope' || r.status === 'not-possible' || r.rhoRequired === null || r.biaxial?.rhoStatus === 'not-possible';

function addToDigest(d: LoadDigest, r: ColumnLoadResult, area: number): void {
  d.counts[r.status]++;
  // with no reinforcement given the measure is the largest ρg required (about x, about y alone, exact, biaxial)
  const rhoMeasure = r.utilisation === null && r.status !== 'unstable' && r.status !== 'outside-scope';
  if (cannotBeMet(r) || (rhoMeasure && r.measureValue === null)) d.unmet.push(r.index);
  else d.requiredArea = Math.max(d.requiredArea, r.steelRequired ?? 0, (r.biaxial?.rhoRequired ?? 0) * area, rhoMeasure ? (r.measureValue ?? 0) * area : 0);
}

/** Where the governing figure comes from, when not the uniaxial check about x or the biaxial check. */
const GOVERNING_FROM: Partial<Record<MeasureSource, string>> = {
  'x-exact': '; here the exact search about x',
  y: '; here the check about y alone',
  'y-exact': '; here the exact search about y alone',
};

/** Ranking, bar proposals, summary and exit status for the results of every load. */
export function summarise(ctx: ColumnCheckContext, sorted: readonly ColumnLoadResult[]): ColumnCheck {
  const d = newDigest();
  for (const r of sorted) addToDigest(d, r, ctx.area);
  return deepFreeze(assemble(ctx, d, sorted[0], sorted.length, sorted.map((r) => r.index), sorted));
}

/** The check from the digest of every load; `results` is what the caller holds (every result, or none when streamed). */
function assemble(ctx: ColumnCheckContext, d: LoadDigest, gov: ColumnLoadResult | undefined, total: number, order: ArrayLike<number>, results: readonly ColumnLoadResult[]): ColumnCheck {
  const { input, basis } = ctx;
  const frame = describeCheck(ctx);
  const { measure } = frame;
  const counts = d.counts;
  const bad = total - counts.ok;
  const governingWhy = !gov
    ? 'no loads'
    : gov.status !== 'ok' && gov.status !== 'fails'
      ? // the reason is a fact of the load (statusCause): the views put it in words (report/check-view.ts governingWords)
        `${gov.status}${gov.statusClause ? ` [${gov.statusClause}]` : ''}`
      : measure === 'utilisation'
        ? `highest utilisation ${gov.measureValue === null ? '—' : gov.measureValue.toFixed(3)} (the larger of the uniaxial and exact biaxial figures${GOVERNING_FROM[gov.measureFrom] ?? ''})`
        : `largest ρg required ${gov.measureValue === null ? '—' : gov.measureValue.toFixed(4)}${ctx.biaxial ? ` (the larger of the uniaxial and exact biaxial figures${GOVERNING_FROM[gov.measureFrom] ?? ''})` : GOVERNING_FROM[gov.measureFrom] ? ` (${GOVERNING_FROM[gov.measureFrom]!.slice(2)})` : ''}`;
  const summaryText =
    total === 0
      ? 'no loads'
      : bad === 0
        ? `all ${total} load${total === 1 ? '' : 's'} pass; governing ${gov!.id}`
        : `${bad} of ${total} load${total === 1 ? '' : 's'} ${bad === 1 ? 'does' : 'do'} not pass (${LOAD_STATUSES.filter((s) => s !== 'ok' && counts[s] > 0)
            .map((s) => `${counts[s]} ${s}`)
            .join(', ')}); governing ${gov!.id}`;

  // 6. bar proposals, each re-verified against every load with every effect
  let bars: BarProposal[] = [];
  let barsSkipped: string | null = null;
  const kind = input.arrangement.kind;
  if (!input.barSelection) barsSkipped = 'bar selection not requested';
  else if (!isSelectableKind(kind)) barsSkipped = 'bar selection needs a regular arrangement (two-faces, four-faces, side-faces or ring)';
  else if (total === 0) barsSkipped = 'no loads';
  else if (d.unmet.length === total) barsSkipped = 'no load can be met: each is unstable, outside the slenderness method or needs more than the maximum ρg; change the section or the bracing';
  else {
    // proposals cover the loads that can be met; the others are named in barsUnmet
    const unmet = new Set(d.unmet);
    const met = Array.from(order).filter((i) => !unmet.has(i));
    const limits = met.reduce(
      (acc, i) => {
        const x = basis.steelAreaLimits(input.loads[i]!.Pu, ctx.area);
        return { min: Math.max(acc.min, x.min), max: Math.min(acc.max, x.max) };
      },
      { min: 0, max: Infinity },
    );
    const sel = input.barSelection;
    bars = proposeBars({
      basis,
      shape: input.shape,
      kind,
      detailing: sel.detailing,
      sizes: sel.sizes,
      requiredArea: d.requiredArea,
      areaLimits: limits,
      verify: layoutVerifier(input, met),
      // the spacing rule at the given aggregate, else the basis's stated assumption
      aggregate: sel.aggregate ?? basis.detailing.defaultAggregate,
      ...(input.capContext ? { capContext: input.capContext } : {}),
      ...(sel.count !== undefined ? { count: sel.count } : {}),
    });
    if (bars.length === 0) barsSkipped = 'no single-size layout satisfies the spacing, steel and capacity limits';
  }

  const f = frame;
  // the fields in the order of the ColumnCheck interface
  return {
    basis: f.basis,
    units: f.units,
    shape: f.shape,
    arrangement: f.arrangement,
    gamma: f.gamma,
    gammaB: f.gammaB,
    gammaSource: f.gammaSource,
    capContext: f.capContext,
    area: f.area,
    depth: f.depth,
    results,
    governingId: gov?.id ?? null,
    measure,
    governingWhy,
    summary: { total, counts, text: summaryText },
    exitCode: bad === 0 ? 0 : 1,
    bars,
    barsSkipped,
    barsUnmet: input.barSelection && bars.length > 0 ? [...d.unmet].sort((a, b) => a - b).map((i) => input.loads[i]!.id) : [],
    limits: f.limits,
    chart: f.chart,
    biaxialChart: f.biaxialChart,
    checked: f.checked,
    slenderness: f.slenderness,
    barSelection: f.barSelection,
    biaxial: f.biaxial,
    variants: f.variants,
    notes: f.notes,
    detailing: f.detailing,
  };
}

/**
 * A check held as a ranking instead of as results, for load files too big to hold every result:
 * the same check as `checkColumn` (same ranking, summary and proposals), whose results are computed
 * again, one at a time, in ranked order when a view reads them (the engine is deterministic).
 */
export interface RankedColumnCheck {
  /** the check without its results */
  readonly check: ColumnCheckHead;
  /** the governing load's result (undefined: no loads) */
  readonly governing: ColumnLoadResult | undefined;
  /** every result, governing first, computed again on each call */
  results(): Generator<ColumnLoadResult, void, undefined>;
  /** the id of a load by input index */
  loadId(index: number): string | undefined;
}

/**
 * Checks every load once, keeping per load only its rank keys (numbers in typed arrays), and ranks
 * them: memory stays flat in the number of loads. `visit` sees every result in input order as it is
 * made (views size their columns there). Loads, proposals and summary as in `checkColumn`.
 */
export function rankColumnCheck(ctx: ColumnCheckContext, visit?: (r: ColumnLoadResult) => void): RankedColumnCheck {
  const loads = ctx.input.loads;
  const n = loads.length;
  const status = new Uint8Array(n);
  const measure = new Float64Array(n);
  const demand = new Float64Array(n);
  const d = newDigest();
  for (const r of checkColumnLoads(ctx)) {
    status[r.index] = STATUS_RANK[r.status];
    measure[r.index] = r.measureValue ?? Infinity;
    demand[r.index] = r.demandRatio;
    addToDigest(d, r, ctx.area);
    visit?.(r);
  }
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((a, b) => compareRank(status[a]!, measure[a]!, demand[a]!, a, status[b]!, measure[b]!, demand[b]!, b));
  const at = (k: number): ColumnLoadResult => {
    const i = order[k]!;
    const r = checkOneLoad(ctx, loads[i]!, i);
    return k === 0 ? { ...r, governing: true } : r;
  };
  const governing = n > 0 ? at(0) : undefined;
  const { results: _none, ...check } = assemble(ctx, d, governing, n, order, []);
  return {
    check: deepFreeze(check),
    governing,
    *results() {
      for (let k = 0; k < n; k++) yield k === 0 ? governing! : at(k);
    },
    loadId: (index) => loads[index]?.id,
  };
}

/**
 * Re-verifies candidate layouts: the largest utilisation of the discrete bars over every load, with every
 * effect (slenderness re-run with the candidate's bars, the minimum moment, every sign and orientation
 * variant, the exact biaxial capacity where Muy is given). Loads are tried in `order` (worst first) and the
 * search stops at the first failure, or at the first utilisation above `stopAbove` (default just above 1: a
 * caller comparing candidates passes the best utilisation so far). Unstable or out-of-scope loads count as failing.
 */
export function layoutVerifier(
  input: ColumnCheckInput,
  order?: ArrayLike<number>,
): (arrangement: Arrangement, area: number, gamma: number, stopAbove?: number) => { utilisation: number; index: number } {
  // the candidate's own detailing is the proposer's (bar-selection.ts): the given bars' facts do not apply to it
  const { barSelection: _sel, rho: _rho, layout: _layout, detailingInput: _given, ...rest } = input;
  const indices = order ? Array.from(order) : input.loads.map((_, i) => i);
  return (arrangement, area, gamma, stopAbove = 1 + 1e-9) => {
    const check = prepareColumnCheck({ ...rest, arrangement, gamma, layout: { arrangement, area, gamma, description: '' } }, { readings: false });
    // screen every load on the ray tables (interpolated, biaxial left out), then settle exactly every load
    // within the screening margin of failing, worst first; stop at the first exact failure
    const screened = indices.map((i) => ({ i, u: checkedUtilisation(check, input.loads[i]!, false) }));
    screened.sort((a, b) => b.u - a.u);
    const biaxial = (i: number) => input.loads[i]!.Muy !== undefined;
    let worst = { utilisation: 0, index: indices[0] ?? 0 };
    for (const { i, u: su } of screened) {
      if (su < SCREEN_MARGIN * worst.utilisation && su < SCREEN_MARGIN && !biaxial(i)) continue;
      const u = checkedUtilisation(check, input.loads[i]!, true);
      if (u > worst.utilisation) worst = { utilisation: u, index: i };
      if (u > stopAbove) break;
    }
    return worst;
  };
}

/** Loads screened below this share of the worst exact utilisation (and of 1) need no exact settling. */
const SCREEN_MARGIN = 0.97;

/** Freezes the result's own data; the basis (shared, holds the material laws) and typed arrays are left as they are. */
function deepFreeze<T>(o: T): T {
  if (o && typeof o === 'object' && !Object.isFrozen(o) && !ArrayBuffer.isView(o) && !isBasis(o)) {
    Object.freeze(o);
    for (const v of Object.values(o as object)) deepFreeze(v);
  }
  return o;
}

const isBasis = (o: object): boolean => 'profile' in o && 'design' in o && 'nominal' in o;
