/**
 * The Mx–My contour of an actual section at one axial load as CSV or JSON (`pmchart contour`).
 * CSV columns (stable interface): na_angle_deg,na_depth,eps_t,phi,P,Mx,My — forces and moments in the
 * system's display units (kip, kip-ft / kN, kN·m), named in the JSON header. Pure: no I/O.
 */
import { contourAtAxial, type BiaxialSection } from '../analysis/biaxial.js';
import type { Arrangement, Shape } from '../section/types.js';
import { DISPLAY_UNITS, toDisplay, type UnitSystem } from '../units/index.js';
import { CAUTION } from './caution.js';
import { fmt, num } from './format.js';

export const CONTOUR_COLUMNS = ['na_angle_deg', 'na_depth', 'eps_t', 'phi', 'P', 'Mx', 'My'] as const;

export interface ContourViewInput {
  sec: BiaxialSection;
  Pu: number;
  /** neutral-axis angles over a full turn */
  count: number;
  units: UnitSystem;
  shape: Shape;
  arrangement: Arrangement;
  gamma: number;
  /** γB when given (outer-column spacing ÷ b) */
  gammaB?: number;
  steel: string;
  steelArea: number;
  rhoG: number;
}

const csvCell = (v: number): string => fmt(v);

export function contourText(format: 'csv' | 'json', v: ContourViewInput, generator: string): string {
  const u = v.units;
  const du = DISPLAY_UNITS[u];
  const F = (x: number) => toDisplay(x, 'force', u);
  const M = (x: number) => toDisplay(x, 'moment', u);
  const rows = contourAtAxial(v.sec, v.Pu, v.count, 'design').map((p) => [(p.theta * 180) / Math.PI, p.c, p.epsT, p.phi, F(p.P), M(p.Mx), M(p.My)]);
  if (format === 'csv') return [CONTOUR_COLUMNS.join(','), ...rows.map((r) => r.map(csvCell).join(','))].join('\n') + '\n';
  const b = v.sec.basis;
  return (
    JSON.stringify(
      {
        generator,
        code: b.code,
        codeTitle: b.title,
        units: u,
        unitsOf: { P: du.force, Mx: du.moment, My: du.moment, na_depth: du.length },
        inputs: {
          fc: num(b.fc),
          fy: num(b.fy),
          shape: v.shape,
          arrangement: v.arrangement,
          gamma: num(v.gamma),
          ...(v.gammaB !== undefined ? { gammaB: num(v.gammaB) } : {}),
          transverse: b.transverse,
          steel: v.steel,
          steelArea: num(v.steelArea),
          rho_g: num(v.rhoG),
          Pu: num(F(v.Pu)),
        },
        conventions: [
          'x across the width b, y along the depth h; Mx bends in the depth h (the chart plane), My in the width b.',
          'Neutral-axis angle 0° is uniaxial bending about x with the +y face compressed, 90° about y with the +x face compressed.',
          `Values are ${b.symbols.designFamily} (design) capacities of the actual bars; the ${b.symbols.axialCap ?? 'axial cap'} is checked for Pu.`,
        ],
        basis: { parameters: b.parameters, notes: b.notes },
        columns: CONTOUR_COLUMNS,
        points: rows.map((r) => r.map((x) => num(x))),
        caution: CAUTION,
      },
      null,
      1,
    ) + '\n'
  );
}
