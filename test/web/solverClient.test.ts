// The page's side of the solver worker, driven by a stand-in worker: outcomes, progress, cancel,
// and the latest-input-wins controller used while dragging.
import { describe, expect, it } from 'vitest';
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { SolverClient, type WorkerLike } from '../../web/worker/SolverClient.ts';
import { LatestSolveController } from '../../web/controllers/LatestSolveController.ts';
import type { FromWorker, ToWorker } from '../../web/worker/protocol.ts';
import type { BarFile } from '../../src/index.ts';

/** A stand-in worker: records messages; the test answers them by hand. */
class FakeWorker implements WorkerLike {
  readonly received: ToWorker[] = [];
  terminated = false;
  private listener: ((event: MessageEvent<FromWorker>) => void) | null = null;
  postMessage(message: ToWorker): void {
    this.received.push(message);
  }
  addEventListener(type: string, listener: (event: never) => void): void {
    if (type === 'message') this.listener = listener as (event: MessageEvent<FromWorker>) => void;
  }
  terminate(): void {
    this.terminated = true;
  }
  answer(message: FromWorker): void {
    this.listener?.({ data: message } as MessageEvent<FromWorker>);
  }
  requestIds(): number[] {
    return this.received.filter((message) => message.type === 'request').map((message) => message.id);
  }
}

const bar: BarFile = { format: 'barwright.bar', version: 1, length_mm: 300, section: { shape: 'rect', width_mm: 40, thickness_mm: 20 }, material: { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 } };
const analysis = { theory: 'timoshenko', bending: [{ mode: 1, hz: 400, ratio: 1, nodes_mm: [67, 233] }], torsion: [], lateral: [], warnings: [], mesh: { elements: 40 } };

function clientWithWorkers(): { client: SolverClient; workers: FakeWorker[] } {
  const workers: FakeWorker[] = [];
  const client = new SolverClient('test', () => {
    const worker = new FakeWorker();
    workers.push(worker);
    return worker;
  });
  return { client, workers };
}

describe('solver client', () => {
  it('passes results, input errors, progress and "not available yet" through as outcomes', async () => {
    const { client, workers } = clientWithWorkers();
    const progress: number[] = [];
    const first = client.request({ kind: 'analyze', bar, modes: 3, withShapes: false, withSensitivities: false });
    const second = client.request({ kind: 'analyzeMany', bars: [{ id: 'a', bar }], modes: 3 }, { onProgress: (done) => progress.push(done) });
    const third = client.request({ kind: 'nextCut', session: {} as never });
    const [a, b, c] = workers[0]!.requestIds();
    workers[0]!.answer({ type: 'input-error', id: a!, source: 'bar', field: 'length_mm', rule: 'must be greater than 0 mm', message: 'bar: length_mm: must be greater than 0 mm' });
    workers[0]!.answer({ type: 'progress', id: b!, done: 1, total: 1 });
    workers[0]!.answer({ type: 'result', id: b!, value: [{ id: 'a', analysis, error: null }], elapsedMs: 3 });
    workers[0]!.answer({ type: 'unavailable', id: c!, what: 'Next-cut advice' });
    expect(await first).toEqual({ status: 'input-error', field: 'length_mm', rule: 'must be greater than 0 mm', message: 'bar: length_mm: must be greater than 0 mm' });
    expect(await second).toMatchObject({ status: 'ok', elapsedMs: 3 });
    expect(progress).toEqual([1]);
    expect(await third).toEqual({ status: 'unavailable', what: 'Next-cut advice' });
  });

  it('cancels a batch between items and a single long job by stopping its worker', async () => {
    const { client, workers } = clientWithWorkers();
    const batch = new AbortController();
    const many = client.request({ kind: 'analyzeMany', bars: [{ id: 'a', bar }], modes: 3 }, { signal: batch.signal });
    batch.abort();
    const cancel = workers[0]!.received.find((message) => message.type === 'cancel');
    expect(cancel).toBeDefined();
    workers[0]!.answer({ type: 'cancelled', id: cancel!.id });
    expect(await many).toEqual({ status: 'cancelled' });
    expect(workers[0]!.terminated).toBe(false);

    const plan = new AbortController();
    const design = client.request({ kind: 'design', bar, target: { note: 'A4', a4: 442, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] }, limits: { min_thickness_mm: 5 } }, { signal: plan.signal });
    plan.abort();
    expect(await design).toEqual({ status: 'cancelled' });
    expect(workers[0]!.terminated).toBe(true);
    // The next request starts a fresh worker.
    void client.request({ kind: 'analyze', bar, modes: 3, withShapes: false, withSensitivities: false });
    expect(workers).toHaveLength(2);
  });
});

describe('latest-input-wins controller', () => {
  it('keeps one request in flight and sends only the newest waiting input', async () => {
    const { client, workers } = clientWithWorkers();
    let updates = 0;
    const controllers: ReactiveController[] = [];
    const host: ReactiveControllerHost = {
      addController: (controller) => controllers.push(controller),
      removeController: () => undefined,
      requestUpdate: () => {
        updates += 1;
      },
      updateComplete: Promise.resolve(true),
    };
    const latest = new LatestSolveController<'analyze'>(host, client);
    controllers.forEach((controller) => controller.hostConnected?.());
    const shapes = [300, 290, 280, 270].map((length) => ({ ...bar, length_mm: length }));
    for (const shape of shapes) latest.give({ kind: 'analyze', bar: shape, modes: 3, withShapes: false, withSensitivities: false });
    const sent = () => workers[0]!.received.filter((message) => message.type === 'request');
    expect(sent()).toHaveLength(1);
    workers[0]!.answer({ type: 'result', id: sent()[0]!.id, value: { analysis, sensitivities: null }, elapsedMs: 2 });
    await new Promise((resolve) => setTimeout(resolve, 0));
    // Inputs 290 and 280 were superseded: the second request is the newest shape.
    expect(sent()).toHaveLength(2);
    expect((sent()[1] as { request: { bar: BarFile } }).request.bar.length_mm).toBe(270);
    expect(latest.state.value).not.toBeNull();
    expect(latest.state.busy).toBe(true);
    workers[0]!.answer({ type: 'result', id: sent()[1]!.id, value: { analysis, sensitivities: null }, elapsedMs: 2 });
    await new Promise((resolve) => setTimeout(resolve, 0));
    expect(latest.state.busy).toBe(false);
    expect(latest.state.latencyMs).not.toBeNull();
    expect(updates).toBeGreaterThan(0);
  });
});
