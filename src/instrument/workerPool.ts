// Node only (node:worker_threads): not re-exported from src/index.ts, so browser bundles never
// see it. A browser pool of web workers can run the same per-bar function through runBatch.
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { InputError } from '../fileFormats/InputError.ts';
import type { BatchRunner } from './runBatch.ts';

/** Message a pool worker receives: one task. */
export interface WorkerTask<Job> {
  id: number;
  job: Job;
}

/** Message a pool worker sends back: the result, or the error thrown (InputError fields kept). */
export type WorkerReply<Result> =
  | { id: number; ok: true; result: Result }
  | { id: number; ok: false; error: { name: string; message: string; source?: string; field?: string; rule?: string } };

/** A fixed set of worker threads running one module's task function; see createWorkerPool. */
export interface WorkerPool<Job, Result> extends BatchRunner<Job, Result> {
  /** Stops every worker (pending tasks are rejected). Call when done: a live worker keeps Node running. */
  close(): Promise<void>;
}

/** Options of createWorkerPool. */
export interface WorkerPoolOptions {
  /** Number of worker threads (default: available cores, at most 8). */
  size?: number;
}

/** The plain-JavaScript entry of a worker whose task module is TypeScript: registers tsx, then imports it. */
const bootstrapUrl = new URL('./workerBootstrap.mjs', import.meta.url);

interface Pending<Result> {
  resolve: (result: Result) => void;
  reject: (error: Error) => void;
}

/**
 * Starts `size` worker threads on the module at `moduleUrl` (a module whose top level calls
 * serveWorkerTasks) and hands tasks to whichever is free, one at a time each. A plain-JavaScript
 * module (the built command line's build/cli/keyboardBarWorker.js) is each thread's entry itself;
 * a `.ts` module (run from the sources: tests, bench) starts from workerBootstrap.mjs, which
 * registers tsx, a dev dependency, and imports it (Node 20 does not apply `--import tsx` hooks to
 * a worker's own entry file). Errors thrown in a task come back as errors of the
 * same kind (an InputError stays an InputError). Cancelling is the batch's job: it stops
 * submitting; close() terminates the threads.
 */
export function createWorkerPool<Job, Result>(moduleUrl: URL, options: WorkerPoolOptions = {}): WorkerPool<Job, Result> {
  const size = Math.max(1, Math.floor(options.size ?? Math.min(8, availableParallelism())));
  const workers: Worker[] = [];
  const idle: Worker[] = [];
  const queue: { task: WorkerTask<Job>; pending: Pending<Result> }[] = [];
  const inFlight = new Map<Worker, { task: WorkerTask<Job>; pending: Pending<Result> }>();
  let nextId = 1;
  let closed = false;
  let alive = size;
  const typescript = moduleUrl.pathname.endsWith('.ts');

  const dispatch = (): void => {
    while (idle.length > 0 && queue.length > 0) {
      const worker = idle.pop()!;
      const item = queue.shift()!;
      inFlight.set(worker, item);
      worker.postMessage(item.task);
    }
  };

  for (let i = 0; i < size; i++) {
    const worker = typescript ? new Worker(bootstrapUrl, { workerData: { moduleUrl: moduleUrl.href } }) : new Worker(moduleUrl);
    worker.on('message', (reply: WorkerReply<Result>) => {
      const item = inFlight.get(worker);
      inFlight.delete(worker);
      idle.push(worker);
      if (item && item.task.id === reply.id) {
        if (reply.ok) item.pending.resolve(reply.result);
        else {
          const { name, message, source, field, rule } = reply.error;
          item.pending.reject(name === 'InputError' && source !== undefined && field !== undefined && rule !== undefined ? new InputError(source, field, rule) : new Error(message));
        }
      }
      dispatch();
    });
    worker.on('error', (error) => {
      const item = inFlight.get(worker);
      inFlight.delete(worker);
      item?.pending.reject(error instanceof Error ? error : new Error(String(error)));
    });
    worker.on('exit', (code) => {
      const item = inFlight.get(worker);
      inFlight.delete(worker);
      if (item) item.pending.reject(new Error(`internal: worker stopped (exit code ${code}) during a task`));
      alive--;
      const at = idle.indexOf(worker);
      if (at >= 0) idle.splice(at, 1);
      // With no thread left nothing would ever take the queued tasks: fail them now.
      if (alive === 0) for (const queued of queue.splice(0)) queued.pending.reject(new Error(`internal: every worker stopped (last exit code ${code})`));
    });
    workers.push(worker);
    idle.push(worker);
  }

  return {
    size,
    run(job: Job): Promise<Result> {
      if (closed) return Promise.reject(new Error('internal: the worker pool is closed'));
      return new Promise<Result>((resolve, reject) => {
        queue.push({ task: { id: nextId++, job }, pending: { resolve, reject } });
        dispatch();
      });
    },
    async close(): Promise<void> {
      closed = true;
      for (const item of queue.splice(0)) item.pending.reject(new Error('internal: the worker pool was closed'));
      await Promise.all(workers.map((worker) => worker.terminate()));
    },
  };
}
