// barwright's public surface, floor by floor from the ground up: the CLI and the web app import
// only from here or from a module's own index.ts. Add one line per module.
export * from './fileFormats/index.ts';
export * from './units/index.ts';
export * from './pitch/index.ts';
export * from './material/index.ts';
export * from './section/index.ts';
export * from './eigen/index.ts';
export * from './fe/index.ts';
export * from './optimize/index.ts';
export * from './modes/index.ts';
export * from './audio/index.ts';
export * from './resonator/index.ts';
export * from './design/index.ts';
export * from './session/index.ts';
export * from './instrument/index.ts';
export * from './projectDocument/index.ts';
