/**
 * The detailing check of given reinforcement (issue 19 U4): a given ρg or bar layout against the basis's
 * detailing rules (`Basis.detailing`, `steelAreaLimits`, `minimumClearSpacing`). Facts, not sentences: each
 * rule gives one `RuleFinding` (rule, clause, outcome, value, limit); a binding rule violated makes the load's
 * status `detailing` (src/design/column-check.ts). Pure: no I/O.
 *
 *   section (once): steel-max-lap, clear-spacing, cover, bar-size-lap
 *   each load:      steel-min (EN 1992-1-1 9.5.2(2) depends on NEd; the reduced effective area on the load), steel-max
 */
import type { RuleFinding } from '../codes/rules.js';
import type { Basis, DetailingRuleDef } from '../codes/types.js';
import type { Arrangement, Bar, Shape } from '../section/types.js';
import { clearSpacing } from './bar-selection.js';

/** What is known of the bars beyond their area: bar and tie sizes, cover, aggregate (internal length units). */
export interface DetailingInput {
  /** the longitudinal bar, when named (--bar) */
  bar?: { name: string; diameter: number };
  /** clear cover to the tie and the tie diameter, when given (γ from cover, tie and bar) */
  cover?: number;
  tieDiameter?: number;
  /** maximum aggregate size; absent: the basis's assumed default */
  aggregate?: number;
}

/** The given reinforcement as the detailing check sees it. */
export interface DetailingSubject {
  basis: Basis;
  shape: Shape;
  arrangement: Arrangement;
  gamma: number;
  gammaB?: number;
  /** the checked bars, actual areas and positions */
  bars: readonly Bar[];
  input?: DetailingInput;
}

/** The rule of a basis by id, or undefined where the basis does not have it. */
export const detailingRule = (basis: Basis, id: string): DetailingRuleDef | undefined => basis.detailing.rules.find((r) => r.id === id);

/** The aggregate size the spacing rule uses, and whether it is the basis's assumption. */
export function aggregateOf(basis: Basis, input?: DetailingInput): { value: number; assumed: boolean } {
  return input?.aggregate !== undefined ? { value: input.aggregate, assumed: false } : { value: basis.detailing.defaultAggregate, assumed: true };
}

const TOL = 1e-9;

function finding(basis: Basis, id: string, outcome: RuleFinding['outcome'], value: number | null, limit: number | null, quantity: RuleFinding['quantity'], clause?: string): RuleFinding[] {
  const rule = detailingRule(basis, id);
  if (!rule) return [];
  return [{ rule: id, clause: clause ?? rule.clause, outcome, value, limit, ...(quantity ? { quantity } : {}) }];
}

/** Smallest clear distance between adjacent bars: the regular arrangements' faces, or the closest pair of custom bars. */
export function layoutClearSpacing(s: Pick<DetailingSubject, 'shape' | 'arrangement' | 'gamma' | 'gammaB' | 'bars'>, barDiameter: number): number {
  const a = s.arrangement;
  if (a.kind === 'ring') return clearSpacing(s.shape, a.kind, a.bars, s.gamma, barDiameter, s.gammaB);
  if (a.kind !== 'custom') return clearSpacing(s.shape, a.kind, a.barsPerFace, s.gamma, barDiameter, s.gammaB);
  let min = Infinity;
  const bars = s.bars;
  for (let i = 0; i < bars.length; i++) {
    for (let j = i + 1; j < bars.length; j++) min = Math.min(min, Math.hypot(bars[i]!.x - bars[j]!.x, bars[i]!.y - bars[j]!.y));
  }
  return min - barDiameter;
}

/**
 * The findings that do not depend on the load: where bars are lapped (a note above the basis's lap-zone
 * ratio), clear spacing (bar size known), cover (cover, tie and bar known; "unchecked" otherwise) and the
 * largest bar that may be lap spliced (a note).
 */
export function sectionDetailing(s: DetailingSubject, rho: number): RuleFinding[] {
  const { basis, input } = s;
  const d = basis.detailing;
  const out: RuleFinding[] = [];
  out.push(...finding(basis, 'steel-max-lap', rho > d.lapZoneRho + TOL ? 'violated' : 'met', rho, d.lapZoneRho, 'ratio'));
  const db = input?.bar?.diameter;
  if (db === undefined) out.push(...finding(basis, 'clear-spacing', 'unchecked', null, null, 'length'));
  else {
    const clear = layoutClearSpacing(s, db);
    const required = basis.minimumClearSpacing(db, aggregateOf(basis, input).value);
    out.push(...finding(basis, 'clear-spacing', clear < required - TOL ? 'violated' : 'met', Number.isFinite(clear) ? clear : null, required, 'length'));
  }
  if (db === undefined || input?.cover === undefined) out.push(...finding(basis, 'cover', 'unchecked', input?.cover ?? null, null, 'length'));
  else {
    const required = d.minimumCover(input.tieDiameter ?? 0, db);
    out.push(...finding(basis, 'cover', input.cover < required - TOL ? 'violated' : 'met', input.cover, required, 'length'));
  }
  if (Number.isFinite(d.maxLappedBar)) {
    out.push(...(db === undefined ? finding(basis, 'bar-size-lap', 'unchecked', null, d.maxLappedBar, 'length') : finding(basis, 'bar-size-lap', db > d.maxLappedBar + 1e-6 ? 'violated' : 'met', db, d.maxLappedBar, 'length')));
  }
  return out;
}

/**
 * The steel ratio of one load: the basis's limits for its axial force (`steelAreaLimits`), the minimum
 * lowered by the reduced effective area where the basis has one (ACI 318-19 10.3.1.2, CSA A23.3-19 10.10.5):
 * Ae ≥ share·Ag, read as Ae = max(share, utilisation)·Ag (a section carrying the load at utilisation u
 * needs about u·Ag of the concrete: common practice), so the minimum is ρmin·min(1, max(share, u)) of Ag.
 */
export function loadSteelDetailing(basis: Basis, Pu: number, area: number, rho: number, utilisation: number | null): RuleFinding[] {
  const lim = basis.steelAreaLimits(Pu, area);
  const min = lim.min / area;
  const max = lim.max / area;
  const share = basis.detailing.reducedAreaShare;
  const u = utilisation === null || !Number.isFinite(utilisation) ? 1 : utilisation;
  const reduced = share === undefined ? 1 : Math.min(1, Math.max(share, u));
  const minRule = detailingRule(basis, 'steel-min');
  const clause = reduced < 1 && minRule ? `${minRule.clause}, reduced effective area` : undefined;
  return [
    ...finding(basis, 'steel-min', rho < min * reduced - TOL ? 'violated' : 'met', rho, min * reduced, 'ratio', clause),
    ...finding(basis, 'steel-max', rho > max + TOL ? 'violated' : 'met', rho, max, 'ratio'),
  ];
}

/** True for a finding of a binding rule that is violated: it makes the load's status `detailing`. */
export function breaksDetailing(basis: Basis, f: RuleFinding): boolean {
  return f.outcome === 'violated' && detailingRule(basis, f.rule)?.binding === true;
}

/** How a detailing finding's value stands to its limit: rules with a lower limit (steel-min, clear spacing, cover) read ≥ when met, the others ≤. */
export function findingComparison(f: RuleFinding): '<' | '≥' | '>' | '≤' {
  const atLeast = f.rule === 'steel-min' || f.rule === 'clear-spacing' || f.rule === 'cover';
  return atLeast ? (f.outcome === 'violated' ? '<' : '≥') : f.outcome === 'violated' ? '>' : '≤';
}
