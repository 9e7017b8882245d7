/**
 * Reading a biaxial load off emulated biaxial sheets (src/design/biaxial-chart-reading.ts) and its place in
 * the check engine (`results[].biaxial.rhoFromChart`).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { contourPointAtAngle, prepareBiaxial } from '../../src/analysis/biaxial.js';
import type { BiaxialContour } from '../../src/analysis/biaxial-family.js';
import { ACI_318_19 } from '../../src/codes/aci318.js';
import { BiaxialCharts, bracketingLevels, contourScale } from '../../src/design/biaxial-chart-reading.js';
import { checkColumn } from '../../src/design/column-check.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Arrangement, Shape } from '../../src/section/types.js';
import { runCli } from '../helpers/run-cli.js';
import { expectClose } from '../helpers/tolerance.js';

const basis = ACI_318_19.resolve({ units: 'us', fc: 5, fy: 60, transverse: 'tied' });
const shape: Shape = { kind: 'rectangle', b: 20, h: 24 };
const arrangement: Arrangement = { kind: 'four-faces', barsPerFace: 3 };
const gamma = 0.8;
const Ag = 20 * 24;

/** The exact contour point of the smeared bars at ρg, axial level ν and moment direction ψ (degrees). */
function exactPoint(rho: number, nu: number, psiDeg: number) {
  const sec = prepareBiaxial(basis, shape, layoutBars(shape, arrangement, rho * Ag, { gamma }));
  const q = contourPointAtAngle(sec, nu * basis.normalisingStress * Ag, (psiDeg * Math.PI) / 180)!;
  return { Pu: q.P, Mux: q.Mx, Muy: q.My };
}

describe('bracketingLevels', () => {
  it('brackets ν on the grid and keeps a level it sits on (hand arithmetic)', () => {
    expect(bracketingLevels(0.35, 0.1)).toEqual({ lower: 0.3, upper: 0.4 });
    expect(bracketingLevels(0.3, 0.1)).toEqual({ lower: 0.3, upper: null });
    expect(bracketingLevels(-0.05, 0.1)).toEqual({ lower: -0.1, upper: 0 });
  });
});

describe('contourScale: the ray against a drawn polyline', () => {
  // a quarter circle of radius 2 drawn as chords 5° apart (hand geometry: a chord's midpoint lies at R·cos(Δ/2) from the centre)
  const deg = Array.from({ length: 19 }, (_, i) => i * 5);
  const c: BiaxialContour = {
    rho: 0.02,
    level: 0,
    reachable: true,
    angleDeg: deg,
    mx: deg.map((d) => 2 * Math.cos((d * Math.PI) / 180)),
    my: deg.map((d) => 2 * Math.sin((d * Math.PI) / 180)),
    mxo: 2,
    myo: 2,
    alpha: 2,
    misfit: 0,
  };
  it('on a vertex: the radius itself; mid-chord: R·cos 2.5° (hand geometry)', () => {
    expectClose(contourScale(c, 'first', 1, 0), 2, 1e-12);
    const a = (12.5 * Math.PI) / 180;
    expectClose(contourScale(c, 'first', Math.cos(a), Math.sin(a)), 2 * Math.cos((2.5 * Math.PI) / 180), 1e-12);
  });
  it('a first-quadrant sheet reads the other quadrants by symmetry', () => {
    expectClose(contourScale(c, 'first', -0.5, -0.5), contourScale(c, 'first', 0.5, 0.5), 1e-12);
  });
});

describe('BiaxialCharts.read against the exact biaxial search', () => {
  const charts = new BiaxialCharts({ basis, shape, arrangement, gamma, rhoLimits: basis.rhoLimits });

  it('a load on the exact ρg = 0.03 contour at ν = 0.3 (a sheet level) and ψ = 30° (a drawn direction) reads 0.03', () => {
    const load = exactPoint(0.03, 0.3, 30);
    const r = charts.read(load.Pu, load.Mux, load.Muy);
    expect(r.levels).toHaveLength(1);
    expectClose(r.rhoFromChart!, 0.03, 1e-9);
  });

  it('between drawn directions the chord lies inside the exact contour, so the reading is a little high (conservative)', () => {
    const load = exactPoint(0.03, 0.3, 32.5);
    const r = charts.read(load.Pu, load.Mux, load.Muy);
    expect(r.rhoFromChart!).toBeGreaterThan(0.03);
    expect(r.rhoFromChart! - 0.03).toBeLessThan(0.002);
  });

  it('between levels the reading is linear in ν between the two sheets', () => {
    const load = exactPoint(0.03, 0.35, 30);
    const r = charts.read(load.Pu, load.Mux, load.Muy);
    expect(r.levels.map((l) => l.level)).toEqual([0.3, 0.4]);
    const [lo, hi] = r.levels;
    expectClose(r.rhoFromChart!, lo!.rho! + 0.5 * (hi!.rho! - lo!.rho!), 1e-9);
  });

  it('a level above every curve’s axial cap is off the sheets (null), never a number', () => {
    const r = charts.read(1.2 * basis.normalisingStress * Ag, 1, 1);
    expect(r.rhoFromChart).toBeNull();
  });
});

describe('the engine: results[].biaxial.rhoFromChart beside the exact ρg required', () => {
  it('the exact biaxial ρg required of a load on the 0.03 contour is 0.03 (two independent searches: along the ray and at fixed P), and the chart reading agrees', () => {
    const load = exactPoint(0.03, 0.3, 30);
    const c = checkColumn({ basis, shape, arrangement, gamma, loads: [{ id: 'C1', Pu: load.Pu, Mu: load.Mux, Muy: load.Muy }] });
    const b = c.results[0]!.biaxial!;
    expectClose(b.rhoRequired!, 0.03, 1e-6);
    expectClose(b.rhoFromChart!, 0.03, 1e-9);
    expectClose(b.chartMinusExact!, 0, 1, 1e-6);
    expect(c.biaxialChart).toMatchObject({ axialStep: 0.1, angleStepDeg: 5 });
  });

  it('the axial step is the engine’s input', () => {
    const load = exactPoint(0.03, 0.3, 30);
    const c = checkColumn({ basis, shape, arrangement, gamma, chartAxialStep: 0.25, loads: [{ id: 'C1', Pu: load.Pu, Mu: load.Mux, Muy: load.Muy }] });
    expect(c.results[0]!.biaxial!.chartLevels.map((l) => l.level)).toEqual([0.25, 0.5]);
  });
});

describe('pmchart check --muy', () => {
  const section = ['--fc', '5', '--fy', '60', '--b', '20', '--h', '24', '--arrangement', 'four-faces', '--bars-per-face', '3', '--gamma', '0.8', '--proposals', '0'];
  it('prints the biaxial chart reading beside the exact answer, in the table and the JSON', async () => {
    const t = await runCli(['check', ...section, '--pu', '800', '--mu', '300', '--muy', '250']);
    expect(t.code).toBe(0);
    expect(t.stdout).toMatch(/ρg req biax\s+ρg chart\s+ρg chart biax/);
    expect(t.stdout).toMatch(/ρg chart biax: read off biaxial sheets at γ = 0\.8 .* step of 0\.1; .*differs from the exact ρg req biax by [+-]/);
    const j = await runCli(['check', ...section, '--pu', '800', '--mu', '300', '--muy', '250', '--json']);
    const r = JSON.parse(j.stdout);
    const b = r.results[0].biaxial;
    expect(b.rhoFromChart).toBeGreaterThan(0.01);
    expectClose(b.chartMinusExact, b.rhoFromChart - b.rhoRequired, 1e-6, 1e-8); // JSON numbers carry 7 significant digits
    expect(r.biaxialChart).toMatchObject({ axialStep: 0.1 });
  });
  it('refuses an axial step outside 0.02–0.25 naming the flag (exit 2)', async () => {
    const r = await runCli(['check', ...section, '--pu', '800', '--mu', '300', '--muy', '250', '--chart-axial-step', '0.5']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--chart-axial-step/);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});

describe('generated biaxial loads (property test, fixed seed in CI)', () => {
  const charts = new BiaxialCharts({ basis, shape, arrangement: { kind: 'four-faces', barsPerFace: [3, 5] }, gamma, rhoLimits: basis.rhoLimits });
  const rhos = charts.rhos;
  it('every reading is null or a finite ρg within the drawn family, and its levels bracket ν', () => {
    fc.assert(
      fc.property(fc.double({ min: -0.3, max: 1.1, noNaN: true }), fc.double({ min: 0, max: 2, noNaN: true }), fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), (nu, m, psi) => {
        const r = charts.read(nu * basis.normalisingStress * Ag, m * Ag * 24 * Math.cos(psi), m * Ag * 20 * Math.sin(psi));
        if (r.rhoFromChart !== null) {
          expect(Number.isFinite(r.rhoFromChart)).toBe(true);
          expect(r.rhoFromChart).toBeGreaterThanOrEqual(rhos[0]! - 1e-12);
          expect(r.rhoFromChart).toBeLessThanOrEqual(rhos[rhos.length - 1]! + 1e-12);
        }
        expect(r.levels[0]!.level).toBeLessThanOrEqual(nu + 1e-9);
        expect(r.levels[r.levels.length - 1]!.level).toBeGreaterThanOrEqual(nu - 1e-9);
      }),
      { numRuns: 300 },
    );
  });
});
