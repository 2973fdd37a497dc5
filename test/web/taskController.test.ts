// The workbench's task controller: results bound to the subject and inputs they were asked for,
// stale results dropped, cancel of one subject's work only, the 'latest' policy used while
// dragging, the 'finish' cancel mode of the keyboard plan, and cancel when the view goes away.
import { describe, expect, it } from 'vitest';
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { TaskBook, TaskController, type TaskBinding, type TaskRun, type TaskWork } from '../../web/controllers/TaskController.ts';
import type { JobOutcome } from '../../web/worker/jobProtocol.ts';

/** Work the test finishes by hand; it records its signal and whether it was asked to stop. */
class ManualWork<R> {
  readonly runs: { run: TaskRun<{ done: number; total: number }>; finish: (outcome: JobOutcome<R>) => void }[] = [];
  readonly work: TaskWork<R> = (run) =>
    new Promise((resolve) => {
      this.runs.push({ run, finish: resolve });
    });
  finish(index: number, value: R): void {
    this.runs[index]!.finish({ status: 'ok', value, elapsedMs: 1 });
  }
}

/** A host counting update requests; connects its controllers at once. */
function host(): ReactiveControllerHost & { updates: number; controllers: ReactiveController[] } {
  const controllers: ReactiveController[] = [];
  const self = {
    updates: 0,
    controllers,
    addController: (controller: ReactiveController) => {
      controllers.push(controller);
      controller.hostConnected?.();
    },
    removeController: () => undefined,
    requestUpdate: () => {
      self.updates += 1;
    },
    updateComplete: Promise.resolve(true),
  };
  return self;
}

const settle = () => new Promise((resolve) => setTimeout(resolve, 0));

describe('task controller', () => {
  it('delivers a result with the binding it was asked for, whichever subject is shown meanwhile', async () => {
    const delivered: [string, TaskBinding][] = [];
    const tasks = new TaskController<string>(host(), { onResult: (value, binding) => void delivered.push([value, binding]) });
    const work = new ManualWork<string>();
    tasks.run({ subject: 'bar-A4', key: 'a4-inputs' }, work.work);
    tasks.run({ subject: 'bar-E5', key: 'e5-inputs' }, work.work);
    expect(tasks.active().map((state) => state.binding?.subject)).toEqual(['bar-A4', 'bar-E5']);
    work.finish(0, 'plan made for A4');
    await settle();
    expect(delivered).toEqual([['plan made for A4', { subject: 'bar-A4', key: 'a4-inputs' }]]);
    expect(tasks.state('bar-A4')).toMatchObject({ running: false, value: 'plan made for A4', problem: null });
    expect(tasks.state('bar-E5').running).toBe(true);
  });

  it('drops a result whose inputs changed while it ran', async () => {
    let currentKey = 'shape-1';
    const delivered: string[] = [];
    const tasks = new TaskController<string>(host(), { isCurrent: (binding) => binding.key === currentKey, onResult: (value) => void delivered.push(value) });
    const work = new ManualWork<string>();
    tasks.run({ subject: 'bar-A2', key: 'shape-1' }, work.work);
    currentKey = 'shape-2';
    work.finish(0, 'plan for shape 1');
    await settle();
    expect(delivered).toEqual([]);
    expect(tasks.state('bar-A2')).toMatchObject({ running: false, value: null, problem: { status: 'stale' } });
  });

  it('cancels one subject alone: its signal aborts, the other subject runs on and delivers', async () => {
    const delivered: string[] = [];
    const tasks = new TaskController<string>(host(), { onResult: (value) => void delivered.push(value) });
    const work = new ManualWork<string>();
    tasks.run({ subject: 'bar-A4', key: 'a' }, work.work);
    tasks.run({ subject: 'bar-E5', key: 'e' }, work.work);
    tasks.cancel('bar-A4');
    expect(work.runs[0]!.run.signal.aborted).toBe(true);
    expect(work.runs[1]!.run.signal.aborted).toBe(false);
    expect(tasks.state('bar-A4')).toMatchObject({ running: false, problem: { status: 'cancelled' } });
    // Whatever the cancelled work still answers is ignored.
    work.finish(0, 'late A4');
    work.finish(1, 'E5');
    await settle();
    expect(delivered).toEqual(['E5']);
  });

  it("restart policy: new inputs for a subject cancel its running work; the same inputs don't start it twice", async () => {
    const delivered: string[] = [];
    const tasks = new TaskController<string>(host(), { onResult: (value) => void delivered.push(value) });
    const work = new ManualWork<string>();
    tasks.run({ subject: 'bars', key: 'k1' }, work.work);
    tasks.run({ subject: 'bars', key: 'k1' }, work.work);
    expect(work.runs).toHaveLength(1);
    tasks.run({ subject: 'bars', key: 'k2' }, work.work);
    expect(work.runs).toHaveLength(2);
    expect(work.runs[0]!.run.signal.aborted).toBe(true);
    work.finish(0, 'old');
    work.finish(1, 'new');
    await settle();
    expect(delivered).toEqual(['new']);
  });

  it("latest policy: the running work finishes; only the newest inputs given meanwhile follow", async () => {
    const delivered: string[] = [];
    const tasks = new TaskController<string>(host(), { policy: 'latest', onResult: (value) => void delivered.push(value) });
    const work = new ManualWork<string>();
    for (const key of ['300', '290', '280', '270']) tasks.run({ subject: 'bar-A2', key }, work.work);
    expect(work.runs).toHaveLength(1);
    work.finish(0, 'shape 300');
    await settle();
    expect(work.runs).toHaveLength(2);
    expect(tasks.state('bar-A2')).toMatchObject({ running: true, value: 'shape 300', binding: { key: '270' } });
    work.finish(1, 'shape 270');
    await settle();
    expect(delivered).toEqual(['shape 300', 'shape 270']);
    expect(tasks.state('bar-A2')).toMatchObject({ running: false, value: 'shape 270', valueBinding: { subject: 'bar-A2', key: '270' } });
    expect(tasks.state('bar-A2').latencyMs).not.toBeNull();
  });

  it('forget drops a subject: its late result reaches nobody', async () => {
    const delivered: string[] = [];
    const tasks = new TaskController<string>(host(), { policy: 'latest', onResult: (value) => void delivered.push(value) });
    const work = new ManualWork<string>();
    tasks.run({ subject: 'bar-A2', key: 'x' }, work.work);
    tasks.forget('bar-A2');
    work.finish(0, 'for A2');
    await settle();
    expect(delivered).toEqual([]);
    expect(tasks.state('bar-A2')).toMatchObject({ running: false, value: null });
  });

  it("cancel mode 'finish': cancel asks the work to stop and its partial result is still delivered", async () => {
    const delivered: string[] = [];
    let changes = 0;
    const book = new TaskBook<string>({ cancelMode: 'finish', onResult: (value) => void delivered.push(value) }, () => (changes += 1));
    const work = new ManualWork<string>();
    book.run({ subject: 'keyboard-plan', key: 'C4-B4' }, work.work);
    book.cancel('keyboard-plan');
    expect(work.runs[0]!.run.signal.aborted).toBe(true);
    expect(book.state('keyboard-plan')).toMatchObject({ running: true, stopping: true });
    work.finish(0, '5 of 12 bars');
    await settle();
    expect(delivered).toEqual(['5 of 12 bars']);
    expect(book.state('keyboard-plan')).toMatchObject({ running: false, stopping: false, problem: null });
    expect(changes).toBeGreaterThanOrEqual(3);
  });

  it('reports progress and re-renders its host; a view that goes away cancels its work', async () => {
    const view = host();
    const tasks = new TaskController<string>(view);
    const work = new ManualWork<string>();
    tasks.run({ subject: 'bar-A4', key: 'a' }, work.work);
    work.runs[0]!.run.onProgress({ done: 42, total: 600 });
    expect(tasks.state('bar-A4').progress).toEqual({ done: 42, total: 600 });
    const before = view.updates;
    view.controllers.forEach((controller) => controller.hostDisconnected?.());
    expect(work.runs[0]!.run.signal.aborted).toBe(true);
    expect(view.updates).toBeGreaterThan(before);
    expect(tasks.active()).toEqual([]);
  });
});
