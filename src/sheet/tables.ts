/**
 * tables/*.json: the lookup table of one sheet with its parameters (CSV comes from src/chart/lookup-table.ts).
 * Curves and key points use the names of `pmchart table --format json` (curves[].rho_g, key_points[].nominal/factored).
 */
import { describeArrangement, describeShape } from '../config/describe.js';
import type { ResolvedChartSet, ResolvedSheet } from '../config/types.js';
import type { Basis } from '../codes/types.js';
import { keyPointRecord, type FamilyKind, type LookupTable } from '../chart/lookup-table.js';
import { DISPLAY_UNITS } from '../units/index.js';

export function tableJson(set: ResolvedChartSet, sheet: ResolvedSheet, basis: Basis, table: LookupTable, primary: FamilyKind, generator: string): string {
  const dimless = set.normalisation === 'dimensionless';
  const doc = {
    generator,
    set: set.name,
    sheet: {
      index: sheet.index,
      title: sheet.title,
      shape: describeShape(sheet.shape),
      fc: sheet.fc,
      fy: sheet.fy,
      basisOptions: sheet.basisOptions,
      gamma: sheet.gamma,
      ...(sheet.gammaB !== undefined ? { gammaB: sheet.gammaB } : {}),
      arrangement: { ...sheet.arrangement, text: describeArrangement(sheet.arrangement) },
      transverse: sheet.transverse,
    },
    basis: { code: basis.code, title: basis.title, factors: basis.factorSummary, symbols: basis.symbols },
    units: set.units,
    normalisation: set.normalisation,
    valueUnit: dimless ? 'dimensionless' : DISPLAY_UNITS[set.units].stress,
    values: dimless
      ? `P/(${basis.symbols.normalisingStress}·Ag) and M/(${basis.symbols.normalisingStress}·Ag·h)`
      : 'P/Ag and M/(Ag·h)',
    sheetShows: primary,
    curvesBy: set.ratios.kind,
    curves: table.rows.map((r) => ({
      rho_g: Number(r.rhoG.toPrecision(6)),
      ...(r.omega !== undefined ? { omega: r.omega } : {}),
      key_points: r.points.map(keyPointRecord),
    })),
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}
