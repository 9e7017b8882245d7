/**
 * Bar-size tables. Diameters and areas in the table's own system: in and in² (US), mm and mm² (SI).
 */
import type { BarSetId } from '../codes/types.js';
import type { UnitSystem } from '../units/index.js';

export interface BarSize {
  /** designation as written on drawings, e.g. "#8", "25", "25M" */
  name: string;
  diameter: number;
  area: number;
}

export interface BarSet {
  id: BarSetId;
  units: UnitSystem;
  source: string;
  sizes: readonly BarSize[];
}

/** ASTM A615/A615M Table 1 nominal dimensions (inch-pound designations). */
const ASTM_A615: BarSet = {
  id: 'astm-a615',
  units: 'us',
  source: 'ASTM A615/A615M, Table 1 (nominal diameter and area)',
  sizes: [
    { name: '#3', diameter: 0.375, area: 0.11 },
    { name: '#4', diameter: 0.5, area: 0.2 },
    { name: '#5', diameter: 0.625, area: 0.31 },
    { name: '#6', diameter: 0.75, area: 0.44 },
    { name: '#7', diameter: 0.875, area: 0.6 },
    { name: '#8', diameter: 1.0, area: 0.79 },
    { name: '#9', diameter: 1.128, area: 1.0 },
    { name: '#10', diameter: 1.27, area: 1.27 },
    { name: '#11', diameter: 1.41, area: 1.56 },
    { name: '#14', diameter: 1.693, area: 2.25 },
    { name: '#18', diameter: 2.257, area: 4.0 },
  ],
};

/** Common metric diameters 10–40 mm; area = π·d²/4 (common practice, rounded to 0.1 mm²). */
const metric = (id: BarSetId, source: string, diameters: number[]): BarSet => ({
  id,
  units: 'si',
  source,
  sizes: diameters.map((d) => ({ name: `${d}`, diameter: d, area: Math.round((Math.PI * d * d * 10) / 4) / 10 })),
});

/**
 * CSA G30.18 metric bar designations with nominal diameter (mm) and area (mm²), from memory of
 * CSA G30.18 Table 1 as quoted in CSA A23.3 practice; areas are the nominal (rounded) values.
 */
const CSA_G30_18: BarSet = {
  id: 'csa-g30.18',
  units: 'si',
  source: 'CSA G30.18, Table 1 nominal dimensions (from memory)',
  sizes: [
    { name: '10M', diameter: 11.3, area: 100 },
    { name: '15M', diameter: 16.0, area: 200 },
    { name: '20M', diameter: 19.5, area: 300 },
    { name: '25M', diameter: 25.2, area: 500 },
    { name: '30M', diameter: 29.9, area: 700 },
    { name: '35M', diameter: 35.7, area: 1000 },
    { name: '45M', diameter: 43.7, area: 1500 },
    { name: '55M', diameter: 56.4, area: 2500 },
  ],
};

/**
 * ASTM A615M soft-metric bar designations (nominal diameter mm, area mm²), from memory of the
 * standard's Table 1. Labelled "#25 (A615M)" so they are never read as the inch-pound #25 … sizes:
 * a US #10 is 1.27 in², an A615M #10 is 71 mm².
 */
const ASTM_A615M: BarSet = {
  id: 'astm-a615m',
  units: 'si',
  source: 'ASTM A615M, Table 1 soft-metric nominal dimensions (from memory)',
  sizes: [
    { name: '#10 (A615M)', diameter: 9.5, area: 71 },
    { name: '#13 (A615M)', diameter: 12.7, area: 129 },
    { name: '#16 (A615M)', diameter: 15.9, area: 199 },
    { name: '#19 (A615M)', diameter: 19.1, area: 284 },
    { name: '#22 (A615M)', diameter: 22.2, area: 387 },
    { name: '#25 (A615M)', diameter: 25.4, area: 510 },
    { name: '#29 (A615M)', diameter: 28.7, area: 645 },
    { name: '#32 (A615M)', diameter: 32.3, area: 819 },
    { name: '#36 (A615M)', diameter: 35.8, area: 1006 },
    { name: '#43 (A615M)', diameter: 43.0, area: 1452 },
    { name: '#57 (A615M)', diameter: 57.3, area: 2581 },
  ],
};

/** AS/NZS 4671 D500N deformed bars N12–N40 (nominal diameter mm, area mm²), from memory of the standard's table. */
const AS4671_D500N: BarSet = {
  id: 'as4671-d500n',
  units: 'si',
  source: 'AS/NZS 4671 D500N nominal dimensions (from memory)',
  sizes: [
    { name: 'N12', diameter: 12, area: 110 },
    { name: 'N16', diameter: 16, area: 200 },
    { name: 'N20', diameter: 20, area: 310 },
    { name: 'N24', diameter: 24, area: 450 },
    { name: 'N28', diameter: 28, area: 620 },
    { name: 'N32', diameter: 32, area: 800 },
    { name: 'N36', diameter: 36, area: 1020 },
    { name: 'N40', diameter: 40, area: 1260 },
  ],
};

export const BAR_SETS: Record<string, BarSet> = {
  'astm-a615': ASTM_A615,
  metric: metric('metric', 'common metric bar diameters 10–40 mm (common practice), area = π·d²/4', [10, 12, 14, 16, 20, 25, 28, 32, 36, 40]),
  // Diameters commonly stocked for EN 1992-1-1 work (common practice; EN 10080 leaves the range to product standards).
  'en-common': metric('en-common', 'common European bar diameters 12–40 mm (common practice), area = π·d²/4', [12, 14, 16, 20, 25, 28, 32, 40]),
  'csa-g30.18': CSA_G30_18,
  'as4671-d500n': AS4671_D500N,
  'astm-a615m': ASTM_A615M,
};

export function barSet(id: BarSetId): BarSet {
  const set = BAR_SETS[id];
  if (!set) throw new Error(`bar set ${id} is not registered`);
  return set;
}

/** Finds a bar size by name ("#9", "9", "25", "25M") in a set. */
export function findBar(set: BarSet, name: string): BarSize | undefined {
  const n = name.trim().toUpperCase().replace(/^NO\.?\s*/, '#').replace(/\s*\(A615M\)$/, '');
  return set.sizes.find((s) => {
    const base = s.name.toUpperCase().replace(/\s*\(A615M\)$/, '');
    return base === n || base === `#${n}` || base.replace(/M$/, '') === n.replace(/M$/, '');
  });
}
