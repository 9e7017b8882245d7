/**
 * `pmchart sheet <section flags>`: one sheet for a quick look, as SVG, PNG or PDF (from the --out
 * extension). Same section flags as `pmchart table`; render modules are imported lazily.
 */
import { extname, resolve } from 'node:path';
import type { Command } from 'commander';
import { ERROR_CODES, PmError } from '../errors.js';
import { addSectionOptions } from '../flags/section-flags.js';
import { sheetSetFromFlags, type SheetOptions } from '../flags/sheet-flags.js';
import { addOfficeOptions, resolveOfficeFlags, withOfficeSection } from '../flags/office-flags.js';
export * from '../flags/sheet-flags.js';

/** Writes the sheet; returns the path written. */
export async function runSheet(o: SheetOptions): Promise<string> {
  const out = resolve(o.out ?? 'sheet.pdf');
  const kind = extname(out).toLowerCase();
  if (!['.svg', '.png', '.pdf'].includes(kind)) throw new PmError(ERROR_CODES.invalidValue, '--out', 'must end in .svg, .png or .pdf', { value: o.out });
  const { checkFileTarget } = await import('../io/files.js');
  checkFileTarget(out, '--out');
  // the office file under the flags: title block, logo, and units, basis code and paper where no flag gives them
  const office = resolveOfficeFlags(o);
  const { set, capContext } = await sheetSetFromFlags(withOfficeSection(o, office.file), office);
  const { checkLogo } = await import('../sheet/logo.js');
  await checkLogo(set.titleBlock.logo, o.logo !== undefined ? '--logo' : '--office-file logo');
  const { renderSheet } = await import('../sheet/render-sheet.js');
  const { writeFileAtomic } = await import('../sheet/files.js');
  writeFileAtomic(out, await renderSheet(set, 1, kind.slice(1) as 'svg' | 'png' | 'pdf', { capContext }), '--out');
  return out;
}

export function registerSheet(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  const cmd = program.command('sheet').description('one chart sheet from section flags, for a quick look (SVG, PNG or PDF by the --out extension)');
  addSectionOptions(cmd)
    .option('--rho <list>', 'ρg values: start:stop:step or a comma list (default 0.01:0.08:0.01)')
    .option('--omega <list>', 'instead of --rho: mechanical ratios ω = As·fyd/(Ac·fcd), start:stop:step or a comma list')
    .option('--families <which>', 'design, nominal or both', 'design')
    .option('--dimensionless', 'divide by the normalising stress (f′c, or fcd for EN 1992-1-1)')
    .option('--eccentricities <list>', 'e/h of the radial lines (default 0.1,0.25,0.5,1)')
    .option('--paper <size>', 'a4, a3, letter or tabloid (default tabloid for US units, a3 for SI)')
    .option('--portrait', 'portrait instead of landscape')
    .option('--office <text>', 'office name for the title block')
    .option('--project <text>', 'project name for the title block')
    .option('--date <yyyy-mm-dd>', 'date for the title block and PDF metadata (default SOURCE_DATE_EPOCH, else today)');
  addOfficeOptions(cmd, 'the sheet')
    .option('--out <file>', 'output file: .svg, .png or .pdf', 'sheet.pdf')
    .action((opts: SheetOptions) =>
      run(async () => {
        process.stdout.write(`${await runSheet(opts)}\n`);
      }),
    );
}
