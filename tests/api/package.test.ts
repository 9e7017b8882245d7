/**
 * The library as another program uses it: `import … from 'pmchart'` through the package.json `exports`
 * map (Node resolves a package's own name from inside it), with no CLI in between. It runs the built
 * dist/, so it fails loudly when dist/ is missing or older than src/ (tests/helpers/built.ts).
 * Loads: the issue-4 hand-check (common practice, worked by hand): 24 × 24 in, f′c = 4 ksi, fy = 60 ksi,
 * ACI 318-19, bars on two faces at γ = 0.75, Pu = 900 kip, Mu = 600 kip-ft → Pu/(b·h) = 1.5625 ksi.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { requireFreshBuild } from '../helpers/built.js';

const root = new URL('../../', import.meta.url).pathname;

const run = (code: string) => spawnSync(process.execPath, ['--input-type=module', '-e', code], { cwd: root, encoding: 'utf8' });

describe("import { checkColumn } from 'pmchart'", () => {
  beforeAll(requireFreshBuild);
  it('has typings in dist/index.d.ts', () => {
    expect(existsSync(`${root}dist/index.d.ts`)).toBe(true);
  });

  it('checks a column without the CLI', () => {
    const r = run(`
      import { checkColumn, resolveBasis, LOAD_STATUSES } from 'pmchart';
      const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
      const c = checkColumn({ basis, shape: { kind: 'rectangle', b: 24, h: 24 }, arrangement: { kind: 'two-faces', barsPerFace: 2 },
        gamma: 0.75, loads: [{ id: 'C-1', Pu: 900, Mu: 600 * 12 }] });
      console.log(JSON.stringify({ P: c.results[0].normalised.P, rho: c.results[0].rhoRequired, status: c.results[0].status, frozen: Object.isFrozen(c), statuses: LOAD_STATUSES }));
    `);
    expect(r.stderr).toBe('');
    const out = JSON.parse(r.stdout);
    expect(out.P).toBeCloseTo(1.5625, 9);
    expect(out.rho).toBeGreaterThan(0.01);
    expect(out.rho).toBeLessThan(0.04);
    expect(out.status).toBe('ok');
    expect(out.frozen).toBe(true);
    expect(out.statuses).toEqual(['ok', 'fails', 'not-possible', 'unstable', 'outside-scope', 'detailing']);
  });

  it('computes a biaxial contour family and reads a load off it (issue 15)', () => {
    const r = run(`
      import { computeBiaxialFamily, BiaxialCharts, resolveBasis } from 'pmchart';
      const basis = resolveBasis('aci318-19', { units: 'us', fc: 5, fy: 60, transverse: 'tied' });
      const f = computeBiaxialFamily({ basis, shape: { kind: 'rectangle', b: 1, h: 1 }, arrangement: { kind: 'four-faces', barsPerFace: [3, 3] },
        gamma: 0.8, rhos: [0.02], levels: [0.3] });
      const c = f.contours[0][0];
      const charts = new BiaxialCharts({ basis, shape: { kind: 'rectangle', b: 20, h: 20 }, arrangement: { kind: 'four-faces', barsPerFace: 3 }, gamma: 0.8, rhoLimits: basis.rhoLimits });
      const reading = charts.read(0.3 * 5 * 400, 100 * 12, 80 * 12);
      console.log(JSON.stringify({ quadrants: f.quadrants, mxo: c.mxo, myo: c.myo, alpha: c.alpha, points: c.angleDeg.length, rho: reading.rhoFromChart }));
    `);
    expect(r.stderr).toBe('');
    const out = JSON.parse(r.stdout);
    // a square with the same bars on every face is symmetric about both axes and the diagonal (common practice)
    expect(out.quadrants).toBe('first');
    expect(out.mxo).toBeCloseTo(out.myo, 9);
    expect(out.points).toBe(19);
    expect(Number.isFinite(out.alpha)).toBe(true);
    expect(out.rho).toBeGreaterThanOrEqual(0.01);
  });

  it('renders one sheet of a chart set read from text', () => {
    const r = run(`
      import { readFileSync } from 'node:fs';
      import { nodeFileAccess, readChartSet, renderSheet } from 'pmchart';
      const set = readChartSet(readFileSync('charts-config/demo.json', 'utf8'), { files: nodeFileAccess, baseDir: 'charts-config' });
      const svg = await renderSheet(set, 1, 'svg');
      console.log(JSON.stringify({ sheets: set.sheets.length, svg: typeof svg === 'string' && svg.startsWith('<svg'), caution: String(svg).includes('qualified engineers') }));
    `);
    expect(r.stderr).toBe('');
    const out = JSON.parse(r.stdout);
    expect(out.sheets).toBeGreaterThan(1);
    expect(out.svg).toBe(true);
    expect(out.caution).toBe(true);
  });
});
