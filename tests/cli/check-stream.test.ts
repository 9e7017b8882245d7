/**
 * Big load files are printed from a check held as a ranking (`rankColumnCheck`): the loads are ranked
 * once, then each result is computed again in ranked order and printed alone. The output format is a
 * stable interface, so the streamed text, JSON and .txt/.json reports must be the very bytes of the
 * held path (`runCheck`). `writeCheck(o, out, 0)` streams every check, however small, so each case
 * here (ties, statuses, effects, bases, shapes) is compared both ways. This checks two paths of our
 * own code against each other; the figures themselves are checked against published sources in
 * tests/design and tests/cli/check*.test.ts.
 */
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Writable } from 'node:stream';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { runCheck, writeCheck, type CheckOptions } from '../../src/cli/check.js';
import { clearFaults, faults } from '../helpers/fs-faults.mjs';

// a full disk is injected by a test-only mock of node:fs (tests/helpers/fs-faults.mjs)
vi.mock('node:fs', async (importOriginal) => (await import('../helpers/fs-faults.mjs')).faultyFs(await importOriginal<typeof import('node:fs')>()));

const dir = mkdtempSync(join(tmpdir(), 'pmchart-stream-'));
const csv = (name: string, text: string) => {
  const file = join(dir, `${name}.csv`);
  writeFileSync(file, text);
  return file;
};

/** Collects what is written, asking for a drain now and then as a slow pipe would. */
function sink(): { out: Writable; text: () => string } {
  const parts: string[] = [];
  const out = new Writable({ highWaterMark: 1024, write: (chunk: Buffer, _enc, cb) => (parts.push(chunk.toString('utf8')), setImmediate(cb)) });
  return { out, text: () => parts.join('') };
}

async function streamed(o: CheckOptions): Promise<string> {
  const s = sink();
  await writeCheck(o, s.out, 0);
  return s.text();
}

afterEach(() => {
  process.exitCode = 0;
  clearFaults();
});

// Invented load sets: repeated rows (ties broken by input order), tension, a zero load, and loads beyond the section.
const uniaxial = csv('uniaxial', 'id,Pu,Mu\nA,400,150\nB,900,600\nC,400,150\nT,-100,80\nZ,0,0\nBIG,5000,4000\nD,650,300\nE,900,600\n');
const biaxial = csv('biaxial', 'id,Pu,Mu,Muy\nlow,300,100,20\nhigh,500,220,160\nsame,300,100,20\nflat,700,90,0\n');
const slender = csv('slender', 'id,Pu,Mu,M1\nS1,400,200,-120\nS2,250,150,90\nS3,400,200,-120\nS4,1400,200,-200\n');
const enSlender = csv('en', 'id,Pu,Mu,Muy,M01,M02\nE1,1500,60,30,30,60\nE2,900,120,10,-40,120\nE3,2500,40,40,20,40\n');
const ring = csv('ring', 'id,Pu,Mu\nR1,2000,300\nR2,1200,500\nR3,2000,300\n');

const cases: [string, CheckOptions][] = [
  ['uniaxial, ρg required, bar proposals', { fc: '4', fy: '60', b: '24', h: '24', gamma: String(20 / 24), loads: uniaxial }],
  ['uniaxial, given ρg (utilisation, fails)', { fc: '4', fy: '60', b: '24', h: '24', gamma: '0.8', rho: '0.02', proposals: '0', loads: uniaxial }],
  ['biaxial, given ρg: three methods', { fc: '5', fy: '60', b: '18', h: '24', arrangement: 'four-faces', barsPerFace: '4', gamma: '0.75', rho: '0.025', proposals: '0', loads: biaxial }],
  ['biaxial, ρg required', { fc: '5', fy: '60', b: '18', h: '24', arrangement: 'four-faces', barsPerFace: '4', gamma: '0.75', proposals: '2', loads: biaxial }],
  ['slender (ACI 318-19 moment magnifier), given bars', { fc: '4', fy: '60', b: '16', h: '16', arrangement: 'four-faces', barsPerFace: '3', bar: '#8', gamma: '0.6875', proposals: '0', klu: '240in', betaDns: '0.6', loads: slender }],
  ['slender and biaxial (EN 1992-1-1 nominal curvature), ν and μ', { code: 'en1992-1-1', fc: '30', fy: '500', b: '400', h: '400', arrangement: 'four-faces', barsPerFace: '3', gamma: '0.75', rho: '0.01570796', klu: '6000mm', creep: '1', proposals: '0', loads: enSlender }],
  ['ring in a circle (orientations)', { fc: '5', fy: '60', shape: 'circle', diameter: '24', arrangement: 'ring', bars: '8', gamma: '0.75', proposals: '3', loads: ring }],
];

describe('writeCheck streams the very bytes of the held check', () => {
  for (const [name, o] of cases) {
    it(`${name}: text and JSON`, async () => {
      const text = runCheck(o);
      const code = process.exitCode;
      process.exitCode = 0;
      expect(await streamed(o)).toBe(text);
      expect(process.exitCode ?? 0).toBe(code ?? 0);
      const json = runCheck({ ...o, json: true });
      expect(await streamed({ ...o, json: true })).toBe(json);
      JSON.parse(json);
    });
    it(`${name}: .txt and .json reports`, async () => {
      for (const ext of ['txt', 'json']) {
        const held = join(dir, `held.${ext}`);
        const stream = join(dir, `stream.${ext}`);
        runCheck({ ...o, report: held });
        await streamed({ ...o, report: stream });
        expect(readFileSync(stream, 'utf8')).toBe(readFileSync(held, 'utf8'));
      }
    });
  }

  it('a streamed report whose write fails (injected ENOSPC): one line naming --report, exit 3, the previous report intact, no temporary file', async () => {
    const o = cases[0]![1];
    const sub = mkdtempSync(join(dir, 'fault-'));
    const report = join(sub, 'streamed-fault.json');
    await streamed({ ...o, report });
    const before = readFileSync(report, 'utf8');
    faults.write = 'streamed-fault';
    const e = await streamed({ ...o, report }).then(
      () => ({ message: 'no error', exitCode: 0 }),
      (x: unknown) => x as { message: string; exitCode: number },
    );
    expect(e.message).toBe(`--report: ${report} cannot be written (ENOSPC)`);
    expect(e.exitCode).toBe(3);
    expect(readFileSync(report, 'utf8')).toBe(before);
    expect(readdirSync(sub)).toEqual(['streamed-fault.json']);
  });

  it('the first streamed row is the governing load, marked, and the JSON ranks as the held result', async () => {
    const o = cases[0]![1];
    const text = await streamed(o);
    expect(text).toMatch(/\n\* BIG /);
    const doc = JSON.parse(await streamed({ ...o, json: true }));
    // ties (A and C, B and E) keep input order; BIG (not possible) governs
    expect(doc.results.map((r: { id: string }) => r.id).slice(0, 3)).toEqual(['BIG', 'B', 'E']);
    expect(doc.results.filter((r: { governing: boolean }) => r.governing).length).toBe(1);
  });
});
