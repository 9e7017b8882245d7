/**
 * The flags of `pmchart check` beyond the uniaxial short column: a moment about y (`--muy`) and the
 * slenderness member data (`--klu` …, end moments in each basis's own sign convention). Parsing only; the
 * engine applies them (src/design/column-check.ts).
 */
import { parseDecimal, RESTRAINT_FLEXIBILITY_MAX, STABILITY_INDEX_MAX } from '../input/limits.js';
import type { Command } from 'commander';
import type { FactoredLoad } from '../design/check.js';
import type { ColumnCheckInput } from '../design/column-check.js';
import type { AxisMember, SlendernessRequest, SwayMember } from '../design/column-effects.js';
import { parseLoadQuantity } from '../input/loads-csv.js';
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
  sway?: boolean;
  m2Sway?: string;
  m1Sway?: string;
  m2SwayY?: string;
  m1SwayY?: string;
  m02Sway?: string;
  m01Sway?: string;
  m02SwayY?: string;
  m01SwayY?: string;
  stabilityIndex?: string;
  storeyPu?: string;
  storeyPc?: string;
  k1?: string;
  k2?: string;
  lu?: string;
  kluBraced?: string;
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
    .option('--creep <ratio>', 'EN 1992-1-1 5.8.4 effective creep ratio φef (not given: A = 0.7 by 5.8.3.1(1))')
    .option('--sway', 'a sway (unbraced) column: --klu is the unbraced effective length; the basis\'s sway method applies (ACI 318 6.6.4.6, EN 1992-1-1 5.8.3.2(3), CSA A23.3 10.16, AS 3600 10.4.3)')
    .option('--m2-sway <moment>', 'ACI 318: sway part of the end moment at the end of M2, positive where it adds to M2 (required with --sway); M2s column in --loads')
    .option('--m1-sway <moment>', 'ACI 318: sway part at the end of M1, of the same sign as --m2-sway in reverse curvature (default: equal to --m2-sway); M1s column')
    .option('--m2-sway-y <moment>', 'ACI 318: sway part at the end of M2 about y; M2sy column')
    .option('--m1-sway-y <moment>', 'ACI 318: sway part at the end of M1 about y (default --m2-sway-y); M1sy column')
    .option('--m02-sway <moment>', 'EN 1992-1-1 and CSA A23.3: sway part at the end of M02, of the sign of --m02 where it adds to it (required with --sway for CSA); M02s column')
    .option('--m01-sway <moment>', 'EN 1992-1-1 and CSA A23.3: sway part at the end of M01, of the opposite sign to --m02-sway in reverse curvature (default: −M02s); M01s column')
    .option('--m02-sway-y <moment>', 'EN 1992-1-1 and CSA A23.3: sway part at the end of M02 about y; M02sy column')
    .option('--m01-sway-y <moment>', 'EN 1992-1-1 and CSA A23.3: sway part at the end of M01 about y (default −M02sy); M01sy column')
    .option('--stability-index <Q>', 'ACI 318 6.6.4.4.1 / CSA A23.3 stability index Q of the storey, for δs = 1/(1 − Q) (a Q column in --loads gives it per load)')
    .option('--storey-pu <force>', 'ΣPu (ΣPf, ΣN*) of the storey, with --storey-pc, for δs from the storey sums (storeyPu column per load)')
    .option('--storey-pc <force>', 'ΣPc (ΣNc) of the storey (storeyPc column per load)')
    .option('--k1 <ratio>', 'EN 1992-1-1 5.8.3.2(3): relative flexibility of the restraint at end 1 (0 rigid; ≥ 0.1 used), with --k2 and --lu')
    .option('--k2 <ratio>', 'EN 1992-1-1 5.8.3.2(3): relative flexibility of the restraint at end 2')
    .option('--lu <length>', 'EN 1992-1-1: clear height ℓ of the unbraced member; with --k1, --k2 gives l0 by Eq. 5.16 (instead of --klu)')
    .option('--klu-braced <length>', 'ACI 318 6.6.4.6.4, CSA A23.3 10.16.4, AS 3600 10.4.2: effective length as braced (k ≤ 1) for the check along the length (δb); default --klu (conservative)');
}

/** Sway flags (beyond --sway) and what each needs. */
const SWAY_MOMENT_FLAGS = [
  ['m2Sway', 'M2s'],
  ['m1Sway', 'M1s'],
  ['m2SwayY', 'M2sy'],
  ['m1SwayY', 'M1sy'],
  ['m02Sway', 'M02s'],
  ['m01Sway', 'M01s'],
  ['m02SwayY', 'M02sy'],
  ['m01SwayY', 'M01sy'],
] as const;
const SWAY_MEMBER_FLAGS = ['stabilityIndex', 'storeyPu', 'storeyPc', 'k1', 'k2', 'lu', 'kluBraced'] as const;
/** Load-file columns of the sway parts in each convention (the larger end first, as the convention's columns). */
export const SWAY_COLUMNS = { 'opposite-sign': ['M1s', 'M2s', 'M1sy', 'M2sy'], 'same-sign': ['M01s', 'M02s', 'M01sy', 'M02sy'] } as const;
const Q_MAX = STABILITY_INDEX_MAX;
const K_MAX = RESTRAINT_FLEXIBILITY_MAX;

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

/** The sway member data from the flags (--sway given): ranges here, what applies to the basis checked by its method. */
function resolveSway(o: EffectsFlags, section: ResolvedSection, u: ResolvedSection['units'], len: (path: string, text: string) => number): SwayMember {
  const basis = section.basis;
  const sway = basis.slenderness?.sway;
  const conv = endMomentConvention(basis);
  const own = new Set(sway && sway.inputs.moments !== 'none' ? [`${conv.largerFlag}Sway`, `${conv.smallerFlag}Sway`, `${conv.largerFlag}SwayY`, `${conv.smallerFlag}SwayY`] : []);
  for (const [k] of SWAY_MOMENT_FLAGS) {
    if (o[k] !== undefined && !own.has(k)) {
      throw new PmError(
        ERROR_CODES.conflict,
        flagOf(k),
        own.size === 0
          ? `does not apply: ${basis.title} does not split the end moments into non-sway and sway parts (give the whole moment in --mu/${flagOf(conv.largerFlag)})`
          : `is not the sway-moment flag of ${basis.title}: give ${[...own].map(flagOf).join(', ')} instead, ${conv.rule}`,
      );
    }
  }
  const needs = sway?.inputs;
  const refuse = (flag: string, what: string) => {
    throw new PmError(ERROR_CODES.conflict, flag, `does not apply to ${sway?.title ?? basis.title}${what}`);
  };
  if (needs) {
    if (o.stabilityIndex !== undefined && !needs.stabilityIndex) refuse('--stability-index', needs.storeySums ? ': give --storey-pu and --storey-pc' : '');
    if ((o.storeyPu !== undefined || o.storeyPc !== undefined) && !needs.storeySums) refuse(o.storeyPu !== undefined ? '--storey-pu' : '--storey-pc', '');
    if ((o.k1 !== undefined || o.k2 !== undefined || o.lu !== undefined) && !needs.restraint) refuse(o.k1 !== undefined ? '--k1' : o.k2 !== undefined ? '--k2' : '--lu', ': give the unbraced --klu');
    if (o.kluBraced !== undefined && !needs.bracedLength) refuse('--klu-braced', '');
  }
  if ((o.k1 === undefined) !== (o.k2 === undefined)) throw new PmError(ERROR_CODES.missing, o.k1 === undefined ? '--k1' : '--k2', 'is required with the other end\'s flexibility (k1 and k2 together)');
  if ((o.storeyPu === undefined) !== (o.storeyPc === undefined)) throw new PmError(ERROR_CODES.missing, o.storeyPu === undefined ? '--storey-pu' : '--storey-pc', 'is required with the other storey sum (ΣPu and ΣPc together)');
  if (o.stabilityIndex !== undefined && o.storeyPu !== undefined) throw new PmError(ERROR_CODES.conflict, '--stability-index', 'and --storey-pu/--storey-pc both give δs: give one');
  const force = (path: string, t: string) => {
    const v = parseLoadQuantity(t, 'force', u, path);
    if (!(v > 0)) throw new PmError(ERROR_CODES.outOfRange, path, 'must be greater than 0', { value: t });
    return v;
  };
  return {
    ...(o.stabilityIndex !== undefined ? { stabilityIndex: plain('--stability-index', o.stabilityIndex, 0, Q_MAX) } : {}),
    ...(o.storeyPu !== undefined ? { storeyPu: force('--storey-pu', o.storeyPu) } : {}),
    ...(o.storeyPc !== undefined ? { storeyPc: force('--storey-pc', o.storeyPc) } : {}),
    ...(o.kluBraced !== undefined ? { bracedEffectiveLength: len('--klu-braced', o.kluBraced) } : {}),
    ...(o.k1 !== undefined ? { k1: plain('--k1', o.k1, 0, K_MAX) } : {}),
    ...(o.k2 !== undefined ? { k2: plain('--k2', o.k2, 0, K_MAX) } : {}),
  };
}

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
  const swayGiven = [...SWAY_MOMENT_FLAGS.map(([k]) => o[k]), ...SWAY_MEMBER_FLAGS.map((k) => o[k])].some((v) => v !== undefined);
  if (swayGiven && o.sway !== true) {
    const first = [...SWAY_MOMENT_FLAGS.map(([k]) => k), ...SWAY_MEMBER_FLAGS].find((k) => o[k] !== undefined)!;
    throw new PmError(ERROR_CODES.conflict, flagOf(first), 'applies to a sway column: add --sway');
  }
  if (o.sway === true && o.lu !== undefined) {
    if (o.klu !== undefined) throw new PmError(ERROR_CODES.conflict, '--lu', 'and --klu both give the length: give --klu (l0), or --lu with --k1 and --k2');
    if (o.k1 === undefined || o.k2 === undefined) throw new PmError(ERROR_CODES.missing, o.k1 === undefined ? '--k1' : '--k2', 'is required with --lu (l0 = ℓ by Eq. 5.16 of EN 1992-1-1 needs both ends\' flexibilities)');
    o = { ...o, klu: o.lu };
  }
  if (o.sway === true && o.klu === undefined) throw new PmError(ERROR_CODES.missing, '--klu', 'is required with --sway (the unbraced effective length)');
  const anyMember = [o.kluY, ...Object.values(endFlags)].some((v) => v !== undefined);
  if (o.klu === undefined && anyMember) throw new PmError(ERROR_CODES.missing, '--klu', 'is required with the other slenderness flags (an effective length)');
  if (o.klu !== undefined) {
    const swayMember = o.sway === true ? resolveSway(o, section, u, len) : undefined;
    const ei = o.eiOption ?? 'a';
    if (!isEiOption(ei)) throw new PmError(ERROR_CODES.invalidValue, '--ei-option', 'is not one of the allowed values', { value: ei, allowed: EI_OPTIONS.join(', ') });
    const member = (l: number): AxisMember => ({
      effectiveLength: l,
      ...(o.betaDns !== undefined ? { betaDns: plain('--beta-dns', o.betaDns, 0, 1) } : {}),
      eiOption: ei,
      transverseLoads: o.transverseLoads === true,
      ...(o.creep !== undefined ? { creepRatio: plain('--creep', o.creep, 0, 5) } : {}),
      ...(swayMember ? { sway: swayMember } : {}),
    });
    if (o.betaDns === undefined && section.basis.slenderness?.needsSustainedLoadRatio === true) {
      throw new PmError(ERROR_CODES.missing, '--beta-dns', 'is required with --klu (sustained ÷ total factored axial load, 0–1: ACI 318-19 βdns, AS 3600 βd, CSA A23.3 βd)');
    }
    slenderness = { x: member(len(o.lu !== undefined ? '--lu' : '--klu', o.klu)), ...(o.kluY !== undefined ? { y: member(len('--klu-y', o.kluY)) } : {}) };
    const moment = (path: string, t: string | undefined) => (t === undefined ? undefined : parseQuantity(t, 'moment', u, path));
    if (single) {
      const l = loads[0]!;
      for (const [key, column] of END_MOMENT_FLAGS) {
        const m = moment(flagOf(key), o[key]);
        if (m !== undefined) l[column] = m;
      }
      for (const [key, column] of SWAY_MOMENT_FLAGS) {
        const m = moment(flagOf(key), o[key]);
        if (m !== undefined) l[column] = m;
      }
    } else if (Object.values(endFlags).some((v) => v !== undefined)) {
      throw new PmError(ERROR_CODES.conflict, `${flagOf(conv.smallerFlag)}/${flagOf(conv.largerFlag)}`, `apply to --pu/--mu; give ${conv.columns.join(', ')} columns in --loads instead`);
    } else if (SWAY_MOMENT_FLAGS.some(([k]) => o[k] !== undefined)) {
      const k = SWAY_MOMENT_FLAGS.find(([f]) => o[f] !== undefined)![0];
      throw new PmError(ERROR_CODES.conflict, flagOf(k), `applies to --pu/--mu; give ${SWAY_COLUMNS[conv.singleCurvature].join(', ')} columns in --loads instead`);
    }
    // a load file's end-moment columns must be the basis's own (signs differ between conventions)
    const own: readonly string[] = conv.columns;
    const splits = section.basis.slenderness?.sway?.inputs.moments;
    const ownSway: readonly string[] = splits === 'none' ? [] : SWAY_COLUMNS[conv.singleCurvature];
    for (const l of loads) {
      for (const key of ['M1', 'M2', 'M1y', 'M2y', 'M01', 'M02', 'M01y', 'M02y'] as const) {
        if (l[key] !== undefined && !own.includes(key)) {
          throw new PmError(ERROR_CODES.conflict, `--loads ${key} column`, `is not an end-moment column of ${section.basis.title}: use ${own.join(', ')}, ${conv.rule}`);
        }
      }
      const swayNeeds = o.sway === true ? section.basis.slenderness?.sway?.inputs : undefined;
      for (const key of ['M2s', 'M1s', 'M2sy', 'M1sy', 'M02s', 'M01s', 'M02sy', 'M01sy', 'Q', 'storeyPu', 'storeyPc'] as const) {
        if (l[key] === undefined) continue;
        if (o.sway !== true) throw new PmError(ERROR_CODES.conflict, `--loads ${key} column`, 'applies to a sway column: add --sway');
        if ((key === 'Q' && swayNeeds && !swayNeeds.stabilityIndex) || ((key === 'storeyPu' || key === 'storeyPc') && swayNeeds && !swayNeeds.storeySums)) {
          throw new PmError(ERROR_CODES.conflict, `--loads ${key} column`, `does not apply to ${swayNeeds ? (section.basis.slenderness?.sway?.title ?? '') : ''}`);
        }
        if (key === 'Q' || key === 'storeyPu' || key === 'storeyPc') continue;
        if (!ownSway.includes(key)) {
          throw new PmError(
            ERROR_CODES.conflict,
            `--loads ${key} column`,
            ownSway.length === 0
              ? `does not apply: ${section.basis.title} does not split the end moments into non-sway and sway parts (give the whole moment in Mu or ${conv.columns[1]})`
              : `is not a sway-moment column of ${section.basis.title}: use ${ownSway.join(', ')}, ${conv.rule}`,
          );
        }
      }
    }
    if ((slenderness.x.eiOption ?? 'a') !== 'a' && input.rho === undefined && input.layout === undefined) {
      throw new PmError(ERROR_CODES.missing, '--ei-option', `${slenderness.x.eiOption} needs the reinforcement: give --rho or a bar layout (option a needs none)`);
    }
  }
  if (slenderness === null) {
    // sway columns of a load file without a sway column to apply them to: refused, never silently dropped
    for (const l of loads) {
      for (const key of ['M2s', 'M1s', 'M2sy', 'M1sy', 'M02s', 'M01s', 'M02sy', 'M01sy', 'Q', 'storeyPu', 'storeyPc'] as const) {
        if (l[key] !== undefined) throw new PmError(ERROR_CODES.conflict, `--loads ${key} column`, 'applies to a sway column: add --sway and --klu');
      }
    }
  }
  return { loads, slenderness };
}
