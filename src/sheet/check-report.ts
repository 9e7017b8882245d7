/**
 * `pmchart check --report FILE.pdf|svg`: a one-page calculation sheet.
 *
 *   check outcome ──1──▶ curve family at the actual γ ──2──▶ page (plot + panels) ──3──▶ SVG / PDF bytes
 *                        src/analysis/family.ts             this file, src/chart       src/render
 *
 * 1. The φ-factored family at the standard ρg steps of the emulated charts, plus the curve at the governing
 *    load's ρg required; every load plotted at its normalised point, labelled, the governing one marked.
 * 2. Panels: inputs, the Mx–My contour at the governing Pu when there are biaxial results, the results table,
 *    biaxial and slenderness tables, bar proposals, the slenderness steps of the governing load, the basis
 *    notes and the check's assumptions, the caution, a title block. Tables longer than the page are cut with
 *    a note: the .txt and .json reports hold every row.
 * 3. The sheet's vega-lite template with its load overlay (src/chart/spec.ts); the contour is an inset.
 */
import { computeFamily, type CurveFamily } from '../analysis/family.js';
import { squashPoint } from '../analysis/biaxial.js';
import { contourSpec } from '../chart/contour-spec.js';
import type { Box, SheetLayout } from '../chart/layout.js';
import { roundStep } from '../chart/axes.js';
import { LOAD_MARK_WORDS } from '../chart/spec.js';
import { Deco, estWidth, plotLayers, wrap, type LoadLabelRow, type SheetData, type TemplateParams } from '../chart/sheet-data.js';
import { COLOURS, TEXT_STYLES, type TextStyle } from '../chart/style.js';
import { contourPlot } from '../chart/contour-plot.js';
import { strainClassWord } from '../codes/types.js';
import type { ColumnCheck, ColumnLoadResult } from '../design/column-check.js';
import { arrangementName, barsUnmetLine, barsView, biaxialView, noteText, resultsFootnotes, resultsView, slendernessView, STATUS_WORDS, symbolsOf, type TableView } from '../report/check-view.js';
import { cell as f, fmt } from '../report/format.js';
import { prepareBiaxial } from '../analysis/biaxial.js';
import type { CapContext } from '../codes/types.js';
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
  generator: string;
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

function reportLayout(W: number, H: number, plotShare: number): ReportLayout {
  const u = Math.min(W, H) / 100 + 0.8;
  const m = 3.2 * u;
  const gap = 2.2 * u;
  const header: Box = { x: m, y: m, w: W - 2 * m, h: 4.2 * u };
  const titleBlock: Box = { x: m, y: H - m - 5.0 * u, w: W - 2 * m, h: 5.0 * u };
  const top = header.y + header.h + gap;
  const bottomY = titleBlock.y - gap;
  const bw = W - 2 * m;
  const colA: Box = { x: m, y: top, w: 0.4 * bw, h: bottomY - top };
  const colB: Box = { x: colA.x + colA.w + gap, y: top, w: 0.27 * bw - gap, h: bottomY - top };
  const colC: Box = { x: colB.x + colB.w + gap, y: top, w: W - m - (colB.x + colB.w + gap), h: bottomY - top };
  const plotTop = top + 2.4 * u;
  const plotH = plotShare * colA.h - 2.4 * u - 4.6 * u;
  const plot: Box = { x: m + 6.2 * u, y: plotTop, w: colA.w - 6.2 * u - 0.6 * u, h: plotH };
  const bTop = plot.y + plot.h + 4.6 * u + 4.4 * u;
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
  const L = reportLayout(paper.w, paper.h, plotShare(paper, c));
  const data: SheetData = { curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [], loadMarks: [], loadLabels: [], extraCurves: [] };
  const g = new Deco(L, data);

  // 1. the family at the actual γ, the governing curve, the loads
  const family = computeFamily({ basis: b, shape: c.shape, arrangement: c.arrangement, gamma: c.gamma, ...(c.gammaB !== null ? { gammaX: c.gammaB } : {}), rhos: c.chart.rhos, capContext: c.capContext, basePoints: SHEET_BASE_POINTS });
  const plotCtx = { family, set: { referenceLines: { strainStates: true, eccentricities: [0.1, 0.25, 0.5, 1], axialCap: true }, ratios: { kind: 'rhoG' as const, values: [...c.chart.rhos] } } };
  // a first pass fits the axes to the curves and the loads; the second places the curves' labels at that
  // scale, near the loads' axial levels and clear of their marks
  const scratch: SheetData = { curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [] };
  plotLayers(plotCtx, L, ['design'], 'design', 1, scratch);
  const gov = c.results[0];
  const req = gov?.rhoRequired ?? null;
  const onStep = (rho: number) => c.chart.rhos.some((r) => Math.abs(r - rho) < 5e-4);
  if (gov && req !== null && !onStep(req)) extraCurve(family, req, `ρg req ${fmt(req, 4)}`, c.capContext, data, c.gammaB);
  const checked = c.checked?.rho;
  if (checked !== undefined && !onStep(checked) && (req === null || Math.abs(checked - req) >= 5e-4)) extraCurve(family, checked, `checked ρg ${fmt(checked, 4)}`, c.capContext, data, c.gammaB);
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
  };

  // 2. panels
  const title = `Column check: ${sectionText(c)}`;
  header(g, title, input);
  g.text('heading', L.colA.x, L.colA.y + 1.0 * L.u, `Loads on the ${sy.designFamily} curves at the actual γ = ${fmt(c.gamma, 4)}`);
  plotCaption(g, L, c);
  const insets: Inset[] = [];
  const yB = inputsPanel(g, L, c);
  if (c.biaxial && c.checked && gov) contourPanel(g, L, c, gov, yB, insets);
  else if (gov) summaryPanel(g, L, c, yB);
  const bottom = new Flow(g, L.bottom);
  if (bottom.heading('Results (governing load first)', Math.min(2, c.results.length))) {
    bottom.table(columns(resultsView(c)), resultsView(c).rows, resultsView(c).marked, (n) => `${n} more loads, in rank order: the .txt and .json reports list every load.`);
    bottom.note([`Summary: ${c.summary.text}.`, ...resultsFootnotes(c)].join(' '));
  }
  const bx = biaxialView(c);
  if (bx && bottom.heading('Biaxial bending: three methods side by side (checked reinforcement; above 1 fails)', Math.min(2, c.results.length))) bottom.table(columns(bx), bx.rows, bx.marked);
  const sl = slendernessView(c);
  if (sl && bottom.heading(`Slenderness: ${sl.method}`, 2)) bottom.table(columns(sl.table), sl.table.rows, sl.table.marked);
  const bars = barsView(c);
  if (bottom.heading('Bar proposals (lightest first, re-verified with the discrete bars against every load and effect)', typeof bars === 'string' ? 0 : Math.min(2, bars.rows.length))) {
    if (typeof bars === 'string') bottom.note(bars, 'body');
    else bottom.table(columns(bars), bars.rows, bars.rows.map((_, i) => i === 0));
    const unmet = barsUnmetLine(c);
    if (unmet) bottom.note(unmet, 'body');
  }
  sidePanel(g, L, c, input);
  titleBlock(g, L, c, input);
  return { template, data, insets, title };
}

/**
 * Share of the column height the plot takes: what the tables under it need (in table lines, estimated), within
 * 45–62 %, so a short check gets a large plot and a long one keeps its tables on the page.
 */
function plotShare(paper: { w: number; h: number }, c: ColumnCheck): number {
  const u = Math.min(paper.w, paper.h) / 100 + 0.8;
  const colH = reportLayout(paper.w, paper.h, 0.5).colA.h;
  const n = Math.min(c.results.length, 12);
  let lines = 5 + n + 3 + 4 + Math.max(1, c.bars.length);
  if (c.biaxial && c.checked) lines += 5 + n;
  if (c.slenderness) lines += 5 + 2 * n;
  const need = lines * 1.22 * u + 9 * u;
  return Math.min(0.62, Math.max(0.45, 1 - need / colH));
}

function sectionText(c: ColumnCheck): string {
  const un = DISPLAY_UNITS[c.units];
  const sy = c.basis.symbols;
  const dims = c.shape.kind === 'rectangle' ? `${fmt(c.shape.b)} × ${fmt(c.shape.h)} ${un.length}` : `D = ${fmt(c.shape.diameter)} ${un.length}`;
  return `${dims} ${c.basis.transverse}, ${arrangementName(c.arrangement)}, ${sy.concreteStrength} ${fmt(c.basis.fc)} ${un.stress}, ${sy.steelStrength} ${fmt(c.basis.fy)} ${un.stress}, γ ${fmt(c.gamma, 3)}${c.gammaB !== null ? `, γB ${fmt(c.gammaB, 3)}` : ''}`;
}

/** Columns of a shared table view for the drawn table: text columns left, figures right. */
function columns(t: TableView): { head: string; unit?: string; align: 'l' | 'r' }[] {
  const text = new Set(['id', 'strain state', 'status', 'note', 'bars', 'method', 'axis', 'neglected', 'by load']);
  return t.headers.map((h, i) => {
    const sp = h.lastIndexOf(' ');
    const unitLike = sp > 0 && /^[a-zA-Z²·\-]+$/.test(h.slice(sp + 1)) && !text.has(h) && /(kip|kN|in|mm|ft|m|ksi|MPa|psi|²)/.test(h.slice(sp + 1));
    return { head: h === 'id' ? 'load' : unitLike ? h.slice(0, sp) : h, ...(unitLike ? { unit: h.slice(sp + 1) } : {}), align: i === 0 || text.has(h) ? ('l' as const) : ('r' as const) };
  });
}

// ── plot ────────────────────────────────────────────────────────────────────────────────────────

function extraCurve(family: CurveFamily, rho: number, label: string, capContext: CapContext, data: SheetData, gammaB: number | null): void {
  const one = computeFamily({ basis: family.basis, shape: family.shape, arrangement: family.arrangement, gamma: family.gamma, ...(gammaB !== null ? { gammaX: gammaB } : {}), rhos: [rho], capContext, basePoints: SHEET_BASE_POINTS });
  const c = one.curves[0]!;
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

function plotCaption(g: Deco, L: ReportLayout, c: ColumnCheck): void {
  const u = L.u;
  const y = L.plot.y + L.plot.h + 4.6 * u + 0.4 * u;
  const n = c.results.length;
  const gov = c.results[0];
  const vs = symbolsOf(c);
  const slender = `${c.slenderness ? ' Moments as checked: magnified for slenderness.' : ''}${c.biaxial ? ` The chart shows ${vs.M} about x${c.shape.kind === 'circle' ? ' (the resultant for a circle)' : ''}; ${vs.M}y enters the biaxial check.` : ''}`;
  const text = `Curves at ρg ${c.chart.rhos.map((r) => fmt(r, 3)).join(', ')}; dashed ink: ρg required of the governing load and the checked ρg, where they fall between the steps. ${LOAD_MARK_WORDS.mark[0]!.toUpperCase()}${LOAD_MARK_WORDS.mark.slice(1)}: the ${n} load${n === 1 ? '' : 's'} at (${vs.M}/(Ag·${vs.depth}), ${vs.P}/Ag), ${LOAD_MARK_WORDS.ray}; ${LOAD_MARK_WORDS.governing}: governing${gov ? ` (${gov.id})` : ''}${n > LABELLED_LOADS ? `; the first ${LABELLED_LOADS} by rank are labelled` : ''}.${slender}`;
  let yy = y;
  for (const line of wrap(text, L.colA.w, g.size('caption')).slice(0, 3)) {
    g.text('caption', L.colA.x, yy, line);
    yy += g.size('caption') * 1.3;
  }
}

// ── panels ──────────────────────────────────────────────────────────────────────────────────────

function header(g: Deco, title: string, input: CheckReportInput): void {
  const { header: b, u } = g.L;
  g.rect({ x: b.x, y: b.y, w: 0.7 * u, h: b.h }, COLOURS.accent);
  const right = 'calculation sheet · 1 of 1';
  g.text('headerRight', b.x + b.w, b.y + b.h * 0.62, right);
  g.text('sheetTitle', b.x + 1.8 * u, b.y + b.h * 0.66, title, b.w - 1.8 * u - estWidth(right, g.size('headerRight')) - 3 * u);
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
    g.text('caption', b.x, y, k.toUpperCase(), kw - 0.5 * u);
    y = g.paragraph('body', b.x + kw, y, b.w - kw, v, 1.3);
    y += 0.15 * u;
  }
  const params = Object.entries(c.basis.parameters).map(([k, v]) => `${k} ${typeof v === 'number' ? fmt(v, 5) : v}`);
  g.text('caption', b.x, y, 'PARAMETERS', kw - 0.5 * u);
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
  const sec = prepareBiaxial(c.basis, c.shape, c.checked!.bars, c.capContext);
  const tension = -sec.basis.design.factor(1) * sec.basis.design.steel.yieldStress * sec.steelArea;
  const bottomLimit = L.bottom.y - 3.6 * u;
  if (load.Pu > Math.min(sec.cap.design, squashPoint(sec)) || load.Pu <= tension) {
    return g.paragraph('body', b.x, y + 1.0 * u, b.w, `${vs.P} = ${f(toDisplay(load.Pu, 'force', c.units), 5)} ${un.force} is outside the axial range of the section: no contour.`) + u;
  }
  const size = Math.max(10 * u, Math.min(b.w, bottomLimit - y));
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
function summaryPanel(g: Deco, L: ReportLayout, c: ColumnCheck, y: number): void {
  const { colB: b, u } = L;
  const gov = c.results[0]!;
  const area = c.units === 'us' ? 'in²' : 'mm²';
  g.text('heading', b.x, y + 1.0 * u, `Governing load: ${gov.id} (${STATUS_WORDS[gov.status]})`);
  y += 2.0 * u;
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
}

/** Places blocks top to bottom in a box; a table that does not fit is cut with a note. */
class Flow {
  y: number;
  constructor(
    readonly g: Deco,
    readonly box: Box,
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
      if (this.left >= 1.6 * this.u) {
        this.g.text('caption', this.box.x, this.y + 1.0 * this.u, `${text}: no room on this sheet; the .txt and .json reports hold it.`, this.box.w);
        this.y += 1.6 * this.u;
      }
      return false;
    }
    this.g.text('heading', this.box.x, this.y + 1.0 * this.u, text, this.box.w);
    this.y += 1.8 * this.u;
    return true;
  }
  /**
   * A table: header row with a unit row under it, then rows; column widths from the text, stretched to the box.
   * `bold` marks rows drawn bold in the first column (the governing load). Returns the rows drawn.
   */
  table(cols: { head: string; unit?: string; align: 'l' | 'r' }[], rows: string[][], bold: boolean[] = [], omittedNote?: (n: number) => string): number {
    const u = this.u;
    const g = this.g;
    const line = 1.22 * u;
    const fsCell = TEXT_STYLES.cellRight.size * u;
    const natural = cols.map((c, i) => Math.max(estWidth(c.head, TEXT_STYLES.cellHead.size * u), estWidth(c.unit ?? '', TEXT_STYLES.cellSub.size * u), ...rows.map((r) => estWidth(r[i] ?? '', fsCell))) + 1.2 * u);
    const total = natural.reduce((a, v) => a + v, 0);
    const scale = this.box.w / total;
    const widths = natural.map((w) => w * scale);
    const headH = 2.2 * line;
    const fit = Math.max(0, Math.floor((this.left - headH - 1.6 * u) / line));
    const shown = rows.length <= fit ? rows.length : Math.max(0, fit - 1);
    if (fit <= 0) return 0;
    const x0 = this.box.x;
    g.rect({ x: x0, y: this.y, w: this.box.w, h: headH }, COLOURS.panel);
    let x = x0;
    cols.forEach((c, i) => {
      const w = widths[i]!;
      g.text('cellHead', x + w / 2, this.y + 0.85 * line, c.head, w - 0.2 * u);
      if (c.unit) g.text('cellSub', x + w / 2, this.y + 1.85 * line, c.unit, w - 0.2 * u);
      x += w;
    });
    this.y += headH;
    for (let k = 0; k < shown; k++) {
      const r = rows[k]!;
      if (k % 2 === 1) g.rect({ x: x0, y: this.y, w: this.box.w, h: line }, '#f8fafb');
      let cx = x0;
      cols.forEach((c, i) => {
        const w = widths[i]!;
        const t = r[i] ?? '';
        const style: TextStyle = c.align === 'l' ? (i === 0 && bold[k] ? 'cellRho' : 'body') : 'cellRight';
        if (c.align === 'l') g.text(style, cx + 0.5 * u, this.y + 0.8 * line, t, w - 0.8 * u);
        else g.text(style, cx + w - 0.5 * u, this.y + 0.8 * line, t, w - 0.6 * u);
        cx += w;
      });
      this.y += line;
    }
    g.rule(x0, this.y + 0.1 * u, x0 + this.box.w, this.y + 0.1 * u, COLOURS.faint, 0.6);
    this.y += 0.4 * u;
    if (shown < rows.length) {
      g.text('caption', x0, this.y + 0.9 * u, omittedNote ? omittedNote(rows.length - shown) : `${rows.length - shown} more rows: the .txt and .json reports list every row.`, this.box.w);
      this.y += 1.3 * u;
    }
    this.y += 0.6 * u;
    return shown;
  }
  note(text: string, style: TextStyle = 'caption'): void {
    if (this.left < 1.5 * this.u) return;
    this.y = this.g.paragraph(style, this.box.x, this.y + 0.9 * this.u, this.box.w, text, 1.3) + 0.3 * this.u;
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
    g.text('heading', b.x, y + 1.0 * u, `Slenderness steps, ${gov.id}`);
    y += 2.0 * u;
    const axes = [['x', e.x], ['y', e.y]].filter((a): a is ['x' | 'y', NonNullable<typeof e.x>] => a[1] != null);
    const colW = b.w / axes.length;
    let yEnd = y;
    axes.forEach(([axis, s], k) => {
      let yy = y;
      const x = b.x + k * colW;
      g.text('valueBold', x, yy, `bending about ${axis}`);
      yy += 1.3 * u;
      for (const st of s.steps) {
        const v = typeof st.value === 'number' ? f(st.value, 5) : String(st.value);
        yy = g.paragraph('dimLeft', x, yy, colW - 0.8 * u, `${st.label} = ${v}${st.unit ? ` ${st.unit}` : ''}`, 1.22);
      }
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

function titleBlock(g: Deco, L: ReportLayout, c: ColumnCheck, input: CheckReportInput): void {
  const { titleBlock: b, u } = L;
  const cells: [string, string, number][] = [
    ['office', input.office ?? '', 3.2],
    ['project', input.project ?? '', 4.2],
    ['design basis', c.basis.title, 1.4],
    ['section', sectionText(c), 5.2],
    ['date', input.date, 1.1],
    ['generated by', input.generator, 1.3],
    ['sheet', '1 of 1', 0.8],
  ];
  g.rect(b, COLOURS.paper, COLOURS.ink, 0.9);
  const total = cells.reduce((s, c) => s + c[2], 0);
  let x = b.x;
  cells.forEach(([cap, val, wgt], k) => {
    const w = (b.w * wgt) / total;
    if (k > 0) g.rule(x, b.y, x, b.y + b.h, COLOURS.ink, 0.5);
    g.text('caption', x + 0.7 * u, b.y + 1.3 * u, cap.toUpperCase(), w - 1.4 * u);
    g.text(k === 1 ? 'valueBold' : 'value', x + 0.7 * u, b.y + b.h - 1.0 * u, val || '—', w - 1.4 * u);
    x += w;
  });
}
