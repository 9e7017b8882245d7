/**
 * One sheet as data: every mark a sheet draws (curves, reference lines, labels, pictogram, lookup
 * table, title block, notes) as rows of named datasets. The vega-lite template (spec.ts) depends only
 * on set-wide choices, so a renderer compiles it once and swaps these datasets per sheet.
 * Plot rows are in chart units (normalised M, P); decoration rows are in points from the plot origin.
 */
import type { Curve, CurveFamily, PointValues } from '../analysis/family.js';
import type { Basis } from '../codes/types.js';
import { describeArrangement, describeShape, describeTransverse, fmt, stressText, gammaText } from '../config/describe.js';
import type { BasisSymbols } from '../codes/types.js';
import { RATIO_SYMBOL, type ResolvedChartSet, type ResolvedSheet } from '../config/types.js';
import { DISPLAY_UNITS } from '../units/index.js';
import { sheetLayout, type Box, type SheetLayout } from './layout.js';
import { columnsFor, lookupTable, shortLabel, type FamilyKind, type LookupTable } from './lookup-table.js';
import { simplifyIndices } from './simplify.js';
import { innerBranch } from '../analysis/inner-branch.js';
import type { BarEntryDrawing } from '../config/schema.js';
import { axesFor, familyExtent, sheetAxes, type AxisExtent, type SheetAxes } from './axes.js';
import { centredBox, estimateText, LabelPlacer, type LabelBox, type MeasureText, type Segment } from './labels.js';
import { AVG_CHAR_EM, COLOURS, curveColour, LINE_KINDS, TEXT_STYLES, type TextStyle } from './style.js';

export interface SheetContext {
  set: ResolvedChartSet;
  sheet: ResolvedSheet;
  family: CurveFamily;
  /** 1-based position of the sheet in its book */
  sheetNumber: number;
  sheetCount: number;
  /** e.g. "pmchart 0.1.0" */
  generator: string;
  /** text widths (node-canvas in Node, a DOM canvas in the browser); default an estimate */
  measureText?: MeasureText;
  /** the extent the axes must cover: the envelope of the sheet's group in a book; default this sheet's curves */
  extent?: AxisExtent;
  /** the office logo (src/sheet/logo.ts makes it from the set's titleBlock.logo); absent: none */
  logo?: LogoRef;
}

export interface CurveRow { curve: string; family: FamilyKind; i: number; M: number; P: number; colour: string }
/** A curve label: centre in chart units; `bold` 1 on the primary family; `knock` its knockout path in points (spec.ts). */
export interface CurveLabelRow { M: number; P: number; text: string; colour: string; bold?: 0 | 1; knock?: string; z: number }
export interface RefRow { line: string; kind: 'strain' | 'ray' | 'cap' | 'zero'; i: number; M: number; P: number }
export interface RefLabelRow { kind: 'strain' | 'ray' | 'cap'; M: number; P: number; text: string; knock?: string; z: number }
export interface FrameRow { M: number; P: number }
export interface TextRow { style: TextStyle; x: number; y: number; text: string; z: number }
export interface RectRow { x: number; y: number; x2: number; y2: number; fill: string; stroke: string; strokeWidth: number; z: number }
export interface RuleRow { x: number; y: number; x2: number; y2: number; stroke: string; strokeWidth: number; z: number }
export interface DotRow { x: number; y: number; size: number; fill: string; z: number }
/** A load drawn on a report plot (chart units); `governing` is 1 for the governing load. */
export interface LoadMarkRow { id: string; M: number; P: number; governing: 0 | 1; z: number }
/** A label of a load mark, placed in points from the plot origin (src/sheet/check-report.ts places them apart). */
export interface LoadLabelRow { x: number; y: number; text: string; governing: 0 | 1; z: number }
/** Further curves on a report plot (chart units), e.g. the curve at the governing load's ρg required. */
export interface ExtraCurveRow { curve: string; i: number; M: number; P: number }
/** An image centred at (x, y), points from the plot origin (the office logo): `url` in SVG output, `raster` on canvas. */
export interface ImageRow { x: number; y: number; url: string; raster: string; z: number }

/**
 * Rows of decoration datasets carry `z`, their drawing order (the vega-lite `order` channel), so the
 * output never depends on the order in which a renderer happened to receive them.
 */
export interface SheetData {
  curves: CurveRow[];
  curveLabels: CurveLabelRow[];
  refs: RefRow[];
  refLabels: RefLabelRow[];
  frame: FrameRow[];
  texts: TextRow[];
  rects: RectRow[];
  rules: RuleRow[];
  dots: DotRow[];
  rings: DotRow[];
  /** report plots only (TemplateParams.overlay) */
  loadMarks?: LoadMarkRow[];
  loadLabels?: LoadLabelRow[];
  extraCurves?: ExtraCurveRow[];
  /** the office logo in the title block (TemplateParams.logo) */
  images?: ImageRow[];
}

/** Set-wide choices the template depends on (a change compiles a new view). */
export interface TemplateParams {
  layout: SheetLayout;
  xTitle: string;
  yTitle: string;
  families: FamilyKind[];
  /**
   * Report plots: fixed axis domains (chart units, so marks and page-point labels line up exactly) and the
   * load-mark layers. Absent on chart sheets.
   */
  overlay?: { domainM: [number, number]; domainP: [number, number]; loadRays?: boolean };
  /** Chart sheets: the axes, each ending at a round value beyond the data (src/chart/axes.ts). */
  axes?: SheetAxes;
  /**
   * Biaxial sheets: small-multiple panels drawn in page points (src/chart/panel-spec.ts); `layout.plot` is
   * the panels area and curve rows hold points from its origin. Absent on P–M sheets.
   */
  panels?: boolean;
  /** the office logo's image size in points (its box in the title block less a margin); absent: no logo */
  logo?: { w: number; h: number };
}

export interface BuiltSheet {
  template: TemplateParams;
  data: SheetData;
  table: LookupTable;
}

/** Largest distance, in page points, between a drawn curve and a computed point it leaves out. */
export const SIMPLIFY_TOLERANCE_PT = 0.08;

const round = (x: number, d = 2): number => Math.round(x * 10 ** d) / 10 ** d;
/** Chart coordinates carry five decimals: ample for print, and short, deterministic JSON. */
const r5 = (x: number): number => Math.round(x * 1e5) / 1e5 + 0;

/** The primary family: the one labelled, tabulated and used for reference lines. */
export const primaryFamily = (set: ResolvedChartSet): FamilyKind => (set.families === 'nominal' ? 'nominal' : 'design');

/** "ν = " where the basis names its dimensionless value, "" otherwise. */
const named = (symbol: string | undefined): string => (symbol ? `${symbol} = ` : '');

/** How the sheet's values are normalised, in one line: "ν = NRd/(fcd·Ag), μ = MRd/(fcd·Ag·h), fcd = 40 MPa". */
export function normalisationText(set: ResolvedChartSet, sy: BasisSymbols, P: string, M: string, normalisingStress: number): string {
  const su = DISPLAY_UNITS[set.units].stress;
  if (set.normalisation !== 'dimensionless') return `${P}/Ag and ${M}/(Ag·h) in ${su}`;
  const ns = sy.normalisingStress;
  return `${named(sy.dimensionlessAxial)}${P}/(${ns}·Ag), ${named(sy.dimensionlessMoment)}${M}/(${ns}·Ag·h), ${ns} = ${stressText(normalisingStress, set.units)}`;
}

export function templateParams(set: ResolvedChartSet, basis: Basis): TemplateParams {
  const layout = sheetLayout(set.paper.widthPt, set.paper.heightPt, set.ratios.values.length);
  const sy = basis.symbols;
  const fam = primaryFamily(set);
  const families: FamilyKind[] = set.families === 'both' ? ['nominal', 'design'] : [fam];
  const axial = set.families === 'both' ? `${sy.nominalAxial}, ${sy.designAxial}` : fam === 'design' ? sy.designAxial : sy.nominalAxial;
  const moment = set.families === 'both' ? `${sy.nominalMoment}, ${sy.designMoment}` : fam === 'design' ? sy.designMoment : sy.nominalMoment;
  const su = DISPLAY_UNITS[set.units].stress;
  const dimless = set.normalisation === 'dimensionless';
  const ns = sy.normalisingStress;
  return {
    layout,
    xTitle: dimless ? `${named(sy.dimensionlessMoment)}${moment} / (${ns} · Ag · h)   (dimensionless)` : `${moment} / (Ag · h)   (${su})`,
    yTitle: dimless ? `${named(sy.dimensionlessAxial)}${axial} / (${ns} · Ag)   (dimensionless)` : `${axial} / Ag   (${su})`,
    families,
  };
}

export function buildSheet(ctx: SheetContext): BuiltSheet {
  const { set, family } = ctx;
  const basis = family.basis;
  const template = templateParams(set, basis);
  const L = template.layout;
  const divisor = set.normalisation === 'dimensionless' ? basis.normalisingStress : 1;
  const table = lookupTable(family, divisor, set.ratios.kind === 'omega' ? set.ratios.values : undefined);
  const primary = primaryFamily(set);
  const data: SheetData = { curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [] };
  const measure = ctx.measureText ?? estimateText;
  const own = familyExtent(family, template.families, divisor);
  // the group's shared scale only where this sheet's curves fill 75 % of it; explicit group axes win
  const axes = sheetAxes(own, ctx.extent, L.plot, ctx.sheet.axes);
  template.axes = axes;

  if (ctx.logo) template.logo = logoInner(L);
  const deco = new Deco(L, data, measure);
  const legend = template.families.length > 1 ? familyLegend(ctx, deco) : undefined;
  plotLayers(ctx, L, template.families, primary, divisor, data, { axes, measure, rayValues: 'border', ...(legend ? { reserved: [legend] } : {}) });
  ehScale(set.referenceLines.eccentricities, axes, deco);
  header(ctx, deco);
  lookupPanel(ctx, table, primary, deco);
  sidePanel(ctx, deco);
  titleBlock(ctx, deco);
  return { template, data, table };
}

/**
 * The e/h scale on the plot border: each ray's value where it meets the top or right edge, with a short
 * tick outside the frame, and "e/h" at the corner.
 */
export function ehScale(eccentricities: readonly number[], axes: SheetAxes, g: Deco): void {
  const { plot: b, u } = g.L;
  const [m0, m1] = axes.M.domain;
  const [p0, p1] = axes.P.domain;
  if (!(p1 > 0)) return;
  const tick = 0.45 * u;
  let any = false;
  const placed: { a: number; b: number; side: 'top' | 'right' }[] = [];
  for (const e of eccentricities) {
    if (!(e > 0)) continue;
    const text = fmt(e);
    const w = g.width('dim', text);
    if (e * p1 <= m1) {
      const x = b.x + ((e * p1 - m0) / (m1 - m0)) * b.w;
      if (placed.some((q) => q.side === 'top' && Math.abs(q.a - x) < (q.b + w) / 2 + 2)) continue;
      placed.push({ a: x, b: w, side: 'top' });
      g.rule(x, b.y - tick, x, b.y, COLOURS.ray, 0.7);
      g.text('dim', x, b.y - tick - 0.25 * u, text);
    } else {
      const y = b.y + ((p1 - m1 / e) / (p1 - p0)) * b.h;
      if (placed.some((q) => q.side === 'right' && Math.abs(q.a - y) < 1.1 * g.size('dimLeft'))) continue;
      placed.push({ a: y, b: w, side: 'right' });
      g.rule(b.x + b.w, y, b.x + b.w + tick, y, COLOURS.ray, 0.7);
      g.text('dimLeft', b.x + b.w + tick + 0.2 * u, y + 0.3 * g.size('dimLeft'), text);
    }
    any = true;
  }
  // the scale's name above the top-left corner, clear of the values
  if (any) g.text('dim', b.x - 0.4 * u - g.width('dim', 'e/h') / 2, b.y - tick - 0.25 * u, 'e/h');
}

/**
 * With both families drawn: a key in the plot's top-right corner pairing each design curve (solid) with
 * its nominal curve (dashed and lighter in weight, the same colour). Returns its box in points from the plot origin.
 */
function familyLegend(ctx: SheetContext, g: Deco): LabelBox {
  const { plot: b, u } = g.L;
  const sy = ctx.family.basis.symbols;
  const n = ctx.family.curves.length;
  const line = 1.15 * g.size('body');
  const sw = 2.6 * u;
  const keyW = Math.max(...ctx.family.curves.map((c, k) => g.width('body', curveKeyText(ctx.set, c.rho, k))));
  const head = `solid ${sy.designFamily} · dashed ${sy.nominalFamily} (labels ending n)`;
  const w = Math.max(keyW + 2 * sw + 2.4 * u, g.width('caption', head)) + 1.6 * u;
  const h = (n + 1.4) * line + 0.8 * u;
  const x = b.x + b.w - w - 0.4 * u;
  const y = b.y + 0.4 * u;
  g.rect({ x, y, w, h }, COLOURS.paper, COLOURS.faint, 0.5);
  g.text('caption', x + 0.8 * u, y + 0.4 * u + line * 0.9, head);
  ctx.family.curves.forEach((c, k) => {
    const yy = y + 0.4 * u + line * (k + 1.9);
    const col = curveColour(k, n);
    const x0 = x + 0.8 * u;
    g.rule(x0, yy - 0.3 * g.size('body'), x0 + sw, yy - 0.3 * g.size('body'), col, 1.5);
    // the nominal key in the nominal curves' dash and weight (LINE_KINDS)
    const [dash, gap] = LINE_KINDS.nominal.dash;
    for (let xx = x0 + sw + 0.6 * u; xx < x0 + 2 * sw + 0.6 * u - 0.1; xx += dash + gap) g.rule(xx, yy - 0.3 * g.size('body'), Math.min(xx + dash, x0 + 2 * sw + 0.6 * u), yy - 0.3 * g.size('body'), col, LINE_KINDS.nominal.width);
    g.text('body', x0 + 2 * sw + 1.2 * u, yy, curveKeyText(ctx.set, c.rho, k));
  });
  return { x0: x - b.x - 2, y0: y - b.y - 2, x1: x + w - b.x + 2, y1: y + h - b.y + 2 };
}

/** A curve's label: "ρg 0.02", or "ω 0.2" on ω sets (the value the set asked for, not a rounded conversion). */
export function curveKeyText(set: Pick<ResolvedChartSet, 'ratios'>, rho: number, k: number): string {
  const { kind, values } = set.ratios;
  return `${RATIO_SYMBOL[kind]} ${fmt(kind === 'omega' ? values[k]! : rho, 4)}`;
}

// ── plot ────────────────────────────────────────────────────────────────────────────────────────

export interface PlotOptions {
  /** the sheet's axes (chart units); default: fitted to this family */
  axes?: SheetAxes;
  /** text widths; default an estimate */
  measure?: MeasureText;
  /**
   * 'border' (chart sheets): rays run to the plot border, whose e/h scale the caller draws (ehScale), and
   * every curve gets its compression-zone labels. 'tips' (report plots): rays end just past the outermost
   * curve with their value at the tip, and curves get compression-zone labels only with `focusP` (near the
   * loads' levels, clear of the `reserved` load marks), else on the tension branch only. Default 'tips'.
   */
  rayValues?: 'border' | 'tips';
  /** boxes, in points from the plot origin, that labels must keep clear of (a legend) */
  reserved?: LabelBox[];
  /** report plots: the loads' P (chart units); curves get compression-zone labels near these levels */
  focusP?: number[];
}

/** Font size of the ρg labels and of the reference-line labels, in type units. */
export const CURVE_LABEL_EM = 0.82;
export const REF_LABEL_EM = 0.78;

/**
 * Where the two compression-zone labels of a curve prefer to sit, as fractions of the curve's own largest
 * P: the lower one a little under half-way up, where a typical column load falls, the upper one near the
 * cap, so a reader finds a label near any load (common practice).
 */
const LOWER_LEVEL = 0.5;
const UPPER_LEVEL = 0.9;

/** A curve label's row: its centre in chart units and its knockout (a box in points around the centre). */
function labelRow(M: number, P: number, text: string, colour: string, bold: boolean, w: number, h: number, z: number): CurveLabelRow {
  return { M: r5(M), P: r5(P), text, colour, bold: bold ? 1 : 0, knock: knockout(-w / 2 - 1, -h / 2, w + 2, h), z };
}

/** A knockout as a vega symbol path in points around the mark's anchor (symbol size 4 draws it 1:1). */
export function knockout(x0: number, y0: number, w: number, h: number): string {
  const f = (v: number) => String(round(v));
  return `M${f(x0)},${f(y0)}h${f(w)}v${f(h)}h${f(-w)}Z`;
}

/** A curve's label text: "ρg 0.02"; on ω sets "ω 0.2 · ρg 0.0123" (the value asked for, then the sheet's ρg). */
export function curveLabelText(set: Pick<ResolvedChartSet, 'ratios'>, rho: number, k: number, nominal: boolean): string {
  const key = curveKeyText(set, rho, k);
  const withRho = set.ratios.kind === 'omega' ? `${key} · ρg ${String(Number(rho.toPrecision(3)))}` : key;
  return nominal ? `${withRho} n` : withRho;
}

/** Indices of the points just before a bar-row step (src/analysis/family.ts sweeps a pair of depths there). */
export function barEntryIndices(cOverH: ArrayLike<number>): Set<number> {
  const out = new Set<number>();
  for (let i = 1; i < cOverH.length; i++) if (cOverH[i]! / cOverH[i - 1]! - 1 < 1e-6) out.add(i - 1);
  return out;
}

/** Where the ray M = e·P meets a curve on its compression side (chart units), or null. */
function rayHit(c: Curve, fam: FamilyKind, e: number, d: number): { M: number; P: number } | null {
  const P = fam === 'design' ? c.phiPn : c.Pn;
  const M = fam === 'design' ? c.phiMn : c.Mn;
  for (let i = P.length - 1; i > 0; i--) {
    const f0 = M[i]! - e * P[i]!;
    const f1 = M[i - 1]! - e * P[i - 1]!;
    if (f0 <= 0 && f1 > 0 && P[i - 1]! > 0) {
      const t = f0 / (f0 - f1);
      return { M: (M[i]! + t * (M[i - 1]! - M[i]!)) / d, P: (P[i]! + t * (P[i - 1]! - P[i]!)) / d };
    }
  }
  return null;
}

/**
 * Points to leave out so each bar-entry step becomes a chord on the inner side: the point before the
 * step and the points before it that lie above the point after the step (the curve then rises
 * monotonically through the step, inside the computed curve).
 */
export function innerChord(P: ArrayLike<number>, before: ReadonlySet<number>): Set<number> {
  const out = new Set<number>();
  for (const a of before) {
    const pAfter = P[a + 1]!;
    for (let j = a; j >= 0 && (j === a || P[j]! >= pAfter); j--) out.add(j);
  }
  return out;
}

/** Point on a polyline where P first reaches `level` (from the pure-tension end), with its segment index. */
function crossing(M: ArrayLike<number>, P: ArrayLike<number>, level: number, d: number): { M: number; P: number } | null {
  for (let i = 1; i < P.length; i++) {
    const p0 = P[i - 1]! / d;
    const p1 = P[i]! / d;
    if (p0 <= level && p1 >= level && p1 > p0) {
      const t = (level - p0) / (p1 - p0);
      return { M: (M[i - 1]! + t * (M[i]! - M[i - 1]!)) / d, P: level };
    }
  }
  return null;
}

/** Lighter tone of the same hue (mixed toward paper white), for nominal curves beside their design curves. */
export function lighter(hex: string, t = 0.5): string {
  const c = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
  return `#${c.map((v) => Math.round(v + (255 - v) * t).toString(16).padStart(2, '0')).join('')}`;
}

/**
 * A curve of one family as a sheet draws it, in chart units: the inner (conservative) branch by default
 * (src/analysis/inner-branch.ts, the same branch the check's chart reading reads), the computed points
 * ('steps'), or the computed points with each bar-entry step cut to a chord on its inner side ('chord').
 */
export function drawnCurve(c: Curve, fam: FamilyKind, drawing: BarEntryDrawing, steps: ReadonlySet<number>, negativeStart: number | undefined, d: number): { M: number[]; P: number[] } {
  const P = fam === 'design' ? c.phiPn : c.Pn;
  const M = fam === 'design' ? c.phiMn : c.Mn;
  if (drawing === 'inner') {
    const b = innerBranch(M, P, negativeStart);
    return { M: b.M.map((v) => v / d), P: b.P.map((v) => v / d) };
  }
  const cut = drawing === 'chord' ? innerChord(P, steps) : new Set<number>();
  const idx = Array.from(P, (_, i) => i).filter((i) => !cut.has(i));
  return { M: idx.map((i) => M[i]! / d), P: idx.map((i) => P[i]! / d) };
}

export function plotLayers(
  ctx: { family: CurveFamily; set: Pick<ResolvedChartSet, 'referenceLines' | 'ratios'> },
  templateLayout: SheetLayout,
  families: FamilyKind[],
  primary: FamilyKind,
  d: number,
  out: SheetData,
  opts: PlotOptions = {},
): SheetAxes {
  const { family, set } = ctx;
  const n = family.curves.length;
  const L = templateLayout;
  const u = L.u;
  const axes = opts.axes ?? axesFor(familyExtent(family, families, d), L.plot);
  const measure = opts.measure ?? estimateText;
  const [m0, m1] = axes.M.domain;
  const [p0, p1] = axes.P.domain;
  // chart units → points from the plot origin
  const X = (M: number) => ((M - m0) / (m1 - m0)) * L.plot.w;
  const Y = (P: number) => ((p1 - P) / (p1 - p0)) * L.plot.h;
  const M_ = (x: number) => m0 + (x / L.plot.w) * (m1 - m0);
  const P_ = (y: number) => p1 - (y / L.plot.h) * (p1 - p0);
  const drawing = set.referenceLines.barEntry ?? 'inner';
  const skip = drawing === 'chord' ? barEntryIndices(family.sweep.cOverH) : new Set<number>();

  const placer = new LabelPlacer({ x0: 0, y0: 0, x1: L.plot.w, y1: L.plot.h });
  for (const b of opts.reserved ?? []) placer.reserve(b);
  const segs = (Ms: number[], Ps: number[]): Segment[] => Ms.slice(1).map((_, i) => [X(Ms[i]!), Y(Ps[i]!), X(Ms[i + 1]!), Y(Ps[i + 1]!)] as Segment);

  /** each curve as drawn, chart units, per family: the polylines labels are placed on */
  const drawn = family.curves.map((c, k) => {
    const colour = curveColour(k, n);
    const byFam = {} as Record<FamilyKind, { M: number[]; P: number[] }>;
    for (const fam of families) {
      const line = drawnCurve(c, fam, drawing, skip, family.negativeBranchStart, d);
      const id = `${fam}-${c.rho}`;
      // drawn within SIMPLIFY_TOLERANCE_PT of every point of the drawn branch
      const keep = simplifyIndices(line.M.map(X), line.P.map(Y), SIMPLIFY_TOLERANCE_PT);
      keep.forEach((i, j) => out.curves.push({ curve: id, family: fam, i: j, M: r5(line.M[i]!), P: r5(line.P[i]!), colour }));
      placer.addObstacle({ group: `curve-${k}`, weight: fam === primary ? 1 : 0.5, segments: segs(keep.map((i) => line.M[i]!), keep.map((i) => line.P[i]!)) });
      byFam[fam] = line;
    }
    return byFam;
  });

  const pointsOf = (id: string): { rho: number; v: PointValues }[] =>
    family.curves.flatMap((c) => {
      const v = c.keyPoints.find((p) => p.id === id)?.[primary];
      return v ? [{ rho: c.rho, v }] : [];
    });

  out.refs.push({ line: 'zero', kind: 'zero', i: 0, M: r5(Math.max(0, m0)), P: 0 }, { line: 'zero', kind: 'zero', i: 1, M: r5(m1), P: 0 });
  placer.addObstacle({ group: 'zero', weight: 0.4, segments: [[X(Math.max(0, m0)), Y(0), X(m1), Y(0)]] });

  const refEnds: { kind: 'strain' | 'cap'; M: number; P: number; text: string }[] = [];
  if (set.referenceLines.strainStates) {
    for (const s of family.basis.strainStates) {
      const pts = pointsOf(s.id);
      pts.forEach((p, i) => out.refs.push({ line: `strain-${s.id}`, kind: 'strain', i, M: r5(p.v.M / d), P: r5(p.v.P / d) }));
      placer.addObstacle({ group: `strain-${s.id}`, weight: 0.5, segments: segs(pts.map((p) => p.v.M / d), pts.map((p) => p.v.P / d)) });
      const last = pts[pts.length - 1];
      if (last) refEnds.push({ kind: 'strain', M: last.v.M / d, P: last.v.P / d, text: shortLabel({ id: s.id, label: s.label }) });
    }
  }
  if (set.referenceLines.axialCap) {
    const pts = pointsOf('axial-cap');
    pts.forEach((p, i) => out.refs.push({ line: 'cap', kind: 'cap', i, M: r5(p.v.M / d), P: r5(p.v.P / d) }));
    placer.addObstacle({ group: 'cap', weight: 0.5, segments: segs(pts.map((p) => p.v.M / d), pts.map((p) => p.v.P / d)) });
    const last = pts[pts.length - 1];
    const sy = family.basis.symbols;
    if (last) refEnds.push({ kind: 'cap', M: last.v.M / d, P: last.v.P / d, text: `${primary === 'design' ? sy.designAxial : sy.nominalAxial},max` });
  }
  // e/h rays: M/(Ag·h) = e/h · P/Ag, from the origin to the plot border (top, or right for large e/h)
  const report = opts.rayValues !== 'border';
  const outer = family.curves[n - 1];
  for (const e of set.referenceLines.eccentricities) {
    if (!(e > 0) || !(p1 > 0)) continue;
    const hit = report && outer ? rayHit(outer, families.includes('nominal') ? 'nominal' : primary, e, d) : null;
    if (report && !hit) continue;
    const end = hit ? { M: hit.M * 1.07, P: hit.P * 1.07 } : e * p1 <= m1 ? { M: e * p1, P: p1 } : { M: m1, P: m1 / e };
    out.refs.push({ line: `ray-${e}`, kind: 'ray', i: 0, M: 0, P: 0 }, { line: `ray-${e}`, kind: 'ray', i: 1, M: r5(end.M), P: r5(end.P) });
    placer.addObstacle({ group: `ray-${e}`, weight: 0.4, segments: [[X(0), Y(0), X(end.M), Y(end.P)]] });
    if (report) {
      const text = `e/h ${fmt(e)}`;
      const rfs0 = Math.max(REF_LABEL_EM * u, L.minText ?? 0);
      out.refLabels.push({ kind: 'ray', M: r5(end.M), P: r5(end.P), text, knock: knockout(1, -2 - 0.6 * rfs0, measure(text, rfs0, false) + 2, 1.2 * rfs0), z: out.refLabels.length });
      // drawn at dx 2, dy −2 from the tip (spec.ts): other labels keep clear of it
      const rfs = rfs0;
      placer.reserve({ x0: X(end.M) + 2, y0: Y(end.P) - 2 - 0.6 * rfs, x1: X(end.M) + 2 + measure(text, rfs, false), y1: Y(end.P) - 2 + 0.6 * rfs });
    }
  }

  // 1. ρg labels in the compression zone (P > 0), never dropped: two per curve of every family drawn, at
  // clearly different heights, one near or on the cap (upper) and one lower down, so a reader finds a
  // label near any load; on report plots the lower one sits at the loads' level
  const fs = Math.max(CURVE_LABEL_EM * u, L.minText ?? 0);
  const h = 1.05 * fs;
  const order = [primary, ...families.filter((f) => f !== primary)];
  const focus = (opts.focusP ?? []).filter((p) => Number.isFinite(p) && p > 0);
  type Cand = { box: LabelBox; penalty: number; M: number; P: number };
  const upperAt = new Map<string, number>();
  const label = (k: number, fam: FamilyKind, zone: 'upper' | 'lower') => {
    const c = family.curves[k]!;
    const line = drawn[k]![fam];
    const bold = fam === primary;
    const text = curveLabelText(set, c.rho, k, fam !== primary);
    const w = measure(text, fs, bold);
    let pMax = 0;
    for (const v of line.P) pMax = Math.max(pMax, v);
    if (!(pMax > 0)) return;
    const key = `${fam}-${k}`;
    const upperP = upperAt.get(key);
    // the lower label keeps at least a quarter of the curve's height below the upper one
    const ok = (P: number) => zone === 'upper' || upperP === undefined || P <= upperP - 0.25 * pMax;
    const fLo = zone === 'upper' ? 0.7 : 0.08;
    const fHi = zone === 'upper' ? 1 : 0.62;
    const lowPref = focus.length ? Math.min(fHi, Math.max(fLo, focus.reduce((s, p) => s + p, 0) / focus.length / pMax)) : LOWER_LEVEL;
    const pref = zone === 'upper' ? UPPER_LEVEL : lowPref;
    const cands: Cand[] = [];
    const at = (pt: { M: number; P: number } | null, penalty: number, dy = 0) => {
      if (!pt || !(pt.P > 0)) return;
      const x = X(pt.M);
      const y = Y(pt.P) + dy;
      const P = P_(y);
      if (P > 0 && ok(P)) cands.push({ box: centredBox(x, y, w, h, 1), penalty, M: pt.M, P });
    };
    const levels = (step: number) => {
      for (let f = fLo; f <= fHi + 1e-9; f += step) at(crossing(line.M, line.P, Math.min(f, 0.995) * pMax, 1), 3 * Math.abs(f - pref));
    };
    levels(0.03);
    // on the cap: the flat top of a factored curve
    if (zone === 'upper') {
      const flat = line.P.map((v, i) => ({ v, m: line.M[i]! })).filter((q) => q.v >= pMax * (1 - 1e-9));
      const capM = Math.max(...flat.map((q) => q.m));
      const capMin = Math.min(...flat.map((q) => q.m));
      if (flat.length > 1 && X(capM) - X(capMin) > w + 4) for (const t of [0.5, 0.35, 0.65, 0.8, 0.2]) at({ M: capMin + (capM - capMin) * t, P: pMax }, 0.6 + Math.abs(t - 0.5));
    }
    let chosen = placer.place(cands, `curve-${k}`, 0.4 * h);
    if (chosen < 0) {
      // denser positions, then beside the curve rather than on it (a label off its curve reads less surely)
      cands.length = 0;
      for (let f = fLo; f <= fHi + 1e-9; f += 0.01) {
        const pt = crossing(line.M, line.P, Math.min(f, 0.995) * pMax, 1);
        const pen = 3 * Math.abs(f - pref);
        at(pt, pen);
        at(pt, pen + 8, -1.1 * h);
        at(pt, pen + 8, 1.1 * h);
      }
      chosen = placer.place(cands, `curve-${k}`, 0.4 * h);
    }
    if (chosen < 0) chosen = placer.force(cands);
    const best = cands[chosen];
    if (!best) return;
    if (zone === 'upper') upperAt.set(key, best.P);
    out.curveLabels.push(labelRow(best.M, best.P, text, curveColour(k, n), bold, w, h, out.curveLabels.length));
  };
  if (!report || focus.length) {
    for (const fam of order) for (let k = 0; k < n; k++) label(k, fam, 'upper');
    for (const fam of order) for (let k = 0; k < n; k++) label(k, fam, 'lower');
  }

  // 2. reference-line names at the outer end of their line: beside it, above or below; dropped if no room
  for (const r of refEnds) {
    const rfs = Math.max(REF_LABEL_EM * u, L.minText ?? 0);
    const w = measure(r.text, rfs, false);
    const x = X(r.M);
    const y = Y(r.P);
    const rh = 1.1 * rfs;
    const box = (x0: number, yc: number): LabelBox => ({ x0, y0: yc - rh / 2, x1: x0 + w, y1: yc + rh / 2 });
    const cands = [
      { box: box(x + 5, y), penalty: 0 },
      { box: box(x + 4, y - rh), penalty: 0.3 },
      { box: box(x + 4, y + rh), penalty: 0.3 },
      { box: box(x - 5 - w, y - rh * 0.8), penalty: 0.6 },
      { box: box(x - 5 - w, y + rh * 0.8), penalty: 0.6 },
    ];
    const i = placer.place(cands, r.kind === 'cap' ? 'cap' : undefined);
    const b = cands[i];
    if (b) out.refLabels.push({ kind: r.kind, M: r5(M_(b.box.x0)), P: r5(P_((b.box.y0 + b.box.y1) / 2)), text: r.text, knock: knockout(-1, -rh / 2, w + 2, rh), z: out.refLabels.length });
  }

  // 3. a further label on the tension branch where there is room (lowest priority)
  const tensionP = (k: number) => (family.curves[k]!.keyPoints.find((p) => p.id === 'pure-tension')?.[primary]?.P ?? 0) / d;
  family.curves.forEach((c, k) => {
    const line = drawn[k]![primary];
    const text = curveLabelText(set, c.rho, k, false);
    const w = measure(text, fs, true);
    const cands: { box: LabelBox; penalty: number; M: number; P: number }[] = [];
    for (const f of [0.33, 0.25, 0.42, 0.18, 0.5]) {
      const pt = crossing(line.M, line.P, f * tensionP(k), 1);
      if (pt) cands.push({ box: centredBox(X(pt.M), Y(pt.P), w, h, 1), penalty: Math.abs(f - 0.33), M: pt.M, P: pt.P });
    }
    const free = report ? cands : cands.filter((q) => placer.cost(q.box, `curve-${k}`) === 0);
    const b = free[placer.place(free)];
    if (b) out.curveLabels.push(labelRow(b.M, b.P, text, curveColour(k, n), true, w, h, out.curveLabels.length));
  });

  // invisible frame: the axes' corners
  out.frame.push({ M: r5(m0), P: r5(p0) }, { M: r5(m1), P: r5(p1) });
  return axes;
}

// ── decoration in page points ──────────────────────────────────────────────────────────────────

export class Deco {
  constructor(
    readonly L: SheetLayout,
    readonly out: SheetData,
    readonly measure: MeasureText = estimateText,
  ) {}
  private ox = (x: number) => round(x - this.L.plot.x);
  private oy = (y: number) => round(y - this.L.plot.y);
  size = (style: TextStyle) => Math.max(TEXT_STYLES[style].size * this.L.u, this.L.minText ?? 0);
  /** advance width of `text` in a text style, in points */
  width = (style: TextStyle, text: string) => this.measure(text, this.size(style), TEXT_STYLES[style].weight === 'bold');
  text(style: TextStyle, x: number, y: number, text: string, maxW?: number): void {
    const bold = TEXT_STYLES[style].weight === 'bold';
    const t = maxW === undefined ? text : truncate(text, maxW, this.size(style), (s, f) => this.measure(s, f, bold));
    this.out.texts.push({ style, x: this.ox(x), y: this.oy(y), text: t, z: this.out.texts.length });
  }
  rect(b: Box, fill: string, stroke = 'transparent', strokeWidth = 0): void {
    this.out.rects.push({ x: this.ox(b.x), y: this.oy(b.y), x2: this.ox(b.x + b.w), y2: this.oy(b.y + b.h), fill, stroke, strokeWidth, z: this.out.rects.length });
  }
  rule(x: number, y: number, x2: number, y2: number, stroke: string = COLOURS.rule, strokeWidth = 0.6): void {
    this.out.rules.push({ x: this.ox(x), y: this.oy(y), x2: this.ox(x2), y2: this.oy(y2), stroke, strokeWidth, z: this.out.rules.length });
  }
  dot(x: number, y: number, diameter: number, fill: string, ring = false): void {
    const list = ring ? this.out.rings : this.out.dots;
    list.push({ x: this.ox(x), y: this.oy(y), size: round(diameter * diameter, 3), fill, z: list.length });
  }
  /** wraps text into lines at an estimated width; returns the y after the last line */
  paragraph(style: TextStyle, x: number, y: number, w: number, text: string, leading = 1.38): number {
    const fs = this.size(style);
    for (const line of wrap(text, w, fs, (s, f) => this.measure(s, f, TEXT_STYLES[style].weight === 'bold'))) {
      this.text(style, x, y, line);
      y += fs * leading;
    }
    return y;
  }
}

export const estWidth = (s: string, fontSize: number) => s.length * AVG_CHAR_EM * fontSize;

/** Cuts text to width `w` with an ellipsis, by `measure` (default the estimate). */
export function truncate(s: string, w: number, fs: number, measure: (s: string, fs: number) => number = estWidth): string {
  if (measure(s, fs) <= w) return s;
  // the longest prefix that fits with its ellipsis, by bisection (width grows with the prefix): a few dozen
  // measurements for any length, where one per character took 42 s for a 20,000-character title
  const cut = (n: number) => `${s.slice(0, n).trimEnd()}…`;
  let lo = 1;
  let hi = s.length;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (measure(cut(mid), fs) <= w) lo = mid;
    else hi = mid - 1;
  }
  return cut(lo);
}

/** Wraps text into lines no wider than `w` by `measure` (default the estimate); a word longer than a line stands alone. */
export function wrap(text: string, w: number, fs: number, measure?: (s: string, fs: number) => number): string[] {
  const fits = measure ? (s: string) => measure(s, fs) <= w : (s: string) => s.length <= Math.max(8, Math.floor(w / (AVG_CHAR_EM * fs)));
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (!word) continue;
    const next = line ? `${line} ${word}` : word;
    if (line && !fits(next)) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

/** The sheet's head: accent bar, title (shrunk or wrapped before any cut) and "sheet n of N". */
export function header(ctx: Pick<SheetContext, 'sheet' | 'sheetNumber' | 'sheetCount'>, g: Deco): void {
  const { header: b, u } = g.L;
  g.rect({ x: b.x, y: b.y, w: 0.7 * u, h: b.h }, COLOURS.accent);
  const right = `sheet ${ctx.sheetNumber} of ${ctx.sheetCount}`;
  g.text('headerRight', b.x + b.w, b.y + b.h * 0.62, right);
  const room = b.w - 1.8 * u - g.width('headerRight', right) - 3 * u;
  const title = ctx.sheet.title;
  // the title whole: full size, smaller, or in two smaller lines; cut only past that
  if (g.width('sheetTitle', title) <= room) g.text('sheetTitle', b.x + 1.8 * u, b.y + b.h * 0.66, title);
  else if (g.width('sheetTitleMid', title) <= room) g.text('sheetTitleMid', b.x + 1.8 * u, b.y + b.h * 0.62, title);
  else {
    // two lines of the small title size, else as many lines of body type as it takes: never cut
    let style: TextStyle = 'sheetTitleSmall';
    let lines = wrap(title, room, g.size(style), (t, f) => g.measure(t, f, true));
    if (lines.length > 2) {
      style = 'valueBoldSmall';
      lines = breakLines(g, style, title, room);
    }
    const fs = g.size(style);
    const top = b.y + b.h / 2 - (fs * 1.12 * (lines.length - 1)) / 2 + 0.35 * fs;
    lines.forEach((l, i) => g.text(style, b.x + 1.8 * u, top + i * fs * 1.12, l));
  }
  g.rule(b.x, b.y + b.h + 0.6 * u, b.x + b.w, b.y + b.h + 0.6 * u, COLOURS.rule, 0.8);
}

function lookupPanel(ctx: SheetContext, table: LookupTable, primary: FamilyKind, g: Deco): void {
  const { table: b, u } = g.L;
  const basis = ctx.family.basis;
  const sy = basis.symbols;
  const su = DISPLAY_UNITS[ctx.set.units].stress;
  const first = table.rows[0];
  if (!first) return;
  const groups = first.points.map((p) => ({ p, cols: columnsFor(p.id) }));
  const resultantFactor = table.rows.some((r) => r.points.some((p) => p.design !== null && p.design.phi !== 1));
  const nCols = groups.reduce((s, gr) => s + gr.cols.length, 0);
  const rhoW = 5.2 * u;
  const colW = (b.w - rhoW) / nCols;
  const line = 1.32 * u;
  const P = primary === 'design' ? sy.designAxial : sy.nominalAxial;
  const M = primary === 'design' ? sy.designMoment : sy.nominalMoment;
  const dimless = ctx.set.normalisation === 'dimensionless';
  const pCol = dimless && sy.dimensionlessAxial ? sy.dimensionlessAxial : 'P';
  const mCol = dimless && sy.dimensionlessMoment ? sy.dimensionlessMoment : 'M';
  const unitText = dimless ? `${pCol} = ${P}/(${sy.normalisingStress}·Ag), ${mCol} = ${M}/(${sy.normalisingStress}·Ag·h), dimensionless` : `P = ${P}/Ag, M = ${M}/(Ag·h), ${su}`;
  const key = RATIO_SYMBOL[ctx.set.ratios.kind];
  g.text('heading', b.x, b.y + 1.0 * u, `Key points of the ${primary === 'design' ? sy.designFamily : sy.nominalFamily} curves`);
  g.text('body', b.x + 0.52 * b.w, b.y + 1.0 * u, unitText, 0.48 * b.w);

  const top = b.y + 2.0 * u;
  g.rect({ x: b.x, y: top, w: b.w, h: 3 * line + 0.2 * u }, COLOURS.panel);
  let x = b.x + rhoW;
  g.text('cellHead', b.x + rhoW / 2, top + 0.9 * line, key);
  for (const { p, cols } of groups) {
    const w = colW * cols.length;
    const mid = x + w / 2;
    g.text('cellHead', mid, top + 0.9 * line, shortLabel(p), w - 0.3 * u);
    const v = p[primary];
    const shared = table.rows.every((r) => {
      const q = r.points.find((z) => z.id === p.id)?.[primary];
      return q && v && Math.abs(q.cOverH - v.cOverH) < 1e-9;
    });
    const facts: string[] = [];
    if (v && shared && Number.isFinite(v.cOverH) && v.cOverH < 1e3 && v.cOverH > 1e-3) facts.push(`c/h ${v.cOverH.toFixed(3)}`);
    // the resultant factor (ACI φ) where the basis has one; bases with factors in the materials report 1
    if (v && primary === 'design' && p.id !== 'axial-cap' && resultantFactor) facts.push(`φ ${v.phi.toFixed(2)}`);
    if (primary === 'design' && p.id === 'axial-cap') facts.push('per ρg');
    g.text('cellSub', mid, top + 1.9 * line, facts.join(' · '), w - 0.2 * u);
    cols.forEach((c, k) => g.text('cellSub', x + colW * (k + 0.5), top + 2.85 * line, c === 'P' ? pCol : mCol));
    g.rule(x, top, x, top + (3 + table.rows.length) * line + 0.4 * u, COLOURS.rule, 0.5);
    x += w;
  }
  let y = top + 3 * line + 0.2 * u;
  table.rows.forEach((r, k) => {
    if (k % 2 === 1) g.rect({ x: b.x, y, w: b.w, h: line }, '#f8fafb');
    const base = y + 0.78 * line;
    g.text('cellRho', b.x + 0.6 * u, base, fmt(r.omega ?? r.rhoG, 4));
    let cx = b.x + rhoW;
    for (const { p, cols } of groups) {
      const v = r.points.find((z) => z.id === p.id)?.[primary];
      for (const c of cols) {
        g.text('cellRight', cx + colW - 0.6 * u, base, v ? (c === 'P' ? v.P : v.M).toFixed(3).replace(/^-0\.000$/, '0.000') : '—');
        cx += colW;
      }
    }
    y += line;
  });
  g.rule(b.x, y + 0.1 * u, b.x + b.w, y + 0.1 * u, COLOURS.faint, 0.6);
  g.rule(b.x, top, b.x + b.w, top, COLOURS.faint, 0.6);
}

/** The caution at the foot of every chart sheet's side column. */
export const SHEET_CAUTION =
  'For use by qualified engineers only. Check every value against the governing code edition, the project specification and local practice; this sheet does not replace the judgement of the engineer of record.';

/** Side-column variants, largest first: the first whose notes and caution fit the column is drawn. */
export type SideFit = { picture: number; notes: TextStyle };
const SIDE_FITS: SideFit[] = [
  { picture: 1, notes: 'body' },
  { picture: 0.8, notes: 'bodySmall' },
  { picture: 0.6, notes: 'bodyTiny' },
  // the print floor can set every notes style to one size: a smaller picture then makes the room
  { picture: 0.4, notes: 'bodyTiny' },
];

/** Draws a side column with the largest variant that fits (tried on a scratch layer); `draw` returns the column's bottom. */
export function fitSideColumn(g: Deco, draw: (g: Deco, fit: SideFit) => number): void {
  for (const fit of SIDE_FITS) {
    const trial = new Deco(g.L, { curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [] }, g.measure);
    if (draw(trial, fit) <= g.L.side.y + g.L.side.h + 0.01 || fit === SIDE_FITS[SIDE_FITS.length - 1]) {
      draw(g, fit);
      return;
    }
  }
}

const sidePanel = (ctx: SheetContext, g: Deco): void => fitSideColumn(g, (d, fit) => sideColumn(ctx, d, fit));

/** Draws the side column; returns the bottom of its caution box. */
function sideColumn(ctx: SheetContext, g: Deco, fit: SideFit): number {
  const { side: b, u } = g.L;
  const { family, sheet, set } = ctx;
  const basis = family.basis;

  // pictogram, to scale from the unit-depth bars of the family
  g.text('heading', b.x, b.y + 1.0 * u, 'Section (to scale)');
  const picH = fit.picture * Math.min(0.27 * b.h, 0.62 * b.w);
  const box: Box = { x: b.x, y: b.y + 2.0 * u, w: b.w, h: picH };
  g.rect(box, COLOURS.panel);
  const aspect = sheet.shape.kind === 'rectangle' ? sheet.shape.aspect : 1;
  const scale = Math.min((box.h - 6.5 * u) / 1, (box.w * 0.55) / aspect);
  const cx = box.x + box.w * 0.42;
  const cy = box.y + box.h / 2 + 0.6 * u;
  const hw = (aspect * scale) / 2;
  const hh = scale / 2;
  if (sheet.shape.kind === 'circle') g.dot(cx, cy, scale, COLOURS.ink, true);
  else g.rect({ x: cx - hw, y: cy - hh, w: 2 * hw, h: 2 * hh }, COLOURS.paper, COLOURS.ink, 1.1);
  const mid = Math.floor((family.curves.length - 1) / 2);
  const rhoShown = family.curves[mid]?.rho ?? 0.02;
  for (const bar of family.bars) {
    const area = bar.area * rhoShown; // the family's unit-depth bars add up to Ag at ρg = 1
    const dia = Math.sqrt((4 * area) / Math.PI) * scale;
    g.dot(cx + bar.x * scale, cy - bar.y * scale, Math.max(dia, 1.6 * u * 0.6), COLOURS.ink);
  }
  // dimension lines: h on the left, γ·h between the outer rows on the right
  const ys = family.bars.map((z) => z.y);
  const yTop = cy - Math.max(...ys) * scale;
  const yBot = cy - Math.min(...ys) * scale;
  const xl = cx - hw - 2.2 * u;
  const xr = cx + hw + 2.2 * u;
  const tick = 0.6 * u;
  g.rule(xl, cy - hh, xl, cy + hh, COLOURS.muted, 0.6);
  g.rule(xl - tick, cy - hh, xl + tick, cy - hh, COLOURS.muted, 0.6);
  g.rule(xl - tick, cy + hh, xl + tick, cy + hh, COLOURS.muted, 0.6);
  g.text('dim', xl - 1.3 * u, cy + 0.3 * u, sheet.shape.kind === 'circle' ? 'h = D' : 'h');
  g.rule(xr, yTop, xr, yBot, COLOURS.muted, 0.6);
  g.rule(xr - tick, yTop, xr + tick, yTop, COLOURS.muted, 0.6);
  g.rule(xr - tick, yBot, xr + tick, yBot, COLOURS.muted, 0.6);
  g.text('dimLeft', xr + 1.0 * u, cy + 0.3 * u, `γh = ${gammaText(sheet.gamma)} h`);
  g.text('dim', cx, cy - hh - 1.0 * u, 'compression face');
  g.rule(cx - hw - 0.8 * u, cy, cx + hw + 0.8 * u, cy, COLOURS.faint, 0.4);
  g.text('caption', box.x + 0.8 * u, box.y + box.h - 0.8 * u, `${family.bars.length} bars, drawn at ρg = ${fmt(rhoShown, 4)}${set.ratios.kind === 'omega' ? ` (ω ${fmt(set.ratios.values[mid]!, 4)})` : ''}; thin line: bending axis`, box.w - 1.6 * u);

  // basis parameters
  let y = box.y + box.h + 2.4 * u;
  g.text('heading', b.x, y, `Basis: ${basis.title}`);
  y += 1.5 * u;
  const params = Object.entries(basis.parameters).map(([k, v]) => `${k} ${typeof v === 'number' ? fmt(v, 6) : v}`);
  y = g.paragraph(fit.notes, b.x, y, b.w, params.join('  ·  '));
  y += 1.0 * u;
  g.text('heading', b.x, y, 'Assumptions');
  y += 1.5 * u;
  const su = DISPLAY_UNITS[set.units].stress;
  const extra = [
    set.normalisation === 'dimensionless'
      ? `Values are divided by Ag (and h for moments) and by ${basis.symbols.normalisingStress} = ${stressText(basis.normalisingStress, set.units)}; h is the depth in the bending plane (D for circular columns).`
      : `Values are divided by Ag (and h for moments), in ${su}; h is the depth in the bending plane (D for circular columns).`,
    'Short column: slenderness, creep and second-order effects are not included.',
  ];
  const arr = family.arrangement;
  if (sheet.gammaB !== undefined) {
    extra.push(`Bar columns: the outer bar columns are γB·b = ${gammaText(sheet.gammaB)}·b apart (centres), set apart from γ; the cover across b differs from the cover across h.`);
  } else if (arr.kind === 'four-faces' && typeof arr.barsPerFace !== 'number' && arr.barsPerFace[0] !== arr.barsPerFace[1]) {
    extra.push('Bar columns: the outer bar columns have the same cover across b as the outer rows have across h.');
  }
  if (arr.kind === 'ring') {
    extra.push(
      `Orientation: the ${arr.bars} bars are drawn with one bar at the compression extreme. Turned half a bar pitch (${fmt(180 / arr.bars, 3)}°) the curves differ slightly; pmchart check takes the weaker orientation for every load.`,
    );
  }
  // the basis notes state why the curves step; a smoothed drawing says which model it then shows
  const drawing = set.referenceLines.barEntry ?? 'inner';
  if (drawing !== 'steps' && barEntryIndices(family.sweep.cOverH).size > 0) {
    extra.push(
      drawing === 'chord'
        ? 'Drawn smoothed: where a bar row enters the rectangular stress block the computed curve steps inward; each step is drawn here as a chord on its inner side. Key points and tables keep the computed model (block with displaced concrete deducted).'
        : 'Drawn on the inner branch: where a bar row enters the rectangular stress block the computed curve steps inward and would fold back; each curve is drawn with the least moment it reaches at each axial level, the conservative side, and pmchart check reads the same line. Key points and tables keep the computed model.',
    );
  }
  if (set.ratios.kind === 'omega') {
    const fyd = basis.design.steel.yieldStress;
    extra.unshift(
      `Curves per mechanical ratio ω = ρg·σy/${basis.symbols.normalisingStress}, σy = ${stressText(fyd, set.units)} the design yield stress: ρg = ω·${fmt(basis.normalisingStress / fyd, 4)} here.`,
    );
  }
  return notesAndCaution(g, fit, y, [...basis.notes, ...extra]);
}

/** The side column's bulleted notes from `y`, then the caution box pinned to the column's foot; returns the box's bottom. */
export function notesAndCaution(g: Deco, fit: SideFit, y: number, notes: readonly string[]): number {
  const { side: b, u } = g.L;
  for (const note of notes) {
    g.text(fit.notes, b.x, y, '•');
    y = g.paragraph(fit.notes, b.x + 1.0 * u, y, b.w - 1.0 * u, note) + 0.3 * u;
  }
  const lines = wrap(SHEET_CAUTION, b.w - 2 * u, g.size('caution'), (t, f) => g.measure(t, f, true));
  const ch = lines.length * g.size('caution') * 1.35 + 1.4 * u;
  const cTop = Math.max(y + 0.5 * u, b.y + b.h - ch);
  g.rect({ x: b.x, y: cTop, w: b.w, h: ch }, '#fbf1ef', COLOURS.caution, 0.7);
  g.paragraph('caution', b.x + u, cTop + 1.0 * u + 0.5 * g.size('caution'), b.w - 2 * u, SHEET_CAUTION, 1.35);
  return cTop + ch;
}

function titleBlock(ctx: SheetContext, g: Deco): void {
  const { set, sheet, family } = ctx;
  const tb = set.titleBlock;
  const basis = family.basis;
  const sy = basis.symbols;
  const fam = set.families === 'both' ? `${sy.nominalFamily} and ${sy.designFamily}` : set.families === 'design' ? sy.designFamily : sy.nominalFamily;
  const primary = primaryFamily(set);
  const P = set.families === 'both' ? `${sy.nominalAxial}, ${sy.designAxial}` : primary === 'design' ? sy.designAxial : sy.nominalAxial;
  const M = set.families === 'both' ? `${sy.nominalMoment}, ${sy.designMoment}` : primary === 'design' ? sy.designMoment : sy.nominalMoment;
  const ratios = set.ratios.values;
  const curves = `${fam} · ${RATIO_SYMBOL[set.ratios.kind]} ${fmt(ratios[0]!, 4)}–${fmt(ratios[ratios.length - 1]!, 4)}`;
  const sheetRow: [string, string, number][] = [
    ['office', tb.office, 3],
    ['project', tb.project, 3],
    ['sheet title', sheet.title, 4.6],
    ['sheet', `${ctx.sheetNumber} of ${ctx.sheetCount}`, 1.1],
  ];
  const section: [string, string, number][] = [
    ['design basis', basis.title, 1.3],
    ['materials', `${sy.concreteStrength} ${stressText(sheet.fc, set.units)} · ${sy.steelStrength} ${stressText(sheet.fy, set.units)}`, 1.9],
    sheet.gammaB === undefined ? ['γ', gammaText(sheet.gamma), 0.6] : ['γ · γB', `${gammaText(sheet.gamma)} · ${gammaText(sheet.gammaB)}`, 0.8],
    ['shape · bars', `${describeShape(sheet.shape)} · ${describeArrangement(sheet.arrangement)}`, 3.7],
  ];
  const people: [string, string, number][] = [
    ['transverse', describeTransverse(sheet.transverse), 0.9],
    ['prepared · checked', [tb.preparedBy, tb.checkedBy].filter(Boolean).join(' · ') || '—', 1.5],
    ['rev.', tb.revision, 0.5],
    ['date', tb.date, 1.1],
    ['generated by', ctx.generator, 1.4],
  ];
  const factors: [string, string, number][] = [['factors', basis.factorSummary, 4.6]];
  const norm: [string, string, number][] = [
    ['normalisation', normalisationText(set, sy, P, M, basis.normalisingStress), 4.6],
    ['curves', curves, 2.4],
  ];
  // narrow pages: the crowded rows split in two, so no value is cut
  const rows: [string, string, number][][] =
    (g.L.titleRows ?? 3) >= 5 ? [[sheetRow[0]!, sheetRow[1]!, people[2]!, people[3]!, sheetRow[3]!], [sheetRow[2]!], section, [people[0]!, people[1]!, people[4]!, norm[1]!], [...factors, norm[0]!]] : [sheetRow, [...section, ...people], [...factors, ...norm]];
  drawTitleBlock(g, rows, ctx.logo);
}

/** A logo for a title block: `url` for SVG output (cleaned SVG or PNG as a data URI), `raster` a PNG data URI for canvas outputs. */
export interface LogoRef {
  url: string;
  raster: string;
}

/**
 * Title-block cells [caption, value, width weight] row by row, in the sheet layout's title-block box; with a
 * logo, its fixed box (`logoBox`) at the right end first. Captions are never upper-cased (γ would become Γ, ρg
 * "ΡG"). No value is cut: a row's cells first lend width to a neighbour whose value is too long, then a value
 * goes to the smaller size, then to two or three lines in the smallest size.
 */
export function drawTitleBlock(g: Deco, rows: [string, string, number][][], logo?: LogoRef): void {
  const { titleBlock: whole, u } = g.L;
  g.rect(whole, COLOURS.paper, COLOURS.ink, 0.9);
  const b = logo ? { ...whole, w: whole.w - logoBox(g.L).w } : whole;
  if (logo) {
    const lb = logoBox(g.L);
    g.rule(lb.x, lb.y, lb.x, lb.y + lb.h, COLOURS.ink, 0.5);
    drawLogo(g, logo, lb);
  }
  const rowH = b.h / rows.length;
  rows.forEach((cells, r) => {
    const y = b.y + r * rowH;
    if (r > 0) g.rule(b.x, y, b.x + b.w, y, COLOURS.ink, 0.5);
    const widths = cellWidths(g, cells, b.w);
    let x = b.x;
    cells.forEach(([cap, val], k) => {
      const w = widths[k]!;
      if (k > 0) g.rule(x, y, x, y + rowH, COLOURS.ink, 0.5);
      g.text('caption', x + 0.7 * u, y + 1.05 * u, cap, w - 1.4 * u);
      const bold = cap === 'office' || cap === 'project' || cap === 'sheet';
      cellValue(g, x + 0.7 * u, y, rowH, w - 1.4 * u, val, bold);
      x += w;
    });
  });
}

/** The fixed box of the office logo: the right end of the title block, full height. */
export function logoBox(L: SheetLayout): Box {
  const b = L.titleBlock;
  const w = Math.min(0.13 * b.w, 2.6 * b.h);
  return { x: b.x + b.w - w, y: b.y, w, h: b.h };
}

/** The logo centred in `box` (inside a margin), as large as its aspect allows (vega image mark, `aspect: true`). */
export function drawLogo(g: Deco, logo: LogoRef, box: Box): void {
  (g.out.images ??= []).push({ x: round(box.x + box.w / 2 - g.L.plot.x), y: round(box.y + box.h / 2 - g.L.plot.y), url: logo.url, raster: logo.raster, z: g.out.images.length });
}

/** Inner size of the logo's box (the image mark's width and height). */
export const logoInner = (L: SheetLayout): { w: number; h: number } => {
  const b = logoBox(L);
  return { w: round(b.w - 1.4 * L.u), h: round(b.h - 1.4 * L.u) };
};

/**
 * Cell widths of a title-block row: by weight, then cells whose value (at full size) or caption does not fit
 * take width from cells with room to spare, in proportion to that room.
 */
function cellWidths(g: Deco, cells: [string, string, number][], total: number): number[] {
  const u = g.L.u;
  const sum = cells.reduce((s, c) => s + c[2], 0);
  const w = cells.map((c) => (total * c[2]) / sum);
  const need = cells.map(([cap, val]) => Math.max(g.width('caption', cap), g.width(cap === 'office' || cap === 'project' || cap === 'sheet' ? 'valueBold' : 'value', val)) + 1.6 * u);
  const short = cells.map((_, k) => Math.max(0, need[k]! - w[k]!));
  const spare = cells.map((_, k) => Math.max(0, w[k]! - need[k]!));
  const want = short.reduce((a, v) => a + v, 0);
  const have = spare.reduce((a, v) => a + v, 0);
  if (want === 0 || have === 0) return w;
  const moved = Math.min(want, have);
  return w.map((v, k) => v + (moved * short[k]!) / want - (moved * spare[k]!) / have);
}

/** One title-block value, whole: full size, smaller, or wrapped into two or three lines of smaller type. */
function cellValue(g: Deco, x: number, y: number, rowH: number, w: number, val: string, bold: boolean): void {
  const u = g.L.u;
  const full: TextStyle = bold ? 'valueBold' : 'value';
  const small: TextStyle = bold ? 'valueBoldSmall' : 'valueSmall';
  if (g.width(full, val) <= w) return g.text(full, x, y + rowH - 0.9 * u, val);
  if (g.width(small, val) <= w) return g.text(small, x, y + rowH - 0.9 * u, val);
  // lines from the cell's foot upwards, the top line clear of the caption
  const top = y + 1.05 * u + 0.35 * u;
  for (const style of [small, 'bodyTiny'] as TextStyle[]) {
    const fs = g.size(style);
    const lines = breakLines(g, style, val, w);
    const lead = fs * 1.08;
    const base = y + rowH - 0.45 * u;
    const firstBase = base - (lines.length - 1) * lead;
    if (firstBase - 0.75 * fs >= top || style === 'bodyTiny') {
      lines.forEach((l, i) => g.text(style, x, firstBase + i * lead, l));
      return;
    }
  }
}

/** Wraps at spaces, and breaks a word longer than the width after "-", "_", "·" or anywhere: every character is kept. */
export function breakLines(g: Deco, style: TextStyle, text: string, w: number): string[] {
  const fits = (s: string) => g.width(style, s) <= w;
  const out: string[] = [];
  for (const line of wrap(text, w, g.size(style), (s, f) => g.measure(s, f, TEXT_STYLES[style].weight === 'bold'))) {
    let rest = line;
    while (!fits(rest) && rest.length > 1) {
      let n = rest.length - 1;
      while (n > 1 && !fits(rest.slice(0, n))) n--;
      const soft = Math.max(rest.lastIndexOf('-', n - 1), rest.lastIndexOf('_', n - 1), rest.lastIndexOf('·', n - 1));
      const cut = soft > n / 2 ? soft + 1 : n;
      out.push(rest.slice(0, cut));
      rest = rest.slice(cut).trimStart();
    }
    if (rest) out.push(rest);
  }
  return out;
}
