/**
 * The load and layout types of the check, and the small helpers the engine (column-check.ts) shares
 * with the chart readings. Pure: no I/O.
 */
import type { Basis } from '../codes/types.js';
import type { Arrangement } from '../section/types.js';
import type { ChartReading } from './chart-reading.js';
import type { EndMoments } from './column-effects.js';

/**
 * A factored load in internal units (kip, kip·in or N, N·mm); tension negative. End moments for the
 * slenderness check in either sign convention (`EndMoments`, src/design/column-effects.ts).
 */
export interface FactoredLoad extends EndMoments {
  id: string;
  Pu: number;
  Mu: number;
  /** moment about the y axis for the biaxial check; absent: uniaxial */
  Muy?: number;
  /** this load's sustained ÷ total factored axial load (ACI 318-19 6.6.4.4.4 βdns; AS 3600 and CSA A23.3 βd) for the slenderness check; absent: the member's */
  betaDns?: number;
}

/** A given layout to check: discrete bars of total area `area` at `gamma`. */
export interface GivenLayout {
  arrangement: Arrangement;
  area: number;
  gamma: number;
  description: string;
}

/** ρg limits for an axial demand (basis.steelAreaLimits over Ag). */
export function rhoLimitsFor(basis: Basis, Pu: number, area: number): { min: number; max: number } {
  const l = basis.steelAreaLimits(Pu, area);
  return { min: l.min / area, max: l.max / area };
}

/**
 * A reader applies the basis minimum to what the chart gives: EN 1992-1-1 9.5.2(2) makes it depend on
 * NEd, so it can exceed the lowest curve. The rounded reading is then the next curve at or above it.
 */
export function withMinimum(r: ChartReading, min: number, rhos: readonly number[]): ChartReading {
  const rounded = r.rhoRoundedDown === null || r.rhoRoundedDown >= min - 1e-12 ? r.rhoRoundedDown : (rhos.find((x) => x >= min - 1e-12) ?? null);
  return { ...r, rhoFromChart: r.rhoFromChart === null ? null : Math.max(r.rhoFromChart, min), rhoRoundedDown: rounded };
}

