/**
 * pmchart as a user gets it: `npm pack` of this checkout (after `npm run build`), the tarball unpacked into
 * a temporary `node_modules/pmchart`, its dependencies linked from the checkout's node_modules (so the test
 * runs offline), and every command run from another folder. Catches what only shows once installed: files
 * left out of package.json `files`, code that reads the working directory for its own files, and dev
 * dependencies reached at run time (the page once bundled itself with esbuild at run time, issue 23).
 * One pack serves every case. A missing or stale dist/ fails here, loudly: the build is the thing tested.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, realpathSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { BUILT, requireFreshBuild, root } from '../helpers/built.js';

const tmp = mkdtempSync(join(tmpdir(), 'pmchart-installed-'));
/** where the package is installed, as npm would place it for a project in tmp/app */
const app = join(tmp, 'app');
const pkg = join(app, 'node_modules', 'pmchart');
/** the user's folder, neither the checkout nor the package */
const work = join(tmp, 'work');
const section = ['--fc', '4', '--fy', '60', '--gamma', '0.8', '--arrangement', 'four-faces', '--bars-per-face', '3'];

const pmchart = (args: string[]) => spawnSync(process.execPath, [join(pkg, 'bin', 'pmchart.js'), ...args], { cwd: work, encoding: 'utf8', env: { ...process.env, PMCHART_DEBUG: '' } });

describe('the packed package, installed elsewhere (npm pack)', () => {
  beforeAll(() => {
    requireFreshBuild();
    const packed = JSON.parse(
      execFileSync('npm', ['pack', '--json', '--ignore-scripts', '--pack-destination', tmp], { cwd: root, encoding: 'utf8', env: { ...process.env, npm_config_offline: 'true', npm_config_audit: 'false', npm_config_fund: 'false' } }),
    ) as { filename: string }[];
    mkdirSync(pkg, { recursive: true });
    execFileSync('tar', ['-xzf', join(tmp, packed[0]!.filename), '-C', pkg, '--strip-components=1']);
    // the dependencies, from the checkout (offline): what `npm install <tarball>` would have fetched
    symlinkSync(realpathSync(join(root, 'node_modules')), join(pkg, 'node_modules'), 'dir');
    mkdirSync(work);
  }, 180_000);

  it('holds the built CLI, library and page, and no sources or tests', () => {
    for (const f of [...BUILT, 'bin/pmchart.js', 'package.json', 'README.md']) expect(existsSync(join(pkg, f)), f).toBe(true);
    expect(existsSync(join(pkg, 'src'))).toBe(false);
    expect(existsSync(join(pkg, 'tests'))).toBe(false);
  });

  it('--help lists the commands', () => {
    const r = pmchart(['--help']);
    expect(r.status).toBe(0);
    for (const c of ['table', 'check', 'contour', 'set', 'sheet', 'schedule', 'page']) expect(r.stdout).toMatch(new RegExp(`^  ${c} `, 'm'));
  });

  it('table writes the family', () => {
    const r = pmchart(['table', ...section, '--rho', '0.02,0.04']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout.split('\n').length).toBeGreaterThan(100);
  });

  it('check: one load, and a load file by --loads', () => {
    // Pu/(b·h) = 500 kip / (20 in × 20 in) = 1.25 ksi (hand calculation)
    const one = pmchart(['check', ...section, '--b', '20', '--h', '20', '--pu', '500', '--mu', '200', '--json']);
    expect(one.stderr).toBe('');
    expect(one.status).toBe(0);
    expect(JSON.parse(one.stdout).results[0].normalised.P).toBeCloseTo(1.25, 9);
    writeFileSync(join(work, 'loads.csv'), 'id,Pu,Mu\nA,500,200\nB,300,150\n');
    const file = pmchart(['check', ...section, '--b', '20', '--h', '20', '--loads', 'loads.csv', '--json']);
    expect(file.stderr).toBe('');
    expect(file.status).toBe(0);
    expect(JSON.parse(file.stdout).results.map((r: { id: string }) => r.id).sort()).toEqual(['A', 'B']);
  });

  it('sheet --out x.svg writes the sheet', () => {
    const r = pmchart(['sheet', ...section, '--rho', '0.02,0.04', '--out', 'x.svg']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(readFileSync(join(work, 'x.svg'), 'utf8')).toMatch(/^<svg|^<\?xml/);
  });

  it('contour writes an SVG plot', () => {
    const r = pmchart(['contour', ...section, '--b', '20', '--h', '20', '--rho', '0.02', '--pu', '500', '--out', 'c.svg']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(readFileSync(join(work, 'c.svg'), 'utf8')).toContain('<svg');
  });

  it('set renders a tiny chart set (render processes start from the installed bundle)', () => {
    writeFileSync(
      join(work, 'tiny.json'),
      JSON.stringify({
        name: 'tiny',
        titleBlock: { office: 'Fenwick Hollow Engineers (invented)', project: 'Test Bay Annex (invented)', date: '2026-01-05' },
        units: 'us',
        basis: { code: 'aci318-19' },
        paper: { size: 'letter' },
        rhoG: [0.02, 0.04],
        sheets: [{ fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
      }),
    );
    const r = pmchart(['set', 'tiny.json', '--out', 'sets', '--jobs', '1', '--no-progress']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(readFileSync(join(work, 'sets', 'tiny', 'book.pdf')).subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('schedule checks a one-mark schedule', () => {
    writeFileSync(
      join(work, 'schedule.csv'),
      'mark,code,units,fc,fy,b,h,diameter,arrangement,bars_per_face,bars,bar,cover,tie,transverse\nK1,aci318-19,si,35MPa,420MPa,600,600,,four-faces,4,,25,40,10,tied\n',
    );
    writeFileSync(join(work, 'schedule-loads.csv'), 'mark,id,Pu,Mu\nK1,U1,3000,200\nK1,U2,2500,300\n');
    const r = pmchart(['schedule', 'schedule.csv', '--loads', 'schedule-loads.csv', '--json']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).columns.map((c: { mark: string }) => c.mark)).toEqual(['K1']);
  });

  it('page --out x.html writes the page with its browser code', () => {
    const r = pmchart(['page', ...section, '--out', 'x.html', '--date', '2026-01-05']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const html = readFileSync(join(work, 'x.html'), 'utf8');
    expect(html).toContain(readFileSync(join(pkg, 'dist/page/browser.js'), 'utf8'));
    expect(html).toContain('For use by qualified engineers only.');
  });

  it("import('pmchart') by name from the project's folder, and checkColumn", () => {
    const r = spawnSync(
      process.execPath,
      [
        '--input-type=module',
        '-e',
        `const { checkColumn, resolveBasis } = await import('pmchart');
         const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
         const c = checkColumn({ basis, shape: { kind: 'rectangle', b: 24, h: 24 }, arrangement: { kind: 'two-faces', barsPerFace: 2 }, gamma: 0.75, loads: [{ id: 'C-1', Pu: 900, Mu: 600 * 12 }] });
         console.log(JSON.stringify({ P: c.results[0].normalised.P, status: c.results[0].status, from: import.meta.resolve('pmchart') }));`,
      ],
      { cwd: app, encoding: 'utf8' },
    );
    expect(r.stderr).toBe('');
    const out = JSON.parse(r.stdout);
    // the package resolved is the installed one, not the checkout
    expect(out.from).toContain('/app/node_modules/pmchart/');
    // Pu/(b·h) = 900 kip / (24 in × 24 in) = 1.5625 ksi (hand calculation)
    expect(out.P).toBeCloseTo(1.5625, 9);
    expect(out.status).toBe('ok');
  });
});
