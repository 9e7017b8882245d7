/**
 * `pmchart set <file> [--out DIR]`: a chart set from charts-config/*.json → out/<set-name>/ with
 * book.pdf, sheets/*.svg|png and tables/*.csv|json. Render modules are imported lazily so other
 * commands never load vega, canvas or pdf-lib.
 */
import { dirname } from 'node:path';
import { nodeFileAccess, readInputText } from '../io/read.js';
import type { Command } from 'commander';
import { ERROR_CODES, PmError } from '../errors.js';
import { MAX_CONFIG_BYTES } from '../input/limits.js';
import { generatorLabel } from '../version.js';

export interface SetOptions {
  out?: string;
  jobs?: string;
  /** show a progress bar or lines on stderr (default true) */
  progress?: boolean;
}

export interface SetResult {
  dir: string;
  sheets: number;
  book?: string;
  warnings: string[];
}

export async function runSet(file: string, o: SetOptions = {}, stderr: NodeJS.WriteStream = process.stderr): Promise<SetResult> {
  const text = readInputText(file, MAX_CONFIG_BYTES, file);
  const { readChartSetReport } = await import('../config/read.js');
  const { set, warnings } = readChartSetReport(text, { source: file, files: nodeFileAccess, baseDir: dirname(file), ...(process.env.SOURCE_DATE_EPOCH ? { sourceDateEpoch: process.env.SOURCE_DATE_EPOCH } : {}) });
  for (const w of warnings) stderr.write(`pmchart: warning: ${w}\n`);

  let jobs: number | undefined;
  if (o.jobs !== undefined) {
    // decimal digits only: Number("0x2") is 2, Number("") is 0
    jobs = /^\s*\d{1,3}\s*$/.test(o.jobs) ? Number(o.jobs) : NaN;
    if (!Number.isInteger(jobs) || jobs < 1 || jobs > 64) throw new PmError(ERROR_CODES.outOfRange, '--jobs', 'is outside 1–64', { value: o.jobs, allowed: '1–64' });
  }
  const progress = o.progress === false ? undefined : await makeProgress(stderr, set.sheets.length, set.name);
  const { makeChartSet } = await import('../sheet/pipeline.js');
  try {
    const made = await makeChartSet(set, {
      outDir: o.out ?? 'out',
      generator: generatorLabel(),
      ...(jobs !== undefined ? { jobs } : {}),
      ...(progress ? { onSheet: progress.tick } : {}),
    });
    progress?.stop();
    return { dir: made.dir, sheets: made.sheets, ...(made.book ? { book: made.book } : {}), warnings };
  } catch (e) {
    progress?.stop();
    throw e;
  }
}

/** A bar with count and ETA on a terminal (cli-progress); a few plain lines otherwise. */
async function makeProgress(stderr: NodeJS.WriteStream, total: number, name: string): Promise<{ tick: (done: number) => void; stop: () => void }> {
  if (stderr.isTTY) {
    const { SingleBar, Presets } = (await import('cli-progress')).default;
    const bar = new SingleBar({ format: `${name} |{bar}| {value}/{total} sheets · ETA {eta_formatted}`, stream: stderr, hideCursor: true }, Presets.shades_classic);
    bar.start(total, 0);
    return { tick: (d) => bar.update(d), stop: () => bar.stop() };
  }
  const every = Math.max(1, Math.ceil(total / 20));
  return {
    tick: (d) => {
      if (d % every === 0 || d === total) stderr.write(`pmchart: ${name}: ${d}/${total} sheets\n`);
    },
    stop: () => {},
  };
}

export function registerSet(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  program
    .command('set')
    .description('a chart set (charts-config/*.json) → out/<set-name>/: book.pdf, sheets/, tables/')
    .argument('<file>', 'chart-set JSON file (schema: charts-config/chart-set.schema.json)')
    .option('--out <dir>', 'parent folder for the set folder', 'out')
    .option('--jobs <n>', 'processes rendering sheets (default: cores, at most 4)')
    .option('--no-progress', 'no progress output on stderr')
    .action((file: string, opts: SetOptions) =>
      run(async () => {
        const r = await runSet(file, opts);
        process.stdout.write(`${r.dir}: ${r.sheets} sheet${r.sheets === 1 ? '' : 's'}${r.book ? `, ${r.book}` : ''}\n`);
      }),
    );
}
