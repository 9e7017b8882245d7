/**
 * What `pmchart check` adds beyond the uniaxial short-column check, pure (no I/O):
 *
 *   loads ─▶ slenderness (per axis, the basis's method) ─▶ magnified Mux, Muy ─▶ uniaxial check (check.ts)
 *                                                                     └──────▶ biaxial check, three methods
 *
 * Loads are in internal units (kip, kip·in or N, N·mm).
 */
import { prepareBiaxial, type BiaxialSection } from '../analysis/biaxial.js';
import type { Basis, CapContext } from '../codes/types.js';
import { ERROR_CODES, PmError } from '../errors.js';
import type { Bar, Shape } from '../section/types.js';
import { checkBiaxial, type BiaxialResult } from './biaxial.js';
import { aboutYAxis, slendernessCheck, type EiOption, type SlendernessResult } from './slenderness.js';

/** End moments of one load for the slenderness check; each defaults as described in `magnifyLoad`. */
export interface EndMoments {
  M1?: number;
  M2?: number;
  M1y?: number;
  M2y?: number;
}

/** Member data for one bending axis. */
export interface AxisMember {
  effectiveLength: number;
  betaDns?: number;
  eiOption?: EiOption;
  transverseLoads?: boolean;
  creepRatio?: number;
}

export interface SlendernessRequest {
  /** bending about x (the depth h) */
  x: AxisMember;
  /** bending about y (the width b); defaults to x's member data */
  y?: AxisMember;
}

export interface MagnifiedLoad {
  Mux: number;
  Muy: number;
  x: SlendernessResult;
  /** present when the load has a moment about y or y-axis member data is given */
  y: SlendernessResult | null;
}

/**
 * Second-order moments about each axis separately (ACI 318-19 6.6.4: each axis magnified for its own
 * conditions, common practice). M2 defaults to |Mu| about that axis; M1 defaults to −M2 (equal end
 * moments in single curvature, M1/M2 = −1, the most severe case: Cm = 1.0). Signs of Mux and Muy are kept.
 */
export function magnifyLoad(
  basis: Basis,
  shape: Shape,
  bars: readonly Bar[],
  load: { Pu: number; Mux: number; Muy: number } & EndMoments,
  req: SlendernessRequest,
): MagnifiedLoad {
  const sec = { shape, bars };
  const m2x = load.M2 ?? Math.abs(load.Mux);
  const x = slendernessCheck(basis, sec, { ...req.x, Pu: load.Pu, M2: m2x, M1: load.M1 ?? -m2x });
  const sign = (m: number) => (m < 0 ? -1 : 1);
  let y: SlendernessResult | null = null;
  let Muy = load.Muy;
  if (load.Muy !== 0 || req.y !== undefined || load.M2y !== undefined) {
    const m2y = load.M2y ?? Math.abs(load.Muy);
    y = slendernessCheck(basis, aboutYAxis(sec), { ...(req.y ?? req.x), Pu: load.Pu, M2: m2y, M1: load.M1y ?? -m2y });
    Muy = sign(load.Muy) * y.magnifiedMoment;
  }
  return { Mux: sign(load.Mux) * x.magnifiedMoment, Muy, x, y };
}

/** The actual bars of a checked reinforcement, ready for the biaxial surface. */
export function biaxialSectionFor(basis: Basis, shape: Shape, bars: readonly Bar[], capContext: CapContext = {}): BiaxialSection {
  if (bars.length === 0) throw new PmError(ERROR_CODES.missing, '--rho', 'or a bar layout is required for the biaxial check');
  return prepareBiaxial(basis, shape, bars, capContext);
}

/** Biaxial check of one load (moments already magnified where asked). */
export function biaxialFor(sec: BiaxialSection, Pu: number, Mux: number, Muy: number): BiaxialResult {
  return checkBiaxial(sec, { Pu, Mux, Muy });
}
