/** tables/*.json: the lookup table of one sheet with its parameters (CSV comes from src/chart/lookup-table.ts). */
import { describeArrangement, describeShape } from '../config/describe.js';
import type { ResolvedChartSet, ResolvedSheet } from '../config/types.js';
import type { Basis } from '../codes/types.js';
import { roundPoint, type FamilyKind, type LookupTable } from '../chart/lookup-table.js';
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
    rows: table.rows.map((r) => ({
      ...(r.omega !== undefined ? { omega: r.omega } : {}),
      rhoG: Number(r.rhoG.toPrecision(6)),
      points: r.points.map((p) => ({ id: p.id, label: p.label, nominal: roundPoint(p.nominal), design: roundPoint(p.design) })),
    })),
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}
