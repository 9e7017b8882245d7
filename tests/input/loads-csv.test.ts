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
