/**
 * What the page hands back to the command line: `pmchart sheet …` / `pmchart check …` lines that
 * reproduce the view, and a chart-set JSON snippet for `pmchart set`. Formatting only.
 */
import { DISPLAY_UNITS } from '../units/index.js';
import type { ChartView, PageFields } from './engine.js';

const kebab = (key: string): string => `--${key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;

/** POSIX shell quoting: plain words stay bare, anything else goes in single quotes. */
export function shellWord(s: string): string {
  return /^[A-Za-z0-9_.,:/+=@%-]+$/.test(s) ? s : `'${s.replace(/'/g, `'\\''`)}'`;
}

/** Keys the page uses internally and never prints. */
const HIDDEN = new Set(['json', 'proposals', 'date', 'format']);

/** `pmchart <command> --flag value …` from option keys, in the given order; unset and false options are left out. */
export function commandLine(command: string, options: Record<string, unknown>, tail: string[] = []): string {
  const words = ['pmchart', command];
  for (const [key, value] of Object.entries(options)) {
    if (HIDDEN.has(key) || value === undefined || value === false || value === '') continue;
    words.push(kebab(key));
    if (value !== true) words.push(shellWord(String(value)));
  }
  return [...words, ...tail].join(' ');
}

/** A chart-set file for `pmchart set` holding the sheets that bracket the view's γ and the exact γ. */
export function chartSetSnippet(view: ChartView, fields: PageFields): string {
  const { set, request } = view;
  const sheet = set.sheets[0]!;
  const s = request.section;
  const gammas = [...new Set([...view.sheets.map((x) => x.gamma), Number(s.gamma.toPrecision(6))])].sort((a, b) => a - b);
  // basis options as the flags gave them (already checked by the chart's resolution)
  const options: Record<string, number | string> = {};
  for (const k of ['alphaCc', 'gammaC', 'gammaS', 'steelK', 'steelEpsUk'] as const) if (fields[k]) options[k] = Number(fields[k]);
  for (const k of ['concreteLaw', 'steelBranch'] as const) if (fields[k]) options[k] = fields[k]!;
  const unit = DISPLAY_UNITS[s.units].stress;
  const file = {
    name: 'page-view',
    titleBlock: { office: '', project: '' },
    units: set.units,
    basis: { code: set.code, ...(Object.keys(options).length ? { options } : {}) },
    normalisation: set.normalisation,
    families: set.families,
    [set.ratios.kind === 'omega' ? 'omega' : 'rhoG']: set.ratios.values,
    referenceLines: { eccentricities: set.referenceLines.eccentricities },
    sheets: [
      {
        shape: sheet.shape.kind === 'circle' ? 'circle' : { kind: 'rectangle', aspect: Number(sheet.shape.aspect.toPrecision(6)) },
        fc: `${Number(s.basis.fc.toPrecision(6))}${unit}`,
        fy: `${Number(s.basis.fy.toPrecision(6))}${unit}`,
        gamma: gammas,
        ...(sheet.gammaB !== undefined ? { gammaB: sheet.gammaB } : {}),
        arrangement: sheet.arrangement,
        transverse: sheet.transverse,
      },
    ],
  };
  return JSON.stringify(file, null, 2);
}
