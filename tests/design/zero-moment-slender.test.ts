/**
 * Issue 19 U1, end to end: a slender column with Mu = 0 is in single curvature (M1 = −M2, M1/M2 = −1 when M2 = 0),
 * so it is slender beyond kℓu/r = 22 and gets M2,min magnified (ACI 318-19 6.2.5.1(b), 6.6.4.5.4); "--mu 0" must not
 * be "ok" where "--mu 0.1" is outside the scope of the method (6.2.5.3).
 *
 * NOTE FOR THE MERGE: the M1/M2 = −1 default when M2 = 0 is fixed inside src/design/slenderness.ts on branch
 * s19-rules; this test passes once that branch and s19-engine are merged (on s19-engine alone the Mu = 0 case
 * still takes M1/M2 = 0, limit 34, and is called short).
 *
 * Hand calculation, ACI 318-19: 12 × 12 in, 4 corner bars, ρg = 0.02; f′c = 4 ksi; kℓu = 108 in, βdns = 1.
 * r = 0.3·12 = 3.6 in (6.2.5.2), kℓu/r = 30 > 22 = 34 + 12·(−1) (6.2.5.1(b)): slender about both axes.
 * Ec = 57,000·√4000 psi = 3604.997 ksi (19.2.2.1(b)); Ig = 12⁴/12 = 1728 in⁴;
 * (EI)eff = 0.4·3604.997·1728/(1 + 1) = 1,245,887 kip·in² (6.6.4.4.4(a)); Pc = π²·1,245,887/108² = 1054.2 kip (6.6.4.4.2).
 * Pu = 300 kip: M2,min = 300·(0.6 + 0.03·12) = 288 kip·in (6.6.4.5.4), Cm = 1.0;
 * δ = 1/(1 − 300/(0.75·1054.2)) = 1.6114 (6.6.4.5.2) > 1.4: beyond 6.2.5.3, outside the method's scope.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn } from '../../src/design/column-check.js';
import { expectClose } from '../helpers/tolerance.js';

const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const input = (Mu: number) => ({
  basis: aci,
  shape: { kind: 'rectangle' as const, b: 12, h: 12 },
  arrangement: { kind: 'four-faces' as const, barsPerFace: 2 },
  gamma: 0.7,
  capContext: { depth: 12 },
  loads: [{ id: 'Z', Pu: 300, Mu }],
  rho: 0.02,
  slenderness: { x: { effectiveLength: 108, betaDns: 1 } },
});

describe('U1 end to end: Mu = 0 on a slender column (ACI 318-19 6.2.5.1(b), 6.6.4.5.4, 6.2.5.3) — needs the s19-rules merge', () => {
  it('Mu = 0.1 kip-ft (1.2 kip·in): slender, δ = 1.6114 > 1.4, outside scope', () => {
    const r = checkColumn(input(1.2)).results[0]!;
    expect(r.slenderness!.x.neglected).toBe(false);
    expectClose(r.slenderness!.x.delta, 1.6114, 1e-3);
    expect(r.status).toBe('outside-scope');
  });

  it('Mu = 0: the same δ about x (and about y, whose member defaults to x), so the same status, never "ok"', () => {
    const c = checkColumn(input(0));
    const r = c.results[0]!;
    expect(r.slenderness!.x.neglected).toBe(false);
    expectClose(r.slenderness!.x.delta, 1.6114, 1e-3);
    expect(r.slenderness!.y!.neglected).toBe(false);
    expect(r.status).toBe('outside-scope');
    expect(c.exitCode).toBe(1);
  });
});
