// The worker's side of the job protocol (jobProtocol.ts): runs each request through its kind's
// handler with an AbortSignal of its own, forwards progress, and answers once. A cancel aborts
// that job's signal only; long handlers pass the signal to the library (designBar, planKeyboard)
// or call `checkpoint()` between items, so a cancelled job stops where it stands and every other
// job carries on. A job cancelled before it started never runs.
import { isInputError } from '../../src/index.ts';
import type { FromJobWorker, JobCatalog, JobKind, ToJobWorker } from './jobProtocol.ts';

/** What a handler gets besides its payload. */
export interface JobContext {
  /** Aborted when the page cancels this job (and only this job). */
  readonly signal: AbortSignal;
  /** Reports `done` of at most `total` steps to the page. */
  progress(done: number, total: number): void;
  /**
   * Lets waiting messages (a cancel) arrive, then throws JobCancelled if this job was
   * cancelled. For handlers that work through items asynchronously.
   */
  checkpoint(): Promise<void>;
}

/** The handlers of a catalog: one function per kind, synchronous or not. */
export type JobHandlers<C extends JobCatalog> = { [K in JobKind<C>]: (payload: C[K]['payload'], context: JobContext) => C[K]['result'] | Promise<C[K]['result']> };

/** Thrown by `checkpoint()` once the job was cancelled. */
export class JobCancelled extends Error {
  constructor() {
    super('cancelled');
    this.name = 'JobCancelled';
  }
}

/** Thrown by a handler for a computation this build does not offer; the page shows "not available yet". */
export class JobUnavailable extends Error {
  constructor(readonly what: string) {
    super(`${what} is not available`);
    this.name = 'JobUnavailable';
  }
}

/** The worker global as far as the protocol needs it (a stand-in in unit tests). */
export interface JobScope {
  postMessage(message: FromJobWorker): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<ToJobWorker<JobCatalog>>) => void): void;
}

/** Lets the event loop deliver messages already waiting (a cancel sent right after its request). */
function yieldToMessages(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/** Serves `handlers` on `scope` (the worker's global by default) until the worker ends. */
export function serveJobs<C extends JobCatalog>(handlers: JobHandlers<C>, scope: JobScope = self as unknown as JobScope): void {
  const running = new Map<number, AbortController>();

  const run = async (id: number, kind: string, payload: unknown, controller: AbortController): Promise<void> => {
    const signal = controller.signal;
    const context: JobContext = {
      signal,
      progress: (done, total) => {
        if (!signal.aborted) scope.postMessage({ type: 'progress', id, done, total });
      },
      checkpoint: async () => {
        await yieldToMessages();
        if (signal.aborted) throw new JobCancelled();
      },
    };
    try {
      await yieldToMessages();
      if (signal.aborted) throw new JobCancelled();
      const handler = (handlers as Record<string, ((payload: unknown, context: JobContext) => unknown) | undefined>)[kind];
      if (!handler) throw new JobUnavailable(`The computation "${kind}"`);
      const started = performance.now();
      const value = await handler(payload, context);
      if (signal.aborted) scope.postMessage({ type: 'cancelled', id });
      else scope.postMessage({ type: 'result', id, value, elapsedMs: performance.now() - started });
    } catch (error) {
      if (signal.aborted || error instanceof JobCancelled) scope.postMessage({ type: 'cancelled', id });
      else if (isInputError(error)) scope.postMessage({ type: 'error', id, error: { kind: 'input', source: error.source, field: error.field, rule: error.rule, message: error.message } });
      else if (error instanceof JobUnavailable) scope.postMessage({ type: 'error', id, error: { kind: 'unavailable', what: error.what } });
      else scope.postMessage({ type: 'error', id, error: { kind: 'failed', message: error instanceof Error ? error.message : String(error) } });
    } finally {
      running.delete(id);
    }
  };

  scope.addEventListener('message', (event) => {
    const message = event.data;
    if (message.type === 'cancel') {
      running.get(message.id)?.abort();
      return;
    }
    const controller = new AbortController();
    running.set(message.id, controller);
    void run(message.id, message.kind, message.payload, controller);
  });
}
