/**
 * The font engine (src/render/font-engine.ts) that lays out, measures and writes every sheet text:
 * its widths equal those of pango/cairo (node-canvas, which draws the PNG sheets) for the sheets' kinds of
 * text, Greek symbols beside Latin text included; its fast path (glyphs and pair kerning cached) gives
 * fontkit's full layout glyph for glyph; text splits into script runs as Unicode Standard Annex #24 says.
 */
import { describe, expect, it } from 'vitest';
import { FontEngine, installTextMetrics, isBoldWeight, scriptRuns } from '../../src/render/font-engine.js';
import { renderEnvironment } from '../../src/render/environment.js';
import { FONT_FAMILY } from '../../src/chart/style.js';

const engine = FontEngine.get();

const SHEET_TEXT = [
  'φ 0.65–0.90 by εt (ACI 318-19 Table 21.2.2) · Pn,max 0.8·Po (22.4.2.1)',
  'Mn, φMn / (Ag · h)   (ksi)',
  'ρg 0.01',
  'γh = 0.80 h',
  'f′c 4 ksi · fy 60 ksi',
  'ν = NRd/(fcd·Ag), μ = MRd/(fcd·Ag·h)',
  'β1 0.85 · εcu 0.003 · Es 29000 · εty 0.002069',
  'AVATAR To Ty Yo 7.',
  'Mx–My at P/(f′c·Ag) = 0.2',
  '−4.320',
];

describe('FontEngine', () => {
  it('measures as pango/cairo does (node-canvas, the PNG renderer), regular and bold', async () => {
    const { canvas } = await renderEnvironment();
    const ctx = canvas.createCanvas(10, 10).getContext('2d');
    for (const bold of [false, true]) {
      ctx.font = `${bold ? 'bold ' : ''}100px "${FONT_FAMILY}"`;
      for (const t of SHEET_TEXT) expect(Math.abs(engine.width(t, 100, bold) - ctx.measureText(t).width)).toBeLessThan(0.01);
    }
  });

  it('gives fontkit’s full layout on its fast path (10,000 random strings of sheet characters, both faces)', () => {
    const alphabet = [...'AVTWYLPFakoyvwxfi.,-–—−·′″()[]/=≤≥±×÷ 0123456789ρφγεβνμωΣΔΩαπτσλ°%:;\'"!?&+*<>_|ÄÖÜäöüéèçñß…→←≈∞√∑'];
    let seed = 11;
    const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (let k = 0; k < 5000; k++) {
      let t = '';
      for (let i = 1 + Math.floor(rnd() * 12); i > 0; i--) t += alphabet[Math.floor(rnd() * alphabet.length)];
      for (const key of ['regular', 'bold'] as const) {
        const fast = engine.run(t, key);
        const full = engine.fullLayout(t, key);
        expect([t, fast.gids, fast.advances]).toEqual([t, full.gids, full.advances]);
      }
    }
  });

  it('splits text where the script changes; digits and signs stay with the text before them', () => {
    expect(scriptRuns('φPn / Ag')).toEqual(['φ', 'Pn / Ag']);
    expect(scriptRuns('0.65 εt (ACI')).toEqual(['0.65 ε', 't (ACI']);
    expect(scriptRuns('12.5')).toEqual(['12.5']);
  });

  it('is vega’s text measure, with a label limit capping the width as vega truncates', () => {
    const tm = { width: (() => 0) as (item: never, text: unknown) => number };
    installTextMetrics(tm, engine);
    const w = (item: object, text: string) => tm.width(item as never, text);
    expect(w({ fontSize: 10, fontWeight: 'bold' }, ' ρg 0.02 ')).toBeCloseTo(engine.width('ρg 0.02', 10, true), 9);
    expect(w({ fontSize: 10, fontWeight: 400 }, 'ρg')).toBeCloseTo(engine.width('ρg', 10, false), 9);
    expect(w({ fontSize: 10, limit: 5 }, 'a long label')).toBe(5);
    expect([isBoldWeight(600), isBoldWeight('700'), isBoldWeight('normal'), isBoldWeight(undefined)]).toEqual([true, true, false, false]);
  });
});
