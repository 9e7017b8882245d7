/**
 * Pure compression reads one way (issue 13): the nominal curve's last point, the CSV's last row, the JSON key
 * point "pure compression (Po)" and the sheet lookup table give the same Po.
 * ACI 318-19 22.4.2.2: Po = 0.85·f′c·(Ag − Ast) + fy·Ast with fy ≤ 80 ksi in Po (hand arithmetic below).
 */
import { describe, expect, it } from 'vitest';
import { computeFamily } from '../../src/analysis/family.js';
import { lookupTable } from '../../src/chart/lookup-table.js';
import { runTable } from '../../src/cli/table.js';
import { resolveBasis } from '../../src/codes/registry.js';
import { expectClose } from '../helpers/tolerance.js';

describe('pure compression, ACI 318-19, f′c = 10 ksi, fy = 100 ksi, γ = 0.8, ρg = 0.02', () => {
  // Po/Ag = 0.85·10·0.98 + 80·0.02 = 8.33 + 1.6 = 9.93 ksi (22.4.2.2). At a uniform εcu = 0.003 the bars would
  // carry min(100, 0.003·29,000) = 87 ksi, i.e. 10.07 ksi, which 22.4.2.2 does not count.
  const basis = resolveBasis('aci318-19', { units: 'us', fc: 10, fy: 100, transverse: 'tied' });
  const f = computeFamily({ basis, shape: { kind: 'rectangle', b: 1, h: 1 }, arrangement: { kind: 'two-faces', barsPerFace: 2 }, gamma: 0.8, rhos: [0.02] });
  it('the curve end and the key point are both Po = 9.93 ksi', () => {
    const c = f.curves[0]!;
    expectClose(c.Pn[c.Pn.length - 1]!, 9.93, 1e-9);
    expectClose(c.keyPoints.find((k) => k.id === 'pure-compression')!.nominal!.P, 9.93, 1e-9);
    expect(Math.max(...c.Pn)).toBeLessThanOrEqual(9.93 + 1e-9);
  });
  it('the CSV last row and the lookup table agree', () => {
    const csv = runTable({ code: 'aci318-19', fc: '10', fy: '100', gamma: '0.8', rho: '0.02' }).trim().split('\n');
    const head = csv[0]!.split(',');
    const last = csv[csv.length - 1]!.split(',');
    expectClose(Number(last[head.indexOf('Pn_norm')]), 9.93, 1e-9);
    const t = lookupTable(f, 1);
    const p = t.rows[0]!.points.find((x) => x.id === 'pure-compression')!;
    expectClose(p.nominal!.P, 9.93, 1e-9);
  });
  it('the notes say so, naming the 87 ksi the section would otherwise give', () => {
    expect(basis.notes.some((n) => n.startsWith('Pure compression is one value') && n.includes('87 ksi') && n.includes('held at Po'))).toBe(true);
  });
});
