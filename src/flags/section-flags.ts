/**
 * The section flags shared by `table`, `sheet` and `check`: code, units, materials, shape, γ (or the
 * detailing it comes from), arrangement and transverse type. Read once, resolved once.
 */
import { readInputText } from '../io/read.js';
import type { Command } from 'commander';
import { BASIS_IDS, designCode, parseStrength, resolveBasis } from '../codes/registry.js';
import type { Basis, BasisOptions, CapContext, CodeId, ColumnUse } from '../codes/types.js';
import { ERROR_CODES, isFieldKey, isPmError, PmError, requireInRange } from '../errors.js';
import { parseCustomBars } from '../input/custom-bars.js';
import { flagOf, parseFlags, SectionFlagsSchema, type CheckedSectionFlags } from '../input/flags.js';
import { BARS_PER_FACE_RANGE, GAMMA_RANGE, MAX_CUSTOM_BARS_BYTES, RING_BARS_RANGE } from '../input/limits.js';
import { barSet, findBar, type BarSize } from '../section/bar-tables.js';
import { gammaFromCover, sectionDepth, sectionWidth } from '../section/geometry.js';
import type { Arrangement, ArrangementKind, CustomBar, Shape } from '../section/types.js';
import { DISPLAY_UNITS, parseQuantity, systemFactor, type UnitSystem } from '../units/index.js';

export interface SectionFlags {
  code?: string;
  units?: string;
  fc?: string;
  fy?: string;
  shape?: string;
  b?: string;
  h?: string;
  diameter?: string;
  gamma?: string;
  gammaB?: string;
  cover?: string;
  tie?: string;
  bar?: string;
  arrangement?: string;
  barsPerFace?: string;
  bars?: string;
  customBars?: string;
  transverse?: string;
  alphaCc?: string;
  columnUse?: string;
  lapZoneRhoMax?: string;
  gammaC?: string;
  gammaS?: string;
  concreteLaw?: string;
  steelBranch?: string;
  steelK?: string;
  steelEpsUk?: string;
}

export interface ResolvedSection {
  code: CodeId;
  units: UnitSystem;
  basis: Basis;
  /** the actual shape in internal length units when sized; a unit-depth shape otherwise */
  shape: Shape;
  sized: boolean;
  arrangement: Arrangement;
  gamma: number;
  /** γB: outer-column spacing ÷ b, when given (rectangles); absent: the same cover as γ gives on h */
  gammaB?: number;
  /** how γ was obtained */
  gammaSource: 'given' | 'bars';
  /** longitudinal bar, when named */
  bar?: BarSize;
  /** cover to the tie and tie diameter, internal length units, when given */
  cover?: number;
  tieDiameter?: number;
  capContext: CapContext;
}

/** γ range of flags and chart sets alike (src/input/limits.ts). */
export { GAMMA_RANGE };

/** Registers the shared section flags on a command. */
export function addSectionOptions(cmd: Command): Command {
  return cmd
    .option('--code <id>', `design basis: ${BASIS_IDS.join(', ')} (default ${BASIS_IDS[0]}, or the --office-file's)`)
    .option('--units <system>', "unit system: us (kip, in, ksi) or si (kN, mm, MPa); default: the basis's first (us for ACI, si otherwise)")
    .option('--fc <stress>', "specified concrete strength f′c (fck), e.g. 4, 4ksi, 28MPa")
    .option('--fy <stress>', 'specified yield strength fy (fyk), e.g. 60, 420MPa')
    .option('--shape <shape>', 'rectangle or circle', 'rectangle')
    .option('--b <length>', 'rectangle width across the bending plane')
    .option('--h <length>', 'rectangle depth in the bending plane')
    .option('--diameter <length>', 'circle diameter D')
    .option('--gamma <ratio>', 'outer-row centre spacing ÷ depth, 0.3–0.95')
    .option('--gamma-b <ratio>', 'outer-column centre spacing ÷ width b, 0.3–0.95 (rectangles; default: the same cover as --gamma gives on h)')
    .option('--cover <length>', 'clear cover to the tie or spiral (γ from detailing)')
    .option('--tie <size>', 'tie or spiral size, a bar name (#4, 10) or a diameter (γ from detailing)')
    .option('--bar <size>', 'longitudinal bar size, e.g. #9, 25 (γ from detailing)')
    .option('--arrangement <kind>', 'two-faces, four-faces, side-faces, ring or custom', 'two-faces')
    .option('--bars-per-face <n>', 'bars per face (two-faces, four-faces counting corners, side-faces); four-faces also nb,nh: nb on each b face, nh on each h face')
    .option('--bars <n>', 'bar count for ring')
    .option('--custom-bars <file>', 'JSON list of {x, y, share}: centroidal position ÷ b (or D) and ÷ h, share of Ast')
    .option('--transverse <type>', 'tied or spiral', 'tied')
    .option('--alpha-cc <value>', 'EN 1992-1-1 αcc (National Annex)')
    .option('--lap-zone-rho-max <ratio>', 'EN 1992-1-1 9.5.2(3): the section is at a lap, As,max = ratio·Ac (0.04–0.08, 0.08 recommended)')
    .option('--column-use <use>', 'ACI 318 bar-grade limit by use: gravity (default) or special-seismic (Table 20.2.2.4(a))')
    .option('--gamma-c <value>', 'EN 1992-1-1 γc (National Annex)')
    .option('--gamma-s <value>', 'EN 1992-1-1 γs (National Annex)')
    .option('--concrete-law <law>', 'parabola-rectangle or rectangular-block, where the basis offers both')
    .option('--steel-branch <branch>', 'horizontal or inclined top branch, where the basis offers both')
    .option('--steel-k <ratio>', 'EN 1992-1-1 inclined branch: k = (ft/fy)k, 1.0–1.35 (default 1.08, class B)')
    .option('--steel-eps-uk <strain>', 'EN 1992-1-1 inclined branch: εuk, 0.025–0.15 (default 0.05, class B); εud = 0.9·εuk');
}

/** A bar size by name, or a plain diameter with an optional length unit. */
function barOrDiameter(path: string, text: string, units: UnitSystem, basis: Basis): { size?: BarSize; diameter: number } {
  const set = barSet(basis.barSet);
  const size = findBar(set, text);
  if (size) return { size, diameter: size.diameter * systemFactor('length', set.units, units) };
  if (/^#/.test(text.trim())) {
    throw new PmError(ERROR_CODES.invalidValue, path, 'is not a bar size of the table', { value: text, allowed: set.sizes.map((s) => s.name).join(', ') });
  }
  const diameter = parseQuantity(text, 'length', units, path);
  return { diameter: requireInRange(path, diameter, units === 'us' ? 0.2 : 5, units === 'us' ? 3 : 75, DISPLAY_UNITS[units].length) };
}

function readCustomBars(path: string, file: string): CustomBar[] {
  return parseCustomBars(readInputText(file, MAX_CUSTOM_BARS_BYTES, path), path);
}

/** Bars per face or ring bars: the ranges chart-set files use (src/input/limits.ts). */
function barCount(kind: Exclude<ArrangementKind, 'custom'>, f: CheckedSectionFlags): Arrangement {
  if (kind === 'ring') return { kind, bars: requireInRange('--bars', f.bars ?? 8, ...RING_BARS_RANGE) };
  const range = BARS_PER_FACE_RANGE[kind];
  const given = f.barsPerFace ?? (kind === 'two-faces' ? 2 : 3);
  if (typeof given !== 'number') {
    if (kind !== 'four-faces') throw new PmError(ERROR_CODES.conflict, '--bars-per-face', `takes two counts nb,nh only with --arrangement four-faces; ${kind} takes one`, { value: given.join(',') });
    return { kind, barsPerFace: [requireInRange('--bars-per-face', given[0], range[0], range[1]), requireInRange('--bars-per-face', given[1], range[0], range[1])] };
  }
  return { kind, barsPerFace: requireInRange('--bars-per-face', given, range[0], range[1]) };
}

/** Resolves the shared flags; `needSize` makes b/h or D mandatory (checks). */
export function resolveSectionFlags(given: SectionFlags, needSize = false): ResolvedSection {
  // 1. each flag on its own: the zod schema of src/input/flags.ts (form, enums, unit-free ranges)
  const f = parseFlags(SectionFlagsSchema, given);
  const code = f.code ?? BASIS_IDS[0]!;
  const u: UnitSystem = f.units ?? withFlagNames(() => designCode(code)).unitSystems[0]!;
  const su = DISPLAY_UNITS[u];
  if (f.fc === undefined) throw new PmError(ERROR_CODES.missing, '--fc', `is required (a stress, default unit ${su.stress})`);
  if (f.fy === undefined) throw new PmError(ERROR_CODES.missing, '--fy', `is required (a stress, default unit ${su.stress})`);
  const transverse = f.transverse ?? 'tied';

  // 2. the basis, with its options
  const options: BasisOptions = {
    ...(f.alphaCc !== undefined ? { alphaCc: f.alphaCc } : {}),
    ...(f.gammaC !== undefined ? { gammaC: f.gammaC } : {}),
    ...(f.gammaS !== undefined ? { gammaS: f.gammaS } : {}),
    ...(f.concreteLaw !== undefined ? { concreteLaw: f.concreteLaw } : {}),
    ...(f.steelBranch !== undefined ? { steelBranch: f.steelBranch } : {}),
    ...(f.steelK !== undefined ? { steelK: f.steelK } : {}),
    ...(f.steelEpsUk !== undefined ? { steelEpsUk: f.steelEpsUk } : {}),
    ...(f.lapZoneRhoMax !== undefined ? { lapZoneRhoMax: f.lapZoneRhoMax } : {}),
    ...(f.columnUse !== undefined ? { columnUse: f.columnUse as ColumnUse } : {}),
  };
  // strengths by class name where the basis has them ("C50/60", "B500B"), else quantities
  const fc = withFlagNames(() => parseStrength(designCode(code), f.fc!, 'concrete', u, '--fc'));
  const fy = withFlagNames(() => parseStrength(designCode(code), f.fy!, 'steel', u, '--fy'));
  const basis = withFlagNames(() => resolveBasis(code, { units: u, fc, fy, transverse, options }, { code: '--code', fc: '--fc', fy: '--fy', columnUse: '--column-use' }));

  // 3. shape and size
  const shapeKind = f.shape ?? 'rectangle';
  const len = (path: string, text: string) => {
    const v = parseQuantity(text, 'length', u, path);
    return requireInRange(path, v, u === 'us' ? 6 : 150, u === 'us' ? 240 : 6000, su.length);
  };
  let shape: Shape;
  let sized: boolean;
  if (shapeKind === 'circle') {
    if (f.b !== undefined || f.h !== undefined) throw new PmError(ERROR_CODES.conflict, '--b/--h', 'do not apply to --shape circle; give --diameter');
    sized = f.diameter !== undefined;
    shape = { kind: 'circle', diameter: sized ? len('--diameter', f.diameter!) : 1 };
  } else {
    if (f.diameter !== undefined) throw new PmError(ERROR_CODES.conflict, '--diameter', 'applies to --shape circle only; give --b and --h');
    if ((f.b === undefined) !== (f.h === undefined)) throw new PmError(ERROR_CODES.missing, f.b === undefined ? '--b' : '--h', 'is required when the other side is given');
    sized = f.b !== undefined;
    shape = sized ? { kind: 'rectangle', b: len('--b', f.b!), h: len('--h', f.h!) } : { kind: 'rectangle', b: 1, h: 1 };
  }
  if (needSize && !sized) {
    throw new PmError(ERROR_CODES.missing, shapeKind === 'circle' ? '--diameter' : '--b/--h', 'is required for this command (a length, default unit ' + su.length + ')');
  }

  // 4. arrangement
  const kind = f.arrangement ?? 'two-faces';
  if (shapeKind === 'circle' && kind !== 'ring' && kind !== 'custom') {
    throw new PmError(ERROR_CODES.conflict, '--arrangement', 'must be ring or custom for a circle', { value: kind });
  }
  let arrangement: Arrangement;
  if (kind === 'custom') {
    if (f.customBars === undefined) throw new PmError(ERROR_CODES.missing, '--custom-bars', 'is required with --arrangement custom');
    arrangement = { kind: 'custom', bars: readCustomBars('--custom-bars', f.customBars) };
  } else arrangement = barCount(kind, f);

  // 5. γ: given, or from cover + tie + db/2 on each side (common practice).
  let gamma: number;
  let gammaSource: ResolvedSection['gammaSource'] = 'given';
  let bar: BarSize | undefined;
  let cover: number | undefined;
  let tieDiameter: number | undefined;
  if (f.bar !== undefined) {
    const b = barOrDiameter('--bar', f.bar, u, basis);
    bar = b.size ?? { name: f.bar, diameter: b.diameter, area: (Math.PI * b.diameter * b.diameter) / 4 };
    if (b.size) {
      const set = barSet(basis.barSet);
      const k = systemFactor('length', set.units, u);
      bar = { name: b.size.name, diameter: b.size.diameter * k, area: b.size.area * k * k };
    }
  }
  if (f.cover !== undefined) cover = requireInRange('--cover', parseQuantity(f.cover, 'length', u, '--cover'), u === 'us' ? 0.5 : 12, u === 'us' ? 6 : 150, su.length);
  if (f.tie !== undefined) tieDiameter = barOrDiameter('--tie', f.tie, u, basis).diameter;
  if (f.gamma !== undefined) {
    if (f.cover !== undefined) throw new PmError(ERROR_CODES.conflict, '--gamma', 'and --cover both set γ; give one of them');
    gamma = f.gamma;
  } else if (cover !== undefined) {
    if (!sized) throw new PmError(ERROR_CODES.missing, shapeKind === 'circle' ? '--diameter' : '--h', 'is required to derive γ from --cover');
    if (bar === undefined) throw new PmError(ERROR_CODES.missing, '--bar', 'is required to derive γ from --cover');
    gamma = gammaFromCover(sectionDepth(shape), cover, tieDiameter ?? 0, bar.diameter);
    gammaSource = 'bars';
    requireInRange('γ from --cover/--tie/--bar', Number(gamma.toFixed(4)), GAMMA_RANGE[0], GAMMA_RANGE[1]);
  } else if (arrangement.kind === 'custom') {
    let lo = Infinity;
    let hi = -Infinity;
    for (const b of arrangement.bars) {
      lo = Math.min(lo, b.y);
      hi = Math.max(hi, b.y);
    }
    gamma = hi - lo;
    gammaSource = 'bars';
  } else {
    throw new PmError(ERROR_CODES.missing, '--gamma', `is required, or --cover with --bar and --h (allowed: ${GAMMA_RANGE[0]}–${GAMMA_RANGE[1]})`);
  }
  // γB: the columns' spacing across b, beside γ (the layout's gammaX); cover detailing keeps one cover on every face
  if (f.gammaB !== undefined) {
    if (shapeKind === 'circle' || kind === 'ring' || kind === 'custom') throw new PmError(ERROR_CODES.conflict, '--gamma-b', `applies to rectangles with two-faces, four-faces or side-faces bars, not ${shapeKind === 'circle' ? 'a circle' : kind}`);
    if (gammaSource === 'bars') throw new PmError(ERROR_CODES.conflict, '--gamma-b', 'needs --gamma; with --cover every face has the same cover');
  }

  return {
    code: basis.code,
    units: u,
    basis,
    shape,
    sized,
    arrangement,
    gamma,
    ...(f.gammaB !== undefined ? { gammaB: f.gammaB } : {}),
    gammaSource,
    ...(bar ? { bar } : {}),
    ...(cover !== undefined ? { cover } : {}),
    ...(tieDiameter !== undefined ? { tieDiameter } : {}),
    capContext: sized ? { depth: sectionDepth(shape), leastDimension: Math.min(sectionDepth(shape), sectionWidth(shape)) } : {},
  };
}

/** Runs core code and names its field keys (`alphaCc`, `klu`) as the command line's flags (`--alpha-cc`, `--klu`). */
export function withFlagNames<T>(fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (isPmError(e) && isFieldKey(e.path)) throw e.at(flagOf(e.path));
    throw e;
  }
}
