#!/usr/bin/env node
// Launcher for the barwright command line (package.json `bin`). It runs the plain-JavaScript
// build in build/cli/ that `npm install` makes through the project's `prepare` script
// (scripts/buildCli.mjs): no TypeScript loader at run time, so a command starts in well under a
// second. In a checkout whose sources are newer than that build (an edit, a pull), it rebuilds
// first and says so in one line on stderr; without esbuild to rebuild with, it says what to run.
import { existsSync, statSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { newestSourceTime } from '../../scripts/cliSources.mjs';

const root = new URL('../../', import.meta.url);
const built = new URL('build/cli/barwright.js', root);

/** Modification time of the build (when the build started, or its newest source if later), or -1 when there is none. */
function buildTime() {
  try {
    return statSync(built).mtimeMs;
  } catch {
    return -1;
  }
}

const builtAt = buildTime();
if (builtAt < 0 || newestSourceTime(root) > builtAt) {
  const missing = builtAt < 0;
  if (existsSync(new URL('node_modules/esbuild/package.json', root))) {
    const build = spawnSync(process.execPath, [new URL('scripts/buildCli.mjs', root).pathname, '--quiet'], { stdio: ['ignore', 'ignore', 'inherit'] });
    if (build.status !== 0) process.exit(1);
    process.stderr.write(`barwright: ${missing ? 'the command line was not built yet; built it' : 'the sources changed since the command line was built; built it again'} (build/cli)\n`);
  } else if (missing) {
    process.stderr.write('barwright: the command line is not built (build/cli/barwright.js is missing) and esbuild, a dev dependency, is not installed to build it: run `npm install` without --omit=dev\n');
    process.exit(1);
  } else {
    process.stderr.write('barwright: warning: build/cli is older than the sources and esbuild, a dev dependency, is not installed to rebuild it: running the older build (`npm install` without --omit=dev brings it up to date)\n');
  }
}

const { main } = await import(built.href);
process.exitCode = await main(process.argv.slice(2));
