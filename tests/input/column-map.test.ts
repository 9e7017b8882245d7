/**
 * Load files from analysis exports (issue 22): --columns header maps, --compression, basis symbols as
 * headers, duplicates numbered, loads grouped by mark. Unit factors: NIST SP 811 Appendix B
 * (1 kip = 4448.2216152605 N, 1 in = 25.4 mm). The export here is invented.
 */
import { describe, expect, it } from 'vitest';
import { parseColumnMap, parseCompression, symbolAliases } from '../../src/input/column-map.js';
import { LOAD_FIELDS, parseGroupedLoadsCsv, parseLoadsCsv } from '../../src/input/loads-csv.js';
import { DESIGN_CODES } from '../../src/codes/registry.js';

const EXPORT = [
  'Level,Member,Combination,Position,Axial N [kN],Shear [kN],Moment Major [kN·m],Moment Minor [kN·m]',
  'Level 1,C1,ULS-01,top,-1200,5,80,10',
  'Level 1,C1,ULS-01,bottom,-1224,5,-48,-6',
  'Level 1,C2,ULS-01,top,150,1,3,2',
].join('\n');
const MAP = 'mark=Member,id=Level+Combination,Pu=Axial N,Mu=Moment Major,Muy=Moment Minor';

const problem = (fn: () => unknown): string => {
  try {
    fn();
  } catch (e) {
    return (e as Error).message;
  }
  return 'accepted';
};

describe('an export read through --columns and --compression negative', () => {
  const notes: string[] = [];
  const rows = parseGroupedLoadsCsv(EXPORT, 'si', '--loads', {
    group: 'mark',
    columns: parseColumnMap(MAP, ['mark', ...LOAD_FIELDS]),
    compression: 'negative',
    duplicates: 'number',
    onNote: (n) => notes.push(n),
  });

  it('turns the export’s negative compression into ours (positive), in internal units (N, N·mm)', () => {
    expect(rows.map((r) => r.load.Pu)).toEqual([1_200_000, 1_224_000, -150_000]);
    expect(rows[0]!.load.Mu).toBe(80e6);
    expect(rows[0]!.load.Muy).toBe(10e6);
  });
  it('joins the id from two columns with " / " and numbers a repeated combination', () => {
    expect(rows.map((r) => [r.group, r.load.id])).toEqual([
      ['C1', 'Level 1 / ULS-01'],
      ['C1', 'Level 1 / ULS-01 #2'],
      ['C2', 'Level 1 / ULS-01'],
    ]);
  });
  it('lists the columns the map leaves unread in one note', () => {
    expect(notes).toEqual(['--loads: columns not named in --columns are ignored: "Position", "Shear [kN]"']);
  });
  it('keeps positive compression when asked, and refuses an unknown sign', () => {
    const pos = parseLoadsCsv('id,Pu,Mu\nA,100,10\n', 'us', '--loads', { compression: 'positive' });
    expect(pos[0]!.Pu).toBe(100);
    expect(problem(() => parseCompression('down'))).toBe('--compression: down is not one of the allowed values (allowed: positive, negative)');
  });
});

describe('header matching', () => {
  it('matches case-insensitively with inner spaces kept, and reads a mapped M2 only as Muy', () => {
    const loads = parseLoadsCsv('Output Case,P,M3,M2\nU1,-10,20,5\n', 'us', '--loads', { columns: parseColumnMap('id=output case,Pu=p,Mu=M3,Muy=M2', LOAD_FIELDS), compression: 'negative' });
    // M2 mapped to Muy is never the end moment M2: the load has no M2 (kip-ft → kip-in × 12)
    expect(loads).toEqual([{ id: 'U1', Pu: 10, Mu: 240, Muy: 60 }]);
  });
  it('refuses a map naming a source column the file does not have, a field twice, or a join on a number', () => {
    expect(problem(() => parseLoadsCsv('Combo,P,M3\nU1,1,2\n', 'us', '--loads', { columns: parseColumnMap('id=Case,Pu=P,Mu=M3', LOAD_FIELDS) }))).toBe(
      '--loads header: Combo,P,M3 has no column "case" (id in --columns)',
    );
    expect(problem(() => parseColumnMap('Pu=P,pu=N', LOAD_FIELDS))).toBe('--columns: maps the field Pu twice');
    expect(problem(() => parseColumnMap('Pu=P+N', LOAD_FIELDS))).toBe('--columns: Pu=P+N joins several source columns for Pu; only id may be joined');
    expect(problem(() => parseColumnMap('Pu=P,Mu=P', LOAD_FIELDS))).toBe('--columns: reads the source column "p" for both Pu and Mu; a source column fills one field');
  });
  it('reads each basis’s own action symbols as Pu and Mu, taken from the registry', () => {
    const aliases = symbolAliases();
    for (const code of Object.values(DESIGN_CODES)) {
      const s = code!.symbols;
      if (s.actionAxial) expect(aliases.get(s.actionAxial.toLowerCase())).toBe('Pu');
      if (s.actionMoment) expect(aliases.get(s.actionMoment.toLowerCase())).toBe('Mu');
    }
    // EN 1992-1-1 NEd/MEd, CSA A23.3 Pf/Mf, AS 3600 N*/M* (the standards' own symbols for factored actions)
    for (const [p, m] of [['NEd', 'MEd'], ['Pf', 'Mf'], ['N* kN', 'M* kN-m']]) {
      expect(parseLoadsCsv(`id,${p},${m}\nA,100,20\n`, 'si')).toEqual([{ id: 'A', Pu: 100_000, Mu: 20e6 }]);
    }
  });
  it('still refuses a repeated id without a map (our own files)', () => {
    expect(problem(() => parseLoadsCsv('id,Pu,Mu\nA,1,2\nA,3,4\n', 'us'))).toBe('--loads line 3 id: "A" repeats the id of line 2');
  });
});

describe('a schedule’s loads: bare numbers in each mark’s units', () => {
  it('reads kip and kip-ft for a US mark and kN and kN·m for an SI mark in one file', async () => {
    const { parseScheduleCsv } = await import('../../src/input/schedule-csv.js');
    const { readScheduleLoads } = await import('../../src/flags/schedule-rows.js');
    const rows = parseScheduleCsv(
      ['mark,code,units,fc,fy,b,h,arrangement,bars_per_face,bar,cover,tie', 'U1,aci318-19,us,5,60,20,20,four-faces,4,#9,1.5,#4', 'S1,en1992-1-1,si,C30/37,B500B,400,400,four-faces,3,20,35,8'].join('\n'),
    );
    const loads = readScheduleLoads('mark,id,Pu,Mu\nU1,a,100,10\nS1,a,100,10\n', rows, {});
    // US internal units kip and kip-in (10 kip-ft = 120 kip-in); SI internal units N and N·mm
    expect(loads.get('U1')).toEqual([{ id: 'a', Pu: 100, Mu: 120 }]);
    expect(loads.get('S1')).toEqual([{ id: 'a', Pu: 100_000, Mu: 10e6 }]);
  });
});

describe('numbered repeats', () => {
  it('skips a number the file already uses as an id', () => {
    const loads = parseLoadsCsv('C,P,M\nA,1,1\nA,2,2\nA #2,3,3\nA,4,4\n', 'us', '--loads', { columns: parseColumnMap('id=C,Pu=P,Mu=M', LOAD_FIELDS), duplicates: 'number' });
    expect(loads.map((l) => l.id)).toEqual(['A', 'A #2', 'A #2 #2', 'A #3']);
  });
});

describe('beta_dns per load', () => {
  it('reads a ratio 0–1 (empty: the member’s) and names a bad cell', () => {
    expect(parseLoadsCsv('id,Pu,Mu,beta_dns\nA,1,2,0.5\nB,1,2,\n', 'us')).toEqual([
      { id: 'A', Pu: 1, Mu: 24, betaDns: 0.5 },
      { id: 'B', Pu: 1, Mu: 24 },
    ]);
    expect(problem(() => parseLoadsCsv('id,Pu,Mu,beta_dns\nA,1,2,1.5\n', 'us'))).toBe('--loads line 2 beta_dns: 1.5 is not a ratio within 0–1');
  });
});
