/**
 * One sheet as data: every mark a sheet draws (curves, reference lines, labels, pictogram, lookup
 * table, title block, notes) as rows of named datasets. The vega-lite template (spec.ts) depends only
 * on set-wide choices, so a renderer compiles it once and swaps these datasets per sheet.
 * Plot rows are in chart units (normalised M, P); decoration rows are in points from the plot origin.
 */
import type { CurveFamily, PointValues } from '../analysis/family.js';
import type { Basis } from '../codes/types.js';
import { describeArrangement, describeShape, describeTransverse, fmt, stressText } from '../config/describe.js';
import type { BasisSymbols } from '../codes/types.js';
import { RATIO_SYMBOL, type ResolvedChartSet, type ResolvedSheet } from '../config/types.js';
import { DISPLAY_UNITS } from '../units/index.js';
import { sheetLayout, type Box, type SheetLayout } from './layout.js';
import { columnsFor, lookupTable, shortLabel, type FamilyKind, type LookupTable } from './lookup-table.js';
import { simplifyIndices } from './simplify.js';
import { AVG_CHAR_EM, COLOURS, curveColour, TEXT_STYLES, type TextStyle } from './style.js';

export interface SheetContext {
  set: ResolvedChartSet;
  sheet: ResolvedSheet;
  family: CurveFamily;
  /** 1-based position of the sheet in its book */
  sheetNumber: number;
  sheetCount: number;
  /** e.g. "pmchart 0.1.0" */
  generator: string;
}

export interface CurveRow { curve: string; family: FamilyKind; i: number; M: number; P: number; colour: string }
export interface CurveLabelRow { M: number; P: number; text: string; colour: string; z: number }
export interface RefRow { line: string; kind: 'strain' | 'ray' | 'cap' | 'zero'; i: number; M: number; P: number }
export interface RefLabelRow { kind: 'strain' | 'ray' | 'cap'; M: number; P: number; text: string; z: number }
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
  overlay?: { domainM: [number, number]; domainP: [number, number] };
}

export interface BuiltSheet {
  template: TemplateParams;
  data: SheetData;
  table: LookupTable;
}

/** Where a ρg label sits on its curve, as a fraction of the curve's pure-tension force. */
const LABEL_LEVEL = 0.33;

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

  plotLayers(ctx, L, template.families, primary, divisor, data);
  const deco = new Deco(L, data);
  header(ctx, deco);
  lookupPanel(ctx, table, primary, deco);
  sidePanel(ctx, deco);
  titleBlock(ctx, deco);
  return { template, data, table };
}

/** A curve's label: "ρg 0.02", or "ω 0.2" on ω sets (the value the set asked for, not a rounded conversion). */
export function curveKeyText(set: Pick<ResolvedChartSet, 'ratios'>, rho: number, k: number): string {
  const { kind, values } = set.ratios;
  return `${RATIO_SYMBOL[kind]} ${fmt(kind === 'omega' ? values[k]! : rho, 4)}`;
}

// ── plot ────────────────────────────────────────────────────────────────────────────────────────

export function plotLayers(ctx: { family: CurveFamily; set: Pick<ResolvedChartSet, 'referenceLines' | 'ratios'> }, templateLayout: SheetLayout, families: FamilyKind[], primary: FamilyKind, d: number, out: SheetData): void {
  const { family, set } = ctx;
  const n = family.curves.length;
  // Points per page point: from the extent of the outermost curve and the plot box.
  const L = templateLayout;
  const last = family.curves[n - 1];
  let mSpan = 0;
  let pSpan = 0;
  if (last) {
    for (const arr of [last.Mn, last.phiMn]) for (const v of arr) mSpan = Math.max(mSpan, v / d);
    let lo = 0;
    let hi = 0;
    for (const arr of [last.Pn, last.phiPn]) for (const v of arr) ((lo = Math.min(lo, v / d)), (hi = Math.max(hi, v / d)));
    pSpan = hi - lo;
  }
  const sx = L.plot.w / (1.2 * mSpan || 1);
  const sy = L.plot.h / (1.04 * pSpan || 1);
  family.curves.forEach((c, k) => {
    const colour = curveColour(k, n);
    for (const fam of families) {
      const P = fam === 'design' ? c.phiPn : c.Pn;
      const M = fam === 'design' ? c.phiMn : c.Mn;
      const id = `${fam}-${c.rho}`;
      // drawn within SIMPLIFY_TOLERANCE_PT of every computed point
      const keep = simplifyIndices(Array.from(M, (v) => (v / d) * sx), Array.from(P, (v) => (v / d) * sy), SIMPLIFY_TOLERANCE_PT);
      keep.forEach((i, j) => out.curves.push({ curve: id, family: fam, i: j, M: r5(M[i]! / d), P: r5(P[i]! / d), colour }));
    }
  });

  // ρg labels sit on the tension branch, each at a third of its own pure-tension force: the labels
  // step down diagonally, where the curves run nearly parallel and well apart.
  const tensionP = (k: number) => (family.curves[k]!.keyPoints.find((p) => p.id === 'pure-tension')?.[primary]?.P ?? 0) / d;
  family.curves.forEach((c, k) => {
    const level = LABEL_LEVEL * tensionP(k);
    const P = primary === 'design' ? c.phiPn : c.Pn;
    const M = primary === 'design' ? c.phiMn : c.Mn;
    for (let i = 1; i < P.length; i++) {
      const p0 = P[i - 1]! / d;
      const p1 = P[i]! / d;
      if (p0 <= level && p1 >= level) {
        const t = p1 === p0 ? 0 : (level - p0) / (p1 - p0);
        const m = (M[i - 1]! + t * (M[i]! - M[i - 1]!)) / d;
        out.curveLabels.push({ M: r5(m), P: r5(level), text: curveKeyText(set, c.rho, k), colour: curveColour(k, n), z: out.curveLabels.length });
        break;
      }
    }
  });

  const pointsOf = (id: string): { rho: number; v: PointValues }[] =>
    family.curves.flatMap((c) => {
      const v = c.keyPoints.find((p) => p.id === id)?.[primary];
      return v ? [{ rho: c.rho, v }] : [];
    });

  out.refs.push({ line: 'zero', kind: 'zero', i: 0, M: 0, P: 0 });
  let mMax = 0;
  let pMax = 0;
  let pMin = 0;
  for (const c of out.curves) {
    mMax = Math.max(mMax, c.M);
    pMax = Math.max(pMax, c.P);
    pMin = Math.min(pMin, c.P);
  }
  out.refs.push({ line: 'zero', kind: 'zero', i: 1, M: r5(mMax * 1.06), P: 0 });

  if (set.referenceLines.strainStates) {
    for (const s of family.basis.strainStates) {
      const pts = pointsOf(s.id);
      pts.forEach((p, i) => out.refs.push({ line: `strain-${s.id}`, kind: 'strain', i, M: r5(p.v.M / d), P: r5(p.v.P / d) }));
      const last = pts[pts.length - 1];
      if (last) out.refLabels.push({ kind: 'strain', M: r5(last.v.M / d), P: r5(last.v.P / d), text: shortLabel({ id: s.id, label: s.label }), z: out.refLabels.length });
    }
  }
  if (set.referenceLines.axialCap) {
    const pts = pointsOf('axial-cap');
    pts.forEach((p, i) => out.refs.push({ line: 'cap', kind: 'cap', i, M: r5(p.v.M / d), P: r5(p.v.P / d) }));
    const last = pts[pts.length - 1];
    const sy = family.basis.symbols;
    if (last) out.refLabels.push({ kind: 'cap', M: r5(last.v.M / d), P: r5(last.v.P / d), text: `${primary === 'design' ? sy.designAxial : sy.nominalAxial},max`, z: out.refLabels.length });
  }
  // e/h rays: M/(Ag·h) = e/h · P/Ag, from the origin to just past the outermost curve.
  const outer = family.curves[n - 1];
  if (outer) {
    const fams = families.includes('nominal') ? 'nominal' : primary;
    const P = fams === 'design' ? outer.phiPn : outer.Pn;
    const M = fams === 'design' ? outer.phiMn : outer.Mn;
    for (const e of set.referenceLines.eccentricities) {
      let hit: [number, number] | null = null;
      for (let i = P.length - 1; i > 0 && !hit; i--) {
        const f0 = M[i]! - e * P[i]!;
        const f1 = M[i - 1]! - e * P[i - 1]!;
        if (f0 <= 0 && f1 > 0 && P[i - 1]! > 0) {
          const t = f0 / (f0 - f1);
          hit = [(M[i]! + t * (M[i - 1]! - M[i]!)) / d, (P[i]! + t * (P[i - 1]! - P[i]!)) / d];
        }
      }
      if (!hit) continue;
      const [m, p] = [hit[0] * 1.07, hit[1] * 1.07];
      out.refs.push({ line: `ray-${e}`, kind: 'ray', i: 0, M: 0, P: 0 }, { line: `ray-${e}`, kind: 'ray', i: 1, M: r5(m), P: r5(p) });
      out.refLabels.push({ kind: 'ray', M: r5(m), P: r5(p), text: `e/h ${fmt(e)}`, z: out.refLabels.length });
    }
  }
  // invisible frame: room right of the outermost curve for line labels
  out.frame.push({ M: 0, P: r5(pMin) }, { M: r5(mMax * 1.2), P: r5(pMax * 1.04) });
}

// ── decoration in page points ──────────────────────────────────────────────────────────────────

export class Deco {
  constructor(
    readonly L: SheetLayout,
    readonly out: SheetData,
  ) {}
  private ox = (x: number) => round(x - this.L.plot.x);
  private oy = (y: number) => round(y - this.L.plot.y);
  size = (style: TextStyle) => TEXT_STYLES[style].size * this.L.u;
  text(style: TextStyle, x: number, y: number, text: string, maxW?: number): void {
    const t = maxW === undefined ? text : truncate(text, maxW, this.size(style));
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
    for (const line of wrap(text, w, fs)) {
      this.text(style, x, y, line);
      y += fs * leading;
    }
    return y;
  }
}

export const estWidth = (s: string, fontSize: number) => s.length * AVG_CHAR_EM * fontSize;

export function truncate(s: string, w: number, fs: number): string {
  if (estWidth(s, fs) <= w) return s;
  const n = Math.max(1, Math.floor(w / (AVG_CHAR_EM * fs)) - 1);
  return `${s.slice(0, n).trimEnd()}…`;
}

export function wrap(text: string, w: number, fs: number): string[] {
  const max = Math.max(8, Math.floor(w / (AVG_CHAR_EM * fs)));
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (!word) continue;
    if (line && line.length + 1 + word.length > max) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  return lines;
}

function header(ctx: SheetContext, g: Deco): void {
  const { header: b, u } = g.L;
  g.rect({ x: b.x, y: b.y, w: 0.7 * u, h: b.h }, COLOURS.accent);
  const right = `sheet ${ctx.sheetNumber} of ${ctx.sheetCount}`;
  g.text('headerRight', b.x + b.w, b.y + b.h * 0.62, right);
  g.text('sheetTitle', b.x + 1.8 * u, b.y + b.h * 0.66, ctx.sheet.title, b.w - 1.8 * u - estWidth(right, g.size('headerRight')) - 3 * u);
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

function sidePanel(ctx: SheetContext, g: Deco): void {
  const { side: b, u } = g.L;
  const { family, sheet, set } = ctx;
  const basis = family.basis;

  // pictogram, to scale from the unit-depth bars of the family
  g.text('heading', b.x, b.y + 1.0 * u, 'Section (to scale)');
  const picH = Math.min(0.27 * b.h, 0.62 * b.w);
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
  g.text('dimLeft', xr + 1.0 * u, cy + 0.3 * u, `γh = ${sheet.gamma.toFixed(2)} h`);
  g.text('dim', cx, cy - hh - 1.0 * u, 'compression face');
  g.rule(cx - hw - 0.8 * u, cy, cx + hw + 0.8 * u, cy, COLOURS.faint, 0.4);
  g.text('caption', box.x + 0.8 * u, box.y + box.h - 0.8 * u, `${family.bars.length} bars, drawn at ρg = ${fmt(rhoShown, 4)}${set.ratios.kind === 'omega' ? ` (ω ${fmt(set.ratios.values[mid]!, 4)})` : ''}; thin line: bending axis`, box.w - 1.6 * u);

  // basis parameters
  let y = box.y + box.h + 2.4 * u;
  g.text('heading', b.x, y, `Basis: ${basis.title}`);
  y += 1.5 * u;
  const params = Object.entries(basis.parameters).map(([k, v]) => `${k} ${typeof v === 'number' ? fmt(v, 6) : v}`);
  y = g.paragraph('body', b.x, y, b.w, params.join('  ·  '));
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
  if (set.ratios.kind === 'omega') {
    const fyd = basis.design.steel.yieldStress;
    extra.unshift(
      `Curves per mechanical ratio ω = ρg·σy/${basis.symbols.normalisingStress}, σy = ${stressText(fyd, set.units)} the design yield stress: ρg = ω·${fmt(basis.normalisingStress / fyd, 4)} here.`,
    );
  }
  for (const note of [...basis.notes, ...extra]) {
    g.text('body', b.x, y, '•');
    y = g.paragraph('body', b.x + 1.0 * u, y, b.w - 1.0 * u, note) + 0.35 * u;
  }
  // caution, pinned to the bottom of the column
  const caution =
    'For use by qualified engineers only. Check every value against the governing code edition, the project specification and local practice; this sheet does not replace the judgement of the engineer of record.';
  const lines = wrap(caution, b.w - 2 * u, g.size('caution'));
  const ch = lines.length * g.size('caution') * 1.35 + 1.4 * u;
  const cTop = Math.max(y + 0.5 * u, b.y + b.h - ch);
  g.rect({ x: b.x, y: cTop, w: b.w, h: ch }, '#fbf1ef', COLOURS.caution, 0.7);
  g.paragraph('caution', b.x + u, cTop + 1.0 * u + 0.5 * g.size('caution'), b.w - 2 * u, caution, 1.35);
}

function titleBlock(ctx: SheetContext, g: Deco): void {
  const { titleBlock: b, u } = g.L;
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
  const rows: [string, string, number][][] = [
    [
      ['office', tb.office, 3],
      ['project', tb.project, 3],
      ['sheet title', sheet.title, 4.6],
      ['sheet', `${ctx.sheetNumber} of ${ctx.sheetCount}`, 1.1],
    ],
    [
      ['design basis', basis.title, 1.3],
      ['materials', `${sy.concreteStrength} ${stressText(sheet.fc, set.units)} · ${sy.steelStrength} ${stressText(sheet.fy, set.units)}`, 1.9],
      ['γ', sheet.gamma.toFixed(2), 0.6],
      ['shape · bars', `${describeShape(sheet.shape)} · ${describeArrangement(sheet.arrangement)}`, 3.7],
      ['transverse', describeTransverse(sheet.transverse), 0.9],
      ['prepared · checked', [tb.preparedBy, tb.checkedBy].filter(Boolean).join(' · ') || '—', 1.5],
      ['rev.', tb.revision, 0.5],
      ['date', tb.date, 1.1],
      ['generated by', ctx.generator, 1.4],
    ],
    [
      ['factors', basis.factorSummary, 4.6],
      ['normalisation', normalisationText(set, sy, P, M, basis.normalisingStress), 4.6],
      ['curves', curves, 2.4],
    ],
  ];
  g.rect(b, COLOURS.paper, COLOURS.ink, 0.9);
  const rowH = b.h / rows.length;
  rows.forEach((cells, r) => {
    const y = b.y + r * rowH;
    if (r > 0) g.rule(b.x, y, b.x + b.w, y, COLOURS.ink, 0.5);
    const total = cells.reduce((s, c) => s + c[2], 0);
    let x = b.x;
    cells.forEach(([cap, val, wgt], k) => {
      const w = (b.w * wgt) / total;
      if (k > 0) g.rule(x, y, x, y + rowH, COLOURS.ink, 0.5);
      g.text('caption', x + 0.7 * u, y + 1.05 * u, cap.toUpperCase(), w - 1.4 * u);
      g.text(r === 0 && k !== 2 ? 'valueBold' : 'value', x + 0.7 * u, y + rowH - 0.9 * u, val, w - 1.4 * u);
      x += w;
    });
  });
}
