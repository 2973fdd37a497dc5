// Vite configuration of the workbench: the app lives in web/, the library in src/ (imported
// through src/index.ts), the demo project in fixtures/. Everything is served by the app itself.
// The build (`npm run build`, `npm start`) adds the service worker that keeps the workbench
// working offline (scripts/serviceWorkerPlugin.ts); web/public/ holds the web app manifest and
// the icons, copied as they are.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import { serviceWorkerPlugin } from './scripts/serviceWorkerPlugin.ts';

const repositoryRoot = fileURLToPath(new URL('.', import.meta.url));
const { version } = JSON.parse(readFileSync(new URL('package.json', import.meta.url), 'utf8')) as { version: string };

export default defineConfig({
  root: 'web',
  publicDir: 'public',
  define: { __BARWRIGHT_VERSION__: JSON.stringify(version) },
  plugins: [serviceWorkerPlugin({ source: fileURLToPath(new URL('web/offline/serviceWorker.ts', import.meta.url)), publicDir: fileURLToPath(new URL('web/public', import.meta.url)) })],
  server: { fs: { allow: [repositoryRoot] } },
  preview: { port: 5173, strictPort: true },
  worker: { format: 'es' },
  // No bundler-timing warnings: on a busy 2-core machine every build would print one.
  build: { outDir: '../dist', emptyOutDir: true, target: 'es2022', rolldownOptions: { checks: { bundlerTimings: false } } },
  optimizeDeps: { include: ['lit', 'lit/decorators.js', 'idb', 'zod', 'chart.js'] },
});
