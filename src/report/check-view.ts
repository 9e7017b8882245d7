/**
 * Views of one `ColumnCheck` (src/design/column-check.ts): the tables every output shares, the text
 * table, the text report and the JSON. Every figure, rounding and label is made here once; the drawn
 * report (src/sheet/check-report.ts) lays out these same tables. Pure: no I/O.
 *
 * Each table row is made by one function (`resultRow`, `slendernessRows`, `biaxialRow`, `resultJson`),
 * so the text and the JSON can also be produced load by load (`checkTextPieces`, `checkJsonPieces`) from
 * a check held as a ranking (`rankColumnCheck`), with the same bytes as from a whole `ColumnCheck`.
 */
import type { RuleFinding } from '../codes/rules.js';
import { strainClassWord, type Basis } from '../codes/types.js';
import type { ColumnCheck, ColumnCheckFrame, ColumnCheckHead, ColumnLoadResult, LoadNote, LoadStatus, MeasureSource } from '../design/column-check.js';
import { detailingRule, findingComparison } from '../design/detailing.js';
import type { SlendernessResult } from '../design/slenderness.js';
import { barSet } from '../section/bar-tables.js';
import { faceCounts, type Arrangement } from '../section/types.js';
import { DISPLAY_UNITS, toDisplay, type UnitSystem } from '../units/index.js';
import { CAUTION } from './caution.js';
import { cell as f, fmt, num } from './format.js';

/**
 * A column of a view's table: its key, its heading, the unit of its cells (null for words and ratios) and
 * its alignment. The text table prints `heading unit` as one header; the drawn sheet and the page put the
 * unit under the heading. Nothing downstream reads a unit or an alignment back out of header text.
 */
export interface TableColumn {
  readonly key: string;
  readonly heading: string;
  readonly unit: string | null;
  readonly align: 'left' | 'right';
}

/** A column of words (left-aligned, no unit). */
const wordsCol = (heading: string, key = heading): TableColumn => ({ key, heading, unit: null, align: 'left' });
/** A column of figures (right-aligned), with the unit of its cells where they have one. */
const figureCol = (heading: string, unit: string | null = null, key = heading): TableColumn => ({ key, heading, unit, align: 'right' });

/** A column's header in the text table: the heading, then the unit. */
export const headerText = (c: TableColumn): string => (c.unit ? `${c.heading} ${c.unit}` : c.heading);

/** A table as every view shows it: columns (and their headers as the text table prints them), rows of formatted cells, which rows to mark. */
export interface TableView {
  columns: readonly TableColumn[];
  headers: string[];
  rows: string[][];
  /** per row: the governing load */
  marked: boolean[];
}

const tableView = (columns: readonly TableColumn[], rows: string[][], marked: boolean[]): TableView => ({ columns, headers: columns.map(headerText), rows, marked });

export interface ViewUnits {
  force: string;
  moment: string;
  stress: string;
  length: string;
  area: string;
}

export const unitsOf = (u: UnitSystem): ViewUnits => ({ ...DISPLAY_UNITS[u], area: u === 'us' ? 'in²' : 'mm²' });

/** Words of a status, as every view prints it. */
export const STATUS_WORDS: Record<LoadStatus, string> = {
  ok: 'ok',
  fails: 'FAILS',
  'not-possible': 'NOT POSSIBLE',
  unstable: 'UNSTABLE',
  'outside-scope': 'OUTSIDE SCOPE',
  detailing: 'DETAILING',
};

/** Symbols of the actions and the normalised axes for this check's basis and shape. */
export function symbolsOf(c: Pick<ColumnCheck, 'basis' | 'shape'>) {
  const sy = c.basis.symbols;
  const circle = c.shape.kind === 'circle';
  return {
    P: sy.actionAxial ?? 'Pu',
    M: sy.actionMoment ?? 'Mu',
    depth: circle ? 'D' : 'h',
    perArea: circle ? 'Ag' : 'b·h',
    perAreaDepth: circle ? 'Ag·D' : 'b·h²',
    nu: sy.dimensionlessAxial ?? null,
    mu: sy.dimensionlessMoment ?? null,
    firstOrder: sy.firstOrderMoment ?? 'M2',
    secondOrder: sy.secondOrderMoment ?? 'Mc',
    epsT: sy.tensionStrain ?? 'εt',
    Po: sy.squashLoad ?? 'Po',
    cap: sy.axialCap ?? 'axial cap',
  };
}

/** A load's note in words (the JSON's `results[].notes`): the engine gives it as a fact (`LoadNote`). */
export function loadNoteText(n: LoadNote): string {
  switch (n.kind) {
    case 'rho-not-possible':
      return `not possible within ρg ≤ ${rhoWords(n.rhoMax)}`;
    case 'rho-minimum-governs':
      return `minimum ρg = ${rhoWords(n.rhoMin)} governs`;
    case 'cap-governs-rho':
      return 'axial cap governs ρg';
    case 'moment-raised':
      return n.bothSigns ? 'moment raised to the basis minimum; both signs checked, the worse governs' : 'moment raised to the basis minimum';
    case 'method-minimum-both-signs':
      return 'the minimum moment of the slenderness method governs: both signs checked, the worse governs';
    case 'weakest-orientation':
      return `weakest orientation: ring turned ${String(Number(n.turnDeg.toFixed(2)))}° from a bar at the compression extreme`;
    case 'negative-branch-governs':
      return 'the branch with compression on the −y face governs';
    case 'off-charts':
      return 'off the charted range';
    case 'circle-resultant':
      return 'circle: the resultant of Mux and Muy is checked on the weakest orientation';
    case 'y-moment-raised':
      return 'about y alone: the moment raised to the basis minimum (one axis at a time)';
    case 'exact-search':
      return n.cause === 'ring-turned' ? 'ring turned off a bar or a mid-gap: exact search with the neutral axis free to incline' : 'bars not symmetric about the bending plane: exact search with the neutral axis free to incline';
  }
}

/** The note column of a load's row. */
export function noteText(r: ColumnLoadResult, c: Pick<ColumnCheck, 'basis' | 'shape'>): string {
  return [
    r.status !== 'ok' && r.status !== 'fails' ? `${statusReasonOf(r, c.basis)}${r.statusClause ? ` [${r.statusClause}]` : ''}` : '',
    r.rhoStatus === 'minimum-governs' && r.status === 'ok' ? 'minimum ρg' : '',
    r.governedBy === 'cap' ? 'cap' : '',
    r.momentRaised ? `${symbolsOf(c).M} raised to minimum` : '',
    r.variant.sign === -1 ? '−y-face branch governs' : '',
    r.variant.turnDeg !== 0 ? `weakest orientation ${fmt(r.variant.turnDeg, 4)}°` : '',
    ...r.findings.filter((x) => x.rule === 'min-moment-sign').map((x) => `minimum both signs about ${x.axis}: ${f(x.value ?? null, 3)} vs ${f(x.limit ?? null, 3)} [${x.clause}]`),
    MEASURE_NOTE[r.measureFrom] ? `${MEASURE_NOTE[r.measureFrom]} governs` : '',
  ]
    .filter(Boolean)
    .join('; ');
}

/** The check that gives a load's measure, in words (the uniaxial and biaxial figures have their own columns). */
const MEASURE_NOTE: Partial<Record<MeasureSource, string>> = {
  'x-exact': 'exact search about x (neutral axis inclined)',
  y: 'about y alone',
  'y-exact': 'about y alone, exact search (neutral axis inclined)',
};

/** A rule finding's name in words; rules added by other checks show their id. */
const RULE_WORDS: Readonly<Record<string, string>> = {
  'min-moment': 'minimum moment',
  'min-moment-sign': 'minimum moment in either sign, the worse governs',
  'exact-section': 'exact search, neutral axis free to incline',
};

/**
 * One finding as a line: rule, axis, clause, outcome, and the figures compared (display units). A detailing
 * rule of the basis is named by its rulebook title, in the words of `findingWords` (the detailing lines).
 */
export function findingText(basis: Basis, x: RuleFinding, units: UnitSystem): string {
  if (detailingRule(basis, x.rule)) return findingWords(basis, x);
  const v = (n: number | null | undefined) =>
    n === null || n === undefined ? '—' : x.quantity === 'moment' || x.quantity === 'force' ? `${f(toDisplay(n, x.quantity, units), 5)} ${unitsOf(units)[x.quantity]}` : f(n, 4);
  const figures = x.value !== undefined || x.limit !== undefined ? `: ${v(x.value)} against ${v(x.limit)}` : '';
  return `${RULE_WORDS[x.rule] ?? x.rule}${x.axis ? ` about ${x.axis}` : ''} [${x.clause}] ${x.outcome}${figures}`;
}

/** A detailing finding as the reason of a load's status: the rule's title and the figures compared, internal units to 4 significant digits. */
export function findingReason(basis: Basis, x: RuleFinding): string {
  const title = detailingRule(basis, x.rule)?.title ?? x.rule;
  const n = (v: number | null | undefined) => (v === null || v === undefined ? '—' : String(Number(v.toPrecision(4))));
  if (x.outcome === 'unchecked') return `${title}: unchecked`;
  return `${title}: ${n(x.value)} ${findingComparison(x)} ${n(x.limit)}`;
}

/** Words for where a failing measure comes from (the x uniaxial and biaxial figures need none). */
const MEASURE_WORDS: Partial<Record<MeasureSource, string>> = {
  'x-exact': 'about x, exact search: the neutral axis inclines',
  y: 'about y alone',
  'y-exact': 'about y alone, exact search: the neutral axis inclines',
};

/** ρg to 4 decimals, trailing zeros dropped. */
const rhoWords = (r: number): string => String(Number(r.toFixed(4)));

/** Why a load has its status, in words, from the engine's facts (`statusCause`, and `statusFinding` for `detailing`). */
export function statusReasonOf(r: Pick<ColumnLoadResult, 'status' | 'statusCause' | 'statusFinding'>, basis: Basis): string {
  const c = r.statusCause;
  switch (c.kind) {
    case 'none':
      return '';
    case 'slenderness':
      return `about ${c.axis}: ${c.warning ?? (r.status === 'unstable' ? 'the axial load reaches the critical load of the magnifier' : "second-order moment beyond the method's limit")}`;
    case 'rho-beyond-maximum':
      return `needs more than the maximum ρg = ${rhoWords(c.rhoMax)}: enlarge the section`;
    case 'detailing':
      return r.statusFinding ? findingReason(basis, r.statusFinding) : '';
    case 'utilisation': {
      const from = MEASURE_WORDS[c.from];
      return `utilisation ${c.value.toFixed(3)} > 1${from ? ` (${from})` : ''}`;
    }
  }
}

/** The governing load's reason in words: the engine's `governingWhy`, with the status's reason (a fact of the load) put in words. */
export function governingWords(c: Pick<ColumnCheckHead, 'governingWhy' | 'basis'>, gov: ColumnLoadResult | undefined): string {
  if (!gov || gov.status === 'ok' || gov.status === 'fails') return c.governingWhy;
  const why = statusReasonOf(gov, c.basis);
  return `${gov.status}${why ? ` ${why}` : ''}${gov.statusClause ? ` [${gov.statusClause}]` : ''}`;
}

/** A finding in JSON: the facts, moments and forces in display units. */
export function findingJson(x: RuleFinding, units: UnitSystem) {
  const d = (n: number | null | undefined) =>
    n === null || n === undefined ? null : x.quantity === 'moment' || x.quantity === 'force' ? num(toDisplay(n, x.quantity, units)) : num(n);
  return {
    rule: x.rule,
    clause: x.clause,
    ...(x.axis ? { axis: x.axis } : {}),
    outcome: x.outcome,
    ...(x.value !== undefined ? { value: d(x.value) } : {}),
    ...(x.limit !== undefined ? { limit: d(x.limit) } : {}),
    ...(x.quantity ? { quantity: x.quantity } : {}),
  };
}

/** Columns of the table of the checks about each axis alone (the y minimum moment, the exact searches). */
export function axisChecksColumns(c: ColumnCheckFrame): TableColumn[] {
  const un = unitsOf(c.units);
  const s = symbolsOf(c);
  const measure = c.checked ? 'util' : 'ρg req';
  return [wordsCol('id'), wordsCol('check'), figureCol(s.M, un.moment, 'M'), figureCol(measure, null, 'measure'), figureCol(`uniaxial ${measure}`, null, 'uniaxialMeasure'), figureCol('NA angle°', null, 'naAngle'), wordsCol('clause'), wordsCol('governs')];
}

/** Headers of the table of the checks about each axis alone, as the text table prints them. */
export const axisChecksHeaders = (c: ColumnCheckFrame): string[] => axisChecksColumns(c).map(headerText);

/** One load's rows of that table: about y alone, its exact search, and the exact search about x, where each applies. */
export function axisChecksRows(r: ColumnLoadResult, c: ColumnCheckFrame): string[][] {
  const u = c.units;
  const M = (x: number) => f(toDisplay(x, 'moment', u), 5);
  const checked = c.checked !== null;
  const clauses = (axis: 'x' | 'y', rule: string) => [...new Set(r.findings.filter((x) => x.axis === axis && x.rule === rule).flatMap((x) => x.clause.split(', ')))].join(', ');
  const gov = (from: MeasureSource) => (r.measureFrom === from ? 'yes' : '');
  const rows: string[][] = [];
  const y = r.yAxis;
  if (y) {
    const uni = checked ? y.utilisation : y.rhoRequired;
    rows.push([r.id, 'about y alone', M(y.Mdesign), f(uni, checked ? 3 : undefined), '', '', clauses('y', 'min-moment'), gov('y')]);
    if (y.exact) rows.push([r.id, 'about y alone, exact', M(y.Mdesign), f(checked ? y.exact.utilisation : y.exact.rhoRequired, checked ? 3 : undefined), f(uni, checked ? 3 : undefined), f(y.exact.neutralAxisAngleDeg, 3), clauses('y', 'exact-section'), gov('y-exact')]);
  }
  const e = r.exactUniaxial;
  if (e) {
    const uni = checked ? r.utilisation : r.rhoRequired;
    rows.push([r.id, 'about x, exact', M(r.Mdesign), f(checked ? e.utilisation : e.rhoRequired, checked ? 3 : undefined), f(uni, checked ? 3 : undefined), f(e.neutralAxisAngleDeg, 3), clauses('x', 'exact-section'), gov('x-exact')]);
  }
  return rows;
}

/** The checks about each axis alone for every load that has one; null when no load has any. */
export function axisChecksView(c: ColumnCheck): TableView | null {
  const rows: string[][] = [];
  const marked: boolean[] = [];
  for (const r of c.results) {
    for (const row of axisChecksRows(r, c)) {
      rows.push(row);
      marked.push(r.governing);
    }
  }
  return rows.length === 0 ? null : tableView(axisChecksColumns(c), rows, marked);
}

/** The results table: one row per load, governing first. */
export function resultsView(c: ColumnCheck): TableView {
  return tableView(resultsColumns(c), c.results.map((r) => resultRow(r, c)), c.results.map((r) => r.governing));
}

/** Columns of the results table. */
export function resultsColumns(c: ColumnCheckFrame): TableColumn[] {
  const un = unitsOf(c.units);
  const s = symbolsOf(c);
  const withUtil = c.checked !== null;
  const biax = c.biaxial;
  return [
    wordsCol('id'),
    figureCol(s.P, un.force, 'Pu'),
    figureCol(s.M, un.moment, 'Mu'),
    ...(biax ? [figureCol(`${s.M}y`, un.moment, 'Muy')] : []),
    figureCol(`${s.P}/${s.perArea}`, null, 'normalisedP'),
    figureCol(`${s.M}/${s.perAreaDepth}`, null, 'normalisedM'),
    ...(s.nu && s.mu ? [figureCol(s.nu, null, 'nu'), figureCol(s.mu, null, 'mu')] : []),
    figureCol(`e/${s.depth}`, null, 'eOverH'),
    figureCol('ρg req', null, 'rhoRequired'),
    ...(biax && !withUtil ? [figureCol('ρg req biax', null, 'rhoRequiredBiaxial')] : []),
    figureCol('ρg chart', null, 'rhoFromChart'),
    ...(biax ? [figureCol('ρg chart biax', null, 'rhoFromChartBiaxial')] : []),
    figureCol('ρg rounded', null, 'rhoRoundedDown'),
    figureCol('extra', un.area, 'extraSteelRoundedDown'),
    figureCol(s.epsT, null, 'epsT'),
    figureCol('φ', null, 'phi'),
    wordsCol('strain state', 'strainClass'),
    ...(withUtil ? [figureCol('util', null, 'utilisation')] : []),
    ...(withUtil && biax ? [figureCol('util biax', null, 'utilisationBiaxial')] : []),
    wordsCol('status'),
    wordsCol('note', 'notes'),
  ];
}

/** Headers of the results table, as the text table prints them. */
export const resultsHeaders = (c: ColumnCheckFrame): string[] => resultsColumns(c).map(headerText);

/** One load's row of the results table. */
export function resultRow(r: ColumnLoadResult, c: ColumnCheckFrame): string[] {
  const u = c.units;
  const s = symbolsOf(c);
  const withUtil = c.checked !== null;
  const biax = c.biaxial;
  return [
    r.id,
    f(toDisplay(r.Pu, 'force', u), 5),
    Number.isFinite(r.Mu) ? (r.momentRaised ? '↑' : '') + f(toDisplay(Math.sign(r.Mu || 1) * r.Mdesign, 'moment', u), 5) : '∞',
    ...(biax ? [f(r.Muy === null ? null : toDisplay(r.Muy, 'moment', u), 5)] : []),
    f(r.normalised.P),
    f(r.normalised.M),
    ...(s.nu && s.mu ? [f(r.dimensionless.P), f(r.dimensionless.M)] : []),
    f(r.normalised.eOverH, 3),
    f(r.rhoRequired),
    ...(biax && !withUtil ? [f(r.biaxial?.rhoRequired ?? null)] : []),
    f(r.rhoFromChart),
    ...(biax ? [f(r.biaxial?.rhoFromChart ?? null)] : []),
    f(r.rhoRoundedDown, 3),
    f(r.extraSteelRoundedDown, 3),
    f(r.strain.epsT, 3),
    f(r.strain.phi, 3),
    strainClassWord(c.basis.symbols, r.strain.class),
    ...(withUtil ? [f(r.utilisation, 3)] : []),
    ...(withUtil && biax ? [f(r.biaxial?.exact?.utilisation ?? null, 3)] : []),
    STATUS_WORDS[r.status],
    noteText(r, c),
  ];
}

/** Lines under the results table: the governing mark, the measure, the moments, the rounding cost. */
export function resultsFootnotes(c: ColumnCheck): string[] {
  return footnotesFor(c, c.results[0]);
}

function footnotesFor(c: ColumnCheckHead, gov: ColumnLoadResult | undefined): string[] {
  const un = unitsOf(c.units);
  const s = symbolsOf(c);
  const out = [
    `* governing load: ${governingWords(c, gov)}. Loads are ranked by status (unstable, outside scope, not possible, detailing, fails, ok), then by ${c.measure === 'utilisation' ? 'utilisation' : 'ρg required'}.`,
    `${s.M} is the moment checked: after slenderness where asked, ↑ where raised to the basis minimum; signed. Normalised values in ${un.stress}; ${s.epsT} and φ at capacity along the load ray (${c.checked ? 'checked reinforcement' : 'at ρg required'}).`,
  ];
  if (gov && gov.extraSteelRoundedDown !== null && gov.extraSteelRoundedDown > 0) {
    out.push(`Reading the next lower sheet and rounding up would cost ${f(gov.extraSteelRoundedDown, 3)} ${un.area} more steel than the exact ρg for ${gov.id}.`);
  }
  out.push(...detailingLines(c, gov));
  const bc = c.biaxialChart;
  if (bc) {
    const diff = gov?.biaxial?.chartMinusExact ?? null;
    out.push(
      `ρg chart biax: read off biaxial sheets at γ = ${fmt(c.gamma, 4)} with contours at ρg ${bc.rhos.map((r) => fmt(r, 3)).join(', ')}, one sheet per ${axialLevelWords(c)} step of ${bc.axialStep}; linear between contours along the moment direction and linear between levels.` +
        (diff !== null && gov ? ` For ${gov.id} it differs from the exact ρg req biax by ${diff >= 0 ? '+' : ''}${f(diff)}.` : ''),
    );
  }
  return out;
}

/** Words of a finding's outcome. */
const OUTCOME_WORDS: Record<RuleFinding['outcome'], string> = { applied: 'applied', met: 'met', violated: 'BROKEN', unchecked: 'unchecked' };

/** A finding in words: the rule's title, its clause, the figures compared (display units) and the outcome; a non-binding rule broken is a note. */
export function findingWords(basis: Basis, f: RuleFinding): string {
  const rule = detailingRule(basis, f.rule);
  const un = unitsOf(basis.units);
  const v = (x: number | null | undefined) => (x === null || x === undefined ? '—' : f.quantity === 'length' ? `${fmt(x, 4)} ${un.length}` : fmt(x, 4));
  const figures = f.outcome === 'unchecked' ? '' : ` ${v(f.value)} ${findingComparison(f)} ${v(f.limit)}`;
  const outcome = f.outcome === 'violated' && rule && !rule.binding ? 'NOTE' : OUTCOME_WORDS[f.outcome];
  return `${rule?.title ?? f.rule} [${f.clause}${rule?.source === 'from memory' ? ', from memory' : ''}]:${figures} ${outcome}`;
}

/** The detailing of the given reinforcement in lines: the section's rules, the governing load's steel ratio, the aggregate assumed. */
export function detailingLines(c: ColumnCheckHead | ColumnCheckFrame, gov: ColumnLoadResult | undefined): string[] {
  if (!c.checked) return [];
  const un = unitsOf(c.units);
  const b = c.basis;
  const steel = (gov?.findings ?? []).filter((f) => f.rule === 'steel-min' || f.rule === 'steel-max');
  const all = [...steel, ...c.detailing.findings];
  if (all.length === 0) return [];
  return [
    `Detailing of the given reinforcement (${b.title}; a broken rule makes the load's status DETAILING, a NOTE does not): ${all.map((f) => findingWords(b, f)).join('; ')}${steel.length > 0 && gov ? ` (steel ratio for ${gov.id}; each load is checked at its own axial force)` : ''}.`,
    `Clear spacing at a maximum aggregate size of ${fmt(c.detailing.aggregate, 4)} ${un.length} (${c.detailing.aggregateAssumed ? 'assumed; --aggregate to change' : 'given'}); cover: ${b.detailing.coverAssumption}.`,
  ];
}

/** The loads the proposals do not cover, in one line; null when they cover every load. */
export function barsUnmetLine(c: Pick<ColumnCheck, 'barsUnmet'>): string | null {
  return c.barsUnmet.length === 0 ? null : `The proposals cover the loads that can be met; no layout within the basis limits meets ${c.barsUnmet.join(', ')} (unstable, outside the slenderness method, or beyond the maximum ρg).`;
}

/** The axial level of the biaxial sheets in the basis's words: ν for EN 1992-1-1, P/(f′c·Ag) otherwise. */
const axialLevelWords = (c: ColumnCheckFrame): string => c.basis.symbols.dimensionlessAxial ?? `${symbolsOf(c).P}/(${c.basis.symbols.normalisingStress}·Ag)`;

/** Slenderness per load and axis; null without slenderness input. */
export function slendernessView(c: ColumnCheck): { method: string; table: TableView } | null {
  if (!c.slenderness) return null;
  const rows: string[][] = [];
  const marked: boolean[] = [];
  let method = '';
  for (const r of c.results) {
    for (const row of slendernessRows(r, c)) {
      method ||= row.method;
      rows.push(row.cells);
      marked.push(r.governing);
    }
  }
  return { method, table: tableView(slendernessColumns(c), rows, marked) };
}

/** Columns of the slenderness table. */
export function slendernessColumns(c: ColumnCheckFrame): TableColumn[] {
  const un = unitsOf(c.units);
  const s = symbolsOf(c);
  return [wordsCol('id'), wordsCol('axis'), figureCol('slenderness'), figureCol('limit'), wordsCol('neglected'), figureCol('δ', null, 'delta'), figureCol(s.firstOrder, un.moment, 'firstOrderMoment'), figureCol(s.secondOrder, un.moment, 'magnifiedMoment'), wordsCol('note')];
}

/** Headers of the slenderness table, as the text table prints them. */
export const slendernessHeaders = (c: ColumnCheckFrame): string[] => slendernessColumns(c).map(headerText);

/** One load's rows of the slenderness table: one per axis magnified, with the method of each. */
export function slendernessRows(r: ColumnLoadResult, c: ColumnCheckFrame): { method: string; cells: string[] }[] {
  const e = r.slenderness;
  if (!e) return [];
  const u = c.units;
  const M = (x: number) => f(toDisplay(x, 'moment', u), 5);
  const out: { method: string; cells: string[] }[] = [];
  for (const [axis, sl] of [['x', e.x], ['y', e.y]] as const) {
    if (!sl) continue;
    const st = (key: string) => sl.steps.find((x) => x.key === key)?.value;
    out.push({
      method: sl.method,
      cells: [
        r.id,
        axis,
        f((st('klu-over-r') as number | undefined) ?? null, 3),
        f((st('limit') as number | undefined) ?? null, 3),
        sl.neglected ? 'yes' : 'no',
        f(sl.delta, 4),
        M(sl.firstOrderMoment),
        M(sl.magnifiedMoment),
        sl.ok ? '' : shortWarning(sl),
      ],
    });
  }
  return out;
}

const shortWarning = (s: SlendernessResult): string => (s.ok ? '' : s.delta === Infinity ? 'unstable' : (s.warnings[0] ?? 'outside the method'));

/** Biaxial methods side by side, with the checked reinforcement; null when no load has Muy or no reinforcement is given. */
export function biaxialView(c: ColumnCheck): TableView | null {
  if (!c.biaxial || !c.checked) return null;
  return tableView(biaxialColumns(c), c.results.map((r) => biaxialRow(r, c)), c.results.map((r) => r.governing));
}

/** Columns of the biaxial table. */
export function biaxialColumns(c: ColumnCheckFrame): TableColumn[] {
  const un = unitsOf(c.units);
  const s = symbolsOf(c);
  return [
    wordsCol('id'),
    figureCol(s.P, un.force, 'Pu'),
    figureCol(`${s.M}x`, un.moment, 'Mux'),
    figureCol(`${s.M}y`, un.moment, 'Muy'),
    figureCol('exact'),
    figureCol('NA angle°', null, 'naAngle'),
    figureCol('reciprocal'),
    wordsCol('method'),
    figureCol('contour'),
    figureCol('α', null, 'alpha'),
    figureCol('exact M@P', null, 'exactMomentUtilisation'),
    figureCol('contour M@P', null, 'contourMomentUtilisation'),
  ];
}

/** Headers of the biaxial table, as the text table prints them. */
export const biaxialHeaders = (c: ColumnCheckFrame): string[] => biaxialColumns(c).map(headerText);

/** One load's row of the biaxial table. */
export function biaxialRow(r: ColumnLoadResult, c: ColumnCheckFrame): string[] {
  const u = c.units;
  const M = (x: number | null) => f(x === null ? null : toDisplay(x, 'moment', u), 5);
  const b = r.biaxial;
  return [
    r.id,
    f(toDisplay(r.Pu, 'force', u), 5),
    M(r.Mu),
    M(r.Muy),
    f(b?.exact?.utilisation ?? null, 3),
    f(b?.exact?.neutralAxisAngleDeg ?? null, 3),
    f(b?.reciprocalLoad?.utilisation ?? null, 3),
    b?.reciprocalLoad?.method ?? '—',
    f(b?.loadContour?.utilisation ?? null, 3),
    f(b?.loadContour?.alpha ?? null, 3),
    f(b?.exact?.momentUtilisation ?? null, 3),
    f(b?.loadContour?.momentScale ?? null, 3),
  ];
}

/** Bar proposals; a sentence when there are none. */
export function barsView(c: ColumnCheck): TableView | string {
  return barsViewFor(c, loadIdIn(c));
}

/** The id of a load by input index, in a whole check. */
const loadIdIn = (c: ColumnCheck) => (index: number) => c.results.find((r) => r.index === index)?.id;

function barsViewFor(c: ColumnCheckHead, loadId: (index: number) => string | undefined): TableView | string {
  const un = unitsOf(c.units);
  if (c.bars.length === 0) return `Bar proposals: none (${c.barsSkipped ?? 'none found'}).`;
  // a flags column only where a proposal is flagged (lap-zone ratio, bar too large to lap)
  const flagged = c.bars.some((p) => p.findings.length > 0);
  const rows = c.bars.map((p) => [
    p.layout,
    f(p.area, 4),
    f(p.rho, 4),
    f(p.gamma, 4),
    `${f(p.clearSpacing, 3)} ≥ ${f(p.clearSpacingRequired, 3)}`,
    f(p.utilisation, 3),
    loadId(p.governingLoad) ?? '',
    ...(flagged ? [p.findings.map((x) => (x.rule === 'steel-max-lap' ? `ρg > ${fmt(x.limit ?? 0, 3)} where lapped [${x.clause}]` : `not lap spliced [${x.clause}]`)).join('; ')] : []),
  ]);
  const columns = [
    wordsCol('bars', 'layout'),
    figureCol('As', un.area, 'area'),
    figureCol('ρg', null, 'rho'),
    figureCol('γ', null, 'gamma'),
    figureCol('clear', un.length, 'clearSpacing'),
    figureCol('util (all effects)', null, 'utilisation'),
    wordsCol('by load', 'governingLoad'),
    ...(flagged ? [wordsCol('flags')] : []),
  ];
  return tableView(columns, rows, rows.map(() => false));
}

/** An arrangement's name in section lines: its kind, and for unequal four-faces counts the two counts in words. */
export function arrangementName(a: Arrangement): string {
  if (a.kind !== 'four-faces') return a.kind;
  const [nb, nh] = faceCounts(a.barsPerFace);
  return nb === nh ? a.kind : `${a.kind} (${nb} on each b face, ${nh} on each h face)`;
}

/** The section in one line. */
export function sectionLine(c: ColumnCheckFrame): string {
  const un = unitsOf(c.units);
  const b = c.basis;
  const dims = c.shape.kind === 'rectangle' ? `${fmt(c.shape.b)} × ${fmt(c.shape.h)} ${un.length}` : `D = ${fmt(c.shape.diameter)} ${un.length}`;
  return `${b.title}, ${dims} ${b.transverse}, ${arrangementName(c.arrangement)}, ${b.symbols.concreteStrength} = ${fmt(b.fc)} ${un.stress}, ${b.symbols.steelStrength} = ${fmt(b.fy)} ${un.stress}, γ = ${fmt(c.gamma, 4)} (${c.gammaSource === 'bars' ? 'from the bars' : 'given'})${c.gammaB !== null ? `, γB = ${fmt(c.gammaB, 4)} (given)` : ''}`;
}

/** Assumptions of the check itself, beside the basis notes. */
export function checkAssumptions(c: ColumnCheckFrame): string[] {
  const b = c.basis;
  const lim = c.limits;
  const s = symbolsOf(c);
  const out = [
    c.slenderness
      ? c.slenderness.x.sway
        ? `Slender sway (unbraced) column: ${s.M} is the second-order moment of the basis's sway method (${c.basis.slenderness?.sway?.title ?? 'none in pmchart'}); every step is listed per load with its clause.`
        : `Slender column (non-sway): ${s.M} is the second-order moment of the basis's method; every step is listed per load.`
      : `Short column: factored ${s.P} and ${s.M} are taken as given (slenderness effects are not added here).`,
    `Moments keep their signs. ${c.variants.length === 1 ? 'The layout is symmetric about the bending axis, so both signs give the same capacity.' : c.variants.map((v) => v.label).join('; ') + ': the weakest governs.'}`,
    `ρg required is solved exactly at the actual γ = ${fmt(c.gamma, 4)} with the bars smeared in the chosen arrangement; the ${b.symbols.designFamily} curve includes the ${s.cap}.`,
    `Chart readings emulate sheets at γ steps of ${c.chart.gammaStep} with curves at ρg ${c.chart.rhos.map((r) => fmt(r, 3)).join(', ')}: linear between curves along the load ray, linear in γ between sheets; the traditional reading takes the next lower sheet and the next curve out.`,
    `ρg limits ${fmt(lim.min, 3)}–${fmt(lim.max, 3)} of Ag at zero axial load; each load uses the basis's limits for its own axial force, chart readings included.`,
    'Status: ok; FAILS (utilisation above 1); DETAILING (the given reinforcement breaks a detailing rule of the basis: steel ratio, clear spacing or cover; the rule and clause are named); NOT POSSIBLE (more than the maximum ρg); UNSTABLE (the axial load reaches the magnifier’s critical load; for a sway column also Q ≥ 1 or the storey’s ΣPu ≥ 0.75·ΣPc); OUTSIDE SCOPE (beyond the second-order method’s limit, e.g. δs from Q above 1.5, or a sway column on a basis with no sway method). Exit status 1 when any load is not ok.',
  ];
  if (c.barSelection) {
    out.push(
      c.barSelection.detailing === 'cover'
        ? `Bar proposals: one bar size each, centres at cover + tie + db/2 from the faces (γ recomputed per size); ${b.clearSpacingRule}; ${b.minimumBarRule}; sizes from ${barSet(b.barSet).source}, ${b.units === 'us' ? '#5' : '12 mm'} and up (common practice). Each proposal is re-verified with its discrete bars against every load with every effect (slenderness, minimum moment, both signs, ring orientations, about y alone, exact biaxial).`
        : `Bar proposals: γ was given, so bar centres stay at (1 − γ)·h/2 from the faces for every size and the cover is not checked; ${b.clearSpacingRule}; ${b.minimumBarRule}. Each proposal is re-verified against every load with every effect.`,
    );
    if (c.barSelection.aggregate === null) out.push(`No maximum aggregate size given: the spacing rule assumes ${fmt(c.basis.detailing.defaultAggregate, 4)} ${unitsOf(c.units).length} (--aggregate to change).`);
    out.push(`Bar proposals are flagged, not refused, above ρg ${fmt(c.basis.detailing.lapZoneRho, 3)} where bars are lapped${Number.isFinite(c.basis.detailing.maxLappedBar) ? ` and for bars larger than ${fmt(c.basis.detailing.maxLappedBar, 4)} ${unitsOf(c.units).length}, which cannot be lap spliced` : ''}.`);
  }
  if (c.slenderness) {
    out.push(`Slenderness: each axis magnified separately for its own member data (${c.slenderness.x.sway ? 'sway: the storey data and k1, k2 serve both axes' : 'non-sway'}), both axes always (a load without ${s.M}y has ${s.M}y = 0, and kℓu about y defaults to kℓu about x); the magnified moments feed the uniaxial and biaxial checks.`);
  }
  out.push(
    `Minimum moments act about one axis at a time (ACI 318-19 R6.6.4.5.4; EN 1992-1-1 5.8.9): each load is also checked about y alone at the same ${s.P}, its moment about y raised to the minimum; a governing minimum is an accidental eccentricity, checked in both signs on a layout not symmetric about the axis. A layout not symmetric about the bending plane is checked by the exact search with the neutral axis free to incline (the uniaxial figure never governs lower).`,
  );
  if (c.biaxial) {
    out.push(
      c.checked
        ? `Biaxial: exact capacity of the actual bars under an inclined neutral axis along the load ray in (P, Mx, My); reciprocal load 1/Pn = 1/Pnx + 1/Pny − 1/${s.Po} where Pn ≥ 0.1·f′c·Ag (factored values), else the linear moment sum at Pu; load contour (Mx/Mxo)^α + (My/Myo)^α with the basis’s exponent.`
        : 'Biaxial: ρg req biax is the exact ρg at which the smeared bars at γ carry the load along its ray in (P, Mx, My) under an inclined neutral axis.',
    );
  }
  return [...out, ...c.notes];
}

/** Column widths of a text table, grown one row at a time; a marked row counts with its "* ". */
export class ColumnWidths {
  readonly w: number[];
  constructor(headers: readonly string[]) {
    this.w = headers.map((h) => h.length);
  }
  add(cells: readonly string[], marked = false): void {
    const w = this.w;
    // a loop, not Math.max(...rows): 200k rows overflow the call stack as spread arguments
    for (let i = 0; i < w.length; i++) w[i] = Math.max(w[i]!, (i === 0 && marked ? 2 : 0) + (cells[i] ?? '').length);
  }
}

/** The lines of a text table: headers, rule, rows (the marked ones with "* "). */
export function* tableLines(headers: readonly string[], widths: ColumnWidths, rows: Iterable<{ cells: readonly string[]; marked: boolean }>): Generator<string> {
  const w = widths.w;
  const line = (cells: readonly string[]) => cells.map((x, i) => (i === 0 ? x.padEnd(w[i]!) : x.padStart(w[i]!))).join('  ').trimEnd();
  yield line(headers);
  yield line(w.map((n) => '-'.repeat(n)));
  for (const { cells, marked } of rows) yield line(marked ? [`* ${cells[0]}`, ...cells.slice(1)] : cells);
}

/** Renders a table as aligned text, the governing row marked with "* ". */
export function textTable(t: TableView): string {
  const widths = new ColumnWidths(t.headers);
  t.rows.forEach((r, i) => widths.add(r, t.marked[i]));
  return [...tableLines(t.headers, widths, t.rows.map((cells, i) => ({ cells, marked: t.marked[i] === true })))].join('\n');
}

/**
 * What the text and JSON views read: a whole check, or a check held as a ranking whose results are
 * computed again, in ranked order, each time they are read (`RankedColumnCheck` fits as it is).
 */
export interface CheckRows {
  readonly check: ColumnCheckHead;
  readonly governing: ColumnLoadResult | undefined;
  results(): Iterable<ColumnLoadResult>;
  loadId(index: number): string | undefined;
}

/** A whole check as rows. */
export const rowsOf = (c: ColumnCheck): CheckRows => ({ check: c, governing: c.results[0], results: () => c.results, loadId: loadIdIn(c) });

/** Column widths of the per-load tables of the text view. */
export interface TextSizes {
  results: ColumnWidths;
  slenderness: ColumnWidths | null;
  biaxial: ColumnWidths | null;
  /** the checks about each axis alone, and how many rows they have */
  axes: ColumnWidths;
  axesRows: number;
}

/**
 * Sizes the per-load tables of the text view one result at a time, in any order (`visit`, e.g. as
 * the engine ranks the loads); `finish` counts the governing load's rows with their mark.
 */
export function textSizer(c: ColumnCheckFrame): { visit(r: ColumnLoadResult): void; finish(governing: ColumnLoadResult | undefined): TextSizes } {
  const sizes: TextSizes = {
    results: new ColumnWidths(resultsHeaders(c)),
    slenderness: c.slenderness ? new ColumnWidths(slendernessHeaders(c)) : null,
    biaxial: c.biaxial && c.checked ? new ColumnWidths(biaxialHeaders(c)) : null,
    axes: new ColumnWidths(axisChecksHeaders(c)),
    axesRows: 0,
  };
  const add = (r: ColumnLoadResult, marked: boolean) => {
    sizes.results.add(resultRow(r, c), marked);
    for (const row of axisChecksRows(r, c)) {
      sizes.axes.add(row, marked);
      if (!marked) sizes.axesRows++;
    }
    if (sizes.slenderness) for (const row of slendernessRows(r, c)) sizes.slenderness.add(row.cells, marked);
    if (sizes.biaxial) sizes.biaxial.add(biaxialRow(r, c), marked);
  };
  return {
    visit: (r) => add(r, false),
    finish: (gov) => {
      if (gov) add(gov, true);
      return sizes;
    },
  };
}

/** Sizes the text tables of a whole check. */
function sizeText(src: CheckRows): TextSizes {
  const sizer = textSizer(src.check);
  for (const r of src.results()) sizer.visit(r);
  return sizer.finish(src.governing);
}

/** The readable table the CLI prints. */
export function checkText(c: ColumnCheck): string {
  return [...checkTextPieces(rowsOf(c))].join('');
}

/** The text table in pieces, each ending with a newline: a ranked check is printed load by load. */
export function* checkTextPieces(src: CheckRows, sizes: TextSizes = sizeText(src)): Generator<string> {
  for (const b of textBlocks(src, sizes)) {
    if (typeof b === 'string') yield `${b}\n`;
    else for (const l of b.lines) yield `${l}\n`;
  }
  yield '\n';
  yield `${CAUTION}\n`;
}

/** An element of the text body: a string (may hold several lines), or lines made one at a time. */
type TextBlock = string | { lines: Iterable<string> };

function* textBlocks(src: CheckRows, sizes: TextSizes): Generator<TextBlock> {
  const c = src.check;
  yield sectionLine(c);
  if (c.checked) yield `Checked reinforcement: ${c.checked.description} (ρg = ${f(c.checked.rho)})`;
  yield `Chart sheets read: γ = ${c.chart.lower}${c.chart.upper !== null ? ` and ${c.chart.upper}` : ''}`;
  yield '';
  yield { lines: resultsTableLines(src, sizes.results) };
  yield* footnotesFor(c, src.governing);
  yield '';
  yield `Summary: ${c.summary.text}.`;
  if (c.slenderness || c.biaxial || sizes.axesRows > 0) {
    yield '';
    yield { lines: effectLines(src, sizes) };
  }
  const bars = barsViewFor(c, (i) => src.loadId(i));
  yield '';
  yield typeof bars === 'string' ? bars : textTable(bars);
  const unmet = barsUnmetLine(c);
  if (unmet) yield unmet;
}

function resultsTableLines(src: CheckRows, widths: ColumnWidths): Generator<string> {
  const c = src.check;
  return tableLines(resultsHeaders(c), widths, mapRows(src.results(), (r) => [{ cells: resultRow(r, c), marked: r.governing }]));
}

function* mapRows<T>(results: Iterable<ColumnLoadResult>, rows: (r: ColumnLoadResult) => T[]): Generator<T> {
  for (const r of results) yield* rows(r);
}

/** The slenderness and biaxial sections of the text table (empty for a short uniaxial check). */
export function effectsText(c: ColumnCheck): string {
  const src = rowsOf(c);
  return [...effectLines(src, sizeText(src))].join('\n');
}

function* effectLines(src: CheckRows, sizes: TextSizes): Generator<string> {
  const c = src.check;
  let any = false;
  if (c.slenderness && sizes.slenderness) {
    // the method of the first load (in ranked order) that has slenderness rows
    let method = '';
    for (const r of src.results()) {
      method = slendernessRows(r, c)[0]?.method ?? '';
      if (method) break;
    }
    yield `Slenderness (${method}):`;
    yield* tableLines(slendernessHeaders(c), sizes.slenderness, mapRows(src.results(), (r) => slendernessRows(r, c).map((row) => ({ cells: row.cells, marked: r.governing }))));
    any = true;
  }
  if (sizes.biaxial) {
    if (any) yield '';
    yield 'Biaxial (checked reinforcement, actual bars; > 1 fails). exact: along the load ray in (P, Mx, My); reciprocal: Pu/Pn (or the linear moment sum);';
    yield 'contour: left-hand side (Mux/Mxo)^α + (Muy/Myo)^α. The M@P columns compare moments at fixed P: exact, and the contour value^(1/α).';
    yield* tableLines(biaxialHeaders(c), sizes.biaxial, mapRows(src.results(), (r) => [{ cells: biaxialRow(r, c), marked: r.governing }]));
    any = true;
  } else if (c.biaxial) {
    if (any) yield '';
    yield 'Biaxial: no reinforcement given, so ρg req biax is the exact biaxial ρg required (Mux and Muy together; ρg req is for Mux alone); give --rho or a bar layout for the three methods side by side.';
    any = true;
  }
  if (sizes.axesRows > 0) {
    if (any) yield '';
    yield 'Each axis alone (one axis at a time; the minimum moment in both signs where it governs; the exact search where the neutral axis inclines):';
    yield* tableLines(axisChecksHeaders(c), sizes.axes, mapRows(src.results(), (r) => axisChecksRows(r, c).map((cells) => ({ cells, marked: r.governing }))));
  }
}

/** Text report: inputs, assumptions and clauses, results, slenderness steps, biaxial details, caution. */
export function checkReportText(c: ColumnCheck, generator: string): string {
  return [...checkReportPieces(rowsOf(c), generator)].join('');
}

/** The text report in pieces, each ending with a newline: a ranked check is written load by load. */
export function* checkReportPieces(src: CheckRows, generator: string, sizes: TextSizes = sizeText(src)): Generator<string> {
  const c = src.check;
  const b = c.basis;
  const head = [
    `pmchart column check — ${generator}`,
    '',
    'INPUTS',
    `  ${sectionLine(c)}`,
    `  loads: ${c.summary.total} factored combination(s)`,
    ...Object.entries(b.parameters).map(([k, v]) => `  ${k} = ${v}`),
    '',
    'ASSUMPTIONS AND CODE CLAUSES',
    ...b.notes.map((n) => `  - ${n}`),
    ...checkAssumptions(c).map((n) => `  - ${n}`),
    '',
    'RESULTS (governing first)',
  ];
  for (const l of head) yield `${l}\n`;
  // the body of the text table without its section line; each element indented on its first line
  let first = true;
  for (const block of textBlocks(src, sizes)) {
    if (first) {
      first = false;
      continue;
    }
    if (typeof block === 'string') yield `${block ? `  ${block}` : block}\n`;
    else {
      let k = 0;
      for (const l of block.lines) yield `${k++ === 0 && l ? `  ${l}` : l}\n`;
    }
  }
  yield '\n';
  for (const l of detailLines(src)) yield `${l}\n`;
  yield 'CAUTION\n';
  yield `  ${CAUTION}\n`;
}

/** Every slenderness step and the biaxial method details, for the text report. */
function* detailLines(src: CheckRows): Generator<string> {
  const c = src.check;
  const u = c.units;
  if (c.slenderness) {
    yield 'SLENDERNESS STEPS (internal units as labelled)';
    for (const r of src.results()) {
      for (const [axis, s] of [['x', r.slenderness?.x], ['y', r.slenderness?.y]] as const) {
        if (!s) continue;
        yield `  ${r.id}, bending about ${axis}: ${s.method}`;
        for (const st of s.steps) yield `    ${st.label} = ${typeof st.value === 'number' ? f(st.value, 5) : String(st.value)}${st.unit ? ` ${st.unit}` : ''}`;
        for (const w of s.warnings) yield `    WARNING: ${w}`;
      }
    }
    yield '';
  }
  let findings = false;
  for (const r of src.results()) {
    if (r.findings.length === 0) continue;
    if (!findings) yield 'RULE FINDINGS (clauses of the basis)';
    findings = true;
    for (const x of r.findings) yield `  ${r.id}: ${findingText(c.basis, x, u)}`;
  }
  if (findings) yield '';
  if (c.biaxial && c.checked) {
    yield 'BIAXIAL METHODS';
    const F = (x: number) => f(toDisplay(x, 'force', u), 5);
    const M = (x: number) => f(toDisplay(x, 'moment', u), 5);
    for (const r of src.results()) {
      const b = r.biaxial;
      if (!b?.exact || !b.reciprocalLoad || !b.loadContour) continue;
      yield `  ${r.id}: exact ${f(b.exact.utilisation, 4)} (neutral axis ${f(b.exact.neutralAxisAngleDeg, 4)}°, depth ${f(b.exact.neutralAxisDepth, 4)}, ${symbolsOf(c).epsT} = ${f(b.exact.epsT, 3)}, φ = ${f(b.exact.phi, 3)}${b.exact.capGoverns ? `, ${symbolsOf(c).cap} governs` : ''})`;
      yield `    reciprocal load: Pnx = ${F(b.reciprocalLoad.Pnx)}, Pny = ${F(b.reciprocalLoad.Pny)}, ${symbolsOf(c).Po} = ${F(b.reciprocalLoad.Po)}, Pn = ${F(b.reciprocalLoad.Pn)} (0.1·f′c·Ag = ${F(b.reciprocalLoad.validityLimit)}) → ${b.reciprocalLoad.method} ${f(b.reciprocalLoad.utilisation, 4)}; ${b.reciprocalLoad.note}`;
      yield `    load contour: Mnox = ${M(b.loadContour.Mnox)}, Mnoy = ${M(b.loadContour.Mnoy)} at Pu, α = ${f(b.loadContour.alpha, 3)} (${b.loadContour.alphaSource}) → ${f(b.loadContour.utilisation, 4)}; moments may scale by 1/${f(b.loadContour.momentScale, 4)} at fixed Pu (exact: 1/${f(b.exact.momentUtilisation, 4)})`;
    }
    yield '';
  }
}

// ───────────────────────────── JSON ─────────────────────────────

const disp = (x: number, kind: 'force' | 'moment', u: UnitSystem) => num(toDisplay(x, kind, u));
const orNull = (x: number | null | undefined) => (x === null || x === undefined ? null : num(x));

function slenderJson(s: SlendernessResult, u: UnitSystem) {
  return {
    neglected: s.neglected,
    delta: num(s.delta),
    magnifiedMoment: disp(s.magnifiedMoment, 'moment', u),
    firstOrderMoment: disp(s.firstOrderMoment, 'moment', u),
    ok: s.ok,
    method: s.method,
    warnings: s.warnings,
    steps: s.steps.map((st) => ({ key: st.key, clause: st.clause, label: st.label, value: typeof st.value === 'number' ? num(st.value) : st.value, ...(st.unit ? { unit: st.unit } : {}) })),
  };
}

/** The exact search of one axis alone as JSON. */
const exactJson = (e: ColumnLoadResult['exactUniaxial']) =>
  e === null
    ? null
    : { utilisation: orNull(e.utilisation), rhoRequired: orNull(e.rhoRequired), rhoStatus: e.rhoStatus, signs: e.signs, neutralAxisAngleDeg: orNull(e.neutralAxisAngleDeg) };

/** One result as JSON: the stable fields (id, rhoRequired, rhoFromChart, rhoRoundedDown …) and the engine's additions. */
export function resultJson(r: ColumnLoadResult, c: ColumnCheckFrame) {
  const u = c.units;
  const b = r.biaxial;
  return {
    id: r.id,
    Pu: disp(r.Pu, 'force', u),
    Mu: disp(r.Mu, 'moment', u),
    ...(c.biaxial ? { Muy: disp(r.Muy ?? 0, 'moment', u) } : {}),
    firstOrder: { Mux: disp(r.firstOrder.Mux, 'moment', u), Muy: r.firstOrder.Muy === null ? null : disp(r.firstOrder.Muy, 'moment', u) },
    Mdesign: disp(r.Mdesign, 'moment', u),
    momentRaised: r.momentRaised,
    normalised: { P: num(r.normalised.P), M: num(r.normalised.M), eOverH: orNull(r.normalised.eOverH) },
    dimensionless: { P: num(r.dimensionless.P), M: num(r.dimensionless.M), ...(c.basis.symbols.dimensionlessAxial ? { symbols: [c.basis.symbols.dimensionlessAxial, c.basis.symbols.dimensionlessMoment] } : {}) },
    rhoRequired: orNull(r.rhoRequired),
    rhoStatus: r.rhoStatus,
    governedBy: r.governedBy,
    steelRequired: orNull(r.steelRequired),
    rhoFromChart: orNull(r.rhoFromChart),
    rhoRoundedDown: r.rhoRoundedDown,
    extraSteelRoundedDown: orNull(r.extraSteelRoundedDown),
    chartSheets: r.chartSheets.map((sh) => ({ gamma: sh.gamma, rho: orNull(sh.rho), roundedUp: sh.roundedUp, position: sh.position })),
    strain: {
      epsT: num(r.strain.epsT),
      phi: num(r.strain.phi),
      class: r.strain.class,
      words: strainClassWord(c.basis.symbols, r.strain.class),
      cOverH: num(r.strain.cOverH),
      atRho: num(r.strain.atRho),
      capGoverns: r.strain.capGoverns,
    },
    utilisation: orNull(r.utilisation),
    capacity: r.capacity === null ? null : { Pu: disp(r.capacity.P, 'force', u), Mu: disp(r.capacity.M, 'moment', u) },
    variant: { label: r.variant.label, sign: r.variant.sign, turnDeg: num(r.variant.turnDeg), checked: r.variantsChecked },
    status: r.status,
    statusReason: statusReasonOf(r, c.basis),
    statusClause: r.statusClause,
    measure: orNull(r.measureValue),
    governing: r.governing,
    notes: r.notes.map(loadNoteText),
    measureFrom: r.measureFrom,
    findings: r.findings.map((x) => findingJson(x, u)),
    yAxis: r.yAxis
      ? {
          Mu: disp(r.yAxis.Mu, 'moment', u),
          minimum: disp(r.yAxis.minimum, 'moment', u),
          Mdesign: disp(r.yAxis.Mdesign, 'moment', u),
          normalised: { P: num(r.yAxis.normalised.P), M: num(r.yAxis.normalised.M) },
          rhoRequired: orNull(r.yAxis.rhoRequired),
          rhoStatus: r.yAxis.rhoStatus,
          utilisation: orNull(r.yAxis.utilisation),
          capacity: r.yAxis.capacity === null ? null : { Pu: disp(r.yAxis.capacity.P, 'force', u), Mu: disp(r.yAxis.capacity.M, 'moment', u) },
          variant: { label: r.yAxis.variant.label, sign: r.yAxis.variant.sign, turnDeg: num(r.yAxis.variant.turnDeg) },
          exact: exactJson(r.yAxis.exact),
        }
      : null,
    exactUniaxial: exactJson(r.exactUniaxial),
    ...(r.slenderness ? { slenderness: { ...slenderJson(r.slenderness.x, u), ...(r.slenderness.y ? { y: slenderJson(r.slenderness.y, u) } : {}) } } : {}),
    ...(c.biaxial
      ? {
          biaxial: b
            ? {
                exact: orNull(b.exact?.utilisation),
                reciprocalLoad: orNull(b.reciprocalLoad?.utilisation),
                loadContour: orNull(b.loadContour?.utilisation),
                rhoRequired: orNull(b.rhoRequired),
                rhoStatus: b.rhoStatus,
                rhoFromChart: orNull(b.rhoFromChart),
                chartMinusExact: orNull(b.chartMinusExact),
                chartLevels: b.chartLevels.map((l) => ({ level: num(l.level), rho: orNull(l.rho), position: l.position })),
                details:
                  b.exact && b.reciprocalLoad && b.loadContour
                    ? {
                        exact: {
                          capacity: { P: disp(b.exact.capacity.P, 'force', u), Mx: disp(b.exact.capacity.Mx, 'moment', u), My: disp(b.exact.capacity.My, 'moment', u) },
                          neutralAxisAngleDeg: num(b.exact.neutralAxisAngleDeg),
                          neutralAxisDepth: num(b.exact.neutralAxisDepth),
                          epsT: num(b.exact.epsT),
                          phi: num(b.exact.phi),
                          class: b.exact.strainClass,
                          capGoverns: b.exact.capGoverns,
                          momentUtilisationAtPu: num(b.exact.momentUtilisation),
                        },
                        reciprocalLoad: {
                          method: b.reciprocalLoad.method,
                          Pnx: disp(b.reciprocalLoad.Pnx, 'force', u),
                          Pny: disp(b.reciprocalLoad.Pny, 'force', u),
                          Po: disp(b.reciprocalLoad.Po, 'force', u),
                          Pn: disp(b.reciprocalLoad.Pn, 'force', u),
                          validityLimit: disp(b.reciprocalLoad.validityLimit, 'force', u),
                          Mnox: disp(b.reciprocalLoad.Mnox, 'moment', u),
                          Mnoy: disp(b.reciprocalLoad.Mnoy, 'moment', u),
                          note: b.reciprocalLoad.note,
                        },
                        loadContour: {
                          alpha: num(b.loadContour.alpha),
                          alphaSource: b.loadContour.alphaSource,
                          axialRatio: num(b.loadContour.axialRatio),
                          momentScale: num(b.loadContour.momentScale),
                          Mnox: disp(b.loadContour.Mnox, 'moment', u),
                          Mnoy: disp(b.loadContour.Mnoy, 'moment', u),
                          note: b.loadContour.note,
                        },
                      }
                    : null,
              }
            : null,
        }
      : {}),
  };
}


/** The whole check as JSON (stable fields documented in the README). */
export function checkJson(c: ColumnCheck, generator: string): string {
  return [...checkJsonPieces(rowsOf(c), generator)].join('');
}

/** Placeholder for the results while the rest of the document is written (the results follow one by one). */
const RESULTS_SLOT = '\u0000results\u0000';

/**
 * The JSON document in pieces with exactly the bytes of JSON.stringify(document, null, 1): the head
 * with a placeholder for the results, then each result indented to its depth, then the tail.
 */
export function* checkJsonPieces(src: CheckRows, generator: string): Generator<string> {
  const c = src.check;
  const u = c.units;
  const un = unitsOf(u);
  const out = {
    generator,
    code: c.basis.code,
    codeTitle: c.basis.title,
    units: { system: u, force: un.force, moment: un.moment, stress: un.stress, length: un.length, area: un.area },
    section: {
      shape: c.shape,
      area: num(c.area),
      gamma: num(c.gamma),
      ...(c.gammaB !== null ? { gammaB: num(c.gammaB) } : {}),
      gammaSource: c.gammaSource,
      arrangement: c.arrangement,
      transverse: c.basis.transverse,
      fc: num(c.basis.fc),
      fy: num(c.basis.fy),
    },
    chart: { gammaStep: c.chart.gammaStep, sheets: [c.chart.lower, ...(c.chart.upper !== null ? [c.chart.upper] : [])], rhos: c.chart.rhos },
    ...(c.biaxialChart ? { biaxialChart: { axialStep: c.biaxialChart.axialStep, angleStepDeg: c.biaxialChart.angleStepDeg, rhos: c.biaxialChart.rhos } } : {}),
    rhoLimits: { min: num(c.limits.min), max: num(c.limits.max) },
    checked: c.checked ? { kind: c.checked.kind, rho: num(c.checked.rho), description: c.checked.description } : null,
    governing: c.governingId,
    measure: c.measure,
    governingWhy: governingWords(c, src.governing),
    summary: { total: c.summary.total, ...c.summary.counts, text: c.summary.text },
    exitCode: c.exitCode,
    results: RESULTS_SLOT,
    bars: c.bars.map((p) => ({
      layout: p.layout,
      size: p.size,
      count: p.count,
      perFace: p.perFace,
      area: num(p.area),
      rho: num(p.rho),
      gamma: num(p.gamma),
      clearSpacing: num(p.clearSpacing),
      clearSpacingRequired: num(p.clearSpacingRequired),
      utilisation: num(p.utilisation),
      governingLoad: src.loadId(p.governingLoad) ?? null,
      findings: p.findings.map((x) => findingJson(x, u)),
    })),
    barsNote: c.barsSkipped,
    barsUnmet: c.barsUnmet,
    detailing: { findings: c.detailing.findings.map((x) => findingJson(x, u)), aggregate: num(c.detailing.aggregate), aggregateAssumed: c.detailing.aggregateAssumed, rules: c.basis.detailing.rules },
    basis: { parameters: c.basis.parameters, notes: c.basis.notes },
    assumptions: checkAssumptions(c),
    caution: CAUTION,
  };
  const [head, tail] = (JSON.stringify(out, null, 1) + '\n').split(JSON.stringify(RESULTS_SLOT)) as [string, string];
  const total = c.summary.total;
  if (total === 0) {
    yield `${head}[]${tail}`;
    return;
  }
  yield `${head}[\n`;
  let k = 0;
  for (const r of src.results()) {
    const text = JSON.stringify(resultJson(r, c), null, 1).replace(/\n/g, '\n  ');
    yield `  ${text}${++k < total ? ',' : ''}\n`;
  }
  yield ` ]${tail}`;
}
