/**
 * `pmchart contour`: the factored Mx–My contour of the actual section at one axial load, as CSV or JSON.
 * CSV columns (stable interface): na_angle_deg,na_depth,eps_t,phi,P,Mx,My — forces and moments in the
 * system's display units (kip, kip-ft / kN, kN·m), named in the JSON header.
 */
import { renameSync, writeFileSync } from 'node:fs';
import type { Command } from 'commander';
import { contourAtAxial, squashPoint } from '../analysis/biaxial.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { DISPLAY_UNITS, parseQuantity, toDisplay } from '../units/index.js';
import { generatorLabel } from '../version.js';
import { actualBars, biaxialSectionOf } from './actual-bars.js';
import { csvLine, num } from './format.js';
import { addSectionOptions, resolveSectionFlags, type SectionFlags } from './section-flags.js';
import { CAUTION } from './table.js';

export const CONTOUR_COLUMNS = ['na_angle_deg', 'na_depth', 'eps_t', 'phi', 'P', 'Mx', 'My'] as const;

export interface ContourOptions extends SectionFlags {
  pu?: string;
  rho?: string;
  points?: string;
  format?: string;
  out?: string;
}

/** Runs the command and returns the text it prints or writes (tests call this without the parser). */
export function runContour(o: ContourOptions): string {
  const section = resolveSectionFlags(o, true);
  const format = o.format ?? 'csv';
  if (format !== 'csv' && format !== 'json') throw new PmError(ERROR_CODES.invalidValue, '--format', 'is not one of the allowed values', { value: format, allowed: 'csv, json' });
  if (o.pu === undefined) throw new PmError(ERROR_CODES.missing, '--pu', `is required (the design axial load, default unit ${DISPLAY_UNITS[section.units].force}, compression positive)`);
  const Pu = parseQuantity(o.pu, 'force', section.units, '--pu');
  const count = o.points === undefined ? 72 : Number(o.points);
  if (!Number.isInteger(count)) throw new PmError(ERROR_CODES.invalidValue, '--points', 'is not a whole number', { value: o.points, allowed: '8–3600' });
  requireInRange('--points', count, 8, 3600);
  const bars = actualBars(section, o.rho);
  const sec = biaxialSectionOf(section, bars.bars);
  const u = section.units;
  const du = DISPLAY_UNITS[u];
  const cap = sec.cap.design;
  const tension = -sec.basis.design.factor(1) * sec.basis.design.steel.yieldStress * sec.steelArea;
  if (Pu > cap || Pu > squashPoint(sec) || Pu <= tension) {
    const hi = Math.min(cap, squashPoint(sec));
    throw new PmError(ERROR_CODES.outOfRange, '--pu', 'is outside the axial range of the section', {
      value: o.pu,
      allowed: `${num(toDisplay(tension, 'force', u), 5)} to ${num(toDisplay(hi, 'force', u), 5)} ${du.force}`,
    });
  }
  const pts = contourAtAxial(sec, Pu, count, 'design');
  const F = (x: number) => toDisplay(x, 'force', u);
  const M = (x: number) => toDisplay(x, 'moment', u);
  const rows = pts.map((p) => [(p.theta * 180) / Math.PI, p.c, p.epsT, p.phi, F(p.P), M(p.Mx), M(p.My)]);
  let text: string;
  if (format === 'csv') {
    text = [csvLine(CONTOUR_COLUMNS), ...rows.map((r) => csvLine(r))].join('\n') + '\n';
  } else {
    const b = section.basis;
    text =
      JSON.stringify(
        {
          generator: generatorLabel(),
          code: b.code,
          codeTitle: b.title,
          units: u,
          unitsOf: { P: du.force, Mx: du.moment, My: du.moment, na_depth: du.length },
          inputs: {
            fc: num(b.fc),
            fy: num(b.fy),
            shape: section.shape,
            arrangement: section.arrangement,
            gamma: num(section.gamma),
            transverse: b.transverse,
            steel: bars.source,
            steelArea: num(bars.steelArea),
            rho_g: num(bars.rhoG),
            Pu: num(F(Pu)),
          },
          conventions: [
            'x across the width b, y along the depth h; Mx bends in the depth h (the chart plane), My in the width b.',
            'Neutral-axis angle 0° is uniaxial bending about x with the +y face compressed, 90° about y with the +x face compressed.',
            `Values are ${b.symbols.designFamily} (design) capacities of the actual bars; the axial cap is checked for Pu.`,
          ],
          basis: { parameters: b.parameters, notes: b.notes },
          columns: CONTOUR_COLUMNS,
          points: rows.map((r) => r.map((v) => num(v))),
          caution: CAUTION,
        },
        null,
        1,
      ) + '\n';
  }
  if (o.out) {
    const tmp = `${o.out}.tmp-${process.pid}`;
    try {
      writeFileSync(tmp, text);
      renameSync(tmp, o.out);
    } catch (e) {
      throw new PmError(ERROR_CODES.io, '--out', `cannot be written (${(e as Error).message.split('\n')[0]})`, { value: o.out });
    }
    return '';
  }
  return text;
}

export function registerContour(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  const cmd = program.command('contour').description('factored Mx–My contour of the actual section at one axial load (CSV or JSON)');
  addSectionOptions(cmd)
    .option('--pu <force>', 'design axial load, compression positive (default unit kip or kN)')
    .option('--rho <value>', 'ρg of the section (or give --bar to use the arrangement’s bars)')
    .option('--points <n>', 'neutral-axis angles over a full turn (8–3600)', '72')
    .option('--format <fmt>', 'csv or json', 'csv')
    .option('--out <file>', 'write to a file instead of standard output')
    .action((opts: ContourOptions) => run(() => void process.stdout.write(runContour(opts))));
}
