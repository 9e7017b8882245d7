/**
 * Start-up path of the production bundle (issue 12): `--help`, `table` and `check` must not load
 * node-canvas, vega, vega-lite or pdf-lib, nor our render and sheet code. Checked by what the module
 * loader resolves (a resolve hook records every URL), never by timing. dist/bundle/meta.json (written
 * by scripts/bundle.mjs) says which sources each bundle file holds.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const bin = join(root, 'bin', 'pmchart.js');
const dir = mkdtempSync(join(tmpdir(), 'pmchart-startup-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Runs in the loader thread: appends every resolved URL to the file named by PMCHART_LOAD_LOG.
const hook = `data:text/javascript,${encodeURIComponent(`
import { appendFileSync } from 'node:fs';
export async function resolve(specifier, context, next) {
  const r = await next(specifier, context);
  if (!r.url.startsWith('node:')) appendFileSync(process.env.PMCHART_LOAD_LOG, r.url + '\\n');
  return r;
}`)}`;
const register = `data:text/javascript,${encodeURIComponent(`import { register } from 'node:module'; register(${JSON.stringify(hook)});`)}`;

/** Bundle files (paths relative to the repository) that hold a heavy package or render code. */
function heavyBundleFiles(): Set<string> {
  const meta = JSON.parse(readFileSync(join(root, 'dist/bundle/meta.json'), 'utf8')) as {
    outputs: Record<string, { inputs: Record<string, unknown>; imports?: { path: string; external?: boolean }[] }>;
  };
  const heavy = new Set<string>();
  const heavySource = /^(node_modules\/(canvas|vega|vega-lite|vega-[a-z-]+|pdf-lib|@pdf-lib\/[a-z]+)\/|src\/(render|sheet)\/)/;
  for (const [out, o] of Object.entries(meta.outputs)) {
    if (out.endsWith('.map')) continue;
    if (Object.keys(o.inputs).some((i) => heavySource.test(i))) heavy.add(out);
  }
  return heavy;
}

function loadedFiles(args: string[]): { status: number | null; files: string[] } {
  const log = join(dir, `load-${args[0]}-${Math.random().toString(36).slice(2)}.log`);
  const r = spawnSync(process.execPath, ['--import', register, bin, ...args], { env: { ...process.env, PMCHART_LOAD_LOG: log }, encoding: 'utf8' });
  const files = existsSync(log) ? readFileSync(log, 'utf8').trim().split('\n') : [];
  return { status: r.status, files: files.map((u) => (u.startsWith('file://') ? fileURLToPath(u).slice(root.length) : u)) };
}

const SECTION = ['--fc', '5', '--fy', '60', '--b', '24', '--h', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#9'];
const heavyPackage = /node_modules\/(canvas|vega|vega-lite|pdf-lib|@pdf-lib)\//;

describe('start-up of the bundled CLI', () => {
  it('the bundle exists and holds the render code apart from the entry', () => {
    const heavy = heavyBundleFiles();
    expect(heavy.has('dist/bundle/pmchart.js')).toBe(false);
    expect([...heavy].some((f) => f.startsWith('dist/bundle/vendor/'))).toBe(true);
  });

  for (const args of [['--help'], ['table', '--fc', '7', '--fy', '80', '--gamma', '0.8'], ['check', ...SECTION, '--pu', '400', '--mu', '200'], ['check', ...SECTION, '--rho', '0.02', '--pu', '400', '--mu', '200', '--muy', '60', '--json']]) {
    it(`\`pmchart ${args.slice(0, 1).join(' ')}${args.includes('--muy') ? ' (biaxial)' : ''}\` loads neither canvas, vega nor pdf-lib`, () => {
      const heavy = heavyBundleFiles();
      const { status, files } = loadedFiles(args);
      expect(status).toBe(0);
      expect(files).toContain('dist/bundle/pmchart.js');
      expect(files.filter((f) => heavyPackage.test(f) || heavy.has(f))).toEqual([]);
    });
  }

  it('a drawing command does load them (the check above can fail)', () => {
    const heavy = heavyBundleFiles();
    const { status, files } = loadedFiles(['sheet', ...SECTION, '--out', join(dir, 'sheet.pdf')]);
    expect(status).toBe(0);
    expect(files.some((f) => /node_modules\/canvas\//.test(f))).toBe(true);
    expect(files.filter((f) => heavy.has(f)).length).toBeGreaterThan(0);
  });
});
