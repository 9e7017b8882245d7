/** Spelled-out text for sheet parameters (titles, index page, file names). */
import type { BasisOptions, BasisSymbols, Transverse } from '../codes/types.js';
import { barCount } from '../section/arrangements.js';
import { faceCounts } from '../section/types.js';
import { DISPLAY_UNITS, type UnitSystem } from '../units/index.js';
import type { ResolvedShape, ResolvedSheet } from './types.js';

/** Trims float noise: 0.7500000001 → "0.75". */
/** A number in a title or a file name: up to 6 decimals, so that two sheets' values never print alike (4 and 4.0001). */
export const fmt = (x: number, digits = 6): string => String(Number(x.toFixed(digits)));
/** γ and γB with two decimals at the least (0.30, 0.75) and every further digit that tells sheets apart (0.305). */
export const gammaText = (g: number): string => (Number(g.toFixed(2)) === Number(fmt(g)) ? g.toFixed(2) : fmt(g));

export function describeShape(s: ResolvedShape): string {
  if (s.kind === 'circle') return 'circular';
  return s.aspect === 1 ? 'square' : `rectangular, b/h ${fmt(s.aspect)}`;
}

export function describeArrangement(a: ResolvedSheet['arrangement']): string {
  switch (a.kind) {
    case 'two-faces':
      return `${a.barsPerFace} bars on each of two faces`;
    case 'four-faces': {
      const [nb, nh] = faceCounts(a.barsPerFace);
      return nb === nh
        ? `${nb} bars per face on four faces (${barCount(a)} bars)`
        : `${nb} bars on each b face, ${nh} on each h face (${barCount(a)} bars)`;
    }
    case 'side-faces':
      return `${a.barsPerFace} bars on each side face`;
    case 'ring':
      return `${a.bars} bars in a ring`;
  }
}

/** Short kebab form for file names: "two-faces-4-per-face"; unequal four-faces counts "four-faces-3-on-b-5-on-h". */
export function arrangementSlug(a: ResolvedSheet['arrangement']): string {
  if (a.kind === 'ring') return `ring-${a.bars}-bars`;
  if (a.kind === 'four-faces') {
    const [nb, nh] = faceCounts(a.barsPerFace);
    return nb === nh ? `${a.kind}-${nb}-per-face` : `${a.kind}-${nb}-on-b-${nh}-on-h`;
  }
  return `${a.kind}-${a.barsPerFace}-per-face`;
}

export const describeTransverse = (t: Transverse): string => (t === 'spiral' ? 'spiral' : 'tied');

export const stressText = (v: number, units: UnitSystem): string => `${fmt(v)} ${DISPLAY_UNITS[units].stress}`;

const OPTION_TEXT: { [K in keyof Required<BasisOptions>]: [symbol: string, slug: string] } = {
  alphaCc: ['αcc', 'alphacc'],
  gammaC: ['γc', 'gammac'],
  gammaS: ['γs', 'gammas'],
  concreteLaw: ['concrete', 'concrete'],
  steelBranch: ['steel branch', 'steel'],
  steelK: ['k', 'k'],
  steelEpsUk: ['εuk', 'epsuk'],
  columnUse: ['use', 'use'],
  lapZoneRhoMax: ['lap ρmax', 'lap'],
};

/** Basis options as title text: { alphaCc: 0.85 } → "αcc 0.85"; "" for none. */
export function describeBasisOptions(o: BasisOptions): string {
  return (Object.keys(OPTION_TEXT) as (keyof BasisOptions)[])
    .filter((k) => o[k] !== undefined)
    .map((k) => `${OPTION_TEXT[k][0]} ${typeof o[k] === 'number' ? fmt(o[k]) : o[k]}`)
    .join(', ');
}

/** Basis options for file names: { alphaCc: 0.85 } → "alphacc-0.85"; "" for none. */
export function basisOptionsSlug(o: BasisOptions): string {
  return (Object.keys(OPTION_TEXT) as (keyof BasisOptions)[])
    .filter((k) => o[k] !== undefined)
    .map((k) => `${OPTION_TEXT[k][1]}-${typeof o[k] === 'number' ? fmt(o[k]) : o[k]}`)
    .join('-');
}

/** The symbols a title needs: the specified strengths (f′c/fy, or fck/fyk). */
export type TitleSymbols = Pick<BasisSymbols, 'concreteStrength' | 'steelStrength'>;

/** Values a sheet-title pattern can use. */
export function titleFields(s: Omit<ResolvedSheet, 'title' | 'fileStem'>, units: UnitSystem, family: string, symbols: TitleSymbols): Record<string, string> {
  return {
    index: String(s.index),
    shape: describeShape(s.shape),
    fcSymbol: symbols.concreteStrength,
    fySymbol: symbols.steelStrength,
    options: describeBasisOptions(s.variantOptions),
    fc: stressText(s.fc, units),
    fy: stressText(s.fy, units),
    // γB, when given, travels with γ so that every title pattern states it
    gamma: s.gammaB === undefined ? gammaText(s.gamma) : `${gammaText(s.gamma)} (γB ${gammaText(s.gammaB)})`,
    gammaB: s.gammaB === undefined ? '' : gammaText(s.gammaB),
    arrangement: describeArrangement(s.arrangement),
    transverse: describeTransverse(s.transverse),
    family,
  };
}

/** The axial level's name on biaxial sheets: ν where the basis names it (EN 1992-1-1), else P/(f′c·Ag). */
export const levelSymbol = (symbols: Pick<BasisSymbols, 'normalisingStress' | 'dimensionlessAxial'>): string => symbols.dimensionlessAxial ?? `P/(${symbols.normalisingStress}·Ag)`;

/** Appended to a biaxial sheet's title: " — Mx–My contours at P/(f′c·Ag) 0–0.3". */
export function biaxialTitlePart(s: Pick<ResolvedSheet, 'axialLevels'>, symbols: Pick<BasisSymbols, 'normalisingStress' | 'dimensionlessAxial'>): string {
  const lv = s.axialLevels ?? [];
  const range = lv.length > 1 ? `${fmt(lv[0]!)}–${fmt(lv[lv.length - 1]!)}` : fmt(lv[0] ?? 0);
  return ` — Mx–My contours at ${levelSymbol(symbols)} ${range}`;
}

/** Appended to a biaxial sheet's file stem: "-biaxial-levels-0-0.3". */
export function biaxialStemPart(s: Pick<ResolvedSheet, 'axialLevels'>): string {
  const lv = s.axialLevels ?? [];
  return `-biaxial-levels-${fmt(lv[0] ?? 0)}${lv.length > 1 ? `-to-${fmt(lv[lv.length - 1]!)}` : ''}`;
}

export const DEFAULT_TITLE_PATTERN = '{shape} column, {fcSymbol} {fc}, {fySymbol} {fy}, γ {gamma}, {arrangement}, {transverse}';

/** Fills {field} placeholders; a non-empty {options} the pattern leaves out is appended, so variant sheets always say so. */
export function fillPattern(pattern: string, fields: Record<string, string>): string {
  // own fields only: {constructor} is not a field (it printed native code through the prototype)
  const text = pattern.replace(/\{(\w+)\}/g, (m, k: string) => (Object.hasOwn(fields, k) ? fields[k]! : m));
  return fields.options && !pattern.includes('{options}') ? `${text}, ${fields.options}` : text;
}

/** A spelled-out, file-system-safe stem: "03-square-fc-7ksi-fy-80ksi-gamma-0.75-two-faces-4-per-face-tied". */
export function fileStemFor(s: Omit<ResolvedSheet, 'title' | 'fileStem'>, units: UnitSystem, total: number): string {
  const su = DISPLAY_UNITS[units].stress.toLowerCase();
  const shape = s.shape.kind === 'circle' ? 'circular' : s.shape.aspect === 1 ? 'square' : `rectangular-aspect-${fmt(s.shape.aspect)}`;
  const idx = String(s.index).padStart(String(total).length, '0');
  const variant = basisOptionsSlug(s.variantOptions);
  return [idx, shape, `fc-${fmt(s.fc)}${su}`, `fy-${fmt(s.fy)}${su}`, `gamma-${gammaText(s.gamma)}`, ...(s.gammaB !== undefined ? [`gammab-${gammaText(s.gammaB)}`] : []), arrangementSlug(s.arrangement), s.transverse, ...(variant ? [variant] : [])].join('-');
}
