// Entry of every pool worker thread (Node): registers the TypeScript loader (tsx), then loads the
// task module named in workerData. Plain JavaScript so Node can start it without a loader, like
// the CLI's own launcher (src/cli/barwright.mjs).
import { register } from 'tsx/esm/api';
import { workerData } from 'node:worker_threads';

register();
await import(workerData.moduleUrl);
