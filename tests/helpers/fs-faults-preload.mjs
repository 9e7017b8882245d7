/**
 * Loaded into a spawned CLI with `node --import <this file>` by tests only: patches `node:fs` with the
 * faults of fs-faults.mjs, set from TEST_FS_FAULTS (JSON of `faults`), and updates the named ESM
 * exports of node:fs so that the bundle's `import { writeSync } from 'node:fs'` sees them.
 */
import fs from 'node:fs';
import { syncBuiltinESMExports } from 'node:module';
import { faults, faultyFunctions } from './fs-faults.mjs';

Object.assign(faults, JSON.parse(process.env.TEST_FS_FAULTS ?? '{}'));
Object.assign(fs, faultyFunctions(fs));
syncBuiltinESMExports();
