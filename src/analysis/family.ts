/**
 * Curve families: for one (basis, shape, arrangement, γ), the normalised interaction curves
 * Pn/Ag–Mn/(Ag·h) and φPn/Ag–φMn/(Ag·h) for each ρg, with their key points.
 * Points run from pure tension (c/h → 0) to pure compression (c/h → ∞).
 */
import type { Basis, CapContext } from '../codes/types.js';
import { layoutBars, mirroredBars, symmetricAboutBendingAxis } from '../section/arrangements.js';
import { sectionDepth } from '../section/geometry.js';
import type { Arrangement, Bar, Shape } from '../section/types.js';
import { designAt, nominalAt, prepareSection, R, RESPONSE_SIZE, type PreparedSection } from './prepared-section.js';
import { findRootOrNaN } from './solve.js';
import { tensionStrain } from './section-forces.js';

/** Ends of the sweep: they stand for the limits c → 0 (pure tension) and c → ∞ (pure compression). */
export const C_OVER_H_MIN = 1e-6;
export const C_OVER_H_MAX = 1e6;

export interface FamilyRequest {
  basis: Basis;
  shape: Shape;
  arrangement: Arrangement;
  /** outer-row spacing over depth */
  gamma: number;
  /** γB: outer-column spacing over width b (LayoutOptions.gammaX); absent: the same cover as γ gives on h */
  gammaX?: number;
  rhos: readonly number[];
  capContext?: CapContext;
  /** base points per curve before key points are added (default 400) */
  basePoints?: number;
}

export const KEY_POINT_IDS = [
  'pure-compression',
  'axial-cap',
  'decompression',
  'balanced',
  'tension-controlled',
  'pure-bending',
  'pure-tension',
] as const;
export type KeyPointId = (typeof KEY_POINT_IDS)[number] | string;

/** A point on one family, normalised (stress units). */
export interface PointValues {
  cOverH: number;
  epsT: number;
  phi: number;
  P: number;
  M: number;
}

export interface KeyPoint {
  id: KeyPointId;
  label: string;
  /** on the nominal curve (null where the curve never reaches it) */
  nominal: PointValues | null;
  /** on the factored curve, cap included */
  design: PointValues | null;
}

export interface Curve {
  rho: number;
  Pn: Float64Array;
  Mn: Float64Array;
  phiPn: Float64Array;
  phiMn: Float64Array;
  keyPoints: KeyPoint[];
}

export interface CurveFamily {
  basis: Basis;
  /** unit-depth shape */
  shape: Shape;
  arrangement: Arrangement;
  gamma: number;
  /** unit-depth bars with areas adding to Ag (ρg = 1) */
  bars: readonly Bar[];
  sweep: { cOverH: Float64Array; epsT: Float64Array; phi: Float64Array };
  curves: Curve[];
  /**
   * For a layout not symmetric about the bending axis: the index where the negative branch starts (c/h there
   * is measured from the −y face and M < 0). Absent: one branch (symmetric layouts, rings).
   */
  negativeBranchStart?: number;
  /** the prepared section, for further queries on the same family */
  section: PreparedSection;
}

/** Base grid: c/h = ½·tan θ with θ uniform, which spreads points evenly along the curve's length. */
export function baseGrid(n: number): number[] {
  const g: number[] = [C_OVER_H_MIN, C_OVER_H_MAX];
  for (let i = 0; i < n - 2; i++) {
    const theta = ((i + 0.5) / (n - 2)) * (Math.PI / 2);
    g.push(Math.min(C_OVER_H_MAX, Math.max(C_OVER_H_MIN, 0.5 * Math.tan(theta))));
  }
  return g.sort((a, b) => a - b);
}

/** c/h at which the extreme tension bar reaches strain εt (monotone in c; solved numerically for any basis). */
export function depthForTensionStrain(section: PreparedSection, epsT: number): number {
  const f = (logC: number) => tensionStrain(section.basis.profile(Math.exp(logC), 1, section.dt), section.dt) - epsT;
  const x = findRootOrNaN(f, Math.log(C_OVER_H_MIN), Math.log(C_OVER_H_MAX), 1e-14);
  return Number.isNaN(x) ? NaN : Math.exp(x);
}

/**
 * c/h at which a bar row crosses a jump of a concrete law (the edge of the rectangular block): there
 * the displaced-concrete deduction of that row switches on and the curve steps by 0.85·f′c·As,row.
 * Sweeping just below and at these depths draws the step as a clean jump instead of a slanted segment.
 */
function lawJumpDepths(section: PreparedSection): number[] {
  const { basis, bars } = section;
  const jumps = new Set<number>();
  for (const law of [basis.nominal.concrete, basis.design.concrete]) {
    for (const e of law.breakpoints) {
      const step = Math.abs(law.stress(e * (1 + 1e-9)) - law.stress(e * (1 - 1e-9)));
      if (e > 0 && step > 1e-9 * law.peakStress) jumps.add(e);
    }
  }
  const rows = [...new Set(bars.map((b) => 0.5 - b.y))];
  const out: number[] = [];
  for (const e of jumps) {
    for (const d of rows) {
      const f = (logC: number) => {
        const p = basis.profile(Math.exp(logC), 1, section.dt);
        return p.top - p.curvature * d - e;
      };
      const x = findRootOrNaN(f, Math.log(C_OVER_H_MIN), Math.log(C_OVER_H_MAX), 1e-14);
      // one depth just either side: at the root itself rounding may put the row on either side of the block edge
      if (Number.isFinite(x)) out.push(Math.exp(x) * (1 - 1e-7), Math.exp(x) * (1 + 1e-7));
    }
  }
  return out;
}

/**
 * Builds a family from a request. A layout that is not symmetric about the bending axis (a custom layout
 * with more steel on one face) gets both branches: after the positive branch (compression on the +y face,
 * pure tension → pure compression) comes the negative one (compression on the −y face, M < 0), swept back
 * from pure compression to pure tension, so each curve is one closed loop. Rings keep one branch: their
 * other bending directions are orientations (src/design/column-check.ts checks the weakest).
 */
export function computeFamily(req: FamilyRequest): CurveFamily {
  const bars = layoutBars(req.shape, req.arrangement, 1, { gamma: req.gamma, ...(req.gammaX !== undefined ? { gammaX: req.gammaX } : {}) });
  const section = prepareSection(req.basis, req.shape, bars, req.capContext ?? {});
  const family = familyOf(section, req.arrangement, req.gamma, req.rhos, req.basePoints ?? 400);
  if (req.arrangement.kind === 'ring' || symmetricAboutBendingAxis(bars, sectionDepth(req.shape))) return family;
  const mirror = familyOf(prepareSection(req.basis, req.shape, mirroredBars(bars), req.capContext ?? {}), req.arrangement, req.gamma, req.rhos, req.basePoints ?? 400);
  return withNegativeBranch(family, mirror);
}

/** Appends the mirrored family's curves, reversed and with M negated, as the negative branch. */
function withNegativeBranch(pos: CurveFamily, mirror: CurveFamily): CurveFamily {
  const joined = (a: Float64Array, b: Float64Array, sign: 1 | -1): Float64Array => {
    const out = new Float64Array(a.length + b.length);
    out.set(a);
    for (let i = 0; i < b.length; i++) out[a.length + i] = sign * b[b.length - 1 - i]!;
    return out;
  };
  const negate = (v: PointValues | null): PointValues | null => (v ? { ...v, M: -v.M } : null);
  return {
    ...pos,
    negativeBranchStart: pos.sweep.cOverH.length,
    sweep: { cOverH: joined(pos.sweep.cOverH, mirror.sweep.cOverH, 1), epsT: joined(pos.sweep.epsT, mirror.sweep.epsT, 1), phi: joined(pos.sweep.phi, mirror.sweep.phi, 1) },
    curves: pos.curves.map((c, j) => {
      const m = mirror.curves[j]!;
      return {
        rho: c.rho,
        Pn: joined(c.Pn, m.Pn, 1),
        Mn: joined(c.Mn, m.Mn, -1),
        phiPn: joined(c.phiPn, m.phiPn, 1),
        phiMn: joined(c.phiMn, m.phiMn, -1),
        keyPoints: [
          ...c.keyPoints,
          ...m.keyPoints.map((k) => ({ id: `${k.id}-negative`, label: `${k.label}, negative moment`, nominal: negate(k.nominal), design: negate(k.design) })),
        ],
      };
    }),
  };
}

/** Builds a family on a prepared section (custom bars, checks). */
export function familyOf(section: PreparedSection, arrangement: Arrangement, gamma: number, rhos: readonly number[], basePoints = 400): CurveFamily {
  const basis = section.basis;

  // 1. Base grid plus the c/h of the strain states (shared by every ρg), with close neighbours so the curve bends sharply there.
  const stateDepths = basis.strainStates.map((s) => depthForTensionStrain(section, s.epsT));
  const cs = new Set<number>(baseGrid(basePoints));
  for (const c of stateDepths) {
    if (!Number.isFinite(c)) continue;
    for (const k of [1, 0.98, 0.995, 1.005, 1.02]) cs.add(c * k);
  }
  for (const c of lawJumpDepths(section)) cs.add(c);
  const sweep = evaluate(section, [...cs].filter((c) => c >= C_OVER_H_MIN && c <= C_OVER_H_MAX).sort((a, b) => a - b));

  // 2. ρg-dependent roots (P = 0 and P = cap, nominal and factored): bracket on the sweep, refine on the section.
  const roots = rhos.map((rho) => rootsFor(section, rho, sweep));
  const extra = new Set<number>();
  for (const rt of roots) for (const c of Object.values(rt)) if (Number.isFinite(c) && !cs.has(c)) extra.add(c);
  const all = extra.size === 0 ? sweep : merge(sweep, evaluate(section, [...extra].sort((a, b) => a - b)));

  // 3. One sweep serves every ρg.
  const { cOverH, cols } = all;
  const n = cOverH.length;
  const epsT = cols[R.epsT]!;
  const phi = cols[R.factor]!;
  const curves: Curve[] = rhos.map((rho, j) => {
    const Pn = new Float64Array(n);
    const Mn = new Float64Array(n);
    const phiPn = new Float64Array(n);
    const phiMn = new Float64Array(n);
    const capD = section.cap('design', rho);
    // The nominal curve ends at the code's Po (one value for the curve's last point, the key point and
    // the notes): where Po limits the steel stress (ACI 318-19 22.4.2.2, fy ≤ 80 ksi) the strain-compatible
    // section at uniform strain would give more, which the code does not count. Elsewhere this is a no-op.
    const poN = section.squash('nominal', rho);
    for (let i = 0; i < n; i++) {
      Pn[i] = Math.min(cols[R.PcN]![i]! + rho * cols[R.PsN]![i]!, poN);
      Mn[i] = cols[R.McN]![i]! + rho * cols[R.MsN]![i]!;
      const f = phi[i]!;
      phiPn[i] = Math.min(f * (cols[R.PcD]![i]! + rho * cols[R.PsD]![i]!), capD);
      phiMn[i] = f * (cols[R.McD]![i]! + rho * cols[R.MsD]![i]!);
    }
    return { rho, Pn, Mn, phiPn, phiMn, keyPoints: keyPointsFor(section, rho, stateDepths, roots[j]!) };
  });

  return { basis, shape: section.shape, arrangement, gamma, bars: section.bars, sweep: { cOverH, epsT, phi }, curves, section };
}

/** Response columns at sorted depths. */
interface Sweep {
  cOverH: Float64Array;
  cols: Float64Array[];
}

function evaluate(section: PreparedSection, depths: readonly number[]): Sweep {
  const n = depths.length;
  const cols = Array.from({ length: RESPONSE_SIZE }, () => new Float64Array(n));
  const r = new Float64Array(RESPONSE_SIZE);
  for (let i = 0; i < n; i++) {
    section.respond(depths[i]!, r);
    for (let k = 0; k < RESPONSE_SIZE; k++) cols[k]![i] = r[k]!;
  }
  return { cOverH: Float64Array.from(depths), cols };
}

/** Merges two sorted sweeps. */
function merge(a: Sweep, b: Sweep): Sweep {
  const n = a.cOverH.length + b.cOverH.length;
  const cOverH = new Float64Array(n);
  const cols = Array.from({ length: RESPONSE_SIZE }, () => new Float64Array(n));
  let i = 0;
  let j = 0;
  for (let k = 0; k < n; k++) {
    const takeA = j >= b.cOverH.length || (i < a.cOverH.length && a.cOverH[i]! <= b.cOverH[j]!);
    const src = takeA ? a : b;
    const at = takeA ? i++ : j++;
    cOverH[k] = src.cOverH[at]!;
    for (let q = 0; q < RESPONSE_SIZE; q++) cols[q]![k] = src.cols[q]![at]!;
  }
  return { cOverH, cols };
}

interface Roots {
  bendingN: number;
  bendingD: number;
  capN: number;
  capD: number;
}

/**
 * Roots of g(c) = P(c) − target: the sign change is found on the swept columns (no new evaluations),
 * then refined on the section. Scans from the compression end when `fromHigh`.
 */
function sweptRoot(section: PreparedSection, sweep: Sweep, rho: number, kind: 'nominal' | 'design', target: number, fromHigh: boolean): number {
  const { cOverH, cols } = sweep;
  const n = cOverH.length;
  const at = (i: number) =>
    kind === 'nominal'
      ? cols[R.PcN]![i]! + rho * cols[R.PsN]![i]! - target
      : cols[R.factor]![i]! * (cols[R.PcD]![i]! + rho * cols[R.PsD]![i]!) - target;
  const r = new Float64Array(RESPONSE_SIZE);
  const g = (c: number) => (kind === 'nominal' ? nominalAt(section.respond(c, r), rho)[0] : designAt(section.respond(c, r), rho)[0]) - target;
  let prev = fromHigh ? n - 1 : 0;
  let gPrev = at(prev);
  if (gPrev === 0) return cOverH[prev]!;
  for (let k = 1; k < n; k++) {
    const i = fromHigh ? n - 1 - k : k;
    const gi = at(i);
    if (gi === 0) return cOverH[i]!;
    if (gi * gPrev < 0) return findRootOrNaN(g, Math.min(cOverH[i]!, cOverH[prev]!), Math.max(cOverH[i]!, cOverH[prev]!));
    prev = i;
    gPrev = gi;
  }
  return NaN;
}

function rootsFor(section: PreparedSection, rho: number, sweep: Sweep): Roots {
  const capN = section.cap('nominal', rho);
  const capD = section.cap('design', rho);
  return {
    bendingN: sweptRoot(section, sweep, rho, 'nominal', 0, false),
    bendingD: sweptRoot(section, sweep, rho, 'design', 0, false),
    // from the compression end: the cap is crossed once on the way down from pure compression
    capN: Number.isFinite(capN) ? sweptRoot(section, sweep, rho, 'nominal', capN, true) : NaN,
    capD: Number.isFinite(capD) ? sweptRoot(section, sweep, rho, 'design', capD, true) : NaN,
  };
}

function pointAt(section: PreparedSection, rho: number, c: number, kind: 'nominal' | 'design', cap = Infinity): PointValues | null {
  if (!Number.isFinite(c)) return null;
  const r = section.respond(c, new Float64Array(RESPONSE_SIZE));
  const [P, M] = kind === 'nominal' ? nominalAt(r, rho) : designAt(r, rho);
  return { cOverH: c, epsT: r[R.epsT]!, phi: kind === 'nominal' ? 1 : r[R.factor]!, P: Math.min(P, cap), M };
}

function keyPointsFor(section: PreparedSection, rho: number, stateDepths: readonly number[], roots: Roots): KeyPoint[] {
  const { basis } = section;
  const capD = section.cap('design', rho);
  const out: KeyPoint[] = [];
  const top = pointAt(section, rho, C_OVER_H_MAX, 'nominal')!;
  const topD = pointAt(section, rho, C_OVER_H_MAX, 'design')!;
  out.push({
    id: 'pure-compression',
    label: `pure compression (${basis.symbols.squashLoad ?? 'Po'})`,
    nominal: { ...top, P: section.squash('nominal', rho) },
    design: { ...topD, P: topD.phi * section.squash('design', rho) },
  });
  const capN = section.cap('nominal', rho);
  if (Number.isFinite(capN) || Number.isFinite(capD)) {
    out.push({
      id: 'axial-cap',
      label: 'axial cap (Pn,max)',
      nominal: Number.isFinite(capN) ? pointAt(section, rho, roots.capN, 'nominal') : null,
      design: Number.isFinite(capD) ? pointAt(section, rho, roots.capD, 'design', capD) : null,
    });
  }
  basis.strainStates.forEach((s, k) => {
    const c = stateDepths[k]!;
    out.push({ id: s.id, label: s.label, nominal: pointAt(section, rho, c, 'nominal'), design: pointAt(section, rho, c, 'design', capD) });
  });
  out.push({
    id: 'pure-bending',
    label: 'pure bending (P = 0)',
    nominal: pointAt(section, rho, roots.bendingN, 'nominal'),
    design: pointAt(section, rho, roots.bendingD, 'design', capD),
  });
  out.push({
    id: 'pure-tension',
    label: 'pure tension',
    nominal: pointAt(section, rho, C_OVER_H_MIN, 'nominal'),
    design: pointAt(section, rho, C_OVER_H_MIN, 'design'),
  });
  return out;
}
