/**
 * Bar selection: from the required steel area, the lightest practical layouts of one bar size, each
 * re-verified with the actual discrete bars at the γ its own diameter gives.
 *
 * Limits (US and SI):
 * - Ast between the basis limits (ACI 318-19 10.6.1.1: 0.01·Ag ≤ Ast ≤ 0.08·Ag);
 * - at least the basis's minimum bar count (basis.minimumBarCount: ACI 318-19 10.7.3.1, EN 1992-1-1 9.5.2(4), CSA A23.3-19 10.9.3);
 * - clear spacing ≥ the basis's minimum (Basis.minimumClearSpacing: ACI 318-19 25.2.3, EN 1992-1-1 8.2(2), CSA A23.1 6.6.5.2);
 * - bar centres at cover + tie + db/2 from each face (common practice), so bars fit inside cover and tie.
 */
import type { Basis, CapContext } from '../codes/types.js';
import type { BarSize } from '../section/bar-tables.js';
import { gammaFromCover, grossArea, sectionDepth, sectionWidth } from '../section/geometry.js';
import type { Arrangement, Shape } from '../section/types.js';

export type SelectableKind = 'two-faces' | 'four-faces' | 'side-faces' | 'ring';
export const isSelectableKind = (k: string): k is SelectableKind => ['two-faces', 'four-faces', 'side-faces', 'ring'].includes(k);

/** Where the bars sit: from cover and tie (γ follows each bar size), or a fixed γ (centres fixed). */
export type Detailing = { kind: 'cover'; cover: number; tieDiameter: number } | { kind: 'gamma'; gamma: number };

export interface BarSelectionRequest {
  basis: Basis;
  /** the actual section, internal length units */
  shape: Shape;
  kind: SelectableKind;
  detailing: Detailing;
  /** bar sizes in internal units (diameter, area), lightest first */
  sizes: readonly BarSize[];
  /** required steel area from the exact ρg at the nominal γ (internal area units) */
  requiredArea: number;
  /** allowed steel area (internal area units) */
  areaLimits: { min: number; max: number };
  /**
   * Re-verifies a candidate with its discrete bars against every load with every effect applied
   * (the check engine supplies it: slenderness, minimum moment, sign and orientation, biaxial);
   * returns the largest utilisation and the load that gives it. A candidate above 1 is never proposed.
   */
  verify: (arrangement: Arrangement, area: number, gamma: number) => { utilisation: number; index: number };
  /** maximum aggregate size, internal length units (0 when not given) */
  aggregate?: number;
  capContext?: CapContext;
  /** how many proposals to return (default 5) */
  count?: number;
  /** extra counts tried per size above the area estimate when re-verification fails (default 4) */
  extraCounts?: number;
}

export interface BarProposal {
  size: string;
  barDiameter: number;
  barArea: number;
  /** total bars */
  count: number;
  /** bars per face (corners counted on both faces for four-faces); per ring for ring */
  perFace: number;
  layout: string;
  /** total steel area, internal units */
  area: number;
  rho: number;
  /** γ realised by this bar size */
  gamma: number;
  clearSpacing: number;
  clearSpacingRequired: number;
  /** largest demand ÷ capacity over the loads, exact section with discrete bars */
  utilisation: number;
  /** index into the loads of the one that governs this layout */
  governingLoad: number;
}

/** Smallest per-face count of an arrangement holding at least `bars` bars, and the minimum count rule. */
export function perFaceFor(kind: SelectableKind, bars: number, minBars: number): number {
  const n = Math.max(bars, minBars);
  switch (kind) {
    case 'two-faces':
    case 'side-faces':
      return Math.max(2, Math.ceil(n / 2));
    case 'four-faces':
      return Math.max(2, Math.ceil(n / 4) + 1);
    case 'ring':
      return n;
  }
}

export const totalBars = (kind: SelectableKind, perFace: number): number =>
  kind === 'four-faces' ? 4 * (perFace - 1) : kind === 'ring' ? perFace : 2 * perFace;

export const arrangementOf = (kind: SelectableKind, perFace: number): Arrangement =>
  kind === 'ring' ? { kind, bars: perFace } : { kind, barsPerFace: perFace };


/** Count and per-face count for a steel area with one bar size. */
export function barsForArea(area: number, bar: { area: number }, kind: SelectableKind, minBars = 4): { count: number; perFace: number } {
  const perFace = perFaceFor(kind, Math.ceil(area / bar.area - 1e-9), minBars);
  return { count: totalBars(kind, perFace), perFace };
}

/** Required clear spacing: the basis's rule (ACI 318-19 25.2.3, EN 1992-1-1 8.2(2), CSA A23.1 6.6.5.2). */
export function requiredClearSpacing(basis: Pick<Basis, 'minimumClearSpacing'>, barDiameter: number, aggregate = 0): number {
  return basis.minimumClearSpacing(barDiameter, aggregate);
}

/** Smallest centre-to-centre spacing of adjacent bars minus the diameter. */
export function clearSpacing(shape: Shape, kind: SelectableKind, perFace: number, gamma: number, barDiameter: number): number {
  const h = sectionDepth(shape);
  const w = sectionWidth(shape);
  const inset = ((1 - gamma) * h) / 2;
  const across = w - 2 * inset;
  const deep = gamma * h;
  let centres: number;
  switch (kind) {
    case 'two-faces':
      centres = across / (perFace - 1);
      break;
    case 'four-faces':
      centres = Math.min(across, deep) / (perFace - 1);
      break;
    case 'side-faces':
      centres = Math.min(deep / (perFace - 1), across);
      break;
    case 'ring':
      centres = 2 * (deep / 2) * Math.sin(Math.PI / perFace);
      break;
  }
  return centres - barDiameter;
}

export function describeLayout(kind: SelectableKind, count: number, perFace: number, name: string): string {
  const size = /^\d+(\.\d+)?$/.test(name) ? `× ${name} mm` : /^\d/.test(name) ? `× ${name}` : name; // metric sizes are bare diameters; CSA names end in M
  switch (kind) {
    case 'two-faces':
      return `${count} ${size} (${perFace} per face, 2 faces)`;
    case 'four-faces':
      return `${count} ${size} (${perFace} per face incl. corners, 4 faces)`;
    case 'side-faces':
      return `${count} ${size} (${perFace} per side face)`;
    case 'ring':
      return `${count} ${size} (on a ring)`;
  }
}

/** Proposals sorted by steel area (then utilisation), the lightest `count`. */
export function proposeBars(req: BarSelectionRequest): BarProposal[] {
  const { basis, shape, kind, detailing } = req;
  const ag = grossArea(shape);
  const h = sectionDepth(shape);
  const minBars = basis.minimumBarCount(shape.kind);
  const out: BarProposal[] = [];
  for (const size of req.sizes) {
    const gamma = detailing.kind === 'cover' ? gammaFromCover(h, detailing.cover, detailing.tieDiameter, size.diameter) : detailing.gamma;
    if (!(gamma > 0.3 && gamma < 0.95)) continue;
    if (((1 - gamma) * h) / 2 < size.diameter / 2) continue;
    const needed = Math.max(req.requiredArea, req.areaLimits.min);
    let perFace = perFaceFor(kind, Math.ceil(needed / size.area - 1e-9), minBars);
    for (let extra = 0; extra <= (req.extraCounts ?? 4); extra++, perFace++) {
      const count = totalBars(kind, perFace);
      const area = count * size.area;
      if (area > req.areaLimits.max * (1 + 1e-9)) break;
      const clear = clearSpacing(shape, kind, perFace, gamma, size.diameter);
      const clearRequired = requiredClearSpacing(basis, size.diameter, req.aggregate ?? 0);
      if (clear < clearRequired - 1e-9) break; // more bars only close the spacing further
      const arrangement = arrangementOf(kind, perFace);
      const rho = area / ag;
      const worst = req.verify(arrangement, area, gamma);
      if (worst.utilisation <= 1 + 1e-9) {
        out.push({
          size: size.name,
          barDiameter: size.diameter,
          barArea: size.area,
          count,
          perFace,
          layout: describeLayout(kind, count, perFace, size.name),
          area,
          rho,
          gamma,
          clearSpacing: clear,
          clearSpacingRequired: clearRequired,
          utilisation: worst.utilisation,
          governingLoad: worst.index,
        });
        break;
      }
    }
  }
  out.sort((a, b) => a.area - b.area || a.utilisation - b.utilisation);
  return out.slice(0, req.count ?? 5);
}
