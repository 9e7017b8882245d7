/** Writes charts-config/chart-set.schema.json and office.schema.json from the zod schemas (`npm run schema`, after `npm run build`). */
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeFileAtomic } from '../io/files.js';
import { chartSetJsonSchema, officeJsonSchema } from './schema.js';

export const schemaText = (): string => `${JSON.stringify(chartSetJsonSchema(), null, 2)}\n`;
export const officeSchemaText = (): string => `${JSON.stringify(officeJsonSchema(), null, 2)}\n`;

const isMain = process.argv[1] !== undefined && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const target = resolve(dirname(fileURLToPath(import.meta.url)), '../../charts-config/chart-set.schema.json');
  writeFileAtomic(target, schemaText());
  process.stdout.write(`wrote ${target}\n`);
  const office = resolve(dirname(target), 'office.schema.json');
  writeFileAtomic(office, officeSchemaText());
  process.stdout.write(`wrote ${office}\n`);
}
