/**
 * A PDF content stream behind the part of the Canvas 2D interface that vega's canvas renderer draws with
 * (`view.toCanvas(1, { externalContext })`): vega walks its scenegraph (groups, clips, rules, lines,
 * areas, paths, rects, symbols, text, images) and each call lands here as PDF operators (ISO 32000-1
 * §8 graphics, §9 text) instead of going through cairo. Paths are kept in page coordinates, because a
 * canvas path is fixed where each segment is added (vega translates, adds a path, translates back, then
 * fills). Text is written as glyph ids of the shared font engine (CIDs = the font's own glyph ids, see
 * pdf-writer.ts), so widths, kerning and the ToUnicode text are the engine's.
 *
 * What the page needs from the book (fonts, transparency states, images) is recorded and returned with
 * the stream (`PageContent`), so render processes can send pages to the parent, which writes fonts once.
 *
 * Each mark vega draws (not its groups) is a segment (`beginSegment`/`endSegment`): it sets every state it
 * uses itself, so the book writer can draw a segment that recurs on other pages (frames, title-block rules
 * and labels, notes, the caution) once as a form XObject (ISO 32000-1 §8.10) and refer to it.
 */
import { createHash } from 'node:crypto';
import { createRequire } from 'node:module';
import { FontEngine, isBoldWeight, type FontKey } from './font-engine.js';

/** One page as a render process hands it to the book writer (plain data: it crosses process boundaries). */
export interface PageContent {
  width: number;
  height: number;
  /** the content stream, uncompressed; a segment stands in it as SEGMENT_MARK + key + SEGMENT_MARK */
  stream: string;
  /** the segments' own content, by key (a hash of the content) */
  segments: Record<string, string>;
  /** glyphs drawn, per face: [glyph id, the text it stands for], ascending ids */
  glyphs: Record<FontKey, [number, string][]>;
  /** constant alphas used (ExtGState /GaN, N = alpha × 1000) */
  alphas: number[];
  /** images drawn (XObject /Im<key>): PNG bytes, base64 */
  images: { key: string; png: string }[];
}

/** Marks a segment's place in a page stream (NUL never occurs in content operators). */
export const SEGMENT_MARK = '\u0000';

/** Resource names a content stream refers to. */
export const FONT_RESOURCE: Record<FontKey, string> = { regular: 'FR', bold: 'FB' };
export const alphaResource = (milli: number): string => `Ga${milli}`;
export const imageResource = (key: string): string => `Im${key}`;
export const formResource = (key: string): string => `Fx${key}`;

type Matrix = [number, number, number, number, number, number];
const IDENTITY: Matrix = [1, 0, 0, 1, 0, 0];

function multiply(m: Matrix, n: Matrix): Matrix {
  // m · n: n applied first (canvas transform(n) on a context whose matrix is m)
  return [m[0] * n[0] + m[2] * n[1], m[1] * n[0] + m[3] * n[1], m[0] * n[2] + m[2] * n[3], m[1] * n[2] + m[3] * n[3], m[0] * n[4] + m[2] * n[5] + m[4], m[1] * n[4] + m[3] * n[5] + m[5]];
}

/** A number in a content stream: at most 3 decimals (1/1000 pt), no exponent, no "-0". */
export function num(v: number): string {
  const r = Math.round(v * 1000) / 1000;
  return r === 0 || !Number.isFinite(r) ? '0' : String(r);
}

interface Rgba {
  r: number;
  g: number;
  b: number;
  a: number;
}

const NAMED: Record<string, string> = {
  black: '#000000',
  white: '#ffffff',
  red: '#ff0000',
  green: '#008000',
  blue: '#0000ff',
  gray: '#808080',
  grey: '#808080',
  lightgray: '#d3d3d3',
  lightgrey: '#d3d3d3',
  darkgray: '#a9a9a9',
  darkgrey: '#a9a9a9',
  silver: '#c0c0c0',
  orange: '#ffa500',
  steelblue: '#4682b4',
};

const colourCache = new Map<string, Rgba>();

/** CSS colour → RGBA in 0–1 (hex, rgb()/rgba(), a few names, transparent); anything else is an error, never black by default. */
export function parseColour(c: string): Rgba {
  let v = colourCache.get(c);
  if (v) return v;
  const s = c.trim().toLowerCase();
  const hex = NAMED[s] ?? s;
  let m: RegExpMatchArray | null;
  if (s === 'transparent' || s === 'none') v = { r: 0, g: 0, b: 0, a: 0 };
  else if ((m = hex.match(/^#([0-9a-f]{3,4}|[0-9a-f]{6}|[0-9a-f]{8})$/))) {
    let h = m[1]!;
    if (h.length <= 4) h = [...h].map((x) => x + x).join('');
    const p = (i: number) => parseInt(h.slice(i, i + 2), 16) / 255;
    v = { r: p(0), g: p(2), b: p(4), a: h.length === 8 ? p(6) : 1 };
  } else if ((m = s.match(/^rgba?\(([^)]*)\)$/))) {
    const parts = m[1]!.split(/[\s,/]+/).filter(Boolean);
    const ch = (x: string) => (x.endsWith('%') ? parseFloat(x) / 100 : parseFloat(x) / 255);
    const a = parts[3] === undefined ? 1 : parts[3].endsWith('%') ? parseFloat(parts[3]) / 100 : parseFloat(parts[3]);
    v = { r: ch(parts[0] ?? '0'), g: ch(parts[1] ?? '0'), b: ch(parts[2] ?? '0'), a };
    if (![v.r, v.g, v.b, v.a].every(Number.isFinite)) v = undefined;
  }
  if (!v) throw new Error(`PDF writer: colour "${c}" is not one it reads (hex, rgb(), rgba() or a basic name)`);
  colourCache.set(c, v);
  return v;
}

interface CanvasState {
  m: Matrix;
  fillStyle: unknown;
  strokeStyle: unknown;
  globalAlpha: number;
  lineWidth: number;
  lineCap: string;
  lineJoin: string;
  miterLimit: number;
  dash: number[];
  lineDashOffset: number;
  font: string;
  textAlign: string;
  textBaseline: string;
  globalCompositeOperation: string;
}

/** What has been set in the PDF graphics state (operators are written only when a value changes). */
interface PdfState {
  fill: string;
  stroke: string;
  alpha: number;
  lineWidth: string;
  cap: number;
  join: number;
  miter: string;
  dash: string;
}

const PDF_DEFAULT: PdfState = { fill: '0 0 0 rg', stroke: '0 0 0 RG', alpha: 1000, lineWidth: '1', cap: 0, join: 0, miter: '10', dash: '[] 0 d' };
/** A segment knows nothing of the state around it: its first use of each value writes it. */
const PDF_UNKNOWN: PdfState = { fill: '', stroke: '', alpha: -1, lineWidth: '', cap: -1, join: -1, miter: '', dash: '' };
const CAP: Record<string, number> = { butt: 0, round: 1, square: 2 };
const JOIN: Record<string, number> = { miter: 0, round: 1, bevel: 2 };

interface Frame {
  canvas: CanvasState;
  /** whether a `q` was written for this frame (only when it clips) */
  q: boolean;
  pdf: PdfState | undefined;
}

const fontCache = new Map<string, { size: number; key: FontKey }>();
function parseFont(font: string): { size: number; key: FontKey } {
  let f = fontCache.get(font);
  if (!f) {
    const m = font.match(/(-?\d*\.?\d+(?:e[-+]?\d+)?)px/i);
    const size = m ? parseFloat(m[1]!) : 10;
    const before = m ? font.slice(0, m.index) : font;
    const key: FontKey = before.split(/\s+/).some((w) => isBoldWeight(w)) ? 'bold' : 'regular';
    f = { size, key };
    fontCache.set(font, f);
  }
  return f;
}

/** Pixels per point an image that is not a PNG (an SVG logo) is rasterised at: 288 dpi. */
const RASTER_SCALE = 4;

/**
 * PNG bytes of an image as drawn: node-canvas keeps an image's source (a data URL or a Buffer) in `src`;
 * a PNG goes in as it is, anything else node-canvas loaded (SVG, JPEG) is rasterised at 288 dpi.
 */
function pngBytes(image: unknown, w: number, h: number): Uint8Array {
  const src = (image as { src?: unknown }).src;
  let bytes: Uint8Array | undefined;
  if (src instanceof Uint8Array) bytes = src;
  else if (typeof src === 'string' && src.startsWith('data:image/png;base64,')) bytes = Buffer.from(src.slice('data:image/png;base64,'.length), 'base64');
  if (bytes && bytes[1] === 0x50 && bytes[2] === 0x4e && bytes[3] === 0x47) return bytes;
  const { createCanvas } = createRequire(import.meta.url)('canvas') as typeof import('canvas');
  const c = createCanvas(Math.max(1, Math.ceil(w * RASTER_SCALE)), Math.max(1, Math.ceil(h * RASTER_SCALE)));
  c.getContext('2d').drawImage(image as import('canvas').Image, 0, 0, c.width, c.height);
  return c.toBuffer('image/png');
}

export class PdfCanvas {
  private readonly out: string[] = [];
  private readonly stack: Frame[] = [];
  private s: CanvasState = {
    m: IDENTITY,
    fillStyle: '#000000',
    strokeStyle: '#000000',
    globalAlpha: 1,
    lineWidth: 1,
    lineCap: 'butt',
    lineJoin: 'miter',
    miterLimit: 10,
    dash: [],
    lineDashOffset: 0,
    font: '10px sans-serif',
    textAlign: 'start',
    textBaseline: 'alphabetic',
    globalCompositeOperation: 'source-over',
  };
  private pdf: PdfState = { ...PDF_DEFAULT };
  private path: string[] = [];
  /** current point and subpath start, page coordinates */
  private cx = 0;
  private cy = 0;
  private sx = 0;
  private sy = 0;
  private hasPoint = false;
  private readonly glyphs: Record<FontKey, Map<number, string>> = { regular: new Map(), bold: new Map() };
  private readonly alphas = new Set<number>();
  private readonly images = new Map<string, Uint8Array>();
  private readonly segments = new Map<string, string>();
  private segment: { start: number; outer: PdfState; depth: number } | undefined;
  /** vega reads it when it clips to dirty bounds */
  readonly pixelRatio = 1;
  imageSmoothingEnabled = true;

  constructor(
    readonly width: number,
    readonly height: number,
    private readonly engine: FontEngine = FontEngine.get(),
  ) {
    // vega's page space: origin top left, y down, 1 unit = 1 pt
    this.out.push(`1 0 0 -1 0 ${num(height)} cm`);
  }

  // ── state ──────────────────────────────────────────────────────────
  get fillStyle(): unknown {
    return this.s.fillStyle;
  }
  set fillStyle(v: unknown) {
    this.s.fillStyle = v;
  }
  get strokeStyle(): unknown {
    return this.s.strokeStyle;
  }
  set strokeStyle(v: unknown) {
    this.s.strokeStyle = v;
  }
  get globalAlpha(): number {
    return this.s.globalAlpha;
  }
  set globalAlpha(v: number) {
    if (Number.isFinite(v) && v >= 0 && v <= 1) this.s.globalAlpha = v;
  }
  get lineWidth(): number {
    return this.s.lineWidth;
  }
  set lineWidth(v: number) {
    if (Number.isFinite(v) && v > 0) this.s.lineWidth = v;
  }
  get lineCap(): string {
    return this.s.lineCap;
  }
  set lineCap(v: string) {
    if (v in CAP) this.s.lineCap = v;
  }
  get lineJoin(): string {
    return this.s.lineJoin;
  }
  set lineJoin(v: string) {
    if (v in JOIN) this.s.lineJoin = v;
  }
  get miterLimit(): number {
    return this.s.miterLimit;
  }
  set miterLimit(v: number) {
    if (Number.isFinite(v) && v > 0) this.s.miterLimit = v;
  }
  get lineDashOffset(): number {
    return this.s.lineDashOffset;
  }
  set lineDashOffset(v: number) {
    if (Number.isFinite(v)) this.s.lineDashOffset = v;
  }
  get font(): string {
    return this.s.font;
  }
  set font(v: string) {
    this.s.font = v;
  }
  get textAlign(): string {
    return this.s.textAlign;
  }
  set textAlign(v: string) {
    this.s.textAlign = v;
  }
  get textBaseline(): string {
    return this.s.textBaseline;
  }
  set textBaseline(v: string) {
    this.s.textBaseline = v;
  }
  get globalCompositeOperation(): string {
    return this.s.globalCompositeOperation;
  }
  set globalCompositeOperation(v: string) {
    this.s.globalCompositeOperation = v;
  }
  setLineDash(d: readonly number[]): void {
    if (!d.every((x) => Number.isFinite(x) && x >= 0)) return;
    this.s.dash = d.length % 2 === 1 ? [...d, ...d] : [...d];
  }
  getLineDash(): number[] {
    return [...this.s.dash];
  }

  save(): void {
    this.stack.push({ canvas: { ...this.s, dash: [...this.s.dash] }, q: false, pdf: undefined });
  }

  restore(): void {
    const f = this.stack.pop();
    if (!f) return;
    this.s = f.canvas;
    if (f.q) {
      this.out.push('Q');
      this.pdf = f.pdf!;
    }
  }

  // ── transforms ─────────────────────────────────────────────────────
  translate(x: number, y: number): void {
    this.s.m = multiply(this.s.m, [1, 0, 0, 1, x, y]);
  }
  scale(x: number, y: number): void {
    this.s.m = multiply(this.s.m, [x, 0, 0, y, 0, 0]);
  }
  rotate(a: number): void {
    const c = Math.cos(a);
    const s = Math.sin(a);
    this.s.m = multiply(this.s.m, [c, s, -s, c, 0, 0]);
  }
  transform(a: number, b: number, c: number, d: number, e: number, f: number): void {
    this.s.m = multiply(this.s.m, [a, b, c, d, e, f]);
  }
  setTransform(a: number, b: number, c: number, d: number, e: number, f: number): void {
    this.s.m = [a, b, c, d, e, f];
  }

  private tx(x: number, y: number): [number, number] {
    const m = this.s.m;
    return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
  }

  // ── paths ──────────────────────────────────────────────────────────
  beginPath(): void {
    this.path = [];
    this.hasPoint = false;
  }
  moveTo(x: number, y: number): void {
    const [px, py] = this.tx(x, y);
    this.path.push(`${num(px)} ${num(py)} m`);
    this.cx = this.sx = px;
    this.cy = this.sy = py;
    this.hasPoint = true;
  }
  lineTo(x: number, y: number): void {
    if (!this.hasPoint) return this.moveTo(x, y);
    const [px, py] = this.tx(x, y);
    this.path.push(`${num(px)} ${num(py)} l`);
    this.cx = px;
    this.cy = py;
  }
  bezierCurveTo(x1: number, y1: number, x2: number, y2: number, x: number, y: number): void {
    if (!this.hasPoint) this.moveTo(x1, y1);
    const [a, b] = this.tx(x1, y1);
    const [c, d] = this.tx(x2, y2);
    const [e, f] = this.tx(x, y);
    this.path.push(`${num(a)} ${num(b)} ${num(c)} ${num(d)} ${num(e)} ${num(f)} c`);
    this.cx = e;
    this.cy = f;
  }
  quadraticCurveTo(x1: number, y1: number, x: number, y: number): void {
    if (!this.hasPoint) this.moveTo(x1, y1);
    // the cubic with the same curve: control points 2/3 of the way to the quadratic one (affine, so in page space)
    const [qx, qy] = this.tx(x1, y1);
    const [ex, ey] = this.tx(x, y);
    const c1x = this.cx + (2 / 3) * (qx - this.cx);
    const c1y = this.cy + (2 / 3) * (qy - this.cy);
    const c2x = ex + (2 / 3) * (qx - ex);
    const c2y = ey + (2 / 3) * (qy - ey);
    this.path.push(`${num(c1x)} ${num(c1y)} ${num(c2x)} ${num(c2y)} ${num(ex)} ${num(ey)} c`);
    this.cx = ex;
    this.cy = ey;
  }
  closePath(): void {
    if (!this.hasPoint) return;
    this.path.push('h');
    this.cx = this.sx;
    this.cy = this.sy;
  }
  rect(x: number, y: number, w: number, h: number): void {
    const m = this.s.m;
    if (m[1] === 0 && m[2] === 0) {
      const [px, py] = this.tx(x, y);
      this.path.push(`${num(px)} ${num(py)} ${num(w * m[0])} ${num(h * m[3])} re`);
      this.cx = this.sx = px;
      this.cy = this.sy = py;
      this.hasPoint = true;
    } else {
      this.moveTo(x, y);
      this.lineTo(x + w, y);
      this.lineTo(x + w, y + h);
      this.lineTo(x, y + h);
      this.closePath();
    }
  }
  /** Canvas arc semantics (HTML Living Standard, "arc()"): a line to the start, then the sweep as cubic Béziers of ≤ 90°. */
  arc(x: number, y: number, r: number, a0: number, a1: number, ccw = false): void {
    if (!(r >= 0)) return;
    const TAU = 2 * Math.PI;
    let sweep: number;
    if (!ccw) sweep = a1 - a0 >= TAU ? TAU : ((((a1 - a0) % TAU) + TAU) % TAU);
    else sweep = a0 - a1 >= TAU ? -TAU : -((((a0 - a1) % TAU) + TAU) % TAU);
    const sx = x + r * Math.cos(a0);
    const sy = y + r * Math.sin(a0);
    if (this.hasPoint) this.lineTo(sx, sy);
    else this.moveTo(sx, sy);
    if (sweep === 0 || r === 0) return;
    const n = Math.ceil(Math.abs(sweep) / (Math.PI / 2) - 1e-9);
    const step = sweep / n;
    const k = (4 / 3) * Math.tan(step / 4);
    let a = a0;
    for (let i = 0; i < n; i++) {
      const b = a + step;
      const ca = Math.cos(a);
      const sa = Math.sin(a);
      const cb = Math.cos(b);
      const sb = Math.sin(b);
      this.bezierCurveTo(x + r * (ca - k * sa), y + r * (sa + k * ca), x + r * (cb + k * sb), y + r * (sb - k * cb), x + r * cb, y + r * sb);
      a = b;
    }
  }
  ellipse(x: number, y: number, rx: number, ry: number, rotation: number, a0: number, a1: number, ccw = false): void {
    const m = this.s.m;
    this.translate(x, y);
    this.rotate(rotation);
    this.scale(rx, ry);
    this.arc(0, 0, 1, a0, a1, ccw);
    this.s.m = m;
  }
  /** Canvas arcTo: a line to the first tangent point, then the arc of radius r tangent to both lines. */
  arcTo(x1: number, y1: number, x2: number, y2: number, r: number): void {
    if (!this.hasPoint) return this.moveTo(x1, y1);
    const m = this.s.m;
    const det = m[0] * m[3] - m[1] * m[2];
    // the current point back in user space
    const ux = this.cx - m[4];
    const uy = this.cy - m[5];
    const x0 = (m[3] * ux - m[2] * uy) / det;
    const y0 = (-m[1] * ux + m[0] * uy) / det;
    const d1x = x0 - x1;
    const d1y = y0 - y1;
    const d2x = x2 - x1;
    const d2y = y2 - y1;
    const l1 = Math.hypot(d1x, d1y);
    const l2 = Math.hypot(d2x, d2y);
    const cross = d1x * d2y - d1y * d2x;
    if (r === 0 || l1 === 0 || l2 === 0 || Math.abs(cross) < 1e-12) return this.lineTo(x1, y1);
    const cos = (d1x * d2x + d1y * d2y) / (l1 * l2);
    const half = Math.acos(Math.max(-1, Math.min(1, cos))) / 2;
    const t = r / Math.tan(half);
    const p1x = x1 + (d1x / l1) * t;
    const p1y = y1 + (d1y / l1) * t;
    const p2x = x1 + (d2x / l2) * t;
    const p2y = y1 + (d2y / l2) * t;
    // centre: along the bisector at r / sin(half)
    const bx = d1x / l1 + d2x / l2;
    const by = d1y / l1 + d2y / l2;
    const bl = Math.hypot(bx, by);
    const dc = r / Math.sin(half);
    const ccx = x1 + (bx / bl) * dc;
    const ccy = y1 + (by / bl) * dc;
    this.lineTo(p1x, p1y);
    this.arc(ccx, ccy, r, Math.atan2(p1y - ccy, p1x - ccx), Math.atan2(p2y - ccy, p2x - ccx), cross > 0);
  }

  // ── painting ───────────────────────────────────────────────────────
  private setAlpha(a: number): void {
    const milli = Math.round(a * 1000);
    if (milli === this.pdf.alpha) return;
    this.alphas.add(milli);
    this.out.push(`/${alphaResource(milli)} gs`);
    this.pdf.alpha = milli;
  }

  /** The paint's colour and alpha set in the PDF; false when nothing would show. */
  private paint(style: unknown, stroke: boolean): boolean {
    if (typeof style !== 'string') throw new Error('PDF writer: gradients and patterns are not drawn (a colour string is)');
    if (this.s.globalCompositeOperation !== 'source-over') throw new Error(`PDF writer: blend mode "${this.s.globalCompositeOperation}" is not drawn`);
    const c = parseColour(style);
    const a = this.s.globalAlpha * c.a;
    if (a <= 0) return false;
    const op = `${num(c.r)} ${num(c.g)} ${num(c.b)} ${stroke ? 'RG' : 'rg'}`;
    if (stroke ? this.pdf.stroke !== op : this.pdf.fill !== op) {
      this.out.push(op);
      if (stroke) this.pdf.stroke = op;
      else this.pdf.fill = op;
    }
    this.setAlpha(a);
    return true;
  }

  /** Line width and dashes scale with the transform, as on a canvas. */
  private strokeState(): void {
    const m = this.s.m;
    const k = Math.sqrt(Math.abs(m[0] * m[3] - m[1] * m[2]));
    const lw = num(this.s.lineWidth * k);
    if (lw !== this.pdf.lineWidth) {
      this.out.push(`${lw} w`);
      this.pdf.lineWidth = lw;
    }
    const cap = CAP[this.s.lineCap]!;
    if (cap !== this.pdf.cap) {
      this.out.push(`${cap} J`);
      this.pdf.cap = cap;
    }
    const join = JOIN[this.s.lineJoin]!;
    if (join !== this.pdf.join) {
      this.out.push(`${join} j`);
      this.pdf.join = join;
    }
    if (join === 0) {
      const ml = num(Math.max(1, this.s.miterLimit));
      if (ml !== this.pdf.miter) {
        this.out.push(`${ml} M`);
        this.pdf.miter = ml;
      }
    }
    const dash = this.s.dash.length === 0 || this.s.dash.every((d) => d === 0) ? '[] 0 d' : `[${this.s.dash.map((d) => num(d * k)).join(' ')}] ${num(this.s.lineDashOffset * k)} d`;
    if (dash !== this.pdf.dash) {
      this.out.push(dash);
      this.pdf.dash = dash;
    }
  }

  fill(rule?: 'nonzero' | 'evenodd'): void {
    if (this.path.length === 0 || !this.paint(this.s.fillStyle, false)) return;
    this.out.push(this.path.join(' '), rule === 'evenodd' ? 'f*' : 'f');
  }
  stroke(): void {
    if (this.path.length === 0 || !this.paint(this.s.strokeStyle, true)) return;
    this.strokeState();
    this.out.push(this.path.join(' '), 'S');
  }
  clip(rule?: 'nonzero' | 'evenodd'): void {
    const top = this.stack[this.stack.length - 1];
    if (top && !top.q) {
      this.out.push('q');
      top.q = true;
      top.pdf = { ...this.pdf };
    }
    // an empty path clips everything away
    this.out.push(this.path.length === 0 ? '0 0 m h' : this.path.join(' '), rule === 'evenodd' ? 'W* n' : 'W n');
  }
  fillRect(x: number, y: number, w: number, h: number): void {
    const path = this.path;
    const point = [this.cx, this.cy, this.sx, this.sy, this.hasPoint] as const;
    this.beginPath();
    this.rect(x, y, w, h);
    this.fill();
    this.path = path;
    [this.cx, this.cy, this.sx, this.sy, this.hasPoint] = point;
  }
  strokeRect(x: number, y: number, w: number, h: number): void {
    const path = this.path;
    const point = [this.cx, this.cy, this.sx, this.sy, this.hasPoint] as const;
    this.beginPath();
    this.rect(x, y, w, h);
    this.stroke();
    this.path = path;
    [this.cx, this.cy, this.sx, this.sy, this.hasPoint] = point;
  }
  /** Nothing to clear on a fresh PDF page (vega does not call it on an external context). */
  clearRect(): void {}

  // ── text ───────────────────────────────────────────────────────────
  measureText(text: string): { width: number } {
    const f = parseFont(this.s.font);
    return { width: this.engine.width(text, f.size, f.key === 'bold') };
  }

  fillText(text: string, x: number, y: number): void {
    this.text(text, x, y, false);
  }
  strokeText(text: string, x: number, y: number): void {
    this.text(text, x, y, true);
  }

  private text(text: string, x: number, y: number, stroke: boolean): void {
    if (!text) return;
    const f = parseFont(this.s.font);
    if (!(f.size > 0) || !this.paint(stroke ? this.s.strokeStyle : this.s.fillStyle, stroke)) return;
    if (stroke) this.strokeState();
    const face = this.engine.faces[f.key];
    const run = this.engine.run(text, f.key);
    const upm = face.unitsPerEm;
    const w = (run.total * f.size) / upm;
    const align = this.s.textAlign;
    if (align === 'center') x -= w / 2;
    else if (align === 'right' || align === 'end') x -= w;
    const base = this.s.textBaseline;
    if (base !== 'alphabetic') {
      const asc = (face.font.ascent * f.size) / upm;
      const desc = (face.font.descent * f.size) / upm; // negative
      y += base === 'top' || base === 'hanging' ? asc : base === 'middle' ? (asc + desc) / 2 : base === 'bottom' || base === 'ideographic' ? desc : 0;
    }
    const used = this.glyphs[f.key];
    let hex = '';
    const parts: string[] = [];
    for (let i = 0; i < run.gids.length; i++) {
      const g = run.gids[i]!;
      const had = used.get(g);
      const ch = run.chars[i]!;
      if (had === undefined || (ch !== '' && (had === '' || ch < had))) used.set(g, ch);
      hex += g.toString(16).padStart(4, '0');
      const kern = run.advances[i]! - run.widths[i]!;
      if (kern !== 0 && i < run.gids.length - 1) {
        parts.push(`<${hex}>`, num((-kern * 1000) / upm));
        hex = '';
      }
    }
    if (hex) parts.push(`<${hex}>`);
    const m = this.s.m;
    // text space: glyphs up (−y of the canvas), origin at (x, y)
    const tm = [m[0], m[1], -m[2], -m[3], m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]].map(num).join(' ');
    const show = parts.length === 1 ? `${parts[0]} Tj` : `[${parts.join(' ')}] TJ`;
    this.out.push(`BT /${FONT_RESOURCE[f.key]} ${num(f.size)} Tf ${tm} Tm${stroke ? ' 1 Tr' : ''} ${show}${stroke ? ' 0 Tr' : ''} ET`);
  }

  // ── images ─────────────────────────────────────────────────────────
  drawImage(image: unknown, x: number, y: number, w?: number, h?: number): void {
    const iw = w ?? (image as { width: number }).width;
    const ih = h ?? (image as { height: number }).height;
    if (!(iw > 0 && ih > 0)) return;
    const bytes = pngBytes(image, iw, ih);
    const key = createHash('sha1').update(bytes).digest('hex').slice(0, 16);
    this.images.set(key, bytes);
    this.setAlpha(this.s.globalAlpha);
    const m = multiply(this.s.m, [iw, 0, 0, -ih, x, y + ih]);
    this.out.push(`q ${m.map(num).join(' ')} cm /${imageResource(key)} Do Q`);
  }

  /** Starts a mark's drawing: what follows sets all the state it uses (see the file comment). */
  beginSegment(): void {
    if (this.segment) return;
    this.segment = { start: this.out.length, outer: this.pdf, depth: this.stack.length };
    this.pdf = { ...PDF_UNKNOWN };
  }

  /** Ends a mark's drawing: its operators leave the page stream for a keyed segment. */
  endSegment(): void {
    const seg = this.segment;
    if (!seg) return;
    this.segment = undefined;
    if (this.stack.length !== seg.depth) throw new Error('PDF writer: a mark left a save() without its restore()');
    this.pdf = seg.outer;
    const ops = this.out.splice(seg.start);
    if (ops.length === 0) return;
    const body = ops.join('\n');
    const key = createHash('sha1').update(body).digest('hex').slice(0, 16);
    this.segments.set(key, body);
    this.out.push(`${SEGMENT_MARK}${key}${SEGMENT_MARK}`);
  }

  /** The page as data for the book writer. */
  finish(): PageContent {
    this.endSegment();
    while (this.stack.length > 0) this.restore();
    const stream = this.out.join('\n');
    const glyphs = (k: FontKey) => [...this.glyphs[k]].sort((a, b) => a[0] - b[0]);
    return {
      width: this.width,
      height: this.height,
      stream,
      segments: Object.fromEntries([...this.segments].sort((a, b) => (a[0] < b[0] ? -1 : 1))),
      glyphs: { regular: glyphs('regular'), bold: glyphs('bold') },
      alphas: [...this.alphas].sort((a, b) => a - b),
      images: [...this.images].sort((a, b) => (a[0] < b[0] ? -1 : 1)).map(([key, b]) => ({ key, png: Buffer.from(b).toString('base64') })),
    };
  }
}
