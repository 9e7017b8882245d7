/** Load files through csv-parse (issue 14). Unit factors: NIST SP 811 Appendix B (1 kip = 4448.2216152605 N, 1 in = 25.4 mm). */
import { describe, expect, it } from 'vitest';
import { parseLoadQuantity, parseLoadsCsv } from '../../src/input/loads-csv.js';
import { expectClose } from '../helpers/tolerance.js';

const problem = (text: string, units: 'us' | 'si' = 'us') => {
  try {
    parseLoadsCsv(text, units);
  } catch (e) {
    return (e as Error).message;
  }
  return 'accepted';
};

describe('parseLoadsCsv', () => {
  it('reads header units and converts them to the run units', () => {
    const [a] = parseLoadsCsv('id,Pu kip,Mu [kN·m]\nA,100,100\n', 'us');
    expect(a!.Pu).toBe(100);
    expectClose(a!.Mu, 100e6 / (4448.2216152605 * 25.4), 1e-12); // 100 kN·m in kip·in
    const [b] = parseLoadsCsv('id,Pu (kN),Mu (kip-ft)\nB,-50,10\n', 'si');
    expect(b!.Pu).toBe(-50_000);
    expectClose(b!.Mu, 10 * 12 * 4448.2216152605 * 25.4, 1e-12);
  });
  it('detects ";" and reads decimal commas', () => {
    const loads = parseLoadsCsv('id;Pu;Mu\nA;1,5;2,5\n"B;2";3;0\n', 'us');
    expect(loads.map((l) => [l.id, l.Pu, l.Mu])).toEqual([
      ['A', 1.5, 30],
      ['B;2', 3, 0],
    ]);
  });
  it('keeps comments, blank lines, CRLF and a BOM out of the rows, and counts lines', () => {
    const loads = parseLoadsCsv('\uFEFF# loads of grid C\r\nid,Pu,Mu\r\n\r\nA,1,2\r\n', 'us');
    expect(loads).toEqual([{ id: 'A', Pu: 1, Mu: 24 }]);
    expect(problem('# c\nid,Pu,Mu\n\nA,1,x\n')).toBe('--loads line 4 Mu: x is not a number with an optional moment unit (kip-ft, kip-in, kn-m, knm, n-mm)');
  });
  it('refuses duplicate ids and duplicate columns with their lines', () => {
    expect(problem('id,Pu,Mu\nA,1,2\nB,1,2\nA,3,4\n')).toBe('--loads line 4 id: "A" repeats the id of line 2');
    expect(problem('id,Pu,Mu,Pu\nA,1,2,3\n')).toBe('--loads line 1: names the column "Pu" twice (columns 2 and 4)');
    expect(problem('id,Pu,Mu,pu kip\nA,1,2,3\n')).toBe('--loads line 1: names the column "Pu" twice (columns 2 and 4)');
  });
  it('names an unterminated quote where it opens', () => {
    expect(problem('id,Pu,Mu\nA,1,2\n"B,1,2\nC,1,2\n')).toBe('--loads line 3: has a quote (") that is not closed by the end of the file (line 4)');
  });
  it('refuses non-finite and absurd loads instead of printing ∞', () => {
    expect(problem('id,Pu,Mu\nA,1e999,2\n')).toBe('--loads line 2 Pu: 1e999 is not a finite force');
    expect(problem('id,Pu,Mu\nA,1e308,2\n')).toBe('--loads line 2 Pu: 1e308 is beyond ±1000000000 kip');
    expect(() => parseLoadQuantity('1e308', 'force', 'us', '--pu')).toThrow('--pu: 1e308 is beyond ±1000000000 kip');
  });
  it('refuses a header unit of the wrong kind, and a unit in both header and cell', () => {
    expect(problem('id,Pu ksi,Mu\nA,1,2\n')).toMatch(/^--loads line 1 Pu: ksi has a unit that is not a force unit/);
    expect(problem('id,Pu kip,Mu\nA,1kN,2\n')).toBe('--loads line 2 Pu: 1kN has a unit while the header gives kip');
  });
  it('refuses empty cells, long ids, long quantities and missing columns', () => {
    expect(problem('id,Pu,Mu\nA,12,\n')).toBe('--loads line 2 Mu: is empty');
    expect(problem(`id,Pu,Mu\n${'x'.repeat(65)},1,2\n`)).toBe('--loads line 2 id: is longer than 64 characters');
    expect(problem(`id,Pu,Mu\nA,${'1'.repeat(100)},2\n`)).toBe('--loads line 2 Pu: is longer than 64 characters');
    expect(problem('name,P,M\nA,1,2\n')).toBe('--loads header: name,P,M must name the columns id, Pu and Mu');
  });
});

/**
 * Issue 25: every cell of a load file is accounted for. Each input below was read silently before
 * (extra cells dropped, a shifted row read as Pu = 2, an unknown "My" column skipping the biaxial
 * check, "1.500" read as 1.5 in a decimal-comma file), which is unconservative.
 */
describe('parseLoadsCsv strictness (issue 25)', () => {
  it('refuses a row with more cells than the header names', () => {
    expect(problem('id,Pu,Mu\nA,500,250,250\n')).toBe(
      '--loads line 2 column 4: 250 is a cell beyond the 3 columns of the header (an unquoted comma in an id? quote the id)',
    );
  });
  it('refuses an unquoted comma in an id that shifts the columns', () => {
    // "C2,east" unquoted: id C2, Pu "east"… is an error already; "C2,3" gives Pu = 3, Mu = 500, plus a fourth cell
    expect(problem('id,Pu,Mu\nC2,3,500,250\n')).toMatch(/^--loads line 2 column 4: 250 is a cell beyond the 3 columns/);
  });
  it('accepts empty trailing cells (a spreadsheet export), which hold nothing', () => {
    expect(parseLoadsCsv('id,Pu,Mu\nA,1,2,,\n', 'us')).toEqual([{ id: 'A', Pu: 1, Mu: 24 }]);
  });
  it('refuses unknown columns, which would otherwise skip a check (My instead of Muy)', () => {
    expect(problem('id,Pu,Mu,My\nA,500,250,250\n')).toBe(
      '--loads line 1 column 4: "My" is not a column pmchart reads (id, Pu, Mu, Muy, M1, M2, M1y, M2y, M01, M02, M01y, M02y, beta_dns, M2s, M1s, M2sy, M1sy, M02s, M01s, M02sy, M01sy, Q, storeyPu, storeyPc); rename it, name it in --ignore-columns to skip it, or map the file with --columns',
    );
    expect(problem('id,Pu,Mu,Mu_y\nA,500,250,250\n')).toMatch(/^--loads line 1 column 4: "Mu_y" is not a column pmchart reads/);
  });
  it('skips a column only when the caller names it in ignoreColumns', () => {
    const loads = parseLoadsCsv('id,Pu,Mu,Remark,Case\nA,500,250,governs,1\n', 'us', '--loads', { ignoreColumns: ['remark', 'Case'] });
    expect(loads).toEqual([{ id: 'A', Pu: 500, Mu: 3000 }]);
  });
  it('refuses ignoreColumns that the header lacks, or that name id, Pu or Mu', () => {
    const at = (text: string, ignoreColumns: string[]) => {
      try {
        parseLoadsCsv(text, 'us', '--loads', { ignoreColumns });
      } catch (e) {
        return (e as Error).message;
      }
      return 'accepted';
    };
    expect(at('id,Pu,Mu\nA,1,2\n', ['Remark'])).toBe('--ignore-columns: "Remark" is not a column of the header of --loads');
    expect(at('id,Pu,Mu\nA,1,2\n', ['Mu'])).toBe('--ignore-columns: "Mu" names a column every load needs (id, Pu, Mu)');
  });
  it('refuses a value under a blank header cell', () => {
    expect(problem('id,Pu,Mu,\nA,1,2,\n')).toBe('accepted');
    expect(problem('id,Pu,Mu,\nA,1,2,7\n')).toBe('--loads line 2 column 4: 7 is a cell under a blank header cell');
  });
  it('refuses "1.500" in a decimal-comma file unless thousands says how to read it', () => {
    expect(problem('id;Pu;Mu\nA;1.500;2,5\n')).toBe(
      '--loads line 2 Pu: 1.500 has a dot in a file with decimal commas (a thousands separator?); say --thousands dot (1.500 = 1500) or --thousands none (1.500 = 1.5)',
    );
    const read = (thousands: 'dot' | 'none') => parseLoadsCsv('id;Pu;Mu\nA;1.500;2,5\nB;1.234.567,5;0\n'.replace(thousands === 'none' ? /B;.*\n/ : /$^/, ''), 'us', '--loads', { thousands });
    expect(read('dot').map((l) => l.Pu)).toEqual([1500, 1234567.5]);
    expect(read('none').map((l) => l.Pu)).toEqual([1.5]);
  });
  it('refuses malformed groups with --thousands dot, and --thousands dot in a comma file', () => {
    const at = (text: string) => {
      try {
        parseLoadsCsv(text, 'us', '--loads', { thousands: 'dot' });
      } catch (e) {
        return (e as Error).message;
      }
      return 'accepted';
    };
    expect(at('id;Pu;Mu\nA;1.50;2\n')).toBe('--loads line 2 Pu: 1.50 is not a number with dots between groups of three digits (--thousands dot)');
    expect(at('id,Pu,Mu\nA,1.5,2\n')).toBe('--thousands: dot applies to files separated by ";" with decimal commas; --loads is separated by ","');
  });
  it('refuses control characters in an id, so no SVG or terminal line carries them', () => {
    expect(problem('id,Pu,Mu\n"A\u001b[31m",1,2\n')).toBe('--loads line 2 id: "A\\u001b[31m" has a control character (plain text only)');
  });
});
