/** Types of fs-faults.mjs (plain JS so that a spawned CLI can load it with --import). */
export declare const faults: { write: string | undefined; swapRename: boolean; swapPauseMs: number };
export declare function faultyFunctions(fs: object): Record<string, unknown>;
export declare function faultyFs<T extends object>(fsModule: T): T;
export declare function clearFaults(): void;
