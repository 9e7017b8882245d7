/**
 * Discrete strain-compatibility points against outside references.
 * Source A: Nilson, Darwin & Dolan, Design of Concrete Structures, 14th ed., Example 8.1 (inputs from memory),
 *           recomputed from first principles (ACI 318-19 22.2 strain compatibility).
 * Source B: circular spiral column, ACI 318-19, first principles (hand strain compatibility, 22.2; D 20 in, 8 #8, f′c 4 ksi, fy 60 ksi).
 */
import { describe, expect, it } from 'vitest';
import { designAt, nominalAt, prepareSection, R } from '../../src/analysis/prepared-section.js';
import { barResultant, concreteResultant } from '../../src/analysis/section-forces.js';
import { computeFamily } from '../../src/analysis/family.js';
import { ACI_318_19 } from '../../src/codes/aci318.js';
import { rectangularBlock } from '../../src/materials/rectangular-block.js';
import { elasticPlasticSteel } from '../../src/materials/elastic-plastic-steel.js';
import type { Bar, Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const tied = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const rect: Shape = { kind: 'rectangle', b: 12, h: 20 };
// 2 #11 per face (3.12 in² per face), centres 2.5 in from each face
const bars: Bar[] = [
  { x: -3, y: 7.5, area: 1.56 },
  { x: 3, y: 7.5, area: 1.56 },
  { x: -3, y: -7.5, area: 1.56 },
  { x: 3, y: -7.5, area: 1.56 },
];
const Ag = 240;
const rho = 6.24 / Ag;
const sec = prepareSection(tied, rect, bars);
const at = (c: number) => {
  const r = sec.respond(c / 20);
  const [P, M] = nominalAt(r, rho);
  return { P: P * Ag, M: M * Ag * 20, phi: r[R.factor]! };
};

describe('rectangular tied column 12×20 in, 4 #11 (Nilson, Darwin & Dolan 14th ed. Ex. 8.1, recomputed)', () => {
  it('balanced point: c = 10.357 in, Pn = 348.6 kip, Mn = 4739 in·kip, φ = 0.65', () => {
    const cb = (17.5 * 0.003) / (0.003 + 60 / 29000);
    const p = at(cb);
    expectClose(cb, 10.36, 0.001);
    expectClose(p.P, 348.6, 0.001);
    expectClose(p.M, 4739, 0.001);
    expect(p.phi).toBeCloseTo(0.65, 6);
  });
  it('c = 5.0 in: Pn = 111.3 kip, Mn = 3708 in·kip, φ = 0.90', () => {
    const p = at(5);
    expectClose(p.P, 111.3, 0.001);
    expectClose(p.M, 3708, 0.001);
    expect(p.phi).toBeCloseTo(0.9, 6);
  });
  it('c = 18.0 in: Pn = 808.4 kip, Mn = 2735 in·kip, φ = 0.65', () => {
    const p = at(18);
    expectClose(p.P, 808.4, 0.001);
    expectClose(p.M, 2735, 0.001);
    expect(p.phi).toBeCloseTo(0.65, 6);
  });
  it('Po = 1169.2 kip and φPn,max = 0.80·0.65·Po = 608.0 kip', () => {
    expectClose(sec.squash('nominal', rho) * Ag, 1169.2, 0.001);
    expectClose(sec.cap('design', rho) * Ag, 608.0, 0.001);
  });
  it('deducts displaced concrete: without it the balanced Pn would be 359.2 kip', () => {
    const cb = (17.5 * 0.003) / (0.003 + 60 / 29000);
    const p = tied.profile(cb, 20);
    const conc = concreteResultant(rect, tied.nominal.concrete, p);
    const noDeduction = rectangularBlock(0, 0.85, 0.003); // zero-stress law: nothing displaced
    const steel = barResultant(bars, 20, elasticPlasticSteel(60, 29000), noDeduction, p);
    expectClose(conc.P + steel.P, 359.2, 0.001);
    expectClose(at(cb).P, 348.6, 0.001);
  });
});

describe('circular spiral column D = 20 in, 8 #8 on a 7.625 in radius (ACI 318-19, first principles)', () => {
  const spiral = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'spiral' });
  const A = Math.PI * 100;
  const fam = computeFamily({
    basis: spiral,
    shape: { kind: 'circle', diameter: 20 },
    arrangement: { kind: 'ring', bars: 8 },
    gamma: 15.25 / 20,
    rhos: [6.32 / A],
  });
  const kp = (id: string) => fam.curves[0]!.keyPoints.find((k) => k.id === id)!;
  it('balanced: c = 10.431 in, Pn = 466.1 kip, Mn = 3663 in·kip, φ = 0.75', () => {
    const b = kp('balanced');
    expectClose(b.nominal!.cOverH * 20, 10.431, 0, 0.0005 * 20);
    expectClose(b.nominal!.P * A, 466.1, 0.001);
    expectClose(b.nominal!.M * A * 20, 3663, 0.001);
    expectClose(b.design!.phi, 0.75, 1e-9);
  });
  it('εt = εty + 0.003: c = 6.553 in, Pn = 105.0 kip, Mn = 3010 in·kip, φ = 0.90', () => {
    const t = kp('tension-controlled');
    expectClose(t.nominal!.cOverH * 20, 6.553, 0, 0.0005 * 20);
    expectClose(t.nominal!.P * A, 105.0, 0.001);
    expectClose(t.nominal!.M * A * 20, 3010, 0.001);
    expectClose(t.design!.phi, 0.9, 1e-9);
  });
  it('pure bending: c = 5.348 in, Mn = 2580 in·kip', () => {
    const t = kp('pure-bending');
    expectClose(t.nominal!.cOverH * 20, 5.348, 0, 0.0005 * 20);
    expectClose(t.nominal!.M * A * 20, 2580, 0.001);
    expect(Math.abs(t.nominal!.P)).toBeLessThan(1e-9);
  });
  it('Po = 1425.9 kip, 0.85·Po = 1212.0 kip, φPn,max = 909.0 kip', () => {
    expectClose(kp('pure-compression').nominal!.P * A, 1425.9, 0.001);
    expectClose(kp('axial-cap').nominal!.P * A, 1212.0, 0.001);
    expectClose(kp('axial-cap').design!.P * A, 909.0, 0.001);
  });
});

describe('hand calculations from first principles (ACI 318-19 22.2, 22.4)', () => {
  it('Po = 0.85·f′c·(Ag − Ast) + fy·Ast for the 12×20 section: 0.85·4·233.76 + 60·6.24 = 1169.18 kip', () => {
    expectClose(sec.squash('nominal', rho) * Ag, 0.85 * 4 * (240 - 6.24) + 60 * 6.24, 1e-12);
  });
  it('pure tension = −fy·Ast = −374.4 kip with no moment for a symmetric section', () => {
    const t = at(1e-7);
    expectClose(t.P, -374.4, 1e-4);
    expect(Math.abs(t.M)).toBeLessThan(1e-3);
  });
  it('doubly reinforced pure bending: quadratic for c with elastic compression steel and displaced concrete', () => {
    // P = 0: 0.85·f′c·b·β1·c + As′(Es·εcu·(c − d′)/c − 0.85·f′c) − As·fy = 0, with As = As′ = 3.12 in², d′ = 2.5 in.
    const Cc = 0.85 * 4 * 12 * 0.85; // 34.68 kip/in
    const k = 3.12 * 29000 * 0.003; // 271.44
    const a2 = Cc;
    const a1 = k - 3.12 * 0.85 * 4 - 3.12 * 60; // 73.632
    const a0 = -k * 2.5; // −678.6
    const c = (-a1 + Math.sqrt(a1 * a1 - 4 * a2 * a0)) / (2 * a2); // 3.4875 in
    const fsTop = 29000 * 0.003 * (c - 2.5) / c; // 24.63 ksi < fy: elastic, as assumed
    expect(fsTop).toBeLessThan(60);
    expect(0.85 * c).toBeGreaterThan(2.5); // the top bars sit inside the block: deduct
    const M = Cc * c * (10 - (0.85 * c) / 2) + 3.12 * (fsTop - 3.4) * 7.5 + 3.12 * 60 * 7.5; // ≈ 2931 in·kip
    expectClose(c, 3.4875, 1e-3);
    expectClose(M, 2931, 1e-3);
    const fam = computeFamily({ basis: tied, shape: rect, arrangement: { kind: 'two-faces', barsPerFace: 2 }, gamma: 0.75, rhos: [rho] });
    const pb = fam.curves[0]!.keyPoints.find((p) => p.id === 'pure-bending')!;
    expectClose(pb.nominal!.cOverH * 20, c, 1e-6);
    expectClose(pb.nominal!.M * Ag * 20, M, 1e-6);
    expectClose(pb.design!.M * Ag * 20, 0.9 * M, 1e-6); // εt ≫ εty + 0.003 at c = 3.49 in
    expect(designAt(sec.respond(c / 20), rho)[0]).toBeCloseTo(0, 6);
  });
});
