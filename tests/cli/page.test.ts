/**
 * `pmchart page` through the CLI in-process (it reads the page bundle `npm run build` writes): one self-contained HTML file, deterministic, with a CSP that
 * allows exactly its own inline script and style by hash; bad presets exit 2 and leave no file.
 * (The page in a browser: tests/page/page.test.ts.)
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { cli as inProcess, type CliResult } from '../helpers/run-cli.js';

const cli = (args: string[]) => inProcess(args);
const dir = mkdtempSync(join(tmpdir(), 'pmchart-page-cli-'));
const flags = ['--fc', '7ksi', '--fy', '80ksi', '--gamma', '0.78', '--arrangement', 'four-faces', '--bars-per-face', '4', '--date', '2026-03-02'];
const hash = (s: string) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`;

describe('pmchart page (CLI)', () => {
  const a = join(dir, 'a.html');
  let first: CliResult;
  let html = '';
  beforeAll(async () => {
    first = await cli(['page', '--out', a, ...flags]);
    html = existsSync(a) ? readFileSync(a, 'utf8') : '';
  });

  it('writes one HTML file holding its script and style, and nothing it loads from elsewhere', () => {
    expect(first.status).toBe(0);
    expect(first.stdout.trim()).toBe(a);
    expect(html).toMatch(/^<!doctype html>/);
    expect(html).not.toMatch(/<script[^>]+src=|<link[^>]+href=|@import|url\(http/i);
  });

  it('allows exactly its inline script and style by sha256, with no unsafe sources', () => {
    const csp = /<meta http-equiv="Content-Security-Policy" content="([^"]+)">/.exec(html)![1]!.replace(/&#39;|&apos;/g, "'");
    const script = /<script>([\s\S]*)<\/script>\n<\/body>/.exec(html)![1]!;
    const style = /<style>([\s\S]*?)<\/style>/.exec(html)![1]!;
    expect(csp.startsWith("default-src 'none'; connect-src 'none'")).toBe(true);
    expect(csp).toContain(`script-src ${hash(script)}`);
    expect(csp).toContain(`style-src ${hash(style)}`);
    expect(csp).toContain('img-src data: blob:');
    expect(csp).not.toContain('unsafe');
    expect(html.match(/<script>/g)).toHaveLength(1);
  });

  it('carries the presets under the flag names and the caution', () => {
    const presets = JSON.parse(/<script type="application\/json" id="pmchart-presets">([\s\S]*?)<\/script>/.exec(html)![1]!);
    expect(presets.fields).toMatchObject({ fc: '7ksi', fy: '80ksi', gamma: '0.78', arrangement: 'four-faces', barsPerFace: '4' });
    expect(presets.grid).toBe(0.05);
    expect(html).toContain('For use by qualified engineers only.');
  });

  it('gives the same bytes for the same presets', async () => {
    const b = join(dir, 'b.html');
    expect((await cli(['page', '--out', b, ...flags])).status).toBe(0);
    expect(readFileSync(b, 'utf8')).toBe(html);
  });

  it('checks presets as `pmchart table` does: bad input exits 2 with one line and writes nothing', async () => {
    const bad = join(dir, 'bad.html');
    for (const [args, message] of [
      [['--gamma', '1.2', '--fc', '4', '--fy', '60'], 'pmchart: --gamma: 1.2 is outside 0.3–0.95\n'],
      [['--gamma', '0.8', '--fc', 'abc', '--fy', '60'], null],
      [['--grid', '0.2'], 'pmchart: --grid: 0.2 is not one of the allowed values (allowed: 0.05, 0.1)\n'],
    ] as const) {
      const r = await cli(['page', '--out', bad, ...args]);
      expect(r.status).toBe(2);
      expect(r.stderr.split('\n')).toHaveLength(2);
      if (message) expect(r.stderr).toBe(message);
      expect(existsSync(bad)).toBe(false);
    }
    const txt = await cli(['page', '--out', join(dir, 'x.txt')]);
    expect(txt.status).toBe(2);
    expect(txt.stderr).toContain('--out');
  });

  it('reads a load CSV as `pmchart check --loads` does, naming the line of a bad cell', async () => {
    const csv = join(dir, 'loads.csv');
    writeFileSync(csv, 'id,Pu,Mu\nC1,900,600\nC2,abc,100\n');
    const r = await cli(['page', '--out', join(dir, 'l.html'), ...flags, '--loads', csv]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^pmchart: --loads line 3 Pu: /);
  });

  it('works from any folder: run with the working directory outside the project, it writes the page (no bundling at run time)', async () => {
    // the bug: the page was bundled at run time by esbuild, which resolved from the working directory
    const elsewhere = mkdtempSync(join(tmpdir(), 'pmchart-page-cwd-'));
    const r = await inProcess(['page', '--out', 'here.html', ...flags], { cwd: elsewhere });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const written = readFileSync(join(elsewhere, 'here.html'), 'utf8');
    // the same page as written from the project's folder
    expect(written).toBe(html);
  });
});
