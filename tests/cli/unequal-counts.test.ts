/**
 * `--bars-per-face nb,nh` and `--gamma-b` on the command line (issue 15): read for four-faces, refused
 * with exit 2 and one line naming the flag elsewhere, and γB carried to the exact biaxial analysis.
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/run-cli.js';
import { expectClose } from '../helpers/tolerance.js';

// an invented 16 × 24 in column, f′c 4 ksi, fy 60 ksi, γ 0.75, 12 #8 as [3, 5]
const section = ['--fc', '4', '--fy', '60', '--b', '16', '--h', '24', '--gamma', '0.75', '--arrangement', 'four-faces'];

describe('--bars-per-face 3,5', () => {
  it('check reads the pair, checks 12 bars and names the counts', async () => {
    const r = await runCli(['check', ...section, '--bars-per-face', '3,5', '--bar', '#8', '--pu', '300', '--mu', '200', '--proposals', '0', '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.section.arrangement).toEqual({ kind: 'four-faces', barsPerFace: [3, 5] });
    expect(out.section).not.toHaveProperty('gammaB');
    expect(out.checked.description).toBe('12 #8 (3 on each b face, 5 on each h face)');
    // 12 × 0.79 in² (ASTM A615 Table 1) over 16 × 24 in
    expectClose(out.checked.rho, 9.48 / 384, 1e-6);
  });
  it('the text view names the counts in the section line', async () => {
    const r = await runCli(['check', ...section, '--bars-per-face', '3,5', '--bar', '#8', '--pu', '300', '--mu', '200', '--proposals', '0']);
    expect(r.stdout).toContain('four-faces (3 on each b face, 5 on each h face)');
  });
  it('check --json proposals for Mux with Muy carry an unequal pair as perFace [nb, nh], as barsPerFace', async () => {
    const r = await runCli(['check', '--fc', '5', '--fy', '60', '--b', '16', '--h', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#8', '--arrangement', 'four-faces', '--pu', '400', '--mu', '300', '--muy', '150', '--json']);
    expect(r.code).toBe(0);
    const pairs = JSON.parse(r.stdout).bars.filter((p: { perFace: unknown }) => Array.isArray(p.perFace));
    expect(pairs.length).toBeGreaterThan(0);
    for (const p of pairs) {
      const [nb, nh] = p.perFace as [number, number];
      expect(p.count).toBe(2 * nb + 2 * nh - 4);
      expect(p.layout).toContain(`(${nb} on each b face, ${nh} on each h face, corners on both)`);
    }
  });
  it('a single count keeps today’s meaning: 3 on every face, 8 bars', async () => {
    const r = await runCli(['check', ...section, '--bars-per-face', '3', '--bar', '#8', '--pu', '300', '--mu', '200', '--proposals', '0', '--json']);
    const out = JSON.parse(r.stdout);
    expect(out.section.arrangement).toEqual({ kind: 'four-faces', barsPerFace: 3 });
    expect(out.checked.description).toBe('8 #8');
  });

  const refusals: [string, string[], RegExp][] = [
    ['a pair for two-faces', ['--bars-per-face', '3,5'], /^pmchart: --bars-per-face: 3,5 takes two counts nb,nh only with --arrangement four-faces; two-faces takes one/],
    ['a pair for side-faces', ['--bars-per-face', '3,5'], /^pmchart: --bars-per-face: .*only with --arrangement four-faces/],
    ['three counts', ['--bars-per-face', '3,5,7'], /^pmchart: --bars-per-face: 3,5,7 is not a whole number or two whole numbers "nb,nh"/],
    ['a count below 2', ['--bars-per-face', '1,5'], /^pmchart: --bars-per-face: 1 is outside 2–20/],
    ['a count above 20', ['--bars-per-face', '3,21'], /^pmchart: --bars-per-face: 21 is outside 2–20/],
    ['γB beyond γ’s range', ['--bars-per-face', '3,5', '--gamma-b', '1.2'], /^pmchart: --gamma-b: 1.2 is outside 0.3–0.95/],
  ];
  for (const [what, flags, message] of refusals) {
    it(`refuses ${what} with exit 2 and one line naming the flag`, async () => {
      const arrangement = what.includes('two-faces') ? 'two-faces' : what.includes('side-faces') ? 'side-faces' : 'four-faces';
      const r = await runCli(['table', ...section.slice(0, -1), arrangement, ...flags]);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
    });
  }
  it('refuses --gamma-b with --cover (one cover on every face) and on a circle', async () => {
    const cover = await runCli(['table', '--fc', '4', '--fy', '60', '--b', '16', '--h', '24', '--cover', '1.5', '--bar', '#8', '--gamma-b', '0.6']);
    expect(cover.code).toBe(2);
    expect(cover.stderr).toMatch(/^pmchart: --gamma-b: needs --gamma/);
    const circle = await runCli(['table', '--fc', '4', '--fy', '60', '--shape', 'circle', '--arrangement', 'ring', '--gamma', '0.75', '--gamma-b', '0.6']);
    expect(circle.code).toBe(2);
    expect(circle.stderr).toMatch(/^pmchart: --gamma-b: applies to rectangles/);
  });
});

describe('--gamma-b reaches the exact biaxial analysis (contour)', () => {
  it('γB 0.5: at 90° and φPn = 0.65·541.45 kips, c = 8 in and φMny = 0.65·3873.328 in·kips = 209.8053 kip·ft (hand calculation, strain compatibility per ACI 318-19 22.2)', async () => {
    // Bending about y, compression on the +x face; the section is 16 in deep and 24 in wide. γB = 0.5 puts
    // the h faces at x = ±0.5·16/2 = ±4 in: 5 bars at d = 4 in, 2 at d = 8 in (mid b faces), 5 at d = 12 in.
    // c = 8 in, a = 0.85·8 = 6.8 in (ACI 318-19 22.2.2.4), Cc = 0.85·4·6.8·24 = 554.88 kips at x = 4.6 in → 2552.448 in·kips
    //   d = 4  (5 #8): εs = 0.003·4/8 = 0.0015 → 29000·0.0015 − 3.4 = 40.1 ksi, F = 3.95·40.1 = 158.395, M = ·4 = 633.58
    //   d = 8  (2 #8): εs = 0
    //   d = 12 (5 #8): εs = −0.0015 → −43.5 ksi, F = −171.825, M = ·(−4) = 687.3
    // Pn = 554.88 + 158.395 − 171.825 = 541.45 kips; Mn = 3873.328 in·kips; εt = 0.0015 < εy: φ = 0.65 (Table 21.2.2)
    const r = await runCli(['contour', ...section, '--gamma-b', '0.5', '--bars-per-face', '3,5', '--bar', '#8', '--pu', String(0.65 * 541.45), '--format', 'json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.inputs.gammaB).toBe(0.5);
    const cols: string[] = out.columns;
    const row: number[] = out.points.find((p: number[]) => p[cols.indexOf('na_angle_deg')] === 90);
    expectClose(row[cols.indexOf('na_depth')]!, 8, 1e-6);
    expectClose(row[cols.indexOf('My')]!, (0.65 * 3873.328) / 12, 1e-6);
  });
  it('check with --gamma-b: a load on that hand-summed point has exact biaxial utilisation 1', async () => {
    const muy = (0.65 * 3873.328) / 12; // kip·ft
    const r = await runCli(['check', ...section, '--gamma-b', '0.5', '--bars-per-face', '3,5', '--bar', '#8', '--pu', String(0.65 * 541.45), '--mu', '0', '--muy', String(muy), '--proposals', '0', '--json']);
    const out = JSON.parse(r.stdout);
    expect(out.section.gammaB).toBe(0.5);
    const b = out.results[0].biaxial;
    expectClose(b.exact, 1, 1e-6);
    expectClose(b.details.exact.neutralAxisAngleDeg, 90, 1e-6);
    expectClose(b.details.exact.neutralAxisDepth, 8, 1e-6);
  });
});
