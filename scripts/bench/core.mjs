// Core figures: one family of 8 curves (≥ 400 points each), with the affine-in-ρg sweep and naively;
// cold start of `pmchart table`; peak memory of a table of 2,000 ρg values.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { computeFamily } from '../../dist/analysis/family.js';
import { baseGrid } from '../../dist/analysis/family.js';
import { prepareSection, nominalAt, designAt } from '../../dist/analysis/prepared-section.js';
import { ACI_318_19 } from '../../dist/codes/aci318.js';
import { layoutBars } from '../../dist/section/arrangements.js';
import { runNode } from './lib/measure.mjs';

export const name = 'core';

const basis = ACI_318_19.resolve({ units: 'us', fc: 7, fy: 80, transverse: 'tied' });
const shape = { kind: 'rectangle', b: 1, h: 1 };
const arrangement = { kind: 'four-faces', barsPerFace: 4 };
const rhos = [0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08];

function median(fn, runs) {
  const t = [];
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint();
    fn();
    t.push(Number(process.hrtime.bigint() - t0) / 1e6);
  }
  return t.sort((a, b) => a - b)[Math.floor(runs / 2)];
}

/** Curve by curve: real bar areas per ρg, both models evaluated at every point, no shared sweep. */
function naive() {
  const grid = baseGrid(400);
  for (const rho of rhos) {
    const s = prepareSection(basis, shape, layoutBars(shape, arrangement, rho, { gamma: 0.8 }));
    for (const c of grid) {
      const r = s.respond(c);
      nominalAt(r, rho);
      designAt(r, rho);
    }
  }
}

export async function run() {
  const fast = () => computeFamily({ basis, shape, arrangement, gamma: 0.8, rhos });
  const n = fast().curves[0].Pn.length;
  for (let i = 0; i < 50; i++) { fast(); naive(); }
  const tFast = median(fast, 200);
  const tNaive = median(naive, 200);
  const bin = fileURLToPath(new URL('../../bin/pmchart.js', import.meta.url));
  const args = [bin, 'table', '--fc', '7', '--fy', '80', '--gamma', '0.8', '--arrangement', 'four-faces', '--bars-per-face', '4'];
  spawnSync(process.execPath, args);
  const cold = [];
  for (let i = 0; i < 7; i++) {
    const t0 = process.hrtime.bigint();
    spawnSync(process.execPath, args, { stdio: 'ignore' });
    cold.push(Number(process.hrtime.bigint() - t0) / 1e9);
  }
  cold.sort((a, b) => a - b);
  const big = runNode([bin, 'table', '--fc', '7', '--fy', '80', '--gamma', '0.8', '--rho', '0.01:0.08:0.000035'], { stdio: ['ignore', 'ignore', 'pipe'], allowFailure: true });
  const bigNote = big.error ? `failed: ${big.error.replace(/^pmchart: /, '')}` : '';
  return [
    { figure: `family of 8 curves × ${n} points, shared sweep (warm median)`, value: tFast, unit: 'ms', target: '≤ 2 ms' },
    { figure: 'same family computed naively, curve by curve (warm median)', value: tNaive, unit: 'ms', target: '(comparison)' },
    { figure: '`pmchart table` cold start, wall (median of 7)', value: cold[3], unit: 's', target: '≤ 0.6 s' },
    { figure: '`pmchart table` with 2,000 ρg values: peak RSS', value: big.rssMb, unit: 'MB', target: '≤ 200 MB (streamed)' },
    { figure: '  same, wall', value: big.wall, unit: 's', target: bigNote },
  ];
}
