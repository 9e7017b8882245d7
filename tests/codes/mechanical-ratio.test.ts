import { describe, expect, it } from 'vitest';
import { omegaFromRho, omegaPerRho, resolveBasis, rhoFromOmega } from '../../src/codes/index.js';
import { expectClose } from '../helpers/tolerance.js';

describe('mechanical reinforcement ratio ω = As·fyd/(Ac·fcd)', () => {
  // C30/37 and B500 with the recommended factors: fcd = 30/1.5 = 20 MPa, fyd = 500/1.15 = 434.783 MPa
  // (EN 1992-1-1 3.1.6(1), 3.2.7(2)); so ω = ρ·434.783/20 = 21.739·ρ (hand calculation).
  const ec2 = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });

  it('omegaFromRho: ρ = 0.02 gives ω = 0.43478', () => {
    expectClose(omegaPerRho(ec2), 21.73913, 1e-6);
    expectClose(omegaFromRho(ec2, 0.02), 0.434783, 1e-5);
  });
  it('rhoFromOmega: ω = 0.5 gives ρ = 0.023', () => {
    expectClose(rhoFromOmega(ec2, 0.5), 0.023, 1e-9);
  });
  it('follows the partial factors: αcc = 0.85 gives fcd = 17 MPa and ω = 0.02·434.783/17 = 0.51151', () => {
    const b = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied', options: { alphaCc: 0.85 } });
    expectClose(omegaFromRho(b, 0.02), 0.511509, 1e-5);
  });
  it('round-trips and maps 0 to 0', () => {
    for (const rho of [0, 0.002, 0.01, 0.04]) expectClose(rhoFromOmega(ec2, omegaFromRho(ec2, rho)), rho, 1e-12, 1e-15);
    expect(omegaFromRho(ec2, 0)).toBe(0);
  });
  it('uses fy/f′c for ACI 318-19 (4 ksi, 60 ksi: ω = 15·ρ)', () => {
    const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
    expectClose(omegaFromRho(aci, 0.02), 0.3, 1e-12);
  });
});
