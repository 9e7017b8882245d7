/**
 * The one module of input limits. CLI flags, chart-set files, load CSV files and custom-bar files
 * all read their ranges, caps and messages from here, so the command line and the config can never
 * disagree. Pure and browser-safe (no node: imports).
 *
 * Unit-free limits (γ, ρg, ω, counts) also go into the generated JSON Schema; ranges that depend on
 * units or on the basis (f′c, fy, lengths) stay in the rule stages that know them.
 */
import { ERROR_CODES, PmError } from '../errors.js';
import { MAX_QUANTITY_CHARS, unitSuffixes, type QuantityKind } from '../units/index.js';

/** γ a sheet or a section may use (common practice: outer rows closer than 0.3·h or beyond 0.95·h are not buildable). */
export const GAMMA_RANGE = [0.3, 0.95] as const;
/** γB (outer-column spacing ÷ b, beside γ): the same buildable range as γ (common practice). */
export const GAMMA_B_RANGE = GAMMA_RANGE;
/** ρg values a family may hold; the basis's own column limits are printed on the sheet. */
export const RHO_RANGE = [0.001, 0.1] as const;
/**
 * A ρg given to `check --rho`: what the section maths takes. Beyond the basis's own column limits the check
 * still runs and reports the load status `detailing` with the rule and clause (issue 19), as a bar layout would.
 */
export const CHECK_RHO_RANGE = [0.0001, 0.25] as const;
/** ω values a family may hold before each sheet's conversion to ρg is checked against RHO_RANGE. */
export const OMEGA_RANGE = [0.01, 5] as const;
export const ECCENTRICITY_RANGE = [0.01, 10] as const;
export const ASPECT_RANGE = [0.2, 5] as const;
export const PNG_SCALE_RANGE = [0.5, 8] as const;

/**
 * Bars per face: two-faces may have one bar per face; the others count corners on both faces.
 * A four-faces pair [nb, nh] holds each count to the same range.
 */
export const BARS_PER_FACE_RANGE = { 'two-faces': [1, 20], 'four-faces': [2, 20], 'side-faces': [2, 20] } as const;
/** Bars on a ring (circles). */
export const RING_BARS_RANGE = [4, 48] as const;
/** Custom bars: count and the share of Ast one bar may carry (shares are normalised). */
export const CUSTOM_BARS_RANGE = [2, 1000] as const;
export const CUSTOM_BAR_SHARE_MAX = 1e6;
/** Bar coordinates are fractions of b (or D) and h from the centroid. */
export const CUSTOM_BAR_COORD_MAX = 0.5;

/** `check --chart-gamma-step` and `--chart-axial-step` (P/(f′c·Ag), ν for EN 1992-1-1): the grids of the emulated sheets. */
export const CHART_GAMMA_STEP_RANGE = [0.01, 0.2] as const;
export const CHART_AXIAL_STEP_RANGE = [0.02, 0.25] as const;

/** Curves in a chart set's family (a sheet stays legible). */
export const SET_CURVES_RANGE = [1, 20] as const;
/** Curves `table` may compute in one run. */
export const TABLE_CURVES_MAX = 2000;
/** `table --points` range, and the cap on curves × points (rows), checked before any work. */
export const TABLE_POINTS_RANGE = [400, 20000] as const;
export const TABLE_ROWS_MAX = 1_000_000;

/**
 * Axial levels of biaxial sheets: factored P over (normalising stress · Ag), i.e. P/(f′c·Ag) or ν. From
 * well into tension to beyond any column's axial cap (levels past a ρg's cap simply draw no contour).
 */
export const AXIAL_LEVEL_RANGE = [-0.5, 1.2] as const;
/** Axial levels in one biaxial sheet group, and panels (levels) on one biaxial sheet. */
export const MAX_AXIAL_LEVELS = 24;
export const MAX_LEVELS_PER_SHEET = 6;

/** Sheets in one chart set; computed from list lengths before anything is expanded. */
export const MAX_SHEETS = 5000;
/** Entries in any list of a chart-set file, and values a {from, to, step} range may give. */
export const MAX_LIST = 1000;

/** Characters of one quantity ("4ksi", "28 MPa"); longer text is refused before parsing (src/units). */
export { MAX_QUANTITY_CHARS };
/** Characters of a title-block field; of a sheet-title pattern; of a set name. */
export const MAX_TEXT_CHARS = 200;
export const MAX_TITLE_PATTERN_CHARS = 400;
export const MAX_NAME_CHARS = 80;
/** Characters of any other flag value (file names, lists). */
export const MAX_FLAG_CHARS = 4096;

/** File sizes, bytes. */
export const MAX_CONFIG_BYTES = 1 << 20;
export const MAX_CUSTOM_BARS_BYTES = 1 << 20;
/** An office logo (SVG or PNG): at most 1 MB. */
export const MAX_LOGO_BYTES = 1 << 20;
/** An office defaults file (JSON). */
export const MAX_OFFICE_FILE_BYTES = 1 << 16;
/** Characters of a file path in a chart set or office file (logo, officeFile). */
export const MAX_PATH_CHARS = 1000;
export const MAX_LOADS_BYTES = 32 << 20;
/** Load rows in one CSV file. */
export const MAX_LOAD_ROWS = 200_000;
/**
 * Loads a drawn check report (.pdf, .svg) may plot: one page cannot show more, and the renderer's
 * memory grows with every mark. Text and JSON reports, and the printed table, take every load.
 */
export const MAX_DRAWN_REPORT_LOADS = 20_000;
/** Characters of a load id. */
export const MAX_LOAD_ID_CHARS = 64;

/**
 * Largest magnitude of a load in the display unit (kip or kN, kip-ft or kN·m). Far beyond any column,
 * it keeps every product and quotient of the check finite.
 */
export const LOAD_MAX_ABS = 1e9;

/** Options of the EN 1992-1-1 basis (National Annex ranges, common practice). */
export const ALPHA_CC_RANGE = [0.8, 1.0] as const;
export const GAMMA_C_RANGE = [1.0, 2.0] as const;
export const GAMMA_S_RANGE = [1.0, 1.5] as const;
/** EN 1992-1-1 Annex C Table C.1, classes A–C: k = (ft/fy)k and εuk (the basis checks them too). */
export { STEEL_EPS_UK_RANGE, STEEL_K_RANGE } from '../codes/en1992.js';

/** Enums shared by flags and config. */
export const CONCRETE_LAWS = ['parabola-rectangle', 'rectangular-block'] as const;
export const STEEL_BRANCHES = ['horizontal', 'inclined'] as const;

/**
 * Pattern of a quantity of `kind` written as text: a decimal number and an optional unit of that
 * kind in any letter case (no hex, no "Infinity"). JSON Schema patterns have no flags, so each
 * letter is spelled [kK]; "-" also matches "·" and "2" also "²", as the parser reads them.
 */
export function quantityPattern(kind: QuantityKind): string {
  const letter = (c: string) => {
    if (/[a-z]/.test(c)) return `[${c}${c.toUpperCase()}]`;
    if (c === '-') return '[-·]';
    if (c === '2') return '[2²]';
    if (c === '/') return '/';
    return c;
  };
  const units = unitSuffixes(kind)
    .sort((a, b) => b.length - a.length)
    .map((u) => [...u].map(letter).join(''))
    .join('|');
  return `^\\s*[-+]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][-+]?\\d+)?\\s*(${units})?\\s*$`;
}
/** Pattern of a set name (also the output folder name). */
export const NAME_PATTERN = '^[A-Za-z0-9][A-Za-z0-9_-]*$';
/** Pattern of an issue date; the calendar check is `isCalendarDate`. */
export const DATE_PATTERN = '^\\d{4}-\\d{2}-\\d{2}$';

export const rangeText = ([lo, hi]: readonly [number, number], unit = ''): string => `${lo}–${hi}${unit ? ` ${unit}` : ''}`;

/** True for a real calendar date YYYY-MM-DD between years 1 and 9999 (2026-02-30 and 2026-13-01 are not). */
export function isCalendarDate(text: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (y < 1 || mo < 1 || mo > 12 || d < 1) return false;
  const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
  const days = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][mo - 1]!;
  return d <= days;
}

/**
 * SOURCE_DATE_EPOCH (reproducible-builds.org specification: a decimal count of seconds since
 * 1970-01-01 UTC) → YYYY-MM-DD, or undefined when it is not such a count within years 1970–9999.
 */
export function dateFromEpoch(text: string): string | undefined {
  if (!/^\d{1,12}$/.test(text)) return undefined;
  const ms = Number(text) * 1000;
  if (ms > Date.UTC(9999, 11, 31)) return undefined;
  return new Date(ms).toISOString().slice(0, 10);
}

/** A plain decimal number ("0.75", "-1e-3"); refuses hex, binary, "Infinity", "" and blanks. */
export function parseDecimal(text: string): number | undefined {
  const t = text.trim();
  if (t.length === 0 || t.length > MAX_QUANTITY_CHARS || !/^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/.test(t)) return undefined;
  const v = Number(t);
  return Number.isFinite(v) ? v : undefined;
}

/**
 * The issue date of a sheet, report or book: the flag's date when given, else SOURCE_DATE_EPOCH,
 * else today (UTC). Each must be a real calendar date; errors name the flag or the variable.
 */
export function issueDate(given: string | undefined, flag: string, sourceDateEpoch: string | undefined, now: Date = new Date()): string {
  if (given !== undefined) {
    if (!isCalendarDate(given)) throw new PmError(ERROR_CODES.invalidValue, flag, /^\d{4}-\d{2}-\d{2}$/.test(given) ? 'is not a calendar date' : 'is not a date in the form YYYY-MM-DD', { value: given });
    return given;
  }
  if (sourceDateEpoch !== undefined && sourceDateEpoch !== '') {
    const d = dateFromEpoch(sourceDateEpoch);
    if (d === undefined) {
      throw new PmError(ERROR_CODES.invalidValue, 'SOURCE_DATE_EPOCH', 'is not a count of seconds since 1970-01-01 (UTC) up to year 9999', { value: JSON.stringify(sourceDateEpoch.slice(0, 24)) });
    }
    return d;
  }
  return now.toISOString().slice(0, 10);
}

/** Column schedules (`pmchart schedule`, issue 22): file size, marks and the characters of a mark. */
export const MAX_SCHEDULE_BYTES = 8 << 20;
export const MAX_SCHEDULE_MARKS = 20_000;
export const MAX_MARK_CHARS = 64;
/** `schedule --jobs`: processes checking marks. */
export const SCHEDULE_JOBS_RANGE = [1, 64] as const;

/** A sway column's stability index Q (ACI 318-19 6.6.4.4.1): beyond this a typing error; Q ≥ 1 itself is a status (unstable). */
export const STABILITY_INDEX_MAX = 10;
/** EN 1992-1-1 5.8.3.2(3) relative flexibilities k1, k2: 0 (rigid) to a pin (common practice: 1000 stands for one). */
export const RESTRAINT_FLEXIBILITY_MAX = 1000;
