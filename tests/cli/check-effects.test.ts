/**
 * `pmchart check` with a moment about y and slenderness inputs: the stable JSON fields
 * `biaxial: {exact, reciprocalLoad, loadContour}` and `slenderness: {neglected, delta, magnifiedMoment}`,
 * and the magnified moment feeding the check.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { capacityAlongRay, prepareBiaxial } from '../../src/analysis/biaxial.js';
import { runCheck, type CheckOptions } from '../../src/cli/check.js';
import { ACI_318_19 } from '../../src/codes/aci318.js';
import { layoutBars } from '../../src/section/arrangements.js';
import { expectClose } from '../helpers/tolerance.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const cli = (args: string[]) => inProcess(args);
const base: CheckOptions = { fc: '5', fy: '60', b: '18', h: '24', arrangement: 'four-faces', barsPerFace: '4', gamma: '0.75', rho: '0.025', proposals: '0', json: true };
const json = (o: CheckOptions) => JSON.parse(runCheck(o));

describe('check --muy: biaxial fields', () => {
  it('carries biaxial {exact, reciprocalLoad, loadContour}; exact equals the surface search on the actual bars', () => {
    const out = json({ ...base, pu: '500', mu: '220', muy: '140' });
    const r = out.results[0];
    expect(Object.keys(r.biaxial).slice(0, 3)).toEqual(['exact', 'reciprocalLoad', 'loadContour']);
    const basis = ACI_318_19.resolve({ units: 'us', fc: 5, fy: 60, transverse: 'tied' });
    const shape = { kind: 'rectangle' as const, b: 18, h: 24 };
    const sec = prepareBiaxial(basis, shape, layoutBars(shape, { kind: 'four-faces', barsPerFace: 4 }, 0.025 * 432, { gamma: 0.75 }), { depth: 24 });
    expectClose(r.biaxial.exact, capacityAlongRay(sec, 500, 220 * 12, 140 * 12).utilisation, 1e-6);
    expect(r.biaxial.reciprocalLoad).toBeGreaterThan(0);
    expect(r.biaxial.details.loadContour.alpha).toBe(1.5);
    expect(r.Muy).toBe(140);
    expect(r.slenderness).toBeUndefined();
  });
  it('with Muy = 0 the exact biaxial utilisation is the uniaxial utilisation of the check', () => {
    const r = json({ ...base, pu: '700', mu: '90', muy: '0' }).results[0];
    expectClose(r.biaxial.exact, r.utilisation, 1e-4);
  });
  it('reads Muy, M1 columns from a load file and puts the worst biaxial load first', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-fx-'));
    const file = join(dir, 'loads.csv');
    writeFileSync(file, 'id,Pu,Mu,Muy\nlow,300,100,20\nhigh,500,220,160\n');
    const out = json({ ...base, loads: file });
    expect(out.results.map((r: { id: string }) => r.id)).toEqual(['high', 'low']);
    expect(out.governing).toBe('high');
    expect(out.results[0].biaxial.exact).toBeGreaterThan(out.results[1].biaxial.exact);
  });
  it('--muy with --loads is a one-line conflict, exit 2', async () => {
    const r = await cli(['check', '--fc', '5', '--fy', '60', '--b', '18', '--h', '24', '--gamma', '0.75', '--loads', '/dev/null', '--muy', '10']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n').length).toBe(1);
  });
});

describe('check --klu: slenderness fields and the magnified moment feeding the check', () => {
  // The hand-calculated column of tests/design/slenderness.test.ts (ACI 318-19 6.6.4, option (c)):
  // 16 × 16 in, 8 #8, kℓu = 240 in, Pu = 400 kips, M2 = 200 kip-ft, M1 = −120 kip-ft, βdns = 0.6 → δ = 1.3686.
  const col: CheckOptions = { fc: '4', fy: '60', b: '16', h: '16', arrangement: 'four-faces', barsPerFace: '3', bar: '#8', gamma: '0.6875', proposals: '0', json: true };
  it('slenderness {neglected: false, delta: 1.3686, magnifiedMoment: 273.71 kip-ft}, and Mu checked is the magnified one', () => {
    const out = json({ ...col, pu: '400', mu: '200', klu: '240in', m1: '-120', betaDns: '0.6', eiOption: 'c' });
    const r = out.results[0];
    expect(r.slenderness.neglected).toBe(false);
    expectClose(r.slenderness.delta, 1.3686, 1e-4);
    expectClose(r.slenderness.magnifiedMoment, 1.3686 * 200, 1e-4);
    expectClose(r.Mu, r.slenderness.magnifiedMoment, 1e-6);
    expect(r.slenderness.steps.length).toBeGreaterThan(10);
    const short = json({ ...col, pu: '400', mu: '200' }).results[0];
    expect(r.utilisation).toBeGreaterThan(short.utilisation);
    expect(out.assumptions[0]).toMatch(/Slender column/);
  });
  it('a short member is neglected: delta 1, moment unchanged', () => {
    const r = json({ ...col, pu: '400', mu: '200', klu: '80in', m1: '-120', betaDns: '0.6' }).results[0];
    expect(r.slenderness).toMatchObject({ neglected: true, delta: 1, magnifiedMoment: 200 });
  });
  it('the report lists every step', () => {
    const text = runCheck({ ...col, json: false, pu: '400', mu: '200', klu: '240in', m1: '-120', betaDns: '0.6', eiOption: 'b' });
    expect(text).toMatch(/Slenderness/);
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-fx-'));
    const report = join(dir, 'r.txt');
    runCheck({ ...col, json: false, pu: '400', mu: '200', muy: '60', klu: '240in', m1: '-120', betaDns: '0.6', eiOption: 'b', report });
    const body = spawnSync('cat', [report], { encoding: 'utf8' }).stdout;
    expect(body).toMatch(/SLENDERNESS STEPS/);
    expect(body).toMatch(/6\.6\.4\.4\.4\(b\)/);
    expect(body).toMatch(/BIAXIAL METHODS/);
    expect(body).toMatch(/qualified engineers/);
  });
  it('missing --beta-dns or a bad --ei-option: one line, exit 2', async () => {
    const args = ['check', '--fc', '4', '--fy', '60', '--b', '16', '--h', '16', '--gamma', '0.7', '--pu', '400', '--mu', '200', '--klu', '240in'];
    const a = await cli(args);
    expect(a.status).toBe(2);
    expect(a.stderr).toMatch(/--beta-dns/);
    const b = await cli([...args, '--beta-dns', '0.6', '--ei-option', 'z']);
    expect(b.status).toBe(2);
    expect(b.stderr).toMatch(/--ei-option/);
  });
});

describe('check on EN 1992-1-1: the basis declares its own methods', () => {
  it('nominal curvature (5.8.8) feeds Mu; the load-contour exponent follows Eq. 5.39', () => {
    // the hand-calculated column of tests/design/slenderness.test.ts: MEd = 155.06 kN·m (As = 8 Ø20 ≈ 0.0157·Ac)
    const out = JSON.parse(
      runCheck({ code: 'en1992-1-1', fc: '30', fy: '500', b: '400', h: '400', arrangement: 'four-faces', barsPerFace: '3', gamma: '0.75', rho: '0.01570796', pu: '1500', mu: '60', muy: '30', klu: '6000mm', m01: '30', m02: '60', creep: '1', proposals: '0', json: true }),
    );
    const r = out.results[0];
    expect(r.slenderness.method).toMatch(/5\.8\.8/);
    expectClose(r.slenderness.magnifiedMoment, 155.058, 1e-4);
    expectClose(r.Mu, 155.058, 1e-4);
    const a = r.biaxial.details.loadContour;
    expectClose(a.alpha, 1 + ((a.axialRatio - 0.1) / 0.6) * 0.5, 1e-6);
  });
});
