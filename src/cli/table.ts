/**
 * `pmchart table`: normalised curve families as CSV or JSON. Needs no section size.
 * CSV columns (stable interface): rho_g,c_over_h,eps_t,phi,Pn_norm,Mn_norm,phiPn_norm,phiMn_norm
 */
import type { Command } from 'commander';
import type { CurveFamily, KeyPoint, PointValues } from '../analysis/family.js';
import { DISPLAY_UNITS } from '../units/index.js';
import { generatorLabel } from '../version.js';
import { csvLine, fmt, num } from '../flags/format.js';
import { addSectionOptions } from '../flags/section-flags.js';
import { familyBatches, resolveTableOptions, type TableOptions, type TableRequest } from '../flags/table-flags.js';
export * from '../flags/table-flags.js';

import { TABLE_COLUMNS } from '../chart/lookup-table.js';
import { CAUTION } from '../report/caution.js';
export { CAUTION, TABLE_COLUMNS };

/** Runs the command and returns the text it prints (tests call this without the parser). */
export function runTable(o: TableOptions): string {
  return [...tablePieces(o)].join('');
}

/** The command's output in pieces of one curve each, so that it can be streamed with flat memory. */
export function tablePieces(o: TableOptions): Iterable<string> {
  const req = resolveTableOptions(o);
  return (o.format ?? 'csv') === 'json' ? tableJsonPieces(familyBatches(req), req) : tableCsvPieces(familyBatches(req), req);
}

/** Writes the pieces to a stream, waiting for it to drain: memory stays flat for 2,000 curves. */
export async function streamTable(o: TableOptions, out: NodeJS.WritableStream = process.stdout): Promise<void> {
  for (const piece of tablePieces(o)) if (!out.write(piece)) await new Promise((r) => out.once('drain', r));
}

export function tableCsv(family: CurveFamily, req: TableRequest): string {
  return [...tableCsvPieces([{ family, first: 0 }], req)].join('');
}

function* tableCsvPieces(batches: Iterable<{ family: CurveFamily; first: number }>, req: TableRequest): Generator<string> {
  yield `${csvLine(TABLE_COLUMNS)}\n`;
  for (const { family } of batches) yield* curveCsvPieces(family, req);
}

function* curveCsvPieces(family: CurveFamily, req: TableRequest): Generator<string> {
  const k = req.dimensionless ? 1 / family.basis.normalisingStress : 1;
  const { cOverH, epsT, phi } = family.sweep;
  for (const c of family.curves) {
    const lines: string[] = [];
    for (let i = 0; i < cOverH.length; i++) {
      lines.push(csvLine([c.rho, cOverH[i]!, epsT[i]!, phi[i]!, c.Pn[i]! * k, c.Mn[i]! * k, c.phiPn[i]! * k, c.phiMn[i]! * k]));
    }
    yield `${lines.join('\n')}\n`;
  }
}

const pointJson = (p: PointValues | null, k: number, prefix: 'n' | 'phi') =>
  p === null
    ? null
    : {
        c_over_h: num(p.cOverH),
        eps_t: num(p.epsT),
        phi: num(p.phi),
        [prefix === 'n' ? 'Pn_norm' : 'phiPn_norm']: num(p.P * k),
        [prefix === 'n' ? 'Mn_norm' : 'phiMn_norm']: num(p.M * k),
      };

export const keyPointJson = (kp: KeyPoint, k: number) => ({
  id: kp.id,
  label: kp.label,
  nominal: pointJson(kp.nominal, k, 'n'),
  factored: pointJson(kp.design, k, 'phi'),
});

export function normalisationInfo(family: CurveFamily, dimensionless: boolean) {
  const b = family.basis;
  const su = DISPLAY_UNITS[b.units].stress;
  const s = b.symbols;
  const ag = family.shape.kind === 'circle' ? 'Ag·D' : 'b·h²';
  const ap = family.shape.kind === 'circle' ? 'Ag' : 'b·h';
  return dimensionless
    ? { kind: 'dimensionless', unit: '1', axial: `${s.nominalAxial}/(${s.normalisingStress}·${ap})`, moment: `${s.nominalMoment}/(${s.normalisingStress}·${ag})`, divisor: num(b.normalisingStress) }
    : { kind: 'stress', unit: su, axial: `${s.nominalAxial}/(${ap})`, moment: `${s.nominalMoment}/(${ag})`, divisor: 1 };
}

export function tableJson(family: CurveFamily, req: TableRequest): string {
  return [...tableJsonPieces([{ family, first: 0 }], req)].join('');
}

/** Placeholder for the curves while the rest of the document is written (the curves follow one by one). */
const CURVES_SLOT = '\u0000curves\u0000';

/**
 * The JSON document in pieces with exactly the bytes of JSON.stringify(document, null, 1): the
 * head with a placeholder for the curve list, then each curve indented to its depth.
 */
function* tableJsonPieces(batches: Iterable<{ family: CurveFamily; first: number }>, req: TableRequest): Generator<string> {
  const it = batches[Symbol.iterator]();
  const firstBatch = it.next().value as { family: CurveFamily; first: number };
  const family = firstBatch.family;
  const b = family.basis;
  const k = req.dimensionless ? 1 / b.normalisingStress : 1;
  const su = DISPLAY_UNITS[b.units].stress;
  const s = req.section;
  const out = {
    generator: generatorLabel(),
    code: b.code,
    codeTitle: b.title,
    units: b.units,
    normalisation: normalisationInfo(family, req.dimensionless),
    inputs: {
      fc: num(b.fc),
      fy: num(b.fy),
      stressUnit: su,
      shape: family.shape.kind,
      gamma: num(family.gamma),
      ...(s.gammaB !== undefined ? { gammaB: num(s.gammaB) } : {}),
      gammaSource: s.gammaSource,
      arrangement: family.arrangement,
      transverse: b.transverse,
      rho_g: req.rhos,
      ...(req.omegas ? { omega: req.omegas } : {}),
    },
    basis: { parameters: b.parameters, notes: b.notes, symbols: b.symbols },
    columns: TABLE_COLUMNS,
    curves: CURVES_SLOT,
    caution: CAUTION,
  };
  const curve = (f: CurveFamily, c: CurveFamily['curves'][number], j: number) => ({
    rho_g: c.rho,
    ...(req.omegas ? { omega: req.omegas[j] } : {}),
    key_points: c.keyPoints.map((kp) => keyPointJson(kp, k)),
    points: Array.from(f.sweep.cOverH, (_, i) => [c.rho, num(f.sweep.cOverH[i]!), num(f.sweep.epsT[i]!), num(f.sweep.phi[i]!), num(c.Pn[i]! * k), num(c.Mn[i]! * k), num(c.phiPn[i]! * k), num(c.phiMn[i]! * k)]),
  });
  const [head, tail] = (JSON.stringify(out, null, 1) + '\n').split(JSON.stringify(CURVES_SLOT)) as [string, string];
  yield `${head}[\n`;
  const total = req.rhos.length;
  let batch: { family: CurveFamily; first: number } | undefined = firstBatch;
  while (batch) {
    for (const [j, c] of batch.family.curves.entries()) {
      const at = batch.first + j;
      const text = JSON.stringify(curve(batch.family, c, at), null, 1).replace(/\n/g, '\n  ');
      yield `  ${text}${at < total - 1 ? ',' : ''}\n`;
    }
    const n = it.next();
    batch = n.done ? undefined : n.value;
  }
  yield ` ]${tail}`;
}


export function registerTable(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  const cmd = program.command('table').description('normalised interaction-curve family as CSV or JSON (no section size needed)');
  addSectionOptions(cmd)
    .option('--rho <list>', 'ρg values: start:stop:step or a comma list (default 0.01:0.08:0.01)')
    .option('--omega <list>', 'instead of --rho: mechanical ratios ω = As·fyd/(Ac·fcd) (fy/f′c for ACI and CSA), start:stop:step or a comma list')
    .option('--format <fmt>', 'csv or json', 'csv')
    .option('--dimensionless', 'divide the normalised values by the normalising stress (f′c, or fcd for EN 1992-1-1)')
    .option('--points <n>', 'base points per curve before key points are added (≥ 400)', '400')
    .action((opts: TableOptions) => run(() => streamTable(opts)));
}

export { fmt };
