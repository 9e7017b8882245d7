/** Generator name and version printed on sheets, reports and JSON output. Kept in step with package.json by a test. */
export const GENERATOR = { name: 'pmchart', version: '0.1.0' } as const;
export const generatorLabel = (): string => `${GENERATOR.name} ${GENERATOR.version}`;
