import { mkdtempSync, readFileSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { BenchRow, BenchSuite } from '../measure.ts';

/**
 * Sizes in bytes (minified, before compression) of the bundles of the workbench as built at
 * commit ee24c72, before numeric left the bundles and the views were split (issue 14): one main
 * bundle for the page and one per worker. A record, not a measurement of this run; the goal is
 * each at most half of it.
 */
const before: Record<string, number> = { main: 749_351, keyboardTaskWorker: 334_753, partialWorker: 279_559, solverWorker: 275_603 };
/** All JavaScript of that build: the four above, the listening view (18 034), the demo project (14 200) and the audio worklet (504). */
const beforeAllScripts = 1_672_004;

/** The workers the page starts (web/worker/*, web/audio/partialWorker.ts) that have a record from before issue 14. */
const workerNames = ['solverWorker', 'keyboardTaskWorker', 'partialWorker'] as const;
/** Workers added since (no record before): the 3D model's (the shape view's check, the tuning view's advice on the 3D model). */
const newWorkerNames = ['solidWorker'] as const;

interface ManifestChunk {
  file: string;
  imports?: string[];
  dynamicImports?: string[];
  isEntry?: boolean;
}

/** numeric's own source announces itself in any bundle that carries it. */
const numericSignature = /numeric\.version\s*=|numeric\.(solveQP|dopri|uncmin)\s*=/;

function row(name: string, bytes: number, detail: Record<string, number | string> = {}): BenchRow {
  return { suite: 'bundles', case: name, runs: 1, detail: { bytes, ...detail } };
}

/** Size against its record before issue 14 and the goal of at most half of it. */
function againstBefore(bytes: number, key: string): Record<string, number | string> {
  const was = before[key]!;
  return { before_bytes: was, ratio_to_before: bytes / was, goal: 'at most 0.5', within_goal: bytes <= was / 2 ? 'yes' : 'no' };
}

/**
 * The workbench's bundles as `npm start` builds them (vite build with the project's config, in a
 * temporary folder): the page's entry bundle and what it loads before the first view (its static
 * imports), the view chunks loaded on demand, each worker, and whether numeric is in any of them;
 * sizes before and after issue 14 and the goal (each at most half). The build's wall time is the
 * first row.
 */
export const bundlesSuite: BenchSuite = {
  name: 'bundles',
  async run() {
    const { build } = await import('vite');
    const outDir = mkdtempSync(join(tmpdir(), 'barwright-bundles-'));
    const nodeEnv = process.env.NODE_ENV;
    process.env.NODE_ENV = 'production';
    const started = performance.now();
    try {
      await build({
        configFile: fileURLToPath(new URL('../../../vite.config.ts', import.meta.url)),
        logLevel: 'error',
        build: { outDir, emptyOutDir: true, manifest: true },
      });
      const buildMs = performance.now() - started;
      const manifest = JSON.parse(readFileSync(join(outDir, '.vite', 'manifest.json'), 'utf8')) as Record<string, ManifestChunk>;
      const size = (file: string) => statSync(join(outDir, file)).size;
      const assets = readdirSync(join(outDir, 'assets')).map((name) => `assets/${name}`);
      const scripts = assets.filter((file) => file.endsWith('.js'));
      const withNumeric = scripts.filter((file) => numericSignature.test(readFileSync(join(outDir, file), 'utf8')));

      const entry = manifest['index.html']!;
      // What the page loads before anything else: the entry and its static imports, transitively.
      const initial = new Set<string>();
      const visit = (key: string) => {
        const chunk = manifest[key]!;
        if (initial.has(chunk.file)) return;
        initial.add(chunk.file);
        for (const next of chunk.imports ?? []) visit(next);
      };
      visit('index.html');
      const initialBytes = [...initial].reduce((sum, file) => sum + size(file), 0);
      const workers = workerNames.map((name) => {
        const file = scripts.find((candidate) => candidate.startsWith(`assets/${name}-`));
        if (!file) throw new Error(`no ${name} bundle in the build`);
        return { name, file };
      });
      const newWorkers = newWorkerNames.map((name) => {
        const file = scripts.find((candidate) => candidate.startsWith(`assets/${name}-`));
        if (!file) throw new Error(`no ${name} bundle in the build`);
        return { name, file };
      });
      const workerFiles = new Set([...workers, ...newWorkers].map((worker) => worker.file));
      const onDemand = scripts.filter((file) => !initial.has(file) && !workerFiles.has(file) && !/captureProcessor-/.test(file));
      const totalBytes = scripts.reduce((sum, file) => sum + size(file), 0);

      const rows: BenchRow[] = [
        { suite: 'bundles', case: 'vite build (the workbench, service worker included)', median_ms: buildMs, runs: 1, detail: { files: assets.length, bundles_with_numeric: withNumeric.length === 0 ? 'none' : withNumeric.join(' ') } },
        row(`main bundle (${entry.file})`, size(entry.file), againstBefore(size(entry.file), 'main')),
        row('page start: main bundle + its static imports', initialBytes, { files: initial.size, ...againstBefore(initialBytes, 'main') }),
        ...workers.map((worker) => row(`worker ${worker.name}`, size(worker.file), againstBefore(size(worker.file), worker.name))),
        ...newWorkers.map((worker) => row(`worker ${worker.name}`, size(worker.file))),
        row('views and libraries loaded on demand (all together)', onDemand.reduce((sum, file) => sum + size(file), 0), { files: onDemand.length, largest_bytes: Math.max(...onDemand.map(size)) }),
        row('all JavaScript of the build', totalBytes, { files: scripts.length, before_bytes: beforeAllScripts, ratio_to_before: totalBytes / beforeAllScripts }),
        row('service worker (sw.js)', size('sw.js')),
      ];
      return rows;
    } finally {
      if (nodeEnv === undefined) delete process.env.NODE_ENV;
      else process.env.NODE_ENV = nodeEnv;
      rmSync(outDir, { recursive: true, force: true });
    }
  },
};
