// What the built command line (build/cli) is made from, for the launcher's "is the build older
// than its sources?" check. scripts/buildCli.mjs writes the list (build/cli/sources.json: every
// file of this repository esbuild read for the bundles, plus package.json, the lock file and the
// build scripts); the launcher then needs one small read and a stat per file, no folder walk.
import { readFileSync, statSync } from 'node:fs';

/** Name of the list of sources inside build/cli. */
export const sourceListName = 'sources.json';

/** Files that are sources of every build besides those esbuild reads. */
export const alwaysSources = ['package.json', 'package-lock.json', 'scripts/buildCli.mjs', 'scripts/cliSources.mjs'];

/**
 * The newest modification time (ms) among the sources of the build in `root`/build/cli (`root`
 * a file URL ending in /). Infinity when the list is missing or a listed file is gone (the build
 * cannot be trusted then), -1 for an empty list.
 */
export function newestSourceTime(root) {
  let files;
  try {
    files = JSON.parse(readFileSync(new URL(`build/cli/${sourceListName}`, root), 'utf8'));
  } catch {
    return Infinity;
  }
  let newest = -1;
  for (const file of files) {
    try {
      newest = Math.max(newest, statSync(new URL(file, root)).mtimeMs);
    } catch {
      return Infinity;
    }
  }
  return newest;
}
