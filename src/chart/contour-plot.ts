/**
 * The Mx–My contour plot of an actual section at one axial load: data for src/chart/contour-spec.ts,
 * standalone (`pmchart contour --out FILE.svg|pdf`) or as the check report's inset.
 */
import { contourAtAxial, type BiaxialSection } from '../analysis/biaxial.js';
import { contourExtent, type ContourLoad, type ContourPlot } from './contour-spec.js';
import type { Box } from './layout.js';
import type { TextRow } from './sheet-data.js';
import { DISPLAY_UNITS, toDisplay, type UnitSystem } from '../units/index.js';

/** Neutral-axis angles over a full turn for a drawn contour: about 2.5° apart, smooth at print size. */
export const PLOT_CONTOUR_POINTS = 144;

export interface ContourLoadInput {
  id: string;
  /** internal units */
  Mux: number;
  Muy: number;
  governing: boolean;
}

export function contourPlot(
  sec: BiaxialSection,
  Pu: number,
  loads: readonly ContourLoadInput[],
  units: UnitSystem,
  frame: { page: { w: number; h: number }; plot: Box; u: number; texts?: TextRow[] },
  count = PLOT_CONTOUR_POINTS,
): ContourPlot {
  const M = (x: number) => toDisplay(x, 'moment', units);
  const pts = contourAtAxial(sec, Pu, count, 'design');
  const contour = pts.map((p, i) => ({ i, Mx: M(p.Mx), My: M(p.My) }));
  if (contour.length > 2) contour.push({ ...contour[0]!, i: contour.length }); // close the loop
  const marks: ContourLoad[] = loads.map((l) => ({ id: l.id, Mx: M(l.Mux), My: M(l.Muy), governing: l.governing ? 1 : 0 }));
  let max = 0;
  for (const p of [...contour, ...marks]) max = Math.max(max, Math.abs(p.Mx), Math.abs(p.My));
  const sy = sec.basis.symbols;
  const mu = DISPLAY_UNITS[units].moment;
  return {
    page: frame.page,
    plot: frame.plot,
    u: frame.u,
    extent: contourExtent(max),
    xTitle: `Mx = ${sy.designMoment} about x, bends the depth h   (${mu})`,
    yTitle: `My = ${sy.designMoment} about y, bends the width b   (${mu})`,
    contour,
    loads: marks,
    texts: frame.texts ?? [],
  };
}
