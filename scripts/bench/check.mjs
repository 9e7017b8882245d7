// Check figures (issue 4): exact required-ρg solutions per second, and a 10,000-row load file end to end.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { resolveBasis } from '../../dist/codes/registry.js';
import { prepareColumnCheck } from '../../dist/design/column-check.js';
import { rhoRequired } from '../../dist/design/rho-required.js';

export const name = 'check';
const root = fileURLToPath(new URL('../..', import.meta.url));

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
  const file = join(dir, 'loads.csv');
  const rows = ['id,Pu,Mu'];
  for (let i = 0; i < 10_000; i++) rows.push(`C${i + 1},${(-150 + ((i * 7919) % 1500)).toFixed(1)},${(20 + ((i * 104729) % 700)).toFixed(1)}`);
  writeFileSync(file, rows.join('\n') + '\n');
  const args = [join(root, 'bin', 'pmchart.js'), 'check', '--fc', '5', '--fy', '60', '--b', '24', '--h', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#9', '--loads', file, '--json'];
  const times = [];
  for (let k = 0; k < 3; k++) {
    const t1 = process.hrtime.bigint();
    // exit 1 means a load does not pass: a result, not a failure of the run
    const r = spawnSync(process.execPath, args, { maxBuffer: 1 << 30 });
    if (r.status !== 0 && r.status !== 1) throw new Error(`bench: check exited ${r.status}: ${r.stderr}`);
    times.push(Number(process.hrtime.bigint() - t1) / 1e9);
  }
  return [
    { figure: 'exact rhoRequired solutions, warm, one core', value: perSecond, unit: '1/s', target: '≥ 100,000' },
    { figure: '10,000-row load file end to end, process start incl. (best of 3)', value: Math.min(...times), unit: 's', target: '≤ 1.5 s' },
  ];
}
