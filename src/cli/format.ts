/** Number, list and date helpers of the flag readers (src/flags/format.ts), re-exported for the commands. */
export * from '../flags/format.js';
