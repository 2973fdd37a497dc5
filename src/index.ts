// barwright's one public surface: the CLI and the web app import only from here.
// Each concept folder has an index.ts re-exporting its public functions; add one line per folder.
export * from './project/InputError.ts';
