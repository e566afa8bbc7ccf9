/** Types of launch.mjs (plain JavaScript: it runs before anything is compiled). */
export declare const PROGRAMS: Record<string, string>;
/** The reason the compiled programs must be rebuilt, or null when dist/node is up to date. */
export declare function staleness(): string | null;
export declare function build(reason: string): Promise<void>;
/** Builds when stale; returns the compiled entry of `program` (or the build folder). */
export declare function ensureBuilt(program?: string): Promise<string>;
