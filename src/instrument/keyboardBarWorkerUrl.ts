// Node only, like workerPool.ts: where the keyboard-planning worker thread's module is.

/**
 * The module a keyboard-planning worker thread runs (see keyboardBarWorker.ts): run from the
 * sources (tests, bench: this file is `.ts`), the TypeScript module beside this file, started
 * through workerBootstrap.mjs; in the built command line (scripts/buildCli.mjs bundles this file
 * into build/cli/barwright.js), the plain-JavaScript bundle beside it, build/cli/keyboardBarWorker.js.
 */
export const keyboardBarWorkerUrl: URL = new URL(import.meta.url.endsWith('.ts') ? './keyboardBarWorker.ts' : './keyboardBarWorker.js', import.meta.url);
