// The solver worker: receives requests from the page (protocol.ts), runs them through the
// library off the main thread, reports progress for batches and honours cancel between items.
import { isInputError } from '../../src/index.ts';
import type { FromWorker, SolverRequest, ToWorker } from './protocol.ts';
import { Cancelled, runAnalyze, runAnalyzeMany, runChimeSet, runDesign, runNextCut, runResonators } from './solverJobs.ts';

const cancelled = new Set<number>();

function post(message: FromWorker): void {
  (self as unknown as Worker).postMessage(message);
}

/** Lets queued messages (cancel) arrive, reports progress and stops a cancelled batch. */
function checkpointFor(id: number, total: number): (done: number) => Promise<void> {
  return async (done) => {
    await new Promise((resolve) => setTimeout(resolve, 0));
    if (cancelled.has(id)) throw new Cancelled();
    post({ type: 'progress', id, done, total });
  };
}

async function run(id: number, request: SolverRequest): Promise<unknown> {
  switch (request.kind) {
    case 'analyze':
      return runAnalyze(request);
    case 'analyzeMany':
      return runAnalyzeMany(request, checkpointFor(id, request.bars.length));
    case 'design':
      return runDesign(request, (done, total) => post({ type: 'progress', id, done, total }));
    case 'nextCut':
      return runNextCut(request, (done, total) => post({ type: 'progress', id, done, total }));
    case 'resonators':
      return runResonators(request);
    case 'chimeSet':
      return runChimeSet(request);
  }
}

self.addEventListener('message', (event: MessageEvent<ToWorker>) => {
  const message = event.data;
  if (message.type === 'cancel') {
    cancelled.add(message.id);
    return;
  }
  const { id, request } = message;
  const started = performance.now();
  run(id, request)
    .then((value) => post({ type: 'result', id, value, elapsedMs: performance.now() - started }))
    .catch((error: unknown) => {
      if (error instanceof Cancelled) post({ type: 'cancelled', id });
      else if (isInputError(error)) post({ type: 'input-error', id, source: error.source, field: error.field, rule: error.rule, message: error.message });
      else post({ type: 'failed', id, message: error instanceof Error ? error.message : String(error) });
    })
    .finally(() => cancelled.delete(id));
});
