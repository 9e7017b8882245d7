/**
 * `pmchart page --out FILE.html [section flags]`: writes the live chart page, one self-contained HTML file
 * that works from file:// with no network. The flags preset the page's inputs (the names of
 * `pmchart sheet` and `pmchart check`) and are checked here as those commands check them.
 */
import { readInputText } from '../io/read.js';
import { extname, resolve } from 'node:path';
import type { Command } from 'commander';
import { ERROR_CODES, PmError } from '../errors.js';
import { reportDate } from './format.js';
import { MAX_LOADS_BYTES, parseDecimal } from '../input/limits.js';
import { checkTitleFlags } from '../input/flags.js';
import { parseLoadsCsv } from './check.js';
import { BASIS_IDS, designCode } from '../codes/registry.js';
import { isUnitSystem } from '../units/index.js';
import { addSectionOptions } from './section-flags.js';
import { sheetSetFromFlags, type SheetOptions } from './sheet.js';
import { CAUTION, resolveTableOptions } from './table.js';

export interface PageOptions extends SheetOptions {
  out?: string;
  grid?: string;
  pu?: string;
  mu?: string;
  muy?: string;
  loads?: string;
}

/** Option keys that are not page inputs. */
const NOT_FIELDS = new Set(['out', 'grid', 'date', 'loads', 'paper', 'portrait', 'office', 'project']);

/** Writes the page; returns the path written. */
export async function runPage(o: PageOptions): Promise<string> {
  const out = resolve(o.out ?? 'column-charts.html');
  if (extname(out).toLowerCase() !== '.html') throw new PmError(ERROR_CODES.invalidValue, '--out', 'must end in .html', { value: o.out });
  const grid = o.grid === undefined ? 0.05 : (parseDecimal(o.grid) ?? NaN);
  if (grid !== 0.05 && grid !== 0.1) throw new PmError(ERROR_CODES.invalidValue, '--grid', 'is not one of the allowed values', { value: o.grid, allowed: '0.05, 0.1' });
  const date = reportDate(o.date);
  checkTitleFlags(o);
  const { checkFileTarget } = await import('../io/files.js');
  checkFileTarget(out, '--out');
  const fields: Record<string, string | boolean> = {};
  for (const [k, v] of Object.entries(o)) if (!NOT_FIELDS.has(k) && v !== undefined) fields[k] = v as string | boolean;
  // presets are checked as `pmchart table`/`sheet` check them, when they describe a whole section
  if (o.fc !== undefined && o.fy !== undefined && (o.gamma !== undefined || o.cover !== undefined)) {
    resolveTableOptions({ ...o, format: 'json' });
    await sheetSetFromFlags({ ...o, date });
  }
  if (o.rho !== undefined || o.omega !== undefined) {
    fields.ratioKind = o.omega !== undefined ? 'omega' : 'rho';
    fields.ratios = (o.omega ?? o.rho)!;
    delete fields.rho;
    delete fields.omega;
  }
  if (o.loads !== undefined) {
    const text = readInputText(o.loads, MAX_LOADS_BYTES, '--loads');
    const units = o.units ?? designCode(o.code ?? BASIS_IDS[0]!).unitSystems[0]!;
    if (isUnitSystem(units)) parseLoadsCsv(text, units);
    fields.loads = text;
  }
  const { bundlePage, pageHtml } = await import('../page/build.js');
  const { writeFileAtomic } = await import('../sheet/files.js');
  const html = pageHtml(bundlePage(), { fields, grid, date }, CAUTION);
  writeFileAtomic(out, html, '--out');
  return out;
}

export function registerPage(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  const cmd = program.command('page').description('the live chart page: one offline HTML file that computes in the browser (flags preset its inputs)');
  addSectionOptions(cmd)
    .option('--rho <list>', 'ρg values: start:stop:step or a comma list (default 0.01:0.08:0.01)')
    .option('--omega <list>', 'instead of --rho: mechanical ratios ω, start:stop:step or a comma list')
    .option('--families <which>', 'design, nominal or both')
    .option('--dimensionless', 'divide by the normalising stress (f′c, or fcd for EN 1992-1-1)')
    .option('--eccentricities <list>', 'e/h of the radial lines (default 0.1,0.25,0.5,1)')
    .option('--pu <force>', 'a factored axial load to show (needs --b/--h or --diameter)')
    .option('--mu <moment>', 'its factored moment')
    .option('--muy <moment>', 'its moment about y')
    .option('--loads <file>', 'a load CSV (id,Pu,Mu[,Muy]) to show, as `pmchart check --loads` reads')
    .option('--grid <step>', 'γ step of the bracketing print sheets, 0.05 or 0.1', '0.05')
    .option('--date <yyyy-mm-dd>', 'date on the chart title block (default SOURCE_DATE_EPOCH, else today)')
    .option('--out <file>', 'output file (.html)', 'column-charts.html')
    .action((opts: PageOptions) =>
      run(async () => {
        process.stdout.write(`${await runPage(opts)}\n`);
      }),
    );
}
