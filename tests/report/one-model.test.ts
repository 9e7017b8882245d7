/**
 * One result, many views: the text table, the JSON and the drawn report show the same figures for the same
 * input, because each reads the one `ColumnCheck`. Loads: three invented combinations on the issue-4 hand-check
 * section (common practice, worked by hand): 24 × 24 in, f′c = 4 ksi, fy = 60 ksi, ACI 318-19, γ = 0.75.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCheck, runCheckAsync, type CheckOptions } from '../../src/cli/check.js';
import { fmt } from '../../src/report/format.js';

const dir = mkdtempSync(join(tmpdir(), 'pmchart-views-'));
const loads = join(dir, 'loads.csv');
writeFileSync(loads, 'id,Pu,Mu,Muy\nG1-gravity,900,600,120\nW2-wind,420,-520,60\nU3-uplift,-60,210,30\n');
const base: CheckOptions = { fc: '4', fy: '60', b: '24', h: '24', gamma: '0.75', barsPerFace: '2', proposals: '0', loads };

/** Cells of the text table's rows, keyed by load id (first column, governing mark removed). */
function textRows(text: string): { headers: string[]; rows: Map<string, string[]> } {
  const lines = text.split('\n');
  const h = lines.findIndex((l) => l.startsWith('id  '));
  const headers = lines[h]!.split(/\s{2,}/);
  const rows = new Map<string, string[]>();
  for (const l of lines.slice(h + 2)) {
    if (!l.trim() || l.startsWith('* governing')) break;
    const cells = l.replace(/^\* /, '').split(/\s{2,}/);
    rows.set(cells[0]!, cells);
  }
  return { headers, rows };
}

describe('text, JSON and drawn report of one check', () => {
  for (const extra of [{}, { rho: '0.025' }] as CheckOptions[]) {
    it(`agree on every load's ρg required, readings and status${extra.rho ? ' and utilisation' : ''}`, async () => {
      const json = JSON.parse(runCheck({ ...base, ...extra, json: true }));
      const { headers, rows } = textRows(runCheck({ ...base, ...extra }));
      const col = (name: string) => headers.indexOf(name);
      const svgFile = join(dir, `r${extra.rho ? 1 : 0}.svg`);
      await runCheckAsync({ ...base, ...extra, report: svgFile });
      const svgTexts = [...readFileSync(svgFile, 'utf8').matchAll(/>([^<>]*)<\/text>/g)].map((m) => m[1]!.replace(/&amp;/g, '&'));
      expect(json.results.map((r: { id: string }) => r.id)).toEqual([...rows.keys()]);
      for (const r of json.results) {
        const cells = rows.get(r.id)!;
        expect(cells[col('ρg req')]).toBe(r.rhoRequired === null ? '—' : fmt(r.rhoRequired, 4));
        expect(cells[col('ρg chart')]).toBe(r.rhoFromChart === null ? '—' : fmt(r.rhoFromChart, 4));
        expect(cells[col('status')]).toBe(r.status === 'ok' ? 'ok' : r.status.toUpperCase().replace('-', ' '));
        if (extra.rho) expect(cells[col('util')]).toBe(fmt(r.utilisation, 3));
        // the drawn report prints the same cells (the first rows that fit on the sheet)
        expect(svgTexts).toContain(cells[col('ρg req')]);
        if (extra.rho) expect(svgTexts).toContain(cells[col('util')]);
      }
      expect(json.summary.text.length).toBeGreaterThan(0);
      expect(svgTexts.join(' ')).toContain(json.summary.text);
    });
  }
});
