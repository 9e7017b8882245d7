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

/**
 * Columns of curve points, shared by `pmchart table` and the set tables (stable interface): normalised
 * nominal (Pn, Mn) and factored (φPn, φMn) values at one neutral-axis depth c/h.
 */
export const TABLE_COLUMNS = ['rho_g', 'c_over_h', 'eps_t', 'phi', 'Pn_norm', 'Mn_norm', 'phiPn_norm', 'phiMn_norm'] as const;

/** The set tables' key-point columns, after TABLE_COLUMNS; ω sets add `omega` last. */
export const KEY_POINT_COLUMNS = ['point', 'point_label'] as const;

/**
 * CSV of the key points: the `pmchart table` columns, then the key point's id and label. A key point at
 * the same c/h on both curves (a strain state) fills one row; one reached at different depths (P = 0,
 * the axial cap) gives one row per curve, with the other curve's two columns empty.
 */
export function tableCsv(t: LookupTable): string {
  const withOmega = t.rows.some((r) => r.omega !== undefined);
  const lines = [[...TABLE_COLUMNS, ...KEY_POINT_COLUMNS, ...(withOmega ? ['omega'] : [])].join(',')];
  const cell = (x: number | undefined) => (x === undefined ? '' : String(sig(x)));
  for (const r of t.rows) {
    for (const p of r.points) {
      const label = `"${p.label.replace(/"/g, '""')}"`;
      const tail = [p.id, label, ...(withOmega ? [String(r.omega)] : [])];
      // φ as the table command gives it: the factor at that depth (the factored point's, where there is one)
      const row = (at: PointValues, n: PointValues | null, f: PointValues | null) =>
        lines.push([cell(r.rhoG), cell(at.cOverH), cell(at.epsT), cell((f ?? at).phi), cell(n?.P), cell(n?.M), cell(f?.P), cell(f?.M), ...tail].join(','));
      const { nominal: n, design: f } = p;
      if (n && f && Math.abs(n.cOverH - f.cOverH) <= 1e-9 * Math.max(1, n.cOverH)) row(n, n, f);
      else {
        if (n) row(n, n, null);
        if (f) row(f, null, f);
      }
    }
  }
  return `${lines.join('\n')}\n`;
}

/** A key point for JSON, named as in `pmchart table --format json` (key_points). */
export function keyPointRecord(p: LookupPoint) {
  const v = (q: PointValues | null, prefix: '' | 'phi') =>
    q === null ? null : { c_over_h: sig(q.cOverH), eps_t: sig(q.epsT), phi: sig(q.phi), [prefix ? 'phiPn_norm' : 'Pn_norm']: sig(q.P), [prefix ? 'phiMn_norm' : 'Mn_norm']: sig(q.M) };
  return { id: p.id, label: p.label, nominal: v(p.nominal, ''), factored: v(p.design, 'phi') };
}

export function roundPoint(v: PointValues | null): PointValues | null {
  return v === null ? null : { cOverH: sig(v.cOverH), epsT: sig(v.epsT), phi: sig(v.phi), P: sig(v.P), M: sig(v.M) };
}
