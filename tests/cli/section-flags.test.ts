/** Shared section flags: γ from detailing (common practice) and the one-line errors. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { resolveSectionFlags } from '../../src/cli/section-flags.js';
import { GENERATOR } from '../../src/version.js';
import { expectClose } from '../helpers/tolerance.js';

describe('resolveSectionFlags', () => {
  it('derives γ from cover, tie and bar: 24 in, 1.5 in cover, #4 tie, #11 bars → (24 − 2·2.705)/24', () => {
    const s = resolveSectionFlags({ fc: '4', fy: '60', b: '24', h: '24', cover: '1.5', tie: '#4', bar: '#11' });
    expectClose(s.gamma, (24 - 2 * (1.5 + 0.5 + 0.705)) / 24, 1e-12);
    expect(s.gammaSource).toBe('bars');
    expect(s.bar).toMatchObject({ name: '#11', diameter: 1.41, area: 1.56 });
    expect(s.capContext.depth).toBe(24);
  });
  it('converts SI sizes; ACI in SI reads bar names from the ASTM A615M soft-metric table', () => {
    // ASTM A615M Table 1 (from memory): #10 is 9.5 mm, #25 is 25.4 mm and 510 mm²
    const s = resolveSectionFlags({ units: 'si', fc: '35', fy: '420', b: '500', h: '600', cover: '40', tie: '10', bar: '25' });
    expectClose(s.gamma, (600 - 2 * (40 + 9.5 + 12.7)) / 600, 1e-12);
    expect(s.bar!.area).toBe(510);
    expect(s.bar!.name).toBe('#25 (A615M)');
  });
  it('accepts a circle with a ring', () => {
    const s = resolveSectionFlags({ fc: '5', fy: '60', shape: 'circle', diameter: '24', arrangement: 'ring', bars: '10', gamma: '0.75', transverse: 'spiral' });
    expect(s.shape).toEqual({ kind: 'circle', diameter: 24 });
    expect(s.arrangement).toEqual({ kind: 'ring', bars: 10 });
  });
  it('names the flag and the allowed values on bad input', () => {
    const bad: [Record<string, string>, string][] = [
      [{ fy: '60', gamma: '0.8' }, '--fc: is required (a stress, default unit ksi)'],
      [{ fc: '4', fy: '60' }, '--gamma: is required, or --cover with --bar and --h (allowed: 0.3–0.95)'],
      [{ fc: '4', fy: '60', gamma: '0.8', shape: 'circle', arrangement: 'two-faces' }, '--arrangement: two-faces must be ring or custom for a circle'],
      [{ fc: '4', fy: '60', gamma: '0.8', units: 'imperial' }, '--units: imperial is not one of the allowed values (allowed: us, si)'],
      [{ fc: '4', fy: '60', gamma: '0.8', b: '24' }, '--h: is required when the other side is given'],
      [{ fc: '4', fy: '60', b: '24', h: '24', cover: '1.5', bar: '#12' }, '--bar: #12 is not a bar size of the table'],
      [{ fc: '4', fy: '60', gamma: '0.8', transverse: 'hoop' }, '--transverse: hoop is not one of the allowed values (allowed: tied, spiral)'],
    ];
    for (const [flags, msg] of bad) expect(() => resolveSectionFlags(flags)).toThrow(msg);
  });
  it('requires a size when the command needs one', () => {
    expect(() => resolveSectionFlags({ fc: '4', fy: '60', gamma: '0.8' }, true)).toThrow('--b/--h: is required for this command');
  });
});

describe('GENERATOR', () => {
  it('matches package.json', () => {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8'));
    expect(GENERATOR).toEqual({ name: pkg.name, version: pkg.version });
  });
});

describe('resolveSectionFlags: default units follow the basis', () => {
  it('takes si for EN 1992-1-1 and CSA A23.3, us for ACI', () => {
    expect(resolveSectionFlags({ code: 'en1992-1-1', fc: '30', fy: '500', gamma: '0.8' }).units).toBe('si');
    expect(resolveSectionFlags({ code: 'csa-a23.3-19', fc: '35', fy: '400', gamma: '0.8' }).units).toBe('si');
    expect(resolveSectionFlags({ fc: '4', fy: '60', gamma: '0.8' }).units).toBe('us');
  });
});
