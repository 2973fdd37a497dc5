// Vite's client-side types (import.meta.glob, ?worker imports, JSON modules) for the workbench.
/// <reference types="vite/client" />

/** The workbench's version (package.json `version`), set by vite.config.ts. */
declare const __BARWRIGHT_VERSION__: string;
