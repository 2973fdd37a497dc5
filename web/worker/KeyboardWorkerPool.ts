// A small pool of keyboard-planning web workers behind the library's BatchRunner interface, so
// planKeyboard runs every blank-advice and bar-design task off the main thread, several at once.
// The workers are the job client's own-lane workers: one task per worker at a time, kept for the
// next task.
import { InputError, type BatchRunner, type KeyboardTask, type KeyboardTaskResult } from '../../src/index.ts';
import { JobClient, type JobWorkerLike } from './JobClient.ts';
import type { KeyboardJobs } from './keyboardTaskProtocol.ts';

/** Starts one keyboard-planning worker module (Vite bundles it from this URL pattern). */
export function startKeyboardTaskWorker(name: string): JobWorkerLike {
  return new Worker(new URL('./keyboardTaskWorker.ts', import.meta.url), { type: 'module', name }) as unknown as JobWorkerLike;
}

/** Workers for a plan on this machine: one core left for the page, at least 1, at most 4. */
export function planWorkerCount(cores: number | undefined = globalThis.navigator?.hardwareConcurrency): number {
  const available = typeof cores === 'number' && Number.isFinite(cores) ? Math.floor(cores) : 2;
  return Math.max(1, Math.min(4, available - 1));
}

/**
 * A pool of `size` workers, started on first use; each runs one task at a time. A task whose
 * input breaks a rule rejects with that InputError; a worker that dies rejects its task only and
 * is replaced on the next one. `close()` ends every worker (tasks still running reject).
 */
export class KeyboardWorkerPool implements BatchRunner<KeyboardTask, KeyboardTaskResult> {
  readonly size: number;
  private readonly client: JobClient<KeyboardJobs>;
  private closed = false;

  constructor(size: number = planWorkerCount(), spawn: (name: string) => JobWorkerLike = startKeyboardTaskWorker) {
    this.size = Math.max(1, Math.floor(size));
    this.client = new JobClient<KeyboardJobs>({ name: 'barwright-plan', spawn, lanes: { keyboardTask: 'own' }, ownLimit: this.size, spareWorkers: this.size });
  }

  /** Runs one task on a free worker. */
  async run(task: KeyboardTask): Promise<KeyboardTaskResult> {
    if (this.closed) throw new Error('the planning workers were closed');
    const outcome = await this.client.request('keyboardTask', task);
    switch (outcome.status) {
      case 'ok':
        return outcome.value;
      case 'input-error':
        throw new InputError(outcome.source, outcome.field, outcome.rule);
      case 'unavailable':
        throw new Error(`${outcome.what} is not available`);
      case 'failed':
        throw new Error(`planning: ${outcome.message}`);
      case 'cancelled':
        throw new Error('the planning task was cancelled');
    }
  }

  /** Ends every worker. */
  close(): void {
    this.closed = true;
    this.client.dispose();
  }
}
