/**
 * One biaxial sheet as data: small multiples of Mx–My contour panels (one per axial level, sharing one
 * scale), the lookup table of Mxo, Myo and the fitted load-contour exponent α, the section with both
 * axes, the basis, assumptions, caution and title block. Every mark is in points from the panels
 * area's origin; the vega-lite template is src/chart/panel-spec.ts. Pure: formats the family, computes
 * no capacity.
 */
import { ALPHA_SEARCH_MAX, type BiaxialContour, type BiaxialFamily } from '../analysis/biaxial-family.js';
import { describeArrangement, describeShape, describeTransverse, fmt, levelSymbol, stressText, gammaText } from '../config/describe.js';
import type { ResolvedChartSet, ResolvedSheet } from '../config/types.js';
import { RATIO_SYMBOL } from '../config/types.js';
import { DISPLAY_UNITS } from '../units/index.js';
import { PANEL_LABEL_EM } from './panel-spec.js';
import { MIN_FILL, roundStep, tickFormat, type AxisExtent, type AxisScale } from './axes.js';
import { biaxialTable, type BiaxialTable } from './biaxial-table.js';
import { centredBox, estimateText, LabelPlacer, type MeasureText, type Segment } from './labels.js';
import { sheetLayout, type Box, type SheetLayout } from './layout.js';
import { curveKeyText, Deco, drawTitleBlock, logoInner, type LogoRef, fitSideColumn, notesAndCaution, type SideFit, header, wrap, type SheetData, type TemplateParams } from './sheet-data.js';
import { COLOURS, curveColour, TEXT_STYLES } from './style.js';

export interface BiaxialSheetContext {
  set: ResolvedChartSet;
  sheet: ResolvedSheet;
  family: BiaxialFamily;
  sheetNumber: number;
  sheetCount: number;
  generator: string;
  measureText?: MeasureText;
  /** the extent the panels must cover (mx in M, my in P, chart units): the group's envelope in a book; default this sheet's contours */
  extent?: AxisExtent;
  /** the office logo; absent: none */
  logo?: LogoRef;
}

export interface BuiltBiaxialSheet {
  template: TemplateParams;
  data: SheetData;
  table: BiaxialTable;
}

const r2 = (x: number): number => Math.round(x * 100) / 100 + 0;

/** The extent of a family's contours in chart units (divided by `divisor`): mx in M, my in P. */
export function biaxialExtent(family: BiaxialFamily, divisor: number): AxisExtent {
  const out: AxisExtent = { M: [0, 0], P: [0, 0] };
  for (const row of family.contours)
    for (const c of row) {
      for (const v of c.mx) out.M = [Math.min(out.M[0], v / divisor), Math.max(out.M[1], v / divisor)];
      for (const v of c.my) out.P = [Math.min(out.P[0], v / divisor), Math.max(out.P[1], v / divisor)];
    }
  return out;
}

/** The panels grid: `cols` × `rows` cells, each with a plot of w × h points. */
interface PanelGrid {
  cols: number;
  rows: number;
  w: number;
  h: number;
  cellW: number;
  cellH: number;
}

/** Room around a panel's plot, in type units: tick labels left and below, the axis name above. */
const PAD = { left: 3.6, right: 1.4, top: 2.6, bottom: 3.4 } as const;
/** A panel's plot is at most this much wider than tall, or taller than wide (contours keep their shape near enough). */
const MAX_PANEL_ASPECT = 1.3;

/** The grid of `n` panels in a w × h area whose plots are largest (ties: fewer rows). */
export function panelGrid(n: number, w: number, h: number, u: number): PanelGrid {
  let best: PanelGrid = { cols: 1, rows: n, w: 0, h: 0, cellW: w, cellH: h / n };
  for (let cols = 1; cols <= n; cols++) {
    const rows = Math.ceil(n / cols);
    const cellW = w / cols;
    const cellH = h / rows;
    let pw = cellW - (PAD.left + PAD.right) * u;
    let ph = cellH - (PAD.top + PAD.bottom) * u;
    if (!(pw > 0 && ph > 0)) continue;
    pw = Math.min(pw, MAX_PANEL_ASPECT * ph);
    ph = Math.min(ph, MAX_PANEL_ASPECT * pw);
    if (pw * ph > best.w * best.h * (1 + 1e-9)) best = { cols, rows, w: pw, h: ph, cellW, cellH };
  }
  return best;
}

/** Template parameters of biaxial sheets: the panels area stands in the layout's plot box. */
export function biaxialTemplate(set: ResolvedChartSet): { template: TemplateParams; layout: SheetLayout } {
  const base = sheetLayout(set.paper.widthPt, set.paper.heightPt, set.ratios.values.length + 1);
  const u = base.u;
  const top = base.header.y + base.header.h + 2.2 * u;
  const plot: Box = { x: base.header.x, y: top, w: base.side.x - 2.2 * u - base.header.x, h: base.table.y - 1.6 * u - top };
  // narrow pages: the table spans the page width under the side column; the panels keep beside it
  const layout: SheetLayout = { ...base, plot };
  return { template: { layout, xTitle: 'Mx', yTitle: 'My', families: ['design'], panels: true }, layout };
}

export function buildBiaxialSheet(ctx: BiaxialSheetContext): BuiltBiaxialSheet {
  const { set, family } = ctx;
  const basis = family.basis;
  const dimless = set.normalisation === 'dimensionless';
  const divisor = dimless ? basis.normalisingStress : 1;
  const { template, layout: L } = biaxialTemplate(set);
  const omegas = set.ratios.kind === 'omega' ? set.ratios.values : undefined;
  const table = biaxialTable(family, divisor, omegas);
  const data: SheetData = { curves: [], curveLabels: [], refs: [], refLabels: [], frame: [], texts: [], rects: [], rules: [], dots: [], rings: [] };
  if (ctx.logo) template.logo = logoInner(L);
  const g = new Deco(L, data, ctx.measureText ?? estimateText);
  header(ctx, g);
  panels(ctx, g, divisor);
  lookupPanel(ctx, table, g);
  sidePanel(ctx, g);
  biaxialTitleBlock(ctx, g);
  return { template, data, table };
}

// ── panels ──────────────────────────────────────────────────────────────────────────────────────

/** Names of the axes as the sheet prints them. */
export function axisNames(set: ResolvedChartSet, family: BiaxialFamily): { x: string; y: string; unit: string } {
  const sy = family.basis.symbols;
  const su = DISPLAY_UNITS[set.units].stress;
  const M = sy.designMoment;
  if (set.normalisation === 'dimensionless') {
    const ns = sy.normalisingStress;
    return { x: `${M}x / (${ns}·Ag·h)`, y: `${M}y / (${ns}·Ag·b)`, unit: 'dimensionless' };
  }
  return { x: `${M}x / (Ag·h)`, y: `${M}y / (Ag·b)`, unit: su };
}

function panels(ctx: BiaxialSheetContext, g: Deco, d: number): void {
  const { family, set } = ctx;
  const { plot: area, u } = g.L;
  const n = family.levels.length;
  const sy = family.basis.symbols;
  // the colour key of the ρg family across the top (the heading left out where the key needs the room)
  const keyH = 2.0 * u;
  // a capital for words ("Design"), never for a symbol (φ-factored stays φ, not Φ)
  const head = `${/^[a-z]/.test(sy.designFamily) ? sy.designFamily.charAt(0).toUpperCase() : sy.designFamily.charAt(0)}${sy.designFamily.slice(1)} Mx–My contours`;
  const sym = `${RATIO_SYMBOL[set.ratios.kind]}:`;
  const values = family.rhos.map((rho, k) => curveKeyText(set, rho, k).replace(/^\S+ /, ''));
  const keyW = g.width('body', sym) + 0.8 * u + values.reduce((w, t) => w + 3.4 * u + g.width('body', t), 0);
  let kx = area.x;
  if (g.width('heading', head) + 2.0 * u + keyW <= area.w) {
    g.text('heading', kx, area.y + 1.1 * u, head);
    kx += g.width('heading', head) + 2.0 * u;
  }
  g.text('body', kx, area.y + 1.1 * u, sym);
  kx += g.width('body', sym) + 0.8 * u;
  values.forEach((text, k) => {
    g.rule(kx, area.y + 0.8 * u, kx + 1.8 * u, area.y + 0.8 * u, curveColour(k, family.rhos.length), 2.2);
    g.text('body', kx + 2.2 * u, area.y + 1.1 * u, text);
    kx += 2.2 * u + g.width('body', text) + 1.2 * u;
  });
  const grid = panelGrid(n, area.w, area.h - keyH, u);
  // one scale for every panel: the group's extent, to the next round value
  const own = biaxialExtent(family, d);
  const ext = ctx.extent ?? own;
  // each axis to its own round end (mx and my are normalised by different sizes on rectangles)
  // the round step (1, 2, 2.5, 5 × 10^k) whose axis end overshoots the data least (the finer on a tie), ticks at least 2.6 type units apart
  const most = Math.max(3, Math.min(10, Math.floor(Math.min(grid.w, grid.h) / (2.6 * Math.max(u, g.size('dim') / TEXT_STYLES.dim.size)))));
  const axis = (lo: number, hi: number): AxisScale => {
    const top = family.quadrants === 'first' ? hi : Math.max(hi, -lo);
    let best: AxisScale | undefined;
    for (let k = 3; k <= most; k++) {
      const step = roundStep(family.quadrants === 'first' ? top : 2 * top, k);
      const end = Math.max(step, Math.ceil(top / step - 1e-9) * step);
      if (!best || end <= best.domain[1] + 1e-12) best = { domain: family.quadrants === 'first' ? [0, end] : [-end, end], step };
    }
    return best!;
  };
  const shared = { x: axis(Math.min(ext.M[0], own.M[0]), Math.max(ext.M[1], own.M[1])), y: axis(Math.min(ext.P[0], own.P[0]), Math.max(ext.P[1], own.P[1])) };
  // the group's scale only where this sheet's contours fill MIN_FILL of it on both axes; one scale for all its panels
  const fills = (e: [number, number], a: AxisScale) => Math.max(e[1], -e[0]) / a.domain[1] >= MIN_FILL - 1e-9;
  const scale = ctx.extent && !(fills(own.M, shared.x) && fills(own.P, shared.y)) ? { x: axis(own.M[0], own.M[1]), y: axis(own.P[0], own.P[1]) } : shared;
  const names = axisNames(set, family);
  // panels packed from the top left; room left below them takes the reading notes
  const cellH = grid.h + (PAD.top + PAD.bottom) * u;
  family.levels.forEach((level, i) => {
    const col = i % grid.cols;
    const row = Math.floor(i / grid.cols);
    const x0 = area.x + col * grid.cellW + PAD.left * u;
    const y0 = area.y + keyH + row * cellH + PAD.top * u;
    panel(ctx, g, { x: x0, y: y0, w: grid.w, h: grid.h }, scale, level, i, family.contours[i]!, names, d);
  });
  readingNotes(ctx, g, area.y + keyH + grid.rows * cellH + 0.6 * u, area.y + area.h);
}

/** How to read a load off the sheet, where the panels leave room below them (dropped when they do not). */
function readingNotes(ctx: BiaxialSheetContext, g: Deco, top: number, bottom: number): void {
  const { set, family } = ctx;
  const { plot: area, u } = g.L;
  const sy = family.basis.symbols;
  const P = sy.actionAxial ?? 'Pu';
  const M = sy.actionMoment ?? 'Mu';
  const ns = sy.normalisingStress;
  const dimless = set.normalisation === 'dimensionless';
  const by = (x: string) => (dimless ? `(${ns}·${x})` : `(${x})`);
  const key = RATIO_SYMBOL[set.ratios.kind];
  const steps = [
    `1. Normalise the factored load: level ${P}/(${ns}·Ag); mx = ${M}x/${by('Ag·h')} and my = ${M}y/${by('Ag·b')}, with h along y and b along x.`,
    `2. Take the panels whose levels bracket the load's. In each, the point ${family.quadrants === 'first' ? '(|mx|, |my|)' : '(mx, my), signs kept,'} lies inside the contour of every ${key} that carries the load; interpolate between contours, then linearly between the two levels.`,
    `3. No contour of a ${key} at a level: the level is above that ${key}'s ${sy.axialCap ?? 'axial cap'}, which cannot carry the load.`,
    '4. The fitted α is a least-squares average: the exact contour lies up to the misfit inside or outside the fitted curve, so a check with α is only as close as its misfit; read final values off the drawn contours.',
  ];
  const fs = g.size('bodySmall');
  const colW = (area.w - 2.0 * u) / 2;
  const cols = [steps.slice(0, 2), steps.slice(2)];
  const need = 1.6 * u + Math.max(...cols.map((c) => c.reduce((n, t) => n + wrap(t, colW, fs, (s, f) => g.measure(s, f, false)).length * fs * 1.38 + 0.3 * u, 0)));
  if (bottom - top < need) return;
  g.rule(area.x, top, area.x + area.w, top, COLOURS.rule, 0.6);
  g.text('heading', area.x, top + 1.3 * u, 'Reading a load off this sheet');
  cols.forEach((c, k) => {
    let y = top + 2.7 * u;
    for (const t of c) y = g.paragraph('bodySmall', area.x + k * (colW + 2.0 * u), y, colW, t) + 0.3 * u;
  });
}

/** Decimals of a tick format ".2f" → 2. */
const decimals = (s: AxisScale): number => Number(tickFormat(s).slice(1, -1));

function panel(ctx: BiaxialSheetContext, g: Deco, b: Box, s: { x: AxisScale; y: AxisScale }, level: number, levelIndex: number, contours: readonly BiaxialContour[], names: { x: string; y: string; unit: string }, d: number): void {
  const { family, set } = ctx;
  const u = g.L.u;
  const [x0, x1] = s.x.domain;
  const [y0, y1] = s.y.domain;
  const X = (v: number) => b.x + ((v - x0) / (x1 - x0)) * b.w;
  const Y = (v: number) => b.y + b.h - ((v - y0) / (y1 - y0)) * b.h;
  // grid, axes through the origin, frame
  const ticks = (a: AxisScale, draw: (v: number, text: string, zero: boolean) => void) => {
    const dec = decimals(a);
    for (let k = Math.ceil(a.domain[0] / a.step - 1e-9); k * a.step <= a.domain[1] + 1e-9 * a.step; k++) {
      const v = Number((k * a.step).toFixed(10)) + 0;
      draw(v, v.toFixed(dec), Math.abs(v) < 1e-12);
    }
  };
  // offsets scale with the tick type, which the print floor may set above its share of u
  const tu = Math.max(u, g.size('dim') / TEXT_STYLES.dim.size);
  ticks(s.x, (v, t, zero) => {
    g.rule(X(v), b.y, X(v), b.y + b.h, zero ? COLOURS.muted : '#e4e9ed', zero ? 0.7 : 0.5);
    g.text('dim', X(v), b.y + b.h + 1.1 * tu, t);
  });
  ticks(s.y, (v, t, zero) => {
    g.rule(b.x, Y(v), b.x + b.w, Y(v), zero ? COLOURS.muted : '#e4e9ed', zero ? 0.7 : 0.5);
    g.text('dim', b.x - 0.5 * tu - g.width('dim', t) / 2, Y(v) + 0.3 * tu, t);
  });
  g.rect(b, 'transparent', COLOURS.faint, 0.7);
  g.text('dimLeft', b.x + b.w - g.width('dimLeft', `${names.x} →`), b.y + b.h + 2.3 * tu, `${names.x} →`);
  g.text('dimLeft', b.x - 3.2 * tu, b.y - 1.1 * tu, `↑ ${names.y}`);

  // the contours, in page points from the panels area's origin
  const n = family.rhos.length;
  const placer = new LabelPlacer({ x0: b.x, y0: b.y, x1: b.x + b.w, y1: b.y + b.h });
  const drawn: { k: number; xs: number[]; ys: number[]; angles: readonly number[] }[] = [];
  contours.forEach((c, k) => {
    if (!c.reachable) return;
    const xs = c.mx.map((v) => X(v / d));
    const ys = c.my.map((v) => Y(v / d));
    const closed = family.quadrants === 'all';
    const id = `level-${levelIndex}-rho-${k}`;
    const m = xs.length;
    for (let j = 0; j < m + (closed ? 1 : 0); j++) {
      const q = j % m;
      g.out.curves.push({ curve: id, family: 'design', i: j, M: r2(xs[q]! - g.L.plot.x), P: r2(ys[q]! - g.L.plot.y), colour: curveColour(k, n) });
    }
    const segs: Segment[] = xs.slice(1).map((_, j) => [xs[j]!, ys[j]!, xs[j + 1]!, ys[j + 1]!] as Segment);
    placer.addObstacle({ group: `curve-${k}`, weight: 1, segments: segs });
    drawn.push({ k, xs, ys, angles: c.angleDeg });
  });

  // the level, top right (outside every contour), and what is missing
  const levelText = `${levelSymbol(family.basis.symbols)} = ${level.toFixed(2)}`;
  const lw = g.width('heading', levelText);
  const lx = family.quadrants === 'first' ? b.x + b.w - lw - 0.6 * u : b.x + 0.6 * u;
  g.rect({ x: lx - 0.4 * u, y: b.y + 0.3 * u, w: lw + 0.8 * u, h: 1.5 * u }, COLOURS.paper);
  g.text('heading', lx, b.y + 1.4 * u, levelText);
  placer.reserve({ x0: lx - 0.4 * u, y0: b.y + 0.3 * u, x1: lx + lw + 0.4 * u, y1: b.y + 1.8 * u });
  const missing = contours.filter((c) => !c.reachable);
  if (missing.length > 0) {
    const sym = RATIO_SYMBOL[set.ratios.kind];
    const idx = contours.map((c, k) => (c.reachable ? -1 : k)).filter((k) => k >= 0);
    const names = idx.map((k) => curveKeyText(set, family.rhos[k]!, k).replace(/^\S+ /, ''));
    const what = level > 0 ? `above the ${family.basis.symbols.axialCap ?? 'axial cap'}` : 'beyond pure tension';
    const text = missing.length === contours.length ? `every ${sym}: ${what}` : `${sym} ${names.length > 2 ? `${names[0]}–${names[names.length - 1]}` : names.join(', ')}: ${what}`;
    const tw = g.width('caption', text);
    const tx = family.quadrants === 'first' ? b.x + b.w - tw - 0.6 * u : b.x + 0.6 * u;
    g.text('caption', tx, b.y + 2.6 * u, text);
    placer.reserve({ x0: tx, y0: b.y + 1.8 * u, x1: tx + tw, y1: b.y + 2.9 * u });
  }

  // ρg values on the curves, spread over the quadrant (outer curves toward 45°, alternating sides)
  const fs = Math.max(PANEL_LABEL_EM * u, g.L.minText ?? 0);
  const h = 1.05 * fs;
  for (const c of [...drawn].reverse()) {
    const text = curveKeyText(set, family.rhos[c.k]!, c.k).replace(/^\S+ /, '');
    const w = g.measure(text, fs, true);
    const pref = c.k % 2 === 0 ? 30 : 60;
    const cands = c.angles
      .map((a, j) => ({ a, j }))
      .filter(({ a }) => a % 90 > 4 && a % 90 < 86)
      .map(({ a, j }) => ({ box: centredBox(c.xs[j]!, c.ys[j]!, w, h, 1), penalty: Math.abs((a % 90) - pref) / 30 + (a >= 90 ? 0.5 : 0), j }));
    const chosen = placer.place(cands, `curve-${c.k}`, 0.2 * h);
    const best = cands[chosen];
    if (best) g.out.curveLabels.push({ M: r2(c.xs[best.j]! - g.L.plot.x), P: r2(c.ys[best.j]! - g.L.plot.y), text, colour: curveColour(c.k, n), z: g.out.curveLabels.length });
  }
}

// ── lookup table ────────────────────────────────────────────────────────────────────────────────

function lookupPanel(ctx: BiaxialSheetContext, t: BiaxialTable, g: Deco): void {
  const { table: b, u } = g.L;
  const { set, family } = ctx;
  const sy = family.basis.symbols;
  const line = 1.32 * u;
  const names = axisNames(set, family);
  g.text('heading', b.x, b.y + 1.0 * u, 'Uniaxial capacities and fitted load contour per level');
  const explain = `(Mx/Mxo)^α + (My/Myo)^α = 1 fitted by least squares on the contour radius (Bresler 1960 load contour); misfit: worst radial gap, % of the exact radius. Mxo, Myo: the ${sy.designFamily} capacities about each axis at the level, in the axes' units (${names.unit}).`;
  const ex = b.x + 0.42 * b.w;
  const lines = wrap(explain, b.w - (ex - b.x), g.size('caption'), (s, f) => g.measure(s, f, false));
  lines.slice(0, 2).forEach((l, i) => g.text('caption', ex, b.y + (0.55 + i * 0.95) * u, l, b.x + b.w - ex));
  const top = b.y + 2.0 * u;
  const rhoW = 4.6 * u;
  const nL = t.levels.length;
  const groupW = (b.w - rhoW) / nL;
  const weights = [1, 1, 1.6];
  const colW = weights.map((w) => (groupW * w) / 3.6);
  g.rect({ x: b.x, y: top, w: b.w, h: 2 * line + 0.2 * u }, COLOURS.panel);
  g.text('cellHead', b.x + rhoW / 2, top + 1.4 * line, RATIO_SYMBOL[set.ratios.kind]);
  const lsym = levelSymbol(sy);
  t.levels.forEach((lv, i) => {
    const x = b.x + rhoW + i * groupW;
    g.text('cellHead', x + groupW / 2, top + 0.85 * line, `${lsym} = ${lv.toFixed(2)}`, groupW - 0.4 * u);
    let cx = x;
    ['Mxo', 'Myo', 'α (misfit)'].forEach((h, c) => {
      g.text('cellSub', cx + colW[c]! / 2, top + 1.8 * line, h);
      cx += colW[c]!;
    });
    g.rule(x, top, x, top + (2 + t.rhos.length) * line + 0.4 * u, COLOURS.rule, 0.5);
  });
  let y = top + 2 * line + 0.2 * u;
  t.rhos.forEach((rho, k) => {
    if (k % 2 === 1) g.rect({ x: b.x, y, w: b.w, h: line }, '#f8fafb');
    const base = y + 0.78 * line;
    g.text('cellRho', b.x + 0.6 * u, base, t.omegas ? fmt(t.omegas[k]!, 4) : fmt(rho, 4));
    t.cells[k]!.forEach((c, i) => {
      let cx = b.x + rhoW + i * groupW;
      // α at the fit's upper search end (6) says "at least": a near-rectangular contour (small ρg in tension)
      const alpha = c.alpha >= ALPHA_SEARCH_MAX - 0.01 ? `≥${ALPHA_SEARCH_MAX}` : c.alpha.toFixed(2);
      const vals = c.reachable ? [c.mxo.toFixed(3), c.myo.toFixed(3), `${alpha} (${(100 * c.misfit).toFixed(1)}%)`] : ['—', '—', '—'];
      vals.forEach((v, j) => {
        g.text('cellRight', cx + colW[j]! - 0.5 * u, base, v);
        cx += colW[j]!;
      });
    });
    y += line;
  });
  g.rule(b.x, y + 0.1 * u, b.x + b.w, y + 0.1 * u, COLOURS.faint, 0.6);
  g.rule(b.x, top, b.x + b.w, top, COLOURS.faint, 0.6);
}

// ── side column ─────────────────────────────────────────────────────────────────────────────────

const sidePanel = (ctx: BiaxialSheetContext, g: Deco): void => fitSideColumn(g, (d, fit) => sideColumn(ctx, d, fit));

/** The notes of a biaxial sheet after the basis's own. */
export function biaxialNotes(set: ResolvedChartSet, family: BiaxialFamily): string[] {
  const basis = family.basis;
  const sy = basis.symbols;
  const su = DISPLAY_UNITS[set.units].stress;
  const ns = sy.normalisingStress;
  const notes = [
    `Contours: the ${sy.designFamily} moment pairs (Mx, My) the section resists at each axial level, from the exact strain-compatibility search under an inclined neutral axis, at moment directions atan2(My, Mx) ${angleStep(family)}° apart, joined by straight lines.`,
    family.quadrants === 'first'
      ? 'The bars are symmetric about both axes: the first quadrant tells all (the others are its mirror images).'
      : 'The bars are not symmetric about both axes: all four quadrants are drawn; Mxo and Myo are read on the positive axes.',
    set.normalisation === 'dimensionless'
      ? `Mx is divided by Ag·h and My by Ag·b, both also by ${ns} = ${stressText(basis.normalisingStress, set.units)}; h is the depth along y, b the width along x.`
      : `Mx is divided by Ag·h and My by Ag·b, in ${su}; h is the depth along y, b the width along x.`,
    `Axial level: the factored axial load over ${ns}·Ag (compression positive). A ${RATIO_SYMBOL[set.ratios.kind]} whose ${basis.symbols.axialCap ?? 'axial cap'} lies below a level has no contour there.`,
    'Short column: slenderness, creep and second-order effects are not included; enter moments already magnified about each axis.',
  ];
  if (set.ratios.kind === 'omega') {
    const fyd = basis.design.steel.yieldStress;
    notes.unshift(`Curves per mechanical ratio ω = ρg·σy/${ns}, σy = ${stressText(fyd, set.units)} the design yield stress: ρg = ω·${fmt(basis.normalisingStress / fyd, 4)} here.`);
  }
  return notes;
}

const angleStep = (family: BiaxialFamily): string => {
  const c = family.contours.flat().find((x) => x.reachable && x.angleDeg.length > 1);
  return c ? fmt(c.angleDeg[1]! - c.angleDeg[0]!) : '5';
};

function sideColumn(ctx: BiaxialSheetContext, g: Deco, fit: SideFit): number {
  const { side: b, u } = g.L;
  const { family, sheet, set } = ctx;
  const basis = family.basis;

  g.text('heading', b.x, b.y + 1.0 * u, 'Section (to scale) and axes');
  const picH = fit.picture * Math.min(0.3 * b.h, 0.66 * b.w);
  const box: Box = { x: b.x, y: b.y + 2.0 * u, w: b.w, h: picH };
  g.rect(box, COLOURS.panel);
  const aspect = sheet.shape.kind === 'rectangle' ? sheet.shape.aspect : 1;
  // room in the box: the y label above (2.8 type units), the b dimension and its label below (3.6)
  const scale = Math.min(box.h - 6.4 * u, (box.w * 0.5) / aspect);
  const cx = box.x + box.w * 0.45;
  const cy = box.y + 2.8 * u + scale / 2;
  const hw = (aspect * scale) / 2;
  const hh = scale / 2;
  g.rect({ x: cx - hw, y: cy - hh, w: 2 * hw, h: 2 * hh }, COLOURS.paper, COLOURS.ink, 1.1);
  const mid = Math.floor((family.rhos.length - 1) / 2);
  const rhoShown = family.rhos[mid] ?? 0.02;
  for (const bar of family.bars) {
    const dia = Math.sqrt((4 * bar.area * rhoShown) / Math.PI) * scale;
    g.dot(cx + bar.x * scale, cy - bar.y * scale, Math.max(dia, 0.96 * u), COLOURS.ink);
  }
  // centroidal axes: x across the width b, y along the depth h
  g.rule(cx - hw - 1.2 * u, cy, cx + hw + 1.6 * u, cy, COLOURS.accent, 0.6);
  g.rule(cx, cy + hh + 1.2 * u, cx, cy - hh - 1.6 * u, COLOURS.accent, 0.6);
  g.text('dimLeft', cx + hw + 1.9 * u, cy + 0.3 * u, 'x');
  g.text('dim', cx, cy - hh - 1.9 * u, 'y');
  // dimensions: h on the left, b below, γ·h between the outer rows on the right
  const tick = 0.6 * u;
  const xl = cx - hw - 2.6 * u;
  g.rule(xl, cy - hh, xl, cy + hh, COLOURS.muted, 0.6);
  g.rule(xl - tick, cy - hh, xl + tick, cy - hh, COLOURS.muted, 0.6);
  g.rule(xl - tick, cy + hh, xl + tick, cy + hh, COLOURS.muted, 0.6);
  g.text('dim', xl - 1.0 * u, cy + 0.3 * u, 'h');
  const yb = cy + hh + 1.6 * u;
  g.rule(cx - hw, yb, cx + hw, yb, COLOURS.muted, 0.6);
  g.rule(cx - hw, yb - tick, cx - hw, yb + tick, COLOURS.muted, 0.6);
  g.rule(cx + hw, yb - tick, cx + hw, yb + tick, COLOURS.muted, 0.6);
  g.text('dim', cx, yb + 1.5 * u, 'b');
  const ys = family.bars.map((z) => z.y);
  const xr = cx + hw + 4.2 * u;
  const yTop = cy - Math.max(...ys) * scale;
  const yBot = cy - Math.min(...ys) * scale;
  g.rule(xr, yTop, xr, yBot, COLOURS.muted, 0.6);
  g.rule(xr - tick, yTop, xr + tick, yTop, COLOURS.muted, 0.6);
  g.rule(xr - tick, yBot, xr + tick, yBot, COLOURS.muted, 0.6);
  g.text('dimLeft', xr + 0.8 * u, cy - 1.2 * u, `γh = ${gammaText(sheet.gamma)} h`);
  if (family.gammaX !== undefined) g.text('dimLeft', xr + 0.8 * u, cy + 0.2 * u, `γB·b = ${gammaText(family.gammaX)} b`);
  // under the box: what is drawn and which way each moment bends
  let y = g.paragraph('caption', box.x, box.y + box.h + 1.1 * u, box.w, `${family.bars.length} bars, drawn at ${RATIO_SYMBOL.rhoG} = ${fmt(rhoShown, 4)}. Mx bends about x (compresses the +y face), My about y (compresses the +x face).`, 1.3);
  y += 1.6 * u;
  g.text('heading', b.x, y, `Basis: ${basis.title}`);
  y += 1.5 * u;
  const params = Object.entries(basis.parameters).map(([k, v]) => `${k} ${typeof v === 'number' ? fmt(v, 6) : v}`);
  y = g.paragraph(fit.notes, b.x, y, b.w, params.join('  ·  '));
  y += 1.0 * u;
  g.text('heading', b.x, y, 'Assumptions');
  y += 1.5 * u;
  return notesAndCaution(g, fit, y, [...basis.notes, ...biaxialNotes(set, family)]);
}

// ── title block ─────────────────────────────────────────────────────────────────────────────────

function biaxialTitleBlock(ctx: BiaxialSheetContext, g: Deco): void {
  const { set, sheet, family } = ctx;
  const tb = set.titleBlock;
  const basis = family.basis;
  const sy = basis.symbols;
  const ratios = set.ratios.values;
  const lv = family.levels;
  const names = axisNames(set, family);
  const curves = `${sy.designFamily} Mx–My · ${RATIO_SYMBOL[set.ratios.kind]} ${fmt(ratios[0]!, 4)}–${fmt(ratios[ratios.length - 1]!, 4)} · ${levelSymbol(sy)} ${lv.map((v) => fmt(v)).join(', ')}`;
  const gammaShown = family.gammaX !== undefined ? `${gammaText(sheet.gamma)} · γB ${gammaText(family.gammaX)}` : gammaText(sheet.gamma);
  const sheetRow: [string, string, number][] = [
    ['office', tb.office, 3],
    ['project', tb.project, 3],
    ['sheet title', sheet.title, 4.6],
    ['sheet', `${ctx.sheetNumber} of ${ctx.sheetCount}`, 1.1],
  ];
  const section: [string, string, number][] = [
    ['design basis', basis.title, 1.3],
    ['materials', `${sy.concreteStrength} ${stressText(sheet.fc, set.units)} · ${sy.steelStrength} ${stressText(sheet.fy, set.units)}`, 1.9],
    ['γ', gammaShown, 0.6],
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
    ['normalisation', `${names.x} and ${names.y}${names.unit === 'dimensionless' ? `, ${sy.normalisingStress} = ${stressText(basis.normalisingStress, set.units)}` : ` in ${names.unit}`}`, 4.6],
    ['curves', curves, 2.4],
  ];
  const rows: [string, string, number][][] =
    (g.L.titleRows ?? 3) >= 5 ? [[sheetRow[0]!, sheetRow[1]!, people[2]!, people[3]!, sheetRow[3]!], [sheetRow[2]!], section, [people[0]!, people[1]!, people[4]!, norm[1]!], [...factors, norm[0]!]] : [sheetRow, [...section, ...people], [...factors, ...norm]];
  drawTitleBlock(g, rows, ctx.logo);
}
