/**
 * Each basis's rulebook as a list: every rule the check applies around the section, with its clause and
 * where its text comes from ('published': checked against published text or a published source named in
 * the tests; 'from memory': recalled, to be confirmed against the standard). The basis files take their
 * `rules` from here, the slenderness methods bring their own (codes/slenderness-*.ts). The detailing rules
 * (steel limits, clear spacing, cover, lap zone) are added beside these by the detailing work.
 * Each rule has a row in the clause matrix of the tests (tests/codes/clause-matrix.ts).
 */
import type { RuleDef } from './rules.js';
import { ACI_318_14_SLENDERNESS, ACI_318_19_SLENDERNESS } from './slenderness-aci318.js';
import { AS_3600_SLENDERNESS } from './slenderness-as3600.js';
import { CSA_A23_SLENDERNESS } from './slenderness-csa-a23.js';
import { EN_1992_SLENDERNESS } from './slenderness-en1992.js';

const aciSection = (edition: 'ACI 318-19' | 'ACI 318-14'): RuleDef[] => [
  { id: 'axial-cap', clause: '22.4.2.1', title: 'Pn,max = 0.80·Po (tied), 0.85·Po (spiral); stands in for a minimum eccentricity of short columns', source: 'published' },
  { id: 'strength-reduction', clause: 'Table 21.2.2', title: `φ from εt: 0.65 tied / 0.75 spiral to 0.90 at ${edition === 'ACI 318-19' ? 'εty + 0.003' : '0.005'}`, source: 'published' },
  {
    id: 'biaxial-method',
    clause: '22.2',
    title: 'biaxial bending: the exact strain-compatibility surface of the actual bars governs; Bresler reciprocal load and load contour (α = 1.5) shown beside',
    source: 'from memory',
  },
  {
    id: 'grade-limit',
    clause: 'Table 20.2.2.4(a)',
    title:
      edition === 'ACI 318-19'
        ? 'fy of longitudinal column bars ≤ 100 ksi (gravity), ≤ 80 ksi in special moment frames (special structural walls: 100 ksi)'
        : 'fy of longitudinal column bars ≤ 80 ksi; special seismic systems 60 ksi (20.2.2.5)',
    source: 'from memory',
  },
];

/** ACI 318-19: section rules, then the slenderness rulebook. */
export const ACI_318_19_RULES: readonly RuleDef[] = [...aciSection('ACI 318-19'), ...ACI_318_19_SLENDERNESS.rules];
/** ACI 318-14: section rules, then the slenderness rulebook (318-14 clause numbers). */
export const ACI_318_14_RULES: readonly RuleDef[] = [...aciSection('ACI 318-14'), ...ACI_318_14_SLENDERNESS.rules];

/** EN 1992-1-1:2004 with the recommended values. */
export const EN_1992_RULES: readonly RuleDef[] = [
  { id: 'biaxial-method', clause: '5.8.9(4)', title: 'load contour (MEdz/MRdz)^a + (MEdy/MRdy)^a ≤ 1, a from NEd/NRd by Eq. 5.39 (a = 2 for circles); exact surface beside', source: 'from memory' },
  ...EN_1992_SLENDERNESS.rules,
];

/** AS 3600-2018 (as published in 2018; Amendment 2 (2021) Table 2.2.2 φ not applied: see `edition`). */
export const AS_3600_RULES: readonly RuleDef[] = [
  { id: 'biaxial-method', clause: '10.6.4', title: 'load contour (Mx*/φMux)^αn + (My*/φMuy)^αn ≤ 1, αn = 0.7 + 1.7·N*/(0.6·Nuo), 1 ≤ αn ≤ 2', source: 'from memory' },
  { id: 'strength-reduction', clause: 'Table 2.2.2', title: 'φ = 1.24 − 13·kuo/12 within 0.65–0.85 (Class N, bending with axial force)', source: 'from memory' },
  {
    id: 'edition',
    clause: 'Table 2.2.2 (Amdt 2)',
    title: 'AS 3600-2018 as published; Amendment 2 (2021), which amends Table 2.2.2 (published summary), is not applied',
    source: 'published',
  },
  ...AS_3600_SLENDERNESS.rules,
];

/** CSA A23.3-19 (from memory throughout). */
export const CSA_A23_RULES: readonly RuleDef[] = [
  { id: 'biaxial-method', clause: 'Bresler (1960)', title: 'exact strain-compatibility surface governs; Bresler reciprocal load and load contour (α = 1.5) shown beside', source: 'from memory' },
  ...CSA_A23_SLENDERNESS.rules,
];

/** The sources a rule may name (RuleDef.source). */
export const RULE_SOURCES: readonly RuleDef['source'][] = ['published', 'from memory'];
