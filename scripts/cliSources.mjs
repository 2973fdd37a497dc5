// What the built command line (build/cli) is made from, for the launcher's "is the build older
// than its sources?" check and for the build's own time stamp (scripts/buildCli.mjs).
import { existsSync, readdirSync, statSync } from 'node:fs';

/**
 * The newest modification time (ms) among the files the command line is built from: every
 * TypeScript/JavaScript/JSON file under src/, package.json, package-lock.json and the build
 * script; -1 when `root` (a file URL ending in /) has no src/ folder.
 */
export function newestSourceTime(root) {
  const source = new URL('src/', root);
  if (!existsSync(source)) return -1;
  let newest = -1;
  for (const name of readdirSync(source, { recursive: true })) {
    if (!/\.(ts|mjs|js|json)$/.test(name)) continue;
    newest = Math.max(newest, statSync(new URL(name, source)).mtimeMs);
  }
  for (const file of ['package.json', 'package-lock.json', 'scripts/buildCli.mjs', 'scripts/cliSources.mjs']) {
    const url = new URL(file, root);
    if (existsSync(url)) newest = Math.max(newest, statSync(url).mtimeMs);
  }
  return newest;
}
