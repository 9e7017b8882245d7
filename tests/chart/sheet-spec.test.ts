/**
 * Sheet → vega-lite spec (pure). Snapshot of the spec; curve order; lookup table against the core's
 * key points and against first-principles values (hand calculation, worked from
 * ACI 318-19 22.2 strain compatibility, f′c 4 ksi, fy 60 ksi, γ 0.80, bars on two faces).
 */
import { describe, expect, it } from 'vitest';
import { buildSheet, SIMPLIFY_TOLERANCE_PT } from '../../src/chart/sheet-data.js';
import { simplifyIndices } from '../../src/chart/simplify.js';
import { sheetSpec } from '../../src/chart/spec.js';
import { TABLE_COLUMNS, tableCsv } from '../../src/chart/lookup-table.js';
import { runTable } from '../../src/cli/table.js';
import { familyForSheet } from '../../src/sheet/curves.js';
import { referenceSet } from '../helpers/chart-set.js';
import { expectClose } from '../helpers/tolerance.js';

const build = (over: Record<string, unknown> = {}) => {
  const set = referenceSet(over);
  const sheet = set.sheets[0]!;
  const family = familyForSheet(set, sheet);
  return { set, family, built: buildSheet({ set, sheet, family, sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' }) };
};

describe('sheet spec', () => {
  it('matches the snapshot (template and datasets)', () => {
    const { built } = build({ rhoG: [0.02, 0.04] });
    expect(sheetSpec(built.template, built.data)).toMatchSnapshot();
  });

  it('draws curves in point order with the order channel, one line per ρg, coloured along the ramp', () => {
    const { built } = build();
    const spec = sheetSpec(built.template, built.data) as { layer: { name: string; encoding: Record<string, { field?: string }> }[] };
    const curves = spec.layer.find((l) => l.name === 'curves_design')!;
    expect(curves.encoding.order!.field).toBe('i');
    expect(curves.encoding.detail!.field).toBe('curve');
    const ids = [...new Set(built.data.curves.map((c) => c.curve))];
    expect(ids).toEqual(['design-0.01', 'design-0.02', 'design-0.04', 'design-0.08']);
    for (const id of ids) {
      const rows = built.data.curves.filter((c) => c.curve === id);
      expect(rows.map((r) => r.i)).toEqual(rows.map((_, k) => k));
      // from pure tension (P < 0, M ≈ 0) to pure compression (M ≈ 0)
      expect(rows[0]!.P).toBeLessThan(0);
      expect(Math.abs(rows[rows.length - 1]!.M)).toBeLessThan(1e-4);
    }
  });

  it('labels every curve with its ρg and gives axis titles with symbols and units', () => {
    const { built } = build();
    // the compression-zone label of each curve comes first; tension-branch labels follow where there is room
    expect(built.data.curveLabels.slice(0, 4).map((l) => l.text)).toEqual(['ρg 0.01', 'ρg 0.02', 'ρg 0.04', 'ρg 0.08']);
    expect(built.template.yTitle).toBe('φPn / Ag   (ksi)');
    expect(built.template.xTitle).toBe('φMn / (Ag · h)   (ksi)');
    const dimless = build({ normalisation: 'dimensionless', families: 'both' }).built.template;
    expect(dimless.yTitle).toBe('Pn, φPn / (f′c · Ag)   (dimensionless)');
  });

  it('draws the strain-state lines through the key points, e/h rays and the axial cap', () => {
    const { built, family } = build();
    const kinds = new Set(built.data.refs.map((r) => r.line));
    for (const id of ['strain-decompression', 'strain-balanced', 'strain-tension-controlled', 'cap', 'ray-0.1', 'ray-0.25', 'ray-0.5', 'ray-1', 'zero']) expect(kinds).toContain(id);
    const bal = built.data.refs.filter((r) => r.line === 'strain-balanced');
    family.curves.forEach((c, k) => {
      const kp = c.keyPoints.find((p) => p.id === 'balanced')!.design!;
      expectClose(bal[k]!.P, kp.P, 1e-4, 1e-5);
      expectClose(bal[k]!.M, kp.M, 1e-4, 1e-5);
    });
    // a ray of e/h ends on the line M = (e/h)·P
    const ray = built.data.refs.filter((r) => r.line === 'ray-0.25');
    expectClose(ray[1]!.M, 0.25 * ray[1]!.P, 1e-3);
  });

  it('keeps every computed curve point within the drawing tolerance', () => {
    // a quarter circle of radius 100 pt sampled at 400 points: RDP must keep the chord error ≤ tolerance
    const x = Array.from({ length: 400 }, (_, i) => 100 * Math.cos((i / 399) * (Math.PI / 2)));
    const y = Array.from({ length: 400 }, (_, i) => 100 * Math.sin((i / 399) * (Math.PI / 2)));
    const keep = simplifyIndices(x, y, SIMPLIFY_TOLERANCE_PT);
    expect(keep[0]).toBe(0);
    expect(keep[keep.length - 1]).toBe(399);
    expect(keep.length).toBeLessThan(400);
    for (let k = 1; k < keep.length; k++) {
      const [a, b] = [keep[k - 1]!, keep[k]!];
      for (let i = a + 1; i < b; i++) {
        // distance of point i from the chord a–b
        const chord = Math.hypot(x[b]! - x[a]!, y[b]! - y[a]!);
        const dist = Math.abs(((x[b]! - x[a]!) * (y[a]! - y[i]!) - (x[a]! - x[i]!) * (y[b]! - y[a]!)) / chord);
        expect(dist).toBeLessThanOrEqual(SIMPLIFY_TOLERANCE_PT + 1e-9);
      }
    }
    // a straight line collapses to its ends
    expect(simplifyIndices([0, 1, 2, 3], [0, 2, 4, 6], 0.01)).toEqual([0, 3]);
  });
});

describe('lookup table', () => {
  it('equals the core key points', () => {
    const { built, family } = build();
    family.curves.forEach((c, k) => {
      const row = built.table.rows[k]!;
      expect(row.rhoG).toBe(c.rho);
      expect(row.points.map((p) => p.id)).toEqual(c.keyPoints.map((p) => p.id));
      c.keyPoints.forEach((kp, j) => {
        expect(row.points[j]!.design).toEqual(kp.design);
        expect(row.points[j]!.nominal).toEqual(kp.nominal);
      });
    });
  });

  it('agrees with first-principles values (hand strain compatibility, ACI 318-19 22.2: f′c 4, fy 60, γ 0.80, two faces)', () => {
    const { built } = build();
    const row = (rho: number) => built.table.rows.find((r) => r.rhoG === rho)!;
    const pt = (rho: number, id: string) => row(rho).points.find((p) => p.id === id)!;
    // Po/(b·h): 3.966, 4.532, 5.664, 7.928; balanced c/h 0.5327
    for (const [rho, po] of [[0.01, 3.966], [0.02, 4.532], [0.04, 5.664], [0.08, 7.928]] as const) expectClose(pt(rho, 'pure-compression').nominal!.P, po, 1e-3);
    for (const [rho, P, M] of [[0.01, 1.522, 0.6544], [0.02, 1.505, 0.8876], [0.04, 1.471, 1.354], [0.08, 1.404, 2.287]] as const) {
      expectClose(pt(rho, 'balanced').nominal!.P, P, 1e-3);
      expectClose(pt(rho, 'balanced').nominal!.M, M, 1e-3);
      expectClose(pt(rho, 'balanced').nominal!.cOverH, 0.5327, 0, 0.0005);
      // the sheet shows φ·(Pn, Mn) with φ = 0.65 at εt = εty, tied (ACI 318-19 Table 21.2.2)
      expectClose(pt(rho, 'balanced').design!.P, 0.65 * P, 1e-3);
    }
    // tension-controlled limit εt = εty + 0.003, c/h = 0.3346: ρg 0.02 gives Pn/(b·h) 0.933, Mn/(b·h²) 0.812
    expectClose(pt(0.02, 'tension-controlled').nominal!.P, 0.933, 1e-3);
    expectClose(pt(0.02, 'tension-controlled').nominal!.M, 0.812, 1e-3);
    expectClose(pt(0.02, 'tension-controlled').design!.P, 0.9 * 0.933, 1e-3);
  });

  it('shows the same numbers on the sheet as in the core (3 decimals)', () => {
    const { built, family } = build();
    const texts = new Set(built.data.texts.map((t) => t.text));
    for (const c of family.curves) {
      const bal = c.keyPoints.find((p) => p.id === 'balanced')!.design!;
      expect(texts).toContain(bal.P.toFixed(3));
      expect(texts).toContain(bal.M.toFixed(3));
    }
  });

  it('divides by f′c for dimensionless sheets', () => {
    const a = build().built.table;
    const b = build({ normalisation: 'dimensionless' }).built.table;
    expectClose(b.rows[1]!.points[0]!.nominal!.P, a.rows[1]!.points[0]!.nominal!.P / 4, 1e-12);
  });

  it('writes CSV with the columns of `pmchart table`, then the key point, one row per point and depth', () => {
    const { built, family } = build();
    const lines = tableCsv(built.table).trim().split('\n');
    expect(lines[0]!.split(',').slice(0, TABLE_COLUMNS.length)).toEqual([...TABLE_COLUMNS]);
    expect(lines[0]).toBe('rho_g,c_over_h,eps_t,phi,Pn_norm,Mn_norm,phiPn_norm,phiMn_norm,point,point_label');
    // balanced: one depth for both curves, one row with nominal and factored values
    const bal = lines.filter((l) => l.startsWith('0.02,') && l.includes(',balanced,'));
    expect(bal).toHaveLength(1);
    const kp = family.curves[1]!.keyPoints.find((p) => p.id === 'balanced')!;
    const cells = bal[0]!.split(',').map(Number);
    expectClose(cells[4]!, kp.nominal!.P, 1e-5);
    expectClose(cells[6]!, kp.design!.P, 1e-5);
    // ACI 318-19 22.2 strain compatibility (first principles, hand calculation): balanced Pn/(b·h) = 1.505 ksi at ρg 0.02
    expect(cells[4]!).toBeCloseTo(1.505, 2);
  });

  it('gives the set table and `pmchart table` the same columns for the same sheet', () => {
    const set = referenceSet({});
    const sheet = set.sheets[0]!;
    const setHead = tableCsv(build().built.table).split('\n')[0]!.split(',');
    const cmd = runTable({ code: 'aci318-19', fc: String(sheet.fc), fy: String(sheet.fy), gamma: String(sheet.gamma), rho: '0.02' } as never).split('\n')[0]!.split(',');
    expect(setHead.slice(0, cmd.length)).toEqual(cmd);
    expect(setHead.slice(cmd.length)).toEqual(['point', 'point_label']);
  });
});
