/**
 * A given bar layout (`layout`) has its own symmetry: a layout not symmetric about the bending axis under an
 * arrangement that is (the one the sheets are drawn for) still meets a negative moment as its mirror image, and a
 * governing minimum moment still acts in either sign (ACI 318-19 6.6.4.5.4, an accidental eccentricity). Failed
 * ("ok") before the fix: the variants came from the arrangement alone.
 *
 * Hand calculation, ACI 318-19 22.2 (εcu = 0.003, β1 = 0.85 for f′c = 4 ksi, Table 22.2.2.4.3; displaced concrete
 * 0.85·f′c deducted inside the block), Table 21.2.2 φ = 0.65 (compression-controlled), 22.4.2.1 cap
 * φPn,max = 0.80·0.65·Po; 6.6.4 magnifier with 19.2.2.1(b) Ec = 57,000·√4000 psi, 6.6.4.4.4(a) (EI)eff = 0.4·Ec·Ig.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn } from '../../src/design/column-check.js';
import { expectClose } from '../helpers/tolerance.js';

const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });

describe('a given layout not symmetric about the bending axis, under a symmetric arrangement (ACI 318-19 6.6.4.5.4, 22.2)', () => {
  // 12 × 20 in; the arrangement: equal bars at y = ±7.5 in (symmetric). The layout checked: 3 in² at y = +7.5 in
  // (top), 1 in² at y = −7.5 in (bottom), 4 in² in all. Pu = 515 kip, Mu = +10 kip·in (compression on the top,
  // 3 in² face); kℓu = 216 in about x, 60 in about y.
  const input = {
    basis: aci,
    shape: { kind: 'rectangle' as const, b: 12, h: 20 },
    arrangement: { kind: 'custom' as const, bars: [{ x: 0, y: 0.375, share: 1 }, { x: 0, y: -0.375, share: 1 }] },
    gamma: 0.75,
    capContext: { depth: 20 },
    layout: { arrangement: { kind: 'custom' as const, bars: [{ x: 0, y: 0.375, share: 3 }, { x: 0, y: -0.375, share: 1 }] }, area: 4, gamma: 0.75, description: '3 in² top, 1 in² bottom' },
    loads: [{ id: 'L', Pu: 515, Mu: 10 }],
    slenderness: { x: { effectiveLength: 216 }, y: { effectiveLength: 60 } },
  };

  it('both signs of the governing minimum are checked on the layout, and the worse (> 1) governs', () => {
    // kℓu/r = 216/6 = 36 > 34: slender. Ig = 12·20³/12 = 8000 in⁴; (EI)eff = 0.4·3604.997·8000 = 11,535,990 kip·in²;
    // Pc = π²·11,535,990/216² = 2440.3 kip; M2,min = 515·(0.6 + 0.03·20) = 618 kip·in > 10, Cm = 1;
    // δ = 1/(1 − 515/(0.75·2440.3)) = 1.39157; Mc = 1.39157·618 = 859.99 kip·in, an accidental moment.
    // Po = 0.85·4·(240 − 4) + 60·4 = 1042.4 kip; cap = 0.52·1042.4 = 542.048 kip.
    // Sign as given (3 in² face in compression), c = 20 in from the top: a = 17 in, Cc = 0.85·4·17·12 = 693.6 kip at
    // 1.5 in → 1040.4 kip·in; 3 in² at d′ = 2.5 in, ε = 0.002625 > εy: 3·(60 − 3.4) = 169.8 kip → 1273.5;
    // 1 in² at 17.5 in, ε = 0.003·2.5/20 = 0.000375: 10.875 kip at −7.5 in → −81.56. φPn = 0.65·874.28 = 568.3 ≥ 515,
    // φMn = 0.65·2232.34 = 1451.0 ≥ 860: held; the cap gives 515/542.048 = 0.9501 ("ok" before the fix).
    // Other sign, c = 20 in from the bottom: Cc 693.6 → 1040.4; 1 in² at d′ = 2.5 in: 56.6 kip → 424.5; 3 in² at
    // 17.5 in: 3·10.875 = 32.625 kip → −244.69. φPn = 0.65·782.83 = 508.84 ≤ 515, φMn = 0.65·1220.21 = 793.14 ≤ 860:
    // outside the diagram (compression branch), so the utilisation is > 1.
    expect(0.65 * (693.6 + 56.6 + 32.625)).toBeLessThanOrEqual(515);
    expect(0.65 * (1040.4 + 424.5 - 244.6875)).toBeLessThanOrEqual(859.99);
    const r = checkColumn(input).results[0]!;
    expect(r.status).toBe('fails');
    expectClose(r.Mdesign, 859.99, 1e-4);
    expect(r.variantsChecked).toBe(4);
    const f = r.findings.find((x) => x.rule === 'min-moment-sign' && x.axis === 'x');
    expect(f).toMatchObject({ clause: '6.6.4.5.4', outcome: 'applied' });
    expectClose(f!.limit!, 515 / (0.52 * 1042.4), 1e-4); // the given sign: 0.9501
    expect(f!.value!).toBeGreaterThan(1);
    expect(r.utilisation!).toBeGreaterThan(1);
    expect(r.status).toBe('fails');
  });

  it('a negative moment meets the mirrored layout: compression on the 1 in² face', () => {
    // short column, Mu = −860 kip·in at Pu = 515 kip: the bottom (1 in²) face compressed, the case above's other sign
    const { slenderness: _s, ...short } = input;
    const r = checkColumn({ ...short, loads: [{ id: 'N', Pu: 515, Mu: -860 }] }).results[0]!;
    expect(r.status).toBe('fails');
    expect(r.variant.sign).toBe(-1);
    expect(r.utilisation!).toBeGreaterThan(1);
    expect(r.status).toBe('fails');
    // the given-layout check agrees with the same bars given as the arrangement itself
    const same = checkColumn({ ...short, arrangement: input.layout.arrangement, layout: undefined, rho: 4 / 240, loads: [{ id: 'N', Pu: 515, Mu: -860 }] }).results[0]!;
    expectClose(r.utilisation!, same.utilisation!, 1e-9);
  });
});
