/**
 * Plot details of a sheet: shared group scales, fixed group axes, bar-entry steps and their smoothed
 * drawing, the nominal family's tone, and the label placer.
 */
import { describe, expect, it } from 'vitest';
import { buildSheet, barEntryIndices } from '../../src/chart/sheet-data.js';
import { roundScale, roundStep, tickFormat, tickValues } from '../../src/chart/axes.js';
import { LabelPlacer, segmentHitsBox } from '../../src/chart/labels.js';
import { sheetSpec } from '../../src/chart/spec.js';
import { familyForSheet, groupExtents } from '../../src/sheet/curves.js';
import { referenceSet } from '../helpers/chart-set.js';
import { expectClose } from '../helpers/tolerance.js';

const build = (over: Record<string, unknown> = {}, k = 0, extents = false) => {
  const set = referenceSet(over);
  const sheet = set.sheets[k]!;
  const family = familyForSheet(set, sheet);
  const extent = extents ? groupExtents(set)[sheet.origin] : undefined;
  return { set, family, built: buildSheet({ set, sheet, family, sheetNumber: k + 1, sheetCount: set.sheets.length, generator: 'pmchart 0.1.0', ...(extent ? { extent } : {}) }) };
};

describe('round axis steps (common practice: 1, 2, 2.5, 5 × 10^k)', () => {
  it('picks the smallest round step for the tick count and ends on round values', () => {
    expect(roundStep(2.15, 10)).toBe(0.25);
    expect(roundStep(10, 10)).toBe(1);
    expect(roundStep(0.42, 8)).toBe(0.1);
    expect(roundScale(-4.32, 6.17, 12)).toEqual({ domain: [-5, 7], step: 1 });
    expect(roundScale(0, 1.75, 8)).toEqual({ domain: [0, 1.75], step: 0.25 });
    expect(tickValues({ domain: [-0.5, 0.5], step: 0.25 })).toEqual([-0.5, -0.25, 0, 0.25, 0.5]);
    expect(tickFormat({ domain: [0, 1], step: 0.25 })).toBe('.2f');
    expect(tickFormat({ domain: [0, 10], step: 2 })).toBe('.0f');
  });
  it('handles an empty span', () => {
    expect(roundStep(0, 10)).toBe(1);
    expect(roundStep(NaN, 10)).toBe(1);
  });
});

describe('group scales', () => {
  const group = { sheets: [{ fc: [4, 8], fy: 60, gamma: [0.6, 0.9], arrangement: { kind: 'two-faces', barsPerFace: 3 } }, { fc: 5, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }] };
  it('draws the sheets of a group to one scale, the envelope of its sheets, where each sheet fills 75 % of it', () => {
    // f′c 8 ksi, γ 0.8 and 0.85: near-identical families share the group's scale
    const close = { sheets: [{ fc: 8, fy: 60, gamma: [0.8, 0.85], arrangement: { kind: 'two-faces', barsPerFace: 3 } }] };
    const shared = [0, 1].map((k) => build(close, k, true).built.template.axes);
    expect(shared[1]).toEqual(shared[0]);
    const own = build(close, 1).built.template.axes!;
    expect(shared[0]!.M.domain[1]).toBeGreaterThanOrEqual(own.M.domain[1]);
  });
  it('gives a sheet its own scale where the group envelope would leave its curves under 75 % of an axis', () => {
    // f′c 4 ksi, γ 0.6 beside f′c 8 ksi, γ 0.9: at P/Ag in ksi the weaker family spans about half the
    // stronger one's range (P scales with f′c), so a shared scale would leave half its plot empty
    const axes = [0, 1, 2, 3].map((k) => build(group, k, true).built.template.axes!);
    expect(axes[0]).toEqual(build(group, 0).built.template.axes);
    expect(axes[0]).not.toEqual(axes[3]);
    // a separate group keeps its own scale
    expect(build(group, 4, true).built.template.axes).not.toEqual(axes[0]);
  });
  it('takes a group’s fixed axes as given', () => {
    const fixed = { sheets: [{ ...group.sheets[1], axes: { P: [-6, 8], M: [0, 3] } }] };
    const { built } = build(fixed);
    expect(built.template.axes!.P.domain).toEqual([-6, 8]);
    expect(built.template.axes!.M.domain).toEqual([0, 3]);
    const spec = sheetSpec(built.template, built.data) as { encoding: { y: { scale: { domain: number[] } } } };
    expect(spec.encoding.y.scale.domain).toEqual([-6, 8]);
  });
  it('refuses axes whose low end is not below the high end, naming the field', () => {
    expect(() => build({ sheets: [{ ...group.sheets[1], axes: { M: [2, 1] } }] })).toThrow(/^sheets\[0\]\.axes\.M: .*must be \[low, high\]/);
  });
});

describe('bar-entry steps', () => {
  // f′c 12 ksi, fy 60 ksi, γ 0.75, 4 bars per face on four faces (12 bars): the middle rows hold 2 bars each,
  // at ±γh/6 = ±0.125 h from the centroid. Hand calculation (ACI 318-19 22.2.2.4.1, block stress 0.85·f′c,
  // displaced concrete deducted; φ = 0.65 compression-controlled, 21.2.2): at ρg 0.08 a middle row has
  // As = 0.08·2/12 Ag, so φ·ΔP = 0.65·0.85·12·0.08/6 = 0.0884 ksi and φ·ΔM = 0.0884·0.125 = 0.01105 ksi.
  const over = { rhoG: [0.08], sheets: [{ fc: 12, fy: 60, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: 4 } }] };
  it('with barEntry: "steps" draws each step as one straight segment between the two states at the same depth', () => {
    const { built } = build({ ...over, referenceLines: { barEntry: 'steps' } });
    const rows = built.data.curves;
    const drops = rows.slice(1).map((r, i) => ({ dP: r.P - rows[i]!.P, dM: r.M - rows[i]!.M })).filter((d) => d.dP < -0.05);
    const mid = drops.find((d) => Math.abs(d.dP + 0.0884) < 0.002);
    expect(mid).toBeDefined();
    expectClose(mid!.dP, -0.0884, 1e-3);
    expectClose(mid!.dM, -0.01105, 1e-3);
  });
  it('steps only between two states at one depth (no ramp across a sweep interval)', () => {
    const { family } = build(over);
    const { cOverH } = family.sweep;
    const P = family.curves[0]!.phiPn;
    let steps = 0;
    for (let i = 1; i < P.length; i++) {
      if (P[i]! < P[i - 1]! - 1e-9) {
        steps++;
        expect(cOverH[i]! / cOverH[i - 1]! - 1, `c/h ${cOverH[i]}`).toBeLessThan(1e-6);
      }
    }
    expect(steps).toBeGreaterThanOrEqual(2);
  });
  it('with barEntry: false draws no step back in P and says which model it shows', () => {
    const { built, family } = build({ ...over, referenceLines: { barEntry: false } });
    expect(barEntryIndices(family.sweep.cOverH).size).toBeGreaterThan(0);
    const rows = built.data.curves;
    // between pure tension and the cap, P rises monotonically (bar-entry steps are the only reversals)
    const top = rows.findIndex((r) => r.P >= Math.max(...rows.map((q) => q.P)) - 1e-9);
    for (let i = 1; i <= top; i++) expect(rows[i]!.P).toBeGreaterThanOrEqual(rows[i - 1]!.P - 1e-9);
    expect(built.data.texts.some((t) => t.text.startsWith('Drawn smoothed'))).toBe(true);
  });
});

describe('families: both', () => {
  it('draws nominal curves in the design curve’s colour, dashed and lighter in weight, labels them and pairs them in a key', () => {
    const { built } = build({ families: 'both' });
    const d = built.data.curves.find((c) => c.curve === 'design-0.02')!.colour;
    const n = built.data.curves.find((c) => c.curve === 'nominal-0.02')!.colour;
    expect(n).toBe(d);
    const spec = sheetSpec(built.template, built.data) as { layer: { name: string; mark: { strokeDash?: number[]; strokeWidth: number } }[] };
    const nom = spec.layer.find((l) => l.name === 'curves_nominal')!.mark;
    const des = spec.layer.find((l) => l.name === 'curves_design')!.mark;
    expect(nom.strokeDash!.length).toBeGreaterThan(0);
    expect(des.strokeDash).toBeUndefined();
    expect(nom.strokeWidth).toBeLessThan(des.strokeWidth);
    // nominal curves carry their own labels in the compression zone ("ρg 0.02 n")
    expect(built.data.curveLabels.filter((l) => l.text === 'ρg 0.02 n' && l.P > 0).length).toBeGreaterThanOrEqual(2);
    expect(built.data.texts.some((t) => t.text.startsWith('solid φ-factored · dashed nominal'))).toBe(true);
  });
});

describe('label placer', () => {
  it('never places a label over another and prefers boxes that cross fewer lines', () => {
    const p = new LabelPlacer({ x0: 0, y0: 0, x1: 100, y1: 100 });
    p.addObstacle({ group: 'a', weight: 1, segments: [[0, 10, 100, 10]] });
    const a = { box: { x0: 0, y0: 5, x1: 20, y1: 15 }, penalty: 0 };
    const b = { box: { x0: 0, y0: 20, x1: 20, y1: 30 }, penalty: 0.5 };
    expect(p.place([a, b])).toBe(1);
    expect(p.place([b])).toBe(-1);
    expect(p.place([{ box: { x0: 90, y0: 90, x1: 110, y1: 95 }, penalty: 0 }])).toBe(-1);
    expect(segmentHitsBox([0, 0, 10, 10], { x0: 4, y0: 4, x1: 6, y1: 6 })).toBe(true);
    expect(segmentHitsBox([0, 0, 10, 0], { x0: 4, y0: 4, x1: 6, y1: 6 })).toBe(false);
  });
});
