#!/usr/bin/env node
// Speed figures, printed only (tests never assert on timings). Runs against dist/: `npm run build` first.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
if (!existsSync(join(root, 'dist', 'cli', 'main.js'))) {
  console.error('bench: dist/ is missing; run `npm run build` first');
  process.exit(2);
}
const imp = (p) => import(new URL(`../dist/${p}`, import.meta.url).href);

// ── check: exact required ρg (issue 4) ──────────────────────────────────────────────────────────
{
  const { resolveBasis } = await imp('codes/registry.js');
  const { prepareCheck } = await imp('design/check.js');
  const { rhoRequired } = await imp('design/rho-required.js');
  const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const ctx = prepareCheck({ basis, shape: { kind: 'rectangle', b: 24, h: 24 }, arrangement: { kind: 'two-faces', barsPerFace: 3 }, gamma: 0.8, loads: [] });
  const limits = { min: 0.01, max: 0.08 };
  const loads = Array.from({ length: 1000 }, (_, i) => ({ P: -0.3 + ((i * 37) % 1000) / 250, M: 0.05 + ((i * 91) % 1000) / 800 }));
  let sink = 0;
  const run = (n) => {
    for (let i = 0; i < n; i++) sink += rhoRequired(ctx.table, loads[i % 1000], limits).rho ?? 0;
  };
  run(50_000); // warm-up
  const n = 200_000;
  const t0 = process.hrtime.bigint();
  run(n);
  const s = Number(process.hrtime.bigint() - t0) / 1e9;
  console.log(`check: exact rhoRequired, warm, one core: ${Math.round(n / s).toLocaleString('en-US')} solutions/s (target ≥ 100,000) [${sink > 0 ? 'ok' : ''}]`);
}

// ── check: 10,000-row load file end to end, process start included (issue 4) ──────────────────
{
  const dir = mkdtempSync(join(tmpdir(), 'pmchart-bench-'));
  const file = join(dir, 'loads.csv');
  const rows = ['id,Pu,Mu'];
  for (let i = 0; i < 10_000; i++) rows.push(`C${i + 1},${(-150 + ((i * 7919) % 1500)).toFixed(1)},${(20 + ((i * 104729) % 700)).toFixed(1)}`);
  writeFileSync(file, rows.join('\n') + '\n');
  const args = [join(root, 'bin', 'pmchart.js'), 'check', '--fc', '5', '--fy', '60', '--b', '24', '--h', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#9', '--loads', file, '--json'];
  const times = [];
  for (let k = 0; k < 3; k++) {
    const t0 = process.hrtime.bigint();
    execFileSync('node', args, { maxBuffer: 1 << 30 });
    times.push(Number(process.hrtime.bigint() - t0) / 1e9);
  }
  console.log(`check: 10,000-row load file, end to end incl. process start: best ${Math.min(...times).toFixed(2)} s of 3 (target ≤ 1.5 s)`);
}
