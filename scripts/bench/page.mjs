// Live page figures: time from an input change to the redrawn chart, measured in the browser with
// performance.now() (the page's own timer, from reading the form to the finished vega run), for the
// default 8-curve family (medians) with and without the bracketing sheets and with four loads; and the file size.
import { statSync } from 'node:fs';
import { openPage, writePage } from '../page-browser.mjs';

export const name = 'page';

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function timeChanges(page, key, values) {
  const ms = [];
  for (const v of values) {
    const n = await page.evaluate(() => window.pmchartPage.draws());
    await page.evaluate(([k, x]) => window.pmchartPage.set(k, x), [key, v]);
    await page.waitForFunction((n) => window.pmchartPage.draws() > n, n, { timeout: 30_000 });
    ms.push(await page.evaluate(() => window.pmchartPage.lastMs()));
  }
  return median(ms);
}

export async function run() {
  const plain = writePage(['--fc', '7ksi', '--fy', '80ksi', '--gamma', '0.8', '--arrangement', 'four-faces', '--bars-per-face', '4', '--date', '2026-03-02']);
  const gammas = Array.from({ length: 21 }, (_, i) => (0.7 + 0.005 * (i + 1)).toFixed(3));
  const rows = [];
  const { browser, page } = await openPage(plain);
  try {
    await timeChanges(page, 'gamma', gammas.slice(0, 5)); // warm up
    rows.push({ figure: 'page γ change → redrawn, 8 curves + 2 bracketing sheets', value: await timeChanges(page, 'gamma', gammas), unit: 'ms', target: '≤ 50 ms' });
    rows.push({ figure: 'page f′c change → redrawn, same', value: await timeChanges(page, 'fc', ['7.5ksi', '8ksi', '8.5ksi', '9ksi', '9.5ksi', '10ksi', '7ksi']), unit: 'ms', target: '≤ 50 ms' });
    await page.evaluate(() => { document.getElementById('show-sheets').checked = false; });
    rows.push({ figure: 'page γ change → redrawn, 8 curves alone', value: await timeChanges(page, 'gamma', gammas), unit: 'ms', target: '≤ 50 ms' });
  } finally {
    await browser.close();
  }
  const demo = writePage();
  const opened = await openPage(demo);
  try {
    await timeChanges(opened.page, 'gamma', ['0.73', '0.74', '0.75']);
    rows.push({ figure: 'page γ change → chart and 4-load check redrawn', value: await timeChanges(opened.page, 'gamma', gammas), unit: 'ms', target: '(reported)' });
  } finally {
    await opened.browser.close();
  }
  rows.push({ figure: 'page HTML file size (vega, vega-lite, core)', value: statSync(plain).size / 1024 / 1024, unit: 'MB', target: '(reported)' });
  return rows;
}
