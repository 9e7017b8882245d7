/**
 * The page's fields (pure): every list the page offers comes from the library's own lists (the basis
 * registry and the enumerations the flag readers validate against), and messages are in the page's words —
 * field names, not the command line's flags — mapped in one place (fields.ts).
 */
import { describe, expect, it } from 'vitest';
import { BASIS_IDS } from '../../src/codes/registry.js';
import { TRANSVERSE_TYPES } from '../../src/codes/types.js';
import { PmError, ERROR_CODES } from '../../src/errors.js';
import { CONCRETE_LAWS, STEEL_BRANCHES } from '../../src/input/limits.js';
import { pageBody } from '../../src/page/markup.js';
import { loadsView, type PageFields } from '../../src/page/engine.js';
import { pageMessage, pageWords } from '../../src/page/fields.js';
import { ARRANGEMENTS, SHAPES } from '../../src/section/types.js';
import { UNIT_SYSTEMS } from '../../src/units/index.js';

/** The option values of the select named `name` in the page's markup. */
function options(name: string): string[] {
  const html = pageBody('caution');
  const select = new RegExp(`<select id="f-${name}"[^>]*>([\\s\\S]*?)</select>`).exec(html);
  if (!select) throw new Error(`no select ${name}`);
  return [...select[1]!.matchAll(/<option value="([^"]*)"/g)].map((m) => m[1]!);
}

describe('page fields', () => {
  it('lists every design basis of the registry, AS 3600 included', () => {
    expect(options('code')).toEqual([...BASIS_IDS]);
    expect(options('code')).toContain('as3600-2018');
  });

  it('lists shapes, arrangements, transverse types, unit systems and the basis options from the library’s lists', () => {
    expect(options('shape')).toEqual([...SHAPES]);
    // 'custom' reads a bar file, which the page has no field for
    expect(options('arrangement')).toEqual(ARRANGEMENTS.filter((a) => a !== 'custom'));
    expect(options('transverse')).toEqual([...TRANSVERSE_TYPES]);
    expect(options('units')).toEqual(['', ...UNIT_SYSTEMS]);
    expect(options('concreteLaw')).toEqual(['', ...CONCRETE_LAWS]);
    expect(options('steelBranch')).toEqual(['', ...STEEL_BRANCHES]);
  });

  it('says problems in field names, not flags', () => {
    const loads = new PmError(ERROR_CODES.invalidValue, '--loads line 3 Pu', 'is not a number', { value: 'abc' });
    expect(pageMessage(loads)).toBe('pasted loads line 3 Pu: abc is not a number');
    const circle = new PmError(ERROR_CODES.conflict, '--b/--h', 'do not apply to --shape circle; give --diameter');
    expect(pageMessage(circle)).toBe('b/h: do not apply to Shape circle; give D');
    const gamma = new PmError(ERROR_CODES.outOfRange, '--gamma', 'is outside 0.3–0.95', { value: 1.2, allowed: '0.3–0.95' });
    expect(pageMessage(gamma)).toBe('γ: 1.2 is outside 0.3–0.95');
    expect(pageWords('give --rho or a bar layout')).toBe('give ρg list or a bar layout');
    expect(pageWords('--omega and --rho both set the curves')).toBe('ω list and ρg list both set the curves');
    // a flag the page has no field for keeps its name, without the dashes
    expect(pageWords('--klu: is outside')).toBe('klu: is outside');
    expect(pageMessage(loads)).not.toMatch(/--/);
  });

  it('the page’s one door into the library (engine.ts) hands back its problems in those words', async () => {
    const fields = { fc: '4', fy: '60', gamma: '0.8', shape: 'circle', arrangement: 'ring', bars: '8', b: '16', h: '24' } as PageFields;
    const lv = await loadsView(fields, { kind: 'typed', pu: '500', mu: '100' }, 0.05);
    expect(lv.ok).toBe(false);
    if (lv.ok) return;
    expect(lv.problem.path).toBe('--b/--h');
    expect(lv.problem.message).toBe('b/h: do not apply to Shape circle; give D');
  });
});
