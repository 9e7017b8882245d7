/** `pmchart table` end to end through the CLI in-process, against first-principles chart points (ACI 318-19 22.2 strain compatibility, hand calculation: f′c 4 ksi, fy 60 ksi, γ 0.80, two faces). */
import { describe, expect, it } from 'vitest';
import { runTable } from '../../src/cli/table.js';
import { expectClose } from '../helpers/tolerance.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const cli = (args: string[]) => inProcess(args);
const base = ['table', '--code', 'aci318-19', '--units', 'us', '--fc', '4', '--fy', '60', '--shape', 'rectangle', '--gamma', '0.8', '--arrangement', 'two-faces'];

describe('pmchart table (CLI)', () => {
  it('prints CSV with the fixed leading columns and ≥ 400 rows per ρg', async () => {
    const r = await cli([...base, '--rho', '0.01:0.02:0.01', '--format', 'csv']);
    expect(r.status).toBe(0);
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toBe('rho_g,c_over_h,eps_t,phi,Pn_norm,Mn_norm,phiPn_norm,phiMn_norm');
    const rows = lines.slice(1).map((l) => l.split(',').map(Number));
    expect(rows.filter((r) => r[0] === 0.01).length).toBeGreaterThanOrEqual(400);
    expect(rows.filter((r) => r[0] === 0.02).length).toBeGreaterThanOrEqual(400);
    // the balanced row (c/h = 0.5327) for ρg = 0.02: Pn/(b·h) = 1.505, Mn/(b·h²) = 0.8876 (first principles)
    const bal = rows.filter((r) => r[0] === 0.02).find((r) => Math.abs(r[1]! - 0.53271) < 1e-4)!;
    expectClose(bal[4]!, 1.505, 0.001);
    expectClose(bal[5]!, 0.8876, 0.001);
    expectClose(bal[3]!, 0.65, 1e-9);
  });
  it('prints JSON with metadata and key points per ρg', async () => {
    const out = JSON.parse((await inProcess([...base, '--rho', '0.04', '--format', 'json'])).stdout);
    expect(out.code).toBe('aci318-19');
    expect(out.units).toBe('us');
    expect(out.normalisation.unit).toBe('ksi');
    expect(out.inputs.gamma).toBe(0.8);
    const kp = out.curves[0].key_points;
    expectClose(kp.find((k: { id: string }) => k.id === 'pure-compression').nominal.Pn_norm, 5.664, 0.001);
    expectClose(kp.find((k: { id: string }) => k.id === 'balanced').nominal.Mn_norm, 1.354, 0.001);
    expect(out.caution).toMatch(/qualified engineers/);
  });
  it('divides by f′c with --dimensionless', () => {
    const csv = runTable({ fc: '4', fy: '60', gamma: '0.8', rho: '0.02', dimensionless: true });
    const row = csv.trim().split('\n').slice(1).map((l) => l.split(',').map(Number)).find((r) => Math.abs(r[1]! - 0.53271) < 1e-4)!;
    expectClose(row[4]!, 1.505 / 4, 0.001);
  });
  it('gives identical bytes on two runs', () => {
    expect(runTable({ fc: '4', fy: '60', gamma: '0.8' })).toBe(runTable({ fc: '4', fy: '60', gamma: '0.8' }));
  });
  it('rejects bad input with one line naming the flag and range, exit 2, no stack trace', async () => {
    for (const [args, msg] of [
      [['--gamma', '1.2'], '--gamma: 1.2 is outside 0.3–0.95'],
      [['--fc', '30'], '--fc: 30 ksi is outside 2.5–20 ksi'],
      [['--rho', '0.2'], '--rho: 0.2 is outside 0.001–0.1'],
      [['--format', 'xml'], '--format: xml is not one of the allowed values (allowed: csv, json)'],
      [['--arrangement', 'ring', '--shape', 'circle', '--bars', '2'], '--bars: 2 is outside 4–48'], // the chart-set limit (issue 14: CLI and config share limits),
    ] as [string[], string][]) {
      // a flag given again replaces the base's (a repeated flag is an error of its own since issue 14)
      const merged = [...base];
      for (let i = 0; i < args.length; i += 2) {
        const at = merged.indexOf(args[i]!);
        if (at >= 0) merged[at + 1] = args[i + 1]!;
        else merged.push(args[i]!, args[i + 1]!);
      }
      const r = await cli(merged);
      expect(r.status).toBe(2);
      expect(r.stderr).toBe(`pmchart: ${msg}\n`);
      expect(r.stdout).toBe('');
    }
  });
});
