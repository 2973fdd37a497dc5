#!/usr/bin/env node
// Builds the command line ahead of time: src/cli/main.ts and the keyboard-planning worker thread
// (src/instrument/keyboardBarWorker.ts) bundled by esbuild into plain JavaScript in build/cli/
// (git-ignored), so `barwright` starts without a TypeScript loader. Runs from `npm install`
// (the project's own `prepare` script) and from `npm run build:cli`; the launcher
// (src/cli/barwright.mjs) also runs it when the sources are newer than the build.
//
// Writes to a fresh temporary folder and renames it into place, so a barwright started while a
// build runs sees either the old build or the new one, never half of one.
//
// Without esbuild (`npm install --omit=dev` leaves the dev dependencies out) it prints one line;
// with --if-possible (the `prepare` script) it exits 0, so the install itself succeeds, and the
// launcher then says how to build.
import { chmodSync, existsSync, mkdirSync, mkdtempSync, renameSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { alwaysSources, sourceListName } from './cliSources.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const target = join(root, 'build', 'cli');

let esbuild;
try {
  esbuild = await import('esbuild');
} catch {
  process.stderr.write('barwright: esbuild (a dev dependency) is not installed, so the command line was not built: run `npm install` without --omit=dev\n');
  // From `prepare` (--if-possible) the install goes on; asked for by hand, it is a failure.
  process.exit(process.argv.includes('--if-possible') ? 0 : 1);
}

const started = performance.now();
// Sources saved while this build runs must count as newer than it: the bundle's time is set to
// the moment the build started (the launcher compares it with the sources' times).
const startedAt = Date.now();
mkdirSync(join(root, 'build'), { recursive: true });
const staging = mkdtempSync(join(root, 'build', '.cli-'));
chmodSync(staging, 0o755);
try {
  const result = await esbuild.build({
    absWorkingDir: root,
    entryPoints: { barwright: 'src/cli/main.ts', keyboardBarWorker: 'src/instrument/keyboardBarWorker.ts' },
    outdir: staging,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    // One file per entry, every dependency inside: Node resolves and reads nothing else at start.
    splitting: false,
    // Kept readable: an "internal failure" prints a stack trace a maker can send back.
    minify: false,
    legalComments: 'none',
    logLevel: 'warning',
    metafile: true,
    // CommonJS dependencies bundled into ESM may call require() for Node's own modules.
    banner: { js: "import { createRequire as __barwrightCreateRequire } from 'node:module'; const require = __barwrightCreateRequire(import.meta.url);" },
  });
  writeFileSync(join(staging, 'package.json'), '{ "type": "module" }\n');
  // The launcher's staleness check: every file of this repository the bundles were made from
  // (dependencies count through the lock file).
  const sources = [...new Set([...Object.keys(result.metafile.inputs).filter((file) => !file.includes('node_modules/')), ...alwaysSources])].sort();
  writeFileSync(join(staging, sourceListName), `${JSON.stringify(sources, null, 1)}\n`);
  // A source dated in the future (a clock skew) must not make every start rebuild: then the
  // stamp is that date. Files saved during the build are dated before now and stay newer.
  const now = Date.now();
  const ahead = Math.max(...sources.map((file) => statSync(join(root, file)).mtimeMs).filter((time) => time > now));
  const stamp = new Date(Number.isFinite(ahead) ? Math.ceil(ahead) + 1 : startedAt);
  utimesSync(join(staging, 'barwright.js'), stamp, stamp);
  const previous = `${target}.previous-${process.pid}`;
  if (existsSync(target)) renameSync(target, previous);
  renameSync(staging, target);
  rmSync(previous, { recursive: true, force: true });
} catch (error) {
  rmSync(staging, { recursive: true, force: true });
  process.stderr.write(`barwright: building the command line failed: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
}
if (!existsSync(join(target, 'barwright.js'))) process.exit(1);
if (!process.argv.includes('--quiet')) process.stderr.write(`barwright: command line built into build/cli in ${Math.round(performance.now() - started)} ms\n`);
