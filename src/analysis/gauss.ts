/**
 * Gauss–Legendre nodes and weights on [−1, 1], found by Newton iteration on Pn(x)
 * (Abramowitz & Stegun 25.4.29; Press et al., Numerical Recipes, 3rd ed., §4.6.1).
 */
export function gaussLegendre(n: number): { nodes: Float64Array; weights: Float64Array } {
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (x * p1 - p0)) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    nodes[i] = x;
    weights[i] = 2 / ((1 - x * x) * dp * dp);
  }
  return { nodes, weights };
}

/** The rule the section integrator uses: exact for polynomials to degree 19. */
export const GAUSS_10 = gaussLegendre(10);

const EXACT_RULES = new Map<number, { nodes: Float64Array; weights: Float64Array }>();

/**
 * The fewest points exact for a polynomial integrand of degree `degree` (m points are exact to degree
 * 2m − 1, Abramowitz & Stegun 25.4.29), cached; `undefined` (no polynomial) gives GAUSS_10.
 */
export function gaussForDegree(degree: number | undefined): { nodes: Float64Array; weights: Float64Array } {
  if (degree === undefined || degree > 18) return GAUSS_10;
  const m = Math.max(1, Math.ceil((degree + 1) / 2));
  let r = EXACT_RULES.get(m);
  if (!r) {
    r = gaussLegendre(m);
    EXACT_RULES.set(m, r);
  }
  return r;
}
