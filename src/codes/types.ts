/**
 * The one interface every design basis implements. Analysis asks a basis for its strain profile,
 * its material laws and its factors; it never branches on a code's name.
 */
import type { ConcreteLaw, SteelLaw } from '../materials/types.js';
import type { ShapeKind } from '../section/types.js';
import type { UnitSystem } from '../units/index.js';
import type { RuleDef } from './rules.js';
import type { SlendernessMethod } from './slenderness.js';

export const CODE_IDS = ['aci318-19', 'aci318-14', 'en1992-1-1', 'csa-a23.3-19', 'as3600-2018'] as const;
export type CodeId = (typeof CODE_IDS)[number];
export const isCodeId = (s: unknown): s is CodeId => CODE_IDS.includes(s as CodeId);

export const TRANSVERSE_TYPES = ['tied', 'spiral'] as const;
export type Transverse = (typeof TRANSVERSE_TYPES)[number];
export const isTransverse = (s: unknown): s is Transverse => TRANSVERSE_TYPES.includes(s as Transverse);

/** Linear strain over the depth: ε(depth) = top − curvature·depth, compression positive, depth from the compression face. */
export interface StrainProfile {
  top: number;
  curvature: number;
}

/** Context some caps need, e.g. CSA A23.3 ties the tied-column cap to h in mm. */
export interface CapContext {
  /** section depth in the system's length unit, when known */
  depth?: number;
  /** smallest overall dimension of the cross-section (min(b, h), or D), when known */
  leastDimension?: number;
}

/** A set of material laws plus the factor applied to the section resultant. */
export interface ResistanceModel {
  /** e.g. "nominal", "φ-factored", "design (γc = 1.5, γs = 1.15)" */
  readonly label: string;
  readonly concrete: ConcreteLaw;
  readonly steel: SteelLaw;
  /** factor on the section resultant at extreme-tension strain εt (ACI φ); 1 where factors sit in the materials */
  factor(epsT: number): number;
  /** Po/Ag = concreteStress·(1 − ρ) + steelStress·ρ for this model (ACI 318-19 22.4.2.2 form) */
  readonly squash: { readonly concreteStress: number; readonly steelStress: number };
  /** maximum axial resistance as a multiple of this model's Po (ACI 318-19 22.4.2.1); Infinity where the code sets none */
  capFactor(ctx: CapContext): number;
}

/** A named strain state of the extreme tension bar, marked on charts and listed in tables. */
export interface StrainState {
  readonly id: 'decompression' | 'balanced' | 'tension-controlled' | string;
  readonly label: string;
  /** extreme-tension-bar strain, tension positive */
  readonly epsT: number;
}

export interface BasisInput {
  units: UnitSystem;
  /** specified concrete strength (f′c or fck) in the system's stress unit */
  fc: number;
  /** specified yield strength (fy or fyk) in the system's stress unit */
  fy: number;
  transverse: Transverse;
  options?: BasisOptions;
}

/** Options some bases read; others ignore them. Defaults are each basis's recommended values. */
export interface BasisOptions {
  /** EN 1992-1-1 3.1.6(1) αcc (recommended 1.0) */
  alphaCc?: number;
  /** EN 1992-1-1 2.4.2.4 γc (recommended 1.5) */
  gammaC?: number;
  /** EN 1992-1-1 2.4.2.4 γs (recommended 1.15) */
  gammaS?: number;
  /** concrete law where a code offers more than one */
  concreteLaw?: 'parabola-rectangle' | 'rectangular-block';
  /** EN 1992-1-1 3.2.7(2) steel branch (default horizontal) */
  steelBranch?: 'horizontal' | 'inclined';
  /** EN 1992-1-1 Annex C Table C.1 ratio k = (ft/fy)k for the inclined branch (default 1.08, class B) */
  steelK?: number;
  /**
   * What the column is part of, for edition limits on the bar grade (ACI 318-19 Table 20.2.2.4(a)):
   * 'gravity' (the default) or 'special-seismic' (special moment frames and special structural walls).
   */
  columnUse?: ColumnUse;
  /**
   * EN 1992-1-1 9.5.2(3): the section is at a lap, where As,max is 0.08·Ac (recommended) instead of
   * 0.04·Ac; the value is the lap-zone maximum ratio, 0.04–0.08 (National Annex). Absent: outside laps.
   */
  lapZoneRhoMax?: number;
  /** EN 1992-1-1 Annex C Table C.1 characteristic strain at maximum force εuk (default 0.05, class B); εud = 0.9·εuk (3.2.7(2) Note 1) */
  steelEpsUk?: number;
}

export const COLUMN_USES = ['gravity', 'special-seismic'] as const;
export type ColumnUse = (typeof COLUMN_USES)[number];

export const BAR_SET_IDS = ['astm-a615', 'metric', 'en-common', 'csa-g30.18', 'as4671-d500n', 'astm-a615m'] as const;
export type BarSetId = (typeof BAR_SET_IDS)[number];

export type StrainClass = 'compression-controlled' | 'transition' | 'tension-controlled';

export interface Basis {
  readonly code: CodeId;
  /** e.g. "ACI 318-19" */
  readonly title: string;
  readonly units: UnitSystem;
  readonly fc: number;
  readonly fy: number;
  readonly Es: number;
  readonly transverse: Transverse;
  /**
   * Strain profile for neutral-axis depth c ≥ 0 in a section of depth h (c = Infinity: uniform compression).
   * `tensionDepth` is the depth of the extreme tension bar below the compression face (default h); bases
   * with a steel strain limit pivot about it (EN 1992-1-1 Fig. 6.1, pivot A), the others ignore it.
   */
  profile(c: number, h: number, tensionDepth?: number): StrainProfile;
  readonly nominal: ResistanceModel;
  readonly design: ResistanceModel;
  readonly strainStates: readonly StrainState[];
  /** classification of the extreme-tension strain for reports */
  classify(epsT: number): StrainClass;
  /** stress that makes the normalised values dimensionless (f′c, or fcd for EN 1992-1-1) */
  readonly normalisingStress: number;
  /** symbols used on charts and tables */
  readonly symbols: BasisSymbols;
  /** allowed gross reinforcement ratio for columns */
  readonly rhoLimits: { readonly min: number; readonly max: number };
  /**
   * Allowed total longitudinal steel area for an axial demand (same internal units as the section):
   * ACI 318-19 10.6.1.1 is a fixed 1–8 % of Ag; EN 1992-1-1 9.5.2 depends on NEd.
   */
  steelAreaLimits(axialDemand: number, grossArea: number): { min: number; max: number };
  /**
   * Smallest design moment the code requires for an axial demand in a section of the given depth
   * (EN 1992-1-1 6.1(4) minimum eccentricity); 0 where the basis sets none for short columns.
   */
  minimumMoment(axialDemand: number, depth: number): number;
  /** clauses (in this basis's edition) of the rules the check applies around the section, for its typed findings */
  readonly checkClauses?: CheckClauses;
  /**
   * Smallest clear distance between adjacent longitudinal bars of diameter db with maximum aggregate
   * size dg (0 when not given: the aggregate term is not checked), in the system's length unit.
   */
  minimumClearSpacing(barDiameter: number, aggregate: number): number;
  /** the rule above as text with its clause, for reports */
  readonly clearSpacingRule: string;
  /** which bar-size table proposals draw from (src/section/bar-tables.ts) */
  readonly barSet: BarSetId;
  /** fewest longitudinal bars the code allows for this transverse type and shape */
  minimumBarCount(shape: 'rectangle' | 'circle'): number;
  /** the rule above as text with its clause, for reports */
  readonly minimumBarRule: string;
  /**
   * The factors on resistance in one line for title blocks and covers, with where they come from,
   * e.g. "αcc 1.0 · γc 1.5 · γs 1.15 (recommended)", "φc 0.65 · φs 0.85 · α1 0.76 · β1 0.82".
   */
  readonly factorSummary: string;
  /** derived parameters worth printing (β1, εcu, αcc …), name → value */
  readonly parameters: Readonly<Record<string, number | string>>;
  /** assumptions with their clauses, for sheets, reports and the README */
  readonly notes: readonly string[];
  /**
   * Load-contour exponent α in (Mx/Mxo)^α + (My/Myo)^α ≤ 1 at axial ratio NEd/NRd (EN 1992-1-1 5.8.9
   * Eq. 5.39). Optional: without it, `loadContourExponent` (src/design/biaxial.ts) uses Bresler's
   * documented exponent.
   */
  biaxialExponent?(axialRatio: number, shape: ShapeKind): BiaxialExponent;
  /**
   * The axial resistance the exponent's ratio divides by, for gross area Ac and steel area As
   * (EN 1992-1-1 5.8.9(4): NRd = Ac·fcd + As·fyd). Optional: without it the ratio is Pu/Po of the
   * design model (the section's squash load).
   */
  biaxialReferenceLoad?(grossArea: number, steelArea: number): number;
  /**
   * true where the code replaces the curve between the decompression point (εt = 0) and the squash load
   * by a straight line (AS 3600-2018 10.6.2.3): for c beyond the extreme tension bar the section's
   * response is the linear blend of the decompression response and the squash load. Default false.
   */
  readonly linearTransitionToSquash?: boolean;
  /**
   * The basis's rulebook for slender braced columns (src/codes/slenderness-*.ts): its method, end-moment
   * convention and rules; src/design/slenderness.ts runs it. None when absent.
   */
  readonly slenderness?: SlendernessMethod;
  /**
   * Every rule the check applies around the section for this basis, with clause and source (published or
   * from memory): slenderness, minimum moments, biaxial method, scope limits … Each has a row in the
   * clause matrix of the tests (tests/codes/clause-matrix.ts).
   */
  readonly rules: readonly RuleDef[];
  /** the detailing rules a given layout or ρg is checked against (src/design/detailing.ts) */
  readonly detailing: DetailingRules;
}

/**
 * A detailing rule of a basis. Ids: 'steel-min', 'steel-max', 'steel-max-lap', 'clear-spacing', 'cover',
 * 'bar-size-lap'. A binding rule broken makes the load's status `detailing`; the others are flagged as notes.
 */
export interface DetailingRuleDef extends RuleDef {
  readonly binding: boolean;
}

/**
 * The detailing rules of a basis: the steel ratio limits come from `steelAreaLimits`, the clear spacing from
 * `minimumClearSpacing`; here are the rules' clauses and the figures the other rules need.
 */
export interface DetailingRules {
  /** every detailing rule the basis has, with clause and source; a rule not listed is not checked */
  readonly rules: readonly DetailingRuleDef[];
  /**
   * Smallest share of Ag a reduced effective area may take for the minimum steel of a column larger than
   * the loads need (ACI 318-19 10.3.1.2: one half); absent where the basis has no such provision.
   */
  readonly reducedAreaShare?: number;
  /** gross ratio above which a layout is flagged where its bars are lapped (all bars lapped at one level doubles the area) */
  readonly lapZoneRho: number;
  /** maximum aggregate size assumed when none is given, in the system's length unit (common practice) */
  readonly defaultAggregate: number;
  /** smallest clear cover to the tie for the tie and longitudinal bar diameters (system's length unit), at the mildest exposure */
  minimumCover(tieDiameter: number, barDiameter: number): number;
  /** what the cover rule assumes (exposure, what is not checked), for reports */
  readonly coverAssumption: string;
  /** largest longitudinal bar diameter that may be lap spliced (system's length unit); Infinity where the basis sets none */
  readonly maxLappedBar: number;
}

/** An exponent with where it comes from. */
export interface BiaxialExponent {
  alpha: number;
  source: string;
}

export { SLENDERNESS_METHODS, type SlendernessMethodId } from './slenderness.js';

export interface BasisSymbols {
  /** e.g. "Pn", "NRk"; the unfactored family */
  nominalAxial: string;
  nominalMoment: string;
  /** e.g. "φPn", "NRd", "Pr" */
  designAxial: string;
  designMoment: string;
  /** name of the factored family: "φ-factored", "design" */
  designFamily: string;
  nominalFamily: string;
  /** symbol of the normalising stress, e.g. "f′c", "fcd" */
  normalisingStress: string;
  /** symbol of the specified concrete strength on sheets, titles and reports: "f′c" (ACI, CSA), "fck" (EN) */
  concreteStrength: string;
  /** symbol of the specified yield strength of the bars: "fy" (ACI, CSA), "fyk" (EN) */
  steelStrength: string;
  /** symbol of the dimensionless axial value P/(normalising stress·Ag) where the code's practice has one ("ν" for EN); absent: the ratio is spelled out */
  dimensionlessAxial?: string;
  /** symbol of the dimensionless moment M/(normalising stress·Ag·h) ("μ" for EN); absent: spelled out */
  dimensionlessMoment?: string;
  /** the code's words for the strain classes of `Basis.classify`; absent: ACI 318's words (`STRAIN_CLASS_WORDS`) */
  strainClassWords?: Readonly<Record<StrainClass, string>>;
  /** symbols of the factored actions: "Pu"/"Mu" (ACI), "NEd"/"MEd" (EN), "Pf"/"Mf" (CSA), "N*"/"M*" (AS 3600); absent: Pu, Mu */
  actionAxial?: string;
  actionMoment?: string;
  /** the slenderness table's moments: first-order and second-order ("M2"/"Mc" for ACI, "M0Ed"/"MEd" for EN); absent: M2, Mc */
  firstOrderMoment?: string;
  secondOrderMoment?: string;
  /** symbol of the extreme-tension-bar strain in tables and notes: "εt" (ACI 318 21.2.2); absent: εt */
  tensionStrain?: string;
  /** symbol of the squash load: "Po" (ACI 318 22.4.2.2), "Nuo" (AS 3600 10.6.2.2); absent: Po */
  squashLoad?: string;
  /** words for the axial limit of the design curve: "axial cap" (ACI 318 22.4.2.1); absent: axial cap */
  axialCap?: string;
}

/** ACI 318-19 21.2.2 words for the strain classes. */
export const STRAIN_CLASS_WORDS: Readonly<Record<StrainClass, string>> = {
  'compression-controlled': 'compression-controlled',
  transition: 'transition',
  'tension-controlled': 'tension-controlled',
};

/** The words a basis uses for a strain class. */
export const strainClassWord = (symbols: BasisSymbols, c: StrainClass): string => (symbols.strainClassWords ?? STRAIN_CLASS_WORDS)[c];

/** A design code: input limits and a resolver from materials to a Basis. */
export interface DesignCode {
  readonly id: CodeId;
  readonly title: string;
  /** unit systems the basis accepts (EN 1992-1-1 and CSA A23.3 are SI-only; ACI 318 has both) */
  readonly unitSystems: readonly UnitSystem[];
  /** the symbols of every basis this code resolves (known before materials are given, e.g. for sheet titles) */
  readonly symbols: BasisSymbols;
  /** allowed specified strengths in the given system's stress unit */
  limits(units: UnitSystem): { fc: [number, number]; fy: [number, number] };
  /**
   * The edition's upper limit on the specified yield strength of longitudinal column bars for a use
   * (ACI 318-14 and 318-19 Table 20.2.2.4(a)), in the system's stress unit, with the rule as text;
   * absent where `limits` already says all.
   */
  yieldLimit?(units: UnitSystem, use: ColumnUse): { max: number; rule: string };
  /**
   * A strength given by the code's own class name, in MPa ("C50/60" → fck 50 for EN 1992-1-1 Table 3.1,
   * "B500B" → fyk 500); NaN for a name of the right form that the code does not list; undefined where
   * the text is not such a name.
   */
  namedStrength?(text: string, kind: 'concrete' | 'steel'): number | undefined;
  resolve(input: BasisInput): Basis;
}

/**
 * Clauses of the check's rules around the section, named by the basis (the engine never spells one).
 * A minimum moment is an accidental eccentricity: it acts about one axis at a time, in either sign.
 */
export interface CheckClauses {
  /** the clause of `minimumMoment` (every column); absent where `minimumMoment` is 0 */
  readonly minimumMoment?: string;
  /** the minimum the slenderness method puts on a slender column's first-order moment */
  readonly slenderMinimumMoment?: string;
  /** strain compatibility of the actual section, the neutral axis free to incline (the exact biaxial search) */
  readonly sectionAnalysis: string;
}
