/**
 * The lookup table of a biaxial sheet: per ρg and axial level, the uniaxial capacities Mxo and Myo and
 * the fitted load-contour exponent α with its worst radial misfit (src/analysis/biaxial-family.ts), in
 * the sheet's normalisation. The same rows feed the sheet, tables/*.csv and tables/*.json.
 */
import type { BiaxialFamily } from '../analysis/biaxial-family.js';
import { sig } from './lookup-table.js';

/** Columns of a biaxial sheet's CSV (stable interface): one row per contour point. */
export const BIAXIAL_TABLE_COLUMNS = ['rho_g', 'axial_level', 'angle_deg', 'phiMx_norm', 'phiMy_norm'] as const;

export interface BiaxialCell {
  rho: number;
  level: number;
  /** false when the level is beyond this ρg's reach (above its axial cap, or beyond pure tension) */
  reachable: boolean;
  /** divided as the axes: Mx/(Ag·h) and My/(Ag·b), and by the normalising stress when dimensionless */
  mxo: number;
  myo: number;
  alpha: number;
  /** worst |radius ÷ fitted radius − 1| */
  misfit: number;
}

export interface BiaxialTable {
  /** values divided by this (1 for stress normalisation, the normalising stress for dimensionless) */
  divisor: number;
  levels: readonly number[];
  rhos: readonly number[];
  /** the mechanical ratios the curves were asked for, on ω sets */
  omegas?: readonly number[];
  /** cells[k][i]: ρg k, level i */
  cells: BiaxialCell[][];
  /** contour points for the CSV, in the sheet's normalisation: per ρg, per reachable level */
  points: { rho: number; level: number; angleDeg: readonly number[]; mx: number[]; my: number[] }[];
}

export function biaxialTable(family: BiaxialFamily, divisor: number, omegas?: readonly number[]): BiaxialTable {
  const cells = family.rhos.map((rho, k) =>
    family.levels.map((level, i) => {
      const c = family.contours[i]![k]!;
      return { rho, level, reachable: c.reachable, mxo: c.mxo / divisor, myo: c.myo / divisor, alpha: c.alpha, misfit: c.misfit };
    }),
  );
  const points = family.rhos.flatMap((rho, k) =>
    family.levels.flatMap((level, i) => {
      const c = family.contours[i]![k]!;
      return c.reachable ? [{ rho, level, angleDeg: c.angleDeg, mx: c.mx.map((v) => v / divisor), my: c.my.map((v) => v / divisor) }] : [];
    }),
  );
  return { divisor, levels: family.levels, rhos: family.rhos, ...(omegas ? { omegas } : {}), cells, points };
}

/** Six significant digits, and never "-0". */
const cell = (x: number): string => String(sig(x) + 0);

/** CSV of the contour points (BIAXIAL_TABLE_COLUMNS): finite values only, ρg by ρg, level by level, angle by angle. */
export function biaxialTableCsv(t: BiaxialTable): string {
  const lines: string[] = [BIAXIAL_TABLE_COLUMNS.join(',')];
  for (const p of t.points) {
    p.angleDeg.forEach((a, j) => {
      const row = [p.rho, p.level, a, p.mx[j]!, p.my[j]!];
      if (row.every(Number.isFinite)) lines.push(row.map(cell).join(','));
    });
  }
  return `${lines.join('\n')}\n`;
}

/** One table cell for JSON: finite numbers rounded as in the CSV, null where the contour does not exist. */
export function biaxialCellRecord(c: BiaxialCell) {
  const v = (x: number) => (c.reachable && Number.isFinite(x) ? sig(x) + 0 : null);
  return { axial_level: sig(c.level) + 0, reachable: c.reachable, Mxo_norm: v(c.mxo), Myo_norm: v(c.myo), alpha: v(c.alpha), misfit: v(c.misfit) };
}
