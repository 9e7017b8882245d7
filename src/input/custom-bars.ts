/**
 * Custom-bar files: a JSON list of {x, y, share}, positions as fractions of b (or D) and h from the
 * centroid, share of Ast (normalised over the list). Checked by one zod schema; the front end says
 * how to name the place (`--custom-bars[3].share`). Browser-safe: the caller reads the file.
 */
import { z } from 'zod';
import { ERROR_CODES, PmError } from '../errors.js';
import type { CustomBar } from '../section/types.js';
import { list, parseOrThrow, ranged } from './fields.js';
import { CUSTOM_BAR_COORD_MAX, CUSTOM_BAR_SHARE_MAX, CUSTOM_BARS_RANGE, MAX_CUSTOM_BARS_BYTES } from './limits.js';

const coord = ranged([-CUSTOM_BAR_COORD_MAX, CUSTOM_BAR_COORD_MAX]);

export const CustomBarsSchema = list(
  z
    .object({
      x: coord.default(0),
      y: coord,
      share: z
        .number()
        .positive({ message: 'must be greater than 0' })
        .max(CUSTOM_BAR_SHARE_MAX, { message: `is above ${CUSTOM_BAR_SHARE_MAX}` })
        .default(1),
    })
    .strict(),
  CUSTOM_BARS_RANGE[1],
).min(CUSTOM_BARS_RANGE[0], { message: `must hold at least ${CUSTOM_BARS_RANGE[0]} bars {x, y, share}` });

/** Parses the text of a custom-bar file; `at` names the file (a flag or a config path). */
export function parseCustomBars(text: string, at: string): CustomBar[] {
  if (text.length > MAX_CUSTOM_BARS_BYTES) {
    throw new PmError(ERROR_CODES.invalidValue, at, `is larger than ${MAX_CUSTOM_BARS_BYTES} bytes`);
  }
  let data: unknown;
  try {
    data = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    throw new PmError(ERROR_CODES.invalidValue, at, `is not valid JSON (${(e as Error).message.split('\n')[0]})`);
  }
  return parseOrThrow(CustomBarsSchema, data, (path) => `${at}${path.map((p) => (typeof p === 'number' ? `[${p}]` : `.${String(p)}`)).join('')}`);
}
