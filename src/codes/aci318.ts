/**
 * ACI 318-19 and ACI 318-14 design bases. The two editions differ here only in the strain that
 * ends the transition zone: εty + 0.003 (318-19 Table 21.2.2) against 0.005 (318-14 Table 21.2.2).
 */
import { ACI_318_14_RULES, ACI_318_19_RULES } from './rulebooks.js';
import { ACI_318_14_SLENDERNESS, ACI_318_19_SLENDERNESS } from './slenderness-aci318.js';
import { elasticPlasticSteel } from '../materials/elastic-plastic-steel.js';
import { rectangularBlock } from '../materials/rectangular-block.js';
import { stressToMPa, type UnitSystem } from '../units/index.js';
import { bresslerBiaxialExponent } from './biaxial-exponent.js';
import type { RuleDef } from './rules.js';
import type { SlendernessMethod } from './slenderness.js';
import type { Basis, BasisInput, CodeId, ColumnUse, DesignCode, DetailingRules, ResistanceModel, StrainClass, StrainProfile } from './types.js';

/** ACI 318-19 22.2.2.1: maximum usable strain at the extreme concrete compression fibre. */
export const ACI_EPS_CU = 0.003;

/** ACI 318-19 20.2.2.2: Es = 29,000,000 psi (US) or 200,000 MPa (SI). */
export const aciSteelModulus = (units: UnitSystem): number => (units === 'us' ? 29_000 : 200_000);

/** ACI 318-19 Table 22.2.2.4.3: β1 from f′c, in psi units (fc given in ksi) or MPa units. */
export function aciBeta1(fc: number, units: UnitSystem): number {
  const beta = units === 'us' ? 0.85 - (0.05 * (fc - 4)) / 1 : 0.85 - (0.05 * (fc - 28)) / 7;
  return Math.min(0.85, Math.max(0.65, beta));
}

/** ACI 318-19 22.4.2.1 caps fy in Po at 80,000 psi (550 MPa). */
export const aciPoYieldCap = (units: UnitSystem): number => (units === 'us' ? 80 : 550);

/** ACI 318-19 Table 21.2.2: φ from εt, linear between εty and the tension-controlled limit. */
export function aciPhi(epsT: number, epsTy: number, epsTension: number, phiCompression: number): number {
  if (epsT <= epsTy) return phiCompression;
  if (epsT >= epsTension) return 0.9;
  return phiCompression + ((0.9 - phiCompression) * (epsT - epsTy)) / (epsTension - epsTy);
}

interface Edition {
  id: CodeId;
  title: string;
  /** tension-controlled limit strain given εty */
  tensionLimit(epsTy: number): number;
  tensionLimitText: string;
  clause: string;
  /** Table 20.2.2.4(a): maximum fy of longitudinal column bars by use, ksi (from memory) */
  fyMaxKsi: Record<ColumnUse, number>;
  /** what the special-seismic limit covers, in the edition's words (Table 20.2.2.4(a), from memory) */
  seismicWhat: string;
  /** the edition's rulebook for slender columns and its list of rules */
  slenderness: SlendernessMethod;
  rules: readonly RuleDef[];
}

/** ksi → MPa as the SI editions round the grades: 60 → 420, 80 → 550, 100 → 690. */
const GRADE_MPA: Record<number, number> = { 60: 420, 80: 550, 100: 690 };

const EDITIONS: Record<'aci318-19' | 'aci318-14', Edition> = {
  'aci318-19': {
    id: 'aci318-19',
    title: 'ACI 318-19',
    tensionLimit: (epsTy) => epsTy + 0.003,
    tensionLimitText: 'εty + 0.003',
    clause: 'ACI 318-19 Table 21.2.2',
    // Table 20.2.2.4(a) (from memory): Grade 100 in gravity columns; special moment frames and special walls Grade 80
    fyMaxKsi: { gravity: 100, 'special-seismic': 80 },
    // Table 20.2.2.4(a) (from memory): special moment frames Grade 80; special structural walls allow Grade 100,
    // so the 80 ksi limit is the frames' (conservative for a wall boundary element, which is not what pmchart checks)
    seismicWhat: 'longitudinal bars of special moment frames (special structural walls allow up to 100 ksi / 690 MPa there; pmchart applies the frame limit)',
    slenderness: ACI_318_19_SLENDERNESS,
    rules: ACI_318_19_RULES,
  },
  'aci318-14': {
    id: 'aci318-14',
    title: 'ACI 318-14',
    tensionLimit: () => 0.005,
    tensionLimitText: '0.005',
    clause: 'ACI 318-14 Table 21.2.2',
    // Table 20.2.2.4(a) (from memory): 80 ksi for longitudinal column bars; 20.2.2.5: A706 Grade 60 in special seismic systems
    fyMaxKsi: { gravity: 80, 'special-seismic': 60 },
    seismicWhat: 'longitudinal bars of special moment frames and special structural walls (20.2.2.5: ASTM A706 Grade 60)',
    slenderness: ACI_318_14_SLENDERNESS,
    rules: ACI_318_14_RULES,
  },
};

/** Symbols of ACI 318 (Chapter 2 notation): f′c, fy; φ on the nominal strengths. */
export const ACI_SYMBOLS = {
  nominalAxial: 'Pn',
  nominalMoment: 'Mn',
  designAxial: 'φPn',
  designMoment: 'φMn',
  designFamily: 'φ-factored',
  nominalFamily: 'nominal',
  normalisingStress: 'f′c',
  concreteStrength: 'f′c',
  steelStrength: 'fy',
} as const;

function makeAci(edition: Edition): DesignCode {
  return {
    id: edition.id,
    title: edition.title,
    unitSystems: ['us', 'si'],
    symbols: ACI_SYMBOLS,
    limits: (units) =>
      units === 'us'
        ? { fc: [2.5, 20], fy: [40, 100] }
        : { fc: [17, 140], fy: [280, 690] },
    yieldLimit: (units, use) => yieldLimitOf(edition, units, use),
    resolve: (input: BasisInput): Basis => resolveAci(edition, input),
  };
}

function yieldLimitOf(edition: Edition, units: UnitSystem, use: ColumnUse): { max: number; rule: string } {
  const ksi = edition.fyMaxKsi[use];
  const max = units === 'us' ? ksi : GRADE_MPA[ksi]!;
  const what = use === 'gravity' ? 'longitudinal bars of columns outside special seismic systems' : edition.seismicWhat;
  return { max, rule: `the ${edition.title} limit fy ≤ ${max} ${units === 'us' ? 'ksi' : 'MPa'} for ${what} (Table 20.2.2.4(a), from memory)` };
}

function resolveAci(edition: Edition, input: BasisInput): Basis {
  const { units, fc, fy, transverse } = input;
  const Es = aciSteelModulus(units);
  const beta1 = aciBeta1(fc, units);
  const epsTy = fy / Es; // ACI 318-19 21.2.2.1
  const epsTc = edition.tensionLimit(epsTy);
  const phiC = transverse === 'spiral' ? 0.75 : 0.65; // Table 21.2.2
  const capRatio = transverse === 'spiral' ? 0.85 : 0.8; // 22.4.2.1
  const concrete = rectangularBlock(0.85 * fc, beta1, ACI_EPS_CU, `0.85·f′c block over a = β1·c, β1 = ${beta1.toFixed(3)}`);
  const steel = elasticPlasticSteel(fy, Es);
  const squash = { concreteStress: 0.85 * fc, steelStress: Math.min(fy, aciPoYieldCap(units)) };
  const nominal: ResistanceModel = {
    label: 'nominal',
    concrete,
    steel,
    factor: () => 1,
    squash,
    capFactor: () => capRatio,
  };
  const design: ResistanceModel = {
    label: 'φ-factored',
    concrete,
    steel,
    factor: (epsT) => aciPhi(epsT, epsTy, epsTc, phiC),
    squash,
    capFactor: () => phiC * capRatio,
  };
  const fcMPa = stressToMPa(fc, units);
  const su = units === 'us' ? 'ksi' : 'MPa';
  return {
    code: edition.id,
    title: edition.title,
    units,
    fc,
    fy,
    Es,
    transverse,
    profile: (c: number, h: number): StrainProfile => aciProfile(c, h),
    nominal,
    design,
    strainStates: [
      { id: 'decompression', label: 'εt = 0', epsT: 0 },
      { id: 'balanced', label: 'εt = εty (balanced)', epsT: epsTy },
      { id: 'tension-controlled', label: `εt = ${edition.tensionLimitText} (tension-controlled limit)`, epsT: epsTc },
    ],
    classify: (epsT: number): StrainClass =>
      epsT <= epsTy ? 'compression-controlled' : epsT >= epsTc ? 'tension-controlled' : 'transition',
    normalisingStress: fc,
    symbols: ACI_SYMBOLS,
    rhoLimits: { min: 0.01, max: 0.08 }, // 10.6.1.1
    steelAreaLimits: (_p: number, ag: number) => ({ min: 0.01 * ag, max: 0.08 * ag }), // 10.6.1.1
    minimumMoment: () => 0, // no minimum eccentricity for short columns; the cap 22.4.2.1 stands in for it
    // 6.6.4.5.4 M2,min = Pu(0.6 + 0.03h) in. (318-19; the same clause number in 318-14 from memory); 22.2.1, 22.2.2 strain compatibility
    checkClauses: { slenderMinimumMoment: '6.6.4.5.4', sectionAnalysis: '22.2.1, 22.2.2' },
    // 25.2.3: clear spacing ≥ max(1.5 in, 1.5·db, 4/3·dagg) for columns; ACI 318M's SI floor is 40 mm (from memory; 38 mm, the plain conversion, would accept what 318M refuses)
    minimumClearSpacing: (db: number, dg: number) => Math.max(units === 'us' ? 1.5 : 40, 1.5 * db, (4 / 3) * dg),
    // 10.7.3.1 (from memory): four within rectangular or circular ties, six enclosed by spirals
    minimumBarCount: () => (transverse === 'spiral' ? 6 : 4),
    minimumBarRule: `at least ${transverse === 'spiral' ? 6 : 4} bars (${edition.title} 10.7.3.1, from memory)`,
    clearSpacingRule: `clear spacing ≥ max(${units === 'us' ? '1.5 in' : '40 mm'}, 1.5·db, 4/3·aggregate) (${edition.title} 25.2.3)`,
    barSet: units === 'us' ? 'astm-a615' : 'astm-a615m', // ACI in SI: ASTM A615M soft-metric sizes
    factorSummary: `φ ${phiC}–0.90 by εt (${edition.clause}) · Pn,max ${capRatio}·Po (22.4.2.1)`,
    parameters: {
      'β1': Number(beta1.toFixed(4)),
      'εcu': ACI_EPS_CU,
      Es: Es,
      'εty': Number(epsTy.toFixed(6)),
      'tension-controlled εt': Number(epsTc.toFixed(6)),
      'φ (compression-controlled)': phiC,
      'Pn,max / Po': capRatio,
      'fy in Po': squash.steelStress,
    },
    biaxialExponent: bresslerBiaxialExponent,
    slenderness: edition.slenderness,
    rules: edition.rules,
    detailing: aciDetailing(edition.id as 'aci318-19' | 'aci318-14', units, input.options?.columnUse ?? 'gravity'),
    notes: [
      `Equivalent rectangular stress block 0.85·f′c over a = β1·c, β1 = ${beta1.toFixed(3)} (${edition.title} 22.2.2.4, Table 22.2.2.4.3); concrete tensile strength neglected (22.2.2.2).`,
      `Extreme-fibre concrete strain εcu = 0.003 (22.2.2.1); plane sections (22.2.1.2).`,
      `Reinforcement elastic–perfectly plastic, Es = ${Es} ${su} (20.2.2.1, 20.2.2.2); εty = fy/Es = ${epsTy.toFixed(5)}.`,
      `Displaced concrete is deducted for bars inside the stress block, so a curve steps slightly where a bar row enters the block; moments are taken about the gross-section centroid.`,
      `φ per ${edition.clause}: ${phiC} (${transverse}) for εt ≤ εty, 0.90 for εt ≥ ${edition.tensionLimitText}, linear between.`,
      `Axial cap Pn,max = ${capRatio}·Po (22.4.2.1) with Po = 0.85·f′c·(Ag − Ast) + fy·Ast (22.4.2.2), fy in Po ≤ ${aciPoYieldCap(units)} ${su}.`,
      `Pure compression is one value: the nominal curve ends at Po (22.4.2.2), as do the tables and key points.${
        fy > aciPoYieldCap(units)
          ? ` Here fy = ${fy} ${su} > ${aciPoYieldCap(units)} ${su}: strain compatibility at a uniform εcu = 0.003 would put the bars at ${fmt(Math.min(fy, ACI_EPS_CU * Es))} ${su}, more than Po counts (22.4.2.2), so the curve is held at Po.`
          : ''
      }`,
      `Column steel 0.01·Ag ≤ Ast ≤ 0.08·Ag (10.6.1.1). f′c = ${fc} ${su} (${fcMPa.toFixed(1)} MPa).`,
      `Bar grade: ${yieldLimitOf(edition, units, input.options?.columnUse ?? 'gravity').rule}; use: ${input.options?.columnUse ?? 'gravity'} columns.`,
    ],
  };
}

/** ACI 318-19 22.2.1.2 and 22.2.2.1: plane strain with εcu = 0.003 at the extreme compression fibre. */
export function aciProfile(c: number, _h: number): StrainProfile {
  if (!Number.isFinite(c)) return { top: ACI_EPS_CU, curvature: 0 };
  return { top: ACI_EPS_CU, curvature: ACI_EPS_CU / c };
}

const fmt = (x: number): string => String(Number(x.toPrecision(4)));

export const ACI_318_19: DesignCode = makeAci(EDITIONS['aci318-19']);
export const ACI_318_14: DesignCode = makeAci(EDITIONS['aci318-14']);

// ───────────────────────────── detailing (issue 19) ─────────────────────────────

/** The cover table of each edition: 318-19 moved the durability chapter's cover table to 20.6 (ACI 318-19 Table 20.6.1.3.1; 318-14 Table 20.5.1.3.1). */
const ACI_COVER_TABLE: Record<'aci318-19' | 'aci318-14', string> = { 'aci318-19': 'Table 20.6.1.3.1', 'aci318-14': 'Table 20.5.1.3.1' };

/**
 * ACI 318 detailing rules for columns (the same clause numbers in 318-14 and 318-19, but the cover table):
 * 10.6.1.1 0.01·Ag ≤ Ast ≤ 0.08·Ag; 10.3.1.2 a reduced effective area ≥ Ag/2 for a column larger than the
 * loads need (not for special moment frames); R10.6.1.1 about 0.04 where bars are lapped (a note); 25.2.3
 * clear spacing; the cover table (columns not exposed to weather or in contact with ground: 1.5 in to ties);
 * 25.5.1.1 no lap splices of bars larger than No. 11 (a note: splice them mechanically or by welding).
 */
function aciDetailing(id: 'aci318-19' | 'aci318-14', units: UnitSystem, use: ColumnUse): DetailingRules {
  const us = units === 'us';
  return {
    rules: [
      { id: 'steel-min', clause: '10.6.1.1', title: 'Ast ≥ 0.01·Ag', source: 'published', binding: true },
      { id: 'steel-max', clause: '10.6.1.1', title: 'Ast ≤ 0.08·Ag', source: 'published', binding: true },
      { id: 'steel-max-lap', clause: 'R10.6.1.1', title: 'about 0.04·Ag where bars are lap spliced', source: 'from memory', binding: false },
      { id: 'clear-spacing', clause: '25.2.3', title: 'clear spacing ≥ max(1.5 in, 1.5·db, 4/3·dagg)', source: 'published', binding: true },
      { id: 'cover', clause: ACI_COVER_TABLE[id], title: 'specified cover 1.5 in to ties, columns not exposed to weather or in contact with ground', source: 'published', binding: true },
      { id: 'bar-size-lap', clause: '25.5.1.1', title: 'no lap splices of bars larger than No. 11', source: 'from memory', binding: false },
    ],
    // 10.3.1.2: not for columns of special moment frames
    ...(use === 'gravity' ? { reducedAreaShare: 0.5 } : {}),
    lapZoneRho: 0.04,
    defaultAggregate: us ? 0.75 : 19, // 3/4 in (19 mm) maximum aggregate, common practice
    // the cover table: 1.5 in; 40 mm in SI (ACI 318M, from memory)
    minimumCover: () => (us ? 1.5 : 40),
    coverAssumption: `${us ? '1.5 in' : '40 mm'} to the ties: columns not exposed to weather or in contact with ground (${ACI_COVER_TABLE[id]}); other exposures and fire need more and are not checked`,
    // No. 11 (1.41 in) and #36 (A615M, 35.8 mm) are the largest lapped sizes
    maxLappedBar: us ? 1.41 : 35.8,
  };
}
