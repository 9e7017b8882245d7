/** Unit parsing; conversion factors are exact by definition (NIST SP 811 Appendix B). */
import { describe, expect, it } from 'vitest';
import { parseQuantity, toDisplay } from '../../src/units/index.js';
import { expectClose } from '../helpers/tolerance.js';

describe('parseQuantity', () => {
  it('reads bare numbers in the system default unit', () => {
    expect(parseQuantity('4', 'stress', 'us', '--fc')).toBe(4);
    expect(parseQuantity('600', 'moment', 'us', '--mu')).toBe(7200); // kip-ft → kip·in
    expect(parseQuantity('4000', 'force', 'si', '--pu')).toBe(4_000_000); // kN → N
    expect(parseQuantity('800', 'moment', 'si', '--mu')).toBe(800e6); // kN·m → N·mm
  });
  it('reads explicit suffixes, across systems', () => {
    expect(parseQuantity('4000psi', 'stress', 'us', '--fc')).toBe(4);
    expectClose(parseQuantity('28MPa', 'stress', 'us', '--fc'), 4.0611, 1e-4);
    expectClose(parseQuantity('4ksi', 'stress', 'si', '--fc'), 27.579, 1e-4);
    expect(parseQuantity('24in', 'length', 'si', '--h')).toBeCloseTo(609.6, 9);
    expect(parseQuantity('600mm', 'length', 'si', '--h')).toBe(600);
    expect(parseQuantity('900kip', 'force', 'us', '--pu')).toBe(900);
    expect(parseQuantity('7200kip-in', 'moment', 'us', '--mu')).toBe(7200);
    expect(parseQuantity('600kip-ft', 'moment', 'us', '--mu')).toBe(7200);
    expect(parseQuantity('800kN-m', 'moment', 'si', '--mu')).toBe(800e6);
    expect(parseQuantity('-50kip', 'force', 'us', '--pu')).toBe(-50);
  });
  it('names the field and the allowed units when the unit is wrong', () => {
    expect(() => parseQuantity('4kip', 'stress', 'us', '--fc')).toThrow(/^--fc: 4kip has a unit that is not a stress unit \(allowed: ksi, psi/);
    expect(() => parseQuantity('abc', 'length', 'us', '--h')).toThrow(/^--h: "abc" is not a number/);
  });
  it('converts back to display units', () => {
    expect(toDisplay(7200, 'moment', 'us')).toBe(600);
    expect(toDisplay(4e6, 'force', 'si')).toBe(4000);
  });
});
