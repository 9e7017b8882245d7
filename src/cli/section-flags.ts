/** The shared section flags live in src/flags/section-flags.ts (the page reads them too); re-exported for the commands. */
export * from '../flags/section-flags.js';
