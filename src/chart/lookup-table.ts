/**
 * The lookup table of a sheet: per ρg, the core's key points (src/analysis/family.ts KeyPoint) in the
 * sheet's normalisation. The same rows feed the sheet, tables/*.csv and tables/*.json.
 */
import type { CurveFamily, KeyPoint, PointValues } from '../analysis/family.js';

export type FamilyKind = 'design' | 'nominal';

export interface LookupPoint {
  id: string;
  label: string;
  nominal: PointValues | null;
  design: PointValues | null;
}

export interface LookupRow {
  /** the mechanical ratio the curve was asked for, on ω sets */
  omega?: number;
  rhoG: number;
  points: LookupPoint[];
}

export interface LookupTable {
  /** values divided by this (1 for stress normalisation, f′c for dimensionless) */
  divisor: number;
  rows: LookupRow[];
}

const scaled = (p: PointValues | null, d: number): PointValues | null => (p === null ? null : { ...p, P: p.P / d, M: p.M / d });

/** Key points of every curve, P and M divided by `divisor`; c/h, εt and φ as computed. `omegas` key the rows of ω sets (same order as the curves). */
export function lookupTable(family: CurveFamily, divisor: number, omegas?: readonly number[]): LookupTable {
  return {
    divisor,
    rows: family.curves.map((c, k) => ({
      ...(omegas ? { omega: omegas[k]! } : {}),
      rhoG: c.rho,
      points: c.keyPoints.map((k: KeyPoint) => ({ id: String(k.id), label: k.label, nominal: scaled(k.nominal, divisor), design: scaled(k.design, divisor) })),
    })),
  };
}

/** Which values a column group shows for a key point. */
export function columnsFor(id: string): ('P' | 'M')[] {
  if (id === 'pure-compression' || id === 'pure-tension') return ['P'];
  if (id === 'pure-bending') return ['M'];
  return ['P', 'M'];
}

const SHORT: Record<string, string> = {
  'pure-compression': 'pure axial',
  'axial-cap': 'axial cap',
  'pure-bending': 'P = 0',
  'pure-tension': 'pure tension',
};

/** Short column-group heading for a key point; strain states keep the basis's own symbols (εt = εty, εs = εyd). */
export function shortLabel(p: Pick<LookupPoint, 'id' | 'label'>): string {
  if (SHORT[p.id]) return SHORT[p.id]!;
  if (p.id === 'tension-controlled') return 'tension-ctl. limit';
  const cut = p.label.indexOf(' (');
  return cut > 0 ? p.label.slice(0, cut) : p.label;
}

/** Rounds for files: six significant digits keeps CSV/JSON readable and deterministic. */
export const sig = (x: number): number => (Number.isFinite(x) ? Number(x.toPrecision(6)) : x);

/** CSV rows per key point and family; ω sets lead with an `omega` column. */
export function tableCsv(t: LookupTable): string {
  const withOmega = t.rows.some((r) => r.omega !== undefined);
  const lines = [`${withOmega ? 'omega,' : ''}rhoG,point,label,family,cOverH,epsT,phi,P,M`];
  for (const r of t.rows) {
    for (const p of r.points) {
      for (const fam of ['nominal', 'design'] as const) {
        const v = p[fam];
        if (!v) continue;
        const label = `"${p.label.replace(/"/g, '""')}"`;
        lines.push([...(withOmega ? [r.omega] : []), sig(r.rhoG), p.id, label, fam, sig(v.cOverH), sig(v.epsT), sig(v.phi), sig(v.P), sig(v.M)].join(','));
      }
    }
  }
  return `${lines.join('\n')}\n`;
}

export function roundPoint(v: PointValues | null): PointValues | null {
  return v === null ? null : { cOverH: sig(v.cOverH), epsT: sig(v.epsT), phi: sig(v.phi), P: sig(v.P), M: sig(v.M) };
}
