/**
 * Ramer–Douglas–Peucker polyline simplification (Ramer 1972; Douglas & Peucker 1973): keeps the
 * points needed so that no dropped point lies farther than `tolerance` from the drawn line.
 * x and y are pre-scaled so the tolerance is in page points. Returns the kept indices, in order.
 */
export function simplifyIndices(x: ArrayLike<number>, y: ArrayLike<number>, tolerance: number): number[] {
  const n = x.length;
  if (n <= 2) return Array.from({ length: n }, (_, i) => i);
  const keep = new Uint8Array(n);
  keep[0] = 1;
  keep[n - 1] = 1;
  const stack: [number, number][] = [[0, n - 1]];
  const tol2 = tolerance * tolerance;
  while (stack.length > 0) {
    const [a, b] = stack.pop()!;
    const ax = x[a]!;
    const ay = y[a]!;
    const dx = x[b]! - ax;
    const dy = y[b]! - ay;
    const len2 = dx * dx + dy * dy;
    let worst = -1;
    let worstD = tol2;
    for (let i = a + 1; i < b; i++) {
      const px = x[i]! - ax;
      const py = y[i]! - ay;
      let d2: number;
      if (len2 === 0) d2 = px * px + py * py;
      else {
        const t = Math.max(0, Math.min(1, (px * dx + py * dy) / len2));
        const ex = px - t * dx;
        const ey = py - t * dy;
        d2 = ex * ex + ey * ey;
      }
      if (d2 > worstD) {
        worstD = d2;
        worst = i;
      }
    }
    if (worst > 0) {
      keep[worst] = 1;
      stack.push([a, worst], [worst, b]);
    }
  }
  const out: number[] = [];
  for (let i = 0; i < n; i++) if (keep[i]) out.push(i);
  return out;
}
