/** Spelled-out text for sheet parameters (titles, index page, file names). */
import type { Transverse } from '../codes/types.js';
import { DISPLAY_UNITS, type UnitSystem } from '../units/index.js';
import type { ResolvedShape, ResolvedSheet } from './types.js';

/** Trims float noise: 0.7500000001 → "0.75". */
export const fmt = (x: number, digits = 3): string => String(Number(x.toFixed(digits)));

export function describeShape(s: ResolvedShape): string {
  if (s.kind === 'circle') return 'circular';
  return s.aspect === 1 ? 'square' : `rectangular, b/h ${fmt(s.aspect)}`;
}

export function describeArrangement(a: ResolvedSheet['arrangement']): string {
  switch (a.kind) {
    case 'two-faces':
      return `${a.barsPerFace} bars on each of two faces`;
    case 'four-faces':
      return `${a.barsPerFace} bars per face on four faces (${4 * (a.barsPerFace - 1)} bars)`;
    case 'side-faces':
      return `${a.barsPerFace} bars on each side face`;
    case 'ring':
      return `${a.bars} bars in a ring`;
  }
}

/** Short kebab form for file names: "two-faces-4-per-face". */
export function arrangementSlug(a: ResolvedSheet['arrangement']): string {
  return a.kind === 'ring' ? `ring-${a.bars}-bars` : `${a.kind}-${a.barsPerFace}-per-face`;
}

export const describeTransverse = (t: Transverse): string => (t === 'spiral' ? 'spiral' : 'tied');

export const stressText = (v: number, units: UnitSystem): string => `${fmt(v)} ${DISPLAY_UNITS[units].stress}`;

/** Values a sheet-title pattern can use. */
export function titleFields(s: Omit<ResolvedSheet, 'title' | 'fileStem'>, units: UnitSystem, family: string): Record<string, string> {
  return {
    index: String(s.index),
    shape: describeShape(s.shape),
    fc: stressText(s.fc, units),
    fy: stressText(s.fy, units),
    gamma: s.gamma.toFixed(2),
    arrangement: describeArrangement(s.arrangement),
    transverse: describeTransverse(s.transverse),
    family,
  };
}

export const DEFAULT_TITLE_PATTERN = '{shape} column, f′c {fc}, fy {fy}, γ {gamma}, {arrangement}, {transverse}';

export function fillPattern(pattern: string, fields: Record<string, string>): string {
  return pattern.replace(/\{(\w+)\}/g, (m, k: string) => fields[k] ?? m);
}

/** A spelled-out, file-system-safe stem: "03-square-fc-7ksi-fy-80ksi-gamma-0.75-two-faces-4-per-face-tied". */
export function fileStemFor(s: Omit<ResolvedSheet, 'title' | 'fileStem'>, units: UnitSystem, total: number): string {
  const su = DISPLAY_UNITS[units].stress.toLowerCase();
  const shape = s.shape.kind === 'circle' ? 'circular' : s.shape.aspect === 1 ? 'square' : `rectangular-aspect-${fmt(s.shape.aspect)}`;
  const idx = String(s.index).padStart(String(total).length, '0');
  return [idx, shape, `fc-${fmt(s.fc)}${su}`, `fy-${fmt(s.fy)}${su}`, `gamma-${s.gamma.toFixed(2)}`, arrangementSlug(s.arrangement), s.transverse].join('-');
}
