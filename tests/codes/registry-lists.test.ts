/**
 * Every list of bases is derived from the registry (issue 19): the --code help, the live page's basis
 * select, the chart-set schema's description and its "unknown basis" message. The page's select once
 * lacked AS 3600-2018; these checks fail if any list is spelled by hand again and drifts.
 */
import { Command } from 'commander';
import { describe, expect, it } from 'vitest';
import { BASIS_IDS, DESIGN_CODE_LIST, DESIGN_CODES } from '../../src/codes/registry.js';
import { schemaText } from '../../src/config/write-schema.js';
import { addSectionOptions } from '../../src/flags/section-flags.js';
import { FIELD_GROUPS } from '../../src/page/fields.js';

describe('lists of bases come from the registry', () => {
  it('BASIS_IDS is the registry in order, and includes AS 3600-2018 (common practice: one source of truth)', () => {
    expect(BASIS_IDS).toEqual(Object.keys(DESIGN_CODES));
    expect(BASIS_IDS).toContain('as3600-2018');
  });
  it('the page’s basis select offers every basis of the registry, with its title', () => {
    const field = FIELD_GROUPS.flatMap((g) => g.fields).find((f) => f.key === 'code')!;
    expect(field.options).toEqual(DESIGN_CODE_LIST.map((c) => [c.id, c.title]));
  });
  it('the --code help lists every basis of the registry', () => {
    const cmd = addSectionOptions(new Command('x'));
    const help = cmd.options.find((o) => o.long === '--code')!.description;
    for (const id of BASIS_IDS) expect(help).toContain(id);
  });
  it('the chart-set JSON Schema describes basis.code with every basis of the registry', () => {
    const schema = JSON.parse(schemaText());
    const text: string = schema.properties.basis.properties.code.description;
    for (const id of BASIS_IDS) expect(text).toContain(id);
  });
});
