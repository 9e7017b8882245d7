/**
 * Failure and recovery of `pmchart set` (issue 14): a failing write or rename, a render process
 * that dies, a killed parent, SIGTERM, a file where the set folder goes, stale folders of killed
 * runs, and standard output on a full device. Each time the previous book is intact and nothing is
 * left behind. Faults are injected by test-only means (CI runs as root, which ignores read-only
 * permissions): `node:fs` is mocked here (tests/helpers/fs-faults.mjs), the child pool is handed a test-only
 * render worker that kills itself (tests/helpers/crashing-render-worker.ts), and a spawned CLI loads the
 * fs faults with `node --import`. Shipped code reads no switch for any of them.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, openSync, readdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import type * as ChildPool from '../../src/io/child-pool.js';
import { makeChartSet } from '../../src/sheet/pipeline.js';
import { bin, requireFreshBuild } from '../helpers/built.js';
import { referenceSet } from '../helpers/chart-set.js';
import { clearFaults, faults } from '../helpers/fs-faults.mjs';

const crash = vi.hoisted(() => ({ worker: false }));
vi.mock('node:fs', async (importOriginal) => (await import('../helpers/fs-faults.mjs')).faultyFs(await importOriginal<typeof import('node:fs')>()));
// the child pool runs the test-only worker that kills itself on chunk 2, when a test asks for it
vi.mock('../../src/io/child-pool.js', async (importOriginal) => {
  const real = await importOriginal<typeof ChildPool>();
  const crashing = new URL('../helpers/crashing-render-worker.ts', import.meta.url).pathname;
  return { ...real, runInChildren: ((o) => real.runInChildren(crash.worker ? { ...o, workerPath: crashing } : o)) as typeof real.runInChildren };
});
const preload = new URL('../helpers/fs-faults-preload.mjs', import.meta.url).pathname;

const set = referenceSet({
  rhoG: [0.01, 0.04],
  outputs: { pdf: true, tables: true },
  sheets: [{ fc: 4, fy: 60, gamma: [0.7, 0.8, 0.9], arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
});
const generator = 'pmchart 0.1.0';
const root = mkdtempSync(join(tmpdir(), 'pmchart-faults-'));
const notes: string[] = [];
type Failure = { message: string; exitCode: number };
const failure = (p: Promise<unknown>): Promise<Failure> => p.then(() => ({ message: 'no error', exitCode: 0 }), (x: unknown) => x as Failure);
const make = (outDir: string, extra: { jobs?: number; chunkSize?: number } = {}) => makeChartSet(set, { outDir, generator, jobs: 1, onNote: (n) => notes.push(n), ...extra });

let n = 0;
/** A folder holding a finished set; returns its folder and the book's bytes. */
async function withBook(): Promise<{ out: string; target: string; book: Buffer }> {
  const out = join(root, `run-${++n}`);
  const made = await make(out);
  return { out, target: made.dir, book: readFileSync(join(made.dir, 'book.pdf')) };
}
const intact = (r: { out: string; target: string; book: Buffer }) => {
  expect(readFileSync(join(r.target, 'book.pdf')).equals(r.book)).toBe(true);
  expect(readdirSync(r.out)).toEqual(['reference']);
  expect(readdirSync(r.target, { recursive: true }).filter((f) => /\.tmp$|\.chunk-/.test(String(f)))).toEqual([]);
};

afterEach(() => {
  clearFaults();
  crash.worker = false;
  notes.length = 0;
});

describe('faults inside the run', () => {
  it('a write that fails (ENOSPC on book.pdf): exit 3, one line, previous book intact', async () => {
    const r = await withBook();
    faults.write = 'book.pdf';
    const e = await failure(make(r.out));
    expect(e.message).toMatch(/book\.pdf: cannot be written \(ENOSPC\)$/);
    expect(e.exitCode).toBe(3);
    intact(r);
  }, 60_000);
  it('a rename that fails during the swap: the previous set is put back', async () => {
    const r = await withBook();
    faults.swapRename = true;
    const e = await failure(make(r.out));
    expect(e.message).toMatch(/reference: cannot be written \(EIO\)$/);
    expect(e.exitCode).toBe(3);
    intact(r);
  }, 60_000);
  it('a render process that dies after its sibling finished: one line, exit 1, others stopped, staging removed', async () => {
    const r = await withBook();
    crash.worker = true;
    const e = await failure(make(r.out, { jobs: 2, chunkSize: 1 }));
    expect(e.message).toMatch(/^render process [12] stopped \(SIGKILL\)$/);
    expect(e.exitCode).toBe(1);
    intact(r);
  }, 60_000);
});

describe('the place the set goes', () => {
  it('a file at out/<set-name> is an error and is not touched', async () => {
    const out = join(root, 'file-target');
    mkdirSync(out);
    writeFileSync(join(out, 'reference'), 'my notes');
    const e = await failure(make(out));
    expect(e.message).toMatch(/reference: exists and is not a folder/);
    expect(e.exitCode).toBe(2);
    expect(readFileSync(join(out, 'reference'), 'utf8')).toBe('my notes');
    expect(readdirSync(out)).toEqual(['reference']);
  });
  it('--out naming a file: exit 2 naming --out', async () => {
    const file = join(root, 'plain-file');
    writeFileSync(file, 'x');
    const e = await failure(make(file));
    expect(e.message).toBe(`--out: ${file} is a file, not a folder`);
    expect(e.exitCode).toBe(2);
  });
  it('stale folders of a killed run: .partial removed, a lone .old put back, each with a note', async () => {
    const r = await withBook();
    const dead = 2 ** 22 + 12345; // above the usual pid_max of 4194304: no such process
    renameSync(r.target, `${r.target}.old-${dead}`);
    mkdirSync(`${r.target}.partial-${dead}`);
    writeFileSync(join(`${r.target}.partial-${dead}`, 'half.svg'), '<svg');
    faults.write = 'book.pdf';
    await make(r.out).catch(() => undefined);
    expect(notes.some((t) => t.startsWith(`restored ${r.target} from reference.old-${dead}`))).toBe(true);
    expect(notes.some((t) => t.startsWith(`removed ${r.target}.partial-${dead}`))).toBe(true);
    intact(r);
  }, 60_000);
});

describe('signals and devices (the built CLI)', () => {
  const setFile = join(root, 'set.json');
  beforeAll(() => {
    requireFreshBuild(); // these run bin/pmchart.js: fail loudly on a missing or stale dist/
    writeFileSync(
      setFile,
      JSON.stringify({
        name: 'signals',
        titleBlock: { office: 'Fenwick Hollow Engineers (invented)', project: 'Test Bay Annex (invented)', date: '2026-01-05' },
        units: 'us',
        basis: { code: 'aci318-19' },
        rhoG: [0.01, 0.04],
        outputs: { pdf: true, svg: true, tables: true },
        sheets: [{ fc: [4, 5], fy: [60, 75], gamma: [0.7, 0.75, 0.8, 0.85, 0.9], arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
      }),
    );
  });
  const workers = (mark: string): number[] =>
    readdirSync('/proc')
      .filter((p) => /^\d+$/.test(p))
      .filter((p) => {
        try {
          return readFileSync(`/proc/${p}/environ`, 'utf8').includes(`PMCHART_TEST_MARK=${mark}`);
        } catch {
          return false;
        }
      })
      .map(Number);
  const until = async (ok: () => boolean, ms = 60_000) => {
    for (let t = 0; t < ms && !ok(); t += 100) await new Promise((r) => setTimeout(r, 100));
    return ok();
  };

  for (const signal of ['SIGTERM', 'SIGINT', 'SIGKILL'] as const) {
    it(`${signal} to the parent mid-set stops the render processes; ${signal === 'SIGKILL' ? 'the next run cleans up' : 'staging removed'}`, async () => {
      const out = join(root, `sig-${signal}`);
      const mark = `${signal}-${process.pid}`;
      const first = spawnSync(process.execPath, [bin, 'set', setFile, '--out', out, '--no-progress', '--jobs', '2'], { encoding: 'utf8' });
      expect(first.status, first.stderr).toBe(0);
      const book = readFileSync(join(out, 'signals', 'book.pdf'));
      const child = spawn(process.execPath, [bin, 'set', setFile, '--out', out, '--no-progress', '--jobs', '2'], { env: { ...process.env, PMCHART_TEST_MARK: mark }, stdio: ['ignore', 'ignore', 'pipe'] });
      let stderr = '';
      child.stderr.on('data', (d) => (stderr += String(d)));
      // wait until the render processes have written into the staging folder
      expect(await until(() => readdirSync(out).some((f) => f.startsWith('signals.partial-') && existsSync(join(out, f, 'tables'))))).toBe(true);
      const exited = new Promise<number | null>((r) => child.once('exit', (code, sig) => r(code ?? (sig ? 128 : null))));
      child.kill(signal);
      const code = await exited;
      expect(await until(() => workers(mark).length === 0, 20_000)).toBe(true);
      if (signal === 'SIGKILL') {
        const next = spawnSync(process.execPath, [bin, 'set', setFile, '--out', out, '--no-progress', '--jobs', '1'], { encoding: 'utf8' });
        expect(next.status, next.stderr).toBe(0);
        expect(next.stderr).toMatch(/^pmchart: removed .*signals\.partial-\d+, left by a run that stopped/m);
      } else {
        expect(code).toBe(signal === 'SIGINT' ? 130 : 143);
        expect(stderr).toMatch(new RegExp(`^pmchart: stopped by ${signal}; removed .*signals\\.partial-\\d+\\n$`));
      }
      expect(readdirSync(out)).toEqual(['signals']);
      expect(readFileSync(join(out, 'signals', 'book.pdf')).equals(book)).toBe(true);
    }, 240_000);
  }

  it('a kill between the two renames of the swap: the next run restores the set', async () => {
    const out = join(root, 'swap-kill');
    expect(spawnSync(process.execPath, [bin, 'set', setFile, '--out', out, '--no-progress', '--jobs', '1'], { encoding: 'utf8' }).status).toBe(0);
    const book = readFileSync(join(out, 'signals', 'book.pdf'));
    const child = spawn(process.execPath, ['--import', preload, bin, 'set', setFile, '--out', out, '--no-progress', '--jobs', '1'], { env: { ...process.env, TEST_FS_FAULTS: JSON.stringify({ swapPauseMs: 60_000 }) }, stdio: 'ignore' });
    expect(await until(() => readdirSync(out).some((f) => f.startsWith('signals.old-')), 120_000)).toBe(true);
    child.kill('SIGKILL');
    await new Promise((r) => child.once('exit', r));
    expect(existsSync(join(out, 'signals'))).toBe(false);
    const next = spawnSync(process.execPath, ['--import', preload, bin, 'set', setFile, '--out', out, '--no-progress', '--jobs', '1'], { encoding: 'utf8', env: { ...process.env, TEST_FS_FAULTS: JSON.stringify({ write: 'book.pdf' }) } });
    expect(next.stderr).toMatch(/^pmchart: restored .*signals from signals\.old-\d+/m);
    expect(next.status).toBe(3);
    expect(readdirSync(out)).toEqual(['signals']);
    expect(readFileSync(join(out, 'signals', 'book.pdf')).equals(book)).toBe(true);
  }, 240_000);

  it('standard output on a full device (/dev/full): one line, exit 3, no stack trace', () => {
    const fd = openSync('/dev/full', 'w');
    const r = spawnSync(process.execPath, [bin, 'table', '--fc', '4', '--fy', '60', '--gamma', '0.8'], { stdio: ['ignore', fd, 'pipe'], encoding: 'utf8' });
    expect(r.stderr).toBe('pmchart: standard output cannot be written (ENOSPC)\n');
    expect(r.status).toBe(3);
  });
  it('a closed pipe (EPIPE) ends quietly with exit 0', () => {
    const r = spawnSync('bash', ['-c', `"${process.execPath}" "${bin}" table --fc 4 --fy 60 --gamma 0.8 --rho 0.01:0.08:0.001 | head -1 >/dev/null; echo "\${PIPESTATUS[0]}"`], { encoding: 'utf8' });
    expect(r.stdout.trim()).toBe('0');
    expect(r.stderr).toBe('');
  });
});
