import { readChartSet } from '../../src/config/read.js';

/** A small US set around the first-principles chart points of ACI 318-19 22.2 strain compatibility (hand calculation; f′c 4 ksi, fy 60 ksi, γ 0.80, two faces); invented office and project. */
export const referenceSet = (over: Record<string, unknown> = {}) =>
  readChartSet(
    JSON.stringify({
      name: 'reference',
      titleBlock: { office: 'Fenwick Hollow Engineers (invented)', project: 'Test Bay Annex (invented)', date: '2026-01-05' },
      units: 'us',
      basis: { code: 'aci318-19' },
      paper: { size: 'letter' },
      rhoG: [0.01, 0.02, 0.04, 0.08],
      sheets: [{ fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
      ...over,
    }),
  );
