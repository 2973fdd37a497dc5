// The worker's side of the job protocol (serveJobs) on a stand-in worker scope, with test
// handlers and the real solver handlers: one final answer per job, progress forwarded, input
// errors with their field and rule, and cancel aborting that job's signal only.
import { describe, expect, it } from 'vitest';
import { InputError, type BarFile } from '../../src/index.ts';
import { serveJobs, type JobContext, type JobHandlers, type JobScope } from '../../web/worker/serveJobs.ts';
import { solverHandlers } from '../../web/worker/solverJobs.ts';
import type { FromJobWorker, JobCatalog, ToJobWorker } from '../../web/worker/jobProtocol.ts';
import type { SolverJobs } from '../../web/worker/solverProtocol.ts';

/** A stand-in worker global: the test sends messages in and reads the answers. */
class FakeScope implements JobScope {
  readonly sent: FromJobWorker[] = [];
  private listener: ((event: MessageEvent<ToJobWorker<JobCatalog>>) => void) | null = null;
  postMessage(message: FromJobWorker): void {
    this.sent.push(message);
  }
  addEventListener(_type: 'message', listener: (event: MessageEvent<ToJobWorker<JobCatalog>>) => void): void {
    this.listener = listener;
  }
  send(message: ToJobWorker<JobCatalog>): void {
    this.listener?.({ data: message } as MessageEvent<ToJobWorker<JobCatalog>>);
  }
  /** The final answer for `id`, once there is one. */
  async final(id: number): Promise<Exclude<FromJobWorker, { type: 'progress' }>> {
    for (let tries = 0; tries < 2000; tries++) {
      const found = this.sent.find((message) => message.id === id && message.type !== 'progress');
      if (found) return found as Exclude<FromJobWorker, { type: 'progress' }>;
      await new Promise((resolve) => setTimeout(resolve, 1));
    }
    throw new Error(`no answer for job ${id}`);
  }
  finals(id: number): number {
    return this.sent.filter((message) => message.id === id && message.type !== 'progress').length;
  }
}

type TestJobs = {
  count: { payload: { to: number }; result: number };
  fail: { payload: { how: 'input' | 'crash' }; result: never };
};

/** Counts to `to`, one step per checkpoint, reporting progress. */
async function count(payload: { to: number }, job: JobContext): Promise<number> {
  for (let step = 0; step < payload.to; step++) {
    await job.checkpoint();
    job.progress(step + 1, payload.to);
  }
  return payload.to;
}

const handlers: JobHandlers<TestJobs> = {
  count,
  fail(payload) {
    if (payload.how === 'input') throw new InputError('bar', 'length_mm', 'must be greater than 0 mm');
    throw new Error('internal');
  },
};

describe('serveJobs', () => {
  it('answers each job once: result with progress, input error with field and rule, failure, unknown kind', async () => {
    const scope = new FakeScope();
    serveJobs(handlers, scope);
    scope.send({ type: 'request', id: 1, kind: 'count', payload: { to: 3 } });
    scope.send({ type: 'request', id: 2, kind: 'fail', payload: { how: 'input' } });
    scope.send({ type: 'request', id: 3, kind: 'fail', payload: { how: 'crash' } });
    scope.send({ type: 'request', id: 4, kind: 'unheard-of', payload: {} });
    expect(await scope.final(1)).toMatchObject({ type: 'result', value: 3 });
    expect(scope.sent.filter((message) => message.id === 1 && message.type === 'progress').map((message) => (message as { done: number }).done)).toEqual([1, 2, 3]);
    expect(await scope.final(2)).toEqual({ type: 'error', id: 2, error: { kind: 'input', source: 'bar', field: 'length_mm', rule: 'must be greater than 0 mm', message: 'bar: length_mm: must be greater than 0 mm' } });
    expect(await scope.final(3)).toEqual({ type: 'error', id: 3, error: { kind: 'failed', message: 'internal' } });
    expect(await scope.final(4)).toMatchObject({ type: 'error', error: { kind: 'unavailable' } });
    for (const id of [1, 2, 3, 4]) expect(scope.finals(id)).toBe(1);
  });

  it('cancels one job at its next checkpoint; a job running beside it completes', async () => {
    const scope = new FakeScope();
    serveJobs(handlers, scope);
    scope.send({ type: 'request', id: 1, kind: 'count', payload: { to: 1000 } });
    scope.send({ type: 'request', id: 2, kind: 'count', payload: { to: 20 } });
    // Let job 1 start, then cancel it.
    while (!scope.sent.some((message) => message.id === 1 && message.type === 'progress')) await new Promise((resolve) => setTimeout(resolve, 1));
    scope.send({ type: 'cancel', id: 1 });
    expect(await scope.final(1)).toEqual({ type: 'cancelled', id: 1 });
    expect(await scope.final(2)).toMatchObject({ type: 'result', value: 20 });
    const stepsOfFirst = scope.sent.filter((message) => message.id === 1 && message.type === 'progress').length;
    expect(stepsOfFirst).toBeLessThan(1000);
    expect(scope.finals(1)).toBe(1);
  });

  it('never starts a job cancelled before it began', async () => {
    const scope = new FakeScope();
    let started = 0;
    serveJobs<TestJobs>({ ...handlers, count: (payload, job) => ((started += 1), count(payload, job)) }, scope);
    scope.send({ type: 'request', id: 1, kind: 'count', payload: { to: 2 } });
    scope.send({ type: 'cancel', id: 1 });
    expect(await scope.final(1)).toEqual({ type: 'cancelled', id: 1 });
    expect(started).toBe(0);
  });
});

const bar: BarFile = { format: 'barwright.bar', version: 1, length_mm: 300, section: { shape: 'rect', width_mm: 46, thickness_mm: 20 }, material: { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 } };

describe('solver handlers and the job signal', () => {
  it('a design stops at its first solver-call check once the job signal is aborted', () => {
    const aborted = new AbortController();
    aborted.abort();
    const progress: number[] = [];
    const context: JobContext = { signal: aborted.signal, progress: (done) => progress.push(done), checkpoint: async () => undefined };
    const result = solverHandlers.design({ bar, target: { note: 'A4', a4: 442, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] }, limits: { min_thickness_mm: 5 } }, context) as SolverJobs['design']['result'];
    // designBar reports a run stopped by its caller (src/design/designBar.ts: `cancelled`).
    expect(result.cancelled).toBe(true);
    expect(result.solves).toBeLessThan(10);
  });

  it('a many-bar analysis cancelled through the protocol stops between bars', async () => {
    const scope = new FakeScope();
    serveJobs(solverHandlers, scope);
    const bars = Array.from({ length: 40 }, (_, index) => ({ id: `bar-${index}`, bar: { ...bar, length_mm: 250 + index } }));
    scope.send({ type: 'request', id: 9, kind: 'analyzeMany', payload: { bars, modes: 3 } });
    while (!scope.sent.some((message) => message.id === 9 && message.type === 'progress' && message.done >= 2)) await new Promise((resolve) => setTimeout(resolve, 1));
    scope.send({ type: 'cancel', id: 9 });
    expect(await scope.final(9)).toEqual({ type: 'cancelled', id: 9 });
    const lastDone = Math.max(...scope.sent.filter((message) => message.id === 9 && message.type === 'progress').map((message) => (message as { done: number }).done));
    expect(lastDone).toBeLessThan(40);
  });
});
