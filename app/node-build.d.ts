// Types of app/node-build.js, for the tests and benchmarks that build or check the program.

/** Why dist/node cannot be run as it is (no build, or a source changed since), or null when it is up to date. */
export function nodeBuildStale(recordPath?: string): string | null;

/** Builds dist/node from the sources; `clean` first removes an earlier build's files. */
export function nodeBuild(options?: { clean?: boolean }): Promise<void>;

/** True when dist/renderer is older than a file the page is built from. */
export function rendererBuildStale(): boolean;
