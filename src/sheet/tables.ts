/**
 * tables/*.json: the lookup table of one sheet with its parameters (CSV comes from src/chart/lookup-table.ts).
 * Curves and key points use the names of `pmchart table --format json` (curves[].rho_g, key_points[].nominal/factored).
 */
import { describeArrangement, describeShape } from '../config/describe.js';
import type { ResolvedChartSet, ResolvedSheet } from '../config/types.js';
import type { Basis } from '../codes/types.js';
import { keyPointRecord, type FamilyKind, type LookupTable } from '../chart/lookup-table.js';
import { DISPLAY_UNITS } from '../units/index.js';
import type { BiaxialFamily } from '../analysis/biaxial-family.js';
import { BIAXIAL_TABLE_COLUMNS, biaxialCellRecord, type BiaxialTable } from '../chart/biaxial-table.js';
import { levelSymbol } from '../config/describe.js';
import { sig } from '../chart/lookup-table.js';

/** The sheet's parameters as both tables' JSON gives them (`chart` after the title on biaxial sheets). */
function sheetRecord(sheet: ResolvedSheet, chart?: 'biaxial') {
  return {
    index: sheet.index,
    title: sheet.title,
    ...(chart ? { chart } : {}),
    shape: describeShape(sheet.shape),
    fc: sheet.fc,
    fy: sheet.fy,
    basisOptions: sheet.basisOptions,
    gamma: sheet.gamma,
    ...(sheet.gammaB !== undefined ? { gammaB: sheet.gammaB } : {}),
    arrangement: { ...sheet.arrangement, text: describeArrangement(sheet.arrangement) },
    transverse: sheet.transverse,
  };
}

export function tableJson(set: ResolvedChartSet, sheet: ResolvedSheet, basis: Basis, table: LookupTable, primary: FamilyKind, generator: string): string {
  const dimless = set.normalisation === 'dimensionless';
  const doc = {
    generator,
    set: set.name,
    sheet: sheetRecord(sheet),
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

/**
 * tables/*.json of a biaxial sheet: its parameters, and per ρg and axial level the uniaxial capacities
 * Mxo, Myo and the fitted load-contour exponent α with its worst radial misfit (null where the level is
 * beyond the ρg's reach). The contour points are in the CSV beside it (`csvColumns`).
 */
export function biaxialTableJson(set: ResolvedChartSet, sheet: ResolvedSheet, family: BiaxialFamily, table: BiaxialTable, generator: string): string {
  const basis = family.basis;
  const sy = basis.symbols;
  const dimless = set.normalisation === 'dimensionless';
  const ns = sy.normalisingStress;
  const doc = {
    generator,
    set: set.name,
    sheet: { ...sheetRecord(sheet, 'biaxial'), axial_levels: table.levels.map((v) => sig(v) + 0) },
    basis: { code: basis.code, title: basis.title, factors: basis.factorSummary, symbols: sy },
    units: set.units,
    normalisation: set.normalisation,
    valueUnit: dimless ? 'dimensionless' : DISPLAY_UNITS[set.units].stress,
    values: dimless ? `${sy.designMoment}x/(${ns}·Ag·h) and ${sy.designMoment}y/(${ns}·Ag·b)` : `${sy.designMoment}x/(Ag·h) and ${sy.designMoment}y/(Ag·b)`,
    axialLevel: `${levelSymbol(sy)}: factored axial load over ${ns}·Ag, compression positive`,
    sheetShows: 'design',
    quadrants: family.quadrants,
    loadContour: '(Mx/Mxo)^alpha + (My/Myo)^alpha = 1, alpha by least squares on the contour radius (Bresler 1960); misfit: worst |r/r_fit - 1|',
    csvColumns: [...BIAXIAL_TABLE_COLUMNS],
    curvesBy: set.ratios.kind,
    curves: table.rhos.map((rho, k) => ({
      rho_g: Number(rho.toPrecision(6)),
      ...(table.omegas ? { omega: table.omegas[k] } : {}),
      levels: table.cells[k]!.map(biaxialCellRecord),
    })),
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}
