// The page's side of the partial-finding worker: one promise per request.
import type { TapReport } from '../../src/index.ts';
import type { PartialRequest, PartialResponse } from './partialProtocol.ts';

/** How an analysis ended: partials, or a message fit to show the maker. */
export type PartialOutcome = { ok: true; report: TapReport; elapsedMs: number } | { ok: false; inputError: boolean; message: string };

/** Runs partial finding in a module worker, started on first use. */
export class PartialClient {
  private worker: Worker | null = null;
  private nextId = 1;
  private readonly pending = new Map<number, (outcome: PartialOutcome) => void>();

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const worker = new Worker(new URL('./partialWorker.ts', import.meta.url), { type: 'module', name: 'barwright-partials' });
    worker.addEventListener('message', (event: MessageEvent<PartialResponse>) => {
      const { id, ...outcome } = event.data;
      this.pending.get(id)?.(outcome);
      this.pending.delete(id);
    });
    worker.addEventListener('error', (event) => {
      for (const resolve of this.pending.values()) resolve({ ok: false, inputError: false, message: `the analysis stopped: ${event.message || 'unknown error'}` });
      this.pending.clear();
      this.worker?.terminate();
      this.worker = null;
    });
    this.worker = worker;
    return worker;
  }

  /** Analyses a request; buffers in it are transferred to the worker. */
  analyse(request: PartialRequest): Promise<PartialOutcome> {
    const id = this.nextId++;
    const worker = this.ensureWorker();
    return new Promise((resolve) => {
      this.pending.set(id, resolve);
      const transfer = request.kind === 'wav' ? [request.bytes] : [request.samples.buffer as ArrayBuffer];
      worker.postMessage({ id, request }, transfer);
    });
  }

  /** Stops the worker. */
  dispose(): void {
    this.worker?.terminate();
    this.worker = null;
    this.pending.clear();
  }
}
