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
import { Deco, estWidth, plotLayers, wrap, type LoadLabelRow, type SheetData, type TemplateParams } from '../chart/sheet-data.js';
import { COLOURS, TEXT_STYLES, type TextStyle } from '../chart/style.js';
import { statusText, type ResolvedCheck } from '../cli/check.js';
import type { CheckEffects } from '../cli/check-effects.js';
import { contourPlot } from '../cli/contour-plot.js';
import { fmt } from '../cli/format.js';
import { biaxialSectionFor } from '../design/column-effects.js';
import type { CheckOutcome, LoadResult } from '../design/check.js';
import type { CapContext } from '../codes/types.js';
import type { Inset } from '../render/renderer.js';
import { DISPLAY_UNITS, toDisplay, type UnitSystem } from '../units/index.js';
import { SHEET_BASE_POINTS } from './curves.js';

export interface CheckReportInput {
  rc: ResolvedCheck;
  outcome: CheckOutcome;
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
const f = (x: number | null | undefined, d = 4): string => (x === null || x === undefined || Number.isNaN(x) ? '—' : Number.isFinite(x) ? fmt(x, d) : x > 0 ? '∞' : '—');
const CLASS_SHORT: Record<string, string> = { 'compression-controlled': 'compression', transition: 'transition', 'tension-controlled': 'tension' };

export function buildCheckReport(input: CheckReportInput): CheckReportPage {
  const { rc, outcome } = input;
  const s = rc.section;
  const b = s.basis;
  const u = s.units;
  const paper = reportPaper(u);
  const fx = rc.effects;
  const biaxial = fx?.bars ? fx : undefined;
  const L = reportLayout(paper.w, paper.h, plotShare(paper, rc, outcome));
  const data: SheetData = { curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [], loadMarks: [], loadLabels: [], extraCurves: [] };
  const g = new Deco(L, data);

  // 1. the family at the actual γ, the governing curve, the loads
  const family = computeFamily({ basis: b, shape: rc.request.shape, arrangement: rc.request.arrangement, gamma: s.gamma, rhos: outcome.chart.rhos, capContext: s.capContext, basePoints: SHEET_BASE_POINTS });
  plotLayers(
    { family, set: { referenceLines: { strainStates: true, eccentricities: [0.1, 0.25, 0.5, 1], axialCap: true }, ratios: { kind: 'rhoG', values: [...outcome.chart.rhos] } } },
    L,
    ['design'],
    'design',
    1,
    data,
  );
  const gov = outcome.results[0];
  const req = gov?.rhoRequired ?? null;
  const onStep = (rho: number) => outcome.chart.rhos.some((r) => Math.abs(r - rho) < 5e-4);
  if (gov && req !== null && !onStep(req)) extraCurve(family, req, `ρg req ${fmt(req, 4)}`, s.capContext, data);
  const checked = outcome.checked?.rho;
  if (checked !== undefined && !onStep(checked) && (req === null || Math.abs(checked - req) >= 5e-4)) extraCurve(family, checked, `checked ρg ${fmt(checked, 4)}`, s.capContext, data);
  const domain = plotDomain(data, outcome.results);
  placeLoads(L, domain, outcome.results, data);

  const sy = b.symbols;
  const su = DISPLAY_UNITS[u].stress;
  const hSym = rc.request.shape.kind === 'circle' ? 'D' : 'h';
  const template: TemplateParams = {
    layout: L,
    xTitle: `${sy.designMoment} / (Ag · ${hSym}),  Mu / (Ag · ${hSym})   (${su})`,
    yTitle: `${sy.designAxial} / Ag,  Pu / Ag   (${su})`,
    families: ['design'],
    overlay: domain,
  };

  // 2. panels
  const title = `Column check: ${sectionText(rc)}`;
  header(g, title, input);
  g.text('heading', L.colA.x, L.colA.y + 1.0 * L.u, `Loads on the ${sy.designFamily} curves at the actual γ = ${fmt(s.gamma, 4)}`);
  plotCaption(g, L, rc, outcome);
  const insets: Inset[] = [];
  const yB = inputsPanel(g, L, rc, outcome);
  if (biaxial && gov) contourPanel(g, L, rc, biaxial, gov, yB, insets);
  else if (gov) summaryPanel(g, L, rc, outcome, yB);
  const bottom = new Flow(g, L.bottom);
  resultsTable(bottom, rc, outcome);
  if (biaxial) biaxialTable(bottom, rc, biaxial, outcome);
  if (fx?.slenderness) slendernessTable(bottom, rc, fx, outcome);
  barsTable(bottom, rc, outcome);
  sidePanel(g, L, rc, input, fx, outcome);
  titleBlock(g, L, rc, input);
  return { template, data, insets, title };
}

/**
 * Share of the column height the plot takes: what the tables under it need (in table lines, estimated), within
 * 45–62 %, so a short check gets a large plot and a long one keeps its tables on the page.
 */
function plotShare(paper: { w: number; h: number }, rc: ResolvedCheck, outcome: CheckOutcome): number {
  const u = Math.min(paper.w, paper.h) / 100 + 0.8;
  const colH = reportLayout(paper.w, paper.h, 0.5).colA.h;
  const n = Math.min(outcome.results.length, 12);
  const fx = rc.effects;
  let lines = 5 + n + 3 + 4 + Math.max(1, outcome.bars.length);
  if (fx?.bars) lines += 5 + n;
  if (fx?.slenderness) lines += 5 + 2 * n;
  const need = lines * 1.22 * u + 9 * u;
  return Math.min(0.62, Math.max(0.45, 1 - need / colH));
}

function sectionText(rc: ResolvedCheck): string {
  const s = rc.section;
  const un = DISPLAY_UNITS[s.units];
  const dims = s.shape.kind === 'rectangle' ? `${fmt(s.shape.b)} × ${fmt(s.shape.h)} ${un.length}` : `D = ${fmt(s.shape.diameter)} ${un.length}`;
  return `${dims} ${s.basis.transverse}, ${s.arrangement.kind}, f′c ${fmt(s.basis.fc)} ${un.stress}, fy ${fmt(s.basis.fy)} ${un.stress}, γ ${fmt(s.gamma, 3)}`;
}

// ── plot ────────────────────────────────────────────────────────────────────────────────────────

function extraCurve(family: CurveFamily, rho: number, label: string, capContext: CapContext, data: SheetData): void {
  const one = computeFamily({ basis: family.basis, shape: family.shape, arrangement: family.arrangement, gamma: family.gamma, rhos: [rho], capContext, basePoints: SHEET_BASE_POINTS });
  const c = one.curves[0]!;
  const rows = Array.from(c.phiPn, (P, i) => ({ curve: label, i, M: r5(c.phiMn[i]!), P: r5(P) }));
  data.extraCurves!.push(...rows);
  // label on the compression side, clear of the ρg labels on the tension branch
  const pMax = Math.max(...rows.map((p) => p.P));
  const at = [...rows].reverse().find((p) => p.P <= 0.55 * pMax && p.P > 0);
  if (at) data.curveLabels.push({ M: at.M, P: at.P, text: label, colour: COLOURS.ink, z: data.curveLabels.length });
}

function plotDomain(data: SheetData, results: readonly LoadResult[]): { domainM: [number, number]; domainP: [number, number] } {
  let mMax = 0;
  let pMax = 0;
  let pMin = 0;
  for (const c of [...data.curves, ...(data.extraCurves ?? [])]) {
    mMax = Math.max(mMax, c.M);
    pMax = Math.max(pMax, c.P);
    pMin = Math.min(pMin, c.P);
  }
  for (const r of results) {
    if (!Number.isFinite(r.normalised.M) || !Number.isFinite(r.normalised.P)) continue;
    mMax = Math.max(mMax, r.normalised.M);
    pMax = Math.max(pMax, r.normalised.P);
    pMin = Math.min(pMin, r.normalised.P);
  }
  const sm = niceStep(mMax * 1.18, 10);
  const sp = niceStep((pMax - pMin) * 1.06, 12);
  return { domainM: [0, Math.ceil((mMax * 1.18) / sm) * sm], domainP: [Math.floor((pMin * 1.04) / sp) * sp, Math.ceil((pMax * 1.04) / sp) * sp] };
}

/** Load marks in chart units; labels in points from the plot origin, set beside their mark where they collide with no other label. */
function placeLoads(L: SheetLayout, d: { domainM: [number, number]; domainP: [number, number] }, results: readonly LoadResult[], data: SheetData): void {
  const px = (M: number) => ((M - d.domainM[0]) / (d.domainM[1] - d.domainM[0])) * L.plot.w;
  const py = (P: number) => L.plot.h - ((P - d.domainP[0]) / (d.domainP[1] - d.domainP[0])) * L.plot.h;
  const placed: { x0: number; y0: number; x1: number; y1: number }[] = [];
  // labels of the extra curves (centred on their point) are obstacles too
  for (const c of data.curveLabels.filter((l) => l.colour === COLOURS.ink)) {
    const w = estWidth(c.text, 0.82 * L.u);
    placed.push({ x0: px(c.M) - w / 2, y0: py(c.P) - 0.6 * L.u, x1: px(c.M) + w / 2, y1: py(c.P) + 0.6 * L.u });
  }
  const marks = results.filter((r) => Number.isFinite(r.normalised.M) && Number.isFinite(r.normalised.P));
  // marks drawn in reverse rank, so the governing one sits on top
  [...marks].reverse().forEach((r, z) => data.loadMarks!.push({ id: r.id, M: r5(r.normalised.M), P: r5(r.normalised.P), governing: r.governing ? 1 : 0, z }));
  for (const p of marks) placed.push({ x0: px(p.normalised.M) - 3, y0: py(p.normalised.P) - 3, x1: px(p.normalised.M) + 3, y1: py(p.normalised.P) + 3 });
  const labels: LoadLabelRow[] = [];
  marks.slice(0, LABELLED_LOADS).forEach((r) => {
    const x = px(r.normalised.M);
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

function plotCaption(g: Deco, L: ReportLayout, rc: ResolvedCheck, outcome: CheckOutcome): void {
  const u = L.u;
  const y = L.plot.y + L.plot.h + 4.6 * u + 0.4 * u;
  const n = outcome.results.length;
  const gov = outcome.results[0];
  const slender = `${rc.effects?.slenderness ? ' Moments as checked: magnified for slenderness.' : ''}${rc.effects?.bars ? ' The chart shows Mux; Muy enters the biaxial check.' : ''}`;
  const text = `Curves at ρg ${outcome.chart.rhos.map((r) => fmt(r, 3)).join(', ')}; dashed ink: ρg required of the governing load and the checked ρg, where they fall between the steps. Dots: the ${n} load${n === 1 ? '' : 's'} at (Mu/(Ag·h), Pu/Ag); red diamond: governing${gov ? ` (${gov.id})` : ''}${n > LABELLED_LOADS ? `; the first ${LABELLED_LOADS} by rank are labelled` : ''}.${slender}`;
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

function inputsPanel(g: Deco, L: ReportLayout, rc: ResolvedCheck, outcome: CheckOutcome): number {
  const { colB: b, u } = L;
  const s = rc.section;
  const un = DISPLAY_UNITS[s.units];
  let y = b.y + 1.0 * u;
  g.text('heading', b.x, y, 'Inputs');
  y += 1.6 * u;
  const rows: [string, string][] = [
    ['design basis', s.basis.title],
    ['section', s.shape.kind === 'rectangle' ? `b × h = ${fmt(s.shape.b)} × ${fmt(s.shape.h)} ${un.length}, ${s.basis.transverse}` : `D = ${fmt(s.shape.diameter)} ${un.length}, ${s.basis.transverse}`],
    ['materials', `f′c = ${fmt(s.basis.fc)} ${un.stress}, fy = ${fmt(s.basis.fy)} ${un.stress}`],
    ['bars', `${s.arrangement.kind}, γ = ${fmt(s.gamma, 4)} (${s.gammaSource === 'given' ? 'given' : 'from cover, tie and bar'})`],
    ['checked steel', outcome.checked ? `${outcome.checked.description} (ρg = ${f(outcome.checked.rho)})` : 'none given: ρg required only'],
    ['loads', `${outcome.results.length} factored combination${outcome.results.length === 1 ? '' : 's'}, governing ${outcome.governingId ?? '—'}`],
    ['chart sheets read', `γ = ${outcome.chart.lower}${outcome.chart.upper !== null ? ` and ${outcome.chart.upper}` : ''} (step ${outcome.chart.gammaStep})`],
  ];
  const kw = 8.2 * u;
  for (const [k, v] of rows) {
    g.text('caption', b.x, y, k.toUpperCase(), kw - 0.5 * u);
    y = g.paragraph('body', b.x + kw, y, b.w - kw, v, 1.3);
    y += 0.15 * u;
  }
  const params = Object.entries(s.basis.parameters).map(([k, v]) => `${k} ${typeof v === 'number' ? fmt(v, 5) : v}`);
  g.text('caption', b.x, y, 'PARAMETERS', kw - 0.5 * u);
  y = g.paragraph('body', b.x + kw, y, b.w - kw, params.join(' · '), 1.3);
  return y + 0.8 * u;
}

function contourPanel(g: Deco, L: ReportLayout, rc: ResolvedCheck, fx: CheckEffects, gov: LoadResult, y: number, insets: Inset[]): number {
  const { colB: b, u } = L;
  const s = rc.section;
  const load = rc.request.loads[gov.index]!;
  const un = DISPLAY_UNITS[s.units];
  g.text('heading', b.x, y + 1.0 * u, `Mx–My contour at Pu of ${gov.id}`);
  y += 1.8 * u;
  const sec = biaxialSectionFor(s.basis, rc.request.shape, fx.bars!, s.capContext);
  const tension = -sec.basis.design.factor(1) * sec.basis.design.steel.yieldStress * sec.steelArea;
  const bottomLimit = L.bottom.y - 3.6 * u;
  if (load.Pu > Math.min(sec.cap.design, squashPoint(sec)) || load.Pu <= tension) {
    return g.paragraph('body', b.x, y + 1.0 * u, b.w, `Pu = ${f(toDisplay(load.Pu, 'force', s.units), 5)} ${un.force} is outside the axial range of the section: no contour.`) + u;
  }
  const size = Math.max(10 * u, Math.min(b.w, bottomLimit - y));
  const box: Box = { x: b.x, y, w: b.w, h: size };
  const left = 5.4 * u;
  const bottom = 4.4 * u;
  const side = Math.min(box.w - left - 0.8 * u, box.h - bottom - 0.6 * u);
  const plot: Box = { x: left + (box.w - left - 0.8 * u - side) / 2, y: 0.6 * u, w: side, h: side };
  const cp = contourPlot(sec, load.Pu, [{ id: gov.id, Mux: load.Mu, Muy: load.Muy ?? 0, governing: true }], s.units, { page: { w: box.w, h: box.h }, plot, u });
  const spec = contourSpec({ ...cp, xTitle: `Mx   (${un.moment})`, yTitle: `My   (${un.moment})` });
  insets.push({ spec, x: Math.round(box.x * 100) / 100, y: Math.round(box.y * 100) / 100 });
  const e = fx.loads[gov.index]!.biaxial!;
  g.paragraph('caption', b.x, box.y + box.h + 1.0 * u, b.w, `${s.basis.symbols.designFamily} contour of the actual bars at Pu = ${f(toDisplay(load.Pu, 'force', s.units), 5)} ${un.force}, both axes to one scale; Mx bends the depth h, My the width b; the diamond is (Mux, Muy) of ${gov.id}. Moment utilisation at Pu ${f(e.exact.momentUtilisation, 3)} (exact).`, 1.3);
  return box.y + box.h + 3.6 * u;
}

/** The governing load's answer in a few lines (when there is no contour to show). */
function summaryPanel(g: Deco, L: ReportLayout, rc: ResolvedCheck, outcome: CheckOutcome, y: number): void {
  const { colB: b, u } = L;
  const gov = outcome.results[0]!;
  const area = rc.section.units === 'us' ? 'in²' : 'mm²';
  g.text('heading', b.x, y + 1.0 * u, `Governing load: ${gov.id}`);
  y += 2.0 * u;
  const lines: [TextStyle, string][] = [];
  if (gov.rhoRequired === null) lines.push(['valueBold', `Not possible within ρg ≤ ${fmt(outcome.limits.max, 3)}`]);
  else {
    lines.push(['valueBold', `ρg required = ${f(gov.rhoRequired)}${gov.steelRequired !== null ? `, Ast = ${f(gov.steelRequired, 4)} ${area}` : ''}`]);
    if (gov.rhoStatus === 'minimum-governs') lines.push(['body', `The minimum ρg = ${fmt(outcome.limits.min, 3)} governs.`]);
    if (gov.governedBy === 'cap') lines.push(['body', 'Held by the axial cap, not by the curve.']);
  }
  lines.push(['body', `Chart reading ${f(gov.rhoFromChart)}; next lower sheet, next curve out: ${f(gov.rhoRoundedDown, 3)}${gov.extraSteelRoundedDown != null && gov.extraSteelRoundedDown > 0 ? `, ${f(gov.extraSteelRoundedDown, 4)} ${area} more steel than exact` : ''}.`]);
  lines.push(['body', `At capacity along the load ray: εt = ${f(gov.strain.epsT, 3)}, φ = ${f(gov.strain.phi, 3)}, ${gov.strain.class}.`]);
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

function resultsTable(fl: Flow, rc: ResolvedCheck, outcome: CheckOutcome): void {
  const u = rc.section.units;
  const un = DISPLAY_UNITS[u];
  const area = u === 'us' ? 'in²' : 'mm²';
  const withUtil = outcome.checked !== null;
  const biax = outcome.results.some((r) => rc.request.loads[r.index]?.Muy !== undefined);
  const hSym = rc.request.shape.kind === 'circle' ? 'D' : 'h';
  if (!fl.heading('Results (governing load first)', Math.min(2, outcome.results.length))) return;
  const cols = [
    { head: 'load', align: 'l' as const },
    { head: 'Pu', unit: un.force, align: 'r' as const },
    { head: biax ? 'Mux' : 'Mu', unit: un.moment, align: 'r' as const },
    ...(biax ? [{ head: 'Muy', unit: un.moment, align: 'r' as const }] : []),
    { head: 'Pu/Ag', unit: un.stress, align: 'r' as const },
    { head: `Mu/(Ag·${hSym})`, unit: un.stress, align: 'r' as const },
    { head: 'e/h', align: 'r' as const },
    { head: 'ρg required', unit: 'exact', align: 'r' as const },
    { head: 'ρg chart', unit: 'read', align: 'r' as const },
    { head: 'ρg rounded', unit: 'next sheet down', align: 'r' as const },
    { head: 'extra As', unit: area, align: 'r' as const },
    { head: 'εt', align: 'r' as const },
    { head: 'φ', align: 'r' as const },
    { head: 'class', align: 'l' as const },
    ...(withUtil ? [{ head: 'utilisation', align: 'r' as const }] : []),
    { head: 'note', align: 'l' as const },
  ];
  const rows = outcome.results.map((r) => [
    r.id,
    f(toDisplay(r.Pu, 'force', u), 5),
    f(toDisplay(r.Mu, 'moment', u), 5),
    ...(biax ? [f(toDisplay(rc.request.loads[r.index]?.Muy ?? 0, 'moment', u), 5)] : []),
    f(r.normalised.P),
    f(r.normalised.M),
    f(r.normalised.eOverH, 3),
    f(r.rhoRequired),
    f(r.rhoFromChart),
    f(r.rhoRoundedDown, 3),
    f(r.extraSteelRoundedDown, 4),
    f(r.strain.epsT, 3),
    f(r.strain.phi, 3),
    CLASS_SHORT[r.strain.class] ?? r.strain.class,
    ...(withUtil ? [f(r.utilisation, 3)] : []),
    statusText(r),
  ]);
  fl.table(cols, rows, outcome.results.map((r) => r.governing), (n) => `${n} more loads, in rank order: the .txt and .json reports list every load.`);
  const gov = outcome.results[0];
  const extra = gov?.extraSteelRoundedDown;
  fl.note(
    `εt and φ at capacity along the load ray (${outcome.checked ? 'checked reinforcement' : 'at ρg required'}). ρg chart: read between curves along the load ray and between the sheets at γ ${outcome.chart.lower}${outcome.chart.upper !== null ? ` and ${outcome.chart.upper}` : ''}. ρg rounded: the next lower sheet, the next curve out.` +
      (gov && extra != null && extra > 0 ? ` For ${gov.id} the rounded reading costs ${f(extra, 4)} ${area} more steel than the exact ρg.` : ''),
  );
}

function biaxialTable(fl: Flow, rc: ResolvedCheck, fx: CheckEffects, outcome: CheckOutcome): void {
  const u = rc.section.units;
  const un = DISPLAY_UNITS[u];
  if (!fl.heading('Biaxial bending: three methods side by side (checked reinforcement; above 1 fails)', Math.min(2, outcome.results.length))) return;
  const rows = outcome.results.map((r) => {
    const b = fx.loads[r.index]!.biaxial!;
    return [
      r.id,
      f(b.exact.utilisation, 3),
      f(b.exact.neutralAxisAngleDeg, 3),
      f(b.reciprocalLoad.utilisation, 3),
      b.reciprocalLoad.method === 'reciprocal-load' ? 'reciprocal load' : 'linear moments',
      f(b.loadContour.utilisation, 3),
      f(b.loadContour.alpha, 3),
      f(b.exact.momentUtilisation, 3),
      f(b.loadContour.momentScale, 3),
      f(toDisplay(b.reciprocalLoad.Pn, 'force', u), 4),
    ];
  });
  fl.table(
    [
      { head: 'load', align: 'l' },
      { head: 'exact', unit: 'along the ray', align: 'r' },
      { head: 'NA angle', unit: '°', align: 'r' },
      { head: 'Bresler', unit: 'Pu/Pn or sum', align: 'r' },
      { head: 'method', align: 'l' },
      { head: 'load contour', unit: 'left side', align: 'r' },
      { head: 'α', align: 'r' },
      { head: 'exact', unit: 'moments at Pu', align: 'r' },
      { head: 'contour', unit: 'moments at Pu', align: 'r' },
      { head: 'Pn', unit: `${un.force}, reciprocal`, align: 'r' },
    ],
    rows,
    outcome.results.map((r) => r.governing),
  );
}

function slendernessTable(fl: Flow, rc: ResolvedCheck, fx: CheckEffects, outcome: CheckOutcome): void {
  const u = rc.section.units;
  const un = DISPLAY_UNITS[u];
  const method = fx.loads[outcome.results[0]?.index ?? 0]?.magnified?.x.method ?? '';
  if (!fl.heading(`Slenderness: ${method}`, 2)) return;
  const rows: string[][] = [];
  const bold: boolean[] = [];
  for (const r of outcome.results) {
    const e = fx.loads[r.index]!.magnified!;
    for (const [axis, s] of [['x', e.x], ['y', e.y]] as const) {
      if (!s) continue;
      const st = (p: string) => s.steps.find((x) => x.label.startsWith(p))?.value;
      const num = (v: unknown) => (typeof v === 'number' ? f(v, 3) : '—');
      rows.push([
        r.id,
        axis,
        num(st('kℓu/r') ?? st('λ = l0/i')),
        num(st('limit') ?? st('λlim')),
        s.neglected ? 'yes' : 'no',
        f(s.delta, 4),
        f(toDisplay(s.firstOrderMoment, 'moment', u), 5),
        f(toDisplay(s.magnifiedMoment, 'moment', u), 5),
        s.ok ? '' : s.delta === Infinity ? 'unstable: Pu ≥ 0.75·Pc' : 'over 1.4 × first order',
      ]);
      bold.push(r.governing);
    }
  }
  fl.table(
    [
      { head: 'load', align: 'l' },
      { head: 'axis', align: 'l' },
      { head: 'slenderness', align: 'r' },
      { head: 'limit', align: 'r' },
      { head: 'neglected', align: 'l' },
      { head: 'δ', align: 'r' },
      { head: 'M2', unit: un.moment, align: 'r' },
      { head: 'Mc', unit: un.moment, align: 'r' },
      { head: 'note', align: 'l' },
    ],
    rows,
    bold,
  );
}

function barsTable(fl: Flow, rc: ResolvedCheck, outcome: CheckOutcome): void {
  const u = rc.section.units;
  const un = DISPLAY_UNITS[u];
  if (!fl.heading('Bar proposals (lightest first, re-verified with the discrete bars)', outcome.bars.length === 0 ? 0 : Math.min(2, outcome.bars.length))) return;
  if (outcome.bars.length === 0) {
    fl.note(`None: ${outcome.barsSkipped ?? 'no layout passes every load within the limits'}.`, 'body');
    return;
  }
  const rows = outcome.bars.map((p) => [
    p.layout,
    f(p.area, 4),
    f(p.rho, 4),
    f(p.gamma, 3),
    `${f(p.clearSpacing, 3)} ≥ ${f(p.clearSpacingRequired, 3)}`,
    f(p.utilisation, 3),
    outcome.results.find((r) => r.index === p.governingLoad)?.id ?? '',
  ]);
  fl.table(
    [
      { head: 'bars', align: 'l' },
      { head: 'As', unit: u === 'us' ? 'in²' : 'mm²', align: 'r' },
      { head: 'ρg', align: 'r' },
      { head: 'γ', align: 'r' },
      { head: 'clear', unit: un.length, align: 'r' },
      { head: 'util.', align: 'r' },
      { head: 'by load', align: 'l' },
    ],
    rows,
    rows.map((_, i) => i === 0),
  );
}

function sidePanel(g: Deco, L: ReportLayout, rc: ResolvedCheck, input: CheckReportInput, fx: CheckEffects | undefined, outcome: CheckOutcome): void {
  const { colC: b, u } = L;
  // caution, pinned to the foot of the column
  const cLines = wrap(input.caution + ' This sheet states the code edition and its assumptions; it does not replace the judgement of the engineer of record.', b.w - 2 * u, g.size('caution'));
  const ch = cLines.length * g.size('caution') * 1.35 + 1.4 * u;
  const cTop = b.y + b.h - ch;
  g.rect({ x: b.x, y: cTop, w: b.w, h: ch }, '#fbf1ef', COLOURS.caution, 0.7);
  cLines.forEach((l, i) => g.text('caution', b.x + u, cTop + 1.0 * u + 0.5 * g.size('caution') + i * g.size('caution') * 1.35, l));
  const limit = cTop - 1.0 * u;

  let y = b.y;
  const gov = outcome.results[0];
  if (fx?.slenderness && gov) {
    const e = fx.loads[gov.index]!.magnified!;
    g.text('heading', b.x, y + 1.0 * u, `Slenderness steps, ${gov.id}`);
    y += 2.0 * u;
    const axes = [['x', e.x], ['y', e.y]].filter((a): a is ['x' | 'y', NonNullable<typeof e.x>] => a[1] !== undefined);
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

  g.text('heading', b.x, y + 1.0 * u, `Assumptions and clauses: ${rc.section.basis.title}`);
  y += 2.0 * u;
  const notes = [...rc.section.basis.notes, ...input.assumptions];
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

function titleBlock(g: Deco, L: ReportLayout, rc: ResolvedCheck, input: CheckReportInput): void {
  const { titleBlock: b, u } = L;
  const cells: [string, string, number][] = [
    ['office', input.office ?? '', 3.2],
    ['project', input.project ?? '', 4.2],
    ['design basis', rc.section.basis.title, 1.4],
    ['section', sectionText(rc), 5.2],
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
