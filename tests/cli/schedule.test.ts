/**
 * `pmchart schedule` (issue 22): each mark equals a single `pmchart check` of that column and its loads;
 * an export read with --columns and --compression negative; errors naming the schedule line and column
 * or the mark (exit 2); row order changes nothing (property); --jobs 1 and --jobs 3 give the same bytes
 * (built binary, run from /tmp). The schedule, the export and the marks are invented.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import fc from 'fast-check';
import { PDFDict, PDFDocument, PDFHexString, PDFName, PDFNumber } from 'pdf-lib';
import { beforeAll, describe, expect, it } from 'vitest';
import { runCheck, type CheckOptions } from '../../src/cli/check.js';
import { runSchedule } from '../../src/cli/schedule.js';
import { bin, requireFreshBuild } from '../helpers/built.js';
import { runCli } from '../helpers/run-cli.js';

const dir = mkdtempSync(join(tmpdir(), 'pmchart-schedule-'));
const file = (name: string, text: string): string => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

// three marks: a slender rectangle with four faces (klu, βdns), a circle with a ring, an unequal pair 3x5 with γ given
const SCHEDULE = [
  'mark,code,units,fc,fy,b,h,diameter,arrangement,bars_per_face,bars,bar,cover,tie,transverse,gamma,klu,beta_dns',
  'G2-A,aci318-19,us,5,60,20,20,,four-faces,4,,#9,1.5,#4,tied,,20ft,0.6',
  'G2-B,aci318-19,us,5,60,,,24,ring,,8,#8,1.5,#4,spiral,,,',
  'G10-C,aci318-19,us,4ksi,60,16,24,,four-faces,3x5,,#8,,,tied,0.75,,',
].join('\n');
// an invented export: compression negative, kip and kip-ft, the combination split over two columns
const EXPORT = [
  'Floor,Col,Case,P [kip],M-major [kip-ft],M-minor [kip-ft],Note',
  'F2,G2-A,D+L,-620,110,0,x',
  'F2,G2-A,D+L+W,-480,260,40,x',
  'F2,G2-A,0.9D+W,-150,240,35,x',
  'F2,G2-B,D+L,-700,90,30,x',
  'F2,G2-B,D+L+W,-520,210,60,x',
  'F10,G10-C,D+L,-420,180,0,x',
  'F10,G10-C,D+L+W,-300,260,0,x',
  'F10,G10-C,0.9D+W,40,150,0,x',
].join('\n');
const MAP = 'mark=Col,id=Floor+Case,Pu=P,Mu=M-major,Muy=M-minor';
const sched = file('schedule.csv', SCHEDULE);
const loads = file('export.csv', EXPORT);

/** The same loads in our own form for one mark (compression positive, ids joined by hand). */
function ownLoads(mark: string): string {
  const rows = EXPORT.split('\n')
    .slice(1)
    .map((l) => l.split(','))
    .filter((c) => c[1] === mark)
    .map((c) => `${c[0]} / ${c[2]},${-Number(c[3])},${c[4]},${c[5]}`);
  return file(`own-${mark}.csv`, `id,Pu,Mu,Muy\n${rows.join('\n')}\n`);
}

const FLAGS: Record<string, CheckOptions> = {
  'G2-A': { code: 'aci318-19', units: 'us', fc: '5', fy: '60', b: '20', h: '20', arrangement: 'four-faces', barsPerFace: '4', bar: '#9', cover: '1.5', tie: '#4', transverse: 'tied', klu: '20ft', betaDns: '0.6' },
  'G2-B': { code: 'aci318-19', units: 'us', fc: '5', fy: '60', shape: 'circle', diameter: '24', arrangement: 'ring', bars: '8', bar: '#8', cover: '1.5', tie: '#4', transverse: 'spiral' },
  'G10-C': { code: 'aci318-19', units: 'us', fc: '4ksi', fy: '60', b: '16', h: '24', arrangement: 'four-faces', barsPerFace: '3,5', bar: '#8', gamma: '0.75', transverse: 'tied' },
};

describe('schedule --json: each mark as a single check', async () => {
  const out = JSON.parse(await runSchedule(sched, { loads, columns: MAP, compression: 'negative', json: true }));
  process.exitCode = 0;

  it('lists the marks sorted, with the stable fields, summary and caution', () => {
    expect(out.columns.map((c: { mark: string }) => c.mark)).toEqual(['G2-A', 'G2-B', 'G10-C']);
    for (const key of ['mark', 'status', 'utilisation', 'governing', 'rhoProvided', 'rhoRequired']) expect(out.columns[0]).toHaveProperty(key);
    expect(out.summary.total).toBe(3);
    expect(out.bases).toEqual([{ code: 'aci318-19', title: 'ACI 318-19' }]);
    expect(out.caution).toMatch(/qualified engineers/);
    expect(out.notes).toEqual(['--loads: columns not named in --columns are ignored: "Note"']);
  });

  it('gives each mark the governing measure, load, status and ρg of `pmchart check` on that column', () => {
    for (const c of out.columns) {
      const single = JSON.parse(runCheck({ ...FLAGS[c.mark]!, loads: ownLoads(c.mark), proposals: '0', json: true }));
      const g = single.results[0];
      expect(c.governing).toBe(single.governing);
      expect(c.utilisation).toBe(g.measure);
      expect(c.status).toBe(g.status);
      expect(c.rhoProvided).toBe(single.checked.rho);
      // the slender mark's klu and βdns reach the engine: its governing moment is magnified (ACI 318-19 6.6.4)
      if (c.mark === 'G2-A') expect(Math.abs(g.Mu)).toBeGreaterThan(Math.abs(g.firstOrder.Mux));
      // ρg required: the uniaxial figure, or at least it where the exact biaxial one is larger (loads with Muy on a rectangle)
      if (c.mark === 'G10-C' || c.mark === 'G2-B') expect(c.rhoRequired).toBe(g.rhoRequired);
      else expect(c.rhoRequired).toBeGreaterThanOrEqual(g.rhoRequired);
    }
    process.exitCode = 0;
  });

  it('reads the export’s tension (a positive P with --compression negative) as tension', () => {
    const single = JSON.parse(runCheck({ ...FLAGS['G10-C']!, loads: ownLoads('G10-C'), proposals: '0', json: true }));
    const uplift = single.results.find((r: { id: string }) => r.id === 'F10 / 0.9D+W');
    expect(uplift.Pu).toBe(-40);
    process.exitCode = 0;
  });
});

describe('check --loads with --columns and --compression', () => {
  it('gives the same check as the loads in our own form', () => {
    const exported = file('g2a-export.csv', EXPORT.split('\n').filter((l, i) => i === 0 || l.includes('G2-A')).join('\n'));
    const a = JSON.parse(runCheck({ ...FLAGS['G2-A']!, loads: exported, columns: 'id=Floor+Case,Pu=P,Mu=M-major,Muy=M-minor', compression: 'negative', json: true }));
    const b = JSON.parse(runCheck({ ...FLAGS['G2-A']!, loads: ownLoads('G2-A'), json: true }));
    expect(a.results).toEqual(b.results);
    process.exitCode = 0;
  });
});

describe('a forgotten --compression negative', () => {
  it('is named in a note when every axial load reads as tension', async () => {
    // the export without its one uplift row: every P is negative (compression, as exported)
    const allNegative = file('all-negative.csv', EXPORT.split('\n').filter((l) => !l.includes(',40,')).join('\n'));
    const r = await runCli(['schedule', sched, '--loads', allNegative, '--columns', MAP, '--json']);
    expect(JSON.parse(r.stdout).notes).toContain('--loads: every axial load is tension (negative Pu); if the file gives compression as negative, add --compression negative');
    const stated = await runCli(['schedule', sched, '--loads', allNegative, '--columns', MAP, '--compression', 'positive', '--json']);
    expect(JSON.parse(stated.stdout).notes).not.toContain('--loads: every axial load is tension (negative Pu); if the file gives compression as negative, add --compression negative');
    const c = await runCli(['check', '--fc', '5', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.75', '--loads', ownLoads('G2-B')]);
    expect(c.stderr).toBe('');
    const neg = file('neg.csv', 'id,Pu,Mu\nA,-100,50\nB,-200,40\n');
    const n = await runCli(['check', '--fc', '5', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.75', '--loads', neg]);
    expect(n.stderr).toBe('pmchart: note: --loads: every axial load is tension (negative Pu); if the file gives compression as negative, add --compression negative\n');
  });
});

describe('check: --columns and --compression need --loads', () => {
  it('refuses them with --pu/--mu, naming the flag', async () => {
    const r = await runCli(['check', '--fc', '5', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.75', '--pu', '100', '--mu', '50', '--compression', 'negative']);
    expect(r.code).toBe(2);
    expect(r.stderr).toBe('pmchart: --compression: applies to --loads; --pu is compression positive\n');
  });
});

describe('errors (exit 2, one line)', () => {
  it('names the schedule line and column of a bad cell', async () => {
    const bad = file('bad.csv', SCHEDULE.replace('G2-B,aci318-19,us,5,60,,,24,ring,,8,#8', 'G2-B,aci318-19,us,5,60,,,24,ring,,8,#99'));
    const r = await runCli(['schedule', bad, '--loads', loads, '--columns', MAP, '--compression', 'negative']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^pmchart: bad\.csv line 3 bar: #99 is not a bar size of the table/);
    const pair = file('pair.csv', SCHEDULE.replace('3x5', '3x55'));
    const p = await runCli(['schedule', pair, '--loads', loads, '--columns', MAP]);
    expect(p.stderr).toMatch(/^pmchart: pair\.csv line 4 bars_per_face: /);
    const both = file('both.csv', SCHEDULE.replace('16,24,,four-faces,3x5,,#8,,,tied,0.75', '16,24,,four-faces,3x5,,#8,1.5,,tied,0.75'));
    expect((await runCli(['schedule', both, '--loads', loads, '--columns', MAP])).stderr).toBe('pmchart: both.csv line 4 gamma: and cover both set γ; give gamma, or cover and tie\n');
  });
  it('names a mark found in only one file, unless --allow-missing', async () => {
    const extra = file('extra.csv', `${EXPORT}\nF2,G7-Z,D+L,-100,10,0,x\n`);
    const r = await runCli(['schedule', sched, '--loads', extra, '--columns', MAP, '--compression', 'negative']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^pmchart: loads mark: "G7-Z" is not in the schedule/);
    const fewer = file('fewer.csv', EXPORT.split('\n').filter((l) => !l.includes('G2-B')).join('\n'));
    const f = await runCli(['schedule', sched, '--loads', fewer, '--columns', MAP, '--compression', 'negative']);
    expect(f.code).toBe(2);
    expect(f.stderr).toMatch(/^pmchart: schedule mark: "G2-B" has no loads/);
    const ok = await runCli(['schedule', sched, '--loads', fewer, '--columns', MAP, '--compression', 'negative', '--allow-missing', '--json']);
    const doc = JSON.parse(ok.stdout);
    expect(doc.columns.map((c: { mark: string }) => c.mark)).toEqual(['G2-A', 'G10-C']);
    expect(doc.notes).toContain('marks of the schedule with no loads, not checked: G2-B');
  });
  it('names an unknown schedule column and a repeated mark', async () => {
    const col = file('col.csv', SCHEDULE.replace('transverse,gamma', 'transverse,colour'));
    expect((await runCli(['schedule', col, '--loads', loads])).stderr).toMatch(/^pmchart: col\.csv line 1: has the unknown column "colour"/);
    const twice = file('twice.csv', `${SCHEDULE}\nG2-A,aci318-19,us,5,60,20,20,,four-faces,4,,#9,1.5,#4,tied,,,\n`);
    expect((await runCli(['schedule', twice, '--loads', loads])).stderr).toBe('pmchart: twice.csv line 5 mark: "G2-A" repeats the mark of line 2\n');
  });
});

describe('row order changes nothing (property)', () => {
  it('gives the same JSON for any order of schedule rows and load rows', async () => {
    const base = await runSchedule(sched, { loads, columns: MAP, compression: 'negative', json: true });
    const sRows = SCHEDULE.split('\n');
    const lRows = EXPORT.split('\n');
    let cases = 0;
    await fc.assert(
      fc.asyncProperty(fc.shuffledSubarray(sRows.slice(1), { minLength: sRows.length - 1 }), fc.shuffledSubarray(lRows.slice(1), { minLength: lRows.length - 1 }), async (s, l) => {
        cases++;
        const a = file('p-schedule.csv', [sRows[0], ...s].join('\n'));
        const b = file('p-loads.csv', [lRows[0], ...l].join('\n'));
        expect(await runSchedule(a, { loads: b, columns: MAP, compression: 'negative', json: true })).toBe(base);
      }),
      { numRuns: 12 },
    );
    expect(cases).toBe(12);
    process.exitCode = 0;
  });
});

describe('built binary: --jobs and the report', () => {
  beforeAll(requireFreshBuild);
  const run = (args: string[]) => spawnSync(process.execPath, [bin, ...args], { cwd: tmpdir(), encoding: 'utf8' });

  it('gives the same bytes with --jobs 1 and --jobs 3, run from /tmp', () => {
    const common = ['schedule', sched, '--loads', loads, '--columns', MAP, '--compression', 'negative'];
    const one = run([...common, '--json', '--jobs', '1']);
    const three = run([...common, '--json', '--jobs', '3']);
    expect(one.stderr).toBe('');
    expect(three.stdout).toBe(one.stdout);
    expect(three.status).toBe(one.status);
    expect(run([...common, '--jobs', '3']).stdout).toBe(run(common).stdout);
  });

  it('writes a bound report: a summary page, a sheet per mark, a bookmark per mark, fixed dates', async () => {
    const pdf = join(dir, 'report.pdf');
    const r = run(['schedule', sched, '--loads', loads, '--columns', MAP, '--compression', 'negative', '--report', pdf, '--date', '2026-03-02', '--project', 'Invented Tower']);
    expect([0, 1]).toContain(r.status);
    const doc = await PDFDocument.load(readFileSync(pdf), { updateMetadata: false });
    expect(doc.getPageCount()).toBe(4);
    // the outline: Summary, then one entry per mark (ISO 32000-1 12.3.3)
    const outlines = doc.catalog.lookup(PDFName.of('Outlines'), PDFDict);
    expect((outlines.get(PDFName.of('Count')) as PDFNumber).asNumber()).toBe(4);
    const first = outlines.lookup(PDFName.of('First'), PDFDict);
    const second = first.lookup(PDFName.of('Next'), PDFDict);
    expect((first.lookup(PDFName.of('Title')) as PDFHexString).decodeText()).toBe('Summary');
    expect((second.lookup(PDFName.of('Title')) as PDFHexString).decodeText()).toMatch(/^G2-A: /);
    expect(doc.getCreationDate()?.toISOString()).toBe('2026-03-02T00:00:00.000Z');
    const again = join(dir, 'report2.pdf');
    run(['schedule', sched, '--loads', loads, '--columns', MAP, '--compression', 'negative', '--report', again, '--date', '2026-03-02', '--project', 'Invented Tower']);
    expect(readFileSync(again).equals(readFileSync(pdf))).toBe(true);
  }, 180_000);
});
