// Entry of a pool worker thread whose task module is TypeScript (tests and the bench run from the
// sources): registers the TypeScript loader (tsx, a dev dependency), then loads the task module
// named in workerData. Plain JavaScript so Node can start it without a loader. The built command
// line does not come here: its worker (build/cli/keyboardBarWorker.js) is plain JavaScript.
import { register } from 'tsx/esm/api';
import { workerData } from 'node:worker_threads';

register();
await import(workerData.moduleUrl);
