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

/** Rules of 1 to 9 points: n points are exact for polynomials to degree 2n − 1. */
const SMALL_RULES = [1, 2, 3, 4, 5, 6, 7, 8, 9].map(gaussLegendre);
/** The smallest rule exact for polynomials of the given degree; GAUSS_10 when the degree is unknown or high. */
export function gaussExactFor(degree: number | undefined): { nodes: Float64Array; weights: Float64Array } {
  if (degree === undefined || !(degree >= 0)) return GAUSS_10;
  const n = Math.max(1, Math.ceil((degree + 1) / 2));
  return n >= 10 ? GAUSS_10 : SMALL_RULES[n - 1]!;
}
