// barwright's one public surface: the CLI and the web app import only from here.
// Each concept folder has an index.ts re-exporting its public functions; add one line per folder.
export * from './project/InputError.ts';
export * from './project/roundDecimals.ts';
export * from './project/barFile.ts';
export * from './pitch/index.ts';
export * from './material/index.ts';
export * from './section/index.ts';
export * from './fe/index.ts';
export * from './eigen/index.ts';
export * from './modes/index.ts';
export * from './audio/index.ts';
export * from './resonator/index.ts';
export * from './design/index.ts';
export * from './project/sessionFile.ts';
export * from './project/sessionLogEdits.ts';
export * from './session/index.ts';
export * from './project/projectFile.ts';
export * from './instrument/index.ts';
