/** The atomic writer and the I/O error classes live in src/io/files.ts (no render code), re-exported for the sheet pipeline. */
export * from '../io/files.js';
