/**
 * The flags of `pmchart check` beyond the uniaxial short column: a moment about y (`--muy`) and the
 * slenderness member data (`--klu` …, end moments in each basis's own sign convention). Parsing only; the
 * engine applies them (src/design/column-check.ts).
 */
import { parseDecimal } from '../input/limits.js';
import type { Command } from 'commander';
import type { FactoredLoad } from '../design/check.js';
import type { ColumnCheckInput } from '../design/column-check.js';
import type { AxisMember, SlendernessRequest } from '../design/column-effects.js';
import { EI_OPTIONS, endMomentConvention, isEiOption } from '../design/slenderness.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { flagOf } from '../input/flags.js';
import { DISPLAY_UNITS, parseQuantity } from '../units/index.js';
import type { ResolvedSection } from './section-flags.js';

export interface EffectsFlags {
  muy?: string;
  klu?: string;
  kluY?: string;
  m1?: string;
  m2?: string;
  m1Y?: string;
  m2Y?: string;
  m01?: string;
  m02?: string;
  m01Y?: string;
  m02Y?: string;
  betaDns?: string;
  eiOption?: string;
  transverseLoads?: boolean;
  creep?: string;
}

export function addEffectsOptions(cmd: Command): Command {
  return cmd
    .option('--muy <moment>', 'factored moment about the y axis (bending in b) for the biaxial check; a Muy column in --loads does the same')
    .option('--klu <length>', 'effective length kℓu (l0 for EN 1992-1-1) for bending about x: turns the slenderness check on')
    .option('--klu-y <length>', 'effective length for bending about y (default --klu)')
    .option('--m1 <moment>', 'smaller end moment about x, negative in single curvature (default −M2); M1 column in --loads')
    .option('--m2 <moment>', 'larger end moment about x, positive (default |Mu|); M2 column in --loads')
    .option('--m1-y <moment>', 'smaller end moment about y, negative in single curvature (default −M2y); M1y column')
    .option('--m2-y <moment>', 'larger end moment about y (default |Muy|); M2y column')
    .option('--m01 <moment>', 'EN 1992-1-1 and CSA A23.3: smaller end moment about x, same sign as --m02 in single curvature (EN 5.8.3.1 rm > 0; CSA 10.15.3.2); M01 column in --loads')
    .option('--m02 <moment>', 'EN 1992-1-1 and CSA A23.3: larger end moment about x, with its sign (default |Mu|); M02 column')
    .option('--m01-y <moment>', 'EN 1992-1-1 and CSA A23.3: smaller end moment about y, same sign as --m02-y in single curvature; M01y column')
    .option('--m02-y <moment>', 'EN 1992-1-1 and CSA A23.3: larger end moment about y (default |Muy|); M02y column')
    .option('--beta-dns <ratio>', 'ACI 318-19 6.6.4.4.4 βdns, sustained ÷ total factored axial load, 0–1 (required with --klu for ACI)')
    .option('--ei-option <a|b|c>', 'ACI 318-19 6.6.4.4.4 (EI)eff option', 'a')
    .option('--transverse-loads', 'transverse loads between supports: Cm = 1.0 (ACI 318-19 6.6.4.5.3(b))')
    .option('--creep <ratio>', 'EN 1992-1-1 5.8.4 effective creep ratio φef (not given: A = 0.7 by 5.8.3.1(1))');
}

/** End-moment options and the load column each fills, in both sign conventions (ACI M1/M2; EN and CSA M01/M02). */
const END_MOMENT_FLAGS = [
  ['m1', 'M1'],
  ['m2', 'M2'],
  ['m1Y', 'M1y'],
  ['m2Y', 'M2y'],
  ['m01', 'M01'],
  ['m02', 'M02'],
  ['m01Y', 'M01y'],
  ['m02Y', 'M02y'],
] as const;

const plain = (path: string, text: string, lo: number, hi: number): number => {
  const v = parseDecimal(text) ?? NaN;
  if (!Number.isFinite(v)) throw new PmError(ERROR_CODES.invalidValue, path, 'is not a number', { value: text, allowed: `${lo}–${hi}` });
  return requireInRange(path, v, lo, hi);
};

/** Reads the flags: Muy and end moments of a single load (a new load list), and the member data. */
export function resolveEffects(o: EffectsFlags, section: ResolvedSection, input: ColumnCheckInput, single: boolean): { loads: FactoredLoad[]; slenderness: SlendernessRequest | null } {
  const u = section.units;
  const loads = input.loads.map((l) => ({ ...l }));
  if (o.muy !== undefined) {
    if (!single) throw new PmError(ERROR_CODES.conflict, '--muy', 'applies to --pu/--mu; give a Muy column in --loads instead');
    loads[0]!.Muy = parseQuantity(o.muy, 'moment', u, '--muy');
  }
  const lengthRange: [number, number] = u === 'us' ? [12, 1200] : [300, 30000];
  const len = (path: string, text: string) => requireInRange(path, parseQuantity(text, 'length', u, path), lengthRange[0], lengthRange[1], DISPLAY_UNITS[u].length);
  let slenderness: SlendernessRequest | null = null;
  const endFlags = Object.fromEntries(END_MOMENT_FLAGS.map(([key]) => [flagOf(key), o[key]]));
  const conv = endMomentConvention(section.basis);
  const ownFlags: readonly string[] = [conv.smallerFlag, conv.largerFlag, conv.smallerFlagY, conv.largerFlagY].map(flagOf);
  for (const [flag, v] of Object.entries(endFlags)) {
    if (v !== undefined && !ownFlags.includes(flag)) {
      throw new PmError(ERROR_CODES.conflict, flag, `is not the end-moment flag of ${section.basis.title}: give ${ownFlags.join(', ')} instead, ${conv.rule}`);
    }
  }
  const anyMember = [o.kluY, ...Object.values(endFlags)].some((v) => v !== undefined);
  if (o.klu === undefined && anyMember) throw new PmError(ERROR_CODES.missing, '--klu', 'is required with the other slenderness flags (an effective length)');
  if (o.klu !== undefined) {
    const ei = o.eiOption ?? 'a';
    if (!isEiOption(ei)) throw new PmError(ERROR_CODES.invalidValue, '--ei-option', 'is not one of the allowed values', { value: ei, allowed: EI_OPTIONS.join(', ') });
    const member = (l: number): AxisMember => ({
      effectiveLength: l,
      ...(o.betaDns !== undefined ? { betaDns: plain('--beta-dns', o.betaDns, 0, 1) } : {}),
      eiOption: ei,
      transverseLoads: o.transverseLoads === true,
      ...(o.creep !== undefined ? { creepRatio: plain('--creep', o.creep, 0, 5) } : {}),
    });
    if (o.betaDns === undefined && section.basis.slenderness?.needsSustainedLoadRatio === true) {
      throw new PmError(ERROR_CODES.missing, '--beta-dns', 'is required with --klu (sustained ÷ total factored axial load, 0–1: ACI 318-19 βdns, AS 3600 βd, CSA A23.3 βd)');
    }
    slenderness = { x: member(len('--klu', o.klu)), ...(o.kluY !== undefined ? { y: member(len('--klu-y', o.kluY)) } : {}) };
    const moment = (path: string, t: string | undefined) => (t === undefined ? undefined : parseQuantity(t, 'moment', u, path));
    if (single) {
      const l = loads[0]!;
      for (const [key, column] of END_MOMENT_FLAGS) {
        const m = moment(flagOf(key), o[key]);
        if (m !== undefined) l[column] = m;
      }
    } else if (Object.values(endFlags).some((v) => v !== undefined)) {
      throw new PmError(ERROR_CODES.conflict, `${flagOf(conv.smallerFlag)}/${flagOf(conv.largerFlag)}`, `apply to --pu/--mu; give ${conv.columns.join(', ')} columns in --loads instead`);
    }
    // a load file's end-moment columns must be the basis's own (signs differ between conventions)
    const own: readonly string[] = conv.columns;
    for (const l of loads) {
      for (const key of ['M1', 'M2', 'M1y', 'M2y', 'M01', 'M02', 'M01y', 'M02y'] as const) {
        if (l[key] !== undefined && !own.includes(key)) {
          throw new PmError(ERROR_CODES.conflict, `--loads ${key} column`, `is not an end-moment column of ${section.basis.title}: use ${own.join(', ')}, ${conv.rule}`);
        }
      }
    }
    if ((slenderness.x.eiOption ?? 'a') !== 'a' && input.rho === undefined && input.layout === undefined) {
      throw new PmError(ERROR_CODES.missing, '--ei-option', `${slenderness.x.eiOption} needs the reinforcement: give --rho or a bar layout (option a needs none)`);
    }
  }
  return { loads, slenderness };
}
