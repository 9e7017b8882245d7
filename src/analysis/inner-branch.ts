/**
 * The inner (conservative) branch of a computed interaction curve, as sheets draw it and as the check's
 * chart reading reads it. Where the computed points fold back in P (a bar row entering the rectangular
 * stress block drops P and M at one neutral-axis depth, or φ falling faster than Pn rises), the curve
 * passes some axial levels two or three times. The inner branch keeps, at every axial level P, the
 * smallest moment the computed polyline reaches there: a point on or inside it is on or inside every
 * computed branch at its P, so a reading off it never exceeds the computed capacity at that load level.
 * The result rises monotonically in P (horizontal runs allowed), so it never crosses itself.
 */

export interface Polyline {
  M: number[];
  P: number[];
}

interface Pt {
  M: number;
  P: number;
}

/** The smallest M of a monotone (non-decreasing P) polyline at level p, or NaN outside its range. */
function minAt(line: readonly Pt[], p: number): number {
  let m = NaN;
  for (let k = 0; k + 1 < line.length; k++) {
    const a = line[k]!;
    const b = line[k + 1]!;
    if (p < a.P || p > b.P) continue;
    const v = b.P === a.P ? Math.min(a.M, b.M) : a.M + ((p - a.P) / (b.P - a.P)) * (b.M - a.M);
    if (!(v >= m)) m = v;
  }
  if (line.length === 1 && line[0]!.P === p) m = line[0]!.M;
  return m;
}

/** The lower envelope in M of two monotone polylines (each non-decreasing in P). */
function mergeMin(A: readonly Pt[], B: readonly Pt[]): Pt[] {
  const [X, Y] = A[0]!.P <= B[0]!.P ? [A, B] : [B, A];
  const lo = Y[0]!.P;
  const hi = Math.min(X[X.length - 1]!.P, Y[Y.length - 1]!.P);
  if (lo > hi) return [...X, ...Y];
  const out: Pt[] = X.filter((q) => q.P < lo);
  const levels = [...new Set([...X, ...Y].map((q) => q.P).filter((p) => p >= lo && p <= hi))].sort((a, b) => a - b);
  // where the two cross between levels, the envelope switches branch: add the crossing
  const all: number[] = [];
  for (let j = 0; j < levels.length; j++) {
    const p = levels[j]!;
    if (j > 0) {
      const q = levels[j - 1]!;
      const d0 = minAt(X, q) - minAt(Y, q);
      const d1 = minAt(X, p) - minAt(Y, p);
      if (d0 * d1 < 0) all.push(q + (d0 / (d0 - d1)) * (p - q));
    }
    all.push(p);
  }
  const xLo = minAt(X, lo);
  if (Number.isFinite(xLo)) out.push({ M: xLo, P: lo });
  for (const p of all) out.push({ M: Math.min(minAt(X, p), minAt(Y, p)), P: p });
  // above the overlap: the branch that reaches higher, from its own value at the top of the overlap
  const upper = X[X.length - 1]!.P > hi ? X : Y[Y.length - 1]!.P > hi ? Y : null;
  if (upper) {
    out.push({ M: minAt(upper, hi), P: hi });
    for (const q of upper) if (q.P > hi) out.push(q);
  }
  return dedupe(out);
}

function dedupe(line: Pt[]): Pt[] {
  return line.filter((q, i) => i === 0 || q.M !== line[i - 1]!.M || q.P !== line[i - 1]!.P);
}

/** One branch, ordered so that P rises from pure tension to pure compression. */
function innerOfBranch(M: ArrayLike<number>, P: ArrayLike<number>, from: number, to: number): Pt[] {
  if (to - from < 2) return Array.from({ length: to - from }, (_, k) => ({ M: M[from + k]!, P: P[from + k]! }));
  // the flat top (an axial cap, or a curve ending on one level): set aside, then drawn from its start to its least M
  let pMax = -Infinity;
  for (let i = from; i < to; i++) pMax = Math.max(pMax, P[i]!);
  const tol = 1e-12 * Math.max(1, Math.abs(pMax));
  let flat = to;
  while (flat - 1 > from && P[flat - 1]! >= pMax - tol) flat--;
  // monotone runs, split where P falls back
  let env: Pt[] | null = null;
  let run: Pt[] = [];
  const close = () => {
    if (run.length) env = env ? mergeMin(env, run) : run;
    run = [];
  };
  const end = flat + 1 < to ? flat + 1 : to; // the flat's first point ends the rising part
  for (let i = from; i < end; i++) {
    const q = { M: M[i]!, P: P[i]! };
    if (run.length && q.P < run[run.length - 1]!.P) close();
    run.push(q);
  }
  close();
  const out: Pt[] = env ?? [];
  if (end < to) {
    // along the flat: its least M (pure compression on a symmetric section, M = 0)
    let mMin = Infinity;
    for (let i = flat; i < to; i++) mMin = Math.min(mMin, M[i]!);
    const top = out[out.length - 1];
    if (top && top.P >= pMax - tol) {
      if (mMin < top.M) out.push({ M: mMin, P: top.P });
    } else out.push({ M: mMin, P: pMax });
  }
  return dedupe(out);
}

/**
 * The inner branch of a curve (chart or internal units alike). `negativeStart`: where a closed loop's
 * negative-moment branch starts (`CurveFamily.negativeBranchStart`); it runs from pure compression back to
 * pure tension with M < 0, so its inner side is the larger M, and it is treated mirrored.
 */
export function innerBranch(M: ArrayLike<number>, P: ArrayLike<number>, negativeStart?: number): Polyline {
  const n = P.length;
  const split = negativeStart !== undefined && negativeStart > 0 && negativeStart < n ? negativeStart : n;
  const pos = innerOfBranch(M, P, 0, split);
  let neg: Pt[] = [];
  if (split < n) {
    const k = n - split;
    const mr = Array.from({ length: k }, (_, i) => -M[n - 1 - i]!);
    const pr = Array.from({ length: k }, (_, i) => P[n - 1 - i]!);
    neg = innerOfBranch(mr, pr, 0, k)
      .reverse()
      .map((q) => ({ M: -q.M, P: q.P }));
  }
  const all = [...pos, ...neg];
  return { M: all.map((q) => q.M), P: all.map((q) => q.P) };
}

/** Whether a polyline crosses itself (two non-adjacent segments intersect): O(n²), for tests and checks. */
export function selfCrossing(M: readonly number[], P: readonly number[]): [number, number] | null {
  const n = P.length;
  const cross = (ax: number, ay: number, bx: number, by: number, cx: number, cy: number) => (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
  for (let i = 0; i + 1 < n; i++) {
    for (let j = i + 2; j + 1 < n; j++) {
      if (i === 0 && j === n - 2 && M[0] === M[n - 1] && P[0] === P[n - 1]) continue;
      const d1 = cross(M[j]!, P[j]!, M[j + 1]!, P[j + 1]!, M[i]!, P[i]!);
      const d2 = cross(M[j]!, P[j]!, M[j + 1]!, P[j + 1]!, M[i + 1]!, P[i + 1]!);
      const d3 = cross(M[i]!, P[i]!, M[i + 1]!, P[i + 1]!, M[j]!, P[j]!);
      const d4 = cross(M[i]!, P[i]!, M[i + 1]!, P[i + 1]!, M[j + 1]!, P[j + 1]!);
      if (d1 * d2 < 0 && d3 * d4 < 0) return [i, j];
    }
  }
  return null;
}
