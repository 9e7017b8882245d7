/**
 * The flags of `pmchart table` (and the ρg/ω lists `sheet` and the page share) read into a table request:
 * the section, the ratios and the points per curve. Pure reading and checking; the command prints.
 */
import { computeFamily, type CurveFamily } from '../analysis/family.js';
import { omegaFromRho, rhoFromOmega } from '../codes/mechanical-ratio.js';
import type { Basis } from '../codes/types.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { RHO_RANGE, TABLE_CURVES_MAX, TABLE_POINTS_RANGE, TABLE_ROWS_MAX, parseDecimal } from '../input/limits.js';
import { parseNumberList } from './format.js';
import { resolveSectionFlags, type ResolvedSection, type SectionFlags } from './section-flags.js';

export interface TableOptions extends SectionFlags {
  rho?: string;
  /** mechanical ratios ω = As·fyd/(Ac·fcd) instead of --rho */
  omega?: string;
  format?: string;
  dimensionless?: boolean;
  points?: string;
}

/** ρg span every family must stay inside (for --rho and --omega alike). */
export { RHO_RANGE };

/** Every value in range and larger than the one before (as chart-set files require), at most TABLE_CURVES_MAX. */
function requireIncreasing(path: string, list: number[], range: readonly [number, number]): void {
  if (list.length > TABLE_CURVES_MAX) throw new PmError(ERROR_CODES.outOfRange, path, `gives ${list.length} curves, beyond ${TABLE_CURVES_MAX}`, { allowed: `1–${TABLE_CURVES_MAX}` });
  list.forEach((r, k) => {
    requireInRange(path, r, range[0], range[1]);
    if (k > 0 && !(r > list[k - 1]!)) throw new PmError(ERROR_CODES.invalidValue, path, 'must be larger than the value before it', { value: r });
  });
}

/** Parses a ρg list flag against the allowed 0.001–0.10 span. */
export function parseRhoList(text: string | undefined, path = '--rho'): number[] {
  const list = parseNumberList(text ?? '0.01:0.08:0.01');
  if (!list || list.length === 0) {
    throw new PmError(ERROR_CODES.invalidValue, path, 'is not a list (0.01,0.02) or a range start:stop:step', { value: text });
  }
  requireIncreasing(path, list, RHO_RANGE);
  return list;
}

/**
 * Parses an ω list flag and turns it into ρg with the basis's design laws (ρ = ω·fcd/fyd);
 * the allowed ω span is the one that maps onto 0.001–0.10 in ρg.
 */
export function parseOmegaList(text: string, basis: Basis, path = '--omega'): { omegas: number[]; rhos: number[] } {
  const list = parseNumberList(text);
  if (!list || list.length === 0) {
    throw new PmError(ERROR_CODES.invalidValue, path, 'is not a list (0.1,0.2) or a range start:stop:step', { value: text });
  }
  const lo = Number(omegaFromRho(basis, RHO_RANGE[0]).toPrecision(3));
  const hi = Number(omegaFromRho(basis, RHO_RANGE[1]).toPrecision(3));
  requireIncreasing(path, list, [lo, hi]);
  return { omegas: list, rhos: list.map((w) => Number(rhoFromOmega(basis, w).toPrecision(12))) };
}

export interface TableRequest {
  section: ResolvedSection;
  rhos: number[];
  /** the ω values the families were asked for, when --omega was given (same order as rhos) */
  omegas?: number[];
  dimensionless: boolean;
  basePoints: number;
}

export function resolveTableOptions(o: TableOptions): TableRequest {
  const section = resolveSectionFlags(o);
  const format = o.format ?? 'csv';
  if (format !== 'csv' && format !== 'json') {
    throw new PmError(ERROR_CODES.invalidValue, '--format', 'is not one of the allowed values', { value: format, allowed: 'csv, json' });
  }
  const basePoints = o.points === undefined ? 400 : (parseDecimal(o.points) ?? NaN);
  if (!Number.isInteger(basePoints)) throw new PmError(ERROR_CODES.invalidValue, '--points', 'is not a whole number', { value: o.points });
  requireInRange('--points', basePoints, TABLE_POINTS_RANGE[0], TABLE_POINTS_RANGE[1]);
  if (o.omega !== undefined) {
    if (o.rho !== undefined) throw new PmError(ERROR_CODES.conflict, '--omega', 'and --rho both set the families; give one of them');
    const { omegas, rhos } = parseOmegaList(o.omega, section.basis);
    requireRows(rhos.length, basePoints);
    return { section, rhos, omegas, dimensionless: o.dimensionless === true, basePoints };
  }
  const rhos = parseRhoList(o.rho);
  requireRows(rhos.length, basePoints);
  return { section, rhos, dimensionless: o.dimensionless === true, basePoints };
}

/** Curves × points is bounded before any curve is computed. */
function requireRows(curves: number, points: number): void {
  if (curves * points > TABLE_ROWS_MAX) {
    throw new PmError(ERROR_CODES.outOfRange, '--points', `× ${curves} curves gives ${curves * points} rows, beyond ${TABLE_ROWS_MAX}`, { value: points, allowed: `curves × points ≤ ${TABLE_ROWS_MAX}` });
  }
}

export function familyFor(req: TableRequest, rhos: number[] = req.rhos): CurveFamily {
  const s = req.section;
  return computeFamily({
    basis: s.basis,
    shape: s.shape,
    arrangement: s.arrangement,
    gamma: s.gamma,
    ...(s.gammaB !== undefined ? { gammaX: s.gammaB } : {}),
    rhos,
    capContext: s.capContext,
    basePoints: req.basePoints,
  });
}

/**
 * Curves computed together share one c/h sweep that holds every curve's key points, so rows grow
 * as curves² (2,000 curves gave 6,374 rows each and 1.7 GB of JSON). Up to BATCH curves (a chart
 * set's limit) are computed together as before; longer lists go in batches of BATCH, one at a time,
 * so memory stays flat and rows stay within curves × (points + key points of BATCH curves).
 */
export const TABLE_BATCH = 20;
export function* familyBatches(req: TableRequest): Generator<{ family: CurveFamily; first: number }> {
  for (let first = 0; first < req.rhos.length; first += TABLE_BATCH) yield { family: familyFor(req, req.rhos.slice(first, first + TABLE_BATCH)), first };
}

