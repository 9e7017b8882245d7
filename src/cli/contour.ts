/**
 * `pmchart contour`: the factored Mx–My contour of the actual section at one axial load, as CSV or JSON,
 * or plotted (SVG or PDF by the --out extension, render modules imported lazily).
 * CSV columns (stable interface): na_angle_deg,na_depth,eps_t,phi,P,Mx,My — forces and moments in the
 * system's display units (kip, kip-ft / kN, kN·m), named in the JSON header.
 */
import { renameSync, rmSync, writeFileSync } from 'node:fs';
import { extname } from 'node:path';
import type { Command } from 'commander';
import { contourAtAxial, momentUtilisationAtAxial, squashPoint, type BiaxialSection } from '../analysis/biaxial.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { DISPLAY_UNITS, parseQuantity, toDisplay } from '../units/index.js';
import { generatorLabel } from '../version.js';
import { actualBars, biaxialSectionOf } from './actual-bars.js';
import { csvLine, num, reportDate } from './format.js';
import { addSectionOptions, resolveSectionFlags, type SectionFlags } from './section-flags.js';
import { CAUTION } from './table.js';
import { wrap, type TextRow } from '../chart/sheet-data.js';
import { TEXT_STYLES, type TextStyle } from '../chart/style.js';
import { PLOT_CONTOUR_POINTS } from './contour-plot.js';

export const CONTOUR_COLUMNS = ['na_angle_deg', 'na_depth', 'eps_t', 'phi', 'P', 'Mx', 'My'] as const;

export const PLOT_FORMATS = ['.svg', '.pdf'] as const;

export interface ContourOptions extends SectionFlags {
  pu?: string;
  /** load point to mark on a plot: Mux (bends the depth h) and Muy */
  mu?: string;
  muy?: string;
  date?: string;
  project?: string;
  rho?: string;
  points?: string;
  format?: string;
  out?: string;
}

const isPlot = (out: string | undefined): boolean => out !== undefined && (PLOT_FORMATS as readonly string[]).includes(extname(out).toLowerCase());

/** Flags → section, bars and the axial load, checked (shared by the text and plot outputs). */
function resolveContour(o: ContourOptions) {
  const section = resolveSectionFlags(o, true);
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
  return { section, Pu, count, bars, sec };
}

/** Runs the command and returns the text it prints or writes (tests call this without the parser). */
export function runContour(o: ContourOptions): string {
  if (isPlot(o.out)) throw new PmError(ERROR_CODES.invalidValue, '--out', 'is a plot; plots are written by runContourPlot', { value: o.out });
  const format = o.format ?? 'csv';
  if (format !== 'csv' && format !== 'json') throw new PmError(ERROR_CODES.invalidValue, '--format', 'is not one of the allowed values', { value: format, allowed: 'csv, json' });
  const { section, Pu, count, bars, sec } = resolveContour(o);
  const u = section.units;
  const du = DISPLAY_UNITS[u];
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
      rmSync(tmp, { force: true });
      throw new PmError(ERROR_CODES.io, '--out', `cannot be written (${(e as NodeJS.ErrnoException).code ?? (e as Error).message.split('\n')[0]})`, { value: o.out });
    }
    return '';
  }
  return text;
}

/**
 * Writes the contour plot (SVG or PDF by the --out extension) and returns the path. A page of its own:
 * letter landscape for US units, A4 landscape for SI; the plot square on the left, the section, the load,
 * the conventions, the basis notes and the caution on the right.
 */
export async function runContourPlot(o: ContourOptions): Promise<string> {
  const out = o.out ?? '';
  const kind = extname(out).toLowerCase();
  if (!isPlot(out)) throw new PmError(ERROR_CODES.invalidValue, '--out', 'must end in .svg or .pdf for a plot', { value: o.out, allowed: PLOT_FORMATS.join(', ') });
  const date = reportDate(o.date);
  const { section, Pu, bars, sec } = resolveContour(o);
  const u = section.units;
  const Mux = o.mu === undefined ? undefined : parseQuantity(o.mu, 'moment', u, '--mu');
  const Muy = o.muy === undefined ? undefined : parseQuantity(o.muy, 'moment', u, '--muy');
  const loads = Mux !== undefined || Muy !== undefined ? [{ id: 'load', Mux: Mux ?? 0, Muy: Muy ?? 0, governing: true }] : [];
  const { contourPlot } = await import('./contour-plot.js');
  const { contourSpec } = await import('../chart/contour-spec.js');
  const [W, H] = u === 'us' ? [792, 612] : [841.89, 595.28];
  const uu = Math.min(W, H) / 100 + 0.8;
  const m = 3.2 * uu;
  const top = m + 6.4 * uu;
  const side = Math.min(H - top - m - 5.6 * uu, 0.6 * W);
  const plot = { x: m + 6.6 * uu, y: top, w: side, h: side };
  const texts = contourPageTexts(o, section, sec, Pu, bars.source, loads, date, { W, H, u: uu, m, plot });
  const spec = contourSpec(contourPlot(sec, Pu, loads, u, { page: { w: W, h: H }, plot, u: uu, texts }));
  const { SheetRenderer } = await import('../render/renderer.js');
  const { writeFileAtomic } = await import('../sheet/files.js');
  const renderer = await SheetRenderer.create();
  try {
    if (kind === '.svg') writeFileAtomic(out, await renderer.specSvg(spec));
    else {
      const pdf = renderer.pdfPages();
      await pdf.addSpec(spec, W, H);
      const { fixPdfMetadata } = await import('../sheet/book.js');
      const title = `Mx–My contour at Pu = ${fmtNum(toDisplay(Pu, 'force', u))} ${DISPLAY_UNITS[u].force}`;
      writeFileAtomic(out, await fixPdfMetadata(pdf.toBuffer(), { title, date, generator: generatorLabel(), subject: section.basis.title }));
    }
  } finally {
    renderer.finalize();
  }
  return out;
}

const fmtNum = (x: number, d = 4): string => String(Number(x.toPrecision(d)));

function contourPageTexts(
  o: ContourOptions,
  section: ReturnType<typeof resolveSectionFlags>,
  sec: BiaxialSection,
  Pu: number,
  steel: string,
  loads: { Mux: number; Muy: number }[],
  date: string,
  g: { W: number; H: number; u: number; m: number; plot: { x: number; y: number; w: number; h: number } },
): TextRow[] {
  const { u, m, plot } = g;
  const b = section.basis;
  const un = DISPLAY_UNITS[section.units];
  const rows: TextRow[] = [];
  const put = (style: TextStyle, x: number, y: number, text: string) => rows.push({ style, x: Math.round((x - plot.x) * 100) / 100, y: Math.round((y - plot.y) * 100) / 100, text, z: rows.length });
  const size = (style: TextStyle) => TEXT_STYLES[style].size * u;
  const P = `${fmtNum(toDisplay(Pu, 'force', section.units))} ${un.force}`;
  put('sheetTitle', m, m + 2.2 * u, `Mx–My contour at Pu = ${P}`);
  put('body', m, m + 4.0 * u, `${b.symbols.designFamily} capacity of the actual section and bars at the design axial load · ${b.title}`);
  const x0 = plot.x + plot.w + 3.4 * u;
  const w = g.W - m - x0;
  let y = plot.y + 0.6 * u;
  const para = (style: TextStyle, text: string, gap = 1.36) => {
    for (const line of wrap(text, w, size(style))) {
      put(style, x0, y, line);
      y += size(style) * gap;
    }
  };
  const heading = (t: string) => {
    y += 0.5 * u;
    put('heading', x0, y, t);
    y += 1.5 * u;
  };
  const s = section.shape;
  heading('Section');
  para('body', `${s.kind === 'rectangle' ? `${fmtNum(s.b)} × ${fmtNum(s.h)} ${un.length}` : `D = ${fmtNum(s.diameter)} ${un.length}`} ${b.transverse}, ${section.arrangement.kind}, γ = ${fmtNum(section.gamma)}`);
  para('body', `f′c = ${fmtNum(b.fc)} ${un.stress}, fy = ${fmtNum(b.fy)} ${un.stress}; steel ${steel} (Ast = ${fmtNum(sec.steelArea)} ${section.units === 'us' ? 'in²' : 'mm²'})`);
  heading('Load');
  if (loads.length === 0) para('body', `Pu = ${P}; no moments given (--mu, --muy mark a load point).`);
  for (const l of loads) {
    const util = momentUtilisationAtAxial(sec, Pu, l.Mux, l.Muy);
    const M = (x: number) => `${fmtNum(toDisplay(x, 'moment', section.units))} ${un.moment}`;
    para('body', `Pu = ${P}, Mux = ${M(l.Mux)}, Muy = ${M(l.Muy)} (red diamond).`);
    para('valueBold', `Moment utilisation at Pu (exact): ${Number.isFinite(util) ? fmtNum(util, 3) : '—'}`);
  }
  heading('Conventions');
  para('body', 'x runs across the width b, y along the depth h. Mx bends the depth h (the chart plane), My bends the width b. Both axes share one scale, so the contour keeps its true shape.');
  para('body', `Each point is the ${b.symbols.designFamily} moment pair of one neutral-axis angle (${PLOT_CONTOUR_POINTS} over a full turn) with the depth set so that P = Pu; the axial cap is checked for Pu.`);
  heading(`Basis: ${b.title}`);
  for (const n of b.notes) para('body', `• ${n}`, 1.3);
  y = Math.max(y + 0.8 * u, g.H - m - 5.2 * u);
  para('caution', CAUTION, 1.3);
  put('caption', m, g.H - m, `${generatorLabel()} · ${date}${o.project ? ` · ${o.project}` : ''}`);
  return rows;
}

export function registerContour(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  const cmd = program.command('contour').description('factored Mx–My contour of the actual section at one axial load (CSV or JSON; SVG or PDF plot by the --out extension)');
  addSectionOptions(cmd)
    .option('--pu <force>', 'design axial load, compression positive (default unit kip or kN)')
    .option('--mu <moment>', 'Mux of a load point to mark on the plot (default unit kip-ft or kN-m)')
    .option('--muy <moment>', 'Muy of a load point to mark on the plot')
    .option('--project <text>', 'project name for the plot page')
    .option('--date <yyyy-mm-dd>', 'date for the plot page and PDF metadata (default SOURCE_DATE_EPOCH, else today)')
    .option('--rho <value>', 'ρg of the section (or give --bar to use the arrangement’s bars)')
    .option('--points <n>', 'neutral-axis angles over a full turn (8–3600)', '72')
    .option('--format <fmt>', 'csv or json', 'csv')
    .option('--out <file>', 'write to a file instead of standard output; .svg or .pdf writes the plot')
    .action((opts: ContourOptions) =>
      run(async () => {
        if (isPlot(opts.out)) process.stdout.write(`${await runContourPlot(opts)}\n`);
        else process.stdout.write(runContour(opts));
      }),
    );
}
