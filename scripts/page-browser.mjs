// Shared by scripts/page-screenshot.mjs and scripts/bench/page.mjs: write the live page with the demo
// presets (invented column C-14 of the README) and open it in Debian's chromium through playwright-core.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = fileURLToPath(new URL('..', import.meta.url));
export const CHROMIUM = process.env.PMCHART_CHROMIUM ?? '/usr/bin/chromium';
export const DEMO_FLAGS = ['--units', 'si', '--fc', '32MPa', '--fy', '420MPa', '--gamma', '0.72', '--arrangement', 'four-faces', '--bars-per-face', '5', '--b', '450', '--h', '450', '--loads', join(root, 'charts-config/c14-loads.csv'), '--date', '2026-03-02'];

/** Writes the page with `flags` to a temporary folder; returns its path. */
export function writePage(flags = DEMO_FLAGS) {
  const file = join(mkdtempSync(join(tmpdir(), 'pmchart-page-')), 'column-charts.html');
  const r = spawnSync(process.execPath, [join(root, 'bin/pmchart.js'), 'page', '--out', file, ...flags], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`pmchart page failed: ${r.stderr}`);
  return file;
}

/** Opens `file` in chromium; resolves when the page has drawn its first chart. */
export async function openPage(file, viewport = { width: 1400, height: 1000 }) {
  if (!existsSync(CHROMIUM)) throw new Error(`Chromium is not installed at ${CHROMIUM}; install it with: sudo apt-get update && sudo apt-get install -y chromium`);
  const { chromium } = await import('playwright-core');
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: process.getuid?.() === 0 ? ['--no-sandbox'] : [] });
  const page = await browser.newPage({ viewport });
  await page.goto(`file://${file}`);
  await page.waitForFunction(() => (window.pmchartPage?.draws() ?? 0) > 0, null, { timeout: 60_000 });
  return { browser, page };
}
