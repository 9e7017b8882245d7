export * from './schema.js';
export * from './types.js';
export * from './read.js';
export * from './rules.js';
export * from './describe.js';
export * from './expand.js';
