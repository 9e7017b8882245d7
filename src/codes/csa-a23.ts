/**
 * CSA A23.3-19 design basis for column sections.
 *
 * The material resistance factors act inside the section analysis (CSA A23.3-19 8.4.2, 8.4.3):
 * the factored family uses α1·φc·f′c on the concrete block and φs·fs in the steel, with factor 1
 * on the resultant. The nominal family is the same analysis with φc = φs = 1.
 *
 * Clause numbers and the Pr,max rule are from memory of CSA A23.3-19 (and -14, which introduced
 * the (0.2 + 0.002h) term); check them against the standard text.
 *
 * CSA A23.3 is an SI code: the basis accepts `units: 'si'` only (N, mm, MPa).
 */
import { CSA_A23_RULES } from './rulebooks.js';
import { CSA_A23_SLENDERNESS } from './slenderness-csa-a23.js';
import { ERROR_CODES, PmError } from '../errors.js';
import { elasticPlasticSteel } from '../materials/elastic-plastic-steel.js';
import { rectangularBlock } from '../materials/rectangular-block.js';
import { yieldClass } from './strain-class.js';
import type { Basis, BasisInput, CapContext, DesignCode, DetailingRules, ResistanceModel, StrainProfile } from './types.js';

/** CSA A23.3-19 10.1.3: maximum usable strain at the extreme concrete compression fibre (from memory). */
export const CSA_EPS_CU = 0.0035;
/** CSA A23.3-19 8.5.4.1: Es = 200 000 MPa (from memory). */
export const CSA_STEEL_MODULUS = 200_000;
/** CSA A23.3-19 8.4.2 and 8.4.3(a): φc = 0.65, φs = 0.85 (from memory). */
export const CSA_PHI_C = 0.65;
export const CSA_PHI_S = 0.85;

/** CSA A23.3-19 10.1.7: α1 = 0.85 − 0.0015·f′c ≥ 0.67 (f′c in MPa). */
export const csaAlpha1 = (fc: number): number => Math.max(0.67, 0.85 - 0.0015 * fc);
/** CSA A23.3-19 10.1.7: β1 = 0.97 − 0.0025·f′c ≥ 0.67 (f′c in MPa). */
export const csaBeta1 = (fc: number): number => Math.max(0.67, 0.97 - 0.0025 * fc);

/** Depth assumed for the tied-column cap when a table has no size (it makes the cap 0.80·Pro). */
export const CSA_ASSUMED_DEPTH_MM = 300;

/**
 * CSA A23.3-19 10.10.4 (from memory): Pr,max = 0.90·Pro for spiral columns, and
 * Pr,max = (0.2 + 0.002·h)·Pro ≤ 0.80·Pro for tied columns with h in mm.
 * Without a size, h ≥ 300 mm is assumed, which gives 0.80. pmchart takes h as the least overall
 * dimension of the section when it is known (the lower, conservative cap for non-square sections),
 * else the depth in the bending plane — check it against the clause text (from memory).
 */
export function csaCapRatio(transverse: 'tied' | 'spiral', depthMm?: number): number {
  if (transverse === 'spiral') return 0.9;
  const h = depthMm ?? CSA_ASSUMED_DEPTH_MM;
  return Math.min(0.8, 0.2 + 0.002 * h);
}

/** CSA A23.3-19 10.1.2 and 10.1.3: plane strain with εcu = 0.0035 at the extreme compression fibre. */
export function csaProfile(c: number, _h: number): StrainProfile {
  if (!Number.isFinite(c)) return { top: CSA_EPS_CU, curvature: 0 };
  return { top: CSA_EPS_CU, curvature: CSA_EPS_CU / c };
}

/** Symbols of CSA A23.3-19 (2.3, from memory): f′c, fy; factored resistances Pr, Mr. */
export const CSA_SYMBOLS = {
  nominalAxial: 'Pn',
  nominalMoment: 'Mn',
  designAxial: 'Pr',
  designMoment: 'Mr',
  designFamily: 'factored',
  nominalFamily: 'nominal',
  normalisingStress: 'f′c',
  concreteStrength: 'f′c',
  steelStrength: 'fy',
  // A23.3-19 factors the materials (φc, φs): the class only says whether the tension steel has yielded
  strainClassWords: { 'compression-controlled': 'steel below fy', transition: 'steel below fy', 'tension-controlled': 'steel yielded' },
  actionAxial: 'Pf',
  actionMoment: 'Mf',
} as const;

export const CSA_A23_3_19: DesignCode = {
  id: 'csa-a23.3-19',
  title: 'CSA A23.3-19',
  unitSystems: ['si'],
  symbols: CSA_SYMBOLS,
  // 8.6.1.1: 20 ≤ f′c ≤ 80 MPa; 8.5.1: fy ≤ 500 MPa (from memory); 300 MPa is pmchart's lower bound.
  limits: () => ({ fc: [20, 80], fy: [300, 500] }),
  resolve: (input: BasisInput): Basis => resolveCsa(input),
};

function resolveCsa(input: BasisInput): Basis {
  const { units, fc, fy, transverse } = input;
  if (units !== 'si') {
    throw new PmError(ERROR_CODES.invalidValue, 'units', 'is not available for CSA A23.3-19, an SI code', { value: units, allowed: 'si' });
  }
  const Es = CSA_STEEL_MODULUS;
  const alpha1 = csaAlpha1(fc);
  const beta1 = csaBeta1(fc);
  const epsY = fy / Es;

  const model = (label: string, phiC: number, phiS: number): ResistanceModel => ({
    label,
    concrete: rectangularBlock(alpha1 * phiC * fc, beta1, CSA_EPS_CU, `block ${phiC === 1 ? '' : 'φc·'}α1·f′c over a = β1·c, α1 = ${fmt(alpha1)}, β1 = ${fmt(beta1)}`),
    // φs·fs with fs = Es·ε ≤ fy is the elastic–plastic law with yield stress φs·fy and modulus φs·Es.
    steel: elasticPlasticSteel(phiS * fy, phiS * Es, `${phiS === 1 ? '' : 'φs·'}elastic–plastic fy = ${fy} MPa, Es = ${Es} MPa`),
    factor: () => 1,
    // 10.10.4: Pro = α1·φc·f′c·(Ag − Ast) + φs·fy·Ast
    squash: { concreteStress: alpha1 * phiC * fc, steelStress: phiS * fy },
    capFactor: (ctx: CapContext) => csaCapRatio(transverse, ctx.leastDimension ?? ctx.depth),
  });
  const nominal = model('nominal (φc = φs = 1)', 1, 1);
  const design = model(`factored (φc = ${CSA_PHI_C}, φs = ${CSA_PHI_S})`, CSA_PHI_C, CSA_PHI_S);

  const capText =
    transverse === 'spiral'
      ? 'Pr,max = 0.90·Pro (spiral, 10.10.4)'
      : `Pr,max = (0.2 + 0.002·h)·Pro ≤ 0.80·Pro (tied, 10.10.4, h in mm); charts without a section size assume h ≥ ${CSA_ASSUMED_DEPTH_MM} mm, i.e. 0.80·Pro`;

  return {
    code: 'csa-a23.3-19',
    title: 'CSA A23.3-19',
    units,
    fc,
    fy,
    Es,
    transverse,
    profile: (c: number, h: number): StrainProfile => csaProfile(c, h),
    nominal,
    design,
    strainStates: [
      { id: 'decompression', label: 'εt = 0', epsT: 0 },
      { id: 'balanced', label: 'εt = εy (balanced)', epsT: epsY },
    ],
    classify: yieldClass(epsY),
    normalisingStress: fc,
    symbols: CSA_SYMBOLS,
    rhoLimits: { min: 0.01, max: 0.08 }, // 10.9.1, 10.9.2
    steelAreaLimits: (_p: number, ag: number) => ({ min: 0.01 * ag, max: 0.08 * ag }), // 10.9.1, 10.9.2
    // Short columns: no minimum eccentricity; the cap Pr,max stands in (the 15 + 0.03h minimum of 10.15.3 is for slender columns).
    minimumMoment: () => 0,
    // from memory: 10.15.3.1 M2 ≥ Pf(15 + 0.03h); 10.1 strain compatibility
    checkClauses: { slenderMinimumMoment: '10.15.3.1', sectionAnalysis: '10.1' },
    // CSA A23.1-19 6.6.5.2 (referenced by A23.3; from memory): clear distance ≥ max(1.4·db, 1.4·aggregate, 30 mm).
    minimumClearSpacing: (db: number, dg: number) => Math.max(1.4 * db, 1.4 * dg, 30),
    // 10.9.3 (from memory): four bars in rectangular or circular ties, six in spirals
    minimumBarCount: () => (transverse === 'spiral' ? 6 : 4),
    minimumBarRule: `at least ${transverse === 'spiral' ? 6 : 4} bars (CSA A23.3-19 10.9.3, from memory)`,
    clearSpacingRule: 'clear spacing ≥ max(1.4·db, 1.4·aggregate, 30 mm) (CSA A23.1-19 6.6.5.2, from memory)',
    barSet: 'csa-g30.18',
    slenderness: CSA_A23_SLENDERNESS, // 10.15.3 non-sway (from memory)
    rules: CSA_A23_RULES,
    detailing: CSA_DETAILING,
    factorSummary: `φc ${CSA_PHI_C} · φs ${CSA_PHI_S} · α1 ${fmt(alpha1)} · β1 ${fmt(beta1)} (8.4.2, 8.4.3, 10.1.7)`,
    parameters: {
      'α1': r4(alpha1),
      'β1': r4(beta1),
      'εcu': CSA_EPS_CU,
      'φc': CSA_PHI_C,
      'φs': CSA_PHI_S,
      Es,
      'εy': r6(epsY),
      'Pr,max / Pro': transverse === 'spiral' ? 0.9 : '(0.2 + 0.002h) ≤ 0.80',
    },
    notes: [
      `Equivalent rectangular stress block α1·φc·f′c over a = β1·c with α1 = ${fmt(alpha1)}, β1 = ${fmt(beta1)} (10.1.7); concrete tensile strength neglected.`,
      `Extreme-fibre concrete strain εcu = 0.0035 (10.1.3); plane sections (10.1.2).`,
      `Material resistance factors inside the analysis: φc = ${CSA_PHI_C} on concrete (8.4.2), φs = ${CSA_PHI_S} on reinforcement (8.4.3); the nominal family uses φc = φs = 1.`,
      `Reinforcement elastic–perfectly plastic, Es = ${Es} MPa (8.5.4.1); εy = fy/Es = ${fmt(epsY)}.`,
      `Displaced concrete is deducted for bars inside the stress block, so a curve steps slightly where a bar row enters the block; moments about the gross-section centroid.`,
      `Pro = α1·φc·f′c·(Ag − Ast) + φs·fy·Ast; ${capText}.`,
      `Column steel 0.01·Ag ≤ Ast ≤ 0.08·Ag (10.9.1, 10.9.2). Slender non-sway columns by the moment magnifier of 10.15.3 in \`check\` (end moments same sign in single curvature); sway frames (10.16) are not included. Clause numbers from memory of CSA A23.3-19.`,
    ],
  };
}

const fmt = (x: number): string => String(Number(x.toPrecision(4)));
const r4 = (x: number): number => Number(x.toFixed(4));
const r6 = (x: number): number => Number(x.toFixed(6));

// ───────────────────────────── detailing (issue 19) ─────────────────────────────

/**
 * CSA A23.3-19 detailing rules for columns (from memory: the standard's text was not found): 10.9.1 As ≥
 * 0.01·Ag, 10.10.5 a reduced effective area ≥ Ag/2 for a column larger than the loads need; 10.9.2 As ≤
 * 0.08·Ag including lap splice regions (so bars lapped at one level flag above 0.04); CSA A23.1-19 6.6.5.2
 * clear spacing; A23.1-19 Table 17 cover 30 mm for columns at exposure N; 12.14.2.1 no lap splices of bars
 * larger than 35M (a note).
 */
const CSA_DETAILING: DetailingRules = {
  rules: [
    { id: 'steel-min', clause: '10.9.1', title: 'As ≥ 0.01·Ag', source: 'from memory', binding: true },
    { id: 'steel-max', clause: '10.9.2', title: 'As ≤ 0.08·Ag', source: 'from memory', binding: true },
    { id: 'steel-max-lap', clause: '10.9.2', title: '0.08·Ag including lap splice regions: 0.04·Ag between laps where bars are lapped at one level', source: 'from memory', binding: false },
    { id: 'clear-spacing', clause: 'CSA A23.1-19 6.6.5.2', title: 'clear spacing ≥ max(1.4·db, 1.4·aggregate, 30 mm)', source: 'from memory', binding: true },
    { id: 'cover', clause: 'CSA A23.1-19 Table 17', title: 'cover 30 mm, columns at exposure N', source: 'from memory', binding: true },
    { id: 'bar-size-lap', clause: '12.14.2.1', title: 'no lap splices of bars larger than 35M', source: 'from memory', binding: false },
  ],
  reducedAreaShare: 0.5, // 10.10.5 (from memory)
  lapZoneRho: 0.04,
  defaultAggregate: 20, // 20 mm nominal maximum aggregate, common practice
  minimumCover: (tie: number, bar: number) => Math.max(30, tie, bar - tie),
  coverAssumption: '30 mm for columns at exposure N (interior; CSA A23.1-19 Table 17, from memory); other exposures and fire need more and are not checked',
  maxLappedBar: 35.7,
};
