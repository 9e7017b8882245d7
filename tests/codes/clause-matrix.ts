/**
 * The clause matrix: for every rule of every rulebook (Basis.rules), the test that exercises it and the
 * outside reference that test checks against. tests/codes/clause-matrix.test.ts fails when a rule has
 * no row here, when a row names a test that does not exist, or when the sources disagree.
 *   code id → rule id → { file, test (an `it` or `describe` name in that file), source, reference }
 * `source` repeats the rule's own ('published' or 'from memory'); `reference` names the published
 * clause, textbook example or hand calculation the test compares with.
 */
export interface MatrixRow {
  /** test file, relative to the repository root */
  file: string;
  /** the name of an `it` or `describe` block in that file */
  test: string;
  source: 'published' | 'from memory';
  reference: string;
}

const SL = 'tests/design/slenderness.test.ts';
const SL_RULES = 'tests/design/slenderness-rules.test.ts';
const SL_EN = 'tests/design/slenderness-en-terms.test.ts';
const SL_AS_CSA = 'tests/design/slenderness-as-csa.test.ts';
const RB = 'tests/codes/rulebooks.test.ts';
const SW = 'tests/design/slenderness-sway.test.ts';
const ACI_SWAY_HAND = 'Q = 0.2: δs = 1.25, M2 = 2100, along the length δ = 1.0104, design moment 2121.75 kip·in';
const aciSway = (edition: string, neglect: string): Record<string, MatrixRow> => ({
  'sway-slenderness-limit': { file: SW, test: edition === 'ACI 318-19' ? 'kℓu/r = 22 exactly may be neglected (6.2.5.1(a)): the first-order end moment 1800, not magnified' : 'ACI 318-14: the same figures under its own neglect clause 6.2.5(a) and 1.4 limit 6.2.6 (from memory)', source: 'from memory', reference: `${edition} ${neglect}, hand calculation` },
  'sway-end-moments': { file: SW, test: ACI_SWAY_HAND, source: 'from memory', reference: `${edition} 6.6.4.6.1 (published text, up.codes), M2 = 600 + 1.25·1200 = 2100 by hand` },
  'sway-magnifier': { file: SW, test: 'storey sums ΣPu = 3000, ΣPc = 16,000 kips: δs = 1/(1 − 3000/12,000) = 1.3333 (6.6.4.6.2(b)); kℓu as braced 144 in is short along the length', source: 'from memory', reference: `${edition} 6.6.4.6.2(a), (b), hand calculation` },
  'sway-stability-limit': { file: SW, test: 'Q = 1 and ΣPu = 0.75·ΣPc are unstable: δ infinite (6.6.4.6.2)', source: 'from memory', reference: `${edition} 6.6.4.6.2; δs > 1.5 only by (b) or (c) (published text, up.codes)` },
  'sway-along-length': { file: SW, test: ACI_SWAY_HAND, source: 'from memory', reference: `${edition} 6.6.4.6.4, along the length δ = 1.010359 by hand` },
});
const ACI = 'tests/codes/aci318.test.ts';

const ACI19_HAND = 'ACI 318-19 6.6.4 non-sway moment magnification — hand calculation';
const ACI14_HAND = 'δ = 2.2850 and the 1.4 limit of 6.2.6 fails, cited as ACI 318-14 6.2.6';
const EN_HAND = 'λ = 51.96 > λlim = 37.90; e2 = 56.37 mm; MEd = 155.06 kN·m';
const CSA_HAND = 'single curvature: δ = 2.2361, Mc = 223.61 kN·m';
const AS_HAND = 'δb = 1.4561, M* = 436.83 kN·m';

export const CLAUSE_MATRIX: Readonly<Record<string, Readonly<Record<string, MatrixRow>>>> = {
  'aci318-19': {
    'axial-cap': { file: ACI, test: 'spiral columns use 0.75 and a cap of 0.85·Po (22.4.2.1)', source: 'published', reference: 'ACI 318-19 22.4.2.1' },
    'strength-reduction': { file: ACI, test: 'is 0.65 (tied) at εt ≤ εty, 0.90 at εt ≥ εty + 0.003 and linear between', source: 'published', reference: 'ACI 318-19 Table 21.2.2' },
    'biaxial-method': { file: 'tests/design/biaxial.test.ts', test: 'checkBiaxial: three methods side by side', source: 'from memory', reference: 'Bresler, ACI Journal 57(5), 1960; exact surface by strain compatibility (22.2)' },
    'grade-limit': { file: ACI, test: 'ACI 318-19: 100 ksi allowed in gravity columns (the default), 80 ksi in special seismic systems', source: 'from memory', reference: 'ACI 318-19 Table 20.2.2.4(a)' },
    'slenderness-limit': { file: SL, test: 'double curvature raises the limit and caps it at 40: M1/M2 = +0.75 → min(43, 40)', source: 'from memory', reference: 'ACI 318-19 6.2.5.1(b), hand calculation' },
    'radius-of-gyration': { file: SL, test: ACI19_HAND, source: 'from memory', reference: 'ACI 318-19 6.2.5.2, hand calculation r = 0.30·16 = 4.8 in' },
    'end-moment-convention': { file: SL_RULES, test: 'M1 = M2 = 0: limit 22, slender, Cm = 1.0, δ = 1.2948, Mc = 559.34 kip·in', source: 'from memory', reference: 'ACI 318-19 6.2.5.1 sign convention, hand calculation' },
    magnifier: { file: SL, test: ACI19_HAND, source: 'from memory', reference: 'ACI 318-19 6.6.4.4.2, 6.6.4.4.4, 6.6.4.5.2, hand calculation' },
    'cm-factor': { file: SL, test: ACI19_HAND, source: 'from memory', reference: 'ACI 318-19 6.6.4.5.3(a), Cm = 0.84 by hand' },
    'min-moment': { file: SL, test: 'the minimum moment governs a small M2 and sets Cm = 1.0 (6.6.4.5.4)', source: 'from memory', reference: 'ACI 318-19 6.6.4.5.4, M2,min = 432 kip·in by hand' },
    'stability-limit': { file: SL, test: 'Pu ≥ 0.75·Pc is unstable: not ok, δ infinite', source: 'from memory', reference: 'ACI 318-19 6.6.4.5.2' },
    'second-order-limit': { file: SL, test: ACI19_HAND, source: 'from memory', reference: 'ACI 318-19 6.2.5.3, options (a), (b) exceed 1.4 by hand' },
    ...aciSway('ACI 318-19', '6.2.5.1(a)'),
  },
  'aci318-14': {
    'axial-cap': { file: RB, test: 'ACI 318-14: Pn,max = 0.80·Po tied, 0.85·Po spiral (22.4.2.1); load contour α = 1.5 (Bresler, 1960, from memory)', source: 'published', reference: 'ACI 318-14 22.4.2.1' },
    'strength-reduction': { file: ACI, test: '318-19 ends the transition at εty + 0.003, 318-14 at 0.005', source: 'published', reference: 'ACI 318-14 Table 21.2.2' },
    'biaxial-method': { file: RB, test: 'ACI 318-14: Pn,max = 0.80·Po tied, 0.85·Po spiral (22.4.2.1); load contour α = 1.5 (Bresler, 1960, from memory)', source: 'from memory', reference: 'Bresler, ACI Journal 57(5), 1960' },
    'grade-limit': { file: ACI, test: 'ACI 318-14: fy = 100 ksi is refused (80 ksi for longitudinal column bars), naming --fy, the limit and the use', source: 'from memory', reference: 'ACI 318-14 Table 20.2.2.4(a), 20.2.2.5' },
    'slenderness-limit': { file: RB, test: ACI14_HAND, source: 'from memory', reference: 'ACI 318-14 6.2.5(b), hand calculation' },
    'radius-of-gyration': { file: RB, test: ACI14_HAND, source: 'from memory', reference: 'ACI 318-14 6.2.5.1' },
    'end-moment-convention': { file: RB, test: 'ACI 318-14: M1 = M2 = 0 is single curvature, M1/M2 = −1: limit 34 − 12 = 22 < kℓu/r = 144/4.8 = 30, slender', source: 'from memory', reference: 'ACI 318-14 6.2.5, hand calculation' },
    magnifier: { file: RB, test: ACI14_HAND, source: 'from memory', reference: 'ACI 318-14 6.6.4.5.2, δ = 2.2850 by hand' },
    'cm-factor': { file: RB, test: ACI14_HAND, source: 'from memory', reference: 'ACI 318-14 6.6.4.5.3, Cm = 0.84 by hand' },
    'min-moment': { file: RB, test: ACI14_HAND, source: 'from memory', reference: 'ACI 318-14 6.6.4.5.4, M2,min = 432 kip·in by hand' },
    'stability-limit': { file: RB, test: 'Pu = 700 kips ≥ 0.75·Pc = 632.5 kips is unstable (6.6.4.5.2)', source: 'from memory', reference: 'ACI 318-14 6.6.4.5.2' },
    'second-order-limit': { file: RB, test: ACI14_HAND, source: 'from memory', reference: 'ACI 318-14 6.2.6' },
    ...aciSway('ACI 318-14', '6.2.5(a)'),
  },
  'en1992-1-1': {
    'biaxial-method': { file: SL_EN, test: 'NRd = 2383.9 kN and a = 1.48', source: 'from memory', reference: 'EN 1992-1-1 5.8.9(4) Eq. 5.39; Bond et al., Worked Examples to Eurocode 2 (The Concrete Centre), biaxial column check' },
    'slenderness-limit': { file: SL_EN, test: 'λ = 43.30 > λlim = 31.83: slender (A = 0.7), said in the steps', source: 'published', reference: 'EN 1992-1-1:2004 5.8.3.1(1), published text quoted in the test' },
    'radius-of-gyration': { file: SL, test: EN_HAND, source: 'from memory', reference: 'EN 1992-1-1 5.8.3.2(1), hand calculation i = 115.47 mm' },
    'end-moment-convention': { file: SL_EN, test: 'M01 = +30, M02 = +60 (same sign): single curvature, rm = +0.5, λlim = 31.83, slender', source: 'published', reference: 'EN 1992-1-1:2004 5.8.3.1(1), published text quoted in the test' },
    imperfection: { file: SL, test: 'a short column (l0 = 3 m, λ = 25.98 < λlim) is not magnified: the end moment M02 + NEd·ei', source: 'from memory', reference: 'EN 1992-1-1 5.2(7), ei = l0/400' },
    'min-moment': { file: 'tests/codes/en1992.test.ts', test: 'minimum moment NEd·e0 with e0 = max(h/30, 20 mm) (6.1(4))', source: 'from memory', reference: 'EN 1992-1-1 6.1(4)' },
    'equivalent-moment': { file: SL, test: EN_HAND, source: 'from memory', reference: 'EN 1992-1-1 5.8.8.2(2) Eq. 5.32, M0e = 48 kN·m by hand' },
    'nominal-curvature': { file: SL, test: EN_HAND, source: 'published', reference: 'EN 1992-1-1 5.8.8.3 Eq. 5.34–5.37, hand calculation' },
    'curvature-factor-c': { file: SL_RULES, test: 'M01 = M02 (constant first-order moment): c = 8, e2 = 70.47 mm, MEd = 188.20 kN·m', source: 'published', reference: 'EN 1992-1-1:2004 5.8.8.2(4), published text quoted in the test' },
    magnifier: { file: SL, test: EN_HAND, source: 'from memory', reference: 'EN 1992-1-1 5.8.8.2 Eq. 5.31, 5.33, hand calculation' },
    'sway-effective-length': { file: SW, test: 'Eq. 5.16 factor: 2.081666 for k1 = 0.5, k2 = 1.0; 2.0 from the second term for k1 = k2 = 1 (√6 = 2.449 is larger)', source: 'from memory', reference: 'EN 1992-1-1 5.8.3.2(3) Eq. 5.16, hand calculation' },
    'sway-slenderness-limit': { file: SW, test: 'l0 = 8326.66 mm, λ = 72.11 > λlim = 22.11, e2 = 95.93 mm, MEd = 265.11 kN·m', source: 'published', reference: 'EN 1992-1-1:2004 5.8.3.1(1) "rm should be taken as 1,0 … for unbraced members in general" (usingeurocodes.com), λlim = 22.106 by hand' },
    'sway-imperfection': { file: SW, test: 'l0 = 8326.66 mm, λ = 72.11 > λlim = 22.11, e2 = 95.93 mm, MEd = 265.11 kN·m', source: 'from memory', reference: 'EN 1992-1-1 5.2(7), ei = 20.817 mm by hand' },
    'sway-end-moments': { file: SW, test: 'l0 = 8326.66 mm, λ = 72.11 > λlim = 22.11, e2 = 95.93 mm, MEd = 265.11 kN·m', source: 'from memory', reference: 'EN 1992-1-1 5.8.8.2, M0Ed = 121.225 kN·m, MEd = 265.115 kN·m by hand' },
  },
  'csa-a23.3-19': {
    'biaxial-method': { file: RB, test: 'CSA biaxial: load contour with Bresler’s α = 1.5 for a rectangle (Bresler, ACI Journal 57(5), 1960, from memory)', source: 'from memory', reference: 'Bresler, ACI Journal 57(5), 1960' },
    'slenderness-limit': { file: SL_AS_CSA, test: CSA_HAND, source: 'from memory', reference: 'CSA A23.3-19 10.15.2, hand calculation' },
    'radius-of-gyration': { file: SL_AS_CSA, test: CSA_HAND, source: 'from memory', reference: 'CSA A23.3-19 10.14.2' },
    'end-moment-convention': { file: SL_AS_CSA, test: 'double curvature (M1 = −50): limit (25 + 5)/0.597614 = 50.20 ≥ 50, neglected', source: 'from memory', reference: 'CSA A23.3-19 10.15.2 sign convention, hand calculation' },
    'min-moment': { file: RB, test: 'CSA: M2 = 40 kN·m < M2,min = 2e6·(15 + 0.03·400) = 54 kN·m governs, Cm = 1.0; δ = 1/(1 − 0.642240) = 2.795170', source: 'from memory', reference: 'CSA A23.3-19 10.15.3.1, hand calculation' },
    magnifier: { file: SL_AS_CSA, test: CSA_HAND, source: 'from memory', reference: 'CSA A23.3-19 10.15.3.1, δ = 2.2361 by hand' },
    'cm-factor': { file: SL_AS_CSA, test: CSA_HAND, source: 'from memory', reference: 'CSA A23.3-19 10.15.3.2, Cm = 0.8 by hand' },
    'stability-limit': { file: RB, test: 'CSA: Pf = 3500 kN ≥ 0.75·Pc = 3114.1 kN is unstable', source: 'from memory', reference: 'CSA A23.3-19 10.15.3.1' },
    'sway-slenderness-limit': { file: SW, test: 'Q = 0.1: δs = 1.1111, M2 = 148.89 kN·m, along the length δ = 1.2349, Mc = 183.86 kN·m', source: 'from memory', reference: 'CSA A23.3-19 10.16 (no sway neglect limit applied), hand calculation' },
    'sway-end-moments': { file: SW, test: 'Q = 0.1: δs = 1.1111, M2 = 148.89 kN·m, along the length δ = 1.2349, Mc = 183.86 kN·m', source: 'from memory', reference: 'CSA A23.3-19 10.16.2, M2 = 148.889 kN·m by hand' },
    'sway-magnifier': { file: SW, test: 'Q = 0.1: δs = 1.1111, M2 = 148.89 kN·m, along the length δ = 1.2349, Mc = 183.86 kN·m', source: 'from memory', reference: 'CSA A23.3-19 10.16.3, δs = 1.1111 by hand' },
    'sway-stability-limit': { file: SW, test: 'storey sums: ΣPf = 0.75·ΣPc is unstable (10.16.3.1); δs = 1.5 from Q is within, above is outside', source: 'from memory', reference: 'CSA A23.3-19 10.16.3.1, 10.16.3.2' },
    'sway-along-length': { file: SW, test: 'Q = 0.1: δs = 1.1111, M2 = 148.89 kN·m, along the length δ = 1.2349, Mc = 183.86 kN·m', source: 'from memory', reference: 'CSA A23.3-19 10.16.4, δ = 1.234882 by hand' },
  },
  'as3600-2018': {
    'biaxial-method': { file: SL_RULES, test: 'AS 3600-2018 10.6.4: load-contour exponent αn = 0.7 + 1.7·N*/(0.6·Nuo), 1 ≤ αn ≤ 2 (from memory)', source: 'from memory', reference: 'AS 3600-2018 10.6.4, hand calculation αn = 1.245' },
    'strength-reduction': { file: 'tests/codes/as3600.test.ts', test: 'φ in the transition (Table 2.2.2): kuo = 0.45 → φ = 1.24 − 13·0.45/12 = 0.7525; ends 0.85 and 0.65', source: 'from memory', reference: 'AS 3600-2018 Table 2.2.2' },
    edition: { file: RB, test: 'the basis title and first note say Amendment 2’s φ is not applied', source: 'published', reference: 'AS 3600:2018 Amd 2:2021, published summary listing Table 2.2.2' },
    'slenderness-limit': { file: SL_AS_CSA, test: AS_HAND, source: 'from memory', reference: 'AS 3600-2018 10.3.1, hand calculation' },
    'radius-of-gyration': { file: SL_AS_CSA, test: AS_HAND, source: 'from memory', reference: 'AS 3600-2018 10.5.2, r = 180 mm by hand' },
    'end-moment-convention': { file: SL_RULES, test: 'AS 3600-2018 10.3.1 / 10.4.2: M1*/M2* = −1 when |M2*| ≤ 0.05·D·N* (from memory)', source: 'from memory', reference: 'AS 3600-2018 10.3.1, 10.4.2, hand calculation' },
    'min-moment': { file: SL_AS_CSA, test: 'a short column (Le = 4 m, Le/r = 22.2 ≤ 25) keeps M2* ≥ N*·0.05·D', source: 'from memory', reference: 'AS 3600-2018 10.1.2' },
    magnifier: { file: SL_AS_CSA, test: AS_HAND, source: 'from memory', reference: 'AS 3600-2018 10.4.2, δb = 1.4561 by hand' },
    'buckling-load': { file: SL_AS_CSA, test: AS_HAND, source: 'from memory', reference: 'AS 3600-2018 10.4.4, Nc = 6,657,899 N by hand' },
    'stability-limit': { file: RB, test: 'AS: N* = 7000 kN ≥ Nc = 6,657,899 N (Le = 8 m, the section of slenderness-as-csa.test.ts) is unstable', source: 'from memory', reference: 'AS 3600-2018 10.4.2' },
    'scope-slenderness': { file: SL_RULES, test: 'Le/r = 121 > 120 is outside the moment-magnifier method (10.5.1, from memory): not ok, with the clause', source: 'from memory', reference: 'AS 3600-2018 10.5.1' },
    'sway-slenderness-limit': { file: SW, test: 'ΣN* = ΣNc is unstable; Le/r = 22 is short (10.3.1(a))', source: 'from memory', reference: 'AS 3600-2018 10.3.1(a)' },
    'sway-magnifier': { file: SW, test: 'δs = 2.0 governs: M* = 600 kN·m', source: 'from memory', reference: 'AS 3600-2018 10.4.3, δs = 2.0 by hand' },
    'sway-braced-magnifier': { file: SW, test: 'δb governs a stiff storey: M* = 436.83 kN·m, the braced answer', source: 'from memory', reference: 'AS 3600-2018 10.4.2, δb = 1.4561 by hand' },
    'sway-stability-limit': { file: SW, test: 'ΣN* = ΣNc is unstable; Le/r = 22 is short (10.3.1(a))', source: 'from memory', reference: 'AS 3600-2018 10.4.3' },
  },
};
