// Vite configuration of the workbench: the app lives in web/, the library in src/ (imported
// through src/index.ts), the demo project in fixtures/. Everything is served by the app itself.
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

const repositoryRoot = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  root: 'web',
  server: { fs: { allow: [repositoryRoot] } },
  worker: { format: 'es' },
  build: { outDir: '../dist', emptyOutDir: true, target: 'es2022', chunkSizeWarningLimit: 1500 },
  optimizeDeps: { include: ['lit', 'lit/decorators.js', 'idb', 'zod', 'chart.js'] },
});
