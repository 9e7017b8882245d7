// Check figures (issues 4, 12 and 21): exact required-ρg solutions per second; 10,000-row load files end
// to end (process start included, best of 3 by CPU): uniaxial with --json on a symmetric layout without
// slenderness, and biaxial (Muy column, given ρg). Targets are CPU seconds (user + system) of the run; an
// unsymmetric layout and a ring (exact searches, issue 19) are reported beside them without a target.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { resolveBasis } from '../../dist/codes/registry.js';
import { prepareColumnCheck } from '../../dist/design/column-check.js';
import { rhoRequired } from '../../dist/design/rho-required.js';
import { bin, runNode } from './lib/measure.mjs';
import { QUICK, scaled } from './lib/quick.mjs';

/** The lowest-CPU of n runs (CPU: the shared machine makes wall times noisy), with the largest RSS seen. */
function bestCpuOf(n, fn) {
  const runs = Array.from({ length: n }, fn);
  const best = runs.reduce((a, b) => (b.cpu < a.cpu ? b : a));
  return { ...best, rssMb: Math.max(...runs.map((r) => r.rssMb)) };
}

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
  solve(scaled(50_000, 5_000)); // warm-up
  const n = scaled(200_000, 20_000);
  const t0 = process.hrtime.bigint();
  solve(n);
  const perSecond = n / (Number(process.hrtime.bigint() - t0) / 1e9);
  if (!(sink > 0)) throw new Error('bench: rhoRequired returned nothing');

  const dir = mkdtempSync(join(tmpdir(), 'pmchart-bench-'));
  try {
    const N = scaled(10_000, 1_000);
    const runs = QUICK ? 1 : 3;
    const count = N.toLocaleString('en');
    const uni = join(dir, 'loads.csv');
    const rows = ['id,Pu,Mu'];
    for (let i = 0; i < N; i++) rows.push(`C${i + 1},${(-150 + ((i * 7919) % 1500)).toFixed(1)},${(20 + ((i * 104729) % 700)).toFixed(1)}`);
    writeFileSync(uni, rows.join('\n') + '\n');
    const bi = join(dir, 'biaxial.csv');
    const brows = ['id,Pu,Mu,Muy'];
    for (let i = 0; i < N; i++) brows.push(`B${i + 1},${(-100 + ((i * 7919) % 1200)).toFixed(1)},${(20 + ((i * 104729) % 500)).toFixed(1)},${(10 + ((i * 15485863) % 300)).toFixed(1)}`);
    writeFileSync(bi, brows.join('\n') + '\n');
    // an unsymmetric layout (more steel on the +y face: exact searches about x) and a ring in a circle (orientations)
    const custom = join(dir, 'custom.json');
    writeFileSync(custom, JSON.stringify([{ x: -0.4, y: 0.4, share: 2 }, { x: 0, y: 0.4, share: 2 }, { x: 0.4, y: 0.4, share: 2 }, { x: -0.4, y: -0.4 }, { x: 0.4, y: -0.4 }]));
    // exit 1 says a load does not pass: a result, not a failed run
    const u = bestCpuOf(runs, () => loadsRun([bin, 'check', ...SECTION, '--loads', uni, '--json']));
    const b = bestCpuOf(runs, () => loadsRun([bin, 'check', ...SECTION, '--rho', '0.02', '--loads', bi, '--json']));
    const un = loadsRun([bin, 'check', '--fc', '5', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.8', '--arrangement', 'custom', '--custom-bars', custom, '--rho', '0.02', '--loads', uni, '--json']);
    const ring = loadsRun([bin, 'check', '--fc', '5', '--fy', '60', '--shape', 'circle', '--diameter', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#9', '--arrangement', 'ring', '--bars', '8', '--loads', uni, '--json']);
    const per = QUICK ? ` (quick: ${count} loads; targets are for 10,000)` : '';
    return [
      { figure: 'exact rhoRequired solutions, warm, one core', value: perSecond, unit: '1/s', target: '≥ 100,000' },
      { figure: `${count} uniaxial loads, symmetric, no slenderness, --json: CPU${per}`, value: u.cpu, unit: 's', target: '≤ 0.6 s' },
      { figure: '  same: wall, peak RSS', value: `${u.wall.toFixed(2)} s, ${u.rssMb.toFixed(0)} MB`, unit: '', target: '' },
      { figure: `${count} biaxial loads (Muy, given ρg), --json: CPU`, value: b.cpu, unit: 's', target: '≤ 1.5 s' },
      { figure: '  same: wall, peak RSS', value: `${b.wall.toFixed(2)} s, ${b.rssMb.toFixed(0)} MB`, unit: '', target: '' },
      { figure: `${count} uniaxial loads, unsymmetric custom layout (exact search): CPU`, value: un.cpu, unit: 's', target: '(reported)' },
      { figure: `${count} uniaxial loads, ring of 8 in a circle (orientations): CPU`, value: ring.cpu, unit: 's', target: '(reported)' },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
