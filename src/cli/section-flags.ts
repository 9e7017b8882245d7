/**
 * The section flags shared by `table`, `sheet` and `check`: code, units, materials, shape, γ (or the
 * detailing it comes from), arrangement and transverse type. Read once, resolved once.
 */
import { readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { designCode, parseStrength, resolveBasis } from '../codes/registry.js';
import { COLUMN_USES, isTransverse, TRANSVERSE_TYPES, type Basis, type BasisOptions, type CapContext, type CodeId, type ColumnUse } from '../codes/types.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { barSet, findBar, type BarSize } from '../section/bar-tables.js';
import { gammaFromCover, sectionDepth, sectionWidth } from '../section/geometry.js';
import { ARRANGEMENTS, isArrangementKind, isShapeKind, SHAPES, type Arrangement, type CustomBar, type Shape } from '../section/types.js';
import { DISPLAY_UNITS, isUnitSystem, parseQuantity, systemFactor, UNIT_SYSTEMS, type UnitSystem } from '../units/index.js';

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
  /** how γ was obtained */
  gammaSource: 'given' | 'detailing';
  /** longitudinal bar, when named */
  bar?: BarSize;
  /** cover to the tie and tie diameter, internal length units, when given */
  cover?: number;
  tieDiameter?: number;
  capContext: CapContext;
}

export const GAMMA_RANGE: [number, number] = [0.3, 0.95];

/** Registers the shared section flags on a command. */
export function addSectionOptions(cmd: Command): Command {
  return cmd
    .option('--code <id>', 'design basis: aci318-19, aci318-14, en1992-1-1, csa-a23.3-19, as3600-2018', 'aci318-19')
    .option('--units <system>', "unit system: us (kip, in, ksi) or si (kN, mm, MPa); default: the basis's first (us for ACI, si otherwise)")
    .option('--fc <stress>', "specified concrete strength f′c (fck), e.g. 4, 4ksi, 28MPa")
    .option('--fy <stress>', 'specified yield strength fy (fyk), e.g. 60, 420MPa')
    .option('--shape <shape>', 'rectangle or circle', 'rectangle')
    .option('--b <length>', 'rectangle width across the bending plane')
    .option('--h <length>', 'rectangle depth in the bending plane')
    .option('--diameter <length>', 'circle diameter D')
    .option('--gamma <ratio>', 'outer-row centre spacing ÷ depth, 0.3–0.95')
    .option('--cover <length>', 'clear cover to the tie or spiral (γ from detailing)')
    .option('--tie <size>', 'tie or spiral size, a bar name (#4, 10) or a diameter (γ from detailing)')
    .option('--bar <size>', 'longitudinal bar size, e.g. #9, 25 (γ from detailing)')
    .option('--arrangement <kind>', 'two-faces, four-faces, side-faces, ring or custom', 'two-faces')
    .option('--bars-per-face <n>', 'bars per face (two-faces, four-faces counting corners, side-faces)')
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

const oneOf = (path: string, value: string, allowed: readonly string[]): never => {
  throw new PmError(ERROR_CODES.invalidValue, path, 'is not one of the allowed values', { value, allowed: allowed.join(', ') });
};

function positiveInt(path: string, text: string | undefined, fallback: number, lo: number, hi: number): number {
  const n = text === undefined ? fallback : Number(text);
  if (!Number.isInteger(n)) throw new PmError(ERROR_CODES.invalidValue, path, 'is not a whole number', { value: text, allowed: `${lo}–${hi}` });
  return requireInRange(path, n, lo, hi);
}

function plainNumber(path: string, text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const v = Number(text);
  if (!Number.isFinite(v)) throw new PmError(ERROR_CODES.invalidValue, path, 'is not a number', { value: text });
  return v;
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
  let data: unknown;
  try {
    data = JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    throw new PmError(ERROR_CODES.io, path, `cannot be read as JSON (${(e as Error).message.split('\n')[0]})`, { value: file });
  }
  if (!Array.isArray(data) || data.length < 2) {
    throw new PmError(ERROR_CODES.invalidValue, path, 'must hold a JSON list of at least 2 bars {x, y, share}', { value: file });
  }
  return data.map((b, i) => {
    const o = b as Record<string, unknown>;
    const x = Number(o.x ?? 0);
    const y = Number(o.y);
    const share = Number(o.share ?? 1);
    if (![x, y, share].every(Number.isFinite) || Math.abs(x) > 0.5 || Math.abs(y) > 0.5 || share <= 0) {
      throw new PmError(ERROR_CODES.outOfRange, `${path}[${i}]`, 'needs |x| ≤ 0.5, |y| ≤ 0.5 and share > 0', { value: JSON.stringify(b) });
    }
    return { x, y, share };
  });
}

/** Resolves the shared flags; `needSize` makes b/h or D mandatory (checks). */
export function resolveSectionFlags(f: SectionFlags, needSize = false): ResolvedSection {
  const units = f.units ?? designCode(f.code ?? 'aci318-19').unitSystems[0]!;
  if (!isUnitSystem(units)) oneOf('--units', units, UNIT_SYSTEMS);
  const u = units as UnitSystem;
  const su = DISPLAY_UNITS[u];
  if (f.fc === undefined) throw new PmError(ERROR_CODES.missing, '--fc', `is required (a stress, default unit ${su.stress})`);
  if (f.fy === undefined) throw new PmError(ERROR_CODES.missing, '--fy', `is required (a stress, default unit ${su.stress})`);
  const transverse = f.transverse ?? 'tied';
  if (!isTransverse(transverse)) oneOf('--transverse', transverse, TRANSVERSE_TYPES);

  const options: BasisOptions = {};
  const alphaCc = plainNumber('--alpha-cc', f.alphaCc);
  const gammaC = plainNumber('--gamma-c', f.gammaC);
  const gammaS = plainNumber('--gamma-s', f.gammaS);
  if (alphaCc !== undefined) options.alphaCc = requireInRange('--alpha-cc', alphaCc, 0.8, 1.0);
  if (gammaC !== undefined) options.gammaC = requireInRange('--gamma-c', gammaC, 1.0, 2.0);
  if (gammaS !== undefined) options.gammaS = requireInRange('--gamma-s', gammaS, 1.0, 1.5);
  if (f.concreteLaw !== undefined) {
    const laws = ['parabola-rectangle', 'rectangular-block'] as const;
    if (!laws.includes(f.concreteLaw as (typeof laws)[number])) oneOf('--concrete-law', f.concreteLaw, laws);
    options.concreteLaw = f.concreteLaw as (typeof laws)[number];
  }
  if (f.steelBranch !== undefined) {
    const branches = ['horizontal', 'inclined'] as const;
    if (!branches.includes(f.steelBranch as (typeof branches)[number])) oneOf('--steel-branch', f.steelBranch, branches);
    options.steelBranch = f.steelBranch as (typeof branches)[number];
  }

  const lap = plainNumber('--lap-zone-rho-max', f.lapZoneRhoMax);
  if (lap !== undefined) options.lapZoneRhoMax = lap;
  if (f.columnUse !== undefined) {
    if (!(COLUMN_USES as readonly string[]).includes(f.columnUse)) oneOf('--column-use', f.columnUse, COLUMN_USES);
    options.columnUse = f.columnUse as ColumnUse;
  }

  // ranges are checked by the basis that reads them (EN 1992-1-1 names these flags in its errors)
  const steelK = plainNumber('--steel-k', f.steelK);
  const steelEpsUk = plainNumber('--steel-eps-uk', f.steelEpsUk);
  if (steelK !== undefined) options.steelK = steelK;
  if (steelEpsUk !== undefined) options.steelEpsUk = steelEpsUk;

  const code = designCode(f.code ?? 'aci318-19');
  const fc = parseStrength(code, f.fc, 'concrete', u, '--fc');
  const fy = parseStrength(code, f.fy, 'steel', u, '--fy');
  const basis = resolveBasis(f.code ?? 'aci318-19', { units: u, fc, fy, transverse: transverse as 'tied' | 'spiral', options });

  const shapeKind = f.shape ?? 'rectangle';
  if (!isShapeKind(shapeKind)) oneOf('--shape', shapeKind, SHAPES);
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

  const kind = f.arrangement ?? 'two-faces';
  if (!isArrangementKind(kind)) oneOf('--arrangement', kind, ARRANGEMENTS);
  if (shapeKind === 'circle' && kind !== 'ring' && kind !== 'custom') {
    throw new PmError(ERROR_CODES.conflict, '--arrangement', 'must be ring or custom for a circle', { value: kind });
  }
  let arrangement: Arrangement;
  switch (kind) {
    case 'two-faces':
      arrangement = { kind, barsPerFace: positiveInt('--bars-per-face', f.barsPerFace, 2, 1, 30) };
      break;
    case 'four-faces':
    case 'side-faces':
      arrangement = { kind, barsPerFace: positiveInt('--bars-per-face', f.barsPerFace, 3, 2, 30) };
      break;
    case 'ring':
      arrangement = { kind, bars: positiveInt('--bars', f.bars, 8, 4, 60) };
      break;
    default:
      if (f.customBars === undefined) throw new PmError(ERROR_CODES.missing, '--custom-bars', 'is required with --arrangement custom');
      arrangement = { kind: 'custom', bars: readCustomBars('--custom-bars', f.customBars) };
  }

  // γ: given, or from cover + tie + db/2 on each side (common practice).
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
    gamma = requireInRange('--gamma', plainNumber('--gamma', f.gamma)!, GAMMA_RANGE[0], GAMMA_RANGE[1]);
  } else if (cover !== undefined) {
    if (!sized) throw new PmError(ERROR_CODES.missing, shapeKind === 'circle' ? '--diameter' : '--h', 'is required to derive γ from --cover');
    if (bar === undefined) throw new PmError(ERROR_CODES.missing, '--bar', 'is required to derive γ from --cover');
    gamma = gammaFromCover(sectionDepth(shape), cover, tieDiameter ?? 0, bar.diameter);
    gammaSource = 'detailing';
    requireInRange('γ from --cover/--tie/--bar', Number(gamma.toFixed(4)), GAMMA_RANGE[0], GAMMA_RANGE[1]);
  } else if (arrangement.kind === 'custom') {
    const ys = arrangement.bars.map((b) => b.y);
    gamma = Math.max(...ys) - Math.min(...ys);
    gammaSource = 'detailing';
  } else {
    throw new PmError(ERROR_CODES.missing, '--gamma', `is required, or --cover with --bar and --h (allowed: ${GAMMA_RANGE[0]}–${GAMMA_RANGE[1]})`);
  }

  return {
    code: basis.code,
    units: u,
    basis,
    shape,
    sized,
    arrangement,
    gamma,
    gammaSource,
    ...(bar ? { bar } : {}),
    ...(cover !== undefined ? { cover } : {}),
    ...(tieDiameter !== undefined ? { tieDiameter } : {}),
    capContext: sized ? { depth: sectionDepth(shape), leastDimension: Math.min(sectionDepth(shape), sectionWidth(shape)) } : {},
  };
}
