/**
 * The office logo as the title blocks draw it: an SVG or PNG file of at most 1 MB (MAX_LOGO_BYTES), checked by
 * its content, not its name. SVG is cleaned before it goes anywhere: no scripts, no event handlers, no
 * animation, no foreign content, and no reference outside the file (href, xlink:href, CSS url(), @import,
 * DOCTYPE entities) — a logo must draw the same on every machine and run nothing. Pure: the caller reads the
 * bytes (src/io/read.ts).
 */
import { ERROR_CODES, PmError } from '../errors.js';

export interface ResolvedLogo {
  kind: 'svg' | 'png';
  /** the cleaned SVG text or the PNG bytes, as a data URI */
  dataUri: string;
  /** pixel size (PNG) or the SVG's width and height (from its attributes or viewBox) */
  width: number;
  height: number;
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/** base64 without Buffer (the live page bundles config/ for the browser). */
function base64(bytes: Uint8Array): string {
  const abc = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
  let out = '';
  for (let i = 0; i < bytes.length; i += 3) {
    const a = bytes[i]!;
    const b = bytes[i + 1];
    const c = bytes[i + 2];
    out += abc[a >> 2]! + abc[((a & 3) << 4) | ((b ?? 0) >> 4)]! + (b === undefined ? '=' : abc[((b & 15) << 2) | ((c ?? 0) >> 6)]!) + (c === undefined ? '=' : abc[c & 63]!);
  }
  return out;
}

/** Reads a logo's bytes; `at` names the field or flag (`titleBlock.logo`, `--logo`) in errors (exit 2). */
export function logoFromBytes(bytes: Uint8Array, at: string, file: string): ResolvedLogo {
  if (bytes.length >= 24 && PNG_SIGNATURE.every((v, i) => bytes[i] === v)) {
    // IHDR: width and height, big-endian, at bytes 16–23 (ISO/IEC 15948 11.2.2)
    const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    const width = dv.getUint32(16);
    const height = dv.getUint32(20);
    if (width === 0 || height === 0 || width > 20000 || height > 20000) throw new PmError(ERROR_CODES.invalidValue, at, 'is a PNG of an unusable size (1–20000 pixels a side)', { value: file });
    return { kind: 'png', dataUri: `data:image/png;base64,${base64(bytes)}`, width, height };
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new PmError(ERROR_CODES.invalidValue, at, 'is neither a PNG nor an SVG file', { value: file });
  }
  if (!/<svg[\s>]/i.test(text)) throw new PmError(ERROR_CODES.invalidValue, at, 'is neither a PNG nor an SVG file', { value: file });
  const svg = cleanSvg(text);
  const size = svgSize(svg);
  if (!size) throw new PmError(ERROR_CODES.invalidValue, at, 'is an SVG without a size: give the <svg> element width and height, or a viewBox', { value: file });
  const sized = withSize(svg, size);
  return { kind: 'svg', dataUri: `data:image/svg+xml;base64,${base64(new TextEncoder().encode(sized))}`, width: size.w, height: size.h };
}

/** Elements removed whole, with their content: they run code, embed other documents or change the drawing over time. */
const DROPPED = ['script', 'foreignObject', 'iframe', 'embed', 'object', 'audio', 'video', 'animate', 'animateMotion', 'animateTransform', 'set', 'discard', 'handler', 'listener'];

/**
 * The SVG without anything that runs or reaches outside the file: scripts and other active elements, `on…`
 * handlers, href/xlink:href other than "#fragment" or an embedded PNG/JPEG, CSS url() other than "#fragment",
 * @import, processing instructions, and the DOCTYPE (whose entities could pull in files).
 */
export function cleanSvg(text: string): string {
  let s = text.replace(/^\uFEFF/, '');
  s = s.replace(/<!DOCTYPE[^[>]*(\[[\s\S]*?\])?\s*>/gi, '');
  s = s.replace(/<\?(?!xml\s)[\s\S]*?\?>/gi, '');
  s = s.replace(/<!\[CDATA\[([\s\S]*?)\]\]>/g, (_, body: string) => body.replace(/</g, '&lt;'));
  for (const el of DROPPED) {
    s = s.replace(new RegExp(`<(?:[\\w-]+:)?${el}\\b[^>]*/>`, 'gi'), '');
    s = s.replace(new RegExp(`<((?:[\\w-]+:)?${el})\\b[\\s\\S]*?</\\1\\s*>`, 'gi'), '');
    // an unclosed one: everything after it goes
    s = s.replace(new RegExp(`<(?:[\\w-]+:)?${el}\\b[\\s\\S]*$`, 'i'), '</svg>');
  }
  // attributes, inside tags only
  s = s.replace(/<([a-zA-Z][\w:.-]*)(\s[^<>]*?)?(\/?)>/g, (_, name: string, attrs: string | undefined, close: string) => `<${name}${cleanAttributes(attrs ?? '')}${close}>`);
  // style elements: no url() to the outside, no @import
  s = s.replace(/(<style\b[^>]*>)([\s\S]*?)(<\/style\s*>)/gi, (_, open: string, css: string, end: string) => `${open}${cleanCss(css)}${end}`);
  return s;
}

const SAFE_HREF = /^\s*(#|data:image\/(png|jpeg);base64,)/i;

function cleanAttributes(attrs: string): string {
  const out: string[] = [];
  const re = /([^\s=/]+)(?:\s*=\s*("[^"]*"|'[^']*'|[^\s"'>]+))?/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(attrs))) {
    const name = m[1]!;
    const raw = m[2];
    const value = raw === undefined ? '' : raw.replace(/^["']|["']$/g, '');
    const lower = name.toLowerCase();
    if (lower.startsWith('on')) continue;
    if ((lower === 'href' || lower.endsWith(':href') || lower === 'src') && !SAFE_HREF.test(decodeEntities(value))) continue;
    if (lower === 'style' && raw !== undefined) {
      out.push(` ${name}="${cleanCss(value).replace(/"/g, '&quot;')}"`);
      continue;
    }
    // presentation attributes can hold url(…) too (fill, clip-path, mask, filter, marker-*)
    if (raw !== undefined && /url\s*\(/i.test(decodeEntities(value)) && !/^\s*url\(\s*['"]?#[^)]*\)\s*$/i.test(decodeEntities(value))) continue;
    out.push(raw === undefined ? ` ${name}` : ` ${name}=${raw}`);
  }
  return out.join('');
}

/** Numeric and the five named XML entities, so "&#106;avascript:" is seen for what it is. */
function decodeEntities(v: string): string {
  return v
    .replace(/&#x([0-9a-f]+);?/gi, (_, h: string) => String.fromCodePoint(parseInt(h, 16)))
    .replace(/&#(\d+);?/g, (_, d: string) => String.fromCodePoint(Number(d)))
    .replace(/&(lt|gt|amp|quot|apos);/g, (_, n: string) => ({ lt: '<', gt: '>', amp: '&', quot: '"', apos: "'" })[n]!);
}

function cleanCss(css: string): string {
  return decodeEntities(css)
    .replace(/\\/g, '')
    .replace(/@import[^;]*;?/gi, '')
    .replace(/url\s*\(\s*(['"]?)([^)]*?)\1\s*\)/gi, (all, _q: string, target: string) => (target.trim().startsWith('#') ? all : 'none'))
    .replace(/expression\s*\(/gi, '(');
}

/** width and height of the root <svg> in user units (px, pt, mm, cm, in), else from its viewBox. */
export function svgSize(svg: string): { w: number; h: number } | undefined {
  const root = /<svg\b([^>]*)>/i.exec(svg)?.[1] ?? '';
  const attr = (n: string) => new RegExp(`\\s${n}\\s*=\\s*["']([^"']*)["']`, 'i').exec(root)?.[1];
  const len = (v: string | undefined) => {
    const m = v === undefined ? null : /^\s*([0-9.]+(?:e[-+]?\d+)?)\s*(px|pt|mm|cm|in)?\s*$/i.exec(v);
    if (!m) return undefined;
    const k = { px: 1, pt: 4 / 3, mm: 96 / 25.4, cm: 96 / 2.54, in: 96 }[(m[2] ?? 'px').toLowerCase() as 'px'];
    const n = Number(m[1]) * k;
    return Number.isFinite(n) && n > 0 ? n : undefined;
  };
  const w = len(attr('width'));
  const h = len(attr('height'));
  const vb = attr('viewBox')?.trim().split(/[\s,]+/).map(Number);
  const vw = vb && vb.length === 4 && vb.every(Number.isFinite) && vb[2]! > 0 && vb[3]! > 0 ? { w: vb[2]!, h: vb[3]! } : undefined;
  if (w !== undefined && h !== undefined) return { w, h };
  if (vw && w !== undefined) return { w, h: (w * vw.h) / vw.w };
  if (vw && h !== undefined) return { w: (h * vw.w) / vw.h, h };
  return vw;
}

/** The root <svg> with explicit width and height (a renderer needs them to size the image). */
function withSize(svg: string, size: { w: number; h: number }): string {
  return svg.replace(/<svg\b([^>]*)>/i, (_, attrs: string) => {
    const rest = attrs.replace(/\s(width|height)\s*=\s*("[^"]*"|'[^']*')/gi, '');
    const vb = /\sviewBox\s*=/i.test(rest) ? '' : ` viewBox="0 0 ${round(size.w)} ${round(size.h)}"`;
    return `<svg${rest} width="${round(size.w)}" height="${round(size.h)}"${vb}>`;
  });
}

const round = (v: number): number => Math.round(v * 1000) / 1000;
