/**
 * `pmchart check`: factored loads on a sized column → exact required ρg, the chart readings, the strain
 * state, utilisation of a given ρg or bar layout, and bar proposals. Readable table, or JSON with
 * `--json` (stable fields: results[].id, rhoRequired, rhoFromChart, rhoRoundedDown).
 */
import { readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { extname } from 'node:path';
import type { Command } from 'commander';
import type { Detailing } from '../design/bar-selection.js';
import { checkLoads, type CheckOutcome, type CheckRequest, type FactoredLoad, type LoadResult } from '../design/check.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { parseLoadQuantity, parseLoadsCsv as readLoadsCsv } from '../input/loads-csv.js';
import { barSet } from '../section/bar-tables.js';
import { barCount } from '../section/arrangements.js';
import { DISPLAY_UNITS, parseQuantity, systemFactor, toDisplay, type UnitSystem } from '../units/index.js';
import { generatorLabel } from '../version.js';
import { fmt, num, reportDate } from './format.js';
import { addSectionOptions, resolveSectionFlags, type ResolvedSection, type SectionFlags } from './section-flags.js';
import { CAUTION } from './table.js';
import { addEffectsOptions, applySlenderness, effectsAssumptions, effectsJson, effectsReport, effectsText, finishEffects, resolveEffects, type CheckEffects, type EffectsFlags } from './check-effects.js';

export interface CheckOptions extends SectionFlags, EffectsFlags {
  pu?: string;
  mu?: string;
  loads?: string;
  rho?: string;
  aggregate?: string;
  chartGammaStep?: string;
  proposals?: string;
  json?: boolean;
  report?: string;
  /** title block of a PDF/SVG report */
  project?: string;
  office?: string;
  date?: string;
}

export const REPORT_FORMATS = ['.txt', '.json', '.pdf', '.svg'] as const;
/** Report formats drawn by the sheet renderer (imported only when asked for). */
export const DRAWN_REPORT_FORMATS = ['.pdf', '.svg'] as const;
const isDrawn = (file: string): boolean => (DRAWN_REPORT_FORMATS as readonly string[]).includes(extname(file).toLowerCase());

/** Smallest practical longitudinal bar: #5 (US) or 12 mm (SI), common practice. */
const MIN_PRACTICAL_BAR = { us: 0.625, si: 12 } as const;

export interface ResolvedCheck {
  section: ResolvedSection;
  request: CheckRequest;
  json: boolean;
  report?: string;
  aggregate?: number;
  /** Muy and slenderness (check-effects.ts); absent when neither is asked for */
  effects?: CheckEffects;
}

/** Load files are read by src/input/loads-csv.ts (csv-parse; header units, ";" files, duplicates refused). */
export function parseLoadsCsv(text: string, units: UnitSystem, path = '--loads'): FactoredLoad[] {
  return readLoadsCsv(text, units, path);
}

export function resolveCheckOptions(o: CheckOptions): ResolvedCheck {
  if (o.report !== undefined) {
    const ext = extname(o.report).toLowerCase();
    if (!(REPORT_FORMATS as readonly string[]).includes(ext)) {
      throw new PmError(ERROR_CODES.invalidValue, '--report', 'has an unknown extension', { value: o.report, allowed: REPORT_FORMATS.join(', ') });
    }
  }
  if (o.date !== undefined) reportDate(o.date);
  const section = resolveSectionFlags(o, true);
  const u = section.units;
  const { basis } = section;

  let loads: FactoredLoad[];
  if (o.loads !== undefined) {
    if (o.pu !== undefined || o.mu !== undefined) throw new PmError(ERROR_CODES.conflict, '--loads', 'and --pu/--mu both give loads; use one of them');
    let text: string;
    try {
      text = readFileSync(o.loads, 'utf8');
    } catch (e) {
      throw new PmError(ERROR_CODES.io, '--loads', `cannot be read (${(e as NodeJS.ErrnoException).code ?? 'error'})`, { value: o.loads });
    }
    loads = parseLoadsCsv(text, u);
  } else {
    if (o.pu === undefined) throw new PmError(ERROR_CODES.missing, '--pu', `is required, or --loads FILE.csv (a force, default unit ${DISPLAY_UNITS[u].force}; tension negative)`);
    if (o.mu === undefined) throw new PmError(ERROR_CODES.missing, '--mu', `is required with --pu (a moment, default unit ${DISPLAY_UNITS[u].moment})`);
    loads = [{ id: 'load', Pu: parseLoadQuantity(o.pu, 'force', u, '--pu'), Mu: parseLoadQuantity(o.mu, 'moment', u, '--mu') }];
  }

  const request: CheckRequest = {
    basis,
    shape: section.shape,
    arrangement: section.arrangement,
    gamma: section.gamma,
    capContext: section.capContext,
    loads,
  };
  if (o.chartGammaStep !== undefined) {
    const step = Number(o.chartGammaStep);
    request.chartGammaStep = requireInRange('--chart-gamma-step', Number.isFinite(step) ? step : NaN, 0.01, 0.2);
  }
  if (o.rho !== undefined) {
    const lim = basis.rhoLimits;
    const rho = Number(o.rho);
    request.rho = requireInRange('--rho', Number.isFinite(rho) ? rho : NaN, lim.min, lim.max);
  } else if (section.bar && (o.barsPerFace !== undefined || o.bars !== undefined) && section.arrangement.kind !== 'custom') {
    const count = barCount(section.arrangement);
    request.layout = {
      arrangement: section.arrangement,
      area: count * section.bar.area,
      gamma: section.gamma,
      description: /^\d+(\.\d+)?$/.test(section.bar.name) ? `${count} × ${section.bar.name} mm` : `${count} ${section.bar.name}`,
    };
  }

  let aggregate: number | undefined;
  if (o.aggregate !== undefined) {
    aggregate = requireInRange('--aggregate', parseQuantity(o.aggregate, 'length', u, '--aggregate'), u === 'us' ? 0.25 : 5, u === 'us' ? 3 : 75, DISPLAY_UNITS[u].length);
  }
  const proposals = o.proposals === undefined ? 5 : Number(o.proposals);
  if (!Number.isInteger(proposals)) throw new PmError(ERROR_CODES.invalidValue, '--proposals', 'is not a whole number', { value: o.proposals, allowed: '0–20' });
  requireInRange('--proposals', proposals, 0, 20);
  if (proposals > 0) {
    const set = barSet(basis.barSet);
    const k = systemFactor('length', set.units, u);
    const sizes = set.sizes
      .map((s) => ({ name: s.name, diameter: s.diameter * k, area: s.area * k * k }))
      .filter((s) => s.diameter >= MIN_PRACTICAL_BAR[u] - 1e-9);
    const detailing: Detailing =
      section.cover !== undefined ? { kind: 'cover', cover: section.cover, tieDiameter: section.tieDiameter ?? 0 } : { kind: 'gamma', gamma: section.gamma };
    request.barSelection = { detailing, sizes, count: proposals, ...(aggregate !== undefined ? { aggregate } : {}) };
  }
  const rc: ResolvedCheck = { section, request, json: o.json === true, ...(o.report !== undefined ? { report: o.report } : {}), ...(aggregate !== undefined ? { aggregate } : {}) };
  const fx = resolveEffects(o, rc, o.loads === undefined);
  if (fx.slenderness || loads.some((l) => l.Muy !== undefined)) rc.effects = fx;
  return rc;
}

/** Resolves the flags and checks every load (no output). */
export function computeCheck(o: CheckOptions): { rc: ResolvedCheck; outcome: CheckOutcome } {
  const rc = resolveCheckOptions(o);
  if (rc.effects) applySlenderness(rc, rc.effects);
  const outcome = checkLoads(rc.request);
  if (rc.effects) finishEffects(rc, rc.effects, outcome);
  return { rc, outcome };
}

/**
 * Runs the command and returns what it prints; writes a .txt or .json report when asked. PDF and SVG
 * reports are drawn, which is asynchronous: `runCheckAsync` (what the CLI calls) writes every format.
 */
export function runCheck(o: CheckOptions): string {
  if (o.report !== undefined && isDrawn(o.report)) {
    throw new PmError(ERROR_CODES.invalidValue, '--report', 'is a drawn report; write PDF and SVG reports with runCheckAsync', { value: o.report });
  }
  const { rc, outcome } = computeCheck(o);
  if (rc.report !== undefined) {
    const body = extname(rc.report).toLowerCase() === '.json' ? checkJson(rc, outcome) : checkReportText(rc, outcome);
    writeAtomic(rc.report, body);
  }
  return rc.json ? checkJson(rc, outcome) : checkText(rc, outcome);
}

/** The command as the CLI runs it: every report format, the drawn ones through the lazily imported renderer. */
export async function runCheckAsync(o: CheckOptions): Promise<string> {
  if (o.report === undefined || !isDrawn(o.report)) return runCheck(o);
  const { rc, outcome } = computeCheck(o);
  const date = reportDate(o.date);
  const { writeCheckReport } = await import('../sheet/check-report-file.js');
  await writeCheckReport(rc.report!, {
    rc,
    outcome,
    assumptions: [...checkAssumptions(rc, outcome), ...outcome.notes],
    caution: CAUTION,
    date,
    ...(o.project !== undefined ? { project: o.project } : {}),
    ...(o.office !== undefined ? { office: o.office } : {}),
    generator: generatorLabel(),
  });
  return rc.json ? checkJson(rc, outcome) : checkText(rc, outcome);
}

/** Writes through a temporary file and a rename, so a failed run leaves no half-written file. */
export function writeAtomic(file: string, body: string): void {
  const tmp = `${file}.${process.pid}.tmp`;
  try {
    writeFileSync(tmp, body);
    renameSync(tmp, file);
  } catch (e) {
    rmSync(tmp, { force: true });
    throw new PmError(ERROR_CODES.io, '--report', `cannot be written (${(e as NodeJS.ErrnoException).code ?? 'error'})`, { value: file });
  }
}

// ───────────────────────────── output ─────────────────────────────

interface Units {
  force: string;
  moment: string;
  stress: string;
  length: string;
  area: string;
}

const unitsOf = (u: UnitSystem): Units => ({ ...DISPLAY_UNITS[u], area: u === 'us' ? 'in²' : 'mm²' });

/** Assumptions of the check itself, beside the basis notes. */
export function checkAssumptions(rc: ResolvedCheck, outcome: CheckOutcome): string[] {
  const b = rc.section.basis;
  const lim = outcome.limits;
  const out = [
    rc.effects?.slenderness
      ? `Slender column: Mu is the magnified moment (${rc.effects.loads[0]?.magnified?.x.method ?? 'basis method'}); every step is listed per load.`
      : `Short column: factored Pu and Mu are taken as given (slenderness effects are not added here).`,
    `Uniaxial bending about the axis across b; the moment sign is ignored (bars symmetric about the bending axis).`,
    `ρg required is solved exactly at the actual γ = ${fmt(rc.section.gamma, 4)} with the bars smeared in the chosen arrangement; the ${b.symbols.designFamily} curve includes the axial cap.`,
    `Chart readings emulate sheets at γ steps of ${outcome.chart.gammaStep} with curves at ρg ${outcome.chart.rhos.map((r) => fmt(r, 3)).join(', ')}: linear between curves along the load ray, linear in γ between sheets; the traditional reading takes the next lower sheet and the next curve out.`,
    `ρg limits ${fmt(lim.min, 3)}–${fmt(lim.max, 3)} of Ag at zero axial load; each load uses the basis's limits for its own axial force (the minimum grows with NEd in EN 1992-1-1 9.5.2(2)), chart readings included.`,
  ];
  if (rc.request.barSelection) {
    const d = rc.request.barSelection.detailing;
    out.push(
      d.kind === 'cover'
        ? `Bar proposals: one bar size each, centres at cover + tie + db/2 from the faces (γ recomputed per size); ${b.clearSpacingRule}; ${b.minimumBarRule}; sizes from ${barSet(b.barSet).source}, ${b.units === 'us' ? '#5' : '12 mm'} and up (common practice).`
        : `Bar proposals: γ was given, so bar centres stay at (1 − γ)·h/2 from the faces for every size and the cover is not checked; ${b.clearSpacingRule}; ${b.minimumBarRule}.`,
    );
    if (rc.aggregate === undefined) out.push('No maximum aggregate size given: the aggregate term of the spacing rule is not checked.');
  }
  out.push(...effectsAssumptions(rc.effects));
  return out;
}

/** The note column of a load's row, shared by the text table and the drawn report. */
export const statusText = (r: LoadResult): string =>
  [
    r.rhoStatus === 'not-possible' ? `not possible (ρg > ${fmt(r.strain.atRho, 3)})` : r.rhoStatus === 'minimum-governs' ? 'minimum' : r.governedBy === 'cap' ? 'cap' : '',
    r.Mdesign > Math.abs(r.Mu) ? 'M raised to minimum' : '',
  ]
    .filter(Boolean)
    .join('; ');

function table(headers: string[], rows: string[][]): string {
  // a loop, not Math.max(...rows): 200k rows overflow the call stack as spread arguments
  const w = headers.map((h, i) => rows.reduce((m, r) => Math.max(m, (r[i] ?? '').length), h.length));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(w[i]!) : c.padStart(w[i]!))).join('  ').trimEnd();
  return [line(headers), line(w.map((n) => '-'.repeat(n))), ...rows.map(line)].join('\n');
}

const f = (x: number | null | undefined, d = 4): string => (x === null || x === undefined ? '—' : Number.isFinite(x) ? fmt(x, d) : x > 0 ? '∞' : '—');

function sectionLine(rc: ResolvedCheck): string {
  const s = rc.section;
  const un = unitsOf(s.units);
  const dims = s.shape.kind === 'rectangle' ? `${fmt(s.shape.b)} × ${fmt(s.shape.h)} ${un.length}` : `D = ${fmt(s.shape.diameter)} ${un.length}`;
  return `${s.basis.title}, ${dims} ${s.basis.transverse}, ${s.arrangement.kind}, ${s.basis.symbols.concreteStrength} = ${fmt(s.basis.fc)} ${un.stress}, ${s.basis.symbols.steelStrength} = ${fmt(s.basis.fy)} ${un.stress}, γ = ${fmt(s.gamma, 4)} (${s.gammaSource})`;
}

function resultsTable(rc: ResolvedCheck, outcome: CheckOutcome): string {
  const u = rc.section.units;
  const un = unitsOf(u);
  const ap = rc.section.shape.kind === 'circle' ? 'Ag' : 'b·h';
  const ag = rc.section.shape.kind === 'circle' ? 'Ag·D' : 'b·h²';
  const withUtil = outcome.checked !== null;
  const headers = [
    'id',
    `Pu ${un.force}`,
    `Mu ${un.moment}`,
    `Pu/${ap}`,
    `Mu/${ag}`,
    'e/h',
    'ρg req',
    'ρg chart',
    'ρg rounded',
    `extra ${un.area}`,
    'εt',
    'φ',
    'class',
    ...(withUtil ? ['util'] : []),
    'note',
  ];
  const rows = outcome.results.map((r) => [
    (r.governing ? '* ' : '') + r.id,
    f(toDisplay(r.Pu, 'force', u), 5),
    f(toDisplay(r.Mu, 'moment', u), 5),
    f(r.normalised.P),
    f(r.normalised.M),
    f(r.normalised.eOverH, 3),
    f(r.rhoRequired),
    f(r.rhoFromChart),
    f(r.rhoRoundedDown, 3),
    f(r.extraSteelRoundedDown, 3),
    f(r.strain.epsT, 3),
    f(r.strain.phi, 3),
    r.strain.class,
    ...(withUtil ? [f(r.utilisation, 3)] : []),
    statusText(r),
  ]);
  return table(headers, rows);
}

function barsTable(rc: ResolvedCheck, outcome: CheckOutcome): string {
  const un = unitsOf(rc.section.units);
  if (outcome.bars.length === 0) return `Bar proposals: none (${outcome.barsSkipped ?? 'none found'}).`;
  const rows = outcome.bars.map((p) => [
    p.layout,
    f(p.area, 4),
    f(p.rho, 4),
    f(p.gamma, 4),
    `${f(p.clearSpacing, 3)} ≥ ${f(p.clearSpacingRequired, 3)}`,
    f(p.utilisation, 3),
    outcome.results.find((r) => r.index === p.governingLoad)?.id ?? '',
  ]);
  return table(['bars', `As ${un.area}`, 'ρg', 'γ', `clear ${un.length}`, 'util', 'by load'], rows);
}

export function checkText(rc: ResolvedCheck, outcome: CheckOutcome): string {
  const un = unitsOf(rc.section.units);
  const lines = [sectionLine(rc)];
  if (outcome.checked) lines.push(`Checked reinforcement: ${outcome.checked.description} (ρg = ${f(outcome.checked.rho)})`);
  lines.push(`Chart sheets read: γ = ${outcome.chart.lower}${outcome.chart.upper !== null ? ` and ${outcome.chart.upper}` : ''}`, '');
  lines.push(resultsTable(rc, outcome));
  lines.push(`* governing load. Normalised values in ${un.stress}; εt and φ at capacity along the load ray (${outcome.checked ? 'checked reinforcement' : 'at ρg required'}).`);
  const gov = outcome.results[0];
  if (gov && gov.extraSteelRoundedDown !== null && gov.extraSteelRoundedDown > 0) {
    lines.push(`Reading the next lower sheet and rounding up would cost ${f(gov.extraSteelRoundedDown, 3)} ${un.area} more steel than the exact ρg for ${gov.id}.`);
  }
  const fxText = effectsText(rc, rc.effects, outcome);
  if (fxText) lines.push('', fxText.trimEnd());
  lines.push('', barsTable(rc, outcome), '', CAUTION, '');
  return lines.join('\n');
}

/** Text report: inputs, assumptions and clauses, results, bars, caution. */
export function checkReportText(rc: ResolvedCheck, outcome: CheckOutcome): string {
  const b = rc.section.basis;
  const lines = [
    `pmchart column check — ${generatorLabel()}`,
    '',
    'INPUTS',
    `  ${sectionLine(rc)}`,
    `  loads: ${outcome.results.length} factored combination(s)`,
    ...Object.entries(b.parameters).map(([k, v]) => `  ${k} = ${v}`),
    '',
    'ASSUMPTIONS AND CODE CLAUSES',
    ...b.notes.map((n) => `  - ${n}`),
    ...checkAssumptions(rc, outcome).map((n) => `  - ${n}`),
    ...outcome.notes.map((n) => `  - ${n}`),
    '',
    'RESULTS (governing first)',
    ...checkText(rc, outcome)
      .split('\n')
      .slice(outcome.checked ? 4 : 3)
      .filter((l) => l !== CAUTION)
      .map((l) => (l ? `  ${l}` : l)),
    ...effectsReport(rc, rc.effects, outcome),
    'CAUTION',
    `  ${CAUTION}`,
    '',
  ];
  return lines.join('\n');
}

export function checkJson(rc: ResolvedCheck, outcome: CheckOutcome): string {
  const s = rc.section;
  const u = s.units;
  const un = unitsOf(u);
  const out = {
    generator: generatorLabel(),
    code: s.basis.code,
    codeTitle: s.basis.title,
    units: { system: u, force: un.force, moment: un.moment, stress: un.stress, length: un.length, area: un.area },
    section: {
      shape: s.shape,
      area: num(outcome.area),
      gamma: num(s.gamma),
      gammaSource: s.gammaSource,
      arrangement: s.arrangement,
      transverse: s.basis.transverse,
      fc: num(s.basis.fc),
      fy: num(s.basis.fy),
    },
    chart: { gammaStep: outcome.chart.gammaStep, sheets: [outcome.chart.lower, ...(outcome.chart.upper !== null ? [outcome.chart.upper] : [])], rhos: outcome.chart.rhos },
    rhoLimits: { min: num(outcome.limits.min), max: num(outcome.limits.max) },
    checked: outcome.checked,
    governing: outcome.governingId,
    results: outcome.results.map((r) => ({ ...resultJson(r, u), ...effectsJson(rc, rc.effects, r) })),
    bars: outcome.bars.map((p) => ({
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
      governingLoad: outcome.results.find((r) => r.index === p.governingLoad)?.id ?? null,
    })),
    barsNote: outcome.barsSkipped,
    basis: { parameters: s.basis.parameters, notes: s.basis.notes },
    assumptions: [...checkAssumptions(rc, outcome), ...outcome.notes],
    caution: CAUTION,
  };
  return JSON.stringify(out, null, 1) + '\n';
}

/** One result as JSON; later checks add their fields beside these. */
export function resultJson(r: LoadResult, u: UnitSystem) {
  return {
    id: r.id,
    Pu: num(toDisplay(r.Pu, 'force', u)),
    Mu: num(toDisplay(r.Mu, 'moment', u)),
    normalised: { P: num(r.normalised.P), M: num(r.normalised.M), eOverH: r.normalised.eOverH === null ? null : num(r.normalised.eOverH) },
    rhoRequired: r.rhoRequired === null ? null : num(r.rhoRequired),
    rhoStatus: r.rhoStatus,
    governedBy: r.governedBy,
    steelRequired: r.steelRequired === null ? null : num(r.steelRequired),
    rhoFromChart: r.rhoFromChart === null ? null : num(r.rhoFromChart),
    rhoRoundedDown: r.rhoRoundedDown,
    extraSteelRoundedDown: r.extraSteelRoundedDown === null ? null : num(r.extraSteelRoundedDown),
    chartSheets: r.chartSheets.map((sh) => ({ gamma: sh.gamma, rho: sh.rho === null ? null : num(sh.rho), roundedUp: sh.roundedUp, position: sh.position })),
    strain: { epsT: num(r.strain.epsT), phi: num(r.strain.phi), class: r.strain.class, cOverH: num(r.strain.cOverH), atRho: num(r.strain.atRho), capGoverns: r.strain.capGoverns },
    utilisation: r.utilisation === null ? null : num(r.utilisation),
    capacity: r.capacity === null ? null : { Pu: num(toDisplay(r.capacity.P, 'force', u)), Mu: num(toDisplay(r.capacity.M, 'moment', u)) },
    governing: r.governing,
    notes: r.notes,
  };
}

export function registerCheck(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  const cmd = program.command('check').description('check factored loads on a sized column: exact ρg required, chart readings, utilisation, bar proposals');
  addEffectsOptions(addSectionOptions(cmd))
    .option('--pu <force>', 'factored axial load, compression positive (default unit kip or kN)')
    .option('--mu <moment>', 'factored moment (default unit kip-ft or kN-m)')
    .option('--loads <file>', 'CSV of load combinations with columns id,Pu,Mu (tension negative Pu)')
    .option('--rho <ratio>', 'given ρg to check (utilisation)')
    .option('--aggregate <length>', 'maximum aggregate size, for the clear-spacing rule')
    .option('--chart-gamma-step <step>', 'γ step of the emulated chart sheets', '0.05')
    .option('--proposals <n>', 'how many bar layouts to propose (0 for none)', '5')
    .option('--json', 'print JSON instead of the table')
    .option('--report <file>', 'also write a report: .txt, .json, or a one-page calculation sheet as .pdf or .svg')
    .option('--project <text>', 'project name for the title block of a PDF/SVG report')
    .option('--office <text>', 'office name for the title block of a PDF/SVG report')
    .option('--date <yyyy-mm-dd>', 'date of a PDF/SVG report and its PDF metadata (default SOURCE_DATE_EPOCH, else today)')
    .action((opts: CheckOptions) => run(async () => void process.stdout.write(await runCheckAsync(opts))));
}
