/**
 * Axis extents of a sheet: each axis ends at the next round value beyond the data, so the plot
 * spends its area on curves. A book shares one extent per sheet group (the envelope of its sheets).
 */
import type { CurveFamily } from '../analysis/family.js';
import type { FamilyKind } from './lookup-table.js';

/** Extents in chart units (normalised M and P as the sheet shows them). */
export interface AxisExtent {
  M: [number, number];
  P: [number, number];
}

/** One axis: its domain and the round step of its ticks and grid. */
export interface AxisScale {
  domain: [number, number];
  step: number;
}

export interface SheetAxes {
  M: AxisScale;
  P: AxisScale;
}

/** Round steps 1, 2, 2.5 and 5 × 10^k (common practice for chart grids). */
const MULTIPLIERS = [1, 2, 2.5, 5, 10];

/** The smallest round step that divides `span` into at most `ticks` intervals. */
export function roundStep(span: number, ticks: number): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / ticks;
  const p = 10 ** Math.floor(Math.log10(raw));
  for (const m of MULTIPLIERS) if (m * p >= raw * (1 - 1e-9)) return m * p;
  return 10 * p;
}

/** Rounds to 10 significant digits so that steps × integers print cleanly. */
const clean = (x: number): number => Number(x.toPrecision(10)) + 0;

/** Share of an axis the curves must fill (issue: plots spent 35–40 % of their area on nothing). */
export const MIN_FILL = 0.75;

/**
 * The domain from the next round value at or below `lo` to the next at or above `hi`, `ticks` intervals
 * at most. A data end already on a round value stays there. With `minFill`, a finer round step is taken
 * (up to 1.6 × the ticks) where the coarse one would leave the data less than that share of the axis.
 */
export function roundScale(lo: number, hi: number, ticks: number, minFill = 0): AxisScale {
  let out: AxisScale | null = null;
  for (let t = ticks; t <= Math.ceil(1.6 * ticks); t++) {
    const step = roundStep(hi - lo, t);
    const eps = 1e-9 * Math.max(1, Math.abs(hi), Math.abs(lo));
    const s: AxisScale = { domain: [clean(Math.floor((lo + eps) / step) * step), clean(Math.ceil((hi - eps) / step) * step)], step };
    if (!out) out = s;
    if ((hi - lo) / (s.domain[1] - s.domain[0]) >= minFill - 1e-9) return s;
  }
  return out!;
}

/** The share of each axis that an extent fills. */
export function fillOf(e: AxisExtent, a: SheetAxes): { M: number; P: number } {
  return { M: (e.M[1] - e.M[0]) / (a.M.domain[1] - a.M.domain[0]), P: (e.P[1] - e.P[0]) / (a.P.domain[1] - a.P.domain[0]) };
}

/**
 * A sheet's axes in a book: the group's shared scale where this sheet's own curves still fill MIN_FILL of
 * it in both directions, else its own; an explicit group `axes` always wins.
 */
export function sheetAxes(own: AxisExtent, group: AxisExtent | undefined, plot: { w: number; h: number }, fixed?: { M?: [number, number]; P?: [number, number] }): SheetAxes {
  const mine = axesFor(own, plot, fixed);
  if (!group) return mine;
  const shared = axesFor(envelope([group, own]), plot, fixed);
  const f = fillOf(own, shared);
  return (fixed?.M || f.M >= MIN_FILL - 1e-9) && (fixed?.P || f.P >= MIN_FILL - 1e-9) ? shared : mine;
}

/** Minor grid values: each major step split in five (in four for steps of 2 × 10^k), inside the domain. */
export function minorValues(s: AxisScale): number[] {
  const mant = Number((s.step / 10 ** Math.floor(Math.log10(s.step))).toPrecision(6));
  const minor = s.step / (mant === 2 ? 4 : 5);
  const out: number[] = [];
  const first = Math.ceil(s.domain[0] / minor - 1e-9);
  for (let k = first; k * minor <= s.domain[1] + 1e-9 * minor; k++) {
    const v = clean(k * minor);
    if (Math.abs(v / s.step - Math.round(v / s.step)) > 1e-6) out.push(v);
  }
  return out;
}

/** A fixed domain (a group's own `axes`): ticks at a round step inside it. */
export function fixedScale(domain: [number, number], ticks: number): AxisScale {
  return { domain, step: roundStep(domain[1] - domain[0], ticks) };
}

/** Tick values of a scale: the multiples of its step inside its domain. */
export function tickValues(s: AxisScale): number[] {
  const out: number[] = [];
  const first = Math.ceil(s.domain[0] / s.step - 1e-9);
  for (let k = first; k * s.step <= s.domain[1] + 1e-9 * s.step; k++) out.push(clean(k * s.step));
  return out;
}

/** The extent of the drawn curves of a family (every family drawn), divided by `divisor`; M starts at 0. */
export function familyExtent(family: CurveFamily, families: readonly FamilyKind[], divisor: number): AxisExtent {
  let mMax = 0;
  let pMin = 0;
  let pMax = 0;
  for (const c of family.curves) {
    for (const fam of families) {
      const P = fam === 'design' ? c.phiPn : c.Pn;
      const M = fam === 'design' ? c.phiMn : c.Mn;
      for (let i = 0; i < P.length; i++) {
        mMax = Math.max(mMax, M[i]! / divisor);
        pMin = Math.min(pMin, P[i]! / divisor);
        pMax = Math.max(pMax, P[i]! / divisor);
      }
    }
  }
  return { M: [0, mMax], P: [pMin, pMax] };
}

/** The envelope of several extents. */
export function envelope(list: readonly AxisExtent[]): AxisExtent {
  const out: AxisExtent = { M: [Infinity, -Infinity], P: [Infinity, -Infinity] };
  for (const e of list) {
    out.M = [Math.min(out.M[0], e.M[0]), Math.max(out.M[1], e.M[1])];
    out.P = [Math.min(out.P[0], e.P[0]), Math.max(out.P[1], e.P[1])];
  }
  return out;
}

/** Tick counts for a plot box: about one tick per 34 pt across and 32 pt up (common practice for readable grids). */
export function axesFor(extent: AxisExtent, plot: { w: number; h: number }, fixed?: { M?: [number, number]; P?: [number, number] }): SheetAxes {
  const nx = Math.max(5, Math.min(16, Math.floor(plot.w / 34)));
  const ny = Math.max(5, Math.min(16, Math.floor(plot.h / 32)));
  return {
    M: fixed?.M ? fixedScale(fixed.M, nx) : roundScale(extent.M[0], extent.M[1], nx, MIN_FILL),
    P: fixed?.P ? fixedScale(fixed.P, ny) : roundScale(extent.P[0], extent.P[1], ny, MIN_FILL),
  };
}

/** A d3 number format showing every tick exactly: as many decimals as the step has (0.25 → ".2f"). */
export function tickFormat(s: AxisScale): string {
  const text = String(Number(s.step.toPrecision(6)));
  const dot = text.indexOf('.');
  return `.${dot < 0 ? 0 : text.length - dot - 1}f`;
}
