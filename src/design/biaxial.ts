/**
 * A biaxial load check three ways, side by side: the exact surface of the actual section
 * (src/analysis/biaxial.ts), Bresler's reciprocal load method, and the load contour method.
 * All capacities are the basis's design (factored) values, in internal units. Pure: no I/O.
 */
import {
  capacityAlongRay,
  momentUtilisationAtAxial,
  squashPoint,
  uniaxialAxialAt,
  uniaxialMomentAt,
  type BiaxialSection,
} from '../analysis/biaxial.js';
import { bresslerBiaxialExponent } from '../codes/biaxial-exponent.js';
import type { Basis, BiaxialExponent, StrainClass } from '../codes/types.js';
import type { ShapeKind } from '../section/types.js';

export interface BiaxialLoad {
  /** factored axial load, compression positive */
  Pu: number;
  /** factored moment about the x axis (bending in the depth h) */
  Mux: number;
  /** factored moment about the y axis (bending in the width b) */
  Muy: number;
}

/** The basis's exponent hook, or Bresler's documented exponent where the basis declares none. */
export function loadContourExponent(basis: Basis, axialRatio: number, shape: ShapeKind): BiaxialExponent {
  return basis.biaxialExponent ? basis.biaxialExponent(axialRatio, shape) : bresslerBiaxialExponent(axialRatio, shape);
}

/** Bresler's reciprocal load formula: 1/Pn = 1/Pnx + 1/Pny − 1/Po (ACI Journal 57(5), 1960). */
export function reciprocalLoadCapacity(Pnx: number, Pny: number, Po: number): number {
  return 1 / (1 / Pnx + 1 / Pny - 1 / Po);
}

/** Linear moment interaction Mx/Mxo + My/Myo (Bresler, 1960; for low axial load). */
export const linearMomentValue = (Mx: number, My: number, Mxo: number, Myo: number): number => Math.abs(Mx) / Mxo + Math.abs(My) / Myo;

/** Load contour (Mx/Mxo)^α + (My/Myo)^α (Bresler, 1960; EN 1992-1-1 5.8.9(4) Eq. 5.38). */
export const loadContourValue = (Mx: number, My: number, Mxo: number, Myo: number, alpha: number): number =>
  Math.pow(Math.abs(Mx) / Mxo, alpha) + Math.pow(Math.abs(My) / Myo, alpha);

export interface ExactResult {
  /** demand ÷ capacity along the load ray in (P, Mx, My) */
  utilisation: number;
  capacity: { P: number; Mx: number; My: number };
  /** neutral-axis angle (deg, 0 = uniaxial about x) and depth at capacity */
  neutralAxisAngleDeg: number;
  neutralAxisDepth: number;
  epsT: number;
  phi: number;
  strainClass: StrainClass;
  capGoverns: boolean;
  /** |Mu| ÷ exact capacity moment in the load's direction at P = Pu (compare with the load contour's momentScale) */
  momentUtilisation: number;
}

export interface ReciprocalLoadResult {
  /** Pu ÷ capacity by the method used (reciprocal load), or the linear moment sum (low axial load) */
  utilisation: number;
  method: 'reciprocal-load' | 'linear-moment';
  /** uniaxial factored capacities at the load's eccentricities, pure compression (uncapped) */
  Pnx: number;
  Pny: number;
  Po: number;
  /** 1/Pn = 1/Pnx + 1/Pny − 1/Po (factored, before the cap) */
  Pn: number;
  /** 0.1·f′c·Ag: the reciprocal load method is used where Pn ≥ this */
  validityLimit: number;
  /** uniaxial moment capacities at Pu (linear-moment branch) */
  Mnox: number;
  Mnoy: number;
  /** axial cap (factored) */
  cap: number;
  note: string;
}

export interface LoadContourResult {
  /** (Mux/Mnox)^α + (Muy/Mnoy)^α, or Pu/cap where the axial load alone exceeds the cap */
  utilisation: number;
  alpha: number;
  alphaSource: string;
  /** Pu ÷ factored pure compression (NEd/NRd) */
  axialRatio: number;
  Mnox: number;
  Mnoy: number;
  termX: number;
  termY: number;
  /** utilisation^(1/α): the factor on both moments at fixed Pu, comparable with exact.momentUtilisation */
  momentScale: number;
  note: string;
}

export interface BiaxialResult {
  exact: ExactResult;
  reciprocalLoad: ReciprocalLoadResult;
  loadContour: LoadContourResult;
}

/** Checks one load on a prepared section by all three methods. */
export function checkBiaxial(sec: BiaxialSection, load: BiaxialLoad): BiaxialResult {
  const { Pu, Mux, Muy } = load;
  const basis = sec.basis;
  const cap = sec.cap.design;

  // 1. exact: along the load ray on the factored surface of the actual section
  const ray = capacityAlongRay(sec, Pu, Mux, Muy, 'design');
  const exact: ExactResult = {
    utilisation: ray.utilisation,
    capacity: ray.capacity,
    neutralAxisAngleDeg: (ray.point.theta * 180) / Math.PI,
    neutralAxisDepth: ray.point.c,
    epsT: ray.point.epsT,
    phi: ray.point.phi,
    strainClass: basis.classify(ray.point.epsT),
    capGoverns: ray.capGoverns,
    momentUtilisation: Pu <= cap ? momentUtilisationAtAxial(sec, Pu, Mux, Muy) : NaN,
  };

  // uniaxial moment capacities at Pu (for the linear and load-contour methods)
  const reach = Pu <= cap;
  const mxo = reach ? uniaxialMomentAt(sec, 'x', Pu, Mux < 0).moment : NaN;
  const myo = reach ? uniaxialMomentAt(sec, 'y', Pu, Muy < 0).moment : NaN;
  const Po = squashPoint(sec, 'design');

  // 2. reciprocal load (Bresler), with the linear moment interaction at low axial load
  const Pnx = uniaxialAxialAt(sec, 'x', Pu, Mux).P;
  const Pny = uniaxialAxialAt(sec, 'y', Pu, Muy).P;
  const Pn = reciprocalLoadCapacity(Pnx, Pny, Po);
  const validityLimit = 0.1 * basis.fc * sec.grossArea;
  const common = { Pnx, Pny, Po, Pn, validityLimit, Mnox: mxo, Mnoy: myo, cap };
  let rl: ReciprocalLoadResult;
  if (Pu > 0 && Pn >= validityLimit && Pnx > 0 && Pny > 0) {
    const PnCapped = Math.min(Pn, cap);
    rl = {
      ...common,
      utilisation: Pu / PnCapped,
      method: 'reciprocal-load',
      note: Pn > cap ? 'Pn from 1/Pn = 1/Pnx + 1/Pny − 1/Po exceeds the axial cap; the cap governs' : 'Pn ≥ 0.1·f′c·Ag: reciprocal load method',
    };
  } else {
    const u = reach ? linearMomentValue(Mux, Muy, mxo, myo) : Pu / cap;
    rl = {
      ...common,
      utilisation: Number.isFinite(u) ? u : Infinity,
      method: 'linear-moment',
      note: 'Pn < 0.1·f′c·Ag (or tension): linear moment interaction Mux/Mxo + Muy/Myo ≤ 1 with the design capacities at Pu',
    };
  }

  // 3. load contour with the basis's exponent
  // EN 1992-1-1 5.8.9(4) divides by NRd = Ac·fcd + As·fyd, not by the strain-compatibility squash load
  const axialRatio = Pu / (basis.biaxialReferenceLoad ? basis.biaxialReferenceLoad(sec.grossArea, sec.steelArea) : Po);
  const ex = loadContourExponent(basis, axialRatio, sec.shape.kind);
  let lc: LoadContourResult;
  if (!reach) {
    lc = { utilisation: Pu / cap, alpha: ex.alpha, alphaSource: ex.source, axialRatio, Mnox: NaN, Mnoy: NaN, termX: NaN, termY: NaN, momentScale: NaN, note: 'Pu exceeds the axial cap; no moment capacity at this load' };
  } else {
    const termX = Math.pow(Math.abs(Mux) / mxo, ex.alpha);
    const termY = Math.pow(Math.abs(Muy) / myo, ex.alpha);
    const u = termX + termY;
    lc = {
      utilisation: Number.isFinite(u) ? u : Infinity,
      alpha: ex.alpha,
      alphaSource: ex.source,
      axialRatio,
      Mnox: mxo,
      Mnoy: myo,
      termX,
      termY,
      momentScale: Math.pow(u, 1 / ex.alpha),
      note: '(Mux/Mxo)^α + (Muy/Myo)^α ≤ 1 with the design uniaxial moment capacities at Pu; utilisation is the left-hand side',
    };
  }
  return { exact, reciprocalLoad: rl, loadContour: lc };
}
