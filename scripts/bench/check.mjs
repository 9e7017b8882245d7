// Check figures (issues 4 and 12): exact required-ρg solutions per second; 10,000-row load files end
// to end (process start included, best of 3): uniaxial with --json, and biaxial (Muy column, given ρg).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { resolveBasis } from '../../dist/codes/registry.js';
import { prepareColumnCheck } from '../../dist/design/column-check.js';
import { rhoRequired } from '../../dist/design/rho-required.js';
import { bestOf, bin, runNode } from './lib/measure.mjs';

export const name = 'check';

const loadsRun = (args) => {
  const r = runNode(args, { allowFailure: true });
  if (r.status !== undefined && r.status !== 0 && r.status !== 1) throw new Error(`bench: check exited ${r.status}: ${r.error}`);
  return r;
};

const SECTION = ['--fc', '5', '--fy', '60', '--b', '24', '--h', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#9'];

export async function run() {
  const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const ctx = prepareColumnCheck({ basis, shape: { kind: 'rectangle', b: 24, h: 24 }, arrangement: { kind: 'two-faces', barsPerFace: 3 }, gamma: 0.8, loads: [] });
  const limits = { min: 0.01, max: 0.08 };
  const loads = Array.from({ length: 1000 }, (_, i) => ({ P: -0.3 + ((i * 37) % 1000) / 250, M: 0.05 + ((i * 91) % 1000) / 800 }));
  let sink = 0;
  const solve = (n) => {
    for (let i = 0; i < n; i++) sink += rhoRequired(ctx.variants[0].table, loads[i % 1000], limits).rho ?? 0;
  };
  solve(50_000); // warm-up
  const n = 200_000;
  const t0 = process.hrtime.bigint();
  solve(n);
  const perSecond = n / (Number(process.hrtime.bigint() - t0) / 1e9);
  if (!(sink > 0)) throw new Error('bench: rhoRequired returned nothing');

  const dir = mkdtempSync(join(tmpdir(), 'pmchart-bench-'));
  try {
    const uni = join(dir, 'loads.csv');
    const rows = ['id,Pu,Mu'];
    for (let i = 0; i < 10_000; i++) rows.push(`C${i + 1},${(-150 + ((i * 7919) % 1500)).toFixed(1)},${(20 + ((i * 104729) % 700)).toFixed(1)}`);
    writeFileSync(uni, rows.join('\n') + '\n');
    const bi = join(dir, 'biaxial.csv');
    const brows = ['id,Pu,Mu,Muy'];
    for (let i = 0; i < 10_000; i++) brows.push(`B${i + 1},${(-100 + ((i * 7919) % 1200)).toFixed(1)},${(20 + ((i * 104729) % 500)).toFixed(1)},${(10 + ((i * 15485863) % 300)).toFixed(1)}`);
    writeFileSync(bi, brows.join('\n') + '\n');
    // exit 1 says a load does not pass: a result, not a failed run
    const u = bestOf(3, () => loadsRun([bin, 'check', ...SECTION, '--loads', uni, '--json']));
    const b = bestOf(3, () => loadsRun([bin, 'check', ...SECTION, '--rho', '0.02', '--loads', bi, '--json']));
    return [
      { figure: 'exact rhoRequired solutions, warm, one core', value: perSecond, unit: '1/s', target: '≥ 100,000' },
      { figure: '10,000 uniaxial loads, --json, end to end, wall (best of 3)', value: u.wall, unit: 's', target: '≤ 0.6 s' },
      { figure: '  same, CPU of that run', value: u.cpu, unit: 's', target: '' },
      { figure: '10,000 biaxial loads (Muy, given ρg), --json, end to end, wall', value: b.wall, unit: 's', target: '≤ 1.5 s' },
      { figure: '  same, CPU of that run', value: b.cpu, unit: 's', target: '' },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
