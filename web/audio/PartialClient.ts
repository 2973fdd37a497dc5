// The page's side of the partial-finding worker: the shared job client on one worker, started on
// first use. Buffers in a request are transferred to the worker.
import type { JobOutcome } from '../worker/jobProtocol.ts';
import { JobClient, type JobRequestOptions, type JobWorkerLike } from '../worker/JobClient.ts';
import type { PartialJobs, PartialRequest } from './partialProtocol.ts';

/** Starts the partial-finding worker module (Vite bundles it from this URL pattern). */
export function startPartialWorker(name: string): JobWorkerLike {
  return new Worker(new URL('./partialWorker.ts', import.meta.url), { type: 'module', name }) as unknown as JobWorkerLike;
}

/** Runs partial finding in a module worker. */
export class PartialClient extends JobClient<PartialJobs> {
  constructor(spawn: (name: string) => JobWorkerLike = startPartialWorker) {
    super({ name: 'barwright-partials', spawn });
  }

  /** Analyses a recording or a capture; its buffer is transferred to the worker. */
  analyse(request: PartialRequest, options: Omit<JobRequestOptions, 'transfer'> = {}): Promise<JobOutcome<PartialJobs['partials']['result']>> {
    const transfer = request.kind === 'wav' ? [request.bytes] : [request.samples.buffer as ArrayBuffer];
    return this.request('partials', request, { ...options, transfer });
  }
}
