/** Command lines and shell quoting of the live page (pure formatting). */
import { describe, expect, it } from 'vitest';
import { commandLine, shellWord } from '../../src/page/commands.js';

describe('shellWord', () => {
  it('leaves plain words bare and single-quotes the rest (POSIX sh)', () => {
    expect(shellWord('0.01:0.08:0.01')).toBe('0.01:0.08:0.01');
    expect(shellWord('7ksi')).toBe('7ksi');
    expect(shellWord('#9')).toBe("'#9'");
    expect(shellWord('a b')).toBe("'a b'");
    expect(shellWord("it's")).toBe(`'it'\\''s'`);
    expect(shellWord('')).toBe("''");
  });
});

describe('commandLine', () => {
  it('turns option keys into flags, leaves out unset, false and internal options', () => {
    expect(commandLine('check', { fc: '4', barsPerFace: '3', alphaCc: undefined, dimensionless: false, json: true, proposals: '0', transverseLoads: true }, ['--out', 'x.pdf'])).toBe(
      'pmchart check --fc 4 --bars-per-face 3 --transverse-loads --out x.pdf',
    );
  });
});
