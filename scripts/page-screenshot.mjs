#!/usr/bin/env node
// Regenerates docs/page.png for the README: the live page with the invented column C-14 (README
// "A worked check") and its four load combinations on the chart, the pointer on the plot.
// Run after `npm run build`:  node scripts/page-screenshot.mjs
import { join } from 'node:path';
import { openPage, root, writePage } from './page-browser.mjs';

const { browser, page } = await openPage(writePage(), { width: 1360, height: 1250 });
try {
  const box = await page.locator('#chart svg').boundingBox();
  await page.mouse.move(box.x + box.width * 0.42, box.y + box.height * 0.3);
  await page.waitForFunction(() => /ρg/.test(document.getElementById('reading').textContent ?? ''));
  const out = join(root, 'docs/page.png');
  await page.screenshot({ path: out, fullPage: false });
  console.log(out);
} finally {
  await browser.close();
}
