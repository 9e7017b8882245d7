/**
 * `pmchart check --report FILE.pdf|svg`: a one-page calculation sheet.
 *
 *   check outcome ──1──▶ curve family at the actual γ ──2──▶ page (plot + panels) ──3──▶ SVG / PDF bytes
 *                        src/design/check-curves.ts         this file, src/chart       src/render
 *
 * This file computes no figure: the family, the extra curves and the checked section of the contour come
 * from src/design/check-curves.ts (which the page shares), the tables and words from src/report/check-view.ts.
 *
 * 1. The φ-factored family at the standard ρg steps of the emulated charts, plus the curve at the governing
 *    load's ρg required; every load plotted at its normalised point, labelled, the governing one marked.
 * 2. Panels: inputs, the Mx–My contour at the governing Pu when there are biaxial results, the results table,
 *    biaxial and slenderness tables, bar proposals, the slenderness steps of the governing load, the basis
 *    notes and the check's assumptions, the caution, a title block. Tables longer than the page are cut with
 *    a note: the .txt and .json reports hold every row.
 * 3. The sheet's vega-lite template with its load overlay (src/chart/spec.ts); the contour is an inset.
 */
import { contourSpec } from '../chart/contour-spec.js';
import type { Box, SheetLayout } from '../chart/layout.js';
import { roundStep } from '../chart/axes.js';
import { LOAD_MARK_WORDS } from '../chart/spec.js';
import { breakLines, Deco, drawTitleBlock, estWidth, logoInner, plotLayers, wrap, type LoadLabelRow, type LogoRef, type SheetData, type TemplateParams } from '../chart/sheet-data.js';
import { COLOURS, TEXT_STYLES, type TextStyle } from '../chart/style.js';
import { estimateText, type MeasureText } from '../chart/labels.js';
import { contourPlot } from '../chart/contour-plot.js';
import { strainClassWord } from '../codes/types.js';
import type { ColumnCheck, ColumnLoadResult } from '../design/column-check.js';
import { arrangementName, barsUnmetLine, barsView, biaxialView, noteText, resultsFootnotes, resultsView, slendernessView, STATUS_WORDS, symbolsOf, type TableView } from '../report/check-view.js';
import { cell as f, fmt } from '../report/format.js';
import { checkedSection, checkFamily } from '../design/check-curves.js';
import type { Inset } from '../render/renderer.js';
import { DISPLAY_UNITS, toDisplay, type UnitSystem } from '../units/index.js';
import { SHEET_BASE_POINTS } from './curves.js';

export interface CheckReportInput {
  check: ColumnCheck;
  /** the check's own assumptions and notes (besides basis.notes) */
  assumptions: string[];
  caution: string;
  date: string;
  project?: string;
  office?: string;
  /** the column mark (e.g. "C-14"), named in the header and the title block */
  mark?: string;
  preparedBy?: string;
  checkedBy?: string;
  revision?: string;
  /** the office logo (src/sheet/logo.ts), drawn in the title block's fixed box */
  logo?: LogoRef;
  generator: string;
  /** text widths with the sheet typeface (SheetRenderer.measureText); default an estimate */
  measureText?: MeasureText;
}

export interface CheckReportPage {
  template: TemplateParams;
  data: SheetData;
  insets: Inset[];
  title: string;
}

/** Loads labelled on the plot: the governing one and the next in rank (a label per point would not read). */
export const LABELLED_LOADS = 12;

/** Page size of the report: tabloid landscape for US units, A3 landscape for SI (as chart sheets). */
export function reportPaper(units: UnitSystem): { w: number; h: number } {
  return units === 'us' ? { w: 1224, h: 792 } : { w: 1190.55, h: 841.89 };
}

interface ReportLayout extends SheetLayout {
  colA: Box;
  colB: Box;
  colC: Box;
  /** results and tables, under the plot, across columns A and B */
  bottom: Box;
}

/** `captionH`: the height of the caption under the plot (all its lines). */
function reportLayout(W: number, H: number, plotShare: number, captionH = 4.0 * (Math.min(W, H) / 100 + 0.8), minBottom = 0): ReportLayout {
  const u = Math.min(W, H) / 100 + 0.8;
  const m = 3.2 * u;
  const gap = 2.2 * u;
  const header: Box = { x: m, y: m, w: W - 2 * m, h: 4.2 * u };
  // two rows: office, project, column mark, sheet; basis, section, people, revision, date, generator
  const titleBlock: Box = { x: m, y: H - m - 6.4 * u, w: W - 2 * m, h: 6.4 * u };
  const top = header.y + header.h + gap;
  const bottomY = titleBlock.y - gap;
  const bw = W - 2 * m;
  const colA: Box = { x: m, y: top, w: 0.4 * bw, h: bottomY - top };
  const colB: Box = { x: colA.x + colA.w + gap, y: top, w: 0.27 * bw - gap, h: bottomY - top };
  const colC: Box = { x: colB.x + colB.w + gap, y: top, w: W - m - (colB.x + colB.w + gap), h: bottomY - top };
  const plotTop = top + 2.4 * u;
  const plotH = plotShare * colA.h - 2.4 * u - 4.6 * u;
  const plot: Box = { x: m + 6.2 * u, y: plotTop, w: colA.w - 6.2 * u - 0.6 * u, h: plotH };
  // the tables start under the plot's caption and under column B's panels (minBottom)
  const bTop = Math.max(plot.y + plot.h + 4.6 * u + captionH + 0.6 * u, minBottom);
  const bottom: Box = { x: m, y: bTop, w: colB.x + colB.w - m, h: bottomY - bTop };
  return { page: { w: W, h: H }, u, header, plot, table: bottom, side: colC, titleBlock, colA, colB, colC, bottom };
}

/** A round step for about `n` ticks over `span`: 1, 2, 2.5 or 5 × 10^k. */
function niceStep(span: number, n: number): number {
  const raw = span / n;
  const p = 10 ** Math.floor(Math.log10(raw));
  for (const k of [1, 2, 2.5, 5, 10]) if (k * p >= raw) return k * p;
  return 10 * p;
}

const r5 = (x: number): number => Math.round(x * 1e5) / 1e5 + 0;

export function buildCheckReport(input: CheckReportInput): CheckReportPage {
  const c = input.check;
  const b = c.basis;
  const u = c.units;
  const paper = reportPaper(u);
  const measure = input.measureText ?? estimateText;
  const captionLines = plotCaptionLines(c, reportLayout(paper.w, paper.h, 0.5), measure);
  const captionH = captionLines.length * TEXT_STYLES.caption.size * (Math.min(paper.w, paper.h) / 100 + 0.8) * 1.3 + 0.4 * (Math.min(paper.w, paper.h) / 100 + 0.8);
  // the largest plot that leaves every table under it whole (a figure is never cut for a bigger plot)
  const fit = fittingShare(paper, c, captionH, measure);
  const L = reportLayout(paper.w, paper.h, fit.share, captionH, fit.minBottom);
  const data: SheetData = { curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [], loadMarks: [], loadLabels: [], extraCurves: [] };
  const g = new Deco(L, data, measure);

  // 1. the family at the actual γ, the governing curve, the loads
  const family = checkFamily(c, SHEET_BASE_POINTS);
  const plotCtx = { family, set: { referenceLines: { strainStates: true, eccentricities: [0.1, 0.25, 0.5, 1], axialCap: true }, ratios: { kind: 'rhoG' as const, values: [...c.chart.rhos] } } };
  // a first pass fits the axes to the curves and the loads; the second places the curves' labels at that
  // scale, near the loads' axial levels and clear of their marks
  const scratch: SheetData = { curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [] };
  plotLayers(plotCtx, L, ['design'], 'design', 1, scratch);
  const gov = c.results[0];
  const req = gov?.rhoRequired ?? null;
  const onStep = (rho: number) => c.chart.rhos.some((r) => Math.abs(r - rho) < 5e-4);
  if (gov && req !== null && !onStep(req)) extraCurve(c, req, `ρg req ${fmt(req, 4)}`, data);
  const checked = c.checked?.rho;
  if (checked !== undefined && !onStep(checked) && (req === null || Math.abs(checked - req) >= 5e-4)) extraCurve(c, checked, `checked ρg ${fmt(checked, 4)}`, data);
  const domain = plotDomain({ ...scratch, extraCurves: data.extraCurves ?? [] }, c.results);
  const px = (M: number) => ((M - domain.domainM[0]) / (domain.domainM[1] - domain.domainM[0])) * L.plot.w;
  const py = (P: number) => L.plot.h - ((P - domain.domainP[0]) / (domain.domainP[1] - domain.domainP[0])) * L.plot.h;
  const shown = c.results.filter((r) => Number.isFinite(r.chartM) && Number.isFinite(r.normalised.P));
  // the loads' labels first (clear of the extra curves' labels), then the curves' labels clear of them
  placeLoads(L, domain, c.results, data);
  const keepClear = [
    ...(data.loadLabels ?? []).map((l) => {
      const fs = (l.governing ? 0.86 : 0.76) * L.u;
      return { x0: l.x - 1, y0: l.y - 0.65 * fs, x1: l.x + estWidth(l.text, fs) + 3, y1: l.y + 0.65 * fs };
    }),
    ...shown.map((r) => ({ x0: px(r.chartM) - 0.9 * L.u, y0: py(r.normalised.P) - 0.9 * L.u, x1: px(r.chartM) + 0.9 * L.u, y1: py(r.normalised.P) + 0.9 * L.u })),
    ...data.curveLabels.map((l) => {
      const w = estWidth(l.text, 0.82 * L.u);
      return { x0: px(l.M) - w / 2, y0: py(l.P) - 0.6 * L.u, x1: px(l.M) + w / 2, y1: py(l.P) + 0.6 * L.u };
    }),
  ];
  plotLayers(plotCtx, L, ['design'], 'design', 1, data, {
    axes: { M: { domain: domain.domainM, step: roundStep(domain.domainM[1] - domain.domainM[0], 10) }, P: { domain: domain.domainP, step: roundStep(domain.domainP[1] - domain.domainP[0], 12) } },
    focusP: shown.slice(0, 12).map((r) => r.normalised.P),
    reserved: keepClear,
  });

  const sy = b.symbols;
  const su = DISPLAY_UNITS[u].stress;
  const vs = symbolsOf(c);
  const hSym = vs.depth;
  const template: TemplateParams = {
    layout: L,
    xTitle: `${sy.designMoment} / (Ag · ${hSym}),  ${vs.M} / (Ag · ${hSym})   (${su})`,
    yTitle: `${sy.designAxial} / Ag,  ${vs.P} / Ag   (${su})`,
    families: ['design'],
    overlay: domain,
    ...(input.logo ? { logo: logoInner(L) } : {}),
  };

  // 2. panels
  const title = `Column check${input.mark ? ` ${input.mark}` : ''}: ${sectionText(c)}`;
  header(g, title, input);
  g.text('heading', L.colA.x, L.colA.y + 1.0 * L.u, `Loads on the ${sy.designFamily} curves at the actual γ = ${fmt(c.gamma, 4)}`);
  plotCaption(g, L, captionLines);
  const insets: Inset[] = [];
  const yB = inputsPanel(g, L, c);
  if (c.biaxial && c.checked && gov) contourPanel(g, L, c, gov, yB, insets);
  else if (gov) summaryPanel(g, L, c, yB);
  bottomTables(new Flow(g, L.bottom, fit.small), c);
  sidePanel(g, L, c, input);
  titleBlock(g, c, input);
  return { template, data, insets, title };
}

/**
 * The plot's share of the column: from 62 % down to 40 % in steps of 2.5 %, the first at which the tables under the
 * plot (and under column B's panels) are drawn whole, tried on a scratch layer; the smallest when none is.
 */
function fittingShare(paper: { w: number; h: number }, c: ColumnCheck, captionH: number, measure: MeasureText): { share: number; minBottom: number; small: boolean } {
  const start = MAX_PLOT_SHARE;
  const blank = (): SheetData => ({ curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [] });
  // the tables run under column B too: they start below its inputs and its contour (at least MIN_CONTOUR units) or summary
  const L0 = reportLayout(paper.w, paper.h, start, captionH);
  const g0 = new Deco(L0, blank(), measure);
  const yB = inputsPanel(g0, L0, c);
  const gov = c.results[0];
  const contour = c.biaxial && c.checked && gov;
  const summaryEnd = !contour && gov ? summaryPanel(g0, L0, c, yB) + 0.6 * L0.u : yB;
  // the contour inset at a good size, then smaller; per size, shares from the largest; per share, the tables at the
  // cell size, then all in the smaller type
  for (const side of contour ? CONTOUR_SIDES : [0]) {
    const colBEnd = contour ? yB + (1.8 + side + 5.6) * L0.u : summaryEnd;
    for (let s = start; s >= MIN_PLOT_SHARE - 1e-9; s -= 0.025) {
      for (const small of [false, true]) {
        const L = reportLayout(paper.w, paper.h, s, captionH, colBEnd);
        const scratch = new Flow(new Deco(L, blank(), measure), L.bottom, small);
        bottomTables(scratch, c);
        if (!scratch.cut) return { share: s, minBottom: colBEnd, small };
      }
    }
  }
  const side = CONTOUR_SIDES[CONTOUR_SIDES.length - 1]!;
  return { share: MIN_PLOT_SHARE, minBottom: contour ? yB + (1.8 + side + 5.6) * L0.u : summaryEnd, small: true };
}

/** Largest share of the column height the plot takes (a short check). */
const MAX_PLOT_SHARE = 0.62;
/** Smallest share of the column height the plot is given to make room for the tables (the plot is the sheet's point). */
const MIN_PLOT_SHARE = 0.4;
/** Sides of the Mx–My contour inset tried (the larger first), type units; the last is its smallest. */
const CONTOUR_SIDES = [16, 12, 9];
const MIN_CONTOUR = 9;

/** The tables under the plot: results, biaxial methods, slenderness, bar proposals. */
function bottomTables(bottom: Flow, c: ColumnCheck): void {
  if (bottom.heading('Results (governing load first)', Math.min(2, c.results.length))) {
    // many loads cannot all be drawn: past the first dozen, rows may go to the text and JSON reports
    bottom.table(columns(resultsView(c)), resultsView(c).rows, resultsView(c).marked, (n) => `${n} more loads, in rank order: the .txt and .json reports list every load.`, LABELLED_LOADS);
    bottom.note([`Summary: ${c.summary.text}.`, ...resultsFootnotes(c)].join(' '));
  }
  const bx = biaxialView(c);
  if (bx && bottom.heading('Biaxial bending: three methods side by side (checked reinforcement; above 1 fails)', Math.min(2, c.results.length))) bottom.table(columns(bx), bx.rows, bx.marked, undefined, LABELLED_LOADS);
  const sl = slendernessView(c);
  if (sl && bottom.heading(`Slenderness: ${sl.method}`, 2)) bottom.table(columns(sl.table), sl.table.rows, sl.table.marked, undefined, 2 * LABELLED_LOADS);
  const bars = barsView(c);
  if (bottom.heading('Bar proposals (lightest first, re-verified with the discrete bars against every load and effect)', typeof bars === 'string' ? 0 : Math.min(2, bars.rows.length))) {
    if (typeof bars === 'string') bottom.note(bars, 'body');
    else bottom.table(columns(bars), bars.rows, bars.rows.map((_, i) => i === 0));
    const unmet = barsUnmetLine(c);
    if (unmet) bottom.note(unmet, 'body');
  }
}

function sectionText(c: ColumnCheck): string {
  const un = DISPLAY_UNITS[c.units];
  const sy = c.basis.symbols;
  const dims = c.shape.kind === 'rectangle' ? `${fmt(c.shape.b)} × ${fmt(c.shape.h)} ${un.length}` : `D = ${fmt(c.shape.diameter)} ${un.length}`;
  return `${dims} ${c.basis.transverse}, ${arrangementName(c.arrangement)}, ${sy.concreteStrength} ${fmt(c.basis.fc)} ${un.stress}, ${sy.steelStrength} ${fmt(c.basis.fy)} ${un.stress}, γ ${fmt(c.gamma, 3)}${c.gammaB !== null ? `, γB ${fmt(c.gammaB, 3)}` : ''}`;
}

/** Columns of a shared table view for the drawn table: the view's own headings, units and alignment (the first column names the load). */
function columns(t: TableView): { head: string; unit?: string; align: 'l' | 'r' }[] {
  return t.columns.map((c) => ({ head: c.key === 'id' ? 'load' : c.heading, ...(c.unit ? { unit: c.unit } : {}), align: c.align === 'left' ? ('l' as const) : ('r' as const) }));
}

// ── plot ────────────────────────────────────────────────────────────────────────────────────────

function extraCurve(check: ColumnCheck, rho: number, label: string, data: SheetData): void {
  const c = checkFamily(check, SHEET_BASE_POINTS, [rho]).curves[0]!;
  const rows = Array.from(c.phiPn, (P, i) => ({ curve: label, i, M: r5(c.phiMn[i]!), P: r5(P) }));
  data.extraCurves!.push(...rows);
  // label on the compression side, clear of the ρg labels on the tension branch
  const pMax = Math.max(...rows.map((p) => p.P));
  const at = [...rows].reverse().find((p) => p.P <= 0.55 * pMax && p.P > 0);
  if (at) data.curveLabels.push({ M: at.M, P: at.P, text: label, colour: COLOURS.ink, z: data.curveLabels.length });
}

function plotDomain(data: SheetData, results: readonly ColumnLoadResult[]): { domainM: [number, number]; domainP: [number, number] } {
  let mMax = 0;
  let mMin = 0;
  let pMax = 0;
  let pMin = 0;
  for (const c of [...data.curves, ...(data.extraCurves ?? [])]) {
    mMax = Math.max(mMax, c.M);
    mMin = Math.min(mMin, c.M);
    pMax = Math.max(pMax, c.P);
    pMin = Math.min(pMin, c.P);
  }
  for (const r of results) {
    if (!Number.isFinite(r.chartM) || !Number.isFinite(r.normalised.P)) continue;
    mMax = Math.max(mMax, r.chartM);
    mMin = Math.min(mMin, r.chartM);
    pMax = Math.max(pMax, r.normalised.P);
    pMin = Math.min(pMin, r.normalised.P);
  }
  // a layout not symmetric about the bending axis has a negative branch too (M < 0)
  const sm = niceStep((mMax - mMin) * 1.18, 10);
  const sp = niceStep((pMax - pMin) * 1.06, 12);
  return { domainM: [mMin < 0 ? Math.floor((mMin * 1.18) / sm) * sm : 0, Math.ceil((mMax * 1.18) / sm) * sm], domainP: [Math.floor((pMin * 1.04) / sp) * sp, Math.ceil((pMax * 1.04) / sp) * sp] };
}

/** Load marks in chart units; labels in points from the plot origin, set beside their mark where they collide with no other label. */
function placeLoads(L: SheetLayout, d: { domainM: [number, number]; domainP: [number, number] }, results: readonly ColumnLoadResult[], data: SheetData): void {
  const px = (M: number) => ((M - d.domainM[0]) / (d.domainM[1] - d.domainM[0])) * L.plot.w;
  const py = (P: number) => L.plot.h - ((P - d.domainP[0]) / (d.domainP[1] - d.domainP[0])) * L.plot.h;
  const placed: { x0: number; y0: number; x1: number; y1: number }[] = [];
  // labels of the extra curves (centred on their point) are obstacles too
  for (const c of data.curveLabels) {
    const w = estWidth(c.text, 0.82 * L.u);
    placed.push({ x0: px(c.M) - w / 2, y0: py(c.P) - 0.6 * L.u, x1: px(c.M) + w / 2, y1: py(c.P) + 0.6 * L.u });
  }
  const marks = results.filter((r) => Number.isFinite(r.chartM) && Number.isFinite(r.normalised.P));
  // marks drawn in reverse rank, so the governing one sits on top
  [...marks].reverse().forEach((r, z) => data.loadMarks!.push({ id: r.id, M: r5(r.chartM), P: r5(r.normalised.P), governing: r.governing ? 1 : 0, z }));
  for (const p of marks) placed.push({ x0: px(p.chartM) - 3, y0: py(p.normalised.P) - 3, x1: px(p.chartM) + 3, y1: py(p.normalised.P) + 3 });
  const labels: LoadLabelRow[] = [];
  marks.slice(0, LABELLED_LOADS).forEach((r) => {
    const x = px(r.chartM);
    const y = py(r.normalised.P);
    const fs = (r.governing ? 0.86 : 0.76) * L.u;
    const w = estWidth(r.id, fs) + 2;
    const h = fs * 1.2;
    const off = 0.55 * L.u + (r.governing ? 2.5 : 0);
    const tries: [number, number][] = [
      [x + off, y - off],
      [x + off, y + off],
      [x - off - w, y - off],
      [x - off - w, y + off],
      [x + off, y - off - h],
      [x + off, y + off + h],
    ];
    const fits = (lx: number, ly: number) => lx >= 0 && lx + w <= L.plot.w && ly - h / 2 >= 0 && ly + h / 2 <= L.plot.h;
    const free = (lx: number, ly: number) => !placed.some((q) => lx < q.x1 && lx + w > q.x0 && ly - h / 2 < q.y1 && ly + h / 2 > q.y0);
    const spot = tries.find(([lx, ly]) => fits(lx, ly) && free(lx, ly)) ?? tries.find(([lx, ly]) => fits(lx, ly)) ?? tries[0]!;
    placed.push({ x0: spot[0], y0: spot[1] - h / 2, x1: spot[0] + w, y1: spot[1] + h / 2 });
    labels.push({ x: Math.round(spot[0] * 100) / 100, y: Math.round(spot[1] * 100) / 100, text: r.id, governing: r.governing ? 1 : 0, z: labels.length });
  });
  for (const l of labels) data.loadLabels!.push(l); // no spread: 200k loads overflow the call stack
}

/** The caption under the plot, in lines of the column's width (every line is drawn: nothing is cut). */
function plotCaptionLines(c: ColumnCheck, L: ReportLayout, measure: MeasureText): string[] {
  const n = c.results.length;
  const gov = c.results[0];
  const vs = symbolsOf(c);
  const slender = `${c.slenderness ? ' Moments as checked: magnified for slenderness.' : ''}${c.biaxial ? ` The chart shows ${vs.M} about x${c.shape.kind === 'circle' ? ' (the resultant for a circle)' : ''}; ${vs.M}y enters the biaxial check.` : ''}`;
  const text = `Curves at ρg ${c.chart.rhos.map((r) => fmt(r, 3)).join(', ')}; dashed ink: ρg required of the governing load and the checked ρg, where they fall between the steps. ${LOAD_MARK_WORDS.mark[0]!.toUpperCase()}${LOAD_MARK_WORDS.mark.slice(1)}: the ${n} load${n === 1 ? '' : 's'} at (${vs.M}/(Ag·${vs.depth}), ${vs.P}/Ag), ${LOAD_MARK_WORDS.ray}; ${LOAD_MARK_WORDS.governing}: governing${gov ? ` (${gov.id})` : ''}${n > LABELLED_LOADS ? `; the first ${LABELLED_LOADS} by rank are labelled` : ''}.${slender}`;
  const fs = TEXT_STYLES.caption.size * L.u;
  return wrap(text, L.colA.w, fs, (s, f) => measure(s, f, false));
}

function plotCaption(g: Deco, L: ReportLayout, lines: readonly string[]): void {
  let y = L.plot.y + L.plot.h + 4.6 * L.u + 0.4 * L.u;
  for (const line of lines) {
    g.text('caption', L.colA.x, y, line);
    y += g.size('caption') * 1.3;
  }
}

// ── panels ──────────────────────────────────────────────────────────────────────────────────────

function header(g: Deco, title: string, input: CheckReportInput): void {
  const { header: b, u } = g.L;
  g.rect({ x: b.x, y: b.y, w: 0.7 * u, h: b.h }, COLOURS.accent);
  const right = 'calculation sheet · 1 of 1';
  g.text('headerRight', b.x + b.w, b.y + b.h * 0.62, right);
  const room = b.w - 1.8 * u - g.width('headerRight', right) - 3 * u;
  // the title whole: full size, smaller, or in lines of smaller type; never cut
  if (g.width('sheetTitle', title) <= room) g.text('sheetTitle', b.x + 1.8 * u, b.y + b.h * 0.66, title);
  else if (g.width('sheetTitleMid', title) <= room) g.text('sheetTitleMid', b.x + 1.8 * u, b.y + b.h * 0.62, title);
  else {
    const style: TextStyle = 'sheetTitleSmall';
    const lines = breakLines(g, g.width(style, title) <= 2 * room ? style : 'valueBoldSmall', title, room);
    const st: TextStyle = g.width(style, title) <= 2 * room ? style : 'valueBoldSmall';
    const fs = g.size(st);
    const top = b.y + b.h / 2 - (fs * 1.12 * (lines.length - 1)) / 2 + 0.35 * fs;
    lines.forEach((l, i) => g.text(st, b.x + 1.8 * u, top + i * fs * 1.12, l));
  }
  g.rule(b.x, b.y + b.h + 0.6 * u, b.x + b.w, b.y + b.h + 0.6 * u, COLOURS.rule, 0.8);
  void input;
}

function inputsPanel(g: Deco, L: ReportLayout, c: ColumnCheck): number {
  const { colB: b, u } = L;
  const un = DISPLAY_UNITS[c.units];
  const sy = c.basis.symbols;
  let y = b.y + 1.0 * u;
  g.text('heading', b.x, y, 'Inputs');
  y += 1.6 * u;
  const rows: [string, string][] = [
    ['design basis', c.basis.title],
    ['section', c.shape.kind === 'rectangle' ? `b × h = ${fmt(c.shape.b)} × ${fmt(c.shape.h)} ${un.length}, ${c.basis.transverse}` : `D = ${fmt(c.shape.diameter)} ${un.length}, ${c.basis.transverse}`],
    ['materials', `${sy.concreteStrength} = ${fmt(c.basis.fc)} ${un.stress}, ${sy.steelStrength} = ${fmt(c.basis.fy)} ${un.stress}`],
    ['bars', `${arrangementName(c.arrangement)}, γ = ${fmt(c.gamma, 4)} (${c.gammaSource === 'given' ? 'given' : 'from cover, tie and bar'})${c.gammaB !== null ? `, γB = ${fmt(c.gammaB, 4)} (given)` : ''}`],
    ['checked steel', c.checked ? `${c.checked.description} (ρg = ${f(c.checked.rho)})` : 'none given: ρg required only'],
    ['loads', `${c.results.length} factored combination${c.results.length === 1 ? '' : 's'}, governing ${c.governingId ?? '—'}`],
    ['status', c.summary.text],
    ['chart sheets read', `γ = ${c.chart.lower}${c.chart.upper !== null ? ` and ${c.chart.upper}` : ''} (step ${c.chart.gammaStep})`],
  ];
  const kw = 8.2 * u;
  for (const [k, v] of rows) {
    g.text('caption', b.x, y, k);
    y = g.paragraph('body', b.x + kw, y, b.w - kw, v, 1.3);
    y += 0.15 * u;
  }
  const params = Object.entries(c.basis.parameters).map(([k, v]) => `${k} ${typeof v === 'number' ? fmt(v, 5) : v}`);
  g.text('caption', b.x, y, 'parameters');
  y = g.paragraph('body', b.x + kw, y, b.w - kw, params.join(' · '), 1.3);
  return y + 0.8 * u;
}

function contourPanel(g: Deco, L: ReportLayout, c: ColumnCheck, gov: ColumnLoadResult, y: number, insets: Inset[]): number {
  const { colB: b, u } = L;
  const load = { Pu: gov.Pu, Mu: gov.Mu, Muy: gov.Muy ?? 0 };
  const un = DISPLAY_UNITS[c.units];
  const vs = symbolsOf(c);
  g.text('heading', b.x, y + 1.0 * u, `Mx–My contour at ${vs.P} of ${gov.id}`);
  y += 1.8 * u;
  const { section: sec, minP, maxP } = checkedSection(c)!;
  // the caption under the inset (about three lines) ends above the tables
  const bottomLimit = L.bottom.y - 4.8 * u;
  if (load.Pu > maxP || load.Pu <= minP) {
    return g.paragraph('body', b.x, y + 1.0 * u, b.w, `${vs.P} = ${f(toDisplay(load.Pu, 'force', c.units), 5)} ${un.force} is outside the axial range of the section: no contour.`) + u;
  }
  const size = Math.max(MIN_CONTOUR * u, Math.min(b.w, bottomLimit - y));
  const box: Box = { x: b.x, y, w: b.w, h: size };
  const left = 5.4 * u;
  const bottom = 4.4 * u;
  const side = Math.min(box.w - left - 0.8 * u, box.h - bottom - 0.6 * u);
  const plot: Box = { x: left + (box.w - left - 0.8 * u - side) / 2, y: 0.6 * u, w: side, h: side };
  const cp = contourPlot(sec, load.Pu, [{ id: gov.id, Mux: load.Mu, Muy: load.Muy, governing: true }], c.units, { page: { w: box.w, h: box.h }, plot, u });
  const spec = contourSpec({ ...cp, xTitle: `Mx   (${un.moment})`, yTitle: `My   (${un.moment})` });
  insets.push({ spec, x: Math.round(box.x * 100) / 100, y: Math.round(box.y * 100) / 100 });
  g.paragraph('caption', b.x, box.y + box.h + 1.0 * u, b.w, `${c.basis.symbols.designFamily} contour of the actual bars at ${vs.P} = ${f(toDisplay(load.Pu, 'force', c.units), 5)} ${un.force}, both axes to one scale; Mx bends the depth h, My the width b; the diamond is (${vs.M}x, ${vs.M}y) of ${gov.id}. Moment utilisation at ${vs.P} ${f(gov.biaxial?.exact?.momentUtilisation ?? null, 3)} (exact).`, 1.3);
  return box.y + box.h + 3.6 * u;
}

/** The governing load's answer in a few lines (when there is no contour to show). */
/** Returns the y after its last line. */
function summaryPanel(g: Deco, L: ReportLayout, c: ColumnCheck, y: number): number {
  const { colB: b, u } = L;
  const gov = c.results[0]!;
  const area = c.units === 'us' ? 'in²' : 'mm²';
  y = g.paragraph('heading', b.x, y + 1.0 * u, b.w, `Governing load: ${gov.id} (${STATUS_WORDS[gov.status]})`, 1.2) + 0.6 * u;
  const lines: [TextStyle, string][] = [];
  if (gov.status !== 'ok') lines.push(['valueBold', noteText(gov, c)]);
  if (gov.rhoRequired !== null) {
    lines.push(['valueBold', `ρg required = ${f(gov.rhoRequired)}${gov.steelRequired !== null ? `, Ast = ${f(gov.steelRequired, 4)} ${area}` : ''}`]);
    if (gov.rhoStatus === 'minimum-governs') lines.push(['body', `The minimum ρg = ${fmt(c.limits.min, 3)} governs.`]);
    if (gov.governedBy === 'cap') lines.push(['body', `Held by the ${c.basis.symbols.axialCap ?? 'axial cap'}, not by the curve.`]);
  }
  if (gov.biaxial?.rhoStatus) lines.push(['valueBold', `ρg required, exact biaxial = ${f(gov.biaxial.rhoRequired)}`]);
  lines.push(['body', `Chart reading ${f(gov.rhoFromChart)}; next lower sheet, next curve out: ${f(gov.rhoRoundedDown, 3)}${gov.extraSteelRoundedDown != null && gov.extraSteelRoundedDown > 0 ? `, ${f(gov.extraSteelRoundedDown, 4)} ${area} more steel than exact` : ''}.`]);
  if (gov.biaxial && gov.biaxial.rhoFromChart !== null && c.biaxialChart) {
    const d = gov.biaxial.chartMinusExact;
    lines.push(['body', `Biaxial sheets (level step ${c.biaxialChart.axialStep}): ρg ${f(gov.biaxial.rhoFromChart)}${d !== null ? `, ${d >= 0 ? '+' : ''}${f(d)} against the exact biaxial` : ''}.`]);
  }
  lines.push(['body', `At capacity along the load ray: ${c.basis.symbols.tensionStrain ?? 'εt'} = ${f(gov.strain.epsT, 3)}, φ = ${f(gov.strain.phi, 3)}, ${strainClassWord(c.basis.symbols, gov.strain.class)}.`]);
  if (gov.utilisation !== null) lines.push(['valueBold', `Utilisation of the checked steel: ${f(gov.utilisation, 3)}`]);
  for (const [style, text] of lines) y = g.paragraph(style, b.x, y, b.w, text, 1.35) + 0.3 * u;
  return y;
}

/** A table row of `lines` lines: the table line (1.22 units; 1.0 in the smaller type) or the lines and a margin. */
const rowHeight = (u: number, lines: number, lead: number, large: boolean): number => Math.max((large ? 1.22 : 1.0) * u, lines * lead + (large ? 0.45 : 0.3) * u);

/**
 * Places blocks top to bottom in a box. Figures are never cut: a table's number columns keep the width of their
 * widest figure (in smaller type when the row is too wide), its text columns share the rest and wrap into more
 * lines. Rows that do not fit go to a note naming the text and JSON reports; `cut` records that a table lost rows
 * it had to show (or a block its heading), so the caller can make room.
 */
class Flow {
  y: number;
  /** a block or a table row that had to be shown was left out */
  cut = false;
  /** `small`: every table in the smaller type (a crowded sheet) */
  constructor(
    readonly g: Deco,
    readonly box: Box,
    readonly small = false,
  ) {
    this.y = box.y;
  }
  get u(): number {
    return this.g.L.u;
  }
  get left(): number {
    return this.box.y + this.box.h - this.y;
  }
  /** Writes the heading when it and `lines` more lines fit; else a one-line pointer to the text report where that fits. */
  heading(text: string, lines = 4): boolean {
    if (this.left < 1.8 * this.u + (lines + 2.2) * 1.22 * this.u + 1.6 * this.u) {
      this.cut = true;
      if (this.left >= 1.6 * this.u) {
        this.g.paragraph('caption', this.box.x, this.y + 1.0 * this.u, this.box.w, `${text}: no room on this sheet; the .txt and .json reports hold it.`, 1.3);
        this.y += 1.6 * this.u;
      }
      return false;
    }
    this.g.paragraph('heading', this.box.x, this.y + 1.0 * this.u, this.box.w, text, 1.2);
    this.y += 1.8 * this.u;
    return true;
  }
  /**
   * A table: header rows (the head wrapped, a unit line under it), then rows; `bold` marks rows drawn bold in the
   * first column (the governing load). Rows past `mustShow` may go to the note without counting as cut. Returns
   * the rows drawn.
   */
  table(cols: { head: string; unit?: string; align: 'l' | 'r' }[], rows: string[][], bold: boolean[] = [], omittedNote?: (n: number) => string, mustShow = Infinity): number {
    const u = this.u;
    const g = this.g;
    const pad = 1.0 * u;
    const W = this.box.w;
    const words = (t: string) => t.split(/\s+/).filter(Boolean);
    // styles: figures at the cell size, else smaller; text likewise
    const sizes: { num: TextStyle; bold: TextStyle; text: TextStyle }[] = [
      { num: 'cellRight', bold: 'cellRho', text: 'body' },
      { num: 'bodyTiny', bold: 'valueBoldSmall', text: 'bodyTiny' },
    ];
    const plans: { st: (typeof sizes)[number]; widths: number[] }[] = [];
    for (const st of this.small ? sizes.slice(1) : sizes) {
      const cellW = (i: number, t: string, k: number) => g.width(cols[i]!.align === 'r' ? st.num : i === 0 && bold[k] ? st.bold : st.text, t);
      // the head may wrap at spaces; a figure never
      const headMin = cols.map((c) => Math.max(...words(c.head).map((w) => g.width('cellHead', w)), g.width('cellSub', c.unit ?? '')));
      const need = cols.map((c, i) => {
        if (c.align === 'r') return Math.max(headMin[i]!, ...rows.map((r, k) => cellW(i, r[i] ?? '', k))) + pad;
        // text: its longest word (a load id longer than 9 units breaks after "-" or "_"), at least 4 units
        return Math.max(headMin[i]!, 4 * u, Math.min(9 * u, Math.max(0, ...rows.map((r, k) => Math.max(0, ...words(r[i] ?? '').map((w) => cellW(i, w, k))))))) + pad;
      });
      const want = cols.map((c, i) => Math.max(need[i]!, g.width('cellHead', c.head) + pad, ...rows.map((r, k) => cellW(i, r[i] ?? '', k) + pad)));
      const sumNeed = need.reduce((a, v) => a + v, 0);
      const sumWant = want.reduce((a, v) => a + v, 0);
      // every column its natural width when that fits (the slack spread evenly), else its need plus a share of the rest
      const widths = sumWant <= W ? want.map((v) => v + (W - sumWant) / cols.length) : need.map((v, i) => v + ((W - sumNeed) * (want[i]! - need[i]!)) / Math.max(1e-9, sumWant - sumNeed));
      plans.push({ st, widths: sumNeed > W ? need.map((v) => (v * W) / sumNeed) : widths });
      if (sumNeed > W) plans.pop(); // figures would not fit whole at this size
    }
    if (plans.length === 0) {
      // not even the smaller type holds every figure: the smaller type, columns in proportion (rare: dozens of columns)
      const st = sizes[sizes.length - 1]!;
      const need = cols.map((c, i) => Math.max(g.width('cellHead', c.head), ...rows.map((r) => g.width(st.num, r[i] ?? ''))) + pad);
      const sum = need.reduce((a, v) => a + v, 0);
      plans.push({ st, widths: need.map((v) => (v * W) / sum) });
    }
    // the larger type where the rows that must show fit with it, else the smaller
    const plan = plans.find((p) => this.rowsFitting(p, cols, rows, bold) >= Math.min(rows.length, mustShow)) ?? plans[plans.length - 1]!;
    const { st, widths } = plan;
    const lead = (style: TextStyle) => g.size(style) * 1.18;
    // header
    const heads = cols.map((c, i) => breakLines(g, 'cellHead', c.head, widths[i]! - 0.3 * u));
    const headLines = Math.max(...heads.map((h) => h.length));
    const hasUnit = cols.some((c) => c.unit);
    const headH = headLines * lead('cellHead') + (hasUnit ? lead('cellSub') : 0) + 0.7 * u;
    // rows: each text cell in as many lines as it takes
    const cells = rows.map((r, k) => cols.map((c, i) => (c.align === 'r' ? [r[i] ?? ''] : breakLines(g, i === 0 && bold[k] ? st.bold : st.text, r[i] ?? '', widths[i]! - 0.8 * u))));
    const rowH = cells.map((rc) => rowHeight(u, Math.max(...rc.map((l) => l.length)), lead(st.text), st.num === 'cellRight'));
    const noteH = 1.3 * u;
    let room = this.left - headH - 1.0 * u;
    let shown = 0;
    while (shown < rows.length && rowH[shown]! <= room - (shown + 1 < rows.length ? noteH : 0)) room -= rowH[shown++]!;
    if (shown < Math.min(rows.length, mustShow)) this.cut = true;
    if (shown === 0 && rows.length > 0) return 0;
    const x0 = this.box.x;
    g.rect({ x: x0, y: this.y, w: W, h: headH }, COLOURS.panel);
    let x = x0;
    cols.forEach((c, i) => {
      const w = widths[i]!;
      heads[i]!.forEach((l, j) => g.text('cellHead', x + w / 2, this.y + 0.35 * u + (j + 0.8) * lead('cellHead'), l));
      if (c.unit) g.text('cellSub', x + w / 2, this.y + 0.35 * u + headLines * lead('cellHead') + 0.8 * lead('cellSub'), c.unit);
      x += w;
    });
    this.y += headH;
    for (let k = 0; k < shown; k++) {
      const r = cells[k]!;
      if (k % 2 === 1) g.rect({ x: x0, y: this.y, w: W, h: rowH[k]! }, '#f8fafb');
      let cx = x0;
      cols.forEach((c, i) => {
        const w = widths[i]!;
        const base = this.y + 0.25 * u + 0.82 * lead(st.text) + 0.1 * u;
        if (c.align === 'l') {
          const style: TextStyle = i === 0 && bold[k] ? st.bold : st.text;
          r[i]!.forEach((l, j) => g.text(style, cx + 0.5 * u, base + j * lead(st.text), l));
        } else {
          const t = r[i]![0]!;
          // cellRight is right-aligned by its layer; the smaller style is placed by its measured width
          if (st.num === 'cellRight') g.text('cellRight', cx + w - 0.5 * u, base, t);
          else g.text(st.num, cx + w - 0.5 * u - g.width(st.num, t), base, t);
        }
        cx += w;
      });
      this.y += rowH[k]!;
    }
    g.rule(x0, this.y + 0.1 * u, x0 + W, this.y + 0.1 * u, COLOURS.faint, 0.6);
    this.y += 0.4 * u;
    if (shown < rows.length) {
      g.text('caption', x0, this.y + 0.9 * u, omittedNote ? omittedNote(rows.length - shown) : `${rows.length - shown} more rows: the .txt and .json reports list every row.`);
      this.y += noteH;
    }
    this.y += 0.6 * u;
    return shown;
  }
  /** How many rows fit below the current position with this plan (as table() lays them out). */
  private rowsFitting(plan: { st: { num: TextStyle; bold: TextStyle; text: TextStyle }; widths: number[] }, cols: { head: string; unit?: string; align: 'l' | 'r' }[], rows: string[][], bold: boolean[]): number {
    const { g, u } = this;
    const lead = (style: TextStyle) => g.size(style) * 1.18;
    const headLines = Math.max(...cols.map((c, i) => breakLines(g, 'cellHead', c.head, plan.widths[i]! - 0.3 * u).length));
    const headH = headLines * lead('cellHead') + (cols.some((c) => c.unit) ? lead('cellSub') : 0) + 0.7 * u;
    let room = this.left - headH - 1.0 * u;
    let n = 0;
    for (const [k, r] of rows.entries()) {
      const lines = Math.max(...cols.map((c, i) => (c.align === 'r' ? 1 : breakLines(g, i === 0 && bold[k] ? plan.st.bold : plan.st.text, r[i] ?? '', plan.widths[i]! - 0.8 * u).length)));
      const h = rowHeight(u, lines, lead(plan.st.text), plan.st.num === 'cellRight');
      if (h > room - (n + 1 < rows.length ? 1.3 * u : 0)) break;
      room -= h;
      n++;
    }
    return n;
  }
  note(text: string, style: TextStyle = 'caption'): void {
    if (this.left < 1.5 * this.u) {
      this.cut = true;
      return;
    }
    this.y = this.g.paragraph(style, this.box.x, this.y + 0.9 * this.u, this.box.w, text, 1.3) + 0.3 * this.u;
    if (this.y > this.box.y + this.box.h) this.cut = true;
  }
}

function sidePanel(g: Deco, L: ReportLayout, c: ColumnCheck, input: CheckReportInput): void {
  const { colC: b, u } = L;
  // caution, pinned to the foot of the column
  const cLines = wrap(input.caution + ' This sheet states the code edition and its assumptions; it does not replace the judgement of the engineer of record.', b.w - 2 * u, g.size('caution'));
  const ch = cLines.length * g.size('caution') * 1.35 + 1.4 * u;
  const cTop = b.y + b.h - ch;
  g.rect({ x: b.x, y: cTop, w: b.w, h: ch }, '#fbf1ef', COLOURS.caution, 0.7);
  cLines.forEach((l, i) => g.text('caution', b.x + u, cTop + 1.0 * u + 0.5 * g.size('caution') + i * g.size('caution') * 1.35, l));
  const limit = cTop - 1.0 * u;

  let y = b.y;
  const gov = c.results[0];
  if (c.slenderness && gov?.slenderness) {
    const e = gov.slenderness;
    y = g.paragraph('heading', b.x, y + 1.0 * u, b.w, `Slenderness steps, ${gov.id}`, 1.2) + 0.6 * u;
    const axes = [['x', e.x], ['y', e.y]].filter((a): a is ['x' | 'y', NonNullable<typeof e.x>] => a[1] != null);
    const colW = b.w / axes.length;
    let yEnd = y;
    axes.forEach(([axis, s], k) => {
      let yy = y;
      const x = b.x + k * colW;
      g.text('valueBold', x, yy, `bending about ${axis}`);
      yy += 1.3 * u;
      // a sway column has some forty steps: those that do not fit above the assumptions are counted, never drawn over them
      const stepLimit = limit - 10 * u;
      let left = 0;
      for (const st of s.steps) {
        const v = typeof st.value === 'number' ? f(st.value, 5) : String(st.value);
        const text = `${st.label} = ${v}${st.unit ? ` ${st.unit}` : ''}`;
        const h = wrap(text, colW - 0.8 * u, g.size('dimLeft')).length * g.size('dimLeft') * 1.22;
        if (left > 0 || yy + h > stepLimit) {
          left++;
          continue;
        }
        yy = g.paragraph('dimLeft', x, yy, colW - 0.8 * u, text, 1.22);
      }
      if (left > 0) yy = g.paragraph('caption', x, yy + 0.2 * u, colW - 0.8 * u, `${left} more step${left === 1 ? '' : 's'}: the .txt and .json reports list every step with its clause.`, 1.22);
      for (const w of s.warnings) yy = g.paragraph('caption', x, yy, colW - 0.8 * u, `WARNING: ${w}`, 1.22);
      yEnd = Math.max(yEnd, yy);
    });
    y = yEnd + 0.6 * u;
  }

  g.text('heading', b.x, y + 1.0 * u, `Assumptions and clauses: ${c.basis.title}`);
  y += 2.0 * u;
  const notes = [...c.basis.notes, ...input.assumptions];
  const lh = g.size('body') * 1.3;
  let cut = 0;
  for (let i = 0; i < notes.length; i++) {
    const lines = wrap(notes[i]!, b.w - 1.0 * u, g.size('body'));
    if (y + lines.length * lh > limit - lh) {
      cut = notes.length - i;
      break;
    }
    g.text('body', b.x, y, '•');
    for (const l of lines) {
      g.text('body', b.x + 1.0 * u, y, l);
      y += lh;
    }
    y += 0.25 * u;
  }
  if (cut > 0) g.text('caption', b.x, y + 0.2 * u, `${cut} more assumption${cut === 1 ? '' : 's'}: the .txt and .json reports list them all.`, b.w);
}

/**
 * Two rows, whole values (drawTitleBlock lends width, shrinks and wraps; nothing is cut): the office, project,
 * column mark and sheet; the basis, section, preparer and checker, revision, date and generator. The logo, when
 * given, in the block's fixed box at the right.
 */
function titleBlock(g: Deco, c: ColumnCheck, input: CheckReportInput): void {
  const people = [input.preparedBy, input.checkedBy].map((p) => (p === undefined || p === '' ? '—' : p)).join(' · ');
  drawTitleBlock(
    g,
    [
      [
        ['office', input.office || '—', 3.2],
        ['project', input.project || '—', 4.6],
        ['column mark', input.mark || '—', 1.2],
        ['sheet', '1 of 1', 0.8],
      ],
      [
        ['design basis', c.basis.title, 1.4],
        ['section', sectionText(c), 4.6],
        ['prepared · checked', people, 1.5],
        ['rev.', input.revision || '—', 0.5],
        ['date', input.date, 1.0],
        ['generated by', input.generator, 1.2],
      ],
    ],
    input.logo,
  );
}
