/**
 * Big inputs within the caps finish with bounded memory (issue 14). Memory is measured by running
 * the built CLI under a V8 heap cap (--max-old-space-size), never by timing: before the fix the
 * 2,000-curve table built one string of every row (and a c/h sweep of 6,374 rows per curve) and
 * the 200k-row load file went through a hand-written splitter and spread arguments.
 */
import { closeSync, existsSync, mkdtempSync, openSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { MAX_DRAWN_REPORT_LOADS } from '../../src/input/limits.js';

const bin = new URL('../../bin/pmchart.js', import.meta.url).pathname;
const dist = new URL('../../dist/input/loads-csv.js', import.meta.url).pathname;
const dir = mkdtempSync(join(tmpdir(), 'pmchart-big-'));

describe('big inputs within the caps', () => {
  it('a 2,000-value ρg table streams under a 48 MB heap, CSV and JSON', () => {
    const rhos = Array.from({ length: 2000 }, (_, i) => Number((0.001 + i * 0.0000495).toFixed(7)));
    for (const format of ['csv', 'json']) {
      const file = join(dir, `table.${format}`);
      const fd = openSync(file, 'w');
      const r = spawnSync(process.execPath, ['--max-old-space-size=48', bin, 'table', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--rho', rhos.join(','), '--format', format], { stdio: ['ignore', fd, 'pipe'], encoding: 'utf8' });
      closeSync(fd);
      expect(r.stderr).toBe('');
      expect(r.status).toBe(0);
      expect(statSync(file).size).toBeGreaterThan(50e6);
      if (format === 'csv') {
        const text = readFileSync(file, 'utf8');
        const last = text.slice(text.lastIndexOf('\n', text.length - 2) + 1).trim().split(',').map(Number);
        expect(last[0]).toBe(rhos[1999]);
        expect(last.every(Number.isFinite)).toBe(true);
      }
    }
  }, 300_000);

  it('a 200,000-row load file is read under a 160 MB heap, every load finite', () => {
    const rows = ['id,Pu kip,Mu [kip-ft]'];
    for (let i = 0; i < 200_000; i++) rows.push(`L${i},${100 + (i % 500)},${50 + (i % 300)}`);
    const file = join(dir, 'loads.csv');
    writeFileSync(file, `${rows.join('\n')}\n`);
    const script = `import { readFileSync } from 'node:fs';
      const { parseLoadsCsv } = await import(${JSON.stringify(dist)});
      const loads = parseLoadsCsv(readFileSync(${JSON.stringify(file)}, 'utf8'), 'us');
      process.stdout.write(String(loads.length) + ' ' + loads.every((l) => Number.isFinite(l.Pu) && Number.isFinite(l.Mu)));`;
    const r = spawnSync(process.execPath, ['--max-old-space-size=160', '--input-type=module', '-e', script], { encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.stdout).toBe('200000 true');
  }, 300_000);

  it('a drawn report above its load cap is refused in one line, exit 2, before any check', () => {
    const rows = ['id,Pu,Mu'];
    for (let i = 0; i <= MAX_DRAWN_REPORT_LOADS; i++) rows.push(`L${i},100,50`);
    const file = join(dir, 'drawn.csv');
    writeFileSync(file, `${rows.join('\n')}\n`);
    const report = join(dir, 'drawn.pdf');
    const r = spawnSync(process.execPath, [bin, 'check', '--fc', '4', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.8', '--loads', file, '--report', report], { encoding: 'utf8' });
    expect(r.stderr).toBe(`pmchart: --report: draws at most ${MAX_DRAWN_REPORT_LOADS} loads and --loads has ${MAX_DRAWN_REPORT_LOADS + 1}; write a .txt or .json report for every load\n`);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(existsSync(report)).toBe(false);
  }, 120_000);

  it('one row beyond the cap is refused before any check', () => {
    const rows = ['id,Pu,Mu'];
    for (let i = 0; i <= 200_000; i++) rows.push(`L${i},1,1`);
    const file = join(dir, 'too-many.csv');
    writeFileSync(file, `${rows.join('\n')}\n`);
    const r = spawnSync(process.execPath, [bin, 'check', '--fc', '4', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.8', '--loads', file], { encoding: 'utf8' });
    expect(r.stderr).toBe('pmchart: --loads: has more than 200000 load rows (allowed: 1–200000 rows)\n');
    expect(r.status).toBe(2);
  }, 120_000);
});
