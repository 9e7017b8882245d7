/**
 * AS 3600-2018 design basis for column sections (SI only: N, mm, MPa).
 *
 * Clause numbers and formulas are from memory of AS 3600-2018 unless a note says otherwise; check
 * them against the standard. The 2018 edition changed the stress block and the capacity reduction
 * factors against AS 3600-2009 (Chowdhury & Loo, "The New Australian Concrete Structures Standard
 * AS 3600:2018 – Aspects of its Complexity and Effectiveness", Athens Journal of Technology and
 * Engineering 6(3), 2019, 163–178, list of changes).
 *
 *   - rectangular stress block α2·f′c over γ₂·ku·d (8.1.3): α2 = 0.85 − 0.0015·f′c ≥ 0.67 and the
 *     depth factor 0.97 − 0.0025·f′c ≥ 0.67. AS 3600 calls the depth factor γ; pmchart calls it
 *     γ₂ (`blockDepthFactor`) so it is never read as the bar-spacing ratio γ of the charts;
 *   - εcu = 0.003 at the extreme compression fibre (8.1.2, 10.6.1);
 *   - squash load Nuo = α1·f′c·(Ag − As) + fsy·As with α1 = 1.0 − 0.003·f′c within 0.72–0.85 (10.6.2.2),
 *     and a straight line between the decompression point (kuo = 1) and Nuo (10.6.2.3);
 *   - φ = 1.24 − 13·kuo/12 within 0.65–0.85 for Class N bars in bending with axial force (Table 2.2.2),
 *     kuo = c/do with do the depth of the extreme tension bar; 0.65 at Nuo;
 *   - minimum eccentricity 0.05·D (10.1.2); column steel 1 %–4 % of Ag (10.7.1).
 */
import { AS_3600_RULES } from './rulebooks.js';
import { AS_3600_SLENDERNESS } from './slenderness-as3600.js';
import { ERROR_CODES, PmError } from '../errors.js';
import { elasticPlasticSteel } from '../materials/elastic-plastic-steel.js';
import { rectangularBlock } from '../materials/rectangular-block.js';
import { aciProfile } from './aci318.js';
import { as3600BiaxialExponent } from './biaxial-exponent.js';
import type { Basis, BasisInput, DesignCode, DetailingRules, ResistanceModel, StrainClass, StrainProfile } from './types.js';

/** AS 3600-2018 8.1.2 / 10.6.1: maximum concrete compressive strain (from memory). */
export const AS_EPS_CU = 0.003;
/** AS 3600-2018 3.2.2: Es = 200 000 MPa (from memory). */
export const AS_STEEL_MODULUS = 200_000;

const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));

/** AS 3600-2018 8.1.3: stress-block intensity factor α2 = 0.85 − 0.0015·f′c, 0.67 ≤ α2 ≤ 0.85 (f′c in MPa, from memory). */
export const asAlpha2 = (fc: number): number => clamp(0.85 - 0.0015 * fc, 0.67, 0.85);
/** AS 3600-2018 8.1.3: stress-block depth factor (the standard's γ; pmchart's γ₂) = 0.97 − 0.0025·f′c, 0.67–0.85 (from memory). */
export const asBlockDepthFactor = (fc: number): number => clamp(0.97 - 0.0025 * fc, 0.67, 0.85);
/** AS 3600-2018 10.6.2.2: squash-load factor α1 = 1.0 − 0.003·f′c, 0.72 ≤ α1 ≤ 0.85 (from memory). */
export const asAlpha1 = (fc: number): number => clamp(1.0 - 0.003 * fc, 0.72, 0.85);

/** AS 3600-2018 Table 2.2.2, Class N bars, bending with axial force: φ = 1.24 − 13·kuo/12 within 0.65–0.85 (from memory). */
export const asPhi = (kuo: number): number => clamp(1.24 - (13 * kuo) / 12, 0.65, 0.85);

/** kuo = c/do from the extreme-tension-bar strain εt (tension positive) with εcu at the face: εt = εcu·(1/kuo − 1). */
export const kuoFromStrain = (epsT: number): number => (epsT <= -AS_EPS_CU ? Infinity : AS_EPS_CU / (AS_EPS_CU + epsT));

/**
 * The edition pmchart implements: the 2018 text, from memory. Amendment 2 (published 21 May 2021) amends
 * Table 2.2.2 among others (its published summary lists the table); secondary sources describe its φ for
 * bending with axial compression as re-expressed with a factor kφ (φ0 = 0.65·kφ). That text was not found,
 * so it is not applied: the title says so on every output.
 */
export const AS_EDITION_TITLE = 'AS 3600-2018 (Amdt 2 φ not applied)';
export const AS_EDITION_NOTE =
  'Edition: AS 3600-2018 as recalled (from memory); Amendment 2 (2021), which amends Table 2.2.2 (φ for bending with axial compression, re-expressed with kφ), is not applied: check φ against the amended table.';

/** Symbols of AS 3600-2018 (1.7 notation, from memory): f′c, fsy; φNu, φMu; loads N*, M*. */
export const AS_SYMBOLS = {
  nominalAxial: 'Nu',
  nominalMoment: 'Mu',
  designAxial: 'φNu',
  designMoment: 'φMu',
  designFamily: 'φ-factored',
  nominalFamily: 'ultimate',
  normalisingStress: 'f′c',
  concreteStrength: 'f′c',
  steelStrength: 'fsy',
  actionAxial: 'N*',
  actionMoment: 'M*',
  firstOrderMoment: 'M*',
  secondOrderMoment: 'δb·M*',
  // AS words, not ACI's (issue 19; from memory of AS 3600-2018 notation): steel strain εs, squash load Nuo,
  // no separate axial cap (the curve ends at φ·Nuo, 10.6.2.2); sections classed by kuo against the balanced kuo
  tensionStrain: 'εs',
  squashLoad: 'Nuo',
  axialCap: 'squash load φNuo (no separate axial cap)',
  strainClassWords: {
    'compression-controlled': 'compression failure (kuo ≥ kuo,b)',
    transition: 'tension failure, φ rising',
    'tension-controlled': 'tension failure, φ = 0.85',
  },
} as const;

export const AS_3600_2018: DesignCode = {
  id: 'as3600-2018',
  title: 'AS 3600-2018',
  unitSystems: ['si'],
  symbols: AS_SYMBOLS,
  // 1.1.2 (from memory): f′c 20–100 MPa; D500N bars (AS/NZS 4671), fsy ≤ 500 MPa; 250 MPa is pmchart's lower bound.
  limits: () => ({ fc: [20, 100], fy: [250, 500] }),
  resolve: (input: BasisInput): Basis => resolveAs3600(input),
};

function resolveAs3600(input: BasisInput): Basis {
  const { units, fc, fy: fsy, transverse } = input;
  if (units !== 'si') {
    throw new PmError(ERROR_CODES.invalidValue, 'units', 'is not available for AS 3600-2018, an SI code', { value: units, allowed: 'si' });
  }
  const Es = AS_STEEL_MODULUS;
  const alpha2 = asAlpha2(fc);
  const gammaBlock = asBlockDepthFactor(fc);
  const alpha1 = asAlpha1(fc);
  const epsSy = fsy / Es;
  const kuoBalanced = AS_EPS_CU / (AS_EPS_CU + epsSy);
  // φ reaches 0.85 at kuo = (1.24 − 0.85)·12/13 = 0.36; εt there
  const epsTUpper = AS_EPS_CU * (1 / 0.36 - 1);
  const concrete = rectangularBlock(alpha2 * fc, gammaBlock, AS_EPS_CU, `α2·f′c block over γ₂·c, α2 = ${fmt(alpha2)}, γ₂ = ${fmt(gammaBlock)}`);
  const steel = elasticPlasticSteel(fsy, Es, `elastic–plastic fsy = ${fsy} MPa, Es = ${Es} MPa`);
  // 10.6.2.2: Nuo = α1·f′c·(Ag − As) + fsy·As (displaced concrete deducted, as in the sweep)
  const squash = { concreteStress: alpha1 * fc, steelStress: fsy };
  const nominal: ResistanceModel = { label: 'ultimate (φ = 1)', concrete, steel, factor: () => 1, squash, capFactor: () => Infinity };
  const design: ResistanceModel = {
    label: 'φ-factored',
    concrete,
    steel,
    factor: (epsT: number) => asPhi(kuoFromStrain(epsT)),
    squash,
    capFactor: () => Infinity,
  };
  return {
    code: 'as3600-2018',
    // the edition and amendment assumed, on every output that prints the basis title (issue 19)
    title: AS_EDITION_TITLE,
    units,
    fc,
    fy: fsy,
    Es,
    transverse,
    profile: (c: number, h: number): StrainProfile => aciProfile(c, h), // same plane-strain profile, εcu = 0.003 at the face
    nominal,
    design,
    linearTransitionToSquash: true,
    strainStates: [
      { id: 'decompression', label: 'kuo = 1 (decompression)', epsT: 0 },
      { id: 'balanced', label: `kuo = ${fmt(kuoBalanced)} (balanced, εst = εsy)`, epsT: epsSy },
      { id: 'phi-upper', label: 'kuo = 0.36 (φ = 0.85 from here)', epsT: epsTUpper },
    ],
    classify: (epsT: number): StrainClass => (epsT <= epsSy ? 'compression-controlled' : epsT >= epsTUpper ? 'tension-controlled' : 'transition'),
    normalisingStress: fc,
    symbols: AS_SYMBOLS,
    rhoLimits: { min: 0.01, max: 0.04 }, // 10.7.1 (from memory)
    steelAreaLimits: (_n: number, ag: number) => ({ min: 0.01 * ag, max: 0.04 * ag }), // 10.7.1 (from memory)
    // 10.1.2 (from memory): design moment not less than N*·0.05·D
    minimumMoment: (N: number, D: number) => Math.max(0, N) * 0.05 * D,
    // from memory: 10.1.2 M* ≥ N*·0.05D, for short and slender columns alike; 10.6.2 section strength
    checkClauses: { minimumMoment: '10.1.2', slenderMinimumMoment: '10.1.2', sectionAnalysis: '10.6.2' },
    // clear spacing of column bars (from memory; clause not verified): at least max(db, 1.5·aggregate, 25 mm)
    minimumClearSpacing: (db: number, dg: number) => Math.max(db, 1.5 * dg, 25),
    clearSpacingRule: 'clear spacing ≥ max(db, 1.5·aggregate, 25 mm) (AS 3600-2018, from memory; clause not verified)',
    barSet: 'as4671-d500n',
    // 10.7.4 (from memory): at least 4 bars in a rectangular arrangement, 6 in a circular one
    minimumBarCount: (shape: 'rectangle' | 'circle') => (shape === 'circle' ? 6 : 4),
    minimumBarRule: 'at least 4 bars in a rectangular and 6 in a circular arrangement (AS 3600-2018 10.7.4, from memory)',
    factorSummary: `φ 0.65–0.85 = 1.24 − 13·kuo/12 (Table 2.2.2, Class N) · α2 ${fmt(alpha2)} · γ₂ ${fmt(gammaBlock)} · α1 ${fmt(alpha1)}`,
    slenderness: AS_3600_SLENDERNESS,
    rules: AS_3600_RULES,
    // 10.6.4 (from memory): αn from N*/(0.6·Nuo), Nuo = α1·f′c·(Ag − As) + fsy·As (10.6.2.2)
    biaxialExponent: as3600BiaxialExponent,
    biaxialReferenceLoad: (Ag: number, As: number) => 0.6 * (alpha1 * fc * (Ag - As) + fsy * As),
    detailing: AS3600_DETAILING,
    parameters: {
      'α2': r4(alpha2),
      'γ₂ (block depth)': r4(gammaBlock),
      'α1 (squash)': r4(alpha1),
      'εcu': AS_EPS_CU,
      Es,
      'εsy': r6(epsSy),
      'kuo balanced': r4(kuoBalanced),
      'φ': '1.24 − 13·kuo/12, 0.65–0.85',
    },
    notes: [
      AS_EDITION_NOTE,
      `Rectangular stress block α2·f′c over γ₂·c with α2 = 0.85 − 0.0015·f′c = ${fmt(alpha2)} and γ₂ = 0.97 − 0.0025·f′c = ${fmt(gammaBlock)}, each within 0.67–0.85 (AS 3600-2018 8.1.3, from memory). γ₂ is the standard's γ, renamed so it is not read as the bar-spacing γ.`,
      `Extreme-fibre concrete strain εcu = 0.003; plane sections; concrete tensile strength neglected (8.1.2, 10.6.1, from memory).`,
      `Reinforcement D500N (AS/NZS 4671) elastic–perfectly plastic, fsy = ${fsy} MPa, Es = ${Es} MPa; εsy = ${fmt(epsSy)}, so the balanced kuo = 0.003/(0.003 + εsy) = ${fmt(kuoBalanced)}.`,
      `Squash load Nuo = α1·f′c·(Ag − As) + fsy·As with α1 = 1.0 − 0.003·f′c = ${fmt(alpha1)} within 0.72–0.85 (10.6.2.2, from memory); between the decompression point (kuo = 1) and Nuo the curve is the straight line of 10.6.2.3 (from memory), so the curve's end is Nuo itself.`,
      `φ = 1.24 − 13·kuo/12 within 0.65–0.85 for Class N reinforcement in bending with axial force (Table 2.2.2, from memory), kuo = c/do with do the depth of the extreme tension bar; φ = 0.65 for kuo ≥ ${fmt((1.24 - 0.65) * 12 / 13)} and at Nuo. No separate axial cap: the minimum eccentricity stands for it.`,
      `Minimum design moment N*·0.05·D (10.1.2, from memory). Column steel 0.01·Ag ≤ As ≤ 0.04·Ag (10.7.1, from memory).`,
      `Displaced concrete is deducted for bars inside the stress block; moments about the gross-section centroid. Clause numbers from memory of AS 3600-2018: check them against the standard.`,
      `Circular sections: the block is applied unreduced over the circular segment; any reduction of α2 the standard makes where the compression zone narrows toward the extreme fibre (from memory, 8.1.3) is not applied — check it for circles.`,
    ],
  };
}

const fmt = (x: number): string => String(Number(x.toPrecision(4)));
const r4 = (x: number): number => Number(x.toFixed(4));
const r6 = (x: number): number => Number(x.toFixed(6));

// ───────────────────────────── detailing (issue 19) ─────────────────────────────

/**
 * AS 3600-2018 detailing rules for columns (from memory: the standard's text was not found): 10.7.1 0.01·Ag ≤
 * As ≤ 0.04·Ag, the 0.04 applying at splices too; clear spacing max(db, 1.5·aggregate, 25 mm) (clause not
 * verified); cover at least the bar diameter for placing (4.10.3, exposure table 4.10.3.2 not checked).
 */
const AS3600_DETAILING: DetailingRules = {
  rules: [
    { id: 'steel-min', clause: '10.7.1', title: 'As ≥ 0.01·Ag', source: 'from memory', binding: true },
    { id: 'steel-max', clause: '10.7.1', title: 'As ≤ 0.04·Ag', source: 'from memory', binding: true },
    { id: 'steel-max-lap', clause: '10.7.1', title: 'As ≤ 0.04·Ag where bars are lapped', source: 'from memory', binding: false },
    { id: 'clear-spacing', clause: 'not verified', title: 'clear spacing ≥ max(db, 1.5·aggregate, 25 mm)', source: 'from memory', binding: true },
    { id: 'cover', clause: '4.10.3', title: 'cover ≥ the bar diameter for placing', source: 'from memory', binding: true },
  ],
  lapZoneRho: 0.04,
  defaultAggregate: 20, // 20 mm maximum aggregate, common practice
  minimumCover: (tie: number, bar: number) => Math.max(tie, bar - tie),
  coverAssumption: 'cover for placing only: at least the tie diameter, and the bar diameter to the main bars (4.10.3, from memory); the exposure classification table (4.10.3.2) and fire are not checked',
  maxLappedBar: Infinity,
};
