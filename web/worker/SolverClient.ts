// The page's side of a solver worker: typed requests, one promise each, progress callbacks and
// cancel. Outcomes never throw: a view gets ok / input-error / unavailable / failed / cancelled.
import type { FromWorker, SolverRequest, SolverResults, ToWorker } from './protocol.ts';

/** How a request ended. */
export type SolverOutcome<K extends keyof SolverResults> =
  | { status: 'ok'; value: SolverResults[K]; elapsedMs: number }
  | { status: 'input-error'; field: string; rule: string; message: string }
  | { status: 'unavailable'; what: string }
  | { status: 'failed'; message: string }
  | { status: 'cancelled' };

/** Options of one request. */
export interface SolverRequestOptions {
  onProgress?: (done: number, total: number) => void;
  signal?: AbortSignal;
}

/** The minimal worker interface the client needs (a real Worker, or a stand-in in tests). */
export interface WorkerLike {
  postMessage(message: ToWorker): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<FromWorker>) => void): void;
  addEventListener(type: 'error', listener: (event: ErrorEvent) => void): void;
  terminate(): void;
}

interface Pending {
  resolve: (outcome: SolverOutcome<keyof SolverResults>) => void;
  onProgress?: (done: number, total: number) => void;
  kind: SolverRequest['kind'];
}

/** Starts the solver worker module (Vite bundles it from this URL pattern). */
export function startSolverWorker(name: string): WorkerLike {
  return new Worker(new URL('./solverWorker.ts', import.meta.url), { type: 'module', name }) as unknown as WorkerLike;
}

/**
 * A client for one worker. Batches are cancelled cooperatively (the worker stops between
 * items); a cancelled single job ends the worker, which restarts on the next request, so a long
 * computation never keeps running after the maker pressed Cancel.
 */
export class SolverClient {
  private worker: WorkerLike | null = null;
  private nextId = 1;
  private readonly pending = new Map<number, Pending>();

  constructor(
    private readonly name: string,
    private readonly spawn: (name: string) => WorkerLike = startSolverWorker,
  ) {}

  private ensureWorker(): WorkerLike {
    if (this.worker) return this.worker;
    const worker = this.spawn(this.name);
    worker.addEventListener('message', (event: MessageEvent<FromWorker>) => this.receive(event.data));
    worker.addEventListener('error', (event: ErrorEvent) => this.failAll(`the solver stopped: ${event.message || 'unknown error'}`));
    this.worker = worker;
    return worker;
  }

  private receive(message: FromWorker): void {
    const pending = this.pending.get(message.id);
    if (!pending) return;
    if (message.type === 'progress') {
      pending.onProgress?.(message.done, message.total);
      return;
    }
    this.pending.delete(message.id);
    switch (message.type) {
      case 'result':
        pending.resolve({ status: 'ok', value: message.value as SolverResults[keyof SolverResults], elapsedMs: message.elapsedMs });
        break;
      case 'input-error':
        pending.resolve({ status: 'input-error', field: message.field, rule: message.rule, message: message.message });
        break;
      case 'unavailable':
        pending.resolve({ status: 'unavailable', what: message.what });
        break;
      case 'failed':
        pending.resolve({ status: 'failed', message: message.message });
        break;
      case 'cancelled':
        pending.resolve({ status: 'cancelled' });
        break;
    }
  }

  private failAll(message: string): void {
    for (const pending of this.pending.values()) pending.resolve({ status: 'failed', message });
    this.pending.clear();
    this.worker?.terminate();
    this.worker = null;
  }

  /** Sends a request; resolves with its outcome. */
  request<K extends SolverRequest['kind']>(request: Extract<SolverRequest, { kind: K }>, options: SolverRequestOptions = {}): Promise<SolverOutcome<K>> {
    return new Promise<SolverOutcome<K>>((resolve) => {
      if (options.signal?.aborted) {
        resolve({ status: 'cancelled' });
        return;
      }
      const id = this.nextId++;
      const pending: Pending = { resolve: resolve as Pending['resolve'], kind: request.kind };
      if (options.onProgress) pending.onProgress = options.onProgress;
      this.pending.set(id, pending);
      options.signal?.addEventListener('abort', () => this.cancel(id), { once: true });
      this.ensureWorker().postMessage({ type: 'request', id, request });
    });
  }

  /** Cancels one request: cooperatively for batches, by restarting the worker otherwise. */
  private cancel(id: number): void {
    const pending = this.pending.get(id);
    if (!pending || !this.worker) return;
    if (pending.kind === 'analyzeMany') {
      this.worker.postMessage({ type: 'cancel', id });
      return;
    }
    this.pending.delete(id);
    pending.resolve({ status: 'cancelled' });
    const others = [...this.pending.entries()];
    this.pending.clear();
    this.worker.terminate();
    this.worker = null;
    for (const [, other] of others) other.resolve({ status: 'cancelled' });
  }

  /** Stops the worker (e.g. when the page goes away). */
  dispose(): void {
    this.failAll('the solver was closed');
  }
}

/** The worker for quick jobs (a bar's modes, next-cut advice, resonators). */
export const quickSolver = new SolverClient('barwright-quick');

/** The worker for long jobs (planning an undercut, the whole keyboard), cancellable. */
export const longSolver = new SolverClient('barwright-long');
