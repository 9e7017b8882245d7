/** `pmchart table` with the EN 1992-1-1 and CSA A23.3-19 bases, and the --omega families. */
import { describe, expect, it } from 'vitest';
import { runTable } from '../../src/cli/table.js';
import { expectClose } from '../helpers/tolerance.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const cli = (args: string[]) => inProcess(args);
const ec2 = { code: 'en1992-1-1', units: 'si', fc: '30', fy: '500', gamma: '0.8' };

interface Kp {
  id: string;
  factored: { c_over_h: number; phiPn_norm: number; phiMn_norm: number } | null;
}
const keyPoints = (json: string, j = 0): Kp[] => JSON.parse(json).curves[j].key_points;
const kp = (list: Kp[], id: string) => list.find((k) => k.id === id)!.factored!;

describe('pmchart table --code en1992-1-1 (source: EN 1992-1-1:2004, first principles)', () => {
  it('gives the normalised balanced point and pure compression of C30/37, B500, ρ = 0.02', () => {
    const out = runTable({ ...ec2, rho: '0.02', format: 'json', dimensionless: true });
    const list = keyPoints(out);
    expectClose(kp(list, 'balanced').c_over_h, 0.5552, 0, 0.0005);
    expectClose(kp(list, 'balanced').phiPn_norm, 0.4394, 0.001);
    expectClose(kp(list, 'balanced').phiMn_norm, 0.2908, 0.001);
    expectClose(kp(list, 'pure-compression').phiPn_norm, 1.38, 0.001);
    const meta = JSON.parse(out);
    expect(meta.codeTitle).toBe('EN 1992-1-1:2004');
    expect(meta.normalisation.divisor).toBe(20);
    expect(meta.basis.symbols.designAxial).toBe('NRd');
  });
  it('takes the rectangular block through --concrete-law', () => {
    const list = keyPoints(runTable({ ...ec2, rho: '0.02', format: 'json', dimensionless: true, concreteLaw: 'rectangular-block' }));
    expectClose(kp(list, 'balanced').phiPn_norm, 0.4341, 0.001);
    expectClose(kp(list, 'balanced').phiMn_norm, 0.2934, 0.001);
  });
  it('takes the inclined branch with --steel-k and --steel-eps-uk: pure tension at σs(εud) (3.2.7(2)a, hand calculation)', () => {
    // k = 1.15, εuk = 7.5 %, εud = 6.75 %: σs = 434.783·[1 + 0.15·(0.0675 − 0.0021739)/(0.075 − 0.0021739)] = 493.29 MPa
    const list = keyPoints(runTable({ ...ec2, rho: '0.02', format: 'json', steelBranch: 'inclined', steelK: '1.15', steelEpsUk: '0.075' }));
    expectClose(kp(list, 'pure-tension').phiPn_norm, -0.02 * 493.29, 1e-3);
    expect(() => runTable({ ...ec2, steelBranch: 'inclined', steelK: '2' })).toThrowError('--steel-k: 2 is outside 1–1.35');
  });
  it('draws families per ω with --omega: ω = 0.4348 is ρ = 0.02 (ω = ρ·fyd/fcd, hand calculation)', () => {
    const out = JSON.parse(runTable({ ...ec2, omega: '0.2,0.434783', format: 'json' }));
    expect(out.inputs.omega).toEqual([0.2, 0.434783]);
    expectClose(out.curves[0].rho_g, 0.0092, 1e-9);
    expectClose(out.curves[1].rho_g, 0.02, 1e-6);
    expect(out.curves[1].omega).toBe(0.434783);
  });
  it('rejects --omega with --rho, and ω outside the span of ρ 0.001–0.10', () => {
    expect(() => runTable({ ...ec2, omega: '0.2', rho: '0.01' })).toThrowError(/^--omega: and --rho both set the families/);
    expect(() => runTable({ ...ec2, omega: '3' })).toThrowError('--omega: 3 is outside 0.0217–2.17');
  });
  it('exits 2 with one line when asked for US units', async () => {
    const r = await cli(['table', '--code', 'en1992-1-1', '--units', 'us', '--fc', '4', '--fy', '60', '--gamma', '0.8']);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('pmchart: --units: us is not available for EN 1992-1-1:2004 (allowed: si)\n');
    expect(r.stdout).toBe('');
  });
});

describe('pmchart table --code csa-a23.3-19 (source: hand calculation from CSA A23.3-19 10.10.4)', () => {
  const csa = { code: 'csa-a23.3-19', units: 'si', fc: '35', fy: '400', gamma: '0.7', rho: '0.025', format: 'json' };
  it('caps the factored family at 0.80·Pro without a size, Pro/Ag = 4190327.5/160000 = 26.18955 MPa', () => {
    const list = keyPoints(runTable(csa));
    expectClose(kp(list, 'pure-compression').phiPn_norm, 26.18955, 1e-6);
    expectClose(kp(list, 'axial-cap').phiPn_norm, 0.8 * 26.18955, 1e-6);
  });
  it('uses (0.2 + 0.002·h) for a sized tied column: h = 250 mm gives 0.70·Pro', () => {
    const list = keyPoints(runTable({ ...csa, b: '400', h: '250' }));
    expectClose(kp(list, 'axial-cap').phiPn_norm, 0.7 * 26.18955, 1e-6);
  });
});
