/**
 * The contour page of `pmchart contour --out FILE.svg|pdf`: a plot square on the left, the section, the
 * load, the conventions, the basis notes and the caution on the right. Pure: returns the vega-lite spec.
 * Letter landscape for US units, A4 landscape for SI.
 */
import { momentUtilisationAtAxial, type BiaxialSection } from '../analysis/biaxial.js';
import type { Arrangement, Shape } from '../section/types.js';
import { CAUTION } from '../report/caution.js';
import { DISPLAY_UNITS, toDisplay, type UnitSystem } from '../units/index.js';
import { generatorLabel } from '../version.js';
import { contourPlot, PLOT_CONTOUR_POINTS, type ContourLoadInput } from './contour-plot.js';
import { contourSpec } from './contour-spec.js';
import { wrap, type TextRow } from './sheet-data.js';
import { TEXT_STYLES, type TextStyle } from './style.js';

export interface ContourPageInput {
  sec: BiaxialSection;
  units: UnitSystem;
  shape: Shape;
  arrangement: Arrangement;
  gamma: number;
  /** γB when given (outer-column spacing ÷ b) */
  gammaB?: number;
  /** design axial load, internal units */
  Pu: number;
  /** "ρg = 0.02" or "8 × #9" */
  steel: string;
  loads: readonly ContourLoadInput[];
  date: string;
  project?: string;
}

/** The page's spec, size and PDF title. */
export function contourPage(input: ContourPageInput): { spec: ReturnType<typeof contourSpec>; W: number; H: number; title: string } {
  const u = input.units;
  const [W, H] = u === 'us' ? [792, 612] : [841.89, 595.28];
  const uu = Math.min(W, H) / 100 + 0.8;
  const m = 3.2 * uu;
  const top = m + 6.4 * uu;
  const side = Math.min(H - top - m - 5.6 * uu, 0.6 * W);
  const plot = { x: m + 6.6 * uu, y: top, w: side, h: side };
  const texts = contourPageTexts(input, { W, H, u: uu, m, plot });
  const spec = contourSpec(contourPlot(input.sec, input.Pu, input.loads, u, { page: { w: W, h: H }, plot, u: uu, texts }));
  return { spec, W, H, title: `Mx–My contour at Pu = ${fmtNum(toDisplay(input.Pu, 'force', u))} ${DISPLAY_UNITS[u].force}` };
}

const fmtNum = (x: number, d = 4): string => String(Number(x.toPrecision(d)));

function contourPageTexts(
  input: ContourPageInput,
  g: { W: number; H: number; u: number; m: number; plot: { x: number; y: number; w: number; h: number } },
): TextRow[] {
  const { sec, Pu, steel, loads, date } = input;
  const section = input;
  const { u, m, plot } = g;
  const b = sec.basis;
  const un = DISPLAY_UNITS[section.units];
  const rows: TextRow[] = [];
  const put = (style: TextStyle, x: number, y: number, text: string) => rows.push({ style, x: Math.round((x - plot.x) * 100) / 100, y: Math.round((y - plot.y) * 100) / 100, text, z: rows.length });
  const size = (style: TextStyle) => TEXT_STYLES[style].size * u;
  const P = `${fmtNum(toDisplay(Pu, 'force', section.units))} ${un.force}`;
  put('sheetTitle', m, m + 2.2 * u, `Mx–My contour at Pu = ${P}`);
  put('body', m, m + 4.0 * u, `${b.symbols.designFamily} capacity of the actual section and bars at the design axial load · ${b.title}`);
  const x0 = plot.x + plot.w + 3.4 * u;
  const w = g.W - m - x0;
  let y = plot.y + 0.6 * u;
  const para = (style: TextStyle, text: string, gap = 1.36) => {
    for (const line of wrap(text, w, size(style))) {
      put(style, x0, y, line);
      y += size(style) * gap;
    }
  };
  const heading = (t: string) => {
    y += 0.5 * u;
    put('heading', x0, y, t);
    y += 1.5 * u;
  };
  const s = section.shape;
  heading('Section');
  para('body', `${s.kind === 'rectangle' ? `${fmtNum(s.b)} × ${fmtNum(s.h)} ${un.length}` : `D = ${fmtNum(s.diameter)} ${un.length}`} ${b.transverse}, ${section.arrangement.kind}, γ = ${fmtNum(section.gamma)}${section.gammaB !== undefined ? `, γB = ${fmtNum(section.gammaB)}` : ''}`);
  para('body', `f′c = ${fmtNum(b.fc)} ${un.stress}, fy = ${fmtNum(b.fy)} ${un.stress}; steel ${steel} (Ast = ${fmtNum(sec.steelArea)} ${section.units === 'us' ? 'in²' : 'mm²'})`);
  heading('Load');
  if (loads.length === 0) para('body', `Pu = ${P}; no moments given (--mu, --muy mark a load point).`);
  for (const l of loads) {
    const util = momentUtilisationAtAxial(sec, Pu, l.Mux, l.Muy);
    const M = (x: number) => `${fmtNum(toDisplay(x, 'moment', section.units))} ${un.moment}`;
    para('body', `Pu = ${P}, Mux = ${M(l.Mux)}, Muy = ${M(l.Muy)} (red diamond).`);
    para('valueBold', `Moment utilisation at Pu (exact): ${Number.isFinite(util) ? fmtNum(util, 3) : '—'}`);
  }
  heading('Conventions');
  para('body', 'x runs across the width b, y along the depth h. Mx bends the depth h (the chart plane), My bends the width b. Both axes share one scale, so the contour keeps its true shape.');
  para('body', `Each point is the ${b.symbols.designFamily} moment pair of one neutral-axis angle (${PLOT_CONTOUR_POINTS} over a full turn) with the depth set so that P = Pu; the ${b.symbols.axialCap ?? 'axial cap'} is checked for Pu.`);
  heading(`Basis: ${b.title}`);
  for (const n of b.notes) para('body', `• ${n}`, 1.3);
  y = Math.max(y + 0.8 * u, g.H - m - 5.2 * u);
  para('caution', CAUTION, 1.3);
  put('caption', m, g.H - m, `${generatorLabel()} · ${date}${input.project ? ` · ${input.project}` : ''}`);
  return rows;
}

