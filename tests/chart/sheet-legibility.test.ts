/**
 * Legibility of every demo sheet on every paper size (issue: sheets an engineer reads at a glance), read
 * from the sheet's vega-lite spec and datasets (no pixels):
 * - every curve of every family drawn carries at least two ρg labels in the compression zone, at clearly
 *   different heights (at least a fifth of the curve's height apart), one in the upper 30 % near its cap;
 * - every plot label sits on a knockout that covers its text, every line of the plot is drawn before
 *   the knockouts, and nothing drawn after them (rules, dots, rings, texts) enters a label's box;
 * - every text colour is at least 3:1 on white (WCAG 2.1 success criterion 1.4.11 / 1.4.3 large text,
 *   the 3:1 level), and neighbouring curves differ by at least 15 in CIE L* (grayscale);
 * - every font size is at least the print floor: ≥ 5 pt once the page is fitted to Letter or A4
 *   (common practice for printed text), i.e. ≥ 7.75 pt on Tabloid, the US default;
 * - no text is cut ('…') and no Greek symbol is upper-cased;
 * - no drawn curve crosses itself (bar-entry steps drawn on the inner branch);
 * - each P–M plot's curves fill at least 75 % of both axes, with the book's group scale where that holds.
 * Measured: font sizes are the spec's fontSize values in PDF points on the page as drawn; the fitted size
 * multiplies by the page's scale onto Letter or A4 (the smaller, whole page kept).
 */
import { nodeFileAccess } from '../../src/io/read.js';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSheet, curveLabelText, type CurveLabelRow, type SheetData, type TemplateParams } from '../../src/chart/sheet-data.js';
import { buildBiaxialSheet } from '../../src/chart/biaxial-sheet.js';
import { fillOf, familyExtent } from '../../src/chart/axes.js';
import { sheetSpec } from '../../src/chart/spec.js';
import { contrastRatio, CURVE_PALETTE, lightness, printFloor, TEXT_STYLES, COLOURS } from '../../src/chart/style.js';
import { readChartSet } from '../../src/config/read.js';
import type { ResolvedChartSet } from '../../src/config/types.js';
import { biaxialFamilyForSheet, familyForSheet, groupExtents } from '../../src/sheet/curves.js';
import { SheetRenderer } from '../../src/render/renderer.js';
import type { CurveFamily } from '../../src/analysis/family.js';
import { selfCrossing } from '../../src/analysis/inner-branch.js';
import type { BiaxialFamily } from '../../src/analysis/biaxial-family.js';

let renderer: SheetRenderer;
beforeAll(async () => {
  renderer = await SheetRenderer.create();
});
afterAll(() => renderer.finalize());

const DEMOS = ['demo.json', 'demo-eu.json', 'demo-au.json'];
const PAPERS = ['tabloid', 'a3', 'letter', 'a4'] as const;
// Α … Ω but Σ, the summation sign (ΣPu, ΣPc of a storey), which is no upper-cased σ
const GREEK_CAPITALS = /[\u0391-\u03A2\u03A4-\u03A9]/;

interface Box { x0: number; y0: number; x1: number; y1: number }
const overlaps = (a: Box, b: Box) => a.x0 < b.x1 - 0.01 && b.x0 < a.x1 - 0.01 && a.y0 < b.y1 - 0.01 && b.y0 < a.y1 - 0.01;

/** The knockout path "Mx,yhwvhh-wZ" as a box around (cx, cy). */
function knockBox(path: string, cx: number, cy: number): Box {
  const m = /^M(-?[\d.]+),(-?[\d.]+)h(-?[\d.]+)v(-?[\d.]+)/.exec(path)!;
  const [x, y, w, h] = [Number(m[1]), Number(m[2]), Number(m[3]), Number(m[4])];
  return { x0: cx + x, y0: cy + y, x1: cx + x + w, y1: cy + y + h };
}

/** Every font size in a spec (marks and axis config), in points. */
function fontSizes(spec: unknown, out: number[] = []): number[] {
  if (Array.isArray(spec)) for (const v of spec) fontSizes(v, out);
  else if (spec && typeof spec === 'object') {
    for (const [k, v] of Object.entries(spec)) {
      if (/fontsize$/i.test(k) && typeof v === 'number') out.push(v);
      else fontSizes(v, out);
    }
  }
  return out;
}

/** Text colours in a spec: text marks' color/fill, the axes' label and title colours. */
function textColours(spec: { layer: { mark: { type: string; color?: string; fill?: string } }[]; config: { axis: { labelColor: string; titleColor: string } } }, data: SheetData): string[] {
  const out = new Set<string>([spec.config.axis.labelColor, spec.config.axis.titleColor]);
  for (const l of spec.layer) if (l.mark.type === 'text' && !('stroke' in l.mark)) for (const c of [l.mark.color, l.mark.fill]) if (c) out.add(c);
  for (const l of data.curveLabels) out.add(l.colour);
  return [...out];
}

/** the demo sets name an office file and a logo beside them */
const FILES = { files: nodeFileAccess, baseDir: 'charts-config' };

interface Case { demo: string; paper: string; set: ResolvedChartSet; index: number }

const demos = DEMOS.map((file) => {
  const json = JSON.parse(readFileSync(`charts-config/${file}`, 'utf8')) as Record<string, unknown>;
  const base = readChartSet(JSON.stringify(json), FILES);
  const sets = Object.fromEntries(PAPERS.map((size) => [size, readChartSet(JSON.stringify({ ...json, paper: { size, orientation: (json.paper as { orientation?: string } | undefined)?.orientation ?? 'landscape' } }), FILES)]));
  return { file, base, sets };
});

const families = new Map<string, CurveFamily | BiaxialFamily>();
const extents = new Map<string, ReturnType<typeof groupExtents>>();
function built(c: Case): { template: TemplateParams; data: SheetData; family: CurveFamily | BiaxialFamily } {
  const sheet = c.set.sheets[c.index]!;
  const key = `${c.demo}#${c.index}`;
  let ext = extents.get(c.demo);
  if (!ext) extents.set(c.demo, (ext = groupExtents(c.set)));
  let family = families.get(key);
  if (!family) families.set(key, (family = sheet.chart === 'biaxial' ? biaxialFamilyForSheet(c.set, sheet) : familyForSheet(c.set, sheet)));
  const common = { set: c.set, sheet, sheetNumber: c.index + 1, sheetCount: c.set.sheets.length, generator: 'pmchart test', measureText: renderer.measureText, extent: ext[sheet.origin]! };
  const b = sheet.chart === 'biaxial' ? buildBiaxialSheet({ ...common, family: family as BiaxialFamily }) : buildSheet({ ...common, family: family as CurveFamily });
  return { template: b.template, data: b.data, family };
}

describe('the palette', () => {
  it('gives neighbouring curves clearly different grayscale lightness and every curve colour 3:1 on white', () => {
    for (let k = 0; k < 16; k++) {
      const a = CURVE_PALETTE[k % CURVE_PALETTE.length]!;
      const b = CURVE_PALETTE[(k + 1) % CURVE_PALETTE.length]!;
      expect(Math.abs(lightness(a) - lightness(b)), `${a} ${b}`).toBeGreaterThanOrEqual(15);
      expect(contrastRatio(a, '#ffffff')).toBeGreaterThanOrEqual(3);
    }
    for (const s of Object.values(TEXT_STYLES)) expect(contrastRatio(s.colour, COLOURS.paper), s.colour).toBeGreaterThanOrEqual(3);
  });

  it('measures contrast as WCAG 2 does (black on white 21:1; #777777 on white 4.48:1, from the WCAG 2 formula by hand)', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 6);
    // 0x77/255 = 0.46667 → ((0.46667 + 0.055)/1.055)^2.4 = 0.18447; (1.05)/(0.23447) = 4.478
    expect(contrastRatio('#777777', '#ffffff')).toBeCloseTo(4.478, 2);
  });

  it('sets the print floor so text stays 5 pt on Letter or A4', () => {
    // Tabloid 792 × 1224 onto Letter 612 × 792: min(612/792, 792/1224) = 0.6471; 5/0.6471 = 7.727 → 7.75
    expect(printFloor(1224, 792)).toBe(7.75);
    // A3 841.89 × 1190.55 onto Letter: min(612/841.89, 792/1190.55) = 0.6652; 5/0.6652 = 7.516 → 7.55
    expect(printFloor(841.89, 1190.55)).toBe(7.55);
  });
});

for (const d of demos) {
  describe(`${d.file}, every sheet on every paper`, () => {
    for (const paper of PAPERS) {
      it(`${paper}: labels, knockouts, contrast, text size, no cut text, no upper-cased Greek, axes filled`, () => {
        const set = d.sets[paper]!;
        const floor = printFloor(set.paper.widthPt, set.paper.heightPt);
        const fit = Math.min(1, ...[[612, 792], [595.28, 841.89]].map(([w, h]) => Math.min(w! / Math.min(set.paper.widthPt, set.paper.heightPt), h! / Math.max(set.paper.widthPt, set.paper.heightPt))));
        for (let index = 0; index < set.sheets.length; index++) {
          const sheet = set.sheets[index]!;
          const b = built({ demo: d.file, paper, set, index });
          const spec = sheetSpec(b.template, b.data) as never as { layer: { name: string; data?: { name?: string }; mark: { type: string; color?: string; fill?: string } }[]; config: { axis: { labelColor: string; titleColor: string } } };
          const where = `${d.file} ${paper} sheet ${index + 1}`;
          // text size: the floor, and ≥ 5 pt fitted to Letter or A4
          const sizes = fontSizes(spec);
          expect(Math.min(...sizes), where).toBeGreaterThanOrEqual(floor - 0.005);
          expect(Math.min(...sizes) * fit, where).toBeGreaterThanOrEqual(4.995);
          if (paper === 'tabloid') expect(Math.min(...sizes), where).toBeGreaterThanOrEqual(7.75 - 0.005);
          // contrast of every text colour
          for (const c of textColours(spec, b.data)) expect(contrastRatio(c, '#ffffff'), `${where} ${c}`).toBeGreaterThanOrEqual(3);
          // nothing cut, no Greek capital
          // every text of the sheet, the title block's too
          const texts = [...b.data.texts.map((t) => t.text), ...b.data.curveLabels.map((l) => l.text), ...b.data.refLabels.map((l) => l.text), b.template.xTitle, b.template.yTitle];
          expect(texts.filter((t) => t.includes('…')), where).toEqual([]);
          expect(texts.filter((t) => GREEK_CAPITALS.test(t)), where).toEqual([]);
          if (sheet.chart === 'biaxial') continue;

          const family = b.family as CurveFamily;
          const a = b.template.axes!;
          const L = b.template.layout;
          const X = (M: number) => L.plot.x + ((M - a.M.domain[0]) / (a.M.domain[1] - a.M.domain[0])) * L.plot.w;
          const Y = (P: number) => L.plot.y + ((a.P.domain[1] - P) / (a.P.domain[1] - a.P.domain[0])) * L.plot.h;
          // axes filled: the curves take at least 75 % of each axis
          const d0 = set.normalisation === 'dimensionless' ? family.basis.normalisingStress : 1;
          const f = fillOf(familyExtent(family, b.template.families, d0), a);
          expect(f.M, `${where} M`).toBeGreaterThanOrEqual(0.75);
          expect(f.P, `${where} P`).toBeGreaterThanOrEqual(0.75);
          // two compression-zone labels per curve and family, apart in height, one near the cap
          for (const fam of b.template.families) {
            const nominal = b.template.families.length > 1 && fam === 'nominal';
            family.curves.forEach((c, k) => {
              const text = curveLabelText(set, c.rho, k, nominal);
              const rows = b.data.curves.filter((r) => r.curve === `${fam}-${c.rho}`);
              const pMax = Math.max(...rows.map((r) => r.P));
              // the drawn curve (inner branch by default) never crosses itself
              expect(selfCrossing(rows.map((r) => r.M), rows.map((r) => r.P)), `${where} ${fam}-${c.rho} crosses itself`).toBeNull();
              const ls = b.data.curveLabels.filter((l) => l.text === text && l.P > 0);
              expect(ls.length, `${where} ${text}`).toBeGreaterThanOrEqual(2);
              const ps = ls.map((l) => l.P);
              expect(Math.max(...ps) - Math.min(...ps), `${where} ${text} heights`).toBeGreaterThanOrEqual(0.2 * pMax);
              expect(Math.max(...ps), `${where} ${text} near the cap`).toBeGreaterThanOrEqual(0.7 * pMax - 1e-4);
            });
          }
          // knockouts: every plot label on one; lines before them, nothing after them inside a label box
          const names = spec.layer.map((l) => l.name);
          const firstKnock = names.indexOf('ref_label_knockouts');
          expect(firstKnock, where).toBeGreaterThan(0);
          for (const n of names.filter((x) => /^(curves_|rays|zero|strain_lines|cap_line|minor_grid)/.test(x))) expect(names.indexOf(n), `${where} ${n}`).toBeLessThan(firstKnock);
          const boxes: Box[] = [];
          const labelRows: (CurveLabelRow | (typeof b.data.refLabels)[number])[] = [...b.data.curveLabels, ...b.data.refLabels];
          for (const l of labelRows) {
            expect(l.knock, `${where} ${l.text}`).toBeDefined();
            const box = knockBox(l.knock!, X(l.M), Y(l.P));
            boxes.push(box);
            const bold = 'bold' in l ? l.bold !== 0 : false;
            const fs = Math.max(('bold' in l ? 0.82 : 0.78) * L.u, L.minText ?? 0);
            expect(box.x1 - box.x0, `${where} ${l.text} knockout width`).toBeGreaterThanOrEqual(renderer.measureText(l.text, fs, bold) - 0.05);
            expect(box.y1 - box.y0, `${where} ${l.text} knockout height`).toBeGreaterThanOrEqual(fs - 0.05);
          }
          const px = (x: number) => x + L.plot.x;
          const py = (y: number) => y + L.plot.y;
          const after: Box[] = [
            ...b.data.rules.map((r) => ({ x0: Math.min(px(r.x), px(r.x2)), y0: Math.min(py(r.y), py(r.y2)), x1: Math.max(px(r.x), px(r.x2)) + 0.02, y1: Math.max(py(r.y), py(r.y2)) + 0.02 })),
            ...[...b.data.dots, ...b.data.rings].map((r) => ({ x0: px(r.x) - Math.sqrt(r.size) / 2, y0: py(r.y) - Math.sqrt(r.size) / 2, x1: px(r.x) + Math.sqrt(r.size) / 2, y1: py(r.y) + Math.sqrt(r.size) / 2 })),
            ...b.data.texts.map((t) => {
              const s = TEXT_STYLES[t.style];
              const fs = Math.max(s.size * L.u, L.minText ?? 0);
              const w = renderer.measureText(t.text, fs, s.weight === 'bold');
              const x0 = s.align === 'right' ? px(t.x) - w : s.align === 'center' ? px(t.x) - w / 2 : px(t.x);
              return { x0, y0: py(t.y) - 0.76 * fs, x1: x0 + w, y1: py(t.y) + 0.24 * fs };
            }),
          ];
          for (const k of boxes) for (const o of after) expect(overlaps(k, o), `${where}: something drawn over a label box`).toBe(false);
        }
      }, 120_000);
    }
  });
}
