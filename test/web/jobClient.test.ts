// The page's side of the job protocol (JobClient), driven by stand-in workers the test answers
// by hand: outcomes, progress, and cancel of one job never touching another — cooperatively on a
// shared lane, by ending only that job's worker on the 'own' lane.
import { describe, expect, it } from 'vitest';
import { JobClient, type JobWorkerLike } from '../../web/worker/JobClient.ts';
import type { FromJobWorker, JobCatalog, ToJobWorker } from '../../web/worker/jobProtocol.ts';

/** A stand-in worker: records messages; the test answers them. */
class FakeWorker implements JobWorkerLike {
  readonly received: ToJobWorker<JobCatalog>[] = [];
  terminated = false;
  private onMessage: ((event: MessageEvent<FromJobWorker>) => void) | null = null;
  private onError: ((event: ErrorEvent) => void) | null = null;
  constructor(readonly name: string) {}
  postMessage(message: ToJobWorker<JobCatalog>): void {
    this.received.push(message);
  }
  addEventListener(type: string, listener: (event: never) => void): void {
    if (type === 'message') this.onMessage = listener as (event: MessageEvent<FromJobWorker>) => void;
    if (type === 'error') this.onError = listener as (event: ErrorEvent) => void;
  }
  terminate(): void {
    this.terminated = true;
  }
  answer(message: FromJobWorker): void {
    this.onMessage?.({ data: message } as MessageEvent<FromJobWorker>);
  }
  crash(text: string): void {
    this.onError?.({ message: text } as ErrorEvent);
  }
  requests(): { id: number; kind: string }[] {
    return this.received.filter((message) => message.type === 'request').map((message) => ({ id: message.id, kind: (message as { kind: string }).kind }));
  }
  cancels(): number[] {
    return this.received.filter((message) => message.type === 'cancel').map((message) => message.id);
  }
}

type TestJobs = {
  quick: { payload: { n: number }; result: number };
  batch: { payload: { items: number }; result: number[] };
  long: { payload: { label: string }; result: string };
};

function clientWithWorkers(ownLimit = 2): { client: JobClient<TestJobs>; workers: FakeWorker[] } {
  const workers: FakeWorker[] = [];
  const client = new JobClient<TestJobs>({
    name: 'test',
    spawn: (name) => {
      const worker = new FakeWorker(name);
      workers.push(worker);
      return worker;
    },
    lanes: { quick: 'quick', batch: 'quick', long: 'own' },
    ownLimit,
    spareWorkers: 1,
  });
  return { client, workers };
}

describe('job client', () => {
  it('passes results, input errors, progress and "not available" through as outcomes', async () => {
    const { client, workers } = clientWithWorkers();
    const progress: number[] = [];
    const first = client.request('quick', { n: 1 });
    const second = client.request('batch', { items: 2 }, { onProgress: (done) => progress.push(done) });
    const third = client.request('quick', { n: 3 });
    expect(workers).toHaveLength(1);
    const [a, b, c] = workers[0]!.requests();
    expect([a!.kind, b!.kind, c!.kind]).toEqual(['quick', 'batch', 'quick']);
    workers[0]!.answer({ type: 'error', id: a!.id, error: { kind: 'input', source: 'bar', field: 'length_mm', rule: 'must be greater than 0 mm', message: 'bar: length_mm: must be greater than 0 mm' } });
    workers[0]!.answer({ type: 'progress', id: b!.id, done: 1, total: 2 });
    workers[0]!.answer({ type: 'result', id: b!.id, value: [4, 5], elapsedMs: 3 });
    workers[0]!.answer({ type: 'error', id: c!.id, error: { kind: 'unavailable', what: 'Next-cut advice' } });
    expect(await first).toEqual({ status: 'input-error', source: 'bar', field: 'length_mm', rule: 'must be greater than 0 mm', message: 'bar: length_mm: must be greater than 0 mm' });
    expect(await second).toEqual({ status: 'ok', value: [4, 5], elapsedMs: 3 });
    expect(progress).toEqual([1]);
    expect(await third).toEqual({ status: 'unavailable', what: 'Next-cut advice' });
    expect(client.pendingCount).toBe(0);
  });

  it('cancels one job on a shared worker by message; the other job on it completes', async () => {
    const { client, workers } = clientWithWorkers();
    const stop = new AbortController();
    const cancelled = client.request('batch', { items: 10 }, { signal: stop.signal });
    const kept = client.request('quick', { n: 7 });
    const [first, second] = workers[0]!.requests();
    stop.abort();
    // The page hears 'cancelled' at once; the worker is told to abort that job's signal only.
    expect(await cancelled).toEqual({ status: 'cancelled' });
    expect(workers[0]!.cancels()).toEqual([first!.id]);
    expect(workers[0]!.terminated).toBe(false);
    // A late answer for the cancelled job is ignored; the other job's answer arrives as usual.
    workers[0]!.answer({ type: 'result', id: first!.id, value: [1], elapsedMs: 1 });
    workers[0]!.answer({ type: 'result', id: second!.id, value: 49, elapsedMs: 1 });
    expect(await kept).toEqual({ status: 'ok', value: 49, elapsedMs: 1 });
    expect(workers).toHaveLength(1);
  });

  it('runs each own-lane job on a worker of its own; cancelling one ends only its worker', async () => {
    const { client, workers } = clientWithWorkers();
    const stop = new AbortController();
    const cancelled = client.request('long', { label: 'A4' }, { signal: stop.signal });
    const kept = client.request('long', { label: 'E5' });
    expect(workers).toHaveLength(2);
    expect(workers.map((worker) => worker.requests().length)).toEqual([1, 1]);
    stop.abort();
    expect(await cancelled).toEqual({ status: 'cancelled' });
    expect(workers[0]!.terminated).toBe(true);
    expect(workers[1]!.terminated).toBe(false);
    workers[1]!.answer({ type: 'progress', id: workers[1]!.requests()[0]!.id, done: 3, total: 600 });
    workers[1]!.answer({ type: 'result', id: workers[1]!.requests()[0]!.id, value: 'plan for E5', elapsedMs: 900 });
    expect(await kept).toEqual({ status: 'ok', value: 'plan for E5', elapsedMs: 900 });
    // The finished worker is kept for the next own-lane job (one spare).
    const next = client.request('long', { label: 'C7' });
    expect(workers).toHaveLength(2);
    expect(workers[1]!.requests()).toHaveLength(2);
    workers[1]!.answer({ type: 'result', id: workers[1]!.requests()[1]!.id, value: 'plan for C7', elapsedMs: 1 });
    expect(await next).toMatchObject({ status: 'ok', value: 'plan for C7' });
  });

  it('queues own-lane jobs beyond the limit; a queued job cancelled is dropped without touching the running one', async () => {
    const { client, workers } = clientWithWorkers(1);
    const running = client.request('long', { label: 'A4' });
    const stop = new AbortController();
    const queued = client.request('long', { label: 'E5' }, { signal: stop.signal });
    const third = client.request('long', { label: 'C7' });
    expect(workers).toHaveLength(1);
    stop.abort();
    expect(await queued).toEqual({ status: 'cancelled' });
    expect(workers[0]!.terminated).toBe(false);
    expect(workers[0]!.cancels()).toEqual([]);
    workers[0]!.answer({ type: 'result', id: workers[0]!.requests()[0]!.id, value: 'A4', elapsedMs: 1 });
    expect(await running).toMatchObject({ status: 'ok', value: 'A4' });
    // The next waiting job (C7, not the cancelled E5) goes to the freed worker.
    expect(workers[0]!.requests()).toHaveLength(2);
    workers[0]!.answer({ type: 'result', id: workers[0]!.requests()[1]!.id, value: 'C7', elapsedMs: 1 });
    expect(await third).toMatchObject({ status: 'ok', value: 'C7' });
  });

  it('fails only the jobs of a worker that died, and starts a fresh one on the next request', async () => {
    const { client, workers } = clientWithWorkers();
    const shared = client.request('quick', { n: 2 });
    const own = client.request('long', { label: 'A4' });
    const sharedWorker = workers.find((worker) => worker.requests()[0]?.kind === 'quick')!;
    const ownWorker = workers.find((worker) => worker.requests()[0]?.kind === 'long')!;
    sharedWorker.crash('out of memory');
    expect(await shared).toEqual({ status: 'failed', message: 'the worker stopped: out of memory' });
    ownWorker.answer({ type: 'result', id: ownWorker.requests()[0]!.id, value: 'A4', elapsedMs: 1 });
    expect(await own).toMatchObject({ status: 'ok', value: 'A4' });
    void client.request('quick', { n: 3 });
    expect(workers).toHaveLength(3);
  });

  it('answers a request whose signal is already aborted without sending it, and fails pending jobs on dispose', async () => {
    const { client, workers } = clientWithWorkers();
    const stop = new AbortController();
    stop.abort();
    expect(await client.request('quick', { n: 1 }, { signal: stop.signal })).toEqual({ status: 'cancelled' });
    expect(workers).toHaveLength(0);
    const pending = client.request('long', { label: 'A4' });
    client.dispose();
    expect(await pending).toEqual({ status: 'failed', message: 'the workers were closed' });
    expect(workers[0]!.terminated).toBe(true);
    expect(client.workerCount).toBe(0);
  });
});
