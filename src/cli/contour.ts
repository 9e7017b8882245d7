/**
 * `pmchart contour`: the factored Mx–My contour of the actual section at one axial load, as CSV or JSON,
 * or plotted (SVG or PDF by the --out extension, render modules imported lazily).
 * CSV columns (stable interface): na_angle_deg,na_depth,eps_t,phi,P,Mx,My — forces and moments in the
 * system's display units (kip, kip-ft / kN, kN·m), named in the JSON header.
 */
import { parseDecimal } from '../input/limits.js';
import { extname } from 'node:path';
import type { Command } from 'commander';
import { squashPoint } from '../analysis/biaxial.js';
import { checkFileTarget, writeFileAtomic } from '../io/files.js';
import { checkTitleFlags } from '../input/flags.js';
import { contourText } from '../report/contour-view.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { DISPLAY_UNITS, parseQuantity, toDisplay } from '../units/index.js';
import { generatorLabel } from '../version.js';
import { actualBars, biaxialSectionOf } from './actual-bars.js';
import { num, reportDate } from './format.js';
import { addSectionOptions, resolveSectionFlags, type SectionFlags } from './section-flags.js';

export { CONTOUR_COLUMNS } from '../report/contour-view.js';

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
  const count = o.points === undefined ? 72 : (parseDecimal(o.points) ?? NaN);
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
  if (o.out) checkFileTarget(o.out, '--out');
  const { section, Pu, count, bars, sec } = resolveContour(o);
  const text = contourText(format, { sec, Pu, count, units: section.units, shape: section.shape, arrangement: section.arrangement, gamma: section.gamma, ...(section.gammaB !== undefined ? { gammaB: section.gammaB } : {}), steel: bars.source, steelArea: bars.steelArea, rhoG: bars.rhoG }, generatorLabel());
  if (o.out) {
    writeFileAtomic(o.out, text, '--out');
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
  checkTitleFlags(o);
  checkFileTarget(out, '--out');
  const { section, Pu, bars, sec } = resolveContour(o);
  const u = section.units;
  const Mux = o.mu === undefined ? undefined : parseQuantity(o.mu, 'moment', u, '--mu');
  const Muy = o.muy === undefined ? undefined : parseQuantity(o.muy, 'moment', u, '--muy');
  const loads = Mux !== undefined || Muy !== undefined ? [{ id: 'load', Mux: Mux ?? 0, Muy: Muy ?? 0, governing: true }] : [];
  const { contourPage } = await import('../chart/contour-page.js');
  const { spec, W, H, title } = contourPage({ sec, units: u, shape: section.shape, arrangement: section.arrangement, gamma: section.gamma, ...(section.gammaB !== undefined ? { gammaB: section.gammaB } : {}), Pu, steel: bars.source, loads, date, ...(o.project !== undefined ? { project: o.project } : {}) });
  const { SheetRenderer } = await import('../render/renderer.js');
  const { writeFileAtomic } = await import('../sheet/files.js');
  const renderer = await SheetRenderer.create();
  try {
    if (kind === '.svg') writeFileAtomic(out, await renderer.specSvg(spec), '--out');
    else {
      const pdf = renderer.pdfPages();
      await pdf.addSpec(spec, W, H);
      const { fixPdfMetadata } = await import('../sheet/book.js');
      writeFileAtomic(out, await fixPdfMetadata(pdf, { title, date, generator: generatorLabel(), subject: section.basis.title }), '--out');
    }
  } finally {
    renderer.finalize();
  }
  return out;
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
