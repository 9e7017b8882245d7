/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
/**
 * The live page (`pmchart page`) in a real browser: Debian's `chromium` driven by playwright-core, one
 * browser, one file, tests in order. The page must give what the CLI gives for the same input, so most
 * checks compare the page with `pmchart table --format json` and `pmchart check --json`; the outside
 * anchors are hand calculations named beside them.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readChartSet } from '../../src/config/read.js';
import { runCli } from '../helpers/run-cli.js';
import { expectClose } from '../helpers/tolerance.js';
import { requireFreshBuild } from '../helpers/built.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const CHROMIUM = process.env.PMCHART_CHROMIUM ?? '/usr/bin/chromium';
const INSTALL = 'sudo apt-get update && sudo apt-get install -y chromium';
const cli = (args: string[]) => inProcess(args);
const cliJson = async (args: string[]) => JSON.parse((await inProcess(args)).stdout);

const dir = mkdtempSync(join(tmpdir(), 'pmchart-page-'));
const file = join(dir, 'column-charts.html');
const section = ['--fc', '4', '--fy', '60', '--gamma', '0.8', '--arrangement', 'two-faces', '--bars-per-face', '3'];

interface PageFamily {
  gamma: number;
  cOverH: number[];
  curves: { rho: number; Pn: number[]; Mn: number[]; phiPn: number[]; phiMn: number[]; keyPoints: { id: string; nominal: { P: number; M: number } | null; design: { P: number; M: number } | null }[] }[];
}

let browser: Browser;
let page: Page;
const problems: string[] = [];
const requests: string[] = [];

/** Sets a field as a user types it; resolves once the page has finished the update it starts (drawn, or stopped at a message). */
async function setField(key: string, value: string): Promise<void> {
  const before = await page.evaluate(() => (window as unknown as { pmchartPage: { settled(): number } }).pmchartPage.settled());
  await page.evaluate(([k, v]) => (window as unknown as { pmchartPage: { set(k: string, v: string): void } }).pmchartPage.set(k!, v!), [key, value]);
  await page.waitForFunction((n) => (window as unknown as { pmchartPage: { settled(): number } }).pmchartPage.settled() > n, before, { timeout: 30_000 });
}

const visibleMessages = () =>
  page.evaluate(() => Object.fromEntries([...document.querySelectorAll('.msg')].filter((m) => !(m as HTMLElement).hidden).map((m) => [m.id, m.textContent ?? ''])));

describe.sequential('pmchart page in Chromium', () => {
  beforeAll(async () => {
    requireFreshBuild(); // the page's browser code is dist/page/browser.js, built from src/page
    if (!existsSync(CHROMIUM)) {
      throw new Error(`Chromium is not installed at ${CHROMIUM}; the page tests need it. Install it with: ${INSTALL}`);
    }
    const r = await cli(['page', '--out', file, ...section, '--date', '2026-01-05']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    browser = await chromium.launch({ executablePath: CHROMIUM, args: process.getuid?.() === 0 ? ['--no-sandbox'] : [] });
    page = await browser.newPage({ viewport: { width: 1400, height: 1000 }, acceptDownloads: true });
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(`${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`exception: ${e.message}`));
    page.on('request', (q) => requests.push(q.url()));
    await page.goto(`file://${file}`);
    await page.waitForFunction(() => ((window as unknown as { pmchartPage?: { draws(): number } }).pmchartPage?.draws() ?? 0) > 0, null, { timeout: 60_000 });
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
  });

  it('loads from file:// with no console errors and makes no request beyond the file itself', async () => {
    expect(problems).toEqual([]);
    expect(requests).toEqual([`file://${file}`]);
    const html = readFileSync(file, 'utf8');
    const csp = /<meta http-equiv="Content-Security-Policy" content="([^"]+)">/.exec(html)?.[1] ?? '';
    expect(csp).toContain("default-src 'none'; connect-src 'none'");
    expect(csp).toMatch(/script-src 'sha256-[A-Za-z0-9+/=]+'/);
    expect(csp).not.toMatch(/unsafe-(inline|eval)/);
    expect(await page.locator('#chart svg').count()).toBe(1);
    expect(await page.locator('#caution').innerText()).toMatch(/qualified engineers/);
  });

  it('draws the family pmchart table gives; Po/Ag is the hand value', async () => {
    const fam = (await page.evaluate(() => (window as unknown as { pmchartPage: { family(): unknown } }).pmchartPage.family())) as PageFamily;
    // Po/Ag = 0.85·f′c·(1 − ρg) + fy·ρg = 0.85·4·0.96 + 60·0.04 = 5.664 ksi (ACI 318-19 22.4.2.2, worked by hand)
    const c04 = fam.curves.find((c) => c.rho === 0.04)!;
    expectClose(c04.keyPoints.find((k) => k.id === 'pure-compression')!.nominal!.P, 5.664, 1e-9);
  });

  it('after f′c and γ change, family data and key points equal `pmchart table --format json` within 1e-6', async () => {
    await setField('fc', '7ksi');
    await setField('gamma', '0.78');
    expect(await visibleMessages()).toEqual({});
    const fam = (await page.evaluate(() => (window as unknown as { pmchartPage: { family(): unknown } }).pmchartPage.family())) as PageFamily;
    const table = await cliJson(['table', '--format', 'json', ...section.map((a) => (a === '4' ? '7ksi' : a === '0.8' ? '0.78' : a))]);
    expect(fam.gamma).toBe(0.78);
    expect(fam.curves.map((c) => c.rho)).toEqual(table.curves.map((c: { rho_g: number }) => c.rho_g));
    fam.curves.forEach((c, j) => {
      const t = table.curves[j];
      expect(c.Pn.length).toBe(t.points.length);
      t.points.forEach((row: number[], i: number) => {
        expectClose(fam.cOverH[i]!, row[1]!, 1e-6, 1e-9);
        expectClose(c.Pn[i]!, row[4]!, 1e-6, 1e-9);
        expectClose(c.Mn[i]!, row[5]!, 1e-6, 1e-9);
        expectClose(c.phiPn[i]!, row[6]!, 1e-6, 1e-9);
        expectClose(c.phiMn[i]!, row[7]!, 1e-6, 1e-9);
      });
      for (const k of t.key_points) {
        const p = c.keyPoints.find((x) => x.id === k.id)!;
        if (k.nominal) (expectClose(p.nominal!.P, k.nominal.Pn_norm, 1e-6, 1e-9), expectClose(p.nominal!.M, k.nominal.Mn_norm, 1e-6, 1e-9));
        if (k.factored) (expectClose(p.design!.P, k.factored.phiPn_norm, 1e-6, 1e-9), expectClose(p.design!.M, k.factored.phiMn_norm, 1e-6, 1e-9));
      }
    });
  });

  it('reads P/Ag, M/(Ag·h), e/h and ρg under the pointer', async () => {
    const box = (await page.locator('#chart svg').boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.35, box.y + box.height * 0.35);
    await expect.poll(() => page.locator('#reading').innerText()).toMatch(/P\/Ag [\d.]+ ksi · M\/\(Ag·h\) [\d.]+ ksi · e\/h [\d.]+ · ρg/);
  });

  it('the loads table equals `pmchart check --json`; the hand-check load reads 0.03 rounded', async () => {
    const gamma = String(20 / 24);
    const csv = 'id,Pu,Mu\nload,900,600\nC2-wind,450,520kip-ft\nC3-grav,1300,150\n';
    const loadsFile = join(dir, 'loads.csv');
    writeFileSync(loadsFile, csv);
    await setField('fc', '4');
    await setField('gamma', gamma);
    await setField('b', '24');
    await setField('h', '24');
    await setField('loads', csv);
    expect(await visibleMessages()).toEqual({});
    const out = await cliJson(['check', '--json', ...section.map((a) => (a === '0.8' ? gamma : a)), '--b', '24', '--h', '24', '--loads', loadsFile]);
    const cells = await page.$$eval('#results tbody tr', (rows) =>
      rows.map((r) => ({ id: r.getAttribute('data-id'), ...Object.fromEntries([...r.querySelectorAll('td[class]')].map((td) => [td.className, td.getAttribute('data-value')])) })),
    );
    expect(cells.map((c) => c.id)).toEqual(out.results.map((r: { id: string }) => r.id));
    out.results.forEach((r: Record<string, number | null>, i: number) => {
      const c = cells[i] as Record<string, string>;
      expect(c['rho-required']).toBe(r.rhoRequired === null ? '' : String(r.rhoRequired));
      expect(c['rho-chart']).toBe(r.rhoFromChart === null ? '' : String(r.rhoFromChart));
      expect(c['rho-rounded']).toBe(r.rhoRoundedDown === null ? '' : String(r.rhoRoundedDown));
      expect(c['steel-cost']).toBe(r.extraSteelRoundedDown === null ? '' : String(r.extraSteelRoundedDown));
    });
    // issue-4 hand check (common practice, worked by hand): Pu/Ag = 900/576 = 1.5625 ksi; the next lower
    // sheet rounded to the next curve reads ρg 0.03
    const hand = out.results.find((r: { id: string }) => r.id === 'load');
    expect(hand.normalised.P).toBeCloseTo(1.5625, 6);
    expect(cells.find((c) => c.id === 'load')!['rho-rounded' as never]).toBe('0.03');
    expect(await page.locator('#results tr.governing').count()).toBe(1);
    expect(await page.locator('#cmd-check').innerText()).toContain('pmchart check');
  });

  it('gives a chart-set snippet that `pmchart set` reads', async () => {
    const text = await page.locator('#set-json').innerText();
    const set = readChartSet(text);
    expect(set.sheets.map((s) => s.gamma)).toEqual([0.8, 20 / 24, 0.85].map((g) => Number(g.toPrecision(6))));
  });

  it('shows bad input inline, the CLI’s message in field names (not flags), with no exception, and keeps the last chart', async () => {
    const draws = await page.evaluate(() => (window as unknown as { pmchartPage: { draws(): number } }).pmchartPage.draws());
    await setField('gamma', '1.2');
    const cliGamma = (await cli(['table', ...section.map((a) => (a === '0.8' ? '1.2' : a))])).stderr.trim().replace(/^pmchart: /, '');
    expect(cliGamma.startsWith('--gamma: ')).toBe(true);
    expect((await visibleMessages())['m-gamma']).toBe(cliGamma.replace(/^--gamma: /, 'γ: '));
    await setField('gamma', '0.8');
    await setField('fc', 'abc');
    const cliFc = (await cli(['table', ...section.map((a) => (a === '4' ? 'abc' : a))])).stderr.trim().replace(/^pmchart: /, '');
    expect(cliFc.startsWith('--fc: ')).toBe(true);
    expect((await visibleMessages())['m-fc']).toBe(cliFc.replace(/^--fc: /, 'f′c (fck): '));
    expect(await page.locator('#chart svg').count()).toBe(1);
    expect(await page.evaluate(() => (window as unknown as { pmchartPage: { draws(): number } }).pmchartPage.draws())).toBe(draws + 1);
    expect(problems).toEqual([]);
    await setField('fc', '4');
  });

  it('exports the chart as SVG carrying the caution and the basis', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-svg')]);
    const svg = readFileSync((await download.path())!, 'utf8');
    expect(svg).toMatch(/^<svg/);
    expect(svg).toContain('For use by qualified engineers only. Check every result against the governing code edition and local practice');
    expect(svg).toContain('ACI 318-19');
    expect(problems).toEqual([]);
  });

  it('typed Pu, Mu and Muy: the page shows the exact biaxial ρg required and the CLI’s own note on it', async () => {
    await setField('loads', '');
    await setField('pu', '900');
    await setField('mu', '600');
    await setField('muy', '300');
    const note = await page.locator('#loads-table pre.effects').innerText();
    const text = (await cli(['check', ...section, '--b', '24', '--h', '24', '--pu', '900', '--mu', '600', '--muy', '300', '--proposals', '0'])).stdout;
    expect(note).toContain('exact biaxial ρg required');
    expect(text).toContain(note.trim());
    expect(problems).toEqual([]);
  });

  it('biaxial view: contours at the levels the check read, the CLI’s ρg chart biax, one curve per reachable ρg', async () => {
    // a corner column with unequal counts: 3 bars on each 16 in face, 5 on each 24 in face
    await setField('arrangement', 'four-faces');
    await setField('barsPerFace', '3,5');
    await setField('b', '16');
    await setField('h', '24');
    await setField('pu', '844.8');
    await setField('mu', '150');
    await setField('muy', '80');
    expect(await visibleMessages()).toEqual({});
    await page.waitForFunction(() => !(document.getElementById('biaxial') as HTMLElement).hidden);
    const run = await runCli(['check', '--json', ...section.map((a) => (a === 'two-faces' ? 'four-faces' : a === '3' ? '3,5' : a)), '--b', '16', '--h', '24', '--pu', '844.8', '--mu', '150', '--muy', '80']);
    expect(run.stderr).toBe('');
    const out = JSON.parse(run.stdout);
    const biax = out.results[0].biaxial;
    const readout = (cls: string) => page.locator(`#biaxial-readout td.${cls}`).getAttribute('data-value');
    expect(await readout('rho-chart-biaxial')).toBe(String(biax.rhoFromChart));
    expect(await readout('rho-required-biaxial')).toBe(String(biax.rhoRequired));
    expect(await readout('chart-minus-exact')).toBe(String(biax.chartMinusExact));
    expect(await readout('levels-read')).toBe(biax.chartLevels.map((l: { level: number }) => l.level).join(','));
    // Pu/(f′c·Ag) = 844.8/(4·384) = 0.55: the sheets at 0.5 and 0.6 are read
    expect(biax.chartLevels.map((l: { level: number }) => l.level)).toEqual([0.5, 0.6]);
    // Which contours a panel can draw, by hand (ACI 318-19 22.4.2.1, 22.4.2.2, Table 21.2.2 tied φ = 0.65):
    // φPn,max/Ag = 0.65·0.8·(0.85·4·(1 − ρg) + 60·ρg) = 0.52·(3.4 + 56.6·ρg) ksi reaches 0.5·4 = 2.0 ksi for every
    // ρg ≥ 0.01 (2.062 ksi at 0.01), but 0.6·4 = 2.4 ksi only for ρg ≥ 0.0215: the 0.6 panel starts at 0.03.
    const hand = [out.biaxialChart.rhos, out.biaxialChart.rhos.filter((r: number) => r >= 0.0215)];
    expect(hand[1]).toEqual([0.03, 0.04, 0.05, 0.06, 0.07, 0.08]);
    const drawn = (await page.evaluate(() => (window as unknown as { pmchartPage: { biaxial(): unknown } }).pmchartPage.biaxial())) as { levels: number[]; drawn: { rhos: number[] }[] };
    expect(drawn.levels).toEqual([0.5, 0.6]);
    expect(drawn.drawn.map((d) => d.rhos)).toEqual(hand);
    // one drawn line per reachable ρg in each panel of the SVG, and the governing load marked once per panel
    const cells = await page.$$eval('#biaxial-chart g.cell > g', (gs) => gs.map((g) => ({ lines: g.querySelectorAll('g.biax_contours_marks path').length, governing: g.querySelectorAll('g.biax_load_governing_marks path').length })));
    expect(cells).toEqual(hand.map((h) => ({ lines: h.length, governing: 1 })));
    expect(await page.locator('#biaxial-alpha tbody tr').count()).toBe(out.biaxialChart.rhos.length);
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-biaxial-svg')]);
    const svg = readFileSync((await download.path())!, 'utf8');
    expect(svg).toMatch(/^<svg/);
    expect(svg).toContain('For use by qualified engineers only.');
    expect(svg).toContain('ACI 318-19');
    await page.locator('#biaxial').screenshot({ path: join(tmpdir(), 'pmchart-page-biaxial.png') });
    expect(problems).toEqual([]);
  });

  it('biaxial view: pasted loads with a Muy column; another load’s levels on request', async () => {
    const csv = 'id,Pu,Mu,Muy\nC-corner-1,844.8,150,80\nC-corner-2,420,210,-160\nC-corner-3,1000,60,40\n';
    const loadsFile = join(dir, 'corner-loads.csv');
    writeFileSync(loadsFile, csv);
    await setField('loads', csv);
    expect(await visibleMessages()).toEqual({});
    const run = await runCli(['check', '--json', ...section.map((a) => (a === 'two-faces' ? 'four-faces' : a === '3' ? '3,5' : a)), '--b', '16', '--h', '24', '--loads', loadsFile]);
    expect(run.stderr).toBe('');
    const out = JSON.parse(run.stdout);
    const column = await page.$$eval('#results tbody tr', (rows) => rows.map((row) => [row.getAttribute('data-id'), row.querySelector('td.rho-chart-biaxial')?.getAttribute('data-value')]));
    expect(column).toEqual(out.results.map((r: { id: string; biaxial: { rhoFromChart: number | null } }) => [r.id, r.biaxial.rhoFromChart === null ? '' : String(r.biaxial.rhoFromChart)]));
    for (const r of out.results as { id: string; biaxial: { rhoFromChart: number | null } }[]) {
      await setField('biax-load', r.id);
      expect(await page.locator('#biaxial-readout td.biax-load-id').getAttribute('data-value')).toBe(r.id);
      expect(await page.locator('#biaxial-readout td.rho-chart-biaxial').getAttribute('data-value')).toBe(r.biaxial.rhoFromChart === null ? '' : String(r.biaxial.rhoFromChart));
    }
    // every load is drawn on every panel, the governing one as the diamond
    const loadsPerCell = await page.$$eval('#biaxial-chart g.cell > g', (gs) => gs.map((g) => g.querySelectorAll('g.biax_loads_marks path, g.biax_load_governing_marks path').length));
    expect(loadsPerCell.every((n) => n === 3)).toBe(true);
    await page.locator('#biaxial').screenshot({ path: join(tmpdir(), 'pmchart-page-biaxial-csv.png') });
    await setField('loads', '');
    await setField('muy', '');
    expect(await page.locator('#biaxial').isHidden()).toBe(true);
    expect(problems).toEqual([]);
  });

  it('never touches the network in the whole session', () => {
    expect(requests.filter((u) => u !== `file://${file}` && !u.startsWith('blob:') && !u.startsWith('data:'))).toEqual([]);
  });
});
