/**
 * The check engine (src/design/column-check.ts): signed moments on unsymmetric layouts, ring orientation,
 * stability and scope statuses, biaxial design and bar proposals that pass every load with every effect.
 * Strain compatibility by hand follows ACI 318-19 22.2 (εcu = 0.003, rectangular block 22.2.2.4.1 with
 * β1 from Table 22.2.2.4.3, displaced concrete deducted for bars inside the block); φ from Table 21.2.2.
 */
import { describe, expect, it } from 'vitest';
import { capacityAlongRay as biaxialRay, prepareBiaxial } from '../../src/analysis/biaxial.js';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn, type ColumnCheckInput } from '../../src/design/column-check.js';
import { layoutBars } from '../../src/section/arrangements.js';
import { barSet } from '../../src/section/bar-tables.js';
import { expectClose } from '../helpers/tolerance.js';

const aciUs = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });

describe('signed moments on an unsymmetric custom layout (hand calculation, ACI 318-19 22.2)', () => {
  // 12 × 20 in, 1 in² at 2.5 in below the top face, 3 in² at 2.5 in above the bottom face (y = ±0.375·h).
  // Positive moment (top in compression), c = 8 in by hand: a = 0.85·8 = 6.8 in; Cc = 0.85·4·6.8·12 = 277.44 kip;
  // top bar εs = 0.003·5.5/8 = 0.0020625 < εy → fs = 59.8125 ksi, less 0.85·f′c displaced: 56.4125 kip;
  // bottom bars εs = 0.003·9.5/8 = 0.0035625 > εy → −180 kip. Pn = 153.8525 kip;
  // Mn = 277.44·(10 − 3.4) + 56.4125·7.5 + 180·7.5 = 3604.198 kip·in;
  // εt = 0.0035625: φ = 0.65 + 0.25·(0.0035625 − 60/29000)/0.003 = 0.774461 (Table 21.2.2, tied).
  const phi = 0.65 + (0.25 * (0.0035625 - 60 / 29000)) / 0.003;
  const Pu = phi * 153.8525;
  const Mu = phi * 3604.19775;
  const input = (M: number): ColumnCheckInput => ({
    basis: aciUs,
    shape: { kind: 'rectangle', b: 12, h: 20 },
    arrangement: { kind: 'custom', bars: [{ x: 0, y: 0.375, share: 1 }, { x: 0, y: -0.375, share: 3 }] },
    gamma: 0.75,
    capContext: { depth: 20 },
    loads: [{ id: 'L', Pu, Mu: M }],
    rho: 4 / 240,
  });

  it('a positive moment at the hand point uses the whole capacity: utilisation 1.000, ρg required = 4/240', () => {
    const r = checkColumn(input(Mu)).results[0]!;
    expectClose(r.utilisation!, 1, 1e-4);
    expectClose(r.rhoRequired!, 4 / 240, 1e-4);
    expect(r.status).toBe('ok');
  });

  it('the same moment negative puts the 1 in² bar in tension: the mirrored layout governs and the load fails', () => {
    const c = checkColumn(input(-Mu));
    const r = c.results[0]!;
    expect(r.variant.sign).toBe(-1);
    expect(r.utilisation!).toBeGreaterThan(1.5);
    expect(r.status).toBe('fails');
    expect(c.exitCode).toBe(1);
    // the exact biaxial surface of the same bars agrees with the signed uniaxial check (Muy = 0)
    const bars = layoutBars(input(0).shape, input(0).arrangement, 4, { gamma: 0.75 });
    const sec = prepareBiaxial(aciUs, input(0).shape, bars, { depth: 20 });
    expectClose(r.utilisation!, biaxialRay(sec, Pu, -Mu, 0).utilisation, 1e-4);
  });

  it('a load near the axis on a layout with more steel on one face: the ray is met where h(c) rises (hand calculation)', () => {
    // 3 in² at y = +7.5 in, 1 in² at y = −7.5 in; Pu = 400 kip, Mu = +40 kip-ft, e = 1.2 in. Uniform strain puts
    // the resultant 0.81 in above the centroid, so the line through the load meets the +y-face branch twice
    // (once on the tension side, opposite the load); the capacity is the crossing in the load's direction.
    // By hand on that branch: d = 2.5 in (3 in²) and 17.5 in (1 in²) below the +y face; a = min(0.85·c, 20).
    const branch = (c: number) => {
      const a = Math.min(0.85 * c, 20);
      let P = 0.85 * 4 * a * 12;
      let M = P * (10 - a / 2);
      for (const [d, As, y] of [[2.5, 3, 7.5], [17.5, 1, -7.5]] as const) {
        const eps = (0.003 * (c - d)) / c;
        const f = Math.max(-60, Math.min(60, 29000 * eps)) - (d < a ? 0.85 * 4 : 0);
        P += f * As;
        M += f * As * y;
      }
      return { P, M, epsT: (0.003 * (17.5 - c)) / c };
    };
    let lo = 18;
    let hi = 500; // e = M/P falls towards 0.81 in as c grows
    for (let k = 0; k < 200; k++) {
      const mid = (lo + hi) / 2;
      const { P, M } = branch(mid);
      if (M / P > 1.2) lo = mid;
      else hi = mid;
    }
    const hand = branch(lo);
    expectClose(hand.M / hand.P, 1.2, 1e-9);
    expect(hand.epsT).toBeLessThan(0); // φ = 0.65 (Table 21.2.2, compression-controlled)
    const heavyTop = { kind: 'custom' as const, bars: [{ x: 0, y: 0.375, share: 3 }, { x: 0, y: -0.375, share: 1 }] };
    const r = checkColumn({ ...input(0), arrangement: heavyTop, loads: [{ id: 'A', Pu: 400, Mu: 40 * 12 }] }).results[0]!;
    // φPn at the crossing, or the axial cap 0.80·0.65·Po with Po = 0.85·4·236 + 60·4 = 1042.4 kip (22.4.2.1)
    expectClose(r.utilisation!, 400 / Math.min(0.65 * hand.P, 0.8 * 0.65 * 1042.4), 1e-4);
    expect(r.utilisation!).toBeGreaterThan(0);
  });

  it('a moment raised to a minimum is checked with both signs (EN 1992-1-1 6.1(4), e0 = max(h/30, 20 mm))', () => {
    const en = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
    const c = checkColumn({
      basis: en,
      shape: { kind: 'rectangle', b: 300, h: 300 },
      arrangement: { kind: 'custom', bars: [{ x: 0, y: 0.35, share: 1 }, { x: 0, y: -0.35, share: 3 }] },
      gamma: 0.7,
      loads: [{ id: 'axial', Pu: 1.2e6, Mu: 0 }],
      rho: 0.02,
    });
    const r = c.results[0]!;
    expect(r.momentRaised).toBe(true);
    expect(r.variantsChecked).toBe(4); // two branches × both signs
    expectClose(r.Mdesign, 1.2e6 * 20, 1e-9); // e0 = max(300/30, 20) = 20 mm
  });
});

describe('a ring of 6 bars in a circle: the weakest orientation governs (hand calculation, ACI 318-19 22.2)', () => {
  // D = 600 mm, f′c = 30 MPa (β1 = 0.85 − 0.05·2/7), fy = 420 MPa, Es = 200 GPa, spiral, ρg = 0.02, bars on a
  // 240 mm radius (γ = 0.8). Turned half a pitch (30°): bars at y = ±207.85 mm (two each) and 0 (two).
  // c = 300 mm, a = β1·c; the block on a circle is a segment: A = r²·θ − d·√(r² − d²), centroid 2(r² − d²)^1.5/(3A)
  // from the centre, d = r − a, θ = acos(d/r) (circular segment, any engineering handbook).
  const r = 300;
  const beta1 = 0.85 - (0.05 * 2) / 7;
  const c = 300;
  const a = beta1 * c;
  const d = r - a;
  const theta = Math.acos(d / r);
  const segA = r * r * theta - d * Math.sqrt(r * r - d * d);
  const segY = (2 * Math.pow(r * r - d * d, 1.5)) / (3 * segA);
  const Ag = Math.PI * r * r;
  const each = (0.02 * Ag) / 6;
  let P = 0.85 * 30 * segA;
  let M = P * segY;
  for (const y of [207.846, 207.846, 0, 0, -207.846, -207.846]) {
    const depth = r - y;
    const eps = (0.003 * (c - depth)) / c;
    const fs = Math.max(-420, Math.min(420, 200000 * eps));
    const f = fs - (depth < a ? 0.85 * 30 : 0);
    P += f * each;
    M += f * each * y;
  }
  // εt at the extreme tension bar: 0.003·(507.85 − 300)/300 = 0.00208 < εy = 0.0021 → φ = 0.75 (spiral)
  const Pu = (0.75 * P) / 1000;
  const Mu = (0.75 * M) / 1e6;
  const si = resolveBasis('aci318-19', { units: 'si', fc: 30, fy: 420, transverse: 'spiral' });

  it('the exact surface turned half a pitch meets the hand point: utilisation 1.000 at a 30° moment direction', () => {
    const shape = { kind: 'circle' as const, diameter: 600 };
    const sec = prepareBiaxial(si, shape, layoutBars(shape, { kind: 'ring', bars: 6 }, 0.02 * Ag, { gamma: 0.8 }), {});
    const t = Math.PI / 6;
    expectClose(biaxialRay(sec, Pu * 1000, Mu * 1e6 * Math.cos(t), Mu * 1e6 * Math.sin(t)).utilisation, 1, 2e-4);
  });

  it('the check takes the weakest orientation: the largest exact utilisation over 0–30° (1° steps), not the 0° one alone', () => {
    const shape = { kind: 'circle' as const, diameter: 600 };
    const sec = prepareBiaxial(si, shape, layoutBars(shape, { kind: 'ring', bars: 6 }, 0.02 * Ag, { gamma: 0.8 }), {});
    // at the hand point (high axial load) 0° is weaker; at Pu = 1000 kN, Mu = 469.6 kN·m the half pitch is
    for (const [p, m] of [[Pu * 1000, Mu * 1e6], [1000e3, 469.6e6]] as const) {
      const sweep = Array.from({ length: 31 }, (_, k) => biaxialRay(sec, p, m * Math.cos((k * Math.PI) / 180), m * Math.sin((k * Math.PI) / 180)).utilisation);
      const res = checkColumn({ basis: si, shape, arrangement: { kind: 'ring', bars: 6 }, gamma: 0.8, loads: [{ id: 'x', Pu: p, Mu: m }], rho: 0.02 }).results[0]!;
      expectClose(res.utilisation!, Math.max(...sweep), 1e-3);
      expect(res.utilisation!).toBeGreaterThan(sweep[0]! - 1e-9);
    }
  });

  it('the first-principles spiral circle (8 #8, one bar at each pole) at 0° keeps its balanced point: utilisation ≥ 1 there', () => {
    // balanced Pn = 466.1 kip, Mn = 3663 kip·in, φ = 0.75 (first principles, D = 20 in, f′c = 4 ksi, fy = 60 ksi)
    const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'spiral' });
    const res = checkColumn({
      basis,
      shape: { kind: 'circle', diameter: 20 },
      arrangement: { kind: 'ring', bars: 8 },
      gamma: 0.7625,
      loads: [{ id: 'bal', Pu: 0.75 * 466.1, Mu: 0.75 * 3663 }],
      rho: 6.32 / (Math.PI * 100),
    }).results[0]!;
    expect(res.utilisation!).toBeGreaterThanOrEqual(0.999);
  });
});

describe('slender columns: unstable and outside the method (ACI 318-19 6.6.4, 6.2.5.3, by hand)', () => {
  // 20 × 20 in, f′c = 6 ksi: Ec = 57000·√6000 psi = 4415 ksi (19.2.2.1); Ig = 20⁴/12 = 13333 in⁴;
  // (EI)eff = 0.4·Ec·Ig/(1 + βdns) with βdns = 0.6 (6.6.4.4.4(a)) = 1.4717e7 kip·in²;
  // kℓu = 52 ft = 624 in: Pc = π²·(EI)eff/(kℓu)² = 373.0 kip (6.6.4.4.2); 0.75·Pc = 279.8 kip.
  const basis = resolveBasis('aci318-19', { units: 'us', fc: 6, fy: 60, transverse: 'tied' });
  const Pc = (Math.PI ** 2 * ((0.4 * 57 * Math.sqrt(6000) * (20 ** 4 / 12)) / 1.6)) / 624 ** 2;
  const input = (Pu: number, Mu: number, M1: number): ColumnCheckInput => ({
    basis,
    shape: { kind: 'rectangle', b: 20, h: 20 },
    arrangement: { kind: 'four-faces', barsPerFace: 3 },
    gamma: 0.8,
    capContext: { depth: 20 },
    loads: [{ id: 'S', Pu, Mu, M1 }],
    slenderness: { x: { effectiveLength: 624, betaDns: 0.6, eiOption: 'a' } },
  });

  it('Pu = 700 kip ≥ 0.75·Pc: status unstable with the clause, Pc by hand', () => {
    expectClose(Pc, 373.0, 1e-3);
    const c = checkColumn(input(700, 180 * 12, -90 * 12));
    const r = c.results[0]!;
    expect(r.status).toBe('unstable');
    expect(r.statusClause).toContain('6.6.4.5.2');
    const pcStep = r.slenderness!.x.steps.find((s) => s.label.startsWith('Pc'));
    expectClose(pcStep!.value as number, Pc, 1e-3);
    expect(c.exitCode).toBe(1);
    expect(c.bars.length).toBe(0);
  });

  it('Pu = 112 kip in single curvature: δ = 1/(1 − 112/(0.75·Pc)) = 1.668 > 1.4, outside the method (6.2.5.3)', () => {
    const r = checkColumn(input(112, 100 * 12, -100 * 12)).results[0]!;
    expectClose(r.slenderness!.x.delta, 1 / (1 - 112 / (0.75 * Pc)), 1e-4);
    expect(r.status).toBe('outside-scope');
    expect(r.statusClause).toContain('6.2.5.3');
  });
});

describe('biaxial design (exact inclined neutral axis)', () => {
  const base: ColumnCheckInput = {
    basis: aciUs,
    shape: { kind: 'rectangle', b: 20, h: 20 },
    arrangement: { kind: 'four-faces', barsPerFace: 3 },
    gamma: 0.75,
    capContext: { depth: 20 },
    loads: [{ id: 'B1', Pu: 500, Mu: 250 * 12, Muy: 200 * 12 }],
  };

  it('the exact check at biaxial.rhoRequired gives 1.00', () => {
    const r = checkColumn(base).results[0]!;
    const rho = r.biaxial!.rhoRequired!;
    expect(rho).toBeGreaterThan(r.rhoRequired!); // Muy needs more steel than Mux alone
    const again = checkColumn({ ...base, rho }).results[0]!;
    expectClose(again.biaxial!.exact!.utilisation, 1, 1e-6);
  });

  it('bar proposals pass every load with the exact biaxial check of their own bars', () => {
    const sizes = barSet('astm-a615').sizes.filter((s) => s.diameter >= 0.625);
    const c = checkColumn({ ...base, loads: [...base.loads, { id: 'B2', Pu: 150, Mu: 40 * 12, Muy: 130 * 12 }], barSelection: { detailing: { kind: 'cover', cover: 1.5, tieDiameter: 0.5 }, sizes } });
    expect(c.bars.length).toBeGreaterThan(0);
    for (const p of c.bars) {
      const arrangement = { kind: 'four-faces' as const, barsPerFace: p.perFace };
      const sec = prepareBiaxial(aciUs, base.shape, layoutBars(base.shape, arrangement, p.area, { gamma: p.gamma }), { depth: 20 });
      for (const l of [[500, 3000, 2400], [150, 480, 1560]] as const) expect(biaxialRay(sec, l[0], l[1], l[2]).utilisation).toBeLessThanOrEqual(1 + 1e-9);
    }
  });
});

describe('status summary and ranking', () => {
  it('counts the loads that do not pass and names the measure', () => {
    const c = checkColumn({
      basis: aciUs,
      shape: { kind: 'rectangle', b: 16, h: 16 },
      arrangement: { kind: 'two-faces', barsPerFace: 3 },
      gamma: 0.75,
      loads: [
        { id: 'light', Pu: 200, Mu: 50 * 12 },
        { id: 'heavy', Pu: 900, Mu: 250 * 12 },
        { id: 'mid', Pu: 400, Mu: 120 * 12 },
      ],
      rho: 0.02,
    });
    expect(c.measure).toBe('utilisation');
    expect(c.results[0]!.id).toBe('heavy');
    expect(c.summary.counts.fails + c.summary.counts.ok).toBe(3);
    expect(c.summary.text).toMatch(/of 3 loads|all 3 loads/);
    expect(Object.isFrozen(c.results[0])).toBe(true);
  });
});
