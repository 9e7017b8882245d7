/// <reference lib="dom" />
/**
 * The page's schedule panel in a real browser (Debian's `chromium` through playwright-core, issue 22): a
 * schedule and an analysis export pasted (or dropped) in, with the export's column map and sign, list every
 * mark with the status, utilisation and governing load `pmchart schedule --json` gives for the same files;
 * a bad cell is one message in the page's words. The schedule, the export and the marks are invented.
 */
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { requireFreshBuild } from '../helpers/built.js';
import { cli } from '../helpers/run-cli.js';

const CHROMIUM = process.env.PMCHART_CHROMIUM ?? '/usr/bin/chromium';
const dir = mkdtempSync(join(tmpdir(), 'pmchart-page-schedule-'));
const file = join(dir, 'page.html');

const SCHEDULE = [
  'mark,code,units,fc,fy,b,h,diameter,arrangement,bars_per_face,bars,bar,cover,tie,transverse',
  'K1-A,aci318-19,us,5,60,20,20,,four-faces,3,,#9,1.5,#4,tied',
  'K1-B,aci318-19,us,5,60,,,24,ring,,8,#8,1.5,#4,spiral',
  'K2-C,aci318-19,us,4,60,14,14,,four-faces,2,,#6,1.5,#3,tied',
].join('\n');
// compression negative, the combination split over two columns
const EXPORT = [
  'Level,Col,Case,P,M3,M2',
  'L1,K1-A,D+L,-620,110,0',
  'L1,K1-A,D+L+W,-480,260,40',
  'L1,K1-B,D+L,-700,90,30',
  'L2,K2-C,D+L,-420,180,0',
  'L2,K2-C,0.9D+W,40,150,0',
].join('\n');
const MAP = 'mark=Col,id=Level+Case,Pu=P,Mu=M3,Muy=M2';

type Hooks = {
  pmchartPage: {
    draws(): number;
    scheduleSettled(): number;
    schedule(): { rows: { mark: string; status: string; utilisation: number | null; governing: string }[]; exitCode: number } | null;
  };
};
let browser: Browser;
let page: Page;
const problems: string[] = [];

/** Runs `act` and waits until the schedule panel has finished one more update. */
async function settle(act: () => Promise<unknown>): Promise<void> {
  const before = await page.evaluate(() => (window as unknown as Hooks).pmchartPage.scheduleSettled());
  await act();
  await page.waitForFunction((n) => (window as unknown as Hooks).pmchartPage.scheduleSettled() > n, before, { timeout: 60_000 });
}

describe.sequential('the schedule panel in Chromium', () => {
  beforeAll(async () => {
    requireFreshBuild(); // the page's browser code is dist/page/browser.js, built from src/page
    if (!existsSync(CHROMIUM)) throw new Error(`Chromium is not installed at ${CHROMIUM}; install it with: sudo apt-get update && sudo apt-get install -y chromium`);
    const r = await cli(['page', '--out', file, '--fc', '4', '--fy', '60', '--gamma', '0.8', '--date', '2026-01-05']);
    expect(r.stderr).toBe('');
    browser = await chromium.launch({ executablePath: CHROMIUM, args: process.getuid?.() === 0 ? ['--no-sandbox'] : [] });
    page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(`${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`exception: ${e.message}`));
    await page.goto(`file://${file}`);
    await page.waitForFunction(() => ((window as unknown as Partial<Hooks>).pmchartPage?.draws() ?? 0) > 0, null, { timeout: 60_000 });
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
  });

  it('lists every mark with the status, utilisation and governing load of `pmchart schedule --json`', async () => {
    await page.fill('#sched-columns', MAP);
    await page.selectOption('#sched-compression', 'negative');
    await page.fill('#sched-text', SCHEDULE);
    await settle(() => page.fill('#sched-loads', EXPORT));
    const shown = await page.evaluate(() => (window as unknown as Hooks).pmchartPage.schedule());
    writeFileSync(join(dir, 'schedule.csv'), SCHEDULE);
    writeFileSync(join(dir, 'export.csv'), EXPORT);
    const r = await cli(['schedule', join(dir, 'schedule.csv'), '--loads', join(dir, 'export.csv'), '--columns', MAP, '--compression', 'negative', '--json']);
    const cliJson = JSON.parse(r.stdout) as { columns: { mark: string; status: string; utilisation: number | null; governing: string }[]; exitCode: number };
    expect(shown).not.toBeNull();
    expect(shown!.rows.map((x) => x.mark)).toEqual(cliJson.columns.map((c) => c.mark));
    shown!.rows.forEach((row, i) => {
      const c = cliJson.columns[i]!;
      expect(row.status).toBe(c.status);
      expect(row.governing).toBe(c.governing);
      if (c.utilisation === null) expect(row.utilisation).toBeNull();
      else expect(row.utilisation!).toBeCloseTo(c.utilisation, 3); // the JSON rounds to significant digits
    });
    expect(shown!.exitCode).toBe(cliJson.exitCode);
    // the table on the page: one row per mark, its status in the CLI's words
    const cells = await page.$$eval('#schedule-results tbody tr', (rows) => rows.map((tr) => [tr.getAttribute('data-mark'), tr.getAttribute('data-status')]));
    expect(cells).toEqual(cliJson.columns.map((c) => [c.mark, c.status]));
    expect(await page.textContent('#schedule-summary')).toMatch(/mark/);
    expect(problems).toEqual([]);
  });

  it('reads a schedule file dropped on its box', async () => {
    const one = SCHEDULE.split('\n').slice(0, 2).join('\n');
    await settle(() =>
      page.evaluate((text) => {
        const dt = new DataTransfer();
        dt.items.add(new File([text], 'schedule.csv', { type: 'text/csv' }));
        document.getElementById('sched-text')!.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
      }, one),
    );
    expect(await page.inputValue('#sched-text')).toBe(one);
    // the loads hold marks the schedule no longer has: an error naming them, in the page's words
    const msg = await page.textContent('#m-schedule');
    expect(msg).toMatch(/K1-B|K2-C/);
    expect(msg).not.toMatch(/--/);
  });

  it('a bad cell is one message naming the schedule line and column, in the page’s words', async () => {
    await settle(() => page.fill('#sched-text', SCHEDULE.replace('K2-C,aci318-19,us,4,', 'K2-C,aci318-19,us,four,')));
    const msg = (await page.textContent('#m-schedule')) ?? '';
    expect(msg).toMatch(/^schedule line 4 fc/);
    expect(msg).not.toMatch(/--/);
    expect(await page.evaluate(() => (window as unknown as Hooks).pmchartPage.schedule())).toBeNull();
  });
});
