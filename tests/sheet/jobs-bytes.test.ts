/**
 * `--jobs` must not change the bytes (README promise; issue 14 found the first sheet of a chunk
 * inherited the vega views of the sheets the process drew before). 17 sheets (two biaxial) in chunks of 5, made
 * with 1, 2 and 3 processes: the same book.pdf and the same SVG files.
 */
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { makeChartSet } from '../../src/sheet/pipeline.js';
import { referenceSet } from '../helpers/chart-set.js';

const set = referenceSet({
  rhoG: [0.01, 0.04],
  outputs: { pdf: true, svg: true, tables: false },
  sheets: [
    { fc: 4, fy: [60, 75, 80], gamma: [0.7, 0.75, 0.8, 0.85, 0.9], arrangement: { kind: 'two-faces', barsPerFace: 3 } },
    // biaxial sheets (issue 15), drawn after P–M sheets by the same process: 7 levels on sheets 16 (4 levels) and 17 (3)
    { fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'four-faces', barsPerFace: 3 }, chart: 'biaxial', axialLevels: { from: 0, to: 0.6, step: 0.1 } },
  ],
});

describe('bytes do not depend on --jobs', () => {
  it('1, 2 and 3 render processes give the same book and sheets for a set of four chunks', async () => {
    const tmp = mkdtempSync(join(tmpdir(), 'pmchart-jobs-'));
    const dirs: string[] = [];
    for (const jobs of [1, 2, 3]) dirs.push((await makeChartSet(set, { outDir: join(tmp, `j${jobs}`), generator: 'pmchart 0.1.0', jobs, chunkSize: 5, onNote: () => {} })).dir);
    expect(set.sheets.length).toBe(17);
    const [one, ...others] = dirs.map((d) => ({
      book: readFileSync(join(d, 'book.pdf')),
      svgs: readdirSync(join(d, 'sheets')).sort().map((f) => [f, readFileSync(join(d, 'sheets', f), 'utf8')]),
    }));
    for (const o of others) {
      expect(o.svgs).toEqual(one!.svgs);
      expect(o.book.equals(one!.book)).toBe(true);
    }
  }, 300_000);
});
