/**
 * EN 1992-1-1:2004 (Eurocode 2) design basis for column sections.
 *
 * There is no separate φ: the design family uses the design strengths fcd = αcc·fck/γc (3.1.6(1))
 * and fyd = fyk/γs (3.2.7(2)), so its factor is 1. The "nominal" family is the characteristic-strength
 * family (γc = γs = 1, αcc kept). Strain limits follow 6.1(5) and Fig. 6.1; there is no axial cap
 * because pure compression is already limited to the uniform strain εc2.
 *
 * EN 1992-1-1 is an SI code: the basis accepts `units: 'si'` only (N, mm, MPa).
 */
import { EN_1992_RULES } from './rulebooks.js';
import { EN_1992_SLENDERNESS } from './slenderness-en1992.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { elasticPlasticSteel } from '../materials/elastic-plastic-steel.js';
import { inclinedBranchSteel } from '../materials/inclined-branch-steel.js';
import { parabolaRectangle } from '../materials/parabola-rectangle.js';
import { rectangularBlock } from '../materials/rectangular-block.js';
import { yieldClass } from './strain-class.js';
import type { ConcreteLaw, SteelLaw } from '../materials/types.js';
import { en1992BiaxialExponent } from './biaxial-exponent.js';
import type { Basis, BasisInput, DesignCode, DetailingRules, ResistanceModel, StrainProfile } from './types.js';

/** EN 1992-1-1 3.2.7(4): design value of the modulus of elasticity of reinforcing steel, MPa. */
export const EC2_STEEL_MODULUS = 200_000;

/** Recommended values (EN 1992-1-1 2.4.2.4 Table 2.1N, 3.1.6(1)); each National Annex may set its own. */
export const EC2_RECOMMENDED = { alphaCc: 1.0, gammaC: 1.5, gammaS: 1.15 } as const;

/** Reinforcement ductility class B (EN 1992-1-1 Annex C, Table C.1): k ≥ 1.08, εuk ≥ 5.0 %. */
export const EC2_CLASS_B = { k: 1.08, epsUk: 0.05 } as const;
/** k = (ft/fy)k and εuk over reinforcement classes A–C (EN 1992-1-1 Annex C, Table C.1). */
export const STEEL_K_RANGE = [1.0, 1.35] as const;
export const STEEL_EPS_UK_RANGE = [0.025, 0.15] as const;

/** EN 1992-1-1 3.2.7(2) Note 1: recommended εud = 0.9·εuk. */
export const EC2_EPS_UD_RATIO = 0.9;

export interface Ec2ConcreteParameters {
  /** strain at reaching the maximum strength, parabola–rectangle (Table 3.1) */
  epsC2: number;
  /** ultimate strain, parabola–rectangle (Table 3.1) */
  epsCu2: number;
  /** exponent of the parabola (Table 3.1) */
  n: number;
  /** strain at reaching the maximum strength, bilinear law (Table 3.1) */
  epsC3: number;
  /** ultimate strain, bilinear law (Table 3.1); equal to εcu2 */
  epsCu3: number;
  /** rectangular block depth factor (3.1.7(3), Eq. 3.19–3.20) */
  lambda: number;
  /** rectangular block strength factor (3.1.7(3), Eq. 3.21–3.22) */
  eta: number;
}

/**
 * Strain and block parameters of EN 1992-1-1 Table 3.1 and 3.1.7(3) for fck in MPa (C12/15 … C90/105).
 * The fck > 50 formulas give εcu2 = 3.496 ‰ and n = 1.999 at fck = 50, against the tabulated 3.5 ‰ and 2.0,
 * so the parameters are continuous there to the table's rounding.
 */
export function ec2ConcreteParameters(fck: number): Ec2ConcreteParameters {
  if (fck <= 50) {
    return { epsC2: 0.002, epsCu2: 0.0035, n: 2, epsC3: 0.00175, epsCu3: 0.0035, lambda: 0.8, eta: 1 };
  }
  const r4 = Math.pow((90 - fck) / 100, 4);
  const epsCu2 = (2.6 + 35 * r4) / 1000;
  return {
    epsC2: (2.0 + 0.085 * Math.pow(fck - 50, 0.53)) / 1000,
    epsCu2,
    n: 1.4 + 23.4 * r4,
    epsC3: (1.75 + (0.55 * (fck - 50)) / 40) / 1000,
    epsCu3: epsCu2,
    lambda: 0.8 - (fck - 50) / 400,
    eta: 1.0 - (fck - 50) / 200,
  };
}

/**
 * Strain profile of EN 1992-1-1 6.1(5) and Fig. 6.1 for neutral-axis depth c in a section of depth h.
 *   x ≤ h: εcu2 at the compression face (pivot B);
 *   x > h: rotation about εc2 at depth (1 − εc2/εcu2)·h (pivot C); x = ∞: uniform εc2.
 * With a steel strain limit εud (inclined branch), the tension steel at depth dt is held at εud (pivot A)
 * when εcu2 at the face would strain it further. Region 1 of Fig. 6.1 (neutral axis above the section,
 * the whole section in tension) has no c ≥ 0; it is reached by rotating about pivot A for
 * c < PIVOT_A_BLEND·dt, from the uniform-tension profile −εud (c → 0) to the pivot-A profile at that depth.
 */
export function ec2Profile(
  c: number,
  h: number,
  limits: { epsC2: number; epsCu2: number; epsUd: number },
  tensionDepth = h,
): StrainProfile {
  const { epsC2, epsCu2, epsUd } = limits;
  if (!Number.isFinite(c)) return { top: epsC2, curvature: 0 };
  if (c > h) {
    const pivot = (1 - epsC2 / epsCu2) * h;
    const curvature = epsC2 / (c - pivot);
    return { top: curvature * c, curvature };
  }
  const dt = tensionDepth;
  const cAB = (dt * epsCu2) / (epsCu2 + epsUd); // εcu2 at the face and εud at dt together
  if (!Number.isFinite(epsUd) || c >= cAB) return { top: epsCu2, curvature: epsCu2 / c };
  const pivotA = (x: number): StrainProfile => ({ top: (epsUd * x) / (dt - x), curvature: epsUd / (dt - x) });
  const blend = PIVOT_A_BLEND * dt;
  if (c >= blend) return pivotA(c);
  const s = Math.max(0, c) / blend;
  const end = pivotA(blend);
  return { top: -epsUd * (1 - s) + end.top * s, curvature: end.curvature * s };
}

/** Fraction of dt below which the pivot-A profile turns into region 1 of Fig. 6.1 (see ec2Profile). */
export const PIVOT_A_BLEND = 1e-3;

function rejectUnits(units: string): never {
  throw new PmError(ERROR_CODES.invalidValue, 'units', 'is not available for EN 1992-1-1, an SI code', { value: units, allowed: 'si' });
}

/** Symbols of EN 1992-1-1 (1.6): characteristic strengths fck, fyk; ν and μ as customary on European design charts (common practice). */
export const EC2_SYMBOLS = {
  nominalAxial: 'NRk',
  nominalMoment: 'MRk',
  designAxial: 'NRd',
  designMoment: 'MRd',
  designFamily: 'design',
  nominalFamily: 'characteristic',
  normalisingStress: 'fcd',
  concreteStrength: 'fck',
  steelStrength: 'fyk',
  dimensionlessAxial: 'ν',
  dimensionlessMoment: 'μ',
  // EN 1992-1-1 has no strain-controlled φ: the class only says whether the tension steel has yielded (3.2.7)
  strainClassWords: { 'compression-controlled': 'steel below fyd', transition: 'steel below fyd', 'tension-controlled': 'steel at fyd' },
  actionAxial: 'NEd',
  actionMoment: 'MEd',
  firstOrderMoment: 'M0Ed',
  secondOrderMoment: 'MEd',
} as const;

export const EN_1992_1_1: DesignCode = {
  id: 'en1992-1-1',
  title: 'EN 1992-1-1:2004',
  unitSystems: ['si'],
  symbols: EC2_SYMBOLS,
  // Table 3.1 covers C12/15 to C90/105; 3.2.2(3) covers fyk = 400 to 600 MPa.
  limits: () => ({ fc: [12, 90], fy: [400, 600] }),
  namedStrength: ec2NamedStrength,
  resolve: (input: BasisInput): Basis => resolveEc2(input),
};

/** EN 1992-1-1 Table 3.1 strength classes C12/15 … C90/105 (fck/fck,cube). */
export const EC2_STRENGTH_CLASSES: readonly (readonly [number, number])[] = [
  [12, 15], [16, 20], [20, 25], [25, 30], [30, 37], [35, 45], [40, 50], [45, 55], [50, 60], [55, 67], [60, 75], [70, 85], [80, 95], [90, 105],
];

/**
 * "C50/60" → fck = 50 MPa when the pair is a class of Table 3.1; "B500B" (B500A, B500C, B450C …) → fyk in
 * MPa from the grade name (designations as in EN 10080 practice, common practice; the ductility letter
 * A/B/C is Annex C's class and does not change fyk). A C-name outside Table 3.1: NaN. Anything else: undefined.
 */
export function ec2NamedStrength(text: string, kind: 'concrete' | 'steel'): number | undefined {
  if (kind === 'concrete') {
    const m = /^C\s*(\d+)\s*\/\s*(\d+)$/i.exec(text);
    if (!m) return undefined;
    const [fck, cube] = [Number(m[1]), Number(m[2])];
    const known = EC2_STRENGTH_CLASSES.some(([a, b]) => a === fck && b === cube);
    return known ? fck : NaN;
    return fck;
  }
  const m = /^B\s*(\d{3})\s*[ABC]?$/i.exec(text);
  return m ? Number(m[1]) : undefined;
}

function resolveEc2(input: BasisInput): Basis {
  const { units, fc: fck, fy: fyk, transverse } = input;
  if (units !== 'si') rejectUnits(units);
  const o = input.options ?? {};
  const alphaCc = requireInRange('alphaCc', o.alphaCc ?? EC2_RECOMMENDED.alphaCc, 0.8, 1.0); // 3.1.6(1) Note
  const gammaC = requireInRange('gammaC', o.gammaC ?? EC2_RECOMMENDED.gammaC, 1.0, 2.0);
  const gammaS = requireInRange('gammaS', o.gammaS ?? EC2_RECOMMENDED.gammaS, 1.0, 1.5);
  const lawName = o.concreteLaw ?? 'parabola-rectangle';
  const branch = o.steelBranch ?? 'horizontal';
  const k = requireInRange('steelK', o.steelK ?? EC2_CLASS_B.k, ...STEEL_K_RANGE); // Table C.1 classes A–C
  const epsUk = requireInRange('steelEpsUk', o.steelEpsUk ?? EC2_CLASS_B.epsUk, ...STEEL_EPS_UK_RANGE);
  const lapMax = o.lapZoneRhoMax === undefined ? undefined : requireInRange('lapZoneRhoMax', o.lapZoneRhoMax, 0.04, 0.08); // 9.5.2(3)
  const rhoMax = lapMax ?? 0.04;
  const epsUd = branch === 'inclined' ? EC2_EPS_UD_RATIO * epsUk : Infinity; // 3.2.7(2)b: no limit on the horizontal branch

  const Es = EC2_STEEL_MODULUS;
  const t = ec2ConcreteParameters(fck);
  const fcd = (alphaCc * fck) / gammaC; // 3.1.6(1), Eq. 3.15
  const fyd = fyk / gammaS; // 3.2.7(2), Fig. 3.8
  const epsYd = fyd / Es;

  const concreteLaw = (fc: number): ConcreteLaw =>
    lawName === 'rectangular-block'
      ? rectangularBlock(t.eta * fc, t.lambda, t.epsCu2, `rectangular block η·fcd over λ·x, η = ${fmt(t.eta)}, λ = ${fmt(t.lambda)} (3.1.7(3))`)
      : parabolaRectangle(fc, t.epsC2, t.n, `parabola–rectangle εc2 = ${fmt(t.epsC2 * 1000)} ‰, εcu2 = ${fmt(t.epsCu2 * 1000)} ‰, n = ${fmt(t.n)} (3.1.7(1))`);
  const steelLaw = (fy: number): SteelLaw =>
    branch === 'inclined'
      ? inclinedBranchSteel(fy, Es, k, epsUk, epsUd, `inclined top branch k = ${k}, εuk = ${epsUk}, εud = ${fmt(epsUd)} (3.2.7(2)a)`)
      : elasticPlasticSteel(fy, Es, `horizontal top branch, Es = ${Es} MPa (3.2.7(2)b)`);

  const model = (label: string, fc: number, fy: number): ResistanceModel => {
    const concrete = concreteLaw(fc);
    const steel = steelLaw(fy);
    return {
      label,
      concrete,
      steel,
      factor: () => 1,
      // Fig. 6.1 pivot C: at pure compression the whole section sits at εc2, so the steel stress is σs(εc2).
      squash: { concreteStress: concrete.stress(t.epsC2), steelStress: steel.stress(t.epsC2) },
      capFactor: () => Infinity,
    };
  };
  const nominal = model('characteristic (γc = γs = 1)', alphaCc * fck, fyk);
  const design = model(`design (γc = ${gammaC}, γs = ${gammaS})`, fcd, fyd);

  const nonDefault: string[] = [];
  if (alphaCc !== EC2_RECOMMENDED.alphaCc) nonDefault.push(`αcc = ${alphaCc}`);
  if (gammaC !== EC2_RECOMMENDED.gammaC) nonDefault.push(`γc = ${gammaC}`);
  if (gammaS !== EC2_RECOMMENDED.gammaS) nonDefault.push(`γs = ${gammaS}`);

  const lawParams: Record<string, number | string> =
    lawName === 'rectangular-block' ? { 'λ': r4(t.lambda), 'η': r4(t.eta) } : { n: r4(t.n) };
  const steelParams: Record<string, number | string> = branch === 'inclined' ? { k, 'εuk': epsUk, 'εud': r6(epsUd) } : {};

  return {
    code: 'en1992-1-1',
    title: 'EN 1992-1-1:2004',
    units,
    fc: fck,
    fy: fyk,
    Es,
    transverse,
    profile: (c: number, h: number, tensionDepth?: number): StrainProfile =>
      ec2Profile(c, h, { epsC2: t.epsC2, epsCu2: t.epsCu2, epsUd }, tensionDepth ?? h),
    nominal,
    design,
    strainStates: [
      { id: 'decompression', label: 'εs = 0', epsT: 0 },
      { id: 'balanced', label: 'εs = εyd (balanced)', epsT: epsYd },
    ],
    classify: yieldClass(epsYd),
    normalisingStress: fcd,
    symbols: EC2_SYMBOLS,
    rhoLimits: { min: 0.002, max: rhoMax }, // 9.5.2(2), (3) recommended values
    // 9.5.2(2): As,min = max(0.10·NEd/fyd, 0.002·Ac); 9.5.2(3): As,max = 0.04·Ac outside laps, 0.08·Ac at laps.
    steelAreaLimits: (NEd: number, Ac: number) => ({ min: Math.max((0.1 * Math.max(0, NEd)) / fyd, 0.002 * Ac), max: rhoMax * Ac }),
    // 6.1(4): e0 = max(h/30, 20 mm) for compression; N in N, h in mm, moment in N·mm.
    minimumMoment: (NEd: number, h: number) => Math.max(0, NEd) * Math.max(h / 30, 20),
    // 6.1(4) e0 = max(h/30, 20 mm); a slender column adds the imperfection ei of 5.2(7) (5.8.8.2); 6.1(2) section analysis
    checkClauses: { minimumMoment: '6.1(4)', slenderMinimumMoment: '6.1(4), 5.2(7)', sectionAnalysis: '6.1(2)' },
    // 8.2(2): clear distance ≥ max(k1·φ, dg + k2, 20 mm), recommended k1 = 1, k2 = 5 mm.
    minimumClearSpacing: (db: number, dg: number) => Math.max(db, dg > 0 ? dg + 5 : 0, 20),
    // 9.5.2(4): a bar in each corner of a polygonal section (4 in a rectangle); at least four in a circular column
    minimumBarCount: () => 4,
    minimumBarRule: 'a bar in each corner of a rectangle, at least 4 bars in a circular column (9.5.2(4))',
    clearSpacingRule: 'clear spacing ≥ max(k1·φ, dg + k2, 20 mm) with the recommended k1 = 1, k2 = 5 mm (8.2(2))',
    barSet: 'en-common',
    factorSummary: `αcc ${alphaCc} · γc ${gammaC} · γs ${gammaS} (${nonDefault.length > 0 ? 'not all recommended: check the NA' : 'recommended'})`,
    biaxialExponent: en1992BiaxialExponent, // 5.8.9(4) Eq. 5.39
    biaxialReferenceLoad: (Ac: number, As: number) => Ac * fcd + As * fyd, // 5.8.9(4): NRd = Ac·fcd + As·fyd
    slenderness: EN_1992_SLENDERNESS, // 5.8.8
    rules: EN_1992_RULES,
    detailing: EC2_DETAILING,
    parameters: {
      fcd: r4(fcd),
      fyd: r4(fyd),
      'αcc': alphaCc,
      'γc': gammaC,
      'γs': gammaS,
      'εc2': r6(t.epsC2),
      'εcu2': r6(t.epsCu2),
      ...lawParams,
      Es,
      'εyd': r6(epsYd),
      'concrete law': lawName,
      'steel branch': branch,
      ...steelParams,
    },
    notes: [
      `Design strengths fcd = αcc·fck/γc = ${fmt(fcd)} MPa (3.1.6(1)) and fyd = fyk/γs = ${fmt(fyd)} MPa (3.2.7(2)); no separate φ.`,
      nonDefault.length > 0
        ? `Partial factors differ from the recommended values (αcc = 1.0, γc = 1.5, γs = 1.15): ${nonDefault.join(', ')}; check them against the National Annex that applies.`
        : `Recommended partial factors αcc = 1.0, γc = 1.5, γs = 1.15 (2.4.2.4 Table 2.1N, 3.1.6(1)); National Annexes may set other values.`,
      lawName === 'rectangular-block'
        ? `Concrete: rectangular block η·fcd over λ·x with λ = ${fmt(t.lambda)}, η = ${fmt(t.eta)} (3.1.7(3)), strain limits εcu2 and εc2 as for the parabola–rectangle law; the 10 % reduction of η·fcd for compression zones that narrow toward the extreme fibre (circles) is not applied; use the parabola–rectangle law for circular sections.`
        : `Concrete: parabola–rectangle with εc2 = ${fmt(t.epsC2 * 1000)} ‰, εcu2 = ${fmt(t.epsCu2 * 1000)} ‰, n = ${fmt(t.n)} (3.1.7(1), Table 3.1); tensile strength neglected (6.1(2)).`,
      `Strain limits per 6.1(5) and Fig. 6.1: εcu2 at the compression face while x ≤ h; for x > h the profile pivots about εc2 at (1 − εc2/εcu2)·h, so pure compression is a uniform εc2 (${
        design.squash.steelStress < fyd * (1 - 1e-9)
          ? `steel stress σs(εc2) = Es·εc2 = ${fmt(design.squash.steelStress)} MPa, below fyd = ${fmt(fyd)} MPa`
          : `εc2 = ${fmt(t.epsC2 * 1000)} ‰ ≥ εyd = ${fmt(epsYd * 1000)} ‰, so the steel has yielded: σs(εc2) = ${fmt(design.squash.steelStress)} MPa${branch === 'inclined' ? ' on the inclined branch' : ' = fyd'}`
      }).`,
      branch === 'inclined'
        ? `Reinforcement: inclined top branch to k·fyd at εuk, k = ${k}, εuk = ${epsUk}, limited to εud = 0.9·εuk = ${fmt(epsUd)} (3.2.7(2)a, pivot A of Fig. 6.1), Es = ${Es} MPa.`
        : `Reinforcement: horizontal top branch at fyd, no strain limit (3.2.7(2)b), Es = ${Es} MPa (3.2.7(4)).`,
      `Displaced concrete is deducted for bars in compressed concrete; moments about the gross-section centroid.`,
      `Normalisation ν = NRd/(b·h·fcd), μ = MRd/(b·h²·fcd); the characteristic family NRk, MRk (γc = γs = 1) is normalised by the same fcd.`,
      lapMax === undefined
        ? `Longitudinal steel As,min = max(0.10·NEd/fyd, 0.002·Ac), As,max = 0.04·Ac outside laps (9.5.2(2), (3), recommended values).`
        : `Lap zone: As,max = ${lapMax}·Ac at laps (9.5.2(3); 0.08 recommended); As,min = max(0.10·NEd/fyd, 0.002·Ac) (9.5.2(2)).`,
      `Minimum eccentricity e0 = max(h/30, 20 mm) (6.1(4)): MEd is raised to NEd·e0 where smaller. Second-order effects (5.8) are not included.`,
    ],
  };
}

const fmt = (x: number): string => String(Number(x.toPrecision(4)));
const r4 = (x: number): number => Number(x.toFixed(4));
const r6 = (x: number): number => Number(x.toFixed(6));

// ───────────────────────────── detailing (issue 19) ─────────────────────────────

/**
 * EN 1992-1-1 detailing rules for columns, recommended values: 9.5.2(2) As,min = max(0.10·NEd/fyd, 0.002·Ac);
 * 9.5.2(3) As,max = 0.04·Ac outside laps, 0.08·Ac at laps (so bars lapped at one level flag above 0.04);
 * 8.2(2) clear distance ≥ max(k1·φ, dg + k2, 20 mm); 4.4.1.2(3) Table 4.2 cmin,b = φ of the bar (the link's
 * cover ≥ φlink, and cover + φlink ≥ φ of the main bar), with 4.4.1.2(2)'s 10 mm floor; 8.8 bars above
 * φlarge = 32 mm (recommended) are not lapped (a note).
 */
const EC2_DETAILING: DetailingRules = {
  rules: [
    { id: 'steel-min', clause: '9.5.2(2)', title: 'As,min = max(0.10·NEd/fyd, 0.002·Ac)', source: 'published', binding: true },
    { id: 'steel-max', clause: '9.5.2(3)', title: 'As,max = 0.04·Ac outside laps (0.08·Ac at laps)', source: 'published', binding: true },
    { id: 'steel-max-lap', clause: '9.5.2(3)', title: 'As,max = 0.08·Ac at laps: bars lapped at one level, 0.04·Ac between laps', source: 'published', binding: false },
    { id: 'clear-spacing', clause: '8.2(2)', title: 'clear distance ≥ max(k1·φ, dg + k2, 20 mm), k1 = 1, k2 = 5 mm', source: 'published', binding: true },
    { id: 'cover', clause: '4.4.1.2(3)', title: 'cmin,b = bar diameter (Table 4.2), at least 10 mm', source: 'from memory', binding: true },
    { id: 'bar-size-lap', clause: '8.8', title: 'bars larger than φlarge = 32 mm are not lapped', source: 'from memory', binding: false },
  ],
  lapZoneRho: 0.04,
  defaultAggregate: 20, // dg = 20 mm, common practice
  minimumCover: (tie: number, bar: number) => Math.max(tie, bar - tie, 10),
  coverAssumption: 'cmin,b only: the link diameter, and the bar diameter to the main bars (4.4.1.2(3), Table 4.2), at least 10 mm; cmin,dur (exposure class, 4.4.1.2(5)) and Δcdev (4.4.1.3) are not checked',
  maxLappedBar: 32,
};
