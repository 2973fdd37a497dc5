// Node only: the worker side of workerPool.ts.
import { parentPort } from 'node:worker_threads';
import type { WorkerReply, WorkerTask } from './workerPool.ts';

/**
 * Serves tasks posted by a createWorkerPool parent: runs `task(job)` for each and posts back the
 * result or the error (InputError's source, field and rule kept). Call at the top level of a
 * worker module.
 */
export function serveWorkerTasks<Job, Result>(task: (job: Job) => Result | Promise<Result>): void {
  if (!parentPort) throw new Error('internal: serveWorkerTasks must run in a worker thread');
  const port = parentPort;
  port.on('message', async (message: WorkerTask<Job>) => {
    let reply: WorkerReply<Result>;
    try {
      reply = { id: message.id, ok: true, result: await task(message.job) };
    } catch (error) {
      const e = error as { name?: string; message?: string; source?: string; field?: string; rule?: string };
      reply = {
        id: message.id,
        ok: false,
        error: { name: e?.name ?? 'Error', message: e?.message ?? String(error), ...(e?.source !== undefined ? { source: e.source, field: e.field, rule: e.rule } : {}) },
      };
    }
    port.postMessage(reply);
  });
}
