/**
 * Bar selection: from the required steel area, the lightest practical layouts of one bar size, each
 * re-verified with the actual discrete bars at the γ its own diameter gives.
 *
 * Limits (US and SI):
 * - Ast between the basis limits (ACI 318-19 10.6.1.1: 0.01·Ag ≤ Ast ≤ 0.08·Ag);
 * - at least the basis's minimum bar count (basis.minimumBarCount: ACI 318-19 10.7.3.1, EN 1992-1-1 9.5.2(4), CSA A23.3-19 10.9.3);
 * - clear spacing ≥ the basis's minimum (Basis.minimumClearSpacing: ACI 318-19 25.2.3, EN 1992-1-1 8.2(2), CSA A23.1 6.6.5.2);
 * - bar centres at cover + tie + db/2 from each face (common practice), so bars fit inside cover and tie;
 * - with cover detailing, the given cover at least the basis's minimum for the tie and each bar size (Basis.detailing.minimumCover);
 * - flagged, not refused (issue 19): ρg above the basis's lap-zone ratio (Basis.detailing.lapZoneRho: ACI 318-19 R10.6.1.1,
 *   EN 1992-1-1 9.5.2(3), AS 3600 10.7.1) and bars larger than the largest that may be lap spliced (ACI 318-19 25.5.1.1).
 */
import type { RuleFinding } from '../codes/rules.js';
import type { Basis, CapContext } from '../codes/types.js';
import { BARS_PER_FACE_RANGE } from '../input/limits.js';
import type { BarSize } from '../section/bar-tables.js';
import { gammaFromCover, grossArea, sectionDepth, sectionWidth } from '../section/geometry.js';
import { faceCounts, type Arrangement, type FaceCounts, type Shape } from '../section/types.js';

export type SelectableKind = 'two-faces' | 'four-faces' | 'side-faces' | 'ring';
export const isSelectableKind = (k: string): k is SelectableKind => ['two-faces', 'four-faces', 'side-faces', 'ring'].includes(k);

/**
 * Where the bars sit: from cover and tie (γ follows each bar size, the same cover on every face), or a
 * fixed γ (centres fixed), with γB (outer-column spacing ÷ b) when given.
 */
export type Detailing = { kind: 'cover'; cover: number; tieDiameter: number } | { kind: 'gamma'; gamma: number; gammaB?: number };

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
   * With `stopAbove` it may stop at the first load above that utilisation (the figure is then only a bound).
   */
  verify: (arrangement: Arrangement, area: number, gamma: number, stopAbove?: number) => { utilisation: number; index: number };
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
  /** bars per face (corners counted on both faces for four-faces; [nb, nh] for unequal four-faces counts); per ring for ring */
  perFace: FaceCounts;
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
  /** the basis's non-binding detailing rules this layout breaks (above the lap-zone ratio, a bar too large to lap): flags, not failures */
  findings: RuleFinding[];
}

/** The flags of a proposal: rules it breaks that do not refuse it (lap-zone ratio, lap-spliceable bar size). */
export function proposalFlags(basis: Basis, rho: number, barDiameter: number): RuleFinding[] {
  const d = basis.detailing;
  const rule = (id: string) => d.rules.find((r) => r.id === id);
  const out: RuleFinding[] = [];
  const lap = rule('steel-max-lap');
  if (lap && rho > d.lapZoneRho + 1e-9) out.push({ rule: lap.id, clause: lap.clause, outcome: 'violated', value: rho, limit: d.lapZoneRho, quantity: 'ratio' });
  const size = rule('bar-size-lap');
  if (size && barDiameter > d.maxLappedBar + 1e-6) out.push({ rule: size.id, clause: size.clause, outcome: 'violated', value: barDiameter, limit: d.maxLappedBar, quantity: 'length' });
  return out;
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

export const arrangementOf = (kind: SelectableKind, perFace: FaceCounts): Arrangement =>
  kind === 'ring' ? { kind, bars: faceCounts(perFace)[0] } : kind === 'four-faces' ? { kind, barsPerFace: perFace } : { kind, barsPerFace: faceCounts(perFace)[0] };

/** A four-faces count as the arrangement holds it: one number when both faces take the same count. */
const canonical = (nb: number, nh: number): FaceCounts => (nb === nh ? nb : [nb, nh]);


/** Count and per-face count for a steel area with one bar size. */
export function barsForArea(area: number, bar: { area: number }, kind: SelectableKind, minBars = 4): { count: number; perFace: number } {
  const perFace = perFaceFor(kind, Math.ceil(area / bar.area - 1e-9), minBars);
  return { count: totalBars(kind, perFace), perFace };
}

/** Required clear spacing: the basis's rule (ACI 318-19 25.2.3, EN 1992-1-1 8.2(2), CSA A23.1 6.6.5.2). */
export function requiredClearSpacing(basis: Pick<Basis, 'minimumClearSpacing'>, barDiameter: number, aggregate = 0): number {
  return basis.minimumClearSpacing(barDiameter, aggregate);
}

/** Centre-to-centre spacing of the outer bar columns (across b) and rows (along h). */
function spans(shape: Shape, gamma: number, gammaB?: number): { across: number; deep: number } {
  const h = sectionDepth(shape);
  const w = sectionWidth(shape);
  return { across: gammaB !== undefined ? gammaB * w : w - (1 - gamma) * h, deep: gamma * h };
}

/** Smallest centre-to-centre spacing of adjacent bars minus the diameter; γB (across b) when given, else the same cover as γ. */
export function clearSpacing(shape: Shape, kind: SelectableKind, perFace: FaceCounts, gamma: number, barDiameter: number, gammaB?: number): number {
  const { across, deep } = spans(shape, gamma, gammaB);
  const [n, nh] = faceCounts(perFace);
  let centres: number;
  switch (kind) {
    case 'two-faces':
      centres = across / (n - 1);
      break;
    case 'four-faces':
      centres = Math.min(across / (n - 1), deep / (nh - 1));
      break;
    case 'side-faces':
      centres = Math.min(deep / (n - 1), across);
      break;
    case 'ring':
      centres = 2 * (deep / 2) * Math.sin(Math.PI / n);
      break;
  }
  return centres - barDiameter;
}

export function describeLayout(kind: SelectableKind, count: number, perFace: FaceCounts, name: string): string {
  const size = /^\d+(\.\d+)?$/.test(name) ? `× ${name} mm` : /^\d/.test(name) ? `× ${name}` : name; // metric sizes are bare diameters; CSA names end in M
  const [nb, nh] = faceCounts(perFace);
  switch (kind) {
    case 'two-faces':
      return `${count} ${size} (${perFace} per face, 2 faces)`;
    case 'four-faces':
      return nb === nh ? `${count} ${size} (${nb} per face incl. corners, 4 faces)` : `${count} ${size} (${nb} on each b face, ${nh} on each h face, corners on both)`;
    case 'side-faces':
      return `${count} ${size} (${perFace} per side face)`;
    case 'ring':
      return `${count} ${size} (on a ring)`;
  }
}

/**
 * Candidate counts of one bar size, lightest first, as levels of equal bar count: one count per level for
 * two-faces, side-faces and rings; for four-faces every [nb, nh] of that total (2·nb + 2·nh − 4), each count
 * within BARS_PER_FACE_RANGE and as many as the clear spacing of its face allows. Levels span the same bar
 * counts as `extraCounts` steps of one per-face count would.
 */
function candidateLevels(kind: SelectableKind, bars: number, minBars: number, extra: number, maxB: number, maxH: number): { count: number; counts: FaceCounts[] }[] {
  if (kind !== 'four-faces') {
    const first = perFaceFor(kind, bars, minBars);
    return Array.from({ length: extra + 1 }, (_, k) => ({ count: totalBars(kind, first + k), counts: [first + k] }));
  }
  const [lo, hi] = BARS_PER_FACE_RANGE['four-faces'];
  const start = Math.max(4, 2 * Math.ceil(Math.max(bars, minBars) / 2));
  const levels: { count: number; counts: FaceCounts[] }[] = [];
  for (let count = start; count <= start + 4 * extra; count += 2) {
    const counts: FaceCounts[] = [];
    // nb + nh = count/2 + 2; the equal split first, then more bars on the b faces (they resist Mux)
    const sum = count / 2 + 2;
    const nbs = Array.from({ length: sum - 1 }, (_, k) => k + 2).filter((nb) => sum - nb >= 2);
    nbs.sort((a, b) => Math.abs(2 * a - sum) - Math.abs(2 * b - sum) || b - a);
    for (const nb of nbs) {
      const nh = sum - nb;
      if (nb >= lo && nh >= lo && nb <= Math.min(hi, maxB) && nh <= Math.min(hi, maxH)) counts.push(canonical(nb, nh));
    }
    levels.push({ count, counts });
  }
  return levels;
}

/** Proposals sorted by steel area (then utilisation), the lightest `count`. */
export function proposeBars(req: BarSelectionRequest): BarProposal[] {
  const { basis, shape, kind, detailing } = req;
  const ag = grossArea(shape);
  const h = sectionDepth(shape);
  const minBars = basis.minimumBarCount(shape.kind);
  const w = sectionWidth(shape);
  const gammaB = detailing.kind === 'gamma' ? detailing.gammaB : undefined;
  const out: BarProposal[] = [];
  for (const size of req.sizes) {
    const gamma = detailing.kind === 'cover' ? gammaFromCover(h, detailing.cover, detailing.tieDiameter, size.diameter) : detailing.gamma;
    if (!(gamma > 0.3 && gamma < 0.95)) continue;
    // buildable with the given cover and tie: the cover at least the basis's minimum for this bar size
    if (detailing.kind === 'cover' && detailing.cover < basis.detailing.minimumCover(detailing.tieDiameter, size.diameter) - 1e-9) continue;
    if (((1 - gamma) * h) / 2 < size.diameter / 2) continue;
    if (gammaB !== undefined && ((1 - gammaB) * w) / 2 < size.diameter / 2) continue;
    const needed = Math.max(req.requiredArea, req.areaLimits.min);
    const clearRequired = requiredClearSpacing(basis, size.diameter, req.aggregate ?? 0);
    // most bars a face of each kind holds at the required clear spacing (four-faces)
    const { across, deep } = spans(shape, gamma, gammaB);
    const pitch = clearRequired + size.diameter;
    const maxB = Math.floor(across / pitch + 1e-9) + 1;
    const maxH = Math.floor(deep / pitch + 1e-9) + 1;
    let best: BarProposal | null = null;
    for (const level of candidateLevels(kind, Math.ceil(needed / size.area - 1e-9), minBars, req.extraCounts ?? 4, maxB, maxH)) {
      const area = level.count * size.area;
      if (area > req.areaLimits.max * (1 + 1e-9)) break;
      let fits = false;
      for (const perFace of level.counts) {
        const clear = clearSpacing(shape, kind, perFace, gamma, size.diameter, gammaB);
        if (clear < clearRequired - 1e-9) continue;
        fits = true;
        // a candidate need only be followed while it can still beat the best of this total
        const worst: { utilisation: number; index: number } =
          best === null ? req.verify(arrangementOf(kind, perFace), area, gamma) : req.verify(arrangementOf(kind, perFace), area, gamma, best.utilisation);
        // of the layouts with this many bars, the lowest utilisation (the first on a tie)
        if (worst.utilisation <= 1 + 1e-9 && (best === null || worst.utilisation < best.utilisation)) {
          best = {
            size: size.name,
            barDiameter: size.diameter,
            barArea: size.area,
            count: level.count,
            perFace,
            layout: describeLayout(kind, level.count, perFace, size.name),
            area,
            rho: area / ag,
            gamma,
            clearSpacing: clear,
            clearSpacingRequired: clearRequired,
            utilisation: worst.utilisation,
            governingLoad: worst.index,
            findings: proposalFlags(basis, area / ag, size.diameter),
          };
        }
      }
      if (best || !fits) break; // more bars only close the spacing further
    }
    if (best) out.push(best);
  }
  out.sort((a, b) => a.area - b.area || a.utilisation - b.utilisation);
  return out.slice(0, req.count ?? 5);
}
