/**
 * Start reading here: how a chart set becomes files.
 *
 *   config file ──1──▶ resolved set ──2──▶ curves ──3──▶ chart spec ──4──▶ bytes ──5──▶ files
 *   (src/config)       ResolvedChartSet    CurveFamily    vega-lite JSON    SVG/PNG/PDF    out/<set>/
 *                      read.ts             curves.ts      src/chart          src/render     files.ts, book.ts
 *
 * 1. The caller reads and resolves the config (src/config/read.ts) — defaults, units, rule checks.
 * 2–4. Sheets are made in fixed-size chunks (render-chunk.ts), in this process or in child
 *      processes (worker.ts); each chunk writes its tables, SVG and PNG files and returns its PDF
 *      pages as content streams with the glyphs they use.
 * 5. The binder (book.ts) writes those pages behind a cover and index with each font once, adds the
 *    outline and the fixed metadata. Everything is made in a staging folder that replaces
 *    out/<set-name>/ at the end.
 */
import type { ChildProcess } from 'node:child_process';
import { mkdirSync, rmSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { dirname, extname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ResolvedChartSet } from '../config/types.js';
import { runInChildren } from '../io/child-pool.js';
import { SheetRenderer } from '../render/renderer.js';
import type { PageContent } from '../render/pdf-canvas.js';
import { bindBook, perSheetBasis } from './book.js';
import { checkLogo, logoRef } from './logo.js';
import { basisForSheet, groupExtents } from './curves.js';
import { primaryFamily } from '../chart/sheet-data.js';
import { checkTarget, ioError, recoverStale, swapInFolder, writeFileAtomic } from './files.js';
import { chunksOf, type ChunkTask } from './render-chunk.js';
import { renderChunk } from './render-chunk.js';
import type { WorkerMessage } from './worker.js';

export interface MakeSetOptions {
  /** parent folder; the set goes to <outDir>/<set.name>/ (default "out") */
  outDir?: string;
  /** processes rendering sheets (default: available cores, at most 4; 1 renders in this process) */
  jobs?: number;
  /** called after every sheet */
  onSheet?: (done: number, total: number) => void;
  /** e.g. "pmchart 0.1.0" */
  generator: string;
  /** sheets per chunk PDF (default CHUNK_SIZE); the book's bytes depend on it, not on `jobs` */
  chunkSize?: number;
  /** notes about stale folders cleaned up or restored (default: one line each on stderr) */
  onNote?: (text: string) => void;
}

export interface MadeSet {
  dir: string;
  sheets: number;
  book?: string;
  files: { sheets: number; tables: number };
  /** peak resident memory of this process and of the largest child, MB */
  peakRssMb: number;
}

/** Makes every output of a resolved chart set. */
export async function makeChartSet(set: ResolvedChartSet, opts: MakeSetOptions): Promise<MadeSet> {
  const target = resolve(opts.outDir ?? 'out', set.name);
  const staging = `${target}.partial-${process.pid}`;
  // 0. the place: a folder or nothing at the target; leftovers of killed runs cleaned or put back
  checkTarget(target);
  // a logo that cannot be drawn is the user's to fix (exit 2), before any sheet is drawn
  await checkLogo(set.titleBlock.logo);
  for (const note of recoverStale(target)) (opts.onNote ?? ((t: string) => process.stderr.write(`pmchart: ${t}\n`)))(note);
  try {
    rmSync(staging, { recursive: true, force: true });
    mkdirSync(staging, { recursive: true });
  } catch (e) {
    throw ioError(staging, e);
  }
  const children = new Set<ChildProcess>();
  const stopOnSignal = (signal: NodeJS.Signals) => {
    for (const c of children) c.kill('SIGTERM');
    rmSync(staging, { recursive: true, force: true });
    process.stderr.write(`pmchart: stopped by ${signal}; removed ${staging}\n`);
    process.exit(signal === 'SIGINT' ? 130 : 143);
  };
  process.on('SIGINT', stopOnSignal);
  process.on('SIGTERM', stopOnSignal);
  try {
    // 2–4: curves → spec → bytes, chunk by chunk
    const tasks = chunksOf(set, staging, opts.generator, opts.chunkSize, groupExtents(set));
    let done = 0;
    const tick = () => opts.onSheet?.(++done, set.sheets.length);
    const jobs = Math.max(1, Math.min(opts.jobs ?? Math.min(4, availableParallelism()), tasks.length));
    const childRss = { kb: 0 };
    const chunks = jobs === 1 ? await renderHere(tasks, tick) : await renderInChildren(tasks, jobs, tick, childRss, children);

    // 5: bind the book
    let book: string | undefined;
    if (set.outputs.pdf) {
      const bases = set.sheets.map((s) => basisForSheet(set, s));
      const basis = bases[0]!;
      const sy = basis.symbols;
      const design = primaryFamily(set) === 'design';
      const logo = set.titleBlock.logo ? await logoRef(set.titleBlock.logo) : undefined;
      const bytes = await bindBook({
        set,
        pages: chunks.flatMap((c) => c ?? []),
        generator: opts.generator,
        basisTitle: basis.title,
        symbols: sy,
        // every sheet's own basis: a mixed set (basisOptions per group, α2 or fcd by strength) is described per group
        ...perSheetBasis(set, bases, design),
        ...(logo ? { logoPng: Buffer.from(logo.raster.slice(logo.raster.indexOf(',') + 1), 'base64') } : {}),
      });
      writeFileAtomic(join(staging, 'book.pdf'), bytes);
      book = join(target, 'book.pdf');
    }
    swapInFolder(staging, target);
    const o = set.outputs;
    return {
      dir: target,
      sheets: set.sheets.length,
      ...(book ? { book } : {}),
      files: { sheets: set.sheets.length * ((o.svg ? 1 : 0) + (o.png ? 1 : 0)), tables: o.tables ? 2 * set.sheets.length : 0 },
      peakRssMb: Math.max(process.resourceUsage().maxRSS, childRss.kb) / 1024,
    };
  } catch (e) {
    rmSync(staging, { recursive: true, force: true });
    throw e;
  } finally {
    process.off('SIGINT', stopOnSignal);
    process.off('SIGTERM', stopOnSignal);
  }
}

async function renderHere(tasks: ChunkTask[], tick: () => void): Promise<(PageContent[] | undefined)[]> {
  const renderer = await SheetRenderer.create();
  try {
    const out: (PageContent[] | undefined)[] = [];
    for (const t of tasks) out.push(await renderChunk(t, renderer, tick));
    return out;
  } finally {
    renderer.finalize();
  }
}

/**
 * Chunks handed to `jobs` child processes as they become free (node-canvas cannot run in worker
 * threads). Any child that fails or stops stops the others: the caller then removes the staging folder.
 */
function renderInChildren(tasks: ChunkTask[], jobs: number, tick: () => void, rss: { kb: number }, live: Set<ChildProcess>): Promise<(PageContent[] | undefined)[]> {
  const here = fileURLToPath(import.meta.url);
  return runInChildren<ChunkTask, WorkerMessage, PageContent[] | undefined>({
    workerPath: join(dirname(here), `worker${extname(here)}`),
    tasks,
    jobs,
    taskMessage: (task) => ({ type: 'task', task }),
    result: (m) => {
      rss.kb = Math.max(rss.kb, m.maxRssKb);
      return { chunk: m.chunk, value: m.pages };
    },
    onProgress: (m) => {
      if (m.type === 'sheet') tick();
    },
    live,
    label: 'render process',
    failure: { path: '', exitCode: 1 },
    keepErrorPath: false,
  });
}
