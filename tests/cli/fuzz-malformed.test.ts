/**
 * Fuzzing with malformed input (issue 14): ≥ 2,000 generated bad flags, chart-set files, load CSV
 * files and custom-bar files, each run in-process through `main` (the entry bin/pmchart.js calls).
 * Each gives exit 2 and exactly one line on stderr naming the place (the flag, field path or CSV
 * line), and no stack trace. Fixed seed in CI; FC_RANDOM=1 explores new seeds.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/run-cli.js';

const dir = mkdtempSync(join(tmpdir(), 'pmchart-fuzz-'));
let files = 0;
const file = (ext: string, text: string) => {
  const p = join(dir, `f${++files}.${ext}`);
  writeFileSync(p, text);
  return p;
};
const RUNS = 520;

/** One line, exit 2, naming `place`, no stack trace. */
async function expectOneLine(args: string[], place: string | RegExp): Promise<void> {
  const r = await runCli(args);
  const lines = r.stderr.split('\n').filter((l) => l !== '');
  expect(lines, r.stderr).toHaveLength(1);
  expect(r.stderr).not.toMatch(/internal error|\n\s+at /);
  if (typeof place === 'string') expect(lines[0]!.startsWith(`pmchart: ${place}`), `${lines[0]} should name ${place}`).toBe(true);
  else expect(lines[0]).toMatch(place);
  expect(r.code, r.stderr).toBe(2);
}

const junk = fc.oneof(
  fc.constantFrom('', ' ', 'abc', '0x1', '0b1', '1e999', '-1e999', 'Infinity', 'NaN', '1,5', '..5', '1e', '--', '½', '١٢', '4 4', '4ksi ksi', '\u0000'),
  fc.string({ minLength: 65, maxLength: 300 }),
  fc.stringMatching(/^[a-z%$@!]{1,8}$/),
);
const outside = (lo: number, hi: number) => fc.oneof(fc.double({ min: hi * 1.001 + 1e-6, max: 1e12, noNaN: true }), fc.double({ min: -1e12, max: lo - Math.max(1e-6, Math.abs(lo) * 1e-3), noNaN: true }));
const numText = (x: number) => String(x);

describe('malformed flags', () => {
  const base = { '--fc': '4', '--fy': '60', '--gamma': '0.8', '--rho': '0.02', '--bars-per-face': '3' };
  const cases = fc.oneof(
    fc.record({ flag: fc.constant('--gamma'), value: fc.oneof(junk, outside(0.3, 0.95).map(numText)) }),
    fc.record({ flag: fc.constantFrom('--fc', '--fy'), value: fc.oneof(junk, fc.double({ min: 1e4, max: 1e9, noNaN: true }).map(numText), fc.constantFrom('4in', '60kip', '4kN-m', '-4', '0')) }),
    fc.record({ flag: fc.constant('--bars-per-face'), value: fc.oneof(junk, fc.integer({ min: 21, max: 1e6 }).map(String), fc.constantFrom('0', '2.5', '-3')) }),
    fc.record({ flag: fc.constant('--rho'), value: fc.oneof(fc.constantFrom('0.05,0.01', '0.02,0.02', '0.2', '0', 'a,b', '0.001:0.1:0.00001', '1:0:1'), outside(0.001, 0.1).map(numText)) }),
    fc.record({ flag: fc.constantFrom('--units', '--shape', '--arrangement', '--transverse', '--format'), value: fc.stringMatching(/^[a-z]{1,10}$/).filter((v) => !['us', 'si', 'rectangle', 'circle', 'ring', 'custom', 'tied', 'spiral', 'csv', 'json'].includes(v)) }),
  );
  it(`${RUNS} generated bad flag values: exit 2, one line naming the place`, async () => {
    await fc.assert(
      fc.asyncProperty(cases, async ({ flag, value }) => {
        const flags = { ...base, [flag]: value };
        const args = ['table', ...Object.entries(flags).flat()];
        await expectOneLine(args, flag);
      }),
      { numRuns: RUNS },
    );
  }, 300_000);
  it('a repeated flag', async () => {
    await fc.assert(
      fc.asyncProperty(fc.constantFrom('--fc', '--fy', '--gamma', '--rho', '--shape'), async (flag) => {
        await expectOneLine(['table', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--rho', '0.02', '--shape', 'rectangle', flag, '5'], flag);
      }),
      { numRuns: 20 },
    );
  });
});

describe('malformed chart-set files', () => {
  const good = () => ({
    name: 'fuzz',
    titleBlock: { office: 'Fenwick Hollow Engineers (invented)', project: 'Test Bay Annex (invented)', date: '2026-01-05' },
    units: 'us',
    basis: { code: 'aci318-19' },
    rhoG: [0.01, 0.02],
    sheets: [{ fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
  });
  type Doc = ReturnType<typeof good> & Record<string, any>;
  const mutations: fc.Arbitrary<[string, (d: Doc) => void]> = fc.oneof(
    outside(0.3, 0.95).map((g): [string, (d: Doc) => void] => ['sheets[0].gamma', (d) => (d.sheets[0]!.gamma = g)]),
    fc.oneof(junk, fc.constantFrom('4in', '25ksi', '-4')).map((v): [string, (d: Doc) => void] => ['sheets[0].fc', (d) => ((d.sheets[0] as any).fc = v)]),
    fc.array(outside(0.001, 0.1), { minLength: 1, maxLength: 3 }).map((v): [string, (d: Doc) => void] => ['rhoG', (d) => (d.rhoG = v)]),
    fc.integer({ min: 21, max: 1e6 }).map((n): [string, (d: Doc) => void] => ['sheets[0].arrangement.barsPerFace', (d) => (d.sheets[0]!.arrangement.barsPerFace = n)]),
    fc.stringMatching(/^[a-z]{1,8}$/).map((k): [string, (d: Doc) => void] => ['titleBlock', (d) => ((d.titleBlock as any)[`x${k}`] = 1)]),
    fc.constantFrom('2026-13-01', '2026-02-30', '26-1-1', 'today', '2026-00-10').map((v): [string, (d: Doc) => void] => ['titleBlock.date', (d) => (d.titleBlock.date = v)]),
    fc.constantFrom('../up', '', '-x', 'a b', 'ä').map((v): [string, (d: Doc) => void] => ['name', (d) => (d.name = v)]),
    fc.constantFrom('fc', 'fy', 'arrangement').map((k): [string, (d: Doc) => void] => [`sheets[0].${k}`, (d) => ((d.sheets[0] as any)[k] = [])]),
    fc.string({ minLength: 201, maxLength: 400 }).map((v): [string, (d: Doc) => void] => ['titleBlock.office', (d) => (d.titleBlock.office = v)]),
    fc.constantFrom('si', 'metric').map((u): [string, (d: Doc) => void] => [u === 'si' ? 'sheets[0].fc' : 'units', (d) => (d.units = u)]),
  );
  it(`${RUNS} generated bad chart-set fields: exit 2, one line naming the place`, async () => {
    await fc.assert(
      fc.asyncProperty(mutations, async ([place, change]) => {
        const d = good() as Doc;
        change(d);
        await expectOneLine(['set', file('json', JSON.stringify(d)), '--out', join(dir, 'never'), '--no-progress'], place);
      }),
      { numRuns: RUNS },
    );
  }, 300_000);
});

describe('malformed load files', () => {
  const base = ['check', '--fc', '4', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.8'];
  const rows = fc.array(fc.tuple(fc.integer({ min: 0, max: 9 }), fc.integer({ min: -200, max: 800 }), fc.integer({ min: 0, max: 300 })), { minLength: 1, maxLength: 6 });
  const cases = fc.oneof(
    fc.tuple(rows, fc.nat(), junk, fc.constantFrom(1, 2)).map(([r, at, bad, col]) => {
      const lines = r.map(([, p, m], i) => [`L${i}`, String(p), String(m)]);
      const k = at % lines.length;
      lines[k]![col] = bad.includes(',') || bad.includes('"') || bad.includes('\n') || bad.includes('\r') ? `"${bad.replace(/"/g, '""')}"` : bad;
      return { text: `id,Pu,Mu\n${lines.map((l) => l.join(',')).join('\n')}\n`, place: `--loads line ${k + 2}` };
    }),
    rows.filter((r) => r.length >= 2).map((r) => ({ text: `id,Pu,Mu\n${r.map(([, p, m]) => `same,${p},${m}`).join('\n')}\n`, place: '--loads line 3 id' })),
    rows.map((r) => ({ text: `id,Pu,Mu,Pu\n${r.map(([, p, m], i) => `L${i},${p},${m},${p}`).join('\n')}\n`, place: '--loads line 1' })),
    rows.map((r) => ({ text: `id,Pu,Mu\nL0,"${r[0]![1]},${r[0]![2]}\n`, place: '--loads line 2' })),
    fc.constantFrom('ksi', 'mm', 'psi', 'x').map((u) => ({ text: `id,Pu ${u},Mu\nA,1,2\n`, place: '--loads line 1 Pu' })),
    fc.constantFrom('1e999', '1e300', '-1e12').map((v) => ({ text: `id,Pu,Mu\nA,${v},2\n`, place: '--loads line 2 Pu' })),
  );
  it(`${RUNS} generated bad load files: exit 2, one line naming the place`, async () => {
    await fc.assert(
      fc.asyncProperty(cases, async ({ text, place }) => {
        await expectOneLine([...base, '--loads', file('csv', text)], place);
      }),
      { numRuns: RUNS },
    );
  }, 300_000);
});

describe('malformed custom-bar files', () => {
  const base = ['table', '--fc', '4', '--fy', '60', '--rho', '0.02', '--arrangement', 'custom'];
  const cases = fc.oneof(
    fc.constantFrom('', '[', '{}', '[]', '[1]', '[null,null]', '"bars"', '[{"y":0.4}]').map((text) => ({ text, place: '--custom-bars' })),
    fc.tuple(fc.nat(3), outside(-0.5, 0.5)).map(([i, y]) => ({ text: JSON.stringify([0, 1, 2, 3].map((k) => ({ y: k === i ? y : k % 2 ? 0.4 : -0.4 }))), place: `--custom-bars[${i}].y` })),
    fc.tuple(fc.nat(3), fc.oneof(fc.double({ min: 1.0001e6, max: 1e308, noNaN: true }), fc.double({ min: -1e6, max: 0, noNaN: true }))).map(([i, share]) => ({
      text: JSON.stringify([0, 1, 2, 3].map((k) => ({ y: k % 2 ? 0.4 : -0.4, ...(k === i ? { share } : {}) }))),
      place: `--custom-bars[${i}].share`,
    })),
    fc.tuple(fc.nat(3), fc.stringMatching(/^[a-z]{1,6}$/).filter((k) => !['x', 'y', 'share'].includes(k))).map(([i, key]) => ({
      text: JSON.stringify([0, 1, 2, 3].map((k) => ({ y: k % 2 ? 0.4 : -0.4, ...(k === i ? { [key]: 1 } : {}) }))),
      place: `--custom-bars[${i}]`,
    })),
  );
  it(`${RUNS} generated bad custom-bar files: exit 2, one line naming the place`, async () => {
    await fc.assert(
      fc.asyncProperty(cases, async ({ text, place }) => {
        await expectOneLine([...base, '--custom-bars', file('json', text)], place);
      }),
      { numRuns: RUNS },
    );
  }, 300_000);
});
