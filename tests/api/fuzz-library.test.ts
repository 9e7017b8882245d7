/**
 * Fuzzing the library's entry points (issue 25), as the CLI is fuzzed: 10,000 generated inputs, each field
 * either sound or spoiled (NaN, ±∞, negative, zero, huge, null, a string, a wrong kind). Every call either
 * throws a PmError naming a field, or returns a finite, plausible result (statuses from LOAD_STATUSES, an "ok"
 * load has utilisation ≤ 1, curve points finite with the squash load the largest P). Sound checks are kept to
 * about one in ten and uniaxial (a biaxial check takes 0.1 s), so the file runs in a few seconds.
 * Fixed seed in CI (tests/helpers/fast-check-setup.ts); FC_RANDOM=1 explores new seeds.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkColumn, computeFamily, LOAD_STATUSES, PmError, resolveBasis } from '../../src/index.js';

const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const spoilt = fc.constantFrom<unknown>(NaN, Infinity, -Infinity, -1, 0, 1e300, -18, null, undefined, 'x', {}, [], true);
/** A sound value most of the time, else a spoilt one; `p` is the share of spoilt values. */
const maybe = <T>(good: fc.Arbitrary<T>, p: number) => fc.oneof({ weight: Math.round(100 * (1 - p)), arbitrary: good as fc.Arbitrary<unknown> }, { weight: Math.round(100 * p), arbitrary: spoilt });

const rectangle = fc.record({ kind: fc.constant('rectangle'), b: maybe(fc.double({ min: 10, max: 40, noNaN: true }), 0.1), h: maybe(fc.double({ min: 10, max: 40, noNaN: true }), 0.1) });
const circle = fc.record({ kind: fc.constant('circle'), diameter: maybe(fc.double({ min: 12, max: 40, noNaN: true }), 0.1) });
const arrangement = fc.oneof(
  fc.record({ kind: fc.constant('two-faces'), barsPerFace: maybe(fc.integer({ min: 1, max: 20 }), 0.1) }),
  fc.record({ kind: fc.constant('four-faces'), barsPerFace: maybe(fc.integer({ min: 2, max: 20 }), 0.1) }),
  fc.record({ kind: fc.constant('ring'), bars: maybe(fc.integer({ min: 4, max: 48 }), 0.1) }),
  fc.record({ kind: fc.constant('spiral-ish'), bars: fc.integer() }),
);
const load = fc.record({ id: maybe(fc.string({ minLength: 1, maxLength: 8 }), 0.05), Pu: maybe(fc.double({ min: -500, max: 3000, noNaN: true }), 0.1), Mu: maybe(fc.double({ min: -6000, max: 6000, noNaN: true }), 0.1) });

let checks = 0;
let families = 0;

describe('library fuzz', () => {
  it('checkColumn: 3,000 generated inputs give a PmError or a plausible check', () => {
    fc.assert(
      fc.property(
        fc.record({
          basis: maybe(fc.constant(basis), 0.03),
          shape: maybe(fc.oneof(rectangle, circle), 0.03),
          arrangement: maybe(arrangement, 0.03),
          gamma: maybe(fc.double({ min: 0.3, max: 0.95, noNaN: true }), 0.4),
          rho: maybe(fc.double({ min: 0.01, max: 0.08, noNaN: true }), 0.4),
          loads: maybe(fc.array(load, { minLength: 1, maxLength: 2 }), 0.4),
        }),
        (input) => {
          checks++;
          let out;
          try {
            out = checkColumn(input as unknown as Parameters<typeof checkColumn>[0]);
          } catch (e) {
            expect(e).toBeInstanceOf(PmError);
            expect((e as PmError).path).not.toBe('');
            return;
          }
          for (const r of out.results) {
            expect(LOAD_STATUSES).toContain(r.status);
            if (input.rho !== undefined) {
              // a given ρg: a finite utilisation, and "ok" means it is at most 1
              expect(Number.isFinite(r.utilisation), JSON.stringify({ status: r.status, u: r.utilisation })).toBe(true);
              expect(r.utilisation!).toBeGreaterThanOrEqual(0);
              if (r.status === 'ok') expect(r.utilisation!).toBeLessThanOrEqual(1 + 1e-9);
            } else if (r.rhoRequired !== null) {
              // none given: the ρg required is a ratio within the basis's limits (ACI 318-19 10.6.1.1: 0.01–0.08)
              expect(r.rhoRequired).toBeGreaterThanOrEqual(0.01 - 1e-12);
              expect(r.rhoRequired).toBeLessThanOrEqual(0.08 + 1e-12);
            }
          }
        },
      ),
      { numRuns: 3000 },
    );
    expect(checks).toBeGreaterThanOrEqual(3000);
  });

  it('computeFamily: 7,000 generated requests give a PmError or finite curves', () => {
    fc.assert(
      fc.property(
        fc.record({
          basis: maybe(fc.constant(basis), 0.03),
          shape: maybe(fc.oneof(fc.constant({ kind: 'rectangle', b: 1, h: 1 }), fc.constant({ kind: 'circle', diameter: 1 })), 0.03),
          arrangement: maybe(arrangement, 0.03),
          gamma: maybe(fc.double({ min: 0.3, max: 0.95, noNaN: true }), 0.1),
          rhos: maybe(fc.array(maybe(fc.double({ min: 0.001, max: 0.1, noNaN: true }), 0.05), { minLength: 1, maxLength: 3 }), 0.05),
          basePoints: maybe(fc.integer({ min: 16, max: 40 }), 0.1),
        }),
        (request) => {
          families++;
          let f;
          try {
            f = computeFamily(request as unknown as Parameters<typeof computeFamily>[0]);
          } catch (e) {
            expect(e).toBeInstanceOf(PmError);
            expect((e as PmError).path).not.toBe('');
            return;
          }
          for (const c of f.curves) {
            const all = [...c.Pn, ...c.Mn, ...c.phiPn, ...c.phiMn];
            expect(all.every(Number.isFinite)).toBe(true);
            // the squash load is the largest axial capacity of a curve (ACI 318-19 22.4.2.2, common practice)
            const po = c.keyPoints.find((k) => k.id === 'pure-compression')!.nominal!.P;
            expect(Math.max(...c.Pn)).toBeLessThanOrEqual(po * (1 + 1e-9));
            expect(po).toBeGreaterThan(0);
          }
        },
      ),
      { numRuns: 7000 },
    );
    expect(families).toBeGreaterThanOrEqual(7000);
    expect(checks + families).toBeGreaterThanOrEqual(10_000);
  });
});
