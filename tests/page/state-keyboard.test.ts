/// <reference lib="dom" />
/**
 * The live page's state, keyboard and CSV in a real browser (Debian's `chromium` through playwright-core):
 * a reload restores the inputs from the URL fragment, pasted loads too long for it stay out and the page
 * says so, the chart is read from the keyboard, and the loads download as a CSV the CLI reads back.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FRAGMENT_CAP } from '../../src/page/state.js';
import { requireFreshBuild } from '../helpers/built.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const CHROMIUM = process.env.PMCHART_CHROMIUM ?? '/usr/bin/chromium';
const dir = mkdtempSync(join(tmpdir(), 'pmchart-page-state-'));
const file = join(dir, 'state.html');
const section = ['--fc', '4', '--fy', '60', '--gamma', '0.8', '--arrangement', 'two-faces', '--bars-per-face', '3', '--b', '24', '--h', '24'];

type Hooks = { pmchartPage: { settled(): number; draws(): number; set(k: string, v: string): void } };
let browser: Browser;
let page: Page;
const problems: string[] = [];

const drawn = () => page.waitForFunction(() => ((window as unknown as Partial<Hooks>).pmchartPage?.draws() ?? 0) > 0, null, { timeout: 60_000 });

async function setField(key: string, value: string): Promise<void> {
  const before = await page.evaluate(() => (window as unknown as Hooks).pmchartPage.settled());
  await page.evaluate(([k, v]) => (window as unknown as Hooks).pmchartPage.set(k!, v!), [key, value]);
  await page.waitForFunction((n) => (window as unknown as Hooks).pmchartPage.settled() > n, before, { timeout: 30_000 });
}

describe.sequential('page state, keyboard and CSV in Chromium', () => {
  beforeAll(async () => {
    requireFreshBuild(); // the page's browser code is dist/page/browser.js, built from src/page
    if (!existsSync(CHROMIUM)) throw new Error(`Chromium is not installed at ${CHROMIUM}; install it with: sudo apt-get update && sudo apt-get install -y chromium`);
    const r = await inProcess(['page', '--out', file, ...section, '--date', '2026-01-05']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    browser = await chromium.launch({ executablePath: CHROMIUM, args: process.getuid?.() === 0 ? ['--no-sandbox'] : [] });
    page = await browser.newPage({ viewport: { width: 1400, height: 1000 }, acceptDownloads: true });
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(`${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`exception: ${e.message}`));
    await page.goto(`file://${file}`);
    await drawn();
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
  });

  it('a reload restores the inputs from the URL fragment, loads included', async () => {
    await setField('gamma', '0.72');
    await setField('pu', '900');
    await setField('mu', '600');
    expect(new URL(page.url()).hash).toContain('gamma=0.72');
    await page.reload();
    await drawn();
    expect(await page.locator('#f-gamma').inputValue()).toBe('0.72');
    expect(await page.locator('#f-pu').inputValue()).toBe('900');
    expect(await page.locator('#f-mu').inputValue()).toBe('600');
    expect(await page.locator('#results tbody tr').count()).toBe(1);
    expect(problems).toEqual([]);
  });

  it('pasted loads too long for the address stay out of it, and the page says so', async () => {
    const rows = Array.from({ length: 150 }, (_, i) => `C${i},${500 + i},${100 + i}`).join('\n');
    await setField('loads', `id,Pu,Mu\n${rows}\n`);
    const hash = new URL(page.url()).hash;
    expect(hash.length).toBeLessThanOrEqual(FRAGMENT_CAP + 1);
    expect(hash).not.toContain('loads=');
    expect(hash).toContain('gamma=0.72');
    await expect.poll(() => page.locator('#url-note').isVisible()).toBe(true);
    expect(await page.locator('#url-note').innerText()).toMatch(/too long/);
  });

  it('saves the loads as a CSV file that `pmchart check --loads` reads', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#save-loads')]);
    const csv = join(dir, 'saved.csv');
    await download.saveAs(csv);
    expect(readFileSync(csv, 'utf8').split('\n')[1]).toBe('C0,500,100');
    const r = await inProcess(['check', ...section, '--loads', csv, '--json']);
    expect(r.stderr).toBe('');
    expect(JSON.parse(r.stdout).results).toHaveLength(150);
  });

  it('reads the chart from the keyboard: focus, then arrow keys move the reading point', async () => {
    await page.focus('#chart-wrap');
    await page.keyboard.press('Home');
    const first = await page.locator('#reading').innerText();
    expect(first).toMatch(/P\/Ag -?[\d.]+ ksi · M\/\(Ag·h\) [\d.]+ ksi · e\/h \S+ · ρg/);
    expect(await page.locator('#crosshair').isVisible()).toBe(true);
    await page.keyboard.press('Shift+ArrowUp');
    const up = await page.locator('#reading').innerText();
    // higher on the plot is a larger P/Ag
    const pOf = (t: string) => Number(/P\/Ag (-?[\d.]+)/.exec(t)![1]);
    expect(pOf(up)).toBeGreaterThan(pOf(first));
    await page.keyboard.press('Escape');
    expect(await page.locator('#crosshair').isVisible()).toBe(false);
    expect(problems).toEqual([]);
  });
});
