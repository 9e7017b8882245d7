/**
 * The one font engine of sheets and books: DejaVu Sans (regular and bold) read by fontkit. It measures
 * every text that vega lays out (`installTextMetrics`) and that the label pass places
 * (`SheetRenderer.measureText`), and it turns text into the glyph ids and advances the PDF writer
 * (pdf-writer.ts) puts on the page, so the widths a sheet is laid out with are the widths it is drawn with.
 * node-canvas (cairo) draws PNG only.
 */
import fontkit from '@pdf-lib/fontkit';
import type { Font } from '@pdf-lib/fontkit';
import { readFileSync } from 'node:fs';
import { fontPaths } from './environment.js';

export type FontKey = 'regular' | 'bold';

/** A laid-out run: glyph ids (the font's own, before subsetting), each glyph's text, and advances in font units. */
export interface TextRun {
  gids: readonly number[];
  /** the characters each glyph stands for (ToUnicode) */
  chars: readonly string[];
  /** the advance the layout gives each glyph (kerning included) */
  advances: readonly number[];
  /** each glyph's own advance width (the PDF /W entry) */
  widths: readonly number[];
  /** sum of advances, font units */
  total: number;
}

export interface FontFace {
  readonly key: FontKey;
  readonly font: Font;
  readonly bytes: Uint8Array;
  readonly unitsPerEm: number;
}

/** Runs kept per face; cleared past this many distinct strings (memory stays flat on long books). */
const RUN_CACHE_LIMIT = 50_000;

export class FontEngine {
  private readonly runs: Record<FontKey, Map<string, TextRun>> = { regular: new Map(), bold: new Map() };

  private constructor(readonly faces: Record<FontKey, FontFace>) {}

  private static shared: FontEngine | undefined;

  /** The process's engine (fonts are read once). */
  static get(): FontEngine {
    if (!FontEngine.shared) {
      const paths = fontPaths();
      const face = (key: FontKey, path: string): FontFace => {
        const bytes = new Uint8Array(readFileSync(path));
        const font = fontkit.create(bytes as unknown as Buffer) as Font;
        return { key, font, bytes, unitsPerEm: font.unitsPerEm };
      };
      FontEngine.shared = new FontEngine({ regular: face('regular', paths.regular), bold: face('bold', paths.bold) });
    }
    return FontEngine.shared;
  }

  /** The laid-out run of `text` in one face (fontkit shaping with its default features, kerning included). */
  run(text: string, key: FontKey): TextRun {
    const cache = this.runs[key];
    let r = cache.get(text);
    if (r) return r;
    const { font } = this.faces[key];
    const gids: number[] = [];
    const chars: string[] = [];
    const advances: number[] = [];
    const widths: number[] = [];
    let total = 0;
    // one shaping run per script, as pango/HarfBuzz itemise text for cairo (a Greek φ must not make the
    // Latin text after it lose its kerning); no kerning across runs
    for (const part of scriptRuns(text)) {
      const cps = [...part];
      if (cps.every((ch) => pairwise(ch.codePointAt(0)!))) {
        // glyphs and pair kerning, each shaped once per face (fontkit's full layout costs ~100 µs a string;
        // tests/render/font-engine.test.ts checks this path gives fontkit's glyphs and advances)
        const tag = this.scriptTag(key, part);
        const kerns: number[] = [];
        for (let i = 0; i + 1 < cps.length; i++) kerns.push(this.kern(key, tag, cps[i]!, cps[i + 1]!));
        if (!kerns.some(Number.isNaN)) {
          for (let i = 0; i < cps.length; i++) {
            const g = this.glyph(key, tag, cps[i]!);
            const adv = g.advance + (kerns[i] ?? 0);
            gids.push(g.id);
            chars.push(g.chars);
            advances.push(adv);
            widths.push(g.width);
            total += adv;
          }
          continue;
        }
      }
      const laid = font.layout(part);
      laid.glyphs.forEach((g, i) => {
        gids.push(g.id);
        chars.push(String.fromCodePoint(...g.codePoints));
        const adv = laid.positions[i]!.xAdvance;
        advances.push(adv);
        widths.push(g.advanceWidth);
        total += adv;
      });
    }
    r = { gids, chars, advances, widths, total };
    if (cache.size >= RUN_CACHE_LIMIT) cache.clear();
    cache.set(text, r);
    return r;
  }

  private readonly glyphs = new Map<string, { id: number; chars: string; advance: number; width: number }>();
  private readonly kerns = new Map<string, number>();
  private readonly tags = new Map<string, string>();

  /** The OpenType script tag fontkit picks for a run (from its first letter, or for a run of digits and signs). */
  private scriptTag(key: FontKey, run: string): string {
    let probe = '0';
    for (const ch of run) if (scriptOf(ch.codePointAt(0)!) !== undefined) {
      probe = ch;
      break;
    }
    const k = `${key} ${scriptOf(probe.codePointAt(0)!) ?? 'common'}`;
    let tag = this.tags.get(k);
    if (tag === undefined) {
      tag = (this.faces[key].font.layout(probe) as unknown as { script: string }).script;
      this.tags.set(k, tag);
    }
    return tag;
  }

  private glyph(key: FontKey, tag: string, ch: string): { id: number; chars: string; advance: number; width: number } {
    const k = `${key} ${tag} ${ch}`;
    let g = this.glyphs.get(k);
    if (!g) {
      const laid = layoutIn(this.faces[key].font, ch, tag);
      const gl = laid.glyphs[0]!;
      g = { id: gl.id, chars: String.fromCodePoint(...gl.codePoints), advance: laid.positions[0]!.xAdvance, width: gl.advanceWidth };
      this.glyphs.set(k, g);
    }
    return g;
  }

  /**
   * The change a following character makes to a glyph's advance (GPOS pair kerning); NaN where the pair
   * is not two glyphs as shaped alone (a ligature such as "ff"): such a run takes the full layout.
   */
  private kern(key: FontKey, tag: string, a: string, b: string): number {
    const k = `${key} ${tag} ${a}${b}`;
    let v = this.kerns.get(k);
    if (v === undefined) {
      const laid = layoutIn(this.faces[key].font, a + b, tag);
      const ga = this.glyph(key, tag, a);
      const gb = this.glyph(key, tag, b);
      const same = laid.glyphs.length === 2 && laid.glyphs[0]!.id === ga.id && laid.glyphs[1]!.id === gb.id && laid.positions[1]!.xAdvance === gb.advance;
      v = same ? laid.positions[0]!.xAdvance - ga.advance : NaN;
      this.kerns.set(k, v);
    }
    return v;
  }

  /** fontkit's full layout of `text`, for the test of the fast path. */
  fullLayout(text: string, key: FontKey): { gids: number[]; advances: number[] } {
    const gids: number[] = [];
    const advances: number[] = [];
    for (const part of scriptRuns(text)) {
      const laid = this.faces[key].font.layout(part);
      laid.glyphs.forEach((g, i) => {
        gids.push(g.id);
        advances.push(laid.positions[i]!.xAdvance);
      });
    }
    return { gids, advances };
  }

  /** Width of `text` at `size` (points or pixels alike). */
  width(text: string, size: number, bold: boolean): number {
    if (!text || size <= 0) return 0;
    const key: FontKey = bold ? 'bold' : 'regular';
    return (this.run(text, key).total * size) / this.faces[key].unitsPerEm;
  }
}

type Script = 'latin' | 'greek' | 'cyrillic' | undefined;

/** fontkit's layout in a given OpenType script (its `layout(string, features, script)`, which the bundled types omit). */
function layoutIn(font: Font, text: string, script: string): ReturnType<Font['layout']> {
  return (font.layout as unknown as (t: string, f: string[], s: string) => ReturnType<Font['layout']>).call(font, text, [], script);
}

/**
 * Characters DejaVu Sans shapes one glyph each, with at most pair kerning between neighbours (no
 * ligature, mark or contextual lookup in fontkit's default features): Basic Latin, Latin-1, Latin
 * Extended-A, Greek, general punctuation, super- and subscripts, letterlike symbols, arrows, maths
 * operators. Anything else takes fontkit's full layout.
 */
function pairwise(cp: number): boolean {
  return (cp >= 0x20 && cp <= 0x7e) || (cp >= 0xa0 && cp <= 0x17f) || (cp >= 0x370 && cp <= 0x3ff) || (cp >= 0x2010 && cp <= 0x2044) || (cp >= 0x2070 && cp <= 0x209f) || (cp >= 0x2100 && cp <= 0x21ff) || (cp >= 0x2200 && cp <= 0x22ff);
}

function scriptOf(cp: number): Script {
  if ((cp >= 0x41 && cp <= 0x5a) || (cp >= 0x61 && cp <= 0x7a) || (cp >= 0xc0 && cp <= 0x24f && cp !== 0xd7 && cp !== 0xf7) || (cp >= 0x1e00 && cp <= 0x1eff)) return 'latin';
  if ((cp >= 0x370 && cp <= 0x3ff && cp !== 0x37e && cp !== 0x387) || (cp >= 0x1f00 && cp <= 0x1fff)) return 'greek';
  if (cp >= 0x400 && cp <= 0x52f) return 'cyrillic';
  return undefined; // common: digits, spaces, punctuation, symbols
}

/**
 * Splits text where its script changes (Unicode Standard Annex #24: characters of the Common script
 * take the script of the text before them, or at the start the script after them).
 */
export function scriptRuns(text: string): string[] {
  const runs: string[] = [];
  let cur = '';
  let script: Script;
  for (const ch of text) {
    const s = scriptOf(ch.codePointAt(0)!);
    if (s !== undefined && script !== undefined && s !== script) {
      runs.push(cur);
      cur = '';
    }
    if (s !== undefined) script = s;
    cur += ch;
  }
  if (cur) runs.push(cur);
  return runs;
}

/** A CSS weight is bold from 600 up, as a browser picks the bold face of a two-face family. */
export function isBoldWeight(weight: unknown): boolean {
  if (weight === undefined || weight === null || weight === '') return false;
  if (typeof weight === 'number') return weight >= 600;
  const w = String(weight).trim().toLowerCase();
  if (w === 'bold' || w === 'bolder') return true;
  const n = Number(w);
  return Number.isFinite(n) && n >= 600;
}

interface VegaTextItem {
  fontSize?: number | string;
  fontWeight?: number | string;
  limit?: number;
}

/**
 * Makes vega measure text with this engine instead of its canvas (vega-scenegraph's documented
 * `textMetrics.width` hook, as vl-convert uses it). A `limit` caps the width the way vega's
 * truncation does (vega truncates through this same function, so it must not truncate itself).
 */
export function installTextMetrics(textMetrics: { width: (item: never, text: unknown) => number }, engine: FontEngine): void {
  textMetrics.width = ((item: VegaTextItem, text: unknown): number => {
    const size = item.fontSize != null ? +item.fontSize || 0 : 11;
    const s = text == null ? '' : String(text).trim();
    const w = engine.width(s, size, isBoldWeight(item.fontWeight));
    return item.limit !== undefined && item.limit > 0 ? Math.min(w, item.limit) : w;
  }) as never;
}
