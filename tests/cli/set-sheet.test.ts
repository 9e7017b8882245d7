/** `pmchart set` and `pmchart sheet` through the CLI in-process, and the lazy-import rule. */
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli as inProcess } from '../helpers/run-cli.js';

const root = new URL('../../', import.meta.url).pathname;
const cli = (args: string[], env: Record<string, string> = {}) => inProcess(args, { env });
const tmp = mkdtempSync(join(tmpdir(), 'pmchart-cli-'));

describe('pmchart set', () => {
  it('rejects a bad set with one line naming the field, exit 2, and writes nothing', async () => {
    const demo = JSON.parse(readFileSync(join(root, 'charts-config/demo.json'), 'utf8'));
    demo.sheets[0].gamma = { from: 0.7, to: 1.2, step: 0.25 };
    delete demo.officeFile; // the copy is elsewhere: its office file would not be found
    const file = join(tmp, 'bad.json');
    writeFileSync(file, JSON.stringify(demo));
    const r = await cli(['set', file, '--out', join(tmp, 'out')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('pmchart: sheets[0].gamma.to: 1.2 is outside 0.3–0.95\n'); // the schema names the field of the range (issue 14)
    expect(existsSync(join(tmp, 'out'))).toBe(false);
  });

  it('makes a small set with plain progress lines when stderr is not a terminal', async () => {
    const file = join(tmp, 'small.json');
    writeFileSync(
      file,
      JSON.stringify({
        $schema: '../chart-set.schema.json',
        name: 'small-set',
        titleBlock: { office: 'Brackenridge Civil (invented)', project: 'Millrace Depot (invented)', date: '2026-02-01' },
        units: 'si',
        basis: { code: 'aci318-19' },
        rhoG: [0.01, 0.03],
        outputs: { pdf: true, tables: true },
        sheets: [{ fc: '35MPa', fy: '420MPa', gamma: [0.7, 0.8], arrangement: { kind: 'four-faces', barsPerFace: 3 } }],
      }),
    );
    const r = await cli(['set', file, '--out', join(tmp, 'out2')]);
    expect(r.stderr).toBe('pmchart: small-set: 1/2 sheets\npmchart: small-set: 2/2 sheets\n');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('small-set: 2 sheets');
    expect(existsSync(join(tmp, 'out2/small-set/book.pdf'))).toBe(true);
    expect(existsSync(join(tmp, 'out2/small-set/tables/1-square-fc-35mpa-fy-420mpa-gamma-0.70-four-faces-3-per-face-tied.csv'))).toBe(true);
  });
});

describe('pmchart sheet', () => {
  it('writes one sheet from the section flags (SVG by extension)', async () => {
    const out = join(tmp, 'one.svg');
    const r = await cli(['sheet', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--bars-per-face', '3', '--rho', '0.01,0.02', '--office', 'Tamsin Yard Engineers (invented)', '--out', out]);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const svg = readFileSync(out, 'utf8');
    expect(svg).toContain('>ρg 0.02</text>');
    expect(svg).toContain('Tamsin Yard Engineers (invented)');
  });

  it('rejects flags out of range with the flag name', async () => {
    const r = await cli(['sheet', '--fc', '4', '--fy', '60', '--gamma', '1.2', '--out', join(tmp, 'x.pdf')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('pmchart: --gamma: 1.2 is outside 0.3–0.95\n');
    const r2 = await cli(['sheet', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--out', join(tmp, 'x.jpg')]);
    expect(r2.stderr).toMatch(/^pmchart: --out: .*x\.jpg must end in \.svg, \.png or \.pdf\n$/);
  });

  it('gives a deterministic PDF with SOURCE_DATE_EPOCH', async () => {
    const a = join(tmp, 'a.pdf');
    const b = join(tmp, 'b.pdf');
    const args = ['sheet', '--fc', '5', '--fy', '60', '--gamma', '0.75', '--shape', 'circle', '--arrangement', 'ring', '--bars', '8', '--transverse', 'spiral', '--rho', '0.02'];
    expect((await cli([...args, '--out', a], { SOURCE_DATE_EPOCH: '1767225600' })).status).toBe(0);
    expect((await cli([...args, '--out', b], { SOURCE_DATE_EPOCH: '1767225600' })).status).toBe(0);
    expect(Buffer.compare(readFileSync(a), readFileSync(b))).toBe(0);
  });
});

describe('import graph', () => {
  /** Static imports reachable from a module (type-only and dynamic `await import()` excluded). */
  const reach = (entry: string, seen = new Set<string>(), packages = new Set<string>()) => {
    if (seen.has(entry)) return packages;
    seen.add(entry);
    const src = readFileSync(entry, 'utf8');
    for (const m of src.matchAll(/^\s*(?:import|export)\s+(?!type\b)[^'";]*?from\s+'([^']+)'|^\s*import\s+'([^']+)'/gm)) {
      const spec = m[1] ?? m[2]!;
      if (spec.startsWith('.')) reach(resolve(dirname(entry), spec.replace(/\.js$/, '.ts')), seen, packages);
      else packages.add(spec);
    }
    return packages;
  };
  it('keeps vega, canvas, pdf-lib and cli-progress out of the CLI entry (rendering is imported lazily)', () => {
    const pkgs = [...reach(join(root, 'src/cli/main.ts'))];
    for (const heavy of ['vega', 'vega-lite', 'canvas', 'pdf-lib', '@pdf-lib/fontkit', 'cli-progress']) expect(pkgs).not.toContain(heavy);
    expect(pkgs).toContain('commander');
  });
});

describe('pmchart sheet --omega', () => {
  it('keys the curves by ω and turns them into ρg = ω·fcd/fyd (EN 1992-1-1 3.1.6, 3.2.7: C60 fcd = 40 MPa, B500 fyd = 434.78 MPa)', async () => {
    const { sheetSetFromFlags } = await import('../../src/cli/sheet.js');
    const { sheetRhos } = await import('../../src/sheet/curves.js');
    const { set, basis } = await sheetSetFromFlags({ code: 'en1992-1-1', fc: '60', fy: '500', gamma: '0.8', omega: '0.2,0.4' });
    expect(set.ratios).toEqual({ kind: 'omega', values: [0.2, 0.4] });
    const rhos = sheetRhos(set, basis);
    expect(rhos[1]!).toBeCloseTo((0.4 * 40) / (500 / 1.15), 10);
  });
  it('refuses --omega with --rho, one line, exit 2', async () => {
    const r = await cli(['sheet', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--omega', '0.1', '--rho', '0.01', '--out', join(tmp, 'x.pdf')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('pmchart: --omega: and --rho both set the curves; give one of them\n');
    expect(existsSync(join(tmp, 'x.pdf'))).toBe(false);
  });
});
