/**
 * `pmchart check` beyond the uniaxial short column: a moment about y (`--muy`, a `Muy` load column)
 * checked by three biaxial methods, and slenderness (`--klu` …) whose magnified moments feed every check.
 * Stable JSON per result: `biaxial: {exact, reciprocalLoad, loadContour}` (utilisations) and, with
 * slenderness inputs, `slenderness: {neglected, delta, magnifiedMoment}`.
 */
import type { Command } from 'commander';
import type { CheckOutcome, LoadResult } from '../design/check.js';
import type { BiaxialResult } from '../design/biaxial.js';
import { biaxialFor, biaxialSectionFor, magnifyLoad, type AxisMember, type MagnifiedLoad, type SlendernessRequest } from '../design/column-effects.js';
import { EI_OPTIONS, isEiOption, type SlendernessResult } from '../design/slenderness.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { layoutBars } from '../section/arrangements.js';
import { grossArea } from '../section/geometry.js';
import type { Bar } from '../section/types.js';
import { DISPLAY_UNITS, parseQuantity, toDisplay, type UnitSystem } from '../units/index.js';
import { fmt, num } from './format.js';
import type { ResolvedCheck } from './check.js';

export interface EffectsFlags {
  muy?: string;
  klu?: string;
  kluY?: string;
  m1?: string;
  m2?: string;
  m1Y?: string;
  m2Y?: string;
  betaDns?: string;
  eiOption?: string;
  transverseLoads?: boolean;
  creep?: string;
}

export interface LoadEffects {
  /** first-order moments as given */
  firstOrder: { Mux: number; Muy: number };
  magnified: MagnifiedLoad | null;
  biaxial: BiaxialResult | null;
}

export interface CheckEffects {
  slenderness: SlendernessRequest | null;
  /** actual bars of the checked reinforcement (null when none is given) */
  bars: Bar[] | null;
  /** by load index */
  loads: LoadEffects[];
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
    .option('--beta-dns <ratio>', 'ACI 318-19 6.6.4.4.4 βdns, sustained ÷ total factored axial load, 0–1 (required with --klu for ACI)')
    .option('--ei-option <a|b|c>', 'ACI 318-19 6.6.4.4.4 (EI)eff option', 'a')
    .option('--transverse-loads', 'transverse loads between supports: Cm = 1.0 (ACI 318-19 6.6.4.5.3(b))')
    .option('--creep <ratio>', 'EN 1992-1-1 5.8.4 effective creep ratio φef', '0');
}

const plain = (path: string, text: string, lo: number, hi: number): number => {
  const v = Number(text);
  if (!Number.isFinite(v)) throw new PmError(ERROR_CODES.invalidValue, path, 'is not a number', { value: text, allowed: `${lo}–${hi}` });
  return requireInRange(path, v, lo, hi);
};

/** Reads the flags into the loads (single-load values) and the member data. Call before `checkLoads`. */
export function resolveEffects(o: EffectsFlags, rc: ResolvedCheck, single: boolean): CheckEffects {
  const u = rc.section.units;
  const loads = rc.request.loads;
  if (o.muy !== undefined) {
    if (!single) throw new PmError(ERROR_CODES.conflict, '--muy', 'applies to --pu/--mu; give a Muy column in --loads instead');
    loads[0]!.Muy = parseQuantity(o.muy, 'moment', u, '--muy');
  }
  const lengthRange: [number, number] = u === 'us' ? [12, 1200] : [300, 30000];
  const len = (path: string, text: string) => requireInRange(path, parseQuantity(text, 'length', u, path), lengthRange[0], lengthRange[1], DISPLAY_UNITS[u].length);
  let slenderness: SlendernessRequest | null = null;
  const anyMember = [o.kluY, o.m1, o.m2, o.m1Y, o.m2Y].some((v) => v !== undefined);
  if (o.klu === undefined && anyMember) throw new PmError(ERROR_CODES.missing, '--klu', 'is required with the other slenderness flags (an effective length)');
  if (o.klu !== undefined) {
    const ei = o.eiOption ?? 'a';
    if (!isEiOption(ei)) throw new PmError(ERROR_CODES.invalidValue, '--ei-option', 'is not one of the allowed values', { value: ei, allowed: EI_OPTIONS.join(', ') });
    const member = (l: number): AxisMember => ({
      effectiveLength: l,
      ...(o.betaDns !== undefined ? { betaDns: plain('--beta-dns', o.betaDns, 0, 1) } : {}),
      eiOption: ei,
      transverseLoads: o.transverseLoads === true,
      creepRatio: plain('--creep', o.creep ?? '0', 0, 5),
    });
    if (o.betaDns === undefined && rc.section.basis.slendernessMethod === 'moment-magnification-aci318') {
      throw new PmError(ERROR_CODES.missing, '--beta-dns', 'is required with --klu (ACI 318-19 6.6.4.4.4: sustained ÷ total factored axial load, 0–1)');
    }
    slenderness = { x: member(len('--klu', o.klu)), ...(o.kluY !== undefined ? { y: member(len('--klu-y', o.kluY)) } : {}) };
    const moment = (path: string, t: string | undefined) => (t === undefined ? undefined : parseQuantity(t, 'moment', u, path));
    if (single) {
      const l = loads[0]!;
      const m1 = moment('--m1', o.m1);
      const m2 = moment('--m2', o.m2);
      const m1y = moment('--m1-y', o.m1Y);
      const m2y = moment('--m2-y', o.m2Y);
      if (m1 !== undefined) l.M1 = m1;
      if (m2 !== undefined) l.M2 = m2;
      if (m1y !== undefined) l.M1y = m1y;
      if (m2y !== undefined) l.M2y = m2y;
    } else if (anyMember && [o.m1, o.m2, o.m1Y, o.m2Y].some((v) => v !== undefined)) {
      throw new PmError(ERROR_CODES.conflict, '--m1/--m2', 'apply to --pu/--mu; give M1, M2 (M1y, M2y) columns in --loads instead');
    }
  }
  const bars = checkedBars(rc);
  if (slenderness && (slenderness.x.eiOption ?? 'a') !== 'a' && bars === null) {
    throw new PmError(ERROR_CODES.missing, '--ei-option', `${slenderness.x.eiOption} needs the reinforcement: give --rho or a bar layout (option a needs none)`);
  }
  return { slenderness, bars, loads: [] };
}

/** The actual bars of a given ρg or bar layout, as the check places them. */
function checkedBars(rc: ResolvedCheck): Bar[] | null {
  const r = rc.request;
  if (r.layout) return layoutBars(r.shape, r.layout.arrangement, r.layout.area, { gamma: r.layout.gamma });
  if (r.rho !== undefined) return layoutBars(r.shape, r.arrangement, r.rho * grossArea(r.shape), { gamma: r.gamma });
  return null;
}

/** Magnifies each load's moments in place (the magnified moments feed the check). */
export function applySlenderness(rc: ResolvedCheck, fx: CheckEffects): void {
  const { basis } = rc.section;
  const shape = rc.request.shape;
  // option (a) needs no bars; (b) and (c) were checked to have them
  const bars = fx.bars ?? [];
  fx.loads = rc.request.loads.map((l) => {
    const firstOrder = { Mux: l.Mu, Muy: l.Muy ?? 0 };
    if (!fx.slenderness) return { firstOrder, magnified: null, biaxial: null };
    const m = magnifyLoad(basis, shape, bars, { Pu: l.Pu, Mux: l.Mu, Muy: l.Muy ?? 0, ...pick(l) }, fx.slenderness);
    l.Mu = m.Mux;
    if (l.Muy !== undefined || m.y) l.Muy = m.Muy;
    return { firstOrder, magnified: m, biaxial: null };
  });
}

const pick = (l: { M1?: number; M2?: number; M1y?: number; M2y?: number }) => ({
  ...(l.M1 !== undefined ? { M1: l.M1 } : {}),
  ...(l.M2 !== undefined ? { M2: l.M2 } : {}),
  ...(l.M1y !== undefined ? { M1y: l.M1y } : {}),
  ...(l.M2y !== undefined ? { M2y: l.M2y } : {}),
});

/** After `checkLoads`: the biaxial check of each load on the checked reinforcement; governing load by the exact utilisation. */
export function finishEffects(rc: ResolvedCheck, fx: CheckEffects, outcome: CheckOutcome): void {
  for (const r of outcome.results) {
    const m = fx.loads[r.index]?.magnified;
    for (const [axis, s] of [['x', m?.x], ['y', m?.y]] as const) if (s && !s.ok) r.notes.push(`slenderness about ${axis}: ${shortWarning(s)}`);
  }
  if (fx.bars) {
    const sec = biaxialSectionFor(rc.section.basis, rc.request.shape, fx.bars, rc.section.capContext);
    rc.request.loads.forEach((l, i) => {
      fx.loads[i]!.biaxial = biaxialFor(sec, l.Pu, l.Mu, l.Muy ?? 0);
    });
    const key = (r: LoadResult) => Math.max(r.utilisation ?? 0, fx.loads[r.index]!.biaxial!.exact.utilisation);
    outcome.results.sort((a, b) => key(b) - key(a) || a.index - b.index);
    outcome.results.forEach((r, k) => (r.governing = k === 0));
    outcome.governingId = outcome.results[0]?.id ?? null;
  }
}

const disp = (x: number, kind: 'force' | 'moment', u: UnitSystem) => num(toDisplay(x, kind, u));

function slenderJson(s: SlendernessResult, u: UnitSystem) {
  return {
    neglected: s.neglected,
    delta: num(s.delta),
    magnifiedMoment: disp(s.magnifiedMoment, 'moment', u),
    firstOrderMoment: disp(s.firstOrderMoment, 'moment', u),
    ok: s.ok,
    method: s.method,
    warnings: s.warnings,
    steps: s.steps.map((st) => ({ label: st.label, value: typeof st.value === 'number' ? num(st.value) : st.value, ...(st.unit ? { unit: st.unit } : {}) })),
  };
}

/** The fields this module adds to one JSON result. */
export function effectsJson(rc: ResolvedCheck, fx: CheckEffects | undefined, r: LoadResult) {
  if (!fx) return {};
  const u = rc.section.units;
  const e = fx.loads[r.index];
  if (!e) return {};
  const out: Record<string, unknown> = { Muy: disp(rc.request.loads[r.index]!.Muy ?? 0, 'moment', u) };
  if (e.magnified) {
    out.slenderness = { ...slenderJson(e.magnified.x, u), ...(e.magnified.y ? { y: slenderJson(e.magnified.y, u) } : {}) };
  }
  const b = e.biaxial;
  out.biaxial = b
    ? {
        exact: num(b.exact.utilisation),
        reciprocalLoad: num(b.reciprocalLoad.utilisation),
        loadContour: num(b.loadContour.utilisation),
        details: {
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
        },
      }
    : null;
  return out;
}

const f = (x: number | null | undefined, d = 4): string => (x === null || x === undefined ? '—' : Number.isFinite(x) ? fmt(x, d) : x > 0 ? '∞' : '—');

function table(headers: string[], rows: string[][]): string {
  // a loop, not Math.max(...rows): 200k rows overflow the call stack as spread arguments
  const w = headers.map((h, i) => rows.reduce((m, r) => Math.max(m, (r[i] ?? '').length), h.length));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(w[i]!) : c.padStart(w[i]!))).join('  ').trimEnd();
  return [line(headers), line(w.map((n) => '-'.repeat(n))), ...rows.map(line)].join('\n');
}

const shortWarning = (s: SlendernessResult): string =>
  s.ok ? '' : s.delta === Infinity ? 'unstable: Pu ≥ 0.75·Pc' : 'over 1.4 × first-order (6.2.5.3)';

/** Tables for the readable output: slenderness per axis, then the biaxial methods side by side. */
export function effectsText(rc: ResolvedCheck, fx: CheckEffects | undefined, outcome: CheckOutcome): string {
  if (!fx) return '';
  const u = rc.section.units;
  const un = DISPLAY_UNITS[u];
  const M = (x: number) => f(toDisplay(x, 'moment', u), 5);
  const parts: string[] = [];
  if (fx.slenderness) {
    const rows: string[][] = [];
    for (const r of outcome.results) {
      const e = fx.loads[r.index]!;
      for (const [axis, s] of [['x', e.magnified!.x], ['y', e.magnified!.y]] as const) {
        if (!s) continue;
        const st = (p: string) => s.steps.find((x) => x.label.startsWith(p))?.value;
        rows.push([
          r.id,
          axis,
          f(st('kℓu/r') as number ?? (st('λ = l0/i') as number), 3),
          f(st('limit') as number ?? (st('λlim') as number), 3),
          s.neglected ? 'yes' : 'no',
          f(s.delta, 4),
          M(s.firstOrderMoment),
          M(s.magnifiedMoment),
          s.ok ? '' : shortWarning(s),
        ]);
      }
    }
    parts.push(`Slenderness (${outcome.results[0] ? (fx.loads[outcome.results[0].index]!.magnified!.x.method) : ''}):`);
    parts.push(table(['id', 'axis', 'slenderness', 'limit', 'neglected', 'δ', `M2 ${un.moment}`, `Mc ${un.moment}`, 'note'], rows));
  }
  if (fx.bars) {
    const rows = outcome.results.map((r) => {
      const l = rc.request.loads[r.index]!;
      const b = fx.loads[r.index]!.biaxial!;
      return [
        (r.governing ? '* ' : '') + r.id,
        f(toDisplay(l.Pu, 'force', u), 5),
        M(l.Mu),
        M(l.Muy ?? 0),
        f(b.exact.utilisation, 3),
        f(b.exact.neutralAxisAngleDeg, 3),
        f(b.reciprocalLoad.utilisation, 3),
        b.reciprocalLoad.method,
        f(b.loadContour.utilisation, 3),
        f(b.loadContour.alpha, 3),
        f(b.exact.momentUtilisation, 3),
        f(b.loadContour.momentScale, 3),
      ];
    });
    parts.push('Biaxial (checked reinforcement, actual bars; > 1 fails). exact: along the load ray in (P, Mx, My); reciprocal: Pu/Pn (or the linear moment sum);');
    parts.push('contour: left-hand side (Mux/Mxo)^α + (Muy/Myo)^α. The M@Pu columns compare moments at fixed Pu: exact, and the contour value^(1/α).');
    parts.push(table(['id', `Pu ${un.force}`, `Mux ${un.moment}`, `Muy ${un.moment}`, 'exact', 'NA angle°', 'reciprocal', 'method', 'contour', 'α', 'exact M@Pu', 'contour M@Pu'], rows));
  } else if (rc.request.loads.some((l) => (l.Muy ?? 0) !== 0)) {
    parts.push('Muy given without a checked reinforcement: give --rho or a bar layout for the biaxial check (ρg required above is for Mux alone).');
  }
  return parts.length ? parts.join('\n') + '\n' : '';
}

/** Every slenderness step and the biaxial method details, for the report. */
export function effectsReport(rc: ResolvedCheck, fx: CheckEffects | undefined, outcome: CheckOutcome): string[] {
  if (!fx) return [];
  const u = rc.section.units;
  const lines: string[] = [];
  if (fx.slenderness) {
    lines.push('SLENDERNESS STEPS (internal units as labelled)');
    for (const r of outcome.results) {
      const e = fx.loads[r.index]!.magnified!;
      for (const [axis, s] of [['x', e.x], ['y', e.y]] as const) {
        if (!s) continue;
        lines.push(`  ${r.id}, bending about ${axis}: ${s.method}`);
        for (const st of s.steps) lines.push(`    ${st.label} = ${typeof st.value === 'number' ? f(st.value, 5) : String(st.value)}${st.unit ? ` ${st.unit}` : ''}`);
        for (const w of s.warnings) lines.push(`    WARNING: ${w}`);
      }
    }
    lines.push('');
  }
  if (fx.bars) {
    lines.push('BIAXIAL METHODS');
    for (const r of outcome.results) {
      const b = fx.loads[r.index]!.biaxial!;
      const F = (x: number) => f(toDisplay(x, 'force', u), 5);
      const M = (x: number) => f(toDisplay(x, 'moment', u), 5);
      lines.push(
        `  ${r.id}: exact ${f(b.exact.utilisation, 4)} (neutral axis ${f(b.exact.neutralAxisAngleDeg, 4)}°, depth ${f(b.exact.neutralAxisDepth, 4)}, εt = ${f(b.exact.epsT, 3)}, φ = ${f(b.exact.phi, 3)}${b.exact.capGoverns ? ', axial cap governs' : ''})`,
        `    reciprocal load: Pnx = ${F(b.reciprocalLoad.Pnx)}, Pny = ${F(b.reciprocalLoad.Pny)}, Po = ${F(b.reciprocalLoad.Po)}, Pn = ${F(b.reciprocalLoad.Pn)} (0.1·f′c·Ag = ${F(b.reciprocalLoad.validityLimit)}) → ${b.reciprocalLoad.method} ${f(b.reciprocalLoad.utilisation, 4)}; ${b.reciprocalLoad.note}`,
        `    load contour: Mnox = ${M(b.loadContour.Mnox)}, Mnoy = ${M(b.loadContour.Mnoy)} at Pu, α = ${f(b.loadContour.alpha, 3)} (${b.loadContour.alphaSource}) → ${f(b.loadContour.utilisation, 4)}; moments may scale by 1/${f(b.loadContour.momentScale, 4)} at fixed Pu (exact: 1/${f(b.exact.momentUtilisation, 4)})`,
      );
    }
    lines.push('');
  }
  return lines;
}

/** Assumptions the effects add to the check's list. */
export function effectsAssumptions(fx: CheckEffects | undefined): string[] {
  if (!fx) return [];
  const out: string[] = [];
  if (fx.slenderness) {
    out.push(
      'Slenderness: each axis magnified separately for its own member data (non-sway); M2 defaults to |Mu| about the axis and M1 to −M2 (single curvature, Cm = 1.0) unless given; the magnified moments feed the uniaxial and biaxial checks.',
    );
  }
  if (fx.bars) {
    out.push(
      'Biaxial: exact capacity of the actual bars under an inclined neutral axis along the load ray in (P, Mx, My); reciprocal load 1/Pn = 1/Pnx + 1/Pny − 1/Po where Pn ≥ 0.1·f′c·Ag (factored values), else the linear moment sum at Pu; load contour (Mx/Mxo)^α + (My/Myo)^α with the basis’s exponent.',
    );
  }
  return out;
}
