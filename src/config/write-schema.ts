/** Writes charts-config/chart-set.schema.json from the zod schema (`npm run schema`, after `npm run build`). */
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chartSetJsonSchema } from './schema.js';

export const schemaText = (): string => `${JSON.stringify(chartSetJsonSchema(), null, 2)}\n`;

const isMain = process.argv[1] !== undefined && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const target = resolve(dirname(fileURLToPath(import.meta.url)), '../../charts-config/chart-set.schema.json');
  mkdirSync(dirname(target), { recursive: true });
  writeFileSync(`${target}.tmp`, schemaText());
  renameSync(`${target}.tmp`, target);
  process.stdout.write(`wrote ${target}\n`);
}
