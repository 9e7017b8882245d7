/**
 * The built CLI for the tests that must spawn it (the smoke file, heap caps, signals, worker pools, the
 * installed package): `requireFreshBuild()` throws, so the test fails loudly rather than skips, when a
 * file `npm run build` writes is missing or older than the newest file under src/.
 */
import { existsSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { join } from 'node:path';

export const root = realpathSync(new URL('../../', import.meta.url).pathname);
export const bin = join(root, 'bin', 'pmchart.js');
/** What `npm run build` writes and the package needs at run time. */
export const BUILT = ['dist/index.js', 'dist/bundle/pmchart.js', 'dist/bundle/worker.js', 'dist/bundle/schedule-worker.js', 'dist/page/browser.js'];

/** The newest modification time of any file under `dir`. */
export function newest(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newest(p) : statSync(p).mtimeMs);
  }
  return t;
}

/** Throws, naming what is wrong, unless dist/ holds every built file and none is older than src/. */
export function requireFreshBuild(): void {
  const missing = BUILT.filter((f) => !existsSync(join(root, f)));
  if (missing.length) throw new Error(`dist/ is incomplete (${missing.join(', ')}); run \`npm run build\` before this test`);
  const built = Math.min(...BUILT.map((f) => statSync(join(root, f)).mtimeMs));
  if (newest(join(root, 'src')) > built) throw new Error('dist/ is older than src/ (a file under src/ changed after the build); run `npm run build` before this test');
}
