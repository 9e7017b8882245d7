/// <reference lib="dom" />
/**
 * The page escapes every attribute value (issue 25): a load id with `"` broke out of the row's data-id
 * attribute (app.ts escaped &, <, > only), so a crafted id could hide a failing load's row. Chromium
 * (Debian's `chromium`, playwright-core), as tests/page/page.test.ts. Needs `npm run build`.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { esc } from '../../src/page/markup.js';
import { requireFreshBuild } from '../helpers/built.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const CHROMIUM = process.env.PMCHART_CHROMIUM ?? '/usr/bin/chromium';
const dir = mkdtempSync(join(tmpdir(), 'pmchart-page-esc-'));
const crafted = `B" hidden data-x="`;
let browser: Browser | undefined;

afterAll(async () => {
  await browser?.close();
});

describe('page escaping', () => {
  it('esc escapes the double quote that delimits every attribute the page writes', () => {
    expect(esc(`a"b'c<d>&`)).toBe(`a&quot;b'c&lt;d&gt;&amp;`);
  });
  it('a load id with " stays inside its attribute: every row is shown and keeps its id', async () => {
    requireFreshBuild(); // the page's browser code is dist/page/browser.js, built from src/page
    if (!existsSync(CHROMIUM)) throw new Error(`Chromium is not installed at ${CHROMIUM}`);
    const loads = join(dir, 'loads.csv');
    // the id quoted as CSV quotes it ("" for ")
    writeFileSync(loads, `id,Pu,Mu\nA,100,50\n"${crafted.replaceAll('"', '""')}",900,700\n`);
    const file = join(dir, 'page.html');
    const r = await inProcess(['page', '--out', file, '--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.8', '--loads', loads, '--date', '2026-01-05'], { cwd: tmpdir() });
    expect(r.stderr).toBe('');
    browser = await chromium.launch({ executablePath: CHROMIUM, args: process.getuid?.() === 0 ? ['--no-sandbox'] : [] });
    const page = await browser.newPage();
    await page.goto(`file://${file}`);
    await page.waitForSelector('#results tbody tr', { timeout: 60_000 });
    const rows = await page.evaluate(() => [...document.querySelectorAll<HTMLTableRowElement>('#results tbody tr')].map((tr) => ({ id: tr.dataset.id, hidden: tr.hidden, x: tr.hasAttribute('data-x') })));
    const byId = [...rows].sort((a, b) => String(a.id).localeCompare(String(b.id)));
    expect(byId).toEqual([
      { id: 'A', hidden: false, x: false },
      { id: crafted, hidden: false, x: false },
    ]);
  }, 120_000);
});
