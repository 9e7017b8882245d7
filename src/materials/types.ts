/**
 * Material laws in strain space. Compression strain and stress are positive.
 * A law's stress depends on strain only, so the same law serves the section integrator,
 * the displaced-concrete deduction at bars and the biaxial solver.
 */
export interface ConcreteLaw {
  /** short description for sheets and reports */
  readonly label: string;
  /** compressive stress at strain ε (compression positive); 0 for ε ≤ 0 */
  stress(strain: number): number;
  /** strains where stress(ε) has a kink or jump; the integrator splits there */
  readonly breakpoints: readonly number[];
  /** largest stress the law reaches */
  readonly peakStress: number;
  /**
   * degree of stress(ε) as a polynomial in ε between breakpoints (0: constant, 2: parabola); absent when it is
   * not a polynomial. Integrators use it to take as few Gauss points as are exact for that degree.
   */
  readonly polynomialDegree?: number;
}

export interface SteelLaw {
  readonly label: string;
  /** stress at strain ε, compression positive, tension negative */
  stress(strain: number): number;
  /** yield strain fy/Es of the law's yield stress */
  readonly yieldStrain: number;
  readonly yieldStress: number;
  readonly modulus: number;
}
