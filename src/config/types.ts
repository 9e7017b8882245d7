/** The resolved, complete chart set: defaults filled, units converted, cross products expanded. */
import type { BasisOptions, CodeId, Transverse } from '../codes/types.js';
import type { Arrangement } from '../section/types.js';
import type { UnitSystem } from '../units/index.js';
import type { ResolvedLogo } from './logo.js';
import type { BarEntryDrawing, FamilyChoice, Normalisation, PaperSize } from './schema.js';

export const RATIO_KINDS = ['rhoG', 'omega'] as const;
export type RatioKind = (typeof RATIO_KINDS)[number];

/** Curve label symbol of a ratio kind. */
export const RATIO_SYMBOL: Record<RatioKind, string> = { rhoG: 'ρg', omega: 'ω' };

export interface ResolvedTitleBlock {
  office: string;
  project: string;
  preparedBy: string;
  checkedBy: string;
  revision: string;
  /** ISO date YYYY-MM-DD */
  date: string;
  /** the office logo, read and cleaned (config/logo.ts); absent: none */
  logo?: ResolvedLogo;
}

export interface ResolvedPaper {
  size: PaperSize;
  orientation: 'landscape' | 'portrait';
  /** page size in PDF points (1/72 in) */
  widthPt: number;
  heightPt: number;
}

export type ResolvedShape = { kind: 'rectangle'; aspect: number } | { kind: 'circle' };

export interface ResolvedSheet {
  /** 1-based position in the set */
  index: number;
  /** where it came from in the file, e.g. "sheets[1]" */
  origin: string;
  shape: ResolvedShape;
  /** f′c in the set's stress unit */
  fc: number;
  /** fy in the set's stress unit */
  fy: number;
  gamma: number;
  /** γB: outer-column spacing ÷ b (rectangles); absent: the same cover as γ gives on h */
  gammaB?: number;
  arrangement: Exclude<Arrangement, { kind: 'custom' }>;
  transverse: Transverse;
  /** the set's basis.options with the sheet group's own basisOptions over them */
  basisOptions: BasisOptions;
  /** the sheet group's own basisOptions ({} when it has none): a variant named in the title and file name */
  variantOptions: BasisOptions;
  /** the sheet group's fixed axis limits, in the sheet's normalised units (absent: fitted to the group's curves) */
  axes?: { P?: [number, number]; M?: [number, number] };
  /**
   * 'biaxial': a sheet of Mx–My contour panels, one per axial level of `axialLevels` (absent: a P–M
   * interaction sheet, as before)
   */
  chart?: 'biaxial';
  /** biaxial sheets: this sheet's axial levels, P/(normalising stress·Ag) (a run of its group's levels) */
  axialLevels?: number[];
  /** biaxial sheets: which part of the group's levels this sheet holds, [k, of] (1-based) */
  levelPart?: [number, number];
  title: string;
  /** file name without extension for sheets/ and tables/ */
  fileStem: string;
}

export interface ResolvedChartSet {
  name: string;
  titleBlock: ResolvedTitleBlock;
  paper: ResolvedPaper;
  units: UnitSystem;
  code: CodeId;
  basisOptions: BasisOptions;
  normalisation: Normalisation;
  families: FamilyChoice;
  /**
   * The curves of every sheet: geometric ratios ρg, or mechanical ratios ω = As·fyd/(Ac·fcd) that each
   * sheet converts to ρg with its own basis (src/sheet/curves.ts sheetRhos).
   */
  ratios: { kind: RatioKind; values: number[] };
  referenceLines: { strainStates: boolean; eccentricities: number[]; axialCap: boolean; barEntry?: BarEntryDrawing };
  outputs: { pdf: boolean; svg: boolean; png: boolean; pngScale: number; tables: boolean };
  sheets: ResolvedSheet[];
}

/** Paper sizes in PDF points, portrait (ISO 216; ANSI/ASME Y14.1 for Letter and Tabloid). */
export const PAPER_POINTS: Record<PaperSize, [number, number]> = {
  a4: [595.28, 841.89],
  a3: [841.89, 1190.55],
  letter: [612, 792],
  tabloid: [792, 1224],
};
