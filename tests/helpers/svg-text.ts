/**
 * Text boxes of a vega SVG in page points: each <text> with the translations of its enclosing groups,
 * its anchor, rotation and a measured width (node-canvas, the sheet typeface). Ascent 0.76 em and
 * descent 0.24 em of DejaVu Sans (from memory).
 */
export interface TextBox {
  text: string;
  /** the vega mark the text belongs to, e.g. "curve_labels_marks" */
  mark: string;
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

const decode = (s: string) => s.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#x27;|&#39;/g, "'").replace(/&amp;/g, '&');

export function svgTextBoxes(svg: string, measure: (text: string, size: number, bold: boolean) => number): TextBox[] {
  const out: TextBox[] = [];
  const stack: { dx: number; dy: number; mark?: string }[] = [{ dx: 0, dy: 0 }];
  const re = /<g\b([^>]*?)(\/?)>|<\/g>|<text\b([^>]*)>([^<]*)<\/text>/g;
  for (let m = re.exec(svg); m; m = re.exec(svg)) {
    const top = stack[stack.length - 1]!;
    if (m[0] === '</g>') {
      stack.pop();
      continue;
    }
    if (m[0].startsWith('<g')) {
      if (m[2] === '/') continue;
      const t = /transform="translate\(([-\d.e]+),([-\d.e]+)\)"/.exec(m[1]!);
      const cls = /class="mark-text role-mark ([^"]+)"/.exec(m[1]!);
      stack.push({ dx: top.dx + (t ? Number(t[1]) : 0), dy: top.dy + (t ? Number(t[2]) : 0), mark: cls ? cls[1] : top.mark });
      continue;
    }
    const attrs = m[3]!;
    const text = decode(m[4]!);
    if (!text.trim()) continue;
    const tr = /transform="translate\(([-\d.e]+),([-\d.e]+)\)( rotate\(-90\))?/.exec(attrs);
    const fs = Number(/font-size="([\d.]+)px"/.exec(attrs)?.[1] ?? 10);
    const bold = /font-weight="bold"/.test(attrs);
    const anchor = /text-anchor="(\w+)"/.exec(attrs)?.[1] ?? 'start';
    const x = top.dx + (tr ? Number(tr[1]) : 0);
    const y = top.dy + (tr ? Number(tr[2]) : 0);
    const w = measure(text, fs, bold);
    const a = anchor === 'middle' ? w / 2 : anchor === 'end' ? w : 0;
    if (tr?.[3]) out.push({ text, mark: top.mark ?? '', x0: x - 0.76 * fs, x1: x + 0.24 * fs, y0: y - w + a, y1: y + a });
    else out.push({ text, mark: top.mark ?? '', x0: x - a, x1: x - a + w, y0: y - 0.76 * fs, y1: y + 0.24 * fs });
  }
  return out;
}

/** Pairs of boxes that overlap by more than `tol` points both ways. */
export function overlappingPairs(boxes: readonly TextBox[], tol = 0.3): [TextBox, TextBox][] {
  const out: [TextBox, TextBox][] = [];
  for (let i = 0; i < boxes.length; i++)
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i]!;
      const b = boxes[j]!;
      if (Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0) > tol && Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0) > tol) out.push([a, b]);
    }
  return out;
}
