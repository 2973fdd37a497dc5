// Vite plugin (build only): writes the workbench's service worker, sw.js, at the root of the
// build. Its source is web/offline/serviceWorker.ts, compiled with esbuild; the list of files to
// store for offline use is every file of the build (chunks, workers, styles, the page, and the
// public folder's manifest and icons; no source maps) and the build id is a hash of their
// contents, so a build that changes any file is a new version and one that changes none is not.
import { createHash } from 'node:crypto';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { transform } from 'esbuild';
import type { Plugin } from 'vite';

/** Where the worker lands in the build, relative to its root (and so its scope: the whole app). */
const serviceWorkerFileName = 'sw.js';

/** Options of serviceWorkerPlugin. */
export interface ServiceWorkerPluginOptions {
  /** The worker's TypeScript source. */
  source: string;
  /** The public folder copied into the build as it is (manifest, icons). */
  publicDir: string;
}

/** Files under `folder`, as paths relative to it with forward slashes. */
function filesUnder(folder: string): string[] {
  let names: string[];
  try {
    names = readdirSync(folder, { recursive: true }) as string[];
  } catch {
    return [];
  }
  return names.filter((name) => statSync(join(folder, name)).isFile()).map((name) => name.split(sep).join('/'));
}

/** True for files the app never fetches itself (source maps, Vite's build manifest). */
function notServed(fileName: string): boolean {
  return fileName.endsWith('.map') || fileName.startsWith('.vite/') || fileName === serviceWorkerFileName;
}

/**
 * The precache list and build id for a build's files: paths sorted, and the first 16 hex digits
 * of a SHA-256 over every path and its bytes.
 */
function precacheManifest(files: ReadonlyMap<string, string | Uint8Array>): { files: string[]; build: string } {
  const paths = [...files.keys()].filter((path) => !notServed(path)).sort();
  const hash = createHash('sha256');
  for (const path of paths) {
    hash.update(path);
    hash.update('\0');
    hash.update(files.get(path)!);
    hash.update('\0');
  }
  return { files: paths, build: hash.digest('hex').slice(0, 16) };
}

/** The plugin; see the file's header. */
export function serviceWorkerPlugin(options: ServiceWorkerPluginOptions): Plugin {
  return {
    name: 'barwright-service-worker',
    apply: 'build',
    // After Vite has emitted the page and the styles into the bundle.
    enforce: 'post',
    async generateBundle(_outputOptions, bundle) {
      const files = new Map<string, string | Uint8Array>();
      for (const [fileName, output] of Object.entries(bundle)) files.set(fileName, output.type === 'chunk' ? output.code : output.source);
      for (const path of filesUnder(options.publicDir)) if (!files.has(path)) files.set(path, readFileSync(join(options.publicDir, path)));
      if (!files.has('index.html')) this.error('the service worker needs index.html in the build');
      const manifest = precacheManifest(files);
      const compiled = await transform(readFileSync(options.source, 'utf8'), {
        loader: 'ts',
        sourcefile: relative(process.cwd(), options.source),
        format: 'iife',
        target: 'es2022',
        minify: true,
        define: { BARWRIGHT_PRECACHE: JSON.stringify(manifest.files), BARWRIGHT_BUILD: JSON.stringify(manifest.build) },
      });
      this.emitFile({ type: 'asset', fileName: serviceWorkerFileName, source: `// barwright workbench, build ${manifest.build}\n${compiled.code}` });
    },
  };
}
