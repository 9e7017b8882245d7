/**
 * Every rule registered in a rulebook has a row in the clause matrix (tests/codes/clause-matrix.ts) that
 * names a real test exercising it and the outside reference it is checked against (issue 19). The bases
 * are walked from the registry, never from a hand list: a rule added to any basis without a row fails here.
 */
import { readFileSync, existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DESIGN_CODES, resolveBasis } from '../../src/codes/registry.js';
import type { Basis, DesignCode, Transverse } from '../../src/codes/types.js';
import { CLAUSE_MATRIX } from './clause-matrix.js';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

/** Every basis a code resolves to for the options that change its rules (units, transverse type). */
function bases(code: DesignCode): Basis[] {
  const out: Basis[] = [];
  for (const units of code.unitSystems) {
    for (const transverse of ['tied', 'spiral'] as Transverse[]) {
      const lim = code.limits(units);
      out.push(resolveBasis(code.id, { units, fc: (lim.fc[0] + lim.fc[1]) / 4, fy: lim.fy[0], transverse }));
    }
  }
  return out;
}

/** Whether the file has an `it(` or `describe(` block with exactly this name. */
function hasTest(text: string, name: string): boolean {
  return text.split('\n').some((line) => /\b(it|describe)\(/.test(line) && line.includes(name));
}

describe('clause matrix: every rule of every rulebook has a test row', () => {
  const codes = Object.values(DESIGN_CODES) as DesignCode[];
  for (const code of codes) {
    it(`${code.title}: each rule has a row naming a real test, with the rule's own source`, () => {
      const rows = CLAUSE_MATRIX[code.id];
      expect(rows, `no clause-matrix rows for ${code.id}`).toBeDefined();
      const seen = new Set<string>();
      for (const basis of bases(code)) {
        for (const rule of basis.rules) {
          seen.add(rule.id);
          const row = rows![rule.id];
          expect(row, `${code.id}: rule '${rule.id}' (${rule.clause}) has no clause-matrix row`).toBeDefined();
          expect(row!.source, `${code.id} ${rule.id}: source`).toBe(rule.source);
          expect(row!.reference.length).toBeGreaterThan(0);
          const file = resolve(root, row!.file);
          expect(existsSync(file), `${row!.file} does not exist`).toBe(true);
          expect(hasTest(readFileSync(file, 'utf8'), row!.test), `${row!.file} has no test '${row!.test}'`).toBe(true);
        }
      }
      // no stale rows: every row belongs to a rule the rulebook registers
      for (const id of Object.keys(rows!)) expect(seen, `${code.id}: row '${id}' has no rule`).toContain(id);
    });
  }
  it('has no rows for a basis the registry does not know', () => {
    for (const id of Object.keys(CLAUSE_MATRIX)) expect(Object.keys(DESIGN_CODES)).toContain(id);
  });
});

describe('the README lists every rule of every basis with its clause and source', () => {
  const readme = readFileSync(resolve(root, 'README.md'), 'utf8');
  for (const code of Object.values(DESIGN_CODES) as DesignCode[]) {
    it(`${code.title}: a row per rule in the rulebook section`, () => {
      const start = readme.indexOf(`(\`${code.id}\`)\n\n| rule | clause |`);
      expect(start, `no rule table for ${code.id} in README.md`).toBeGreaterThan(0);
      const table = readme.slice(start, readme.indexOf('\n\n', readme.indexOf('| --- |', start)));
      for (const rule of bases(code)[0]!.rules) expect(table).toContain(`| \`${rule.id}\` | ${rule.clause} |`);
      for (const rule of bases(code)[0]!.rules) expect(table).toMatch(new RegExp(`\\| \`${rule.id}\` \\|[^\\n]*\\| ${rule.source} \\|`));
    });
  }
});
