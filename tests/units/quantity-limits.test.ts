/** Quantity text: a length cap checked before parsing, a linear scan, finite results only (issue 14). */
import { describe, expect, it } from 'vitest';
import { MAX_QUANTITY_CHARS, parseQuantity, splitQuantity } from '../../src/units/index.js';

describe('parseQuantity limits', () => {
  it('refuses text beyond the cap before parsing it, naming the field', () => {
    const long = '1'.repeat(4000) + 'x';
    expect(() => parseQuantity(long, 'stress', 'us', '--fc')).toThrow(/^--fc: "111111111111"… is longer than 64 characters$/);
    expect(() => parseQuantity('1'.repeat(MAX_QUANTITY_CHARS + 1), 'stress', 'us', 'sheets[0].fc')).toThrow(/^sheets\[0\]\.fc: .* longer than 64/);
  });
  it('still reads text at the cap', () => {
    const atCap = `4.${'0'.repeat(MAX_QUANTITY_CHARS - 5)}psi`;
    expect(atCap.length).toBe(MAX_QUANTITY_CHARS);
    expect(Number.isFinite(parseQuantity(atCap, 'stress', 'us', '--fc'))).toBe(true);
  });
  it('refuses numbers that are not finite, as written or after conversion', () => {
    expect(() => parseQuantity('1e999', 'force', 'us', '--pu')).toThrow(/^--pu: 1e999 is not a finite force$/);
    // 1e308 kip-ft is 1.2e309 kip·in internally: beyond double range
    expect(() => parseQuantity('1e308', 'moment', 'us', '--mu')).toThrow(/^--mu: 1e308 is not a finite moment$/);
    expect(() => parseQuantity(1e308, 'moment', 'si', 'sheets[0].mu')).toThrow(/not a finite moment/);
  });
  it('refuses hex, Infinity and blanks', () => {
    for (const t of ['0x1', 'Infinity', '', ' ', '.', '-', '1e', '1 2']) {
      expect(() => parseQuantity(t, 'stress', 'us', '--fc'), t).toThrow(/^--fc: /);
    }
  });
  it('splits number and unit in one scan', () => {
    expect(splitQuantity('4.5e-1 ksi')).toEqual({ number: '4.5e-1', unit: 'ksi' });
    expect(splitQuantity('-.5kN·m')).toEqual({ number: '-.5', unit: 'kN·m' });
    expect(splitQuantity('28MPa')).toEqual({ number: '28', unit: 'MPa' });
    expect(splitQuantity('2e')).toEqual({ number: '2', unit: 'e' });
    expect(splitQuantity('abc')).toBeUndefined();
  });
});
